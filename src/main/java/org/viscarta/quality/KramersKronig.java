package org.viscarta.quality;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import org.viscarta.fit.HouseholderSolve;
import org.viscarta.sweep.Numbers;
import org.viscarta.sweep.SweepPoint;

/**
 * Kramers–Kronig consistency of one sweep by the linear Kramers–Kronig test of Schönleber, Klotz &amp;
 * Ivers-Tiffée (2014), Electrochimica Acta 131:20–27, carried over from impedance to moduli: the
 * measured E* is fitted, by linear least squares on relative residuals, with a model that is causal
 * and linear by construction — Maxwell elements on a fixed grid of relaxation times (three a decade
 * over 1/ω_max … 1/ω_min widened by half a decade each side, amplitudes of either sign), an
 * equilibrium modulus and a high-frequency viscous term iωη (which take up what lies beyond). Any consistent pair E′, E″ is fitted
 * to within its noise; where the residuals exceed the noise, E′ and E″ contradict each other (a
 * wrong phase calibration, inertia or resonance of the instrument, nonlinearity). The local
 * approximation E″ ≈ (π/2) dE′/d ln ω is not used: it fails for narrow spectra.
 *
 * <p>The noise of each component is estimated apart from the test, from its own scatter
 * ({@link #smoothNoise}); a residual counts when it exceeds three times that noise and at least 5 %
 * (a convention of this product). Verdict: fail when two or more neighbouring frequencies exceed
 * it, warn when two or more scattered ones do, pass otherwise.
 */
public final class KramersKronig {

    static final double MIN_NOISE = 0.005;
    static final double MIN_LIMIT = 0.05;
    private static final int PER_DECADE = 3;
    private static final double MARGIN = 0.5;

    /**
     * @param departure the largest residual as |ln(measured / fitted)|
     * @param limit     the limit of the component where it occurred
     * @param fromHz    lowest frequency beyond its limit (NaN when none)
     * @param toHz      highest frequency beyond its limit (NaN when none)
     * @param residualNoise the RMS relative residual of the causal fit, per degree of freedom: the noise
     *                  of a consistent sweep
     */
    public record Result(Verdict verdict, double departure, double limit, double fromHz, double toHz, String message,
                         double residualNoise) {
    }

    private KramersKronig() {
    }

    public static Result check(List<SweepPoint> sweep) {
        List<SweepPoint> pts = new ArrayList<>();
        for (SweepPoint p : sweep) {
            if (p.storage() > 0 && p.loss() > 0) {
                pts.add(p);
            }
        }
        pts.sort(Comparator.comparingDouble(SweepPoint::frequencyHz));
        int n = pts.size();
        double wMin = pts.isEmpty() ? 0 : pts.get(0).omega();
        double wMax = pts.isEmpty() ? 0 : pts.get(n - 1).omega();
        double decades = n == 0 ? 0 : Math.log10(wMax / wMin);
        int m = (int) Math.ceil((decades + 2 * MARGIN) * PER_DECADE) + 1;
        int cols = m + 2;
        long distinct = pts.stream().mapToDouble(SweepPoint::frequencyHz).distinct().count();
        if (distinct < 8 || 2 * distinct < cols + 4) { // also too few for the noise estimate
            return new Result(Verdict.WARN, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                    "too few frequencies (" + distinct + ") to test E′ and E″ against each other", Double.NaN);
        }
        double[] tau = new double[m];
        for (int j = 0; j < m; j++) {
            tau[j] = Math.pow(10, Math.log10(1 / wMax) - MARGIN + (decades + 2 * MARGIN) * j / Math.max(1, m - 1));
        }
        double[][] a = design(pts, tau, wMax);
        double[] b = new double[2 * n];
        java.util.Arrays.fill(b, 1);
        double[] x;
        try {
            x = HouseholderSolve.solve(a, b, 1e-12);
        } catch (org.apache.commons.math3.linear.SingularMatrixException e) {
            return new Result(Verdict.WARN, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                    "the frequencies are too close together to test E′ and E″ against each other", Double.NaN);
        }
        double noiseStorage = smoothNoise(pts, true);
        double noiseLoss = smoothNoise(pts, false);
        double limitStorage = Math.max(MIN_LIMIT, 3 * noiseStorage);
        double limitLoss = Math.max(MIN_LIMIT, 3 * noiseLoss);
        double worst = 0;
        double worstLimit = Math.min(limitStorage, limitLoss);
        int beyond = 0;
        int run = 0;
        int longestRun = 0;
        double from = Double.NaN;
        double to = Double.NaN;
        double ss = 0;
        for (int i = 0; i < n; i++) {
            double fs = 0;
            double fl = 0;
            for (int j = 0; j < cols; j++) {
                fs += a[2 * i][j] * x[j];
                fl += a[2 * i + 1][j] * x[j];
            }
            ss += (fs - 1) * (fs - 1) + (fl - 1) * (fl - 1);
            // fitted/measured, as a ratio; a non-positive fit is as far off as it gets
            double ds = fs > 0 ? Math.abs(Math.log(fs)) : Double.POSITIVE_INFINITY;
            double dl = fl > 0 ? Math.abs(Math.log(fl)) : Double.POSITIVE_INFINITY;
            boolean out = ds > limitStorage || dl > limitLoss;
            if (ds / limitStorage > worst / worstLimit || dl / limitLoss > worst / worstLimit) {
                boolean storageWorse = ds / limitStorage >= dl / limitLoss;
                worst = storageWorse ? ds : dl;
                worstLimit = storageWorse ? limitStorage : limitLoss;
            }
            if (out) {
                beyond++;
                run++;
                longestRun = Math.max(longestRun, run);
                double f = pts.get(i).frequencyHz();
                from = Double.isNaN(from) ? f : Math.min(from, f);
                to = Double.isNaN(to) ? f : Math.max(to, f);
            } else {
                run = 0;
            }
        }
        // one point beyond three times the noise happens by chance in a sweep of dozens
        Verdict v = longestRun >= 2 ? Verdict.FAIL : beyond >= 2 ? Verdict.WARN : Verdict.PASS;
        String msg = v == Verdict.PASS
                ? "E′ and E″ are a consistent pair: a causal, linear material describes both within their noise (limits "
                        + Numbers.fixed(100 * (Math.exp(limitStorage) - 1), 0) + " % and " + Numbers.fixed(100 * (Math.exp(limitLoss) - 1), 0)
                        + " %: three times the noise, at least " + Numbers.fixed(100 * MIN_LIMIT, 0) + " %)"
                : String.format(Locale.ROOT, "E′ and E″ %s each other at %d frequenc%s between %s and %s Hz: no causal, linear "
                        + "material describes both there, off by up to %.0f %% (limit %.0f %%, three times the noise); check the "
                        + "instrument's phase calibration, inertia or resonance, and linearity", v == Verdict.FAIL ? "contradict"
                        : "depart from", beyond, beyond == 1 ? "y" : "ies", Numbers.readable(from), Numbers.readable(to),
                        100 * (Math.exp(worst) - 1), 100 * (Math.exp(worstLimit) - 1));
        double residualNoise = Math.sqrt(ss / Math.max(1, 2 * n - cols)); // the scatter about the causal fit
        return new Result(v, worst, worstLimit, from, to, msg, residualNoise);
    }

    /**
     * The design matrix of the causal fit, each row divided by its measured modulus (so that residuals
     * are relative) and each column scaled to unit norm for a well-conditioned QR: Maxwell elements
     * of relaxation times tau, then the equilibrium modulus and a high-frequency viscosity (scaled to
     * order one by wMax). Kept apart from {@link #check} so that the compiler optimises this loop early.
     */
    private static double[][] design(List<SweepPoint> pts, double[] tau, double wMax) {
        int n = pts.size();
        int m = tau.length;
        int cols = m + 2;
        double[][] a = new double[2 * n][cols];
        for (int i = 0; i < n; i++) {
            SweepPoint p = pts.get(i);
            double w = p.omega();
            double[] st = a[2 * i];
            double[] lo = a[2 * i + 1];
            double invStorage = 1 / p.storage();
            double invLoss = 1 / p.loss();
            for (int j = 0; j < m; j++) {
                double x = w * tau[j];
                double d = 1 / (1 + x * x);
                st[j] = x * x * d * invStorage;
                lo[j] = x * d * invLoss;
            }
            st[m] = invStorage; // equilibrium modulus
            lo[m + 1] = w / wMax * invLoss; // high-frequency viscosity, scaled to order one
        }
        double[] norm = new double[cols];
        for (double[] row : a) {
            for (int j = 0; j < cols; j++) {
                norm[j] += row[j] * row[j];
            }
        }
        for (int j = 0; j < cols; j++) {
            norm[j] = norm[j] > 0 ? 1 / Math.sqrt(norm[j]) : 1;
        }
        for (double[] row : a) {
            for (int j = 0; j < cols; j++) {
                row[j] *= norm[j];
            }
        }
        return a;
    }

    /**
     * The relative noise of one component from its own scatter, apart from the test: pseudo-residuals
     * e_i = (y_{i−1} + y_{i+1})/2 − y_i of y = ln E′ (or ln E″) along the frequencies, whose variance is
     * 1.5 σ² for white noise (Gasser, Sroka &amp; Jennen-Steinmetz 1986, Biometrika 73:625–633), taken
     * robustly as 1.4826 × their median absolute value (so that a local defect does not raise it);
     * at least {@link #MIN_NOISE}.
     */
    static double smoothNoise(List<SweepPoint> pts, boolean storage) {
        int n = pts.size();
        double[] e = new double[n - 2];
        for (int i = 1; i + 1 < n; i++) {
            double y0 = Math.log(storage ? pts.get(i - 1).storage() : pts.get(i - 1).loss());
            double y1 = Math.log(storage ? pts.get(i).storage() : pts.get(i).loss());
            double y2 = Math.log(storage ? pts.get(i + 1).storage() : pts.get(i + 1).loss());
            e[i - 1] = Math.abs((y0 + y2) / 2 - y1);
        }
        java.util.Arrays.sort(e);
        double median = e.length % 2 == 1 ? e[e.length / 2] : (e[e.length / 2 - 1] + e[e.length / 2]) / 2;
        return Math.max(MIN_NOISE, 1.4826 * median / Math.sqrt(1.5));
    }
}
