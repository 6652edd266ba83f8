package org.viscarta.fit;

import java.util.function.ToDoubleFunction;
import java.util.function.UnaryOperator;

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
        return new Stencil(x, relativeStep, floor, UnaryOperator.identity()).gradient(f);
    }

    /**
     * The 2p points x ± h_j e_j of a central-difference gradient (h_j = relativeStep · max(|x_j|,
     * floor)), each passed once through a map (such as fitting parameters to natural ones), for the
     * gradients of several functions at the same x: the same gradients as {@link #gradient} of each
     * function composed with the map, without mapping the same points again for each function.
     */
    public static final class Stencil {
        private final double[] h;
        private final double[][] up;
        private final double[][] down;

        /** @param map applied to each point once; must return a new array */
        public Stencil(double[] x, double relativeStep, double floor, UnaryOperator<double[]> map) {
            int p = x.length;
            h = new double[p];
            up = new double[p][];
            down = new double[p][];
            for (int j = 0; j < p; j++) {
                h[j] = relativeStep * Math.max(Math.abs(x[j]), floor);
                double[] a = x.clone();
                double[] b = x.clone();
                a[j] += h[j];
                b[j] -= h[j];
                up[j] = map.apply(a);
                down[j] = map.apply(b);
            }
        }

        /** ∇f at x (f of the mapped points); f must not change the array it is given. */
        public double[] gradient(ToDoubleFunction<double[]> f) {
            double[] g = new double[h.length];
            for (int j = 0; j < g.length; j++) {
                g[j] = (f.applyAsDouble(up[j]) - f.applyAsDouble(down[j])) / (2 * h[j]);
            }
            return g;
        }
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
