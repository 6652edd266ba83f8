package org.viscarta.compare;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * Validation of the group statistics against DOMAIN.md section 10.8, computed there with SciPy 1.17
 * (scipy.stats.ttest_ind(equal_var=False), f_oneway, kruskal) and reproducible with
 * shared/domain-checks.py; Holm's procedure against its definition on hand-checkable cases.
 * The table prints 6–7 significant digits: each value is held to half a unit in its last printed digit.
 */
@Tag("validation")
class GroupStatisticsTest {

    private static final double[] A = {10.2, 11.5, 9.8, 12.1, 10.9};
    private static final double[] B = {13.4, 14.8, 12.9, 15.5};
    private static final double[] C = {11.0, 11.8, 10.5, 12.4, 11.6, 12.0};

    private static void near(String printed, double actual, String what) {
        java.math.BigDecimal bd = new java.math.BigDecimal(printed);
        assertEquals(bd.doubleValue(), actual, 0.5 * Math.pow(10, -bd.scale()) * (1 + 1e-9), what);
    }

    @Test
    void welchMatchesScipy() {
        GroupStatistics.Welch ab = GroupStatistics.welch(A, B);
        near("-4.426106", ab.t(), "t A–B");
        near("5.605270", ab.df(), "df A–B");
        near("0.00522814", ab.p(), "p A–B");
        GroupStatistics.Welch ac = GroupStatistics.welch(A, C);
        near("-1.287613", ac.t(), "t A–C");
        near("7.271369", ac.df(), "df A–C");
        near("0.237345", ac.p(), "p A–C");
        GroupStatistics.Welch bc = GroupStatistics.welch(B, C);
        near("3.901951", bc.t(), "t B–C");
        near("4.334521", bc.df(), "df B–C");
        near("0.0150175", bc.p(), "p B–C");
    }

    @Test
    void welchAnalyticCase() {
        // DOMAIN.md 10.8: x = 1…5, y = 2, 4, …, 10 ⇒ t = −1.897367, ν = 6.25/1.0625 = 5.882353, p = 0.107531
        GroupStatistics.Welch w = GroupStatistics.welch(new double[] {1, 2, 3, 4, 5}, new double[] {2, 4, 6, 8, 10});
        near("-1.897367", w.t(), "t");
        assertEquals(6.25 / 1.0625, w.df(), 1e-12, "df");
        near("0.107531", w.p(), "p");
    }

    @Test
    void anovaAndKruskalWallisMatchScipy() {
        GroupStatistics.GroupTest f = GroupStatistics.oneWayAnova(List.of(A, B, C));
        near("15.047832", f.statistic(), "F");
        near("5.36616e-4", f.p(), "ANOVA p");
        assertEquals(2, f.df1());
        assertEquals(12, f.df2());
        GroupStatistics.GroupTest h = GroupStatistics.kruskalWallis(List.of(A, B, C));
        near("9.148333", h.statistic(), "H");
        near("0.0103149", h.p(), "Kruskal–Wallis p");
    }

    @Test
    void kruskalWallisCorrectsForTies() {
        // Hand-checkable: groups (1, 2), (2, 3). Ranks 1, 2.5 | 2.5, 4; R = 3.5, 6.5; N = 4.
        // H = 12/(4·5)·(3.5²/2 + 6.5²/2) − 15 = 0.6·27.25 − 15 = 1.35; ties: one pair, Σ(t³ − t) = 6,
        // correction 1 − 6/60 = 0.9 ⇒ H = 1.5 (Kruskal & Wallis 1952, tie correction).
        GroupStatistics.GroupTest h = GroupStatistics.kruskalWallis(List.of(new double[] {1, 2}, new double[] {2, 3}));
        assertEquals(1.5, h.statistic(), 1e-12);
    }

    @Test
    void holmMatchesItsDefinition() {
        // DOMAIN.md 10.8: p = (0.01, 0.04, 0.03, 0.005) ⇒ adjusted (0.03, 0.06, 0.06, 0.02)
        assertArrayEquals(new double[] {0.03, 0.06, 0.06, 0.02}, GroupStatistics.holm(new double[] {0.01, 0.04, 0.03, 0.005}), 1e-15);
        // DOMAIN.md 10.8: (AB, AC, BC) = (0.0156844, 0.237345, 0.0300350) adjusted are the Holm values of the raw Welch p
        double[] adj = GroupStatistics.holm(new double[] {0.00522814, 0.237345, 0.0150175});
        near("0.0156844", adj[0], "Holm AB");
        near("0.237345", adj[1], "Holm AC");
        near("0.0300350", adj[2], "Holm BC");
    }

    @Test
    void lettersMatchDomainExample() {
        // DOMAIN.md 10.8: Holm on (AB, AC, BC) ⇒ letters B "a", A "b", C "b" — items in order of descending mean: B, C, A
        boolean[][] sig = new boolean[3][3];
        // order B(0), C(1), A(2): B–C adjusted 0.030 < 0.05, B–A 0.0157 < 0.05, C–A 0.237 not
        sig[0][1] = true;
        sig[1][0] = true;
        sig[0][2] = true;
        sig[2][0] = true;
        assertArrayEquals(new String[] {"a", "b", "b"}, LetterDisplay.letters(3, sig));
    }

    @Test
    void lettersOverlapWhenAMiddleItemDiffersFromNeither() {
        // a < b < c with only a–c significant: a "a", b "ab", c "b" (Piepho 2004's basic case)
        boolean[][] sig = new boolean[3][3];
        sig[0][2] = true;
        sig[2][0] = true;
        assertArrayEquals(new String[] {"a", "ab", "b"}, LetterDisplay.letters(3, sig));
        assertArrayEquals(new String[] {"a", "a", "a"}, LetterDisplay.letters(3, new boolean[3][3]));
    }

    /**
     * Regression: many samples on a gentle gradient of tan δ once made insert–absorb run for
     * minutes and give one sample 150 letters. The display now costs at most n² look-ups per sweep;
     * letters that could not be read are replaced by the pairwise table. The timeout only guards
     * against a hang (speed is measured by the benchmark, not here).
     */
    @Test
    void aGentleGradientOfManySamplesEndsWithReadableLettersOrThePairwiseTable() {
        org.junit.jupiter.api.Assertions.assertTimeoutPreemptively(java.time.Duration.ofSeconds(60), () -> {
            int n = 120;
            DampingComparison.Result r = GradientSamples.of(n, 0.002).compare();
            assertEquals(n, r.letters().size());
            int widest = r.letters().stream().mapToInt(String::length).max().orElse(0);
            boolean shown = r.letters().stream().anyMatch(l -> !l.isEmpty());
            assertTrue(!shown || widest <= LetterDisplay.MAX_LETTERS_PER_ITEM, "widest " + widest);
            assertTrue(shown || r.statements().stream().anyMatch(t -> t.startsWith("Letters are not shown")), r.statements().toString());
        });
    }

    /** Self-check: on a pattern that does not follow the order the display stays exact (insert–absorb), as its definition asks. */
    @Test
    void aPatternAgainstTheOrderStillSharesALetterForEveryPairAlike() {
        // 0 differs from 1, 1 differs from 2, but 0 and 2 are alike: runs alone would miss the pair (0, 2)
        boolean[][] sig = new boolean[3][3];
        sig[0][1] = sig[1][0] = true;
        sig[1][2] = sig[2][1] = true;
        LetterDisplay.Display d = LetterDisplay.display(3, sig);
        assertTrue(d.exact());
        assertEquals(List.of("a", "b", "a"), d.letters());
    }

    /** Values of src/test/resources/scipy/far_apart_groups.out, written by far_apart_groups.py beside it (SciPy 1.17.1). */
    private static java.util.Map<String, Double> farApart() throws java.io.IOException {
        java.util.Map<String, Double> out = new java.util.HashMap<>();
        try (var in = GroupStatisticsTest.class.getResourceAsStream("/scipy/far_apart_groups.out")) {
            for (String line : new String(in.readAllBytes(), java.nio.charset.StandardCharsets.UTF_8).split("\n")) {
                String[] kv = line.trim().split(" ");
                if (kv.length == 2 && !kv[0].equals("scipy")) {
                    out.put(kv[0], Double.parseDouble(kv[1]));
                }
            }
        }
        return out;
    }

    /**
     * Groups far apart: p-values far below 1e-16 keep their digits (1 − cdf gave 0). Relative
     * agreement with SciPy's survival functions to 1e-9.
     */
    @Test
    void tinyPValuesMatchScipysSurvivalFunctions() throws java.io.IOException {
        java.util.Map<String, Double> ref = farApart();
        double[] a = {0.100, 0.101, 0.099, 0.1005, 0.0995, 0.1002, 0.0998, 0.1001};
        double[] b = {0.300, 0.301, 0.299, 0.3005, 0.2995, 0.3002, 0.2998, 0.3001};
        double[] c = {0.500, 0.501, 0.499, 0.5005, 0.4995, 0.5002, 0.4998, 0.5001};
        GroupStatistics.GroupTest f = GroupStatistics.oneWayAnova(List.of(a, b, c));
        assertEquals(ref.get("anova_f"), f.statistic(), ref.get("anova_f") * 1e-9, "F");
        assertEquals(ref.get("anova_p"), f.p(), ref.get("anova_p") * 1e-9, "ANOVA p = 2.4e-52, not 0");
        GroupStatistics.GroupTest h = GroupStatistics.kruskalWallis(List.of(a, b, c));
        assertEquals(ref.get("kruskal_h"), h.statistic(), 1e-9, "H");
        assertEquals(ref.get("kruskal_p"), h.p(), ref.get("kruskal_p") * 1e-9, "Kruskal–Wallis p");
        assertEquals(ref.get("chi2_sf_400_df2"), GroupStatistics.chiSquaredSurvival(400, 2), ref.get("chi2_sf_400_df2") * 1e-9);
        assertEquals(ref.get("f_sf_1e5_2_21"), GroupStatistics.fSurvival(1e5, 2, 21), ref.get("f_sf_1e5_2_21") * 1e-9);
        GroupStatistics.Welch w = GroupStatistics.welch(a, c);
        assertEquals(ref.get("welch_AC_t"), w.t(), Math.abs(ref.get("welch_AC_t")) * 1e-9, "Welch t");
        assertEquals(ref.get("welch_AC_p"), w.p(), ref.get("welch_AC_p") * 1e-6, "Welch p");
    }
}
