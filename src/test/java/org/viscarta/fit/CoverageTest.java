package org.viscarta.fit;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.stream.Stream;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.viscarta.model.ModelCatalogue;
import org.viscarta.model.ViscoelasticModel;
import org.viscarta.sweep.SweepPoint;

/**
 * Numerical self-check: for every model, 200 seeded noisy sweeps (20 frequencies, 0.01–100 Hz,
 * 3 % log-normal noise on each modulus) made from known parameters inside the window; each
 * parameter's reported 95 % interval must contain the truth in at least 90 % of the trials
 * (a coverage test, not a single draw; the binomial sd at 95 % and n = 200 is 1.5 %).
 */
@Tag("self-check")
class CoverageTest {

    private static final int TRIALS = 200;
    private static final double MIN_COVERAGE = 0.90;

    static Stream<Arguments> truths() {
        return Stream.of(
                Arguments.of("springpot", new double[] {1e4, 0.3}),
                Arguments.of("empirical-power-law", new double[] {1e4, 0.2, 2e3, 0.4}),
                Arguments.of("springpot-dashpot", new double[] {1e4, 0.2, 5}),
                Arguments.of("maxwell", new double[] {1e5, 0.05}),
                Arguments.of("kelvin-voigt", new double[] {1e4, 50}),
                Arguments.of("zener", new double[] {1e4, 3e4, 0.05}),
                Arguments.of("burgers", new double[] {1e5, 1e4, 5e4, 5e2}),
                Arguments.of("generalized-maxwell:2", new double[] {1e3, 1e4, 5e3, 0.01, 1}),
                Arguments.of("fractional-kelvin-voigt", new double[] {1e4, 3e3, 0.4}),
                Arguments.of("fractional-maxwell", new double[] {1e5, 0.05, 0.6}),
                Arguments.of("fractional-zener", new double[] {1e4, 3e4, 0.05, 0.6}));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("truths")
    void intervalsCoverTheTruth(String id, double[] truth) {
        ViscoelasticModel m = ModelCatalogue.byId(id).orElseThrow();
        SplittableRandom rng = new SplittableRandom(id.hashCode());
        ModelFitter fitter = new ModelFitter();
        int[] hits = new int[truth.length];
        int converged = 0;
        double[] out = new double[2];
        for (int t = 0; t < TRIALS; t++) {
            List<SweepPoint> pts = new ArrayList<>();
            for (int i = 0; i < 20; i++) {
                double f = 0.01 * Math.pow(1e4, i / 19.0);
                m.modulus(2 * Math.PI * f, truth, out);
                pts.add(new SweepPoint(f, out[0] * Math.exp(0.03 * rng.nextGaussian()), out[1] * Math.exp(0.03 * rng.nextGaussian()), 0));
            }
            FitResult r = fitter.fit("s", m, pts);
            if (!r.converged()) {
                continue;
            }
            converged++;
            for (int j = 0; j < truth.length; j++) {
                if (r.parameters().get(j).intervalContains(truth[j])) {
                    hits[j]++;
                }
            }
        }
        StringBuilder report = new StringBuilder(String.format(Locale.ROOT, "%s: %d/%d converged; coverage", id, converged, TRIALS));
        for (int j = 0; j < truth.length; j++) {
            report.append(String.format(Locale.ROOT, " %s %.3f", m.parameters().get(j).name(), hits[j] / (double) TRIALS));
        }
        System.out.println(report);
        for (int j = 0; j < truth.length; j++) {
            assertTrue(hits[j] / (double) TRIALS >= MIN_COVERAGE, report.toString());
        }
    }
}
