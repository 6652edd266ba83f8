package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viscarta.table.Cells;

/** Regression: inputs that once crashed a verb or leaked into a spreadsheet as formulas. */
@Tag("regression")
class HardeningTest {

    @TempDir
    Path dir;

    @Test
    void aSampleWithoutPositiveLossIsReportedNotACrash() throws IOException {
        Path f = dir.resolve("elastic.csv");
        Files.writeString(f, "# sample: ideal-spring\nfrequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n0.1,1000,0\n1,1000,0\n10,1000,-1\n");
        CliRun r = CliRun.of("fit", f.toString(), "-o", dir.resolve("fits.csv").toString());
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.out().contains("nothing to fit"), r.out());
        assertTrue(r.out().contains("no model converged"), r.out());
    }

    @Test
    void csvCellsThatASpreadsheetWouldEvaluateAreMadeInert() throws IOException {
        // OWASP "CSV Injection": cells beginning with = + - @ tab or CR are prefixed with an apostrophe
        for (String payload : List.of("=HYPERLINK(\"http://x\",\"click\")", "@SUM(1)", "+cmd|' /C calc'!A0", "-2+3", "\tx", "\rx")) {
            assertEquals("'" + payload, Cells.inert(payload), payload);
        }
        for (String number : List.of("-2.5", "+1e-3", "-0", "12", "-Infinity")) {
            assertEquals(number, Cells.inert(number), "numbers stay numbers: " + number);
        }
        Path f = dir.resolve("evil.csv");
        Files.writeString(f, "sample,replicate,frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n"
                + "\"=HYPERLINK(\"\"http://x\"\",\"\"click\"\")\",1,1,1000,100\n\"=HYPERLINK(\"\"http://x\"\",\"\"click\"\")\",2,1,1000,110\n"
                + "-2+3,1,1,1000,200\n-2+3,2,1,1000,190\n");
        Path out = dir.resolve("rank.csv");
        CliRun r = CliRun.of("rank", f.toString(), "-o", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        String csv = Files.readString(out);
        assertTrue(csv.contains("'-2+3"), csv);
        assertTrue(csv.contains("\"'=HYPERLINK("), csv);
        assertTrue(!csv.contains(",=HYPERLINK") && !csv.contains(",-2+3"), csv);
    }

    /** A 40,000-character sample name once hung the report in the wrapping of a chart title (the timeout guards against a hang). */
    @Test
    void aVeryLongSampleNameIsShortenedInFiguresAndKeptInTables() throws IOException {
        String name = "x".repeat(40_000);
        Path f = dir.resolve("long.csv");
        Files.writeString(f, "# sample: " + name + "\n# modulus: tensile\nfrequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n"
                + "0.1,1000,100\n1,1200,150\n10,1500,300\n");
        Path out = dir.resolve("report");
        CliRun r = org.junit.jupiter.api.Assertions.assertTimeoutPreemptively(java.time.Duration.ofSeconds(120),
                () -> CliRun.of("report", f.toString(), "--models", "zener", "--out", out.toString(), "--quiet"));
        assertEquals(0, r.exitCode(), r.err());
        try (Stream<Path> s = Files.list(out.resolve("figures"))) {
            assertTrue(s.allMatch(p -> p.getFileName().toString().length() < 120), "short figure file names");
        }
        String page = Files.readString(out.resolve("report.html"));
        assertTrue(page.contains(name), "the page's tables keep the whole name");
        // 40,000 equal letters compress far beyond POI's guard against zip bombs when read back
        double guard = org.apache.poi.openxml4j.util.ZipSecureFile.getMinInflateRatio();
        org.apache.poi.openxml4j.util.ZipSecureFile.setMinInflateRatio(0.0005);
        try (java.io.InputStream in = Files.newInputStream(out.resolve("report.xlsx"));
             org.apache.poi.ss.usermodel.Workbook wb = org.apache.poi.ss.usermodel.WorkbookFactory.create(in)) {
            String cell = wb.getSheet("Summary").getRow(1).getCell(0).getStringCellValue();
            assertTrue(cell.length() <= 32_767 && cell.startsWith("xxxx") && cell.endsWith("more than a cell holds)"), cell.length() + "");
        } finally {
            org.apache.poi.openxml4j.util.ZipSecureFile.setMinInflateRatio(guard);
        }
    }

    /** A raw file's '# calibration:' line once reached any file on the machine and echoed its first line. */
    @Test
    void aRawFilesCalibrationIsLookedForOnlyBesideIt() throws IOException {
        Path inside = Files.createDirectories(dir.resolve("raw"));
        Files.writeString(dir.resolve("secret.csv"), "TOP SECRET first line\n");
        String raw = Files.readString(Path.of("demo-data", "raw-signals", "alkyd-unaged-raw.csv"));
        for (String where : List.of("../secret.csv", dir.resolve("secret.csv").toAbsolutePath().toString(), "..")) {
            Path f = inside.resolve("alkyd.csv");
            Files.writeString(f, raw.replace("# calibration: calibration-sapphire.csv", "# calibration: " + where));
            CliRun r = CliRun.of("fit", f.toString(), "--models", "springpot");
            assertEquals(2, r.exitCode(), where + ": " + r.err());
            assertTrue(r.err().contains("by its name alone"), r.err());
            assertTrue(!r.err().contains("TOP SECRET"), r.err());
        }
    }

    /** A report set is staged beside its folder and moved in whole; what a stopped run left behind is cleaned. */
    @Test
    void aReportIsMovedInWholeAndLeavesNothingBehind() throws IOException {
        Path in = Path.of("demo-data", "paint-light-ageing.csv");
        Path file = dir.resolve("not-a-folder");
        Files.writeString(file, "mine");
        CliRun onFile = CliRun.of("report", in.toString(), "--models", "springpot", "--out", file.toString(), "--force", "--quiet");
        assertEquals(2, onFile.exitCode(), onFile.err());
        assertTrue(onFile.err().contains(file.toAbsolutePath().toString()) && onFile.err().contains("not a folder"), onFile.err());
        assertEquals("mine", Files.readString(file), "the user's file is untouched");

        Path out = dir.resolve("set");
        Path stale = Files.createDirectory(dir.resolve(".set.staging-123"));
        Files.writeString(stale.resolve("report.xlsx"), "half");
        Files.setLastModifiedTime(stale, java.nio.file.attribute.FileTime.from(java.time.Instant.now().minusSeconds(7200)));
        for (int run = 0; run < 2; run++) {
            CliRun r = CliRun.of("report", in.toString(), "--models", "springpot", "--out", out.toString(), "--force", "--quiet");
            assertEquals(0, r.exitCode(), r.err());
        }
        try (Stream<Path> s = Files.list(dir)) {
            assertEquals(List.of("not-a-folder", "set"), s.map(p -> p.getFileName().toString()).sorted().toList(),
                    "no staging, set-aside or temporary files beside the report");
        }
        try (Stream<Path> s = Files.list(out)) {
            assertEquals(List.of("figures", "report.html", "report.xlsx"), s.map(p -> p.getFileName().toString()).sorted().toList());
        }
    }

    /** Warnings are capped per file with a count of the rest (a bad workbook once printed 599,004 lines). */
    @Test
    void warningsOfOneFileAreCappedWithACountOfTheRest() throws IOException {
        StringBuilder sb = new StringBuilder("# modulus: tensile\nfrequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n");
        for (int i = 1; i <= 200; i++) {
            sb.append(i * 0.01).append(",1000,-1\n");
        }
        Path f = dir.resolve("no-loss.csv");
        Files.writeString(f, sb.toString());
        CliRun r = CliRun.of("rank", f.toString());
        long lines = r.err().lines().filter(l -> l.startsWith("warning:")).count();
        assertTrue(lines <= 51, lines + " warning lines");
        assertTrue(r.err().contains("150 more warnings like the above"), r.err());
    }

    /** Running out of memory ends with one line that says what to do, exit 1. */
    @Test
    void outOfMemorySaysWhatToDo() {
        java.io.StringWriter err = new java.io.StringWriter();
        int code = Viscarta.guardMemory(() -> {
            throw new OutOfMemoryError("Java heap space");
        }, new java.io.PrintWriter(err, true));
        assertEquals(1, code);
        assertEquals(1, err.toString().strip().lines().count(), err.toString());
        assertTrue(err.toString().contains("-Xmx") && err.toString().contains("smaller parts"), err.toString());
    }

    /** Outputs get the permissions any new file of the user gets (their umask), not a temporary file's owner-only ones. */
    @Test
    void outputsAreCreatedWithTheUsersUsualPermissions() throws IOException {
        org.junit.jupiter.api.Assumptions.assumeTrue(java.nio.file.FileSystems.getDefault().supportedFileAttributeViews().contains("posix"));
        Path reference = Files.createFile(dir.resolve("plain-new-file"));
        Path out = dir.resolve("rank.csv");
        CliRun r = CliRun.of("rank", "demo-data/paint-light-ageing.csv", "-o", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        assertEquals(Files.getPosixFilePermissions(reference), Files.getPosixFilePermissions(out));
        Path report = dir.resolve("report");
        CliRun rep = CliRun.of("report", "demo-data/paint-light-ageing.csv", "--models", "springpot", "--out", report.toString(), "--quiet");
        assertEquals(0, rep.exitCode(), rep.err());
        assertEquals(Files.getPosixFilePermissions(reference), Files.getPosixFilePermissions(report.resolve("report.xlsx")));
    }

    /** {@code --target} means the same in report as in match: a sample's name, or a file that holds the target. */
    @Test
    void reportTakesATargetFileAsMatchDoes() throws IOException {
        Path out = dir.resolve("mimic");
        CliRun r = CliRun.of("report", "demo-data/hydrogel-screen/gelatin-5pct-r1.csv", "demo-data/hydrogel-screen/agarose-1.0pct-r1.csv",
                "--target", "demo-data/hydrogel-screen/target-soft-tissue-r1.csv", "--models", "springpot,zener", "--out", out.toString(),
                "--quiet");
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(Files.readString(out.resolve("report.html")).contains("Best mimic of target-soft-tissue"));
    }

    /** Raw geometry out of range, an implausible temperature and a file name with a line break: each one line, exit 2. */
    @Test
    void badRawValuesAndOddFileNamesGiveOneLineInputErrors() throws IOException {
        Path demo = Path.of("demo-data", "raw-signals");
        Files.copy(demo.resolve("calibration-sapphire.csv"), dir.resolve("calibration-sapphire.csv"));
        String raw = Files.readString(demo.resolve("alkyd-unaged-raw.csv"));
        Path neg = dir.resolve("neg.csv");
        Files.writeString(neg, raw.replace("tip_radius: 50 µm", "tip_radius: -50 µm"));
        Path hot = dir.resolve("hot.csv");
        Files.writeString(hot, raw.replace("# temperature: 23 °C", "# temperature: 1e999 °C"));
        Path odd = dir.resolve("odd\nname.csv");
        Files.writeString(odd, "frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n1,abc,10\n");
        for (Object[] c : new Object[][] {{neg, "tip_radius"}, {hot, "plausible temperature"}, {odd, "'abc'"}}) {
            CliRun r = CliRun.of("fit", c[0].toString(), "--models", "springpot");
            assertEquals(2, r.exitCode(), r.err());
            assertEquals(1, r.err().strip().lines().count(), "one line: " + r.err());
            assertTrue(r.err().contains((String) c[1]), r.err());
        }
    }
}
