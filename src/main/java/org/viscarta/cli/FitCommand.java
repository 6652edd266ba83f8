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
import org.viscarta.table.Cells;
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
    @Mixin QualityOptions quality;

    @Option(names = "--time-domain", paramLabel = "GRID", converter = TimeGridConverter.class,
            description = "Also compute the relaxation modulus E(t) and creep compliance J(t) of every fitted model on this "
                    + "time grid in seconds: FROM:TO:COUNT (log-spaced) or a list, e.g. 0.01:100:25.")
    TimeGridConverter.Grid timeGrid;

    @Option(names = "--time-domain-out", paramLabel = "CSV_FILE",
            description = "Write the --time-domain values as CSV (sample, model, time_s, relaxation_modulus_pa, creep_compliance_per_pa).")
    Path timeOut;

    @Option(names = "--every-sample", description = "Print every sample's fits on the terminal even when there are more than "
            + SUMMARY_ABOVE + " samples (above that, the terminal shows a summary and the full table goes to -o).")
    boolean everySample;

    /** Above this many samples the terminal shows a summary of the fits, not every sample. */
    static final int SUMMARY_ABOVE = 20;
    /** Samples named in the summary's list of fits that need a look. */
    private static final int NAMED_IN_SUMMARY = 20;

    @CommandLine.Spec CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        AnalysisRequest request = Requests.build(spec, () -> {
            AnalysisRequest.Builder b = quality.applyTo(models.applyTo(input.request()), false).compute(AnalysisRequest.Part.FITS);
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
        boolean summary = result.samples().size() > SUMMARY_ABOVE && !everySample;
        for (SampleAnalysis sa : result.samples()) {
            if (timeGrid != null) {
                timeRows.addAll(sa.timeDomain());
            }
            if (summary) {
                continue;
            }
            printSample(out, sa);
            printConcerns(out, result.quality().concerns(sa.sample().name()));
            if (timeGrid != null) {
                printTimeDomain(out, sa);
            }
            out.println();
        }
        if (summary) {
            printSummary(out, result, output.out, timeOut);
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

    /** Terminal output fits in this many columns; every parameter of every model is in {@code -o FILE.csv}. */
    private static final int TERMINAL_WIDTH = 100;

    /** The quality checks of a sample that did not pass, under its fits (the quality verb lists every check). */
    static void printConcerns(PrintWriter out, List<org.viscarta.quality.SweepChecks.Check> concerns) {
        java.util.Map<String, List<String>> replicates = new java.util.LinkedHashMap<>();
        for (org.viscarta.quality.SweepChecks.Check c : concerns) {
            replicates.computeIfAbsent(c.verdict() + " " + c.check() + "\u0000" + c.message(), k -> new ArrayList<>()).add(c.replicate());
        }
        replicates.forEach((k, reps) -> {
            String[] parts = k.split("\u0000", 2);
            out.println(Format.wrap("  quality " + parts[0] + " (replicate" + (reps.size() == 1 ? " " : "s ") + String.join(", ", reps)
                    + "): " + parts[1], TERMINAL_WIDTH, "    "));
        });
    }

    private static void printSample(PrintWriter out, SampleAnalysis sa) {
        out.printf("%s (%d replicate(s), %s moduli)%n", sa.sample().name(), sa.sample().replicates().size(), sa.sample().kind());
        TextTable t = new TextTable("model", "AICc", "ΔAICc", "Akaike weight", "best");
        for (ModelSelection.Ranked rk : sa.fits()) {
            FitResult f = rk.fit();
            t.add(f.model(), f.converged() ? Cells.g4(f.aicc()) : "not fitted", f.converged() ? String.format(java.util.Locale.ROOT, "%.2f", rk.deltaAicc()) : "",
                    f.converged() ? weight(rk.weight()) : "", rk.best() ? "yes" : "");
        }
        t.print(out);
        List<String> close = sa.alsoSupported();
        sa.best().ifPresentOrElse(b -> {
            out.println(Format.wrap("  best supported: " + b.model() + (b.variant().isEmpty() ? "" : " (" + b.variant() + ")")
                    + (b.undetermined() ? " (!) but its parameters are not all determined by these data (see below): read it as a "
                    + "description of the curve, not as material constants" : "")
                    + (close.isEmpty() ? "" : "; within ΔAICc < 2: " + String.join(", ", close)), TERMINAL_WIDTH, "    "));
            TextTable p = new TextTable("  parameter", "value", "± standard error", "unit", "95 % CI", "");
            for (ParameterEstimate e : b.parameters()) {
                p.add("  " + e.name(), Cells.g4(e.value()), Cells.g4(e.stdError()), e.unit().equals("-") ? "" : e.unit(),
                        "[" + Cells.g4(e.ci95Low()) + ", " + Cells.g4(e.ci95High()) + "]", e.undetermined() ? "(!)" : "");
            }
            p.print(out);
            List<String> ds = new ArrayList<>();
            for (DerivedEstimate d : b.derived()) {
                ds.add(d.name() + " = " + Cells.g4(d.value()) + " ± " + Cells.g4(d.stdError()) + (d.unit().equals("-") ? "" : " " + d.unit())
                        + (d.undetermined() ? " (!)" : ""));
            }
            if (!ds.isEmpty()) {
                out.println(Format.wrap("  derived (" + b.model() + "): " + String.join("; ", ds), TERMINAL_WIDTH, "    "));
            }
        }, () -> out.println("  no model converged"));
        for (ModelSelection.Ranked rk : sa.fits()) {
            FitResult f = rk.fit();
            if (!f.converged()) {
                out.println(Format.wrap("  " + f.model() + ": " + f.message(), TERMINAL_WIDTH, "    "));
                continue;
            }
            for (ParameterEstimate p : f.parameters()) {
                if (p.undetermined()) {
                    out.println(Format.wrap("  (!) " + f.model() + " " + p.name() + ": " + p.note(), TERMINAL_WIDTH, "    "));
                }
            }
            if (rk.best()) {
                for (DerivedEstimate d : f.derived()) {
                    if (d.undetermined()) {
                        out.println(Format.wrap("  (!) " + f.model() + " " + d.name() + ": " + d.note(), TERMINAL_WIDTH, "    "));
                    }
                }
            }
        }
    }

    /**
     * A campaign's fits in a screenful: how often each model is best supported or failed, the
     * best-supported parameters across samples (median and quartiles), the samples whose fits need a
     * look (no model converged, or the best one's parameters not all determined), the quality
     * concerns, and where the full table is.
     */
    static void printSummary(PrintWriter out, AnalysisResult result, Path csv, Path timeCsv) {
        List<SampleAnalysis> samples = result.samples();
        out.printf(java.util.Locale.ROOT, "%,d samples fitted; a summary (more than %d samples: --every-sample prints each)%n%n",
                samples.size(), SUMMARY_ABOVE);
        java.util.Map<String, int[]> byModel = new java.util.LinkedHashMap<>(); // model → {best, fitted, not fitted}
        java.util.Map<String, List<Double>> values = new java.util.LinkedHashMap<>();
        java.util.Map<String, String> units = new java.util.HashMap<>();
        List<String> look = new ArrayList<>();
        int lookCount = 0;
        for (SampleAnalysis sa : samples) {
            for (ModelSelection.Ranked rk : sa.fits()) {
                int[] c = byModel.computeIfAbsent(rk.fit().model(), k -> new int[3]);
                if (rk.best()) {
                    c[0]++;
                }
                c[rk.fit().converged() ? 1 : 2]++;
            }
            java.util.Optional<FitResult> best = sa.best();
            if (best.isEmpty() || best.get().undetermined()) {
                lookCount++;
                if (look.size() < NAMED_IN_SUMMARY) {
                    look.add(sa.sample().name() + (best.isEmpty() ? " (no model converged)" : " (" + best.get().model()
                            + ": parameters not all determined)"));
                }
                continue;
            }
            for (ParameterEstimate e : best.get().parameters()) {
                String key = best.get().model() + " " + e.name();
                values.computeIfAbsent(key, k -> new ArrayList<>()).add(e.value());
                units.put(key, e.unit().equals("-") ? "" : e.unit());
            }
        }
        TextTable models = new TextTable("model", "best supported", "fitted", "not fitted");
        byModel.forEach((m, c) -> models.add(m, String.format(java.util.Locale.ROOT, "%,d", c[0]),
                String.format(java.util.Locale.ROOT, "%,d", c[1]), String.format(java.util.Locale.ROOT, "%,d", c[2])));
        models.print(out);
        out.println();
        if (!values.isEmpty()) {
            out.println("best-supported parameters across the samples where that model is best:");
            TextTable p = new TextTable("  model and parameter", "samples", "median", "quartiles", "unit");
            values.forEach((k, v) -> {
                double[] x = v.stream().mapToDouble(Double::doubleValue).sorted().toArray();
                p.add("  " + k, String.format(java.util.Locale.ROOT, "%,d", x.length), Cells.g4(org.viscarta.sweep.Numbers.quantile(x, 0.5)),
                        "[" + Cells.g4(org.viscarta.sweep.Numbers.quantile(x, 0.25)) + ", "
                                + Cells.g4(org.viscarta.sweep.Numbers.quantile(x, 0.75)) + "]", units.get(k));
            });
            p.print(out);
            out.println();
        }
        if (lookCount == 0) {
            out.println("fits that need a look: none (every sample's best-supported model converged with determined parameters)");
        } else {
            out.println(Format.wrap(String.format(java.util.Locale.ROOT, "fits that need a look: %,d sample(s)%s: ", lookCount,
                    lookCount > look.size() ? ", the first " + look.size() : "") + String.join("; ", look), TERMINAL_WIDTH, "    "));
        }
        long concerned = samples.stream().filter(sa -> !result.quality().concerns(sa.sample().name()).isEmpty()).count();
        if (concerned > 0) {
            out.println(String.format(java.util.Locale.ROOT, "quality: %,d sample(s) with checks that did not pass ('viscarta "
                    + "quality' lists every check)", concerned));
        }
        out.println(csv != null ? "every model, parameter and sample: " + csv : "every model, parameter and sample: pass -o FILE.csv");
        if (timeCsv != null) {
            out.println("time-domain values: " + timeCsv);
        }
    }

    /** An Akaike weight as people read it: four decimals, "< 0.0001" below. */
    private static String weight(double w) {
        return w < 1e-4 ? "< 0.0001" : String.format(java.util.Locale.ROOT, "%.4f", w);
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
