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

    /** Prose for the terminal, wrapped at {@code width} columns; continuation lines indented by {@code indent}. */
    static String wrap(String text, int width, String indent) {
        String lead = text.substring(0, text.length() - text.stripLeading().length());
        StringBuilder out = new StringBuilder(lead);
        int col = lead.length();
        boolean first = true;
        for (String word : text.stripLeading().split(" ")) {
            if (!first && col + 1 + word.length() > width) {
                out.append('\n').append(indent);
                col = indent.length();
            } else if (!first) {
                out.append(' ');
                col++;
            }
            out.append(word);
            col += word.length();
            first = false;
        }
        return out.toString();
    }
}
