package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Above 20 samples {@code fit} summarises on the terminal and the full table goes to -o. 25
 * invented springpot samples without noise, sample k with α = 0.1 + k/100 (M′ = c ω^α cos(απ/2),
 * M″ = c ω^α sin(απ/2), DOMAIN.md), so the fitted α are the generating ones and their median
 * across samples is α of sample 13, 0.23, and the quartiles those of samples 7 and 19, 0.17 and
 * 0.29 (linear interpolation between order statistics lands on them exactly for 25 values).
 */
@Tag("self-check")
class FitSummaryTest {

    @Test
    void aCampaignIsSummarisedAndEverySampleIsInTheTable(@TempDir Path dir) throws Exception {
        StringBuilder sb = new StringBuilder("# modulus: shear\nsample,frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n");
        for (int k = 1; k <= 25; k++) {
            double alpha = 0.1 + k / 100.0;
            for (int i = 0; i < 12; i++) {
                double f = 0.1 * Math.pow(100, i / 11.0);
                double m = 1e4 * Math.pow(2 * Math.PI * f, alpha);
                sb.append(String.format(Locale.ROOT, "s%02d,%.10g,%.10g,%.10g%n", k, f, m * Math.cos(alpha * Math.PI / 2),
                        m * Math.sin(alpha * Math.PI / 2)));
            }
        }
        Path in = Files.writeString(dir.resolve("campaign.csv"), sb.toString());
        Path csv = dir.resolve("fits.csv");
        CliRun r = CliRun.of("fit", in.toString(), "--models", "springpot", "-o", csv.toString(), "--quiet");
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.out().startsWith("25 samples fitted; a summary"), r.out());
        assertTrue(r.out().matches("(?s).*springpot\\s+25\\s+25\\s+0.*"), "best for all 25, none failed: " + r.out());
        assertTrue(r.out().matches("(?s).*springpot alpha\\s+25\\s+0\\.2300\\s+\\[0\\.1700, 0\\.2900\\].*"), r.out());
        assertTrue(r.out().contains("every model, parameter and sample: " + csv), r.out());
        assertTrue(!r.out().contains("s01 ("), "no per-sample block: " + r.out());
        assertEquals(1 + 25 * 2, Files.readAllLines(csv).size(), "header and c, alpha of each sample");
        CliRun each = CliRun.of("fit", in.toString(), "--models", "springpot", "--every-sample", "--quiet");
        assertTrue(each.out().contains("s01 (1 replicate(s)") && each.out().contains("s25 (1 replicate(s)"), each.out());
    }
}
