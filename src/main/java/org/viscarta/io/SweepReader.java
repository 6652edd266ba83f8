package org.viscarta.io;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.Charset;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.viscarta.io.SweepSinks.Bucket;
import org.viscarta.io.SweepSinks.ExtentSink;
import org.viscarta.io.SweepSinks.Key;
import org.viscarta.io.SweepSinks.Sink;
import org.viscarta.io.SweepSinks.SweepSink;
import org.viscarta.io.TableStart.Line;
import org.viscarta.io.TableStart.Lines;
import org.viscarta.io.TableStart.Start;
import org.viscarta.sweep.ModulusKind;
import org.viscarta.sweep.Quantity;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;
import org.viscarta.sweep.TimeTest;
import org.viscarta.sweep.Unit;

/**
 * Reads a sweep table (PRODUCT.md "Sweep table"): optional {@code # key: value} metadata lines,
 * one header row naming quantities and units, then data. One sample per file, or a tidy table
 * with {@code sample}, {@code replicate}, {@code group} and {@code temperature} columns.
 * Values are converted to SI on reading. Any problem is an {@link InputException} naming the
 * file, line and column.
 */
public final class SweepReader {

    private static final Pattern DECIMAL_COMMA_CELL = Pattern.compile("[+-]?\\d+,\\d+([eE][+-]?\\d+)?");
    private static final Pattern META_VALUE_WITH_UNIT = Pattern.compile("^\\s*([+-]?[0-9.]+(?:[eE][+-]?\\d+)?)\\s*(.*)$");

    private final ModulusKind declaredKind;
    private final Map<String, String> columnMap;

    /**
     * @param declaredKind what the moduli are when neither headers nor metadata say; null means
     *                     "assume tensile and say so"
     */
    public SweepReader(ModulusKind declaredKind) {
        this(declaredKind, Map.of());
    }

    /**
     * @param columnMap headers (as written) mapped to what they hold, e.g. {@code "Gstar_abs_Pa" → "complex_modulus_magnitude [Pa]"}
     */
    public SweepReader(ModulusKind declaredKind, Map<String, String> columnMap) {
        this.declaredKind = declaredKind;
        this.columnMap = Map.copyOf(columnMap);
    }

    /** Reads one file. */
    public SweepFile read(Path path) {
        return readWhole(path);
    }

    private SweepFile readWhole(Path path) {
        String name = path.getFileName().toString().toLowerCase(Locale.ROOT);
        if (name.endsWith(".xlsx") || name.endsWith(".xls")) {
            return readWorkbook(path);
        }
        return decoded(path, cs -> new SweepSink(path));
    }

    /**
     * Streams a text file through {@link #scan} as UTF-8, and again as windows-1252 when it is not
     * valid UTF-8; the sink's checksum is taken from the bytes as they pass.
     */
    private <T, B extends Bucket> T decoded(Path path, java.util.function.Function<Charset, Sink<T, B>> sinks) {
        try {
            return stream(path, StandardCharsets.UTF_8, sinks.apply(StandardCharsets.UTF_8));
        } catch (CharacterCodingException e) {
            try {
                Charset cp = Charset.forName("windows-1252");
                return stream(path, cp, sinks.apply(cp));
            } catch (CharacterCodingException impossible) {
                throw new InputException(path, 0, 0, "cannot decode the file");
            }
        }
    }

    /**
     * Files of at least this size are read ahead on a second thread ({@link Lines}): below it the
     * thread is not worth its start, and a folder of small files is read file by file in parallel
     * anyway.
     */
    static final long READ_AHEAD_BYTES = 1 << 20;

    private <T, B extends Bucket> T stream(Path path, Charset charset, Sink<T, B> sink) throws CharacterCodingException {
        java.nio.charset.CharsetDecoder decoder = charset.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                .onUnmappableCharacter(CodingErrorAction.REPORT);
        MessageDigest md;
        try {
            md = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is missing from this Java runtime", e);
        }
        try (java.io.InputStream raw = Files.newInputStream(path);
             java.security.DigestInputStream digest = new java.security.DigestInputStream(raw, md);
             java.io.BufferedReader in = new java.io.BufferedReader(new java.io.InputStreamReader(digest, decoder), 1 << 16);
             Lines lines = new Lines(in, Files.size(path) >= READ_AHEAD_BYTES)) {
            sink.checksum(() -> {
                lines.close(); // the reading thread, if any, has stopped: the digest is this thread's now
                try {
                    digest.transferTo(java.io.OutputStream.nullOutputStream()); // any bytes the reader left unread
                } catch (IOException e) {
                    throw new UncheckedIOException(e);
                }
                return HexFormat.of().formatHex(md.digest());
            });
            return scan(path, lines, charset.equals(StandardCharsets.UTF_8) ? "UTF-8" : "windows-1252", sink);
        } catch (java.nio.charset.MalformedInputException | java.nio.charset.UnmappableCharacterException e) {
            throw e;
        } catch (IOException | UncheckedIOException e) {
            throw new InputException(path, 0, 0, "cannot read the file (" + e.getMessage() + ")");
        }
    }

    /**
     * Reads every non-empty sheet of an XLSX or XLS workbook ({@link WorkbookText}: XLSX streamed)
     * as its own table — one sample per sheet (named after the sheet unless a '# sample:' cell says
     * otherwise), or a tidy table; cells holding formulas are read as their cached values.
     * Locations read {@code book.xlsx#Sheet:row:column}.
     */
    private SweepFile readWorkbook(Path path) {
        List<Sweep> sweeps = new ArrayList<>();
        List<org.viscarta.sweep.Ramp> ramps = new ArrayList<>();
        List<TimeTest> timeTests = new ArrayList<>();
        CappedWarnings warnings = new CappedWarnings(path);
        TableInfo[] first = new TableInfo[1];
        int[] sheets = new int[1];
        String sha;
        try {
            sha = sha256(path);
            WorkbookText.read(path, (sheet, text) -> {
                Path where = path.resolveSibling(path.getFileName() + "#" + sheet);
                SweepFile sf = scan(where, new java.io.BufferedReader(text, 1 << 16), "XLSX/XLS workbook, sheet '" + sheet + "'",
                        new SweepSink(where, ""));
                sweeps.addAll(sf.sweeps());
                ramps.addAll(sf.ramps());
                timeTests.addAll(sf.timeTests());
                warnings.addAll(sf.warnings());
                if (first[0] == null) {
                    first[0] = sf.info();
                }
                sheets[0]++;
            });
        } catch (IOException | RuntimeException e) {
            if (e instanceof InputException ie) {
                throw ie;
            }
            throw new InputException(path, 0, 0, "the workbook cannot be read (" + e.getMessage() + "); save it again from a "
                    + "spreadsheet program or export the sheet as CSV");
        }
        if (first[0] == null) {
            throw new InputException(path, 1, 0, "the workbook has no sheet with data");
        }
        TableInfo info = new TableInfo(new Layout.WorkbookSheets(sheets[0], first[0].kind()), '\t', '.', "XLSX/XLS",
                first[0].headerLine(), first[0].columns(), first[0].metadata());
        return new SweepFile(path, sha, info, sweeps, ramps, timeTests, warnings.closeOut());
    }

    /** The SHA-256 of a file's bytes, read in a stream. */
    private static String sha256(Path path) throws IOException {
        MessageDigest md;
        try {
            md = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is missing from this Java runtime", e);
        }
        try (java.io.InputStream in = new java.security.DigestInputStream(Files.newInputStream(path), md)) {
            in.transferTo(java.io.OutputStream.nullOutputStream());
        }
        return HexFormat.of().formatHex(md.digest());
    }

    /**
     * The one row pipeline of every sweep table, for both sinks. A table starts at the first row
     * that looks like a header (text cells only) followed, after an optional units row, by data
     * rows; the lines before it are a preamble ('# key: value' lines, and unmarked 'key: value',
     * 'key&lt;separator&gt;value' lines) read into the metadata. The separator comes from the header
     * line, the decimal mark from the first {@value #SNIFFED_ROWS} rows; a wide layout is read
     * whole. Every data row is validated once — field count, labels, numbers, one group per sample —
     * and handed to the sink. A footer (a lone line of text), a 'key: value' line or a new header
     * row ends a block; the next block may bring its own preamble and header, or continue under the
     * previous header, and its sweeps are sweeps of their own.
     *
     * @param encoding how the text was decoded ("UTF-8" gains "with byte-order mark" when one leads the text)
     */
    private <T, B extends Bucket> T scan(Path path, java.io.BufferedReader in, String encoding, Sink<T, B> sink) throws IOException {
        return scan(path, new Lines(in), encoding, sink);
    }

    private <T, B extends Bucket> T scan(Path path, Lines src, String encoding, Sink<T, B> sink) throws IOException {
        Preamble pre = new Preamble(path);
        CappedWarnings warnings = new CappedWarnings(path);
        Start start = TableStart.findStart(src, pre, 0, false);
        Line headerLine;
        Line unitsLine = null;
        if (start == null || start.header() == null) {
            if (pre.seen.isEmpty()) {
                if (!pre.any) {
                    throw new InputException(path, 1, 0, "the file is empty; a sweep table needs a header row and data rows");
                }
                throw new InputException(path, Math.max(1, src.count()), 0, "no header row found; after the '# key: value' lines, "
                        + "write a header such as 'frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]'");
            }
            // no row looks like a header followed by numbers: the first line that is not a comment is the header
            headerLine = pre.seen.get(0);
            src.pushBack(pre.seen.subList(1, pre.seen.size()));
            pre.reset();
        } else {
            headerLine = start.header();
            unitsLine = start.units();
        }
        String enc = src.bom && encoding.equals("UTF-8") ? "UTF-8 with byte-order mark" : encoding;
        char sep = TableStart.detectSeparator(headerLine.text());
        src.splitAt(sep);
        Row headerRow = withUnits(path, row(path, headerLine.text(), headerLine.number(), sep),
                unitsLine == null ? null : row(path, unitsLine.text(), unitsLine.number(), sep));
        List<Row> first = new ArrayList<>();
        first.add(headerRow);
        List<Line> sniffed = src.peek(SNIFFED_ROWS);
        for (Line l : sniffed) {
            if (!l.text().isBlank() && !l.comment()) {
                first.add(row(path, l.text(), l.number(), sep));
            }
        }
        if (wideLayout(path, first, pre.metadata, pre.lines, enc, "", sep) != null) {
            List<Row> all = new ArrayList<>(List.of(headerRow));
            Line l;
            while ((l = src.next()) != null) {
                if (!l.text().isBlank() && !l.comment()) {
                    all.add(row(path, l.text(), l.number(), sep));
                }
            }
            return sink.wide(wideLayout(path, all, pre.metadata, pre.lines, enc, sink.sha(), sep));
        }
        char dm = detectDecimalMark(sep, first);
        Header hd = header(path, headerRow, pre.metadata, pre.lines, warnings, true);
        Header firstHeader = hd;
        Map<String, String> firstMetadata = new LinkedHashMap<>(pre.metadata);
        Map<String, String> notes = new LinkedHashMap<>(pre.notes);
        RowParser<B> rp = new RowParser<>(path, dm, sink, warnings);
        rp.block(hd, pre.metadata, pre.lines);
        int blocks = 1;
        while (true) {
            readBlock(path, src, sep, dm, hd, rp);
            Preamble next = new Preamble(path);
            next.inherit(firstMetadata);
            Start s = TableStart.findStart(src, next, hd == null ? 0 : hd.columns().size(), true);
            notes.putAll(next.notes);
            if (s == null) {
                break;
            }
            if (s.header() != null) {
                Row h = withUnits(path, row(path, s.header().text(), s.header().number(), sep),
                        s.units() == null ? null : row(path, s.units().text(), s.units().number(), sep));
                Header nh = header(path, h, next.metadata, next.lines, warnings, false);
                if (nh == null) {
                    warnings.add(new ReadWarning(path, h.line(), "the table under the header on line " + h.line()
                            + " has no frequency column and is not a sweep table; it is left out"));
                    hd = null;
                    continue;
                }
                hd = nh;
            } else if (hd == null) {
                continue;
            }
            blocks++;
            rp.block(hd, next.metadata, next.lines);
        }
        if (rp.all.isEmpty()) {
            if (rp.skippedLines.isEmpty()) {
                throw new InputException(path, headerRow.line(), 0, "the header is not followed by any data rows");
            }
            throw new InputException(path, rp.skippedLines.get(0), 0, "no data row can be used: every row has a blank or "
                    + "not-a-number cell in a needed column");
        }
        rp.finish(firstHeader);
        boolean tidy = firstHeader.byQuantity().containsKey(Quantity.SAMPLE) || firstHeader.byQuantity().containsKey(Quantity.REPLICATE);
        Layout layout = tidy ? new Layout.Tidy() : new Layout.OneSample();
        if (blocks > 1) {
            layout = new Layout.Blocks(blocks, layout);
        }
        Map<String, String> infoMeta = new LinkedHashMap<>(firstMetadata);
        notes.forEach((k, v) -> infoMeta.putIfAbsent("note_" + k, v));
        TableInfo info = new TableInfo(layout, sep, dm, enc, headerRow.line(), firstHeader.columns(), infoMeta);
        return sink.table(info, List.copyOf(rp.all), rp.attributes(), rp.ramps, warnings);
    }

    /** Rows read before the decimal mark and the layout are decided. */
    private static final int SNIFFED_ROWS = 1000;

    /** Reads data rows of one block into the parser, up to the end of the input or a line that ends the block (left unread). */
    private void readBlock(Path path, Lines src, char sep, char dm, Header hd, RowParser<?> rp) throws IOException {
        Line l;
        while ((l = src.next()) != null) {
            if (l.text().isBlank() || l.comment()) {
                continue;
            }
            List<String> split = l.cellsAt(sep);
            Row r = split != null ? new Row(l.number(), split) : row(path, l.text(), l.number(), sep);
            if (endsBlock(r.cells(), sep)) {
                src.pushBack(l);
                return;
            }
            if (hd != null) {
                rp.accept(r);
            }
        }
    }

    /** A footer or title (one cell of text), a 'key:' line, or a new header row with a frequency column. */
    private boolean endsBlock(List<String> cells, char sep) {
        if (!cells.isEmpty() && TableStart.numeric(cells.get(0), sep)) {
            return false; // the common case: a data row starting with a number
        }
        int filled = 0;
        String only = null;
        for (String c : cells) {
            if (!c.isEmpty()) {
                filled++;
                only = c;
            }
        }
        if (filled == 0) {
            return false;
        }
        if (filled == 1 && !TableStart.numeric(only, sep) && !TableStart.NOT_A_NUMBER.contains(only.toLowerCase(Locale.ROOT))) {
            return true;
        }
        if (cells.get(0).endsWith(":") && !TableStart.numeric(cells.get(0), sep)) {
            return true;
        }
        if (TableStart.headerLike(cells, sep)) {
            for (int i = 0; i < cells.size(); i++) {
                String h = cells.get(i);
                HeaderRecognizer.Result r = HeaderRecognizer.recognize(i, columnMap.getOrDefault(h, h));
                if (r.column() != null && (r.column().quantity() == Quantity.FREQUENCY || r.column().quantity() == Quantity.ANGULAR_FREQUENCY)) {
                    return true;
                }
            }
        }
        return false;
    }

    /** The header row with the units row's units written into it ("Storage modulus" + "Pa" → "Storage modulus [Pa]"). */
    private static Row withUnits(Path path, Row header, Row units) {
        if (units == null) {
            return header;
        }
        List<String> out = new ArrayList<>(header.cells());
        for (int i = 0; i < out.size() && i < units.size(); i++) {
            String u = units.get(i).strip();
            if (u.length() >= 2 && (u.charAt(0) == '[' || u.charAt(0) == '(')) {
                u = u.substring(1, u.length() - 1).strip();
            }
            if (!u.isEmpty() && !u.equals("-") && !out.get(i).isEmpty() && !Preamble.KEY_UNIT.matcher(out.get(i)).matches()) {
                out.set(i, out.get(i) + " [" + u + "]");
            }
        }
        return new Row(header.line(), out);
    }

    /**
     * What {@link #summarize} reports of one sweep, without its points.
     *
     * @param points number of points
     */
    public record SweepSummary(String sample, String replicate, String group, ModulusKind kind, double temperatureC, long points,
                               double minFrequencyHz, double maxFrequencyHz, String test) {

        /** A frequency sweep or ramp (no time-domain test). */
        public SweepSummary(String sample, String replicate, String group, ModulusKind kind, double temperatureC, long points,
                            double minFrequencyHz, double maxFrequencyHz) {
            this(sample, replicate, group, kind, temperatureC, points, minFrequencyHz, maxFrequencyHz, "");
        }
    }

    /** A file summarised: how it was understood, and each sweep's extent. */
    public record Summary(Path path, TableInfo info, List<SweepSummary> sweeps, List<ReadWarning> warnings) {
    }

    /** Warnings kept per file; the rest are counted. */
    /**
     * True for plain decimal numbers with an optional sign, fraction and exponent (see
     * {@link TableStart#isPlainNumber}).
     */
    public static boolean isPlainNumber(String t) {
        return TableStart.isPlainNumber(t);
    }

    /** {@link TableStart#plainValue}: the value of a plain number, NaN when the text is not one. */
    public static double plainValue(String t) {
        return TableStart.plainValue(t);
    }

    /**
     * Reads a sweep table in one streaming pass, keeping for each sweep only its labels, point count
     * and frequency range, so that memory does not grow with the file (a tidy CSV of any size). Every
     * row is validated as {@link #read} does. Workbooks and wide tables are read whole.
     */
    public Summary summarize(Path path) {
        String name = path.getFileName().toString().toLowerCase(Locale.ROOT);
        if (name.endsWith(".xlsx") || name.endsWith(".xls")) {
            return summaryOf(read(path));
        }
        return decoded(path, cs -> new ExtentSink(path));
    }

    static Summary summaryOf(SweepFile f) {
        List<SweepSummary> out = new ArrayList<>();
        for (Sweep s : f.sweeps()) {
            out.add(new SweepSummary(s.sample(), s.replicate(), s.group(), s.kind(), s.temperatureC(), s.points().size(),
                    s.minFrequencyHz(), s.maxFrequencyHz()));
        }
        return new Summary(f.path(), f.info(), out, f.warnings());
    }


    /**
     * Validates rows one at a time — the one row check of every layout but the wide one — into the
     * sink's buckets, block by block. Labels left blank below a label fill down; a point with a blank
     * or not-a-number cell in a needed column is left out and counted; a temperature column that
     * varies by up to {@value #SAME_TEMPERATURE_C} °C within a sweep is one sweep at the mean
     * temperature; descriptive columns are collected as attributes.
     */
    private final class RowParser<B extends Bucket> {
        private final Path path;
        private final char dm;
        private final Sink<?, B> sink;
        private final List<ReadWarning> warnings;
        private Header hd;
        private String defaultSample;
        private String defaultReplicate;
        private boolean replicateGiven;
        private String defaultGroup;
        private double defaultTemperature;
        private int block;
        private String lastSample;
        private String lastReplicate;
        private String lastGroup;
        private String lastTemperature;
        final Map<List<String>, List<B>> buckets = new LinkedHashMap<>();
        final List<B> all = new ArrayList<>();
        final List<Integer> skippedLines = new ArrayList<>();
        private int skipped;
        private final java.util.Set<String> unused = new java.util.LinkedHashSet<>();
        private final java.util.Set<String> varying = new java.util.LinkedHashSet<>();
        private final java.util.Set<String> attributeNames = new java.util.LinkedHashSet<>();
        private int disagreements;
        private int firstDisagreement;
        private String disagreementText;
        private B current;
        private Map<String, String> metadata = Map.of();

        RowParser(Path path, char dm, Sink<?, B> sink, List<ReadWarning> warnings) {
            this.path = path;
            this.dm = dm;
            this.sink = sink;
            this.warnings = warnings;
        }

        /** Starts a block under a header with its metadata. */
        void block(Header header, Map<String, String> blockMetadata, Map<String, Integer> metadataLines) {
            hd = header;
            ColumnSpec amplitude = amplitudeColumn(header.byQuantity());
            if (header.timeType() != null) {
                Map<String, String> m = new LinkedHashMap<>(blockMetadata);
                m.put(TimeTest.TYPE_KEY, header.timeType().name());
                metadata = org.viscarta.sweep.Metadata.inFileOrder(m);
            } else if (amplitude != null) {
                Map<String, String> m = new LinkedHashMap<>(blockMetadata);
                m.put(Sweep.AMPLITUDE_COLUMN, amplitude.quantity().canonical());
                metadata = org.viscarta.sweep.Metadata.inFileOrder(m);
            } else {
                metadata = org.viscarta.sweep.Metadata.inFileOrder(blockMetadata);
            }
            block++;
            defaultSample = blockMetadata.getOrDefault("sample", stem(path));
            replicateGiven = blockMetadata.containsKey("replicate");
            defaultReplicate = blockMetadata.getOrDefault("replicate", "1");
            defaultGroup = blockMetadata.getOrDefault("group", "");
            defaultTemperature = metadataTemperature(path, blockMetadata, metadataLines.getOrDefault("temperature", 0));
            lastSample = null;
            lastReplicate = null;
            lastGroup = null;
            lastTemperature = null;
            current = null;
            for (ColumnSpec c : header.columns()) {
                if (c.quantity() == Quantity.UNUSED) {
                    unused.add(c.header());
                } else if (c.quantity() == Quantity.ATTRIBUTE) {
                    attributeNames.add(c.header());
                }
            }
        }

        void accept(Row rec) {
            int line = rec.line();
            if (rec.size() == 1 && rec.get(0).isEmpty()) {
                return;
            }
            int width = hd.width();
            if (rec.size() > width) {
                for (int i = width; i < rec.size(); i++) {
                    if (!rec.get(i).isEmpty()) {
                        throw new InputException(path, line, width + 1, "row has " + rec.size()
                                + " fields but the header has " + width + "; fill or remove the missing or extra cells");
                    }
                }
            }
            for (int i : hd.unnamed()) {
                if (i < rec.size() && !rec.get(i).isEmpty()) {
                    throw new InputException(path, line, i + 1, "a value " + InputException.quote(rec.get(i))
                            + " in a column without a header; name the column or remove the value");
                }
            }
            Map<Quantity, ColumnSpec> q = hd.byQuantity();
            String sample = fill(rec, q.get(Quantity.SAMPLE), lastSample, defaultSample, line);
            String replicate = fill(rec, q.get(Quantity.REPLICATE), lastReplicate, defaultReplicate, line);
            String[] position = position(rec, q, line);
            String group = fill(rec, q.get(Quantity.GROUP), lastGroup, defaultGroup, line);
            lastSample = sample;
            lastReplicate = replicate;
            if (position != null) {
                // a measured position is a sweep of its own: the replicate label carries it
                replicate = replicate + Sweep.POSITION_SEPARATOR + position[0] + "," + position[1];
            }
            lastGroup = group;
            double temperature = defaultTemperature;
            ColumnSpec tc = q.get(Quantity.TEMPERATURE);
            if (tc != null) {
                String cell = cell(rec, tc.index());
                if (cell.isEmpty() && lastTemperature != null) {
                    cell = lastTemperature;
                }
                if (!TableStart.NOT_A_NUMBER.contains(cell.toLowerCase(Locale.ROOT))) {
                    temperature = number(cell, tc, dm, path, line);
                }
                lastTemperature = cell;
            }
            SweepPoint p = point(rec, q, dm, path, line, hd.fixedFrequencyHz());
            if (p == null) {
                skipped++;
                if (skippedLines.size() < 5) {
                    skippedLines.add(line);
                }
                return;
            }
            checkRedundant(rec, q, p, line);
            B b = bucketFor(sample, replicate, group, temperature, line, q);
            if (!Double.isNaN(temperature)) {
                b.temperatureSum += temperature;
                b.temperatureCount++;
            }
            if (position != null) {
                b.attributes.putIfAbsent(Sweep.X_M, position[0]);
                b.attributes.putIfAbsent(Sweep.Y_M, position[1]);
            }
            for (ColumnSpec c : hd.columns()) {
                if (c.quantity() == Quantity.ATTRIBUTE) {
                    String v = cell(rec, c.index());
                    if (!v.isEmpty()) {
                        String had = b.attributes.putIfAbsent(c.header(), v);
                        if (had != null && !had.equals(v)) {
                            varying.add(c.header());
                        }
                    }
                }
            }
            b.noteFrequency(p.frequencyHz());
            b.add(p, temperature, warnings);
        }

        /** The row's position [m] as exact text (x, y), or null when the table has no position columns. */
        private String[] position(Row rec, Map<Quantity, ColumnSpec> q, int line) {
            ColumnSpec xc = q.get(Quantity.POSITION_X);
            ColumnSpec yc = q.get(Quantity.POSITION_Y);
            if (xc == null || yc == null) {
                return null;
            }
            double x = number(cell(rec, xc.index()), xc, dm, path, line);
            double y = number(cell(rec, yc.index()), yc, dm, path, line);
            attributeNames.add(Sweep.X_M);
            attributeNames.add(Sweep.Y_M);
            return new String[] {Double.toString(x), Double.toString(y)};
        }

        private B bucketFor(String sample, String replicate, String group, double temperature, int line, Map<Quantity, ColumnSpec> q) {
            boolean ownReplicate = replicateGiven || q.containsKey(Quantity.REPLICATE) || q.containsKey(Quantity.POSITION_X);
            String rep = replicate;
            for (int k = 2; ; k++) {
                B b = find(sample, rep, temperature);
                if (b == null || ownReplicate || b.block == block) {
                    if (b == null) {
                        b = sink.bucket(new Key(sample, rep, group, hd.kind(), temperature, block, metadata), line);
                        buckets.computeIfAbsent(List.of(sample, rep), x -> new ArrayList<>()).add(b);
                        all.add(b);
                    }
                    if (!b.group.equals(group)) {
                        throw new InputException(path, line, q.get(Quantity.GROUP).index() + 1, "sample " + InputException.quote(sample)
                                + " is in group " + InputException.quote(b.group) + " on line " + b.firstLine + " but in group "
                                + InputException.quote(group) + " here; a sample belongs to one group");
                    }
                    current = b;
                    return b;
                }
                // a block without its own replicate label repeats a sample already read: its next replicate
                rep = Integer.toString(k);
            }
        }

        /** The sweep of this sample and replicate whose first temperature is within the tolerance, the current one first. */
        private B find(String sample, String replicate, double temperature) {
            if (current != null && current.sample.equals(sample) && current.replicate.equals(replicate)
                    && sameTemperature(current.firstTemperature, temperature)) {
                return current;
            }
            List<B> list = buckets.get(List.of(sample, replicate));
            if (list != null) {
                for (B b : list) {
                    if (sameTemperature(b.firstTemperature, temperature)) {
                        return b;
                    }
                }
            }
            return null;
        }

        private String fill(Row rec, ColumnSpec c, String last, String fallback, int line) {
            if (c == null) {
                return fallback;
            }
            String v = cell(rec, c.index());
            if (!v.isEmpty()) {
                return v;
            }
            if (last != null) {
                return last;
            }
            throw new InputException(path, line, c.index() + 1, "empty " + c.quantity().canonical()
                    + " cell; the first row of a table names its " + c.quantity().canonical() + " (rows below may leave it blank)");
        }

        private void checkRedundant(Row rec, Map<Quantity, ColumnSpec> q, SweepPoint p, int line) {
            ColumnSpec t = hd.redundantTangent();
            if (t == null) {
                return;
            }
            String cell = cell(rec, t.index());
            String c = dm == ',' ? cell.replace(',', '.') : cell;
            double plain = TableStart.plainValue(c);
            if (Double.isNaN(plain)) {
                return;
            }
            double v = plain * (t.unit() == null ? 1 : t.unit().toSi());
            double given = t.quantity() == Quantity.PHASE_ANGLE ? Math.tan(v) : v;
            double fromModuli = p.loss() / p.storage();
            if (Math.abs(given - fromModuli) > 0.01 * Math.abs(fromModuli) + 1e-12) {
                if (disagreements++ == 0) {
                    firstDisagreement = line;
                    disagreementText = String.format(Locale.ROOT, "tan δ %.4g there against E″/E′ = %.4g", given, fromModuli);
                }
            }
        }

        /** The descriptive columns that are constant over every sweep (the others are listed as not used). */
        List<String> attributes() {
            List<String> out = new ArrayList<>(attributeNames);
            out.removeAll(varying);
            return out;
        }

        /** The sample and replicate pairs read as temperature ramps (known once {@link #finish} ran). */
        final java.util.Set<List<String>> ramps = new java.util.HashSet<>();

        /**
         * A sample and replicate is a temperature ramp when its rows fall into five or more
         * temperatures but hold at most {@link SweepSinks#FEW_FREQUENCIES} distinct frequencies
         * (a frequency sweep at each of several temperatures has more).
         */
        private boolean isRamp(List<B> list) {
            if (list.size() < 5) {
                return false;
            }
            double[] seen = new double[SweepSinks.FEW_FREQUENCIES + 1];
            int n = 0;
            for (B b : list) {
                if (b.distinctFrequencies > SweepSinks.FEW_FREQUENCIES) {
                    return false;
                }
                outer:
                for (int i = 0; i < b.distinctFrequencies; i++) {
                    for (int j = 0; j < n; j++) {
                        if (SweepSinks.sameFrequency(seen[j], b.frequencies[i])) {
                            continue outer;
                        }
                    }
                    if (n == seen.length) {
                        return false;
                    }
                    seen[n++] = b.frequencies[i];
                }
            }
            return n <= SweepSinks.FEW_FREQUENCIES;
        }

        /** The file's summary warnings and which sample and replicate pairs are ramps, once every row is read. */
        void finish(Header first) {
            if (skipped > 0) {
                StringBuilder where = new StringBuilder();
                for (int i = 0; i < skippedLines.size(); i++) {
                    where.append(i == 0 ? "" : ", ").append(skippedLines.get(i));
                }
                if (skipped > skippedLines.size()) {
                    where.append(" and ").append(skipped - skippedLines.size()).append(" more");
                }
                warnings.add(new ReadWarning(path, skippedLines.get(0), skipped + (skipped == 1 ? " point was" : " points were")
                        + " left out: a blank or not-a-number cell ('', '--', 'NaN', 'n/a', '*') in a needed column, on line"
                        + (skipped == 1 ? " " : "s ") + where));
            }
            java.util.Set<String> notUsed = new java.util.LinkedHashSet<>(unused);
            notUsed.addAll(varying);
            if (!notUsed.isEmpty()) {
                StringBuilder sb = new StringBuilder();
                for (String h : notUsed) {
                    sb.append(sb.length() == 0 ? "" : ", ").append(InputException.quote(h));
                    if (varying.contains(h)) {
                        sb.append(" (varies within a sweep)");
                    } else if (h.equals(first.redundantTangentHeader())) {
                        sb.append(" (checked against E″/E′)");
                    }
                }
                warnings.add(new ReadWarning(path, first.line(), "columns not used in the analysis: " + sb));
            }
            if (disagreements > 0) {
                warnings.add(new ReadWarning(path, firstDisagreement, "the " + InputException.quote(first.redundantTangentHeader())
                        + " column disagrees with the moduli by more than 1 % on " + disagreements + " row(s), first here ("
                        + disagreementText + "); the moduli were used"));
            }
            for (Map.Entry<List<String>, List<B>> e : buckets.entrySet()) {
                if (first.timeType() == null && isRamp(e.getValue())) {
                    ramps.add(e.getKey());
                }
            }
        }
    }

    /** Temperatures of one sweep within this many °C of its first are one sweep (instrument exports log the measured temperature). */
    private static final double SAME_TEMPERATURE_C = 1.0;

    private static boolean sameTemperature(double a, double b) {
        return (Double.isNaN(a) && Double.isNaN(b)) || Math.abs(a - b) <= SAME_TEMPERATURE_C;
    }

    private static String cell(Row rec, int i) {
        return i < rec.size() ? rec.get(i) : "";
    }

    private static Row row(Path path, String line, int n, char sep) {
        if (line.indexOf('"') < 0) {
            return new Row(n, TableStart.splitPlain(line, sep));
        }
        CSVFormat format = CSVFormat.DEFAULT.builder().setDelimiter(sep).setIgnoreSurroundingSpaces(true).setTrim(true).get();
        try (CSVParser parser = CSVParser.parse(line, format)) {
            List<CSVRecord> recs = parser.getRecords();
            if (recs.size() != 1) {
                throw new InputException(path, n, 0, "the line cannot be read as one table row; check its quotes");
            }
            return new Row(n, recs.get(0).toList());
        } catch (IOException | UncheckedIOException e) {
            throw new InputException(path, n, 0, "the line cannot be read as a table row (" + e.getMessage() + "); check its quotes");
        }
    }

    /**
     * How the header row was understood.
     *
     * @param width            number of fields of the header (trailing empty ones left out)
     * @param unnamed          indices of columns without a header (their cells must stay empty)
     * @param redundantTangent a tan δ or phase column beside E′ and E″, checked against them (null for none)
     */
    private record Header(int line, List<ColumnSpec> columns, Map<Quantity, ColumnSpec> byQuantity, ModulusKind kind, int width,
                          List<Integer> unnamed, ColumnSpec redundantTangent, double fixedFrequencyHz, TimeTest.Type timeType) {
        String redundantTangentHeader() {
            return redundantTangent == null ? "" : redundantTangent.header();
        }
    }

    /**
     * Understands a header row: every column a quantity, a label, an attribute (a descriptive column
     * of unknown name, when the needed columns are all there), or not used (names lab exports carry
     * that the analysis does not need, and tan δ, phase, |E*|, compliances or viscosities beside
     * E′ and E″). When the needed columns are incomplete the error lists every header not understood,
     * each with the {@code --column} option that would map it.
     *
     * @param required false for a later block: a header without a frequency column gives null (a table that is not a sweep table)
     */
    private Header header(Path path, Row headerRecord, Map<String, String> metadata, Map<String, Integer> metadataLines,
                          List<ReadWarning> warnings, boolean required) {
        int headerLine = headerRecord.line();
        List<String> cells = TableStart.trimmed(headerRecord.cells());
        List<ColumnSpec> columns = new ArrayList<>();
        EnumMap<Quantity, ColumnSpec> byQuantity = new EnumMap<>(Quantity.class);
        List<Integer> unnamed = new ArrayList<>();
        List<Integer> unknown = new ArrayList<>();
        for (int c = 0; c < cells.size(); c++) {
            String h = cells.get(c);
            if (h.isEmpty()) {
                unnamed.add(c);
                continue;
            }
            String mapped = mapping(h);
            HeaderRecognizer.Result r = HeaderRecognizer.recognize(c, mapped == null ? h : mapped);
            if (r.column() == null) {
                if (mapped != null) {
                    throw new InputException(path, headerLine, c + 1, "--column \"" + InputException.oneLine(h) + "=" + mapped + "\": "
                            + r.problem());
                }
                if (r.nameKnown() && !HeaderRecognizer.isTime(h)) {
                    throw new InputException(path, headerLine, c + 1, r.problem() + ", or map it with --column \""
                            + InputException.oneLine(h) + "=quantity [unit]\"");
                }
                if (HeaderRecognizer.unneeded(h) || HeaderRecognizer.isTime(h)) {
                    columns.add(new ColumnSpec(c, h, Quantity.UNUSED, null, null));
                } else {
                    unknown.add(c);
                    columns.add(new ColumnSpec(c, h, Quantity.ATTRIBUTE, null, null));
                }
                continue;
            }
            ColumnSpec spec = r.column();
            if (mapped != null) {
                spec = new ColumnSpec(spec.index(), h, spec.quantity(), spec.unit(), spec.kindHint());
            }
            if (spec.quantity() == Quantity.QUALITY) {
                columns.add(spec);
                continue;
            }
            ColumnSpec prev = byQuantity.put(spec.quantity(), spec);
            if (prev != null) {
                throw new InputException(path, headerLine, c + 1, "columns " + (prev.index() + 1) + " and " + (c + 1)
                        + " both hold " + spec.quantity().canonical() + "; keep one of them, or map the other with --column \""
                        + InputException.oneLine(h) + "=ignore\"");
            }
            columns.add(spec);
        }
        boolean hasFrequency = byQuantity.containsKey(Quantity.FREQUENCY) || byQuantity.containsKey(Quantity.ANGULAR_FREQUENCY);
        TimeTest.Type timeType = byQuantity.containsKey(Quantity.RELAXATION_MODULUS) ? TimeTest.Type.RELAXATION
                : byQuantity.containsKey(Quantity.CREEP_COMPLIANCE) ? TimeTest.Type.CREEP : null;
        if (timeType == null) {
            // a clock column beside a frequency sweep is read past, as before
            ColumnSpec clock = byQuantity.remove(Quantity.TIME);
            if (clock != null) {
                columns.set(columns.indexOf(clock), new ColumnSpec(clock.index(), clock.header(), Quantity.UNUSED, clock.unit(), null));
            }
        } else {
            return timeDomainHeader(path, headerRecord, cells, columns, byQuantity, unnamed, timeType, hasFrequency, metadata,
                    metadataLines, warnings);
        }
        ColumnSpec amplitude = amplitudeColumn(byQuantity);
        boolean rampAtOneFrequency = byQuantity.containsKey(Quantity.TEMPERATURE) && metadata.containsKey("frequency");
        if (!required && !hasFrequency && amplitude == null && !rampAtOneFrequency) {
            return null;
        }
        double fixedHz = Double.NaN;
        if (!hasFrequency && (amplitude != null || rampAtOneFrequency) && metadata.containsKey("frequency")) {
            int at = metadataLines.getOrDefault("frequency", headerLine);
            try {
                Unit.Valued v = Unit.parse(metadata.get("frequency").strip(), Quantity.Dimension.FREQUENCY, Quantity.Dimension.ANGULAR_FREQUENCY);
                fixedHz = v.dimension() == Quantity.Dimension.ANGULAR_FREQUENCY ? v.si() / (2 * Math.PI) : v.si();
            } catch (IllegalArgumentException e) {
                throw new InputException(path, at, 0, "'frequency: " + metadata.get("frequency") + "' is not understood ("
                        + e.getMessage() + "); write e.g. 'frequency: 1 Hz'");
            }
            if (!(fixedHz > 0) || Double.isInfinite(fixedHz)) {
                throw new InputException(path, at, 0, "the frequency must be greater than zero");
            }
        }
        try {
            checkRequiredColumns(path, headerLine, byQuantity, amplitude, !Double.isNaN(fixedHz));
        } catch (InputException e) {
            if (unknown.isEmpty()) {
                throw e;
            }
            StringBuilder sb = new StringBuilder(e.problem()).append(". Not understood: ");
            for (int i = 0; i < unknown.size(); i++) {
                String h = cells.get(unknown.get(i));
                sb.append(i == 0 ? "" : ", ").append(InputException.quote(h)).append(" (column ").append(unknown.get(i) + 1).append(")");
            }
            sb.append("; map each with its own option, e.g.");
            int stress = 0;
            for (int i : unknown) {
                String g = guess(cells.get(i), stress);
                stress += g.startsWith("storage_modulus") || g.startsWith("loss_modulus") ? 1 : 0;
                sb.append(" --column \"").append(InputException.oneLine(cells.get(i).length() > 80 ? cells.get(i).substring(0, 80) : cells.get(i)))
                        .append('=').append(g).append('"');
            }
            throw new InputException(path, headerLine, unknown.get(0) + 1, sb.toString());
        }
        ColumnSpec redundant = null;
        if (byQuantity.containsKey(Quantity.STORAGE_MODULUS) && byQuantity.containsKey(Quantity.LOSS_MODULUS)) {
            for (Quantity extra : List.of(Quantity.LOSS_TANGENT, Quantity.PHASE_ANGLE, Quantity.COMPLEX_MODULUS_MAGNITUDE,
                    Quantity.STORAGE_COMPLIANCE, Quantity.LOSS_COMPLIANCE, Quantity.DYNAMIC_VISCOSITY, Quantity.OUT_OF_PHASE_VISCOSITY,
                    Quantity.COMPLEX_VISCOSITY_MAGNITUDE)) {
                ColumnSpec x = byQuantity.remove(extra);
                if (x == null) {
                    continue;
                }
                columns.set(columns.indexOf(x), new ColumnSpec(x.index(), x.header(), Quantity.UNUSED, x.unit(), null));
                if (redundant == null && (extra == Quantity.LOSS_TANGENT || extra == Quantity.PHASE_ANGLE)) {
                    redundant = x;
                }
            }
        }
        ModulusKind kind = resolveKind(path, headerLine, byQuantity, metadata, metadataLines, warnings);
        return new Header(headerLine, columns, byQuantity, kind, cells.size(), unnamed, redundant, fixedHz, null);
    }

    /**
     * The header of a time-domain test: a time column and one relaxation modulus or creep compliance
     * column (labels and descriptive columns as in any table); moduli of a frequency sweep beside them
     * are refused, a table holds one kind of test.
     */
    private Header timeDomainHeader(Path path, Row headerRecord, List<String> cells, List<ColumnSpec> columns,
                                    EnumMap<Quantity, ColumnSpec> byQuantity, List<Integer> unnamed, TimeTest.Type type,
                                    boolean hasFrequency, Map<String, String> metadata, Map<String, Integer> metadataLines,
                                    List<ReadWarning> warnings) {
        int headerLine = headerRecord.line();
        ColumnSpec measured = byQuantity.get(type == TimeTest.Type.RELAXATION ? Quantity.RELAXATION_MODULUS : Quantity.CREEP_COMPLIANCE);
        if (byQuantity.containsKey(Quantity.RELAXATION_MODULUS) && byQuantity.containsKey(Quantity.CREEP_COMPLIANCE)) {
            throw new InputException(path, headerLine, byQuantity.get(Quantity.CREEP_COMPLIANCE).index() + 1, "the table holds both a "
                    + "relaxation modulus and a creep compliance; a table holds one test, so split it in two");
        }
        for (Quantity sweepQuantity : List.of(Quantity.FREQUENCY, Quantity.ANGULAR_FREQUENCY, Quantity.STORAGE_MODULUS,
                Quantity.LOSS_MODULUS, Quantity.COMPLEX_MODULUS_MAGNITUDE, Quantity.STORAGE_COMPLIANCE, Quantity.LOSS_COMPLIANCE)) {
            if (byQuantity.containsKey(sweepQuantity)) {
                throw new InputException(path, headerLine, byQuantity.get(sweepQuantity).index() + 1, "the table holds a "
                        + type.test() + " test (column " + (measured.index() + 1) + ") and a frequency sweep's "
                        + sweepQuantity.canonical() + "; a table holds one kind of test, so split it in two");
            }
        }
        if (!byQuantity.containsKey(Quantity.TIME)) {
            throw new InputException(path, headerLine, 0, "a " + type.test() + " table needs the time since the step, in a "
                    + "column such as 'time [s]' (with its unit: s, ms, min or h)");
        }
        ModulusKind kind = resolveKind(path, headerLine, byQuantity, metadata, metadataLines, warnings);
        return new Header(headerLine, columns, byQuantity, kind, cells.size(), unnamed, null, Double.NaN, type);
    }

    /** The --column mapping of a header, looked up as written and without a units row's unit. */
    private String mapping(String header) {
        String m = columnMap.get(header);
        if (m == null) {
            Matcher u = Preamble.KEY_UNIT.matcher(header);
            if (u.matches()) {
                m = columnMap.get(u.group(1));
                if (m != null && !Preamble.KEY_UNIT.matcher(m).matches() && !m.equals("ignore") && !m.startsWith("quality_")) {
                    m = m + " [" + u.group(2) + "]";
                }
            }
        }
        return m;
    }

    /**
     * A likely mapping for an unknown header, for the error's suggestion (the user checks it): from
     * its name where it says, else from its unit (a stress unit: storage, then loss modulus), else ignore.
     *
     * @param stressSeen how many earlier suggestions were moduli
     */
    private static String guess(String header, int stressSeen) {
        Matcher u = Preamble.KEY_UNIT.matcher(header);
        String name = (u.matches() ? u.group(1) : header).toLowerCase(Locale.ROOT);
        String unitText = u.matches() ? u.group(2).strip() : "";
        Optional<Unit> unit = Unit.anyDimension(unitText);
        String bracket = unitText.isEmpty() ? "" : " [" + unitText + "]";
        Quantity.Dimension d = unit.map(Unit::dimension).orElse(null);
        if (name.contains("stor") || name.contains("elastic")) {
            return "storage_modulus" + (bracket.isEmpty() ? " [Pa]" : bracket);
        }
        if (name.contains("loss") && !name.contains("tan") && !name.contains("factor")) {
            return "loss_modulus" + (bracket.isEmpty() ? " [Pa]" : bracket);
        }
        if (name.contains("angular") || name.contains("omega") || name.contains("rad")) {
            return "angular_frequency" + (bracket.isEmpty() ? " [rad/s]" : bracket);
        }
        if (name.contains("freq") || d == Quantity.Dimension.FREQUENCY) {
            return "frequency" + (bracket.isEmpty() ? " [Hz]" : bracket);
        }
        if (d == Quantity.Dimension.ANGULAR_FREQUENCY) {
            return "angular_frequency" + bracket;
        }
        if (d == Quantity.Dimension.STRESS) {
            return (stressSeen % 2 == 0 ? "storage_modulus" : "loss_modulus") + bracket;
        }
        if (name.contains("tan") || name.contains("factor")) {
            return "loss_tangent";
        }
        if (name.contains("phase") || d == Quantity.Dimension.ANGLE) {
            return "phase_angle" + (bracket.isEmpty() ? " [deg]" : bracket);
        }
        if (name.contains("temp") || d == Quantity.Dimension.TEMPERATURE) {
            return "temperature [°C]";
        }
        if (name.contains("sample") || name.contains("specimen") || name.contains("name")) {
            return "sample";
        }
        return "ignore";
    }

    private static final Pattern WIDE_HEADER = Pattern.compile(
            "^(.+?)[\\s_]+(E'|E′|E''|E″|G'|G′|G''|G″|storage[ _]modulus|loss[ _]modulus)\\s*([\\[(][^\\])]*[\\])])$",
            Pattern.CASE_INSENSITIVE);

    /**
     * The wide layout spreadsheets produce: one frequency column, then a storage and a loss column per
     * sample, the sample's name leading each header ("gel A E' [kPa]", "gel A E'' [kPa]"). Returns null
     * when the header is not of this shape.
     */
    private SweepFile wideLayout(Path path, List<Row> records, Map<String, String> metadata, Map<String, Integer> metadataLines,
                                 String encoding, String sha, char sep) {
        Row header = records.get(0);
        int freqCol = -1;
        ColumnSpec freq = null;
        Map<String, ColumnSpec[]> bySample = new LinkedHashMap<>();
        List<ColumnSpec> columns = new ArrayList<>();
        for (int c = 0; c < header.size(); c++) {
            String h = header.get(c);
            HeaderRecognizer.Result r = HeaderRecognizer.recognize(c, columnMap.getOrDefault(h, h));
            if (r.column() != null && (r.column().quantity() == Quantity.FREQUENCY || r.column().quantity() == Quantity.ANGULAR_FREQUENCY)
                    && freqCol < 0) {
                freqCol = c;
                freq = new ColumnSpec(c, h, r.column().quantity(), r.column().unit(), null);
                columns.add(freq);
                continue;
            }
            Matcher m = WIDE_HEADER.matcher(h.strip());
            if (!m.matches()) {
                return null;
            }
            HeaderRecognizer.Result q = HeaderRecognizer.recognize(c, m.group(2) + " " + m.group(3));
            if (q.column() == null) {
                throw new InputException(path, header.line(), c + 1, q.problem());
            }
            ColumnSpec spec = new ColumnSpec(c, h, q.column().quantity(), q.column().unit(), q.column().kindHint());
            ColumnSpec[] pair = bySample.computeIfAbsent(m.group(1).strip(), k -> new ColumnSpec[2]);
            pair[spec.quantity() == Quantity.STORAGE_MODULUS ? 0 : 1] = spec;
            columns.add(spec);
        }
        if (freqCol < 0 || bySample.isEmpty()) {
            return null;
        }
        for (Map.Entry<String, ColumnSpec[]> e : bySample.entrySet()) {
            if (e.getValue()[0] == null || e.getValue()[1] == null) {
                throw new InputException(path, header.line(), 0, "sample '" + e.getKey() + "' has only one of its two moduli columns; "
                        + "a wide table gives each sample a storage and a loss column");
            }
        }
        CappedWarnings warnings = new CappedWarnings(path);
        Map<Quantity, ColumnSpec> kinds = new EnumMap<>(Quantity.class);
        kinds.put(Quantity.STORAGE_MODULUS, bySample.values().iterator().next()[0]);
        ModulusKind kind = resolveKind(path, header.line(), kinds, metadata, metadataLines, warnings);
        char dm = detectDecimalMark(sep, records);
        double temperature = metadataTemperature(path, metadata, metadataLines.getOrDefault("temperature", 0));
        List<Sweep> sweeps = new ArrayList<>();
        for (Map.Entry<String, ColumnSpec[]> e : bySample.entrySet()) {
            Map<Quantity, ColumnSpec> q = new EnumMap<>(Quantity.class);
            q.put(freq.quantity(), freq);
            q.put(Quantity.STORAGE_MODULUS, e.getValue()[0]);
            q.put(Quantity.LOSS_MODULUS, e.getValue()[1]);
            List<SweepPoint> pts = new ArrayList<>();
            for (int r = 1; r < records.size(); r++) {
                Row rec = records.get(r);
                if (rec.size() == 1 && rec.get(0).isEmpty()) {
                    continue;
                }
                if (rec.size() != header.size()) {
                    throw new InputException(path, rec.line(), Math.min(rec.size(), header.size()) + 1, "row has " + rec.size()
                            + " fields but the header has " + header.size() + "; fill or remove the missing or extra cells");
                }
                if (rec.get(e.getValue()[0].index()).isEmpty() && rec.get(e.getValue()[1].index()).isEmpty()) {
                    continue; // a sample measured at fewer frequencies than the others
                }
                SweepPoint p = point(rec, q, dm, path, rec.line());
                if (p != null) {
                    pts.add(p);
                }
            }
            if (pts.isEmpty()) {
                throw new InputException(path, header.line(), e.getValue()[0].index() + 1, "sample '" + e.getKey() + "' has no values");
            }
            Sweep sw = new Sweep(e.getKey(), metadata.getOrDefault("replicate", "1"), metadata.getOrDefault("group", ""), kind,
                    temperature, path, metadata, pts);
            SweepSinks.checkPoints(path, sw, warnings);
            sweeps.add(sw);
        }
        TableInfo info = new TableInfo(new Layout.Wide(), sep, dm, encoding, header.line(), columns,
                metadata);
        return new SweepFile(path, sha, info, sweeps, warnings.closeOut());
    }

    /** One table row with its 1-based line number. */
    private record Row(int line, List<String> cells) {
        int size() {
            return cells.size();
        }

        String get(int i) {
            return cells.get(i);
        }
    }

    /** The amplitude columns a table may carry; an amplitude sweep varies one of them at a fixed frequency. */
    private static final List<Quantity> AMPLITUDES = List.of(Quantity.STRAIN_AMPLITUDE, Quantity.STRESS_AMPLITUDE,
            Quantity.FORCE_AMPLITUDE, Quantity.DISPLACEMENT_AMPLITUDE);

    /** The table's amplitude column (the first of {@link #AMPLITUDES} present), or null. */
    private static ColumnSpec amplitudeColumn(Map<Quantity, ColumnSpec> q) {
        for (Quantity a : AMPLITUDES) {
            if (q.containsKey(a)) {
                return q.get(a);
            }
        }
        return null;
    }

    /**
     * @param amplitude      the table's amplitude column, or null
     * @param fixedFrequency whether the preamble gives the frequency (allowed for an amplitude sweep without a frequency column)
     */
    private static void checkRequiredColumns(Path path, int headerLine, Map<Quantity, ColumnSpec> q, ColumnSpec amplitude,
                                             boolean fixedFrequency) {
        if (!q.containsKey(Quantity.FREQUENCY) && !q.containsKey(Quantity.ANGULAR_FREQUENCY) && !fixedFrequency) {
            throw new InputException(path, headerLine, 0, amplitude != null
                    ? "an amplitude sweep needs its frequency: add a 'frequency [Hz]' column or a '# frequency: 1 Hz' line above the table"
                    : "no frequency column; add one named 'frequency [Hz]' or 'angular_frequency [rad/s]'");
        }
        if (q.containsKey(Quantity.FREQUENCY) && q.containsKey(Quantity.ANGULAR_FREQUENCY)) {
            throw new InputException(path, headerLine, q.get(Quantity.ANGULAR_FREQUENCY).index() + 1,
                    "both frequency and angular_frequency columns are present; keep one of them");
        }
        boolean pair = q.containsKey(Quantity.STORAGE_MODULUS) && q.containsKey(Quantity.LOSS_MODULUS);
        boolean angle = q.containsKey(Quantity.LOSS_TANGENT) || q.containsKey(Quantity.PHASE_ANGLE);
        boolean magnitude = (q.containsKey(Quantity.COMPLEX_MODULUS_MAGNITUDE) || q.containsKey(Quantity.COMPLEX_VISCOSITY_MAGNITUDE)) && angle;
        boolean compliance = q.containsKey(Quantity.STORAGE_COMPLIANCE) && q.containsKey(Quantity.LOSS_COMPLIANCE);
        boolean viscosity = q.containsKey(Quantity.DYNAMIC_VISCOSITY) && q.containsKey(Quantity.OUT_OF_PHASE_VISCOSITY);
        if (!pair && !magnitude && !compliance && !viscosity) {
            throw new InputException(path, headerLine, 0, "the moduli are incomplete; give storage_modulus and loss_modulus, "
                    + "complex_modulus_magnitude (or complex_viscosity_magnitude) with loss_tangent or phase_angle, "
                    + "storage_compliance and loss_compliance, or dynamic_viscosity and out_of_phase_viscosity");
        }
    }

    private ModulusKind resolveKind(Path path, int headerLine, Map<Quantity, ColumnSpec> q,
                                    Map<String, String> metadata, Map<String, Integer> metadataLines,
                                    List<ReadWarning> warnings) {
        ModulusKind fromHeaders = null;
        for (ColumnSpec c : q.values()) {
            if (c.kindHint() != null) {
                if (fromHeaders != null && fromHeaders != c.kindHint()) {
                    throw new InputException(path, headerLine, c.index() + 1,
                            "headers mix tensile (E) and shear (G) moduli; a table holds one kind");
                }
                fromHeaders = c.kindHint();
            }
        }
        ModulusKind fromMeta = null;
        String m = metadata.get("modulus");
        if (m != null) {
            fromMeta = ModulusKind.parse(m);
            if (fromMeta == null) {
                throw new InputException(path, metadataLines.getOrDefault("modulus", 0), 0,
                        "'modulus: " + m + "' is not understood; write 'modulus: tensile' or 'modulus: shear'");
            }
        }
        if (fromHeaders != null && fromMeta != null && fromHeaders != fromMeta) {
            throw new InputException(path, headerLine, 0, "the headers say " + fromHeaders + " moduli but the metadata say 'modulus: "
                    + m + "'; make them agree");
        }
        ModulusKind kind = fromHeaders != null ? fromHeaders : fromMeta != null ? fromMeta : declaredKind;
        if (kind == null) {
            warnings.add(new ReadWarning(path, headerLine, "neither the headers nor a '# modulus:' line say whether the moduli "
                    + "are tensile or shear; taken as tensile (E). Add '# modulus: shear' or pass --modulus shear if they are G"));
            kind = ModulusKind.TENSILE;
        }
        return kind;
    }

    /**
     * The point of one row in SI units, or null when a needed cell is blank or not a number
     * ({@link #TableStart.NOT_A_NUMBER}): the caller leaves the point out and counts it.
     */
    private static SweepPoint point(Row rec, Map<Quantity, ColumnSpec> q, char dm, Path path, int line) {
        return point(rec, q, dm, path, line, Double.NaN);
    }

    /** @param fixedHz the frequency of every row when the table has no frequency column (an amplitude sweep), else NaN */
    private static SweepPoint point(Row rec, Map<Quantity, ColumnSpec> q, char dm, Path path, int line, double fixedHz) {
        try {
            return pointOrThrow(rec, q, dm, path, line, fixedHz);
        } catch (MissingValue e) {
            return null;
        }
    }

    /** A needed cell that holds no value. */
    private static final class MissingValue extends RuntimeException {
        private static final long serialVersionUID = 1L;
        static final MissingValue INSTANCE = new MissingValue();

        private MissingValue() {
            super(null, null, false, false);
        }
    }

    private static double value(Row rec, ColumnSpec c, char dm, Path path, int line) {
        String cell = cell(rec, c.index());
        char first = cell.isEmpty() ? ' ' : cell.charAt(0);
        // a cell that starts with a digit or a point is no missing-value mark (they all start otherwise): no look-up
        if (!(first >= '0' && first <= '9' || first == '.')
                && (cell.isEmpty() || TableStart.NOT_A_NUMBER.contains(cell.toLowerCase(Locale.ROOT)))) {
            throw MissingValue.INSTANCE;
        }
        return number(cell, c, dm, path, line);
    }

    private static SweepPoint pointOrThrow(Row rec, Map<Quantity, ColumnSpec> q, char dm, Path path, int line, double fixedHz) {
        ColumnSpec measured = q.containsKey(Quantity.RELAXATION_MODULUS) ? q.get(Quantity.RELAXATION_MODULUS)
                : q.get(Quantity.CREEP_COMPLIANCE);
        if (measured != null) {
            // a time-domain point rides the sweep pipeline as (time, value, value); SweepSinks makes it a TimeTest.Point
            ColumnSpec tc = q.get(Quantity.TIME);
            double t = value(rec, tc, dm, path, line);
            if (!(t > 0) || Double.isInfinite(t)) {
                throw new InputException(path, line, tc.index() + 1, "time must be greater than zero (the step is at t = 0), found '"
                        + InputException.oneLine(cell(rec, tc.index())) + "'; leave out the points up to the step");
            }
            double v = value(rec, measured, dm, path, line);
            if (!(v > 0) || Double.isInfinite(v)) {
                throw new InputException(path, line, measured.index() + 1, measured.quantity().canonical() + " must be greater than "
                        + "zero, found '" + InputException.oneLine(cell(rec, measured.index())) + "'; remove or correct the row");
            }
            return new SweepPoint(t, v, v, line);
        }
        double f;
        ColumnSpec fc = q.containsKey(Quantity.FREQUENCY) ? q.get(Quantity.FREQUENCY) : q.get(Quantity.ANGULAR_FREQUENCY);
        f = fc == null ? fixedHz : value(rec, fc, dm, path, line);
        if (fc != null && fc.quantity() == Quantity.ANGULAR_FREQUENCY) {
            f = f / (2.0 * Math.PI);
        }
        if (fc != null && !(f > 0)) {
            throw new InputException(path, line, fc.index() + 1, "frequency must be greater than zero, found '"
                    + rec.get(fc.index()) + "'; remove the row or correct the value");
        }
        double storage;
        double loss;
        double omega = 2 * Math.PI * f;
        if (q.containsKey(Quantity.STORAGE_MODULUS) && q.containsKey(Quantity.LOSS_MODULUS)) {
            storage = value(rec, q.get(Quantity.STORAGE_MODULUS), dm, path, line);
            loss = value(rec, q.get(Quantity.LOSS_MODULUS), dm, path, line);
        } else if (q.containsKey(Quantity.STORAGE_COMPLIANCE) && q.containsKey(Quantity.LOSS_COMPLIANCE)) {
            // J* = J′ − iJ″ = 1/M* ⇒ M′ = J′/(J′² + J″²), M″ = J″/(J′² + J″²) (DOMAIN.md section 0)
            double jp = value(rec, q.get(Quantity.STORAGE_COMPLIANCE), dm, path, line);
            double jpp = value(rec, q.get(Quantity.LOSS_COMPLIANCE), dm, path, line);
            double n = jp * jp + jpp * jpp;
            if (!(n > 0)) {
                throw new InputException(path, line, q.get(Quantity.STORAGE_COMPLIANCE).index() + 1, "the compliances are both zero");
            }
            storage = jp / n;
            loss = jpp / n;
        } else if (q.containsKey(Quantity.DYNAMIC_VISCOSITY) && q.containsKey(Quantity.OUT_OF_PHASE_VISCOSITY)) {
            // η* = G*/(iω) = η′ − iη″ ⇒ G′ = ωη″, G″ = ωη′ (ISO 6721-10; DOMAIN.md section 1)
            loss = omega * value(rec, q.get(Quantity.DYNAMIC_VISCOSITY), dm, path, line);
            storage = omega * value(rec, q.get(Quantity.OUT_OF_PHASE_VISCOSITY), dm, path, line);
        } else {
            boolean viscous = !q.containsKey(Quantity.COMPLEX_MODULUS_MAGNITUDE);
            ColumnSpec mc = viscous ? q.get(Quantity.COMPLEX_VISCOSITY_MAGNITUDE) : q.get(Quantity.COMPLEX_MODULUS_MAGNITUDE);
            double mag = value(rec, mc, dm, path, line) * (viscous ? omega : 1);
            if (!(mag > 0)) {
                throw new InputException(path, line, mc.index() + 1, "|E*| must be greater than zero, found '"
                        + InputException.oneLine(cell(rec, mc.index())) + "'");
            }
            double delta;
            if (q.containsKey(Quantity.PHASE_ANGLE)) {
                delta = value(rec, q.get(Quantity.PHASE_ANGLE), dm, path, line);
            } else {
                delta = Math.atan(value(rec, q.get(Quantity.LOSS_TANGENT), dm, path, line));
            }
            storage = mag * Math.cos(delta);
            loss = mag * Math.sin(delta);
        }
        if (!(storage > 0)) {
            ColumnSpec sc = q.getOrDefault(Quantity.STORAGE_MODULUS, q.getOrDefault(Quantity.COMPLEX_MODULUS_MAGNITUDE,
                    q.getOrDefault(Quantity.STORAGE_COMPLIANCE, q.getOrDefault(Quantity.OUT_OF_PHASE_VISCOSITY,
                            q.get(Quantity.COMPLEX_VISCOSITY_MAGNITUDE)))));
            throw new InputException(path, line, sc.index() + 1, "storage modulus must be greater than zero, found "
                    + String.format(Locale.ROOT, "%g", storage) + " Pa; remove or correct the row");
        }
        double amplitude = Double.NaN;
        ColumnSpec ac = amplitudeColumn(q);
        if (ac != null) {
            amplitude = value(rec, ac, dm, path, line);
            if (!(amplitude > 0)) {
                throw new InputException(path, line, ac.index() + 1, ac.quantity().canonical() + " must be greater than zero, found '"
                        + InputException.oneLine(cell(rec, ac.index())) + "'; remove or correct the row");
            }
        }
        return new SweepPoint(f, storage, loss, line, amplitude);
    }

    private static double number(String cell, ColumnSpec c, char decimalMark, Path path, int line) {
        String t = decimalMark == ',' ? cell.replace(',', '.') : cell;
        if (t.isEmpty()) {
            throw new InputException(path, line, c.index() + 1, "empty cell in column '" + c.header()
                    + "'; fill it or remove the row");
        }
        double v = TableStart.plainValue(t);
        if (Double.isNaN(v)) {
            throw new InputException(path, line, c.index() + 1, InputException.quote(cell) + " in column "
                    + InputException.quote(c.header()) + " is not a number; write plain numbers such as 1250 or 1.25e3");
        }
        if (!Double.isFinite(v)) {
            throw new InputException(path, line, c.index() + 1, InputException.quote(cell) + " is too large to be a number");
        }
        double si = c.unit() == null ? v : v * c.unit().toSi();
        if (!Double.isFinite(si)) {
            throw new InputException(path, line, c.index() + 1, InputException.quote(cell) + " " + c.unit().symbol()
                    + " is too large once converted to SI units");
        }
        return si;
    }


    /**
     * The test temperature [°C] a '# temperature:' line gives ("23 °C", "23"), NaN when there is none;
     * the one reading of it for sweep tables and raw signals.
     *
     * @throws InputException at {@code line} when it is not a plausible temperature in °C
     */
    public static double metadataTemperature(Path path, Map<String, String> metadata, int line) {
        String t = metadata.get("temperature");
        if (t == null) {
            return Double.NaN;
        }
        Matcher m = META_VALUE_WITH_UNIT.matcher(t);
        if (!m.matches()) {
            throw new InputException(path, line, 0, "'# temperature: " + t + "' is not understood; write e.g. '# temperature: 23 °C'");
        }
        String u = m.group(2).strip();
        if (!u.isEmpty() && Unit.find(u, Quantity.Dimension.TEMPERATURE).isEmpty()) {
            throw new InputException(path, line, 0, "'# temperature: " + t + "' has an unknown unit; write it in °C");
        }
        double value = Double.parseDouble(m.group(1));
        if (!(value >= -273.15 && value <= 2000)) {
            throw new InputException(path, line, 0, "'temperature: " + InputException.oneLine(t0(metadata)) + "' is not a plausible "
                    + "temperature in °C (from -273.15 to 2000)");
        }
        return value;
    }

    private static String t0(Map<String, String> metadata) {
        String t = metadata.get("temperature");
        return t.length() > 80 ? t.substring(0, 80) + "…" : t;
    }

    private static char detectDecimalMark(char sep, List<Row> records) {
        if (sep == ',') {
            return '.';
        }
        for (int r = 1; r < records.size(); r++) {
            for (String cell : records.get(r).cells()) {
                if (DECIMAL_COMMA_CELL.matcher(cell).matches()) {
                    return ',';
                }
            }
        }
        return '.';
    }

    /** Text as every sweep table is decoded: UTF-8 (with or without byte-order mark), else windows-1252. */
    public static String decodeText(byte[] bytes) {
        return decode(bytes, new String[1]);
    }

    private static String decode(byte[] bytes, String[] encodingUsed) {
        int offset = bytes.length >= 3 && (bytes[0] & 0xFF) == 0xEF && (bytes[1] & 0xFF) == 0xBB
                && (bytes[2] & 0xFF) == 0xBF ? 3 : 0;
        ByteBuffer buf = ByteBuffer.wrap(bytes, offset, bytes.length - offset);
        try {
            String s = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT).decode(buf).toString();
            encodingUsed[0] = offset == 3 ? "UTF-8 with byte-order mark" : "UTF-8";
            return s;
        } catch (CharacterCodingException e) {
            encodingUsed[0] = "windows-1252";
            return new String(bytes, offset, bytes.length - offset, Charset.forName("windows-1252"));
        }
    }

    private static String stem(Path path) {
        String n = path.getFileName().toString();
        int sheet = n.indexOf(".xls");
        if (sheet > 0 && n.indexOf('#', sheet) > 0) {
            return n.substring(n.indexOf('#', sheet) + 1);
        }
        int dot = n.lastIndexOf('.');
        return dot > 0 ? n.substring(0, dot) : n;
    }

    /** Hex SHA-256 of a byte array. */
    public static String sha256(byte[] bytes) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is missing from this Java runtime", e);
        }
    }
}
