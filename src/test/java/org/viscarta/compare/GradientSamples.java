package org.viscarta.compare;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;

/**
 * Samples on a gradient of tan δ (three replicates each, 0.01 scatter), the case that once made the
 * letter display run for minutes; made here for the regression test and the benchmark alike.
 *
 * @param names  s0, s1, ...
 * @param groups all "" (no groups)
 * @param values each sample's three replicate values
 */
public record GradientSamples(List<String> names, List<String> groups, List<double[]> values) {

    /** {@code n} samples from tan δ = 0.5 down by {@code step} each, seeded. */
    public static GradientSamples of(int n, double step) {
        Random rng = new Random(3);
        List<String> names = new ArrayList<>();
        List<String> groups = new ArrayList<>();
        List<double[]> values = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            names.add("s" + i);
            groups.add("");
            double mean = 0.5 - step * i;
            values.add(new double[] {mean + 0.01 * rng.nextGaussian(), mean + 0.01 * rng.nextGaussian(), mean + 0.01 * rng.nextGaussian()});
        }
        return new GradientSamples(names, groups, values);
    }

    /** Their damping comparison at α = 0.05. */
    public DampingComparison.Result compare() {
        return DampingComparison.compare(names, groups, values, 0.05);
    }
}
