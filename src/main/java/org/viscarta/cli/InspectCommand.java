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

    @Mixin
    QualityOptions quality;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    /** Inputs larger than this together are inspected without the quality checks, which read every point. */
    static final long CHECKED_BYTES = 50L << 20;

    /** The quality checks of the inputs, when they were run. */
    private record Checked(org.viscarta.analysis.AnalysisResult result, String note) {
        /** The checks column of a sweep: the display name is the sample's, with its temperature when it has several. */
        String marker(SweepReader.SweepSummary w) {
            if (result == null) {
                return "";
            }
            for (org.viscarta.analysis.Sample s : result.inputs().samples()) {
                for (org.viscarta.sweep.Sweep r : s.replicates()) {
                    if (same(r, w)) {
                        return result.quality().sweepMarker(s.name(), r.replicate());
                    }
                }
            }
            for (org.viscarta.sweep.Sweep a : result.inputs().amplitudeSweeps()) {
                if (same(a, w)) {
                    return result.quality().amplitudeMarker(a.sample(), a.replicate());
                }
            }
            return "";
        }

        private static boolean same(org.viscarta.sweep.Sweep r, SweepReader.SweepSummary w) {
            return r.sample().equals(w.sample()) && r.replicate().equals(w.replicate()) && r.points().size() == w.points()
                    && Double.compare(r.temperatureC(), w.temperatureC()) == 0 && r.minFrequencyHz() == w.minFrequencyHz();
        }
    }

    private Checked check(List<Path> files) {
        long bytes = 0;
        for (Path f : files) {
            try {
                bytes += java.nio.file.Files.size(f);
            } catch (IOException e) {
                return new Checked(null, "checks: not run (" + e.getMessage() + ")");
            }
        }
        if (bytes > CHECKED_BYTES) {
            return new Checked(null, "checks: not run on inputs over 50 MB, which inspect reads in one streaming pass; "
                    + "run 'viscarta quality' for them");
        }
        try {
            org.viscarta.analysis.AnalysisResult r = org.viscarta.analysis.Analysis.run(
                    quality.applyTo(input.request(), false).badFiles(org.viscarta.analysis.ReadSettings.BadFiles.LEAVE_OUT).build());
            return new Checked(r, "checks: the worst verdict of each sweep's quality checks and the checks concerned; "
                    + "'viscarta quality' explains each");
        } catch (InputException | org.viscarta.io.UsageException | IllegalArgumentException e) {
            return new Checked(null, "checks: not run (" + InputException.oneLine(e.getMessage()) + ")");
        }
    }

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
        Checked checked = check(files);
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
            List<String> marks = new ArrayList<>();
            List<String> tests = new ArrayList<>();
            for (SweepReader.SweepSummary w : s.sweeps()) {
                if (!w.test().isEmpty()) {
                    tests.add("  " + w.sample() + " replicate " + w.replicate() + ": " + w.test() + " (" + w.points() + " points, "
                            + w.kind() + (Double.isNaN(w.temperatureC()) ? "" : ", " + Cells.g4(w.temperatureC()) + " °C") + ")");
                    continue;
                }
                t.add(w.sample(), w.replicate(), w.group(), w.kind().toString(), Long.toString(w.points()),
                        Cells.g4(w.minFrequencyHz()) + "–" + Cells.g4(w.maxFrequencyHz()), Cells.g4(w.temperatureC()));
                String m = checked.marker(w);
                if (!m.isEmpty() && !m.equals("pass")) {
                    marks.add("  checks of " + w.sample() + " replicate " + w.replicate() + ": " + m);
                }
            }
            if (tests.size() < s.sweeps().size()) {
                t.print(o);
            }
            tests.forEach(x -> o.println(Format.wrap(x, 100, "    ")));
            if (checked.result() != null && tests.size() < s.sweeps().size()) {
                if (marks.isEmpty()) {
                    o.println("  checks: every sweep passes");
                }
                marks.forEach(m -> o.println(Format.wrap(m, 100, "    ")));
            }
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
        o.println(Format.wrap(checked.note(), 100, "  "));
        o.flush();
        if (output.out != null) {
            String json = Json.inspect(summaries, leftOut);
            AtomicOutput.write(output.out, output.force, w -> w.write(json.getBytes(StandardCharsets.UTF_8)));
        }
        return CommandLine.ExitCode.OK;
    }
}
