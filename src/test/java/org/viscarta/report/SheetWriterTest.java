package org.viscarta.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import org.apache.poi.ss.usermodel.CellStyle;
import org.apache.poi.ss.usermodel.FormulaError;
import org.apache.poi.xssf.streaming.SXSSFRow;
import org.apache.poi.xssf.streaming.SXSSFSheet;
import org.apache.poi.xssf.streaming.SXSSFWorkbook;
import org.apache.poi.xssf.streaming.SheetDataWriter;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * The sheets' writer writes cells itself instead of through POI's code; its XML must be POI's,
 * character for character, for every kind of cell and text, but for two things it leaves out: the
 * reference of a cell that follows the one before it in its row, and a number's type ({@code t="n"},
 * the default). POI's own SheetDataWriter is the reference, with those two taken out by
 * {@link #withoutImpliedAttributes}; a second test reads a workbook written this way back with
 * POI's reader.
 */
@Tag("regression")
class SheetWriterTest {

    private static final String[] TEXTS = {"plain", "Model fits", " leading space", "trailing space ", "\ttab first",
        "a <tag> & \"quotes\" 'apostrophe'", "line\nbreak\r\nand return", "tan δ at 1 Hz; E′ and E″ [MPa] – 20 °C ± 0.5",
        "no\u00A0break", "emoji \uD83D\uDE00 pair", "control \u0001\u001F chars", "lone \uD800 surrogate", "\uFFFE\uFFFF ends", ""};

    /** POI's writer, its temporary file reachable for deleting. */
    private static final class PoiWriter extends SheetDataWriter {
        PoiWriter() throws IOException {
            super();
        }

        java.io.File file() {
            return getTempFile();
        }
    }

    private static String written(SheetDataWriter w, java.io.File file, SXSSFRow[] rows) throws IOException {
        for (int i = 0; i < rows.length; i++) {
            w.writeRow(rows[i].getRowNum(), rows[i]);
        }
        w.close();
        try (InputStream in = w.getWorksheetXMLInputStream()) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } finally {
            java.nio.file.Files.deleteIfExists(file.toPath());
        }
    }

    @Test
    void everyKindOfCellIsWrittenAsPoiWritesIt() throws IOException {
        try (SXSSFWorkbook wb = new SXSSFWorkbook(-1)) { // keep every row in memory: the writers here are the test's
            SXSSFSheet sheet = wb.createSheet("cells");
            CellStyle[] styles = new CellStyle[300];
            for (int i = 0; i < styles.length; i++) {
                styles[i] = wb.createCellStyle(); // indices past the writer's table of style numbers too
            }
            double[] numbers = {0, -0.0, 1, -1.5, 0.1, 1e-300, 1.7976931348623157e308, Double.MIN_VALUE, 123456789.125, 2.0 / 3,
                Double.NaN, Double.POSITIVE_INFINITY};
            SXSSFRow[] rows = new SXSSFRow[6];
            int[] rowNumbers = {0, 1, 8, 99, 10_000, 1_048_575};
            for (int r = 0; r < rows.length; r++) {
                SXSSFRow row = sheet.createRow(rowNumbers[r]);
                rows[r] = row;
                int c = 0;
                for (double v : numbers) {
                    row.createCell(c++).setCellValue(v);
                }
                for (String t : TEXTS) {
                    row.createCell(c++).setCellValue(t);
                }
                row.createCell(c++).setCellValue(true);
                row.createCell(c++).setCellValue(false);
                row.createCell(c++); // blank
                row.createCell(c++).setCellErrorValue(FormulaError.DIV0.getCode());
                row.createCell(c++).setCellFormula("A1+1");
                for (int k = 0; k < 8; k++) {
                    org.apache.poi.ss.usermodel.Cell styled = row.createCell(c++);
                    styled.setCellStyle(styles[(r * 61 + k * 37) % styles.length]);
                    if (k % 3 == 1) {
                        styled.setCellValue(k * 1.25);
                    } else if (k % 3 == 2) {
                        styled.setCellValue("styled " + k);
                    }
                }
                row.createCell(700 + r).setCellValue("far column"); // past the table of column letters (ZZ and beyond)
                row.createCell(16_383).setCellValue(r); // the last column, XFD
            }
            PoiWriter reference = new PoiWriter();
            String poi = written(reference, reference.file(), rows);
            SheetWriter writer = new SheetWriter();
            String ours = written(writer, writer.file(), rows);
            assertTrue(poi.contains("<c r=\"XFD1048576\""), "the rows were written: " + poi.length() + " characters");
            String expected = withoutImpliedAttributes(poi);
            assertTrue(expected.length() < poi.length() - 1000, "references left out");
            assertTrue(expected.contains("<c r=\"ZY1\""), "a cell after a gap keeps its reference");
            assertEquals(expected, ours);
        }
    }

    /**
     * POI's sheet XML without what the writer leaves out: in each row, the reference of a cell whose
     * column follows the previous cell's (unless POI writes it itself: errors, formulas), and
     * {@code t="n"} of numbers.
     */
    static String withoutImpliedAttributes(String xml) {
        java.util.regex.Matcher row = java.util.regex.Pattern.compile("(<row [^>]*>)(.*?)(</row>)", java.util.regex.Pattern.DOTALL)
                .matcher(xml);
        StringBuilder out = new StringBuilder();
        while (row.find()) {
            java.util.regex.Matcher cell = java.util.regex.Pattern.compile("<c r=\"([A-Z]+)\\d+\"([^>]*)>(.*?)</c>",
                    java.util.regex.Pattern.DOTALL).matcher(row.group(2));
            StringBuilder cells = new StringBuilder();
            int previous = -1;
            while (cell.find()) {
                int column = org.apache.poi.ss.util.CellReference.convertColStringToIndex(cell.group(1));
                String attributes = cell.group(2);
                boolean poiWrites = attributes.contains("t=\"e\"") || cell.group(3).contains("<f>");
                String head = column == previous + 1 && !poiWrites ? "<c" : "<c r=\"" + cell.group(0).substring(6, cell.group(0).indexOf('"', 6)) + "\"";
                if (!poiWrites) {
                    attributes = attributes.replace(" t=\"n\"", "");
                }
                previous = column;
                cell.appendReplacement(cells, java.util.regex.Matcher.quoteReplacement(head + attributes + ">" + cell.group(3) + "</c>"));
            }
            cell.appendTail(cells);
            row.appendReplacement(out, java.util.regex.Matcher.quoteReplacement(row.group(1) + cells + row.group(3)));
        }
        row.appendTail(out);
        return out.toString();
    }

    /** A workbook whose cells lack references reads back with POI's reader at the right places, gaps and all. */
    @Test
    void poiReadsTheCellsBackWhereTheyWereWritten() throws IOException, org.apache.poi.openxml4j.exceptions.InvalidFormatException {
        java.nio.file.Path file = java.nio.file.Files.createTempFile("sheetwriter", ".xlsx");
        try {
            try (SXSSFWorkbook wb = new SXSSFWorkbook(null, 10, true) {
                @Override
                protected SheetDataWriter createSheetDataWriter() throws IOException {
                    return new SheetWriter();
                }
            }) {
                SXSSFSheet sheet = wb.createSheet("cells");
                for (int r = 0; r < 50; r++) {
                    SXSSFRow row = sheet.createRow(r * 2); // every other row
                    for (int c = 0; c < 12; c++) {
                        if ((r + c) % 5 == 3) {
                            continue; // a gap
                        }
                        if (c % 3 == 0) {
                            row.createCell(c).setCellValue("r" + r + "c" + c);
                        } else {
                            row.createCell(c).setCellValue(r * 100 + c + 0.5);
                        }
                    }
                }
                try (java.io.OutputStream out = java.nio.file.Files.newOutputStream(file)) {
                    wb.write(out);
                }
                wb.dispose();
            }
            try (org.apache.poi.xssf.usermodel.XSSFWorkbook back = new org.apache.poi.xssf.usermodel.XSSFWorkbook(file.toFile())) {
                org.apache.poi.ss.usermodel.Sheet sheet = back.getSheet("cells");
                for (int r = 0; r < 50; r++) {
                    org.apache.poi.ss.usermodel.Row row = sheet.getRow(r * 2);
                    for (int c = 0; c < 12; c++) {
                        org.apache.poi.ss.usermodel.Cell cell = row.getCell(c);
                        String where = "row " + (r * 2 + 1) + ", column " + (c + 1);
                        if ((r + c) % 5 == 3) {
                            assertEquals(null, cell, where);
                        } else if (c % 3 == 0) {
                            assertEquals("r" + r + "c" + c, cell.getStringCellValue(), where);
                        } else {
                            assertEquals(r * 100 + c + 0.5, cell.getNumericCellValue(), 0, where);
                        }
                    }
                }
            }
        } finally {
            java.nio.file.Files.deleteIfExists(file);
        }
    }

    @Test
    void plainTextIsPrintableAsciiWithoutWhatXmlEscapes() {
        assertTrue(SheetWriter.plain("Model fits (sample, model) 1.25e-3 [Pa]"));
        for (String t : new String[] {"a<b", "a>b", "a&b", "a\"b", "tab\t", "δ", "\u007F"}) {
            assertEquals(false, SheetWriter.plain(t), t);
        }
    }
}
