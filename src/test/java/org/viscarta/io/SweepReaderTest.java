package org.viscarta.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.Charset;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.viscarta.sweep.ModulusKind;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;

/** Reading sweep tables: every supported layout, unit and dialect, and every kind of bad input. */
@Tag("regression")
class SweepReaderTest {

    @TempDir
    Path dir;

    private final SweepReader reader = new SweepReader(null);

    private Path write(String name, String text) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, text, StandardCharsets.UTF_8);
        return p;
    }

    private SweepFile read(String text) throws IOException {
        return reader.read(write("s.csv", text));
    }

    private InputException bad(String text) throws IOException {
        Path p = write("bad.csv", text);
        InputException e = assertThrows(InputException.class, () -> reader.read(p));
        assertEquals(p, e.file());
        assertTrue(e.getMessage().startsWith(p + ":"), e.getMessage());
        assertFalse(e.getMessage().contains("\n"), "one line: " + e.getMessage());
        return e;
    }

    @Test
    void readsOneSampleWithMetadataInSiUnits() throws IOException {
        SweepFile f = read("""
                # sample: alkyd-B-aged-1500h
                # material: alkyd paint film
                # temperature: 23 °C
                # method: indentation
                # geometry: sphere; tip_radius: 50 µm; indentation_depth: 4 µm; poisson_ratio: 0.35
                frequency [Hz],storage_modulus [MPa],loss_modulus [MPa]
                0.1,112.0,9.8
                1,120.5,12.25
                """);
        assertEquals("one sample per file", f.info().layout());
        assertEquals(6, f.info().headerLine());
        Sweep s = f.sweeps().get(0);
        assertEquals("alkyd-B-aged-1500h", s.sample());
        assertEquals(23.0, s.temperatureC());
        assertEquals("50 µm", s.metadata().get("tip_radius"));
        assertEquals(0.35, s.poissonRatio().orElseThrow());
        assertEquals(112.0e6, s.points().get(0).storage(), 1e-6);
        assertEquals(12.25e6, s.points().get(1).loss(), 1e-6);
        assertEquals(8, s.points().get(1).line());
        assertEquals(ModulusKind.TENSILE, s.kind());
    }

    @Test
    void unnamedSampleTakesTheFileNameAndWarnsAboutUnstatedBasis() throws IOException {
        SweepFile f = reader.read(write("gel-A.csv", "frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n1,100,10\n"));
        assertEquals("gel-A", f.sweeps().get(0).sample());
        assertTrue(f.warnings().stream().anyMatch(w -> w.message().contains("taken as tensile")));
    }

    @Test
    void readsTheTidyMultiSampleLayout() throws IOException {
        SweepFile f = read("""
                sample,replicate,group,frequency [Hz],storage_modulus [kPa],loss_modulus [kPa]
                gel-1,1,agarose,0.1,10,1
                gel-1,1,agarose,1,11,1.2
                gel-1,2,agarose,0.1,10.5,1.1
                gel-1,2,agarose,1,11.5,1.3
                gel-2,1,gelatin,0.1,3,0.5
                gel-2,1,gelatin,1,3.2,0.6
                """);
        assertEquals("tidy multi-sample table", f.info().layout());
        assertEquals(3, f.sweeps().size());
        assertEquals(List.of("gel-1/1/agarose", "gel-1/2/agarose", "gel-2/1/gelatin"),
                f.sweeps().stream().map(s -> s.sample() + "/" + s.replicate() + "/" + s.group()).toList());
        assertEquals(11.5e3, f.sweeps().get(1).points().get(1).storage(), 1e-9);
    }

    @Test
    void tidyTemperatureColumnSplitsSweeps() throws IOException {
        SweepFile f = read("""
                sample,temperature [°C],frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]
                film,10,1,500,50
                film,10,2,520,55
                film,30,1,300,60
                """);
        assertEquals(2, f.sweeps().size());
        assertEquals(30.0, f.sweeps().get(1).temperatureC());
    }

    // SI prefixes k = 1e3, M = 1e6, G = 1e9 (BIPM, The International System of Units, 9th ed. 2019, table 7);
    // 1 Pa = 1 N/m², so 1 N/mm² = 1e6 Pa = 1 MPa
    @ParameterizedTest(name = "{0} → ×{1}")
    @CsvSource({"Pa,1", "kPa,1e3", "MPa,1e6", "GPa,1e9", "N/mm²,1e6", "N/m²,1"})
    void convertsModulusUnitsToPascal(String unit, double factor) throws IOException {
        SweepFile f = read("frequency [Hz],storage_modulus [" + unit + "],loss_modulus (" + unit + ")\n1,2.5,0.5\n");
        SweepPoint p = f.sweeps().get(0).points().get(0);
        assertEquals(2.5 * factor, p.storage(), 1e-12 * factor);
        assertEquals(0.5 * factor, p.loss(), 1e-12 * factor);
    }

    // ω = 2πf (ISO 80000-3; DOMAIN.md section 0); 1 kHz = 1e3 Hz (BIPM SI prefixes)
    @ParameterizedTest(name = "{0} {1} → Hz")
    @CsvSource({"frequency,Hz,2,2", "frequency,kHz,2,2000", "f,Hz,3,3", "angular_frequency,rad/s,6.283185307179586,1",
        "omega,rad/s,12.566370614359172,2", "frequency,rad/s,6.283185307179586,1"})
    void convertsFrequencyUnitsToHertz(String name, String unit, double value, double hz) throws IOException {
        SweepFile f = read(name + " [" + unit + "],storage_modulus [Pa],loss_modulus [Pa]\n" + value + ",100,10\n");
        assertEquals(hz, f.sweeps().get(0).points().get(0).frequencyHz(), 1e-12 * hz);
    }

    @Test
    void lossTangentWithMagnitudeGivesBothModuli() throws IOException {
        SweepFile f = read("frequency [Hz],complex_modulus_magnitude [kPa],loss_tangent\n1,5,0.75\n");
        SweepPoint p = f.sweeps().get(0).points().get(0);
        // |E*| = 5 kPa, tan δ = 3/4 ⇒ E′ = 4 kPa, E″ = 3 kPa (3-4-5 triangle)
        assertEquals(4000, p.storage(), 1e-9);
        assertEquals(3000, p.loss(), 1e-9);
    }

    @ParameterizedTest(name = "phase in {0}")
    @CsvSource({"deg,30", "°,30", "rad,0.5235987755982988"})
    void phaseAngleWithMagnitudeGivesBothModuli(String unit, double phase) throws IOException {
        SweepFile f = read("frequency [Hz],|E*| [Pa],phase_angle [" + unit + "]\n1,1000," + phase + "\n");
        SweepPoint p = f.sweeps().get(0).points().get(0);
        assertEquals(1000 * Math.sqrt(3) / 2, p.storage(), 1e-9);
        assertEquals(500, p.loss(), 1e-9);
    }

    @Test
    void shearHeadersAndMetadataGiveShearModuli() throws IOException {
        assertEquals(ModulusKind.SHEAR, read("frequency [Hz],G' [Pa],G'' [Pa]\n1,100,10\n").sweeps().get(0).kind());
        assertEquals(ModulusKind.SHEAR, read("frequency [Hz],G′ [Pa],G″ [Pa]\n1,100,10\n").sweeps().get(0).kind());
        assertEquals(ModulusKind.SHEAR, read("# modulus: shear\nfrequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n1,100,10\n")
                .sweeps().get(0).kind());
        assertEquals(ModulusKind.TENSILE, read("frequency [Hz],E′ [Pa],E″ [Pa]\n1,100,10\n").sweeps().get(0).kind());
    }

    @Test
    void readsSemicolonsWithDecimalCommaAndAByteOrderMark() throws IOException {
        Path p = dir.resolve("eu.csv");
        byte[] body = "frequency [Hz];storage_modulus [kPa];loss_modulus [kPa]\r\n0,5;12,5;1,25\r\n1;13;1,5\r\n"
                .getBytes(StandardCharsets.UTF_8);
        byte[] withBom = new byte[body.length + 3];
        withBom[0] = (byte) 0xEF;
        withBom[1] = (byte) 0xBB;
        withBom[2] = (byte) 0xBF;
        System.arraycopy(body, 0, withBom, 3, body.length);
        Files.write(p, withBom);
        SweepFile f = reader.read(p);
        assertEquals(';', f.info().separator());
        assertEquals(',', f.info().decimalMark());
        assertEquals("UTF-8 with byte-order mark", f.info().encoding());
        assertEquals(12500, f.sweeps().get(0).points().get(0).storage(), 1e-9);
        assertEquals(0.5, f.sweeps().get(0).points().get(0).frequencyHz());
    }

    @Test
    void readsTabsAndWindows1252() throws IOException {
        Path p = dir.resolve("tab.txt");
        Files.write(p, "# geometry: sphere; tip_radius: 25 µm\nfrequency [Hz]\tstorage_modulus [Pa]\tloss_modulus [Pa]\n1\t100\t10\n"
                .getBytes(Charset.forName("windows-1252")));
        SweepFile f = reader.read(p);
        assertEquals('\t', f.info().separator());
        assertEquals("windows-1252", f.info().encoding());
        assertEquals("25 µm", f.info().metadata().get("tip_radius"));
    }

    @Test
    void keepsNonPositiveLossWithAWarningAndSortsRows() throws IOException {
        SweepFile f = read("frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n10,120,-1\n1,100,10\n1,101,11\n");
        Sweep s = f.sweeps().get(0);
        assertEquals(3, s.points().size());
        assertEquals(1.0, s.points().get(0).frequencyHz());
        assertEquals(2, s.fittablePoints().size());
        assertTrue(f.warnings().stream().anyMatch(w -> w.line() == 2 && w.message().contains("not positive")));
        assertTrue(f.warnings().stream().anyMatch(w -> w.message().contains("appears twice")));
    }

    @Test
    void rejectsNonNumericCellWithFileLineAndColumn() throws IOException {
        InputException e = bad("frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n1,100,10\n2,abc,12\n");
        assertEquals(3, e.line());
        assertEquals(2, e.column());
        assertTrue(e.problem().contains("'abc'"), e.problem());
    }

    @Test
    void rejectsMissingFrequencyColumn() throws IOException {
        InputException e = bad("# sample: x\nstorage_modulus [Pa],loss_modulus [Pa]\n100,10\n");
        assertEquals(2, e.line());
        assertTrue(e.problem().contains("no frequency column"), e.problem());
    }

    @Test
    void rejectsNegativeFrequencyWithFileAndLine() throws IOException {
        InputException e = bad("frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n1,100,10\n-2,110,12\n");
        assertEquals(3, e.line());
        assertEquals(1, e.column());
    }

    @Test
    void rejectsAnEmptyFile() throws IOException {
        InputException e = bad("");
        assertEquals(1, e.line());
        assertTrue(e.problem().contains("empty"), e.problem());
    }

    @Test
    void rejectsAnUnknownUnitNamingTheHeader() throws IOException {
        InputException e = bad("frequency [Hz],storage_modulus [psi],loss_modulus [Pa]\n1,100,10\n");
        assertEquals(1, e.line());
        assertEquals(2, e.column());
        assertTrue(e.problem().contains("'psi'") && e.problem().contains("kPa"), e.problem());
    }

    @Test
    void anUnknownDescriptiveColumnBesideCompleteModuliIsASampleAttribute() throws IOException {
        SweepFile f = read("frequency [Hz],storage_modulus [Pa],loss_modulus [Pa],colour\n1,100,10,red\n");
        assertEquals("red", f.sweeps().get(0).attributes().get("colour"));
        InputException e = bad("frequency [Hz],storage_modulus [Pa],colour\n1,100,red\n");
        assertEquals(3, e.column(), "with the moduli incomplete, the unknown column is named: " + e.getMessage());
        assertTrue(e.problem().contains("'colour' (column 3)"), e.problem());
    }

    @Test
    void aUnitWrittenAfterTheNameIsRead() throws IOException {
        SweepFile f = read("frequency_Hz,storage_modulus_kPa,loss_modulus_kPa\n1,2,0.5\n");
        assertEquals(2000, f.sweeps().get(0).points().get(0).storage(), 1e-9);
    }

    @Test
    void rejectsARowWithMissingCells() throws IOException {
        InputException e = bad("frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n1,100\n");
        assertEquals(2, e.line());
    }

    @Test
    void rejectsZeroStorageModulus() throws IOException {
        InputException e = bad("frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n1,0,10\n");
        assertEquals(2, e.line());
        assertEquals(2, e.column());
    }

    @Test
    void rejectsHeaderOnly() throws IOException {
        InputException e = bad("frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n");
        assertEquals(1, e.line());
    }

    @Test
    void rejectsABrokenWorkbookWithAClearMessage() throws IOException {
        Path p = write("book.xlsx", "not really a workbook");
        InputException e = assertThrows(InputException.class, () -> reader.read(p));
        assertTrue(e.problem().contains("the workbook cannot be read"), e.problem());
    }

    @Test
    void readsEverySheetOfAWorkbookWithCachedFormulaValues() throws IOException {
        Path p = dir.resolve("book.xlsx");
        try (org.apache.poi.xssf.usermodel.XSSFWorkbook wb = new org.apache.poi.xssf.usermodel.XSSFWorkbook()) {
            var one = wb.createSheet("gel A");
            one.createRow(0).createCell(0).setCellValue("# temperature: 25 °C");
            var h = one.createRow(1);
            h.createCell(0).setCellValue("frequency [Hz]");
            h.createCell(1).setCellValue("storage_modulus [kPa]");
            h.createCell(2).setCellValue("loss_modulus [kPa]");
            for (int i = 0; i < 3; i++) {
                var r = one.createRow(2 + i);
                r.createCell(0).setCellValue(Math.pow(10, i - 1));
                r.createCell(1).setCellValue(10 + i);
                r.createCell(2).setCellFormula("B" + (3 + i) + "/10");
            }
            var tidy = wb.createSheet("tidy");
            var th = tidy.createRow(0);
            String[] headers = {"sample", "frequency [Hz]", "storage_modulus [Pa]", "loss_modulus [Pa]"};
            for (int c = 0; c < 4; c++) {
                th.createCell(c).setCellValue(headers[c]);
            }
            for (int i = 0; i < 2; i++) {
                var r = tidy.createRow(1 + i);
                r.createCell(0).setCellValue(i == 0 ? "x" : "y");
                r.createCell(1).setCellValue(1);
                r.createCell(2).setCellValue(100);
                r.createCell(3).setCellValue(10);
            }
            org.apache.poi.ss.usermodel.FormulaEvaluator ev = wb.getCreationHelper().createFormulaEvaluator();
            ev.evaluateAll();
            try (var out = Files.newOutputStream(p)) {
                wb.write(out);
            }
        }
        SweepFile f = reader.read(p);
        assertEquals(List.of("gel A", "x", "y"), f.sweeps().stream().map(Sweep::sample).toList());
        Sweep gel = f.sweeps().get(0);
        assertEquals(25.0, gel.temperatureC());
        assertEquals(1100.0, gel.points().get(1).loss(), 1e-9, "formula B4/10 = 1.1 kPa, read as its cached value");
        assertEquals(4, gel.points().get(1).line(), "spreadsheet row number");
    }

    @Test
    void aBadCellInASheetNamesSheetRowAndColumn() throws IOException {
        Path p = dir.resolve("bad.xlsx");
        try (org.apache.poi.xssf.usermodel.XSSFWorkbook wb = new org.apache.poi.xssf.usermodel.XSSFWorkbook()) {
            var s = wb.createSheet("run 2");
            var h = s.createRow(0);
            h.createCell(0).setCellValue("frequency [Hz]");
            h.createCell(1).setCellValue("storage_modulus [Pa]");
            h.createCell(2).setCellValue("loss_modulus [Pa]");
            var r = s.createRow(1);
            r.createCell(0).setCellValue(1);
            r.createCell(1).setCellValue("about 2");
            r.createCell(2).setCellValue(3);
            try (var out = Files.newOutputStream(p)) {
                wb.write(out);
            }
        }
        InputException e = assertThrows(InputException.class, () -> reader.read(p));
        assertTrue(e.getMessage().startsWith(p + "#run 2:2:2: "), e.getMessage());
    }

    /** Writes one sheet: a header whose loss column name holds a line break, rows 2 and 4 with data, row 3 left out. */
    private static void gappySheet(org.apache.poi.ss.usermodel.Workbook wb) {
        var s = wb.createSheet("gaps");
        var h = s.createRow(0);
        h.createCell(0).setCellValue("frequency [Hz]");
        h.createCell(2).setCellValue("storage_modulus [Pa]"); // column B left empty in the header ...
        h.createCell(3).setCellValue("loss_modulus\n[Pa]");
        var twoDecimals = wb.createCellStyle();
        twoDecimals.setDataFormat(wb.getCreationHelper().createDataFormat().getFormat("0.00"));
        double[][] rows = {{0.125, 1234.5678, 9.87654321}, {10, 2000, 20}};
        int[] at = {1, 3};
        for (int i = 0; i < 2; i++) {
            var r = s.createRow(at[i]);
            for (int c = 0; c < 3; c++) {
                var cell = r.createCell(c == 0 ? 0 : c + 1); // ... and in every row
                cell.setCellValue(rows[i][c]);
                cell.setCellStyle(twoDecimals);
            }
        }
    }

    @Test
    void workbookCellsKeepEveryDigitWhateverTheirDisplayFormatAndRowsKeepTheirNumbers() throws IOException {
        Path xlsx = dir.resolve("gaps.xlsx");
        try (var wb = new org.apache.poi.xssf.usermodel.XSSFWorkbook()) {
            gappySheet(wb);
            try (var out = Files.newOutputStream(xlsx)) {
                wb.write(out);
            }
        }
        Path xls = dir.resolve("gaps.xls");
        try (var wb = new org.apache.poi.hssf.usermodel.HSSFWorkbook()) {
            gappySheet(wb);
            try (var out = Files.newOutputStream(xls)) {
                wb.write(out);
            }
        }
        for (Path p : List.of(xlsx, xls)) { // XLSX through the streaming reader, XLS through the object model
            SweepFile f = reader.read(p);
            List<SweepPoint> pts = f.sweeps().get(0).points();
            assertEquals(2, pts.size(), p.toString());
            assertEquals(0.125, pts.get(0).frequencyHz(), 0, "a '0.00' display format must not round 0.125 Hz: " + p);
            assertEquals(1234.5678, pts.get(0).storage(), 0, p.toString());
            assertEquals(9.87654321, pts.get(0).loss(), 0, "the header with a line break is read as one name: " + p);
            assertEquals(List.of(2, 4), List.of(pts.get(0).line(), pts.get(1).line()), "spreadsheet row numbers: " + p);
            String expected;
            try {
                expected = java.util.HexFormat.of().formatHex(
                        java.security.MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(p)));
            } catch (java.security.NoSuchAlgorithmException ex) {
                throw new AssertionError(ex);
            }
            assertEquals(expected, f.sha256(), "checksum of the file's bytes, read in a stream");
        }
    }

    @Test
    void aWorkbookRefusedEarlyLeavesNoReaderThreadBehind() throws IOException, InterruptedException {
        Path p = dir.resolve("long.xlsx");
        try (var wb = new org.apache.poi.xssf.streaming.SXSSFWorkbook(100)) {
            var s = wb.createSheet("long");
            var h = s.createRow(0);
            h.createCell(0).setCellValue("frequency [Hz]");
            h.createCell(1).setCellValue("storage_modulus [Pa]");
            h.createCell(2).setCellValue("loss_modulus [Pa]");
            for (int r = 1; r <= 50_000; r++) {
                var row = s.createRow(r);
                row.createCell(0).setCellValue(r);
                row.createCell(1).setCellValue(r == 3 ? "about 2" : "100"); // row 4 is refused: the rest is never read
                row.createCell(2).setCellValue(10);
            }
            try (var out = Files.newOutputStream(p)) {
                wb.write(out);
            }
            wb.dispose();
        }
        InputException e = assertThrows(InputException.class, () -> reader.read(p));
        assertTrue(e.getMessage().startsWith(p + "#long:4:2: "), e.getMessage());
        for (int i = 0; i < 100 && readerThreads() > 0; i++) {
            Thread.sleep(50);
        }
        assertEquals(0, readerThreads(), "the sheet's parsing thread stops when the table reader stops");
    }

    private static long readerThreads() {
        return Thread.getAllStackTraces().keySet().stream().filter(t -> t.getName().equals("viscarta-sheet-reader")).count();
    }

    @Test
    void aWorkbookSheetWithTitleRowsAndAUnitsRowReadsAndADateCellIsAnError() throws IOException {
        Path p = dir.resolve("export.xlsx");
        try (org.apache.poi.xssf.usermodel.XSSFWorkbook wb = new org.apache.poi.xssf.usermodel.XSSFWorkbook()) {
            var s = wb.createSheet("sweep");
            s.createRow(0).createCell(0).setCellValue("Frequency sweep (invented example)");
            var meta = s.createRow(1);
            meta.createCell(0).setCellValue("Sample name:");
            meta.createCell(1).setCellValue("gel E");
            var h = s.createRow(3);
            String[] names = {"Point", "Frequency", "G'", "G''"};
            String[] units = {"", "Hz", "kPa", "kPa"};
            var u = s.createRow(4);
            for (int c = 0; c < 4; c++) {
                h.createCell(c).setCellValue(names[c]);
                u.createCell(c).setCellValue(units[c]);
            }
            for (int r = 0; r < 3; r++) {
                var row = s.createRow(5 + r);
                row.createCell(0).setCellValue(r + 1);
                row.createCell(1).setCellValue(Math.pow(10, r - 1));
                row.createCell(2).setCellValue(1.5 + r);
                row.createCell(3).setCellValue(0.2);
            }
            var bad = wb.createSheet("dated");
            var bh = bad.createRow(0);
            bh.createCell(0).setCellValue("frequency [Hz]");
            bh.createCell(1).setCellValue("storage_modulus [Pa]");
            bh.createCell(2).setCellValue("loss_modulus [Pa]");
            var br = bad.createRow(1);
            var date = br.createCell(0);
            date.setCellValue(45000);
            var style = wb.createCellStyle();
            style.setDataFormat(wb.getCreationHelper().createDataFormat().getFormat("yyyy-mm-dd"));
            date.setCellStyle(style);
            br.createCell(1).setCellValue(100);
            br.createCell(2).setCellValue(10);
            try (var out = Files.newOutputStream(p)) {
                wb.write(out);
            }
        }
        InputException e = assertThrows(InputException.class, () -> reader.read(p));
        assertTrue(e.getMessage().startsWith(p + "#dated:2:1: "), e.getMessage());
        assertTrue(e.problem().contains("a date cell"), e.problem());
        // the first sheet alone reads: title and preamble above the header, the units row under it
        Path good = dir.resolve("good.xlsx");
        try (var in = Files.newInputStream(p); var wb = org.apache.poi.ss.usermodel.WorkbookFactory.create(in)) {
            wb.removeSheetAt(1);
            try (var out = Files.newOutputStream(good)) {
                wb.write(out);
            }
        }
        SweepFile f = reader.read(good);
        assertEquals("gel E", f.sweeps().get(0).sample());
        assertEquals(3, f.sweeps().get(0).points().size());
        assertEquals(1500, f.sweeps().get(0).points().get(0).storage(), 1e-9);
        assertEquals(4, f.info().headerLine(), "the header is the sheet's row 4, below the title and the preamble");
    }

    @ParameterizedTest(name = "''{0}'' is a number: {1}")
    @CsvSource({"1,true", "-1.5,true", "+.5,true", "2.,true", "1e3,true", "1.25E-7,true", "NaN,false", "Infinity,false",
        "1d,false", "0x1p3,false", "1e,false", "'',false", ".,false", "1.2.3,false", "١٢,false"})
    void acceptsOnlyPlainDecimalNumbers(String text, boolean expected) {
        assertEquals(expected, SweepReader.isPlainNumber(text));
    }

    @Test
    void quotedCellsAreRead() throws IOException {
        SweepFile f = read("\"sample\",\"frequency [Hz]\",\"storage_modulus [Pa]\",\"loss_modulus [Pa]\"\n\"gel, soft\",1,100,10\n");
        assertEquals("gel, soft", f.sweeps().get(0).sample());
    }

    @Test
    void compliancesBecomeModuli() throws IOException {
        // J* = J′ − iJ″ = 1/M*: J′ = 3e-4, J″ = 4e-4 1/Pa ⇒ |J*| = 5e-4 ⇒ M′ = J′/|J*|² = 1200, M″ = J″/|J*|² = 1600 Pa
        SweepFile f = read("frequency [Hz],J' [1/Pa],J'' [1/Pa]\n1,3e-4,4e-4\n");
        SweepPoint p = f.sweeps().get(0).points().get(0);
        assertEquals(1200, p.storage(), 1e-9);
        assertEquals(1600, p.loss(), 1e-9);
        SweepFile k = read("frequency [Hz],storage_compliance [1/kPa],loss_compliance [1/kPa]\n1,0.3,0.4\n");
        assertEquals(1200, k.sweeps().get(0).points().get(0).storage(), 1e-9); // 0.3 /kPa = 3e-4 /Pa, as above
    }

    @Test
    void viscositiesBecomeShearModuli() throws IOException {
        // η* = G*/(iω) = η′ − iη″ ⇒ G′ = ωη″, G″ = ωη′ (ISO 6721-10); at ω = 2 rad/s, η′ = 50, η″ = 20 Pa·s ⇒ G′ = 40, G″ = 100 Pa
        SweepFile f = read("angular_frequency [rad/s],η' [Pa·s],η'' [Pa·s]\n2,50,20\n");
        SweepPoint p = f.sweeps().get(0).points().get(0);
        assertEquals(40, p.storage(), 1e-9);
        assertEquals(100, p.loss(), 1e-9);
        assertEquals(ModulusKind.SHEAR, f.sweeps().get(0).kind());
        // |η*| with the phase angle: |G*| = ω|η*| = 2·50 = 100 Pa at δ = 30°
        SweepFile m = read("angular_frequency [rad/s],complex_viscosity [mPa·s],phase_angle [deg]\n2,50000,30\n");
        assertEquals(100 * Math.cos(Math.PI / 6), m.sweeps().get(0).points().get(0).storage(), 1e-9);
    }

    @Test
    void aColumnMapNamesWhatAnUnknownHeaderHolds() throws IOException {
        Path p = write("mapped.csv", "angular_frequency_rad_s,G_storage_Pa,G_loss_Pa\n6.283185307179586,100,30\n");
        SweepFile f = new SweepReader(null, java.util.Map.of("angular_frequency_rad_s", "angular_frequency [rad/s]",
                "G_storage_Pa", "G' [Pa]", "G_loss_Pa", "G'' [Pa]")).read(p);
        assertEquals(1.0, f.sweeps().get(0).points().get(0).frequencyHz(), 1e-12);
        assertEquals("G_storage_Pa", f.info().columns().get(1).header());
        InputException e = assertThrows(InputException.class, () -> reader.read(p));
        assertTrue(e.problem().contains("--column \"angular_frequency_rad_s=angular_frequency [rad/s]\""), e.problem());
        assertTrue(e.problem().contains("--column \"G_storage_Pa=storage_modulus [Pa]\""), e.problem());
        assertTrue(e.problem().contains("--column \"G_loss_Pa=loss_modulus [Pa]\""), e.problem());
        Path extra = write("extra.csv", "frequency [Hz],storage_modulus [Pa],loss_modulus [Pa],acrylamide_conc_percent\n1,100,10,12.5\n");
        assertEquals(100, new SweepReader(null, java.util.Map.of("acrylamide_conc_percent", "ignore")).read(extra).sweeps().get(0)
                .points().get(0).storage());
    }

    @Test
    void qualityColumnsAreAcceptedAndIgnored() throws IOException {
        SweepFile f = read("frequency [Hz],storage_modulus [Pa],loss_modulus [Pa],quality_force_distortion,quality_linear\n1,100,10,0.01,yes\n");
        assertEquals(100, f.sweeps().get(0).points().get(0).storage());
    }

    @Test
    void readsTheWideLayoutWithOneColumnPairPerSample() throws IOException {
        SweepFile f = read("""
                # temperature: 23 °C
                frequency [Hz],gel A E' [kPa],gel A E'' [kPa],gel_B storage_modulus [Pa],gel_B loss_modulus [Pa]
                0.1,10,1,9000,800
                1,11,1.5,,
                10,12,2,9500,900
                """);
        assertTrue(f.info().layout().startsWith("wide table"), f.info().layout());
        assertEquals(List.of("gel A", "gel_B"), f.sweeps().stream().map(Sweep::sample).toList());
        assertEquals(3, f.sweeps().get(0).points().size());
        assertEquals(2, f.sweeps().get(1).points().size(), "empty cells: gel_B was not measured at 1 Hz");
        assertEquals(11000, f.sweeps().get(0).points().get(1).storage(), 1e-9);
        assertEquals(23.0, f.sweeps().get(1).temperatureC());
    }

    @Test
    void aWideTableNeedsBothModuliPerSample() throws IOException {
        InputException e = bad("frequency [Hz],gel A E' [Pa],gel B E' [Pa],gel B E'' [Pa]\n1,1,2,3\n");
        assertTrue(e.problem().contains("'gel A' has only one"), e.problem());
    }

    @Test
    void metadataKeepTheOrderOfTheFile() throws IOException {
        // the order in which Provenance lists a file's lines: the file's, on every run (Map.copyOf's order
        // changes between JVM runs where the class-data archive is off, and made two reports differ)
        List<String> keys = List.of("zeta", "operator", "alpha", "instrument", "method", "batch", "mu", "beta", "lot",
                "kappa", "epsilon");
        StringBuilder text = new StringBuilder("# sample: a\n");
        for (String k : keys) {
            text.append("# ").append(k).append(": v-").append(k).append('\n');
        }
        text.append("frequency [Hz],E' [Pa],E'' [Pa]\n1,10,1\n2,11,2\n4,12,3\n");
        SweepFile f = read(text.toString());
        List<String> sweepKeys = f.sweeps().get(0).metadata().keySet().stream().filter(keys::contains).toList();
        List<String> fileKeys = f.info().metadata().keySet().stream().filter(keys::contains).toList();
        assertEquals(keys, sweepKeys);
        assertEquals(keys, fileKeys);
    }
}
