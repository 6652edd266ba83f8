package org.viscarta.temperature;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.TreeSet;

import org.viscarta.io.UsageException;
import org.viscarta.sweep.Numbers;
import org.viscarta.sweep.Ramp;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;

/**
 * Isotherms cut across temperature ramps at several fixed frequencies (the cross-plot): at each
 * temperature of a regular grid, the moduli of every ramp of a replicate, read off by linear
 * interpolation of their logarithms between the two measured temperatures either side, form one
 * short frequency sweep. Those sweeps feed {@link ShiftAnalysis} like measured isotherms.
 *
 * <p>Nothing is extrapolated: a grid temperature outside a ramp's range, or between two of its
 * points further apart than the grid step, is left out for that frequency, and an isotherm needs
 * at least two frequencies.
 */
public final class Isotherms {

    /** A temperature needs at least this many frequencies to make an isotherm. */
    public static final int MIN_FREQUENCIES = 2;

    private Isotherms() {
    }

    /**
     * The isotherms of one sample's ramps.
     *
     * @param ramps the ramps of one sample (any replicates and frequencies)
     * @param stepC the grid step [°C]; grid temperatures are whole multiples of it
     * @return the isotherms, replicate by replicate, coldest first; empty when the ramps allow none
     * @throws UsageException when the step is not positive or the ramps are of several samples
     */
    public static List<Sweep> of(List<Ramp> ramps, double stepC) {
        if (!(stepC > 0) || Double.isInfinite(stepC)) {
            throw new UsageException("the isotherm step must be a positive number of °C, got " + Numbers.plain(stepC));
        }
        Map<String, List<Ramp>> byReplicate = new LinkedHashMap<>();
        for (Ramp r : ramps) {
            if (!r.sample().equals(ramps.get(0).sample())) {
                throw new UsageException("isotherms are cut from one sample's ramps; got '" + ramps.get(0).sample() + "' and '"
                        + r.sample() + "'");
            }
            byReplicate.computeIfAbsent(r.replicate(), k -> new ArrayList<>()).add(r);
        }
        List<Sweep> out = new ArrayList<>();
        for (List<Ramp> rep : byReplicate.values()) {
            out.addAll(ofReplicate(rep, stepC));
        }
        return out;
    }

    private static List<Sweep> ofReplicate(List<Ramp> ramps, double stepC) {
        TreeSet<Double> frequencies = new TreeSet<>();
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (Ramp r : ramps) {
            frequencies.add(r.frequencyHz());
            lo = Math.min(lo, r.minTemperatureC());
            hi = Math.max(hi, r.maxTemperatureC());
        }
        if (frequencies.size() < MIN_FREQUENCIES) {
            return List.of();
        }
        Ramp first = ramps.get(0);
        List<Sweep> out = new ArrayList<>();
        for (long k = (long) Math.ceil(lo / stepC - 1e-9); k * stepC <= hi + 1e-9 * stepC; k++) {
            double t = Math.round(k * stepC * 1e6) / 1e6;
            TreeMap<Double, SweepPoint> points = new TreeMap<>();
            for (Ramp r : ramps) {
                SweepPoint p = at(r, t, stepC);
                if (p != null) {
                    points.putIfAbsent(r.frequencyHz(), p);
                }
            }
            if (points.size() < MIN_FREQUENCIES) {
                continue;
            }
            Map<String, String> meta = new LinkedHashMap<>(first.metadata());
            meta.put("note", String.format(Locale.ROOT, "isotherm at %s °C cut across temperature ramps at %d frequencies "
                    + "(moduli interpolated between neighbouring measured temperatures)", Numbers.plain(t), points.size()));
            out.add(new Sweep(first.sample(), first.replicate(), first.group(), first.kind(), t, first.source(), meta,
                    new ArrayList<>(points.values())));
        }
        return out;
    }

    /** The moduli of a ramp at temperature t, or null when t is not bracketed by points at most a step apart. */
    static SweepPoint at(Ramp r, double t, double stepC) {
        List<Ramp.Point> pts = r.points();
        for (int i = 0; i < pts.size(); i++) {
            Ramp.Point p = pts.get(i);
            if (p.temperatureC() == t) {
                return p.loss() > 0 ? new SweepPoint(r.frequencyHz(), p.storage(), p.loss(), p.line()) : null;
            }
            if (p.temperatureC() > t) {
                if (i == 0) {
                    return null;
                }
                Ramp.Point a = pts.get(i - 1);
                double gap = p.temperatureC() - a.temperatureC();
                if (gap > stepC || !(a.loss() > 0) || !(p.loss() > 0)) {
                    return null;
                }
                double w = (t - a.temperatureC()) / gap;
                double storage = Math.exp((1 - w) * Math.log(a.storage()) + w * Math.log(p.storage()));
                double loss = Math.exp((1 - w) * Math.log(a.loss()) + w * Math.log(p.loss()));
                return new SweepPoint(r.frequencyHz(), storage, loss, w < 0.5 ? a.line() : p.line());
            }
        }
        return null;
    }
}
