package org.viscarta.cli;

/** Text for the terminal: prose wrapped to a width (numbers are formatted by {@link org.viscarta.table.Cells}). */
final class Format {

    private Format() {
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
