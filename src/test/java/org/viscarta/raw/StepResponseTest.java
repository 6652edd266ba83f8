package org.viscarta.raw;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viscarta.analysis.Inputs;
import org.viscarta.analysis.ReadSettings;
import org.viscarta.fit.FitResult;
import org.viscarta.fit.ModelFitter;
import org.viscarta.io.InputException;
import org.viscarta.model.ModelCatalogue;
import org.viscarta.sweep.TimeTest;

/**
 * Raw step tests to M(t) and J(t): records made from a zener material with the contact laws of the
 * geometries (Sneddon's flat punch, Lee and Radok's step solution of the Hertz sphere) and
 * Boltzmann superposition over a linear ramp, converted and fitted back.
 */
@Tag("validation")
class StepResponseTest {

    @TempDir
    Path dir;

    private static final double ER = 4e3;
    private static final double E1 = 1.5e3;
    private static final double TAU = 0.2;

    private static double relaxation(double t) {
        return ER + E1 * Math.exp(-t / TAU);
    }

    /** ∫₀^u E(t − s) ds for the zener (closed form). */
    private static double rampIntegral(double t, double u) {
        return ER * u + E1 * TAU * (Math.exp(-(t - u) / TAU) - Math.exp(-t / TAU));
    }

    /** Sample times: 0.1 ms to 0.1 s, 1 ms to 1 s, 10 ms to 50 s. */
    private static List<Double> times() {
        List<Double> t = new ArrayList<>();
        for (int i = 0; i < 1000; i++) {
            t.add(i * 1e-4);
        }
        for (int i = 100; i < 1000; i++) {
            t.add(i * 1e-3);
        }
        for (int i = 100; i <= 5000; i++) {
            t.add(i * 1e-2);
        }
        return t;
    }

    private Path write(String name, String meta, List<double[]> rows) throws IOException {
        StringBuilder sb = new StringBuilder(meta).append("time [s],force [N],displacement [m]\n");
        for (double[] r : rows) {
            sb.append(String.format(Locale.ROOT, "%.9g,%.12g,%.12g%n", r[0], r[1], r[2]));
        }
        Path p = dir.resolve(name);
        Files.writeString(p, sb.toString());
        return p;
    }

    @Test
    void aFlatPunchRelaxationOverARampIsFittedBackToItsZener() throws IOException {
        // Sneddon: F = 2a E δ/(1 − ν²) for a flat punch; a linear ramp to δ0 in t_R, then held
        double a = 0.5e-3;
        double nu = 0.5;
        double k = 2 * a / (1 - nu * nu);
        double d0 = 20e-6;
        double tr = 5e-3;
        List<double[]> rows = new ArrayList<>();
        for (double t : times()) {
            double u = Math.min(t, tr);
            double force = t <= 0 ? 0 : k * (d0 / tr) * rampIntegral(t, u);
            rows.add(new double[] {t, force, d0 * Math.min(t / tr, 1)});
        }
        Path f = write("relax.csv", "# sample: gel\n# test: stress relaxation\n# geometry: flat punch; punch_radius: 0.5 mm; "
                + "poisson_ratio: 0.5\n# temperature: 23 °C\n", rows);
        Inputs in = Inputs.read(List.of(f), ReadSettings.defaults());
        assertEquals(1, in.timeTests().size());
        TimeTest t = in.timeTests().get(0);
        assertEquals(TimeTest.Type.RELAXATION, t.type());
        assertEquals(23.0, t.temperatureC(), 0);
        // long after the ramp the modulus is the zener's, whatever the ramp did
        TimeTest.Point last = t.points().get(t.points().size() - 1);
        assertEquals(relaxation(last.timeS()), last.value(), 1e-3 * ER, "E(t) late in the hold");
        FitResult fit = new ModelFitter().fitTime("gel", ModelCatalogue.byId("zener").orElseThrow(), t.type(), t.points());
        assertTrue(fit.converged(), fit.message());
        assertEquals(ER, fit.values()[0], 0.01 * ER, "E_r");
        assertEquals(E1, fit.values()[1], 0.03 * E1, "E_1 (the half-ramp shift leaves a small error near the ramp)");
        assertEquals(TAU, fit.values()[2], 0.03 * TAU, "tau");
        assertTrue(in.warnings().toString().contains("within ten ramp times"), in.warnings().toString());
        assertTrue(in.notes().toString().contains("log-spaced points"), in.notes().toString());
    }

    @Test
    void aSphereStepGivesTheRelaxationModulusOfLeeAndRadok() throws IOException {
        // Lee and Radok (1960): F(t) = 4 √R E(t) δ0^{3/2} / (3 (1 − ν²)) after a step of depth δ0
        double r = 50e-6;
        double nu = 0.45;
        double d0 = 4e-6;
        List<double[]> rows = new ArrayList<>();
        for (double t : times()) {
            double force = t <= 0 ? 0 : 4 * Math.sqrt(r) * relaxation(t) * Math.pow(d0, 1.5) / (3 * (1 - nu * nu));
            rows.add(new double[] {t, force, t <= 0 ? 0 : d0});
        }
        Path f = write("sphere.csv", "# test: relaxation\n# geometry: sphere; tip_radius: 50 µm; poisson_ratio: 0.45\n", rows);
        StepResponse.Converted c = StepResponse.convert(RawReader.read(f));
        assertEquals(0.0, c.rampTimeS(), 1e-12, "a step within one sample");
        for (TimeTest.Point p : c.test().points()) {
            // each point is a bin's mean: compare with the mean of the exact values of the same bin within 1e-3
            assertEquals(relaxation(p.timeS()), p.value(), 1.5e-3 * relaxation(p.timeS()), "E at " + p.timeS() + " s");
        }
    }

    @Test
    void aFlatPunchCreepGivesTheZenersCompliance() throws IOException {
        double a = 0.5e-3;
        double nu = 0.5;
        double k = 2 * a / (1 - nu * nu);
        double f0 = 0.01;
        double[] p = {ER, E1, TAU};
        org.viscarta.model.ViscoelasticModel z = ModelCatalogue.byId("zener").orElseThrow();
        List<double[]> rows = new ArrayList<>();
        for (double t : times()) {
            rows.add(new double[] {t, t <= 0 ? 0 : f0, t <= 0 ? 0 : f0 * z.creepCompliance(t, p) / k});
        }
        Path f = write("creep.csv", "# sample: gel\n# test: creep\n# geometry: flat punch; punch_radius: 0.5 mm; poisson_ratio: 0.5\n",
                rows);
        StepResponse.Converted c = StepResponse.convert(RawReader.read(f));
        assertEquals(TimeTest.Type.CREEP, c.test().type());
        for (TimeTest.Point pt : c.test().points()) {
            assertEquals(z.creepCompliance(pt.timeS(), p), pt.value(), 1e-3 * pt.value(), "J at " + pt.timeS() + " s");
        }
    }

    @Test
    void aConeOrARecordWithoutAHoldIsRefusedWithItsReason() throws IOException {
        List<double[]> rising = new ArrayList<>();
        for (int i = 0; i < 100; i++) {
            rising.add(new double[] {i * 0.01, 1e-3 * i, 1e-7 * i});
        }
        Path noHold = write("rising.csv", "# test: relaxation\n# geometry: flat punch; punch_radius: 0.5 mm; poisson_ratio: 0.5\n",
                rising);
        InputException e = assertThrows(InputException.class, () -> StepResponse.convert(RawReader.read(noHold)));
        assertTrue(e.getMessage().contains("is not held"), e.getMessage());
        List<double[]> step = new ArrayList<>();
        for (int i = 0; i < 100; i++) {
            step.add(new double[] {i * 0.01, i == 0 ? 0 : 1e-3, i == 0 ? 0 : 1e-6});
        }
        Path cone = write("cone.csv", "# test: relaxation\n# geometry: cone; half_angle: 70 deg; poisson_ratio: 0.5\n", step);
        InputException c = assertThrows(InputException.class, () -> StepResponse.convert(RawReader.read(cone)));
        assertTrue(c.getMessage().contains("cone is not converted"), c.getMessage());
    }
}
