package org.viscarta.cli;

import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.ComparableSets;
import org.viscarta.compare.DampingRanking;
import org.viscarta.compare.RankingPoint;
import picocli.CommandLine;
import picocli.CommandLine.Option;

/** Where and how samples are ranked by damping: {@code --at}, {@code --band}, {@code --alpha}, {@code --model-outside-range}. */
final class RankOptions {

    @Option(names = "--at", paramLabel = "FREQUENCY", converter = FrequencyConverter.class, defaultValue = "1Hz",
            description = "Reference frequency for tan δ: 1, 1Hz, 0.5 Hz, 6.28rad/s (default: ${DEFAULT-VALUE}).")
    double atHz;

    @Option(names = "--band", paramLabel = "LOW-HIGH",
            description = "Rank by the geometric mean of tan δ over a band instead, e.g. 0.5-5 or 0.5Hz-5Hz (each replicate "
                    + "must cover it).")
    String band;

    @Option(names = "--alpha", paramLabel = "LEVEL", defaultValue = "0.05",
            description = "Significance level of the pairwise and group tests (default: ${DEFAULT-VALUE}).")
    double alpha;

    @Option(names = "--model-outside-range",
            description = "Outside a sample's measured range, report the best-supported model's tan δ (marked as such; "
                    + "not with --band).")
    boolean modelOutsideRange;

    @Option(names = "--temperature-tolerance", paramLabel = "°C", defaultValue = "2",
            description = "Samples are ranked only against samples measured within this many degrees of them, on the same "
                    + "basis (default: ${DEFAULT-VALUE}).")
    double temperatureTolerance;

    @Option(names = "--within-groups", description = "Rank only within each group (the group column or '# group:' line).")
    boolean withinGroups;

    @Option(names = "--drop-outliers", description = "Leave out replicates whose curve departs from the sample's other "
            + "replicates (modified z-score above 3.5, Iglewicz and Hoaglin 1993; three replicates or more); every output names them.")
    boolean dropOutliers;

    AnalysisRequest.Builder applyTo(AnalysisRequest.Builder b, CommandLine cl) {
        b.sets(new ComparableSets(temperatureTolerance, withinGroups)).alpha(alpha).outsideRange(modelOutsideRange ? DampingRanking.OutsideRange.BEST_MODEL : DampingRanking.OutsideRange.NOT_REPORTED)
                .compute(AnalysisRequest.Part.RANKING, AnalysisRequest.Part.QUALITY);
        if (dropOutliers) {
            b.quality(new org.viscarta.analysis.QualitySettings(b.qualitySettings().linearDeparture(), true));
        }
        if (band == null) {
            return b.rankingPoint(new RankingPoint.At(atHz));
        }
        String[] parts = band.strip().split("(?<![eE])-", 2);
        if (parts.length != 2) {
            throw new CommandLine.ParameterException(cl, "--band takes LOW-HIGH, e.g. 0.5-5 or 0.5Hz-5Hz, not '" + band + "'");
        }
        FrequencyConverter fc = new FrequencyConverter();
        try {
            return b.rankingPoint(new RankingPoint.Band(fc.convert(parts[0]), fc.convert(parts[1])));
        } catch (CommandLine.TypeConversionException | IllegalArgumentException e) {
            throw new CommandLine.ParameterException(cl, "--band: " + e.getMessage());
        }
    }
}
