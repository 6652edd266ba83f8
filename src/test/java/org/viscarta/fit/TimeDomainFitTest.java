package org.viscarta.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.stream.Stream;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.viscarta.model.ModelCatalogue;
import org.viscarta.model.ViscoelasticModel;
import org.viscarta.sweep.SweepPoint;
import org.viscarta.sweep.TimeTest;

/**
 * Fits of time-domain tests: SciPy's least_squares on the same data and objective (script and
 * output in src/test/resources/scipy/time_domain_fits.*), the truth of every model with a time
 * domain recovered within its intervals from relaxation and creep data made from it, and a
 * relaxation test and a frequency sweep of one material giving the same tan δ at 1 Hz.
 */
@Tag("validation")
class TimeDomainFitTest {

    private static List<String[]> scipyRows() throws IOException {
        List<String[]> rows = new ArrayList<>();
        for (String line : Files.readAllLines(Path.of("src/test/resources/scipy/time_domain_data.csv")).subList(1, 31)) {
            rows.add(line.split(","));
        }
        return rows;
    }

    private static double[] scipy(String name) throws IOException {
        for (String line : Files.readAllLines(Path.of("src/test/resources/scipy/time_domain_fits.txt"))) {
            if (line.startsWith(name)) {
                String[] parts = line.substring(name.length()).trim().split(" ");
                double[] v = new double[parts.length - 1];
                for (int i = 0; i < parts.length - 2; i++) {
                    v[i] = Double.parseDouble(parts[i]);
                }
                v[v.length - 1] = Double.parseDouble(parts[parts.length - 1]);
                return v;
            }
        }
        throw new AssertionError(name + " not in the fixture");
    }

    @Test
    void fitsAgreeWithScipyOnTheSameDataAndObjective() throws IOException {
        List<TimeTest.Point> relax = new ArrayList<>();
        List<TimeTest.Point> creep = new ArrayList<>();
        int line = 2;
        for (String[] r : scipyRows()) {
            relax.add(new TimeTest.Point(Double.parseDouble(r[0]), Double.parseDouble(r[1]), line));
            creep.add(new TimeTest.Point(Double.parseDouble(r[0]), Double.parseDouble(r[2]), line++));
        }
        ModelFitter fitter = new ModelFitter();
        FitResult z = fitter.fitTime("z", ModelCatalogue.byId("zener").orElseThrow(), TimeTest.Type.RELAXATION, relax);
        double[] zs = scipy("zener relaxation");
        FitResult b = fitter.fitTime("b", ModelCatalogue.byId("burgers").orElseThrow(), TimeTest.Type.CREEP, creep);
        double[] bs = scipy("burgers creep");
        for (Object[] c : new Object[][] {{z, zs}, {b, bs}}) {
            FitResult f = (FitResult) c[0];
            double[] s = (double[]) c[1];
            assertTrue(f.converged(), f.message());
            for (int j = 0; j < s.length - 1; j++) {
                assertEquals(s[j], f.values()[j], 1e-5 * Math.abs(s[j]), f.model() + " parameter " + j);
            }
            assertEquals(s[s.length - 1], f.rss(), 1e-6 * s[s.length - 1], f.model() + " RSS");
            assertEquals(30, f.n());
        }
    }

    static Stream<Arguments> truths() {
        return Stream.of(
                Arguments.of("springpot", new double[] {1e4, 0.3}, true, true),
                // its dashpot, too, acts only at t = 0 in relaxation, so only creep determines eta
                Arguments.of("springpot-dashpot", new double[] {1e4, 0.2, 5}, false, true),
                Arguments.of("maxwell", new double[] {1e5, 0.05}, true, true),
                // a Kelvin–Voigt solid relaxes to its spring at once (the dashpot is a Dirac at t = 0): creep only
                Arguments.of("kelvin-voigt", new double[] {1e4, 50}, false, true),
                Arguments.of("zener", new double[] {1e4, 3e4, 0.05}, true, true),
                Arguments.of("burgers", new double[] {1e5, 1e4, 5e4, 5e2}, true, true),
                Arguments.of("fractional-kelvin-voigt", new double[] {1e4, 3e3, 0.4}, true, true),
                Arguments.of("fractional-maxwell", new double[] {1e5, 0.05, 0.6}, true, true),
                Arguments.of("fractional-zener", new double[] {1e4, 3e4, 0.05, 0.6}, true, true));
    }

    @ParameterizedTest
    @MethodSource("truths")
    void theTruthIsRecoveredWithinItsIntervals(String id, double[] truth, boolean relaxation, boolean creep) {
        ViscoelasticModel m = ModelCatalogue.byId(id).orElseThrow();
        ModelFitter fitter = new ModelFitter();
        for (TimeTest.Type type : TimeTest.Type.values()) {
            if (type == TimeTest.Type.RELAXATION ? !relaxation : !creep) {
                continue;
            }
            SplittableRandom rng = new SplittableRandom(id.hashCode() + type.ordinal());
            int runs = 20;
            int[] covered = new int[truth.length];
            for (int k = 0; k < runs; k++) {
                List<TimeTest.Point> pts = new ArrayList<>();
                for (int i = 0; i < 30; i++) {
                    double t = 0.005 * Math.pow(1e4, i / 29.0);
                    double v = type == TimeTest.Type.RELAXATION ? m.relaxationModulus(t, truth) : m.creepCompliance(t, truth);
                    if (type == TimeTest.Type.RELAXATION && v < 1e-3 * m.relaxationModulus(0.005, truth)) {
                        break; // a liquid's relaxation is recorded until it has fallen a thousandfold, not to nothing
                    }
                    pts.add(new TimeTest.Point(t, v * Math.exp(0.02 * gaussian(rng)), 0));
                }
                FitResult f = fitter.fitTime(id, m, type, pts);
                assertTrue(f.converged(), id + " " + type + ": " + f.message());
                for (int j = 0; j < truth.length; j++) {
                    ParameterEstimate e = f.parameters().get(j);
                    if (e.ci95Low() <= truth[j] && truth[j] <= e.ci95High()) {
                        covered[j]++;
                    }
                }
            }
            for (int j = 0; j < truth.length; j++) {
                // nominal 95 %: 19 of 20 expected; 15 of 20 or fewer would be P < 0.003 for a true 95 % interval
                assertTrue(covered[j] >= 16, id + " " + type + " parameter " + j + ": " + covered[j] + " of " + runs);
            }
        }
    }

    private static double gaussian(SplittableRandom rng) {
        double u = rng.nextDouble();
        double v = rng.nextDouble();
        return Math.sqrt(-2 * Math.log(1 - u)) * Math.cos(2 * Math.PI * v);
    }

    @Test
    void aRelaxationTestAndASweepOfOneMaterialGiveTheSameTanDeltaAt1Hz() {
        // the same zener material measured both ways, 2 % noise each
        double[] truth = {1e4, 3e4, 0.05};
        ViscoelasticModel m = ModelCatalogue.byId("zener").orElseThrow();
        SplittableRandom rng = new SplittableRandom(11);
        List<TimeTest.Point> relax = new ArrayList<>();
        for (int i = 0; i < 30; i++) {
            double t = 0.005 * Math.pow(1e4, i / 29.0);
            relax.add(new TimeTest.Point(t, m.relaxationModulus(t, truth) * Math.exp(0.02 * gaussian(rng)), 0));
        }
        List<SweepPoint> sweep = new ArrayList<>();
        double[] out = new double[2];
        for (int i = 0; i < 15; i++) {
            double f = 0.1 * Math.pow(100, i / 14.0);
            m.modulus(2 * Math.PI * f, truth, out);
            sweep.add(new SweepPoint(f, out[0] * Math.exp(0.02 * gaussian(rng)), out[1] * Math.exp(0.02 * gaussian(rng)), 0));
        }
        ModelFitter fitter = new ModelFitter();
        FitResult a = fitter.fitTime("relax", m, TimeTest.Type.RELAXATION, relax);
        FitResult b = fitter.fit("sweep", m, sweep);
        double[] ta = tanDelta(a);
        double[] tb = tanDelta(b);
        m.modulus(2 * Math.PI, truth, out);
        double exact = out[1] / out[0];
        assertEquals(ta[0], tb[0], 3 * Math.hypot(ta[1], tb[1]), "relaxation " + ta[0] + " ± " + ta[1] + ", sweep " + tb[0] + " ± " + tb[1]);
        assertEquals(exact, ta[0], 3 * ta[1], "the relaxation test's tan δ holds the truth");
        assertFalse(ta[1] > 0.2 * ta[0], "and is pinned down: " + ta[1]);
    }

    /** tan δ at 1 Hz of a fit, with its delta-method standard error. */
    private static double[] tanDelta(FitResult f) {
        double[] p = f.values();
        double[] out = new double[2];
        java.util.function.ToDoubleFunction<double[]> g = x -> {
            f.fitted().modulus(2 * Math.PI, x, out);
            return out[1] / out[0];
        };
        double v = g.applyAsDouble(p);
        double[] grad = DeltaMethod.gradient(g, p, 1e-6, 1e-12);
        return new double[] {v, Math.sqrt(DeltaMethod.variance(grad, f.covariance()))};
    }
}
