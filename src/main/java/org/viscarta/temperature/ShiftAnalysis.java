package org.viscarta.temperature;

import org.viscarta.io.UsageException;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import org.viscarta.sweep.Numbers;
import java.util.Map;
import java.util.TreeMap;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.univariate.BrentOptimizer;
import org.apache.commons.math3.optim.univariate.SearchInterval;
import org.apache.commons.math3.optim.univariate.UnivariateObjectiveFunction;
import org.apache.commons.math3.optim.univariate.UnivariatePointValuePair;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;

/**
 * Time–temperature superposition of one sample's sweeps at several temperatures (DOMAIN.md
 * section 6): G(ω; T) = b_T G(a_T ω; T0). Each curve is superposed on its warmer neighbour by the
 * horizontal shift log10 a that minimises, on a log-frequency grid over their overlap, the squared
 * differences of log10 tan δ (which no vertical factor changes) and of log10 |E*| (divided by b_T):
 * a pairwise, geometric superposition in the spirit of the minimum-distance methods (Bae, Cho, Seo
 * &amp; Kang 2011, Korea-Aust. Rheol. J. 23:81–87; estimate a_T from tan δ first, common practice [P]).
 * The pairwise shifts are chained to the reference temperature; their variances add. A pair whose
 * best overlap is shorter than the minimum is reported, not forced, and breaks the chain.
 */
public final class ShiftAnalysis {

    /** Grid points over an overlap. */
    private static final int GRID = 25;
    /** Scan step of the shift before refinement [decades]. */
    private static final double SCAN_STEP = 0.02;
    /** RMS misfit of superposed curves [decades] above which superposition is called poor (lab convention [P]). */
    public static final double POOR_SUPERPOSITION = 0.05;

    /** How vertical factors b_T are set. */
    public enum Vertical {
        /** b_T = 1. */
        NONE("horizontal shifts only (b_T = 1)"),
        /** b_T = T/T0 in kelvin (ρ = ρ0), the entropic-elasticity factor (Ferry 1980). */
        ENTROPIC("horizontal shifts with entropic vertical factors b_T = T/T0 (kelvin)"),
        /**
         * b_T fitted: the horizontal shift from log tan δ alone, then the vertical offset of log |E*|
         * over the overlap at that shift.
         */
        FITTED("horizontal shifts from tan δ, then vertical factors b_T fitted to log |E*|");

        private final String description;

        Vertical(String description) {
            this.description = description;
        }

        /** The shifts in words, as Provenance states them. */
        public String describe() {
            return description;
        }

        public static Vertical parse(String s) {
            switch (s.strip().toLowerCase(Locale.ROOT)) {
                case "none": return NONE;
                case "entropic": return ENTROPIC;
                case "fitted": return FITTED;
                default: throw new UsageException("--vertical takes none, entropic or fitted, not '" + s + "'");
            }
        }
    }

    /**
     * The superposition of one colder curve on its warmer neighbour.
     *
     * @param phaseGapDeg      at equal |E*| (van Gurp–Palmen plane), the phase angle of the warm curve
     *                         minus that of the cold one [°] (NaN when their |E*| ranges barely overlap)
     * @param phaseGapStdError its standard error [°]
     * @param phaseOnlyShift   the shift [decades] that superposes the phase angles alone (NaN when the loss
     *                         tangent is too flat to fix one, or the curves cannot overlap enough)
     */
    public record PairShift(double coldC, double warmC, double log10Shift, double stdError, double overlapDecades, double rmsMisfit,
                            boolean shifted, String note, double log10Vertical, double verticalStdError, double phaseGapDeg,
                            double phaseGapStdError, double phaseOnlyShift) {

        PairShift withStdError(double se) {
            return new PairShift(coldC, warmC, log10Shift, se, overlapDecades, rmsMisfit, shifted, note, log10Vertical,
                    verticalStdError, phaseGapDeg, phaseGapStdError, phaseOnlyShift);
        }

        PairShift withPhase(double[] gap, double phaseShift) {
            return new PairShift(coldC, warmC, log10Shift, stdError, overlapDecades, rmsMisfit, shifted, note, log10Vertical,
                    verticalStdError, gap[0], gap[1], phaseShift);
        }

        /** How far the phase-only shift lies from the shift used [decades] (NaN when either is missing). */
        public double phaseShiftDifference() {
            return shifted ? Math.abs(phaseOnlyShift - log10Shift) : Double.NaN;
        }
    }

    /**
     * Thermorheological simplicity is questioned (conventions of this product, not a standard) when,
     * at equal |E*|, the phase angles of neighbouring temperatures differ by more than this [°] and by
     * more than twice their standard error ...
     */
    public static final double PHASE_GAP_DEG = 1.0;
    /** ... or when shifting by the phase angle alone moves a curve by more than this [decades] from the shift used. */
    public static final double PHASE_SHIFT_DECADES = 0.3;
    /** A curve whose log tan δ varies less than this [decades] over its frequencies gives no phase-only shift. */
    static final double MIN_PHASE_VARIATION = 0.1;

    /** The factors of one temperature, relative to the reference. */
    public record Factor(double temperatureC, double log10aT, double log10aTStdError, double bT, boolean placed, double log10bTStdError) {
        public double aT() {
            return Math.pow(10, log10aT);
        }
    }

    /**
     * @param referenceC  the reference temperature
     * @param factors     one per temperature, coldest first
     * @param pairs       the neighbour superpositions
     * @param wlf         the WLF fit (null with fewer than three shifted temperatures besides the reference)
     * @param arrhenius   the Arrhenius fit (null with fewer than two)
     * @param master      the master curve at the reference temperature (placed temperatures only)
     * @param notes       conclusions and warnings in words
     */
    public record Result(double referenceC, List<Factor> factors, List<PairShift> pairs, ShiftFits.Fit wlf, ShiftFits.Fit arrhenius,
                         List<SweepPoint> master, List<String> notes) {
    }

    private record Curve(double tC, double[] logF, double[] logTan, double[] logMag) {
    }

    private final double minOverlapDecades;
    private final Vertical vertical;

    public ShiftAnalysis(double minOverlapDecades, Vertical vertical) {
        this.minOverlapDecades = minOverlapDecades;
        this.vertical = vertical;
    }

    /**
     * @param sweeps     the sample's sweeps (replicates allowed) at two or more temperatures
     * @param referenceC one of the measured temperatures
     */
    public Result analyse(List<Sweep> sweeps, double referenceC) {
        Map<Double, List<Sweep>> byT = new TreeMap<>();
        for (Sweep s : sweeps) {
            if (!Double.isFinite(s.temperatureC())) {
                throw new UsageException("sample '" + s.sample() + "' has a sweep without a temperature; "
                        + "add '# temperature: 23 °C' or a temperature column");
            }
            byT.computeIfAbsent(s.temperatureC(), k -> new ArrayList<>()).add(s);
        }
        if (byT.size() < 2) {
            throw new UsageException("superposition needs sweeps at two or more temperatures; found " + byT.size());
        }
        if (!byT.containsKey(referenceC)) {
            throw new UsageException(String.format(Locale.ROOT, "the reference temperature %s °C is not one of the measured "
                    + "temperatures (%s); choose one of them (the WLF constants can then be referred to any temperature)",
                    Numbers.plain(referenceC), String.join(", ", byT.keySet().stream().map(Numbers::plain).toList())));
        }
        List<Curve> curves = new ArrayList<>();
        for (Map.Entry<Double, List<Sweep>> e : byT.entrySet()) {
            curves.add(curve(e.getKey(), e.getValue(), referenceC));
        }
        List<PairShift> pairs = new ArrayList<>();
        for (int i = 0; i + 1 < curves.size(); i++) {
            Curve cold = curves.get(i);
            Curve warm = curves.get(i + 1);
            pairs.add(pair(cold, warm).withPhase(phaseGap(cold, warm), phaseOnlyShift(cold, warm)));
        }
        int ref = new ArrayList<>(byT.keySet()).indexOf(referenceC);
        double[][] boot = bootstrap(curves, pairs, ref);
        if (boot != null) {
            for (int i = 0; i < pairs.size(); i++) {
                if (pairs.get(i).shifted()) {
                    pairs.set(i, pairs.get(i).withStdError(boot[0][i]));
                }
            }
        }
        List<Factor> factors = new ArrayList<>();
        for (int i = 0; i < curves.size(); i++) {
            double log = 0;
            double var = 0;
            boolean placed = true;
            double logB = 0;
            double varB = 0;
            for (int k = Math.min(i, ref); k < Math.max(i, ref); k++) {
                PairShift p = pairs.get(k);
                placed &= p.shifted();
                log += p.log10Shift();
                var += p.stdError() * p.stdError();
                logB += p.log10Vertical();
                varB += p.verticalStdError() * p.verticalStdError();
            }
            double sign = i < ref ? 1 : i == ref ? 0 : -1;
            double t = curves.get(i).tC();
            double b = vertical == Vertical.FITTED ? Math.pow(10, i == ref ? 0.0 : sign * logB) : bT(t, referenceC);
            double se = boot != null ? boot[1][i] : Math.sqrt(var);
            factors.add(new Factor(t, placed ? (i == ref ? 0.0 : sign * log) : Double.NaN, placed ? se : Double.NaN, b,
                    placed, vertical == Vertical.FITTED ? Math.sqrt(varB) : 0));
        }
        List<String> notes = new ArrayList<>();
        double worst = 0;
        for (PairShift p : pairs) {
            if (!p.shifted()) {
                notes.add(p.note());
            } else {
                worst = Math.max(worst, p.rmsMisfit());
            }
        }
        double worstGap = 0;
        double worstPhaseShift = 0;
        boolean gapQuestioned = false;
        boolean phaseShiftQuestioned = false;
        for (PairShift p : pairs) {
            if (Double.isFinite(p.phaseGapDeg())) {
                worstGap = Math.max(worstGap, Math.abs(p.phaseGapDeg()));
                gapQuestioned |= Math.abs(p.phaseGapDeg()) > PHASE_GAP_DEG && Math.abs(p.phaseGapDeg()) > 2 * p.phaseGapStdError();
            }
            if (Double.isFinite(p.phaseShiftDifference())) {
                worstPhaseShift = Math.max(worstPhaseShift, p.phaseShiftDifference());
                phaseShiftQuestioned |= p.phaseShiftDifference() > PHASE_SHIFT_DECADES;
            }
        }
        String phase = String.format(Locale.ROOT, "at equal |E*| the phase angles of neighbouring temperatures differ by up to %.1f° "
                + "(van Gurp–Palmen), and shifting by the phase angle alone moves a curve by up to %.2f decades from the shift used",
                worstGap, worstPhaseShift);
        if (worst > POOR_SUPERPOSITION) {
            notes.add(String.format(Locale.ROOT, "Superposition is poor: after shifting, neighbouring curves still differ by up to "
                    + "%.3f decades (RMS of log tan δ and log |E*|), more than %.2f; %s. The material may not be thermorheologically "
                    + "simple.", worst, POOR_SUPERPOSITION, phase));
        } else if (gapQuestioned || phaseShiftQuestioned) {
            notes.add(String.format(Locale.ROOT, "Superposition is questionable: the curves can be laid over each other (within "
                    + "%.3f decades RMS), but %s — more than %.0f° or %.1f decades, the limits this product uses. Shifts cannot change "
                    + "a phase angle at a given |E*|, so the material is probably not thermorheologically simple: treat the master "
                    + "curve and the shift factors as approximate.", worst, phase, PHASE_GAP_DEG, PHASE_SHIFT_DECADES));
        } else {
            notes.add(String.format(Locale.ROOT, "Neighbouring curves superpose to within %.3f decades (RMS); %s, consistent with "
                    + "thermorheological simplicity.", worst, phase));
        }
        ShiftFits.Fit wlf = ShiftFits.wlf(factors, referenceC);
        ShiftFits.Fit arr = ShiftFits.arrhenius(factors, referenceC);
        notes.add(ShiftFits.whichSupported(wlf, arr));
        List<SweepPoint> master = new ArrayList<>();
        for (Factor f : factors) {
            if (!f.placed()) {
                continue;
            }
            for (Sweep s : byT.get(f.temperatureC())) {
                for (SweepPoint p : s.points()) {
                    master.add(new SweepPoint(p.frequencyHz() * f.aT(), p.storage() / f.bT(), p.loss() / f.bT(), p.line()));
                }
            }
        }
        master.sort(Comparator.comparingDouble(SweepPoint::frequencyHz));
        return new Result(referenceC, factors, pairs, wlf, arr, master, notes);
    }

    /** The master curve as a sweep at the reference temperature. */
    public static Sweep masterSweep(Result r, Sweep template, String name) {
        return new Sweep(name, "master", template.group(), template.kind(), r.referenceC(), template.source(), template.metadata(),
                r.master());
    }

    /** The vertical factor used when building curves: entropic, or 1 (fitted factors are applied to the master curve only). */
    private double bT(double tC, double refC) {
        return vertical == Vertical.ENTROPIC ? (tC + ShiftLaws.KELVIN_OFFSET) / (refC + ShiftLaws.KELVIN_OFFSET) : 1.0;
    }

    private Curve curve(double tC, List<Sweep> sweeps, double refC) {
        Map<Long, double[]> acc = new TreeMap<>();
        double b = bT(tC, refC);
        for (Sweep s : sweeps) {
            for (SweepPoint p : s.fittablePoints()) {
                double[] a = acc.computeIfAbsent(Math.round(Math.log10(p.frequencyHz()) * 1e6), k -> new double[4]);
                a[0] += Math.log10(p.frequencyHz());
                a[1] += Math.log10(p.lossTangent());
                a[2] += Math.log10(p.magnitude() / b);
                a[3]++;
            }
        }
        int n = acc.size();
        double[] lf = new double[n];
        double[] lt = new double[n];
        double[] lm = new double[n];
        int i = 0;
        for (double[] a : acc.values()) {
            lf[i] = a[0] / a[3];
            lt[i] = a[1] / a[3];
            lm[i] = a[2] / a[3];
            i++;
        }
        return new Curve(tC, lf, lt, lm);
    }

    /** Mean squared difference over the overlap when the cold curve is shifted by x decades; NaN when the overlap is too short. */
    private double misfit(Curve cold, Curve warm, double x) {
        return misfit(cold, warm, x, vertical != Vertical.FITTED);
    }

    /** The same, of log tan δ alone or of log tan δ and log |E*|. */
    private double misfit(Curve cold, Curve warm, double x, boolean withMagnitude) {
        double lo = Math.max(cold.logF()[0] + x, warm.logF()[0]);
        double hi = Math.min(cold.logF()[cold.logF().length - 1] + x, warm.logF()[warm.logF().length - 1]);
        if (hi - lo < minOverlapDecades) {
            return Double.NaN;
        }
        double sum = 0;
        for (int k = 0; k < GRID; k++) {
            double g = lo + (hi - lo) * k / (GRID - 1);
            double dt = interp(cold.logF(), cold.logTan(), g - x) - interp(warm.logF(), warm.logTan(), g);
            sum += dt * dt;
            if (withMagnitude) {
                double dm = interp(cold.logF(), cold.logMag(), g - x) - interp(warm.logF(), warm.logMag(), g);
                sum += dm * dm;
            }
        }
        return sum / (withMagnitude ? 2 * GRID : GRID);
    }

    /** The minimum of a misfit within [lo, hi], searched from {@code start} (Brent's method; NaN counts as the worst). */
    private static UnivariatePointValuePair refine(java.util.function.DoubleUnaryOperator misfit, double lo, double hi, double start,
                                                   double tolerance) {
        return new BrentOptimizer(tolerance, tolerance / 100).optimize(new MaxEval(200), GoalType.MINIMIZE,
                new SearchInterval(lo, hi, Math.max(lo, Math.min(hi, start))), new UnivariateObjectiveFunction(x -> {
                    double m = misfit.applyAsDouble(x);
                    return Double.isNaN(m) ? Double.MAX_VALUE : m;
                }));
    }

    private PairShift pair(Curve cold, Curve warm) {
        double xMin = warm.logF()[0] - cold.logF()[cold.logF().length - 1] + minOverlapDecades;
        double xMax = warm.logF()[warm.logF().length - 1] - cold.logF()[0] - minOverlapDecades;
        if (!(xMax > xMin)) {
            return notShifted(cold, warm, "the curves are too short to overlap by " + Numbers.plain(minOverlapDecades) + " decades");
        }
        double bestX = Double.NaN;
        double best = Double.POSITIVE_INFINITY;
        for (double x = xMin; x <= xMax + 1e-12; x += SCAN_STEP) {
            double m = misfit(cold, warm, x);
            if (m < best) {
                best = m;
                bestX = x;
            }
        }
        if (Double.isNaN(bestX)) {
            return notShifted(cold, warm, "no shift gives an overlap of " + Numbers.plain(minOverlapDecades) + " decades");
        }
        double lo = Math.max(xMin, bestX - 2 * SCAN_STEP);
        double hi = Math.min(xMax, bestX + 2 * SCAN_STEP);
        if (hi > lo) {
            UnivariatePointValuePair r = refine(x -> misfit(cold, warm, x), lo, hi, bestX, 1e-10);
            if (r.getValue() <= best) {
                bestX = r.getPoint();
                best = r.getValue();
            }
        }
        double overlap = Math.min(cold.logF()[cold.logF().length - 1] + bestX, warm.logF()[warm.logF().length - 1])
                - Math.max(cold.logF()[0] + bestX, warm.logF()[0]);
        boolean atEdge = bestX <= xMin + 1e-9 || bestX >= xMax - 1e-9;
        // Standard error from the curvature of the sum of squares S(x) = n·misfit(x): var = 2σ²/S''(x), σ² = S_min/(n − 1),
        // so var = 2·misfit_min/((n − 1)·misfit''). The grid points are interpolated, not independent: n counts the measured
        // values (log tan δ and log |E*| of both curves) inside the overlap.
        double h = 0.01;
        double mUp = misfit(cold, warm, bestX + h);
        double mDn = misfit(cold, warm, bestX - h);
        double se = Double.NaN;
        int quantities = vertical == Vertical.FITTED ? 1 : 2; // log tan δ only, or log tan δ and log |E*|
        int n = quantities * (pointsWithin(cold.logF(), bestX, warm) + pointsWithin(warm.logF(), 0, cold, bestX));
        if (Double.isFinite(mUp) && Double.isFinite(mDn) && n > 1) {
            double curvature = (mUp - 2 * best + mDn) / (h * h);
            se = curvature > 0 ? Math.sqrt(2 * best / ((n - 1) * curvature)) : Double.NaN;
        }
        double[] vert = vertical == Vertical.FITTED ? verticalOffset(cold, warm, bestX, 2 * n) : new double[] {0, 0};
        if (atEdge) {
            return new PairShift(cold.tC(), warm.tC(), bestX, se, overlap, Math.sqrt(best), false, String.format(Locale.ROOT,
                    "%s °C on %s °C: the best shift lies at the edge of the allowed overlap; the curves do not overlap enough "
                            + "to be superposed", Numbers.plain(cold.tC()), Numbers.plain(warm.tC())), vert[0], vert[1],
                    Double.NaN, Double.NaN, Double.NaN);
        }
        return new PairShift(cold.tC(), warm.tC(), bestX, se, overlap, Math.sqrt(best), true, "", vert[0], vert[1],
                Double.NaN, Double.NaN, Double.NaN);
    }

    /**
     * The vertical offset log10 b of the cold curve on the warm one at horizontal shift x: the mean
     * difference of log10 |E*| over the overlap, with its standard error (SD over √(n/2), n measured values).
     */
    private static double[] verticalOffset(Curve cold, Curve warm, double x, int n) {
        double lo = Math.max(cold.logF()[0] + x, warm.logF()[0]);
        double hi = Math.min(cold.logF()[cold.logF().length - 1] + x, warm.logF()[warm.logF().length - 1]);
        double[] d = new double[GRID];
        double mean = 0;
        for (int k = 0; k < GRID; k++) {
            double g = lo + (hi - lo) * k / (GRID - 1);
            d[k] = interp(cold.logF(), cold.logMag(), g - x) - interp(warm.logF(), warm.logMag(), g);
            mean += d[k] / GRID;
        }
        double ss = 0;
        for (double v : d) {
            ss += (v - mean) * (v - mean);
        }
        double sd = Math.sqrt(ss / (GRID - 1));
        return new double[] {mean, sd / Math.sqrt(Math.max(1, n / 2.0))};
    }

    /** Replicates of the parametric bootstrap of the shift factors, and its fixed seed (the same inputs give the same report). */
    static final int BOOTSTRAP_REPLICATES = 200;
    private static final long BOOTSTRAP_SEED = 20261202L;

    /**
     * Standard errors of the pair shifts and of the chained shift factors by a parametric bootstrap
     * (Efron &amp; Tibshirani 1993, An Introduction to the Bootstrap, Chapman &amp; Hall, ch. 6): the
     * noise of log tan δ is estimated from the misfit left after superposition (the mean square
     * difference of two linearly interpolated noisy curves, divided by its expected multiple of σ²
     * and corrected for the one fitted shift) and split equally between log E′
     * and log E″; every curve's measured moduli are perturbed with that noise (so log tan δ and
     * log |E*| stay correlated as measured), every pair is superposed again, and the shifts are
     * chained to the reference. The spread of the replicates is the standard error; it counts the
     * interpolation and the correlation of neighbouring pairs (they share a curve), which the
     * curvature of the misfit did not. Returns {pair SEs, factor SEs}, or null when no pair was
     * shifted.
     */
    private double[][] bootstrap(List<Curve> curves, List<PairShift> pairs, int ref) {
        double tanMs = 0;
        double weight = 0;
        int k = 0;
        for (int i = 0; i < pairs.size(); i++) {
            if (pairs.get(i).shifted()) {
                Curve cold = curves.get(i);
                Curve warm = curves.get(i + 1);
                double x = pairs.get(i).log10Shift();
                double[] m = misfitParts(cold, warm, x);
                // the differences over the overlap carry about as many independent values as one curve has points in
                // it (each pairs a value of each curve); one shift was fitted to them
                double n = (pointsWithin(cold.logF(), x, warm) + pointsWithin(warm.logF(), 0, cold, x)) / 2.0;
                tanMs += m[0] * n / Math.max(1, n - 1.0);
                weight += m[2];
                k++;
            }
        }
        if (k == 0 || !(weight > 0)) {
            return null;
        }
        // log tan δ = log E″ − log E′: its noise is √2 times that of each modulus (taken as independent)
        double sdModulus = Math.sqrt(tanMs / weight / 2);
        java.util.SplittableRandom rng = new java.util.SplittableRandom(BOOTSTRAP_SEED);
        int np = pairs.size();
        double[][] shifts = new double[BOOTSTRAP_REPLICATES][np];
        for (int b = 0; b < BOOTSTRAP_REPLICATES; b++) {
            List<Curve> noisy = new ArrayList<>();
            for (Curve c : curves) {
                double[] lt = c.logTan().clone();
                double[] lm = c.logMag().clone();
                for (int j = 0; j < lt.length; j++) {
                    // back to log E′ and log E″, each perturbed, and on to log tan δ and log |E*| again
                    double delta = Math.atan(Math.pow(10, lt[j]));
                    double ls = lm[j] + Math.log10(Math.cos(delta)) + sdModulus * rng.nextGaussian();
                    double ll = lm[j] + Math.log10(Math.sin(delta)) + sdModulus * rng.nextGaussian();
                    lt[j] = ll - ls;
                    lm[j] = ls + 0.5 * Math.log10(1 + Math.pow(10, 2 * (ll - ls)));
                }
                noisy.add(new Curve(c.tC(), c.logF(), lt, lm));
            }
            for (int i = 0; i < np; i++) {
                shifts[b][i] = pairs.get(i).shifted() ? reshift(noisy.get(i), noisy.get(i + 1), pairs.get(i).log10Shift()) : 0;
            }
        }
        double[] pairSe = new double[np];
        for (int i = 0; i < np; i++) {
            final int col = i;
            pairSe[i] = sd(java.util.Arrays.stream(shifts).mapToDouble(r -> r[col]).toArray());
        }
        double[] factorSe = new double[curves.size()];
        for (int j = 0; j < curves.size(); j++) {
            double[] chained = new double[BOOTSTRAP_REPLICATES];
            for (int b = 0; b < BOOTSTRAP_REPLICATES; b++) {
                for (int i = Math.min(j, ref); i < Math.max(j, ref); i++) {
                    chained[b] += shifts[b][i];
                }
            }
            factorSe[j] = j == ref ? 0 : sd(chained);
        }
        return new double[][] {pairSe, factorSe};
    }

    /** The shift of a perturbed pair, searched within half a decade of the measured pair's shift. */
    private double reshift(Curve cold, Curve warm, double x0) {
        double xMin = warm.logF()[0] - cold.logF()[cold.logF().length - 1] + minOverlapDecades;
        double xMax = warm.logF()[warm.logF().length - 1] - cold.logF()[0] - minOverlapDecades;
        double lo = Math.max(xMin, x0 - 0.5);
        double hi = Math.min(xMax, x0 + 0.5);
        if (!(hi > lo)) {
            return x0;
        }
        return refine(x -> misfit(cold, warm, x), lo, hi, x0, 1e-8).getPoint();
    }

    private static double sd(double[] v) {
        double mean = java.util.Arrays.stream(v).average().orElse(Double.NaN);
        double ss = 0;
        for (double x : v) {
            ss += (x - mean) * (x - mean);
        }
        return Math.sqrt(ss / (v.length - 1));
    }

    /**
     * Mean squares of the log tan δ and log |E*| differences over the overlap at shift x (the second 0
     * when fitted vertically), and the mean variance factor of the difference of the two linearly
     * interpolated curves: E[mean square] = σ² × that factor for independent noise σ at every point.
     */
    private double[] misfitParts(Curve cold, Curve warm, double x) {
        double lo = Math.max(cold.logF()[0] + x, warm.logF()[0]);
        double hi = Math.min(cold.logF()[cold.logF().length - 1] + x, warm.logF()[warm.logF().length - 1]);
        double tan = 0;
        double mag = 0;
        double variance = 0;
        for (int k = 0; k < GRID; k++) {
            double g = lo + (hi - lo) * k / (GRID - 1);
            double dt = interp(cold.logF(), cold.logTan(), g - x) - interp(warm.logF(), warm.logTan(), g);
            double dm = interp(cold.logF(), cold.logMag(), g - x) - interp(warm.logF(), warm.logMag(), g);
            tan += dt * dt / GRID;
            mag += dm * dm / GRID;
            variance += (interpolationVariance(cold.logF(), g - x) + interpolationVariance(warm.logF(), g)) / GRID;
        }
        return new double[] {tan, vertical == Vertical.FITTED ? 0 : mag, variance};
    }

    /**
     * The phase-angle gap of two neighbouring curves in the van Gurp–Palmen plane: over the range of
     * log |E*| both cover, δ [°] = a + b·u + c·u² + g·[warm curve] is fitted by least squares (u the
     * centred log |E*|), and g is the gap, with its standard error. {NaN, NaN} when the common range
     * is shorter than 0.2 decades or holds fewer than three points of either curve.
     */
    static double[] phaseGap(Curve cold, Curve warm) {
        double lo = Math.max(min(cold.logMag()), min(warm.logMag()));
        double hi = Math.min(max(cold.logMag()), max(warm.logMag()));
        double[] none = {Double.NaN, Double.NaN};
        if (!(hi - lo >= 0.2)) {
            return none;
        }
        List<double[]> rows = new ArrayList<>();
        List<Double> y = new ArrayList<>();
        int nCold = 0;
        int nWarm = 0;
        double mid = (lo + hi) / 2;
        for (Curve c : List.of(cold, warm)) {
            for (int i = 0; i < c.logMag().length; i++) {
                double m = c.logMag()[i];
                if (m >= lo && m <= hi) {
                    double u = m - mid;
                    rows.add(new double[] {u, u * u, c == warm ? 1 : 0});
                    y.add(Math.toDegrees(Math.atan(Math.pow(10, c.logTan()[i]))));
                    if (c == warm) {
                        nWarm++;
                    } else {
                        nCold++;
                    }
                }
            }
        }
        if (nCold < 3 || nWarm < 3) {
            return none;
        }
        org.apache.commons.math3.stat.regression.OLSMultipleLinearRegression ols =
                new org.apache.commons.math3.stat.regression.OLSMultipleLinearRegression();
        ols.newSampleData(y.stream().mapToDouble(Double::doubleValue).toArray(), rows.toArray(new double[0][]));
        try {
            return new double[] {ols.estimateRegressionParameters()[3], ols.estimateRegressionParametersStandardErrors()[3]};
        } catch (org.apache.commons.math3.linear.SingularMatrixException e) {
            return none;
        }
    }

    /**
     * The shift [decades] of the cold curve onto the warm one that superposes log tan δ alone (a
     * phase angle no vertical shift can change); NaN when the curves cannot overlap enough.
     */
    private double phaseOnlyShift(Curve cold, Curve warm) {
        if (max(cold.logTan()) - min(cold.logTan()) < MIN_PHASE_VARIATION || max(warm.logTan()) - min(warm.logTan()) < MIN_PHASE_VARIATION) {
            return Double.NaN; // a nearly flat loss tangent does not fix a shift
        }
        double xMin = warm.logF()[0] - cold.logF()[cold.logF().length - 1] + minOverlapDecades;
        double xMax = warm.logF()[warm.logF().length - 1] - cold.logF()[0] - minOverlapDecades;
        double bestX = Double.NaN;
        double best = Double.POSITIVE_INFINITY;
        for (double x = xMin; x <= xMax + 1e-12; x += SCAN_STEP) {
            double m = misfit(cold, warm, x, false);
            if (m < best) {
                best = m;
                bestX = x;
            }
        }
        if (Double.isNaN(bestX) || bestX <= xMin + 1e-9 || bestX >= xMax - 1e-9) {
            return Double.NaN;
        }
        double lo = Math.max(xMin, bestX - 2 * SCAN_STEP);
        double hi = Math.min(xMax, bestX + 2 * SCAN_STEP);
        UnivariatePointValuePair r = refine(x -> misfit(cold, warm, x, false), lo, hi, bestX, 1e-10);
        return r.getValue() <= best ? r.getPoint() : bestX;
    }

    private static double min(double[] v) {
        return java.util.Arrays.stream(v).min().orElse(Double.NaN);
    }

    private static double max(double[] v) {
        return java.util.Arrays.stream(v).max().orElse(Double.NaN);
    }

    /** Measured points of the cold curve (shifted by x) inside the warm curve's range. */
    private static int pointsWithin(double[] logF, double x, Curve other) {
        return pointsWithin(logF, x, other, 0);
    }

    /** Points of logF (shifted by x) inside the range of other's log frequencies (shifted by otherX). */
    private static int pointsWithin(double[] logF, double x, Curve other, double otherX) {
        double lo = other.logF()[0] + otherX;
        double hi = other.logF()[other.logF().length - 1] + otherX;
        int n = 0;
        for (double f : logF) {
            if (f + x >= lo - 1e-9 && f + x <= hi + 1e-9) {
                n++;
            }
        }
        return n;
    }

    private PairShift notShifted(Curve cold, Curve warm, String why) {
        return new PairShift(cold.tC(), warm.tC(), Double.NaN, Double.NaN, 0, Double.NaN, false,
                Numbers.plain(cold.tC()) + " °C on " + Numbers.plain(warm.tC()) + " °C: " + why, Double.NaN, Double.NaN,
                Double.NaN, Double.NaN, Double.NaN);
    }

    /** (1 − w)² + w², the variance of a linear interpolation between two points with independent noise, in units of σ². */
    private static double interpolationVariance(double[] x, double at) {
        int n = x.length;
        if (at <= x[0] || at >= x[n - 1]) {
            return 1;
        }
        int i = 1;
        while (x[i] < at) {
            i++;
        }
        double w = (at - x[i - 1]) / (x[i] - x[i - 1]);
        return (1 - w) * (1 - w) + w * w;
    }

    private static double interp(double[] x, double[] y, double at) {
        int n = x.length;
        if (at <= x[0]) {
            return y[0];
        }
        if (at >= x[n - 1]) {
            return y[n - 1];
        }
        int i = 1;
        while (x[i] < at) {
            i++;
        }
        double w = (at - x[i - 1]) / (x[i] - x[i - 1]);
        return (1 - w) * y[i - 1] + w * y[i];
    }

}
