package org.viscarta.cli;

import java.util.OptionalDouble;
import org.viscarta.Campaign;
import org.viscarta.sweep.ModulusKind;
import picocli.CommandLine.Option;

/** How inputs are read and put on one basis: {@code --modulus}, {@code --basis}, {@code --poisson}. */
final class ReadOptions {

    @Option(names = "--modulus", paramLabel = "shear|tensile",
            description = "What the moduli are when neither headers (G′ means shear) nor a '# modulus:' line say. Default: tensile, with a warning.")
    String modulus;

    @Option(names = "--basis", paramLabel = "tensile|shear",
            description = "Convert every sweep to this basis with E = 2(1 + ν)G. Default: keep each as read.")
    String basis;

    @Option(names = "--poisson", paramLabel = "NU",
            description = "Poisson's ratio for --basis; overrides each file's '# poisson_ratio:'.")
    Double poisson;

    @Option(names = "--column", paramLabel = "HEADER=quantity [unit]",
            description = "What a header holds, when it is not recognised: e.g. --column \"G_storage_Pa=G' [Pa]\"; "
                    + "HEADER=ignore leaves a column out (repeatable).")
    java.util.Map<String, String> columns = new java.util.LinkedHashMap<>();

    @Option(names = "--strict", description = "Stop at the first bad file; by default a bad file among several is reported and left out.")
    boolean strict;

    Campaign.Settings applyTo(Campaign.Settings s) {
        ModulusKind declared = modulus == null ? null : kind(modulus, "--modulus");
        ModulusKind target = basis == null ? null : kind(basis, "--basis");
        if (poisson != null && !(poisson > -1 && poisson <= 0.5)) {
            throw new IllegalArgumentException("--poisson must lie in (-1, 0.5], got " + poisson);
        }
        return s.withDeclaredKind(declared)
                .withBasis(target, poisson == null ? OptionalDouble.empty() : OptionalDouble.of(poisson))
                .withColumns(columns).withStrict(strict);
    }

    private static ModulusKind kind(String text, String option) {
        ModulusKind k = ModulusKind.parse(text);
        if (k == null) {
            throw new IllegalArgumentException(option + " takes 'tensile' or 'shear', not '" + text + "'");
        }
        return k;
    }
}
