package org.viscarta.quality;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.viscarta.model.ModelCatalogue;
import org.viscarta.model.ViscoelasticModel;
import org.viscarta.model.Zener;
import org.viscarta.sweep.SweepPoint;

/**
 * The Kramers–Kronig check: sweeps made from every material model of the catalogue (each a linear,
 * causal material; closed forms of DOMAIN.md; the descriptive power law is none) pass at 2 % noise; a loss modulus raised by 30 % over part of
 * the band (as a phase error would) fails, and the failing band is named.
 */
@Tag("validation")
class KramersKronigTest {

    private static List<SweepPoint> sweep(ViscoelasticModel model, double[] p, long seed, double noise) {
        SplittableRandom rng = new SplittableRandom(seed);
        List<SweepPoint> out = new ArrayList<>();
        double[] m = new double[2];
        for (int i = 0; i < 31; i++) {
            double f = 0.01 * Math.pow(1e4, i / 30.0);
            model.modulus(2 * Math.PI * f, p, m);
            out.add(new SweepPoint(f, m[0] * Math.exp(noise * rng.nextGaussian()), m[1] * Math.exp(noise * rng.nextGaussian()), i + 2));
        }
        return out;
    }

    @Test
    void sweepsOfEveryModelInTheCataloguePass() {
        // plausible parameters for every model: each of its own data-derived starts on a zener-like sweep
        List<SweepPoint> base = sweep(new Zener(), new double[] {1e4, 3e4, 0.1}, 1, 0);
        int checked = 0;
        for (ViscoelasticModel family : ModelCatalogue.all()) {
            ViscoelasticModel model = family.variants().get(0);
            if (!model.hasTimeDomain()) {
                // the empirical power law gives E′ and E″ independent exponents: a description of a curve, not a
                // causal material (Kramers–Kronig ties the exponents together), so it is rightly no reference here
                assertEquals("empirical-power-law", model.id());
                continue;
            }
            for (double[] p : model.startValues(base)) {
                KramersKronig.Result r = KramersKronig.check(sweep(model, p, 7 + checked, 0.02));
                assertEquals(Verdict.PASS, r.verdict(), model.id() + " " + java.util.Arrays.toString(p) + ": " + r.message());
                checked++;
            }
        }
        assertTrue(checked >= ModelCatalogue.all().size() - 1, checked + " sweeps");
    }

    @Test
    void aLossModulusDistortedOverPartOfTheBandFails() {
        List<SweepPoint> good = sweep(new Zener(), new double[] {1e4, 3e4, 0.1}, 3, 0.02);
        List<SweepPoint> bad = new ArrayList<>();
        for (SweepPoint p : good) {
            boolean hit = p.frequencyHz() >= 2 && p.frequencyHz() <= 20;
            bad.add(new SweepPoint(p.frequencyHz(), p.storage(), p.loss() * (hit ? 1.3 : 1), p.line()));
        }
        KramersKronig.Result r = KramersKronig.check(bad);
        assertEquals(Verdict.FAIL, r.verdict(), r.message());
        assertTrue(r.fromHz() >= 0.5 && r.toHz() <= 80, "the band named lies around the distorted one: " + r.fromHz() + "–" + r.toHz());
        assertEquals(Verdict.PASS, KramersKronig.check(good).verdict(), KramersKronig.check(good).message());
    }
}
