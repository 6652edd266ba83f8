package org.viscarta.table;

import java.util.Objects;
import java.util.Set;
import java.util.function.Function;

/**
 * One column of an output table, declared once for every medium.
 *
 * @param csvName the machine name in CSV outputs (snake case, SI unit in the name where there is one)
 * @param label   what people read in the terminal, the workbook and the page
 * @param unit    the unit shown after the label in brackets ("–" for dimensionless, "" for none)
 * @param style   how numbers are shown
 * @param width   column width in the workbook [characters]
 * @param value   how the cell's value is taken from a row: a Number (NaN: empty), a Boolean, text, or null (empty)
 * @param media   where the column appears
 */
public record Column<R>(String csvName, String label, String unit, Style style, int width, Function<R, Object> value,
                        Set<Medium> media) {

    public Column {
        Objects.requireNonNull(csvName, "csvName");
        Objects.requireNonNull(label, "label");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(style, "style");
        Objects.requireNonNull(value, "value");
        media = Set.copyOf(media);
        if (!(width > 0)) {
            throw new IllegalArgumentException("column width must be positive, got " + width);
        }
    }

    /** The label with its unit, e.g. "tan δ mean [–]", as the terminal, workbook and page head the column. */
    public String header() {
        return unit.isEmpty() ? label : label + " [" + unit + "]";
    }
}
