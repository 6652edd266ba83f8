package org.viscarta.quality;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.TreeSet;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;

/**
 * A replicate whose curve departs from its sample's other replicates.
 *
 * <p>At each frequency of the band every replicate covers, the log moduli of each replicate
 * (interpolated linearly in log frequency) are held against the median of the replicates with the
 * modified z-score of Iglewicz and Hoaglin (How to Detect and Handle Outliers, ASQC 1993):
 * M = 0.6745 (x − median) / MAD, an outlier above 3.5 — their published rule (quoted from memory).
 * The MAD is floored at {@value #MAD_FLOOR} in ln modulus (5 %, a convention of this product), so
 * that two replicates that happen to agree closely do not make a third, ordinarily different one
 * an outlier. A replicate is flagged when the median over frequencies of its larger score (E′ or
 * E″) exceeds the limit: the whole curve departs, not one point. Needs three replicates or more.
 */
public final class ReplicateOutliers {

    /** Iglewicz and Hoaglin's limit for the modified z-score. */
    public static final double LIMIT = 3.5;
    /** Smallest MAD [ln modulus] used: replicate-to-replicate spread below 5 % is not held against a replicate. */
    static final double MAD_FLOOR = 0.05;
    /** The constant of the modified z-score, 0.6745 (the 75th percentile of the standard normal). */
    static final double K = 0.6745;
    /** Fewest replicates the rule is applied to. */
    public static final int MIN_REPLICATES = 3;

    private ReplicateOutliers() {
    }

    /** One check row per replicate (none when there are fewer than three, or no common band). */
    public static List<SweepChecks.Check> of(List<Sweep> replicates) {
        if (replicates.size() < MIN_REPLICATES) {
            return List.of();
        }
        double lo = replicates.stream().mapToDouble(Sweep::minFrequencyHz).max().orElseThrow();
        double hi = replicates.stream().mapToDouble(Sweep::maxFrequencyHz).min().orElseThrow();
        TreeSet<Double> grid = new TreeSet<>();
        for (Sweep s : replicates) {
            for (SweepPoint p : s.points()) {
                if (p.frequencyHz() >= lo && p.frequencyHz() <= hi) {
                    grid.add(p.frequencyHz());
                }
            }
        }
        if (!(hi > lo) || grid.size() < 2) {
            return List.of();
        }
        int n = replicates.size();
        double[][] score = new double[n][grid.size()];
        double[][] signed = new double[n][grid.size()];
        int j = 0;
        for (double f : grid) {
            double[] s1 = new double[n];
            double[] s2 = new double[n];
            boolean lossUsable = true;
            for (int i = 0; i < n; i++) {
                double[] m = logModuliAt(replicates.get(i), f);
                s1[i] = m[0];
                s2[i] = m[1];
                lossUsable &= Double.isFinite(m[1]);
            }
            double[] z1 = zScores(s1);
            double[] z2 = lossUsable ? zScores(s2) : new double[n];
            for (int i = 0; i < n; i++) {
                boolean storageLarger = Math.abs(z1[i]) >= Math.abs(z2[i]);
                score[i][j] = Math.max(Math.abs(z1[i]), Math.abs(z2[i]));
                signed[i][j] = storageLarger ? z1[i] : z2[i];
            }
            j++;
        }
        List<SweepChecks.Check> out = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            double med = median(score[i]);
            double direction = median(signed[i]);
            Sweep s = replicates.get(i);
            boolean off = med > LIMIT;
            String msg = String.format(Locale.ROOT, "over %.3g–%.3g Hz this replicate's moduli sit a median %.2f robust deviations "
                    + "%s the median of the %d replicates%s", lo, hi, med, direction >= 0 ? "above" : "below", n,
                    off ? " (limit 3.5, the modified z-score of Iglewicz and Hoaglin 1993): look at this specimen or its contact "
                            + "before trusting the sample's mean; rank and report can leave it out with --drop-outliers"
                            : " (limit 3.5, Iglewicz and Hoaglin 1993)");
            out.add(new SweepChecks.Check(s.sample(), s.replicate(), "replicate-outlier", off ? Verdict.WARN : Verdict.PASS, med,
                    LIMIT, msg));
        }
        return out;
    }

    /** Modified z-scores of a set, with the MAD floored. */
    static double[] zScores(double[] x) {
        double med = median(x);
        double[] dev = new double[x.length];
        for (int i = 0; i < x.length; i++) {
            dev[i] = Math.abs(x[i] - med);
        }
        double mad = Math.max(median(dev), MAD_FLOOR);
        double[] z = new double[x.length];
        for (int i = 0; i < x.length; i++) {
            z[i] = K * (x[i] - med) / mad;
        }
        return z;
    }

    static double median(double[] x) {
        double[] c = x.clone();
        Arrays.sort(c);
        int n = c.length;
        return n % 2 == 1 ? c[n / 2] : 0.5 * (c[n / 2 - 1] + c[n / 2]);
    }

    /** ln E′ and ln E″ (NaN when E″ ≤ 0 nearby) at f, linear in log f between the neighbouring points. */
    private static double[] logModuliAt(Sweep s, double f) {
        List<SweepPoint> p = s.points();
        int k = 0;
        while (k < p.size() - 2 && p.get(k + 1).frequencyHz() < f) {
            k++;
        }
        SweepPoint a = p.get(k);
        SweepPoint b = p.get(Math.min(k + 1, p.size() - 1));
        double t = b.frequencyHz() > a.frequencyHz() ? Math.log(f / a.frequencyHz()) / Math.log(b.frequencyHz() / a.frequencyHz()) : 0;
        t = Math.max(0, Math.min(1, t));
        double e1 = (1 - t) * Math.log(a.storage()) + t * Math.log(b.storage());
        double e2 = a.loss() > 0 && b.loss() > 0 ? (1 - t) * Math.log(a.loss()) + t * Math.log(b.loss()) : Double.NaN;
        return new double[] {e1, e2};
    }
}
