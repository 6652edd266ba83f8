package org.viscarta.temperature;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.viscarta.demo.RampModel;
import org.viscarta.io.UsageException;
import org.viscarta.sweep.ModulusKind;
import org.viscarta.sweep.Ramp;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;

@Tag("regression")
class IsothermsTest {

    private static Ramp ramp(String rep, double hz, List<Ramp.Point> pts) {
        return new Ramp("film", rep, "", ModulusKind.TENSILE, hz, Path.of("synthetic.csv"), Map.of(), pts, 0);
    }

    @Test
    void interpolatesTheLogarithmsBetweenTheTwoNeighbouringTemperatures() {
        // Hand computation: halfway between 1e9 Pa and 1e7 Pa on a log scale is 1e8 Pa; a quarter of the
        // way from 1e6 to 1e4 Pa is 10^5.5 Pa.
        Ramp r = ramp("1", 1, List.of(new Ramp.Point(10, 1e9, 1e6, 3), new Ramp.Point(14, 1e7, 1e4, 4)));
        SweepPoint half = Isotherms.at(r, 12, 5);
        assertEquals(1e8, half.storage(), 1e8 * 1e-12);
        assertEquals(1e5, half.loss(), 1e5 * 1e-12);
        SweepPoint quarter = Isotherms.at(r, 11, 5);
        assertEquals(Math.pow(10, 8.5), quarter.storage(), Math.pow(10, 8.5) * 1e-12);
        assertEquals(3, quarter.line(), "the nearer measured point names the line");
        assertNull(Isotherms.at(r, 9.9, 5), "no extrapolation below the ramp");
        assertNull(Isotherms.at(r, 14.1, 5), "no extrapolation above the ramp");
        assertNull(Isotherms.at(r, 12, 3), "points further apart than the step are not bridged");
    }

    @Test
    void theShiftFactorsOfIsothermsCutFromArrheniusRampsFollowTheArrheniusLaw() {
        // The generator's relaxation time follows the Arrhenius law exactly (textbook: log10 a_T =
        // Ea / (R ln 10) (1/T − 1/T0)), and the material is thermorheologically simple, so the isotherms cut
        // across its ramps must superpose with those factors.
        double ea = 300e3;
        RampModel m = new RampModel(2e9, 5e6, 0.55, 40.0, ea);
        List<Ramp> ramps = new ArrayList<>();
        for (double hz : new double[] {0.1, 1, 10}) {
            ramps.add(ramp("1", hz, m.ramp(hz, 0, 100, 1, 0, new Random(1))));
        }
        List<Sweep> iso = Isotherms.of(ramps, 5);
        assertEquals(21, iso.size(), "0, 5, ..., 100 °C");
        for (Sweep s : iso) {
            assertEquals(3, s.points().size());
            assertTrue(s.metadata().get("note").contains("isotherm"));
        }
        ShiftAnalysis.Result r = new ShiftAnalysis(0.3, ShiftAnalysis.Vertical.NONE).analyse(iso, 40);
        double r8 = 8.314462618;
        int placed = 0;
        for (ShiftAnalysis.Factor f : r.factors()) {
            if (!f.placed()) {
                continue;
            }
            placed++;
            double exact = ea / (r8 * Math.log(10)) * (1 / (f.temperatureC() + 273.15) - 1 / (40 + 273.15));
            assertEquals(exact, f.log10aT(), 0.05 + 0.01 * Math.abs(exact), "log10 a_T at " + f.temperatureC() + " °C");
        }
        assertTrue(placed >= 12, "the transition region must be placed, got " + placed);
        double fitted = r.arrhenius().parameter("Ea").value();
        assertEquals(ea / 1000, fitted, 0.02 * ea / 1000, "Arrhenius Ea [kJ/mol]");
    }

    @Test
    void oneFrequencyGivesNoIsothermsAndABadStepIsRefused() {
        RampModel m = new RampModel(2e9, 5e6, 0.55, 40.0, 300e3);
        List<Ramp> one = List.of(ramp("1", 1, m.ramp(1, 0, 100, 1, 0, new Random(1))));
        assertTrue(Isotherms.of(one, 5).isEmpty());
        assertThrows(UsageException.class, () -> Isotherms.of(one, 0));
        List<Ramp> two = List.of(ramp("1", 1, m.ramp(1, 0, 100, 1, 0, new Random(1))),
                new Ramp("other", "1", "", ModulusKind.TENSILE, 10, Path.of("x.csv"), Map.of(), m.ramp(10, 0, 100, 1, 0, new Random(1)), 0));
        assertThrows(UsageException.class, () -> Isotherms.of(two, 5));
    }
}
