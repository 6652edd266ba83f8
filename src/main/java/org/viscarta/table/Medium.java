package org.viscarta.table;

import java.util.EnumSet;
import java.util.Set;

/** Where a table is drawn. */
public enum Medium {
    /** {@code -o FILE.csv}: machine names, SI values at full precision. */
    CSV,
    /** The terminal: labels with units, four significant digits. */
    TERMINAL,
    /** A workbook sheet: labels with units, numeric cells with a number format. */
    SHEET,
    /** The HTML page: labels with units, four significant digits. */
    HTML;

    /** Every medium. */
    public static Set<Medium> all() {
        return EnumSet.allOf(Medium.class);
    }

    /** Every medium but these. */
    public static Set<Medium> allBut(Medium... not) {
        Set<Medium> s = EnumSet.allOf(Medium.class);
        for (Medium m : not) {
            s.remove(m);
        }
        return s;
    }
}
