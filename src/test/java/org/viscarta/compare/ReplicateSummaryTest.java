package org.viscarta.compare;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * Validation: replicate mean, SD and 95 % t-interval against SciPy 1.17.1
 * (src/test/resources/scipy/replicate_summary.py and its .out beside it), on data A of DOMAIN.md 10.8.
 */
@Tag("validation")
class ReplicateSummaryTest {

    private static final double SCIPY_TOLERANCE = 1e-12;

    @Test
    void matchesScipyStudentInterval() {
        ReplicateSummary s = ReplicateSummary.of(new double[] {10.2, 11.5, 9.8, 12.1, 10.9});
        assertEquals(5, s.n());
        assertEquals(10.9, s.mean(), SCIPY_TOLERANCE * 10.9);                  // replicate_summary.out
        assertEquals(0.9354143466934852, s.sd(), SCIPY_TOLERANCE);             // replicate_summary.out
        assertEquals(9.738529682307405, s.ci95Low(), SCIPY_TOLERANCE * 10);    // replicate_summary.out
        assertEquals(12.061470317692596, s.ci95High(), SCIPY_TOLERANCE * 10);  // replicate_summary.out
    }

    @Test
    void oneReplicateHasNoSpreadOrInterval() {
        ReplicateSummary s = ReplicateSummary.of(new double[] {0.3});
        assertEquals(0.3, s.mean());
        assertTrue(Double.isNaN(s.sd()) && Double.isNaN(s.ci95Low()) && Double.isNaN(s.ci95High()));
    }
}
