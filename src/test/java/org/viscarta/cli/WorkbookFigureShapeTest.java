package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.file.Files;
import org.apache.poi.util.Units;
import org.apache.poi.xssf.usermodel.XSSFClientAnchor;
import org.apache.poi.xssf.usermodel.XSSFDrawing;
import org.apache.poi.xssf.usermodel.XSSFPicture;
import org.apache.poi.xssf.usermodel.XSSFShape;
import org.apache.poi.xssf.usermodel.XSSFSheet;
import org.apache.poi.xssf.usermodel.XSSFWorkbook;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * The demo workbook's figures keep their shape: the rectangle each picture's anchor spans (columns
 * at the widths the sheet gives them, as Excel counts them, rows at the sheet's stated default
 * height, plus the anchor's offsets) has the width-to-height ratio of its PNG. The anchors spanned
 * whole columns and rows before: nine columns of twelve characters (601 points) by 21 rows (315
 * points) for a 468 × 302-point figure, 23 % too wide, and in LibreOffice, whose default row is
 * shorter, squeezed further.
 */
@Tag("regression")
class WorkbookFigureShapeTest {

    @Test
    void everyFigureIsAnchoredAtTheShapeOfItsImage() throws IOException {
        int pictures = 0;
        try (InputStream in = Files.newInputStream(DemoReport.folder().resolve("report.xlsx"));
             XSSFWorkbook wb = new XSSFWorkbook(in)) {
            XSSFSheet sheet = wb.getSheet("Figures");
            double rowEmu = sheet.getDefaultRowHeightInPoints() * Units.EMU_PER_POINT;
            assertTrue(sheet.getCTWorksheet().getSheetFormatPr().getCustomHeight(),
                    "the default row height is stated as chosen, so that every program uses it");
            XSSFDrawing drawing = sheet.getDrawingPatriarch();
            for (XSSFShape shape : drawing.getShapes()) {
                XSSFPicture picture = (XSSFPicture) shape;
                XSSFClientAnchor a = picture.getClientAnchor();
                double width = a.getDx2() - (double) a.getDx1();
                for (int c = a.getCol1(); c < a.getCol2(); c++) {
                    width += Units.columnWidthToEMU(sheet.getColumnWidth(c));
                }
                double height = a.getDy2() - (double) a.getDy1() + (a.getRow2() - a.getRow1()) * rowEmu;
                // the PNG's size from its IHDR chunk: width and height, big-endian, at bytes 16 and 20
                ByteBuffer png = ByteBuffer.wrap(picture.getPictureData().getData());
                double imageRatio = png.getInt(16) / (double) png.getInt(20);
                assertEquals(imageRatio, width / height, 0.005 * imageRatio, "picture " + pictures + " at row " + a.getRow1());
                pictures++;
            }
        }
        assertEquals(73, pictures, "the demo report's figures");
    }
}
