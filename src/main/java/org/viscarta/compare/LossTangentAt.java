package org.viscarta.compare;

import java.util.List;
import java.util.Optional;
import org.viscarta.sweep.SweepPoint;

/**
 * The loss tangent of one sweep at a reference frequency, interpolated linearly in log M′ and
 * log M″ against log f between the two measured points that bracket it (common practice [P]; the
 * moduli of viscoelastic solids are close to straight in log–log axes between neighbouring points).
 * Outside the measured range there is no value: the caller decides whether a model may speak there.
 */
public final class LossTangentAt {

    /**
     * The interpolated values.
     *
     * @param frequencyHz reference frequency [Hz]
     * @param storage     M′ [Pa]
     * @param loss        M″ [Pa]
     */
    public record Value(double frequencyHz, double storage, double loss) {
        public double lossTangent() {
            return loss / storage;
        }
    }

    private LossTangentAt() {
    }

    /**
     * @param points      measured points sorted by frequency, with positive moduli
     * @param frequencyHz the reference frequency [Hz]
     * @return the interpolated values, or empty when {@code frequencyHz} lies outside the measured range
     */
    public static Optional<Value> interpolate(List<SweepPoint> points, double frequencyHz) {
        if (points.isEmpty()) {
            return Optional.empty();
        }
        for (SweepPoint p : points) {
            if (p.frequencyHz() == frequencyHz) {
                return Optional.of(new Value(frequencyHz, p.storage(), p.loss()));
            }
        }
        for (int i = 1; i < points.size(); i++) {
            SweepPoint a = points.get(i - 1);
            SweepPoint b = points.get(i);
            if (a.frequencyHz() < frequencyHz && frequencyHz < b.frequencyHz()) {
                double w = Math.log(frequencyHz / a.frequencyHz()) / Math.log(b.frequencyHz() / a.frequencyHz());
                return Optional.of(new Value(frequencyHz, logInterp(a.storage(), b.storage(), w),
                        logInterp(a.loss(), b.loss(), w)));
            }
        }
        return Optional.empty();
    }

    /** Points of the log grid over which {@link #overBand} averages. */
    private static final int BAND_POINTS = 21;

    /**
     * Geometric means of M′, M″ (and so of tan δ) over a frequency band, from the log–log
     * interpolated values on a log-spaced grid of 21 frequencies spanning it.
     *
     * @return the means (frequencyHz is the band's geometric centre), or empty when the band is not
     *         wholly inside the measured range
     */
    public static Optional<Value> overBand(List<SweepPoint> points, double lowHz, double highHz) {
        double sumS = 0;
        double sumL = 0;
        for (int k = 0; k < BAND_POINTS; k++) {
            double f = k == BAND_POINTS - 1 ? highHz : lowHz * Math.pow(highHz / lowHz, k / (double) (BAND_POINTS - 1));
            Optional<Value> v = interpolate(points, f);
            if (v.isEmpty()) {
                return Optional.empty();
            }
            sumS += Math.log(v.get().storage());
            sumL += Math.log(v.get().loss());
        }
        return Optional.of(new Value(Math.sqrt(lowHz * highHz), Math.exp(sumS / BAND_POINTS), Math.exp(sumL / BAND_POINTS)));
    }

    private static double logInterp(double a, double b, double w) {
        return Math.exp((1 - w) * Math.log(a) + w * Math.log(b));
    }
}
