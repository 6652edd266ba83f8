package org.viscarta.cli;

import java.time.Instant;
import java.time.format.DateTimeParseException;
import java.time.temporal.ChronoUnit;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.MasterCurves;
import org.viscarta.analysis.Target;
import org.viscarta.temperature.ShiftAnalysis;
import picocli.CommandLine;
import picocli.CommandLine.Option;

/** What {@code report} adds: the target to mimic, how master curves are built, and the run time it states. */
final class ReportOptions {

    @Option(names = "--target", paramLabel = "SAMPLE|FILE",
            description = "The material to mimic — a sample's name, or a file holding it, as in 'match --target': every "
                    + "(other) sample is ranked by its distance to it (sheet Mimic ranking).")
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

    /** The run time the report states: --timestamp, or now to the second. */
    Instant stated(CommandLine cl) {
        if (timestamp == null) {
            return Instant.now().truncatedTo(ChronoUnit.SECONDS);
        }
        try {
            return Instant.parse(timestamp);
        } catch (DateTimeParseException e) {
            throw new CommandLine.ParameterException(cl,
                    "--timestamp takes an ISO-8601 UTC time such as 2026-12-01T12:00:00Z, not '" + timestamp + "'");
        }
    }

    AnalysisRequest.Builder applyTo(AnalysisRequest.Builder b) {
        b.masterCurves(new MasterCurves(referenceTemperature, ShiftAnalysis.Vertical.parse(vertical)));
        if (target == null) {
            return b;
        }
        java.nio.file.Path file = java.nio.file.Path.of(target);
        return b.target(java.nio.file.Files.isRegularFile(file) ? new Target.FromFile(file) : new Target.AmongInputs(target));
    }
}
