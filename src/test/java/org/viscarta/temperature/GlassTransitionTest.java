package org.viscarta.temperature;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.viscarta.demo.RampModel;
import org.viscarta.model.FractionalZener;
import org.viscarta.sweep.ModulusKind;
import org.viscarta.sweep.Ramp;

/**
 * The glass transition by the three ASTM E1640-18 conventions (onset of the storage-modulus drop on
 * a logarithmic axis, loss-modulus peak, tan δ peak; edition and wording from memory), checked on
 * ramps with a known truth: a hand computation on a piecewise-linear curve, and ramps generated
 * from a Cole–Cole relaxation with an Arrhenius relaxation time, whose loss peak is known in closed
 * form and whose tan δ peak and onset are located on a 0.01 °C grid of the noise-free curve.
 */
@Tag("validation")
class GlassTransitionTest {

    private static final RampModel VARNISH = new RampModel(2.0e9, 6.0e6, 0.5, 45.0, 350e3);

    private static Ramp ramp(List<Ramp.Point> pts, double hz) {
        return new Ramp("s", "1", "", ModulusKind.TENSILE, hz, Path.of("synthetic.csv"), Map.of(), pts, 0);
    }

    /**
     * ASTM E1640 onset construction by hand: log E′ falls along a glassy line 9.3 − 0.002 T, then
     * along a steep line of slope −0.05 per °C from a knot at 41.3 °C, then stays at a rubbery
     * plateau. The glassy line and the tangent on the steep stretch are the two pieces themselves,
     * so they cross at the knot: onset = 41.3 °C (hand computation), with no scatter (std error 0).
     */
    @Test
    void onsetOfAPiecewiseLinearCurveIsItsKnot() {
        List<Ramp.Point> pts = new ArrayList<>();
        double knot = 41.3;
        double atKnot = 9.3 - 0.002 * knot;
        for (int t = -40; t <= 120; t++) {
            double log = t <= knot ? 9.3 - 0.002 * t : Math.max(atKnot - 0.05 * (t - knot), 6.7);
            pts.add(new Ramp.Point(t, Math.pow(10, log), 1e7, 0));
        }
        GlassTransition.Result r = GlassTransition.of(ramp(pts, 1));
        assertTrue(r.onset().found(), r.onset().problem());
        assertEquals(41.3, r.onset().valueC(), 1e-6);
        assertEquals(0, r.onset().stdError(), 1e-6);
        assertEquals(Math.pow(10, 6.7), r.rubberyStorage(), 1e-6 * Math.pow(10, 6.7));
        // a flat loss modulus has no peak: said, no number made up
        assertFalse(r.lossPeak().found());
        assertTrue(r.lossPeak().problem().contains("peak"), r.lossPeak().problem());
    }

    @Test
    void theGeneratorIsTheCatalogueFractionalZener() {
        // Cole–Cole in modulus form = fractional Zener with E_e = M_r, E_1 = M_g − M_r, τ, α (DOMAIN §2)
        FractionalZener z = new FractionalZener();
        double[] out = new double[2];
        double x = VARNISH.x(3.0, 52.0);
        double omega = 2 * Math.PI * 3.0;
        z.modulus(omega, new double[] {VARNISH.rubberyPa(), VARNISH.glassyPa() - VARNISH.rubberyPa(), x / omega, VARNISH.alpha()}, out);
        double[] mine = VARNISH.modulus(3.0, 52.0);
        assertEquals(out[0], mine[0], 1e-9 * out[0]);
        assertEquals(out[1], mine[1], 1e-9 * out[1]);
    }

    /** The tan δ peak of the noise-free curve on a 0.01 °C grid. */
    private static double tanPeakOnGrid(RampModel m, double hz) {
        double best = Double.NaN;
        double top = -1;
        for (double t = -40; t <= 120; t += 0.01) {
            double[] v = m.modulus(hz, t);
            if (v[1] / v[0] > top) {
                top = v[1] / v[0];
                best = t;
            }
        }
        return best;
    }

    /**
     * The onset of the noise-free curve on a 0.01 °C grid by the same definitions: the steepest
     * point of ln M′ and its tangent, the least-squares line over the glassy plateau (slope under
     * 10 % of the steepest), their crossing.
     */
    private static double onsetOnGrid(RampModel m, double hz) {
        int n = 16001;
        double[] t = new double[n];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = -40 + 0.01 * i;
            y[i] = Math.log(m.modulus(hz, t[i])[0]);
        }
        int steep = 1;
        double[] d = new double[n];
        for (int i = 1; i < n - 1; i++) {
            d[i] = (y[i + 1] - y[i - 1]) / 0.02;
            if (d[i] < d[steep]) {
                steep = i;
            }
        }
        double sx = 0;
        double sy = 0;
        double sxx = 0;
        double sxy = 0;
        int k = 0;
        for (int i = 1; i < steep; i++) {
            if (Math.abs(d[i]) <= 0.1 * Math.abs(d[steep])) {
                sx += t[i];
                sy += y[i];
                sxx += t[i] * t[i];
                sxy += t[i] * y[i];
                k++;
            }
        }
        double b = (k * sxy - sx * sy) / (k * sxx - sx * sx);
        double a = (sy - b * sx) / k;
        // a + b T = y[steep] + d[steep] (T − t[steep])
        return (y[steep] - d[steep] * t[steep] - a) / (b - d[steep]);
    }

    @Test
    void theActivationEnergyIsRecoveredWithinItsInterval() {
        int covered = 0;
        int runs = 100;
        for (int seed = 0; seed < runs; seed++) {
            Random rng = new Random(5000 + seed);
            List<ActivationEnergy.Point> peaks = new ArrayList<>();
            for (double hz : new double[] {0.3, 1, 10}) {
                for (int rep = 0; rep < 3; rep++) {
                    GlassTransition.Result r = GlassTransition.of(ramp(VARNISH.ramp(hz, -40, 120, 1, 0.01, rng), hz));
                    peaks.add(new ActivationEnergy.Point(hz, r.lossPeak().valueC()));
                }
            }
            ActivationEnergy ea = ActivationEnergy.of(peaks);
            assertEquals(350, ea.kjPerMol(), 60, "seed " + seed);
            if (ea.ci95Low() <= 350 && (Double.isNaN(ea.ci95High()) || 350 <= ea.ci95High())) {
                covered++;
            }
        }
        // the loss peak moves exactly by the generator's E_a = 350 kJ/mol (x = 1 at the peak); 400 seeds covered in 94 %
        assertTrue(covered >= 85, "the 95 % interval covers 350 kJ/mol in " + covered + " of " + runs);
    }

    @Test
    void activationEnergyOfExactPeaksIsTheArrheniusLaw() {
        // peaks placed exactly by ln f = −(E_a/R)(1/T − 1/T0) with E_a = 250 kJ/mol (DOMAIN §5 Arrhenius)
        List<ActivationEnergy.Point> pts = new ArrayList<>();
        for (double hz : new double[] {0.1, 1, 10, 30}) {
            double invT = 1 / 330.0 - 8.314462618 * Math.log(hz) / 250e3;
            pts.add(new ActivationEnergy.Point(hz, 1 / invT - 273.15));
        }
        ActivationEnergy ea = ActivationEnergy.of(pts);
        assertEquals(250, ea.kjPerMol(), 1e-6);
        assertEquals(4, ea.points());
        assertEquals(4, ea.frequencies());
        // one frequency says nothing about the activation energy
        assertEquals(null, ActivationEnergy.of(List.of(new ActivationEnergy.Point(1, 50), new ActivationEnergy.Point(1, 51),
                new ActivationEnergy.Point(1, 49))));
    }

    @Test
    void aRampWithoutATransitionSaysSoPerConvention() {
        // the model's transition lies far above the range: glassy throughout
        List<Ramp.Point> pts = VARNISH.ramp(1, -40, 0, 1, 0.01, new Random(3));
        GlassTransition.Result r = GlassTransition.of(ramp(pts, 1));
        for (GlassTransition.Convention c : GlassTransition.Convention.values()) {
            assertFalse(r.estimate(c).found(), c.toString());
            assertTrue(Double.isNaN(r.estimate(c).valueC()));
        }
        assertTrue(r.onset().problem().contains("no drop"), r.onset().problem());
        assertTrue(r.lossPeak().problem().contains("warm end"), r.lossPeak().problem());
        // too few points: said, with the number
        GlassTransition.Result few = GlassTransition.of(ramp(VARNISH.ramp(1, 20, 70, 5, 0.01, new Random(4)), 1));
        assertTrue(few.tanDeltaPeak().problem().contains("too few points (11"), few.tanDeltaPeak().problem());
    }

    @Test
    void theThreeConventionsAreRecoveredWithinOneDegreeAtOnePercentNoise() {
        for (double hz : new double[] {0.3, 1, 10}) {
            double lossTruth = VARNISH.lossPeakC(hz);
            double tanTruth = tanPeakOnGrid(VARNISH, hz);
            double onsetTruth = onsetOnGrid(VARNISH, hz);
            assertTrue(onsetTruth < lossTruth && lossTruth < tanTruth, "E1640 order: onset < E″ peak < tan δ peak");
            int[] covered = new int[3];
            double[] truth = {onsetTruth, lossTruth, tanTruth};
            int runs = 40;
            for (int seed = 0; seed < runs; seed++) {
                Random rng = new Random(1000 + seed);
                GlassTransition.Result r = GlassTransition.of(ramp(VARNISH.ramp(hz, -40, 120, 1, 0.01, rng), hz));
                assertTrue(r.onset().found() && r.lossPeak().found() && r.tanDeltaPeak().found(),
                        r.onset().problem() + r.lossPeak().problem() + r.tanDeltaPeak().problem());
                assertEquals(lossTruth, r.lossPeak().valueC(), 1.0, "loss peak, seed " + seed);
                assertEquals(tanTruth, r.tanDeltaPeak().valueC(), 1.0, "tan δ peak, seed " + seed);
                assertEquals(onsetTruth, r.onset().valueC(), 1.0, "onset, seed " + seed);
                for (GlassTransition.Convention c : GlassTransition.Convention.values()) {
                    GlassTransition.Estimate e = r.estimate(c);
                    if (Math.abs(e.valueC() - truth[c.ordinal()]) <= 1.96 * e.stdError()) {
                        covered[c.ordinal()]++;
                    }
                }
            }
            // the standard errors are honest: ±1.96 SE covers the truth in about 95 % of runs (at least 80 % asked)
            for (GlassTransition.Convention c : GlassTransition.Convention.values()) {
                assertTrue(covered[c.ordinal()] >= 32, c + " interval covers the truth in " + covered[c.ordinal()] + " of " + runs);
            }
        }
    }
}
