package org.viscarta.fit;

/**
 * A quantity derived from a fitted model, with its standard error by the delta method.
 *
 * @param name     e.g. {@code crossover_frequency}
 * @param unit     SI unit
 * @param value    the value (NaN when not defined for this fit)
 * @param stdError standard error (NaN when it cannot be computed)
 * @param note     "" or why the data do not determine it (as for parameters: its uncertainty cannot be
 *                 computed or exceeds the value, or a time or frequency lies more than ten times
 *                 outside what the measured frequencies can show)
 */
public record DerivedEstimate(String name, String unit, double value, double stdError, String note) {

    /** A derived quantity the data determine. */
    public DerivedEstimate(String name, String unit, double value, double stdError) {
        this(name, unit, value, stdError, "");
    }

    /** True when the fit flagged this quantity. */
    public boolean undetermined() {
        return !note.isEmpty();
    }
}
