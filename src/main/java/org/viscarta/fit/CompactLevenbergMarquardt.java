package org.viscarta.fit;

/**
 * A compact Levenberg–Marquardt solver for the small problems of model fitting (tens to hundreds
 * of residuals, at most a dozen parameters), without the matrix objects and copies of a general
 * library: the damped normal equations (JᵀJ + λD)δ = −Jᵀr are solved by Cholesky, with Marquardt's
 * diagonal scaling D (the running maximum of diag(JᵀJ), as in MINPACK) and Nielsen's update of the
 * damping λ from the gain ratio ρ = (actual reduction)/(predicted reduction).
 *
 * <p>Sources: Levenberg, K. (1944), Q. Appl. Math. 2:164–168; Marquardt, D. W. (1963), J. SIAM
 * 11:431–441; Moré, J. J. (1978), "The Levenberg–Marquardt algorithm: implementation and theory",
 * Lecture Notes in Mathematics 630:105–116; Nielsen, H. B. (1999), "Damping parameter in Marquardt's
 * method", IMM-REP-1999-05, DTU; Madsen, Nielsen &amp; Tingleff (2004), Methods for Non-Linear Least
 * Squares Problems, 2nd ed., DTU, algorithm 3.16. Validated like the Commons Math path: on the NIST
 * StRD datasets and against SciPy (tests in org.viscarta.fit).
 *
 * <p>Drift toward a parameter at infinity. A model that the data do not need whole (a Burgers model
 * on a solid's sweep, whose second dashpot is not there) has its minimum at a boundary: a parameter
 * runs off to infinity in its log space, the misfit approaching its limit geometrically, and the
 * iteration takes the same step again and again (about 0.37 in ln η per evaluation in one such fit,
 * 60 evaluations or more before the misfit stops falling). When three accepted steps in a row are
 * the same step (directions within {@value #PARALLEL} in cosine, lengths within a factor of two: a
 * converging fit's steps shrink instead), the step is extrapolated, doubled each time (2, 4, 8 …
 * times, at most {@value #DOUBLINGS} times in a row) while the misfit keeps falling — a pattern
 * move (Hooke &amp; Jeeves 1961, J. ACM 8:212–229) along the drift. Only a lower misfit is
 * accepted, so the iteration stays a descent method, and it ends by the same tests as before; the
 * parameter that ran off ends elsewhere along its drift (it is undetermined, and flagged so either
 * way) and the others at the same limits.
 *
 * <p>Coasting. Where the drift runs along a curved valley (a generalized Maxwell model with one
 * element too many on a one-relaxation sweep: the spare element's time runs off while its modulus
 * and the equilibrium modulus trade places, E_∞ + E₂ held), a doubled step leaves the valley's floor
 * and is refused, and the iteration walks on in equal steps that each lower the misfit by a few parts
 * in 10¹² — to the evaluation limit, where the fit counts as not converged. So {@value #COASTING_STEPS}
 * accepted steps in a row that point the same way, are of the same length (within
 * {@value #COASTING_LENGTH}) and each lower the misfit by less than {@value #COASTING_GAIN} of itself
 * end the solve as converged: a converging fit's steps shrink, and a fit still getting somewhere gains
 * more. In the case that prompted it the misfit was then within 2·10⁻⁹ of where the walk ends (3,866
 * evaluations later), the parameters that are not drifting at their limits (to 10⁻⁷), and the drifting
 * ones undetermined and flagged so ({@code CoastingTest}).
 */
final class CompactLevenbergMarquardt {

    /**
     * The outcome: parameters, residual sum of squares, the Jacobian at the parameters by columns
     * (p arrays of n: column j holds ∂r_i/∂θ_j), evaluations, and whether it converged.
     */
    record Result(double[] params, double rss, double[][] columns, int evaluations, boolean converged, String message) {
    }

    /** Cosine above which two steps point the same way. */
    static final double PARALLEL = 0.99;
    /** Most doublings of one extrapolation. */
    static final int DOUBLINGS = 6;
    /** Accepted steps in a row, alike and gaining almost nothing, after which a drift has ended (class comment). */
    static final int COASTING_STEPS = 10;
    /** Relative difference in length within which two steps are alike for {@link #COASTING_STEPS}. */
    static final double COASTING_LENGTH = 0.05;
    /** Relative reduction of the misfit per step below which a step gains almost nothing. */
    static final double COASTING_GAIN = 1e-10;

    private final int maxEvaluations;
    private final double tolerance;
    private final int coastingSteps;

    CompactLevenbergMarquardt(int maxEvaluations, double tolerance) {
        this(maxEvaluations, tolerance, COASTING_STEPS);
    }

    /** With another number of coasting steps (tests: {@code Integer.MAX_VALUE} never stops a solve for coasting). */
    CompactLevenbergMarquardt(int maxEvaluations, double tolerance, int coastingSteps) {
        this.maxEvaluations = maxEvaluations;
        this.tolerance = tolerance;
        this.coastingSteps = coastingSteps;
    }

    /** A point of the iteration: parameters, residuals, Jacobian and misfit (the current one and a trial). */
    private static final class Point {
        final double[] x;
        final double[] r;
        final double[][] jac;
        double cost;

        Point(int n, int p) {
            x = new double[p];
            r = new double[n];
            jac = new double[n][p];
        }

        /** Evaluates at its own x. */
        void evaluate(ResidualFunction f) {
            f.evaluate(x, r, jac);
            cost = dot(r, r);
        }

        /** Zeroes the Jacobian, as a new array would be: a function sees the same arrays whichever solve came before. */
        void clear() {
            for (double[] row : jac) {
                java.util.Arrays.fill(row, 0.0);
            }
        }
    }

    /**
     * The arrays of one solve of n residuals in p parameters, kept by each thread for its next solve
     * of the same shape: a campaign's fits are many solves of one shape, and a 20-frequency fit's two
     * points alone are 80 small arrays, whose allocation cost about as much as two evaluations of the
     * residuals. Results never share them (the parameters and Jacobian are copied out).
     */
    private static final class Workspace {
        final int n;
        final int p;
        Point here;
        Point trial;
        final double[][] a;
        final double[] g;
        final double[][] jt;
        final double[] diag;
        final double[] delta;
        final double[][] m;
        final double[] previous;
        final double[] before;
        final double[] steady;
        boolean inUse;

        Workspace(int n, int p) {
            this.n = n;
            this.p = p;
            here = new Point(n, p);
            trial = new Point(n, p);
            a = new double[p][p];
            g = new double[p];
            jt = new double[p][n];
            diag = new double[p];
            delta = new double[p];
            m = new double[p][p];
            previous = new double[p];
            before = new double[p];
            steady = new double[p];
        }

        void swap() {
            Point t = here;
            here = trial;
            trial = t;
        }

        /** The result at {@code here}, whose Jacobian {@code jt} holds by columns (every return follows {@link #normal}). */
        Result result(int evaluations, boolean converged, String message) {
            double[][] columns = new double[p][];
            for (int j = 0; j < p; j++) {
                columns[j] = jt[j].clone();
            }
            return new Result(here.x.clone(), here.cost, columns, evaluations, converged, message);
        }
    }

    private static final ThreadLocal<Workspace> WORKSPACE = new ThreadLocal<>();

    /** This thread's workspace for the shape, or a new one when it has none of that shape or is inside a solve already. */
    private static Workspace acquire(int n, int p) {
        Workspace kept = WORKSPACE.get();
        if (kept != null && !kept.inUse && kept.n == n && kept.p == p) {
            kept.here.clear();
            kept.trial.clear();
            java.util.Arrays.fill(kept.previous, 0.0);
            kept.inUse = true;
            return kept;
        }
        Workspace w = new Workspace(n, p);
        if (kept == null || !kept.inUse) {
            WORKSPACE.set(w); // a nested solve's workspace is not kept: the outer solve's stays
        }
        w.inUse = true;
        return w;
    }

    Result solve(int n, ResidualFunction f, double[] start) {
        int p = start.length;
        Workspace w = acquire(n, p);
        try {
            return solve(w, f, start);
        } finally {
            w.inUse = false;
        }
    }

    private Result solve(Workspace w, ResidualFunction f, double[] start) {
        int p = w.p;
        System.arraycopy(start, 0, w.here.x, 0, p);
        w.here.evaluate(f);
        int evaluations = 1;
        double[][] a = w.a;
        double[] g = w.g;
        double[][] jt = w.jt;
        double[] diag = w.diag;
        normal(w.here.jac, w.here.r, a, g, jt);
        if (!Double.isFinite(w.here.cost)) {
            return w.result(evaluations, false, "the start gives non-finite residuals");
        }
        for (int j = 0; j < p; j++) {
            diag[j] = Math.max(a[j][j], Double.MIN_NORMAL);
        }
        double lambda = 1e-3;
        double nu = 2;
        double[] delta = w.delta;
        double[][] m = w.m;
        double[] previous = w.previous;
        double[] before = w.before;
        double[] steady = w.steady;
        double previousNorm = 0;
        int repeats = 0;
        int coasting = 0;
        while (evaluations < maxEvaluations) {
            Point here = w.here;
            Point trial = w.trial;
            double cost = here.cost;
            if (gradientSmall(g, a, cost)) {
                return w.result(evaluations, true, "");
            }
            for (int i = 0; i < p; i++) {
                System.arraycopy(a[i], 0, m[i], 0, p);
                m[i][i] += lambda * diag[i];
                delta[i] = -g[i];
            }
            if (!choleskySolve(m, delta)) {
                lambda *= nu;
                nu *= 2;
                if (!(lambda < 1e300)) {
                    return w.result(evaluations, false, "the normal equations are not positive definite");
                }
                continue;
            }
            double xNorm = 0;
            double dNorm = 0;
            for (int j = 0; j < p; j++) {
                trial.x[j] = here.x[j] + delta[j];
                xNorm += here.x[j] * here.x[j] * diag[j];
                dNorm += delta[j] * delta[j] * diag[j];
            }
            trial.evaluate(f);
            evaluations++;
            double costNew = trial.cost;
            double predicted = 0;
            for (int j = 0; j < p; j++) {
                predicted += delta[j] * (lambda * diag[j] * delta[j] - g[j]);
            }
            double rho = Double.isFinite(costNew) && predicted > 0 ? (cost - costNew) / predicted : -1;
            if (rho > 0) {
                double reduction = cost - costNew;
                w.swap();
                normal(w.here.jac, w.here.r, a, g, jt);
                for (int j = 0; j < p; j++) {
                    diag[j] = Math.max(diag[j], a[j][j]);
                }
                lambda *= Math.max(1.0 / 3.0, 1 - Math.pow(2 * rho - 1, 3));
                nu = 2;
                if (reduction <= tolerance * costNew || Math.sqrt(dNorm) <= tolerance * (Math.sqrt(xNorm) + tolerance) || costNew == 0) {
                    return w.result(evaluations, true, "");
                }
                double norm = Math.sqrt(dot(delta, delta));
                boolean parallel = previousNorm > 0 && dot(delta, previous) > PARALLEL * norm * previousNorm;
                repeats = parallel && norm < 2 * previousNorm && previousNorm < 2 * norm ? repeats + 1 : 0;
                coasting = parallel && Math.abs(norm - previousNorm) <= COASTING_LENGTH * previousNorm
                        && reduction <= COASTING_GAIN * costNew ? coasting + 1 : 0;
                if (coasting >= coastingSteps) {
                    return w.result(evaluations, true, "");
                }
                System.arraycopy(previous, 0, before, 0, p);
                System.arraycopy(delta, 0, previous, 0, p);
                previousNorm = norm;
                if (repeats >= 2) {
                    repeats = 0;
                    // along the parameters whose part of the step repeats (to a tenth); the others settle
                    // toward their limits, and stretching their parts of the step would overshoot them
                    boolean any = false;
                    for (int j = 0; j < p; j++) {
                        steady[j] = Math.abs(delta[j] - before[j]) <= 0.1 * Math.abs(delta[j]) ? delta[j] : 0;
                        any |= steady[j] != 0;
                    }
                    double stretch = 2;
                    boolean moved = false;
                    for (int k = 0; any && k < DOUBLINGS && evaluations < maxEvaluations; k++, stretch *= 2) {
                        for (int j = 0; j < p; j++) {
                            w.trial.x[j] = w.here.x[j] + stretch * steady[j];
                        }
                        w.trial.evaluate(f);
                        evaluations++;
                        if (!(w.trial.cost < w.here.cost)) {
                            break;
                        }
                        w.swap();
                        moved = true;
                    }
                    if (moved) {
                        normal(w.here.jac, w.here.r, a, g, jt);
                        for (int j = 0; j < p; j++) {
                            diag[j] = Math.max(diag[j], a[j][j]);
                        }
                        previousNorm = 0;
                    } else {
                        repeats = -3; // not a clean drift: three more steps alike before trying again
                    }
                }
            } else {
                if (Math.sqrt(dNorm) <= tolerance * (Math.sqrt(xNorm) + tolerance)) {
                    return w.result(evaluations, true, "");
                }
                // MINPACK's test on every step, not only accepted ones: both the actual and the predicted
                // reduction below the tolerance (the step was refused by rounding in the misfit, not by
                // a worse point; Moré 1978, section 8)
                if (Double.isFinite(costNew) && Math.abs(cost - costNew) <= tolerance * cost && predicted <= tolerance * cost) {
                    return w.result(evaluations, true, "");
                }
                lambda *= nu;
                nu *= 2;
                if (!(lambda < 1e300)) {
                    return w.result(evaluations, true, "");
                }
            }
        }
        return w.result(evaluations, false, "did not converge within " + maxEvaluations + " evaluations");
    }

    /** max_j |g_j| / sqrt(A_jj · cost) below the tolerance: the residual is orthogonal to every column of J. */
    private boolean gradientSmall(double[] g, double[][] a, double cost) {
        if (cost == 0) {
            return true;
        }
        double worst = 0;
        for (int j = 0; j < g.length; j++) {
            if (a[j][j] > 0) {
                worst = Math.max(worst, Math.abs(g[j]) / Math.sqrt(a[j][j] * cost));
            }
        }
        return worst <= tolerance;
    }

    /**
     * A = JᵀJ and g = Jᵀr. J is copied column by column into {@code jt} (p × n) first, so that each
     * entry is one dot product of two contiguous columns summed in four running parts: the arithmetic
     * of updating A row by row of J, without loading and storing A's entries for every row.
     */
    private static void normal(double[][] jac, double[] r, double[][] a, double[] g, double[][] jt) {
        int n = r.length;
        int p = g.length;
        for (int k = 0; k < n; k++) {
            double[] row = jac[k];
            for (int i = 0; i < p; i++) {
                jt[i][k] = row[i];
            }
        }
        for (int i = 0; i < p; i++) {
            double[] ci = jt[i];
            g[i] = dot(ci, r);
            for (int j = 0; j <= i; j++) {
                double v = dot(ci, jt[j]);
                a[i][j] = v;
                a[j][i] = v;
            }
        }
    }

    /** Solves m·x = b in place (b becomes x) by Cholesky; false when m is not positive definite. */
    private static boolean choleskySolve(double[][] m, double[] b) {
        int p = b.length;
        for (int j = 0; j < p; j++) {
            double d = m[j][j];
            for (int k = 0; k < j; k++) {
                d -= m[j][k] * m[j][k];
            }
            if (!(d > 0)) {
                return false;
            }
            d = Math.sqrt(d);
            m[j][j] = d;
            for (int i = j + 1; i < p; i++) {
                double s = m[i][j];
                for (int k = 0; k < j; k++) {
                    s -= m[i][k] * m[j][k];
                }
                m[i][j] = s / d;
            }
        }
        Cholesky.substitute(m, p, b);
        return true;
    }

    /** Σ a_i b_i in four running parts (independent additions the processor overlaps), then their sum. */
    private static double dot(double[] a, double[] b) {
        int n = a.length;
        double s0 = 0;
        double s1 = 0;
        double s2 = 0;
        double s3 = 0;
        int i = 0;
        for (; i + 3 < n; i += 4) {
            s0 += a[i] * b[i];
            s1 += a[i + 1] * b[i + 1];
            s2 += a[i + 2] * b[i + 2];
            s3 += a[i + 3] * b[i + 3];
        }
        for (; i < n; i++) {
            s0 += a[i] * b[i];
        }
        return (s0 + s1) + (s2 + s3);
    }
}
