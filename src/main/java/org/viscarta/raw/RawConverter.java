package org.viscarta.raw;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.apache.commons.math3.complex.Complex;
import org.viscarta.io.InputException;
import org.viscarta.io.UsageException;

/**
 * Raw oscillation signals to complex moduli: per segment, demodulation of force and displacement
 * over an integer number of cycles after the settling ones, k* = F̂/ĥ, removal of the instrument's
 * phase (from a calibration on a rigid reference) and of the hydrodynamic drag iωb(0), and the
 * geometry's conversion to E* (or G*), with the harmonic distortion of each channel.
 */
public final class RawConverter {

    /** Settings of a conversion. */
    public record Settings(int skipCycles, double distortionLimit) {
        public Settings {
            if (skipCycles < 0) {
                throw new UsageException("--skip-cycles must be >= 0");
            }
            if (!(distortionLimit > 0)) {
                throw new UsageException("the distortion limit must be > 0");
            }
        }

        /** One settling cycle skipped; 5 % distortion (a lab convention, not a standard [P]). */
        public static Settings defaults() {
            return new Settings(1, 0.05);
        }
    }

    /**
     * One drive frequency's result.
     *
     * @param frequencyHz       drive frequency
     * @param storage           M′ [Pa]
     * @param loss              M″ [Pa]
     * @param storageStdError   standard error of M′ (from the demodulation's standard errors)
     * @param lossStdError      standard error of M″
     * @param forceDistortion   THD of the force
     * @param displacementDistortion THD of the displacement
     * @param contactHarmonic   the second harmonic the contact geometry itself produces (0 when none)
     * @param cycles            cycles used
     * @param linear            whether the material's own distortion stays within the limit
     * @param note              why not, or ""
     * @param firstLine         line of the segment's first sample
     */
    public record Point(double frequencyHz, double storage, double loss, double storageStdError, double lossStdError,
                        double forceDistortion, double displacementDistortion, double contactHarmonic, int cycles, boolean linear,
                        String note, int firstLine, String calibrationNote) {
    }

    /** How a calibration corrects the measured stiffness. */
    public enum CalibrationMode {
        /** Subtract the instrument's phase φ_inst(f) measured on the rigid reference: δ_sample = δ_meas − φ_inst. */
        PHASE,
        /**
         * Remove the system's own compliance in series (a cantilever or frame): 1/k*_sample = 1/k*_meas − 1/k*_ref, with k*_ref
         * the complex stiffness measured on the rigid reference (amplitude and phase; DOMAIN.md section 5.2).
         */
        COMPLIANCE
    }

    /**
     * The instrument's transfer at each calibration frequency, measured on a rigid, elastic reference.
     *
     * @param phase     arg k*_ref [rad] (a rigid, elastic reference should show none)
     * @param magnitude |k*_ref| [N/m]
     */
    public record Calibration(double[] frequencyHz, double[] phase, double[] magnitude, CalibrationMode mode) {

        /** A delay and a constant are used between calibration points when they fit every point within this [rad] (0.1°). */
        static final double DELAY_FIT_TOLERANCE = 0.002;
        /** Neighbouring calibration frequencies further apart than this factor leave a drive frequency between them poorly covered. */
        static final double WIDE_SPACING = 3;

        public Calibration {
            frequencyHz = frequencyHz.clone();
            phase = phase.clone();
            magnitude = magnitude.clone();
        }

        public Calibration(double[] frequencyHz, double[] phase) {
            this(frequencyHz, phase, new double[frequencyHz.length], CalibrationMode.PHASE);
        }

        /** The same calibration applied the other way. */
        public Calibration withMode(CalibrationMode m) {
            return new Calibration(frequencyHz, phase, magnitude, m);
        }

        /** |k*_ref|, interpolated linearly in log f and log |k| (the range is checked by {@link #phaseAt}). */
        double magnitudeAt(double f) {
            int n = frequencyHz.length;
            int i = 1;
            while (i < n - 1 && frequencyHz[i] < f) {
                i++;
            }
            double w = Math.log(f / frequencyHz[i - 1]) / Math.log(frequencyHz[i] / frequencyHz[i - 1]);
            return Math.exp((1 - w) * Math.log(magnitude[i - 1]) + w * Math.log(magnitude[i]));
        }

        /**
         * φ_inst(f); NaN outside the calibrated range. At a calibration frequency its measured phase;
         * between them, a constant plus a delay, φ0 + 2π f τ_d, fitted to all calibration points by
         * least squares, where it fits them within {@link #DELAY_FIT_TOLERANCE} (an instrument's
         * electronics and filters act mostly as a delay: its phase grows in proportion to f, which
         * interpolation in log f misses badly); otherwise linear in f between the neighbours.
         */
        double phaseAt(double f) {
            int n = frequencyHz.length;
            if (f < frequencyHz[0] * (1 - 1e-9) || f > frequencyHz[n - 1] * (1 + 1e-9)) {
                return Double.NaN;
            }
            for (int i = 0; i < n; i++) {
                if (Math.abs(f / frequencyHz[i] - 1) < 1e-9) {
                    return phase[i];
                }
            }
            double[] delay = delayFit();
            if (delay != null && delay[2] <= DELAY_FIT_TOLERANCE) {
                return delay[0] + 2 * Math.PI * f * delay[1];
            }
            return linear(f, false);
        }

        /** The phase interpolated linearly between the neighbouring calibration points, in f or in log f. */
        private double linear(double f, boolean logF) {
            int i = 1;
            while (i < frequencyHz.length - 1 && frequencyHz[i] < f) {
                i++;
            }
            double w = logF ? Math.log(f / frequencyHz[i - 1]) / Math.log(frequencyHz[i] / frequencyHz[i - 1])
                    : (f - frequencyHz[i - 1]) / (frequencyHz[i] - frequencyHz[i - 1]);
            return (1 - w) * phase[i - 1] + w * phase[i];
        }

        /** {φ0, τ_d, largest residual} of the least-squares fit φ = φ0 + 2π f τ_d, or null with fewer than two distinct frequencies. */
        private double[] delayFit() {
            int n = frequencyHz.length;
            double mx = 0;
            double my = 0;
            for (int i = 0; i < n; i++) {
                mx += 2 * Math.PI * frequencyHz[i] / n;
                my += phase[i] / n;
            }
            double sxx = 0;
            double sxy = 0;
            for (int i = 0; i < n; i++) {
                double dx = 2 * Math.PI * frequencyHz[i] - mx;
                sxx += dx * dx;
                sxy += dx * (phase[i] - my);
            }
            if (!(sxx > 0)) {
                return null;
            }
            double tau = sxy / sxx;
            double phi0 = my - tau * mx;
            double worst = 0;
            for (int i = 0; i < n; i++) {
                worst = Math.max(worst, Math.abs(phase[i] - phi0 - 2 * Math.PI * frequencyHz[i] * tau));
            }
            return new double[] {phi0, tau, worst};
        }

        /**
         * How uncertain the interpolated phase at f is [rad]: the largest residual of the delay fit
         * where it is used, otherwise half the difference between interpolating linearly in f and in
         * log f; 0 at a calibration frequency.
         */
        double phaseUncertainty(double f) {
            for (double c : frequencyHz) {
                if (Math.abs(f / c - 1) < 1e-9) {
                    return 0;
                }
            }
            double[] delay = delayFit();
            if (delay != null && delay[2] <= DELAY_FIT_TOLERANCE) {
                return delay[2];
            }
            return Math.abs(linear(f, false) - linear(f, true)) / 2;
        }

        /** The neighbouring calibration frequencies of f when they are more than {@link #WIDE_SPACING} apart, else null. */
        double[] wideGap(double f) {
            for (double c : frequencyHz) {
                if (Math.abs(f / c - 1) < 1e-9) {
                    return null;
                }
            }
            int i = 1;
            while (i < frequencyHz.length - 1 && frequencyHz[i] < f) {
                i++;
            }
            return frequencyHz[i] / frequencyHz[i - 1] > WIDE_SPACING ? new double[] {frequencyHz[i - 1], frequencyHz[i]} : null;
        }
    }

    private RawConverter() {
    }

    /** Demodulates a calibration measurement on a rigid reference into its phase per frequency. */
    public static Calibration calibration(RawReader.Measurement m, Settings s) {
        List<double[]> rows = new ArrayList<>();
        for (RawReader.Segment seg : m.segments()) {
            Complex k = stiffness(m, seg, s);
            rows.add(new double[] {seg.frequencyHz(), k.getArgument(), k.abs()});
        }
        rows.sort((a, b) -> Double.compare(a[0], b[0]));
        if (rows.size() < 2 && rows.size() > 0) {
            rows.add(rows.get(0).clone());
        }
        return new Calibration(rows.stream().mapToDouble(r -> r[0]).toArray(), rows.stream().mapToDouble(r -> r[1]).toArray(),
                rows.stream().mapToDouble(r -> r[2]).toArray(), CalibrationMode.PHASE);
    }

    /**
     * Converts every segment.
     *
     * @param calibration null for none
     * @throws InputException for a bad geometry, too short a segment, or a frequency outside the calibration
     */
    public static List<Point> convert(RawReader.Measurement m, Settings s, Calibration calibration) {
        Geometry g = geometry(m);
        double drag = 0;
        if (m.metadata().containsKey("drag")) {
            try {
                drag = Units.drag(m.metadata(), "drag");
            } catch (IllegalArgumentException e) {
                throw new InputException(m.file(), 1, 0, e.getMessage());
            }
        }
        List<Point> out = new ArrayList<>();
        for (RawReader.Segment seg : m.segments()) {
            Demodulated d = demodulate(m, seg, s);
            if (calibration != null && Double.isNaN(calibration.phaseAt(seg.frequencyHz()))) {
                throw new InputException(m.file(), seg.firstLine(), 0, String.format(Locale.ROOT,
                        "drive frequency %.4g Hz lies outside the calibration's range (%.4g–%.4g Hz); calibrate at this frequency "
                                + "too", seg.frequencyHz(), calibration.frequencyHz()[0],
                        calibration.frequencyHz()[calibration.frequencyHz().length - 1]));
            }
            double dragCoefficient = drag;
            java.util.function.BiFunction<Complex, Complex, Complex> pipeline =
                    (force, displacement) -> modulusOf(force, displacement, seg.frequencyHz(), calibration, dragCoefficient, g);
            Complex e = pipeline.apply(d.force, d.displacement);
            double[] se = standardErrors(pipeline, d);
            double contact = g.contactSecondHarmonic(d.displacement.abs());
            double material = Math.max(0, d.forceThd - contact);
            boolean linear = material <= s.distortionLimit() && d.displacementThd <= s.distortionLimit();
            String note = linear ? "" : String.format(Locale.ROOT, "outside the linear range: force distortion %.1f %% (of which the "
                    + "contact geometry accounts for %.1f %%), displacement distortion %.1f %%, limit %.1f %%", 100 * d.forceThd,
                    100 * contact, 100 * d.displacementThd, 100 * s.distortionLimit());
            String calibrationNote = "";
            double[] gap = calibration == null ? null : calibration.wideGap(seg.frequencyHz());
            if (gap != null) {
                double u = calibration.phaseUncertainty(seg.frequencyHz());
                calibrationNote = String.format(Locale.ROOT, "drive frequency %.4g Hz lies between calibration points %.4g and %.4g Hz, "
                        + "more than %.0f times apart: the instrument phase there is interpolated and may be off by about %.2g rad "
                        + "(tan δ by about %.2g; an estimate from how well a delay fits the calibration or how far two "
                        + "interpolations differ, not a measured uncertainty); calibrate closer to this frequency", seg.frequencyHz(), gap[0], gap[1],
                        Calibration.WIDE_SPACING, u, u * (1 + Math.pow(e.getImaginary() / e.getReal(), 2)));
            }
            out.add(new Point(seg.frequencyHz(), e.getReal(), e.getImaginary(), se[0], se[1], d.forceThd,
                    d.displacementThd, contact, d.cycles, linear, note, seg.firstLine(), calibrationNote));
        }
        return out;
    }

    /**
     * The sample's complex modulus from the force and displacement phasors: stiffness k* = F/D, the
     * calibration (instrument phase removed, or the reference's compliance subtracted), the drag
     * iωb removed, and the geometry's conversion to a modulus.
     */
    private static Complex modulusOf(Complex force, Complex displacement, double frequencyHz, Calibration calibration, double drag,
                                     Geometry g) {
        Complex k = force.divide(displacement);
        if (calibration != null) {
            double phi = calibration.phaseAt(frequencyHz);
            if (calibration.mode() == CalibrationMode.PHASE) {
                k = k.multiply(new Complex(Math.cos(-phi), Math.sin(-phi)));
            } else {
                double mag = calibration.magnitudeAt(frequencyHz);
                Complex kRef = new Complex(mag * Math.cos(phi), mag * Math.sin(phi));
                k = k.reciprocal().subtract(kRef.reciprocal()).reciprocal();
            }
        }
        k = k.subtract(new Complex(0, 2 * Math.PI * frequencyHz * drag));
        return g.modulus(k);
    }

    /**
     * Standard errors of E′ and E″, each by its own first-order propagation (delta method) of the
     * covariances of the force and displacement phasors (real and imaginary parts and their
     * covariance, from the sine fits) through {@link #modulusOf}, with a numerical Jacobian.
     */
    private static double[] standardErrors(java.util.function.BiFunction<Complex, Complex, Complex> pipeline, Demodulated d) {
        double[] x = {d.force.getReal(), d.force.getImaginary(), d.displacement.getReal(), d.displacement.getImaginary()};
        double[][] cov = new double[4][4];
        cov[0][0] = d.forcePhasor.seRe() * d.forcePhasor.seRe();
        cov[1][1] = d.forcePhasor.seIm() * d.forcePhasor.seIm();
        cov[0][1] = cov[1][0] = d.forcePhasor.covReIm();
        cov[2][2] = d.displacementPhasor.seRe() * d.displacementPhasor.seRe();
        cov[3][3] = d.displacementPhasor.seIm() * d.displacementPhasor.seIm();
        cov[2][3] = cov[3][2] = d.displacementPhasor.covReIm();
        double[][] jac = new double[2][4];
        for (int j = 0; j < 4; j++) {
            double h = 1e-6 * Math.max(Math.hypot(x[j < 2 ? 0 : 2], x[j < 2 ? 1 : 3]), Double.MIN_NORMAL);
            double[] up = x.clone();
            double[] dn = x.clone();
            up[j] += h;
            dn[j] -= h;
            Complex eu = pipeline.apply(new Complex(up[0], up[1]), new Complex(up[2], up[3]));
            Complex ed = pipeline.apply(new Complex(dn[0], dn[1]), new Complex(dn[2], dn[3]));
            jac[0][j] = (eu.getReal() - ed.getReal()) / (2 * h);
            jac[1][j] = (eu.getImaginary() - ed.getImaginary()) / (2 * h);
        }
        double[] se = new double[2];
        for (int r = 0; r < 2; r++) {
            double v = 0;
            for (int i = 0; i < 4; i++) {
                for (int j = 0; j < 4; j++) {
                    v += jac[r][i] * cov[i][j] * jac[r][j];
                }
            }
            se[r] = Math.sqrt(Math.max(v, 0));
        }
        return se;
    }

    /**
     * The geometry of a measurement. Without an {@code indentation_depth}, a {@code contact_point}
     * (the displacement, or position minus deflection, at first contact) gives the static depth as the
     * mean indentation of the first segment minus the contact point.
     */
    public static Geometry geometry(RawReader.Measurement m) {
        try {
            java.util.Map<String, String> meta = new java.util.LinkedHashMap<>(m.metadata());
            if (!meta.containsKey("indentation_depth") && meta.containsKey("contact_point")) {
                double contact = Units.length(meta, "contact_point");
                double[] d = m.segments().get(0).displacement();
                double mean = java.util.Arrays.stream(d).average().orElseThrow();
                if (!(mean - contact > 0)) {
                    throw new IllegalArgumentException("the mean indentation does not exceed the contact point; check '# contact_point:'");
                }
                meta.put("indentation_depth", (mean - contact) + " m");
            }
            return Geometry.from(meta);
        } catch (IllegalArgumentException e) {
            throw new InputException(m.file(), 1, 0, e.getMessage());
        }
    }

    private record Demodulated(Complex force, Complex displacement, Demodulator.Phasor forcePhasor,
                               Demodulator.Phasor displacementPhasor, double forceThd, double displacementThd, int cycles) {
    }

    private static Complex stiffness(RawReader.Measurement m, RawReader.Segment seg, Settings s) {
        Demodulated d = demodulate(m, seg, s);
        return d.force.divide(d.displacement);
    }

    private static Demodulated demodulate(RawReader.Measurement m, RawReader.Segment seg, Settings s) {
        double f = seg.frequencyHz();
        double[] t = seg.time();
        double start = t[0] + s.skipCycles() / f;
        // the last sample stands for the interval up to the next one: n samples at spacing dt span n·dt
        double dt = t.length > 1 ? (t[t.length - 1] - t[0]) / (t.length - 1) : 0;
        int cycles = (int) Math.floor((t[t.length - 1] + dt - start) * f + 1e-6);
        if (cycles < 2) {
            throw new InputException(m.file(), seg.firstLine(), 0, String.format(Locale.ROOT, "the %.4g Hz segment holds fewer than "
                    + "2 cycles after %d settling cycle(s); record longer or lower --skip-cycles", f, s.skipCycles()));
        }
        double end = start + cycles / f;
        int from = 0;
        while (from < t.length && t[from] < start - 1e-12) {
            from++;
        }
        int to = from;
        while (to < t.length && t[to] < end - 1e-12) {
            to++;
        }
        double[] tt = Arrays.copyOfRange(t, from, to);
        Demodulator.Phasor pf = Demodulator.fit(tt, Arrays.copyOfRange(seg.force(), from, to), f);
        Demodulator.Phasor ph = Demodulator.fit(tt, Arrays.copyOfRange(seg.displacement(), from, to), f);
        return new Demodulated(new Complex(pf.re(), pf.im()), new Complex(ph.re(), ph.im()), pf, ph, pf.distortion(), ph.distortion(),
                cycles);
    }
}
