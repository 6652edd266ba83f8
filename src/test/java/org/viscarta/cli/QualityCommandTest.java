package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The quality checks as the verbs show them: quality, fit, inspect, and rank --drop-outliers. */
@Tag("regression")
class QualityCommandTest {

    @TempDir
    Path dir;

    /** A strain amplitude sweep of G′ = 1000 Pa / sqrt(1 + (γ/10 %)²), 0.1–100 % at ten points a decade. */
    private Path strainSweep() throws IOException {
        StringBuilder sb = new StringBuilder("# sample: gel\n# frequency: 1 Hz\nstrain_amplitude [%],G' [Pa],G'' [Pa]\n");
        for (int i = 0; i <= 30; i++) {
            double strain = 0.1 * Math.pow(10, i / 10.0);
            double g1 = 1000 / Math.sqrt(1 + (strain / 10) * (strain / 10));
            sb.append(String.format(java.util.Locale.ROOT, "%.6g,%.6g,%.6g%n", strain, g1, 100.0));
        }
        Path p = dir.resolve("gel-amplitude.csv");
        Files.writeString(p, sb.toString());
        return p;
    }

    @Test
    void anAmplitudeSweepAddsALinearRangeRowInPercent() throws IOException {
        Path csv = dir.resolve("q.csv");
        CliRun r = CliRun.of("quality", strainSweep().toString(), "-o", csv.toString());
        assertEquals(0, r.exitCode(), r.err());
        List<String> lines = Files.readAllLines(csv);
        assertEquals(QualityCommand.CSV_HEADER, lines.get(0));
        assertEquals(2, lines.size(), String.join("\n", lines));
        String[] row = lines.get(1).split(",");
        assertEquals("linear-range", row[2]);
        // 5 % below the plateau at (γ/10 %)² = 1/0.95² − 1: γ = 3.287 % (by hand)
        assertEquals(3.287, Double.parseDouble(row[4]), 0.05 * 3.287);
        assertTrue(r.out().contains("amplitude sweep of gel (replicate 1):"), r.out());
        // the user's own percentage
        CliRun ten = CliRun.of("quality", strainSweep().toString(), "--linear-limit", "10", "-o", csv.toString(), "--force");
        assertEquals(0, ten.exitCode(), ten.err());
        double limit10 = Double.parseDouble(Files.readAllLines(csv).get(1).split(",")[4]);
        assertEquals(10 * Math.sqrt(1 / 0.81 - 1), limit10, 0.05 * 10 * Math.sqrt(1 / 0.81 - 1));
        CliRun bad = CliRun.of("quality", strainSweep().toString(), "--linear-limit", "150");
        assertEquals(2, bad.exitCode());
        assertTrue(bad.err().contains("linear range"), bad.err());
    }

    @Test
    void fitAndInspectShowTheVerdictsBesideTheirSamples() {
        CliRun fit = CliRun.of("fit", "demo-data/hydrogel-screen", "--models", "springpot");
        assertEquals(0, fit.exitCode(), fit.err());
        assertTrue(fit.out().contains("quality warn replicate-outlier (replicate 3)"), fit.out());
        assertTrue(fit.out().contains("quality fail linear-range (replicates 1, 2, 3)"), fit.out());
        CliRun inspect = CliRun.of("inspect", "demo-data/hydrogel-screen");
        assertEquals(0, inspect.exitCode(), inspect.err());
        assertTrue(inspect.out().contains("checks of gelatin-10pct replicate 3: warn: replicate-outlier"), inspect.out());
        assertTrue(inspect.out().contains("checks of polyacrylamide-8pct replicate 1: amplitude sweep, linear up to 4.24 µm"),
                inspect.out());
    }

    @Test
    void rankLeavesAnOutlierOutOnlyWhenAskedAndSaysSo() throws IOException {
        Path keep = dir.resolve("keep.csv");
        CliRun kept = CliRun.of("rank", "demo-data/hydrogel-screen", "--basis", "tensile", "-o", keep.toString());
        assertEquals(0, kept.exitCode(), kept.err());
        Path drop = dir.resolve("drop.csv");
        CliRun dropped = CliRun.of("rank", "demo-data/hydrogel-screen", "--basis", "tensile", "--drop-outliers", "-o", drop.toString());
        assertEquals(0, dropped.exitCode(), dropped.err());
        assertTrue(dropped.err().contains("sample 'gelatin-10pct': replicate 3 left out of every analysis as an outlier"),
                dropped.err());
        assertEquals(3, replicates(keep, "gelatin-10pct"));
        assertEquals(2, replicates(drop, "gelatin-10pct"));
        assertEquals(3, replicates(drop, "gelatin-5pct"), "the other samples keep every replicate");
    }

    private static int replicates(Path csv, String sample) throws IOException {
        List<String> lines = Files.readAllLines(csv);
        List<String> header = List.of(lines.get(0).split(","));
        for (String l : lines) {
            String[] cells = l.split(",");
            if (cells[header.indexOf("sample")].equals(sample)) {
                return Integer.parseInt(cells[header.indexOf("n_replicates")]);
            }
        }
        throw new AssertionError("no " + sample);
    }
}
