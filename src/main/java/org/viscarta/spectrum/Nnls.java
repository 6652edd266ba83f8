package org.viscarta.spectrum;

import org.viscarta.fit.HouseholderSolve;

/**
 * Non-negative least squares, min ‖A x − b‖ subject to x ≥ 0, by the active-set algorithm of
 * Lawson &amp; Hanson (1974), Solving Least Squares Problems, Prentice-Hall, chapter 23 (the
 * algorithm SciPy's {@code scipy.optimize.nnls} also implements). Commons Math has no NNLS; the
 * unconstrained sub-problems are solved by Householder QR ({@link HouseholderSolve}: Commons Math's
 * reflections on plain arrays).
 */
public final class Nnls {

    private Nnls() {
    }

    /**
     * @param a the m × n matrix (not changed)
     * @param b the m right-hand sides
     * @return x ≥ 0 minimising ‖A x − b‖
     */
    public static double[] solve(double[][] a, double[] b) {
        return solve(a, b, null);
    }

    /**
     * As {@link #solve(double[][], double[])}, the loop started from {@code start} (x ≥ 0, e.g. the
     * same problem's solution from its normal equations; null for x = 0).
     */
    public static double[] solve(double[][] a, double[] b, double[] start) {
        int m = a.length;
        int n = a[0].length;
        double tol = 10 * Math.ulp(1.0) * norm1(a) * Math.max(m, n);
        return activeSet(n, tol, x -> gradient(a, b, x), passive -> leastSquaresOn(a, b, passive), start);
    }

    /**
     * Lawson &amp; Hanson's active-set loop (algorithm NNLS, ch. 23) over a problem given by its
     * gradient Aᵀ(b − A x) and its unconstrained solution on the passive set (null when that
     * solver gives up, and then the loop returns null).
     */
    private static double[] activeSet(int n, double tol, java.util.function.Function<double[], double[]> gradient,
                                      java.util.function.Function<boolean[], double[]> onPassive) {
        return activeSet(n, tol, gradient, onPassive, null);
    }

    /**
     * The loop from a feasible start (x ≥ 0, or null for x = 0): its positive entries are the first
     * passive set, settled as in the loop's inner step before the first look at the gradient. The
     * loop ends where the Kuhn–Tucker conditions hold, wherever it starts; a start near the solution
     * (that of a neighbouring problem) only saves the steps that add one variable at a time.
     */
    private static double[] activeSet(int n, double tol, java.util.function.Function<double[], double[]> gradient,
                                      java.util.function.Function<boolean[], double[]> onPassive, double[] start) {
        double[] x = new double[n];
        boolean[] passive = new boolean[n];
        if (start != null) {
            for (int j = 0; j < n; j++) {
                if (start[j] > 0) {
                    x[j] = start[j];
                    passive[j] = true;
                }
            }
            if (anyPassive(passive)) {
                x = settle(x, passive, tol, onPassive);
                if (x == null) {
                    return null;
                }
            }
        }
        int maxIter = 3 * n + 50;
        for (int iter = 0; iter < maxIter; iter++) {
            double[] w = gradient.apply(x); // w = Aᵀ(b − A x)
            int best = -1;
            double wMax = tol;
            for (int j = 0; j < n; j++) {
                if (!passive[j] && w[j] > wMax) {
                    wMax = w[j];
                    best = j;
                }
            }
            if (best < 0) {
                return x; // Kuhn–Tucker conditions hold
            }
            passive[best] = true;
            x = settle(x, passive, tol, onPassive);
            if (x == null) {
                return null;
            }
        }
        return x;
    }

    /**
     * The loop's inner step: the unconstrained solution z on the passive set, taken when it is
     * positive there; otherwise a step from x (feasible, positive on the passive set) towards z as far
     * as feasibility allows, freeing the variables that reached zero, until it is. Null when the
     * sub-problem's solver gives up.
     */
    private static double[] settle(double[] x, boolean[] passive, double tol, java.util.function.Function<boolean[], double[]> onPassive) {
        int n = x.length;
        while (true) {
            double[] z = onPassive.apply(passive);
            if (z == null) {
                return null;
            }
            boolean feasible = true;
            for (int j = 0; j < n; j++) {
                if (passive[j] && z[j] <= 0) {
                    feasible = false;
                    break;
                }
            }
            if (feasible) {
                return z;
            }
            // step from x towards z as far as feasibility allows, then free the variables that reached zero
            double alpha = Double.POSITIVE_INFINITY;
            for (int j = 0; j < n; j++) {
                if (passive[j] && z[j] <= 0) {
                    alpha = Math.min(alpha, x[j] / (x[j] - z[j]));
                }
            }
            for (int j = 0; j < n; j++) {
                x[j] += alpha * (z[j] - x[j]);
                if (passive[j] && Math.abs(x[j]) <= tol) {
                    passive[j] = false;
                    x[j] = 0;
                }
            }
            if (!anyPassive(passive)) {
                return x;
            }
        }
    }

    /**
     * The same problem given by its normal equations, G = AᵀA and c = Aᵀb: the same active-set
     * algorithm with each unconstrained sub-problem solved by a Cholesky factorisation of G on the
     * passive set (k³/3 operations against QR's 2·m·k² on A, and no copy of A). Squaring A's
     * condition number makes this the fast path for well-posed (regularised) problems only: where a
     * sub-problem is not numerically positive definite it gives up and returns null, and the caller
     * uses {@link #solve(double[][], double[])}.
     *
     * @param g   AᵀA, n × n (not changed)
     * @param c   Aᵀb
     * @param tol the gradient tolerance below which a variable stays at zero (as {@link #solve} computes it)
     * @return x ≥ 0 minimising ‖A x − b‖, or null when a sub-problem is not positive definite
     */
    public static double[] solveNormal(double[][] g, double[] c, double tol) {
        return solveNormal(g, c, tol, null);
    }

    /**
     * As {@link #solveNormal(double[][], double[], double)}, the loop started from {@code start}
     * (x ≥ 0, e.g. the solution at a neighbouring λ; null for x = 0): the same solution, in fewer steps
     * when the start is near it.
     */
    public static double[] solveNormal(double[][] g, double[] c, double tol, double[] start) {
        int n = c.length;
        return activeSet(n, tol, x -> {
            double[] w = new double[n];
            for (int j = 0; j < n; j++) {
                double sum = c[j];
                for (int i = 0; i < n; i++) {
                    sum -= g[j][i] * x[i];
                }
                w[j] = sum;
            }
            return w;
        }, passive -> choleskyOn(g, c, passive), start);
    }

    /** G_PP z_P = c_P by Cholesky; the other entries 0; null when G_PP is not numerically positive definite. */
    private static double[] choleskyOn(double[][] g, double[] c, boolean[] passive) {
        int n = passive.length;
        int k = 0;
        int[] index = new int[n];
        for (int j = 0; j < n; j++) {
            if (passive[j]) {
                index[k++] = j;
            }
        }
        double[][] l = new double[k][k];
        if (!cholesky(g, index, k, l)) {
            return null;
        }
        double[] y = new double[k];
        for (int i = 0; i < k; i++) {
            y[i] = c[index[i]];
        }
        org.viscarta.fit.Cholesky.substitute(l, k, y);
        double[] z = new double[n];
        for (int i = 0; i < k; i++) {
            z[index[i]] = y[i];
        }
        return z;
    }

    /**
     * The lower Cholesky factor of G restricted to the first k of {@code index}, into l; false when
     * a pivot is not clearly positive (relative to its diagonal entry: 1e-13, well above rounding).
     */
    static boolean cholesky(double[][] g, int[] index, int k, double[][] l) {
        for (int i = 0; i < k; i++) {
            double[] gi = g[index[i]];
            for (int j = 0; j <= i; j++) {
                double s = gi[index[j]];
                double[] li = l[i];
                double[] lj = l[j];
                for (int p = 0; p < j; p++) {
                    s -= li[p] * lj[p];
                }
                if (i == j) {
                    if (!(s > 1e-13 * gi[index[i]])) {
                        return false;
                    }
                    li[i] = Math.sqrt(s);
                } else {
                    li[j] = s / lj[j];
                }
            }
        }
        return true;
    }

    private static boolean anyPassive(boolean[] p) {
        for (boolean v : p) {
            if (v) {
                return true;
            }
        }
        return false;
    }

    private static double[] gradient(double[][] a, double[] b, double[] x) {
        int m = a.length;
        int n = x.length;
        double[] r = new double[m];
        for (int i = 0; i < m; i++) {
            double s = b[i];
            for (int j = 0; j < n; j++) {
                s -= a[i][j] * x[j];
            }
            r[i] = s;
        }
        double[] w = new double[n];
        for (int j = 0; j < n; j++) {
            double s = 0;
            for (int i = 0; i < m; i++) {
                s += a[i][j] * r[i];
            }
            w[j] = s;
        }
        return w;
    }

    /** Unconstrained least squares on the passive columns; the others are 0. */
    private static double[] leastSquaresOn(double[][] a, double[] b, boolean[] passive) {
        int m = a.length;
        int n = passive.length;
        int k = 0;
        for (boolean p : passive) {
            k += p ? 1 : 0;
        }
        double[][] sub = new double[m][k];
        int[] index = new int[k];
        int c = 0;
        for (int j = 0; j < n; j++) {
            if (passive[j]) {
                index[c] = j;
                for (int i = 0; i < m; i++) {
                    sub[i][c] = a[i][j];
                }
                c++;
            }
        }
        double[] sol = HouseholderSolve.solve(sub, b, 1e-300);
        double[] z = new double[n];
        for (int j = 0; j < k; j++) {
            z[index[j]] = sol[j];
        }
        return z;
    }

    private static double norm1(double[][] a) {
        double best = 0;
        for (int j = 0; j < a[0].length; j++) {
            double s = 0;
            for (double[] row : a) {
                s += Math.abs(row[j]);
            }
            best = Math.max(best, s);
        }
        return best;
    }
}
