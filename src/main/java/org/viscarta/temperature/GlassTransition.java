package org.viscarta.temperature;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.DecompositionSolver;
import org.apache.commons.math3.linear.QRDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.SingularMatrixException;
import org.viscarta.sweep.Numbers;
import org.viscarta.sweep.Ramp;

/**
 * The glass transition of one temperature ramp by the three conventions of ASTM E1640-18
 * (<i>Standard Test Method for Assignment of the Glass Transition Temperature by Dynamic
 * Mechanical Analysis</i>; edition and wording from memory): the extrapolated onset of the drop of
 * the storage modulus, the peak of the loss modulus and the peak of tan δ.
 *
 * <p>Each is located on a smooth local fit, never on the largest noisy point:
 * <ul>
 * <li>a peak — a cubic in temperature fitted by least squares to ln M″ (or ln tan δ) over the
 * points within 20 % of the smoothed peak height (at least {@link #MIN_WINDOW} points); the peak is
 * where the cubic's slope is zero, and its standard error follows from the fit's covariance by the
 * delta method (dT*∕dβ_k = −k u*^(k−1) ∕ p″(u*));</li>
 * <li>the onset — on ln M′ (the standard plots the storage modulus on a logarithmic axis), the
 * tangent at the inflection point (a cubic fitted around the steepest stretch; its inflection, or
 * the window's centre when the stretch is straight) crossed with a straight line fitted to the
 * glassy region below the transition (points whose smoothed slope is under 10 % of the steepest);
 * the standard error by the delta method over both fits' covariances.</li>
 * </ul>
 * The smoothed curve (a local quadratic over {@code max(3, n/25)} neighbours on each side) only
 * finds the peak, the steepest stretch and the plateaus; the numbers come from the fits. The tan δ
 * peak's height is the fitted cubic's value at the peak, its full width at half maximum is read on
 * the smoothed curve against a zero baseline (common practice). Glassy and rubbery moduli are
 * geometric means of M′ over the plateaus found.
 */
public final class GlassTransition {

    /** The least number of points a local fit uses. */
    public static final int MIN_WINDOW = 7;

    /** A peak's window holds the points within this fraction of its smoothed height. */
    public static final double PEAK_WINDOW_FRACTION = 0.8;

    /** A plateau's smoothed slope of ln M′ is under this fraction of the steepest. */
    public static final double PLATEAU_SLOPE_FRACTION = 0.1;

    /** The fewest points a ramp needs before a transition is looked for. */
    public static final int MIN_POINTS = 15;

    private GlassTransition() {
    }

    /** The three conventions, in the order of temperature they usually give. */
    public enum Convention {
        STORAGE_ONSET("E′ onset", "onset of the storage modulus drop"),
        LOSS_PEAK("E″ peak", "peak of the loss modulus"),
        TAN_DELTA_PEAK("tan δ peak", "peak of tan δ");

        private final String label;
        private final String description;

        Convention(String label, String description) {
            this.label = label;
            this.description = description;
        }

        /** Short label with E (tensile) moduli; {@link #label(boolean)} for shear. */
        public String label() {
            return label;
        }

        /** The label with G′/G″ for shear moduli. */
        public String label(boolean shear) {
            return shear ? label.replace('E', 'G') : label;
        }

        public String description() {
            return description;
        }
    }

    /**
     * One located temperature, or why there is none.
     *
     * @param valueC      the temperature [°C], NaN when not found
     * @param stdError    its standard error [°C] from the local fit
     * @param window      the window used, in words ("" when none)
     * @param problem     why no temperature is given ("" when found)
     */
    public record Estimate(double valueC, double stdError, String window, String problem) {
        static Estimate missing(String why) {
            return new Estimate(Double.NaN, Double.NaN, "", why);
        }

        public boolean found() {
            return problem.isEmpty();
        }
    }

    /**
     * The transition of one ramp.
     *
     * @param ramp            the ramp
     * @param onset           extrapolated onset of the M′ drop
     * @param lossPeak        peak of M″
     * @param tanDeltaPeak    peak of tan δ
     * @param peakHeight      tan δ at its peak (fitted), NaN when no peak
     * @param peakHeightSe    its standard error
     * @param fwhmC           full width of the tan δ peak at half its height [°C], NaN when it does not fall to half inside the range
     * @param fwhmProblem     why no width is given ("" when given)
     * @param glassyStorage   geometric mean M′ of the glassy plateau [Pa], NaN when none
     * @param glassyWindow    the plateau in words ("" when none)
     * @param rubberyStorage  geometric mean M′ of the rubbery plateau [Pa], NaN when none
     * @param rubberyWindow   the plateau in words ("" when none)
     */
    public record Result(Ramp ramp, Estimate onset, Estimate lossPeak, Estimate tanDeltaPeak, double peakHeight,
                         double peakHeightSe, double fwhmC, String fwhmProblem, double glassyStorage, String glassyWindow,
                         double rubberyStorage, String rubberyWindow) {

        public Estimate estimate(Convention c) {
            return switch (c) {
                case STORAGE_ONSET -> onset;
                case LOSS_PEAK -> lossPeak;
                case TAN_DELTA_PEAK -> tanDeltaPeak;
            };
        }
    }

    /** The transition of one ramp by the three conventions. */
    public static Result of(Ramp ramp) {
        List<Ramp.Point> pts = ramp.points();
        int n = pts.size();
        if (n < MIN_POINTS) {
            String why = String.format(Locale.ROOT, "too few points (%d; a transition needs at least %d)", n, MIN_POINTS);
            Estimate m = Estimate.missing(why);
            return new Result(ramp, m, m, m, Double.NaN, Double.NaN, Double.NaN, why, Double.NaN, "", Double.NaN, "");
        }
        double[] t = new double[n];
        double[] lnStorage = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = pts.get(i).temperatureC();
            lnStorage[i] = Math.log(pts.get(i).storage());
        }
        int half = Math.max(3, n / 25);
        // loss and tan δ peaks on the points with a positive loss modulus
        List<Ramp.Point> positive = pts.stream().filter(p -> p.loss() > 0).toList();
        double[] tp = positive.stream().mapToDouble(Ramp.Point::temperatureC).toArray();
        double[] lnLoss = positive.stream().mapToDouble(p -> Math.log(p.loss())).toArray();
        double[] lnTan = positive.stream().mapToDouble(p -> Math.log(p.lossTangent())).toArray();
        Peak loss = peak(tp, lnLoss, half);
        Peak tan = peak(tp, lnTan, half);
        double fwhm = Double.NaN;
        String fwhmProblem = tan.estimate.found() ? "" : tan.estimate.problem;
        if (tan.estimate.found()) {
            double[] s = smooth(tp, lnTan, half)[0];
            double target = Math.log(tan.height / 2);
            double lowSide = crossing(tp, s, tan.index, -1, target);
            double highSide = crossing(tp, s, tan.index, +1, target);
            if (Double.isNaN(lowSide) || Double.isNaN(highSide)) {
                fwhmProblem = "tan δ does not fall to half its peak on the " + (Double.isNaN(lowSide) ? "cold" : "warm")
                        + " side inside the range";
            } else {
                fwhm = highSide - lowSide;
            }
        }
        Onset onset = onset(t, lnStorage, half);
        return new Result(ramp, onset.estimate, loss.estimate, tan.estimate, tan.height, tan.heightSe, fwhm, fwhmProblem,
                onset.glassy, onset.glassyWindow, onset.rubbery, onset.rubberyWindow);
    }

    private record Peak(Estimate estimate, double height, double heightSe, int index) {
    }

    private static Peak peak(double[] t, double[] y, int half) {
        int n = t.length;
        if (n < MIN_POINTS) {
            return new Peak(Estimate.missing(String.format(Locale.ROOT, "too few points with a positive loss modulus (%d)", n)),
                    Double.NaN, Double.NaN, -1);
        }
        double[] s = smooth(t, y, half)[0];
        int top = 0;
        for (int i = 1; i < n; i++) {
            if (s[i] > s[top]) {
                top = i;
            }
        }
        if (top < 2 || top > n - 3) {
            return new Peak(Estimate.missing("no peak inside the measured range (the largest value is at the "
                    + (top < 2 ? "cold" : "warm") + " end, " + Numbers.plain(round1(t[top])) + " °C)"), Double.NaN, Double.NaN, -1);
        }
        double limit = s[top] + Math.log(PEAK_WINDOW_FRACTION);
        int lo = top;
        int hi = top;
        while (lo > 0 && s[lo - 1] >= limit) {
            lo--;
        }
        while (hi < n - 1 && s[hi + 1] >= limit) {
            hi++;
        }
        if (lo == 0 && s[0] >= limit || hi == n - 1 && s[n - 1] >= limit) {
            return new Peak(Estimate.missing("the peak is not inside the measured range (it stays within 20 % of its height up "
                    + "to the " + (lo == 0 ? "cold" : "warm") + " end)"), Double.NaN, Double.NaN, -1);
        }
        while (hi - lo + 1 < MIN_WINDOW && (lo > 0 || hi < n - 1)) {
            if (lo > 0) {
                lo--;
            }
            if (hi - lo + 1 < MIN_WINDOW && hi < n - 1) {
                hi++;
            }
        }
        int m = hi - lo + 1;
        if (m < MIN_WINDOW) {
            return new Peak(Estimate.missing(String.format(Locale.ROOT, "too few points around the peak (%d; %d needed)", m,
                    MIN_WINDOW)), Double.NaN, Double.NaN, -1);
        }
        double centre = t[top];
        double scale = Math.max(1e-9, (t[hi] - t[lo]) / 2);
        Poly fit = Poly.fit(t, y, lo, hi, centre, scale, 3);
        if (fit == null) {
            return new Peak(Estimate.missing("the points around the peak cannot be fitted (repeated temperatures)"),
                    Double.NaN, Double.NaN, -1);
        }
        double b1 = fit.beta[1];
        double b2 = fit.beta[2];
        double b3 = fit.beta[3];
        double ulo = (t[lo] - centre) / scale;
        double uhi = (t[hi] - centre) / scale;
        double best = Double.NaN;
        for (double u : roots(3 * b3, 2 * b2, b1)) {
            if (u >= ulo && u <= uhi && fit.second(u) < 0 && (Double.isNaN(best) || Math.abs(u) < Math.abs(best))) {
                best = u;
            }
        }
        String window = String.format(Locale.ROOT, "cubic over %s to %s °C (%d points)", Numbers.plain(round1(t[lo])),
                Numbers.plain(round1(t[hi])), m);
        if (Double.isNaN(best)) {
            return new Peak(Estimate.missing("no maximum of the local fit inside its window (" + window + ")"), Double.NaN,
                    Double.NaN, -1);
        }
        double u = best;
        double p2 = fit.second(u);
        double[] g = {0, -1 / p2, -2 * u / p2, -3 * u * u / p2};
        double seU = Math.sqrt(Math.max(0, fit.quadratic(g)));
        double[] h = {1, u, u * u, u * u * u};
        double lnHeight = fit.value(u);
        double seLn = Math.sqrt(Math.max(0, fit.quadratic(h)));
        double height = Math.exp(lnHeight);
        return new Peak(new Estimate(centre + scale * u, scale * seU, window, ""), height, height * seLn, top);
    }

    private record Onset(Estimate estimate, double glassy, String glassyWindow, double rubbery, String rubberyWindow) {
    }

    private static Onset onset(double[] t, double[] lnE, int half) {
        int n = t.length;
        double[][] sm = smooth(t, lnE, half);
        double[] s = sm[0];
        double[] d = sm[1];
        int steep = 0;
        for (int i = 1; i < n; i++) {
            if (d[i] < d[steep]) {
                steep = i;
            }
        }
        double max = java.util.Arrays.stream(s).max().orElse(0);
        double min = java.util.Arrays.stream(s).min().orElse(0);
        if (!(d[steep] < 0) || max - min < Math.log(2)) {
            return new Onset(Estimate.missing("no drop of the storage modulus inside the range (it changes by less than a factor 2)"),
                    Double.NaN, "", Double.NaN, "");
        }
        // the steep stretch: slope at least half the steepest, around the steepest point
        int a = steep;
        int b = steep;
        while (a > 0 && d[a - 1] <= 0.5 * d[steep]) {
            a--;
        }
        while (b < n - 1 && d[b + 1] <= 0.5 * d[steep]) {
            b++;
        }
        // the plateaus: slope under 10 % of the steepest, below and above the stretch
        List<Integer> glassy = new ArrayList<>();
        for (int i = 0; i < a; i++) {
            if (Math.abs(d[i]) <= PLATEAU_SLOPE_FRACTION * Math.abs(d[steep])) {
                glassy.add(i);
            }
        }
        List<Integer> rubbery = new ArrayList<>();
        for (int i = b + 1; i < n; i++) {
            if (Math.abs(d[i]) <= PLATEAU_SLOPE_FRACTION * Math.abs(d[steep])) {
                rubbery.add(i);
            }
        }
        double glassyModulus = Double.NaN;
        String glassyWindow = "";
        if (glassy.size() >= 3) {
            glassyModulus = Math.exp(glassy.stream().mapToDouble(i -> lnE[i]).average().orElse(Double.NaN));
            glassyWindow = window(t, glassy);
        }
        double rubberyModulus = Double.NaN;
        String rubberyWindow = "";
        if (rubbery.size() >= 3) {
            rubberyModulus = Math.exp(rubbery.stream().mapToDouble(i -> lnE[i]).average().orElse(Double.NaN));
            rubberyWindow = window(t, rubbery);
        }
        if (a == 0 || steep < 2) {
            return new Onset(Estimate.missing("the drop of the storage modulus starts at the cold end of the range"),
                    glassyModulus, glassyWindow, rubberyModulus, rubberyWindow);
        }
        if (glassy.size() < 5) {
            return new Onset(Estimate.missing(String.format(Locale.ROOT, "no glassy region below the transition inside the range "
                    + "(%d points with a slope under 10 %% of the steepest; 5 needed)", glassy.size())),
                    glassyModulus, glassyWindow, rubberyModulus, rubberyWindow);
        }
        // the steepest point: the middle of the stretch within 1 % of the steepest slope (a straight drop has no single one)
        int first = steep;
        int last = steep;
        while (first > a && d[first - 1] <= 0.99 * d[steep]) {
            first--;
        }
        while (last < b && d[last + 1] <= 0.99 * d[steep]) {
            last++;
        }
        steep = (first + last) / 2;
        // inflection window: a quarter of the steep stretch's width on each side of its steepest point
        double reach = (t[b] - t[a]) / 4;
        int lo = steep;
        int hi = steep;
        while (lo > 0 && t[lo - 1] >= t[steep] - reach) {
            lo--;
        }
        while (hi < n - 1 && t[hi + 1] <= t[steep] + reach) {
            hi++;
        }
        while (hi - lo + 1 < MIN_WINDOW && (lo > 0 || hi < n - 1)) {
            if (lo > 0) {
                lo--;
            }
            if (hi - lo + 1 < MIN_WINDOW && hi < n - 1) {
                hi++;
            }
        }
        double centre = t[steep];
        double scale = Math.max(1e-9, (t[hi] - t[lo]) / 2);
        Poly cubic = Poly.fit(t, lnE, lo, hi, centre, scale, 3);
        int[] gi = glassy.stream().mapToInt(Integer::intValue).toArray();
        Poly line = Poly.fitAt(t, lnE, gi, centre, scale, 1);
        if (cubic == null || line == null) {
            return new Onset(Estimate.missing("the points around the drop cannot be fitted (repeated temperatures)"),
                    glassyModulus, glassyWindow, rubberyModulus, rubberyWindow);
        }
        double ulo = (t[lo] - centre) / scale;
        double uhi = (t[hi] - centre) / scale;
        double u0 = onsetU(cubic.beta, line.beta, ulo, uhi);
        String window = String.format(Locale.ROOT, "glassy line over %s, inflection tangent from a cubic over %s to %s °C "
                + "(%d points)", glassyWindow, Numbers.plain(round1(t[lo])), Numbers.plain(round1(t[hi])), hi - lo + 1);
        if (Double.isNaN(u0) || centre + scale * u0 < t[0] || centre + scale * u0 > t[steep]) {
            return new Onset(Estimate.missing("the glassy line and the inflection tangent do not cross between the cold end "
                    + "and the steepest point (" + window + ")"), glassyModulus, glassyWindow, rubberyModulus, rubberyWindow);
        }
        double var = 0;
        for (Poly p : List.of(cubic, line)) {
            double[] grad = new double[p.beta.length];
            for (int k = 0; k < grad.length; k++) {
                double step = Math.max(1e-12, 1e-4 * Math.sqrt(Math.max(0, p.cov[k][k])));
                double[] up = p.beta.clone();
                double[] down = p.beta.clone();
                up[k] += step;
                down[k] -= step;
                double fu = p == cubic ? onsetU(up, line.beta, ulo, uhi) : onsetU(cubic.beta, up, ulo, uhi);
                double fd = p == cubic ? onsetU(down, line.beta, ulo, uhi) : onsetU(cubic.beta, down, ulo, uhi);
                grad[k] = (fu - fd) / (2 * step);
            }
            var += p.quadratic(grad);
        }
        return new Onset(new Estimate(centre + scale * u0, scale * Math.sqrt(Math.max(0, var)), window, ""),
                glassyModulus, glassyWindow, rubberyModulus, rubberyWindow);
    }

    /**
     * Where the glassy line crosses the tangent at the cubic's inflection (its window's centre when
     * the inflection falls outside the window), in the scaled coordinate; NaN when they are parallel.
     */
    static double onsetU(double[] cubic, double[] line, double ulo, double uhi) {
        double ui = Math.abs(cubic[3]) > 1e-12 ? -cubic[2] / (3 * cubic[3]) : 0;
        if (!(ui >= ulo && ui <= uhi)) {
            ui = 0;
        }
        double value = cubic[0] + ui * (cubic[1] + ui * (cubic[2] + ui * cubic[3]));
        double slope = cubic[1] + ui * (2 * cubic[2] + 3 * ui * cubic[3]);
        // line[0] + line[1] u = value + slope (u − ui)
        double denominator = line[1] - slope;
        if (Math.abs(denominator) < 1e-300) {
            return Double.NaN;
        }
        return (value - slope * ui - line[0]) / denominator;
    }

    private static String window(double[] t, List<Integer> idx) {
        return String.format(Locale.ROOT, "%s to %s °C (%d points)", Numbers.plain(round1(t[idx.get(0)])),
                Numbers.plain(round1(t[idx.get(idx.size() - 1)])), idx.size());
    }

    private static double round1(double v) {
        return Math.round(v * 10) / 10.0;
    }

    /** Where the smoothed curve falls to {@code target}, walking from {@code from} in {@code dir}; NaN if it never does. */
    private static double crossing(double[] t, double[] s, int from, int dir, double target) {
        for (int i = from; i + dir >= 0 && i + dir < t.length; i += dir) {
            int j = i + dir;
            if (s[i] >= target && s[j] < target) {
                return t[i] + (t[j] - t[i]) * (s[i] - target) / (s[i] - s[j]);
            }
        }
        return Double.NaN;
    }

    /** Real roots of a x² + b x + c (a linear or empty set when a vanishes). */
    private static double[] roots(double a, double b, double c) {
        if (Math.abs(a) < 1e-14 * (Math.abs(b) + Math.abs(c))) {
            return b == 0 ? new double[0] : new double[] {-c / b};
        }
        double disc = b * b - 4 * a * c;
        if (disc < 0) {
            return new double[0];
        }
        double q = -0.5 * (b + Math.copySign(Math.sqrt(disc), b));
        return q == 0 ? new double[] {0} : new double[] {q / a, c / q};
    }

    /**
     * The local-quadratic smooth of y and its slope at each point, over {@code half} neighbours on
     * each side (fewer at the ends; at least three points).
     */
    static double[][] smooth(double[] t, double[] y, int half) {
        int n = t.length;
        double[] value = new double[n];
        double[] slope = new double[n];
        for (int i = 0; i < n; i++) {
            int lo = Math.max(0, i - half);
            int hi = Math.min(n - 1, i + half);
            double scale = Math.max(1e-9, (t[hi] - t[lo]) / 2);
            Poly p = hi - lo + 1 >= 4 ? Poly.fit(t, y, lo, hi, t[i], scale, 2) : null;
            if (p == null) {
                p = Poly.fit(t, y, lo, hi, t[i], scale, 1);
            }
            value[i] = p == null ? y[i] : p.beta[0];
            slope[i] = p == null ? 0 : p.beta[1] / scale;
        }
        return new double[][] {value, slope};
    }

    /** A least-squares polynomial in u = (T − centre)/scale with its coefficient covariance. */
    private static final class Poly {
        final double[] beta;
        final double[][] cov;

        private Poly(double[] beta, double[][] cov) {
            this.beta = beta;
            this.cov = cov;
        }

        static Poly fit(double[] t, double[] y, int lo, int hi, double centre, double scale, int degree) {
            int[] idx = java.util.stream.IntStream.rangeClosed(lo, hi).toArray();
            return fitAt(t, y, idx, centre, scale, degree);
        }

        static Poly fitAt(double[] t, double[] y, int[] idx, double centre, double scale, int degree) {
            int m = idx.length;
            int k = degree + 1;
            if (m < k) {
                return null;
            }
            double[][] x = new double[m][k];
            double[] yy = new double[m];
            for (int r = 0; r < m; r++) {
                double u = (t[idx[r]] - centre) / scale;
                double v = 1;
                for (int c = 0; c < k; c++) {
                    x[r][c] = v;
                    v *= u;
                }
                yy[r] = y[idx[r]];
            }
            RealMatrix xm = new Array2DRowRealMatrix(x, false);
            DecompositionSolver solver = new QRDecomposition(xm, 1e-12).getSolver();
            double[] beta;
            double[][] inv;
            try {
                beta = solver.solve(new ArrayRealVector(yy, false)).toArray();
                inv = new QRDecomposition(xm.transpose().multiply(xm), 1e-14).getSolver().getInverse().getData();
            } catch (SingularMatrixException e) {
                return null;
            }
            double rss = 0;
            for (int r = 0; r < m; r++) {
                double f = 0;
                for (int c = 0; c < k; c++) {
                    f += x[r][c] * beta[c];
                }
                rss += (yy[r] - f) * (yy[r] - f);
            }
            double s2 = m > k ? rss / (m - k) : 0;
            for (double[] row : inv) {
                for (int c = 0; c < k; c++) {
                    row[c] *= s2;
                }
            }
            return new Poly(beta, inv);
        }

        double value(double u) {
            double v = 0;
            for (int c = beta.length - 1; c >= 0; c--) {
                v = v * u + beta[c];
            }
            return v;
        }

        double second(double u) {
            return 2 * beta[2] + (beta.length > 3 ? 6 * beta[3] * u : 0);
        }

        /** gᵀ C g. */
        double quadratic(double[] g) {
            double s = 0;
            for (int i = 0; i < g.length; i++) {
                for (int j = 0; j < g.length; j++) {
                    s += g[i] * cov[i][j] * g[j];
                }
            }
            return s;
        }
    }
}
