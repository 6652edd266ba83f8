package org.viscarta.raw;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * The instrument phase between calibration frequencies. Closed form: a pure delay τ_d gives
 * φ(f) = 2π f τ_d, so τ_d = 0.5 ms gives 0.0314 rad at 10 Hz; interpolating 1, 100 and 1000 Hz in
 * log f instead put it at 0.159 rad there.
 */
@Tag("validation")
class CalibrationInterpolationTest {

    private static RawConverter.Calibration delay(double tau, double phi0, double... f) {
        double[] phase = new double[f.length];
        for (int i = 0; i < f.length; i++) {
            phase[i] = phi0 + 2 * Math.PI * f[i] * tau;
        }
        return new RawConverter.Calibration(f, phase);
    }

    @Test
    void aDelayBetweenCalibrationPointsIsInterpolatedExactly() {
        RawConverter.Calibration c = delay(0.5e-3, 0.0, 1, 100, 1000);
        assertEquals(2 * Math.PI * 10 * 0.5e-3, c.phaseAt(10), 1e-12, "0.0314 rad at 10 Hz");
        assertEquals(2 * Math.PI * 300 * 0.5e-3, c.phaseAt(300), 1e-12);
        assertEquals(0, c.phaseUncertainty(10), 1e-12, "the delay fits every point");
        RawConverter.Calibration offset = delay(0.2e-3, 0.01, 0.5, 2, 8, 32);
        assertEquals(0.01 + 2 * Math.PI * 5 * 0.2e-3, offset.phaseAt(5), 1e-12, "a constant plus a delay");
    }

    @Test
    void aPhaseThatIsNoDelayIsInterpolatedLinearlyInFrequencyWithAnUncertainty() {
        // φ = 0.05 log10 f + 0.1 at 1, 10, 100 Hz: no delay fits it
        RawConverter.Calibration c = new RawConverter.Calibration(new double[] {1, 10, 100}, new double[] {0.1, 0.15, 0.2});
        assertEquals(0.1 + 0.05 * (5 - 1) / 9.0, c.phaseAt(5), 1e-12, "linear in f between 1 and 10 Hz");
        double inLogF = 0.1 + 0.05 * Math.log10(5);
        assertEquals(Math.abs(c.phaseAt(5) - inLogF) / 2, c.phaseUncertainty(5), 1e-12);
        assertTrue(c.phaseUncertainty(5) > 0.005);
    }

    @Test
    void aDriveFrequencyBetweenWidelySpacedCalibrationPointsIsNamed() {
        RawConverter.Calibration c = delay(0.5e-3, 0.0, 1, 100, 200);
        double[] gap = c.wideGap(10);
        assertNotNull(gap);
        assertEquals(1, gap[0]);
        assertEquals(100, gap[1]);
        assertNull(c.wideGap(150), "100 and 200 Hz are close enough");
        assertNull(c.wideGap(100), "a calibration frequency itself");
    }
}
