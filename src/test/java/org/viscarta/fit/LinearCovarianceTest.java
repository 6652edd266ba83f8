package org.viscarta.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * Validation: covariance scaling s²(JᵀJ)⁻¹ and the delta method on DOMAIN.md section 10.7's linear
 * example (x = 0…5, y = 0.1, 1.9, 4.2, 5.8, 8.1, 9.9), whose values are printed to 6 significant digits.
 */
@Tag("validation")
class LinearCovarianceTest {

    private static final double SIX_DIGITS = 1e-5;

    @Test
    void linearFitReproducesCoefficientsStandardErrorsAndDeltaMethod() {
        double[] x = {0, 1, 2, 3, 4, 5};
        double[] y = {0.1, 1.9, 4.2, 5.8, 8.1, 9.9};
        ResidualFunction f = (b, r, jac) -> {
            for (int i = 0; i < x.length; i++) {
                r[i] = b[0] + b[1] * x[i] - y[i];
                jac[i][0] = 1;
                jac[i][1] = x[i];
            }
        };
        Solution s = new LeastSquaresEngine(LeastSquaresEngine.Settings.defaults()).solve(6, f, new double[] {1, 1});
        double[] b = s.params();
        double[][] c = s.covariance();
        assertEquals(0.0571429, b[0], SIX_DIGITS * 0.0571429);
        assertEquals(1.9771429, b[1], SIX_DIGITS * 1.9771429);
        assertEquals(0.0277143, s.rss() / 4, SIX_DIGITS * 0.0277143);
        assertEquals(0.1204865, Math.sqrt(c[0][0]), SIX_DIGITS * 0.1204865);
        assertEquals(0.0397954, Math.sqrt(c[1][1]), SIX_DIGITS * 0.0397954);
        assertEquals(-0.00395918, c[0][1], SIX_DIGITS * 0.00395918);
        // delta method for g = β0/β1: ∇g = (1/β1, −β0/β1²)
        double g = b[0] / b[1];
        double g0 = 1 / b[1];
        double g1 = -b[0] / (b[1] * b[1]);
        double var = g0 * g0 * c[0][0] + 2 * g0 * g1 * c[0][1] + g1 * g1 * c[1][1];
        assertEquals(0.0289017, g, SIX_DIGITS * 0.0289017);
        assertEquals(0.0614209, Math.sqrt(var), SIX_DIGITS * 0.0614209);
    }
}
