package org.viscarta.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.viscarta.model.KelvinVoigt;
import org.viscarta.model.Zener;
import org.viscarta.sweep.SweepPoint;

/**
 * Derived quantities carry the same "not determined by the data" flag as parameters. Closed forms
 * (DOMAIN.md, standard linear solid): loss peak at f = sqrt(E_r / (E_r + E_1)) / (2π τ), peak
 * tan δ = E_1 / (2 sqrt(E_r (E_r + E_1))); a Kelvin–Voigt solid is the zener limit E_1 → ∞, τ → 0,
 * whose loss peak lies at infinite frequency.
 */
@Tag("validation")
class DerivedFlagsTest {

    private static List<SweepPoint> sweep(java.util.function.BiConsumer<Double, double[]> model, long seed) {
        Random rng = new Random(seed);
        List<SweepPoint> pts = new ArrayList<>();
        double[] m = new double[2];
        for (int i = 0; i < 15; i++) {
            double f = 0.1 * Math.pow(100, i / 14.0);
            model.accept(2 * Math.PI * f, m);
            pts.add(new SweepPoint(f, m[0] * Math.exp(0.02 * rng.nextGaussian()), m[1] * Math.exp(0.02 * rng.nextGaussian()), i + 2));
        }
        return pts;
    }

    @Test
    void aLossPeakInsideTheWindowIsReportedAndUnflagged() {
        double[] p = {1e4, 3e4, 0.05};
        FitResult r = new ModelFitter(Weighting.LOG).fit("s", new Zener(), sweep((w, m) -> new Zener().modulus(w, p, m), 3));
        DerivedEstimate peak = r.derived().stream().filter(d -> d.name().equals("loss_peak_frequency")).findFirst().orElseThrow();
        double closedForm = Math.sqrt(p[0] / (p[0] + p[1])) / (2 * Math.PI * p[2]); // 1.59 Hz
        assertEquals(closedForm, peak.value(), 0.05 * closedForm, "within the 2 % noise of the data");
        assertFalse(peak.undetermined(), peak.note());
        assertFalse(r.undetermined(), "every zener parameter is determined");
    }

    @Test
    void aZenerFittedToAKelvinVoigtSolidHasItsLossPeakFlagged() {
        double[] kv = {2.5e4, 150}; // E, η: E″ = ωη rises through the window, no peak
        FitResult r = new ModelFitter(Weighting.LOG).fit("s", new Zener(), sweep((w, m) -> new KelvinVoigt().modulus(w, kv, m), 5));
        assertTrue(r.converged(), r.message());
        DerivedEstimate peak = r.derived().stream().filter(d -> d.name().equals("loss_peak_frequency")).findFirst().orElseThrow();
        assertTrue(peak.value() > 10 * 10, "the fitted peak runs off beyond ten times the highest frequency: " + peak.value());
        assertTrue(peak.undetermined() && peak.note().contains("outside the measured frequencies"), peak.note());
        DerivedEstimate tanMax = r.derived().stream().filter(d -> d.name().equals("loss_tangent_max")).findFirst().orElseThrow();
        assertTrue(tanMax.undetermined(), "a peak height of " + tanMax.value() + " is not a property these data show");
        assertTrue(r.undetermined(), "the degenerate zener's parameters are flagged, so 'best supported' carries the flag");
    }

    @Test
    void timesAndFrequenciesAreJudgedAgainstTheMeasuredWindow() {
        double[] window = {2 * Math.PI * 0.1, 2 * Math.PI * 10}; // 0.1–10 Hz
        assertEquals("", ModelFitter.derivedFlag("Hz", 50, 1, window));
        assertTrue(ModelFitter.derivedFlag("Hz", 101, 1, window).contains("outside"));
        assertTrue(ModelFitter.derivedFlag("Hz", 0.009, 0.0001, window).contains("outside"));
        assertEquals("", ModelFitter.derivedFlag("s", 10, 1, window)); // 1/ω reaches 1.59 s; ten times more is 15.9 s
        assertTrue(ModelFitter.derivedFlag("s", 20, 1, window).contains("outside"));
        assertTrue(ModelFitter.derivedFlag("Pa", 1e4, 2e4, window).contains("larger than the value"));
        assertTrue(ModelFitter.derivedFlag("Pa", 1e4, Double.NaN, window).contains("cannot be computed"));
        // a value that overflowed (a time made of a parameter that ran off toward zero) is left blank: its note says why
        assertTrue(ModelFitter.derivedFlag("s", Double.POSITIVE_INFINITY, Double.NaN, window)
                .startsWith("not determined by the data: it comes out infinite"));
        assertEquals("", ModelFitter.derivedFlag("Hz", Double.NaN, Double.NaN, window), "not defined for these parameters");
    }
}
