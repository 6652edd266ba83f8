package org.viscarta.table;

/** How a cell's value becomes text in each medium (Locale.ROOT everywhere). */
public final class Cells {

    private Cells() {
    }

    /**
     * Full precision for machines; "" for NaN and null; true/false for booleans; text made inert
     * for spreadsheets ({@link #inert}).
     */
    public static String csv(Object v) {
        if (v == null) {
            return "";
        }
        if (v instanceof Double || v instanceof Float) {
            double d = ((Number) v).doubleValue();
            return Double.isFinite(d) ? Double.toString(d) : "";
        }
        return v instanceof Number || v instanceof Boolean ? v.toString() : inert(v.toString());
    }

    /**
     * A text cell a spreadsheet will not evaluate: one that begins with =, +, -, @, a tab or a
     * carriage return is prefixed with an apostrophe (the usual defence against formula injection,
     * OWASP "CSV Injection"); a plain number such as -2.5 or 1e-3 stays as it is.
     */
    public static String inert(String text) {
        if (text.isEmpty() || "=+-@\t\r".indexOf(text.charAt(0)) < 0 || PLAIN_NUMBER.matcher(text).matches()) {
            return text;
        }
        return "'" + text;
    }

    private static final java.util.regex.Pattern PLAIN_NUMBER =
            java.util.regex.Pattern.compile("[+-]?(\\d+\\.?\\d*|\\.\\d+)([eE][+-]?\\d+)?|[+-]?Infinity|NaN");

    /**
     * A value for reading in a column of this style: whole numbers as such, fixed decimals for
     * tan δ, weights and temperatures, frequencies without trailing zeros, four significant digits
     * for moduli and parameters; "–" for NaN, "" for null, yes/no for booleans.
     */
    public static String readable(Object v, Style style) {
        if (v instanceof Double || v instanceof Float) {
            double d = ((Number) v).doubleValue();
            if (!Double.isFinite(d)) {
                return g4(d);
            }
            switch (style) {
                // Numbers.fixed gives the text of "%.Nf" (checked against the Formatter) at a third of its cost
                case DECIMAL4: return org.viscarta.sweep.Numbers.fixed(d, 4);
                case DECIMAL2: return org.viscarta.sweep.Numbers.fixed(d, 2);
                case FREQUENCY: return org.viscarta.sweep.Numbers.plain(d);
                case INTEGER: return org.viscarta.sweep.Numbers.fixed(d, 0);
                default: return g4(d);
            }
        }
        return readable(v);
    }

    /** Four significant digits for reading; "–" for NaN and null; yes/no for booleans. */
    public static String readable(Object v) {
        if (v == null) {
            return "";
        }
        if (v instanceof Boolean b) {
            return b ? "yes" : "no";
        }
        if (v instanceof Double || v instanceof Float) {
            return g4(((Number) v).doubleValue());
        }
        return v.toString();
    }

    /** Four significant digits; "–" for NaN, "inf" for infinity. */
    public static String g4(double v) {
        if (!Double.isFinite(v)) {
            return Double.isNaN(v) ? "–" : (v > 0 ? "inf" : "-inf");
        }
        return org.viscarta.sweep.Numbers.general(v, 4); // %.4g's text, without the Formatter's cost
    }
}
