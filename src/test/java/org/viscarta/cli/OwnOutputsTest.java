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
import org.viscarta.io.InputCollector;

/**
 * A folder input skips what Viscarta itself wrote there: the CSV tables of fit, rank and match
 * (-o), the shift tables and a report folder — each written here by the verb itself, so that a change
 * of their columns cannot slip past.
 */
@Tag("self-check")
class OwnOutputsTest {

    @TempDir
    Path dir;

    @Test
    void aFolderInputSkipsTheOutputsViscartaWroteIntoIt() throws IOException {
        Path data = dir.resolve("films.csv");
        Files.writeString(data, "sample,replicate,frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n"
                + "a,1,0.1,1000,100\na,1,1,1200,150\na,1,10,1500,300\na,2,0.1,1010,101\na,2,1,1210,151\na,2,10,1510,301\n"
                + "b,1,0.1,2000,100\nb,1,1,2200,150\nb,1,10,2500,300\nb,2,0.1,2010,101\nb,2,1,2210,151\nb,2,10,2510,301\n");
        Path lib = dir.resolve("lib");
        Files.createDirectories(lib);
        Files.writeString(lib.resolve("ref.csv"), "# name: ref\n# class: gel\n# temperature: 23 °C\n# method: rheometer\n"
                + "frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n0.1,1000,100\n1,1200,150\n10,1500,300\n");
        Path series = dir.resolve("series.csv");
        StringBuilder s = new StringBuilder("sample,temperature [°C],frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n");
        for (int t : new int[] {10, 20, 30}) {
            for (double f : new double[] {0.1, 1, 10}) {
                double shifted = f * Math.pow(10, -(t - 20) / 10.0);
                s.append("film,").append(t).append(',').append(f).append(',').append(1e6 * Math.pow(shifted, 0.2)).append(',')
                        .append(2e5 * Math.pow(shifted, 0.2)).append('\n');
            }
        }
        Files.writeString(series, s.toString());
        List<Path> inputs = List.copyOf(InputCollector.collect(List.of(dir)));
        check(CliRun.of("rank", data.toString(), "-o", dir.resolve("ranking.csv").toString()));
        check(CliRun.of("fit", data.toString(), "--models", "springpot", "-o", dir.resolve("fits.csv").toString(),
                "--time-domain", "0.01:1:3", "--time-domain-out", dir.resolve("time.csv").toString()));
        check(CliRun.of("match", data.toString(), "--library", lib.toString(), "-o", dir.resolve("matches.csv").toString()));
        check(CliRun.of("shift", series.toString(), "--reference-temperature", "20", "-o", dir.resolve("shifted").toString()));
        check(CliRun.of("report", data.toString(), "--models", "springpot", "-o", dir.resolve("report").toString()));
        for (String out : List.of("ranking.csv", "fits.csv", "time.csv", "matches.csv", "shifted/master-curve.csv", "report/report.xlsx")) {
            assertTrue(Files.isRegularFile(dir.resolve(out)), out + " was written beside the inputs");
        }
        assertEquals(inputs, InputCollector.collect(List.of(dir)), "only the inputs are read back");
    }

    private static void check(CliRun r) {
        assertEquals(0, r.exitCode(), r.err());
    }
}
