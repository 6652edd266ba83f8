package org.viscarta.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.util.List;
import java.util.concurrent.Callable;
import org.viscarta.analysis.Analysis;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.AnalysisResult;
import org.viscarta.analysis.Ranking;
import org.viscarta.analysis.Sample;
import org.viscarta.compare.DampingComparison;
import org.viscarta.compare.DampingRanking;
import org.viscarta.report.OutputTables;
import org.viscarta.table.CsvTable;
import org.viscarta.table.Table;
import org.viscarta.table.TerminalTable;
import org.viscarta.table.Cells;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;

/** {@code viscarta rank}: samples ordered by tan δ at a reference frequency. */
@Command(name = "rank", mixinStandardHelpOptions = true,
        header = "Rank samples by loss tangent tan δ at a reference frequency.",
        description = "Rank samples by loss tangent tan δ = E″/E′ at a reference frequency (or its geometric mean over "
            + "a band), highest damping first, with the mean, standard deviation and 95 %% t-interval over "
            + "replicates, and letter groups from pairwise Welch t-tests with Holm's adjustment: samples "
            + "sharing a letter are not distinguishable. With group labels, groups are compared by one-way "
            + "ANOVA and Kruskal–Wallis. Values are interpolated in log–log between the two neighbouring "
            + "measured points; outside the measured range none is reported unless --model-outside-range lets "
            + "the best-supported model give one.")
final class RankCommand implements Callable<Integer> {

    /** The published columns of {@code rank -o} (README); the tests hold the declared table to them. */
    static final List<String> CSV_HEADER = List.of("rank", "sample", "group", "n_replicates", "frequency_hz", "tan_delta",
            "ci95_low", "ci95_high", "storage_modulus_pa", "loss_modulus_pa", "letters", "set", "temperature_c");

    /** Terminal output fits in this many columns (wide details are in the CSV). */
    private static final int TERMINAL_WIDTH = 100;

    @Mixin InputOptions input;
    @Mixin ModelOptions models;
    @Mixin RankOptions rankOptions;
    @Mixin OutputOptions output;

    @CommandLine.Spec CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        AnalysisRequest request = Requests.build(spec, () -> rankOptions.applyTo(models.applyTo(input.request()), spec.commandLine()));
        output.check();
        AnalysisResult result = Analysis.run(request, new Progress(spec.commandLine().getErr(), output.quiet));
        Warnings.print(spec, result.inputs());
        Table<DampingRanking.Row<Sample>> table = OutputTables.ranking(result);
        List<DampingRanking.Row<Sample>> rows = result.rankingRows();
        PrintWriter out = spec.commandLine().getOut();
        Ranking ranking = result.ranking().orElseThrow();
        out.println(Format.wrap(String.format(java.util.Locale.ROOT, "Damping ranking at %s (highest tan δ first) within %d "
                + "comparable set(s): %s", request.rankingPoint().describe(), ranking.sets().size(), request.sets().describe()),
                TERMINAL_WIDTH, ""));
        for (Ranking.RankedSet set : ranking.sets()) {
            out.println();
            out.println(set.label() + ":");
            TerminalTable.print(table, set.result().rows(), out);
            DampingComparison.Result cmp = set.result().comparison();
            cmp.statements().forEach(t -> out.println(Format.wrap(t, TERMINAL_WIDTH, "")));
            for (DampingComparison.GroupSummary g : cmp.groups()) {
                out.printf("  group %s: %d sample(s), %d values, mean tan δ %s [%s, %s]%n", g.group(), g.samples(), g.values().n(),
                        Cells.g4(g.values().mean()), Cells.g4(g.values().ci95Low()), Cells.g4(g.values().ci95High()));
            }
            set.result().rows().stream().filter(r -> !r.note().isEmpty())
                    .forEach(r -> out.println(Format.wrap("  note on " + r.name() + ": " + r.note(), TERMINAL_WIDTH, "    ")));
            set.result().rows().stream().filter(r -> !result.quality().marker(r.subject().name()).isEmpty())
                    .forEach(r -> out.println(Format.wrap("  quality of " + r.name() + ": " + result.quality().marker(r.subject().name())
                            + " (viscarta quality explains)", TERMINAL_WIDTH, "    ")));
        }
        if (!ranking.unranked().isEmpty()) {
            out.println();
            out.println("Not ranked:");
            for (DampingRanking.Row<Sample> r : ranking.unranked()) {
                out.println(Format.wrap("  " + r.name() + (r.tanDelta() == null ? "" : " (tan δ " + Cells.g4(r.tanDelta().mean())
                        + ")") + ": " + r.note(), TERMINAL_WIDTH, "    "));
            }
        }
        out.flush();
        if (output.out != null) {
            CsvTable.write(table, rows, output.out, output.force);
        }
        return CommandLine.ExitCode.OK;
    }
}
