package org.viscarta.quality;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.viscarta.model.Zener;
import org.viscarta.sweep.ModulusKind;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;

/** The plain checks of a sweep on cases of known verdict. */
@Tag("regression")
class SweepChecksTest {

    private static Sweep zener(int points, double fromHz, double toHz, double noise, boolean negativeLoss) {
        SplittableRandom rng = new SplittableRandom(5);
        List<SweepPoint> pts = new ArrayList<>();
        double[] m = new double[2];
        for (int i = 0; i < points; i++) {
            double f = fromHz * Math.pow(toHz / fromHz, i / (points - 1.0));
            new Zener().modulus(2 * Math.PI * f, new double[] {1e4, 3e4, 0.1}, m);
            double loss = negativeLoss && i == 3 ? -m[1] : m[1] * Math.exp(noise * rng.nextGaussian());
            pts.add(new SweepPoint(f, m[0] * Math.exp(noise * rng.nextGaussian()), loss, i + 2));
        }
        return new Sweep("s", "1", "", ModulusKind.TENSILE, 23, Path.of("s.csv"), Map.of(), pts);
    }

    private static SweepChecks.Check find(List<SweepChecks.Check> checks, String id) {
        return checks.stream().filter(c -> c.check().equals(id)).findFirst().orElseThrow();
    }

    @Test
    void aGoodSweepPassesAndItsNoiseIsMeasured() {
        List<SweepChecks.Check> c = SweepChecks.of(zener(31, 0.01, 100, 0.02, false));
        for (SweepChecks.Check k : c) {
            assertEquals(Verdict.PASS, k.verdict(), k.check() + ": " + k.message());
        }
        assertEquals(2, find(c, "noise").value(), 0.8, "2 % noise on each modulus, in %");
        assertEquals(4, find(c, "frequency-span").value(), 1e-9);
        assertEquals(7.5, find(c, "points-per-decade").value(), 1e-9);
    }

    @Test
    void narrowSparseAndNegativeSweepsAreNamed() {
        List<SweepChecks.Check> narrow = SweepChecks.of(zener(9, 1, 5, 0.02, false));
        assertEquals(Verdict.WARN, find(narrow, "frequency-span").verdict());
        List<SweepChecks.Check> sparse = SweepChecks.of(zener(5, 0.01, 100, 0.02, false));
        assertEquals(Verdict.WARN, find(sparse, "points-per-decade").verdict());
        List<SweepChecks.Check> negative = SweepChecks.of(zener(31, 0.01, 100, 0.02, true));
        assertEquals(Verdict.FAIL, find(negative, "loss-modulus-sign").verdict());
        assertEquals(1, find(negative, "loss-modulus-sign").value());
    }
}
