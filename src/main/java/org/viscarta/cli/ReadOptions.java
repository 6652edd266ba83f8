package org.viscarta.cli;

import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.ReadSettings;
import org.viscarta.io.UsageException;
import org.viscarta.sweep.ModulusKind;
import picocli.CommandLine.Option;

/** How inputs are read and put on one basis: {@code --modulus}, {@code --basis}, {@code --poisson}, {@code --column}, {@code --strict}. */
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

    @Option(names = "--group-by", paramLabel = "COLUMN",
            description = "Take each sample's group from this descriptive column of the table (e.g. a composition or exposure column).")
    String groupBy;

    @Option(names = "--strict", description = "Stop at the first bad file; by default a bad file among several is reported and left out.")
    boolean strict;

    /** Puts these options into a request. */
    AnalysisRequest.Builder applyTo(AnalysisRequest.Builder b) {
        if (modulus != null) {
            b.declaredKind(kind(modulus, "--modulus"));
        }
        if (basis != null) {
            b.basis(kind(basis, "--basis"));
        }
        if (poisson != null) {
            b.poisson(poisson);
        }
        return b.columns(columns).groupBy(groupBy).badFiles(strict ? ReadSettings.BadFiles.STOP : ReadSettings.BadFiles.LEAVE_OUT);
    }

    /** The reading settings alone, for verbs that read without analysing. */
    ReadSettings settings() {
        try {
            return applyTo(AnalysisRequest.builder(java.util.List.of())).build().reading();
        } catch (IllegalArgumentException e) {
            throw new UsageException(e.getMessage());
        }
    }

    private static ModulusKind kind(String text, String option) {
        ModulusKind k = ModulusKind.parse(text);
        if (k == null) {
            throw new UsageException(option + " takes 'tensile' or 'shear', not '" + text + "'");
        }
        return k;
    }
}
