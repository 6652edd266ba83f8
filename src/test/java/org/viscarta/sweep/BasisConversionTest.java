package org.viscarta.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/** E* = 2(1 + ν)G* for isotropic materials with real ν (DOMAIN.md 4.3); ν = 1/2 gives E = 3G. */
@Tag("validation")
class BasisConversionTest {

    private static Sweep shear(Map<String, String> meta) {
        return new Sweep("gel", "1", "", ModulusKind.SHEAR, 23, Path.of("gel.csv"), meta,
                List.of(new SweepPoint(1, 1000, 100, 5), new SweepPoint(2, 1100, 120, 6)));
    }

    @Test
    void shearToTensileUsesTheFilesPoissonRatio() {
        BasisConversion.Converted c = BasisConversion.toBasis(shear(Map.of("poisson_ratio", "0.5")), ModulusKind.TENSILE,
                OptionalDouble.empty());
        assertEquals(ModulusKind.TENSILE, c.sweep().kind());
        assertEquals(3000, c.sweep().points().get(0).storage(), 1e-9);
        assertEquals(300, c.sweep().points().get(0).loss(), 1e-9);
        assertTrue(c.note().contains("ν = 0.5"), c.note());
    }

    @Test
    void commandLinePoissonRatioWinsAndTanDeltaIsUnchanged() {
        Sweep s = shear(Map.of("poisson_ratio", "0.5"));
        BasisConversion.Converted c = BasisConversion.toBasis(s, ModulusKind.TENSILE, OptionalDouble.of(0.48));
        assertEquals(2 * 1.48 * 1100, c.sweep().points().get(1).storage(), 1e-9);
        assertEquals(s.points().get(1).lossTangent(), c.sweep().points().get(1).lossTangent(), 1e-15);
    }

    @Test
    void tensileToShearDivides() {
        Sweep e = shear(Map.of()).withPoints(ModulusKind.TENSILE, List.of(new SweepPoint(1, 3000, 300, 1)));
        Sweep g = BasisConversion.toBasis(e, ModulusKind.SHEAR, OptionalDouble.of(0.5)).sweep();
        assertEquals(1000, g.points().get(0).storage(), 1e-9);
    }

    @Test
    void refusesToConvertWithoutAPoissonRatio() {
        IllegalArgumentException ex = assertThrows(IllegalArgumentException.class,
                () -> BasisConversion.toBasis(shear(Map.of()), ModulusKind.TENSILE, OptionalDouble.empty()));
        assertTrue(ex.getMessage().contains("--poisson"), ex.getMessage());
    }

    @Test
    void sameBasisIsLeftAlone() {
        Sweep s = shear(Map.of());
        assertEquals(s, BasisConversion.toBasis(s, ModulusKind.SHEAR, OptionalDouble.empty()).sweep());
    }
}
