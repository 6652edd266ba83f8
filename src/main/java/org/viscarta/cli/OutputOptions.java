package org.viscarta.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.viscarta.io.AtomicOutput;
import org.viscarta.table.Cells;
import org.viscarta.table.CsvTable;
import picocli.CommandLine.Option;

/** {@code -o/--out}, {@code --force} and {@code --quiet}, shared by every verb that writes. */
final class OutputOptions {

    @Option(names = {"-o", "--out"}, paramLabel = "PATH",
            description = "Where to write: a CSV file (fit, rank, match, spectrum, transition; moduli in Pa) or a folder (report, shift).")
    Path out;

    @Option(names = "--force", description = "Replace existing output files.")
    boolean force;

    @Option(names = "--quiet", description = "No progress on stderr (warnings are still printed).")
    boolean quiet;

    /** Fails before any work when the output file exists and --force was not given. */
    void check() {
        if (out != null) {
            AtomicOutput.checkWritable(out, force);
        }
    }

    /** Writes rows of cells as CSV, atomically, for the tables of {@code shift} that are not declared tables. */
    static void writeCsv(Path target, boolean force, List<String> header, List<List<String>> rows) throws IOException {
        CsvTable.writeCells(target, force, header, rows.stream().map(r -> r.stream().map(Cells::inert).toList()).toList());
    }
}
