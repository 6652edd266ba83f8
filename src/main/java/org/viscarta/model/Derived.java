package org.viscarta.model;

import java.util.Objects;
import java.util.function.ToDoubleFunction;

/**
 * A quantity derived from a model's parameters (relaxation time, crossover frequency, relaxed
 * modulus, zero-frequency viscosity ...). Its standard error comes from the parameters' covariance
 * by the delta method.
 *
 * @param name  the name used in outputs, e.g. {@code crossover_frequency}
 * @param unit  SI unit
 * @param value computes it from the natural parameter values; NaN when not defined for these values
 */
public record Derived(String name, String unit, ToDoubleFunction<double[]> value) {

    public Derived {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(value, "value");
    }
}
