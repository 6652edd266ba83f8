package org.viscarta.spectrum;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.viscarta.sweep.SweepPoint;

/**
 * The continuous relaxation spectrum H(τ) — or the retardation spectrum L(τ) — that a frequency
 * sweep supports, by Tikhonov-regularised non-negative least squares.
 *
 * <p>Relaxation (Ferry 1980, Viscoelastic Properties of Polymers, ch. 3; Tschoegl 1989, ch. 4):
 * \[ E'(\omega) = E_e + \int H(\tau)\frac{\omega^2\tau^2}{1+\omega^2\tau^2}\,d\ln\tau,\quad
 *    E''(\omega) = \int H(\tau)\frac{\omega\tau}{1+\omega^2\tau^2}\,d\ln\tau. \]
 * Retardation, on the compliances J* = 1/E*:
 * \[ J'(\omega) = J_g + \int L(\tau)\frac{1}{1+\omega^2\tau^2}\,d\ln\tau,\quad
 *    J''(\omega) = \int L(\tau)\frac{\omega\tau}{1+\omega^2\tau^2}\,d\ln\tau + \frac{1}{\omega\eta_0}. \]
 * The spectrum lives on a log-spaced grid of τ (ten points a decade) over the measured window
 * 1/ω_max … 1/ω_min widened by half a decade each side (the margin); beyond it the data say
 * nothing. Residuals are relative (each row divided by its measured value); the penalty is λ² times
 * the squared second differences of the spectrum (smoothness). The equilibrium modulus E_e (or
 * J_g and the fluidity 1/η0) is a non-negative unknown of its own.
 *
 * <p>λ is chosen by generalised cross-validation, GCV(λ) = n·RSS/(n − tr A_λ)², on a log grid of λ
 * (Honerkamp &amp; Weese 1989, Macromolecules 22:4372, regularise the same inverse problem; Wahba
 * 1977 and Golub, Heath &amp; Wahba 1979, Technometrics 21:215, for GCV), with the influence matrix
 * A_λ of the unconstrained problem on the non-zero entries. The uncertainty band comes from the
 * same linearisation: Cov = σ² M⁻¹ KᵀK M⁻¹, M = KᵀK + λ²LᵀL, σ² = RSS/(n − tr A_λ); it is
 * conditional on which entries are zero, and the smoothing bias is not in it.
 */
public final class RelaxationSpectrum {

    /**
     * Fewest distinct frequencies a spectrum is computed from: with fewer, the regularised solution
     * degenerates into a spike per frequency (a convention of this product).
     */
    public static final int MIN_FREQUENCIES = 8;
    /** Points of the τ grid per decade. */
    static final int PER_DECADE = 10;
    /** Decades the grid reaches beyond the measured window on each side. */
    public static final double MARGIN_DECADES = 0.5;
    /** The λ grid: 10^LAMBDA_LOW … 10^LAMBDA_HIGH. */
    private static final double LAMBDA_LOW = -4;
    private static final double LAMBDA_HIGH = 1;
    private static final int LAMBDA_STEPS = 26;

    /** In words, when the λ chosen lies at an end of the range searched ("" otherwise). */
    public static String lambdaAtLimit(Result r) {
        if (r.lambda() >= Math.pow(10, LAMBDA_HIGH) * 0.999) {
            return " (the largest λ searched: the data would take still smoother spectra)";
        }
        if (r.lambda() <= Math.pow(10, LAMBDA_LOW) * 1.001) {
            return " (the smallest λ searched: the spectrum is hardly smoothed)";
        }
        return "";
    }

    /** Relaxation H(τ) from E′, E″; or retardation L(τ) from J′, J″. */
    public enum Kind {
        RELAXATION, RETARDATION
    }

    /**
     * The result.
     *
     * @param tau          the grid [s]
     * @param h            H(τ) [Pa] (or L(τ) [1/Pa])
     * @param low          lower end of the 95 % band (clipped at 0)
     * @param high         upper end of the 95 % band
     * @param constant     E_e [Pa] (or J_g [1/Pa])
     * @param constantSe   its standard error
     * @param fluidity     1/η0 [1/(Pa·s)] for the retardation spectrum, NaN for relaxation
     * @param lambda       the regularisation parameter chosen
     * @param gcv          the GCV score at λ
     * @param rmsRelative  RMS relative misfit of the data
     * @param points       data points used
     * @param covariance   the covariance of the scaled H(τ_j), packed: its lower triangle row by row, entry (i, j ≤ i)
     *                     at i(i + 1)/2 + j (half the memory of the square, which for a 10,000-sample campaign was
     *                     a hundred megabytes held until the report was written)
     * @param scale        the scale of H(τ): standard errors are those of the scaled values times it
     */
    public record Result(Kind kind, double[] tau, double[] h, double[] low, double[] high, double constant, double constantSe,
                         double fluidity, double lambda, double gcv, double rmsRelative, int points, double[] covariance,
                         double scale) {

        /** gᵀ C g for the packed covariance C. */
        private double variance(double[] g) {
            double var = 0;
            int at = 0;
            for (int i = 0; i < g.length; i++) {
                double off = 0;
                for (int j = 0; j < i; j++) {
                    off += covariance[at++] * g[j];
                }
                var += g[i] * (2 * off + covariance[at++] * g[i]);
            }
            return var;
        }

        /** Modulus (or compliance) predicted at ω: {storage-like, loss-like}. */
        public double[] predict(double omega) {
            double d = Math.log(tau[1] / tau[0]);
            double re = constant;
            double im = kind == Kind.RETARDATION && fluidity > 0 ? fluidity / omega : 0;
            for (int j = 0; j < tau.length; j++) {
                double x = omega * tau[j];
                double den = 1 + x * x;
                re += h[j] * d * (kind == Kind.RELAXATION ? x * x / den : 1 / den);
                im += h[j] * d * x / den;
            }
            return new double[] {re, im};
        }

        /** ∫ H(τ) τ^p d ln τ for p = 0 (the modulus relaxed away), 1 (η0 for a liquid), 2, with its standard error. */
        public double[] moment(int p) {
            double d = Math.log(tau[1] / tau[0]);
            double v = 0;
            double[] g = new double[tau.length];
            for (int j = 0; j < tau.length; j++) {
                g[j] = Math.pow(tau[j], p) * d;
                v += h[j] * g[j];
            }
            double var = variance(g);
            return new double[] {v, Math.sqrt(Math.max(var, 0)) * scale};
        }

        /** The weight-average relaxation time ∫Hτ² d ln τ / ∫Hτ d ln τ [s], with its standard error (delta method). */
        public double[] meanTime() {
            double d = Math.log(tau[1] / tau[0]);
            double m1 = 0;
            double m2 = 0;
            for (int j = 0; j < tau.length; j++) {
                m1 += h[j] * tau[j] * d;
                m2 += h[j] * tau[j] * tau[j] * d;
            }
            double t = m2 / m1;
            double[] g = new double[tau.length];
            for (int j = 0; j < tau.length; j++) {
                g[j] = (tau[j] * tau[j] * d * m1 - m2 * tau[j] * d) / (m1 * m1);
            }
            double var = variance(g);
            return new double[] {t, Math.sqrt(Math.max(var, 0)) * scale};
        }
    }

    private RelaxationSpectrum() {
    }

    /**
     * The spectrum with λ chosen by GCV. The scan over λ solves each problem through its normal
     * equations ({@link Nnls#solveNormal}: KᵀK and LᵀL formed once, λ changing only their sum; each λ
     * started from the previous one's solution),
     * and the spectrum at the λ chosen is then solved as {@link #at} solves it, by QR on the
     * stacked matrix, with its band. Where a normal-equation solve is not positive definite, that λ
     * is scored through {@link #at} instead.
     */
    public static Result of(List<SweepPoint> points, Kind kind) {
        Problem pr = problem(points, kind);
        int m = pr.tau.length;
        int n = pr.k.length;
        int cols = pr.k[0].length;
        double[][] ktk = new double[cols][cols];
        double[] ktb = new double[cols];
        double[] colK = new double[cols];
        for (int p = 0; p < cols; p++) {
            for (int i = 0; i < n; i++) {
                ktb[p] += pr.k[i][p];
                colK[p] += Math.abs(pr.k[i][p]);
            }
            for (int q = 0; q <= p; q++) {
                double s = 0;
                for (int i = 0; i < n; i++) {
                    s += pr.k[i][p] * pr.k[i][q];
                }
                ktk[p][q] = s;
                ktk[q][p] = s;
            }
        }
        // LᵀL of the second differences (1, −2, 1) on the spectrum's m entries, and L's column sums of |·|
        double[][] ltl = new double[cols][cols];
        double[] colL = new double[cols];
        double[] stencil = {1, -2, 1};
        for (int i = 0; i < m - 2; i++) {
            for (int a = 0; a < 3; a++) {
                colL[i + a] += Math.abs(stencil[a]);
                for (int b = 0; b < 3; b++) {
                    ltl[i + a][i + b] += stencil[a] * stencil[b];
                }
            }
        }
        double bestLambda = Double.NaN;
        double bestGcv = Double.POSITIVE_INFINITY;
        double[] bestX = null;
        double[][] g = new double[cols][cols];
        double[] previous = null;
        for (int step = 0; step < LAMBDA_STEPS; step++) {
            double lambda = Math.pow(10, LAMBDA_LOW + (LAMBDA_HIGH - LAMBDA_LOW) * step / (LAMBDA_STEPS - 1));
            double norm1 = 0;
            for (int p = 0; p < cols; p++) {
                for (int q = 0; q < cols; q++) {
                    g[p][q] = ktk[p][q] + lambda * lambda * ltl[p][q];
                }
                norm1 = Math.max(norm1, colK[p] + lambda * colL[p]);
            }
            double tol = 10 * Math.ulp(1.0) * norm1 * Math.max(n + m - 2, cols);
            // started from the solution at the previous λ, which shares most of its non-zero entries
            double[] x = Nnls.solveNormal(g, ktb, tol, previous);
            previous = x;
            double gcv = x == null ? Double.NaN : gcv(pr, x, ktk, g);
            if (Double.isNaN(gcv)) {
                gcv = at(points, kind, lambda).gcv();
            }
            if (gcv < bestGcv) {
                bestGcv = gcv;
                bestLambda = lambda;
                bestX = x;
            }
        }
        // the QR solve at the λ chosen starts from the scan's solution there: the same solution, in a step or two
        return at(points, kind, Double.isNaN(bestLambda) ? Math.pow(10, LAMBDA_LOW) : bestLambda, bestX);
    }

    /**
     * GCV = n·RSS/(n − tr A)² of a solution x, tr A = tr(M_ff⁻¹ (KᵀK)_ff) on its non-zero entries
     * f (M = KᵀK + λ²LᵀL, given as g); NaN when M_ff is not positive definite.
     */
    private static double gcv(Problem pr, double[] x, double[][] ktk, double[][] g) {
        int n = pr.k.length;
        int cols = x.length;
        double rss = rss(pr, x);
        int[] free = new int[cols];
        int f = 0;
        for (int j = 0; j < cols; j++) {
            if (x[j] > 0) {
                free[f++] = j;
            }
        }
        double trace = 0;
        if (f > 0) {
            double[][] l = new double[f][f];
            if (!Nnls.cholesky(g, free, f, l)) {
                return Double.NaN;
            }
            // tr(M⁻¹ K) = Σ_q (M⁻¹ K_q)_q over the columns q of K = (KᵀK)_ff
            double[] y = new double[f];
            for (int q = 0; q < f; q++) {
                for (int i = 0; i < f; i++) {
                    y[i] = ktk[free[i]][free[q]];
                }
                org.viscarta.fit.Cholesky.substitute(l, f, y);
                trace += y[q];
            }
        }
        return n * rss / Math.pow(Math.max(1e-9, n - trace), 2);
    }

    /** The spectrum at a given λ. */
    public static Result at(List<SweepPoint> points, Kind kind, double lambda) {
        return at(points, kind, lambda, null);
    }

    /** As {@link #at(List, Kind, double)}, the active-set loop started from {@code start} (null: from zero). */
    private static Result at(List<SweepPoint> points, Kind kind, double lambda, double[] start) {
        Problem pr = problem(points, kind);
        int m = pr.tau.length;
        int cols = pr.k[0].length;
        int n = pr.k.length;
        double[][] a = new double[n + m - 2][cols];
        double[] b = new double[n + m - 2];
        for (int i = 0; i < n; i++) {
            a[i] = pr.k[i].clone();
            b[i] = 1;
        }
        for (int i = 0; i < m - 2; i++) {
            a[n + i][i] = lambda;
            a[n + i][i + 1] = -2 * lambda;
            a[n + i][i + 2] = lambda;
        }
        double[] x = Nnls.solve(a, b, start);
        double rss = rss(pr, x);
        // influence of the unconstrained problem on the non-zero unknowns
        List<Integer> free = new ArrayList<>();
        for (int j = 0; j < cols; j++) {
            if (x[j] > 0) {
                free.add(j);
            }
        }
        int f = free.size();
        double[][] cov = new double[cols][cols];
        double trace = 0;
        if (f > 0) {
            double[][] ktk = new double[f][f];
            double[][] mm = new double[f][f];
            for (int p = 0; p < f; p++) {
                for (int q = 0; q < f; q++) {
                    double s = 0;
                    for (int i = 0; i < n; i++) {
                        s += pr.k[i][free.get(p)] * pr.k[i][free.get(q)];
                    }
                    double l = 0;
                    for (int i = 0; i < m - 2; i++) {
                        l += a[n + i][free.get(p)] * a[n + i][free.get(q)];
                    }
                    ktk[p][q] = s;
                    mm[p][q] = s + l;
                }
            }
            RealMatrix inv;
            try {
                inv = new LUDecomposition(new Array2DRowRealMatrix(mm, false)).getSolver().getInverse();
            } catch (org.apache.commons.math3.linear.SingularMatrixException e) {
                inv = null;
            }
            if (inv != null) {
                RealMatrix kk = new Array2DRowRealMatrix(ktk, false);
                trace = inv.multiply(kk).getTrace();
                double dof = Math.max(1, n - trace);
                RealMatrix c = inv.multiply(kk).multiply(inv).scalarMultiply(rss / dof);
                for (int p = 0; p < f; p++) {
                    for (int q = 0; q < f; q++) {
                        cov[free.get(p)][free.get(q)] = c.getEntry(p, q);
                    }
                }
            }
        }
        double gcv = n * rss / Math.pow(Math.max(1e-9, n - trace), 2);
        double[] h = new double[m];
        double[] lo = new double[m];
        double[] hi = new double[m];
        for (int j = 0; j < m; j++) {
            h[j] = x[j] * pr.scale;
            double se = Math.sqrt(Math.max(cov[j][j], 0)) * pr.scale;
            lo[j] = Math.max(0, h[j] - 1.96 * se);
            hi[j] = h[j] + 1.96 * se;
        }
        double[] hcov = new double[m * (m + 1) / 2];
        for (int i = 0, at = 0; i < m; i++, at += i) {
            System.arraycopy(cov[i], 0, hcov, at, i + 1);
        }
        double constant = x[m] * pr.scale;
        double constantSe = Math.sqrt(Math.max(cov[m][m], 0)) * pr.scale;
        double fluidity = kind == Kind.RETARDATION ? x[m + 1] * pr.scale : Double.NaN;
        return new Result(kind, pr.tau, h, lo, hi, constant, constantSe, fluidity, lambda, gcv, Math.sqrt(rss / n), n, hcov,
                pr.scale);
    }

    /** Σ (K x − 1)², the relative residuals' sum of squares of a solution. */
    private static double rss(Problem pr, double[] x) {
        double rss = 0;
        for (double[] row : pr.k) {
            double s = -1;
            for (int j = 0; j < x.length; j++) {
                s += row[j] * x[j];
            }
            rss += s * s;
        }
        return rss;
    }

    /** The weighted kernel: rows E′ then E″ (or J′, J″) divided by their measured values; unknowns in units of {@code scale}. */
    private record Problem(double[] tau, double[][] k, double scale) {
    }

    private static Problem problem(List<SweepPoint> points, Kind kind) {
        double wMin = Double.POSITIVE_INFINITY;
        double wMax = 0;
        List<double[]> data = new ArrayList<>();
        for (SweepPoint p : points) {
            if (!(p.storage() > 0 && p.loss() > 0)) {
                continue;
            }
            double w = 2 * Math.PI * p.frequencyHz();
            double re = p.storage();
            double im = p.loss();
            if (kind == Kind.RETARDATION) {
                double m2 = re * re + im * im;
                re = p.storage() / m2;
                im = p.loss() / m2;
            }
            data.add(new double[] {w, re, im});
            wMin = Math.min(wMin, w);
            wMax = Math.max(wMax, w);
        }
        long distinct = data.stream().mapToLong(r -> Math.round(Math.log10(r[0]) * 1e4)).distinct().count();
        if (distinct < MIN_FREQUENCIES) {
            throw new IllegalArgumentException("a spectrum needs at least " + MIN_FREQUENCIES + " distinct frequencies with "
                    + "positive moduli; these data have " + distinct);
        }
        double lo = Math.log10(1 / wMax) - MARGIN_DECADES;
        double hi = Math.log10(1 / wMin) + MARGIN_DECADES;
        int m = (int) Math.ceil((hi - lo) * PER_DECADE) + 1;
        double[] tau = new double[m];
        for (int j = 0; j < m; j++) {
            tau[j] = Math.pow(10, lo + (hi - lo) * j / (m - 1));
        }
        double d = Math.log(tau[1] / tau[0]);
        double[] mags = data.stream().mapToDouble(r -> Math.hypot(r[1], r[2])).sorted().toArray();
        double scale = mags[mags.length / 2];
        int extra = kind == Kind.RELAXATION ? 1 : 2;
        double[][] k = new double[2 * data.size()][m + extra];
        for (int i = 0; i < data.size(); i++) {
            double[] r = data.get(i);
            for (int j = 0; j < m; j++) {
                double x = r[0] * tau[j];
                double den = 1 + x * x;
                k[2 * i][j] = scale * d * (kind == Kind.RELAXATION ? x * x / den : 1 / den) / r[1];
                k[2 * i + 1][j] = scale * d * (x / den) / r[2];
            }
            k[2 * i][m] = scale / r[1];
            if (kind == Kind.RETARDATION) {
                k[2 * i + 1][m + 1] = scale / r[0] / r[2];
            }
        }
        return new Problem(tau, k, scale);
    }
}
