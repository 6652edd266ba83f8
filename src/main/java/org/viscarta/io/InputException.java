package org.viscarta.io;

import java.nio.file.Path;
import java.util.Locale;

/**
 * The one error type for bad input: it knows the file, line and column (1-based; 0 when not
 * applicable) and prints as {@code file:line[:column]: message}. The CLI turns it into one line on
 * stderr and exit code 2.
 */
public final class InputException extends RuntimeException {

    private static final long serialVersionUID = 1L;

    private final transient Path file;
    private final int line;
    private final int column;
    private final String problem;

    /**
     * @param file    the input file (or folder) at fault
     * @param line    1-based line, 0 when the problem concerns the whole file
     * @param column  1-based column (field) number, 0 when the problem concerns the whole line
     * @param problem what is wrong and what to do, in one sentence
     */
    public InputException(Path file, int line, int column, String problem) {
        super(format(file, line, column, problem));
        this.file = file;
        this.line = line;
        this.column = column;
        this.problem = problem;
    }

    public Path file() {
        return file;
    }

    public int line() {
        return line;
    }

    public int column() {
        return column;
    }

    /** The message without the location. */
    public String problem() {
        return problem;
    }

    /** Text from an input file as a message quotes it: in single quotes, at most 80 characters (then "…"). */
    public static String quote(String text) {
        String t = text.length() > 80 ? text.substring(0, 80) + "…" : text;
        return "'" + t + "'";
    }

    /** The text with line breaks and other control characters shown as escapes, so that the message stays one line. */
    public static String oneLine(String text) {
        StringBuilder sb = new StringBuilder(text.length());
        for (char c : text.toCharArray()) {
            if (c == '\n') {
                sb.append(' ');
            } else if (c == '\r') {
                sb.append("\\r");
            } else if (c == '\t') {
                sb.append("\\t");
            } else if (Character.isISOControl(c)) {
                sb.append(String.format(Locale.ROOT, "\\u%04x", (int) c));
            } else {
                sb.append(c);
            }
        }
        return sb.toString();
    }

    static String format(Path file, int line, int column, String problem) {
        StringBuilder sb = new StringBuilder(oneLine(String.valueOf(file).replace("\n", "\\n")));
        if (line > 0) {
            sb.append(':').append(line);
            if (column > 0) {
                sb.append(':').append(column);
            }
        }
        return sb.append(": ").append(oneLine(problem)).toString();
    }

    @Override
    public String toString() {
        return String.format(Locale.ROOT, "%s", getMessage());
    }
}
