package org.viscarta.sweep;

import java.util.Locale;

/**
 * Whether a sweep's moduli are tensile/compressive/indentation moduli (E) or shear moduli (G).
 * The two are related, for an isotropic material with a real, frequency-independent Poisson's
 * ratio ν, by E = 2(1 + ν) G (DOMAIN.md section 4.3).
 */
public enum ModulusKind {
    TENSILE("E"),
    SHEAR("G");

    private final String letter;

    ModulusKind(String letter) {
        this.letter = letter;
    }

    /** E or G, as written in headers such as E′ or G″. */
    public String letter() {
        return letter;
    }

    /** Parses {@code tensile}, {@code shear} (and the letters E, G); returns null when unknown. */
    public static ModulusKind parse(String text) {
        String t = text.strip().toLowerCase(Locale.ROOT);
        switch (t) {
            case "tensile": case "tension": case "compression": case "indentation": case "e": case "young":
                return TENSILE;
            case "shear": case "g":
                return SHEAR;
            default:
                return null;
        }
    }

    @Override
    public String toString() {
        return name().toLowerCase(Locale.ROOT);
    }
}
