package org.viscarta.quality;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.function.DoubleUnaryOperator;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.viscarta.sweep.ModulusKind;
import org.viscarta.sweep.Quantity;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;

/** Amplitude sweeps, replicate outliers and film thickness on cases of known answer. */
@Tag("regression")
class LinearityAndReplicatesTest {

    private static final double E0 = 2.0e4;

    /** An amplitude sweep at 1 Hz, strain 0.01–100 % at ten points a decade, E′ = E0·shape(γ), E″ = E′·tanDelta(γ). */
    private static Sweep amplitudeSweep(DoubleUnaryOperator shape, DoubleUnaryOperator tanDelta, double noise, long seed) {
        SplittableRandom rng = new SplittableRandom(seed);
        List<SweepPoint> pts = new ArrayList<>();
        for (int i = 0; i <= 40; i++) {
            double strain = 1e-4 * Math.pow(10, i / 10.0);
            double e1 = E0 * shape.applyAsDouble(strain) * Math.exp(noise * gaussian(rng));
            double e2 = E0 * shape.applyAsDouble(strain) * tanDelta.applyAsDouble(strain) * Math.exp(noise * gaussian(rng));
            pts.add(new SweepPoint(1.0, e1, e2, i + 3, strain));
        }
        return new Sweep("gel", "1", "", ModulusKind.SHEAR, 23, Path.of("gel-amplitude.csv"),
                Map.of(Sweep.AMPLITUDE_COLUMN, "strain_amplitude"), pts);
    }

    private static double gaussian(SplittableRandom rng) {
        return Math.sqrt(-2 * Math.log(1 - rng.nextDouble())) * Math.cos(2 * Math.PI * rng.nextDouble());
    }

    @Test
    void theLimitOfKnownSofteningCurvesIsFoundWithinFivePercent() {
        double gc = 0.05; // 5 % strain
        // E′/E0 = 1/sqrt(1 + (γ/γc)²): 0.95 at (γ/γc)² = 1/0.95² − 1, γ = 0.328684 γc (solved by hand)
        Sweep a = amplitudeSweep(g -> 1 / Math.sqrt(1 + (g / gc) * (g / gc)), g -> 0.1 * (1 + (g / gc) * (g / gc)), 0, 1);
        assertTrue(a.isAmplitudeSweep());
        LinearRange.Result r = LinearRange.of(a, 0.05);
        double truth = gc * Math.sqrt(1 / (0.95 * 0.95) - 1);
        assertEquals(truth, r.limit(), 0.05 * truth, "5 % limit");
        // E″/E′ = 0.1 (1 + (γ/γc)²) reaches 1 at (γ/γc)² = 9: γ = 3 γc = 15 %
        assertEquals(3 * gc, r.crossover(), 0.05 * 3 * gc, "crossover");
        assertEquals(E0, r.plateauStorage(), 0.005 * E0);
        assertEquals(0.1 * E0, r.plateauLoss(), 0.005 * 0.1 * E0);
        // a user's 10 %: 1/0.9² − 1
        LinearRange.Result r10 = LinearRange.of(a, 0.10);
        double truth10 = gc * Math.sqrt(1 / (0.9 * 0.9) - 1);
        assertEquals(truth10, r10.limit(), 0.05 * truth10, "10 % limit");
        // Gaussian softening E′/E0 = exp(−(γ/γc)²): 0.95 at γ = sqrt(−ln 0.95) γc. Both shapes start quadratically, as
        // the first departure from linearity is even in the amplitude (medium-amplitude oscillatory shear theory)
        Sweep b = amplitudeSweep(g -> Math.exp(-(g / gc) * (g / gc)), g -> 0.2, 0, 2);
        LinearRange.Result rb = LinearRange.of(b, 0.05);
        double truthB = Math.sqrt(-Math.log(0.95)) * gc;
        assertEquals(truthB, rb.limit(), 0.05 * truthB);
        assertTrue(Double.isNaN(rb.crossover()), "tan δ stays 0.2: no crossover");
    }

    @Test
    void withHalfAPercentNoiseTheLimitStaysWithinTenPercent() {
        double gc = 0.05;
        double truth = gc * Math.sqrt(1 / (0.95 * 0.95) - 1);
        for (long seed = 1; seed <= 20; seed++) {
            Sweep a = amplitudeSweep(g -> 1 / Math.sqrt(1 + (g / gc) * (g / gc)), g -> 0.1, 0.005, seed);
            LinearRange.Result r = LinearRange.of(a, 0.05);
            assertEquals(truth, r.limit(), 0.10 * truth, "seed " + seed);
        }
    }

    @Test
    void aSweepLinearThroughoutOrWithoutPlateauIsSaidSo() {
        LinearRange.Result flat = LinearRange.of(amplitudeSweep(g -> 1, g -> 0.1, 0, 3), 0.05);
        assertTrue(flat.linearThroughout());
        // starts softening at once: E′ falls 10 % a step from the first point
        LinearRange.Result none = LinearRange.of(amplitudeSweep(g -> Math.pow(g / 1e-4, -0.5), g -> 0.1, 0, 4), 0.05);
        assertFalse(none.hasPlateau());
        Map<String, List<Sweep>> noSamples = new LinkedHashMap<>();
        Assessment as = Assessment.of(noSamples, List.of(amplitudeSweep(g -> Math.pow(g / 1e-4, -0.5), g -> 0.1, 0, 4)), 0.05);
        assertEquals(Verdict.WARN, as.checks().get(0).verdict());
        assertEquals("linear-range", as.checks().get(0).check());
    }

    /** A frequency sweep of sample "gel": E′ = E0·exp(offset)·(f/1 Hz)^0.1, strain amplitude stated. */
    private static Sweep frequencySweep(String replicate, double offset, double strain) {
        List<SweepPoint> pts = new ArrayList<>();
        for (int i = 0; i <= 20; i++) {
            double f = 0.1 * Math.pow(10, i / 10.0);
            double e1 = E0 * Math.exp(offset) * Math.pow(f, 0.1);
            pts.add(new SweepPoint(f, e1, 0.15 * e1, i + 3, strain));
        }
        return new Sweep("gel", replicate, "", ModulusKind.SHEAR, 23, Path.of("gel-" + replicate + ".csv"),
                Map.of(Sweep.AMPLITUDE_COLUMN, "strain_amplitude"), pts);
    }

    @Test
    void aFrequencySweepAboveTheLinearLimitFails() {
        double gc = 0.05;
        Sweep a = amplitudeSweep(g -> 1 / Math.sqrt(1 + (g / gc) * (g / gc)), g -> 0.1, 0, 1);
        double limit = LinearRange.of(a, 0.05).limit(); // about 1.64 % strain
        Map<String, List<Sweep>> samples = new LinkedHashMap<>();
        samples.put("gel", List.of(frequencySweep("1", 0, 0.01), frequencySweep("2", 0, 0.03)));
        Assessment as = Assessment.of(samples, List.of(a), 0.05);
        List<SweepChecks.Check> lr = as.checks().stream().filter(c -> c.check().equals("linear-range")).toList();
        assertEquals(3, lr.size(), "two frequency sweeps and the amplitude sweep");
        assertEquals(Verdict.PASS, lr.get(0).verdict(), lr.get(0).message());
        assertEquals(1.0, lr.get(0).value(), 1e-12, "1 % strain, written in %");
        assertEquals(100 * limit, lr.get(0).limit(), 1e-9);
        assertEquals(Verdict.FAIL, lr.get(1).verdict(), lr.get(1).message());
        assertEquals(100 * limit, lr.get(2).value(), 1e-9, "the amplitude sweep's row: its limit in %");
        assertEquals("fail: linear-range (replicate 2)", as.marker("gel"));
    }

    private static List<SweepChecks.Check> outliers(double... offsets) {
        List<Sweep> reps = new ArrayList<>();
        for (int i = 0; i < offsets.length; i++) {
            reps.add(frequencySweep(Integer.toString(i + 1), offsets[i], Double.NaN));
        }
        return ReplicateOutliers.of(reps);
    }

    @Test
    void theOutlierRuleOnHandCheckedSets() {
        // offsets in ln modulus 0, 0.02, 0.5: median 0.02, MAD 0.02 → floored to 0.05;
        // replicate 3: M = 0.6745 × 0.48 / 0.05 = 6.475 > 3.5; replicate 1: 0.6745 × 0.02 / 0.05 = 0.2698
        List<SweepChecks.Check> three = outliers(0, 0.02, 0.5);
        assertEquals(6.4752, three.get(2).value(), 1e-3);
        assertEquals(Verdict.WARN, three.get(2).verdict());
        assertEquals(0.2698, three.get(0).value(), 1e-3);
        assertEquals(Verdict.PASS, three.get(0).verdict());
        assertTrue(three.get(2).message().contains("above"), three.get(2).message());
        // five replicates 0, 0.03, −0.03, 0.06, x: median 0.03, MAD 0.03 → 0.05; x = 0.2: M = 0.6745 × 0.17 / 0.05 = 2.293 (kept),
        // x = 0.3: M = 0.6745 × 0.27 / 0.05 = 3.642 (flagged)
        assertEquals(2.2933, outliers(0, 0.03, -0.03, 0.06, 0.2).get(4).value(), 1e-3);
        assertEquals(Verdict.PASS, outliers(0, 0.03, -0.03, 0.06, 0.2).get(4).verdict());
        assertEquals(3.6423, outliers(0, 0.03, -0.03, 0.06, 0.3).get(4).value(), 1e-3);
        assertEquals(Verdict.WARN, outliers(0, 0.03, -0.03, 0.06, 0.3).get(4).verdict());
        assertTrue(outliers(0, 0.5).isEmpty(), "two replicates: no rule");
    }

    private static Sweep film(Map<String, String> metadata, Map<String, String> attributes) {
        List<SweepPoint> pts = List.of(new SweepPoint(1, 1e7, 1e6, 2), new SweepPoint(10, 1.2e7, 1.1e6, 3));
        return new Sweep("film", "1", "", ModulusKind.TENSILE, 23, Path.of("film.csv"), metadata, pts, attributes);
    }

    @Test
    void filmThicknessAgainstTheTenPercentRule() {
        SweepChecks.Check thin = FilmThickness.of(film(Map.of("thickness", "30 µm", "indentation_depth", "4 µm"), Map.of())).orElseThrow();
        assertEquals(Verdict.WARN, thin.verdict());
        assertEquals(100 * 4.0 / 30, thin.value(), 1e-9);
        assertEquals(10, thin.limit());
        SweepChecks.Check thick = FilmThickness.of(film(Map.of("indentation_depth", "4 µm"), Map.of("thickness [µm]", "80"))).orElseThrow();
        assertEquals(Verdict.PASS, thick.verdict());
        assertEquals(5, thick.value(), 1e-9);
        // a sphere's depth from its contact radius: a = 10 µm, R = 50 µm, δ = a²/R = 2 µm in a 15 µm film: 13.3 %
        SweepChecks.Check hertz = FilmThickness.of(film(Map.of("film_thickness", "0.015 mm", "contact_radius", "10 µm",
                "tip_radius", "50 µm"), Map.of())).orElseThrow();
        assertEquals(100 * 2.0 / 15, hertz.value(), 1e-9);
        assertEquals(Verdict.WARN, hertz.verdict());
        assertTrue(FilmThickness.of(film(Map.of("indentation_depth", "4 µm"), Map.of())).isEmpty(), "no thickness, no check");
        assertTrue(FilmThickness.of(film(Map.of("thickness", "30", "indentation_depth", "4 µm"), Map.of())).isEmpty(),
                "a thickness without unit is not guessed");
    }
}
