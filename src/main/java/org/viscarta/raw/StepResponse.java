package org.viscarta.raw;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.viscarta.io.InputException;
import org.viscarta.io.ReadWarning;
import org.viscarta.sweep.Numbers;
import org.viscarta.sweep.TimeTest;

/**
 * A raw step test — time, force and displacement of a stress relaxation (a displacement step, held)
 * or a creep test (a force step, held) — converted to the relaxation modulus M(t) or the creep
 * compliance J(t) with the geometries of the raw oscillation signals.
 *
 * <p>The step: the held value is the median of the controlled signal over the last half of the
 * record; the ramp runs from the first sample at 2 % of it to the first at 98 %. Times count from
 * the ramp's start, and the points after the ramp are kept with their times moved back by half the
 * ramp time — a ramp of duration t_R acts on the response, to first order, like a step at its
 * middle (Zapas and Craft, J. Res. Natl. Bur. Stand. 69A (1965) 541 — cited from memory); common
 * practice trusts the result from about ten ramp times on, and the points before are counted in a
 * warning. The samples are averaged into 20 log-spaced bins per decade of time.
 *
 * <p>Conversion: for the linear geometries (flat punch, tension, plate shear) M(t) = c F(t)/δ₀ and
 * J(t) = δ(t)/(c F₀), with c the geometry's stiffness-to-modulus factor; for a sphere, the step
 * solution of the Hertz contact (Lee and Radok, J. Appl. Mech. 27 (1960) 438):
 * M(t) = 3(1 − ν²) F(t) / (4 √R δ₀^{3/2}) and J(t) = 4 √R δ(t)^{3/2} / (3 (1 − ν²) F₀). A cone is not
 * converted (its contact grows with depth in a way this product does not model for steps).
 */
public final class StepResponse {

    /** Log-spaced bins per decade of time. */
    static final int BINS_PER_DECADE = 20;
    /** Below this many ramp times the ramp correction is approximate (common practice). */
    static final double TRUSTED_RAMP_TIMES = 10;

    private StepResponse() {
    }

    /**
     * A converted step test.
     *
     * @param test      the time-domain test in SI
     * @param warnings  what the conversion noticed
     * @param rampTimeS the ramp time found [s]
     * @param held      the held displacement [m] (relaxation) or force [N] (creep)
     * @param samples   the raw samples after the ramp that were averaged into the test's points
     * @param geometry  the geometry used, in words
     */
    public record Converted(TimeTest test, List<ReadWarning> warnings, double rampTimeS, double held, int samples, String geometry) {
    }

    /** Converts a step test's record. */
    public static Converted convert(RawReader.Measurement m) {
        TimeTest.Type type = m.stepTest().orElseThrow(() -> new IllegalArgumentException("not a step test"));
        RawReader.Segment s = m.segments().get(0);
        boolean relaxation = type == TimeTest.Type.RELAXATION;
        double[] t = s.time();
        double[] controlled = relaxation ? s.displacement() : s.force();
        double[] response = relaxation ? s.force() : s.displacement();
        int n = t.length;
        double held = median(Arrays.copyOfRange(controlled, n / 2, n));
        String what = relaxation ? "displacement" : "force";
        if (!(held > 0)) {
            throw new InputException(m.file(), s.firstLine(), 0, "the held " + what + " of this " + type.test() + " test is not "
                    + "positive (median of the record's second half: " + Numbers.plain(held) + "); a step test holds a positive "
                    + what + " (indentation or tension)");
        }
        int start = -1;
        int end = -1;
        for (int i = 0; i < n; i++) {
            if (start < 0 && controlled[i] >= 0.02 * held) {
                start = i;
            }
            if (controlled[i] >= 0.98 * held) {
                end = i;
                break;
            }
        }
        if (start < 0 || end < 0 || end >= n - 3) {
            throw new InputException(m.file(), s.firstLine(), 0, "no step found: the " + what + " never reaches its held value "
                    + "before the last samples; record the step and its hold");
        }
        double t0 = t[start];
        double rampTime = t[end] - t0;
        Map<String, String> meta = new LinkedHashMap<>(m.metadata());
        if (!meta.containsKey("indentation_depth") && relaxation) {
            meta.put("indentation_depth", held + " m");
        }
        Geometry g;
        try {
            g = Geometry.from(meta);
        } catch (IllegalArgumentException e) {
            throw new InputException(m.file(), 1, 0, e.getMessage());
        }
        if (g instanceof Geometry.Cone) {
            throw new InputException(m.file(), 1, 0, "a step test with a cone is not converted (its contact grows with depth); "
                    + "use a flat punch, a sphere, tension or plate shear, or give the relaxation modulus itself");
        }
        List<ReadWarning> warnings = new ArrayList<>();
        double worstDrift = 0;
        List<double[]> kept = new ArrayList<>();
        int nonPositive = 0;
        int early = 0;
        for (int i = end + 1; i < n; i++) {
            worstDrift = Math.max(worstDrift, Math.abs(controlled[i] / held - 1));
            double time = t[i] - t0 - rampTime / 2;
            double v = value(g, relaxation, response[i], held);
            if (!(time > 0) || !(v > 0) || !Double.isFinite(v)) {
                nonPositive++;
                continue;
            }
            if (time < TRUSTED_RAMP_TIMES * rampTime) {
                early++;
            }
            kept.add(new double[] {time, v, s.firstLine() + i});
        }
        if (kept.size() < 3) {
            throw new InputException(m.file(), s.firstLine(), 0, "fewer than three usable samples after the step's ramp");
        }
        if (worstDrift > 0.25) {
            throw new InputException(m.file(), s.firstLine(), 0, String.format(Locale.ROOT, "the %s is not held: after the step it "
                    + "departs by up to %.0f %% from its held value; a %s test holds a step", what, 100 * worstDrift, type.test()));
        }
        if (worstDrift > 0.05) {
            warnings.add(new ReadWarning(m.file(), s.firstLine(), String.format(Locale.ROOT, "the held %s drifts by up to %.0f %% "
                    + "during the hold; a %s test holds its step, so the result is approximate", what, 100 * worstDrift, type.test())));
        }
        if (nonPositive > 0) {
            warnings.add(new ReadWarning(m.file(), s.firstLine(), nonPositive + " sample(s) after the ramp with a "
                    + (relaxation ? "force" : "displacement") + " of zero or less left out"));
        }
        if (early > 0) {
            warnings.add(new ReadWarning(m.file(), s.firstLine(), String.format(Locale.ROOT, "the ramp took %s s; %d sample(s) lie "
                    + "within ten ramp times of it, where the half-ramp correction is approximate (common practice)",
                    Numbers.plain(rampTime), early)));
        }
        List<TimeTest.Point> points = bins(kept);
        Map<String, String> testMeta = new LinkedHashMap<>(m.metadata());
        testMeta.put("geometry_used", g.describe());
        testMeta.put("step", String.format(Locale.ROOT, "%s held at %s %s, ramp %s s (times from the ramp's middle)", what,
                Numbers.plain(relaxation ? held * 1e6 : held), relaxation ? "µm" : "N", Numbers.plain(rampTime)));
        double temperature = Double.NaN;
        if (meta.containsKey("temperature")) {
            try {
                temperature = Double.parseDouble(meta.get("temperature").replaceAll("[^0-9.eE+-]", ""));
            } catch (NumberFormatException e) {
                throw new InputException(m.file(), 1, 0, "'temperature: " + meta.get("temperature") + "' is not understood; write "
                        + "e.g. 'temperature: 23 °C'");
            }
        }
        String sample = meta.getOrDefault("sample", stem(m.file()));
        TimeTest test = new TimeTest(sample, meta.getOrDefault("replicate", "1"), meta.getOrDefault("group", ""), g.kind(), type,
                temperature, m.file(), testMeta, points);
        return new Converted(test, warnings, rampTime, held, kept.size(), g.describe());
    }

    /** M(t) or J(t) of one sample. */
    static double value(Geometry g, boolean relaxation, double response, double held) {
        if (g instanceof Geometry.Sphere sp) {
            double nu = sp.poisson();
            return relaxation ? 3 * (1 - nu * nu) * response / (4 * Math.sqrt(sp.radius()) * Math.pow(held, 1.5))
                    : 4 * Math.sqrt(sp.radius()) * Math.pow(Math.max(response, 0), 1.5) / (3 * (1 - nu * nu) * held);
        }
        double c = g.modulus(new org.apache.commons.math3.complex.Complex(1, 0)).getReal();
        return relaxation ? c * response / held : response / (c * held);
    }

    /** The samples averaged into log-spaced bins: geometric mean time, mean value, the first line of each bin. */
    private static List<TimeTest.Point> bins(List<double[]> kept) {
        Map<Long, double[]> acc = new LinkedHashMap<>();
        for (double[] k : kept) {
            long bin = (long) Math.floor(Math.log10(k[0]) * BINS_PER_DECADE);
            double[] a = acc.computeIfAbsent(bin, b -> new double[] {0, 0, 0, k[2]});
            a[0] += Math.log(k[0]);
            a[1] += k[1];
            a[2]++;
        }
        List<TimeTest.Point> out = new ArrayList<>();
        for (double[] a : acc.values()) {
            out.add(new TimeTest.Point(Math.exp(a[0] / a[2]), a[1] / a[2], (int) a[3]));
        }
        return out;
    }

    private static double median(double[] v) {
        double[] c = v.clone();
        Arrays.sort(c);
        return c.length % 2 == 1 ? c[c.length / 2] : (c[c.length / 2 - 1] + c[c.length / 2]) / 2;
    }

    private static String stem(java.nio.file.Path file) {
        String name = file.getFileName().toString();
        int dot = name.lastIndexOf('.');
        return dot > 0 ? name.substring(0, dot) : name;
    }
}
