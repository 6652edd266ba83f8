package org.viscarta.compare;

import java.util.ArrayList;
import java.util.BitSet;
import java.util.List;

/**
 * Compact letter display of all-pairwise comparisons by the insert–absorb algorithm (Piepho 2004,
 * "An algorithm for a letter-based representation of all-pairwise comparisons", J. Comput. Graph.
 * Stat. 13:456–466; Gramm et al. 2007, Comput. Stat. Data Anal. 52:725–736): items sharing a
 * letter are not significantly different. Start with one letter shared by all; for each
 * significant pair (i, j), split every letter column holding both into a copy without i and a copy
 * without j; absorb columns that are subsets of others. Letters are then named in the order of the
 * items (which the caller sorts, e.g. by descending mean), 'a' first.
 */
public final class LetterDisplay {

    private LetterDisplay() {
    }

    /**
     * @param n           number of items, in display order
     * @param significant significant[i][j] true when items i and j differ
     * @return the letters of each item, e.g. "a", "ab", "b"
     */
    public static String[] letters(int n, boolean[][] significant) {
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
                columns = absorb(next);
            }
        }
        columns.sort((a, b) -> Integer.compare(a.nextSetBit(0), b.nextSetBit(0)));
        String[] out = new String[n];
        for (int i = 0; i < n; i++) {
            StringBuilder sb = new StringBuilder();
            for (int c = 0; c < columns.size(); c++) {
                if (columns.get(c).get(i)) {
                    sb.append(letter(c));
                }
            }
            out[i] = sb.toString();
        }
        return out;
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
