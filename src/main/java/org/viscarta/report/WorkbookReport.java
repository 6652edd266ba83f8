package org.viscarta.report;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Map;
import org.apache.poi.ss.usermodel.Cell;
import org.apache.poi.ss.usermodel.CellStyle;
import org.apache.poi.ss.usermodel.Font;
import org.apache.poi.ss.usermodel.Row;
import org.apache.poi.ss.usermodel.Sheet;
import org.apache.poi.ss.usermodel.Workbook;
import org.apache.poi.xssf.streaming.SXSSFWorkbook;
import org.viscarta.analysis.AnalysisResult;
import org.viscarta.analysis.Statements;
import org.viscarta.compare.DampingComparison;
import org.viscarta.compare.Matcher;
import org.viscarta.io.SweepFile;
import org.viscarta.sweep.Numbers;
import org.viscarta.table.Column;
import org.viscarta.table.Medium;
import org.viscarta.table.Style;
import org.viscarta.table.Table;
import org.viscarta.temperature.ShiftAnalysis;
import org.viscarta.temperature.ShiftFits;
import org.viscarta.temperature.TemperatureSeries;

/**
 * Writes the report workbook: Read me, Summary, Damping ranking, Group comparison, Reference
 * matches, Mimic ranking (with a target), Quality (when checked), Temperature series, Model fits, Derived quantities, Spectra,
 * Correlations, Data, Reference library, Figures and Provenance. The tables are drawn from their
 * declarations in {@link OutputTables}; numbers are numeric cells; every header carries its unit.
 * Streams rows (SXSSF) so that large campaigns fit in memory.
 */
public final class WorkbookReport {

    /** Columns of the Figures sheet, across which a figure's caption is wrapped (the figure, 6.5 inches wide, spans about seven). */
    private static final int FIGURE_COLUMNS = 9;
    /** The most rows a figure may span and still print on one landscape page. */
    private static final int FIGURE_ROWS_PER_PAGE = 30;

    /** Column widths of the Read me sheet, in characters. */
    private static final int LABEL_WIDTH = 34;
    private static final int TEXT_WIDTH = 100;

    /** Text columns at least this wide [characters] wrap, so that long notes stay within the printed page. */
    private static final int WRAPPED_WIDTH = 30;
    /** Above this many quality checks the Quality sheet lists only those that did not pass (and the amplitude sweeps). */
    static final int MAX_QUALITY_ROWS = 20_000;

    /** Said in a table's sheet when no library was given. */
    private static final String NO_LIBRARY = "(no reference library was given: pass --library DIR)";

    private WorkbookReport() {
    }

    /**
     * A streamed workbook (200 rows in memory per sheet) whose sheets are compressed at Deflate's
     * fastest level by the threads that write their rows ({@link SheetWriter}), and whose container
     * is assembled from those compressed parts: the sheets are large, repetitive XML, and the
     * fastest level costs a few tenths more bytes for a fraction of the time.
     */
    private static final class FastWorkbook extends SXSSFWorkbook {
        /** The sheets' writers in the order the sheets were made (a sheet's index is its writer's). */
        private List<SheetWriter> writers;

        FastWorkbook() {
            super(200);
        }

        /** The writer of the sheet made last. */
        SheetWriter lastWriter() {
            return writers.get(writers.size() - 1);
        }

        @Override
        protected org.apache.poi.xssf.streaming.SheetDataWriter createSheetDataWriter() throws IOException {
            if (writers == null) {
                writers = new java.util.ArrayList<>();
            }
            SheetWriter w = new SheetWriter();
            writers.add(w);
            return w;
        }

        /**
         * Commons Compress's own ZIP writer, not POI's streaming one (which keeps its own account of
         * the bytes written and would not count entries added already compressed); ZIP64 records
         * only where an entry or the container needs them.
         */
        @Override
        protected org.apache.commons.compress.archivers.zip.ZipArchiveOutputStream createArchiveOutputStream(OutputStream out) {
            org.apache.commons.compress.archivers.zip.ZipArchiveOutputStream z =
                    new org.apache.commons.compress.archivers.zip.ZipArchiveOutputStream(out);
            z.setUseZip64(org.apache.commons.compress.archivers.zip.Zip64Mode.AsNeeded);
            z.setLevel(java.util.zip.Deflater.BEST_SPEED);
            return z;
        }

        /**
         * As POI's own close, except that the in-memory package is let go without being saved: POI's
         * workbook keeps its package over a byte array and, on close, writes the whole package into
         * it again (about a quarter of a second for the demo's workbook), for nothing.
         */
        @Override
        public void close() throws IOException {
            if (writers != null) {
                for (SheetWriter w : writers) {
                    w.close();
                }
            }
            dispose();
            getXSSFWorkbook().getPackage().revert();
        }

        /**
         * As POI's own write, except that POI's template (every part but the sheets' rows) is
         * written without compression: {@link #injectData} reads it back at once and compresses what
         * it copies; POI compressed it at Deflate's default level, the figures' PNG among it, only
         * for that to be undone.
         */
        @Override
        public void write(OutputStream stream) throws IOException {
            flushSheets();
            java.io.File template = org.apache.poi.util.TempFile.createTempFile("viscarta-template", ".xlsx");
            try {
                try (org.apache.commons.compress.archivers.zip.ZipArchiveOutputStream zos =
                             new org.apache.commons.compress.archivers.zip.ZipArchiveOutputStream(template)) {
                    zos.setLevel(java.util.zip.Deflater.NO_COMPRESSION);
                    getXSSFWorkbook().write(zos);
                }
                try (org.apache.poi.openxml4j.util.ZipSecureFile zip = new org.apache.poi.openxml4j.util.ZipSecureFile(template);
                     org.apache.poi.openxml4j.util.ZipFileZipEntrySource source = new org.apache.poi.openxml4j.util.ZipFileZipEntrySource(zip)) {
                    injectData(source, stream);
                }
            } finally {
                java.nio.file.Files.deleteIfExists(template.toPath());
            }
        }

        /**
         * Writes the container: every part of POI's template as POI does, except that a sheet's
         * entry is its template up to the empty {@code <sheetData/>}, the rows already compressed,
         * and the rest of the template, joined as raw Deflate parts (the same bytes of XML that POI
         * would write, compressed once).
         */
        @Override
        protected void injectData(org.apache.poi.openxml4j.util.ZipEntrySource source, OutputStream out) throws IOException {
            org.apache.commons.compress.archivers.zip.ZipArchiveOutputStream zos = createArchiveOutputStream(out);
            try {
                java.util.Enumeration<? extends org.apache.commons.compress.archivers.zip.ZipArchiveEntry> en = source.getEntries();
                while (en.hasMoreElements()) {
                    org.apache.commons.compress.archivers.zip.ZipArchiveEntry ze = en.nextElement();
                    byte[] template;
                    try (java.io.InputStream is = source.getInputStream(ze)) {
                        if (is instanceof org.apache.poi.openxml4j.util.ZipArchiveThresholdInputStream t) {
                            t.setGuardState(false);
                        }
                        template = is.readAllBytes();
                    }
                    org.apache.poi.xssf.usermodel.XSSFSheet x = getSheetFromZipEntryName(ze.getName());
                    if (x != null && !(x instanceof org.apache.poi.xssf.usermodel.XSSFChartSheet)) {
                        int index = getXSSFWorkbook().getSheetIndex(x);
                        getSheetAt(index).flushRows();
                        SheetWriter w = writers.get(index);
                        w.close();
                        sheetEntry(zos, ze, template, w);
                    } else {
                        org.apache.commons.compress.archivers.zip.ZipArchiveEntry copy =
                                new org.apache.commons.compress.archivers.zip.ZipArchiveEntry(ze.getName());
                        if (ze.getSize() >= 0) {
                            copy.setSize(ze.getSize());
                        }
                        if (ze.getName().endsWith(".png")) {
                            // a figure, compressed already: stored as it is
                            java.util.zip.CRC32 crc = new java.util.zip.CRC32();
                            crc.update(template);
                            copy.setMethod(java.util.zip.ZipEntry.STORED);
                            copy.setSize(template.length);
                            copy.setCompressedSize(template.length);
                            copy.setCrc(crc.getValue());
                        }
                        if (ze.getTime() >= 0) {
                            copy.setTime(ze.getTime());
                        }
                        zos.putArchiveEntry(copy);
                        zos.write(template);
                        zos.closeArchiveEntry();
                    }
                }
            } finally {
                zos.finish();
                source.close();
            }
        }

        private static final byte[] EMPTY_SHEET_DATA = "<sheetData/>".getBytes(StandardCharsets.UTF_8);

        private static void sheetEntry(org.apache.commons.compress.archivers.zip.ZipArchiveOutputStream zos,
                                       org.apache.commons.compress.archivers.zip.ZipArchiveEntry ze, byte[] template,
                                       SheetWriter w) throws IOException {
            int at = indexOf(template, EMPTY_SHEET_DATA);
            if (at < 0) {
                throw new IOException("the template of " + ze.getName() + " has no empty sheetData to fill");
            }
            java.io.ByteArrayOutputStream h = new java.io.ByteArrayOutputStream(at + 16);
            h.write(template, 0, at);
            h.write("<sheetData>\n".getBytes(StandardCharsets.UTF_8));
            byte[] head = h.toByteArray();
            java.io.ByteArrayOutputStream t = new java.io.ByteArrayOutputStream(template.length - at + 16);
            t.write("</sheetData>".getBytes(StandardCharsets.UTF_8));
            int after = at + EMPTY_SHEET_DATA.length;
            t.write(template, after, template.length - after);
            byte[] tail = t.toByteArray();
            DeflatedPart rows = w.part();
            java.io.File file = w.file();
            if (file.length() != rows.compressedSize()) {
                throw new IOException("the compressed rows of " + ze.getName() + " are incomplete");
            }
            byte[] headDeflated = DeflatedPart.deflate(head, false);
            byte[] tailDeflated = DeflatedPart.deflate(tail, true);
            org.apache.commons.compress.archivers.zip.ZipArchiveEntry e =
                    new org.apache.commons.compress.archivers.zip.ZipArchiveEntry(ze.getName());
            e.setMethod(java.util.zip.ZipEntry.DEFLATED);
            e.setSize(head.length + rows.size() + tail.length);
            e.setCompressedSize(headDeflated.length + rows.compressedSize() + tailDeflated.length);
            e.setCrc(DeflatedPart.combine(DeflatedPart.combine(DeflatedPart.crc(head), rows.crc(), rows.size()),
                    DeflatedPart.crc(tail), tail.length));
            if (ze.getTime() >= 0) {
                e.setTime(ze.getTime());
            }
            try (java.io.InputStream body = new java.io.FileInputStream(file)) {
                zos.addRawArchiveEntry(e, new java.io.SequenceInputStream(java.util.Collections.enumeration(List.of(
                        new java.io.ByteArrayInputStream(headDeflated), body, new java.io.ByteArrayInputStream(tailDeflated)))));
            }
        }

        private static int indexOf(byte[] data, byte[] pattern) {
            outer:
            for (int i = 0; i + pattern.length <= data.length; i++) {
                for (int j = 0; j < pattern.length; j++) {
                    if (data[i + j] != pattern[j]) {
                        continue outer;
                    }
                }
                return i;
            }
            return -1;
        }
    }

    /**
     * Writes the workbook into {@code file}. The same content gives the same bytes: the document's
     * creation time is the run time stated in Provenance, and every ZIP entry carries that time too
     * (stamped in place after writing, without compressing again).
     */
    public static List<String> write(ReportContent c, List<RenderedFigure> figures, java.nio.file.Path file) throws IOException {
        return write(c, () -> figures, file);
    }

    /**
     * As {@link #write(ReportContent, List, java.nio.file.Path)}, with the figures asked for only
     * when their sheet is written, near the end: they may still be drawing while the tables are written.
     *
     * @return for each table longer than a sheet holds ({@link #SHEET_ROWS}), a line saying how much of it
     *         its sheet shows (empty when every table fits)
     */
    public static List<String> write(ReportContent c, FigureSource figureSource, java.nio.file.Path file) throws IOException {
        return write(c, figureSource, file, Math.max(1, Math.min(4, Runtime.getRuntime().availableProcessors())), SHEET_ROWS);
    }

    /**
     * As {@link #write(ReportContent, FigureSource, java.nio.file.Path)}, the tables' rows written by
     * {@code sheetThreads} threads, each sheet at most {@code sheetRows} rows long (tests use fewer
     * than the format's limit).
     */
    static List<String> write(ReportContent c, FigureSource figureSource, java.nio.file.Path file, int sheetThreads, int sheetRows)
            throws IOException {
        List<String> cut;
        java.time.Instant stated = java.time.Instant.parse(c.provenance().runAtUtc());
        AnalysisResult r = c.result();
        try (SXSSFWorkbook wb = new FastWorkbook(); OutputStream buffer = new java.io.BufferedOutputStream(
                java.nio.file.Files.newOutputStream(file), 1 << 16); Tables tables = new Tables(sheetThreads, sheetRows)) {
            var core = wb.getXSSFWorkbook().getProperties().getCoreProperties();
            core.setCreated(java.util.Optional.of(java.util.Date.from(stated)));
            core.setCreator("Viscarta " + c.provenance().toolVersion());
            Styles st = new Styles(wb);
            readMe(wb, st, r);
            table(wb, st, tables, OutputTables.summary(r), r.samples(), "", List.of());
            table(wb, st, tables, OutputTables.ranking(r), r.rankingRows(), "", List.of());
            r.ranking().ifPresent(rk -> groupComparison(wb, st, rk));
            if (r.request().parts().contains(org.viscarta.analysis.AnalysisRequest.Part.QUALITY)) {
                List<String> footer = new java.util.ArrayList<>(Statements.qualitySummary(r));
                List<org.viscarta.quality.SweepChecks.Check> rows = r.quality().checks();
                if (rows.size() > MAX_QUALITY_ROWS) {
                    rows = new java.util.ArrayList<>(r.quality().sweepChecks().stream()
                            .filter(k -> k.verdict() != org.viscarta.quality.Verdict.PASS).toList());
                    rows.addAll(r.quality().amplitudeChecks());
                    footer.add(String.format(java.util.Locale.ROOT, "More than %,d checks: only those that did not pass and the "
                            + "amplitude sweeps are listed; 'viscarta quality -o FILE.csv' writes every one.", MAX_QUALITY_ROWS));
                }
                footer.add("Limits:");
                footer.addAll(Statements.QUALITY_LIMITS);
                table(wb, st, tables, OutputTables.QUALITY, rows, rows.isEmpty() ? "every check passed" : "", footer);
            }
            List<Matcher.Match> shown = r.samples().stream().flatMap(sa -> sa.matches().stream().limit(Matcher.SHOWN)).toList();
            table(wb, st, tables, OutputTables.matches(false), shown, r.library().isEmpty() ? NO_LIBRARY : "", List.of());
            r.mimic().ifPresent(m -> table(wb, st, tables, OutputTables.matches(true), m.matches(), "",
                    List.of("first and second distinguishable: " + Matcher.distinguishable(m.matches()))));
            if (!r.series().isEmpty()) {
                temperatureSeries(wb, st, r);
            }
            if (!r.transitions().isEmpty()) {
                org.viscarta.temperature.Transitions t = r.transitions();
                table(wb, st, tables, OutputTables.transitions(t), t.results(), "", Statements.TRANSITION_METHOD);
                table(wb, st, tables, OutputTables.ACTIVATION, t.activations(), t.activations().isEmpty()
                        ? "no sample was ramped at two or more frequencies" : "", List.of());
                List<String> statements = new java.util.ArrayList<>();
                for (org.viscarta.temperature.Transitions.RankedSet set : t.sets()) {
                    statements.add(set.label() + ":");
                    set.statements().forEach(x -> statements.add("  " + x));
                    set.missing().forEach(x -> statements.add("  not compared: " + x));
                }
                table(wb, st, tables, OutputTables.TRANSITION_RANKING, OutputTables.transitionRankRows(t), t.sets().isEmpty()
                        ? "fewer than two samples at any one frequency, so nothing was compared" : "", statements);
            }
            if (!r.maps().specimens().isEmpty()) {
                List<String> setup = new java.util.ArrayList<>();
                for (org.viscarta.analysis.Maps.Mapped m : r.maps().specimens()) {
                    setup.add(m.specimen().name() + ": " + mapSetup(m));
                    m.specimen().notes().forEach(n -> setup.add("  " + n));
                }
                table(wb, st, tables, OutputTables.POSITIONS, r.maps().specimens().stream().flatMap(m -> m.specimen().points().stream()).toList(),
                        "", setup);
                List<String> statements = new java.util.ArrayList<>();
                for (org.viscarta.analysis.Maps.Mapped m : r.maps().specimens()) {
                    statements.addAll(regionStatements(m.specimen()));
                }
                List<OutputTables.RegionRow> regionRows = OutputTables.regionRows(r.maps().specimens().stream()
                        .map(org.viscarta.analysis.Maps.Mapped::specimen).toList());
                table(wb, st, tables, OutputTables.REGIONS, regionRows, regionRows.isEmpty() ? "no specimen has regions" : "", statements);
            }
            if (!r.timeTests().isEmpty()) {
                List<String> origins = new java.util.ArrayList<>();
                origins.add("Each sample computed from time-domain tests: its tests fitted together with every candidate model (Model "
                        + "fits), then the best-supported model fitted to each replicate alone; that replicate's E′ and E″ at the "
                        + "frequencies 1/(2πt) of its times are what the ranking and matching use.");
                for (org.viscarta.analysis.TimeTests.Derived d : r.timeTests()) {
                    d.sample().replicates().forEach(sw -> origins.add(d.sample().name() + ", replicate " + sw.replicate() + ": "
                            + org.viscarta.analysis.TimeTests.origin(sw).orElse("")));
                }
                table(wb, st, tables, OutputTables.TIME_TESTS, OutputTables.timeTestRows(r), "", origins);
            }
            table(wb, st, tables, OutputTables.modelFits(r.request()), () -> OutputTables.fitRows(r.samples()), "", List.of());
            table(wb, st, tables, OutputTables.DERIVED, () -> OutputTables.derivedRows(r.samples()), "", List.of());
            table(wb, st, tables, OutputTables.CORRELATIONS, () -> OutputTables.correlationRows(r.samples()), "", List.of());
            List<OutputTables.SpectrumRow> spectra = OutputTables.spectrumRows(r.samples());
            if (!spectra.isEmpty()) {
                table(wb, st, tables, OutputTables.SPECTRA, spectra, "", OutputTables.spectrumNotes(r.samples()));
            }
            table(wb, st, tables, OutputTables.data(r.samples()), () -> OutputTables.dataRows(r.samples()), "", List.of());
            table(wb, st, tables, OutputTables.LIBRARY, r.library().map(l -> l.entries()).orElse(List.of()),
                    r.library().isEmpty() ? NO_LIBRARY : "", List.of());
            tables.finish();
            cut = tables.cut();
            List<RenderedFigure> figures = figureSource.get();
            if (!figures.isEmpty()) {
                figures(wb, st, figures);
            }
            provenance(wb, st, c);
            wb.write(buffer);
            wb.dispose();
        }
        ReproducibleZip.restamp(file, stated);
        return cut;
    }

    /**
     * Rows a sheet holds: 1,048,576 (ECMA-376's SpreadsheetML, as POI states it for Excel 2007 and
     * later). A longer table is cut so that it, its note and its footer fit, and says so in its last row.
     */
    static final int SHEET_ROWS = org.apache.poi.ss.SpreadsheetVersion.EXCEL2007.getMaxRows();

    /**
     * Draws a declared table as a sheet: a frozen, filtered header row with units, one row per item,
     * numbers as numeric cells in the column's format, the column widths, a colour scale on tan δ.
     * The sheet and its header are made now, in the workbook's order; its rows are written by
     * {@code tables}, possibly on another thread, and the rest when {@code tables} finishes.
     *
     * @param empty  said in the first row when the table has no rows for a reason ("" for none)
     * @param footer lines after the table
     */
    private static <R> void table(Workbook wb, Styles st, Tables tables, Table<R> table, Iterable<R> items, String empty,
                                  List<String> footer) {
        table(wb, st, tables, table, () -> items, empty, footer);
    }

    /**
     * As {@link #table(Workbook, Styles, Tables, Table, Iterable, String, List)}, with the rows made
     * where they are written: a large campaign's row lists are then not all held at once.
     */
    private static <R> void table(Workbook wb, Styles st, Tables tables, Table<R> table,
                                  java.util.function.Supplier<? extends Iterable<R>> items, String empty, List<String> footer) {
        Sheet s = wb.createSheet(table.name());
        List<Column<R>> cols = table.columnsFor(Medium.SHEET);
        CellStyle[] formats = new CellStyle[cols.size()];
        Object[] header = new Object[cols.size()];
        for (int i = 0; i < cols.size(); i++) {
            Column<R> col = cols.get(i);
            formats[i] = col.style() == Style.TEXT && col.width() >= WRAPPED_WIDTH ? st.wrapInTable : st.byStyle.get(col.style());
            header[i] = col.header();
        }
        Rows rows = new Rows(st, s, formats);
        Row head = rows.styled(st.header, header);
        int headLines = 1;
        for (Column<R> col : cols) {
            headLines = Math.max(headLines, headerLines(col.header(), col.width()));
        }
        head.setHeightInPoints(headLines * 15f);
        rows.wrapping(cols.stream().mapToInt(c -> c.style() == Style.TEXT && c.width() >= WRAPPED_WIDTH ? c.width() : 0).toArray());
        freezeHeader(s);
        SheetWriter writer = wb instanceof FastWorkbook fast ? fast.lastWriter() : null;
        // the rows touch this sheet only, and styles made before
        Runnable body = () -> {
            if (!empty.isEmpty()) {
                rows.row(empty);
            }
            if (writer != null) {
                rows.straightTo(writer);
            }
            Object[] values = new Object[cols.size()];
            // the header, the rows, a note when cut, and the footer (a blank row, then its lines) fit the sheet
            long room = tables.sheetRows - 2L - (footer.isEmpty() ? 0 : 1 + footer.size());
            long written = 0;
            long leftOut = 0;
            for (R item : items.get()) {
                if (written >= room) {
                    leftOut++;
                    continue;
                }
                for (int i = 0; i < values.length; i++) {
                    values[i] = cols.get(i).value().apply(item);
                }
                rows.row(values);
                written++;
            }
            if (leftOut > 0) {
                java.util.Arrays.fill(values, null);
                values[0] = String.format(java.util.Locale.ROOT, "Not shown: the table's last %,d rows (a sheet holds at most %,d). "
                        + "Whole tables: the command line's CSV outputs (-o); the data: the input files.", leftOut, tables.sheetRows);
                rows.row(values);
                tables.cut(String.format(java.util.Locale.ROOT, "%s: the first %,d of %,d rows (a sheet holds at most %,d)",
                        table.name(), written, written + leftOut, tables.sheetRows));
            }
            rows.endStraight();
        };
        // the filter and the print titles are names of the whole workbook: made on the workbook's thread
        Runnable finish = () -> {
            if (empty.isEmpty()) {
                table(s, rows, cols.size() - 1);
                for (int i = 0; i < cols.size(); i++) {
                    if (table.colourScaled().contains(cols.get(i).csvName())) {
                        tanDeltaScale(s, rows, i);
                    }
                }
            }
            if (!footer.isEmpty()) {
                rows.blank();
                int width = cols.stream().mapToInt(Column::width).sum();
                for (String line : footer) {
                    rows.sentence(st.wrap, line, cols.size() - 1, width); // across the table's width, wrapped
                }
            }
            widths(s, cols.stream().mapToInt(Column::width).toArray());
        };
        tables.add(body, finish);
    }

    /**
     * The tables of one workbook, their rows written by worker threads, each sheet by one thread: a
     * large campaign's sheets (model fits, derived quantities, spectra, data) are each a hundred
     * megabytes of XML or more, and are written side by side instead of one after another. What
     * touches the whole workbook waits for {@link #finish()}, which runs it in the tables' order, so
     * that the same content still gives the same file.
     */
    private static final class Tables implements AutoCloseable {
        private final java.util.concurrent.ExecutorService workers;
        private final List<java.util.concurrent.Future<?>> bodies = new java.util.ArrayList<>();
        private final List<Runnable> finishing = new java.util.ArrayList<>();
        /** Rows a sheet may have. */
        final int sheetRows;
        /** Notes of the tables cut, by the table's place in the workbook (written side by side, listed in order). */
        private final java.util.SortedMap<Integer, String> cut = new java.util.TreeMap<>();
        private final ThreadLocal<Integer> current = new ThreadLocal<>();

        Tables(int threads, int sheetRows) {
            this.sheetRows = sheetRows;
            workers = java.util.concurrent.Executors.newFixedThreadPool(threads, task -> {
                Thread t = new Thread(task, "viscarta-sheet");
                t.setDaemon(true);
                return t;
            });
        }

        void add(Runnable body, Runnable finish) {
            int place = bodies.size();
            bodies.add(workers.submit(() -> {
                current.set(place);
                try {
                    body.run();
                } finally {
                    current.remove();
                }
            }));
            finishing.add(finish);
        }

        /** Notes that the table being written on this thread was cut. */
        void cut(String note) {
            synchronized (cut) {
                cut.put(current.get(), note);
            }
        }

        /** The notes of the tables cut, in the workbook's order. */
        List<String> cut() {
            synchronized (cut) {
                return List.copyOf(cut.values());
            }
        }

        /** Waits for every table's rows, then finishes the tables in the order they were added (once). */
        void finish() throws IOException {
            for (java.util.concurrent.Future<?> f : bodies) {
                try {
                    f.get();
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    throw new java.io.InterruptedIOException("interrupted while the sheets were written");
                } catch (java.util.concurrent.ExecutionException e) {
                    if (e.getCause() instanceof RuntimeException re) {
                        throw re;
                    }
                    if (e.getCause() instanceof Error err) {
                        throw err;
                    }
                    throw new IOException(e.getCause());
                }
            }
            finishing.forEach(Runnable::run);
        }

        /** Stops the workers; after a failure, rows still being written are abandoned (the workbook is not kept). */
        @Override
        public void close() {
            workers.shutdownNow();
        }
    }

    /**
     * Lines a bold header needs in a column of {@code width} characters, wrapped at spaces: a word
     * longer than the line is broken by the spreadsheet program, so widths are chosen to hold the
     * longest word (bold letters are about as wide as the digits a column width counts).
     */
    static int headerLines(String text, int width) {
        int perLine = Math.max(1, width - 1);
        int lines = 1;
        int used = 0;
        for (String word : text.split(" ")) {
            int len = word.length();
            if (used > 0 && used + 1 + len > perLine) {
                lines++;
                used = 0;
            }
            used += (used > 0 ? 1 : 0) + len;
            while (used > perLine) {
                lines++;
                used -= perLine;
            }
        }
        return lines;
    }

    /** The figures, when they are needed (waiting for them to be drawn). */
    @FunctionalInterface
    public interface FigureSource {
        List<RenderedFigure> get() throws IOException;
    }

    private static void figures(SXSSFWorkbook wb, Styles st, List<RenderedFigure> figures) {
        Sheet s = wb.createSheet("Figures");
        Rows rows = new Rows(st, s);
        rows.styled(st.title, "Figures (also written as PNG at 200 dpi and SVG under figures/)");
        org.apache.poi.ss.usermodel.Drawing<?> drawing = s.createDrawingPatriarch();
        org.apache.poi.ss.usermodel.CreationHelper helper = wb.getCreationHelper();
        int row = 2;
        for (RenderedFigure f : figures) {
            if (row > 2) {
                s.setRowBreak(row - 1);
            }
            // the caption wrapped across the figure's width, so that the printed page is not widened to a one-line caption
            Row caption = s.createRow(row);
            org.apache.poi.ss.usermodel.Cell text = caption.createCell(0);
            text.setCellValue(f.stem() + ": " + f.caption());
            text.setCellStyle(st.wrap);
            s.addMergedRegionUnsafe(new org.apache.poi.ss.util.CellRangeAddress(row, row, 0, FIGURE_COLUMNS - 1));
            caption.setHeightInPoints(Math.min(MAX_ROW_POINTS, Math.max(1, Rows.linesOf(text.getStringCellValue(),
                    FIGURE_COLUMNS * FIGURE_COLUMN_CHARACTERS)) * FIGURE_ROW_POINTS));
            int picture = wb.addPicture(f.png(), Workbook.PICTURE_TYPE_PNG);
            double widthPt = Figure.WIDTH_PT;
            double heightPt = Figure.WIDTH_PT * f.aspect();
            double pagePt = FIGURE_ROWS_PER_PAGE * FIGURE_ROW_POINTS;
            if (heightPt > pagePt) {
                // a tall figure is made smaller, keeping its shape, so that it stays on one page
                widthPt *= pagePt / heightPt;
                heightPt = pagePt;
            }
            drawing.createPicture(pictureAnchor(helper, row + 1, widthPt, heightPt), picture);
            row += (int) Math.ceil(heightPt / FIGURE_ROW_POINTS) + 3;
        }
        // the rows under the figures are given their height, which the anchors count on (a spreadsheet program's own
        // default differs: LibreOffice's is about 12.8 points, and drew every figure squeezed to 85 % of its height)
        s.setDefaultRowHeightInPoints(FIGURE_ROW_POINTS);
        int[] columns = new int[FIGURE_COLUMNS];
        java.util.Arrays.fill(columns, FIGURE_COLUMN_CHARACTERS);
        widths(s, columns);
    }

    /** Height of the Figures sheet's rows [points], and the width of its columns [characters]. */
    private static final float FIGURE_ROW_POINTS = 15f;
    private static final int FIGURE_COLUMN_CHARACTERS = 12;

    /**
     * Where a picture goes: from the top left of row {@code top}, {@code widthPt} × {@code heightPt}
     * points, its far corner placed by column and row and the offset within them (English Metric
     * Units, 12,700 to the point; a column's width in them as Excel counts it, POI's
     * {@code Units.columnWidthToEMU}). Whole columns and rows alone stretched each figure: nine
     * columns of twelve characters are 601 points, not the figure's 468.
     */
    private static org.apache.poi.ss.usermodel.ClientAnchor pictureAnchor(org.apache.poi.ss.usermodel.CreationHelper helper,
                                                                          int top, double widthPt, double heightPt) {
        long column = org.apache.poi.util.Units.columnWidthToEMU(FIGURE_COLUMN_CHARACTERS * 256);
        long rowHeight = Math.round(FIGURE_ROW_POINTS * org.apache.poi.util.Units.EMU_PER_POINT);
        long w = Math.round(widthPt * org.apache.poi.util.Units.EMU_PER_POINT);
        long h = Math.round(heightPt * org.apache.poi.util.Units.EMU_PER_POINT);
        org.apache.poi.ss.usermodel.ClientAnchor a = helper.createClientAnchor();
        a.setCol1(0);
        a.setRow1(top);
        a.setCol2((int) (w / column));
        a.setDx2((int) (w % column));
        a.setRow2(top + (int) (h / rowHeight));
        a.setDy2((int) (h % rowHeight));
        return a;
    }

    /** The tallest row a spreadsheet allows [points]. */
    private static final float MAX_ROW_POINTS = 409f;

    /** The most characters a spreadsheet cell holds (Excel's limit; LibreOffice's is larger). */
    private static final int CELL_LIMIT = 32_767;

    /** Text as a cell can hold it: whole, or cut with a note saying so. */
    static String fitCell(String text) {
        if (text.length() <= CELL_LIMIT) {
            return text;
        }
        String note = " … (cut: " + text.length() + " characters, more than a cell holds)";
        return text.substring(0, CELL_LIMIT - note.length()) + note;
    }

    /** Cell styles, created once per workbook. */
    private static final class Styles {
        final CellStyle title;
        final CellStyle header;
        final CellStyle wrap;
        /** Wrapped text in a table row, aligned with the row's numbers. */
        final CellStyle wrapInTable;
        /** Plain text in a table row, at the top of the cell like the rest of the row. */
        final CellStyle text;
        final CellStyle bold;
        /** Significant figures for moduli and parameters of any scale. */
        final CellStyle sci;
        /** Four decimals for tan δ and weights. */
        final CellStyle dec4;
        /** Two decimals for AICc, temperatures, angles. */
        final CellStyle dec2;
        /** Frequencies: up to four decimals. */
        final CellStyle freq;
        final CellStyle integer;
        /** p-values: four decimals, and "< 0.0001" below that (the full value stays in the cell). */
        final CellStyle pValue;
        /** The number format of each declared column style. */
        final java.util.Map<Style, CellStyle> byStyle = new java.util.EnumMap<>(Style.class);
        /**
         * The workbook's own default (style 0), what a cell without a style shows. Given to such cells
         * explicitly: for a cell without one, POI looks for a row's or column's default style in the
         * sheet's XML on every read of its style (a tenth of the time of writing a large sheet).
         */
        final CellStyle standard;

        /** Four significant figures: fixed decimals from 0 to 7, and the scientific form. */
        private final CellStyle[] fixed = new CellStyle[8];
        private final CellStyle scientific4;

        /**
         * The display format of a value in a column of moduli or parameters: four significant figures,
         * written plainly between 0.0001 and 10,000 (147.9, 0.2572) and in powers of ten outside
         * (2.305E+04, 1.641E-15), as the terminal and the page write them; the cell keeps every digit.
         */
        CellStyle significant(double v) {
            double a = Math.abs(v);
            if (a == 0) {
                return fixed[0];
            }
            if (a < 1e-4 || a >= 1e4) {
                return scientific4;
            }
            int exponent = (int) Math.floor(Math.log10(a));
            if (Math.round(a * Math.pow(10, 3 - exponent)) >= 10_000) {
                exponent++; // 0.99999 shows as 1.000, not 1.0000
            }
            int decimals = 3 - exponent;
            return fixed[Math.max(0, Math.min(fixed.length - 1, decimals))];
        }

        Styles(Workbook wb) {
            standard = wb.getCellStyleAt(0);
            sci = numberStyle(wb, "0.000E+00");
            scientific4 = sci;
            for (int d = 0; d < fixed.length; d++) {
                fixed[d] = numberStyle(wb, d == 0 ? "0" : "0." + "0".repeat(d));
            }
            dec4 = numberStyle(wb, "0.0000");
            dec2 = numberStyle(wb, "0.00");
            freq = numberStyle(wb, "0.0###");
            integer = numberStyle(wb, "0");
            pValue = numberStyle(wb, "[<0.0001]\"< 0.0001\";0.0000");
            byStyle.put(Style.SCIENTIFIC, sci);
            byStyle.put(Style.DECIMAL4, dec4);
            byStyle.put(Style.DECIMAL2, dec2);
            byStyle.put(Style.FREQUENCY, freq);
            byStyle.put(Style.INTEGER, integer);
            Font big = wb.createFont();
            big.setBold(true);
            big.setFontHeightInPoints((short) 14);
            title = wb.createCellStyle();
            title.setFont(big);
            Font b = wb.createFont();
            b.setBold(true);
            header = wb.createCellStyle();
            header.setFont(b);
            header.setWrapText(true);
            bold = wb.createCellStyle();
            bold.setFont(b);
            bold.setWrapText(true);
            bold.setVerticalAlignment(org.apache.poi.ss.usermodel.VerticalAlignment.TOP);
            wrapInTable = wb.createCellStyle();
            wrapInTable.setWrapText(true);
            wrapInTable.setVerticalAlignment(org.apache.poi.ss.usermodel.VerticalAlignment.TOP);
            text = wb.createCellStyle();
            text.setVerticalAlignment(org.apache.poi.ss.usermodel.VerticalAlignment.TOP);
            wrap = wb.createCellStyle();
            wrap.setWrapText(true);
            wrap.setVerticalAlignment(org.apache.poi.ss.usermodel.VerticalAlignment.TOP);
        }
    }

    private static CellStyle numberStyle(Workbook wb, String format) {
        CellStyle cs = wb.createCellStyle();
        cs.setDataFormat(wb.createDataFormat().getFormat(format));
        cs.setVerticalAlignment(org.apache.poi.ss.usermodel.VerticalAlignment.TOP);
        return cs;
    }

    /** Appends rows to a sheet; numbers go in as numeric cells, NaN as an empty cell. */
    private static final class Rows {
        private final Styles styles;
        private final Sheet sheet;
        private CellStyle[] numberStyles;
        /** Width in characters of each column whose text wraps (0: does not wrap), for the row heights. */
        private int[] wrapped = new int[0];
        private int next;
        /** While a table's body is written: the sheet's writer, which receives each row as it is made. */
        private SheetWriter straight;
        /** The one row object a table's body reuses for each of its rows. */
        private org.apache.poi.xssf.streaming.SXSSFRow reused;
        /**
         * The values of the body's latest row, written when the next one comes; the body's last row is
         * made as other rows are, so that POI, which derives the sheet's dimension from the rows it
         * holds, still sees where the table ends.
         */
        private Object[] pending;

        /**
         * @param numberStyles the display format of numbers in each column (null: General); the
         *                     stored value keeps full precision
         */
        Rows(Styles styles, Sheet sheet, CellStyle... numberStyles) {
            this.styles = styles;
            this.sheet = sheet;
            this.numberStyles = numberStyles;
        }

        /**
         * The widths of the columns whose text wraps [characters; 0 for one that does not]: a row
         * with a longer text there gets the height its lines need (SXSSF cannot measure text, and a
         * spreadsheet program does not resize rows it reads from a file).
         */
        void wrapping(int[] widths) {
            this.wrapped = widths.clone();
        }

        /** The number formats of the columns from here on (a sheet with several blocks changes them per block). */
        void use(CellStyle... styles) {
            this.numberStyles = styles;
        }

        /**
         * From here on, rows go straight to the sheet's writer, one reused row object for all of them,
         * instead of a row object, a map of cells and cell objects made for each and left to the
         * collector (the bulk of a large workbook's garbage). The rows already made are written first;
         * the same XML results ({@code WorkbookThreadsTest}; the sheets' dimensions:
         * {@code WorkbookDimensionTest}). Until {@link #endStraight()}.
         */
        void straightTo(SheetWriter writer) {
            try {
                ((org.apache.poi.xssf.streaming.SXSSFSheet) sheet).flushRows();
            } catch (IOException e) {
                throw new java.io.UncheckedIOException(e);
            }
            straight = writer;
            reused = new org.apache.poi.xssf.streaming.SXSSFRow((org.apache.poi.xssf.streaming.SXSSFSheet) sheet);
        }

        void endStraight() {
            straight = null;
            reused = null;
            if (pending != null) {
                Object[] last = pending;
                pending = null;
                row(last);
            }
        }

        Row row(Object... values) {
            if (straight != null) {
                Row written = pending == null ? null : straightRow(pending);
                if (pending == null) {
                    pending = new Object[values.length];
                }
                if (pending.length != values.length) {
                    throw new IllegalStateException("a table's rows have " + pending.length + " values, not " + values.length);
                }
                System.arraycopy(values, 0, pending, 0, values.length);
                return written;
            }
            Row r = sheet.createRow(next++);
            int lines = cells(r, values, false);
            if (lines > 1) {
                r.setHeightInPoints(Math.min(MAX_ROW_POINTS, lines * 15f));
            }
            return r;
        }

        /** As {@link #row}, in the reused row: every cell set anew (value, type and style), then the row written. */
        private Row straightRow(Object... values) {
            org.apache.poi.xssf.streaming.SXSSFRow r = reused;
            int lines = cells(r, values, true);
            if (lines > 1) {
                r.setHeightInPoints(Math.min(MAX_ROW_POINTS, lines * 15f));
            } else {
                r.setHeight((short) -1);
            }
            try {
                straight.writeRow(next++, r);
            } catch (IOException e) {
                throw new java.io.UncheckedIOException(e);
            }
            return r;
        }

        /**
         * The row's cells from the values: numbers as numeric cells in the column's format (NaN left
         * blank), booleans as yes/no, other values as text (an empty text stays a blank cell: the same
         * to read, a fraction of the XML), nothing for null. In a {@code reused} row every cell is set
         * anew, its style included, and a cell whose value is now null is removed. Returns the lines
         * the row's wrapped texts need.
         */
        private int cells(Row r, Object[] values, boolean reused) {
            int lines = 1;
            for (int i = 0; i < values.length; i++) {
                Object v = values[i];
                Cell cell = reused ? r.getCell(i) : null;
                if (v == null) {
                    if (cell != null) {
                        r.removeCell(cell);
                    }
                    continue;
                }
                if (cell == null) {
                    cell = r.createCell(i);
                }
                CellStyle style = null;
                if (v instanceof Number n) {
                    double d = n.doubleValue();
                    if (Double.isFinite(d)) {
                        cell.setCellValue(d);
                        if (i < numberStyles.length && numberStyles[i] != null) {
                            style = numberStyles[i] == styles.sci ? styles.significant(d) : numberStyles[i];
                        }
                    } else {
                        cell.setBlank();
                    }
                } else if (v instanceof Boolean b) {
                    cell.setCellValue(b ? "yes" : "no");
                } else {
                    String text = v.toString();
                    if (!text.isEmpty()) {
                        cell.setCellValue(fitCell(text));
                    } else {
                        cell.setBlank();
                    }
                    if (i < numberStyles.length && numberStyles[i] != null && !text.isEmpty()) {
                        style = numberStyles[i];
                    } else if (lines > 1 || hasWrapped()) {
                        style = styles.text;
                    }
                    if (i < wrapped.length && wrapped[i] > 0) {
                        lines = Math.max(lines, tableLinesOf(text, wrapped[i]));
                    }
                }
                if (reused) {
                    cell.setCellStyle(style != null ? style : styles.standard);
                } else if (style != null) {
                    cell.setCellStyle(style);
                }
            }
            return lines;
        }

        private boolean hasWrapped() {
            for (int w : wrapped) {
                if (w > 0) {
                    return true;
                }
            }
            return false;
        }

        Row styled(CellStyle style, Object... values) {
            Row r = row(values);
            for (Cell cell : r) {
                cell.setCellStyle(style);
            }
            return r;
        }

        /** A header row whose height fits its texts, wrapped in columns of the given widths [characters]. */
        Row heading(int[] widths, Object... texts) {
            Row r = styled(styles.header, texts);
            int lines = 1;
            for (int i = 0; i < texts.length && i < widths.length; i++) {
                lines = Math.max(lines, headerLines(String.valueOf(texts[i]), widths[i]));
            }
            r.setHeightInPoints(lines * 15f);
            return r;
        }

        void blank() {
            next++;
        }

        /** Index of the last row written. */
        int last() {
            return next - 1;
        }

        /**
         * A label and a wrapped paragraph. SXSSF cannot measure text, so the row height is
         * estimated from the text length and the column widths (in characters).
         */
        Row paragraph(CellStyle labelStyle, CellStyle textStyle, String label, String text, int labelWidth, int textWidth) {
            Row r = row(label, text);
            r.getCell(0).setCellStyle(labelStyle);
            r.getCell(1).setCellStyle(textStyle);
            int lines = Math.max(linesOf(label, labelWidth), linesOf(text, textWidth));
            r.setHeightInPoints(Math.min(MAX_ROW_POINTS, Math.max(1, lines) * 15f));
            return r;
        }

        /**
         * A sentence across the columns 0 … lastColumn (merged, wrapped), with a row height that fits
         * it; {@code width} is the merged columns' width in characters.
         */
        Row sentence(CellStyle style, String text, int lastColumn, int width) {
            Row r = row(text);
            r.getCell(0).setCellStyle(style);
            // a row of its own, so it cannot overlap another merge: POI's check (quadratic in the merges) is not needed
            sheet.addMergedRegionUnsafe(new org.apache.poi.ss.util.CellRangeAddress(r.getRowNum(), r.getRowNum(), 0, lastColumn));
            r.setHeightInPoints(Math.min(MAX_ROW_POINTS, Math.max(1, tableLinesOf(text, width)) * 15f));
            return r;
        }

        /**
         * Lines a text needs in a wrapped table cell of {@code width} characters: a column width
         * counts digits, and running text is narrower (about 1.5 letters a digit in the default font,
         * measured on the demo's notes printed by LibreOffice); rounded up, plus one when long.
         */
        private static int tableLinesOf(String text, int width) {
            double perLine = Math.max(1, width - 2) * 1.5;
            int lines = (int) Math.ceil(text.length() / perLine);
            return lines > 2 ? lines + 1 : lines;
        }

        private static int linesOf(String text, int width) {
            return (int) Math.ceil(text.length() * 1.1 / Math.max(1, width - 2));
        }
    }

    /**
     * Sets column widths in characters. Called after a sheet's rows are written: with column
     * definitions present, POI looks up a default style for every new cell, which is slow.
     */
    private static void widths(Sheet s, int... widths) {
        printSetup(s, java.util.Arrays.stream(widths).sum());
        for (int i = 0; i < widths.length; i++) {
            s.setColumnWidth(i, widths[i] * 256);
        }
    }

    private static void freezeHeader(Sheet s) {
        s.createFreezePane(0, 1);
        s.setRepeatingRows(org.apache.poi.ss.util.CellRangeAddress.valueOf("1:1"));
    }

    /** An autofilter over a table that starts with its header in row 0 and spans columns 0 … lastColumn. */
    private static void table(Sheet s, Rows rows, int lastColumn) {
        if (rows.last() >= 1) {
            s.setAutoFilter(new org.apache.poi.ss.util.CellRangeAddress(0, rows.last(), 0, lastColumn));
        }
    }

    /**
     * A colour scale on a column of tan δ values: white for the lowest, dark blue for the highest
     * damping (a sequential blue scale, readable by colour-blind readers and in greyscale).
     */
    private static void tanDeltaScale(Sheet s, Rows rows, int column) {
        if (rows.last() < 1) {
            return;
        }
        var scf = s.getSheetConditionalFormatting();
        var rule = scf.createConditionalFormattingColorScaleRule();
        var scale = rule.getColorScaleFormatting();
        scale.setNumControlPoints(3);
        scale.getThresholds()[0].setRangeType(org.apache.poi.ss.usermodel.ConditionalFormattingThreshold.RangeType.MIN);
        scale.getThresholds()[1].setRangeType(org.apache.poi.ss.usermodel.ConditionalFormattingThreshold.RangeType.PERCENTILE);
        scale.getThresholds()[1].setValue(50d);
        scale.getThresholds()[2].setRangeType(org.apache.poi.ss.usermodel.ConditionalFormattingThreshold.RangeType.MAX);
        scale.setColors(new org.apache.poi.ss.usermodel.Color[] {rgb(0xFF, 0xFF, 0xFF), rgb(0x9E, 0xCA, 0xE1), rgb(0x31, 0x82, 0xBD)});
        scf.addConditionalFormatting(new org.apache.poi.ss.util.CellRangeAddress[] {
            new org.apache.poi.ss.util.CellRangeAddress(1, rows.last(), column, column)}, rule);
    }

    private static org.apache.poi.xssf.usermodel.XSSFColor rgb(int r, int g, int b) {
        return new org.apache.poi.xssf.usermodel.XSSFColor(new byte[] {(byte) r, (byte) g, (byte) b}, null);
    }

    /** Characters of column width a landscape page holds while the print stays legible (about 70 % scale). */
    private static final int PAGE_CHARACTERS = 190;

    /**
     * Landscape; as many pages wide as the columns need to stay legible (one page for most sheets,
     * two or more for the widest), as many pages down as the rows need.
     */
    private static void printSetup(Sheet s, int totalWidth) {
        s.setFitToPage(true);
        s.getPrintSetup().setLandscape(true);
        s.getPrintSetup().setFitWidth((short) Math.max(1, (totalWidth + PAGE_CHARACTERS - 1) / PAGE_CHARACTERS));
        s.getPrintSetup().setFitHeight((short) 0);
        if (totalWidth > PAGE_CHARACTERS) {
            // printed more than one page wide: every page repeats the first column (the sample), so
            // that a right-hand page still says whose row it is
            s.setRepeatingColumns(org.apache.poi.ss.util.CellRangeAddress.valueOf("A:A"));
        }
    }

    private static void readMe(Workbook wb, Styles st, AnalysisResult r) {
        Sheet s = wb.createSheet("Read me");
        Rows rows = new Rows(st, s);
        rows.styled(st.title, "Viscarta report: oscillatory measurements of soft, lossy materials");
        rows.blank();
        rows.paragraph(st.bold, st.wrap, "What this is", Statements.whatThisIs(r) + " Every number can be traced to its input "
                + "file and line (sheet Data) and to the command that made it (sheet Provenance).", LABEL_WIDTH, TEXT_WIDTH);
        if (r.inputs().isDemo()) {
            rows.paragraph(st.bold, st.wrap, "Demo data", Texts.DEMO, LABEL_WIDTH, TEXT_WIDTH);
        }
        rows.blank();
        rows.styled(st.header, "Sheet", "What it holds");
        for (String[] sh : Texts.sheets(r.request())) {
            rows.paragraph(st.wrap, st.wrap, sh[0], sh[1], LABEL_WIDTH, TEXT_WIDTH);
        }
        rows.blank();
        rows.styled(st.header, "Term", "Meaning");
        for (String[] d : Texts.definitions(r)) {
            rows.paragraph(st.bold, st.wrap, d[0], d[1], LABEL_WIDTH, TEXT_WIDTH);
        }
        rows.blank();
        rows.styled(st.header, "Cautions");
        for (String caution : Texts.cautions(r)) {
            rows.paragraph(st.wrap, st.wrap, "", caution, LABEL_WIDTH, TEXT_WIDTH);
        }
        List<String> warnings = r.inputs().warningTexts();
        if (!warnings.isEmpty()) {
            rows.blank();
            rows.styled(st.header, "Warnings and notes", "(" + warnings.size() + "; also listed in Provenance)");
            for (String w : warnings) {
                rows.paragraph(st.wrap, st.wrap, "", w, LABEL_WIDTH, TEXT_WIDTH);
            }
        }
        widths(s, LABEL_WIDTH, TEXT_WIDTH);
    }

    private static void groupComparison(Workbook wb, Styles st, org.viscarta.analysis.Ranking ranking) {
        Sheet s = wb.createSheet("Group comparison");
        Rows rows = new Rows(st, s);
        rows.styled(st.title, "Which differences in damping are supported, within each comparable set");
        if (ranking.sets().isEmpty()) {
            rows.row("No comparable set holds two or more samples, so nothing was compared.");
        }
        for (org.viscarta.analysis.Ranking.RankedSet set : ranking.sets()) {
            rows.blank();
            rows.styled(st.title, set.label());
            comparison(rows, st, set.result().comparison());
        }
        widths(s, GROUP_COMPARISON_COLUMNS);
    }

    /** Widths of the Group comparison and Temperature series sheets' columns, summed [characters]. */
    private static final int[] GROUP_COMPARISON_COLUMNS = {28, 28, 14, 14, 14, 16, 14};
    private static final int[] TEMPERATURE_SERIES_COLUMNS = {16, 14, 16, 14, 14, 14, 10, 12};
    private static final int GROUP_COMPARISON_WIDTH = java.util.Arrays.stream(GROUP_COMPARISON_COLUMNS).sum();
    private static final int TEMPERATURE_SERIES_WIDTH = java.util.Arrays.stream(TEMPERATURE_SERIES_COLUMNS).sum();

    private static void comparison(Rows rows, Styles st, DampingComparison.Result cmp) {
        for (String statement : cmp.statements()) {
            rows.sentence(st.wrap, statement, 6, GROUP_COMPARISON_WIDTH);
        }
        rows.blank();
        rows.use(null, null, st.dec2, st.dec2, st.pValue, st.pValue);
        rows.heading(GROUP_COMPARISON_COLUMNS, "sample", "other sample", "Welch t [–]", "degrees of freedom [–]", "p [–]", "Holm-adjusted p [–]",
                "supported at α = " + Numbers.plain(cmp.alpha()));
        for (DampingComparison.Pair p : cmp.pairs()) {
            rows.row(p.first(), p.second(), p.welch().t(), p.welch().df(), p.welch().p(), p.pHolm(), p.significant() ? "yes" : "no");
        }
        if (!cmp.groups().isEmpty()) {
            rows.blank();
            rows.use(null, st.integer, st.dec4, st.dec4, st.dec4, st.dec4, st.integer);
            rows.heading(GROUP_COMPARISON_COLUMNS, "group", "samples", "tan δ mean [–]", "tan δ SD [–]", "tan δ 95 % CI low [–]", "tan δ 95 % CI high [–]",
                    "values");
            for (DampingComparison.GroupSummary g : cmp.groups()) {
                rows.row(g.group(), g.samples(), g.values().mean(), g.values().sd(), g.values().ci95Low(), g.values().ci95High(),
                        g.values().n());
            }
            if (cmp.anova() != null) {
                rows.blank();
                rows.use(null, st.dec2, st.integer, st.integer, st.pValue);
                rows.heading(GROUP_COMPARISON_COLUMNS, "test across groups", "statistic", "df1 [–]", "df2 [–]", "p [–]");
                rows.row("one-way ANOVA (F)", cmp.anova().statistic(), cmp.anova().df1(), cmp.anova().df2(), cmp.anova().p());
                rows.row("Kruskal–Wallis (H)", cmp.kruskal().statistic(), cmp.kruskal().df1(), null, cmp.kruskal().p());
            }
        }
    }

    private static void temperatureSeries(Workbook wb, Styles st, AnalysisResult res) {
        Sheet s = wb.createSheet("Temperature series");
        Rows rows = new Rows(st, s, st.dec2, st.dec4, st.dec4, st.sci, st.dec4, null);
        int[] widths = TEMPERATURE_SERIES_COLUMNS;
        for (TemperatureSeries ts : res.series()) {
            ShiftAnalysis.Result r = ts.result();
            rows.styled(st.title, ts.sample() + ": time–temperature superposition at " + Numbers.plain(r.referenceC()) + " °C");
            for (String n : r.notes()) {
                rows.sentence(st.wrap, n, 7, TEMPERATURE_SERIES_WIDTH);
            }
            rows.row("The master curve is analysed as the sample '" + ts.masterName() + "' in the other sheets.");
            rows.use(st.dec2, st.dec4, st.dec4, st.sci, st.dec4, null);
            rows.heading(widths, "temperature [°C]", "log10 a_T [–]", "log10 a_T standard error [–]", "a_T [–]", "b_T [–]", "placed");
            for (ShiftAnalysis.Factor f : r.factors()) {
                rows.row(f.temperatureC(), f.log10aT(), f.log10aTStdError(), f.placed() ? f.aT() : null, f.bT(), f.placed() ? "yes" : "no");
            }
            rows.use(null, null, st.sci, st.sci, st.sci, st.sci, null, st.dec2);
            rows.heading(widths, "law", "parameter", "value", "standard error", "95 % CI low", "95 % CI high", "unit", "AICc [–]");
            for (ShiftFits.Fit fit : java.util.Arrays.asList(r.wlf(), r.arrhenius())) {
                if (fit == null) {
                    continue;
                }
                for (ShiftFits.Parameter p : fit.parameters()) {
                    rows.row(fit.law(), p.name(), p.value(), p.stdError(), p.ci95Low(), p.ci95High(), p.unit(), fit.aicc());
                }
            }
            rows.blank();
        }
        widths(s, widths);
    }

    private static void provenance(Workbook wb, Styles st, ReportContent c) {
        Sheet s = wb.createSheet("Provenance");
        Rows rows = new Rows(st, s, null, null, null, null, null, null, st.integer);
        Provenance p = c.provenance();
        rows.styled(st.title, "Provenance");
        rows.row("tool", "Viscarta " + p.toolVersion());
        rows.paragraph(st.wrap, st.wrap, "command line", p.commandLine(), 30, 60);
        rows.row("run at (UTC)", p.runAtUtc());
        rows.row("Java runtime", System.getProperty("java.version"));
        rows.blank();
        rows.styled(st.header, "setting", "value");
        for (Map.Entry<String, String> e : Statements.settings(c.result().request()).entrySet()) {
            rows.paragraph(st.wrap, st.wrap, e.getKey(), e.getValue(), 30, 60);
        }
        rows.blank();
        rows.styled(st.header, "input file", "SHA-256", "layout", "separator", "decimal mark", "encoding", "sweeps");
        for (SweepFile f : c.result().inputs().files()) {
            rows.row(f.path().toString(), f.sha256(), f.info().layout(), f.info().separatorName(),
                    String.valueOf(f.info().decimalMark()), f.info().encoding(), f.sweeps().size());
        }
        if (c.result().inputs().files().stream().anyMatch(f -> !f.info().metadata().isEmpty())) {
            rows.blank();
            rows.styled(st.header, "input file: metadata or preamble note", "value");
            for (SweepFile f : c.result().inputs().files()) {
                for (Map.Entry<String, String> e : f.info().metadata().entrySet()) {
                    rows.paragraph(st.wrap, st.wrap, f.path().getFileName() + ": " + (e.getKey().startsWith("note_")
                            ? "note " + e.getKey().substring(5) : e.getKey()), e.getValue(), 30, 60);
                }
            }
        }
        rows.blank();
        List<String> warnings = c.result().inputs().warningTexts();
        rows.styled(st.header, "warnings and conversions (" + warnings.size() + ")");
        for (String w : warnings) {
            rows.row(w);
        }
        widths(s, 30, 60, 24, 12, 12, 14, 66);
    }

    /** How a map's positions were placed, in words. */
    public static String mapSetup(org.viscarta.analysis.Maps.Mapped m) {
        org.viscarta.map.MapSetup su = m.setup();
        return (su.imageFile() == null ? "no image" : "image " + su.imageFile().getFileName() + ", registered by "
                + su.registration().describe()) + "; " + (su.regions() == null ? "no regions" : su.regions().describe());
    }

    /** The comparison between a specimen's regions and its spatial autocorrelation, in words. */
    static List<String> regionStatements(org.viscarta.map.MapAnalysis.Specimen s) {
        List<String> out = new java.util.ArrayList<>();
        out.add(s.name() + ":");
        for (org.viscarta.compare.DampingComparison.Result t : new org.viscarta.compare.DampingComparison.Result[] {s.storageTest(),
            s.tanDeltaTest()}) {
            if (t != null) {
                t.statements().forEach(x -> out.add("  " + x));
            }
        }
        if (s.moranStorage() != null) {
            out.add(String.format(java.util.Locale.ROOT, "  Moran's I of log E′ = %.3f (expected %.3f, z = %.1f, p %s) with neighbours "
                    + "within %s µm%s.", s.moranStorage().i(), s.moranStorage().expected(), s.moranStorage().z(),
                    org.viscarta.compare.DampingComparison.pText(s.moranStorage().p()),
                    org.viscarta.sweep.Numbers.plain(s.moranStorage().distanceM() * 1e6), s.moranTanDelta() == null ? ""
                    : String.format(java.util.Locale.ROOT, "; of tan δ = %.3f (z = %.1f)", s.moranTanDelta().i(), s.moranTanDelta().z())));
        }
        return out;
    }
}
