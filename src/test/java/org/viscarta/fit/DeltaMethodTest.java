package org.viscarta.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.viscarta.model.Zener;
import org.viscarta.sweep.SweepPoint;

/**
 * Validation of the one delta-method implementation: for a linear function it is exact,
 * Var(aᵀθ) = aᵀCa; for a product of independent estimates the first-order propagation formula is
 * Var(θ₁θ₂) ≈ θ₂²σ₁² + θ₁²σ₂² (Seber &amp; Wild, Nonlinear Regression, 1989, section 5.1; any
 * textbook on error propagation). A fit's natural-unit covariance agrees with its correlations and
 * standard errors (self-check of the covariance every curve and band now carries).
 */
@Tag("validation")
class DeltaMethodTest {

    /** Central differences of these smooth functions at a 1e-6 relative step: truncation O(h²), rounding ~1e-10. */
    private static final double DIFFERENCES = 1e-8;

    @Test
    void linearFunctionsPropagateExactly() {
        double[][] c = {{4, 1, 0}, {1, 9, -2}, {0, -2, 1}};
        double[] a = {2, -1, 3};
        double exact = 0;
        for (int i = 0; i < 3; i++) {
            for (int j = 0; j < 3; j++) {
                exact += a[i] * c[i][j] * a[j];
            }
        }
        double[] g = DeltaMethod.gradient(x -> a[0] * x[0] + a[1] * x[1] + a[2] * x[2], new double[] {1, 5, -2}, 1e-6, 1.0);
        assertEquals(Math.sqrt(exact), DeltaMethod.standardError(g, c), Math.sqrt(exact) * DIFFERENCES);
    }

    @Test
    void productOfIndependentEstimatesFollowsThePropagationFormula() {
        double t1 = 3.0;
        double t2 = 0.5;
        double s1 = 0.2;
        double s2 = 0.05;
        double[][] c = {{s1 * s1, 0}, {0, s2 * s2}};
        double expected = Math.sqrt(t2 * t2 * s1 * s1 + t1 * t1 * s2 * s2);
        double[] g = DeltaMethod.gradient(x -> x[0] * x[1], new double[] {t1, t2}, 1e-6, 1e-12);
        assertEquals(expected, DeltaMethod.standardError(g, c), expected * DIFFERENCES);
        assertTrue(Double.isNaN(DeltaMethod.standardError(g, null)), "unknown covariance gives no standard error");
    }

    @Test
    void aFitsCovarianceAgreesWithItsCorrelationsAndStandardErrors() {
        Random rng = new Random(11);
        double[] p = {1e4, 3e4, 0.05};
        List<SweepPoint> pts = new ArrayList<>();
        double[] m = new double[2];
        for (int i = 0; i < 15; i++) {
            double f = 0.05 * Math.pow(400, i / 14.0);
            new Zener().modulus(2 * Math.PI * f, p, m);
            pts.add(new SweepPoint(f, m[0] * Math.exp(0.03 * rng.nextGaussian()), m[1] * Math.exp(0.03 * rng.nextGaussian()), i + 2));
        }
        FitResult r = new ModelFitter(Weighting.LOG).fit("s", new Zener(), pts);
        assertTrue(r.converged(), r.message());
        assertEquals("zener", r.fitted().id());
        double[][] cov = r.covariance();
        double[][] corr = r.correlation();
        for (int i = 0; i < 3; i++) {
            for (int j = 0; j < 3; j++) {
                double viaCorrelation = corr[i][j] * r.parameters().get(i).stdError() * r.parameters().get(j).stdError();
                assertEquals(viaCorrelation, cov[i][j], 1e-12 * Math.abs(viaCorrelation) + 1e-300);
            }
        }
    }
}
