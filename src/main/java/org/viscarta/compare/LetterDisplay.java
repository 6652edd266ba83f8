package org.viscarta.compare;

import java.util.ArrayList;
import java.util.BitSet;
import java.util.List;

/**
 * Compact letter display of all-pairwise comparisons: items sharing a letter are not significantly
 * different. Items come sorted by mean (the caller sorts, e.g. by descending tan δ), so the letters
 * are first sought as maximal runs of neighbours that are mutually not different — one sweep,
 * at most n² pair look-ups. When the runs do not show every pair that is alike (differences that
 * do not follow the order), the insert–absorb algorithm (Piepho 2004, "An algorithm for a
 * letter-based representation of all-pairwise comparisons", J. Comput. Graph. Stat. 13:456–466;
 * Gramm et al. 2007, Comput. Stat. Data Anal. 52:725–736) is tried with a bounded number of letter
 * columns. Letters are named in the order of the items, 'a' first. A display needing more than
 * {@value #MAX_LETTERS_PER_ITEM} letters for one item, or more than {@value #MAX_COLUMNS} letters,
 * is not readable; the caller then shows the pairwise table instead.
 */
public final class LetterDisplay {

    /** More letters than this on one item cannot be read at a glance. */
    public static final int MAX_LETTERS_PER_ITEM = 6;
    /** More letter columns than this ('a' to 'z') cannot be read at a glance. */
    public static final int MAX_COLUMNS = 26;
    /** Insert–absorb gives up beyond this many columns (it can grow exponentially). */
    private static final int INSERT_ABSORB_LIMIT = 200;

    private LetterDisplay() {
    }

    /**
     * A letter display.
     *
     * @param letters  each item's letters, e.g. "a", "ab", "b"
     * @param exact    true when every pair that is not different shares a letter (and every pair sharing one is not different)
     * @param readable true when no item has more than {@link #MAX_LETTERS_PER_ITEM} letters and there are at most
     *                 {@link #MAX_COLUMNS} letters
     */
    public record Display(List<String> letters, boolean exact, boolean readable) {
        public Display {
            letters = List.copyOf(letters);
        }
    }

    /**
     * @param n           number of items, in display order
     * @param significant significant[i][j] true when items i and j differ
     * @return the letters of each item, e.g. "a", "ab", "b"
     */
    public static String[] letters(int n, boolean[][] significant) {
        return display(n, significant).letters().toArray(new String[0]);
    }

    /** The letters with whether they are exact and readable. */
    public static Display display(int n, boolean[][] significant) {
        List<BitSet> columns = runs(n, significant);
        boolean exact = exact(n, significant, columns);
        if (!exact) {
            List<BitSet> ia = insertAbsorb(n, significant);
            if (ia != null) {
                columns = ia;
                exact = true;
            }
        }
        columns.sort(LetterDisplay::byFirstMembers);
        String[] out = new String[n];
        int widest = 0;
        for (int i = 0; i < n; i++) {
            StringBuilder sb = new StringBuilder();
            int count = 0;
            for (int c = 0; c < columns.size(); c++) {
                if (columns.get(c).get(i)) {
                    sb.append(letter(c));
                    count++;
                }
            }
            widest = Math.max(widest, count);
            out[i] = sb.toString();
        }
        return new Display(List.of(out), exact, widest <= MAX_LETTERS_PER_ITEM && columns.size() <= MAX_COLUMNS);
    }

    /**
     * Letter columns in the order of their members: the one holding the earliest item first, ties
     * broken by the next item where they differ — so 'a' marks the highest-damping group and the
     * letters follow the ranking.
     */
    private static int byFirstMembers(BitSet a, BitSet b) {
        BitSet diff = (BitSet) a.clone();
        diff.xor(b);
        int first = diff.nextSetBit(0);
        return first < 0 ? 0 : a.get(first) ? -1 : 1;
    }

    /** The maximal runs of consecutive items that are mutually not different; each start extends as far as it can. */
    private static List<BitSet> runs(int n, boolean[][] significant) {
        List<BitSet> out = new ArrayList<>();
        int end = -1;
        for (int i = 0; i < n; i++) {
            int e = Math.max(end, i);
            while (e + 1 < n && fitsRun(significant, i, e + 1)) {
                e++;
            }
            if (e > end) {
                BitSet run = new BitSet(n);
                run.set(i, e + 1);
                out.add(run);
                end = e;
            }
        }
        return out;
    }

    /** Whether item k is not different from any of items from..k−1. */
    private static boolean fitsRun(boolean[][] significant, int from, int k) {
        for (int j = from; j < k; j++) {
            if (significant[j][k]) {
                return false;
            }
        }
        return true;
    }

    /** Every pair not different shares a column. */
    private static boolean exact(int n, boolean[][] significant, List<BitSet> columns) {
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                if (significant[i][j]) {
                    continue;
                }
                boolean shared = false;
                for (BitSet c : columns) {
                    if (c.get(i) && c.get(j)) {
                        shared = true;
                        break;
                    }
                }
                if (!shared) {
                    return false;
                }
            }
        }
        return true;
    }

    /**
     * Insert–absorb: start with one letter shared by all; for each significant pair (i, j), split
     * every letter column holding both into a copy without i and a copy without j; absorb columns
     * that are subsets of others. Null when the columns outgrow {@link #INSERT_ABSORB_LIMIT}.
     */
    private static List<BitSet> insertAbsorb(int n, boolean[][] significant) {
        List<BitSet> columns = new ArrayList<>();
        BitSet all = new BitSet(n);
        all.set(0, n);
        columns.add(all);
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                if (!significant[i][j]) {
                    continue;
                }
                List<BitSet> next = new ArrayList<>();
                for (BitSet c : columns) {
                    if (c.get(i) && c.get(j)) {
                        BitSet withoutI = (BitSet) c.clone();
                        withoutI.clear(i);
                        BitSet withoutJ = (BitSet) c.clone();
                        withoutJ.clear(j);
                        next.add(withoutI);
                        next.add(withoutJ);
                    } else {
                        next.add(c);
                    }
                }
                if (next.size() > INSERT_ABSORB_LIMIT * 2) {
                    return null;
                }
                columns = absorb(next);
                if (columns.size() > INSERT_ABSORB_LIMIT) {
                    return null;
                }
            }
        }
        return columns;
    }
    private static List<BitSet> absorb(List<BitSet> cols) {
        List<BitSet> kept = new ArrayList<>();
        for (int a = 0; a < cols.size(); a++) {
            BitSet ca = cols.get(a);
            if (ca.isEmpty()) {
                continue;
            }
            boolean absorbed = false;
            for (int b = 0; b < cols.size() && !absorbed; b++) {
                if (a == b) {
                    continue;
                }
                BitSet cb = cols.get(b);
                BitSet inter = (BitSet) ca.clone();
                inter.and(cb);
                boolean subset = inter.equals(ca);
                // a proper subset is absorbed; of two equal columns the later one goes
                if (subset && (!ca.equals(cb) || b < a)) {
                    absorbed = true;
                }
            }
            if (!absorbed) {
                kept.add(ca);
            }
        }
        return kept;
    }

    private static String letter(int c) {
        return c < 26 ? String.valueOf((char) ('a' + c)) : "(" + (c + 1) + ")";
    }
}
