package org.viscarta.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.viscarta.Campaign;
import org.viscarta.compare.FittedCurve;
import org.viscarta.compare.Matcher;
import org.viscarta.compare.ReferenceDistance;
import org.viscarta.library.ReferenceLibrary;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code viscarta match}: the closest reference materials, or the best mimic of a target. */
@Command(name = "match", mixinStandardHelpOptions = true,
        header = "Find the closest reference materials, or the candidate that best mimics a target.",
        description = {"match SAMPLE... ranks the references of the library by their distance to each sample; match --target",
            "FILE --candidates DIR|FILE... ranks candidate materials by their distance to a target. The distance is the",
            "root-mean-square difference, in decades, of log10 E′ and log10 E″ over the frequency band both were measured",
            "in (never extrapolated), each side from its best-supported fitted model, with a standard error from the fits."})
final class MatchCommand implements Callable<Integer> {

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

    @Mixin
    ReadOptions read;

    @Mixin
    ModelOptions models;

    @Mixin
    OutputOptions output;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

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
        Campaign.Settings settings = models.applyTo(read.applyTo(Campaign.Settings.defaults()));
        ReferenceDistance rd = new ReferenceDistance(ReferenceDistance.Metric.parse(metric), minOverlap, maxTemperatureDifference);
        output.check();
        PrintWriter out = spec.commandLine().getOut();
        List<List<String>> rows = new ArrayList<>();
        if (mimic) {
            Campaign t = Campaign.read(List.of(target), settings);
            if (t.samples().size() != 1) {
                throw new IllegalArgumentException(target + " holds " + t.samples().size() + " samples; the target must be one");
            }
            Campaign c = Campaign.read(candidates, settings);
            Warnings.print(spec, t);
            Warnings.print(spec, c);
            List<Campaign.SampleFits> tf = t.fit();
            FittedCurve targetCurve = t.curves(tf).get(0);
            List<Matcher.Candidate> cands = c.asCandidates(c.fit()).stream()
                    .filter(x -> !x.name().equals(t.samples().get(0).name())).toList();
            String name = t.samples().get(0).name();
            out.printf("Best mimic of %s (distance in decades of E′ and E″; closest first)%n", name);
            print(out, rows, name, Matcher.rank(name, targetCurve, cands, rd), Integer.MAX_VALUE, true);
        } else {
            ReferenceLibrary lib = ReferenceLibrary.open(library.folder());
            Campaign c = Campaign.read(samples, settings);
            Warnings.print(spec, c);
            List<Matcher.Candidate> refs = c.referenceCandidates(lib, clazz);
            if (refs.isEmpty()) {
                throw new IllegalArgumentException("the library holds no reference" + (clazz == null ? "" : " of class '" + clazz + "'"));
            }
            List<Campaign.SampleFits> fits = c.fit();
            List<List<Matcher.Match>> all = c.matchAll(fits, refs, rd);
            for (int i = 0; i < fits.size(); i++) {
                String name = fits.get(i).sample().name();
                out.printf("%s: closest references%n", name);
                print(out, rows, name, all.get(i), top, false);
            }
        }
        out.flush();
        output.writeCsv(CSV_HEADER, rows);
        return CommandLine.ExitCode.OK;
    }

    private static void print(PrintWriter out, List<List<String>> rows, String sample, List<Matcher.Match> ranked, int top,
                              boolean departure) {
        TextTable t = new TextTable("rank", departure ? "candidate" : "reference", "class", "distance", "± SE", "band [Hz]",
                departure ? "departs most at" : "note", departure ? "note" : "");
        int shown = 0;
        for (Matcher.Match m : ranked) {
            ReferenceDistance.Result r = m.result();
            rows.add(List.of(sample, m.reference(), m.rank() == 0 ? "" : Integer.toString(m.rank()), Format.csv(r.distance()),
                    Format.csv(r.uncertainty()), Format.csv(r.bandLowHz()), Format.csv(r.bandHighHz()),
                    Boolean.toString(r.comparable()), r.note()));
            if (shown++ >= top) {
                continue;
            }
            String band = r.comparable() ? Format.g4(r.bandLowHz()) + "–" + Format.g4(r.bandHighHz()) : "–";
            String where = r.comparable() ? String.format(java.util.Locale.ROOT, "%s Hz (%+.3f decades)", Format.g4(r.departureHz()),
                    r.departure()) : "";
            t.add(m.rank() == 0 ? "" : Integer.toString(m.rank()), m.reference(), m.clazz(), Format.g4(r.distance()),
                    Format.g4(r.uncertainty()), band, departure ? where : r.note(), departure ? r.note() : "");
        }
        t.print(out);
        out.println("  first and second distinguishable: " + Matcher.distinguishable(ranked));
        out.println();
    }
}
