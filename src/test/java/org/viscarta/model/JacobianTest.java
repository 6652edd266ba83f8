package org.viscarta.model;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * Numerical self-check: every model's analytic derivatives against central finite differences at
 * random parameter values and frequencies (seeded). The step is h = 1e-5·|θ|; the truncation
 * error of a central difference is O(h²), so 1e-6 relative (of the largest partial) is a safe bound.
 */
@Tag("self-check")
class JacobianTest {

    private static final double FINITE_DIFFERENCE_TOLERANCE = 1e-6;

    @Test
    void analyticDerivativesMatchCentralDifferences() {
        SplittableRandom rng = new SplittableRandom(7);
        for (ViscoelasticModel m : ModelCatalogue.all().stream().flatMap(x -> x.variants().stream()).toList()) {
            int p = m.parameterCount();
            for (int trial = 0; trial < 200; trial++) {
                double[] theta = new double[p];
                for (int j = 0; j < p; j++) {
                    ParameterSpec s = m.parameters().get(j);
                    if (s.transform() == Transform.LOGIT) {
                        theta[j] = rng.nextDouble(0.02, 0.98);
                    } else if (s.transform() == Transform.IDENTITY) {
                        theta[j] = rng.nextDouble(-1, 2); // log–log slopes
                    } else {
                        theta[j] = Math.pow(10, rng.nextDouble(s.isTime() ? -3 : 1, s.isTime() ? 2 : 8));
                    }
                }
                double omega = Math.pow(10, rng.nextDouble(-2, 3));
                double[] ds = new double[p];
                double[] dl = new double[p];
                m.derivatives(omega, theta, ds, dl);
                double scaleS = 0;
                double scaleL = 0;
                double[][] num = new double[2][p];
                for (int j = 0; j < p; j++) {
                    double h = 1e-5 * Math.abs(theta[j]);
                    double[] up = theta.clone();
                    double[] dn = theta.clone();
                    up[j] += h;
                    dn[j] -= h;
                    double[] a = new double[2];
                    double[] b = new double[2];
                    m.modulus(omega, up, a);
                    m.modulus(omega, dn, b);
                    num[0][j] = (a[0] - b[0]) / (2 * h) * theta[j];
                    num[1][j] = (a[1] - b[1]) / (2 * h) * theta[j];
                    scaleS = Math.max(scaleS, Math.abs(ds[j] * theta[j]));
                    scaleL = Math.max(scaleL, Math.abs(dl[j] * theta[j]));
                }
                for (int j = 0; j < p; j++) {
                    String where = m.id() + " ∂/∂" + m.parameters().get(j).name() + " at ω = " + omega;
                    assertEquals(num[0][j], ds[j] * theta[j], FINITE_DIFFERENCE_TOLERANCE * scaleS, where + " (M′)");
                    assertEquals(num[1][j], dl[j] * theta[j], FINITE_DIFFERENCE_TOLERANCE * scaleL + 1e-300, where + " (M″)");
                }
                // the fits take both at once: the same numbers, bit for bit, as the two methods
                double[] mod = new double[2];
                m.modulus(omega, theta, mod);
                double[] both = new double[2];
                double[] bs = new double[p];
                double[] bl = new double[p];
                m.modulusAndDerivatives(omega, theta, both, bs, bl);
                String where = m.id() + " (" + m.describeVariant() + ") at ω = " + omega;
                assertArrayEquals(mod, both, 0, where + ": M′, M″ with the derivatives");
                assertArrayEquals(ds, bs, 0, where + ": ∂M′ with the modulus");
                assertArrayEquals(dl, bl, 0, where + ": ∂M″ with the modulus");
            }
        }
    }
}
