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

    private LaplaceInversion() {
    }

    /** f(t) for t &gt; 0. */
    public static double invert(Function<Complex, Complex> transform, double t) {
        if (!(t > 0) || Double.isInfinite(t)) {
            throw new IllegalArgumentException("time must be finite and > 0 s, got " + t);
        }
        double r = 2.0 * M / (5.0 * t);
        double sum = 0.5 * transform.apply(new Complex(r, 0)).getReal() * Math.exp(r * t);
        for (int k = 1; k < M; k++) {
            double theta = k * Math.PI / M;
            double cot = Math.cos(theta) / Math.sin(theta);
            Complex s = new Complex(r * theta * cot, r * theta);
            double sigma = theta + (theta * cot - 1.0) * cot;
            Complex term = s.multiply(t).exp().multiply(transform.apply(s)).multiply(new Complex(1.0, sigma));
            sum += term.getReal();
        }
        return r / M * sum;
    }
}
