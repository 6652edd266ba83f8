package org.viscarta.fit;

import java.util.Locale;

/** How the misfit of each modulus value is measured in a fit. All models of one run share it. */
public enum Weighting {
    /** r = ln M_model − ln M_data: every point weighs by its relative misfit (the default). */
    LOG("log"),
    /** r = M_model/M_data − 1: relative residuals, close to LOG for small misfits. */
    RELATIVE("relative"),
    /**
     * r = (ln M_model − ln M_data)/s_f, with s_f the standard deviation of ln M over the replicates
     * measured at that frequency: frequencies where replicates agree weigh more.
     */
    REPLICATE_SD("replicate-sd");

    private final String label;

    Weighting(String label) {
        this.label = label;
    }

    /** The name used on the command line. */
    public String label() {
        return label;
    }

    /** Parses {@code log}, {@code relative} or {@code replicate-sd}. */
    public static Weighting parse(String text) {
        for (Weighting w : values()) {
            if (w.label.equals(text.strip().toLowerCase(Locale.ROOT))) {
                return w;
            }
        }
        throw new IllegalArgumentException("weighting '" + text + "' is not known; use log, relative or replicate-sd");
    }

    @Override
    public String toString() {
        return label;
    }
}
