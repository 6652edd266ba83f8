package org.viscarta.fit;

import org.apache.commons.math3.distribution.TDistribution;

/** Student-t quantiles for confidence intervals (Student 1908), to near double precision. */
public final class StudentT {

    /** Commons Math inverts the CDF to 1e-9 by default; intervals are checked against SciPy to 1e-12. */
    private static final double INVERSE_ACCURACY = 1e-14;

    private StudentT() {
    }

    /** Quantiles already computed, by degrees of freedom (every fit of a campaign asks for a few). */
    private static final java.util.concurrent.ConcurrentHashMap<Double, Double> CACHE = new java.util.concurrent.ConcurrentHashMap<>();

    /** The 0.975 quantile on {@code df} degrees of freedom, for two-sided 95 % intervals. */
    public static double quantile975(double df) {
        return CACHE.computeIfAbsent(df, d -> new TDistribution(null, d, INVERSE_ACCURACY).inverseCumulativeProbability(0.975));
    }
}
