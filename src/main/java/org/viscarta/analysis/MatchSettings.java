package org.viscarta.analysis;

import java.util.Objects;
import java.util.Optional;
import org.viscarta.compare.ReferenceDistance;
import org.viscarta.sweep.Numbers;

/**
 * How samples are compared with references and candidates.
 *
 * @param metric                    what is compared
 * @param minOverlapDecades         the shortest shared band that counts as comparable [decades of frequency]
 * @param maxTemperatureDifferenceC comparisons of materials measured further apart are flagged [°C]
 * @param referenceClass            only references of this class (empty: all)
 */
public record MatchSettings(ReferenceDistance.Metric metric, double minOverlapDecades, double maxTemperatureDifferenceC,
                            Optional<String> referenceClass) {

    public MatchSettings {
        Objects.requireNonNull(metric, "metric");
        Objects.requireNonNull(referenceClass, "referenceClass");
        if (!(minOverlapDecades >= 0) || Double.isInfinite(minOverlapDecades)) {
            throw new IllegalArgumentException("the shortest shared band must be ≥ 0 decades, got " + minOverlapDecades);
        }
        if (!(maxTemperatureDifferenceC >= 0) || Double.isInfinite(maxTemperatureDifferenceC)) {
            throw new IllegalArgumentException("the temperature difference must be ≥ 0 °C, got " + maxTemperatureDifferenceC);
        }
    }

    /** Moduli compared, from 1 decade of overlap, temperatures more than 2 °C apart flagged, every class. */
    public static MatchSettings defaults() {
        return new MatchSettings(ReferenceDistance.Metric.MODULI, 1, 2, Optional.empty());
    }

    /** The distance these settings define. */
    public ReferenceDistance distance() {
        return new ReferenceDistance(metric, minOverlapDecades, maxTemperatureDifferenceC);
    }

    /** The settings in words, as Provenance states them. */
    public String describe() {
        return "RMS of " + metric.describe() + " differences over the shared band, " + ReferenceDistance.GRID_POINTS
                + " log-spaced points; comparable from " + Numbers.plain(minOverlapDecades) + " decade"
                + (minOverlapDecades == 1 ? "" : "s") + " of overlap; temperatures more than "
                + Numbers.plain(maxTemperatureDifferenceC) + " °C apart flagged"
                + referenceClass.map(c -> "; references of class '" + c + "' only").orElse("");
    }
}
