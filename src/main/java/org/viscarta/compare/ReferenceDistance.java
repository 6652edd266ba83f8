package org.viscarta.compare;

import org.viscarta.fit.DeltaMethod;
import org.viscarta.io.UsageException;
import java.util.Locale;
import org.viscarta.sweep.Numbers;

/**
 * The distance between two materials' viscoelastic behaviour over the frequency band both were
 * measured in, never extrapolating either: on a log-spaced grid of K frequencies across the shared
 * band, the root-mean-square difference, in decades, of log10 M′ and log10 M″ (metric
 * {@code moduli}), of log10 tan δ ({@code tan-delta}), or of all three ({@code all}), each side
 * evaluated from its best-supported fitted curve:
 *
 * \[ d = \sqrt{\frac{1}{2K}\sum_k\Big[(\log_{10}M'_a - \log_{10}M'_b)^2 + (\log_{10}M''_a - \log_{10}M''_b)^2\Big]_{f_k}} \]
 *
 * A distance of 0.1 means the curves differ by about 26 % on average (10^0.1 = 1.26). Its standard
 * error comes from both fits' parameter covariances by the delta method (numerical gradient).
 * A band shorter than {@code minOverlapDecades} is "not comparable"; a temperature difference
 * beyond {@code maxTemperatureDifferenceC} is flagged. Common practice for comparing spectra on
 * log axes [P]; no single published source.
 */
public final class ReferenceDistance {

    /** What is compared. */
    public enum Metric {
        MODULI("moduli", "log10 E′ and log10 E″"), TAN_DELTA("tan-delta", "log10 tan δ"),
        ALL("all", "log10 E′, log10 E″ and log10 tan δ");

        private final String label;
        private final String compared;

        Metric(String label, String compared) {
            this.label = label;
            this.compared = compared;
        }

        public String label() {
            return label;
        }

        /** What is compared, in words. */
        public String describe() {
            return compared;
        }

        public static Metric parse(String text) {
            for (Metric m : values()) {
                if (m.label.equals(text.strip().toLowerCase(Locale.ROOT))) {
                    return m;
                }
            }
            throw new UsageException("metric '" + text + "' is not known; use moduli, tan-delta or all");
        }
    }

    /** Relative step and smallest scale of the central differences behind the distance's standard error. */
    static final double GRADIENT_STEP = 1e-6;
    static final double GRADIENT_FLOOR = 1e-12;

    /** Grid points across the shared band. */
    public static final int GRID_POINTS = 25;

    /**
     * The comparison of a sample with one reference.
     *
     * @param distance       RMS difference in decades (NaN when not comparable)
     * @param uncertainty    its standard error (NaN when a covariance is missing)
     * @param bandLowHz      low end of the shared band
     * @param bandHighHz     high end
     * @param comparable     whether the distance could be computed
     * @param departureHz    where on the grid the curves differ most
     * @param departure      that largest difference, in decades (sample minus reference, the larger of M′ and M″)
     * @param note           why not comparable, or what to keep in mind
     */
    public record Result(double distance, double uncertainty, double bandLowHz, double bandHighHz, boolean comparable,
                         double departureHz, double departure, String note) {
    }

    private final Metric metric;
    private final double minOverlapDecades;
    private final double maxTemperatureDifferenceC;

    public ReferenceDistance(Metric metric, double minOverlapDecades, double maxTemperatureDifferenceC) {
        if (!(minOverlapDecades >= 0) || !(maxTemperatureDifferenceC >= 0)) {
            throw new UsageException("overlap and temperature limits must be >= 0");
        }
        this.metric = metric;
        this.minOverlapDecades = minOverlapDecades;
        this.maxTemperatureDifferenceC = maxTemperatureDifferenceC;
    }

    /** The comparison with the distance's standard error. */
    public Result between(FittedCurve a, FittedCurve b) {
        return between(a, b, true);
    }

    /**
     * The comparison; with {@code uncertainty} false the standard error is left NaN (it costs a
     * dozen distance evaluations; {@link #withUncertainty} adds it later to the matches shown).
     */
    public Result between(FittedCurve a, FittedCurve b, boolean uncertainty) {
        double lo = Math.max(a.lowHz(), b.lowHz());
        double hi = Math.min(a.highHz(), b.highHz());
        if (a.kind() != b.kind()) {
            return notComparable(lo, hi, "one holds " + a.kind() + " moduli, the other " + b.kind() + "; pass --basis to convert");
        }
        double decades = hi > lo ? Math.log10(hi / lo) : 0;
        if (decades < minOverlapDecades) {
            return notComparable(lo, hi, String.format(Locale.ROOT, "the measured bands overlap over %.2f decades, less than %s",
                    decades, Numbers.plain(minOverlapDecades)));
        }
        double[] grid = grid(lo, hi);
        double[] ma = onGrid(a, lo, hi, grid);
        double[] mb = onGrid(b, lo, hi, grid);
        double d = distance(ma, mb);
        double worstF = grid[0];
        double worst = 0;
        for (int k = 0; k < GRID_POINTS; k++) {
            double ds = Math.log10(ma[2 * k] / mb[2 * k]);
            double dl = Math.log10(ma[2 * k + 1] / mb[2 * k + 1]);
            double larger = Math.abs(ds) >= Math.abs(dl) ? ds : dl;
            if (Math.abs(larger) > Math.abs(worst)) {
                worst = larger;
                worstF = grid[k];
            }
        }
        String note = "";
        if (Double.isFinite(a.temperatureC()) && Double.isFinite(b.temperatureC())
                && Math.abs(a.temperatureC() - b.temperatureC()) > maxTemperatureDifferenceC) {
            note = String.format(Locale.ROOT, "measured at temperatures %s °C apart", Numbers.plain(Math.abs(a.temperatureC() - b.temperatureC())));
        }
        Result r = new Result(d, Double.NaN, lo, hi, true, worstF, worst, note);
        return uncertainty ? withUncertainty(a, b, r) : r;
    }

    /**
     * The result with the distance's standard error: both fits' parameter covariances propagated by
     * the delta method (central differences), each side's curve moved while the other stays on its
     * grid values; NaN when a covariance is missing.
     */
    public Result withUncertainty(FittedCurve a, FittedCurve b, Result r) {
        if (!r.comparable()) {
            return r;
        }
        double lo = r.bandLowHz();
        double hi = r.bandHighHz();
        double[] grid = grid(lo, hi);
        double[] ma = onGrid(a, lo, hi, grid);
        double[] mb = onGrid(b, lo, hi, grid);
        double var = 0;
        boolean known = true;
        for (int side = 0; side < 2; side++) {
            FittedCurve c = side == 0 ? a : b;
            double[][] cov = c.covariance();
            if (cov == null) {
                known = false;
                continue;
            }
            double[] fixed = side == 0 ? mb : ma;
            boolean first = side == 0;
            double[] grad = DeltaMethod.gradient(x -> {
                double[] moved = evaluate(c, x, grid);
                return first ? distance(moved, fixed) : distance(fixed, moved);
            }, c.params(), GRADIENT_STEP, GRADIENT_FLOOR);
            var += DeltaMethod.variance(grad, cov);
        }
        return new Result(r.distance(), known && var >= 0 ? Math.sqrt(var) : Double.NaN, lo, hi, true, r.departureHz(),
                r.departure(), r.note());
    }

    /** GRID_POINTS log-spaced frequencies from lo to hi, both included. */
    private static double[] grid(double lo, double hi) {
        double[] grid = new double[GRID_POINTS];
        for (int k = 0; k < GRID_POINTS; k++) {
            grid[k] = k == GRID_POINTS - 1 ? hi : lo * Math.pow(hi / lo, k / (double) (GRID_POINTS - 1));
        }
        return grid;
    }

    /** M′, M″ of a curve at its own parameters on the grid of a band: {M′0, M″0, M′1, …}, computed once per curve and band. */
    private double[] onGrid(FittedCurve c, double lo, double hi, double[] grid) {
        GridKey key = new GridKey(c, lo, hi);
        double[] cached = grids.get(key);
        if (cached != null) {
            return cached;
        }
        double[] m = evaluate(c, c.params(), grid);
        if (grids.size() < MAX_GRIDS) {
            grids.putIfAbsent(key, m);
        }
        return m;
    }

    private static double[] evaluate(FittedCurve c, double[] p, double[] grid) {
        double[] out = new double[2 * grid.length];
        for (int k = 0; k < grid.length; k++) {
            double[] m = c.modulus(p, grid[k]);
            out[2 * k] = m[0];
            out[2 * k + 1] = m[1];
        }
        return out;
    }

    /** Curves kept on their grids (2 × 25 numbers each: 10,000 sample-and-band pairs are 4 MB). */
    private static final int MAX_GRIDS = 50_000;
    private final java.util.concurrent.ConcurrentHashMap<GridKey, double[]> grids = new java.util.concurrent.ConcurrentHashMap<>();

    /** A curve (by identity) and a band. */
    private static final class GridKey {
        private final FittedCurve curve;
        private final double lo;
        private final double hi;

        GridKey(FittedCurve curve, double lo, double hi) {
            this.curve = curve;
            this.lo = lo;
            this.hi = hi;
        }

        @Override
        public boolean equals(Object o) {
            return o instanceof GridKey k && k.curve == curve && Double.compare(k.lo, lo) == 0 && Double.compare(k.hi, hi) == 0;
        }

        @Override
        public int hashCode() {
            return 31 * (31 * System.identityHashCode(curve) + Double.hashCode(lo)) + Double.hashCode(hi);
        }
    }

    private double distance(double[] ma, double[] mb) {
        double sum = 0;
        int terms = 0;
        for (int k = 0; k < GRID_POINTS; k++) {
            double sa = ma[2 * k];
            double la = ma[2 * k + 1];
            double sb = mb[2 * k];
            double lb = mb[2 * k + 1];
            if (metric != Metric.TAN_DELTA) {
                double ds = Math.log10(sa / sb);
                double dl = Math.log10(la / lb);
                sum += ds * ds + dl * dl;
                terms += 2;
            }
            if (metric != Metric.MODULI) {
                double dt = Math.log10((la / sa) / (lb / sb));
                sum += dt * dt;
                terms++;
            }
        }
        return Math.sqrt(sum / terms);
    }

    private static Result notComparable(double lo, double hi, String why) {
        return new Result(Double.NaN, Double.NaN, lo, hi, false, Double.NaN, Double.NaN, "not comparable: " + why);
    }

}
