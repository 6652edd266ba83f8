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
import picocli.CommandLine.Option;

/** {@code -o FILE.csv} and {@code --force}, shared by the verbs that write a table. */
final class OutputOptions {

    @Option(names = {"-o", "--out"}, paramLabel = "FILE.csv", description = "Also write the table as CSV (SI units).")
    Path out;

    @Option(names = "--force", description = "Replace an existing output file.")
    boolean force;

    /** Fails before any work when the output exists and --force was not given. */
    void check() {
        if (out != null) {
            AtomicOutput.checkWritable(out, force);
        }
    }

    /** Writes rows of cells as CSV to {@code -o}, atomically (nothing when -o was not given). */
    void writeCsv(List<String> header, List<List<String>> rows) throws IOException {
        if (out != null) {
            writeCsv(out, force, header, rows);
        }
    }

    /** Writes rows of cells as CSV, atomically. */
    static void writeCsv(Path target, boolean force, List<String> header, List<List<String>> rows) throws IOException {
        AtomicOutput.write(target, force, stream -> {
            Writer w = new OutputStreamWriter(stream, StandardCharsets.UTF_8);
            CSVPrinter p = new CSVPrinter(w, CSVFormat.DEFAULT.builder().setRecordSeparator("\n").get());
            p.printRecord(header);
            for (List<String> r : rows) {
                p.printRecord(r);
            }
            p.flush();
        });
    }
}
