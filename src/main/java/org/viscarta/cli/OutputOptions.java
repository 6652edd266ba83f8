package org.viscarta.cli;

import java.io.IOException;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.viscarta.io.AtomicOutput;
import org.viscarta.table.Cells;
import picocli.CommandLine.Option;

/** {@code -o/--out}, {@code --force} and {@code --quiet}, shared by every verb that writes. */
final class OutputOptions {

    @Option(names = {"-o", "--out"}, paramLabel = "PATH",
            description = "Where to write: a CSV file (fit, rank, match, in SI units) or a folder (report, shift).")
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
        AtomicOutput.write(target, force, stream -> {
            Writer w = new OutputStreamWriter(stream, StandardCharsets.UTF_8);
            CSVPrinter p = new CSVPrinter(w, CSVFormat.DEFAULT.builder().setRecordSeparator("\n").get());
            p.printRecord(header);
            for (List<String> r : rows) {
                p.printRecord(r.stream().map(Cells::inert).toList());
            }
            p.flush();
        });
    }
}
