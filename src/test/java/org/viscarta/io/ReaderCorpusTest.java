package org.viscarta.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.stream.Stream;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The reader corpus (src/test/resources/reader-corpus, written with its expectations by
 * make_corpus.py): every file read as expected or refused with its one-line message; and a property
 * test: random and mutated files give a clean result or a clean input error, never another exception.
 */
@Tag("regression")
class ReaderCorpusTest {

    private static Path corpus() throws URISyntaxException {
        return Path.of(ReaderCorpusTest.class.getResource("/reader-corpus/expected.csv").toURI()).getParent();
    }

    static Stream<Arguments> cases() throws IOException, URISyntaxException {
        List<Arguments> out = new ArrayList<>();
        try (InputStream in = Files.newInputStream(corpus().resolve("expected.csv"));
             CSVParser p = CSVParser.parse(new InputStreamReader(in, StandardCharsets.UTF_8),
                     CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).get())) {
            for (CSVRecord r : p) {
                out.add(Arguments.of(r.get("file"), r.get("outcome"), r.get("detail")));
            }
        }
        assertTrue(out.size() >= 40, "at least 40 corpus files");
        return out.stream();
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("cases")
    void readsAsExpected(String file, String outcome, String detail) throws URISyntaxException {
        Path p = corpus().resolve(file);
        if (outcome.equals("ok")) {
            String[] d = detail.split(";");
            SweepFile f = new SweepReader(null).read(p);
            assertEquals(Integer.parseInt(d[0]), f.sweeps().size(), "sweeps");
            assertEquals(Integer.parseInt(d[1]), f.sweeps().stream().mapToInt(s -> s.points().size()).sum(), "points");
            double expected = Double.parseDouble(d[2]);
            assertEquals(expected, f.sweeps().get(0).points().get(0).storage(), 1e-9 * expected, "first storage modulus [Pa]");
            org.viscarta.sweep.Sweep first = f.sweeps().get(0);
            String warnings = f.warnings().toString();
            for (int i = 3; i < d.length; i++) {
                String key = d[i].substring(0, d[i].indexOf('='));
                String value = d[i].substring(d[i].indexOf('=') + 1);
                switch (key) {
                    case "sample" -> assertEquals(value, first.sample(), "sample");
                    case "replicate" -> assertEquals(value, first.replicate(), "replicate");
                    case "temperature" -> assertEquals(Double.parseDouble(value), first.temperatureC(), 1e-9, "temperature");
                    case "attribute" -> assertEquals(value.substring(value.indexOf('=') + 1),
                            first.attributes().get(value.substring(0, value.indexOf('='))), "attribute " + value + " in " + first.attributes());
                    case "warning" -> assertTrue(warnings.contains(value), "a warning says '" + value + "': " + warnings);
                    case "nowarning" -> assertFalse(warnings.contains(value), "no warning says '" + value + "': " + warnings);
                    default -> throw new IllegalArgumentException("unknown expectation " + key);
                }
            }
        } else if (outcome.equals("ramp")) {
            String[] d = detail.split(";");
            SweepFile f = new SweepReader(null).read(p);
            assertEquals(Integer.parseInt(d[0]), f.ramps().size(), "ramps");
            assertEquals(Integer.parseInt(d[1]), f.ramps().stream().mapToInt(r -> r.points().size()).sum(), "points");
            double expected = Double.parseDouble(d[2]);
            org.viscarta.sweep.Ramp first = f.ramps().get(0);
            assertEquals(expected, first.points().get(0).storage(), 1e-9 * expected, "storage modulus at the coldest point [Pa]");
            int sweeps = 0;
            String warnings = f.warnings().toString();
            for (int i = 3; i < d.length; i++) {
                String key = d[i].substring(0, d[i].indexOf('='));
                String value = d[i].substring(d[i].indexOf('=') + 1);
                switch (key) {
                    case "frequency" -> assertEquals(Double.parseDouble(value), first.frequencyHz(), 1e-12, "frequency");
                    case "unsorted" -> assertEquals(Integer.parseInt(value), first.unsorted(), "points sorted into place");
                    case "heating" -> assertEquals(Double.parseDouble(value), first.heatingRateKPerMin().orElseThrow(), 1e-12);
                    case "sweeps" -> sweeps = Integer.parseInt(value);
                    case "warning" -> assertTrue(warnings.contains(value), "a warning says '" + value + "': " + warnings);
                    default -> throw new IllegalArgumentException("unknown expectation " + key);
                }
            }
            assertEquals(sweeps, f.sweeps().size(), "frequency sweeps beside the ramps");
            for (org.viscarta.sweep.Ramp r : f.ramps()) {
                for (int i = 1; i < r.points().size(); i++) {
                    assertTrue(r.points().get(i).temperatureC() >= r.points().get(i - 1).temperatureC(), "sorted by temperature");
                }
            }
        } else if (outcome.equals("timetest")) {
            String[] d = detail.split(";");
            SweepFile f = new SweepReader(null).read(p);
            assertEquals(Integer.parseInt(d[0]), f.timeTests().size(), "time-domain tests");
            assertEquals(Integer.parseInt(d[1]), f.timeTests().stream().mapToInt(t -> t.points().size()).sum(), "points");
            org.viscarta.sweep.TimeTest first = f.timeTests().get(0);
            double expected = Double.parseDouble(d[2]);
            assertEquals(expected, first.points().get(0).value(), 1e-9 * expected, "M(t) or J(t) at the earliest time (SI)");
            int sweeps = 0;
            String warnings = f.warnings().toString();
            for (int i = 3; i < d.length; i++) {
                String key = d[i].substring(0, d[i].indexOf('='));
                String value = d[i].substring(d[i].indexOf('=') + 1);
                switch (key) {
                    case "type" -> assertEquals(value, first.type().name(), "test type");
                    case "kind" -> assertEquals(value, first.kind().toString(), "modulus kind");
                    case "time0" -> assertEquals(Double.parseDouble(value), first.minTimeS(), 1e-12, "earliest time [s]");
                    case "sweeps" -> sweeps = Integer.parseInt(value);
                    case "warning" -> assertTrue(warnings.contains(value), "a warning says '" + value + "': " + warnings);
                    default -> throw new IllegalArgumentException("unknown expectation " + key);
                }
            }
            assertEquals(sweeps, f.sweeps().size(), "frequency sweeps beside the tests");
        } else {
            String[] d = detail.split(";", 3);
            InputException e = assertThrows(InputException.class, () -> new SweepReader(null).read(p));
            assertEquals(Integer.parseInt(d[0]), e.line(), "line: " + e.getMessage());
            assertEquals(Integer.parseInt(d[1]), e.column(), "column: " + e.getMessage());
            assertTrue(e.problem().contains(d[2]), e.getMessage());
            assertFalse(e.getMessage().contains("\n"), "one line");
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("cases")
    void theStreamingSummaryAgreesWithTheFullReading(String file, String outcome, String detail) throws URISyntaxException {
        Path p = corpus().resolve(file);
        SweepReader reader = new SweepReader(null);
        if (outcome.equals("timetest")) {
            SweepFile full = reader.read(p);
            SweepReader.Summary sum = reader.summarize(p);
            assertEquals(full.timeTests().size(), sum.sweeps().size());
            for (int i = 0; i < full.timeTests().size(); i++) {
                assertEquals(full.timeTests().get(i).points().size(), sum.sweeps().get(i).points());
                assertTrue(sum.sweeps().get(i).test().contains(full.timeTests().get(i).type().test()), sum.sweeps().get(i).test());
            }
        } else if (outcome.equals("ramp")) {
            // a ramp is summarised as one line per sample and replicate, at no single temperature
            SweepFile full = reader.read(p);
            SweepReader.Summary sum = reader.summarize(p);
            long series = full.ramps().stream().map(r -> r.sample() + "/" + r.replicate()).distinct().count();
            assertEquals(full.sweeps().size() + series, sum.sweeps().size());
            assertEquals(full.ramps().stream().mapToInt(r -> r.points().size()).sum() + full.sweeps().stream()
                    .mapToInt(s -> s.points().size()).sum(), sum.sweeps().stream().mapToLong(SweepReader.SweepSummary::points).sum());
        } else if (outcome.equals("ok")) {
            SweepFile full = reader.read(p);
            SweepReader.Summary sum = reader.summarize(p);
            assertEquals(full.sweeps().size(), sum.sweeps().size());
            for (int i = 0; i < full.sweeps().size(); i++) {
                assertEquals(full.sweeps().get(i).sample(), sum.sweeps().get(i).sample());
                assertEquals(full.sweeps().get(i).points().size(), sum.sweeps().get(i).points());
                assertEquals(full.sweeps().get(i).minFrequencyHz(), sum.sweeps().get(i).minFrequencyHz());
                assertEquals(full.sweeps().get(i).maxFrequencyHz(), sum.sweeps().get(i).maxFrequencyHz());
            }
            assertEquals(full.info().encoding(), sum.info().encoding());
            assertEquals(full.info().decimalMark(), sum.info().decimalMark());
        } else {
            InputException a = assertThrows(InputException.class, () -> reader.read(p));
            InputException b = assertThrows(InputException.class, () -> reader.summarize(p));
            assertEquals(a.line(), b.line(), b.getMessage());
            assertEquals(a.column(), b.column(), b.getMessage());
        }
    }

    @TempDir
    Path dir;

    @Test
    void randomAndMutatedFilesGiveAResultOrACleanInputErrorOnly() throws IOException, URISyntaxException {
        List<byte[]> seeds = new ArrayList<>();
        try (Stream<Path> s = Files.list(corpus())) {
            for (Path p : s.filter(x -> x.getFileName().toString().matches("\\d\\d-.*")).sorted().toList()) {
                seeds.add(Files.readAllBytes(p));
            }
        }
        byte[] alphabet = "0123456789.,;\t -+eE#[]()\"'\n\r|*/µ°abcdefghijklmnopqrstuvwxyzHzPaGMk_".getBytes(StandardCharsets.UTF_8);
        SplittableRandom rng = new SplittableRandom(20261201);
        int clean = 0;
        int refused = 0;
        for (int trial = 0; trial < 3000; trial++) {
            byte[] base = seeds.get(rng.nextInt(seeds.size()));
            byte[] data;
            if (trial % 10 == 0) {
                data = new byte[rng.nextInt(200)];
                for (int i = 0; i < data.length; i++) {
                    data[i] = alphabet[rng.nextInt(alphabet.length)];
                }
            } else {
                data = base.clone();
                int edits = 1 + rng.nextInt(4);
                for (int k = 0; k < edits && data.length > 0; k++) {
                    int at = rng.nextInt(data.length);
                    switch (rng.nextInt(3)) {
                        case 0 -> data[at] = alphabet[rng.nextInt(alphabet.length)];
                        case 1 -> data[at] = (byte) rng.nextInt(256);
                        default -> data = java.util.Arrays.copyOf(data, at);
                    }
                }
            }
            Path p = dir.resolve("fuzz.csv");
            Files.write(p, data);
            try {
                new SweepReader(null).read(p);
                clean++;
            } catch (InputException e) {
                assertFalse(e.getMessage().contains("\n"), "one line: " + e.getMessage());
                assertTrue(e.getMessage().startsWith(p.toString()), e.getMessage());
                refused++;
            }
        }
        System.out.printf("reader property test: %d read, %d refused cleanly, 0 other exceptions%n", clean, refused);
        assertTrue(clean >= 10 && refused >= 100, "both outcomes exercised: " + clean + " read, " + refused + " refused");
    }
}
