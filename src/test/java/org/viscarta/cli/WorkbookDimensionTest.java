package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.Enumeration;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.zip.ZipEntry;
import java.util.zip.ZipFile;
import org.apache.poi.ss.util.CellRangeAddress;
import org.apache.poi.ss.util.CellReference;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * Every sheet of the demo workbook states its true extent in its {@code <dimension>} element (the
 * range a spreadsheet program or a reader in read-only mode may trust to know where the data end):
 * from A1 to the last row and the rightmost column that hold a cell. The tables' body rows bypass
 * POI's row objects, and POI derives the dimension from the rows it still holds; a first version
 * wrote "A1" for every table.
 */
@Tag("regression")
class WorkbookDimensionTest {

    private static final Pattern DIMENSION = Pattern.compile("<dimension ref=\"([A-Z0-9:]+)\"/>");
    private static final Pattern ROW = Pattern.compile("<row r=\"([0-9]+)\"[^>]*>(.*?)</row>", Pattern.DOTALL);
    /** A cell, with its reference when it has one (a cell without one follows the one before it in its row). */
    private static final Pattern CELL = Pattern.compile("<c(?: r=\"([A-Z]+)[0-9]+\")?[ >]");

    @Test
    void everySheetsDimensionIsTheRangeItsCellsSpan() throws IOException {
        int sheets = 0;
        try (ZipFile zip = new ZipFile(DemoReport.folder().resolve("report.xlsx").toFile())) {
            Enumeration<? extends ZipEntry> entries = zip.entries();
            while (entries.hasMoreElements()) {
                ZipEntry e = entries.nextElement();
                if (!e.getName().matches("xl/worksheets/sheet[0-9]+\\.xml")) {
                    continue;
                }
                String xml = new String(zip.getInputStream(e).readAllBytes(), StandardCharsets.UTF_8);
                Matcher d = DIMENSION.matcher(xml);
                assertTrue(d.find(), e.getName() + " has no dimension");
                int lastRow = -1;
                int lastColumn = -1;
                Matcher r = ROW.matcher(xml);
                while (r.find()) {
                    Matcher c = CELL.matcher(r.group(2));
                    int column = -1;
                    while (c.find()) {
                        column = c.group(1) != null ? CellReference.convertColStringToIndex(c.group(1)) : column + 1;
                        lastRow = Math.max(lastRow, Integer.parseInt(r.group(1)) - 1);
                        lastColumn = Math.max(lastColumn, column);
                    }
                }
                if (lastRow < 0) {
                    continue; // a sheet of pictures only
                }
                CellRangeAddress stated = CellRangeAddress.valueOf(d.group(1));
                assertEquals(0, stated.getFirstRow(), e.getName());
                assertEquals(0, stated.getFirstColumn(), e.getName());
                assertEquals(lastRow, stated.getLastRow(), e.getName() + ": " + d.group(1));
                assertEquals(lastColumn, stated.getLastColumn(), e.getName() + ": " + d.group(1));
                sheets++;
            }
        }
        assertTrue(sheets >= 10, sheets + " sheets checked");
    }
}
