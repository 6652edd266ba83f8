package org.viscarta.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.viscarta.Campaign;
import org.viscarta.compare.DampingComparison;
import org.viscarta.compare.ReplicateSummary;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;

/** {@code viscarta rank}: samples ordered by tan δ at a reference frequency. */
@Command(name = "rank", mixinStandardHelpOptions = true,
        header = "Rank samples by loss tangent tan δ at a reference frequency.",
        description = {"Rank samples by loss tangent tan δ = E″/E′ at a reference frequency (or its geometric mean over a band),",
            "highest damping first, with the mean, standard deviation and 95 % t-interval over replicates, and letter",
            "groups from pairwise Welch t-tests with Holm's adjustment: samples sharing a letter are not distinguishable.",
            "With group labels, groups are compared by one-way ANOVA and Kruskal–Wallis. Values are interpolated in",
            "log–log between the two neighbouring measured points; outside the measured range none is reported unless",
            "--model-outside-range lets the best-supported model give one."})
final class RankCommand implements Callable<Integer> {

    static final List<String> CSV_HEADER = List.of("rank", "sample", "group", "n_replicates", "frequency_hz", "tan_delta",
            "ci95_low", "ci95_high", "storage_modulus_pa", "loss_modulus_pa", "letters");

    @Mixin
    InputOptions input;

    @Mixin
    ModelOptions models;

    @Mixin
    RankOptions rankOptions;

    @Mixin
    OutputOptions output;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        Campaign.Settings settings = rankOptions.applyTo(models.applyTo(input.applyTo(Campaign.Settings.defaults())),
                spec.commandLine());
        output.check();
        Campaign campaign = Campaign.read(input.inputs, settings);
        Warnings.print(spec, campaign);
        List<Campaign.SampleFits> fits = settings.modelOutsideRange() ? campaign.fit() : List.of();
        List<Campaign.RankRow> ranking = campaign.rank(fits);
        DampingComparison.Result cmp = campaign.compare(ranking);
        PrintWriter out = spec.commandLine().getOut();
        out.printf("Damping ranking at %s (highest tan δ first)%n", settings.rankingFrequency());
        TextTable t = new TextTable("rank", "sample", "group", "n", "tan δ", "95 % CI", "letters", "E′ or G′ [Pa]", "E″ or G″ [Pa]",
                "note");
        List<List<String>> rows = new ArrayList<>();
        for (Campaign.RankRow r : ranking) {
            ReplicateSummary s = r.tanDelta();
            String rank = r.rank() == 0 ? "" : Integer.toString(r.rank());
            int n = s == null ? r.sample().replicates().size() : s.n();
            t.add(rank, r.sample().name(), r.sample().group(), Integer.toString(n), s == null ? "–" : Format.g4(s.mean()),
                    s == null || s.n() < 2 ? "–" : "[" + Format.g4(s.ci95Low()) + ", " + Format.g4(s.ci95High()) + "]",
                    r.letters(), Format.g4(r.storage()), Format.g4(r.loss()), r.note());
            double f = settings.hasBand() ? Math.sqrt(settings.bandLowHz() * settings.bandHighHz()) : settings.atHz();
            rows.add(List.of(rank, r.sample().name(), r.sample().group(), Integer.toString(n), Format.csv(f),
                    s == null ? "" : Format.csv(s.mean()), s == null ? "" : Format.csv(s.ci95Low()),
                    s == null ? "" : Format.csv(s.ci95High()), Format.csv(r.storage()), Format.csv(r.loss()), r.letters()));
        }
        t.print(out);
        for (String statement : cmp.statements()) {
            out.println(statement);
        }
        for (DampingComparison.GroupSummary g : cmp.groups()) {
            out.printf("  group %s: %d sample(s), %d values, mean tan δ %s [%s, %s]%n", g.group(), g.samples(), g.values().n(),
                    Format.g4(g.values().mean()), Format.g4(g.values().ci95Low()), Format.g4(g.values().ci95High()));
        }
        out.flush();
        output.writeCsv(CSV_HEADER, rows);
        return CommandLine.ExitCode.OK;
    }
}
