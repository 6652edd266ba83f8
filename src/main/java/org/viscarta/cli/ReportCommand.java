package org.viscarta.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import org.viscarta.Campaign;
import org.viscarta.compare.DampingComparison;
import org.viscarta.compare.FittedCurve;
import org.viscarta.compare.Matcher;
import org.viscarta.compare.ReferenceDistance;
import org.viscarta.io.AtomicOutput;
import org.viscarta.library.ReferenceLibrary;
import org.viscarta.report.HtmlReport;
import org.viscarta.report.Provenance;
import org.viscarta.report.RenderedFigure;
import org.viscarta.report.ReportFigures;
import org.viscarta.temperature.ShiftAnalysis;
import org.viscarta.temperature.TemperatureSeries;
import org.viscarta.report.WorkbookReport;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code viscarta report}: the main job, everything into a workbook. */
@Command(name = "report", mixinStandardHelpOptions = true,
        header = "The main job: fits, ranking, matches and figures into a workbook and an HTML page.",
        description = {"The main job: read every input, fit every candidate model to every sample, rank the samples by damping,",
            "match them against the reference library, and write DIR/report.xlsx, DIR/report.html (one self-contained page)",
            "and DIR/figures/ (PNG at 300 dpi and SVG)."})
final class ReportCommand implements Callable<Integer> {

    @Mixin
    InputOptions input;

    @Mixin
    ModelOptions models;

    @Mixin
    LibraryOption library;

    @Option(names = "--out", paramLabel = "DIR", required = true, description = "Folder to write report.xlsx into (created if needed).")
    Path outDir;

    @Mixin
    RankOptions rankOptions;

    @Option(names = "--target", paramLabel = "SAMPLE",
            description = "Name of a sample to mimic: every other sample is ranked by its distance to it (sheet Mimic ranking).")
    String target;

    @Option(names = "--reference-temperature", paramLabel = "°C", defaultValue = "23",
            description = "Samples measured at three or more temperatures get a master curve at this temperature, or at the "
                    + "measured one closest to it (default: ${DEFAULT-VALUE}).")
    double referenceTemperature;

    @Option(names = "--timestamp", paramLabel = "TIME",
            description = "The run time to state in Provenance (ISO-8601 UTC, e.g. 2026-12-01T12:00:00Z); default: now. "
                    + "With the same inputs, settings and time, the outputs are byte for byte the same.")
    String timestamp;

    @Option(names = "--quiet", description = "No progress on stderr.")
    boolean quiet;

    @Option(names = "--force", description = "Replace an existing report.xlsx, report.html and figures.")
    boolean force;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        Campaign.Settings settings = rankOptions.applyTo(models.applyTo(input.applyTo(Campaign.Settings.defaults())),
                spec.commandLine());
        Path xlsx = outDir.resolve("report.xlsx");
        Path html = outDir.resolve("report.html");
        Path figuresDir = outDir.resolve("figures");
        AtomicOutput.checkWritable(xlsx, force);
        AtomicOutput.checkWritable(html, force);
        if (java.nio.file.Files.isDirectory(figuresDir) && !force) {
            throw new org.viscarta.io.InputException(figuresDir, 0, 0,
                    "the figures folder already exists; choose another --out or pass --force to replace its figures");
        }
        Instant stated = timestamp == null ? Instant.now().truncatedTo(ChronoUnit.SECONDS) : parseTimestamp(timestamp);
        Path libraryDir = library.folderOrNull();
        ReferenceLibrary lib = libraryDir == null ? null : ReferenceLibrary.open(libraryDir);
        Campaign read = Campaign.read(input.inputs, settings);
        Warnings.print(spec, read);
        List<TemperatureSeries> series = TemperatureSeries.find(read.samples().stream().flatMap(x -> x.replicates().stream()).toList(),
                referenceTemperature, new ShiftAnalysis(0.3, ShiftAnalysis.Vertical.NONE));
        List<Campaign.Sample> masters = new java.util.ArrayList<>();
        for (TemperatureSeries ts : series) {
            org.viscarta.sweep.Sweep m = ShiftAnalysis.masterSweep(ts.result(), ts.sweeps().get(0), ts.masterName());
            masters.add(new Campaign.Sample(ts.masterName(), m.group(), m.kind(), m.temperatureC(), List.of(m)));
        }
        Campaign campaign = read.withSamples(masters);
        Progress progress = new Progress(spec.commandLine().getErr(), quiet, campaign.samples().size());
        List<Campaign.SampleFits> fits = campaign.fit(progress::done);
        progress.finish();
        List<Campaign.RankRow> ranking = campaign.rank(fits);
        DampingComparison.Result comparison = campaign.compare(ranking);
        ReferenceDistance rd = new ReferenceDistance(ReferenceDistance.Metric.MODULI, 1, 2);
        List<FittedCurve> curves = campaign.curves(fits);
        List<Matcher.Candidate> references = lib == null ? List.of() : campaign.referenceCandidates(lib, null);
        List<List<Matcher.Match>> matches = lib == null ? List.of() : campaign.matchAll(fits, references, rd);
        List<Matcher.Match> mimic = List.of();
        if (target != null) {
            int ti = -1;
            for (int i = 0; i < fits.size(); i++) {
                if (fits.get(i).sample().name().equals(target)) {
                    ti = i;
                }
            }
            if (ti < 0) {
                throw new IllegalArgumentException("--target '" + target + "' is not among the samples read");
            }
            String t = target;
            List<Matcher.Candidate> others = campaign.asCandidates(fits).stream().filter(x -> !x.name().equals(t)).toList();
            mimic = Matcher.rank(target, curves.get(ti), others, rd);
        }
        Provenance prov = new Provenance(VersionProvider.version(), commandLine(), stated.toString(),
                settingsMap(settings, libraryDir));
        WorkbookReport.Content content = new WorkbookReport.Content(campaign, fits, ranking, comparison, lib, matches, target, mimic,
                series, prov);
        List<RenderedFigure> figures = ReportFigures.render(ReportFigures.build(content, references));
        java.nio.file.Files.createDirectories(figuresDir);
        for (RenderedFigure f : figures) {
            AtomicOutput.write(figuresDir.resolve(f.stem() + ".png"), true, o -> o.write(f.png()));
            AtomicOutput.write(figuresDir.resolve(f.stem() + ".svg"), true,
                    o -> o.write(f.svg().getBytes(java.nio.charset.StandardCharsets.UTF_8)));
        }
        AtomicOutput.write(xlsx, force, o -> WorkbookReport.write(content, figures, o));
        String page = HtmlReport.write(content, figures, WorkbookReport.isDemo(content));
        AtomicOutput.write(html, force, o -> o.write(page.getBytes(java.nio.charset.StandardCharsets.UTF_8)));
        PrintWriter out = spec.commandLine().getOut();
        out.printf("%d sample(s) from %d file(s); %d model(s) each; ranked at %s%n", campaign.samples().size(),
                campaign.files().size(), settings.modelIds().size(), settings.rankingFrequency());
        if (campaign.samples().size() > ReportFigures.MAX_SAMPLE_FIGURES) {
            out.printf("per-sample figures left out: more than %d samples%n", ReportFigures.MAX_SAMPLE_FIGURES);
        }
        out.println("wrote " + xlsx);
        out.println("wrote " + html);
        out.println("wrote " + figures.size() + " figure(s) as PNG and SVG in " + figuresDir);
        out.flush();
        return CommandLine.ExitCode.OK;
    }

    private static Instant parseTimestamp(String text) {
        try {
            return Instant.parse(text);
        } catch (java.time.format.DateTimeParseException e) {
            throw new IllegalArgumentException("--timestamp takes an ISO-8601 UTC time such as 2026-12-01T12:00:00Z, not '" + text + "'");
        }
    }

    private String commandLine() {
        StringBuilder sb = new StringBuilder("viscarta");
        for (String a : spec.commandLine().getParseResult().originalArgs()) {
            sb.append(' ').append(a.isEmpty() || a.matches(".*[\\s\"'].*") ? "'" + a.replace("'", "'\\''") + "'" : a);
        }
        return sb.toString();
    }

    private static Map<String, String> settingsMap(Campaign.Settings s, Path libraryDir) {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("models", String.join(", ", s.modelIds()));
        m.put("damping ranked at", s.rankingFrequency());
        m.put("significance level of pairwise and group tests", Campaign.plain(s.alpha()));
        m.put("weighting", s.weighting().label());
        m.put("model value outside measured range", Boolean.toString(s.modelOutsideRange()));
        m.put("basis", s.basis() == null ? "as read" : s.basis().toString());
        m.put("Poisson's ratio override", s.poisson().isPresent() ? Campaign.plain(s.poisson().getAsDouble()) : "none");
        m.put("modulus kind when unstated", s.declaredKind() == null ? "tensile (with a warning)" : s.declaredKind().toString());
        m.put("residuals", "natural log of storage and loss moduli, jointly");
        m.put("optimiser", "Levenberg–Marquardt (Commons Math 3.6.1), multi-start, parameters in log/logit space");
        m.put("confidence level", "95 % (Student t on n − p degrees of freedom)");
        m.put("reference library", libraryDir == null ? "none" : libraryDir.toString());
        m.put("reference distance", "RMS of log10 E′ and log10 E″ differences over the shared band, 25 log-spaced points; "
                + "comparable from 1 decade of overlap; temperatures more than 2 °C apart flagged");
        return m;
    }
}
