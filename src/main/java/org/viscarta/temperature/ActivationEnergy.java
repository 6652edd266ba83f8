package org.viscarta.temperature;

import java.util.List;
import org.viscarta.fit.StudentT;

/**
 * The apparent activation energy of a transition from its temperature at several frequencies
 * (Arrhenius: f = f₀ exp(−E_a ∕ R T), so 1∕T = c − (R∕E_a) ln f). The transition temperature is
 * the measured, noisy variable, so 1∕T is regressed on ln f by ordinary least squares; E_a = −R∕d
 * for the slope d, and its 95 % interval is the Student-t interval of d (n − 2 degrees of
 * freedom) carried through E_a = −R∕d, which is monotone in d (textbook regression; the
 * frequency-shift form of the Arrhenius law as in DOMAIN §5).
 *
 * @param kjPerMol    E_a [kJ/mol]
 * @param ci95Low     lower end of the 95 % interval [kJ/mol]
 * @param ci95High    upper end [kJ/mol], NaN when the interval reaches a slope of zero (unbounded)
 * @param points      the number of temperatures used
 * @param frequencies the number of distinct frequencies
 */
public record ActivationEnergy(double kjPerMol, double ci95Low, double ci95High, int points, int frequencies) {

    /** A transition temperature at one frequency. */
    public record Point(double frequencyHz, double temperatureC) {
    }

    /**
     * The activation energy, or null when fewer than three temperatures at two or more
     * frequencies are given or the temperatures do not fall with frequency.
     */
    public static ActivationEnergy of(List<Point> points) {
        int n = points.size();
        long distinct = points.stream().mapToDouble(Point::frequencyHz).distinct().count();
        if (n < 3 || distinct < 2) {
            return null;
        }
        double mx = 0;
        double my = 0;
        for (Point p : points) {
            mx += Math.log(p.frequencyHz());
            my += 1 / (p.temperatureC() + ShiftLaws.KELVIN_OFFSET);
        }
        mx /= n;
        my /= n;
        double sxx = 0;
        double sxy = 0;
        for (Point p : points) {
            double dx = Math.log(p.frequencyHz()) - mx;
            sxx += dx * dx;
            sxy += dx * (1 / (p.temperatureC() + ShiftLaws.KELVIN_OFFSET) - my);
        }
        double slope = sxy / sxx;
        if (!(slope < 0)) {
            return null;
        }
        double rss = 0;
        for (Point p : points) {
            double fit = my + slope * (Math.log(p.frequencyHz()) - mx);
            double r = 1 / (p.temperatureC() + ShiftLaws.KELVIN_OFFSET) - fit;
            rss += r * r;
        }
        double se = Math.sqrt(rss / (n - 2) / sxx);
        double t = StudentT.quantile975(n - 2);
        double r = ShiftLaws.GAS_CONSTANT / 1000;
        double steep = slope - t * se;
        double shallow = slope + t * se;
        return new ActivationEnergy(-r / slope, -r / steep, shallow < 0 ? -r / shallow : Double.NaN, n, (int) distinct);
    }
}
