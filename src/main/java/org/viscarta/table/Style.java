package org.viscarta.table;

/** How a column's numbers are shown; the stored value (CSV, workbook cell) keeps full precision. */
public enum Style {
    /** Text as it is. */
    TEXT("@"),
    /** Whole numbers (ranks, counts, line numbers). */
    INTEGER("0"),
    /**
     * Four significant figures, for moduli and parameters of any scale: plain between 0.0001 and
     * 10,000, powers of ten outside (the workbook picks the format cell by cell).
     */
    SCIENTIFIC("0.000E+00"),
    /** Four decimals, for tan δ, weights, distances, p-values. */
    DECIMAL4("0.0000"),
    /** Two decimals, for AICc, temperatures, angles. */
    DECIMAL2("0.00"),
    /** Frequencies: up to four decimals. */
    FREQUENCY("0.0###");

    private final String sheetFormat;

    Style(String sheetFormat) {
        this.sheetFormat = sheetFormat;
    }

    /** The spreadsheet number format. */
    public String sheetFormat() {
        return sheetFormat;
    }
}
