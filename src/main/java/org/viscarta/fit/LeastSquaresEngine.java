package org.viscarta.fit;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.apache.commons.math3.exception.ConvergenceException;
import org.apache.commons.math3.exception.MathIllegalStateException;
import org.apache.commons.math3.exception.TooManyEvaluationsException;
import org.apache.commons.math3.exception.TooManyIterationsException;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresProblem;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.fitting.leastsquares.MultivariateJacobianFunction;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.util.Pair;

/**
 * The one adapter to Commons Math's Levenberg–Marquardt optimiser (Levenberg 1944; Marquardt
 * 1963; Moré's MINPACK formulation as implemented in Commons Math 3.6.1). Everything else in
 * Viscarta talks to this class, so that moving to a maintained fork touches one place.
 *
 * <p>Commons Math's {@code getCost()} is the residual norm, not the RSS, and
 * {@code getCovariances()} is the unscaled (JᵀJ)⁻¹; both are handled here (see {@link Solution}).
 */
public final class LeastSquaresEngine {

    /** Which Levenberg–Marquardt implementation runs. */
    public enum Method {
        /** Commons Math 3.6.1's MINPACK translation: the general, reference path. */
        COMMONS_MATH("Levenberg–Marquardt (Commons Math 3.6.1, its MINPACK translation)"),
        /** {@link CompactLevenbergMarquardt}: no matrix objects, for the many small fits of a campaign. */
        COMPACT("Levenberg–Marquardt (Viscarta's compact solver: Cholesky on the damped normal equations, "
                + "Nielsen's damping update; a step repeated three times toward a parameter's limit is extrapolated by "
                + "doubling while the misfit falls; covariance from a Jacobi SVD of the Jacobian)");

        private final String description;

        Method(String description) {
            this.description = description;
        }

        /** The solver in words, as Provenance names it. */
        public String describe() {
            return description;
        }
    }

    /** Limits and tolerances of a solve. */
    public record Settings(int maxEvaluations, int maxIterations, double relativeTolerance,
                           double singularityThreshold, Method method) {

        public Settings {
            if (maxEvaluations < 1 || maxIterations < 1) {
                throw new IllegalArgumentException("evaluation and iteration limits must be positive");
            }
            if (!(relativeTolerance > 0)) {
                throw new IllegalArgumentException("relative tolerance must be > 0, got " + relativeTolerance);
            }
        }

        /**
         * Defaults tight enough to reproduce the NIST StRD certified values to 1e-6 relative; a
         * Jacobian whose singular values span more than 10 decades (condition number above 1e10)
         * counts as singular.
         */
        public static Settings defaults() {
            return new Settings(5000, 2000, 1.0e-14, 1.0e-10, Method.COMMONS_MATH);
        }

        public Settings withMaxEvaluations(int n) {
            return new Settings(n, maxIterations, relativeTolerance, singularityThreshold, method);
        }

        public Settings withMethod(Method m) {
            return new Settings(maxEvaluations, maxIterations, relativeTolerance, singularityThreshold, m);
        }
    }

    /** Two residual sums of squares this close (relative) are the same minimum. */
    private static final double CONFIRMATION = 1e-9;

    /** Tolerance of the second attempt after a {@link ConvergenceException}. */
    private static final double LOOSE_TOLERANCE = 1.0e-10;

    private final Settings settings;

    public LeastSquaresEngine(Settings settings) {
        this.settings = settings;
    }

    /** The solver and its evaluation limit, in words. */
    public String describe() {
        return settings.method().describe() + ", at most " + settings.maxEvaluations() + " evaluations per start";
    }

    /**
     * Solves min Σ r_i(θ)² from one start.
     *
     * @param n     number of residuals
     * @param f     residuals and Jacobian
     * @param start start values (length p)
     */
    public Solution solve(int n, ResidualFunction f, double[] start) {
        if (settings.method() == Method.COMPACT) {
            return solveCompact(n, f, start);
        }
        int p = start.length;
        MultivariateJacobianFunction model = point -> {
            double[] theta = point.toArray();
            double[] r = new double[n];
            double[][] jac = new double[n][p];
            f.evaluate(theta, r, jac);
            return new Pair<RealVector, RealMatrix>(new ArrayRealVector(r, false), new Array2DRowRealMatrix(jac, false));
        };
        LeastSquaresProblem problem = new LeastSquaresBuilder()
                .start(start.clone())
                .model(model)
                .target(new double[n])
                .maxEvaluations(settings.maxEvaluations())
                .maxIterations(settings.maxIterations())
                .lazyEvaluation(false)
                .build();
        LevenbergMarquardtOptimizer lm = new LevenbergMarquardtOptimizer()
                .withCostRelativeTolerance(settings.relativeTolerance())
                .withParameterRelativeTolerance(settings.relativeTolerance())
                .withOrthoTolerance(settings.relativeTolerance());
        LeastSquaresOptimizer.Optimum opt;
        try {
            opt = lm.optimize(problem);
        } catch (TooManyEvaluationsException | TooManyIterationsException e) {
            return failed(n, f, start, "did not converge within " + settings.maxEvaluations() + " evaluations");
        } catch (ConvergenceException e) {
            // Raised when the tolerances ask for more than double precision can give (the iterate is
            // then at the minimum to machine precision), or when the Jacobian holds non-finite values.
            // Solve again once with looser tolerances; a second failure is a failure.
            if (settings.relativeTolerance() < LOOSE_TOLERANCE) {
                return new LeastSquaresEngine(new Settings(settings.maxEvaluations(), settings.maxIterations(),
                        LOOSE_TOLERANCE, settings.singularityThreshold(), settings.method())).solve(n, f, start);
            }
            return failed(n, f, start, "the optimiser stopped: " + e.getMessage());
        } catch (MathIllegalStateException | IllegalArgumentException e) {
            return failed(n, f, start, "the optimiser stopped: " + e.getMessage());
        }
        double[] params = opt.getPoint().toArray();
        double cost = opt.getCost();
        if (!Double.isFinite(cost) || !allFinite(params)) {
            return failed(n, f, start, "the fit left the range of finite numbers");
        }
        return new Solution(params, cost * cost, inverseNormalMatrix(opt.getJacobian(), settings.singularityThreshold()),
                n, opt.getEvaluations(), true, "");
    }

    /**
     * Solves from several starts, in order, and keeps the lowest residual sum of squares among those
     * that converged; when none converged, returns the first failure. It stops early once the lowest
     * residual has been reached from two different starts (to 1e-9 relative): the minimum has then
     * been confirmed, and later starts, spread over less likely regions, are skipped.
     */
    public Solution solveMultiStart(int n, ResidualFunction f, List<double[]> starts) {
        boolean compact = settings.method() == Method.COMPACT;
        Solution best = null;
        double[][] bestColumns = null;
        Solution firstFailure = null;
        int confirmations = 0;
        for (double[] s : starts) {
            // on the compact path (JᵀJ)⁻¹ is computed once, for the start kept, not for every start
            Compact c = compact ? solveCompactDeferred(n, f, s) : null;
            Solution sol = compact ? c.solution() : solve(n, f, s);
            if (sol.converged()) {
                if (best == null || sol.rss() < best.rss() * (1 - CONFIRMATION)) {
                    best = sol;
                    bestColumns = compact ? c.columns() : null;
                    confirmations = 1;
                } else if (Math.abs(sol.rss() - best.rss()) <= CONFIRMATION * best.rss()) {
                    confirmations++;
                    if (sol.rss() < best.rss()) {
                        best = sol;
                        bestColumns = compact ? c.columns() : null;
                    }
                }
                if (confirmations >= 2) {
                    break;
                }
            } else if (firstFailure == null) {
                firstFailure = sol;
            }
        }
        if (best != null && bestColumns != null) {
            best = withCovariance(best, bestColumns);
        }
        return best != null ? best : firstFailure;
    }

    /**
     * Multi-start from one user start: the start itself, the whole vector scaled by decades
     * (10⁻³ … 10¹), and {@code random} seeded log-uniform perturbations of each component within a
     * decade either side. Deterministic for a given seed.
     */
    public Solution solveFromScaledStarts(int n, ResidualFunction f, double[] start, int random, long seed) {
        List<double[]> starts = new ArrayList<>();
        starts.add(start.clone());
        for (int k = -3; k <= 1; k++) {
            if (k == 0) {
                continue;
            }
            double[] s = start.clone();
            for (int j = 0; j < s.length; j++) {
                s[j] *= Math.pow(10, k);
            }
            starts.add(s);
        }
        SplittableRandom rng = new SplittableRandom(seed);
        for (int i = 0; i < random; i++) {
            double[] s = start.clone();
            for (int j = 0; j < s.length; j++) {
                s[j] *= Math.pow(10, rng.nextDouble(-1, 1));
            }
            starts.add(s);
        }
        return solveMultiStart(n, f, starts);
    }

    private Solution solveCompact(int n, ResidualFunction f, double[] start) {
        Compact c = solveCompactDeferred(n, f, start);
        return c.columns() == null ? c.solution() : withCovariance(c.solution(), c.columns());
    }

    /**
     * A compact solution without (JᵀJ)⁻¹ yet, and the Jacobian at its minimum by columns, a copy of
     * its own (null when it did not converge).
     */
    private record Compact(Solution solution, double[][] columns) {
    }

    private Compact solveCompactDeferred(int n, ResidualFunction f, double[] start) {
        CompactLevenbergMarquardt.Result r;
        try {
            r = new CompactLevenbergMarquardt(settings.maxEvaluations(), settings.relativeTolerance()).solve(n, f, start);
        } catch (RuntimeException e) {
            return new Compact(failed(n, f, start, "the optimiser stopped: " + e.getMessage()), null);
        }
        if (!r.converged()) {
            return new Compact(new Solution(r.params(), r.rss(), null, n, r.evaluations(), false, r.message()), null);
        }
        if (!Double.isFinite(r.rss()) || !allFinite(r.params())) {
            return new Compact(failed(n, f, start, "the fit left the range of finite numbers"), null);
        }
        return new Compact(new Solution(r.params(), r.rss(), null, n, r.evaluations(), true, ""), r.columns());
    }

    /** The solution with (JᵀJ)⁻¹ from its Jacobian's columns, which this overwrites. */
    private Solution withCovariance(Solution s, double[][] columns) {
        return new Solution(s.params(), s.rss(), inverseNormalMatrixOfColumns(columns, settings.singularityThreshold()), s.n(),
                s.evaluations(), true, "");
    }

    /**
     * (JᵀJ)⁻¹ = V Σ⁻² Vᵀ from the singular value decomposition of J itself ({@link JacobiSvd}): forming JᵀJ first (as
     * Commons Math's getCovariances does) squares the condition number and loses half the digits on
     * ill-conditioned problems such as NIST's Bennett5. Null when σ_min/σ_max is below
     * {@code threshold}, i.e. some direction is not determined by the data. A Jacobian of more rows
     * than columns is first reduced to its triangular factor R by Householder QR (JᵀJ = RᵀR: the same
     * singular values and V) and the rotations run on the p × p factor: QR preconditioning keeps the
     * Jacobi method's accuracy on column-scaled ill-conditioning (Drmač &amp; Veselić 2008, "New fast
     * and accurate Jacobi SVD algorithm I", SIAM J. Matrix Anal. Appl. 29:1322–1342) at a fraction of
     * the work on the tall matrix.
     */
    static double[][] inverseNormalMatrix(RealMatrix jacobian, double threshold) {
        return inverseNormalMatrix(jacobian.getData(), threshold);
    }

    static double[][] inverseNormalMatrix(double[][] jacobian, double threshold) {
        int p = jacobian.length == 0 ? 0 : jacobian[0].length;
        double[][] columns = new double[p][jacobian.length];
        for (int i = 0; i < jacobian.length; i++) {
            for (int j = 0; j < p; j++) {
                columns[j][i] = jacobian[i][j];
            }
        }
        return inverseNormalMatrixOfColumns(columns, threshold);
    }

    /** {@link #inverseNormalMatrix} of a Jacobian given by its columns (p arrays of n), which this overwrites. */
    static double[][] inverseNormalMatrixOfColumns(double[][] columns, double threshold) {
        for (double[] column : columns) {
            if (!allFinite(column)) {
                return null;
            }
        }
        int p = columns.length;
        if (p == 0) {
            return null;
        }
        int n = columns[0].length;
        double[][] square;
        if (n > p) {
            square = HouseholderSolve.triangularOfColumns(columns);
        } else {
            square = new double[n][p];
            for (int j = 0; j < p; j++) {
                for (int i = 0; i < n; i++) {
                    square[i][j] = columns[j][i];
                }
            }
        }
        JacobiSvd.Result svd = JacobiSvd.decompose(square);
        double[] sv = svd.singularValues();
        double max = 0;
        double min = Double.POSITIVE_INFINITY;
        for (double x : sv) {
            max = Math.max(max, x);
            min = Math.min(min, x);
        }
        if (!(min > threshold * max)) {
            return null;
        }
        double[][] v = svd.v();
        double[][] inv = new double[p][p];
        for (int i = 0; i < p; i++) {
            for (int j = 0; j < p; j++) {
                double sum = 0;
                for (int k = 0; k < p; k++) {
                    sum += v[i][k] * v[j][k] / (sv[k] * sv[k]);
                }
                inv[i][j] = sum;
            }
        }
        return inv;
    }

    private static boolean allFinite(RealMatrix m) {
        for (int i = 0; i < m.getRowDimension(); i++) {
            for (int j = 0; j < m.getColumnDimension(); j++) {
                if (!Double.isFinite(m.getEntry(i, j))) {
                    return false;
                }
            }
        }
        return true;
    }

    private static Solution failed(int n, ResidualFunction f, double[] at, String why) {
        double[] r = new double[n];
        try {
            f.evaluate(at, r, new double[n][at.length]);
        } catch (RuntimeException e) {
            java.util.Arrays.fill(r, Double.NaN);
        }
        double rss = 0;
        for (double v : r) {
            rss += v * v;
        }
        return new Solution(at, rss, null, n, 0, false, why);
    }

    private static boolean allFinite(double[] v) {
        for (double x : v) {
            if (!Double.isFinite(x)) {
                return false;
            }
        }
        return true;
    }
}
