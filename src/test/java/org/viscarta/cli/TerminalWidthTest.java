package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/** Regression: what fit and match print fits in 100 columns; the wide details are in their CSV (rank: ComparableSetsTest). */
@Tag("regression")
class TerminalWidthTest {

    @Test
    void fitAndMatchPrintWithinOneHundredColumns() {
        for (String[] args : new String[][] {{"fit", "demo-data/hydrogel-screen", "--basis", "tensile"},
            {"fit", "demo-data/temperature-series", "--models", "generalized-maxwell,fractional-zener"},
            {"match", "demo-data/paint-light-ageing.csv", "--library", "reference-materials", "--models", "zener,springpot"},
            {"match", "--target", "demo-data/hydrogel-screen/target-soft-tissue-r1.csv", "--candidates", "demo-data/hydrogel-screen",
                "--basis", "tensile", "--models", "zener,springpot"}}) {
            CliRun r = CliRun.of(args);
            assertEquals(0, r.exitCode(), r.err());
            r.out().lines().forEach(l -> assertTrue(l.codePointCount(0, l.length()) <= 100, "wider than 100 columns: " + l));
            assertTrue(r.out().contains(args[0].equals("fit") ? "best supported:" : "distinguishable"), r.out());
        }
    }
}
