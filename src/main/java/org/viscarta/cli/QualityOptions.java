package org.viscarta.cli;

import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.QualitySettings;
import picocli.CommandLine.Option;

/** How the quality checks run: the departure that ends the linear range of an amplitude sweep. */
final class QualityOptions {

    @Option(names = "--linear-limit", paramLabel = "PERCENT", defaultValue = "5",
            description = "Departure of E′ from its small-amplitude plateau that ends the linear range of an amplitude sweep, "
                    + "in %% (default: ${DEFAULT-VALUE}, common practice).")
    double linearLimitPercent;

    /** Requests the checks with this limit, keeping whether outliers are left out. */
    AnalysisRequest.Builder applyTo(AnalysisRequest.Builder b, boolean dropOutliers) {
        return b.quality(new QualitySettings(linearLimitPercent / 100, dropOutliers)).compute(AnalysisRequest.Part.QUALITY);
    }
}
