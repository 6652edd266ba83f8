package org.viscarta.fit;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.Random;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.QRDecomposition;
import org.apache.commons.math3.linear.SingularMatrixException;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/** The plain-array Householder solve against Commons Math's QR solver, the reference it mirrors. */
@Tag("validation")
class HouseholderSolveTest {

    @Test
    void agreesWithCommonsMathOnOverdeterminedAndIllConditionedSystems() {
        Random r = new Random(17);
        for (int trial = 0; trial < 300; trial++) {
            int n = 1 + r.nextInt(25);
            int m = n + r.nextInt(30);
            double[][] a = new double[m][n];
            double[] b = new double[m];
            for (int i = 0; i < m; i++) {
                b[i] = r.nextGaussian();
                for (int j = 0; j < n; j++) {
                    // Maxwell-like columns for part of the trials: close neighbours, badly conditioned
                    double x = Math.pow(10, 3.0 * i / m - 2.0 * j / n);
                    a[i][j] = trial % 2 == 0 ? r.nextGaussian() : x / (1 + x * x);
                }
            }
            double[][] copy = new double[m][];
            for (int i = 0; i < m; i++) {
                copy[i] = a[i].clone();
            }
            double[] want;
            try {
                want = new QRDecomposition(new Array2DRowRealMatrix(a, true), 1e-12).getSolver()
                        .solve(new ArrayRealVector(b, true)).toArray();
            } catch (SingularMatrixException e) {
                assertThrows(SingularMatrixException.class, () -> HouseholderSolve.solve(a, b, 1e-12));
                continue;
            }
            // the same reflections in the same order: the same doubles
            assertArrayEquals(want, HouseholderSolve.solve(a, b, 1e-12), 0.0, "trial " + trial);
            for (int i = 0; i < m; i++) {
                assertArrayEquals(copy[i], a[i], 0.0, "A is left as it was");
            }
        }
    }

    @Test
    void aRankDeficientMatrixIsRefused() {
        double[][] a = {{1, 2}, {2, 4}, {3, 6}};
        assertThrows(SingularMatrixException.class, () -> HouseholderSolve.solve(a, new double[] {1, 2, 3}, 1e-12));
    }
}
