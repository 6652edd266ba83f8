package org.viscarta.model;

import java.util.Arrays;
import java.util.List;
import org.viscarta.sweep.SweepPoint;

/** Simple features of a sweep used to derive start values. */
final class DataFeatures {

    final double omegaMin;
    final double omegaMax;
    final double storageMin;
    final double storageMax;
    final double medianStorage;
    final double medianTanDelta;
    final double omegaAtLossPeak;

    DataFeatures(List<SweepPoint> pts) {
        int n = pts.size();
        double[] storage = new double[n];
        double[] tan = new double[n];
        double oMin = Double.POSITIVE_INFINITY;
        double oMax = 0;
        double peak = -1;
        double peakOmega = Double.NaN;
        for (int i = 0; i < n; i++) {
            SweepPoint p = pts.get(i);
            storage[i] = p.storage();
            tan[i] = p.lossTangent();
            oMin = Math.min(oMin, p.omega());
            oMax = Math.max(oMax, p.omega());
            if (p.loss() > peak) {
                peak = p.loss();
                peakOmega = p.omega();
            }
        }
        omegaMin = oMin;
        omegaMax = oMax;
        storageMin = Arrays.stream(storage).min().orElse(1);
        storageMax = Arrays.stream(storage).max().orElse(1);
        medianStorage = median(storage);
        medianTanDelta = median(tan);
        omegaAtLossPeak = peakOmega;
    }

    /** Geometric centre of the measured window [rad/s]. */
    double omegaCentre() {
        return Math.sqrt(omegaMin * omegaMax);
    }

    static double median(double[] v) {
        double[] s = v.clone();
        Arrays.sort(s);
        int n = s.length;
        return n % 2 == 1 ? s[n / 2] : 0.5 * (s[n / 2 - 1] + s[n / 2]);
    }

    static double clamp(double v, double lo, double hi) {
        return Math.max(lo, Math.min(hi, v));
    }
}
