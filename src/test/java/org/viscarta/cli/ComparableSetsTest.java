package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.io.Reader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.apache.poi.ss.usermodel.CellType;
import org.apache.poi.ss.usermodel.Row;
import org.apache.poi.ss.usermodel.Sheet;
import org.apache.poi.ss.usermodel.Workbook;
import org.apache.poi.ss.usermodel.WorkbookFactory;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Regression: the damping ranking compares like with like only, and its tables read right. */
@Tag("regression")
class ComparableSetsTest {

    @TempDir
    Path dir;

    @Test
    void theDemoRankingNeverMixesTemperaturesOrBasesWithinASet() throws IOException {
        Path out = dir.resolve("rank.csv");
        CliRun r = CliRun.of("rank", "demo-data", "--basis", "tensile", "-o", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        List<CSVRecord> rows;
        try (Reader in = Files.newBufferedReader(out)) {
            rows = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).get().parse(in).getRecords();
        }
        Map<String, double[]> range = new HashMap<>();
        for (CSVRecord row : rows) {
            String set = row.get("set");
            if (row.get("sample").startsWith("acrylic-film-ts @")) {
                assertEquals("", row.get("rank"), "one temperature of a series is not ranked: " + row);
                continue;
            }
            if (set.isEmpty()) {
                continue;
            }
            double t = Double.parseDouble(row.get("temperature_c"));
            range.merge(set, new double[] {t, t}, (a, b) -> new double[] {Math.min(a[0], b[0]), Math.max(a[1], b[1])});
            assertTrue(set.contains("tensile"), set);
        }
        assertTrue(!range.isEmpty());
        range.forEach((set, tt) -> assertTrue(tt[1] - tt[0] <= 2, set + " spans " + tt[0] + "–" + tt[1] + " °C"));
        // letters read the conventional way: 'a' marks the highest-damping group, and each new letter appears in order down the ranking
        String seen = "";
        for (CSVRecord row : rows) {
            if (row.get("rank").isEmpty() || row.get("letters").equals("–")) {
                continue;
            }
            for (char c : row.get("letters").toCharArray()) {
                if (seen.indexOf(c) < 0) {
                    assertEquals((char) ('a' + seen.length()), c, "letters in ranking order, at " + row.get("sample"));
                    seen += c;
                }
            }
        }
        // the raw-signal films have one replicate each: they cannot be tested and say so
        CSVRecord raw = rows.stream().filter(x -> x.get("sample").equals("alkyd-unaged-raw")).findFirst().orElseThrow();
        assertEquals("–", raw.get("letters"));
        assertTrue(r.out().contains("cannot be tested"), r.out());
        // the terminal fits in 100 columns; p-values too small to matter read "< 0.0001"
        r.out().lines().forEach(l -> assertTrue(l.codePointCount(0, l.length()) <= 100, "wider than 100 columns: " + l));
        assertTrue(r.out().contains("p < 0.0001") && !r.out().matches("(?s).*p = [0-9.]+e-[0-9].*"), r.out());
    }

    @Test
    void groupTestsSitUnderTheirOwnHeadersAndPerSet() throws IOException {
        try (InputStream in = Files.newInputStream(DemoReport.folder().resolve("report.xlsx")); Workbook wb = WorkbookFactory.create(in)) {
            Sheet s = wb.getSheet("Group comparison");
            boolean found = false;
            for (Row row : s) {
                if (row.getCell(0) != null && row.getCell(0).getCellType() == CellType.STRING
                        && row.getCell(0).getStringCellValue().equals("test across groups")) {
                    assertEquals("statistic", row.getCell(1).getStringCellValue());
                    assertEquals("p [–]", row.getCell(4).getStringCellValue());
                    Row anova = s.getRow(row.getRowNum() + 1);
                    assertEquals("one-way ANOVA (F)", anova.getCell(0).getStringCellValue());
                    assertEquals(CellType.NUMERIC, anova.getCell(1).getCellType(), "F under 'statistic'");
                    double p = anova.getCell(4).getNumericCellValue();
                    assertTrue(p >= 0 && p <= 1, "a p-value under 'p': " + p);
                    found = true;
                }
            }
            assertTrue(found, "the demo's groups are tested");
            // sentences span the sheet's width, wrapped, so that they are not cut off; p-values read "< 0.0001" when tiny
            Row statement = null;
            for (Row row : s) {
                if (row.getCell(0) != null && row.getCell(0).getCellType() == CellType.STRING
                        && row.getCell(0).getStringCellValue().startsWith("Samples that share a letter")) {
                    statement = row;
                    break;
                }
            }
            assertTrue(statement != null, "the conclusions in words are there");
            assertTrue(statement.getCell(0).getCellStyle().getWrapText(), "wrapped");
            int at = statement.getRowNum();
            assertTrue(s.getMergedRegions().stream().anyMatch(m -> m.getFirstRow() == at && m.getFirstColumn() == 0
                    && m.getLastColumn() >= 6), "merged across the table's width");
            boolean pFormat = false;
            for (Row row : s) {
                if (row.getCell(4) != null && row.getCell(4).getCellType() == CellType.NUMERIC) {
                    pFormat |= row.getCell(4).getCellStyle().getDataFormatString().contains("< 0.0001");
                }
            }
            assertTrue(pFormat, "p-values have a display format that says '< 0.0001' below it");
            String all = cells(s);
            assertTrue(all.contains("23 °C, tensile"), "the comparable set is named");
        }
    }

    private static String cells(Sheet s) {
        StringBuilder sb = new StringBuilder();
        for (Row r : s) {
            r.forEach(c -> sb.append(c.getCellType() == CellType.STRING ? c.getStringCellValue() : "").append('\t'));
            sb.append('\n');
        }
        return sb.toString();
    }
}
