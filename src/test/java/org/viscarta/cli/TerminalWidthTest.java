package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/** Regression: what fit and rank print fits in 100 columns; the wide details are in their CSV. */
@Tag("regression")
class TerminalWidthTest {

    @Test
    void fitAndRankPrintWithinOneHundredColumns() {
        for (String[] args : new String[][] {{"fit", "demo-data/hydrogel-screen", "--basis", "tensile"},
            {"fit", "demo-data/temperature-series", "--models", "generalized-maxwell,fractional-zener"}}) {
            CliRun r = CliRun.of(args);
            assertEquals(0, r.exitCode(), r.err());
            r.out().lines().forEach(l -> assertTrue(l.codePointCount(0, l.length()) <= 100, "wider than 100 columns: " + l));
            assertTrue(r.out().contains("best supported:"), r.out());
        }
    }
}
