package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.apache.poi.ss.usermodel.Cell;
import org.apache.poi.ss.usermodel.CellType;
import org.apache.poi.ss.usermodel.Row;
import org.apache.poi.ss.usermodel.Sheet;
import org.apache.poi.ss.usermodel.Workbook;
import org.apache.poi.ss.usermodel.WorkbookFactory;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** End-to-end runs of the command line, outputs in a temporary folder. */
@Tag("regression")
class CliTest {

    @TempDir
    Path dir;

    private static final String HEADER = "frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n";

    private Path write(String name, String text) throws IOException {
        Path p = dir.resolve(name);
        Files.createDirectories(p.getParent());
        Files.writeString(p, text, StandardCharsets.UTF_8);
        return p;
    }

    /** A zener sweep, noise-free, 0.1–10 Hz at five points per decade (1 Hz is one of them), in one file. */
    private Path zenerFile(String name, double er, double e1, double tau) throws IOException {
        return zenerFile(name, er, e1, tau, 0);
    }

    /** The same with seeded log-normal noise of relative size {@code noise}. */
    private Path zenerFile(String name, double er, double e1, double tau, double noise) throws IOException {
        java.util.SplittableRandom rng = new java.util.SplittableRandom(name.hashCode());
        StringBuilder sb = new StringBuilder("# sample: " + name + "\n# modulus: tensile\n" + HEADER);
        for (int i = 0; i <= 10; i++) {
            double f = 0.1 * Math.pow(10, i / 5.0);
            double x = 2 * Math.PI * f * tau;
            double ns = noise == 0 ? 1 : Math.exp(noise * rng.nextGaussian());
            double nl = noise == 0 ? 1 : Math.exp(noise * rng.nextGaussian());
            sb.append(f).append(',').append((er + e1 * x * x / (1 + x * x)) * ns).append(',').append(e1 * x / (1 + x * x) * nl).append('\n');
        }
        return write(name + ".csv", sb.toString());
    }

    private List<Path> filesIn(Path d) throws IOException {
        if (!Files.exists(d)) {
            return List.of();
        }
        try (Stream<Path> s = Files.walk(d)) {
            return s.filter(Files::isRegularFile).toList();
        }
    }

    private static List<CSVRecord> csv(Path p) throws IOException {
        try (CSVParser parser = CSVParser.parse(p, StandardCharsets.UTF_8, CSVFormat.DEFAULT)) {
            return parser.getRecords();
        }
    }

    @Test
    void helpListsVerbsAndExitCodes() {
        CliRun r = CliRun.of("--help");
        assertEquals(0, r.exitCode());
        for (String s : List.of("inspect", "fit", "rank", "report", "Exit codes", "0   success", "2   bad usage or bad input")) {
            assertTrue(r.out().contains(s), s + " missing from:\n" + r.out());
        }
    }

    @Test
    void versionPrintsTheProjectVersion() {
        CliRun r = CliRun.of("--version");
        assertEquals(0, r.exitCode());
        assertTrue(r.out().startsWith("Viscarta "), r.out());
        assertFalse(r.out().contains("unknown"), r.out());
    }

    @Test
    void unknownOptionIsUsageErrorExitTwo() {
        CliRun r = CliRun.of("fit", "--no-such-option", "x.csv");
        assertEquals(2, r.exitCode());
        assertTrue(r.err().contains("Unknown option"), r.err());
    }

    @Test
    void badFrequencyUnitIsUsageErrorExitTwo() throws IOException {
        CliRun r = CliRun.of("rank", "--at", "3 furlongs", zenerFile("a", 1e3, 2e3, 0.1).toString());
        assertEquals(2, r.exitCode());
        assertTrue(r.err().contains("furlongs"), r.err());
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
        "non-numeric cell|frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\\n1,100,10\\n2,x1,12\\n|:3:2: ",
        "missing frequency column|storage_modulus [Pa],loss_modulus [Pa]\\n100,10\\n|:1: ",
        "negative frequency|frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\\n-1,100,10\\n|:2:1: ",
        "empty file||:1: ",
        "unknown unit|frequency [Hz],storage_modulus [bar],loss_modulus [Pa]\\n1,100,10\\n|:1:2: "})
    void badInputGivesExitTwoAFileLineMessageAndNoOutput(String what, String content, String location) throws IOException {
        Path in = write("bad.csv", content == null ? "" : content.replace("\\n", "\n"));
        Path out = dir.resolve("out");
        for (String[] args : List.of(
                new String[] {"report", in.toString(), "--out", out.toString()},
                new String[] {"fit", in.toString(), "-o", out.resolve("fits.csv").toString()},
                new String[] {"rank", in.toString(), "-o", out.resolve("rank.csv").toString()},
                new String[] {"inspect", in.toString()})) {
            CliRun r = CliRun.of(args);
            assertEquals(2, r.exitCode(), what + " / " + args[0] + ": " + r.err());
            String firstLine = r.err().strip();
            assertEquals(1, firstLine.lines().count(), "one line on stderr: " + r.err());
            assertTrue(firstLine.startsWith(in + location), what + ": " + firstLine);
            assertFalse(r.err().contains("Exception"), r.err());
            assertTrue(filesIn(out).isEmpty(), "no output left behind: " + filesIn(out));
        }
    }

    @Test
    void missingInputIsExitTwo() {
        CliRun r = CliRun.of("fit", dir.resolve("nope.csv").toString());
        assertEquals(2, r.exitCode());
        assertTrue(r.err().contains("nope.csv: no such file or folder"), r.err());
    }

    @Test
    void fitWritesTheDocumentedCsvAndRecoversAZener() throws IOException {
        Path in = zenerFile("film", 2.0e6, 5.0e6, 0.2);
        Path out = dir.resolve("fits.csv");
        CliRun r = CliRun.of("fit", in.toString(), "--models", "zener,maxwell", "-o", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        List<CSVRecord> rows = csv(out);
        assertEquals(FitCommand.CSV_HEADER, rows.get(0).toList());
        assertEquals(1 + 3 + 2, rows.size());
        CSVRecord er = rows.stream().filter(x -> x.get(1).equals("zener") && x.get(2).equals("E_r")).findFirst().orElseThrow();
        assertEquals(2.0e6, Double.parseDouble(er.get(3)), 1e-6 * 2.0e6);
        assertEquals("true", er.get(10));
    }

    @Test
    void fitNamesTheChosenNumberOfMaxwellElementsAndWritesTheTimeDomain() throws IOException {
        Path in = zenerFile("film", 2.0e6, 5.0e6, 0.2, 0.02);
        Path out = dir.resolve("fits.csv");
        Path time = dir.resolve("time.csv");
        CliRun r = CliRun.of("fit", in.toString(), "--models", "zener,generalized-maxwell", "-o", out.toString(),
                "--time-domain", "0.01:10:4", "--time-domain-out", time.toString());
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.out().contains("best supported: zener"), "a tie goes to the model listed first:\n" + r.out());
        List<CSVRecord> rows = csv(out);
        assertTrue(rows.stream().anyMatch(x -> x.get(1).equals("generalized-maxwell") && x.get(11).startsWith("1 element, chosen by AICc")),
                "variant named in the note column");
        List<CSVRecord> t = csv(time);
        assertEquals(FitCommand.TIME_HEADER, t.get(0).toList());
        assertEquals(1 + 2 * 4, t.size());
        // zener E(t) = E_r + E_1 e^{−t/τ} at t = 0.01 s (DOMAIN.md 2.1), from the fitted parameters in fits.csv
        double[] p = rows.stream().filter(x -> x.get(1).equals("zener")).mapToDouble(x -> Double.parseDouble(x.get(3))).toArray();
        CSVRecord first = t.stream().filter(x -> x.get(1).equals("zener")).findFirst().orElseThrow();
        assertEquals(p[0] + p[1] * Math.exp(-0.01 / p[2]), Double.parseDouble(first.get(3)), 1e-9 * 7e6);
    }

    @Test
    void timeDomainOutNeedsAGrid() throws IOException {
        CliRun r = CliRun.of("fit", zenerFile("film", 1e6, 1e6, 0.1).toString(), "--time-domain-out", dir.resolve("t.csv").toString());
        assertEquals(2, r.exitCode());
        assertTrue(r.err().contains("--time-domain GRID"), r.err());
    }

    @Test
    void replicateSdWeightingNeedsReplicatesAndSaysSo() throws IOException {
        CliRun r = CliRun.of("fit", zenerFile("film", 1e6, 1e6, 0.1).toString(), "--models", "zener", "--weighting", "replicate-sd");
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.out().contains("needs at least two replicates"), r.out());
        CliRun bad = CliRun.of("fit", zenerFile("film2", 1e6, 1e6, 0.1).toString(), "--weighting", "cubic");
        assertEquals(2, bad.exitCode());
    }

    @Test
    void existingOutputIsNotReplacedWithoutForce() throws IOException {
        Path in = zenerFile("film", 2.0e6, 5.0e6, 0.2);
        Path out = write("fits.csv", "precious\n");
        CliRun r = CliRun.of("fit", in.toString(), "-o", out.toString());
        assertEquals(2, r.exitCode());
        assertTrue(r.err().contains("--force"), r.err());
        assertEquals("precious\n", Files.readString(out));
        assertEquals(0, CliRun.of("fit", in.toString(), "-o", out.toString(), "--force").exitCode());
        assertTrue(Files.readString(out).startsWith("sample,model"));
    }

    @Test
    void rankOrdersByTanDeltaAndWritesTheDocumentedCsv() throws IOException {
        Path a = zenerFile("stiff", 1.0e6, 0.2e6, 0.1);
        Path b = zenerFile("lossy", 1.0e6, 3.0e6, 0.1);
        Path out = dir.resolve("rank.csv");
        CliRun r = CliRun.of("rank", a.toString(), b.toString(), "--at", "6.283185307179586rad/s", "-o", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        List<CSVRecord> rows = csv(out);
        assertEquals(RankCommand.CSV_HEADER, rows.get(0).toList());
        assertEquals("lossy", rows.get(1).get(1));
        assertEquals("stiff", rows.get(2).get(1));
        assertEquals(1.0, Double.parseDouble(rows.get(1).get(4)), 1e-12);
        // 1 Hz is a measured point: tan δ is the zener's own, E1 x/(1+x²) / (Er + E1 x²/(1+x²)) at x = 2π·1 Hz·0.1 s
        double x = 2 * Math.PI * 0.1;
        double expected = 3.0e6 * x / (1 + x * x) / (1.0e6 + 3.0e6 * x * x / (1 + x * x));
        assertEquals(expected, Double.parseDouble(rows.get(1).get(5)), 1e-12 * expected);
    }

    @Test
    void rankGivesLetterGroupsFromReplicates() throws IOException {
        // Three samples, three noisy replicates each (a tidy table): two alike, one far more lossy.
        StringBuilder sb = new StringBuilder("sample,replicate,group,frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n");
        java.util.SplittableRandom rng = new java.util.SplittableRandom(4);
        String[][] samples = {{"lossy", "0.6"}, {"calm-1", "0.10"}, {"calm-2", "0.10"}};
        for (String[] smp : samples) {
            for (int rep = 1; rep <= 3; rep++) {
                double tan = Double.parseDouble(smp[1]) * Math.exp(0.03 * rng.nextGaussian());
                for (double f : new double[] {0.1, 1, 10}) {
                    sb.append(smp[0]).append(',').append(rep).append(",g,").append(f).append(",1000,").append(1000 * tan).append('\n');
                }
            }
        }
        Path in = write("tidy.csv", sb.toString());
        Path out = dir.resolve("rank.csv");
        CliRun r = CliRun.of("rank", in.toString(), "-o", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        List<CSVRecord> rows = csv(out);
        assertEquals("lossy", rows.get(1).get(1));
        assertEquals("a", rows.get(1).get(10));
        assertEquals("b", rows.get(2).get(10));
        assertEquals("b", rows.get(3).get(10));
        assertTrue(r.out().contains("2 of the 3 differences are supported"), r.out());
    }

    @Test
    void rankOverABandUsesTheGeometricMean() throws IOException {
        Path a = zenerFile("film", 1.0e6, 2.0e6, 0.1);
        Path out = dir.resolve("rank.csv");
        CliRun r = CliRun.of("rank", a.toString(), "--band", "0.5Hz-5Hz", "-o", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        double x;
        double sum = 0;
        for (int k = 0; k <= 20; k++) {
            double f = 0.5 * Math.pow(10, k / 20.0);
            x = 2 * Math.PI * f * 0.1;
            sum += Math.log(2.0e6 * x / (1 + x * x) / (1.0e6 + 2.0e6 * x * x / (1 + x * x)));
        }
        // log–log interpolation between measured points: within 2 % of the model's own geometric mean
        assertEquals(Math.exp(sum / 21), Double.parseDouble(csv(out).get(1).get(5)), 0.02 * Math.exp(sum / 21));
        assertEquals(2, CliRun.of("rank", a.toString(), "--band", "5-0.5").exitCode());
    }

    @Test
    void rankOutsideTheMeasuredRangeSaysSoUnlessTheModelMaySpeak() throws IOException {
        Path a = zenerFile("film", 1.0e6, 2.0e6, 0.1);
        CliRun r = CliRun.of("rank", a.toString(), "--at", "100Hz");
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.out().contains("outside"), r.out());
        CliRun m = CliRun.of("rank", a.toString(), "--at", "100Hz", "--model-outside-range");
        assertTrue(m.out().contains("zener model, not from data"), m.out());
    }

    @Test
    void matchRanksReferencesAndWritesTheDocumentedCsv() throws IOException {
        Path out = dir.resolve("match.csv");
        CliRun r = CliRun.of("match", "demo-data/paint-light-ageing.csv", "--library", "reference-materials", "--class", "paint film",
                "-o", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        List<CSVRecord> rows = csv(out);
        assertEquals(MatchCommand.CSV_HEADER, rows.get(0).toList());
        // the demo films were generated close to these references (DemoData): unaged linseed ~ fresh linseed film
        CSVRecord first = rows.stream().filter(x -> x.get(0).equals("linseed-unaged") && x.get(2).equals("1")).findFirst().orElseThrow();
        assertEquals("linseed-film-fresh", first.get(1));
        CSVRecord aged = rows.stream().filter(x -> x.get(0).equals("linseed-1500h") && x.get(2).equals("1")).findFirst().orElseThrow();
        assertEquals("linseed-film-aged", aged.get(1));
        assertTrue(r.out().contains("first and second distinguishable"), r.out());
    }

    @Test
    void matchNeedsALibraryOrATarget() throws IOException {
        CliRun r = CliRun.of("match", "--target", "demo-data/hydrogel-screen/target-soft-tissue-r1.csv");
        assertEquals(2, r.exitCode());
        CliRun m = CliRun.of("match", "--target", "demo-data/hydrogel-screen/target-soft-tissue-r1.csv",
                "--candidates", "demo-data/hydrogel-screen", "--basis", "tensile");
        assertEquals(0, m.exitCode(), m.err());
        assertTrue(m.out().contains("Best mimic of target-soft-tissue"), m.out());
        assertFalse(m.out().contains(" target-soft-tissue  "), "the target is not its own candidate");
    }

    @Test
    void shiftWritesFactorsFitsAndMasterCurve() throws IOException {
        Path out = dir.resolve("tts");
        CliRun r = CliRun.of("shift", "demo-data/temperature-series", "--reference-temperature", "20", "--wlf-at", "30",
                "-o", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        List<CSVRecord> factors = csv(out.resolve("shift-factors.csv"));
        assertEquals(List.of("temperature_c", "a_t", "log10_a_t", "log10_a_t_std_error", "b_t"), factors.get(0).toList());
        assertEquals(1 + 5, factors.size());
        // the demo series was generated with WLF C1 = 9, C2 = 90 K at 20 °C (DemoData): log10 a_T(10 °C) = 9·10/80 = 1.125
        double log10aT = Double.parseDouble(factors.get(1).get(2));
        double se = Double.parseDouble(factors.get(1).get(3));
        assertEquals(1.125, log10aT, 4 * se + 0.01);
        List<CSVRecord> fits = csv(out.resolve("shift-fits.csv"));
        assertEquals(List.of("model", "parameter", "value", "std_error", "ci95_low", "ci95_high", "unit"), fits.get(0).toList());
        CSVRecord c1 = fits.stream().filter(x -> x.get(0).equals("WLF") && x.get(1).equals("C1")).findFirst().orElseThrow();
        assertTrue(Double.parseDouble(c1.get(4)) <= 9 && 9 <= Double.parseDouble(c1.get(5)), "C1 interval covers 9");
        assertTrue(fits.stream().anyMatch(x -> x.get(0).equals("WLF at 30 °C")));
        assertTrue(Files.readString(out.resolve("master-curve.csv")).contains("frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]"));
        assertEquals(2, CliRun.of("shift", "demo-data/temperature-series", "--reference-temperature", "25").exitCode(),
                "25 °C was not measured");
    }

    @Test
    void moduliTurnsTheDemoRawSignalsIntoSweepsOfTheKnownMaterial() throws IOException {
        Path out = dir.resolve("moduli");
        CliRun r = CliRun.of("moduli", "demo-data/raw-signals", "--out", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        Path table = out.resolve("alkyd-unaged-raw-moduli.csv");
        // DemoData made these signals from a springpot c = 120 MPa·s^α, α = 0.14 through a 50 µm sphere at 4 µm,
        // behind an instrument phase lag that the calibration file records: E′(1 Hz) = c ω^α cos(απ/2)
        double w = 2 * Math.PI;
        double truth = 120e6 * Math.pow(w, 0.14) * Math.cos(0.14 * Math.PI / 2);
        CSVRecord at1 = csvAfterMetadata(table).stream().filter(x -> x.get(0).equals("1.0")).findFirst().orElseThrow();
        assertEquals(truth, Double.parseDouble(at1.get(1)), 0.005 * truth);
        assertEquals(Math.tan(0.14 * Math.PI / 2), Double.parseDouble(at1.get(2)) / Double.parseDouble(at1.get(1)), 0.005);
        CliRun fit = CliRun.of("fit", table.toString(), "--models", "springpot");
        assertEquals(0, fit.exitCode(), fit.err());
        CliRun missing = CliRun.of("moduli", "demo-data/raw-signals/alkyd-unaged-raw.csv", "--calibration",
                dir.resolve("nope.csv").toString(), "--out", dir.resolve("m2").toString());
        assertEquals(2, missing.exitCode());
    }

    private static List<CSVRecord> csvAfterMetadata(Path p) throws IOException {
        String body = Files.readString(p).lines().filter(l -> !l.startsWith("#")).reduce("", (a, b) -> a + b + "\n");
        try (CSVParser parser = CSVParser.parse(body, CSVFormat.DEFAULT)) {
            return parser.getRecords();
        }
    }

    @Test
    void aBadFileAmongSeveralIsLeftOutUnlessStrict() throws IOException {
        Path good = zenerFile("good", 1e6, 2e6, 0.1);
        Path bad = write("bad.csv", "frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n1,x,1\n");
        CliRun r = CliRun.of("rank", good.toString(), bad.toString());
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.err().contains("left out: " + bad + ":2:2: "), r.err());
        assertTrue(r.out().contains("good"), r.out());
        CliRun strict = CliRun.of("rank", good.toString(), bad.toString(), "--strict");
        assertEquals(2, strict.exitCode());
        assertTrue(strict.err().startsWith(bad + ":2:2: "), strict.err());
    }

    /** Files are read side by side (Inputs.read) but taken in their order: the first bad file is the one named. */
    @Test
    void severalBadFilesAreReportedInTheirOrder() throws IOException {
        Path good = zenerFile("good", 1.0e6, 2.0e6, 0.1);
        List<Path> bad = new java.util.ArrayList<>();
        for (int k = 1; k <= 6; k++) {
            bad.add(write("bad-" + k + ".csv", "frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n" + "1,1,1\n".repeat(k) + "1,x,1\n"));
        }
        List<String> args = new java.util.ArrayList<>(List.of("rank", good.toString()));
        bad.forEach(b -> args.add(b.toString()));
        CliRun r = CliRun.of(args.toArray(String[]::new));
        assertEquals(0, r.exitCode(), r.err());
        int last = -1;
        for (int k = 1; k <= 6; k++) {
            int at = r.err().indexOf("left out: " + bad.get(k - 1) + ":" + (k + 2) + ":2: ");
            assertTrue(at > last, "file " + k + " out of order or missing: " + r.err());
            last = at;
        }
        args.add("--strict");
        CliRun strict = CliRun.of(args.toArray(String[]::new));
        assertEquals(2, strict.exitCode());
        assertTrue(strict.err().startsWith(bad.get(0) + ":3:2: "), strict.err());
    }

    @Test
    void inspectWritesJson() throws IOException {
        Path out = dir.resolve("inspect.json");
        CliRun r = CliRun.of("inspect", zenerFile("film", 1e6, 2e6, 0.1).toString(), "-o", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        String json = Files.readString(out);
        assertTrue(json.contains("\"quantity\": \"storage_modulus\"") && json.contains("\"sample\": \"film\""), json);
        assertTrue(json.startsWith("{") && json.strip().endsWith("}"));
    }

    @Test
    void inspectDescribesColumnsAndSamples() throws IOException {
        Path in = zenerFile("film", 1.0e6, 2.0e6, 0.1);
        CliRun r = CliRun.of("inspect", in.toString());
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.out().contains("column 2 'storage_modulus [Pa]' -> storage_modulus [Pa]"), r.out());
        assertTrue(r.out().contains("1 file(s), 1 sample(s)"), r.out());
    }

    @Test
    void quickStartReportOnTheDemoDataWritesAReadableWorkbook() throws IOException {
        // The README's quick start (the shared demo report), with the output in a temporary folder.
        Path out = DemoReport.folder();
        CliRun r = DemoReport.run();
        assertEquals(0, r.exitCode(), r.err());
        Path xlsx = out.resolve("report.xlsx");
        assertTrue(Files.isRegularFile(xlsx));
        try (InputStream in = Files.newInputStream(xlsx); Workbook wb = WorkbookFactory.create(in)) {
            List<String> names = new ArrayList<>();
            wb.forEach(s -> names.add(s.getSheetName()));
            assertEquals(List.of("Read me", "Summary", "Damping ranking", "Group comparison", "Quality", "Reference matches", "Mimic ranking", "Temperature series",
                    "Transitions", "Activation energy", "Transition ranking", "Positions", "Regions", "Time-domain tests", "Model fits", "Derived quantities", "Correlations", "Spectra", "Data", "Reference library", "Figures", "Provenance"), names);
            // both questions of the demo answered: the aged linseed film is closest to the aged reference film,
            // and a gel formulation (not a paint) is the best mimic of the target tissue
            Sheet matches = wb.getSheet("Reference matches");
            boolean agedFound = false;
            for (Row row : matches) {
                if (row.getRowNum() > 0 && row.getCell(0).getStringCellValue().equals("linseed-1500h") && row.getCell(1) != null
                        && row.getCell(1).getNumericCellValue() == 1) {
                    agedFound = row.getCell(2).getStringCellValue().equals("linseed-film-aged");
                }
            }
            assertTrue(agedFound, "linseed-1500h closest to linseed-film-aged");
            Row bestMimic = wb.getSheet("Mimic ranking").getRow(1);
            assertTrue(List.of("gelatin", "agarose", "polyacrylamide").contains(bestMimic.getCell(3).getStringCellValue()));
            Sheet summary = wb.getSheet("Summary");
            assertEquals(24, summary.getLastRowNum(), "24 samples: 15 at 23 °C, two from raw signals, one film at five temperatures, "
                    + "its master curve, and a gel computed from its stress relaxation test");
            Sheet data = wb.getSheet("Data");
            Row first = data.getRow(1);
            assertEquals(CellType.NUMERIC, first.getCell(5).getCellType(), "frequency stored as a number");
            assertEquals(CellType.NUMERIC, first.getCell(7).getCellType(), "storage modulus stored as a number");
            for (Cell h : data.getRow(0)) {
                String t = h.getStringCellValue();
                assertTrue(t.contains("[") || List.of("sample", "replicate", "group", "file", "line", "basis").contains(t), "unit in header: " + t);
            }
            Sheet ranking = wb.getSheet("Damping ranking");
            assertEquals(1.0, ranking.getRow(1).getCell(0).getNumericCellValue());
            assertTrue(ranking.getRow(1).getCell(5).getNumericCellValue() >= ranking.getRow(2).getCell(5).getNumericCellValue());
            Sheet fits = wb.getSheet("Model fits");
            assertEquals(CellType.NUMERIC, fits.getRow(1).getCell(4).getCellType());
            Sheet lib = wb.getSheet("Reference library");
            assertTrue(lib.getLastRowNum() >= 6, "at least six reference materials");
            String prov = cells(wb.getSheet("Provenance"));
            assertTrue(prov.contains("viscarta report demo-data --library reference-materials"), prov);
            assertTrue(prov.matches("(?s).*[0-9a-f]{64}.*"), "SHA-256 of inputs");
            String readMe = cells(wb.getSheet("Read me"));
            assertTrue(readMe.contains("not clinical or structural verdicts"), "cautions");
            assertTrue(readMe.contains("invented demo data") || readMe.contains("Demo data"), "demo notice");
        }
        assertTrue(filesIn(out).stream().noneMatch(p -> p.getFileName().toString().endsWith(".part")), "no temporary files left");
        assertTrue(Files.isRegularFile(out.resolve("report.html")));
        CliRun again = CliRun.of("report", "demo-data", "--out", out.toString());
        assertEquals(2, again.exitCode(), "existing report needs --force");
    }

    private static String cells(Sheet s) {
        StringBuilder sb = new StringBuilder();
        for (Row r : s) {
            for (Cell c : r) {
                sb.append(c.getCellType() == CellType.STRING ? c.getStringCellValue() : String.valueOf(c)).append('\t');
            }
            sb.append('\n');
        }
        return sb.toString();
    }
}
