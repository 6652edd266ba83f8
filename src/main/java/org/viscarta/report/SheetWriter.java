package org.viscarta.report;

import java.io.ByteArrayInputStream;
import java.io.File;
import java.io.FileInputStream;
import java.io.FileOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.SequenceInputStream;
import java.io.Writer;
import java.util.zip.Inflater;
import java.util.zip.InflaterInputStream;
import org.apache.poi.xssf.streaming.SheetDataWriter;

/**
 * The streamed sheets' XML writer: POI's own ({@link SheetDataWriter}), with two changes.
 * <ul>
 * <li>Its characters are encoded without a lock. POI writes a sheet attribute by attribute, a few
 * characters at a time, into a {@link java.io.BufferedWriter}, which takes its lock on every call;
 * on a 330,000-row sheet those calls were about a third of the time spent writing rows. One sheet
 * is written by one thread at a time, so {@link org.viscarta.io.Utf8Writer} encodes them straight
 * into bytes instead (the same bytes as the JDK's UTF-8 writer, without its slow path for text
 * that is not all ASCII).</li>
 * <li>Its temporary file holds the rows already compressed, as a raw Deflate part
 * ({@link DeflatedPart}): by the thread that writes the rows, while it writes them, so that the
 * workbook's container is assembled from compressed parts instead of compressing hundreds of
 * megabytes of XML on one thread at the end (and the temporary file is a sixth of the size).</li>
 * <li>Its cells are written without the objects POI makes for each (a cell reference, its text
 * built in a StringBuilder, a stream of code points for every text, the style number's text): a
 * third of the allocation of a large sheet, which with several sheets written side by side kept the
 * collector busy and the heap growing. Cells of kinds the workbook does not write (formulas,
 * errors, shared strings) and text that needs escaping go through POI's own code.</li>
 * <li>A cell that follows the one before it in its row is written without its reference
 * ({@code r="B7"}, optional in ECMA-376's schema, Part 1, 18.3.1.4 (section number from memory); readers
 * place a cell without one after the cell before it in its row), and a number without its type ({@code t="n"}, the default); a cell after a gap keeps its
 * reference. Otherwise the XML is POI's, character for character ({@code SheetWriterTest}). Every
 * cell's own reference, counting up by one, was about a fifth of a large sheet's XML and defeated
 * the compressor's matches: without them the 10,000-sample campaign's largest sheet compresses in
 * about 40 % less time, to 40 % fewer bytes. LibreOffice 7.4 read the demo workbook's 21 sheets
 * written this way exactly as before; POI's readers place such cells the same way.</li>
 * </ul>
 */
final class SheetWriter extends SheetDataWriter {

    /** Column letters of the first columns (A, B, … AZ, …), made once. */
    private static final String[] LETTERS = new String[128];

    static {
        for (int i = 0; i < LETTERS.length; i++) {
            LETTERS[i] = org.apache.poi.ss.util.CellReference.convertNumToColString(i);
        }
    }

    /** Style numbers as text, made once each per sheet. */
    private final String[] styleNumbers = new String[256];
    /** The row being written, as its number in the sheet (from 1). */
    private String rowNumber = "";
    /** The column of the row's last cell written (−1 before its first). */
    private int previousColumn = -1;

    /**
     * The compressed rows. Set while the superclass's constructor opens the file, so it has no
     * initialiser of its own (one would run after that constructor and clear it).
     */
    private DeflatedPart part;

    SheetWriter() throws IOException {
        super();
    }

    @Override
    public Writer createWriter(File fd) throws IOException {
        FileOutputStream file = new FileOutputStream(fd);
        try {
            return new org.viscarta.io.Utf8Writer(decorateOutputStream(file));
        } catch (RuntimeException e) {
            file.close();
            throw e;
        }
    }

    @Override
    protected OutputStream decorateOutputStream(FileOutputStream fos) {
        part = new DeflatedPart(new java.io.BufferedOutputStream(fos, 1 << 16));
        return part;
    }

    /** The rows' XML, read back from the compressed part (POI's own way of reading a sheet). */
    @Override
    protected InputStream decorateInputStream(FileInputStream fis) {
        return new InflaterInputStream(new SequenceInputStream(fis, new ByteArrayInputStream(DeflatedPart.EMPTY_FINAL_BLOCK)),
                new Inflater(true), 1 << 16);
    }

    @Override
    public void writeRow(int rownum, org.apache.poi.xssf.streaming.SXSSFRow row) throws IOException {
        rowNumber = Integer.toString(rownum + 1);
        previousColumn = -1;
        super.writeRow(rownum, row);
    }

    /**
     * A cell as POI writes it ({@code <c r="B7" s="3" t="n"><v>…</v></c>}, a blank one as
     * {@code <c r="B7" s="3"></c>}, text inline as {@code <is><t>…</t></is>}), without the
     * reference when the cell follows the one before it and without a number's type (a test compares
     * the XML with POI's own writer's, those two differences aside).
     */
    @Override
    public void writeCell(int columnIndex, org.apache.poi.ss.usermodel.Cell cell) throws IOException {
        if (cell == null) {
            return;
        }
        org.apache.poi.ss.usermodel.CellType type = cell.getCellType();
        boolean next = columnIndex == previousColumn + 1;
        previousColumn = columnIndex;
        if (type != org.apache.poi.ss.usermodel.CellType.BLANK && type != org.apache.poi.ss.usermodel.CellType.NUMERIC
                && type != org.apache.poi.ss.usermodel.CellType.STRING && type != org.apache.poi.ss.usermodel.CellType.BOOLEAN) {
            super.writeCell(columnIndex, cell);
            return;
        }
        Writer out = _out;
        if (next) {
            out.write("<c");
        } else {
            out.write("<c r=\"");
            out.write(columnIndex < LETTERS.length ? LETTERS[columnIndex] : org.apache.poi.ss.util.CellReference.convertNumToColString(columnIndex));
            out.write(rowNumber);
            out.write('"');
        }
        int style = cell.getCellStyle().getIndex() & 0xFFFF;
        if (style != 0) {
            out.write(" s=\"");
            out.write(styleNumber(style));
            out.write('"');
        }
        switch (type) {
            case BLANK -> out.write('>');
            case NUMERIC -> {
                out.write("><v>");
                out.write(Double.toString(cell.getNumericCellValue()));
                out.write("</v>");
            }
            case STRING -> {
                String text = cell.getStringCellValue();
                out.write(" t=\"inlineStr\"><is><t");
                if (!text.isEmpty() && (Character.isWhitespace(text.charAt(0)) || Character.isWhitespace(text.charAt(text.length() - 1)))) {
                    out.write(" xml:space=\"preserve\"");
                }
                out.write('>');
                if (plain(text)) {
                    out.write(text);
                } else {
                    outputEscapedString(text);
                }
                out.write("</t></is>");
            }
            default -> { // BOOLEAN
                out.write(" t=\"b\"><v>");
                out.write(cell.getBooleanCellValue() ? "1" : "0");
                out.write("</v>");
            }
        }
        out.write("</c>");
    }

    private String styleNumber(int style) {
        if (style >= styleNumbers.length) {
            return Integer.toString(style);
        }
        String s = styleNumbers[style];
        if (s == null) {
            s = Integer.toString(style);
            styleNumbers[style] = s;
        }
        return s;
    }

    /** Printable ASCII without the characters XML escapes: POI's escaping leaves such text as it is. */
    static boolean plain(String text) {
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            if (c < 0x20 || c > 0x7E || c == '<' || c == '>' || c == '&' || c == '"') {
                return false;
            }
        }
        return true;
    }

    /** The compressed rows, complete once the writer is closed. */
    DeflatedPart part() {
        return part;
    }

    /** The temporary file that holds them. */
    File file() {
        return getTempFile();
    }
}
