package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.apache.poi.ss.usermodel.Workbook;
import org.apache.poi.ss.usermodel.WorkbookFactory;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * Regression: the report's HTML page, figures and reproducibility, from the shared demo report
 * (and a second run for byte stability).
 */
@Tag("regression")
class ReportOutputTest {

    static Path first;
    static java.util.Map<Path, byte[]> firstBytes;

    /** The shared demo report and its bytes, before anything else runs it again. */
    @BeforeAll
    static void readTheSharedReport() throws IOException {
        first = DemoReport.folder();
        firstBytes = bytesUnder(first);
    }

    private static java.util.Map<Path, byte[]> bytesUnder(Path folder) throws IOException {
        java.util.Map<Path, byte[]> bytes = new java.util.TreeMap<>();
        try (Stream<Path> s = Files.walk(folder)) {
            for (Path p : s.filter(Files::isRegularFile).toList()) {
                bytes.put(folder.relativize(p), Files.readAllBytes(p));
            }
        }
        return bytes;
    }

    @Test
    void theDemoReportShowsTheGlassTransitionsOfItsRamps() throws IOException {
        Document doc = Jsoup.parse(first.resolve("report.html").toFile(), "UTF-8");
        Element table = doc.select("h2:contains(Transitions) + p + table").first();
        assertTrue(table != null, "a Transitions table");
        assertEquals(27 + 1, table.select("tr").size(), "27 ramps and a header");
        String text = doc.text();
        assertTrue(text.contains("Why three Tg values") && text.contains("Which Tg to quote"), "the Read me explains the conventions");
        assertTrue(text.contains("ASTM E1640"));
        assertTrue(text.contains("not a safe temperature of use"), "the caution about Tg");
        assertTrue(text.contains("Tg (tan δ peak) at 1 Hz"), "the comparison at 1 Hz");
        for (String sample : org.viscarta.demo.DemoData.RAMPS.keySet()) {
            assertTrue(Files.isRegularFile(first.resolve("figures/transition-" + sample + ".png")), sample);
            assertTrue(doc.select("figure#transition-" + sample + " figcaption").text().contains("ASTM E1640"), sample);
        }
    }

    @Test
    void theDemoReportComparesTheRelaxationTestWithItsSweeps() throws IOException {
        String relaxed = org.viscarta.demo.DemoData.RELAXATION_SAMPLE + " (relaxation)";
        try (InputStream in = Files.newInputStream(first.resolve("report.xlsx")); Workbook wb = WorkbookFactory.create(in)) {
            org.apache.poi.ss.usermodel.Sheet tests = wb.getSheet("Time-domain tests");
            assertTrue(tests != null, "a Time-domain tests sheet");
            int points = 0;
            for (org.apache.poi.ss.usermodel.Row row : tests) {
                org.apache.poi.ss.usermodel.Cell c = row.getCell(0);
                points += c != null && relaxed.equals(c.getStringCellValue()) ? 1 : 0;
            }
            assertEquals(90, points, "3 replicates × 30 measured times");
            for (org.apache.poi.ss.usermodel.Row row : wb.getSheet("Data")) {
                org.apache.poi.ss.usermodel.Cell c = row.getCell(0);
                assertFalse(c != null && c.getCellType() == org.apache.poi.ss.usermodel.CellType.STRING
                        && relaxed.equals(c.getStringCellValue()), "computed moduli are not listed as measured points");
            }
            // the relaxation test and the sweeps of the same (invented) material agree on tan δ at 1 Hz
            double[][] ci = new double[2][];
            org.apache.poi.ss.usermodel.Sheet ranking = wb.getSheet("Damping ranking");
            org.apache.poi.ss.usermodel.Row header = null;
            for (org.apache.poi.ss.usermodel.Row row : ranking) {
                if (row.getCell(1) != null && "sample".equals(row.getCell(1).toString())) {
                    header = row;
                    continue;
                }
                if (header == null || row.getCell(1) == null) {
                    continue;
                }
                String name = row.getCell(1).toString();
                int k = name.equals(relaxed) ? 0 : name.equals(org.viscarta.demo.DemoData.RELAXATION_SAMPLE) ? 1 : -1;
                if (k >= 0) {
                    ci[k] = new double[] {cell(header, row, "tan δ 95 % CI low [–]"), cell(header, row, "tan δ 95 % CI high [–]")};
                }
            }
            assertTrue(ci[0] != null && ci[1] != null, "both are ranked");
            assertTrue(ci[0][0] <= ci[1][1] && ci[1][0] <= ci[0][1], "their intervals overlap: " + java.util.Arrays.toString(ci[0])
                    + " and " + java.util.Arrays.toString(ci[1]));
        }
        assertTrue(Files.isRegularFile(first.resolve("figures/fit-gelatin-5pct-relaxation.png")), "its time-domain figure");
        Document doc = Jsoup.parse(first.resolve("report.html").toFile(), "UTF-8");
        assertTrue(doc.text().contains("Samples computed from time-domain tests"), "the Read me explains");
        assertTrue(doc.select("h2:contains(Time-domain tests) ~ ul li").text().contains("computed from the stress relaxation test"),
                "the origin of each replicate's moduli");
    }

    private static double cell(org.apache.poi.ss.usermodel.Row header, org.apache.poi.ss.usermodel.Row row, String label) {
        for (org.apache.poi.ss.usermodel.Cell h : header) {
            if (h.toString().equals(label)) {
                return row.getCell(h.getColumnIndex()).getNumericCellValue();
            }
        }
        throw new AssertionError("no column '" + label + "'");
    }

    @Test
    void htmlIsSelfContainedAndHoldsTheTables() throws IOException {
        Document doc = Jsoup.parse(first.resolve("report.html").toFile(), "UTF-8");
        assertTrue(doc.select("script, link, iframe, object, embed").isEmpty(), "no script or external resource");
        for (Element e : doc.select("[src], [href]")) {
            String ref = e.hasAttr("src") ? e.attr("src") : e.attr("href");
            assertFalse(ref.startsWith("http") || ref.startsWith("//"), "nothing fetched from elsewhere: " + ref);
        }
        assertTrue(doc.select("style").size() == 1);
        List<String> headings = doc.select("h2").eachText();
        assertEquals(List.of("Read me", "Summary", "Damping ranking", "Quality", "Closest reference materials", "Best mimic of target-soft-tissue",
                "Temperature series: acrylic-film-ts", "Transitions", "Activation energy", "Transition ranking", "Time-domain tests", "Maps", "Regions",
                "Figures", "Provenance"), headings);
        Element ranking = doc.select("h2:contains(Damping ranking) + p + table").first();
        assertEquals(1 + 24, ranking.select("tr").size(), "a row per sample, the master curve and the relaxation test included");
        assertTrue(doc.text().contains("not clinical or structural verdicts"));
        assertTrue(doc.text().contains("invented demo data"));
        assertEquals(doc.select("figure").size(), doc.select("figure svg").size(), "every figure is inline SVG");
        assertTrue(doc.select("figure").size() >= 2 + 15, "overview figures and one fit figure per sample");
    }

    @Test
    void theDemoMasterCurveSpansSeveralMoreDecadesThanOneSweep() throws IOException {
        try (InputStream in = Files.newInputStream(first.resolve("report.xlsx")); Workbook wb = WorkbookFactory.create(in)) {
            org.apache.poi.ss.usermodel.Sheet summary = wb.getSheet("Summary");
            for (org.apache.poi.ss.usermodel.Row row : summary) {
                int low = column(summary, "lowest frequency [Hz]");
                int high = column(summary, "highest frequency [Hz]");
                if (row.getRowNum() > 0 && row.getCell(0).getStringCellValue().equals("acrylic-film-ts master @ 20 °C")) {
                    double decades = Math.log10(row.getCell(high).getNumericCellValue() / row.getCell(low).getNumericCellValue());
                    assertTrue(decades > Math.log10(200) + 2, "master curve spans " + decades + " decades");
                    return;
                }
            }
        }
        throw new AssertionError("no master curve in the Summary");
    }

    /** The index of the header cell with this text in row 0. */
    static int column(org.apache.poi.ss.usermodel.Sheet sheet, String header) {
        for (org.apache.poi.ss.usermodel.Cell c : sheet.getRow(0)) {
            if (c.getStringCellValue().equals(header)) {
                return c.getColumnIndex();
            }
        }
        throw new AssertionError("no column '" + header + "' in " + sheet.getSheetName());
    }

    /** The text of the cell in this column of the first row whose first cell is {@code sample}. */
    private static String cellOf(org.apache.poi.ss.usermodel.Sheet sheet, String sample, String header) {
        int col = column(sheet, header);
        int name = column(sheet, "sample");
        for (org.apache.poi.ss.usermodel.Row row : sheet) {
            if (row.getRowNum() > 0 && row.getCell(name) != null && row.getCell(name).getStringCellValue().equals(sample)) {
                return row.getCell(col) == null ? "" : row.getCell(col).getStringCellValue();
            }
        }
        throw new AssertionError("no row for " + sample + " in " + sheet.getSheetName());
    }

    /**
     * The demo's known faults (DemoData: polyacrylamide measured above its linear limit, gelatin-10pct
     * replicate 3 off, acrylic-1500h too thin for the indentation) are found and marked where a reader
     * sees them: the Quality sheet, the Summary and Damping ranking, and the page; the other samples are
     * not marked.
     */
    @Test
    void theDemoFaultsAreFoundAndMarked() throws IOException {
        try (InputStream in = Files.newInputStream(first.resolve("report.xlsx")); Workbook wb = WorkbookFactory.create(in)) {
            org.apache.poi.ss.usermodel.Sheet q = wb.getSheet("Quality");
            java.util.Set<String> concerns = new java.util.TreeSet<>();
            for (org.apache.poi.ss.usermodel.Row row : q) {
                if (row.getRowNum() == 0 || row.getCell(3) == null || row.getCell(2) == null) {
                    continue;
                }
                String verdict = row.getCell(3).getStringCellValue();
                if (!verdict.equals("pass") && !row.getCell(0).getStringCellValue().endsWith("-raw")) {
                    concerns.add(row.getCell(0).getStringCellValue() + " " + row.getCell(2).getStringCellValue() + " " + verdict);
                }
            }
            assertEquals(java.util.Set.of("polyacrylamide-8pct linear-range fail", "gelatin-10pct replicate-outlier warn",
                    "acrylic-1500h film-thickness warn"), concerns);
            org.apache.poi.ss.usermodel.Sheet summary = wb.getSheet("Summary");
            assertEquals("fail: linear-range (every replicate)", cellOf(summary, "polyacrylamide-8pct", "quality checks"));
            assertEquals("warn: replicate-outlier (replicate 3)", cellOf(summary, "gelatin-10pct", "quality checks"));
            assertEquals("warn: film-thickness (every replicate)", cellOf(summary, "acrylic-1500h", "quality checks"));
            assertEquals("", cellOf(summary, "gelatin-5pct", "quality checks"));
            org.apache.poi.ss.usermodel.Sheet ranking = wb.getSheet("Damping ranking");
            assertEquals("warn: replicate-outlier (replicate 3)", cellOf(ranking, "gelatin-10pct", "quality checks"));
        }
        Document doc = Jsoup.parse(first.resolve("report.html").toFile(), "UTF-8");
        Element quality = doc.select("h2:contains(Quality) + p + table").first();
        assertTrue(quality.text().contains("replicate-outlier") && quality.text().contains("film-thickness"), quality.text());
        assertEquals(5 + 3 + 1 + 5 + 2 * 2, quality.select("tr").size() - 1,
                "five amplitude sweeps, three sweeps above the linear limit, one outlier, five thin-film sweeps, two raw sweeps' two warnings");
    }

    @Test
    void figuresExistAsNonEmptyPngAndSvg() throws IOException {
        try (Stream<Path> s = Files.list(first.resolve("figures"))) {
            List<Path> files = s.toList();
            long png = files.stream().filter(p -> p.toString().endsWith(".png")).count();
            long svg = files.stream().filter(p -> p.toString().endsWith(".svg")).count();
            assertEquals(png, svg);
            assertTrue(png >= 17, "figures: " + png);
            for (Path p : files) {
                byte[] b = Files.readAllBytes(p);
                assertTrue(b.length > 1000, p + " is too small");
                if (p.toString().endsWith(".png")) {
                    assertArrayEquals(new byte[] {(byte) 0x89, 'P', 'N', 'G'}, java.util.Arrays.copyOf(b, 4), p.toString());
                }
            }
        }
    }

    @Test
    void theWorkbookEmbedsTheFigures() throws IOException {
        try (InputStream in = Files.newInputStream(first.resolve("report.xlsx")); Workbook wb = WorkbookFactory.create(in)) {
            assertTrue(wb.getSheet("Figures") != null);
            long pngs;
            try (Stream<Path> s = Files.list(first.resolve("figures"))) {
                pngs = s.filter(p -> p.toString().endsWith(".png")).count();
            }
            assertEquals(pngs, wb.getAllPictures().size());
        }
    }

    /** Runs the same command into the same folder (the command line, which names it, is then the same too). */
    @Test
    void theSameInputsAndTimeGiveTheSameBytes() throws IOException {
        CliRun r = CliRun.of(DemoReport.args(first));
        assertEquals(0, r.exitCode(), r.err());
        java.util.Map<Path, byte[]> secondBytes = bytesUnder(first);
        assertEquals(firstBytes.keySet(), secondBytes.keySet());
        assertTrue(firstBytes.size() >= 2 + 34, "workbook, page and figures: " + firstBytes.size());
        for (Path p : firstBytes.keySet()) {
            assertArrayEquals(firstBytes.get(p), secondBytes.get(p), p.toString());
        }
    }

    /** The page opens with a table of contents, states every caution the analysis calls for, and every figure says it shows demo data. */
    @Test
    void thePageHasContentsTheCautionsItNeedsAndDemoMarkedFigures() throws IOException {
        Document doc = Jsoup.parse(first.resolve("report.html").toFile(), "UTF-8");
        List<String> contents = doc.select("nav li a").eachText();
        assertEquals(doc.select("h2").eachText(), contents, "a link to every section");
        for (Element a : doc.select("nav li a")) {
            assertEquals(1, doc.select(a.attr("href")).size(), "the link " + a.attr("href") + " has its section");
        }
        String cautions = doc.select("div.caution").text();
        assertTrue(cautions.contains("isotropic"), "the demo converts shear to tensile: the isotropy caution is stated");
        assertTrue(cautions.contains("Fit intervals treat the points of all replicates"), cautions);
        for (Element f : doc.select("figure svg")) {
            assertTrue(f.text().contains("Invented demo data"), "every figure of demo data says so");
        }
    }

    /** Every number a person reads in the workbook has a display format (the full value stays in the cell). */
    @Test
    void everyNumberInTheWorkbookHasADisplayFormat() throws IOException {
        try (InputStream in = Files.newInputStream(first.resolve("report.xlsx")); Workbook wb = WorkbookFactory.create(in)) {
            List<String> general = new java.util.ArrayList<>();
            for (org.apache.poi.ss.usermodel.Sheet sheet : wb) {
                for (org.apache.poi.ss.usermodel.Row row : sheet) {
                    for (org.apache.poi.ss.usermodel.Cell cell : row) {
                        if (cell.getCellType() == org.apache.poi.ss.usermodel.CellType.NUMERIC
                                && cell.getCellStyle().getDataFormatString().equals("General")) {
                            general.add(sheet.getSheetName() + "!" + cell.getAddress() + " = " + cell.getNumericCellValue());
                        }
                    }
                }
            }
            assertEquals(List.of(), general.stream().limit(20).toList(), general.size() + " numbers without a display format");
        }
    }
    /**
     * Parameters, their errors and intervals read with four significant figures, plainly between
     * 0.0001 and 10,000 and in powers of ten outside — never "9.72734137542975" — and the shown
     * value is the cell's value rounded (the cell keeps every digit).
     */
    @Test
    void parametersShowFourSignificantFigures() throws IOException {
        try (InputStream in = Files.newInputStream(first.resolve("report.xlsx")); Workbook wb = WorkbookFactory.create(in)) {
            org.apache.poi.ss.usermodel.Sheet sheet = wb.getSheet("Model fits");
            org.apache.poi.ss.usermodel.DataFormatter shown = new org.apache.poi.ss.usermodel.DataFormatter(java.util.Locale.ROOT);
            List<Integer> columns = new java.util.ArrayList<>();
            for (org.apache.poi.ss.usermodel.Cell h : sheet.getRow(0)) {
                String name = h.getStringCellValue();
                if (name.startsWith("value") || name.startsWith("standard error") || name.startsWith("95 % CI")) {
                    columns.add(h.getColumnIndex());
                }
            }
            assertEquals(4, columns.size(), "value, standard error and the two interval ends");
            int checked = 0;
            boolean plain = false;
            boolean powers = false;
            for (org.apache.poi.ss.usermodel.Row row : sheet) {
                for (int c : columns) {
                    org.apache.poi.ss.usermodel.Cell cell = row.getCell(c);
                    if (row.getRowNum() == 0 || cell == null || cell.getCellType() != org.apache.poi.ss.usermodel.CellType.NUMERIC) {
                        continue;
                    }
                    double v = cell.getNumericCellValue();
                    String text = shown.formatCellValue(cell);
                    String mantissa = text.replaceFirst("[eE].*$", "").replace("-", "").replace(".", "").replaceFirst("^0+", "");
                    assertTrue(mantissa.length() <= 4 || (!text.contains(".") && !text.contains("E")),
                            "more than four significant figures shown: " + text + " for " + v);
                    double back = Double.parseDouble(text);
                    assertEquals(v, back, Math.abs(v) * 5.1e-4 + 1e-300, text + " is not " + v + " rounded");
                    plain |= !text.contains("E") && v != 0 && Math.abs(v) < 1e4;
                    powers |= text.contains("E");
                    checked++;
                }
            }
            assertTrue(checked > 100 && plain && powers, checked + " values; plain and powers of ten both seen");
        }
    }

    /** The Spectra sheet: H(τ) ≥ 0 inside its band for every sample with enough frequencies, each summarised in words below. */
    @Test
    void spectraSheetHoldsNonNegativeSpectraInsideTheirBands() throws IOException {
        try (InputStream in = Files.newInputStream(first.resolve("report.xlsx")); Workbook wb = WorkbookFactory.create(in)) {
            org.apache.poi.ss.usermodel.Sheet sheet = wb.getSheet("Spectra");
            java.util.Set<String> samples = new java.util.TreeSet<>();
            java.util.Set<String> described = new java.util.TreeSet<>();
            for (org.apache.poi.ss.usermodel.Row row : sheet) {
                if (row.getRowNum() == 0 || row.getCell(0) == null) {
                    continue;
                }
                if (row.getCell(2) != null && row.getCell(2).getCellType() == org.apache.poi.ss.usermodel.CellType.NUMERIC) {
                    double h = row.getCell(2).getNumericCellValue();
                    assertTrue(h >= 0 && row.getCell(3).getNumericCellValue() <= h + 1e-9 && h <= row.getCell(4).getNumericCellValue() + 1e-9,
                            "row " + row.getRowNum());
                    samples.add(row.getCell(0).getStringCellValue());
                } else {
                    String text = row.getCell(0).getStringCellValue();
                    described.add(text.substring(0, Math.max(0, text.indexOf(": smoothing"))));
                }
            }
            assertTrue(samples.contains("gelatin-10pct") && !samples.contains("alkyd-unaged-raw"),
                    "sweeps with enough frequencies have spectra, the five-frequency raw sample not: " + samples);
            assertEquals(samples, described, "every spectrum is summarised in words under the table");
        }
    }
}
