package org.viscarta.raw;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.DecompositionSolver;
import org.apache.commons.math3.linear.QRDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;

/**
 * Amplitude and phase of a sampled signal at a known drive frequency: the least-squares fit
 *
 * \[ y_k = c_0 + c_1 (t_k - \bar t) + \sum_{n=1}^{3} \big(a_n\cos(n\omega t_k) + b_n\sin(n\omega t_k)\big) + e_k \]
 *
 * solved by QR of the design matrix with centred time, over the samples given (the caller trims to
 * an integer number of cycles after the settling ones). The phasor of the fundamental is
 * Ŷ = a_1 − i b_1, so y ≈ Re{Ŷ e^{iωt}}, amplitude |Ŷ| and phase atan2(−b_1, a_1); standard errors from
 * s²(XᵀX)⁻¹; the total harmonic distortion THD = sqrt(A_2² + A_3²)/A_1. This is the IEEE Std 1057 /
 * 1241 three-parameter (known-frequency) sine fit with drift and harmonic regressors (Händel 2000,
 * IEEE Trans. Instrum. Meas. 49:1189–1193; DOMAIN.md section 5.1).
 */
public final class Demodulator {

    /** Harmonics fitted, the fundamental included. */
    static final int HARMONICS = 3;

    /**
     * The fundamental and distortion of one channel.
     *
     * @param amplitude    |Ŷ|
     * @param phase        arg Ŷ [rad]
     * @param re           Re Ŷ = a_1
     * @param im           Im Ŷ = −b_1
     * @param seRe         standard error of a_1
     * @param seIm         standard error of b_1
     * @param distortion   THD relative to the fundamental
     * @param secondHarmonic A_2/A_1
     * @param covReIm      covariance of Re Ŷ and Im Ŷ
     */
    public record Phasor(double amplitude, double phase, double re, double im, double seRe, double seIm, double distortion,
                         double secondHarmonic, double covReIm) {
    }

    private Demodulator() {
    }

    public static Phasor fit(double[] t, double[] y, double frequencyHz) {
        int n = t.length;
        int p = 2 + 2 * HARMONICS;
        if (n <= p) {
            throw new IllegalArgumentException("too few samples (" + n + ") to fit " + p + " terms");
        }
        double mean = 0;
        for (double v : t) {
            mean += v / n;
        }
        double w = 2 * Math.PI * frequencyHz;
        double[][] x = new double[n][p];
        for (int k = 0; k < n; k++) {
            x[k][0] = 1;
            x[k][1] = t[k] - mean;
            for (int h = 1; h <= HARMONICS; h++) {
                x[k][2 * h] = Math.cos(h * w * t[k]);
                x[k][2 * h + 1] = Math.sin(h * w * t[k]);
            }
        }
        RealMatrix xm = new Array2DRowRealMatrix(x, false);
        DecompositionSolver solver = new QRDecomposition(xm).getSolver();
        RealVector c = solver.solve(new ArrayRealVector(y, false));
        double rss = 0;
        for (int k = 0; k < n; k++) {
            double fitted = 0;
            for (int j = 0; j < p; j++) {
                fitted += x[k][j] * c.getEntry(j);
            }
            rss += (y[k] - fitted) * (y[k] - fitted);
        }
        double s2 = rss / (n - p);
        RealMatrix inv = new QRDecomposition(xm.transpose().multiply(xm)).getSolver().getInverse();
        double a1 = c.getEntry(2);
        double b1 = c.getEntry(3);
        double amp1 = Math.hypot(a1, b1);
        double harm = 0;
        double amp2 = Math.hypot(c.getEntry(4), c.getEntry(5));
        for (int h = 2; h <= HARMONICS; h++) {
            double a = Math.hypot(c.getEntry(2 * h), c.getEntry(2 * h + 1));
            harm += a * a;
        }
        return new Phasor(amp1, Math.atan2(-b1, a1), a1, -b1, Math.sqrt(s2 * inv.getEntry(2, 2)), Math.sqrt(s2 * inv.getEntry(3, 3)),
                Math.sqrt(harm) / amp1, amp2 / amp1, -s2 * inv.getEntry(2, 3)); // Im Ŷ = −b_1
    }
}
