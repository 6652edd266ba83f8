package org.viscarta.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.Random;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * (JᵀJ)⁻¹ for covariances, from the QR-preconditioned Jacobi SVD, against the same inverse in
 * 60-digit decimal arithmetic (JᵀJ formed exactly from the doubles, then Gauss–Jordan): Jacobians
 * with columns scaled over twelve decades, the ill-conditioning model parameters of very different
 * sizes give.
 */
@Tag("self-check")
class InverseNormalMatrixTest {

    private static final MathContext MC = new MathContext(60);

    @Test
    void agreesWithSixtyDigitArithmeticOnColumnScaledJacobians() {
        Random r = new Random(8);
        for (int trial = 0; trial < 60; trial++) {
            int p = 1 + r.nextInt(8);
            int n = p + 2 + r.nextInt(40);
            double[][] j = new double[n][p];
            double[] scale = new double[p];
            for (int c = 0; c < p; c++) {
                scale[c] = Math.pow(10, -6 + 12 * r.nextDouble());
            }
            for (int i = 0; i < n; i++) {
                for (int c = 0; c < p; c++) {
                    j[i][c] = r.nextGaussian() * scale[c];
                }
            }
            double[][] got = LeastSquaresEngine.inverseNormalMatrix(j, 1e-300);
            assertNotNull(got, "trial " + trial);
            BigDecimal[][] want = inverse(normal(j));
            for (int a = 0; a < p; a++) {
                for (int b = 0; b < p; b++) {
                    double w = want[a][b].doubleValue();
                    // relative to the diagonal scale of the entry: (JᵀJ)⁻¹ entries are of order 1/(s_a s_b)
                    double size = Math.sqrt(want[a][a].doubleValue() * want[b][b].doubleValue());
                    assertEquals(w, got[a][b], 1e-10 * size, "trial " + trial + " entry " + a + "," + b);
                }
            }
        }
    }

    private static BigDecimal[][] normal(double[][] j) {
        int p = j[0].length;
        BigDecimal[][] m = new BigDecimal[p][p];
        for (int a = 0; a < p; a++) {
            for (int b = 0; b < p; b++) {
                BigDecimal s = BigDecimal.ZERO;
                for (double[] row : j) {
                    s = s.add(new BigDecimal(row[a]).multiply(new BigDecimal(row[b])));
                }
                m[a][b] = s;
            }
        }
        return m;
    }

    private static BigDecimal[][] inverse(BigDecimal[][] m) {
        int p = m.length;
        BigDecimal[][] a = new BigDecimal[p][2 * p];
        for (int i = 0; i < p; i++) {
            for (int k = 0; k < 2 * p; k++) {
                a[i][k] = k < p ? m[i][k] : (k - p == i ? BigDecimal.ONE : BigDecimal.ZERO);
            }
        }
        for (int c = 0; c < p; c++) {
            int piv = c;
            for (int i = c + 1; i < p; i++) {
                if (a[i][c].abs().compareTo(a[piv][c].abs()) > 0) {
                    piv = i;
                }
            }
            BigDecimal[] t = a[c];
            a[c] = a[piv];
            a[piv] = t;
            BigDecimal d = a[c][c];
            for (int k = 0; k < 2 * p; k++) {
                a[c][k] = a[c][k].divide(d, MC);
            }
            for (int i = 0; i < p; i++) {
                if (i != c && a[i][c].signum() != 0) {
                    BigDecimal f = a[i][c];
                    for (int k = 0; k < 2 * p; k++) {
                        a[i][k] = a[i][k].subtract(f.multiply(a[c][k], MC), MC);
                    }
                }
            }
        }
        BigDecimal[][] inv = new BigDecimal[p][p];
        for (int i = 0; i < p; i++) {
            System.arraycopy(a[i], p, inv[i], 0, p);
        }
        return inv;
    }
}
