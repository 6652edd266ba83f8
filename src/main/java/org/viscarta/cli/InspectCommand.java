package org.viscarta.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.viscarta.analysis.Inputs;
import org.viscarta.io.AtomicOutput;
import org.viscarta.io.ColumnSpec;
import org.viscarta.io.InputCollector;
import org.viscarta.io.InputException;
import org.viscarta.io.ReadWarning;
import org.viscarta.io.SweepReader;
import org.viscarta.io.TableInfo;
import org.viscarta.table.Cells;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;

/** {@code viscarta inspect}: how each input file was understood, in one streaming pass per file. */
@Command(name = "inspect", mixinStandardHelpOptions = true,
        header = "Show how each input file was understood.",
        description = "Show how each input file was understood: layout, separator, columns and units, samples, "
                + "replicates, frequency range, and every warning. Sweep tables are read in one streaming pass, so files of "
                + "any size can be inspected. Writes nothing unless -o is given.")
final class InspectCommand implements Callable<Integer> {

    @Mixin
    InputOptions input;

    @Mixin
    OutputOptions output;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        output.check();
        ReadOptions r = input.read;
        org.viscarta.analysis.ReadSettings settings = r.settings();
        List<Path> files = InputCollector.collect(input.inputs);
        List<SweepReader.Summary> summaries = new ArrayList<>();
        List<String> leftOut = new ArrayList<>();
        for (Path f : files) {
            try {
                summaries.add(Inputs.summarize(f, settings));
            } catch (InputException e) {
                if (r.strict || files.size() == 1) {
                    throw e;
                }
                leftOut.add(e.getMessage());
            }
        }
        if (summaries.isEmpty() && !leftOut.isEmpty()) {
            throw new InputException(files.get(0), 0, 0, leftOut.get(0));
        }
        PrintWriter o = spec.commandLine().getOut();
        for (String l : leftOut) {
            o.println("left out: " + l);
        }
        int sweeps = 0;
        int warnings = 0;
        for (SweepReader.Summary s : summaries) {
            TableInfo info = s.info();
            o.println(s.path());
            o.printf("  layout: %s; separator: %s; decimal mark: '%s'; encoding: %s; header on line %d%n", info.layout(),
                    info.separatorName(), info.decimalMark(), info.encoding(), info.headerLine());
            for (ColumnSpec c : info.columns()) {
                o.printf("  column %d '%s' -> %s%n", c.index() + 1, c.header(), c.describe());
            }
            info.metadata().forEach((k, v) -> o.printf(k.startsWith("note_") ? "  preamble note %s: %s%n" : "  metadata %s: %s%n",
                    k.startsWith("note_") ? k.substring(5) : k, v));
            TextTable t = new TextTable("sample", "replicate", "group", "basis", "points", "frequency [Hz]", "temperature [°C]");
            for (SweepReader.SweepSummary w : s.sweeps()) {
                t.add(w.sample(), w.replicate(), w.group(), w.kind().toString(), Long.toString(w.points()),
                        Cells.g4(w.minFrequencyHz()) + "–" + Cells.g4(w.maxFrequencyHz()), Cells.g4(w.temperatureC()));
            }
            t.print(o);
            for (ReadWarning w : s.warnings()) {
                o.println("  warning: " + w);
            }
            o.println();
            sweeps += s.sweeps().size();
            warnings += s.warnings().size();
        }
        long samples = summaries.stream().flatMap(s -> s.sweeps().stream()).map(w -> w.sample() + "\u0000" + w.temperatureC())
                .distinct().count();
        o.printf("%d file(s), %d sample(s), %d sweep(s), %d warning(s)%s%n", summaries.size(), samples, sweeps, warnings,
                leftOut.isEmpty() ? "" : ", " + leftOut.size() + " file(s) left out");
        o.flush();
        if (output.out != null) {
            String json = Json.inspect(summaries, leftOut);
            AtomicOutput.write(output.out, output.force, w -> w.write(json.getBytes(StandardCharsets.UTF_8)));
        }
        return CommandLine.ExitCode.OK;
    }
}
