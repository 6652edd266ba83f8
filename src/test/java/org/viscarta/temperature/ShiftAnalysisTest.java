package org.viscarta.temperature;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.function.DoubleUnaryOperator;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.viscarta.model.FractionalZener;
import org.viscarta.sweep.ModulusKind;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;

/**
 * Time–temperature superposition: the laws against DOMAIN.md 10.5 (derived there) and their closed
 * forms, and recovery of known shift factors from synthetic temperature series.
 */
@Tag("validation")
class ShiftAnalysisTest {

    /** A broad transition (fractional Zener, E_r = 1 MPa, E_1 = 100 MPa, τ = 0.1 s at the reference, α = 0.35). */
    private static final double[] MATERIAL = {1e6, 1e8, 0.1, 0.35};

    /** Sweeps 0.1–20 Hz (12 points) at each temperature, shifted by log10 a_T(T), with 1 % noise. */
    private static List<Sweep> series(double[] temps, DoubleUnaryOperator log10aT, long seed) {
        return series(temps, log10aT, t -> 1, seed);
    }

    /** The same with a vertical factor: M(ω; T) = b_T M(a_T ω; T0). */
    private static List<Sweep> series(double[] temps, DoubleUnaryOperator log10aT, DoubleUnaryOperator bT, long seed) {
        return series(temps, log10aT, bT, seed, 0.01);
    }

    /** The same with a given relative noise of each modulus. */
    private static List<Sweep> series(double[] temps, DoubleUnaryOperator log10aT, DoubleUnaryOperator bT, long seed, double noise) {
        SplittableRandom rng = new SplittableRandom(seed);
        FractionalZener m = new FractionalZener();
        List<Sweep> out = new ArrayList<>();
        double[] mod = new double[2];
        for (double t : temps) {
            double a = Math.pow(10, log10aT.applyAsDouble(t));
            List<SweepPoint> pts = new ArrayList<>();
            for (int i = 0; i < 12; i++) {
                double f = 0.1 * Math.pow(200, i / 11.0);
                m.modulus(2 * Math.PI * f * a, MATERIAL, mod);
                double b = bT.applyAsDouble(t);
                pts.add(new SweepPoint(f, b * mod[0] * Math.exp(noise * rng.nextGaussian()), b * mod[1] * Math.exp(noise * rng.nextGaussian()), 0));
            }
            out.add(new Sweep("film", "1", "", ModulusKind.TENSILE, t, Path.of("synthetic.csv"), Map.of(), pts));
        }
        return out;
    }

    @Test
    void universalWlfMatchesDomainTable() {
        // DOMAIN.md 10.5, universal WLF (C1 = 17.44, C2 = 51.6 K at Tg)
        assertEquals(1.871245, ShiftLaws.wlf(17.44, 51.6, -5), 5e-7);
        assertEquals(-2.831169, ShiftLaws.wlf(17.44, 51.6, 10), 5e-7);
        assertEquals(-4.871508, ShiftLaws.wlf(17.44, 51.6, 20), 5e-7);
        assertEquals(-8.582677, ShiftLaws.wlf(17.44, 51.6, 50), 5e-7);
        assertEquals(-11.503958, ShiftLaws.wlf(17.44, 51.6, 100), 5e-7);
    }

    @Test
    void arrheniusMatchesDomainTable() {
        // DOMAIN.md 10.5: Ea = 50 kJ/mol, T0 = 298.15 K: ln a_T = −0.780388 at 310.15 K, a_T = 6.334649 at 273.15 K;
        // Ea = 100 kJ/mol: a_T = 0.209973 (310.15 K), 40.127784 (273.15 K)
        assertEquals(-0.780388, ShiftLaws.arrhenius(50e3, 310.15, 298.15) * Math.log(10), 5e-7);
        assertEquals(6.334649, Math.pow(10, ShiftLaws.arrhenius(50e3, 273.15, 298.15)), 5e-7);
        assertEquals(0.209973, Math.pow(10, ShiftLaws.arrhenius(100e3, 310.15, 298.15)), 5e-7);
        assertEquals(40.127784, Math.pow(10, ShiftLaws.arrhenius(100e3, 273.15, 298.15)), 5e-6);
    }

    @Test
    void wlfRereferencingIsItsClosedFormAndGivesTheOtherUniversalPair() {
        // C1' = C1 C2/(C2 + T' − T), C2' = C2 + T' − T; from Tg to Tg + 50 K: 8.857, 101.6 K (DOMAIN.md 6)
        double[] c = ShiftLaws.rereference(17.44, 51.6, 50);
        assertEquals(17.44 * 51.6 / 101.6, c[0], 1e-12);
        assertEquals(101.6, c[1], 1e-12);
        assertEquals(8.857, c[0], 5e-4);
        // the same law: log a between any two temperatures is unchanged by re-referencing
        for (double t : new double[] {55, 70, 120}) {
            double direct = ShiftLaws.wlf(17.44, 51.6, t) - ShiftLaws.wlf(17.44, 51.6, 50);
            assertEquals(direct, ShiftLaws.wlf(c[0], c[1], t - 50), 1e-12);
        }
    }

    @Test
    void recoversWlfShiftFactorsAndConstants() {
        double[] temps = {10, 20, 30, 40, 50};
        DoubleUnaryOperator wlf = t -> ShiftLaws.wlf(10, 80, t - 30);
        ShiftAnalysis.Result r = new ShiftAnalysis(0.3, ShiftAnalysis.Vertical.NONE).analyse(series(temps, wlf, 1), 30);
        for (ShiftAnalysis.Factor f : r.factors()) {
            assertTrue(f.placed(), "placed " + f.temperatureC());
            double truth = wlf.applyAsDouble(f.temperatureC());
            assertEquals(truth, f.log10aT(), Math.max(0.05, 4 * f.log10aTStdError()), "log a_T at " + f.temperatureC());
        }
        ShiftFits.Parameter c1 = r.wlf().parameter("C1");
        ShiftFits.Parameter c2 = r.wlf().parameter("C2");
        assertEquals(10, c1.value(), 0.15 * 10, "C1");
        assertEquals(80, c2.value(), 0.15 * 80, "C2");
        assertTrue(r.notes().stream().anyMatch(n -> n.contains("consistent with thermorheological simplicity")), r.notes().toString());
        assertTrue(r.master().size() == 60, "every point in the master curve");
        double decades = Math.log10(r.master().get(59).frequencyHz() / r.master().get(0).frequencyHz());
        assertTrue(decades > Math.log10(200) + 3, "master curve spans several more decades than one sweep: " + decades);
    }

    @Test
    void reproducesTheUniversalWlfConstantsFromDataMadeWithThem() {
        // data generated with C1 = 17.44, C2 = 51.6 K at T0 = Tg (Williams, Landel & Ferry 1955, universal constants)
        double[] temps = {20, 25, 30, 35, 40, 45};
        DoubleUnaryOperator wlf = t -> ShiftLaws.wlf(17.44, 51.6, t - 20);
        ShiftAnalysis.Result r = new ShiftAnalysis(0.3, ShiftAnalysis.Vertical.NONE).analyse(series(temps, wlf, 2), 20);
        assertEquals(17.44, r.wlf().parameter("C1").value(), 0.1 * 17.44);
        assertEquals(51.6, r.wlf().parameter("C2").value(), 0.15 * 51.6);
    }

    @Test
    void recoversArrheniusActivationEnergyAndPrefersArrhenius() {
        double[] temps = {0, 10, 20, 30, 40, 50, 60};
        DoubleUnaryOperator arr = t -> ShiftLaws.arrhenius(120e3, t + 273.15, 30 + 273.15);
        ShiftAnalysis.Result r = new ShiftAnalysis(0.3, ShiftAnalysis.Vertical.NONE).analyse(series(temps, arr, 3), 30);
        ShiftFits.Parameter ea = r.arrhenius().parameter("Ea");
        assertEquals(120, ea.value(), 0.05 * 120, "Ea [kJ/mol]");
        assertFalse(r.notes().stream().anyMatch(n -> n.contains("support WLF")), r.notes().toString());
    }

    @Test
    void fittedVerticalFactorsAreRecovered() {
        double[] temps = {10, 20, 30, 40, 50};
        DoubleUnaryOperator wlf = t -> ShiftLaws.wlf(10, 80, t - 30);
        DoubleUnaryOperator b = t -> Math.pow(10, -0.004 * (t - 30)); // 20 % softer per 50 K, made up for the test
        ShiftAnalysis.Result r = new ShiftAnalysis(0.3, ShiftAnalysis.Vertical.FITTED).analyse(series(temps, wlf, b, 5), 30);
        for (ShiftAnalysis.Factor f : r.factors()) {
            assertEquals(b.applyAsDouble(f.temperatureC()), f.bT(), 0.02, "b_T at " + f.temperatureC());
            assertEquals(wlf.applyAsDouble(f.temperatureC()), f.log10aT(), Math.max(0.05, 4 * f.log10aTStdError()));
        }
    }

    @Test
    void curvesThatCannotOverlapAreReportedNotForced() {
        // 10 °C and 50 °C only, 12 decades apart: no shift within the allowed overlap superposes them
        DoubleUnaryOperator far = t -> t < 30 ? 12 : 0;
        ShiftAnalysis.Result r = new ShiftAnalysis(1.5, ShiftAnalysis.Vertical.NONE).analyse(series(new double[] {10, 50}, far, 4), 50);
        assertFalse(r.factors().get(0).placed());
        assertTrue(r.notes().get(0).contains("10 °C on 50 °C"), r.notes().toString());
    }

    /**
     * A thermorheologically complex material: two Maxwell processes (E_1 = 1 MPa, τ_1 = 1 s; E_2 =
     * 0.1 MPa, τ_2 = 0.01 s at 30 °C) whose times follow Arrhenius laws with different activation
     * energies (100 and 250 kJ/mol). No single shift lays the curves over each other: the phase
     * angle at equal |E*| changes with temperature.
     */
    private static List<Sweep> complexSeries(double[] temps, long seed) {
        SplittableRandom rng = new SplittableRandom(seed);
        org.viscarta.model.GeneralizedMaxwell liquid = new org.viscarta.model.GeneralizedMaxwell(2, true);
        List<Sweep> out = new ArrayList<>();
        double[] mod = new double[2];
        for (double t : temps) {
            double a1 = Math.pow(10, ShiftLaws.arrhenius(100e3, t + 273.15, 303.15));
            double a2 = Math.pow(10, ShiftLaws.arrhenius(250e3, t + 273.15, 303.15));
            double[] p = {1e6, 1e5, 1.0 * a1, 0.01 * a2};
            List<SweepPoint> pts = new ArrayList<>();
            for (int i = 0; i < 16; i++) {
                double f = 0.01 * Math.pow(1e4, i / 15.0);
                liquid.modulus(2 * Math.PI * f, p, mod);
                pts.add(new SweepPoint(f, mod[0] * Math.exp(0.01 * rng.nextGaussian()), mod[1] * Math.exp(0.01 * rng.nextGaussian()), i + 2));
            }
            out.add(new Sweep("blend", "1", "", ModulusKind.TENSILE, t, Path.of("synthetic.csv"), Map.of(), pts));
        }
        return out;
    }

    @Test
    void aThermorheologicallyComplexMaterialIsCalledQuestionable() {
        ShiftAnalysis.Result r = new ShiftAnalysis(0.3, ShiftAnalysis.Vertical.NONE).analyse(
                complexSeries(new double[] {10, 20, 30, 40, 50, 60}, 8), 30);
        String verdict = String.join(" ", r.notes());
        assertTrue(verdict.contains("questionable") || verdict.contains("poor"), verdict);
        double worst = r.pairs().stream().mapToDouble(p -> Math.abs(p.phaseGapDeg())).filter(Double::isFinite).max().orElse(0);
        assertTrue(worst > ShiftAnalysis.PHASE_GAP_DEG, "van Gurp–Palmen gap " + worst + "°");
    }

    @Test
    void aSimpleMaterialKeepsItsVerdictAndItsPhaseAnglesAgree() {
        // WLF C1 = 12, C2 = 110 K at 30 °C on the broad transition, 1 % noise
        ShiftAnalysis.Result r = new ShiftAnalysis(0.3, ShiftAnalysis.Vertical.NONE).analyse(
                series(new double[] {10, 20, 30, 40, 50, 60}, t -> ShiftLaws.wlf(12, 110, t - 30), 12), 30);
        String verdict = String.join(" ", r.notes());
        assertTrue(verdict.contains("consistent with thermorheological simplicity"), verdict);
        for (ShiftAnalysis.PairShift p : r.pairs()) {
            if (Double.isFinite(p.phaseGapDeg())) {
                assertTrue(Math.abs(p.phaseGapDeg()) < 0.5, p.coldC() + " °C: gap " + p.phaseGapDeg() + "°");
            }
            if (Double.isFinite(p.phaseShiftDifference())) {
                assertTrue(p.phaseShiftDifference() < 0.1, p.coldC() + " °C: phase-only shift off by " + p.phaseShiftDifference());
            }
        }
    }

    /**
     * The shift factors' standard errors are honest: over 200 seeded synthetic series (six
     * temperatures, WLF C1 = 12, C2 = 110 K, or Arrhenius with E_a = 150 kJ/mol, at 30 °C — the cases of
     * the independent check), log a_T ± 1.96 SE covers the true value in
     * 93–97 % of the intervals, at 2 % and at 5 % noise. (The curvature-based errors these replace
     * covered 49–63 %.)
     */
    @org.junit.jupiter.params.ParameterizedTest
    // the suite runs two of the four cases measured for README (WLF at 5 % and Arrhenius at 2 % noise
    // gave 94.7 % and 95.9 %); add them back here to check all four
    @org.junit.jupiter.params.provider.CsvSource({"0.02, wlf", "0.05, arrhenius"})
    void shiftFactorIntervalsCoverTheTruth(double noise, String law) {
        double[] temps = {10, 20, 30, 40, 50, 60};
        DoubleUnaryOperator truth = law.equals("wlf") ? t -> ShiftLaws.wlf(12, 110, t - 30)
                : t -> ShiftLaws.arrhenius(150e3, t + 273.15, 303.15);
        int covered = 0;
        int total = 0;
        double zs = 0;
        double zz = 0;
        for (int k = 0; k < 200; k++) {
            ShiftAnalysis.Result r = new ShiftAnalysis(0.3, ShiftAnalysis.Vertical.NONE).analyse(
                    series(temps, truth, t -> 1, 1000 + k, noise), 30);
            for (ShiftAnalysis.Factor f : r.factors()) {
                if (f.temperatureC() == 30 || !f.placed()) {
                    continue;
                }
                total++;
                double z = (f.log10aT() - truth.applyAsDouble(f.temperatureC())) / f.log10aTStdError();
                zs += z;
                zz += z * z;
                if (Math.abs(f.log10aT() - truth.applyAsDouble(f.temperatureC())) <= 1.96 * f.log10aTStdError()) {
                    covered++;
                }
            }
        }
        double coverage = covered / (double) total;
        System.out.printf("shift-factor coverage, %s at %.0f %% noise: %.3f of %d; z mean %.3f, z rms %.3f%n", law, 100 * noise,
                coverage, total, zs / total, Math.sqrt(zz / total));
        assertTrue(coverage >= 0.93 && coverage <= 0.97, "coverage " + coverage + " of " + total + " intervals");
    }
}
