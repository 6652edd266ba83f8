package org.viscarta.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.viscarta.Campaign;
import org.viscarta.fit.FitResult;
import org.viscarta.fit.ModelSelection;
import org.viscarta.fit.ParameterEstimate;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;

/** {@code viscarta fit}: every candidate model fitted to every sample. */
@Command(name = "fit", mixinStandardHelpOptions = true,
        header = "Fit viscoelastic models to each sample, with intervals and Akaike weights.",
        description = {"Fit viscoelastic models jointly to storage and loss moduli (log residuals, Levenberg–Marquardt),",
            "with standard errors, 95 % intervals, AICc and Akaike weights; the lowest AICc is best supported.",
            "Replicates of a sample are fitted together."})
final class FitCommand implements Callable<Integer> {

    static final List<String> CSV_HEADER = List.of("sample", "model", "parameter", "value", "std_error", "ci95_low",
            "ci95_high", "rss", "aicc", "akaike_weight", "best");

    @Mixin
    InputOptions input;

    @Mixin
    ModelOptions models;

    @Mixin
    OutputOptions output;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        Campaign.Settings settings = models.applyTo(input.applyTo(Campaign.Settings.defaults()));
        output.check();
        Campaign campaign = Campaign.read(input.inputs, settings);
        Warnings.print(spec, campaign);
        List<Campaign.SampleFits> fits = campaign.fit();
        PrintWriter out = spec.commandLine().getOut();
        List<List<String>> rows = new ArrayList<>();
        for (Campaign.SampleFits sf : fits) {
            out.printf("%s (%d replicate(s), %s moduli)%n", sf.sample().name(), sf.sample().replicates().size(),
                    sf.sample().kind());
            TextTable t = new TextTable("model", "AICc", "weight", "best", "parameters (value ± standard error) [95 % CI]");
            for (ModelSelection.Ranked rk : sf.fits()) {
                FitResult f = rk.fit();
                List<String> ps = new ArrayList<>();
                for (ParameterEstimate p : f.parameters()) {
                    ps.add(p.name() + " = " + Format.g4(p.value()) + " ± " + Format.g4(p.stdError()) + (p.unit().equals("-") ? "" : " " + p.unit())
                            + " [" + Format.g4(p.ci95Low()) + ", " + Format.g4(p.ci95High()) + "]"
                            + (p.undetermined() ? " (!)" : ""));
                    rows.add(List.of(f.sample(), f.model(), p.name(), Format.csv(p.value()), Format.csv(p.stdError()),
                            Format.csv(p.ci95Low()), Format.csv(p.ci95High()), Format.csv(f.rss()), Format.csv(f.aicc()),
                            Format.csv(rk.weight()), Boolean.toString(rk.best())));
                }
                t.add(f.variant().isEmpty() ? f.model() : f.model() + " (" + f.variant() + ")", f.converged() ? Format.g4(f.aicc()) : "not converged", Format.g4(rk.weight()),
                        rk.best() ? "yes" : "", f.converged() ? String.join("; ", ps) : f.message());
            }
            t.print(out);
            for (ModelSelection.Ranked rk : sf.fits()) {
                for (ParameterEstimate p : rk.fit().parameters()) {
                    if (rk.fit().converged() && p.undetermined()) {
                        out.println("  (!) " + rk.fit().model() + " " + p.name() + ": " + p.note());
                    }
                }
            }
            out.println();
        }
        out.flush();
        output.writeCsv(CSV_HEADER, rows);
        return CommandLine.ExitCode.OK;
    }
}
