package org.viscarta.compare;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import org.apache.commons.math3.distribution.TDistribution;

/**
 * Tests for comparing samples and groups (DOMAIN.md section 9): Welch's unequal-variance t-test,
 * Holm's step-down adjustment, one-way ANOVA and the Kruskal–Wallis rank test.
 */
public final class GroupStatistics {

    private GroupStatistics() {
    }

    /**
     * A Welch t-test.
     *
     * @param t  the statistic
     * @param df Welch–Satterthwaite degrees of freedom
     * @param p  two-sided p-value
     */
    public record Welch(double t, double df, double p) {
    }

    /**
     * Welch's t-test (Welch 1947, Biometrika 34:28–35; degrees of freedom by Satterthwaite 1946,
     * Biometrics Bull. 2:110–114): t = (x̄₁ − x̄₂)/sqrt(s₁²/n₁ + s₂²/n₂),
     * ν = (s₁²/n₁ + s₂²/n₂)² / [(s₁²/n₁)²/(n₁−1) + (s₂²/n₂)²/(n₂−1)], p from Student's t on ν.
     * Needs at least two values per sample; NaN results when both variances are zero.
     */
    public static Welch welch(double[] a, double[] b) {
        if (a.length < 2 || b.length < 2) {
            throw new IllegalArgumentException("Welch's test needs at least two values in each sample");
        }
        double va = variance(a) / a.length;
        double vb = variance(b) / b.length;
        double se2 = va + vb;
        if (!(se2 > 0)) {
            return new Welch(Double.NaN, Double.NaN, Double.NaN);
        }
        double t = (mean(a) - mean(b)) / Math.sqrt(se2);
        double df = se2 * se2 / (va * va / (a.length - 1) + vb * vb / (b.length - 1));
        double p = Math.min(1, 2 * new TDistribution(null, df, 1e-14).cumulativeProbability(-Math.abs(t))); // lower tail: no cancellation
        return new Welch(t, df, p);
    }

    /**
     * Holm's step-down adjusted p-values (Holm 1979, Scand. J. Statist. 6:65–70): with p sorted
     * ascending, p̃_(i) = max_{j ≤ i} min(1, (m − j + 1) p_(j)); returned in the input order.
     */
    public static double[] holm(double[] p) {
        int m = p.length;
        Integer[] order = new Integer[m];
        for (int i = 0; i < m; i++) {
            order[i] = i;
        }
        Arrays.sort(order, Comparator.comparingDouble(i -> p[i]));
        double[] adjusted = new double[m];
        double running = 0;
        for (int k = 0; k < m; k++) {
            int i = order[k];
            running = Math.max(running, Math.min(1, (m - k) * p[i]));
            adjusted[i] = running;
        }
        return adjusted;
    }

    /**
     * An F or χ² test across groups.
     *
     * @param statistic F (ANOVA) or H (Kruskal–Wallis)
     * @param df1       numerator degrees of freedom (k − 1)
     * @param df2       denominator degrees of freedom (N − k) for ANOVA, NaN for Kruskal–Wallis
     * @param p         p-value
     */
    public record GroupTest(double statistic, double df1, double df2, double p) {
    }

    /**
     * One-way ANOVA (Fisher 1925): F = [Σ nᵢ(x̄ᵢ − x̄)²/(k − 1)] / [ΣΣ(xᵢⱼ − x̄ᵢ)²/(N − k)].
     */
    public static GroupTest oneWayAnova(List<double[]> groups) {
        int k = groups.size();
        int total = 0;
        double grand = 0;
        for (double[] g : groups) {
            total += g.length;
            for (double v : g) {
                grand += v;
            }
        }
        grand /= total;
        double between = 0;
        double within = 0;
        for (double[] g : groups) {
            double m = mean(g);
            between += g.length * (m - grand) * (m - grand);
            for (double v : g) {
                within += (v - m) * (v - m);
            }
        }
        double df1 = k - 1;
        double df2 = total - k;
        double f = (between / df1) / (within / df2);
        double p = fSurvival(f, df1, df2);
        return new GroupTest(f, df1, df2, p);
    }

    /**
     * Kruskal–Wallis H test (Kruskal &amp; Wallis 1952, J. Am. Stat. Assoc. 47:583–621) with the tie
     * correction H/(1 − Σ(t³ − t)/(N³ − N)); p from χ² on k − 1 degrees of freedom.
     */
    public static GroupTest kruskalWallis(List<double[]> groups) {
        List<double[]> all = new ArrayList<>();
        for (int gi = 0; gi < groups.size(); gi++) {
            for (double v : groups.get(gi)) {
                all.add(new double[] {v, gi});
            }
        }
        all.sort(Comparator.comparingDouble(x -> x[0]));
        int n = all.size();
        double[] rankSum = new double[groups.size()];
        double ties = 0;
        int i = 0;
        while (i < n) {
            int j = i;
            while (j + 1 < n && all.get(j + 1)[0] == all.get(i)[0]) {
                j++;
            }
            double rank = (i + j) / 2.0 + 1;
            for (int k = i; k <= j; k++) {
                rankSum[(int) all.get(k)[1]] += rank;
            }
            double t = j - i + 1;
            ties += t * t * t - t;
            i = j + 1;
        }
        double h = 0;
        for (int g = 0; g < groups.size(); g++) {
            h += rankSum[g] * rankSum[g] / groups.get(g).length;
        }
        h = 12.0 / (n * (n + 1.0)) * h - 3 * (n + 1.0);
        double correction = 1 - ties / ((double) n * n * n - n);
        if (correction > 0) {
            h /= correction;
        }
        double df = groups.size() - 1;
        double p = chiSquaredSurvival(h, df);
        return new GroupTest(h, df, Double.NaN, p);
    }

    static double mean(double[] v) {
        double s = 0;
        for (double x : v) {
            s += x;
        }
        return s / v.length;
    }

    static double variance(double[] v) {
        double m = mean(v);
        double s = 0;
        for (double x : v) {
            s += (x - m) * (x - m);
        }
        return s / (v.length - 1);
    }

    /**
     * P(F &gt; f) for the F distribution with (df1, df2) degrees of freedom, as the regularised
     * incomplete beta function I_x(df2/2, df1/2) at x = df2/(df2 + df1 f) (Abramowitz &amp; Stegun
     * 26.6.2), so that very small p-values keep their digits instead of 1 − cdf rounding to 0.
     */
    static double fSurvival(double f, double df1, double df2) {
        if (!(f > 0)) {
            return Double.isNaN(f) ? Double.NaN : 1;
        }
        return org.apache.commons.math3.special.Beta.regularizedBeta(df2 / (df2 + df1 * f), df2 / 2, df1 / 2, 1e-15, 100_000);
    }

    /** P(X &gt; x) for the chi-squared distribution, as the upper regularised gamma function Q(df/2, x/2). */
    static double chiSquaredSurvival(double x, double df) {
        if (!(x > 0)) {
            return Double.isNaN(x) ? Double.NaN : 1;
        }
        return org.apache.commons.math3.special.Gamma.regularizedGammaQ(df / 2, x / 2, 1e-15, 100_000);
    }
}
