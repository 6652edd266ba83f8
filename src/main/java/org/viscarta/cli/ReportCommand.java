package org.viscarta.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.time.Instant;
import java.util.List;
import java.util.concurrent.Callable;
import org.viscarta.analysis.Analysis;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.AnalysisResult;
import org.viscarta.report.Provenance;
import org.viscarta.report.RenderedFigure;
import org.viscarta.report.ReportContent;
import org.viscarta.report.ReportFigures;
import org.viscarta.report.ReportFiles;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;

/** {@code viscarta report}: the main job, everything into a workbook, a page and figures. */
@Command(name = "report", mixinStandardHelpOptions = true,
        header = "The main job: fits, ranking, matches and figures into a workbook and an HTML page.",
        description = "The main job: read every input, fit every candidate model to every sample, rank the samples by "
            + "damping, match them against the reference library, and write report.xlsx, report.html (one "
            + "self-contained page) and figures/ (PNG at 200 dpi and SVG) into the folder given with --out.")
final class ReportCommand implements Callable<Integer> {

    @Mixin InputOptions input;
    @Mixin ModelOptions models;
    @Mixin LibraryOption library;
    @Mixin RankOptions rankOptions;
    @Mixin ReportOptions report;
    @Mixin QualityOptions quality;
    @Mixin OutputOptions output;

    @CommandLine.Spec CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        if (output.out == null) {
            throw new CommandLine.ParameterException(spec.commandLine(), "report needs --out DIR, the folder to write into");
        }
        AnalysisRequest request = Requests.build(spec, () -> {
            AnalysisRequest.Builder b = quality.applyTo(report.applyTo(rankOptions.applyTo(models.applyTo(input.request()),
                    spec.commandLine())), rankOptions.dropOutliers).compute(AnalysisRequest.Part.FITS, AnalysisRequest.Part.SPECTRA,
                    AnalysisRequest.Part.TRANSITIONS, AnalysisRequest.Part.MAPS);
            library.folderIfNamed().ifPresent(dir -> b.library(dir).compute(AnalysisRequest.Part.MATCHES)
                    .uncertainMatches(org.viscarta.compare.Matcher.SHOWN)); // standard errors where the report shows matches
            return b;
        });
        ReportFiles files = new ReportFiles(output.out);
        files.checkWritable(output.force);
        Instant stated = report.stated(spec.commandLine());
        Progress progress = new Progress(spec.commandLine().getErr(), output.quiet);
        // what writing the report needs is loaded on a spare core while the analysis runs (ReportFiles.warmUp)
        Thread warmUp = ReportFiles.warmUpAside();
        AnalysisResult result = Analysis.run(request, progress);
        try {
            warmUp.join();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        Warnings.print(spec, result.inputs());
        Provenance provenance = new Provenance(VersionProvider.version(),
                Provenance.quote("viscarta", spec.commandLine().getParseResult().originalArgs()), stated.toString());
        ReportFiles.Written written = files.write(new ReportContent(result, provenance), output.force, progress::lap);
        List<RenderedFigure> figures = written.figures();
        PrintWriter out = spec.commandLine().getOut();
        out.printf("%d sample(s) from %d file(s); %d model(s) each; ranked at %s%n", result.samples().size(),
                result.inputs().files().size(), request.modelIds().size(), request.rankingPoint().describe());
        if (!result.transitions().isEmpty()) {
            out.printf("%d temperature ramp(s) of %d sample(s): glass transitions in the Transitions sheet%n",
                    result.transitions().results().size(), result.transitions().results().stream().map(t -> t.ramp().sample())
                            .distinct().count());
        }
        if (!result.maps().specimens().isEmpty()) {
            out.printf("%d specimen(s) mapped at %d position(s): the Positions and Regions sheets and the map figures%n",
                    result.maps().specimens().size(), result.maps().specimens().stream().mapToInt(m -> m.specimen().points().size()).sum());
        }
        if (result.samples().size() > ReportFigures.MAX_SAMPLE_FIGURES) {
            out.printf("per-sample figures left out: more than %d samples%n", ReportFigures.MAX_SAMPLE_FIGURES);
        }
        for (String cut : written.cutTables()) {
            out.printf("workbook sheet cut: %s; its last row says so%n", cut);
        }
        out.printf("wrote %s%nwrote %s%nwrote %d figure(s) as PNG and SVG in %s%n", files.workbook(), files.page(), figures.size(),
                files.figures());
        out.flush();
        return CommandLine.ExitCode.OK;
    }
}
