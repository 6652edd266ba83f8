package org.viscarta.cli;

import java.io.PrintWriter;
import java.util.concurrent.Callable;
import org.viscarta.Campaign;
import org.viscarta.io.ColumnSpec;
import org.viscarta.io.ReadWarning;
import org.viscarta.io.SweepFile;
import org.viscarta.sweep.Sweep;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;

/** {@code viscarta inspect}: how each input file was understood. */
@Command(name = "inspect", mixinStandardHelpOptions = true,
        header = "Show how each input file was understood.",
        description = "Show how each input file was understood: layout, separator, columns and units, samples, "
                + "replicates, frequency range, and every warning. Reads only; writes nothing.")
final class InspectCommand implements Callable<Integer> {

    @Mixin
    InputOptions input;

    @picocli.CommandLine.Option(names = {"-o", "--out"}, paramLabel = "FILE.json", description = "Also write the same as JSON.")
    java.nio.file.Path out;

    @picocli.CommandLine.Option(names = "--force", description = "Replace an existing output file.")
    boolean force;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws java.io.IOException {
        if (out != null) {
            org.viscarta.io.AtomicOutput.checkWritable(out, force);
        }
        Campaign campaign = Campaign.read(input.inputs, input.applyTo(Campaign.Settings.defaults()));
        PrintWriter out = spec.commandLine().getOut();
        for (ReadWarning w : campaign.warnings()) {
            if (w.message().startsWith("left out: ")) {
                out.println("left out: " + w.message().substring("left out: ".length()));
            }
        }
        for (SweepFile f : campaign.files()) {
            out.println(f.path());
            out.printf("  layout: %s; separator: %s; decimal mark: '%s'; encoding: %s; header on line %d%n",
                    f.info().layout(), f.info().separatorName(), f.info().decimalMark(), f.info().encoding(),
                    f.info().headerLine());
            for (ColumnSpec c : f.info().columns()) {
                out.printf("  column %d '%s' -> %s%n", c.index() + 1, c.header(), c.describe());
            }
            f.info().metadata().forEach((k, v) -> out.printf("  metadata %s: %s%n", k, v));
            TextTable t = new TextTable("sample", "replicate", "group", "basis", "points", "frequency [Hz]", "temperature [°C]");
            for (Sweep s : f.sweeps()) {
                t.add(s.sample(), s.replicate(), s.group(), s.kind().toString(), Integer.toString(s.points().size()),
                        Format.g4(s.minFrequencyHz()) + "–" + Format.g4(s.maxFrequencyHz()), Format.g4(s.temperatureC()));
            }
            t.print(out);
            for (ReadWarning w : f.warnings()) {
                out.println("  warning: " + w);
            }
            out.println();
        }
        for (String note : campaign.notes()) {
            out.println("conversion: " + note);
        }
        out.printf("%d file(s), %d sample(s), %d sweep(s), %d warning(s)%n", campaign.files().size(),
                campaign.samples().size(), campaign.files().stream().mapToInt(f -> f.sweeps().size()).sum(),
                campaign.warnings().size());
        out.flush();
        if (this.out != null) {
            String json = Json.inspect(campaign);
            org.viscarta.io.AtomicOutput.write(this.out, force, o -> o.write(json.getBytes(java.nio.charset.StandardCharsets.UTF_8)));
        }
        return CommandLine.ExitCode.OK;
    }
}
