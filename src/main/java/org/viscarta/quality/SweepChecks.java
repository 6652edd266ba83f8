package org.viscarta.quality;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.viscarta.sweep.Numbers;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;

/**
 * The checks of one sweep that need no other sweep: Kramers–Kronig consistency, points per decade,
 * frequency span, the sign of the loss modulus, and the noise level. Limits are conventions of this
 * product (stated in each message), not standards.
 */
public final class SweepChecks {

    /** Fewest points a decade, and narrowest span [decades], for a sweep a model can be fitted to with confidence. */
    static final double MIN_POINTS_PER_DECADE = 3;
    static final double MIN_SPAN_DECADES = 1;
    /** Noise above this [relative] is warned. */
    static final double NOISE_WARN = 0.05;
    /** Smallest fall of ln E′ between neighbouring frequencies counted as a fall (2 %). */
    static final double MIN_STORAGE_FALL = 0.02;

    /**
     * One verdict.
     *
     * @param check   the check's id: kramers-kronig, points-per-decade, frequency-span, loss-modulus-sign, noise,
     *                duplicate-frequency, storage-monotonic, linear-range, replicate-outlier, film-thickness
     * @param verdict pass, warn or fail
     * @param value   the measured value (NaN when none)
     * @param limit   the limit it is held to (NaN when none)
     * @param unit    the unit of value and limit ("%", "decades", "µm" ...)
     */
    public record Check(String sample, String replicate, String check, Verdict verdict, double value, double limit,
                        String unit, String message) {

        /** A check whose value and limit are in the usual unit of its kind ({@link #unitOf}). */
        public Check(String sample, String replicate, String check, Verdict verdict, double value, double limit, String message) {
            this(sample, replicate, check, verdict, value, limit, unitOf(check), message);
        }

        /** The same check under another sample name (a sample's display name). */
        public Check withSample(String name) {
            return new Check(name, replicate, check, verdict, value, limit, unit, message);
        }
    }

    /** The unit of a check's value and limit (a linear-range check states its own). */
    static String unitOf(String check) {
        return switch (check) {
            case "frequency-span" -> "decades";
            case "points-per-decade" -> "per decade";
            case "loss-modulus-sign", "duplicate-frequency" -> "points";
            case "replicate-outlier" -> "modified z";
            default -> "%";
        };
    }

    private SweepChecks() {
    }

    public static List<Check> of(Sweep s) {
        List<Check> out = new ArrayList<>();
        List<SweepPoint> pts = s.points();
        double fMin = pts.stream().mapToDouble(SweepPoint::frequencyHz).min().orElse(Double.NaN);
        double fMax = pts.stream().mapToDouble(SweepPoint::frequencyHz).max().orElse(Double.NaN);
        double span = Math.log10(fMax / fMin);
        long distinct = pts.stream().mapToLong(p -> Math.round(Math.log10(p.frequencyHz()) * 1e4)).distinct().count();
        double perDecade = span > 0 ? (distinct - 1) / span : 0;
        out.add(check(s, "frequency-span", span >= MIN_SPAN_DECADES ? Verdict.PASS : Verdict.WARN, span,
                MIN_SPAN_DECADES, "the sweep spans " + Numbers.fixed(span, 2) + " decades of frequency"
                        + (span >= MIN_SPAN_DECADES ? "" : "; less than one decade tells little about how the material changes with rate")));
        out.add(check(s, "points-per-decade", perDecade >= MIN_POINTS_PER_DECADE ? Verdict.PASS : Verdict.WARN,
                perDecade, MIN_POINTS_PER_DECADE, Numbers.fixed(perDecade, 1) + " frequencies a decade"
                        + (perDecade >= MIN_POINTS_PER_DECADE ? "" : "; fewer than three leave a model's shape poorly pinned down")));
        long nonPositive = pts.stream().filter(p -> !(p.loss() > 0)).count();
        out.add(check(s, "loss-modulus-sign", nonPositive == 0 ? Verdict.PASS : Verdict.FAIL, nonPositive, 0,
                nonPositive == 0 ? "every loss modulus is positive" : nonPositive + " point(s) with a loss modulus of zero or below: "
                        + "no passive material dissipates negative energy; check the phase calibration"));
        long duplicates = pts.size() - distinct;
        out.add(check(s, "duplicate-frequency", duplicates == 0 ? Verdict.PASS : Verdict.WARN, duplicates, 0,
                duplicates == 0 ? "no frequency is measured twice" : duplicates + " point(s) repeat a frequency already measured: "
                        + "both are used, as replicates of that frequency; check that the export did not repeat a segment"));
        List<SweepPoint> usable = s.fittablePoints();
        KramersKronig.Result kk = KramersKronig.check(usable);
        if (Double.isFinite(kk.residualNoise())) {
            double noise = kk.residualNoise();
            out.add(check(s, "noise", noise <= NOISE_WARN ? Verdict.PASS : Verdict.WARN, 100 * noise, 100 * NOISE_WARN,
                    "scatter of the moduli about a smooth, causal curve: about " + Numbers.fixed(100 * noise, 1) + " %"
                            + (noise <= NOISE_WARN ? "" : ", more than 5 %: replicates or a longer measurement would help")));
        }
        out.add(check(s, "kramers-kronig", kk.verdict(), 100 * Math.expm1(kk.departure()), 100 * Math.expm1(kk.limit()), kk.message()));
        out.add(monotonic(s, Double.isFinite(kk.residualNoise()) ? kk.residualNoise() : 0));
        return out;
    }

    /**
     * E′ of a linear viscoelastic material with a non-negative relaxation spectrum — every model of
     * the catalogue — does not fall as frequency rises (Tschoegl, The Phenomenological Theory of
     * Linear Viscoelastic Behavior, 1989). A fall between neighbouring frequencies larger than four
     * times the noise of their difference (at least 2 %; a convention of this product) is warned.
     */
    private static Check monotonic(Sweep s, double noise) {
        List<SweepPoint> pts = s.points();
        double allowed = Math.max(MIN_STORAGE_FALL, 4 * Math.sqrt(2) * noise);
        double worst = 0;
        int at = -1;
        int falls = 0;
        for (int i = 1; i < pts.size(); i++) {
            if (pts.get(i).frequencyHz() <= pts.get(i - 1).frequencyHz()) {
                continue;
            }
            double fall = Math.log(pts.get(i - 1).storage() / pts.get(i).storage());
            if (fall > allowed) {
                falls++;
                if (fall > worst) {
                    worst = fall;
                    at = i;
                }
            }
        }
        if (falls == 0) {
            return check(s, "storage-monotonic", Verdict.PASS, 0, 100 * allowed, "E′ does not fall with frequency beyond the noise ("
                    + Numbers.fixed(100 * allowed, 1) + " % allowed between neighbours)");
        }
        SweepPoint p = pts.get(at);
        return check(s, "storage-monotonic", Verdict.WARN, 100 * (1 - Math.exp(-worst)), 100 * allowed, String.format(Locale.ROOT,
                "E′ falls by %.1f %% as frequency rises to %.3g Hz (line %d)%s; no model of the catalogue can follow that: "
                        + "look for slip, inertia or a resonance of the instrument", 100 * (1 - Math.exp(-worst)), p.frequencyHz(), p.line(),
                falls > 1 ? " and at " + (falls - 1) + " other step(s)" : ""));
    }

    private static Check check(Sweep s, String id, Verdict v, double value, double limit, String message) {
        return new Check(s.sample(), s.replicate(), id, v, value, limit, message);
    }
}
