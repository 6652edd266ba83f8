package org.viscarta.model;

import org.apache.commons.math3.special.Gamma;

/**
 * The two-parameter Mittag-Leffler function on the negative real axis,
 *
 * \[ E_{\alpha,\beta}(z) = \sum_{k\ge0} \frac{z^k}{\Gamma(\alpha k + \beta)},\qquad z \le 0,\ 0 &lt; \alpha \le 1,\ \beta &gt; 0, \]
 *
 * which gives the relaxation and creep functions of the fractional models. Evaluated through its
 * Laplace pair L{t^{β−1} E_{α,β}(−λt^α)}(s) = s^{α−β}/(s^α + λ) (Podlubny 1999, Fractional
 * Differential Equations, Academic Press): at t = 1 and λ = −z, E_{α,β}(z) is the inverse transform
 * of s^{α−β}/(s^α − z), computed by {@link LaplaceInversion} (Talbot's contour; the same route
 * DOMAIN.md's check values took in 40-digit arithmetic). For |z| ≤ 0.5 the power series is used
 * instead (its terms fall at least as fast as 0.5^k/Γ(αk + β), no cancellation). Relative
 * accuracy about 1e-10; checked against DOMAIN.md section 10.1.
 *
 * <p>The power series must not be used for large negative arguments: at α = 0.3, z = −10 its terms
 * reach e^{2000} (DOMAIN.md section 2.3).
 */
public final class MittagLeffler {

    private static final double SERIES_RADIUS = 0.5;

    private MittagLeffler() {
    }

    /** E_α(z) = E_{α,1}(z). */
    public static double evaluate(double alpha, double z) {
        return evaluate(alpha, 1.0, z);
    }

    /**
     * @param alpha in (0, 1]
     * @param beta  &gt; 0
     * @param z     ≤ 0
     */
    public static double evaluate(double alpha, double beta, double z) {
        if (!(alpha > 0 && alpha <= 1)) {
            throw new IllegalArgumentException("alpha must lie in (0, 1], got " + alpha);
        }
        if (!(beta > 0) || Double.isInfinite(beta)) {
            throw new IllegalArgumentException("beta must be finite and > 0, got " + beta);
        }
        if (!(z <= 0) || Double.isInfinite(z)) {
            throw new IllegalArgumentException("z must be finite and <= 0, got " + z);
        }
        if (alpha == 1.0 && beta == 1.0) {
            return Math.exp(z);
        }
        if (-z <= SERIES_RADIUS) {
            return series(alpha, beta, z);
        }
        return inverted(powers(alpha, beta), -z);
    }

    /**
     * s_k^α and s_k^{α−β} at the contour's nodes for t = 1: they depend on α and β alone, and a fit
     * evaluates one (α, β) at every time of a test (only λ = −z changes), so the last few pairs are
     * kept per thread. Powers on the principal branch, |s|^a·e^{i a arg s}, as Complex.pow takes them.
     */
    private record Powers(double alpha, double beta, double[] aRe, double[] aIm, double[] bRe, double[] bIm) {
    }

    private static final int KEPT = 4;

    /** The pairs kept by one thread, and which one the next new pair replaces. */
    private static final class Recent {
        final Powers[] kept = new Powers[KEPT];
        int next;
    }

    private static final ThreadLocal<Recent> RECENT = ThreadLocal.withInitial(Recent::new);

    private static Powers powers(double alpha, double beta) {
        Recent recent = RECENT.get();
        for (Powers p : recent.kept) {
            if (p != null && p.alpha() == alpha && p.beta() == beta) {
                return p;
            }
        }
        org.apache.commons.math3.complex.Complex[] s = LaplaceInversion.nodesAt(1.0);
        int m = s.length;
        double[] aRe = new double[m];
        double[] aIm = new double[m];
        double[] bRe = new double[m];
        double[] bIm = new double[m];
        for (int k = 0; k < m; k++) {
            double logAbs = Math.log(Math.hypot(s[k].getReal(), s[k].getImaginary()));
            double arg = Math.atan2(s[k].getImaginary(), s[k].getReal());
            double ma = Math.exp(alpha * logAbs);
            aRe[k] = ma * Math.cos(alpha * arg);
            aIm[k] = ma * Math.sin(alpha * arg);
            double mb = Math.exp((alpha - beta) * logAbs);
            bRe[k] = mb * Math.cos((alpha - beta) * arg);
            bIm[k] = mb * Math.sin((alpha - beta) * arg);
        }
        Powers p = new Powers(alpha, beta, aRe, aIm, bRe, bIm);
        recent.kept[recent.next] = p;
        recent.next = (recent.next + 1) % KEPT;
        return p;
    }

    /** The inverse transform of s^{α−β}/(s^α + λ) at t = 1. */
    private static double inverted(Powers p, double lambda) {
        int m = p.aRe().length;
        double[] fRe = new double[m];
        double[] fIm = new double[m];
        for (int k = 0; k < m; k++) {
            double c = p.aRe()[k] + lambda;
            double d = p.aIm()[k];
            double den = c * c + d * d;
            fRe[k] = (p.bRe()[k] * c + p.bIm()[k] * d) / den;
            fIm[k] = (p.bIm()[k] * c - p.bRe()[k] * d) / den;
        }
        return LaplaceInversion.invertValues(1.0, fRe, fIm);
    }

    private static double series(double alpha, double beta, double z) {
        double sum = 0;
        double zk = 1;
        for (int k = 0; k < 200; k++) {
            double term = zk / Gamma.gamma(alpha * k + beta);
            sum += term;
            if (Math.abs(term) < 1e-17 * Math.abs(sum) && k > 2) {
                break;
            }
            zk *= z;
        }
        return sum;
    }

}
