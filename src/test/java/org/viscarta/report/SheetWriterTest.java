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
 * character for character, for every kind of cell and text: POI's own SheetDataWriter is the
 * reference.
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
            assertEquals(poi, ours);
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
