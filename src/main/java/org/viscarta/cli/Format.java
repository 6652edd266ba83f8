package org.viscarta.cli;

import java.util.Locale;

/** Number formatting for the terminal and CSV outputs (Locale.ROOT everywhere). */
final class Format {

    private Format() {
    }

    /** Four significant digits for reading; "–" for NaN. */
    static String g4(double v) {
        if (!Double.isFinite(v)) {
            return Double.isNaN(v) ? "–" : (v > 0 ? "inf" : "-inf");
        }
        return String.format(Locale.ROOT, "%.4g", v);
    }

    /** Full precision for machines; empty for NaN. */
    static String csv(double v) {
        return Double.isFinite(v) ? Double.toString(v) : "";
    }
}
