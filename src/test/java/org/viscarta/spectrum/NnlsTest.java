package org.viscarta.spectrum;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * The active-set loop started from a neighbouring problem's solution ends at the solution it reaches
 * from zero (a strictly convex problem has one), on random regularised problems whose solutions
 * have both zero and positive entries; and both satisfy the Kuhn–Tucker conditions.
 */
@Tag("self-check")
class NnlsTest {

    @Test
    void aWarmStartEndsWhereTheColdStartEnds() {
        SplittableRandom rng = new SplittableRandom(4);
        for (int trial = 0; trial < 200; trial++) {
            int m = 20 + rng.nextInt(30);
            int n = 5 + rng.nextInt(40);
            double[][] a = new double[m + n][n];
            double[] b = new double[m + n];
            for (int i = 0; i < m; i++) {
                for (int j = 0; j < n; j++) {
                    double x = Math.pow(10, 3.0 * i / m - 3.0 * j / n);
                    a[i][j] = x / (1 + x * x); // Maxwell-like kernels: neighbouring columns nearly alike
                }
                b[i] = rng.nextDouble(-0.5, 1.5);
            }
            double lambda = Math.pow(10, rng.nextDouble(-3, 0));
            for (int j = 0; j < n; j++) {
                a[m + j][j] = lambda; // Tikhonov rows: AᵀA positive definite
            }
            double[][] g = new double[n][n];
            double[] c = new double[n];
            for (int p = 0; p < n; p++) {
                for (int i = 0; i < m + n; i++) {
                    c[p] += a[i][p] * b[i];
                    for (int q = 0; q < n; q++) {
                        g[p][q] += a[i][p] * a[i][q];
                    }
                }
            }
            double tol = 1e-13;
            double[] cold = Nnls.solveNormal(g, c, tol);
            // a start of the right kind: another problem's solution, the same with λ a little larger
            double[][] g2 = new double[n][];
            for (int p = 0; p < n; p++) {
                g2[p] = g[p].clone();
                g2[p][p] += 0.6 * lambda * lambda;
            }
            double[] start = Nnls.solveNormal(g2, c, tol);
            double[] warm = Nnls.solveNormal(g, c, tol, start);
            assertNotNull(cold);
            assertNotNull(warm);
            double top = 0;
            for (double v : cold) {
                top = Math.max(top, v);
            }
            for (int j = 0; j < n; j++) {
                assertEquals(cold[j], warm[j], 1e-9 * Math.max(top, 1e-300), "trial " + trial + ", x[" + j + "]");
            }
            // the QR path from the same start, and from the normal equations' own solution (as the spectrum's final solve)
            double[] qrCold = Nnls.solve(a, b);
            for (double[] from : new double[][] {start, cold}) {
                double[] qrWarm = Nnls.solve(a, b, from);
                for (int j = 0; j < n; j++) {
                    assertEquals(qrCold[j], qrWarm[j], 1e-9 * Math.max(top, 1e-300), "QR, trial " + trial + ", x[" + j + "]");
                }
            }
            // Kuhn–Tucker: x ≥ 0, gradient c − G x ≤ tol where x = 0 and ≈ 0 where x > 0
            for (int j = 0; j < n; j++) {
                double w = c[j];
                for (int k = 0; k < n; k++) {
                    w -= g[j][k] * warm[k];
                }
                if (warm[j] > 0) {
                    assertEquals(0, w, 1e-8 * (Math.abs(c[j]) + 1), "stationary where positive");
                } else {
                    assertEquals(0, warm[j], 0.0);
                    assertEquals(true, w <= 1e-8 * (Math.abs(c[j]) + 1), "no descent where zero: " + w);
                }
            }
        }
    }
}
