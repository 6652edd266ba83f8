package org.viscarta.fit;

import org.apache.commons.math3.linear.SingularMatrixException;

/**
 * Linear least squares min ‖A x − b‖ by Householder QR, on plain arrays: the same reflections, in the
 * same order, as Commons Math's {@code QRDecomposition} and its solver (Golub &amp; Van Loan, Matrix
 * Computations, 4th ed., §5.2 and §5.3.3), without its matrix objects, transposes and copies, which
 * cost more than the arithmetic on the small systems solved once per sweep.
 */
public final class HouseholderSolve {

    private HouseholderSolve() {
    }

    /**
     * The least-squares solution of A x = b for A with at least as many rows as columns; A and b are
     * not changed.
     *
     * @throws SingularMatrixException when a diagonal entry of R is at most {@code threshold} in size
     *     (the rank test of Commons Math's solver)
     */
    public static double[] solve(double[][] a, double[] b, double threshold) {
        int m = a.length;
        int n = a[0].length;
        double[][] qrt = new double[n][];
        double[] rDiag = reflect(a, qrt);
        double[] y = b.clone();
        for (int minor = 0; minor < Math.min(m, n); minor++) {
            double[] qrtMinor = qrt[minor];
            double dot = 0;
            for (int row = minor; row < m; row++) {
                dot += y[row] * qrtMinor[row];
            }
            dot /= rDiag[minor] * qrtMinor[minor];
            for (int row = minor; row < m; row++) {
                y[row] += dot * qrtMinor[row];
            }
        }
        for (int j = 0; j < n; j++) {
            if (Math.abs(rDiag[j]) <= threshold) {
                throw new SingularMatrixException();
            }
        }
        double[] x = new double[n];
        for (int row = n - 1; row >= 0; row--) {
            y[row] /= rDiag[row];
            double yRow = y[row];
            double[] qrtRow = qrt[row];
            x[row] = yRow;
            for (int i = 0; i < row; i++) {
                y[i] -= yRow * qrtRow[i];
            }
        }
        return x;
    }

    /**
     * The triangular factor R (p × p, upper) of A = QR for A with at least as many rows as columns,
     * A given by its columns (p arrays of m, m ≥ p), which the reflections overwrite: AᵀA = RᵀR, so
     * R has A's singular values and right singular vectors at the cost of a p × p problem.
     */
    public static double[][] triangularOfColumns(double[][] columns) {
        return triangularFactor(columns, reflectColumns(columns, columns[0].length));
    }

    private static double[][] triangularFactor(double[][] qrt, double[] rDiag) {
        int p = qrt.length;
        double[][] r = new double[p][p];
        for (int row = 0; row < p; row++) {
            r[row][row] = rDiag[row];
            for (int col = row + 1; col < p; col++) {
                r[row][col] = qrt[col][row];
            }
        }
        return r;
    }

    /**
     * The Householder reflections of A, in Commons Math's layout: column j of A, reflected, becomes
     * row j of {@code qrt} (which must have A's column count of rows); returns the diagonal of R.
     */
    private static double[] reflect(double[][] a, double[][] qrt) {
        int m = a.length;
        int n = a[0].length;
        for (int j = 0; j < n; j++) {
            qrt[j] = new double[m];
        }
        for (int i = 0; i < m; i++) {
            for (int j = 0; j < n; j++) {
                qrt[j][i] = a[i][j];
            }
        }
        return reflectColumns(qrt, m);
    }

    /** The reflections of A given by its columns {@code qrt} (n arrays of m), in place; returns the diagonal of R. */
    private static double[] reflectColumns(double[][] qrt, int m) {
        int n = qrt.length;
        double[] rDiag = new double[n];
        for (int minor = 0; minor < Math.min(m, n); minor++) {
            double[] qrtMinor = qrt[minor];
            double xNormSqr = 0;
            for (int row = minor; row < m; row++) {
                xNormSqr += qrtMinor[row] * qrtMinor[row];
            }
            double alpha = qrtMinor[minor] > 0 ? -Math.sqrt(xNormSqr) : Math.sqrt(xNormSqr);
            rDiag[minor] = alpha;
            if (alpha != 0) {
                qrtMinor[minor] -= alpha;
                for (int col = minor + 1; col < n; col++) {
                    double[] qrtCol = qrt[col];
                    double s = 0;
                    for (int row = minor; row < m; row++) {
                        s -= qrtCol[row] * qrtMinor[row];
                    }
                    s /= alpha * qrtMinor[minor];
                    for (int row = minor; row < m; row++) {
                        qrtCol[row] -= s * qrtMinor[row];
                    }
                }
            }
        }
        return rDiag;
    }
}
