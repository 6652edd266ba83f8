package org.viscarta.model;

import java.util.function.Function;
import org.apache.commons.math3.complex.Complex;

/**
 * Numerical inversion of a Laplace transform F(s) at t &gt; 0 by Talbot's method on the fixed
 * contour of Abate and Valkó:
 *
 * \[ f(t) \approx \frac{r}{M}\Big[\tfrac12 F(r)e^{rt} + \sum_{k=1}^{M-1}
 *    \mathrm{Re}\big(e^{t s(\theta_k)} F(s(\theta_k))(1 + i\sigma(\theta_k))\big)\Big],\quad
 *    s(\theta) = r\theta(\cot\theta + i),\ \sigma(\theta) = \theta + (\theta\cot\theta - 1)\cot\theta,\
 *    \theta_k = k\pi/M,\ r = 2M/(5t) \]
 *
 * F must be analytic to the right of, and on, the contour, with its singularities on the negative
 * real axis (branch cuts of s^α and poles of relaxation spectra lie there). With M = 24 the
 * truncation error is about 10^{−0.6M}, and double-precision rounding, amplified by e^{rt} = e^{2M/5},
 * limits the relative accuracy to about 1e-11.
 *
 * <p>Sources: Talbot, A. (1979), "The accurate numerical inversion of Laplace transforms",
 * J. Inst. Math. Appl. 23:97–120; Abate, J. &amp; Valkó, P. P. (2004), "Multi-precision Laplace
 * transform inversion", Int. J. Numer. Meth. Eng. 60:979–993. DOMAIN.md section 2 checks its
 * closed forms with this method (mpmath's 'talbot').
 */
public final class LaplaceInversion {

    private static final int M = 24;

    /** The contour's angles θ_k = kπ/M and, per angle, cot θ_k and σ(θ_k): the same for every t. */
    private static final double[] THETA = new double[M];
    private static final double[] COT = new double[M];
    private static final double[] SIGMA = new double[M];

    static {
        for (int k = 1; k < M; k++) {
            THETA[k] = k * Math.PI / M;
            COT[k] = Math.cos(THETA[k]) / Math.sin(THETA[k]);
            SIGMA[k] = THETA[k] + (THETA[k] * COT[k] - 1.0) * COT[k];
        }
    }

    /**
     * The nodes s_k and weights w_k = (r/M)·e^{t s_k}(1 + iσ_k) of one t, so that
     * f(t) ≈ (r/M)·½F(r)e^{rt} + Re Σ w_k F(s_k); they depend on t alone, and a fit evaluates the
     * same times again and again, so the last few are kept (per thread: fits run in parallel).
     */
    private record Nodes(Complex[] s, double[] wRe, double[] wIm, double w0) {
    }

    private static final int KEPT = 64;
    private static final ThreadLocal<java.util.LinkedHashMap<Double, Nodes>> NODES = ThreadLocal.withInitial(
            () -> new java.util.LinkedHashMap<>(KEPT * 2, 0.75f, true) {
                @Override
                protected boolean removeEldestEntry(java.util.Map.Entry<Double, Nodes> eldest) {
                    return size() > KEPT;
                }
            });

    private static Nodes nodes(double t) {
        java.util.LinkedHashMap<Double, Nodes> kept = NODES.get();
        Nodes n = kept.get(t);
        if (n == null) {
            double r = 2.0 * M / (5.0 * t);
            Complex[] s = new Complex[M];
            double[] wRe = new double[M];
            double[] wIm = new double[M];
            s[0] = new Complex(r, 0);
            for (int k = 1; k < M; k++) {
                double re = r * THETA[k] * COT[k];
                double im = r * THETA[k];
                s[k] = new Complex(re, im);
                // e^{t s}(1 + iσ) = e^{t·re}(cos(t·im) + i sin(t·im))(1 + iσ)
                double mag = Math.exp(t * re);
                double c = mag * Math.cos(t * im);
                double d = mag * Math.sin(t * im);
                wRe[k] = r / M * (c - d * SIGMA[k]);
                wIm[k] = r / M * (d + c * SIGMA[k]);
            }
            n = new Nodes(s, wRe, wIm, r / M * 0.5 * Math.exp(r * t));
            kept.put(t, n);
        }
        return n;
    }

    private LaplaceInversion() {
    }

    /** The contour's nodes s_0 … s_{M−1} for t (shared: do not change them). */
    static Complex[] nodesAt(double t) {
        return nodes(t).s();
    }

    /**
     * f(t) from the transform's values F(s_k) = fRe[k] + i·fIm[k] at the nodes of {@link #nodesAt}(t),
     * for callers that compute F at the nodes more cheaply than one call at a time.
     */
    static double invertValues(double t, double[] fRe, double[] fIm) {
        Nodes n = nodes(t);
        double sum = n.w0() * fRe[0];
        for (int k = 1; k < M; k++) {
            sum += n.wRe()[k] * fRe[k] - n.wIm()[k] * fIm[k]; // Re(w·F)
        }
        return sum;
    }

    /** f(t) for t &gt; 0. */
    public static double invert(Function<Complex, Complex> transform, double t) {
        if (!(t > 0) || Double.isInfinite(t)) {
            throw new IllegalArgumentException("time must be finite and > 0 s, got " + t);
        }
        Nodes n = nodes(t);
        double sum = n.w0() * transform.apply(n.s()[0]).getReal();
        for (int k = 1; k < M; k++) {
            Complex f = transform.apply(n.s()[k]);
            sum += n.wRe()[k] * f.getReal() - n.wIm()[k] * f.getImaginary(); // Re(w·F)
        }
        return sum;
    }
}
