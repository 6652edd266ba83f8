package org.viscarta.analysis;

import java.util.Objects;
import org.viscarta.sweep.Numbers;
import org.viscarta.temperature.ShiftAnalysis;
import org.viscarta.temperature.TemperatureSeries;

/**
 * How samples measured at several temperatures are superposed into master curves.
 *
 * @param preferredReferenceC the reference temperature [°C]; the measured one closest to it is used
 * @param vertical            how vertical factors b_T are set
 */
public record MasterCurves(double preferredReferenceC, ShiftAnalysis.Vertical vertical) {

    /** Shortest overlap of neighbouring curves that may be superposed [decades of frequency]. */
    static final double MIN_OVERLAP_DECADES = 0.3;

    public MasterCurves {
        Objects.requireNonNull(vertical, "vertical");
        if (!Double.isFinite(preferredReferenceC)) {
            throw new IllegalArgumentException("the master-curve reference temperature must be finite, got " + preferredReferenceC);
        }
    }

    /** The settings in words, as Provenance states them. */
    public String describe() {
        return "samples measured at " + TemperatureSeries.MIN_TEMPERATURES + " or more temperatures, superposed at the measured "
                + "temperature closest to " + Numbers.plain(preferredReferenceC) + " °C; " + vertical.describe()
                + "; neighbours overlapping by at least " + Numbers.plain(MIN_OVERLAP_DECADES) + " decades";
    }

    /** The superposition these settings define. */
    ShiftAnalysis analysis() {
        return new ShiftAnalysis(MIN_OVERLAP_DECADES, vertical);
    }
}
