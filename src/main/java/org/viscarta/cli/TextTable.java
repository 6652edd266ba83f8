package org.viscarta.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;

/** A plain left-aligned text table for the terminal. */
final class TextTable {

    private final List<String[]> rows = new ArrayList<>();

    TextTable(String... header) {
        rows.add(header);
    }

    void add(String... cells) {
        rows.add(cells);
    }

    void print(PrintWriter out) {
        int cols = rows.get(0).length;
        int[] w = new int[cols];
        for (String[] r : rows) {
            for (int i = 0; i < cols && i < r.length; i++) {
                w[i] = Math.max(w[i], r[i] == null ? 0 : r[i].length());
            }
        }
        for (int k = 0; k < rows.size(); k++) {
            String[] r = rows.get(k);
            StringBuilder sb = new StringBuilder();
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
