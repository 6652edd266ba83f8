package org.viscarta.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * The solver on a misfit whose infimum lies at a parameter's infinity, the case of a model the data
 * do not need whole. Residuals r = (a·e^(−u), v − 1, 1/2) [u, v free]: the sum of squares
 * a²e^(−2u) + (v − 1)² + 1/4 falls toward 1/4 as u → ∞ and has no minimum; worked by hand.
 * Gauss–Newton moves u by exactly 1 each step here (r₁/r₁′ = −1), so the misfit's excess shrinks by
 * e⁻² a step: about 16 steps to bring it below 10⁻¹⁴ of the misfit from a = 1, u = 0, taking the same
 * step every time — the drift that {@link CompactLevenbergMarquardt} extrapolates.
 */
@Tag("self-check")
class DriftTest {

    private static final double A = 1;

    private static ResidualFunction drift() {
        return (x, r, jac) -> {
            double e = A * Math.exp(-x[0]);
            r[0] = e;
            r[1] = x[1] - 1;
            r[2] = 0.5;
            jac[0][0] = -e;
            jac[0][1] = 0;
            jac[1][0] = 0;
            jac[1][1] = 1;
            jac[2][0] = 0;
            jac[2][1] = 0;
        };
    }

    @Test
    void aDriftToInfinityIsFollowedByDoublingAndEndsAtTheInfimum() {
        CompactLevenbergMarquardt.Result r = new CompactLevenbergMarquardt(300, 1e-14).solve(3, drift(), new double[] {0, 3});
        assertTrue(r.converged(), r.message());
        // the infimum 1/4, to the tolerance
        assertEquals(0.25, r.rss(), 1e-14 * 0.25 * 10);
        assertEquals(1, r.params()[1], 1e-9, "the determined parameter at its value");
        // far along the drift: e^(−2u) below the tolerance's share of the misfit (u > ½ ln(4·10¹⁴) ≈ 16.8)
        assertTrue(r.params()[0] > 16.8, "u = " + r.params()[0]);
        // without the extrapolation (DOUBLINGS set to 0) the same solve took 45 evaluations: the damped steps
        // move u by less than 1 each; with it, three steps alike and then doublings
        assertTrue(r.evaluations() <= 14, r.evaluations() + " evaluations");
    }

    /**
     * A fit that converges (a determined minimum) takes shrinking steps and is not extrapolated: the
     * exponential decay y = 2e^(−0.7t) at t = 0 … 4, exact, is recovered to rounding.
     */
    @Test
    void aConvergingFitIsNotStretched() {
        double[] t = {0, 1, 2, 3, 4};
        ResidualFunction f = (x, r, jac) -> {
            for (int i = 0; i < t.length; i++) {
                double e = Math.exp(-x[1] * t[i]);
                r[i] = x[0] * e - 2 * Math.exp(-0.7 * t[i]);
                jac[i][0] = e;
                jac[i][1] = -x[0] * t[i] * e;
            }
        };
        CompactLevenbergMarquardt.Result r = new CompactLevenbergMarquardt(300, 1e-14).solve(5, f, new double[] {1, 0.2});
        assertTrue(r.converged(), r.message());
        assertEquals(2, r.params()[0], 1e-10);
        assertEquals(0.7, r.params()[1], 1e-10);
    }
}
