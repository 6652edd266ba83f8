package org.viscarta.raw;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.viscarta.io.InputException;
import org.viscarta.io.SweepReader;

/**
 * Reads Viscarta's raw-signal table (PRODUCT.md "Raw signals"): {@code # key: value} metadata, then
 * {@code time [s]}, either {@code force} and {@code displacement} (or {@code indentation}), or
 * {@code deflection} and {@code position} with {@code # cantilever_stiffness:} (force = k·deflection,
 * indentation = position − deflection), and {@code drive_frequency [Hz]}; consecutive rows of one
 * drive frequency form a segment.
 */
public final class RawReader {

    private static final Pattern HEADER = Pattern.compile("^(.*?)\\s*[\\[(]([^\\])]*)[\\])]\\s*$");

    /** One drive frequency's samples, in SI. */
    public record Segment(double frequencyHz, double[] time, double[] force, double[] displacement, int firstLine) {
    }

    /** A whole raw file. */
    public record Measurement(Path file, String sha256, Map<String, String> metadata, List<Segment> segments) {
        public boolean isCalibration() {
            return "calibration".equalsIgnoreCase(metadata.getOrDefault("role", ""));
        }

        /**
         * A step test's raw record (a '# test:' line naming stress relaxation or creep): one segment of
         * time, force and displacement without a drive frequency, converted by {@link StepResponse}.
         */
        public java.util.Optional<org.viscarta.sweep.TimeTest.Type> stepTest() {
            String t = metadata.getOrDefault("test", "").toLowerCase(Locale.ROOT);
            return t.contains("relaxation") ? java.util.Optional.of(org.viscarta.sweep.TimeTest.Type.RELAXATION)
                    : t.contains("creep") ? java.util.Optional.of(org.viscarta.sweep.TimeTest.Type.CREEP) : java.util.Optional.empty();
        }
    }

    private RawReader() {
    }

    /** True when the file's header row starts with a time column (a raw-signal table, not a sweep table). */
    private static final java.util.regex.Pattern TIME_DOMAIN_TABLE =
            java.util.regex.Pattern.compile("relaxation|creep|\\b[egjd]\\(t\\)");

    public static boolean isRaw(Path file) {
        String name = file.getFileName().toString().toLowerCase(Locale.ROOT);
        if (name.endsWith(".xlsx") || name.endsWith(".xls")) {
            return false;
        }
        try (java.util.stream.Stream<String> lines = Files.lines(file, StandardCharsets.UTF_8)) {
            return lines.map(String::strip).filter(l -> !l.isEmpty() && !l.startsWith("#")).findFirst()
                    .map(l -> l.toLowerCase(Locale.ROOT).replace("\"", ""))
                    // a time column first is a raw signal table, unless the table is a relaxation or creep test
                    .map(l -> l.startsWith("time") && !TIME_DOMAIN_TABLE.matcher(l).find()).orElse(false);
        } catch (IOException | java.io.UncheckedIOException e) {
            return false;
        }
    }

    public static Measurement read(Path file) {
        byte[] bytes;
        List<String> lines;
        try {
            bytes = Files.readAllBytes(file);
            lines = lines(new String(bytes, StandardCharsets.UTF_8));
        } catch (IOException e) {
            throw new InputException(file, 0, 0, "cannot read the file (" + e.getMessage() + ")");
        }
        Map<String, String> meta = new LinkedHashMap<>();
        int i = 0;
        while (i < lines.size() && (lines.get(i).isBlank() || lines.get(i).strip().startsWith("#"))) {
            String l = lines.get(i).strip();
            if (l.startsWith("#")) {
                for (String part : l.substring(1).split(";")) {
                    int c = part.indexOf(':');
                    if (c > 0) {
                        meta.put(part.substring(0, c).strip().toLowerCase(Locale.ROOT).replaceAll("\\s+", "_"), part.substring(c + 1).strip());
                    }
                }
            }
            i++;
        }
        if (i >= lines.size()) {
            throw new InputException(file, lines.size(), 0, "no header row; write 'time [s],force [N],displacement [m],drive_frequency [Hz]'");
        }
        int headerLine = i + 1;
        String[] header = lines.get(i).split(",");
        int tCol = -1;
        int fCol = -1;
        int dCol = -1;
        int defCol = -1;
        int posCol = -1;
        int freqCol = -1;
        int segCol = -1;
        double[] scale = new double[header.length];
        for (int c = 0; c < header.length; c++) {
            Matcher m = HEADER.matcher(header[c].strip().replace("\"", ""));
            String name = m.matches() ? m.group(1).strip().toLowerCase(Locale.ROOT) : header[c].strip().toLowerCase(Locale.ROOT);
            String unit = m.matches() ? m.group(2).strip() : "";
            try {
                switch (name) {
                    case "time": tCol = c; scale[c] = timeUnit(unit); break;
                    case "force": fCol = c; scale[c] = forceUnit(unit); break;
                    case "displacement": case "indentation": dCol = c; scale[c] = Units.lengthFactor(unit, name); break;
                    case "deflection": defCol = c; scale[c] = Units.lengthFactor(unit, name); break;
                    case "position": posCol = c; scale[c] = Units.lengthFactor(unit, name); break;
                    case "drive_frequency": freqCol = c; scale[c] = freqUnit(unit); break;
                    case "segment": segCol = c; scale[c] = 1; break;
                    default: throw new IllegalArgumentException("unknown column '" + header[c].strip() + "'; a raw table has time [s], "
                            + "force [N] and displacement [m] (or deflection and position), and drive_frequency [Hz]");
                }
            } catch (IllegalArgumentException e) {
                throw new InputException(file, headerLine, c + 1, e.getMessage());
            }
        }
        boolean cantilever = fCol < 0 && defCol >= 0 && posCol >= 0;
        String test = meta.getOrDefault("test", "").toLowerCase(Locale.ROOT);
        boolean step = test.contains("relaxation") || test.contains("creep");
        if (step && freqCol < 0 && segCol < 0 && tCol >= 0 && (cantilever || (fCol >= 0 && dCol >= 0))) {
            return stepRecord(file, bytes, lines, i, header, meta, tCol, fCol, dCol, defCol, posCol, scale, cantilever);
        }
        if (tCol < 0 || (freqCol < 0 && segCol < 0) || (!cantilever && (fCol < 0 || dCol < 0))) {
            throw new InputException(file, headerLine, 0, "a raw table needs time, drive_frequency (or segment with a "
                    + "'# drive_frequencies:' line), and force with displacement (or deflection with position)");
        }
        double[] segmentFrequencies = freqCol < 0 ? segmentFrequencies(file, meta, headerLine) : null;
        Map<Double, Double> segmentToFrequency = new LinkedHashMap<>();
        double k = 0;
        if (cantilever) {
            try {
                k = Units.stiffness(meta, "cantilever_stiffness");
            } catch (IllegalArgumentException e) {
                throw new InputException(file, headerLine, 0, "deflection and position need '# cantilever_stiffness: 0.05 N/m' ("
                        + e.getMessage() + ")");
            }
        }
        List<Segment> segments = new ArrayList<>();
        List<double[]> rows = new ArrayList<>();
        double current = Double.NaN;
        int first = 0;
        for (int r = i + 1; r < lines.size(); r++) {
            String l = lines.get(r).strip();
            if (l.isEmpty() || l.startsWith("#")) {
                continue;
            }
            double[] v = row(file, l, r + 1, header.length, scale);
            double freq;
            if (freqCol >= 0) {
                freq = v[freqCol];
                if (!(freq > 0)) {
                    throw new InputException(file, r + 1, freqCol + 1, "drive frequency must be greater than zero");
                }
            } else {
                Double known = segmentToFrequency.get(v[segCol]);
                if (known == null) {
                    if (segmentToFrequency.size() >= segmentFrequencies.length) {
                        throw new InputException(file, r + 1, segCol + 1, "more segments than the " + segmentFrequencies.length
                                + " frequencies of '# drive_frequencies:'; list one frequency per segment, in order");
                    }
                    known = segmentFrequencies[segmentToFrequency.size()];
                    segmentToFrequency.put(v[segCol], known);
                }
                freq = known;
            }
            if (freq != current) {
                if (!rows.isEmpty()) {
                    segments.add(segment(current, rows, tCol, fCol, dCol, defCol, posCol, k, cantilever, first));
                }
                rows.clear();
                current = freq;
                first = r + 1;
            }
            rows.add(v);
        }
        if (!rows.isEmpty()) {
            segments.add(segment(current, rows, tCol, fCol, dCol, defCol, posCol, k, cantilever, first));
        }
        if (segments.isEmpty()) {
            throw new InputException(file, headerLine, 0, "the header is not followed by any samples");
        }
        return new Measurement(file, SweepReader.sha256(bytes), meta, segments);
    }

    /** A step test's record: every row one sample of one segment at no drive frequency. */
    private static Measurement stepRecord(Path file, byte[] bytes, List<String> lines, int headerIndex, String[] header,
                                          Map<String, String> meta, int tCol, int fCol, int dCol, int defCol, int posCol,
                                          double[] scale, boolean cantilever) {
        double k = 0;
        if (cantilever) {
            try {
                k = Units.stiffness(meta, "cantilever_stiffness");
            } catch (IllegalArgumentException e) {
                throw new InputException(file, headerIndex + 1, 0, "deflection and position need '# cantilever_stiffness: 0.05 N/m' ("
                        + e.getMessage() + ")");
            }
        }
        List<double[]> rows = new ArrayList<>();
        for (int r = headerIndex + 1; r < lines.size(); r++) {
            String l = lines.get(r).strip();
            if (l.isEmpty() || l.startsWith("#")) {
                continue;
            }
            double[] v = row(file, l, r + 1, header.length, scale);
            rows.add(v);
        }
        if (rows.size() < 3) {
            throw new InputException(file, headerIndex + 1, 0, "a step test needs the record of the step and its hold; found "
                    + rows.size() + " row(s)");
        }
        return new Measurement(file, SweepReader.sha256(bytes), meta, List.of(segment(Double.NaN, rows, tCol, fCol, dCol, defCol,
                posCol, k, cantilever, headerIndex + 2)));
    }

    /**
     * The text's lines, as {@code text.split("\r?\n", -1)} gives them (a line ends at LF, a CR just
     * before it is dropped, a last empty line kept), found by scanning for LF: the regular expression
     * took a third of the time reading a 47 MB file of raw signals.
     */
    static List<String> lines(String text) {
        List<String> out = new ArrayList<>();
        int start = 0;
        for (int j = text.indexOf('\n'); j >= 0; j = text.indexOf('\n', start)) {
            int end = j > start && text.charAt(j - 1) == '\r' ? j - 1 : j;
            out.add(text.substring(start, end));
            start = j + 1;
        }
        out.add(text.substring(start));
        return java.util.Collections.unmodifiableList(out);
    }

    /** One data row in SI: every cell a plain number, as many as the header has. */
    private static double[] row(Path file, String line, int lineNumber, int width, double[] scale) {
        String[] cells = line.split(",");
        if (cells.length != width) {
            throw new InputException(file, lineNumber, 0, "row has " + cells.length + " fields but the header has " + width);
        }
        double[] v = new double[width];
        for (int c = 0; c < width; c++) {
            String cell = cells[c].strip();
            double plain = SweepReader.plainValue(cell);
            if (Double.isNaN(plain)) {
                throw new InputException(file, lineNumber, c + 1, "'" + cell + "' is not a number");
            }
            v[c] = plain * scale[c];
        }
        return v;
    }

    /** The frequencies of '# drive_frequencies: 0.1, 1, 10 Hz', in segment order. */
    private static double[] segmentFrequencies(Path file, Map<String, String> meta, int headerLine) {
        String list = meta.get("drive_frequencies");
        if (list == null) {
            throw new InputException(file, headerLine, 0, "a segment column needs '# drive_frequencies: 0.1, 1, 10 Hz' (one per segment, in order)");
        }
        String body = list.strip();
        double factor = 1;
        if (body.endsWith("kHz")) {
            factor = 1e3;
            body = body.substring(0, body.length() - 3);
        } else if (body.endsWith("Hz")) {
            body = body.substring(0, body.length() - 2);
        }
        String[] parts = body.split(",");
        double[] out = new double[parts.length];
        for (int i = 0; i < parts.length; i++) {
            String p = parts[i].strip();
            if (!SweepReader.isPlainNumber(p) || !(Double.parseDouble(p) > 0)) {
                throw new InputException(file, headerLine, 0, "'# drive_frequencies: " + list + "' must list positive numbers in Hz");
            }
            out[i] = Double.parseDouble(p) * factor;
        }
        return out;
    }

    private static Segment segment(double f, List<double[]> rows, int tCol, int fCol, int dCol, int defCol, int posCol, double k,
                                   boolean cantilever, int firstLine) {
        int n = rows.size();
        double[] t = new double[n];
        double[] force = new double[n];
        double[] disp = new double[n];
        for (int j = 0; j < n; j++) {
            double[] v = rows.get(j);
            t[j] = v[tCol];
            if (cantilever) {
                force[j] = k * v[defCol];
                disp[j] = v[posCol] - v[defCol];
            } else {
                force[j] = v[fCol];
                disp[j] = v[dCol];
            }
        }
        return new Segment(f, t, force, disp, firstLine);
    }

    private static double timeUnit(String u) {
        switch (u) {
            case "s": return 1;
            case "ms": return 1e-3;
            default: throw new IllegalArgumentException("time needs s or ms, not '" + u + "'");
        }
    }

    private static double forceUnit(String u) {
        switch (u) {
            case "N": return 1;
            case "mN": return 1e-3;
            case "µN": case "μN": case "uN": return 1e-6;
            case "nN": return 1e-9;
            default: throw new IllegalArgumentException("force needs N, mN, µN or nN, not '" + u + "'");
        }
    }

    private static double freqUnit(String u) {
        switch (u) {
            case "Hz": return 1;
            case "kHz": return 1e3;
            default: throw new IllegalArgumentException("drive_frequency needs Hz or kHz, not '" + u + "'");
        }
    }
}
