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
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.viscarta.sweep.ModulusKind;
import org.viscarta.sweep.Quantity;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;
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
        SweepFile f = readWhole(path);
        if (f.warnings().size() <= MAX_WARNINGS) {
            return f;
        }
        List<ReadWarning> kept = new ArrayList<>(f.warnings().subList(0, MAX_WARNINGS));
        kept.add(new ReadWarning(path, 0, (f.warnings().size() - MAX_WARNINGS) + " more warnings like the above"));
        return new SweepFile(f.path(), f.sha256(), f.info(), f.sweeps(), kept);
    }

    private SweepFile readWhole(Path path) {
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(path);
        } catch (IOException e) {
            throw new InputException(path, 0, 0, "cannot read the file (" + e.getMessage() + ")");
        }
        String name = path.getFileName().toString().toLowerCase(Locale.ROOT);
        if (name.endsWith(".xlsx") || name.endsWith(".xls")) {
            return readWorkbook(path, bytes);
        }
        String[] encodingUsed = new String[1];
        String text = decode(bytes, encodingUsed);
        if (text.isBlank()) {
            throw new InputException(path, 1, 0, "the file is empty; a sweep table needs a header row and data rows");
        }
        return parse(path, text, encodingUsed[0], sha256(bytes));
    }

    /**
     * Reads every non-empty sheet of an XLSX or XLS workbook (Apache POI) as its own table — one
     * sample per sheet (named after the sheet unless a '# sample:' cell says otherwise), or a tidy
     * table; cells holding formulas are read as their cached values. Locations read
     * {@code book.xlsx#Sheet:row:column}.
     */
    private SweepFile readWorkbook(Path path, byte[] bytes) {
        List<Sweep> sweeps = new ArrayList<>();
        List<ReadWarning> warnings = new ArrayList<>();
        TableInfo first = null;
        int sheets = 0;
        try (org.apache.poi.ss.usermodel.Workbook wb = org.apache.poi.ss.usermodel.WorkbookFactory.create(
                new java.io.ByteArrayInputStream(bytes))) {
            org.apache.poi.ss.usermodel.DataFormatter fmt = new org.apache.poi.ss.usermodel.DataFormatter(Locale.ROOT);
            for (org.apache.poi.ss.usermodel.Sheet sheet : wb) {
                StringBuilder text = new StringBuilder();
                int last = sheet.getLastRowNum();
                boolean any = false;
                for (int r = 0; r <= last; r++) {
                    org.apache.poi.ss.usermodel.Row row = sheet.getRow(r);
                    if (row != null) {
                        short lastCell = row.getLastCellNum();
                        List<String> cells = new ArrayList<>();
                        for (int c = 0; c < lastCell; c++) {
                            cells.add(cellText(row.getCell(c), fmt));
                        }
                        while (!cells.isEmpty() && cells.get(cells.size() - 1).isEmpty()) {
                            cells.remove(cells.size() - 1);
                        }
                        if (!cells.isEmpty()) {
                            any = true;
                            text.append(cells.get(0).startsWith("#") ? String.join(" ", cells) : String.join("\t", cells));
                        }
                    }
                    text.append('\n');
                }
                if (!any) {
                    continue;
                }
                Path where = path.resolveSibling(path.getFileName() + "#" + sheet.getSheetName());
                SweepFile sf = parse(where, text.toString(), "XLSX/XLS workbook, sheet '" + sheet.getSheetName() + "'", "");
                sweeps.addAll(sf.sweeps());
                warnings.addAll(sf.warnings());
                if (first == null) {
                    first = sf.info();
                }
                sheets++;
            }
        } catch (IOException | RuntimeException e) {
            if (e instanceof InputException ie) {
                throw ie;
            }
            throw new InputException(path, 0, 0, "the workbook cannot be read (" + e.getMessage() + "); save it again from a "
                    + "spreadsheet program or export the sheet as CSV");
        }
        if (first == null) {
            throw new InputException(path, 1, 0, "the workbook has no sheet with data");
        }
        TableInfo info = new TableInfo(new Layout.WorkbookSheets(sheets, first.kind()), '\t', '.', "XLSX/XLS",
                first.headerLine(), first.columns(), first.metadata());
        return new SweepFile(path, sha256(bytes), info, sweeps, warnings);
    }

    private static String cellText(org.apache.poi.ss.usermodel.Cell cell, org.apache.poi.ss.usermodel.DataFormatter fmt) {
        if (cell == null) {
            return "";
        }
        org.apache.poi.ss.usermodel.CellType type = cell.getCellType();
        if (type == org.apache.poi.ss.usermodel.CellType.FORMULA) {
            type = cell.getCachedFormulaResultType();
        }
        switch (type) {
            case NUMERIC:
                return Double.toString(cell.getNumericCellValue());
            case STRING:
                return cell.getStringCellValue().strip();
            case BOOLEAN:
                return Boolean.toString(cell.getBooleanCellValue());
            case ERROR:
                return "#ERROR";
            default:
                return fmt.formatCellValue(cell).strip();
        }
    }

    /** Reads a sweep table held as text (a decoded file, or a workbook sheet) in full. */
    private SweepFile parse(Path path, String text, String encoding, String sha) {
        try {
            return scan(path, new java.io.BufferedReader(new java.io.StringReader(text)), encoding, new SweepSink(path, sha));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /**
     * The one row pipeline of every sweep table, for both sinks: the preamble of '# key: value'
     * lines, the header row, the separator and decimal mark (from the first
     * {@value #SNIFFED_ROWS} rows), the wide layout (read whole), then every row validated once
     * — field count, labels, numbers, one group per sample — and handed to the sink.
     *
     * @param encoding how the text was decoded ("UTF-8" gains "with byte-order mark" when one leads the text)
     */
    private <T, B extends Bucket> T scan(Path path, java.io.BufferedReader in, String encoding, Sink<T, B> sink) throws IOException {
        Map<String, String> metadata = new LinkedHashMap<>();
        Map<String, Integer> metadataLines = new LinkedHashMap<>();
        List<ReadWarning> warnings = new ArrayList<>();
        String line;
        int n = 0;
        String headerText = null;
        boolean bom = false;
        boolean any = false;
        while ((line = in.readLine()) != null) {
            n++;
            if (n == 1 && line.startsWith("\uFEFF")) {
                line = line.substring(1);
                bom = true;
            }
            String l = line.strip();
            if (l.isEmpty()) {
                continue;
            }
            any = true;
            if (l.startsWith("#")) {
                for (String key : parseMetadataLine(l.substring(1), metadata)) {
                    metadataLines.put(key, n);
                }
                continue;
            }
            headerText = line;
            break;
        }
        if (!any) {
            throw new InputException(path, 1, 0, "the file is empty; a sweep table needs a header row and data rows");
        }
        if (headerText == null) {
            throw new InputException(path, Math.max(1, n), 0, "no header row found; after the '# key: value' lines, write a "
                    + "header such as 'frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]'");
        }
        String enc = bom && encoding.equals("UTF-8") ? "UTF-8 with byte-order mark" : encoding;
        char sep = detectSeparator(headerText);
        Row headerRow = row(path, headerText, n, sep);
        List<Row> first = new ArrayList<>();
        first.add(headerRow);
        while (first.size() < SNIFFED_ROWS && (line = in.readLine()) != null) {
            n++;
            if (!line.isBlank() && !line.stripLeading().startsWith("#")) {
                first.add(row(path, line, n, sep));
            }
        }
        if (wideLayout(path, first, metadata, metadataLines, enc, "", sep) != null) {
            List<Row> all = new ArrayList<>(first);
            while ((line = in.readLine()) != null) {
                n++;
                if (!line.isBlank() && !line.stripLeading().startsWith("#")) {
                    all.add(row(path, line, n, sep));
                }
            }
            return sink.wide(wideLayout(path, all, metadata, metadataLines, enc, sink.sha(), sep));
        }
        Header hd = header(path, headerRow, metadata, metadataLines, warnings);
        char dm = detectDecimalMark(sep, first);
        RowParser<B> rp = new RowParser<>(path, hd, dm, metadata, metadataLines, sink, warnings);
        for (int i = 1; i < first.size(); i++) {
            rp.accept(first.get(i));
        }
        while ((line = in.readLine()) != null) {
            n++;
            if (!line.isBlank() && !line.stripLeading().startsWith("#")) {
                rp.accept(row(path, line, n, sep));
            }
        }
        if (rp.buckets.isEmpty()) {
            throw new InputException(path, headerRow.line(), 0, "the header is not followed by any data rows");
        }
        boolean tidy = hd.byQuantity().containsKey(Quantity.SAMPLE) || hd.byQuantity().containsKey(Quantity.REPLICATE);
        TableInfo info = new TableInfo(tidy ? new Layout.Tidy() : new Layout.OneSample(), sep, dm, enc, headerRow.line(),
                hd.columns(), metadata);
        return sink.table(hd, info, metadata, List.copyOf(rp.buckets.values()), warnings);
    }

    /** Rows read before the decimal mark and the layout are decided. */
    private static final int SNIFFED_ROWS = 1000;

    /** The rows of one sweep (sample, replicate, temperature) as a sink keeps them. */
    private abstract static class Bucket {
        final String sample;
        final String replicate;
        final String group;
        final double temperature;
        final int firstLine;

        Bucket(String sample, String replicate, String group, double temperature, int firstLine) {
            this.sample = sample;
            this.replicate = replicate;
            this.group = group;
            this.temperature = temperature;
            this.firstLine = firstLine;
        }

        abstract void add(SweepPoint p, List<ReadWarning> warnings);
    }

    /** Where validated rows go: whole sweeps ({@link SweepSink}) or each sweep's extent ({@link ExtentSink}). */
    private interface Sink<T, B extends Bucket> {
        B bucket(String sample, String replicate, String group, double temperature, int line);

        T table(Header hd, TableInfo info, Map<String, String> metadata, List<B> buckets, List<ReadWarning> warnings);

        /** A wide table, read whole. */
        T wide(SweepFile whole);

        /** The file's checksum when the sink knows it ("" otherwise). */
        String sha();
    }

    /** Every point of one sweep. */
    private static final class Points extends Bucket {
        final List<SweepPoint> points = new ArrayList<>();

        Points(String sample, String replicate, String group, double temperature, int firstLine) {
            super(sample, replicate, group, temperature, firstLine);
        }

        @Override
        void add(SweepPoint p, List<ReadWarning> warnings) {
            points.add(p);
        }
    }

    /** Keeps every point: the sweeps of {@link #read}; sweep-level checks once each sweep is whole. */
    private static final class SweepSink implements Sink<SweepFile, Points> {
        private final Path path;
        private final String sha;

        SweepSink(Path path, String sha) {
            this.path = path;
            this.sha = sha;
        }

        @Override
        public Points bucket(String sample, String replicate, String group, double temperature, int line) {
            return new Points(sample, replicate, group, temperature, line);
        }

        @Override
        public SweepFile table(Header hd, TableInfo info, Map<String, String> metadata, List<Points> buckets,
                               List<ReadWarning> warnings) {
            List<Sweep> sweeps = new ArrayList<>();
            for (Points b : buckets) {
                Sweep s = new Sweep(b.sample, b.replicate, b.group, hd.kind(), b.temperature, path, metadata, b.points);
                checkPoints(path, s, warnings);
                sweeps.add(s);
            }
            return new SweepFile(path, sha, info, sweeps, warnings);
        }

        @Override
        public SweepFile wide(SweepFile whole) {
            return whole;
        }

        @Override
        public String sha() {
            return sha;
        }
    }

    /** Only the point count and frequency range of one sweep. */
    private static final class Extent extends Bucket {
        private final Path path;
        long points;
        double min = Double.POSITIVE_INFINITY;
        double max = 0;
        long warningsDropped;

        Extent(Path path, String sample, String replicate, String group, double temperature, int firstLine) {
            super(sample, replicate, group, temperature, firstLine);
            this.path = path;
        }

        @Override
        void add(SweepPoint p, List<ReadWarning> warnings) {
            points++;
            min = Math.min(min, p.frequencyHz());
            max = Math.max(max, p.frequencyHz());
            if (!(p.loss() > 0)) {
                if (warnings.size() >= MAX_WARNINGS) {
                    warningsDropped++;
                    return;
                }
                warnings.add(new ReadWarning(path, p.line(), String.format(Locale.ROOT,
                        "loss modulus %g Pa is not positive (sample '%s'); the point is kept in the data but left out of model fits",
                        p.loss(), sample)));
            }
        }
    }

    /** Keeps each sweep's extent only, so that memory does not grow with the file: the summaries of {@link #summarize}. */
    private static final class ExtentSink implements Sink<Summary, Extent> {
        private final Path path;

        ExtentSink(Path path) {
            this.path = path;
        }

        @Override
        public Extent bucket(String sample, String replicate, String group, double temperature, int line) {
            return new Extent(path, sample, replicate, group, temperature, line);
        }

        @Override
        public Summary table(Header hd, TableInfo info, Map<String, String> metadata, List<Extent> buckets,
                             List<ReadWarning> warnings) {
            long dropped = buckets.stream().mapToLong(e -> e.warningsDropped).sum();
            if (dropped > 0) {
                warnings.add(new ReadWarning(path, 0, dropped + " more warnings like the above"));
            }
            List<SweepSummary> out = new ArrayList<>();
            for (Extent e : buckets) {
                out.add(new SweepSummary(e.sample, e.replicate, e.group, hd.kind(), e.temperature, e.points, e.min, e.max));
            }
            return new Summary(path, info, out, warnings);
        }

        @Override
        public Summary wide(SweepFile whole) {
            return summaryOf(whole);
        }

        @Override
        public String sha() {
            return "";
        }
    }

    /**
     * What {@link #summarize} reports of one sweep, without its points.
     *
     * @param points number of points
     */
    public record SweepSummary(String sample, String replicate, String group, ModulusKind kind, double temperatureC, long points,
                               double minFrequencyHz, double maxFrequencyHz) {
    }

    /** A file summarised: how it was understood, and each sweep's extent. */
    public record Summary(Path path, TableInfo info, List<SweepSummary> sweeps, List<ReadWarning> warnings) {
    }

    /** Warnings kept per file; the rest are counted. */
    private static final int MAX_WARNINGS = 50;

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
        try {
            return stream(path, StandardCharsets.UTF_8);
        } catch (CharacterCodingException e) {
            try {
                return stream(path, Charset.forName("windows-1252"));
            } catch (CharacterCodingException impossible) {
                throw new InputException(path, 0, 0, "cannot decode the file");
            }
        }
    }

    private static Summary summaryOf(SweepFile f) {
        List<SweepSummary> out = new ArrayList<>();
        for (Sweep s : f.sweeps()) {
            out.add(new SweepSummary(s.sample(), s.replicate(), s.group(), s.kind(), s.temperatureC(), s.points().size(),
                    s.minFrequencyHz(), s.maxFrequencyHz()));
        }
        return new Summary(f.path(), f.info(), out, f.warnings());
    }

    private Summary stream(Path path, Charset charset) throws CharacterCodingException {
        java.nio.charset.CharsetDecoder decoder = charset.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                .onUnmappableCharacter(CodingErrorAction.REPORT);
        try (java.io.BufferedReader in = new java.io.BufferedReader(
                new java.io.InputStreamReader(Files.newInputStream(path), decoder), 1 << 16)) {
            return scan(path, in, charset.equals(StandardCharsets.UTF_8) ? "UTF-8" : "windows-1252", new ExtentSink(path));
        } catch (java.nio.charset.MalformedInputException | java.nio.charset.UnmappableCharacterException e) {
            throw e;
        } catch (IOException e) {
            throw new InputException(path, 0, 0, "cannot read the file (" + e.getMessage() + ")");
        }
    }

    /** Validates rows one at a time — the one row check of every layout but the wide one — into the sink's buckets. */
    private final class RowParser<B extends Bucket> {
        private final Path path;
        private final Header hd;
        private final char dm;
        private final String defaultSample;
        private final String defaultReplicate;
        private final String defaultGroup;
        private final double defaultTemperature;
        private final Sink<?, B> sink;
        private final List<ReadWarning> warnings;
        final Map<List<String>, B> buckets = new LinkedHashMap<>();

        RowParser(Path path, Header hd, char dm, Map<String, String> metadata, Map<String, Integer> metadataLines, Sink<?, B> sink,
                  List<ReadWarning> warnings) {
            this.path = path;
            this.hd = hd;
            this.dm = dm;
            this.defaultSample = metadata.getOrDefault("sample", stem(path));
            this.defaultReplicate = metadata.getOrDefault("replicate", "1");
            this.defaultGroup = metadata.getOrDefault("group", "");
            this.defaultTemperature = metadataTemperature(path, metadata, metadataLines.getOrDefault("temperature", 0));
            this.sink = sink;
            this.warnings = warnings;
        }

        void accept(Row rec) {
            int line = rec.line();
            if (rec.size() == 1 && rec.get(0).isEmpty()) {
                return;
            }
            if (rec.size() != hd.columns().size()) {
                throw new InputException(path, line, Math.min(rec.size(), hd.columns().size()) + 1, "row has " + rec.size()
                        + " fields but the header has " + hd.columns().size() + "; fill or remove the missing or extra cells");
            }
            Map<Quantity, ColumnSpec> q = hd.byQuantity();
            String sample = label(rec, q.get(Quantity.SAMPLE), defaultSample, path, line);
            String replicate = label(rec, q.get(Quantity.REPLICATE), defaultReplicate, path, line);
            String group = label(rec, q.get(Quantity.GROUP), defaultGroup, path, line);
            double temperature = q.containsKey(Quantity.TEMPERATURE) ? number(rec, q.get(Quantity.TEMPERATURE), dm, path, line)
                    : defaultTemperature;
            SweepPoint p = point(rec, q, dm, path, line);
            B b = buckets.computeIfAbsent(List.of(sample, replicate, Double.toString(temperature)),
                    k -> sink.bucket(sample, replicate, group, temperature, line));
            if (!b.group.equals(group)) {
                throw new InputException(path, line, q.get(Quantity.GROUP).index() + 1, "sample '" + sample
                        + "' is in group '" + b.group + "' on line " + b.firstLine + " but in group '" + group
                        + "' here; a sample belongs to one group");
            }
            b.add(p, warnings);
        }
    }

    private static Row row(Path path, String line, int n, char sep) {
        if (line.indexOf('"') < 0) {
            return new Row(n, splitPlain(line, sep));
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

    /** How the header row was understood. */
    private record Header(List<ColumnSpec> columns, Map<Quantity, ColumnSpec> byQuantity, ModulusKind kind) {
    }

    private Header header(Path path, Row headerRecord, Map<String, String> metadata, Map<String, Integer> metadataLines,
                          List<ReadWarning> warnings) {
        int headerLine = headerRecord.line();
        List<ColumnSpec> columns = new ArrayList<>();
        EnumMap<Quantity, ColumnSpec> byQuantity = new EnumMap<>(Quantity.class);
        for (int c = 0; c < headerRecord.size(); c++) {
            String h = headerRecord.get(c);
            if (h.isEmpty()) {
                throw new InputException(path, headerLine, c + 1, "empty column header; give every column a name and unit, e.g. 'loss_modulus [Pa]'");
            }
            String mapped = columnMap.get(h);
            HeaderRecognizer.Result r = HeaderRecognizer.recognize(c, mapped == null ? h : mapped);
            if (r.column() == null) {
                throw new InputException(path, headerLine, c + 1, mapped == null
                        ? r.problem() + ", or map it with --column \"" + h + "=quantity [unit]\""
                        : "--column \"" + h + "=" + mapped + "\": " + r.problem());
            }
            if (mapped != null) {
                ColumnSpec m = r.column();
                r = new HeaderRecognizer.Result(new ColumnSpec(m.index(), h, m.quantity(), m.unit(), m.kindHint()), null);
            }
            if (r.column().quantity() == Quantity.QUALITY) {
                columns.add(r.column());
                continue;
            }
            ColumnSpec prev = byQuantity.put(r.column().quantity(), r.column());
            if (prev != null) {
                throw new InputException(path, headerLine, c + 1, "columns " + (prev.index() + 1) + " and " + (c + 1)
                        + " both hold " + r.column().quantity().canonical() + "; keep one of them");
            }
            columns.add(r.column());
        }
        checkRequiredColumns(path, headerLine, byQuantity);
        ModulusKind kind = resolveKind(path, headerLine, byQuantity, metadata, metadataLines, warnings);
        return new Header(columns, byQuantity, kind);
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
        List<ReadWarning> warnings = new ArrayList<>();
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
                pts.add(point(rec, q, dm, path, rec.line()));
            }
            if (pts.isEmpty()) {
                throw new InputException(path, header.line(), e.getValue()[0].index() + 1, "sample '" + e.getKey() + "' has no values");
            }
            Sweep sw = new Sweep(e.getKey(), metadata.getOrDefault("replicate", "1"), metadata.getOrDefault("group", ""), kind,
                    temperature, path, metadata, pts);
            checkPoints(path, sw, warnings);
            sweeps.add(sw);
        }
        TableInfo info = new TableInfo(new Layout.Wide(), sep, dm, encoding, header.line(), columns,
                metadata);
        return new SweepFile(path, sha, info, sweeps, warnings);
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

    private static void checkRequiredColumns(Path path, int headerLine, Map<Quantity, ColumnSpec> q) {
        if (!q.containsKey(Quantity.FREQUENCY) && !q.containsKey(Quantity.ANGULAR_FREQUENCY)) {
            throw new InputException(path, headerLine, 0,
                    "no frequency column; add one named 'frequency [Hz]' or 'angular_frequency [rad/s]'");
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

    private static SweepPoint point(Row rec, Map<Quantity, ColumnSpec> q, char dm, Path path, int line) {
        double f;
        ColumnSpec fc = q.containsKey(Quantity.FREQUENCY) ? q.get(Quantity.FREQUENCY) : q.get(Quantity.ANGULAR_FREQUENCY);
        f = number(rec, fc, dm, path, line);
        if (fc.quantity() == Quantity.ANGULAR_FREQUENCY) {
            f = f / (2.0 * Math.PI);
        }
        if (!(f > 0)) {
            throw new InputException(path, line, fc.index() + 1, "frequency must be greater than zero, found '"
                    + rec.get(fc.index()) + "'; remove the row or correct the value");
        }
        double storage;
        double loss;
        double omega = 2 * Math.PI * f;
        if (q.containsKey(Quantity.STORAGE_MODULUS) && q.containsKey(Quantity.LOSS_MODULUS)) {
            storage = number(rec, q.get(Quantity.STORAGE_MODULUS), dm, path, line);
            loss = number(rec, q.get(Quantity.LOSS_MODULUS), dm, path, line);
        } else if (q.containsKey(Quantity.STORAGE_COMPLIANCE) && q.containsKey(Quantity.LOSS_COMPLIANCE)) {
            // J* = J′ − iJ″ = 1/M* ⇒ M′ = J′/(J′² + J″²), M″ = J″/(J′² + J″²) (DOMAIN.md section 0)
            double jp = number(rec, q.get(Quantity.STORAGE_COMPLIANCE), dm, path, line);
            double jpp = number(rec, q.get(Quantity.LOSS_COMPLIANCE), dm, path, line);
            double n = jp * jp + jpp * jpp;
            if (!(n > 0)) {
                throw new InputException(path, line, q.get(Quantity.STORAGE_COMPLIANCE).index() + 1, "the compliances are both zero");
            }
            storage = jp / n;
            loss = jpp / n;
        } else if (q.containsKey(Quantity.DYNAMIC_VISCOSITY) && q.containsKey(Quantity.OUT_OF_PHASE_VISCOSITY)) {
            // η* = G*/(iω) = η′ − iη″ ⇒ G′ = ωη″, G″ = ωη′ (ISO 6721-10; DOMAIN.md section 1)
            loss = omega * number(rec, q.get(Quantity.DYNAMIC_VISCOSITY), dm, path, line);
            storage = omega * number(rec, q.get(Quantity.OUT_OF_PHASE_VISCOSITY), dm, path, line);
        } else {
            boolean viscous = !q.containsKey(Quantity.COMPLEX_MODULUS_MAGNITUDE);
            ColumnSpec mc = viscous ? q.get(Quantity.COMPLEX_VISCOSITY_MAGNITUDE) : q.get(Quantity.COMPLEX_MODULUS_MAGNITUDE);
            double mag = number(rec, mc, dm, path, line) * (viscous ? omega : 1);
            if (!(mag > 0)) {
                throw new InputException(path, line, mc.index() + 1, "|E*| must be greater than zero, found '"
                        + rec.get(mc.index()) + "'");
            }
            double delta;
            if (q.containsKey(Quantity.PHASE_ANGLE)) {
                delta = number(rec, q.get(Quantity.PHASE_ANGLE), dm, path, line);
            } else {
                delta = Math.atan(number(rec, q.get(Quantity.LOSS_TANGENT), dm, path, line));
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
        return new SweepPoint(f, storage, loss, line);
    }

    private static double number(Row rec, ColumnSpec c, char decimalMark, Path path, int line) {
        String cell = rec.get(c.index());
        String t = decimalMark == ',' ? cell.replace(',', '.') : cell;
        if (t.isEmpty()) {
            throw new InputException(path, line, c.index() + 1, "empty cell in column '" + c.header()
                    + "'; fill it or remove the row");
        }
        if (!isPlainNumber(t)) {
            throw new InputException(path, line, c.index() + 1, "'" + cell + "' in column '" + c.header()
                    + "' is not a number; write plain numbers such as 1250 or 1.25e3");
        }
        double v = Double.parseDouble(t);
        if (!Double.isFinite(v)) {
            throw new InputException(path, line, c.index() + 1, "'" + cell + "' is too large to be a number");
        }
        return c.unit() == null ? v : v * c.unit().toSi();
    }

    /** Splits a line that holds no quotes at the separator, trimming each cell (the common, fast case). */
    private static List<String> splitPlain(String line, char sep) {
        List<String> cells = new ArrayList<>(8);
        int start = 0;
        for (int i = 0; i <= line.length(); i++) {
            if (i == line.length() || line.charAt(i) == sep) {
                cells.add(line.substring(start, i).strip());
                start = i + 1;
            }
        }
        return cells;
    }

    /**
     * True for plain decimal numbers with an optional sign, fraction and exponent
     * ({@code [+-]?(d+.?d*|.d+)([eE][+-]?d+)?}); rejects what Double.parseDouble would also take
     * but a table should not hold (NaN, Infinity, hex, a trailing d or f).
     */
    public static boolean isPlainNumber(String t) {
        int n = t.length();
        int i = 0;
        if (i < n && (t.charAt(i) == '+' || t.charAt(i) == '-')) {
            i++;
        }
        int digits = 0;
        while (i < n && Character.isDigit(t.charAt(i)) && t.charAt(i) < 128) {
            i++;
            digits++;
        }
        if (i < n && t.charAt(i) == '.') {
            i++;
            while (i < n && Character.isDigit(t.charAt(i)) && t.charAt(i) < 128) {
                i++;
                digits++;
            }
        }
        if (digits == 0) {
            return false;
        }
        if (i < n && (t.charAt(i) == 'e' || t.charAt(i) == 'E')) {
            i++;
            if (i < n && (t.charAt(i) == '+' || t.charAt(i) == '-')) {
                i++;
            }
            int exp = 0;
            while (i < n && Character.isDigit(t.charAt(i)) && t.charAt(i) < 128) {
                i++;
                exp++;
            }
            if (exp == 0) {
                return false;
            }
        }
        return i == n;
    }

    private static String label(Row rec, ColumnSpec c, String fallback, Path path, int line) {
        if (c == null) {
            return fallback;
        }
        String v = rec.get(c.index());
        if (v.isEmpty()) {
            throw new InputException(path, line, c.index() + 1, "empty " + c.quantity().canonical()
                    + " cell; every row of a tidy table names its " + c.quantity().canonical());
        }
        return v;
    }

    private static void checkPoints(Path path, Sweep s, List<ReadWarning> warnings) {
        List<SweepPoint> pts = s.points();
        for (SweepPoint p : pts) {
            if (!(p.loss() > 0)) {
                warnings.add(new ReadWarning(path, p.line(), String.format(Locale.ROOT,
                        "loss modulus %g Pa is not positive (sample '%s'); the point is kept in the data but left out of model fits",
                        p.loss(), s.sample())));
            }
        }
        for (int i = 1; i < pts.size(); i++) {
            if (pts.get(i).frequencyHz() == pts.get(i - 1).frequencyHz()) {
                warnings.add(new ReadWarning(path, pts.get(i).line(), String.format(Locale.ROOT,
                        "frequency %g Hz appears twice in sample '%s' replicate '%s'; both points are used",
                        pts.get(i).frequencyHz(), s.sample(), s.replicate())));
            }
        }
    }

    private static double metadataTemperature(Path path, Map<String, String> metadata, int line) {
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
        return Double.parseDouble(m.group(1));
    }

    /** Parses "key: value" or "key: value; key: value" (geometry lines). Keys lower-case, spaces as underscores. */
    static List<String> parseMetadataLine(String body, Map<String, String> out) {
        List<String> keys = new ArrayList<>();
        for (String part : body.split(";")) {
            int colon = part.indexOf(':');
            if (colon <= 0) {
                continue;
            }
            String key = part.substring(0, colon).strip().toLowerCase(Locale.ROOT).replaceAll("\\s+", "_");
            String value = part.substring(colon + 1).strip();
            if (!key.isEmpty()) {
                out.put(key, value);
                keys.add(key);
            }
        }
        return keys;
    }

    private static char detectSeparator(String headerLine) {
        int commas = 0;
        int semis = 0;
        int tabs = 0;
        boolean quoted = false;
        for (char ch : headerLine.toCharArray()) {
            if (ch == '"') {
                quoted = !quoted;
            } else if (!quoted) {
                if (ch == ',') {
                    commas++;
                } else if (ch == ';') {
                    semis++;
                } else if (ch == '\t') {
                    tabs++;
                }
            }
        }
        if (tabs >= commas && tabs >= semis && tabs > 0) {
            return '\t';
        }
        return semis > commas ? ';' : ',';
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
