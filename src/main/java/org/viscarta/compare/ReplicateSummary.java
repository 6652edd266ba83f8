package org.viscarta.compare;

import org.viscarta.fit.StudentT;

/**
 * Mean, sample standard deviation and 95 % Student-t interval of replicate values
 * (mean ± t_{0.975, n−1} s/√n; Student 1908, textbook formula). With one replicate the spread and
 * interval are NaN: they cannot be estimated.
 *
 * @param n        number of replicates
 * @param mean     arithmetic mean
 * @param sd       sample standard deviation (n − 1 denominator)
 * @param ci95Low  lower end of the 95 % interval of the mean
 * @param ci95High upper end
 */
public record ReplicateSummary(int n, double mean, double sd, double ci95Low, double ci95High) {

    public static ReplicateSummary of(double[] values) {
        int n = values.length;
        if (n == 0) {
            throw new IllegalArgumentException("no values to summarise");
        }
        double mean = 0;
        for (double v : values) {
            mean += v;
        }
        mean /= n;
        if (n == 1) {
            return new ReplicateSummary(1, mean, Double.NaN, Double.NaN, Double.NaN);
        }
        double ss = 0;
        for (double v : values) {
            ss += (v - mean) * (v - mean);
        }
        double sd = Math.sqrt(ss / (n - 1));
        double half = StudentT.quantile975(n - 1) * sd / Math.sqrt(n);
        return new ReplicateSummary(n, mean, sd, mean - half, mean + half);
    }
}
