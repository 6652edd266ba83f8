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
        out.printf("Damping ranking at %s (highest tan δ first), within %d comparable set(s)%n", request.rankingPoint().describe(),
                ranking.sets().size());
        TerminalTable.print(table, rows, out);
        for (Ranking.RankedSet set : ranking.sets()) {
            out.println();
            out.println(set.label() + ":");
            DampingComparison.Result cmp = set.result().comparison();
            cmp.statements().forEach(out::println);
            for (DampingComparison.GroupSummary g : cmp.groups()) {
                out.printf("  group %s: %d sample(s), %d values, mean tan δ %s [%s, %s]%n", g.group(), g.samples(), g.values().n(),
                        Format.g4(g.values().mean()), Format.g4(g.values().ci95Low()), Format.g4(g.values().ci95High()));
            }
        }
        out.flush();
        if (output.out != null) {
            CsvTable.write(table, rows, output.out, output.force);
        }
        return CommandLine.ExitCode.OK;
    }
}
