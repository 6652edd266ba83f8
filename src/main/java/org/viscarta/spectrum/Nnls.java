package org.viscarta.spectrum;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.QRDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;

/**
 * Non-negative least squares, min ‖A x − b‖ subject to x ≥ 0, by the active-set algorithm of
 * Lawson &amp; Hanson (1974), Solving Least Squares Problems, Prentice-Hall, chapter 23 (the
 * algorithm SciPy's {@code scipy.optimize.nnls} also implements). Commons Math has no NNLS; the
 * unconstrained sub-problems are solved by its QR decomposition.
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
        int m = a.length;
        int n = a[0].length;
        double[] x = new double[n];
        boolean[] passive = new boolean[n];
        double tol = 10 * Math.ulp(1.0) * norm1(a) * Math.max(m, n);
        int maxIter = 3 * n + 50;
        for (int iter = 0; iter < maxIter; iter++) {
            double[] w = gradient(a, b, x); // w = Aᵀ(b − A x)
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
            while (true) {
                double[] z = leastSquaresOn(a, b, passive);
                boolean feasible = true;
                for (int j = 0; j < n; j++) {
                    if (passive[j] && z[j] <= 0) {
                        feasible = false;
                        break;
                    }
                }
                if (feasible) {
                    x = z;
                    break;
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
                    break;
                }
            }
        }
        return x;
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
        RealMatrix am = new Array2DRowRealMatrix(sub, false);
        RealVector sol = new QRDecomposition(am, 1e-300).getSolver().solve(new ArrayRealVector(b, false));
        double[] z = new double[n];
        for (int j = 0; j < k; j++) {
            z[index[j]] = sol.getEntry(j);
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
