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

    /** Prints text rows, the first as the header, in columns two spaces apart. */
    public static void print(List<String[]> rows, PrintWriter out) {
        int cols = rows.get(0).length;
        int[] w = new int[cols];
        for (String[] r : rows) {
            for (int i = 0; i < cols && i < r.length; i++) {
                w[i] = Math.max(w[i], r[i] == null ? 0 : r[i].length());
            }
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
