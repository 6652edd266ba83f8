package org.viscarta.compare;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import org.viscarta.sweep.Numbers;
import java.util.Map;

/**
 * Which differences in damping are real: pairwise Welch t-tests between samples on their replicate
 * tan δ values, Holm-adjusted over all pairs, turned into letter groups (samples sharing a letter
 * are not distinguishable at level α); with groups, per-group summaries, a one-way ANOVA and a
 * Kruskal–Wallis test across groups; and the conclusions in words. tan δ is tested on the linear
 * scale (common practice for loss tangents and exponents, DOMAIN.md section 9 [P]).
 */
public final class DampingComparison {

    /**
     * One pairwise comparison.
     *
     * @param first       the sample with the higher mean tan δ
     * @param second      the other sample
     * @param welch       the Welch test
     * @param pHolm       Holm-adjusted p-value
     * @param significant pHolm below α
     */
    public record Pair(String first, String second, GroupStatistics.Welch welch, double pHolm, boolean significant) {
    }

    /** Replicate tan δ values of every sample of one group, pooled. */
    public record GroupSummary(String group, int samples, ReplicateSummary values) {
    }

    /**
     * @param alpha      the significance level
     * @param letters    letter groups in the order of the samples given
     * @param pairs      every pair that could be tested
     * @param groups     per-group summaries (empty without groups)
     * @param anova      one-way ANOVA across groups, or null
     * @param kruskal    Kruskal–Wallis across groups, or null
     * @param statements the conclusions in words
     */
    public record Result(double alpha, List<String> letters, List<Pair> pairs, List<GroupSummary> groups,
                         GroupStatistics.GroupTest anova, GroupStatistics.GroupTest kruskal, List<String> statements) {
        public Result {
            letters = List.copyOf(letters);
            pairs = List.copyOf(pairs);
            groups = List.copyOf(groups);
            statements = List.copyOf(statements);
        }
    }

    private DampingComparison() {
    }

    /** Below this, a p-value is written "< 0.0001" (its digits say nothing a reader can use). */
    private static final double SMALLEST_P_SHOWN = 1e-4;

    /** "= 0.0713" or "< 0.0001", for sentences. */
    public static String pText(double p) {
        return p < SMALLEST_P_SHOWN ? "< 0.0001" : String.format(Locale.ROOT, "= %.3g", p);
    }

    /**
     * How the statements name what is compared.
     *
     * @param quantity  the quantity ("tan δ")
     * @param higher    the verb phrase for a higher mean ("damps more than")
     * @param allDiffer the sentence when every pair differs
     * @param items     what is compared, plural and capitalised ("Samples", "Regions")
     * @param units     what each one's values are ("replicates", "positions")
     * @param groupsWord what the group tests run across ("groups", "regions")
     */
    public record Wording(String quantity, String higher, String allDiffer, String items, String units, String groupsWord) {

        /** Samples with replicates, in groups. */
        public Wording(String quantity, String higher, String allDiffer) {
            this(quantity, higher, allDiffer, "Samples", "replicates", "groups");
        }
    }

    /** The damping ranking's wording. */
    public static final Wording DAMPING = new Wording("tan δ", "damps more than",
            "Every sample damps differently from every other; the ranking order is supported throughout.");

    /** The letter of a sample that cannot be tested (a single replicate). */
    public static final String NOT_TESTED = "–";

    /**
     * @param names  samples in display order (highest mean tan δ first)
     * @param groups each sample's group label ("" when none)
     * @param values each sample's replicate tan δ values
     * @param alpha  significance level, in (0, 1)
     */
    public static Result compare(List<String> names, List<String> groups, List<double[]> values, double alpha) {
        return compare(names, groups, values, alpha, DAMPING);
    }

    /** The same comparison of another quantity, stated in its own words. */
    public static Result compare(List<String> names, List<String> groups, List<double[]> values, double alpha, Wording wording) {
        if (!(alpha > 0 && alpha < 1)) {
            throw new IllegalArgumentException("the significance level must lie in (0, 1), got " + alpha);
        }
        int n = names.size();
        List<int[]> index = new ArrayList<>();
        List<GroupStatistics.Welch> tests = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                if (values.get(i).length >= 2 && values.get(j).length >= 2) {
                    GroupStatistics.Welch w = GroupStatistics.welch(values.get(i), values.get(j));
                    if (Double.isFinite(w.p())) {
                        index.add(new int[] {i, j});
                        tests.add(w);
                    }
                }
            }
        }
        double[] raw = tests.stream().mapToDouble(GroupStatistics.Welch::p).toArray();
        double[] adjusted = GroupStatistics.holm(raw);
        boolean[][] significant = new boolean[n][n];
        List<Pair> pairs = new ArrayList<>();
        for (int k = 0; k < tests.size(); k++) {
            int i = index.get(k)[0];
            int j = index.get(k)[1];
            boolean sig = adjusted[k] < alpha;
            significant[i][j] = sig;
            significant[j][i] = sig;
            pairs.add(new Pair(names.get(i), names.get(j), tests.get(k), adjusted[k], sig));
        }
        // letters among the samples that can be tested (two or more replicates); the others show "–"
        int[] tested = java.util.stream.IntStream.range(0, n).filter(i -> values.get(i).length >= 2).toArray();
        boolean[][] sub = new boolean[tested.length][tested.length];
        for (int a = 0; a < tested.length; a++) {
            for (int b = 0; b < tested.length; b++) {
                sub[a][b] = significant[tested[a]][tested[b]];
            }
        }
        LetterDisplay.Display display = LetterDisplay.display(tested.length, sub);
        List<String> letters = new ArrayList<>(java.util.Collections.nCopies(n, NOT_TESTED));
        for (int a = 0; a < tested.length; a++) {
            letters.set(tested[a], display.readable() ? display.letters().get(a) : "");
        }
        List<String> statements = new ArrayList<>();
        long untestable = values.stream().filter(v -> v.length < 2).count();
        long supported = pairs.stream().filter(Pair::significant).count();
        statements.add(String.format(Locale.ROOT, wording.items() + " that share a letter are not distinguishable in " + wording.quantity()
                + " at α = %s (Welch t-tests between " + wording.units() + ", Holm-adjusted over %d pairs); %d of the %d differences are "
                + "supported.",
                Numbers.plain(alpha), pairs.size(), supported, pairs.size()));
        if (untestable > 0) {
            statements.add(untestable + " sample(s) with a single replicate cannot be tested (a difference needs the scatter "
                    + "of replicates): their letter shows '" + NOT_TESTED + "'.");
        }
        if (!display.readable()) {
            statements.add("Letters are not shown: the overlapping differences would need more than "
                    + LetterDisplay.MAX_LETTERS_PER_ITEM + " letters for a sample or more than " + LetterDisplay.MAX_COLUMNS
                    + " in all; every pairwise comparison is listed with its Holm-adjusted p-value instead.");
        } else if (!display.exact()) {
            statements.add("The letters follow the ranking order: samples sharing a letter are not distinguishable, but some "
                    + "pairs without a common letter are not distinguishable either; the pairwise comparisons say which.");
        }
        if (supported > 0 && supported <= pairs.size() - supported) {
            for (Pair p : pairs) {
                if (p.significant()) {
                    statements.add(String.format(Locale.ROOT, "%s " + wording.higher() + " %s (Holm-adjusted p %s).",
                            p.first(), p.second(), pText(p.pHolm())));
                }
            }
        } else if (supported > 0) {
            List<String> alike = new ArrayList<>();
            for (Pair p : pairs) {
                if (!p.significant()) {
                    alike.add(String.format(Locale.ROOT, "%s and %s (p %s)", p.first(), p.second(), pText(p.pHolm())));
                }
            }
            statements.add(alike.isEmpty() ? wording.allDiffer()
                    : "Every other pair differs in the order of the ranking; not distinguishable: " + String.join("; ", alike) + ".");
        }
        Map<String, List<Integer>> byGroup = new LinkedHashMap<>();
        for (int i = 0; i < n; i++) {
            if (!groups.get(i).isEmpty()) {
                byGroup.computeIfAbsent(groups.get(i), g -> new ArrayList<>()).add(i);
            }
        }
        List<GroupSummary> summaries = new ArrayList<>();
        GroupStatistics.GroupTest anova = null;
        GroupStatistics.GroupTest kruskal = null;
        if (byGroup.size() >= 2) {
            List<double[]> pooled = new ArrayList<>();
            for (Map.Entry<String, List<Integer>> e : byGroup.entrySet()) {
                double[] all = e.getValue().stream().flatMapToDouble(i -> java.util.Arrays.stream(values.get(i))).toArray();
                pooled.add(all);
                summaries.add(new GroupSummary(e.getKey(), e.getValue().size(), ReplicateSummary.of(all)));
            }
            boolean testable = pooled.stream().allMatch(v -> v.length >= 2);
            if (testable) {
                anova = GroupStatistics.oneWayAnova(pooled);
                kruskal = GroupStatistics.kruskalWallis(pooled);
                boolean differ = anova.p() < alpha && kruskal.p() < alpha;
                boolean disagree = (anova.p() < alpha) != (kruskal.p() < alpha);
                statements.add(String.format(Locale.ROOT, "Across the %d " + wording.groupsWord() + ", " + wording.quantity() + " %s (one-way ANOVA F = %.3g, p %s; "
                        + "Kruskal–Wallis H = %.3g, p %s)%s", byGroup.size(),
                        differ ? "differs" : disagree ? "may differ" : "does not differ detectably",
                        anova.statistic(), pText(anova.p()), kruskal.statistic(), pText(kruskal.p()),
                        disagree ? "; the two tests disagree, so treat the difference with caution." : "."));
            } else {
                statements.add("Groups with a single value cannot be compared across groups.");
            }
        }
        return new Result(alpha, letters, pairs, summaries, anova, kruskal, statements);
    }

}
