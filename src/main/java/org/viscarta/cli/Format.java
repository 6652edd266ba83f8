package org.viscarta.cli;

import org.viscarta.table.Cells;

/** Number formatting for the terminal and CSV outputs (Locale.ROOT everywhere; {@link Cells} decides). */
final class Format {

    private Format() {
    }

    /** Four significant digits for reading; "–" for NaN. */
    static String g4(double v) {
        return Cells.g4(v);
    }

    /** Full precision for machines; empty for NaN. */
    static String csv(double v) {
        return Cells.csv(v);
    }
}
