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
import org.viscarta.io.AtomicOutput;
import org.viscarta.library.ReferenceLibrary;
import org.viscarta.report.Provenance;
import org.viscarta.report.WorkbookReport;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code viscarta report}: the main job, everything into a workbook. */
@Command(name = "report", mixinStandardHelpOptions = true,
        header = "The main job: fits, ranking and data into report.xlsx.",
        description = {"The main job: read every input, fit every candidate model to every sample, rank the samples",
            "by damping, and write DIR/report.xlsx with sheets Read me, Summary, Damping ranking, Model fits,",
            "Data, Reference library and Provenance."})
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

    @Option(names = "--force", description = "Replace an existing report.xlsx.")
    boolean force;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        Campaign.Settings settings = rankOptions.applyTo(models.applyTo(input.applyTo(Campaign.Settings.defaults())),
                spec.commandLine());
        Path target = outDir.resolve("report.xlsx");
        AtomicOutput.checkWritable(target, force);
        Path libraryDir = library.folderOrNull();
        ReferenceLibrary lib = libraryDir == null ? null : ReferenceLibrary.open(libraryDir);
        Campaign campaign = Campaign.read(input.inputs, settings);
        Warnings.print(spec, campaign);
        List<Campaign.SampleFits> fits = campaign.fit();
        List<Campaign.RankRow> ranking = campaign.rank(fits);
        Provenance prov = new Provenance(VersionProvider.version(), commandLine(),
                Instant.now().truncatedTo(ChronoUnit.SECONDS).toString(), settingsMap(settings, libraryDir));
        WorkbookReport.Content content = new WorkbookReport.Content(campaign, fits, ranking, lib, prov);
        AtomicOutput.write(target, force, out -> WorkbookReport.write(content, out));
        PrintWriter out = spec.commandLine().getOut();
        out.printf("%d sample(s) from %d file(s); %d model(s) each; ranked at %s%n", campaign.samples().size(),
                campaign.files().size(), settings.modelIds().size(), settings.rankingFrequency());
        out.println("wrote " + target);
        out.flush();
        return CommandLine.ExitCode.OK;
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
        return m;
    }
}
