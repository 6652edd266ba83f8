package org.viscarta.fit;

/**
 * The outcome of one least-squares solve.
 *
 * @param params      parameter values at the optimum (or at the last iterate when not converged)
 * @param rss         residual sum of squares Σ r_i²
 * @param jtjInverse  (JᵀJ)⁻¹ at the optimum, unscaled; null when JᵀJ is singular
 * @param n           number of residuals
 * @param evaluations function evaluations used
 * @param converged   whether the optimiser met its convergence criteria
 * @param message     why it did not converge, or ""
 */
public record Solution(double[] params, double rss, double[][] jtjInverse, int n, int evaluations,
                       boolean converged, String message) {

    public Solution {
        params = params.clone();
    }

    @Override
    public double[] params() {
        return params.clone();
    }

    /** Covariance of the parameters, s²(JᵀJ)⁻¹ with s² = RSS/(n − p); null when singular. */
    public double[][] covariance() {
        if (jtjInverse == null || n <= params.length) {
            return null;
        }
        double s2 = rss / (n - params.length);
        double[][] c = new double[params.length][params.length];
        for (int i = 0; i < c.length; i++) {
            for (int j = 0; j < c.length; j++) {
                c[i][j] = s2 * jtjInverse[i][j];
            }
        }
        return c;
    }
}
