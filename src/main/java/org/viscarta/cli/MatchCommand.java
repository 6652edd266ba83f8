package org.viscarta.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.Optional;
import org.viscarta.analysis.Analysis;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.AnalysisResult;
import org.viscarta.analysis.MatchSettings;
import org.viscarta.analysis.SampleAnalysis;
import org.viscarta.analysis.Target;
import org.viscarta.compare.Matcher;
import org.viscarta.compare.ReferenceDistance;
import org.viscarta.sweep.Numbers;
import org.viscarta.report.OutputTables;
import org.viscarta.table.CsvTable;
import org.viscarta.table.Table;
import org.viscarta.table.TerminalTable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code viscarta match}: the closest reference materials, or the best mimic of a target. */
@Command(name = "match", mixinStandardHelpOptions = true,
        header = "Find the closest reference materials, or the candidate that best mimics a target.",
        description = "match SAMPLE... ranks the references of the library by their distance to each sample; match "
            + "--target FILE --candidates DIR|FILE... ranks candidate materials by their distance to a target. "
            + "The distance is the root-mean-square difference, in decades, of log10 E′ and log10 E″ over the "
            + "frequency band both were measured in (never extrapolated), each side from its best-supported "
            + "fitted model, with a standard error from the fits.")
final class MatchCommand implements Callable<Integer> {

    /** The published columns of {@code match -o} (README); the tests hold the declared table to them. */
    static final List<String> CSV_HEADER = List.of("sample", "reference", "rank", "distance", "distance_uncertainty",
            "band_low_hz", "band_high_hz", "comparable", "note");

    @Parameters(paramLabel = "SAMPLE", arity = "0..*", description = "Sweep tables or folders of the samples to match.")
    List<Path> samples = new ArrayList<>();

    @Option(names = "--target", paramLabel = "FILE", description = "The material to mimic (its replicates are pooled).")
    Path target;

    @Option(names = "--candidates", paramLabel = "DIR|FILE", arity = "1..*", description = "The materials that could mimic it.")
    List<Path> candidates = new ArrayList<>();

    @Mixin
    LibraryOption library;

    @Option(names = "--class", paramLabel = "CLASS", description = "Only references of this class (gel, tissue, paint film, ...).")
    String clazz;

    @Option(names = "--top", paramLabel = "K", defaultValue = "5", description = "How many to show per sample (default: ${DEFAULT-VALUE}).")
    int top;

    @Option(names = "--metric", paramLabel = "moduli|tan-delta|all", defaultValue = "moduli",
            description = "Compare log10 E′ and log10 E″ (default), log10 tan δ, or all three.")
    String metric;

    @Option(names = "--min-overlap", paramLabel = "DECADES", defaultValue = "1",
            description = "Shortest shared band that counts as comparable, in decades of frequency (default: ${DEFAULT-VALUE}).")
    double minOverlap;

    @Option(names = "--max-temperature-difference", paramLabel = "°C", defaultValue = "2",
            description = "Flag comparisons of materials measured further apart in temperature (default: ${DEFAULT-VALUE}).")
    double maxTemperatureDifference;

    @Mixin ReadOptions read;
    @Mixin ModelOptions models;
    @Mixin OutputOptions output;

    @CommandLine.Spec CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        boolean mimic = target != null;
        if (mimic == candidates.isEmpty()) {
            throw new CommandLine.ParameterException(spec.commandLine(), "--target and --candidates go together");
        }
        if (mimic == !samples.isEmpty()) {
            throw new CommandLine.ParameterException(spec.commandLine(),
                    "give either SAMPLE... (matched against the library) or --target FILE --candidates DIR|FILE...");
        }
        if (top < 1) {
            throw new CommandLine.ParameterException(spec.commandLine(), "--top must be at least 1");
        }
        AnalysisRequest request = Requests.build(spec, () -> {
            AnalysisRequest.Builder b = models.applyTo(read.applyTo(AnalysisRequest.builder(mimic ? candidates : samples)))
                    .matching(new MatchSettings(ReferenceDistance.Metric.parse(metric), minOverlap, maxTemperatureDifference,
                            Optional.ofNullable(clazz)));
            return mimic ? b.target(new Target.FromFile(target)).compute(AnalysisRequest.Part.FITS)
                    : b.library(library.folder()).compute(AnalysisRequest.Part.MATCHES);
        });
        output.check();
        AnalysisResult result = Analysis.run(request, new Progress(spec.commandLine().getErr(), output.quiet));
        PrintWriter out = spec.commandLine().getOut();
        Table<Matcher.Match> table = OutputTables.matches(mimic);
        List<Matcher.Match> rows = new ArrayList<>();
        if (mimic) {
            AnalysisResult.Mimic m = result.mimic().orElseThrow();
            m.targetInputs().ifPresent(t -> Warnings.print(spec, t));
            Warnings.print(spec, result.inputs());
            out.printf("Best mimic of %s (distance in decades of E′ and E″; closest first)%n", m.target());
            print(out, table, m.matches(), Integer.MAX_VALUE);
            rows.addAll(m.matches());
        } else {
            Warnings.print(spec, result.inputs());
            for (SampleAnalysis sa : result.samples()) {
                out.printf("%s: closest references%n", sa.sample().name());
                print(out, table, sa.matches(), top);
                rows.addAll(sa.matches());
            }
        }
        out.flush();
        if (output.out != null) {
            CsvTable.write(table, rows, output.out, output.force);
        }
        return CommandLine.ExitCode.OK;
    }

    private static void print(PrintWriter out, Table<Matcher.Match> table, List<Matcher.Match> ranked, int top) {
        List<Matcher.Match> shown = ranked.stream().limit(top).toList();
        TerminalTable.print(table, shown, out);
        for (Matcher.Match m : shown) {
            ReferenceDistance.Result r = m.result();
            String where = r.comparable() ? String.format(java.util.Locale.ROOT, "compared over %s–%s Hz, departs most at %s Hz "
                    + "(%+.3f decades)", Numbers.readable(r.bandLowHz()), Numbers.readable(r.bandHighHz()), Numbers.readable(r.departureHz()),
                    r.departure())
                    : "";
            String text = String.join("; ", java.util.stream.Stream.of(where, r.note()).filter(x -> !x.isEmpty()).toList());
            if (!text.isEmpty()) {
                out.println(Format.wrap("  " + m.reference() + ": " + text, 100, "    "));
            }
        }
        out.println(Format.wrap("  first and second distinguishable: " + Matcher.distinguishable(ranked), 100, "    "));
        out.println();
    }
}
