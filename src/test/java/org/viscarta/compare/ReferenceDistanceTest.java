package org.viscarta.compare;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.viscarta.fit.ModelFitter;
import org.viscarta.model.ModelCatalogue;
import org.viscarta.model.Springpot;
import org.viscarta.model.ViscoelasticModel;
import org.viscarta.model.Zener;
import org.viscarta.sweep.ModulusKind;
import org.viscarta.sweep.SweepPoint;

/** Properties of the reference distance, and nearest references found for materials of known make. */
@Tag("self-check")
class ReferenceDistanceTest {

    private static final ReferenceDistance RD = new ReferenceDistance(ReferenceDistance.Metric.MODULI, 1, 2);

    private static FittedCurve curve(String name, ViscoelasticModel m, double[] p, double lo, double hi, double noise, long seed) {
        SplittableRandom rng = new SplittableRandom(seed);
        List<SweepPoint> pts = new ArrayList<>();
        double[] out = new double[2];
        for (int i = 0; i < 15; i++) {
            double f = lo * Math.pow(hi / lo, i / 14.0);
            m.modulus(2 * Math.PI * f, p, out);
            pts.add(new SweepPoint(f, out[0] * Math.exp(noise * rng.nextGaussian()), out[1] * Math.exp(noise * rng.nextGaussian()), 0));
        }
        return FittedCurve.fit(name, pts, ModelCatalogue.all(), new ModelFitter(), 23, ModulusKind.TENSILE).orElseThrow();
    }

    @Test
    void aMaterialIsAtDistanceZeroFromItself() {
        FittedCurve a = curve("a", new Zener(), new double[] {1e4, 3e4, 0.05}, 0.1, 10, 0.02, 1);
        assertEquals(0, RD.between(a, a).distance(), 1e-15);
    }

    @Test
    void distanceIsSymmetric() {
        FittedCurve a = curve("a", new Zener(), new double[] {1e4, 3e4, 0.05}, 0.1, 10, 0.02, 1);
        FittedCurve b = curve("b", new Springpot(), new double[] {2e4, 0.2}, 0.05, 20, 0.02, 2);
        ReferenceDistance.Result ab = RD.between(a, b);
        ReferenceDistance.Result ba = RD.between(b, a);
        assertEquals(ab.distance(), ba.distance(), 1e-12);
        assertEquals(ab.uncertainty(), ba.uncertainty(), 1e-9);
        assertEquals(0.1, ab.bandLowHz(), 1e-12);
        assertEquals(10, ab.bandHighHz(), 1e-9);
    }

    @Test
    void aUniformFactorOfTenIsOneDecade() {
        // every modulus ×10 ⇒ log10 differences all 1 ⇒ RMS distance exactly 1 decade (definition)
        FittedCurve a = curve("a", new Springpot(), new double[] {1e4, 0.2}, 0.1, 10, 0, 1);
        FittedCurve b = curve("b", new Springpot(), new double[] {1e5, 0.2}, 0.1, 10, 0, 1);
        assertEquals(1.0, RD.between(a, b).distance(), 1e-9);
    }

    @Test
    void shortOverlapOrOtherBasisIsNotComparable() {
        FittedCurve a = curve("a", new Springpot(), new double[] {1e4, 0.2}, 0.1, 1, 0.02, 1);
        FittedCurve b = curve("b", new Springpot(), new double[] {1e4, 0.2}, 0.5, 50, 0.02, 2);
        ReferenceDistance.Result r = RD.between(a, b);
        assertFalse(r.comparable());
        assertTrue(r.note().contains("overlap over 0.30 decades"), r.note());
        FittedCurve g = new FittedCurve("g", a.model(), a.params(), a.covariance(), 0.1, 1, 23, ModulusKind.SHEAR);
        assertTrue(RD.between(a, g).note().contains("--basis"));
    }

    @Test
    void flagsATemperatureDifference() {
        FittedCurve a = curve("a", new Springpot(), new double[] {1e4, 0.2}, 0.1, 10, 0.02, 1);
        FittedCurve warm = new FittedCurve("w", a.model(), a.params(), a.covariance(), 0.1, 10, 37, ModulusKind.TENSILE);
        assertTrue(RD.between(a, warm).note().contains("14 °C apart"), RD.between(a, warm).note());
    }

    @Test
    void findsTheReferenceAMaterialWasMadeLike() {
        // References of known make; each sample is a noisy remake of one of them.
        double[][] zeners = {{1e4, 3e4, 0.05}, {1e4, 3e4, 0.5}, {3e4, 1e4, 0.05}, {1e4, 1e4, 0.01}};
        List<Matcher.Candidate> refs = new ArrayList<>();
        for (int k = 0; k < zeners.length; k++) {
            refs.add(new Matcher.Candidate("ref" + k, "gel", curve("ref" + k, new Zener(), zeners[k], 0.05, 20, 0.02, 10 + k)));
        }
        for (int k = 0; k < zeners.length; k++) {
            FittedCurve sample = curve("s" + k, new Zener(), zeners[k], 0.1, 10, 0.03, 100 + k);
            List<Matcher.Match> ranked = Matcher.rank("s" + k, sample, refs, RD);
            assertEquals("ref" + k, ranked.get(0).reference(), "sample made like ref" + k);
            assertEquals(1, ranked.get(0).rank());
        }
    }

    /**
     * Standard errors computed for the closest few only: the ranking, distances, bands and
     * departures are those of the full computation, the few closest carry the same standard errors
     * (bit for bit: the same arithmetic), the rest none. And a second comparison reusing the curves'
     * grids gives the same numbers as the first.
     */
    @Test
    void uncertaintiesForTheClosestFewChangeNothingElse() {
        FittedCurve sample = curve("s", new Zener(), new double[] {1e4, 3e4, 0.05}, 0.1, 10, 0.02, 1);
        List<Matcher.Candidate> refs = new ArrayList<>();
        for (int k = 0; k < 8; k++) {
            refs.add(new Matcher.Candidate("r" + k, "", curve("r" + k, new Zener(), new double[] {1e4 * (1 + 0.2 * k), 3e4, 0.05 * (1 + k)},
                    0.05, 20, 0.02, 10 + k)));
        }
        List<Matcher.Match> all = Matcher.rank("s", sample, refs, new ReferenceDistance(ReferenceDistance.Metric.ALL, 1, 2));
        ReferenceDistance shared = new ReferenceDistance(ReferenceDistance.Metric.ALL, 1, 2);
        Matcher.rank("s", sample, refs, shared, 3); // fills the grids
        List<Matcher.Match> few = Matcher.rank("s", sample, refs, shared, 3);
        assertEquals(all.size(), few.size());
        for (int i = 0; i < all.size(); i++) {
            ReferenceDistance.Result a = all.get(i).result();
            ReferenceDistance.Result f = few.get(i).result();
            assertEquals(all.get(i).reference(), few.get(i).reference(), "rank " + (i + 1));
            assertEquals(a.distance(), f.distance(), 0.0);
            assertEquals(a.departure(), f.departure(), 0.0);
            assertEquals(a.departureHz(), f.departureHz(), 0.0);
            assertTrue(Double.isFinite(a.uncertainty()));
            if (i < 3) {
                assertEquals(a.uncertainty(), f.uncertainty(), 0.0);
            } else {
                assertTrue(Double.isNaN(f.uncertainty()), "not computed beyond the closest 3");
            }
        }
    }
}
