package org.viscarta.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * Validation: information criteria and Akaike weights against DOMAIN.md section 10.7 (derived
 * there with K = p + 1; Burnham &amp; Anderson 2002; Hurvich &amp; Tsai 1989; Schwarz 1978).
 * The table prints 6 decimals, so values are held to 5e-7 absolute.
 */
@Tag("validation")
class ModelSelectionTest {

    private static final double PRINTED_SIX_DECIMALS = 5e-7;

    private static FitResult fit(String model, int n, int p, double rss) {
        return new FitResult("s", model, List.of(), n, rss, ModelSelection.aic(n, p, rss), ModelSelection.aicc(n, p, rss),
                ModelSelection.bic(n, p, rss), null, true, "", "", List.of());
    }

    @Test
    void criteriaMatchDomainTable() {
        // DOMAIN.md 10.7, n = 30
        assertEquals(-75.241506, ModelSelection.aic(30, 2, 2.0), PRINTED_SIX_DECIMALS);
        assertEquals(-74.318429, ModelSelection.aicc(30, 2, 2.0), PRINTED_SIX_DECIMALS);
        assertEquals(-71.037914, ModelSelection.bic(30, 2, 2.0), PRINTED_SIX_DECIMALS);
        assertEquals(-81.871968, ModelSelection.aic(30, 3, 1.5), PRINTED_SIX_DECIMALS);
        assertEquals(-80.271968, ModelSelection.aicc(30, 3, 1.5), PRINTED_SIX_DECIMALS);
        assertEquals(-76.267179, ModelSelection.bic(30, 3, 1.5), PRINTED_SIX_DECIMALS);
        assertEquals(-80.889015, ModelSelection.aic(30, 4, 1.45), PRINTED_SIX_DECIMALS);
        assertEquals(-78.389015, ModelSelection.aicc(30, 4, 1.45), PRINTED_SIX_DECIMALS);
        assertEquals(-73.883028, ModelSelection.bic(30, 4, 1.45), PRINTED_SIX_DECIMALS);
    }

    @Test
    void akaikeWeightsMatchDomainTableAndNameTheBest() {
        // DOMAIN.md 10.7: weights 0.035362, 0.693958, 0.270679
        List<ModelSelection.Ranked> r = ModelSelection.rank(List.of(fit("A", 30, 2, 2.0), fit("B", 30, 3, 1.5), fit("C", 30, 4, 1.45)));
        assertEquals(0.035362, r.get(0).weight(), PRINTED_SIX_DECIMALS);
        assertEquals(0.693958, r.get(1).weight(), PRINTED_SIX_DECIMALS);
        assertEquals(0.270679, r.get(2).weight(), PRINTED_SIX_DECIMALS);
        assertTrue(r.get(1).best());
        assertFalse(r.get(0).best() || r.get(2).best());
    }

    @Test
    void countingSigmaSquaredPrefersTheSimplerModelAtSmallN() {
        // DOMAIN.md 10.7 "Counting matters": n = 10, (p = 2, RSS = 1.0) vs (p = 3, RSS = 0.6);
        // with K = p + 1, AICc = −13.025851 vs −12.134107 and the simpler model wins.
        assertEquals(-13.025851, ModelSelection.aicc(10, 2, 1.0), PRINTED_SIX_DECIMALS);
        assertEquals(-12.134107, ModelSelection.aicc(10, 3, 0.6), PRINTED_SIX_DECIMALS);
        List<ModelSelection.Ranked> r = ModelSelection.rank(List.of(fit("small", 10, 2, 1.0), fit("large", 10, 3, 0.6)));
        assertTrue(r.get(0).best());
    }

    @Test
    void failedFitsAreNeverRankedOrWeighted() {
        FitResult failed = new FitResult("s", "bad", List.of(), 30, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                null, false, "did not converge", "", List.of());
        List<ModelSelection.Ranked> r = ModelSelection.rank(List.of(failed, fit("A", 30, 2, 2.0)));
        assertFalse(r.get(0).best());
        assertTrue(Double.isNaN(r.get(0).weight()));
        assertEquals(1.0, r.get(1).weight(), 1e-15);
        assertTrue(r.get(1).best());
    }
}
