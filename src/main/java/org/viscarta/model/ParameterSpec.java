package org.viscarta.model;

import java.util.Objects;

/**
 * A named model parameter.
 *
 * @param name      the name used in every output (DOMAIN.md "Viscarta's model names and parameters")
 * @param unit      its SI unit, e.g. "Pa", "s", "Pa·s", "Pa·s^α", "-"
 * @param transform the map that keeps it in its domain during fitting
 * @param isTime    true for relaxation times (checked against the measured window)
 */
public record ParameterSpec(String name, String unit, Transform transform, boolean isTime) {

    public ParameterSpec {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(transform, "transform");
    }

    static ParameterSpec positive(String name, String unit) {
        return new ParameterSpec(name, unit, Transform.LOG, false);
    }

    static ParameterSpec time(String name) {
        return new ParameterSpec(name, "s", Transform.LOG, true);
    }

    static ParameterSpec exponent(String name) {
        return new ParameterSpec(name, "-", Transform.LOGIT, false);
    }
}
