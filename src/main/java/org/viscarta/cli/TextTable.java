package org.viscarta.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import org.viscarta.table.TerminalTable;

/** A plain left-aligned text table for the terminal, for layouts that are not a declared table. */
final class TextTable {

    private final List<String[]> rows = new ArrayList<>();

    TextTable(String... header) {
        rows.add(header);
    }

    void add(String... cells) {
        rows.add(cells);
    }

    void print(PrintWriter out) {
        TerminalTable.print(rows, out);
    }
}
