package org.viscarta.table;

import java.io.IOException;
import java.io.Writer;
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
        Iterable<List<String>> cells = () -> new java.util.Iterator<>() {
            private final java.util.Iterator<R> it = rows.iterator();

            @Override
            public boolean hasNext() {
                return it.hasNext();
            }

            @Override
            public List<String> next() {
                R row = it.next();
                List<String> out = new ArrayList<>(cols.size());
                for (Column<R> c : cols) {
                    out.add(Cells.csv(c.value().apply(row)));
                }
                return out;
            }
        };
        writeCells(target, force, table.csvHeader(), cells);
    }

    /**
     * Writes rows of text cells as CSV, atomically: the one CSV writer of every output. Cells are
     * written as given (a declared table has made its text inert already; see {@link Cells#inert}).
     */
    public static void writeCells(Path target, boolean force, List<String> header, Iterable<List<String>> rows) throws IOException {
        AtomicOutput.write(target, force, stream -> {
            Writer w = new org.viscarta.io.Utf8Writer(stream);
            CSVPrinter p = new CSVPrinter(w, CSVFormat.DEFAULT.builder().setRecordSeparator("\n").get());
            p.printRecord(header);
            for (List<String> r : rows) {
                p.printRecord(r);
            }
            p.flush();
        });
    }
}
