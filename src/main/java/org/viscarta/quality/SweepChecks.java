package org.viscarta.quality;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
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

    /**
     * One verdict.
     *
     * @param check   the check's id: kramers-kronig, points-per-decade, frequency-span, loss-modulus-sign, noise
     * @param verdict pass, warn or fail
     * @param value   the measured value (NaN when none)
     * @param limit   the limit it is held to (NaN when none)
     */
    public record Check(String sample, String replicate, String check, Verdict verdict, double value, double limit,
                        String message) {
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
                MIN_SPAN_DECADES, String.format(Locale.ROOT, "the sweep spans %.2f decades of frequency%s", span,
                        span >= MIN_SPAN_DECADES ? "" : "; less than one decade tells little about how the material changes with rate")));
        out.add(check(s, "points-per-decade", perDecade >= MIN_POINTS_PER_DECADE ? Verdict.PASS : Verdict.WARN,
                perDecade, MIN_POINTS_PER_DECADE, String.format(Locale.ROOT, "%.1f frequencies a decade%s", perDecade,
                        perDecade >= MIN_POINTS_PER_DECADE ? "" : "; fewer than three leave a model's shape poorly pinned down")));
        long nonPositive = pts.stream().filter(p -> !(p.loss() > 0)).count();
        out.add(check(s, "loss-modulus-sign", nonPositive == 0 ? Verdict.PASS : Verdict.FAIL, nonPositive, 0,
                nonPositive == 0 ? "every loss modulus is positive" : nonPositive + " point(s) with a loss modulus of zero or below: "
                        + "no passive material dissipates negative energy; check the phase calibration"));
        List<SweepPoint> usable = s.fittablePoints();
        KramersKronig.Result kk = KramersKronig.check(usable);
        if (Double.isFinite(kk.residualNoise())) {
            double noise = kk.residualNoise();
            out.add(check(s, "noise", noise <= NOISE_WARN ? Verdict.PASS : Verdict.WARN, noise, NOISE_WARN,
                    String.format(Locale.ROOT, "scatter of the moduli about a smooth, causal curve: about %.1f %%%s", 100 * noise,
                            noise <= NOISE_WARN ? "" : ", more than 5 %: replicates or a longer measurement would help")));
        }
        out.add(check(s, "kramers-kronig", kk.verdict(), kk.departure(), kk.limit(), kk.message()));
        return out;
    }

    private static Check check(Sweep s, String id, Verdict v, double value, double limit, String message) {
        return new Check(s.sample(), s.replicate(), id, v, value, limit, message);
    }
}
