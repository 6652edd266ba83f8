package org.viscarta.table;

import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.function.Function;

/**
 * An output table declared once: its name and columns. Each medium's renderer draws it
 * ({@link CsvTable}, {@link TerminalTable}, and the workbook and page renderers of the report).
 *
 * @param name         the sheet name and the page heading
 * @param columns      the columns in order
 * @param csvOrder     the CSV columns' order by machine name, when a published CSV layout differs from the
 *                     order people read (empty: the declared order)
 * @param colourScaled machine names of the columns the workbook shades by value (tan δ)
 */
public record Table<R>(String name, List<Column<R>> columns, List<String> csvOrder, Set<String> colourScaled) {

    public Table {
        columns = List.copyOf(columns);
        csvOrder = List.copyOf(csvOrder);
        colourScaled = Set.copyOf(colourScaled);
        for (String n : csvOrder) {
            if (columns.stream().noneMatch(c -> c.csvName().equals(n) && c.media().contains(Medium.CSV))) {
                throw new IllegalArgumentException("table " + name + ": no CSV column '" + n + "'");
            }
        }
    }

    /** The columns a medium shows, in its order. */
    public List<Column<R>> columnsFor(Medium medium) {
        List<Column<R>> shown = columns.stream().filter(c -> c.media().contains(medium)).toList();
        if (medium != Medium.CSV || csvOrder.isEmpty()) {
            return shown;
        }
        List<Column<R>> out = new ArrayList<>();
        for (String n : csvOrder) {
            shown.stream().filter(c -> c.csvName().equals(n)).forEach(out::add);
        }
        shown.stream().filter(c -> !csvOrder.contains(c.csvName())).forEach(out::add);
        return out;
    }

    /** The CSV header. */
    public List<String> csvHeader() {
        return columnsFor(Medium.CSV).stream().map(Column::csvName).toList();
    }

    /** A table named {@code name}; add columns with the builder's methods. */
    public static <R> Builder<R> named(String name) {
        return new Builder<>(name);
    }

    /** Builds a table column by column. */
    public static final class Builder<R> {
        private final String name;
        private final List<Column<R>> columns = new ArrayList<>();
        private final List<String> csvOrder = new ArrayList<>();
        private final Set<String> colourScaled = new java.util.HashSet<>();

        private Builder(String name) {
            this.name = name;
        }

        /** A column in every medium. */
        public Builder<R> column(String csvName, String label, String unit, Style style, int width, Function<R, Object> value) {
            return column(csvName, label, unit, style, width, value, Medium.all());
        }

        /** A column in the named media only. */
        public Builder<R> column(String csvName, String label, String unit, Style style, int width, Function<R, Object> value,
                                 Set<Medium> media) {
            columns.add(new Column<>(csvName, label, unit, style, width, value, media));
            return this;
        }

        /** The workbook shades the last column added by its value. */
        public Builder<R> colourScale() {
            colourScaled.add(columns.get(columns.size() - 1).csvName());
            return this;
        }

        /** The CSV output keeps this published order of machine names. */
        public Builder<R> csvOrder(String... names) {
            csvOrder.addAll(List.of(names));
            return this;
        }

        public Table<R> build() {
            return new Table<>(name, columns, csvOrder, colourScaled);
        }
    }
}
