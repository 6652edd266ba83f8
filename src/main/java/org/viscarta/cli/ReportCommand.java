package org.viscarta.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.time.Instant;
import java.time.format.DateTimeParseException;
import java.time.temporal.ChronoUnit;
import java.util.List;
import java.util.concurrent.Callable;
import org.viscarta.analysis.Analysis;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.AnalysisResult;
import org.viscarta.analysis.MasterCurves;
import org.viscarta.analysis.Target;
import org.viscarta.report.Provenance;
import org.viscarta.report.RenderedFigure;
import org.viscarta.report.ReportContent;
import org.viscarta.report.ReportFigures;
import org.viscarta.report.ReportFiles;
import org.viscarta.temperature.ShiftAnalysis;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code viscarta report}: the main job, everything into a workbook, a page and figures. */
@Command(name = "report", mixinStandardHelpOptions = true,
        header = "The main job: fits, ranking, matches and figures into a workbook and an HTML page.",
        description = {"The main job: read every input, fit every candidate model to every sample, rank the samples by damping,",
            "match them against the reference library, and write DIR/report.xlsx, DIR/report.html (one self-contained page)",
            "and DIR/figures/ (PNG at 300 dpi and SVG) into the folder given with --out."})
final class ReportCommand implements Callable<Integer> {

    @Mixin InputOptions input;
    @Mixin ModelOptions models;
    @Mixin LibraryOption library;
    @Mixin RankOptions rankOptions;
    @Mixin OutputOptions output;

    @Option(names = "--target", paramLabel = "SAMPLE",
            description = "Name of a sample to mimic: every other sample is ranked by its distance to it (sheet Mimic ranking).")
    String target;

    @Option(names = "--reference-temperature", paramLabel = "°C", defaultValue = "23",
            description = "Samples measured at three or more temperatures get a master curve at this temperature, or at the "
                    + "measured one closest to it (default: ${DEFAULT-VALUE}).")
    double referenceTemperature;

    @Option(names = "--vertical", paramLabel = "none|entropic|fitted", defaultValue = "none",
            description = "Vertical factors b_T of the master curves: none (default), entropic b_T = T/T0, or fitted.")
    String vertical;

    @Option(names = "--timestamp", paramLabel = "TIME",
            description = "The run time to state in Provenance (ISO-8601 UTC, e.g. 2026-12-01T12:00:00Z); default: now. "
                    + "With the same inputs, settings and time, the outputs are byte for byte the same.")
    String timestamp;

    @CommandLine.Spec CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        if (output.out == null) {
            throw new CommandLine.ParameterException(spec.commandLine(), "report needs --out DIR, the folder to write into");
        }
        AnalysisRequest request = Requests.build(spec, () -> {
            AnalysisRequest.Builder b = rankOptions.applyTo(models.applyTo(input.request()), spec.commandLine())
                    .compute(AnalysisRequest.Part.FITS).masterCurves(new MasterCurves(referenceTemperature, ShiftAnalysis.Vertical.parse(vertical)));
            library.folderIfNamed().ifPresent(dir -> b.library(dir).compute(AnalysisRequest.Part.MATCHES));
            return target == null ? b : b.target(new Target.AmongInputs(target));
        });
        ReportFiles files = new ReportFiles(output.out);
        files.checkWritable(output.force);
        Instant stated = timestamp == null ? Instant.now().truncatedTo(ChronoUnit.SECONDS) : parseTimestamp(timestamp);
        AnalysisResult result = Analysis.run(request, new Progress(spec.commandLine().getErr(), output.quiet));
        Warnings.print(spec, result.inputs());
        Provenance provenance = new Provenance(VersionProvider.version(), Provenance.quote("viscarta",
                spec.commandLine().getParseResult().originalArgs()), stated.toString());
        List<RenderedFigure> figures = files.write(new ReportContent(result, provenance), output.force);
        PrintWriter out = spec.commandLine().getOut();
        out.printf("%d sample(s) from %d file(s); %d model(s) each; ranked at %s%n", result.samples().size(),
                result.inputs().files().size(), request.modelIds().size(), request.rankingPoint().describe());
        if (result.samples().size() > ReportFigures.MAX_SAMPLE_FIGURES) {
            out.printf("per-sample figures left out: more than %d samples%n", ReportFigures.MAX_SAMPLE_FIGURES);
        }
        out.println("wrote " + files.workbook());
        out.println("wrote " + files.page());
        out.println("wrote " + figures.size() + " figure(s) as PNG and SVG in " + files.figures());
        out.flush();
        return CommandLine.ExitCode.OK;
    }

    private Instant parseTimestamp(String text) {
        try {
            return Instant.parse(text);
        } catch (DateTimeParseException e) {
            throw new CommandLine.ParameterException(spec.commandLine(),
                    "--timestamp takes an ISO-8601 UTC time such as 2026-12-01T12:00:00Z, not '" + text + "'");
        }
    }
}
