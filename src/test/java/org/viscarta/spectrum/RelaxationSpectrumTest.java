package org.viscarta.spectrum;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.viscarta.sweep.SweepPoint;

/**
 * Spectra recovered from sweeps made with known spectra (closed forms of the generalized Maxwell
 * model and numerical integration of a log-normal H(τ); DOMAIN.md 2.1): peak positions within
 * 0.25 decade and areas within 10 % at 2 % noise, and the data reproduced within the noise.
 */
@Tag("validation")
class RelaxationSpectrumTest {

    /** 41 frequencies 0.01–100 Hz, moduli from {@code model}, 2 % relative noise on each. */
    static List<SweepPoint> sweep(java.util.function.DoubleFunction<double[]> model, long seed, double noise) {
        SplittableRandom rng = new SplittableRandom(seed);
        List<SweepPoint> pts = new ArrayList<>();
        for (int i = 0; i < 41; i++) {
            double f = 0.01 * Math.pow(1e4, i / 40.0);
            double[] m = model.apply(2 * Math.PI * f);
            pts.add(new SweepPoint(f, m[0] * Math.exp(noise * rng.nextGaussian()), m[1] * Math.exp(noise * rng.nextGaussian()), i + 2));
        }
        return pts;
    }

    /** Local maxima of H on the grid, as log10 τ. */
    private static List<Double> peaks(RelaxationSpectrum.Result r) {
        List<Double> out = new ArrayList<>();
        double[] h = r.h();
        double top = java.util.Arrays.stream(h).max().orElse(0);
        for (int j = 1; j + 1 < h.length; j++) {
            if (h[j] > h[j - 1] && h[j] >= h[j + 1] && h[j] > 0.05 * top) {
                out.add(Math.log10(r.tau()[j]));
            }
        }
        return out;
    }

    /** ∫ H d ln τ over log10 τ in [from, to). */
    private static double area(RelaxationSpectrum.Result r, double from, double to) {
        double d = Math.log(r.tau()[1] / r.tau()[0]);
        double s = 0;
        for (int j = 0; j < r.tau().length; j++) {
            double lt = Math.log10(r.tau()[j]);
            if (lt >= from && lt < to) {
                s += r.h()[j] * d;
            }
        }
        return s;
    }

    @Test
    void twoDiscreteModesAreFoundWhereTheyAreWithTheirStrengths() {
        double[] e = {1e5, 2e4};
        double[] t = {0.01, 1.0};
        double ee = 1e3;
        List<SweepPoint> data = sweep(w -> {
            double re = ee;
            double im = 0;
            for (int i = 0; i < 2; i++) {
                double x = w * t[i];
                re += e[i] * x * x / (1 + x * x);
                im += e[i] * x / (1 + x * x);
            }
            return new double[] {re, im};
        }, 17, 0.02);
        RelaxationSpectrum.Result r = RelaxationSpectrum.of(data, RelaxationSpectrum.Kind.RELAXATION);
        List<Double> p = peaks(r);
        assertEquals(2, p.size(), "two peaks: " + p);
        assertEquals(-2, p.get(0), 0.25, "fast mode at 0.01 s");
        assertEquals(0, p.get(1), 0.25, "slow mode at 1 s");
        assertEquals(1e5, area(r, -9, -1), 0.1 * 1e5, "strength of the fast mode");
        assertEquals(2e4, area(r, -1, 9), 0.1 * 2e4, "strength of the slow mode");
        assertTrue(r.rmsRelative() < 0.03, "data reproduced within the 2 % noise: RMS " + r.rmsRelative());
        for (SweepPoint pt : data) {
            double[] m = r.predict(2 * Math.PI * pt.frequencyHz());
            assertEquals(pt.storage(), m[0], 0.08 * pt.storage(), "E′ at " + pt.frequencyHz());
            assertEquals(pt.loss(), m[1], 0.08 * pt.loss(), "E″ at " + pt.frequencyHz());
        }
    }

    @Test
    void aLogNormalSpectrumIsRecoveredWithItsPeakAndArea() {
        double a = 1e4;
        double centre = -1; // log10 τ0, τ0 = 0.1 s
        double width = 0.4; // decades
        double areaTrue = a * Math.sqrt(2 * Math.PI) * width * Math.log(10);
        List<SweepPoint> data = sweep(w -> {
            double re = 0;
            double im = 0;
            int n = 4000;
            double lo = centre - 8 * width;
            double step = 16 * width / n;
            for (int k = 0; k <= n; k++) {
                double lt = lo + k * step;
                double h = a * Math.exp(-0.5 * Math.pow((lt - centre) / width, 2));
                double x = w * Math.pow(10, lt);
                double wt = (k == 0 || k == n ? 0.5 : 1) * step * Math.log(10);
                re += h * x * x / (1 + x * x) * wt;
                im += h * x / (1 + x * x) * wt;
            }
            return new double[] {re, im};
        }, 23, 0.02);
        RelaxationSpectrum.Result r = RelaxationSpectrum.of(data, RelaxationSpectrum.Kind.RELAXATION);
        List<Double> p = peaks(r);
        assertEquals(1, p.size(), "one peak: " + p);
        assertEquals(centre, p.get(0), 0.25);
        assertEquals(areaTrue, area(r, -9, 9), 0.1 * areaTrue);
        assertTrue(r.constant() < 0.05 * areaTrue, "no equilibrium modulus: " + r.constant());
    }

    @Test
    void theRetardationSpectrumOfAMaxwellLiquidGivesItsViscosity() {
        // a single Maxwell element E = 1e4 Pa, τ = 0.1 s: J* = 1/E + 1/(iωη), η = 1e3 Pa·s, no retardation
        List<SweepPoint> data = sweep(w -> {
            double x = w * 0.1;
            return new double[] {1e4 * x * x / (1 + x * x), 1e4 * x / (1 + x * x)};
        }, 5, 0.01);
        RelaxationSpectrum.Result r = RelaxationSpectrum.of(data, RelaxationSpectrum.Kind.RETARDATION);
        assertEquals(1e-3, r.fluidity(), 0.1e-3, "1/η0 = 1/(Eτ)");
        assertEquals(1e-4, r.constant(), 0.1e-4, "J_g = 1/E");
    }

    /**
     * The same regularised NNLS problem solved by SciPy 1.17.1 ({@code scipy.optimize.nnls}):
     * src/test/resources/scipy/spectrum_nnls.py wrote the sweep and the solutions at λ = 0.1 and 0.01
     * beside it. Agreement to 1e-6 of the largest H.
     */
    @Test
    void theInversionAgreesWithScipysNnls() throws Exception {
        java.nio.file.Path dir = java.nio.file.Path.of(RelaxationSpectrumTest.class.getResource("/scipy/spectrum_nnls.out").toURI()).getParent();
        List<SweepPoint> data = new org.viscarta.io.SweepReader(null).read(dir.resolve("spectrum_sweep.csv")).sweeps().get(0).points();
        List<String> lines = java.nio.file.Files.readAllLines(dir.resolve("spectrum_nnls.out"));
        int checked = 0;
        for (int i = 0; i < lines.size(); i++) {
            if (!lines.get(i).startsWith("lambda ")) {
                continue;
            }
            double lambda = Double.parseDouble(lines.get(i).substring(7));
            double[] h = java.util.Arrays.stream(lines.get(i + 1).substring(2).trim().split(" ")).mapToDouble(Double::parseDouble).toArray();
            double constant = Double.parseDouble(lines.get(i + 2).substring(9));
            RelaxationSpectrum.Result r = RelaxationSpectrum.at(data, RelaxationSpectrum.Kind.RELAXATION, lambda);
            assertEquals(h.length, r.h().length, "the same τ grid");
            double top = java.util.Arrays.stream(h).max().orElseThrow();
            for (int j = 0; j < h.length; j++) {
                assertEquals(h[j], r.h()[j], 1e-6 * top, "H at τ index " + j + ", λ = " + lambda);
            }
            assertEquals(constant, r.constant(), 1e-6 * top, "E_e, λ = " + lambda);
            checked++;
        }
        assertEquals(2, checked);
    }

    /**
     * The λ scan's fast path (normal equations, Cholesky) chooses the λ that scoring every λ of the
     * grid through the QR path of {@link RelaxationSpectrum#at} chooses (the path checked against
     * SciPy above), on 40 random sweeps of one or two modes, both kinds, 2–10 % noise.
     */
    @Test
    void theFastLambdaScanChoosesWhatTheFullScanChooses() {
        SplittableRandom rng = new SplittableRandom(29);
        int same = 0;
        for (int trial = 0; trial < 40; trial++) {
            double e1 = Math.pow(10, rng.nextDouble(3, 6));
            double t1 = Math.pow(10, rng.nextDouble(-3, 1));
            double e2 = rng.nextBoolean() ? 0 : Math.pow(10, rng.nextDouble(3, 6));
            double t2 = Math.pow(10, rng.nextDouble(-3, 1));
            double ee = rng.nextBoolean() ? 0 : Math.pow(10, rng.nextDouble(2, 5));
            List<SweepPoint> data = sweep(w -> {
                double x1 = w * t1;
                double x2 = w * t2;
                return new double[] {ee + e1 * x1 * x1 / (1 + x1 * x1) + e2 * x2 * x2 / (1 + x2 * x2),
                    e1 * x1 / (1 + x1 * x1) + e2 * x2 / (1 + x2 * x2)};
            }, trial, rng.nextDouble(0.02, 0.10));
            RelaxationSpectrum.Kind kind = trial % 2 == 0 ? RelaxationSpectrum.Kind.RELAXATION : RelaxationSpectrum.Kind.RETARDATION;
            RelaxationSpectrum.Result best = null;
            for (int k = 0; k < 26; k++) {
                RelaxationSpectrum.Result r = RelaxationSpectrum.at(data, kind, Math.pow(10, -4 + 5.0 * k / 25));
                if (best == null || r.gcv() < best.gcv()) {
                    best = r;
                }
            }
            RelaxationSpectrum.Result fast = RelaxationSpectrum.of(data, kind);
            assertEquals(best.gcv(), fast.gcv(), 1e-6 * best.gcv(), "GCV at the λ chosen, trial " + trial);
            same += fast.lambda() == best.lambda() ? 1 : 0;
        }
        assertEquals(40, same, "the same λ in every trial");
    }

    /**
     * The moments' standard errors from the packed covariance equal gᵀCg worked by hand: grid τ = 1,
     * 10, 100 s (d = ln 10), C = [[4, 1, 0], [1, 9, −2], [0, −2, 16]] (lower triangle packed as
     * 4; 1, 9; 0, −2, 16), scale 2. For p = 0, g = d(1, 1, 1): gᵀCg = d²(4 + 9 + 16 + 2·1 + 2·0 − 2·2)
     * = 27 d²; for p = 1, g = d(1, 10, 100): d²(4 + 900 + 160000 + 2·10 + 0 − 2·2·1000) = 156924 d².
     */
    @Test
    void momentStandardErrorsFromThePackedCovariance() {
        double[] tau = {1, 10, 100};
        double[] h = {1, 2, 3};
        RelaxationSpectrum.Result r = new RelaxationSpectrum.Result(RelaxationSpectrum.Kind.RELAXATION, tau, h, h, h, 0, 0,
                Double.NaN, 1, 1, 0, 3, new double[] {4, 1, 9, 0, -2, 16}, 2);
        double d = Math.log(10);
        assertEquals(d * (1 + 2 + 3), r.moment(0)[0], 1e-12);
        assertEquals(2 * d * Math.sqrt(27), r.moment(0)[1], 1e-12);
        assertEquals(d * (1 + 20 + 300), r.moment(1)[0], 1e-12);
        assertEquals(2 * d * Math.sqrt(156924), r.moment(1)[1], 1e-9);
    }
}
