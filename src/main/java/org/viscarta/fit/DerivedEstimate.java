package org.viscarta.fit;

/**
 * A quantity derived from a fitted model, with its standard error by the delta method.
 *
 * @param name     e.g. {@code crossover_frequency}
 * @param unit     SI unit
 * @param value    the value (NaN when not defined for this fit)
 * @param stdError standard error (NaN when it cannot be computed)
 */
public record DerivedEstimate(String name, String unit, double value, double stdError) {
}
