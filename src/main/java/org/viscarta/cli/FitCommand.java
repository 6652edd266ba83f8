package org.viscarta.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.viscarta.analysis.Analysis;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.AnalysisResult;
import org.viscarta.analysis.SampleAnalysis;
import org.viscarta.fit.DerivedEstimate;
import org.viscarta.fit.FitResult;
import org.viscarta.fit.ModelSelection;
import org.viscarta.fit.ParameterEstimate;
import org.viscarta.fit.TimeDomain;
import org.viscarta.io.AtomicOutput;
import org.viscarta.report.OutputTables;
import org.viscarta.table.CsvTable;
import org.viscarta.table.TerminalTable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code viscarta fit}: every candidate model fitted to every sample. */
@Command(name = "fit", mixinStandardHelpOptions = true,
        header = "Fit viscoelastic models to each sample, with intervals and Akaike weights.",
        description = "Fit viscoelastic models jointly to storage and loss moduli (log residuals by default, "
            + "Levenberg–Marquardt from several data-derived starts), with standard errors, 95 %% intervals, "
            + "AICc and Akaike weights; the lowest AICc is best supported. Replicates of a sample are fitted "
            + "together. Parameters the data do not determine are flagged with the reason.")
final class FitCommand implements Callable<Integer> {

    /** The published columns of {@code fit -o} (README); the tests hold the declared table to them. */
    static final List<String> CSV_HEADER = List.of("sample", "model", "parameter", "value", "std_error", "ci95_low",
            "ci95_high", "rss", "aicc", "akaike_weight", "best", "note");
    /** The published columns of {@code --time-domain-out}. */
    static final List<String> TIME_HEADER = List.of("sample", "model", "time_s", "relaxation_modulus_pa", "creep_compliance_per_pa");

    @Mixin InputOptions input;
    @Mixin ModelOptions models;
    @Mixin OutputOptions output;

    @Option(names = "--time-domain", paramLabel = "GRID", converter = TimeGridConverter.class,
            description = "Also compute the relaxation modulus E(t) and creep compliance J(t) of every fitted model on this "
                    + "time grid in seconds: FROM:TO:COUNT (log-spaced) or a list, e.g. 0.01:100:25.")
    TimeGridConverter.Grid timeGrid;

    @Option(names = "--time-domain-out", paramLabel = "CSV_FILE",
            description = "Write the --time-domain values as CSV (sample, model, time_s, relaxation_modulus_pa, creep_compliance_per_pa).")
    Path timeOut;

    @CommandLine.Spec CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        AnalysisRequest request = Requests.build(spec, () -> {
            AnalysisRequest.Builder b = models.applyTo(input.request()).compute(AnalysisRequest.Part.FITS);
            return timeGrid == null ? b : b.timeGrid(timeGrid.seconds());
        });
        if (timeOut != null && timeGrid == null) {
            throw new CommandLine.ParameterException(spec.commandLine(), "--time-domain-out needs --time-domain GRID");
        }
        output.check();
        if (timeOut != null) {
            AtomicOutput.checkWritable(timeOut, output.force);
        }
        AnalysisResult result = Analysis.run(request, new Progress(spec.commandLine().getErr(), output.quiet));
        Warnings.print(spec, result.inputs());
        PrintWriter out = spec.commandLine().getOut();
        List<TimeDomain.Point> timeRows = new ArrayList<>();
        for (SampleAnalysis sa : result.samples()) {
            printSample(out, sa);
            if (timeGrid != null) {
                printTimeDomain(out, sa);
                timeRows.addAll(sa.timeDomain());
            }
            out.println();
        }
        out.flush();
        if (output.out != null) {
            CsvTable.write(OutputTables.modelFits(request), OutputTables.fitRows(result.samples()), output.out, output.force);
        }
        if (timeOut != null) {
            CsvTable.write(OutputTables.TIME_DOMAIN, timeRows, timeOut, output.force);
        }
        return CommandLine.ExitCode.OK;
    }

    private static void printSample(PrintWriter out, SampleAnalysis sa) {
        out.printf("%s (%d replicate(s), %s moduli)%n", sa.sample().name(), sa.sample().replicates().size(), sa.sample().kind());
        TextTable t = new TextTable("model", "AICc", "ΔAICc", "weight", "best", "parameters (value ± standard error) [95 % CI]");
        for (ModelSelection.Ranked rk : sa.fits()) {
            FitResult f = rk.fit();
            List<String> ps = new ArrayList<>();
            for (ParameterEstimate p : f.parameters()) {
                ps.add(p.name() + " = " + Format.g4(p.value()) + " ± " + Format.g4(p.stdError())
                        + (p.unit().equals("-") ? "" : " " + p.unit())
                        + " [" + Format.g4(p.ci95Low()) + ", " + Format.g4(p.ci95High()) + "]" + (p.undetermined() ? " (!)" : ""));
            }
            t.add(f.variant().isEmpty() ? f.model() : f.model() + " (" + f.variant() + ")",
                    f.converged() ? Format.g4(f.aicc()) : "not converged", Format.g4(rk.deltaAicc()), Format.g4(rk.weight()),
                    rk.best() ? "yes" : "", f.converged() ? String.join("; ", ps) : f.message());
        }
        t.print(out);
        List<String> close = sa.alsoSupported();
        sa.best().ifPresentOrElse(b -> {
            out.println("  best supported: " + b.model() + (close.isEmpty() ? "" : "; within ΔAICc < 2: " + String.join(", ", close)));
            List<String> ds = new ArrayList<>();
            for (DerivedEstimate d : b.derived()) {
                ds.add(d.name() + " = " + Format.g4(d.value()) + " ± " + Format.g4(d.stdError()) + (d.unit().equals("-") ? "" : " " + d.unit()));
            }
            if (!ds.isEmpty()) {
                out.println("  derived (" + b.model() + "): " + String.join("; ", ds));
            }
        }, () -> out.println("  no model converged"));
        for (ModelSelection.Ranked rk : sa.fits()) {
            for (ParameterEstimate p : rk.fit().parameters()) {
                if (rk.fit().converged() && p.undetermined()) {
                    out.println("  (!) " + rk.fit().model() + " " + p.name() + ": " + p.note());
                }
            }
        }
    }

    private static void printTimeDomain(PrintWriter out, SampleAnalysis sa) {
        sa.best().ifPresent(b -> {
            List<TimeDomain.Point> pts = sa.bestTimeDomain();
            if (pts.isEmpty()) {
                out.println("  time domain: " + b.model() + " has none (descriptive model)");
                return;
            }
            out.println("  time domain of " + b.model() + ":");
            TerminalTable.print(OutputTables.TIME_DOMAIN, pts, out);
        });
    }
}
