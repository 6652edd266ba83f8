package org.viscarta.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.viscarta.Campaign;
import org.viscarta.fit.DerivedEstimate;
import org.viscarta.fit.FitResult;
import org.viscarta.fit.ModelSelection;
import org.viscarta.fit.ParameterEstimate;
import org.viscarta.fit.TimeDomain;
import org.viscarta.io.AtomicOutput;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code viscarta fit}: every candidate model fitted to every sample. */
@Command(name = "fit", mixinStandardHelpOptions = true,
        header = "Fit viscoelastic models to each sample, with intervals and Akaike weights.",
        description = {"Fit viscoelastic models jointly to storage and loss moduli (log residuals by default, Levenberg–Marquardt",
            "from several data-derived starts), with standard errors, 95 % intervals, AICc and Akaike weights; the lowest",
            "AICc is best supported. Replicates of a sample are fitted together. Parameters the data do not determine",
            "are flagged with the reason."})
final class FitCommand implements Callable<Integer> {

    static final List<String> CSV_HEADER = List.of("sample", "model", "parameter", "value", "std_error", "ci95_low",
            "ci95_high", "rss", "aicc", "akaike_weight", "best", "note");
    static final List<String> TIME_HEADER = List.of("sample", "model", "time_s", "relaxation_modulus_pa", "creep_compliance_per_pa");

    @Mixin
    InputOptions input;

    @Mixin
    ModelOptions models;

    @Mixin
    OutputOptions output;

    @Option(names = "--time-domain", paramLabel = "GRID", converter = TimeGridConverter.class,
            description = "Also compute the relaxation modulus E(t) and creep compliance J(t) of every fitted model on this "
                    + "time grid in seconds: FROM:TO:COUNT (log-spaced) or a list, e.g. 0.01:100:25.")
    TimeGridConverter.Grid timeGrid;

    @Option(names = "--time-domain-out", paramLabel = "FILE.csv",
            description = "Write the --time-domain values as CSV (sample, model, time_s, relaxation_modulus_pa, creep_compliance_per_pa).")
    Path timeOut;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        Campaign.Settings settings = models.applyTo(input.applyTo(Campaign.Settings.defaults()));
        if (timeOut != null && timeGrid == null) {
            throw new CommandLine.ParameterException(spec.commandLine(), "--time-domain-out needs --time-domain GRID");
        }
        output.check();
        if (timeOut != null) {
            AtomicOutput.checkWritable(timeOut, output.force);
        }
        Campaign campaign = Campaign.read(input.inputs, settings);
        Warnings.print(spec, campaign);
        List<Campaign.SampleFits> fits = campaign.fit();
        PrintWriter out = spec.commandLine().getOut();
        List<List<String>> rows = new ArrayList<>();
        List<List<String>> timeRows = new ArrayList<>();
        for (Campaign.SampleFits sf : fits) {
            printSample(out, sf, rows);
            if (timeGrid != null) {
                printTimeDomain(out, sf, timeRows);
            }
            out.println();
        }
        out.flush();
        output.writeCsv(CSV_HEADER, rows);
        if (timeOut != null) {
            OutputOptions.writeCsv(timeOut, output.force, TIME_HEADER, timeRows);
        }
        return CommandLine.ExitCode.OK;
    }

    private static void printSample(PrintWriter out, Campaign.SampleFits sf, List<List<String>> rows) {
        out.printf("%s (%d replicate(s), %s moduli)%n", sf.sample().name(), sf.sample().replicates().size(), sf.sample().kind());
        TextTable t = new TextTable("model", "AICc", "ΔAICc", "weight", "best", "parameters (value ± standard error) [95 % CI]");
        List<String> close = new ArrayList<>();
        for (ModelSelection.Ranked rk : sf.fits()) {
            FitResult f = rk.fit();
            List<String> ps = new ArrayList<>();
            for (ParameterEstimate p : f.parameters()) {
                ps.add(p.name() + " = " + Format.g4(p.value()) + " ± " + Format.g4(p.stdError())
                        + (p.unit().equals("-") ? "" : " " + p.unit())
                        + " [" + Format.g4(p.ci95Low()) + ", " + Format.g4(p.ci95High()) + "]" + (p.undetermined() ? " (!)" : ""));
                String note = !f.converged() ? f.message() : join(f.variant(), p.note());
                rows.add(List.of(f.sample(), f.model(), p.name(), Format.csv(p.value()), Format.csv(p.stdError()),
                        Format.csv(p.ci95Low()), Format.csv(p.ci95High()), Format.csv(f.rss()), Format.csv(f.aicc()),
                        Format.csv(rk.weight()), Boolean.toString(rk.best()), note));
            }
            if (rk.deltaAicc() < 2 && !rk.best()) {
                close.add(f.model());
            }
            t.add(f.variant().isEmpty() ? f.model() : f.model() + " (" + f.variant() + ")",
                    f.converged() ? Format.g4(f.aicc()) : "not converged", Format.g4(rk.deltaAicc()), Format.g4(rk.weight()),
                    rk.best() ? "yes" : "", f.converged() ? String.join("; ", ps) : f.message());
        }
        t.print(out);
        sf.best().ifPresentOrElse(b -> {
            out.println("  best supported: " + b.model() + (close.isEmpty() ? "" : "; within ΔAICc < 2: " + String.join(", ", close)));
            List<String> ds = new ArrayList<>();
            for (DerivedEstimate d : b.derived()) {
                ds.add(d.name() + " = " + Format.g4(d.value()) + " ± " + Format.g4(d.stdError()) + (d.unit().equals("-") ? "" : " " + d.unit()));
            }
            if (!ds.isEmpty()) {
                out.println("  derived (" + b.model() + "): " + String.join("; ", ds));
            }
        }, () -> out.println("  no model converged"));
        for (ModelSelection.Ranked rk : sf.fits()) {
            for (ParameterEstimate p : rk.fit().parameters()) {
                if (rk.fit().converged() && p.undetermined()) {
                    out.println("  (!) " + rk.fit().model() + " " + p.name() + ": " + p.note());
                }
            }
        }
    }

    private void printTimeDomain(PrintWriter out, Campaign.SampleFits sf, List<List<String>> timeRows) {
        for (ModelSelection.Ranked rk : sf.fits()) {
            for (TimeDomain.Point p : TimeDomain.evaluate(rk.fit(), timeGrid.seconds())) {
                timeRows.add(List.of(p.sample(), p.model(), Format.csv(p.timeS()), Format.csv(p.relaxation()), Format.csv(p.creep())));
            }
        }
        sf.best().ifPresent(b -> {
            List<TimeDomain.Point> pts = TimeDomain.evaluate(b, timeGrid.seconds());
            if (pts.isEmpty()) {
                out.println("  time domain: " + b.model() + " has none (descriptive model)");
                return;
            }
            TextTable t = new TextTable("t [s]", "E(t) or G(t) [Pa]", "J(t) [1/Pa]");
            for (TimeDomain.Point p : pts) {
                t.add(Format.g4(p.timeS()), Format.g4(p.relaxation()), Format.g4(p.creep()));
            }
            out.println("  time domain of " + b.model() + ":");
            t.print(out);
        });
    }

    private static String join(String a, String b) {
        return a.isEmpty() ? b : b.isEmpty() ? a : a + "; " + b;
    }
}
