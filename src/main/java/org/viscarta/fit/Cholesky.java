package org.viscarta.fit;

/** The substitutions of a Cholesky solve, shared by the fits' solver and the spectra's NNLS. */
public final class Cholesky {

    private Cholesky() {
    }

    /**
     * Solves L Lᵀ y = b in place (b becomes y), L the lower factor in the first k rows and columns
     * of {@code l} (entries above the diagonal are not read): forward, then backward substitution.
     */
    public static void substitute(double[][] l, int k, double[] y) {
        for (int i = 0; i < k; i++) {
            double s = y[i];
            for (int j = 0; j < i; j++) {
                s -= l[i][j] * y[j];
            }
            y[i] = s / l[i][i];
        }
        for (int i = k - 1; i >= 0; i--) {
            double s = y[i];
            for (int j = i + 1; j < k; j++) {
                s -= l[j][i] * y[j];
            }
            y[i] = s / l[i][i];
        }
    }
}
