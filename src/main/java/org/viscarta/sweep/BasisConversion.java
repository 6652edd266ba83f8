package org.viscarta.sweep;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;

/**
 * Converts sweeps between tensile (E) and shear (G) moduli with E* = 2(1 + ν) G*, valid for an
 * isotropic material whose Poisson's ratio ν is real and frequency-independent (DOMAIN.md
 * section 4.3; see Tschoegl, Knauss and Emri 2002 for the general, time-dependent case).
 * Conversions are never silent: each one is returned as a note for the report.
 */
public final class BasisConversion {

    private BasisConversion() {
    }

    /** The result of a conversion: the sweep on the requested basis and what was done, if anything. */
    public record Converted(Sweep sweep, String note) {
    }

    /**
     * Puts a sweep on the requested basis.
     *
     * @param sweep           the sweep as read
     * @param target          the basis wanted
     * @param poissonOverride ν given on the command line; it wins over the file's {@code poisson_ratio}
     * @throws IllegalArgumentException when a conversion is needed and no valid ν is known
     */
    public static Converted toBasis(Sweep sweep, ModulusKind target, OptionalDouble poissonOverride) {
        if (sweep.kind() == target) {
            return new Converted(sweep, "");
        }
        OptionalDouble nu = poissonOverride.isPresent() ? poissonOverride : sweep.poissonRatio();
        if (nu.isEmpty()) {
            throw new IllegalArgumentException("sample '" + sweep.sample() + "' holds " + sweep.kind()
                    + " moduli and no Poisson's ratio is known to convert them to " + target
                    + "; add '# poisson_ratio: 0.5' to the file or pass --poisson");
        }
        double factor = 2.0 * (1.0 + nu.getAsDouble());
        double applied = target == ModulusKind.TENSILE ? factor : 1.0 / factor;
        List<SweepPoint> pts = new ArrayList<>(sweep.points().size());
        for (SweepPoint p : sweep.points()) {
            pts.add(p.scaled(applied));
        }
        String note = String.format(Locale.ROOT, "%s moduli converted to %s with E = 2(1 + ν)G, ν = %s",
                sweep.kind(), target, Numbers.plain(nu.getAsDouble()));
        return new Converted(sweep.withPoints(target, pts), note);
    }

}
