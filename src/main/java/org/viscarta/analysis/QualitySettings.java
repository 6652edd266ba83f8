package org.viscarta.analysis;

/**
 * How the quality checks run.
 *
 * @param linearDeparture the departure of E′ from its plateau that ends an amplitude sweep's linear
 *                        range (0.05 for the common 5 %)
 * @param dropOutliers    leave replicates flagged as outliers out of every analysis (fits, ranking,
 *                        matches), said in every output; never done unless asked
 */
public record QualitySettings(double linearDeparture, boolean dropOutliers) {

    /** The common 5 %, outliers kept. */
    public static QualitySettings defaults() {
        return new QualitySettings(org.viscarta.quality.LinearRange.DEFAULT_DEPARTURE, false);
    }

    public QualitySettings {
        if (!(linearDeparture > 0 && linearDeparture < 1)) {
            throw new IllegalArgumentException("the departure that ends the linear range must lie between 0 and 100 %, got "
                    + 100 * linearDeparture + " %");
        }
    }
}
