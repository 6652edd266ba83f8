package org.viscarta.fit;

import org.viscarta.io.UsageException;
import java.util.Locale;

/** How the misfit of each modulus value is measured in a fit. All models of one run share it. */
public enum Weighting {
    /** r = ln M_model − ln M_data: every point weighs by its relative misfit (the default). */
    LOG("log", "log residuals", "the natural-log differences between model and data, ln M_model − ln M_data, of storage "
            + "and loss moduli jointly"),
    /** r = M_model/M_data − 1: relative residuals, close to LOG for small misfits. */
    RELATIVE("relative", "relative residuals", "the relative differences between model and data, (M_model − M_data)/M_data, "
            + "of storage and loss moduli jointly"),
    /**
     * r = (ln M_model − ln M_data)/s_f, with s_f the standard deviation of ln M over the replicates
     * measured at that frequency: frequencies where replicates agree weigh more.
     */
    REPLICATE_SD("replicate-sd", "log residuals / replicate SD", "the natural-log differences between model and data of "
            + "storage and loss moduli jointly, each divided by the standard deviation of ln M over the replicates at that "
            + "frequency");

    private final String label;
    private final String residualName;
    private final String description;

    Weighting(String label, String residualName, String description) {
        this.label = label;
        this.residualName = residualName;
        this.description = description;
    }

    /** What the residuals are, in a column header: "log residuals". */
    public String residualName() {
        return residualName;
    }

    /** What the residuals are, in a sentence of Provenance or Read me. */
    public String describe() {
        return description;
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
        throw new UsageException("weighting '" + text + "' is not known; use log, relative or replicate-sd");
    }

    @Override
    public String toString() {
        return label;
    }
}
