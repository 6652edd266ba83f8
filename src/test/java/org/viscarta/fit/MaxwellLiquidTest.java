package org.viscarta.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.viscarta.model.Burgers;
import org.viscarta.model.GeneralizedMaxwell;
import org.viscarta.sweep.SweepPoint;

/**
 * The generalized Maxwell model on liquids (no equilibrium modulus). Closed forms: a two-mode
 * Maxwell liquid E′ = Σ E_i ω²τ_i² / (1 + ω²τ_i²), E″ = Σ E_i ωτ_i / (1 + ω²τ_i²) (DOMAIN.md 2.1,
 * with E_inf = 0); a Burgers material is such a liquid with two modes (Tschoegl 1989, ch. 3), so
 * both must be fitted with N = 2, not fall back to one element.
 */
@Tag("validation")
class MaxwellLiquidTest {

    private static List<SweepPoint> sweep(java.util.function.BiConsumer<Double, double[]> model, long seed, double noise) {
        Random rng = new Random(seed);
        List<SweepPoint> pts = new ArrayList<>();
        double[] m = new double[2];
        for (int i = 0; i < 25; i++) {
            double f = 0.01 * Math.pow(1e4, i / 24.0);
            model.accept(2 * Math.PI * f, m);
            pts.add(new SweepPoint(f, m[0] * Math.exp(noise * rng.nextGaussian()), m[1] * Math.exp(noise * rng.nextGaussian()), i + 2));
        }
        return pts;
    }

    private static double value(FitResult r, String name) {
        return r.parameters().stream().filter(p -> p.name().equals(name)).findFirst().orElseThrow().value();
    }

    @Test
    void aTwoModeMaxwellLiquidIsFittedWithTwoElementsAndDeterminedParameters() {
        double[] truth = {1e5, 1e4, 0.01, 1.0}; // E_1, E_2, tau_1, tau_2 of the liquid variant
        GeneralizedMaxwell liquid = new GeneralizedMaxwell(2, true);
        List<SweepPoint> data = sweep((w, m) -> liquid.modulus(w, truth, m), 21, 0.02);
        FitResult r = new ModelFitter().fit("liquid", new GeneralizedMaxwell(0), data);
        assertTrue(r.converged(), r.message());
        assertTrue(r.variant().startsWith("2 elements, no equilibrium modulus"), r.variant());
        assertFalse(r.undetermined(), "every parameter has a standard error: " + r.parameters());
        List<Double> taus = List.of(value(r, "tau_1"), value(r, "tau_2")).stream().sorted().toList();
        assertEquals(0.01, taus.get(0), 0.002, "fast mode");
        assertEquals(1.0, taus.get(1), 0.2, "slow mode");
        for (ParameterEstimate p : r.parameters()) {
            assertTrue(p.stdError() > 0 && Double.isFinite(p.stdError()), p.toString());
        }
        double eta = r.derived().stream().filter(d -> d.name().equals("zero_frequency_viscosity")).findFirst().orElseThrow().value();
        assertEquals(1e5 * 0.01 + 1e4 * 1.0, eta, 0.1 * 11000, "η0 = Σ E_i τ_i");
    }

    @Test
    void aBurgersMaterialIsATwoModeLiquid() {
        Burgers burgers = new Burgers();
        double[] p = {1e5, 1e4, 2e4, 50}; // E_1 [Pa], eta_1 [Pa·s], E_2 [Pa], eta_2 [Pa·s] (Burgers' own order)
        List<SweepPoint> data = sweep((w, m) -> burgers.modulus(w, p, m), 7, 0.0);
        FitResult r = new ModelFitter().fit("burgers-like", new GeneralizedMaxwell(0), data);
        assertTrue(r.converged(), r.message());
        assertTrue(r.variant().startsWith("2 elements, no equilibrium modulus"), r.variant());
        assertTrue(r.rss() < 1e-12, "exact data are fitted exactly: RSS " + r.rss());
        // the one-element fit the choice once fell back to is far worse
        FitResult one = new ModelFitter().fit("burgers-like", new GeneralizedMaxwell(1), data);
        assertTrue(one.rss() > 1000 * Math.max(r.rss(), 1e-15), one.rss() + " vs " + r.rss());
    }

    @Test
    void aSolidKeepsItsEquilibriumModulus() {
        double[] truth = {5e3, 1e5, 1e4, 0.01, 1.0}; // E_inf, E_1, E_2, tau_1, tau_2
        GeneralizedMaxwell solid = new GeneralizedMaxwell(2);
        FitResult r = new ModelFitter().fit("solid", new GeneralizedMaxwell(0), sweep((w, m) -> solid.modulus(w, truth, m), 3, 0.02));
        assertTrue(r.variant().startsWith("2 elements,") && !r.variant().contains("liquid"), r.variant());
        assertEquals(5e3, value(r, "E_inf"), 1e3);
    }

    @Test
    void aKelvinVoigtGelIsNotCalledALiquid() {
        double[] kv = {2.5e4, 150}; // E, η: E′ flat, E″ = ωη (a gel's solid plateau with viscous loss)
        org.viscarta.model.KelvinVoigt model = new org.viscarta.model.KelvinVoigt();
        FitResult r = new ModelFitter().fit("gel", new GeneralizedMaxwell(0), sweep((w, m) -> model.modulus(w, kv, m), 9, 0.02));
        assertFalse(r.variant().contains("liquid"), "a liquid fit is far worse here; the solid stays, flagged: " + r.variant());
    }
}
