package org.viscarta.compare;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.viscarta.model.Springpot;
import org.viscarta.sweep.SweepPoint;

/**
 * Loss tangent at a reference frequency. A power law (springpot, DOMAIN.md 2.2) is a straight line in
 * log–log axes, so log–log interpolation between any two of its points must reproduce it exactly
 * (to rounding), and its tan δ must equal tan(απ/2).
 */
@Tag("validation")
class LossTangentAtTest {

    private static List<SweepPoint> springpotSweep(double c, double alpha, double... freqs) {
        List<SweepPoint> pts = new ArrayList<>();
        double[] out = new double[2];
        for (double f : freqs) {
            new Springpot().modulus(2 * Math.PI * f, new double[] {c, alpha}, out);
            pts.add(new SweepPoint(f, out[0], out[1], 0));
        }
        return pts;
    }

    @Test
    void logLogInterpolationIsExactForAPowerLaw() {
        List<SweepPoint> pts = springpotSweep(5000, 0.3, 0.1, 0.37, 2.2, 20);
        LossTangentAt.Value v = LossTangentAt.interpolate(pts, 1.0).orElseThrow();
        double[] exact = new double[2];
        new Springpot().modulus(2 * Math.PI, new double[] {5000, 0.3}, exact);
        assertEquals(exact[0], v.storage(), 1e-12 * exact[0]);
        assertEquals(exact[1], v.loss(), 1e-12 * exact[1]);
        assertEquals(Math.tan(0.3 * Math.PI / 2), v.lossTangent(), 1e-12);
    }

    @Test
    void interpolatesLinearlyInLogBetweenNeighbours() {
        // Two points, one decade apart; at the geometric mean the log-interpolated moduli are geometric means.
        List<SweepPoint> pts = List.of(new SweepPoint(1, 100, 10, 0), new SweepPoint(10, 400, 90, 0));
        LossTangentAt.Value v = LossTangentAt.interpolate(pts, Math.sqrt(10)).orElseThrow();
        assertEquals(200, v.storage(), 1e-9);
        assertEquals(30, v.loss(), 1e-9);
    }

    @Test
    void usesAMeasuredPointAsIs() {
        List<SweepPoint> pts = List.of(new SweepPoint(0.5, 100, 10, 0), new SweepPoint(1, 120, 30, 0), new SweepPoint(2, 150, 20, 0));
        assertEquals(0.25, LossTangentAt.interpolate(pts, 1).orElseThrow().lossTangent(), 0);
    }

    @Test
    void reportsNothingOutsideTheMeasuredRange() {
        List<SweepPoint> pts = springpotSweep(5000, 0.3, 0.1, 1, 10);
        assertTrue(LossTangentAt.interpolate(pts, 0.05).isEmpty());
        assertTrue(LossTangentAt.interpolate(pts, 10.5).isEmpty());
    }
}
