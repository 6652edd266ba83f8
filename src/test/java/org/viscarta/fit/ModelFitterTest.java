package org.viscarta.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.viscarta.model.KelvinVoigt;
import org.viscarta.model.Maxwell;
import org.viscarta.model.ModelCatalogue;
import org.viscarta.model.Springpot;
import org.viscarta.model.ViscoelasticModel;
import org.viscarta.model.Zener;
import org.viscarta.sweep.SweepPoint;

/**
 * Numerical self-checks of the model fitter: exact recovery from noise-free data, recovery within
 * the reported intervals from noisy data, and the coverage of those intervals over many seeded
 * trials. The truth is known because the data are made here from the model.
 */
@Tag("self-check")
class ModelFitterTest {

    private static final ModelFitter FITTER = new ModelFitter();

    private static List<SweepPoint> sweep(ViscoelasticModel m, double[] p, double noise, SplittableRandom rng,
                                          double fLo, double fHi, int n) {
        List<SweepPoint> pts = new ArrayList<>();
        double[] out = new double[2];
        for (int i = 0; i < n; i++) {
            double f = n == 1 ? fLo : fLo * Math.pow(fHi / fLo, i / (double) (n - 1));
            m.modulus(2 * Math.PI * f, p, out);
            double e1 = noise == 0 ? 1 : Math.exp(noise * rng.nextGaussian());
            double e2 = noise == 0 ? 1 : Math.exp(noise * rng.nextGaussian());
            pts.add(new SweepPoint(f, out[0] * e1, out[1] * e2, 0));
        }
        return pts;
    }

    @Test
    void recoversEveryModelExactlyFromNoiseFreeData() {
        Map<ViscoelasticModel, double[]> truths = Map.of(
                new Springpot(), new double[] {5.0e4, 0.23},
                new Maxwell(), new double[] {2.0e5, 0.05},
                new KelvinVoigt(), new double[] {3.0e4, 800},
                new Zener(), new double[] {1.0e6, 4.0e6, 0.3});
        for (Map.Entry<ViscoelasticModel, double[]> e : truths.entrySet()) {
            FitResult r = FITTER.fit("s", e.getKey(), sweep(e.getKey(), e.getValue(), 0, null, 0.05, 50, 15));
            assertTrue(r.converged(), e.getKey().id() + ": " + r.message());
            for (int j = 0; j < e.getValue().length; j++) {
                assertEquals(e.getValue()[j], r.parameters().get(j).value(), 1e-6 * e.getValue()[j],
                        e.getKey().id() + " " + r.parameters().get(j).name());
            }
        }
    }

    @Test
    void noisyZenerSweepIsRecoveredWithinItsReportedIntervals() {
        // 2 % log-normal noise on 20 frequencies, 0.01–100 Hz, relaxation inside the window.
        double[] truth = {2.0e5, 8.0e5, 0.02};
        FitResult r = FITTER.fit("zener-test", new Zener(), sweep(new Zener(), truth, 0.02, new SplittableRandom(11), 0.01, 100, 20));
        assertTrue(r.converged(), r.message());
        for (int j = 0; j < truth.length; j++) {
            ParameterEstimate p = r.parameters().get(j);
            assertTrue(p.intervalContains(truth[j]), p.name() + " = " + truth[j] + " outside [" + p.ci95Low() + ", " + p.ci95High() + "]");
            assertFalse(p.undetermined(), p.note());
        }
    }

    @Test
    void intervalsCoverTheTruthAboutNinetyFivePercentOfTheTime() {
        // 300 seeded noisy zener sweeps: each interval should contain the truth in ~95 % of trials.
        // Binomial sd at n = 300, p = 0.95 is 1.26 %; accept 0.90–0.99 (about ±4 sd).
        double[] truth = {1.0e4, 3.0e4, 0.5};
        SplittableRandom rng = new SplittableRandom(2026);
        int[] hits = new int[3];
        int trials = 300;
        for (int t = 0; t < trials; t++) {
            FitResult r = FITTER.fit("s", new Zener(), sweep(new Zener(), truth, 0.03, rng, 0.02, 20, 16));
            for (int j = 0; j < 3; j++) {
                if (r.parameters().get(j).intervalContains(truth[j])) {
                    hits[j]++;
                }
            }
        }
        for (int j = 0; j < 3; j++) {
            double coverage = hits[j] / (double) trials;
            assertTrue(coverage > 0.90 && coverage < 0.99, "coverage of parameter " + j + ": " + coverage);
        }
    }

    @Test
    void flagsARelaxationTimeFarOutsideTheWindow() {
        // Maxwell with τ = 1000 s measured at 1–100 Hz: only the terminal tail is seen.
        double[] truth = {1.0e5, 1000};
        FitResult r = FITTER.fit("s", new Maxwell(), sweep(new Maxwell(), truth, 0.01, new SplittableRandom(3), 1, 100, 12));
        assertTrue(r.converged(), r.message());
        assertTrue(r.parameter("tau").orElseThrow().undetermined(), "tau should be flagged");
    }

    @Test
    void tooFewPointsIsAFailedFitNotAnException() {
        FitResult r = FITTER.fit("s", new Zener(), sweep(new Zener(), new double[] {1, 2, 3}, 0, null, 1, 2, 1));
        assertFalse(r.converged());
        assertTrue(r.message().contains("too few"), r.message());
    }

    @Test
    void everyCatalogueModelHasStartValuesOfTheRightLength() {
        List<SweepPoint> pts = sweep(new Zener(), new double[] {1e3, 2e3, 1}, 0, null, 0.1, 10, 8);
        for (ViscoelasticModel m : ModelCatalogue.all()) {
            for (double[] s : m.startValues(pts)) {
                assertEquals(m.parameterCount(), s.length, m.id());
            }
        }
    }
}
