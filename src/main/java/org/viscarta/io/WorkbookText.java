package org.viscarta.io;

import java.io.BufferedInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.Reader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;
import org.apache.poi.openxml4j.opc.OPCPackage;
import org.apache.poi.openxml4j.opc.PackageAccess;
import org.apache.poi.poifs.filesystem.FileMagic;
import org.apache.poi.ss.usermodel.Cell;
import org.apache.poi.ss.usermodel.CellType;
import org.apache.poi.ss.usermodel.DataFormatter;
import org.apache.poi.ss.usermodel.DateUtil;
import org.apache.poi.ss.usermodel.Row;
import org.apache.poi.ss.usermodel.Sheet;
import org.apache.poi.ss.usermodel.Workbook;
import org.apache.poi.ss.usermodel.WorkbookFactory;
import org.apache.poi.ss.util.CellReference;
import org.apache.poi.util.XMLHelper;
import org.apache.poi.xssf.eventusermodel.ReadOnlySharedStringsTable;
import org.apache.poi.xssf.eventusermodel.XSSFReader;
import org.apache.poi.xssf.eventusermodel.XSSFSheetXMLHandler;
import org.apache.poi.xssf.usermodel.XSSFComment;
import org.xml.sax.InputSource;
import org.xml.sax.XMLReader;

/**
 * The sheets of a workbook as text, one line per row (row r of the sheet is line r + 1), cells
 * separated by tabs, so that a sheet goes through the same table reader as a text file. An XLSX
 * workbook is read with POI's streaming (event) reader: the sheet's XML is parsed on a helper
 * thread and handed over in chunks of text, so memory does not grow with the sheet. An XLS
 * workbook (at most 65,536 rows a sheet) is read whole with POI's object model.
 *
 * <p>Cell texts: numbers as written (integral values without ".0"), formulas as their cached
 * results, a date-formatted number as "a date cell (…)" so that it is refused as a number, tabs
 * and line breaks inside a cell as spaces. A row whose first cell starts with '#' is joined with
 * spaces (a metadata line).
 */
final class WorkbookText {

    /** Receives each sheet that holds data, with its text. */
    interface SheetVisitor {
        void sheet(String name, Reader text) throws IOException;
    }

    private WorkbookText() {
    }

    /**
     * Visits every sheet with data, in workbook order.
     *
     * @throws IOException when the file cannot be read as a workbook (not a workbook, damaged);
     *                     exceptions of the visitor pass through unchanged
     */
    static void read(Path path, SheetVisitor visitor) throws IOException {
        FileMagic magic;
        try (InputStream in = FileMagic.prepareToCheckMagic(new BufferedInputStream(Files.newInputStream(path)))) {
            magic = FileMagic.valueOf(in);
        }
        if (magic == FileMagic.OOXML) {
            readOoxml(path, visitor);
        } else if (magic == FileMagic.OLE2) {
            readWhole(path, visitor);
        } else {
            throw new IOException("the file is not an XLSX or XLS workbook");
        }
    }

    private static void readOoxml(Path path, SheetVisitor visitor) throws IOException {
        try (OPCPackage pkg = OPCPackage.open(path.toFile(), PackageAccess.READ)) {
            XSSFReader xr = new XSSFReader(pkg);
            ReadOnlySharedStringsTable strings = new ReadOnlySharedStringsTable(pkg, false);
            org.apache.poi.xssf.model.StylesTable styles = xr.getStylesTable();
            XSSFReader.SheetIterator sheets = xr.getSheetIterator();
            while (sheets.hasNext()) {
                InputStream xml = sheets.next();
                String name = sheets.getSheetName();
                try (SheetStream text = new SheetStream(xml, out -> {
                    XMLReader parser = XMLHelper.newXMLReader();
                    parser.setContentHandler(new XSSFSheetXMLHandler(styles, null, strings, out, new RawNumbers(), false));
                    parser.parse(new InputSource(xml));
                })) {
                    if (text.hasData()) {
                        visitor.sheet(name, text);
                    }
                }
            }
        } catch (org.apache.poi.openxml4j.exceptions.OpenXML4JException | org.xml.sax.SAXException e) {
            throw new IOException(e.getMessage(), e);
        }
    }

    private static void readWhole(Path path, SheetVisitor visitor) throws IOException {
        try (Workbook wb = WorkbookFactory.create(path.toFile(), null, true)) {
            DataFormatter fmt = new DataFormatter(Locale.ROOT);
            for (Sheet sheet : wb) {
                StringBuilder text = new StringBuilder();
                Rows rows = new Rows(text::append);
                for (Row row : sheet) {
                    rows.startRow(row.getRowNum());
                    for (Cell cell : row) {
                        rows.cell(cell.getAddress().formatAsString(), cellText(cell, fmt), null);
                    }
                    rows.endRow(row.getRowNum());
                }
                rows.flush();
                if (rows.any) {
                    visitor.sheet(sheet.getSheetName(), new java.io.StringReader(text.toString()));
                }
            }
        }
    }

    private static String cellText(Cell cell, DataFormatter fmt) {
        CellType type = cell.getCellType();
        if (type == CellType.FORMULA) {
            type = cell.getCachedFormulaResultType();
        }
        switch (type) {
            case NUMERIC:
                if (DateUtil.isCellDateFormatted(cell)) {
                    return dateCell(fmt.formatCellValue(cell));
                }
                return number(cell.getNumericCellValue());
            case STRING:
                return cell.getStringCellValue();
            case BOOLEAN:
                return Boolean.toString(cell.getBooleanCellValue());
            case ERROR:
                return "#ERROR";
            default:
                return fmt.formatCellValue(cell);
        }
    }

    private static String dateCell(String shown) {
        return "a date cell (" + shown.strip() + ")";
    }

    /** A number as the table reader expects it: integral values without ".0", others in full precision. */
    static String number(double v) {
        return v == Math.rint(v) && Math.abs(v) < 1e15 ? Long.toString((long) v) : Double.toString(v);
    }

    /**
     * The event reader formats numbers by their cell style; this keeps every digit instead (a
     * "0.00" style must not round 0.125 Hz) and marks date-formatted cells.
     */
    private static final class RawNumbers extends DataFormatter {
        /** Whether each format (by index; fixed within a workbook) shows dates: the test is a regular expression. */
        private final java.util.Map<Integer, Boolean> dates = new java.util.HashMap<>();

        RawNumbers() {
            super(Locale.ROOT);
        }

        @Override
        public String formatRawCellContents(double value, int formatIndex, String formatString) {
            boolean date = dates.computeIfAbsent(formatIndex, i -> DateUtil.isADateFormat(formatIndex, formatString));
            if (date && DateUtil.isValidExcelDate(value)) {
                return dateCell(super.formatRawCellContents(value, formatIndex, formatString));
            }
            return number(value);
        }
    }

    /** Turns row and cell events into lines of text, padding skipped rows and cells. */
    private static final class Rows implements XSSFSheetXMLHandler.SheetContentsHandler {
        private final java.util.function.Consumer<CharSequence> out;
        private final StringBuilder pending = new StringBuilder();
        private final List<String> cells = new ArrayList<>();
        private int nextRow;
        boolean any;

        Rows(java.util.function.Consumer<CharSequence> out) {
            this.out = out;
        }

        @Override
        public void startRow(int rowNum) {
            while (nextRow < rowNum) {
                pending.append('\n');
                nextRow++;
            }
            cells.clear();
        }

        @Override
        public void cell(String ref, String value, XSSFComment comment) {
            int col = ref == null ? cells.size() : column(ref);
            while (cells.size() < col) {
                cells.add("");
            }
            cells.add(value == null ? "" : value.replace('\t', ' ').replace('\r', ' ').replace('\n', ' ').strip());
        }

        /** The 0-based column of a cell reference such as "AB12". */
        private static int column(String ref) {
            int letters = 0;
            while (letters < ref.length() && Character.isLetter(ref.charAt(letters))) {
                letters++;
            }
            return CellReference.convertColStringToIndex(ref.substring(0, letters));
        }

        @Override
        public void endRow(int rowNum) {
            int n = cells.size();
            while (n > 0 && cells.get(n - 1).isEmpty()) {
                n--;
            }
            if (n > 0) {
                List<String> used = cells.subList(0, n);
                pending.append(used.get(0).startsWith("#") ? String.join(" ", used) : String.join("\t", used));
            }
            pending.append('\n');
            nextRow = rowNum + 1;
            if (n > 0 && !any) {
                any = true;
                flush(); // the first row with data is handed over at once: the sheet is not empty
            } else if (pending.length() >= 1 << 16) {
                flush();
            }
        }

        void flush() {
            if (any && pending.length() > 0) {
                out.accept(pending.toString());
            }
            pending.setLength(0);
        }
    }

    /** The parsing work of one sheet, run on the helper thread. */
    private interface Parse {
        void run(Rows rows) throws Exception;
    }

    /**
     * A sheet's text as a {@link Reader}, filled by a helper thread that parses the sheet's XML.
     * At most a few chunks wait in the queue, so a slow reader holds back the parser; closing the
     * reader early (the table reader stopped at an error) stops the parser.
     */
    private static final class SheetStream extends Reader {
        private static final Object END = new Object();
        private final BlockingQueue<Object> queue = new ArrayBlockingQueue<>(4);
        private final Thread worker;
        private final InputStream xml;
        private volatile boolean cancelled;
        private String chunk = "";
        private int pos;
        private boolean ended;

        SheetStream(InputStream xml, Parse parse) {
            this.xml = xml;
            this.worker = new Thread(() -> {
                Rows rows = new Rows(this::hand);
                try {
                    parse.run(rows);
                    rows.flush();
                    hand(END);
                } catch (Cancelled c) {
                    // the reader was closed early: nobody waits for the rest
                } catch (Exception | Error e) {
                    if (!cancelled) {
                        try {
                            hand(e);
                        } catch (Cancelled c) {
                            // closed meanwhile
                        }
                    }
                }
            }, "viscarta-sheet-reader");
            worker.setDaemon(true);
            worker.start();
        }

        private void hand(Object item) {
            try {
                queue.put(item);
            } catch (InterruptedException e) {
                throw new Cancelled();
            }
            if (cancelled) {
                throw new Cancelled();
            }
        }

        /** Whether the sheet holds any cell with text; waits for the first row with data or the end. */
        boolean hasData() throws IOException {
            return next();
        }

        private boolean next() throws IOException {
            if (ended) {
                return false;
            }
            Object item;
            try {
                item = queue.take();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new java.io.InterruptedIOException("interrupted while reading a sheet");
            }
            if (item == END) {
                ended = true;
                return false;
            }
            if (item instanceof Throwable t) {
                ended = true;
                throw new IOException(t.getMessage() == null ? t.getClass().getSimpleName() : t.getMessage(), t);
            }
            chunk = item.toString();
            pos = 0;
            return true;
        }

        @Override
        public int read(char[] buf, int off, int len) throws IOException {
            if (len == 0) {
                return 0;
            }
            while (pos >= chunk.length()) {
                if (!next()) {
                    return -1;
                }
            }
            int n = Math.min(len, chunk.length() - pos);
            chunk.getChars(pos, pos + n, buf, off);
            pos += n;
            return n;
        }

        @Override
        public void close() throws IOException {
            cancelled = true;
            queue.clear();
            worker.interrupt();
            try {
                worker.join(10_000);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
            xml.close();
        }
    }

    /** Stops the helper thread when the reader was closed early. */
    private static final class Cancelled extends RuntimeException {
        private static final long serialVersionUID = 1L;

        Cancelled() {
            super(null, null, false, false);
        }
    }
}
