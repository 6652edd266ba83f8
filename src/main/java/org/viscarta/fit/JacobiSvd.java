package org.viscarta.fit;

/**
 * Singular values and right singular vectors of a tall n × p matrix by one-sided Jacobi rotations
 * (Hestenes 1958): columns are rotated pairwise until they are mutually orthogonal; their norms are
 * then the singular values and the accumulated rotations the right singular vectors V. Accurate to
 * high relative precision even for ill-conditioned matrices (Demmel &amp; Veselić 1992, "Jacobi's
 * method is more accurate than QR", SIAM J. Matrix Anal. Appl. 13:1204–1245), and cheap for the
 * few columns of a model's Jacobian.
 */
final class JacobiSvd {

    private static final int MAX_SWEEPS = 60;

    /** Singular values, unsorted, and V with the matching columns. */
    record Result(double[] singularValues, double[][] v) {
    }

    private JacobiSvd() {
    }

    static Result decompose(double[][] a) {
        int n = a.length;
        int p = a[0].length;
        double[][] u = new double[n][];
        for (int i = 0; i < n; i++) {
            u[i] = a[i].clone();
        }
        double[][] v = new double[p][p];
        for (int i = 0; i < p; i++) {
            v[i][i] = 1;
        }
        for (int sweep = 0; sweep < MAX_SWEEPS; sweep++) {
            boolean rotated = false;
            for (int j = 0; j < p - 1; j++) {
                for (int k = j + 1; k < p; k++) {
                    double alpha = 0;
                    double beta = 0;
                    double gamma = 0;
                    for (int i = 0; i < n; i++) {
                        double x = u[i][j];
                        double y = u[i][k];
                        alpha += x * x;
                        beta += y * y;
                        gamma += x * y;
                    }
                    if (gamma == 0 || Math.abs(gamma) <= 1e-15 * Math.sqrt(alpha * beta)) {
                        continue;
                    }
                    rotated = true;
                    double zeta = (beta - alpha) / (2 * gamma);
                    double t = Math.signum(zeta) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
                    if (zeta == 0) {
                        t = 1;
                    }
                    double c = 1 / Math.sqrt(1 + t * t);
                    double s = c * t;
                    for (int i = 0; i < n; i++) {
                        double x = u[i][j];
                        double y = u[i][k];
                        u[i][j] = c * x - s * y;
                        u[i][k] = s * x + c * y;
                    }
                    for (int i = 0; i < p; i++) {
                        double x = v[i][j];
                        double y = v[i][k];
                        v[i][j] = c * x - s * y;
                        v[i][k] = s * x + c * y;
                    }
                }
            }
            if (!rotated) {
                break;
            }
        }
        double[] sv = new double[p];
        for (int j = 0; j < p; j++) {
            double s = 0;
            for (int i = 0; i < n; i++) {
                s += u[i][j] * u[i][j];
            }
            sv[j] = Math.sqrt(s);
        }
        return new Result(sv, v);
    }
}
