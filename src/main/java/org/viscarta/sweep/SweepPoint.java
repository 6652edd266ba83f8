package org.viscarta.sweep;

/**
 * One measured frequency of a sweep, in SI units.
 *
 * @param frequencyHz  cyclic frequency f [Hz], finite and positive
 * @param storage      storage modulus M′ [Pa], finite and positive
 * @param loss         loss modulus M″ [Pa], finite (zero or negative values are kept but flagged)
 * @param line         the line of the input file the point came from (1-based), or 0 when made in memory
 * @param amplitude    the oscillation amplitude in SI units of the sweep's amplitude column (strain as a
 *                     fraction, stress in Pa, force in N, displacement in m), NaN when the input gives none
 */
public record SweepPoint(double frequencyHz, double storage, double loss, int line, double amplitude) {

    /** A point without an amplitude. */
    public SweepPoint(double frequencyHz, double storage, double loss, int line) {
        this(frequencyHz, storage, loss, line, Double.NaN);
    }

    public SweepPoint {
        if (!(frequencyHz > 0) || Double.isInfinite(frequencyHz)) {
            throw new IllegalArgumentException("frequency must be finite and > 0 Hz, got " + frequencyHz);
        }
        if (!(storage > 0) || Double.isInfinite(storage)) {
            throw new IllegalArgumentException("storage modulus must be finite and > 0 Pa, got " + storage);
        }
        if (!Double.isFinite(loss)) {
            throw new IllegalArgumentException("loss modulus must be finite, got " + loss);
        }
    }

    /** Angular frequency ω = 2πf [rad/s]. */
    public double omega() {
        return 2.0 * Math.PI * frequencyHz;
    }

    /** Loss tangent tan δ = M″/M′. */
    public double lossTangent() {
        return loss / storage;
    }

    /** |M*| = sqrt(M′² + M″²) [Pa]. */
    public double magnitude() {
        return Math.hypot(storage, loss);
    }

    /** Phase angle δ = atan2(M″, M′) [rad]. */
    public double phaseAngle() {
        return Math.atan2(loss, storage);
    }

    /** True when the point can enter a fit on log moduli (both moduli positive). */
    public boolean usableInLogFit() {
        return loss > 0;
    }

    /** The same point with both moduli multiplied by {@code factor} (basis conversion). */
    public SweepPoint scaled(double factor) {
        return new SweepPoint(frequencyHz, storage * factor, loss * factor, line, amplitude);
    }
}
