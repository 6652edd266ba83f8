package org.viscarta.analysis;

import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import org.viscarta.sweep.ModulusKind;

/**
 * How inputs are read and put on one basis.
 *
 * @param declaredKind what the moduli are when neither headers nor metadata say (empty: tensile, with a warning)
 * @param basis        convert every sweep to this basis (empty: keep each as read)
 * @param poisson      Poisson's ratio for the conversion, overriding each file's (empty: each file's own)
 * @param columns      headers (as written) mapped to what they hold, e.g. "Gstar_abs_Pa" to "complex_modulus_magnitude [Pa]"
 * @param badFiles     what a bad file among several does
 * @param groupBy      a sample attribute (a descriptive column of a tidy table) whose value becomes each sample's group
 */
public record ReadSettings(Optional<ModulusKind> declaredKind, Optional<ModulusKind> basis, OptionalDouble poisson,
                           Map<String, String> columns, BadFiles badFiles, Optional<String> groupBy) {

    /** What a bad input file among several does to the run. */
    public enum BadFiles {
        /** It is reported and left out; the rest is analysed (the default). */
        LEAVE_OUT,
        /** The first bad file stops the run ({@code --strict}). */
        STOP
    }

    public ReadSettings {
        Objects.requireNonNull(declaredKind, "declaredKind");
        Objects.requireNonNull(basis, "basis");
        Objects.requireNonNull(poisson, "poisson");
        Objects.requireNonNull(badFiles, "badFiles");
        Objects.requireNonNull(groupBy, "groupBy");
        columns = Map.copyOf(columns);
        if (poisson.isPresent() && !(poisson.getAsDouble() > -1 && poisson.getAsDouble() <= 0.5)) {
            throw new IllegalArgumentException("--poisson must lie in (-1, 0.5], got " + poisson.getAsDouble());
        }
    }

    /** Each sweep as read, tensile when unstated (with a warning), bad files left out. */
    public static ReadSettings defaults() {
        return new ReadSettings(Optional.empty(), Optional.empty(), OptionalDouble.empty(), Map.of(), BadFiles.LEAVE_OUT, Optional.empty());
    }
}
