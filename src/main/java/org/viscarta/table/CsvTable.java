package org.viscarta.table;

import java.io.IOException;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.viscarta.io.AtomicOutput;

/** Draws a declared table as CSV: machine names, full precision, written atomically. */
public final class CsvTable {

    private CsvTable() {
    }

    /** Writes the rows to {@code target} (an existing file only with {@code force}). */
    public static <R> void write(Table<R> table, Iterable<R> rows, Path target, boolean force) throws IOException {
        List<Column<R>> cols = table.columnsFor(Medium.CSV);
        AtomicOutput.write(target, force, stream -> {
            Writer w = new OutputStreamWriter(stream, StandardCharsets.UTF_8);
            CSVPrinter p = new CSVPrinter(w, CSVFormat.DEFAULT.builder().setRecordSeparator("\n").get());
            p.printRecord(table.csvHeader());
            List<String> cells = new ArrayList<>(cols.size());
            for (R row : rows) {
                cells.clear();
                for (Column<R> c : cols) {
                    cells.add(Cells.csv(c.value().apply(row)));
                }
                p.printRecord(cells);
            }
            p.flush();
        });
    }
}
