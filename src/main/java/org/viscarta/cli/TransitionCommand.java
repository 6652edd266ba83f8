package org.viscarta.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.viscarta.analysis.Analysis;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.AnalysisResult;
import org.viscarta.io.UsageException;
import org.viscarta.report.OutputTables;
import org.viscarta.sweep.Numbers;
import org.viscarta.table.CsvTable;
import org.viscarta.table.TerminalTable;
import org.viscarta.temperature.GlassTransition;
import org.viscarta.temperature.Transitions;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code viscarta transition}: the glass transition of temperature ramps. */
@Command(name = "transition", mixinStandardHelpOptions = true,
        header = "Glass transition of temperature ramps: the three ASTM E1640 conventions, tan δ peak, activation energy.",
        description = "Reads temperature ramps (E′ and E″ against temperature at one or a few fixed frequencies: a tidy "
            + "table with temperature and frequency columns, or one file per frequency with a '# frequency: 1 Hz' line) "
            + "and locates the glass transition of each by the three conventions of ASTM E1640: the onset of the drop "
            + "of E′ (on its logarithm: the glassy line crossed with the tangent at the inflection), the peak of E″ and "
            + "the peak of tan δ, each on a local fit with a standard error. Also the tan δ peak's height and width "
            + "at half height, and E′ on the glassy and rubbery plateaus. With several frequencies, the apparent "
            + "activation energy of each sample (Arrhenius, 95 %% interval); with several samples, a comparison at "
            + "each frequency and convention (Welch t-tests, Holm's adjustment, letters).")
final class TransitionCommand implements Callable<Integer> {

    /** The first CSV columns of {@code transition -o} (README); the tests hold the declared table to them. */
    static final List<String> CSV_HEADER = List.of("sample", "replicate", "group", "frequency_hz", "tg_storage_onset_c",
            "tg_storage_onset_std_error_c", "tg_loss_peak_c", "tg_loss_peak_std_error_c", "tg_tan_delta_peak_c",
            "tg_tan_delta_peak_std_error_c", "tan_delta_peak_height", "tan_delta_peak_height_std_error", "tan_delta_peak_fwhm_c",
            "glassy_storage_modulus_pa", "rubbery_storage_modulus_pa", "activation_energy_kj_mol",
            "activation_energy_ci95_low_kj_mol", "activation_energy_ci95_high_kj_mol", "heating_rate_k_min", "notes");

    private static final int WIDTH = 100;

    @Mixin InputOptions input;
    @Mixin OutputOptions output;

    @Option(names = "--alpha", paramLabel = "LEVEL", defaultValue = "0.05",
            description = "Significance level of the comparisons between samples (default: ${DEFAULT-VALUE}).")
    double alpha;

    @CommandLine.Spec CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        output.check();
        AnalysisRequest request = Requests.build(spec, () -> input.request().alpha(alpha).compute(AnalysisRequest.Part.TRANSITIONS));
        AnalysisResult result = Analysis.run(request, new Progress(spec.commandLine().getErr(), output.quiet));
        Warnings.print(spec, result.inputs());
        Transitions t = result.transitions();
        if (t.isEmpty()) {
            throw new UsageException("no temperature ramps in the inputs: a ramp has E′ and E″ at five or more temperatures and "
                    + "at most five fixed frequencies (a temperature column, and a frequency column or a '# frequency:' line)");
        }
        PrintWriter out = spec.commandLine().getOut();
        out.println(Format.wrap("Glass transition by the conventions of ASTM E1640 (onset of the E′ drop, E″ peak, tan δ peak), "
                + "each located on a local fit; ± is the standard error of that fit.", WIDTH, ""));
        Map<String, List<GlassTransition.Result>> bySample = new LinkedHashMap<>();
        t.results().forEach(r -> bySample.computeIfAbsent(r.ramp().sample(), k -> new java.util.ArrayList<>()).add(r));
        for (Map.Entry<String, List<GlassTransition.Result>> e : bySample.entrySet()) {
            out.println();
            out.println(e.getKey() + ":");
            List<String[]> lines = new java.util.ArrayList<>();
            lines.add(new String[] {"replicate", "f [Hz]", "E′ onset [°C]", "E″ peak [°C]", "tan δ peak [°C]", "peak height",
                "FWHM [°C]"});
            List<String> problems = new java.util.ArrayList<>();
            for (GlassTransition.Result r : e.getValue()) {
                String[] row = new String[7];
                row[0] = r.ramp().replicate();
                row[1] = Numbers.plain(r.ramp().frequencyHz());
                for (GlassTransition.Convention c : GlassTransition.Convention.values()) {
                    GlassTransition.Estimate est = r.estimate(c);
                    row[2 + c.ordinal()] = est.found() ? String.format(Locale.ROOT, "%.1f ± %.1f", est.valueC(), est.stdError()) : "–";
                    if (!est.found()) {
                        problems.add("replicate " + r.ramp().replicate() + ", " + Numbers.plain(r.ramp().frequencyHz()) + " Hz, "
                                + c.label() + ": " + est.problem());
                    }
                }
                row[5] = Double.isFinite(r.peakHeight()) ? String.format(Locale.ROOT, "%.3f ± %.3f", r.peakHeight(), r.peakHeightSe()) : "–";
                row[6] = Double.isFinite(r.fwhmC()) ? String.format(Locale.ROOT, "%.1f", r.fwhmC()) : "–";
                lines.add(row);
            }
            TerminalTable.print(lines, out);
            problems.forEach(p -> out.println(Format.wrap("  " + p, WIDTH, "    ")));
            for (Transitions.Activation a : t.activations()) {
                if (!a.sample().equals(e.getKey())) {
                    continue;
                }
                out.println(Format.wrap("  activation energy from the " + a.convention().label() + ": " + (a.energy() == null
                        ? "not estimated (" + a.problem() + ")"
                        : String.format(Locale.ROOT, "%.0f kJ/mol, 95 %% interval %.0f to %s kJ/mol (%d temperatures at %d "
                        + "frequencies)", a.energy().kjPerMol(), a.energy().ci95Low(), Double.isNaN(a.energy().ci95High())
                        ? "unbounded" : String.format(Locale.ROOT, "%.0f", a.energy().ci95High()), a.energy().points(),
                        a.energy().frequencies())), WIDTH, "    "));
            }
        }
        for (Transitions.RankedSet set : t.sets()) {
            out.println();
            out.println(set.label() + " (highest first):");
            List<OutputTables.TransitionRankRow> rows = set.rows().stream().map(r -> new OutputTables.TransitionRankRow(set, r)).toList();
            TerminalTable.print(OutputTables.TRANSITION_RANKING, rows, out);
            set.statements().forEach(s -> out.println(Format.wrap(s, WIDTH, "")));
            set.missing().forEach(s -> out.println(Format.wrap("  not compared: " + s, WIDTH, "    ")));
        }
        out.flush();
        if (output.out != null) {
            CsvTable.write(OutputTables.transitions(t), t.results(), output.out, output.force);
        }
        return CommandLine.ExitCode.OK;
    }
}
