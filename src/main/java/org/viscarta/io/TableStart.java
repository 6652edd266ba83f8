package org.viscarta.io;

import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import org.viscarta.sweep.Unit;

/**
 * Where a table starts in a text: input lines with their numbers and push-back, the shape of a
 * line (header-like, units-like, numbers), and the search for the next header past a preamble.
 * Shared by every text layout of {@link SweepReader}.
 */
final class TableStart {

    private TableStart() {
    }

    /** Preamble lines read while looking for a table before the first row is taken as the header anyway. */
    static final int MAX_PREAMBLE = 1000;

    /**
     * Input lines with their 1-based numbers, one at a time, with push-back; optionally read ahead on
     * a thread of their own ({@link ReadAhead}). Close it to stop that thread.
     */
    static final class Lines implements AutoCloseable {
        private final java.io.BufferedReader in;
        private final ReadAhead ahead;
        private final java.util.ArrayDeque<Line> back = new java.util.ArrayDeque<>();
        private int n;
        boolean bom;

        Lines(java.io.BufferedReader in) {
            this(in, false);
        }

        /** @param readAhead whether the text is read and decoded on a second thread while this one takes the lines */
        Lines(java.io.BufferedReader in, boolean readAhead) {
            this.in = in;
            this.ahead = readAhead ? new ReadAhead(in) : null;
        }

        Line next() throws IOException {
            if (!back.isEmpty()) {
                return back.pollFirst();
            }
            if (ahead != null) {
                return ahead.next(this);
            }
            String s = in.readLine();
            return s == null ? null : line(s, null, '\0');
        }

        /** The next line, numbered; a leading byte-order mark taken off the first (and its split, if any, dropped). */
        private Line line(String s, List<String> cells, char sep) {
            n++;
            if (n == 1 && s.startsWith("\uFEFF")) {
                bom = true;
                return new Line(n, s.substring(1));
            }
            return new Line(n, s, cells, sep);
        }

        /**
         * From now on the reading thread, if any, also splits the lines it reads at {@code sep} (those
         * without quotes), a third of reading a large table, taken off this thread.
         */
        void splitAt(char sep) {
            if (ahead != null) {
                ahead.separator = sep;
            }
        }

        /** Stops reading ahead and waits until the thread has stopped (nothing to do without one). */
        @Override
        public void close() {
            if (ahead != null) {
                ahead.stop();
            }
        }

        void pushBack(Line l) {
            back.addFirst(l);
        }

        void pushBack(List<Line> ls) {
            for (int i = ls.size() - 1; i >= 0; i--) {
                back.addFirst(ls.get(i));
            }
        }

        /** Up to {@code count} following lines, left to be read again. */
        List<Line> peek(int count) throws IOException {
            List<Line> out = new ArrayList<>();
            Line l;
            while (out.size() < count && (l = next()) != null) {
                out.add(l);
            }
            pushBack(out);
            return out;
        }

        /** The next {@code count} lines that are neither blank nor comments (fewer at the end), left to be read again. */
        List<Line> peekContent(int count) throws IOException {
            List<Line> read = new ArrayList<>();
            List<Line> out = new ArrayList<>();
            Line l;
            while (out.size() < count && read.size() < 50 && (l = next()) != null) {
                read.add(l);
                if (!l.text().isBlank() && !l.comment()) {
                    out.add(l);
                }
            }
            pushBack(read);
            return out;
        }

        int count() {
            return n;
        }
    }

    /**
     * Reading ahead: a second thread reads the text (its bytes, their checksum and their decoding,
     * about a third of reading a large table) into batches of lines while the reader's own thread
     * understands the lines already read. At most {@value #QUEUED} batches of {@value #BATCH} lines
     * wait, so memory stays bounded whatever the file's size. A failure of the reading thread (a byte
     * that is not valid in the encoding, an I/O error) reaches the reader's thread where the line
     * would have been, as the same exception.
     */
    private static final class ReadAhead {
        static final int BATCH = 512;
        static final int QUEUED = 16;
        private static final Object END = new Object();

        /** Lines read, and those split (null where not). */
        private record Batch(String[] lines, List<String>[] cells, char separator) {
        }

        private final java.util.concurrent.BlockingQueue<Object> queue = new java.util.concurrent.ArrayBlockingQueue<>(QUEUED);
        private final Thread thread;
        private volatile boolean stopped;
        /** The separator to split at, once the reader knows it ('\0' before). */
        volatile char separator;
        private Batch batch = new Batch(new String[0], null, '\0');
        private int position;
        private boolean ended;

        ReadAhead(java.io.BufferedReader in) {
            thread = new Thread(() -> run(in), "viscarta-read-ahead");
            thread.setDaemon(true);
            thread.start();
        }

        private void run(java.io.BufferedReader in) {
            try {
                while (!stopped) {
                    String[] lines = new String[BATCH];
                    char sep = separator;
                    @SuppressWarnings("unchecked")
                    List<String>[] cells = sep == '\0' ? null : new List[BATCH];
                    int k = 0;
                    Object failure = null;
                    try {
                        for (; k < BATCH; k++) {
                            String s = in.readLine();
                            if (s == null) {
                                break;
                            }
                            lines[k] = s;
                            if (cells != null && s.indexOf('"') < 0) {
                                cells[k] = splitPlain(s, sep);
                            }
                        }
                    } catch (IOException | RuntimeException | Error e) {
                        failure = e;
                    }
                    if (k > 0) {
                        queue.put(k == BATCH ? new Batch(lines, cells, sep)
                                : new Batch(java.util.Arrays.copyOf(lines, k), cells == null ? null : java.util.Arrays.copyOf(cells, k), sep));
                    }
                    if (failure != null || k < BATCH) {
                        queue.put(failure != null ? failure : END);
                        return;
                    }
                }
            } catch (InterruptedException stoppedWhileWaiting) {
                // stop() asked: the reader no longer wants lines
            }
        }

        /** The next line, numbered by {@code lines}, null at the end; throws what reading it threw. */
        Line next(Lines lines) throws IOException {
            if (position < batch.lines().length) {
                int i = position++;
                return lines.line(batch.lines()[i], batch.cells() == null ? null : batch.cells()[i], batch.separator());
            }
            if (ended) {
                return null;
            }
            Object o;
            try {
                o = queue.take();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new java.io.InterruptedIOException("interrupted while reading");
            }
            if (o instanceof Batch b) {
                batch = b;
                position = 0;
                return next(lines);
            }
            ended = true;
            if (o instanceof IOException e) {
                throw e;
            }
            if (o instanceof RuntimeException e) {
                throw e;
            }
            if (o instanceof Error e) {
                throw e;
            }
            return null;
        }

        /** Stops the thread (it may be waiting for room in the queue) and waits for it to end. */
        void stop() {
            stopped = true;
            queue.clear();
            boolean interrupted = false;
            while (thread.isAlive()) {
                queue.clear();
                try {
                    thread.join(10);
                } catch (InterruptedException e) {
                    interrupted = true;
                }
            }
            if (interrupted) {
                Thread.currentThread().interrupt();
            }
        }
    }

    /**
     * One input line and its 1-based number; {@code cells} holds it already split at
     * {@code separator} ({@link #splitPlain}) when the reading thread did so, else null.
     */
    record Line(int number, String text, List<String> cells, char separator) {
        Line(int number, String text) {
            this(number, text, null, '\0');
        }

        /** The cells split at {@code sep}, if the reading thread split this line so; else null. */
        List<String> cellsAt(char sep) {
            return cells != null && separator == sep ? cells : null;
        }

        boolean comment() {
            return text.stripLeading().startsWith("#");
        }
    }

    /** What starts a table: its header line and units line (null when the previous header goes on). */
    record Start(Line header, Line units) {
    }

    /**
     * Reads lines up to the start of the next table, the preamble going into {@code pre}. Returns the
     * header (and units) line, a Start without header when a data row of the previous table's width
     * comes without a new header (the previous header goes on), or null at the end of the input.
     */
    static Start findStart(Lines src, Preamble pre, int previousColumns, boolean later) throws IOException {
        Line l;
        while ((l = src.next()) != null) {
            if (l.text().isBlank()) {
                continue;
            }
            pre.any = true;
            if (l.comment()) {
                pre.hash(l);
                continue;
            }
            char sep = detectSeparator(l.text());
            List<String> cells = trimmed(splitLoose(l.text(), sep));
            if (previousColumns > 0 && numbers(cells, sep) >= 2 && cells.size() <= previousColumns) {
                src.pushBack(l);
                return new Start(null, null);
            }
            if (headerLike(cells, sep)) {
                List<Line> next = src.peekContent(3);
                if (!next.isEmpty()) {
                    List<String> n1 = trimmed(splitLoose(next.get(0).text(), sep));
                    Line units = null;
                    int at = 0;
                    if (unitsLike(n1, sep)) {
                        units = next.get(0);
                        at = 1;
                    }
                    if (next.size() > at && startsData(next, at, sep, cells.size())) {
                        if (units != null) {
                            Line x;
                            do {
                                x = src.next(); // up to and with the units line
                            } while (x != null && x.number() < units.number());
                        }
                        return new Start(l, units);
                    }
                }
            }
            if (!later) {
                pre.seen.add(l);
                if (pre.seen.size() > MAX_PREAMBLE) {
                    return null;
                }
            }
            pre.plain(l, cells);
        }
        return null;
    }

    /** True when the lines from {@code at} begin with data rows: the first with two numbers, or one number and the next with two. */
    static boolean startsData(List<Line> next, int at, char sep, int headerColumns) {
        List<String> d1 = trimmed(splitLoose(next.get(at).text(), sep));
        if (d1.size() > headerColumns) {
            return false;
        }
        int k = numbers(d1, sep);
        if (k >= 2) {
            return true;
        }
        return k == 1 && next.size() > at + 1 && numbers(trimmed(splitLoose(next.get(at + 1).text(), sep)), sep) >= 2;
    }

    /** Cell texts that stand for a missing value: the point is left out with a warning. */
    /** Marks of a missing value (compared in lower case); none starts with a digit or a point, which the reader relies on. */
    static final java.util.Set<String> NOT_A_NUMBER = java.util.Set.of("", "-", "--", "---", "nan", "n/a", "na", "*", "#n/a", "null");

    static boolean numeric(String cell, char sep) {
        return isPlainNumber(cell) || (sep != ',' && cell.indexOf(',') > 0 && isPlainNumber(cell.replace(',', '.')));
    }

    static int numbers(List<String> cells, char sep) {
        int k = 0;
        for (String c : cells) {
            if (numeric(c, sep)) {
                k++;
            }
        }
        return k;
    }

    /** Two or more cells of text, none a number. */
    static boolean headerLike(List<String> cells, char sep) {
        int filled = 0;
        for (String c : cells) {
            if (c.isEmpty()) {
                continue;
            }
            if (numeric(c, sep)) {
                return false;
            }
            filled++;
        }
        return filled >= 2;
    }

    /** A units row: no numbers, every cell short, at least one a known unit ("Hz", "(kPa)", "[Pa]", "rad/s"). */
    static boolean unitsLike(List<String> cells, char sep) {
        boolean known = false;
        for (String c : cells) {
            if (c.isEmpty()) {
                continue;
            }
            if (numeric(c, sep) || c.length() > 20) {
                return false;
            }
            known |= Unit.anyDimension(c).isPresent() && !c.equals("-") && !c.equals("1");
        }
        return known;
    }

    /** Splits at the separator without the quote rules (enough to judge a line's shape). */
    static List<String> splitLoose(String line, char sep) {
        List<String> cells = splitPlain(line, sep);
        for (int i = 0; i < cells.size(); i++) {
            String c = cells.get(i);
            if (c.length() >= 2 && c.startsWith("\"") && c.endsWith("\"")) {
                cells.set(i, c.substring(1, c.length() - 1).strip());
            }
        }
        return cells;
    }

    /** The cells without trailing empty ones. */
    static List<String> trimmed(List<String> cells) {
        int n = cells.size();
        while (n > 0 && cells.get(n - 1).isEmpty()) {
            n--;
        }
        return cells.subList(0, n);
    }

    /** Splits a line that holds no quotes at the separator, trimming each cell (the common, fast case). */
    static List<String> splitPlain(String line, char sep) {
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

    /** 10⁰ … 10²², every one exactly a double (5²² < 2⁵³). */
    private static final double[] EXACT_POWERS_OF_TEN = {
        1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20,
        1e21, 1e22};

    /** 2⁵³: every integer up to it is exactly a double. */
    private static final long EXACT_INTEGERS = 1L << 53;

    /**
     * The value of a plain decimal number ({@link #isPlainNumber}'s form), NaN when t is not one (no
     * plain number is NaN): the same double as {@link Double#parseDouble}, in one pass over the text.
     * When the digits, without the point and leading zeros, make an integer w of at most 2⁵³ and the
     * number is w·10^q with |q| ≤ 22, both w and 10^|q| are exact doubles and one multiplication or
     * division, correctly rounded by IEEE 754, gives the correctly rounded value (Clinger, W. D.
     * (1990), "How to read floating point numbers accurately", PLDI '90, 92–101, the fast path);
     * other numbers (more than 18 significant digits, large exponents) go to Double.parseDouble. A
     * table's numbers are nearly all of the first kind, and Double.parseDouble, with its checks for
     * every form Java accepts, was a tenth of reading a large table.
     */
    public static double plainValue(String t) {
        int n = t.length();
        int i = 0;
        boolean negative = false;
        if (i < n && (t.charAt(i) == '+' || t.charAt(i) == '-')) {
            negative = t.charAt(i) == '-';
            i++;
        }
        long w = 0;
        int significant = 0;
        int scale = 0;
        int digits = 0;
        boolean slow = false;
        boolean point = false;
        for (; i < n; i++) {
            char c = t.charAt(i);
            if (c == '.' && !point) {
                point = true;
                continue;
            }
            int d = c - '0';
            if (d < 0 || d > 9) {
                break;
            }
            digits++;
            if (significant < 18) {
                if (w != 0 || d != 0) {
                    w = w * 10 + d;
                    significant++;
                }
                if (point) {
                    scale--;
                }
            } else {
                slow = true; // more digits than a long holds exactly: Double.parseDouble rounds them
            }
        }
        if (digits == 0) {
            return Double.NaN;
        }
        int exponent = 0;
        if (i < n && (t.charAt(i) == 'e' || t.charAt(i) == 'E')) {
            i++;
            boolean negativeExponent = false;
            if (i < n && (t.charAt(i) == '+' || t.charAt(i) == '-')) {
                negativeExponent = t.charAt(i) == '-';
                i++;
            }
            int expDigits = 0;
            for (; i < n; i++) {
                int d = t.charAt(i) - '0';
                if (d < 0 || d > 9) {
                    break;
                }
                expDigits++;
                if (exponent < 100_000) {
                    exponent = exponent * 10 + d;
                } else {
                    slow = true; // an exponent this long: Double.parseDouble decides between 0, infinity and a value
                }
            }
            if (expDigits == 0) {
                return Double.NaN;
            }
            if (negativeExponent) {
                exponent = -exponent;
            }
        }
        if (i != n) {
            return Double.NaN;
        }
        int q = scale + exponent;
        if (slow || w > EXACT_INTEGERS || q < -22 || q > 22) {
            return Double.parseDouble(t);
        }
        double v = q >= 0 ? w * EXACT_POWERS_OF_TEN[q] : w / EXACT_POWERS_OF_TEN[-q];
        return negative ? -v : v;
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

    static char detectSeparator(String headerLine) {
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
}
