package org.viscarta.fit;

import java.util.function.ToDoubleFunction;

/**
 * The delta method, the one implementation behind every propagated uncertainty (derived
 * quantities of a fit, the model bands of the figures, reference distances): for y = g(θ) with
 * parameter covariance C,
 * \[ \operatorname{Var}(y) \approx \nabla g^\mathsf{T} \, C \, \nabla g, \]
 * the gradient taken by central differences. Source: Seber &amp; Wild, Nonlinear Regression
 * (Wiley 1989), section 5.1; DOMAIN.md section 8.
 */
public final class DeltaMethod {

    private DeltaMethod() {
    }

    /**
     * Central-difference gradient of f at x, with steps h_j = relativeStep · max(|x_j|, floor).
     * The truncation error is O(h²).
     */
    public static double[] gradient(ToDoubleFunction<double[]> f, double[] x, double relativeStep, double floor) {
        double[] g = new double[x.length];
        for (int j = 0; j < x.length; j++) {
            double h = relativeStep * Math.max(Math.abs(x[j]), floor);
            double[] up = x.clone();
            double[] dn = x.clone();
            up[j] += h;
            dn[j] -= h;
            g[j] = (f.applyAsDouble(up) - f.applyAsDouble(dn)) / (2 * h);
        }
        return g;
    }

    /** gᵀ C g. */
    public static double variance(double[] g, double[][] c) {
        double var = 0;
        for (int i = 0; i < g.length; i++) {
            for (int j = 0; j < g.length; j++) {
                var += g[i] * c[i][j] * g[j];
            }
        }
        return var;
    }

    /** √(gᵀ C g); NaN when C is unknown (null) or the quadratic form is negative (C not positive semi-definite). */
    public static double standardError(double[] g, double[][] c) {
        if (c == null) {
            return Double.NaN;
        }
        double var = variance(g, c);
        return var >= 0 ? Math.sqrt(var) : Double.NaN;
    }
}
