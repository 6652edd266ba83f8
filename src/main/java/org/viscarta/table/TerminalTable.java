package org.viscarta.table;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;

/**
 * Draws a declared table as left-aligned text for the terminal, headed by labels with units. Text
 * cells longer than {@value #LONGEST_CELL} characters are cut with "…" (the CSV and the workbook
 * hold them whole), so that tables stay readable in a terminal.
 */
public final class TerminalTable {

    /** The longest text cell shown whole in the terminal. */
    static final int LONGEST_CELL = 40;

    private TerminalTable() {
    }

    /** A cell cut into pieces of at most {@code width} characters, after a space or hyphen where one is near. */
    static List<String> wrap(String cell, int width) {
        List<String> out = new ArrayList<>();
        String rest = cell;
        while (rest.length() > width) {
            int cut = width;
            for (int i = width; i > width / 2; i--) {
                char ch = rest.charAt(i - 1);
                if (ch == ' ' || ch == '-' || ch == '_') {
                    cut = i;
                    break;
                }
            }
            out.add(rest.substring(0, cut).stripTrailing());
            rest = rest.substring(cut);
        }
        out.add(rest);
        return out;
    }

    /** Prints the rows under a header and a rule. */
    public static <R> void print(Table<R> table, Iterable<R> rows, PrintWriter out) {
        List<Column<R>> cols = table.columnsFor(Medium.TERMINAL);
        List<String[]> lines = new ArrayList<>();
        lines.add(cols.stream().map(Column::header).toArray(String[]::new));
        for (R row : rows) {
            String[] cells = new String[cols.size()];
            for (int i = 0; i < cells.length; i++) {
                String cell = Cells.readable(cols.get(i).value().apply(row), cols.get(i).style());
                cells[i] = cell.length() > LONGEST_CELL ? cell.substring(0, LONGEST_CELL - 1) + "…" : cell;
            }
            lines.add(cells);
        }
        print(lines, out);
    }

    /** The width a terminal table keeps within, when its widest column can wrap. */
    static final int TERMINAL_WIDTH = 100;

    /**
     * Prints text rows, the first as the header, in columns two spaces apart. A table wider than
     * {@value #TERMINAL_WIDTH} characters has the column with the most room beyond its header (a name,
     * usually) narrowed, its longer
     * cells continued on the next line.
     */
    public static void print(List<String[]> rows, PrintWriter out) {
        int cols = rows.get(0).length;
        int[] w = new int[cols];
        for (String[] r : rows) {
            for (int i = 0; i < cols && i < r.length; i++) {
                w[i] = Math.max(w[i], r[i] == null ? 0 : r[i].length());
            }
        }
        // the column that can give up the most: the widest cells beyond its header (and 12 characters)
        int width = -2;
        int widest = 0;
        int[] least = new int[cols];
        for (int i = 0; i < cols; i++) {
            width += w[i] + 2;
            least[i] = Math.max(12, rows.get(0)[i] == null ? 0 : rows.get(0)[i].length());
            widest = w[i] - least[i] > w[widest] - least[widest] ? i : widest;
        }
        int narrowed = Math.max(least[widest], w[widest] - (width - TERMINAL_WIDTH));
        if (width > TERMINAL_WIDTH && narrowed < w[widest]) {
            List<String[]> wrapped = new ArrayList<>();
            for (String[] r : rows) {
                String c = widest < r.length && r[widest] != null ? r[widest] : "";
                List<String> parts = wrap(c, narrowed);
                for (int k = 0; k < parts.size(); k++) {
                    String[] line = k == 0 ? java.util.Arrays.copyOf(r, Math.max(cols, r.length)) : new String[cols];
                    line[widest] = parts.get(k);
                    wrapped.add(line);
                }
            }
            w[widest] = narrowed;
            rows = wrapped;
        }
        StringBuilder sb = new StringBuilder();
        for (int k = 0; k < rows.size(); k++) {
            String[] r = rows.get(k);
            sb.setLength(0);
            for (int i = 0; i < cols; i++) {
                String c = i < r.length && r[i] != null ? r[i] : "";
                sb.append(c);
                if (i < cols - 1) {
                    sb.append(" ".repeat(w[i] - c.length() + 2));
                }
            }
            out.println(sb.toString().stripTrailing());
            if (k == 0) {
                int total = 0;
                for (int x : w) {
                    total += x + 2;
                }
                out.println("-".repeat(Math.max(0, total - 2)));
            }
        }
        out.flush();
    }
}
