package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code viscarta spectrum} end to end: the terminal summary, the CSV and a refused input. */
@Tag("regression")
class SpectrumCommandTest {

    @TempDir
    Path dir;

    /** A Maxwell liquid E = 1e4 Pa, τ = 0.1 s (closed form), 25 frequencies 0.01–100 Hz, no noise. */
    private Path maxwell() throws IOException {
        StringBuilder sb = new StringBuilder("# sample: maxwell-liquid\n# modulus: tensile\nfrequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n");
        for (int i = 0; i < 25; i++) {
            double f = 0.01 * Math.pow(1e4, i / 24.0);
            double x = 2 * Math.PI * f * 0.1;
            sb.append(String.format(Locale.ROOT, "%.10g,%.10g,%.10g%n", f, 1e4 * x * x / (1 + x * x), 1e4 * x / (1 + x * x)));
        }
        Path p = dir.resolve("maxwell.csv");
        Files.writeString(p, sb.toString());
        return p;
    }

    @Test
    void aMaxwellLiquidHasOnePeakAtItsTimeAndItsViscosity() throws IOException {
        Path csv = dir.resolve("spectrum.csv");
        CliRun r = CliRun.of("spectrum", maxwell().toString(), "-o", csv.toString());
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.out().contains("peaks of the spectrum at: 0.1"), r.out());
        // η0 = E τ = 1000 Pa·s
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("zero-frequency viscosity ∫Hτ dlnτ = ([0-9.e+]+)").matcher(r.out());
        assertTrue(m.find(), r.out());
        assertEquals(1000, Double.parseDouble(m.group(1)), 50);
        List<String> lines = Files.readAllLines(csv);
        assertEquals("sample,tau_s,h_pa,h_low_pa,h_high_pa", lines.get(0));
        assertTrue(lines.size() > 40, "one row per τ of the grid");
    }

    @Test
    void aFileWithTooFewPointsIsRefused() throws IOException {
        Path p = dir.resolve("two.csv");
        Files.writeString(p, "frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n1,100,10\n2,110,12\n");
        CliRun r = CliRun.of("spectrum", p.toString());
        assertEquals(2, r.exitCode(), r.out() + r.err());
    }

    @Test
    void qualityWritesOneRowPerSweepAndCheck() throws IOException {
        Path csv = dir.resolve("quality.csv");
        CliRun r = CliRun.of("quality", maxwell().toString(), "-o", csv.toString());
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.out().contains("maxwell-liquid replicate"), r.out());
        List<String> lines = Files.readAllLines(csv);
        assertEquals(QualityCommand.CSV_HEADER, lines.get(0));
        assertEquals("sample,replicate,check,verdict,value,limit,message", lines.get(0));
        assertEquals(List.of("frequency-span", "points-per-decade", "loss-modulus-sign", "duplicate-frequency", "noise",
                        "kramers-kronig", "storage-monotonic"),
                lines.stream().skip(1).map(l -> l.split(",")[2]).toList());
        assertTrue(lines.stream().skip(1).allMatch(l -> l.split(",")[3].equals("pass")), String.join("\n", lines));
    }
}
