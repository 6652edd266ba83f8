package org.viscarta.map;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import org.apache.commons.math3.distribution.NormalDistribution;

/**
 * Moran's I, the spatial autocorrelation of a value over positions (Moran, Biometrika 37 (1950) 17),
 * with binary weights w_ij = 1 for two positions closer than a distance d (and 0 for a position with
 * itself), its expectation −1/(n − 1) and its variance under the normality assumption with the
 * z-score and a two-sided p-value (Cliff and Ord, Spatial Processes, 1981, eq. 1.35 — cited from
 * memory; checked against a direct numpy evaluation of the same formulas, script kept with the test).
 *
 * <p>Neighbours are found through a grid of cells of size d, so the cost grows with the positions
 * and their neighbours, not with the square of the positions.
 *
 * @param i         Moran's I
 * @param expected  its expectation with no autocorrelation, −1/(n − 1)
 * @param variance  its variance under normality
 * @param z         (I − E[I]) / sqrt(Var)
 * @param p         two-sided p-value of z
 * @param n         positions
 * @param pairs     neighbour pairs (each counted once)
 * @param distanceM the neighbour distance d [m]
 */
public record MoranI(double i, double expected, double variance, double z, double p, int n, long pairs, double distanceM) {

    /**
     * @param x values, one per position
     * @param xs positions [m]
     * @param ys positions [m]
     * @param distanceM neighbours are closer than this
     * @return null with fewer than three positions or no neighbour pair or no variation
     */
    public static MoranI of(double[] x, double[] xs, double[] ys, double distanceM) {
        int n = x.length;
        if (n < 3 || !(distanceM > 0)) {
            return null;
        }
        double mean = 0;
        for (double v : x) {
            mean += v;
        }
        mean /= n;
        double m2 = 0;
        for (double v : x) {
            double dv = v - mean;
            m2 += dv * dv;
        }
        if (!(m2 > 0)) {
            return null;
        }
        Map<Long, List<Integer>> cells = new HashMap<>();
        for (int k = 0; k < n; k++) {
            cells.computeIfAbsent(key((long) Math.floor(xs[k] / distanceM), (long) Math.floor(ys[k] / distanceM)), c -> new ArrayList<>())
                    .add(k);
        }
        double cross = 0;
        long pairs = 0;
        int[] degree = new int[n];
        double d2 = distanceM * distanceM;
        for (int k = 0; k < n; k++) {
            long cx = (long) Math.floor(xs[k] / distanceM);
            long cy = (long) Math.floor(ys[k] / distanceM);
            for (long ox = -1; ox <= 1; ox++) {
                for (long oy = -1; oy <= 1; oy++) {
                    List<Integer> cell = cells.get(key(cx + ox, cy + oy));
                    if (cell == null) {
                        continue;
                    }
                    for (int j : cell) {
                        if (j <= k) {
                            continue;
                        }
                        double dx = xs[j] - xs[k];
                        double dy = ys[j] - ys[k];
                        if (dx * dx + dy * dy < d2) {
                            cross += 2 * (x[k] - mean) * (x[j] - mean);
                            pairs++;
                            degree[k]++;
                            degree[j]++;
                        }
                    }
                }
            }
        }
        if (pairs == 0) {
            return null;
        }
        double w = 2.0 * pairs;
        double s1 = 2 * w; // ½ Σ (w_ij + w_ji)² with symmetric 0/1 weights: 2 per ordered pair
        double s2 = 0;
        for (int dg : degree) {
            s2 += 4.0 * dg * dg;
        }
        double i = n / w * cross / m2;
        double e = -1.0 / (n - 1);
        double var = (n * n * s1 - n * s2 + 3 * w * w) / (w * w * ((double) n * n - 1)) - e * e;
        double z = (i - e) / Math.sqrt(var);
        double p = 2 * new NormalDistribution().cumulativeProbability(-Math.abs(z));
        return new MoranI(i, e, var, z, p, n, pairs, distanceM);
    }

    /** A cell's key: its two indices packed into one long (indices beyond 32 bits are not reached by real maps). */
    private static long key(long cx, long cy) {
        return (cx << 32) ^ (cy & 0xFFFFFFFFL);
    }
}
