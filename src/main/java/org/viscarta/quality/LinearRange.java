package org.viscarta.quality;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import org.viscarta.sweep.Quantity;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;

/**
 * The linear range of an amplitude sweep: the plateau moduli at small amplitude, the amplitude
 * where the storage modulus leaves its plateau by a set fraction (5 % by default — common practice
 * in oscillatory rheology, not a standard), and the amplitude where E″ overtakes E′ when the sweep
 * reaches it.
 *
 * <p>The plateau is the mean E′ (and E″) over the smallest amplitudes, up to the first point that
 * departs from the running mean by more than half the limit (at least {@value #MIN_PLATEAU} points).
 * The limit is where E′ last crosses into departure and stays there to the end of the sweep,
 * interpolated linearly in E′ against log amplitude; a single noisy point before it does not end
 * the linear range.
 */
public final class LinearRange {

    /** Fewest points the plateau is averaged over. */
    static final int MIN_PLATEAU = 3;
    /** The usual departure that ends the linear range (common practice). */
    public static final double DEFAULT_DEPARTURE = 0.05;

    /**
     * @param quantity        which amplitude the values are in (strain as a fraction, stress in Pa, force in N, displacement in m)
     * @param frequencyHz     the sweep's frequency
     * @param plateauStorage  mean E′ over the plateau [Pa]
     * @param plateauLoss     mean E″ over the plateau [Pa]
     * @param plateauPoints   how many points the plateau averages
     * @param limit           amplitude where E′ leaves the plateau by {@code departure}; NaN when it never does or there is no plateau
     * @param crossover       amplitude where E″ = E′, NaN when not reached
     * @param departure       the fraction used (0.05 for 5 %)
     * @param maxAmplitude    the largest amplitude measured
     * @param minAmplitude    the smallest amplitude measured
     */
    public record Result(String sample, String replicate, Quantity quantity, double frequencyHz, double plateauStorage,
                         double plateauLoss, int plateauPoints, double limit, double crossover, double departure,
                         double minAmplitude, double maxAmplitude) {

        /** True when the sweep shows a plateau at small amplitude. */
        public boolean hasPlateau() {
            return plateauPoints >= MIN_PLATEAU;
        }

        /** True when E′ stays within the limit over the whole sweep. */
        public boolean linearThroughout() {
            return hasPlateau() && Double.isNaN(limit);
        }
    }

    private LinearRange() {
    }

    /**
     * Analyses one amplitude sweep.
     *
     * @param departure fraction of the plateau E′ that ends the linear range (0 &lt; departure &lt; 1)
     * @throws IllegalArgumentException when the sweep is not an amplitude sweep
     */
    public static Result of(Sweep s, double departure) {
        if (!s.isAmplitudeSweep()) {
            throw new IllegalArgumentException("not an amplitude sweep: " + s.sample());
        }
        if (!(departure > 0 && departure < 1)) {
            throw new IllegalArgumentException("departure must be between 0 and 1, got " + departure);
        }
        List<SweepPoint> pts = new ArrayList<>(s.points());
        pts.sort(Comparator.comparingDouble(SweepPoint::amplitude));
        int n = pts.size();
        double[] a = new double[n];
        double[] e1 = new double[n];
        double[] e2 = new double[n];
        for (int i = 0; i < n; i++) {
            a[i] = pts.get(i).amplitude();
            e1[i] = pts.get(i).storage();
            e2[i] = pts.get(i).loss();
        }
        // the plateau: the smallest amplitudes until one departs from the running mean by half the limit
        double sum1 = e1[0];
        double sum2 = e2[0];
        int k = 1;
        while (k < n && Math.abs(e1[k] / (sum1 / k) - 1) <= departure / 2) {
            sum1 += e1[k];
            sum2 += e2[k];
            k++;
        }
        double plateau = sum1 / k;
        double plateauLoss = sum2 / k;
        double limit = Double.NaN;
        if (k >= MIN_PLATEAU) {
            // the last point within the limit, after which every point is beyond it
            int last = n - 1;
            while (last >= 0 && Math.abs(e1[last] / plateau - 1) > departure) {
                last--;
            }
            if (last < n - 1 && last >= 0) {
                limit = crossing(a[last], e1[last] / plateau - 1, a[last + 1], e1[last + 1] / plateau - 1, departure);
            }
        }
        double crossover = Double.NaN;
        for (int i = 1; i < n; i++) {
            double d0 = Math.log(e2[i - 1] / e1[i - 1]);
            double d1 = Math.log(e2[i] / e1[i]);
            if (e2[i - 1] > 0 && e2[i] > 0 && d0 < 0 && d1 >= 0) {
                double t = d0 / (d0 - d1);
                crossover = Math.pow(10, Math.log10(a[i - 1]) + t * (Math.log10(a[i]) - Math.log10(a[i - 1])));
                break;
            }
        }
        return new Result(s.sample(), s.replicate(), s.amplitudeQuantity().orElseThrow(), s.minFrequencyHz(), plateau,
                plateauLoss, k, limit, crossover, departure, a[0], a[n - 1]);
    }

    /** The amplitude where the relative departure reaches ±departure between two points, linear in log amplitude. */
    private static double crossing(double a0, double d0, double a1, double d1, double departure) {
        double target = Math.signum(d1) * departure;
        double t = (target - d0) / (d1 - d0);
        if (!(t >= 0 && t <= 1)) {
            t = 0.5;
        }
        return Math.pow(10, Math.log10(a0) + t * (Math.log10(a1) - Math.log10(a0)));
    }

    /** An amplitude as users read it: strain in %, others in their SI unit. */
    public static String amplitudeText(Quantity q, double si) {
        return switch (q) {
            case STRAIN_AMPLITUDE -> String.format(Locale.ROOT, "%.3g %% strain", 100 * si);
            case STRESS_AMPLITUDE -> String.format(Locale.ROOT, "%.3g Pa stress", si);
            case FORCE_AMPLITUDE -> String.format(Locale.ROOT, "%.3g mN force", 1e3 * si);
            case DISPLACEMENT_AMPLITUDE -> String.format(Locale.ROOT, "%.3g µm displacement", 1e6 * si);
            default -> String.format(Locale.ROOT, "%.3g", si);
        };
    }

    /** The value written in a check's value column: strain amplitude in %, force in mN, displacement in µm, stress in Pa. */
    public static double reported(Quantity q, double si) {
        return switch (q) {
            case STRAIN_AMPLITUDE -> 100 * si;
            case FORCE_AMPLITUDE -> 1e3 * si;
            case DISPLACEMENT_AMPLITUDE -> 1e6 * si;
            default -> si;
        };
    }

    /** The unit of {@link #reported}. */
    public static String reportedUnit(Quantity q) {
        return switch (q) {
            case STRAIN_AMPLITUDE -> "% strain";
            case FORCE_AMPLITUDE -> "mN";
            case DISPLACEMENT_AMPLITUDE -> "µm";
            default -> "Pa";
        };
    }
}
