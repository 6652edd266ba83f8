package org.viscarta.fit;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.concurrent.atomic.AtomicReference;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * The compact solver keeps each thread's arrays for its next solve of the same shape. A solve must
 * give the same numbers, bit for bit, whatever was solved before it on the thread (another shape, the
 * same shape, a solve inside a residual function), and a result must own its parameters and Jacobian.
 * The problem: an exponential decay y = a·e^(−b·t) at 8 times, with noise made here, worked from one start.
 */
@Tag("self-check")
class SolverWorkspaceTest {

    private static final double[] T = {0, 0.5, 1, 1.5, 2, 3, 4, 6};
    private static final double[] Y = {2.02, 1.21, 0.74, 0.44, 0.28, 0.099, 0.036, 0.0051};

    private static ResidualFunction decay() {
        return (x, r, jac) -> {
            for (int i = 0; i < T.length; i++) {
                double e = Math.exp(-x[1] * T[i]);
                r[i] = x[0] * e - Y[i];
                jac[i][0] = e;
                jac[i][1] = -x[0] * T[i] * e;
            }
        };
    }

    /** Another shape: a straight line through three points. */
    private static ResidualFunction line() {
        return (x, r, jac) -> {
            for (int i = 0; i < 3; i++) {
                r[i] = x[0] + x[1] * i + x[2] * i * i - (1 + 2 * i);
                jac[i][0] = 1;
                jac[i][1] = i;
                jac[i][2] = i * i;
            }
        };
    }

    private static CompactLevenbergMarquardt.Result solveDecay() {
        return new CompactLevenbergMarquardt(300, 1e-14).solve(T.length, decay(), new double[] {1, 0.5});
    }

    @Test
    void aSolveGivesTheSameNumbersWhateverCameBefore() {
        // first on a fresh thread: nothing kept yet
        AtomicReference<CompactLevenbergMarquardt.Result> fresh = new AtomicReference<>();
        Thread t = new Thread(() -> fresh.set(solveDecay()));
        t.start();
        assertTrue(join(t));
        CompactLevenbergMarquardt.Result first = fresh.get();
        assertTrue(first.converged(), first.message());
        assertEquals(2.0, first.params()[0], 0.05, "a: the decay's amplitude, about 2");

        CompactLevenbergMarquardt.Result afterSame = solveDecay();
        new CompactLevenbergMarquardt(300, 1e-14).solve(3, line(), new double[] {0, 0, 0});
        CompactLevenbergMarquardt.Result afterOther = solveDecay();
        for (CompactLevenbergMarquardt.Result r : new CompactLevenbergMarquardt.Result[] {afterSame, afterOther}) {
            assertArrayEquals(first.params(), r.params(), 0);
            assertEquals(first.rss(), r.rss(), 0);
            assertEquals(first.evaluations(), r.evaluations());
            for (int j = 0; j < 2; j++) {
                assertArrayEquals(first.columns()[j], r.columns()[j], 0);
            }
        }
        // a result owns its arrays: later solves did not change the first ones
        assertNotSame(afterSame.params(), afterOther.params());
        assertNotSame(afterSame.columns()[0], afterOther.columns()[0]);
    }

    @Test
    void aSolveInsideAResidualFunctionDoesNotDisturbTheOuterOne() {
        CompactLevenbergMarquardt.Result alone = solveDecay();
        ResidualFunction decay = decay();
        double[] inner = new double[1];
        ResidualFunction nesting = (x, r, jac) -> {
            inner[0] = solveDecay().rss(); // the same shape, on the same thread, mid-solve
            decay.evaluate(x, r, jac);
        };
        CompactLevenbergMarquardt.Result outer = new CompactLevenbergMarquardt(300, 1e-14).solve(T.length, nesting, new double[] {1, 0.5});
        assertArrayEquals(alone.params(), outer.params(), 0);
        assertEquals(alone.rss(), outer.rss(), 0);
        assertEquals(alone.rss(), inner[0], 0);
    }

    @Test
    void theColumnsAreTheJacobianAtTheParameters() {
        CompactLevenbergMarquardt.Result r = solveDecay();
        double[] res = new double[T.length];
        double[][] jac = new double[T.length][2];
        decay().evaluate(r.params(), res, jac);
        for (int i = 0; i < T.length; i++) {
            for (int j = 0; j < 2; j++) {
                assertEquals(jac[i][j], r.columns()[j][i], 0, "row " + i + ", column " + j);
            }
        }
    }

    private static boolean join(Thread t) {
        try {
            t.join();
            return true;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return false;
        }
    }
}
