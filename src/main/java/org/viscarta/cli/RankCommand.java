package org.viscarta.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.viscarta.Campaign;
import org.viscarta.compare.ReplicateSummary;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code viscarta rank}: samples ordered by tan δ at a reference frequency. */
@Command(name = "rank", mixinStandardHelpOptions = true,
        header = "Rank samples by loss tangent tan δ at a reference frequency.",
        description = {"Rank samples by loss tangent tan δ = E″/E′ at a reference frequency, highest damping first,",
            "with the mean, standard deviation and 95 % t-interval over replicates. Values are interpolated",
            "in log–log between the two neighbouring measured points; outside the measured range none is reported",
            "unless --model-outside-range lets the best-supported model give one."})
final class RankCommand implements Callable<Integer> {

    static final List<String> CSV_HEADER = List.of("rank", "sample", "group", "n_replicates", "frequency_hz", "tan_delta",
            "ci95_low", "ci95_high", "storage_modulus_pa", "loss_modulus_pa");

    @Mixin
    InputOptions input;

    @Mixin
    ModelOptions models;

    @Option(names = "--at", paramLabel = "FREQUENCY", converter = FrequencyConverter.class, defaultValue = "1Hz",
            description = "Reference frequency: 1, 1Hz, 0.5 Hz, 6.28rad/s (default: ${DEFAULT-VALUE}).")
    double atHz;

    @Option(names = "--model-outside-range",
            description = "Outside a sample's measured range, report the best-supported model's tan δ (marked as such).")
    boolean modelOutsideRange;

    @Mixin
    OutputOptions output;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        Campaign.Settings settings = models.applyTo(input.applyTo(Campaign.Settings.defaults()))
                .withAt(atHz).withModelOutsideRange(modelOutsideRange);
        output.check();
        Campaign campaign = Campaign.read(input.inputs, settings);
        Warnings.print(spec, campaign);
        List<Campaign.SampleFits> fits = modelOutsideRange ? campaign.fit() : List.of();
        List<Campaign.RankRow> ranking = campaign.rank(fits);
        PrintWriter out = spec.commandLine().getOut();
        out.printf("Damping ranking at %s Hz (highest tan δ first)%n", Campaign.plain(atHz));
        TextTable t = new TextTable("rank", "sample", "group", "n", "tan δ", "95 % CI", "E′ or G′ [Pa]", "E″ or G″ [Pa]", "note");
        List<List<String>> rows = new ArrayList<>();
        for (Campaign.RankRow r : ranking) {
            ReplicateSummary s = r.tanDelta();
            String rank = r.rank() == 0 ? "" : Integer.toString(r.rank());
            int n = s == null ? r.sample().replicates().size() : s.n();
            t.add(rank, r.sample().name(), r.sample().group(), Integer.toString(n), s == null ? "–" : Format.g4(s.mean()),
                    s == null || s.n() < 2 ? "–" : "[" + Format.g4(s.ci95Low()) + ", " + Format.g4(s.ci95High()) + "]",
                    Format.g4(r.storage()), Format.g4(r.loss()), r.note());
            rows.add(List.of(rank, r.sample().name(), r.sample().group(), Integer.toString(n), Format.csv(atHz),
                    s == null ? "" : Format.csv(s.mean()), s == null ? "" : Format.csv(s.ci95Low()),
                    s == null ? "" : Format.csv(s.ci95High()), Format.csv(r.storage()), Format.csv(r.loss())));
        }
        t.print(out);
        output.writeCsv(CSV_HEADER, rows);
        return CommandLine.ExitCode.OK;
    }
}
