package org.viscarta.fit;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.viscarta.model.Derived;
import org.viscarta.model.GeneralizedMaxwell;
import org.viscarta.model.ParameterSpec;
import org.viscarta.model.Transform;
import org.viscarta.model.ViscoelasticModel;
import org.viscarta.sweep.SweepPoint;
import org.viscarta.sweep.TimeTest;

/**
 * Fits a viscoelastic model jointly to M′ and M″. By default on log residuals,
 * r = (ln M′_model − ln M′_data, ln M″_model − ln M″_data) at every frequency, so that every point
 * weighs by its relative misfit whatever its magnitude ({@link Weighting} lists the others).
 * Parameters are moved in their transformed space (log for positive values, logit for exponents),
 * with the model's analytic Jacobian carried through the chain rule, from every start the model
 * proposes; the lowest residual sum of squares wins. A model family (generalized-maxwell without a
 * fixed size) is grown one member at a time while AICc improves, keeping the best among the sizes
 * whose parameters are all determined (a regular covariance matrix).
 *
 * <p>Uncertainty: Cov(u) = s²(JᵀJ)⁻¹ with s² = RSS/(n − p) in the transformed parameters u
 * (Bates &amp; Watts 1988; Seber &amp; Wild 1989); the standard error of θ = g(u) by the delta method,
 * se(θ) = |g′(u)| se(u); the 95 % interval g(u ± t_{0.975, n−p} se(u)), exact under the monotone
 * transform (DOMAIN.md section 8). Derived quantities get their standard errors by the delta method
 * with a central-difference gradient in u.
 */
public final class ModelFitter {

    /** A parameter whose relative standard error exceeds this is flagged (100 %). */
    private static final double MAX_RELATIVE_SE = 1.0;
    /**
     * Evaluations per start: these fits converge in tens of evaluations; one still wandering after
     * 300 is stuck on a plateau of the misfit and is reported as not converged.
     */
    private static final int MAX_EVALUATIONS = 300;
    /** Correlation beyond which two parameters are flagged as not separately determined. */
    private static final double MAX_CORRELATION = 0.99;

    private final LeastSquaresEngine engine;
    private final Weighting weighting;

    public ModelFitter(LeastSquaresEngine engine, Weighting weighting) {
        this.engine = engine;
        this.weighting = weighting;
    }

    public ModelFitter(LeastSquaresEngine engine) {
        this(engine, Weighting.LOG);
    }

    /** Model fits use the compact Levenberg–Marquardt path (validated against Commons Math, NIST and SciPy). */
    public ModelFitter(Weighting weighting) {
        this(new LeastSquaresEngine(LeastSquaresEngine.Settings.defaults().withMaxEvaluations(MAX_EVALUATIONS)
                .withMethod(LeastSquaresEngine.Method.COMPACT)), weighting);
    }

    public ModelFitter() {
        this(Weighting.LOG);
    }

    /** How these fits are made, in words, as Provenance states it. */
    public String describe() {
        return engine.describe() + "; several data-derived starts per model; parameters moved in log space (positive "
                + "values) or logit space (exponents); residuals: " + weighting.describe();
    }

    /**
     * Fits a model (or, for a family, each of its variants, keeping the lowest AICc) from the
     * model's own data-derived starts.
     *
     * @param sample name written into the result
     * @param model  the model
     * @param data   points with positive moduli (use {@code Sweep.fittablePoints()}); replicates may be pooled
     */
    public FitResult fit(String sample, ViscoelasticModel model, List<SweepPoint> data) {
        if (data.isEmpty()) {
            return notFitted(sample, model, 0, "no point has positive storage and loss moduli, so there is nothing to fit");
        }
        return bestVariant(model, v -> {
            String unsuitable = v.unsuitable(data);
            if (!unsuitable.isEmpty()) {
                return notFitted(sample, v, 2 * data.size(), unsuitable);
            }
            List<double[]> starts = 2 * data.size() <= v.parameterCount() ? List.of() : v.startValues(data);
            return fitFrom(sample, v, data, starts);
        });
    }

    /**
     * Fits a model's relaxation modulus M(t) or creep compliance J(t) to a time-domain test (or, for a
     * family, each of its variants, keeping the lowest AICc), with the residuals of this fitter's
     * weighting (log or relative; replicate-sd is for frequency sweeps and falls back to log here) and
     * the same uncertainties, AICc and flags as a sweep's fit. The starts are the model's own, derived
     * from the sweep the test approximately corresponds to ({@link #equivalentSweep}).
     *
     * @param data the points of one test, or of a sample's replicates pooled
     */
    public FitResult fitTime(String sample, ViscoelasticModel model, TimeTest.Type type, List<TimeTest.Point> data) {
        if (!model.hasTimeDomain()) {
            return notFitted(sample, model, data.size(), "a descriptive model of frequency sweeps with no time-domain form");
        }
        if (data.size() < 3) {
            return notFitted(sample, model, data.size(), "fewer than three times, so there is nothing to fit");
        }
        List<SweepPoint> approx = equivalentSweep(type, data);
        return bestVariant(model, v -> fitTimeFrom(sample, v, type, data, data.size() <= v.parameterCount() ? List.of()
                : v.startValues(approx)));
    }

    private FitResult bestVariant(ViscoelasticModel model, java.util.function.Function<ViscoelasticModel, FitResult> fitOne) {
        List<ViscoelasticModel> variants = model.variants();
        FitResult best = null;
        FitResult previous = null;
        int step = -1;
        boolean improved = false;
        for (ViscoelasticModel v : variants) {
            if (v.variantStep() != step) {
                if (step >= 0 && !improved) {
                    break; // no variant of a larger size improved on the smaller ones: stop growing
                }
                step = v.variantStep();
                improved = false;
            }
            if (v.fallback() && previous != null && previous.converged() && !previous.undetermined()) {
                continue; // the variant before determined all its parameters: no need for the fallback
            }
            FitResult r = fitOne.apply(v);
            previous = r;
            boolean wins = v.fallback()
                    // a fallback must fit better, not merely be regular: a gel is no liquid because its solid fit is singular
                    ? best == null || r.converged() && r.correlation() != null && (!best.converged() || r.aicc() < best.aicc())
                    : best == null || better(r, best);
            if (wins) {
                best = r;
                improved = true;
            }
        }
        if (variants.stream().map(ViscoelasticModel::variantStep).distinct().count() > 1 && best.converged()) {
            String chosen = best.variant() + ", chosen by AICc among 1–" + GeneralizedMaxwell.MAX_ELEMENTS;
            best = new FitResult(best.sample(), best.model(), best.parameters(), best.n(), best.rss(), best.aic(),
                    best.aicc(), best.bic(), best.correlation(), true, "", chosen, best.derived(), best.fitted(), best.covariance());
        }
        return best;
    }

    /**
     * The frequency sweep a time-domain test approximately corresponds to, for start values only: at
     * ω = 1/t, M′ ≈ M(t) and M″ ≈ −(π/2) dM/d ln t for relaxation; J′ ≈ J(t), J″ ≈ (π/2) dJ/d ln t for
     * creep, then M* = 1/J* (first-order interconversion, Schwarzl and Staverman; Ferry, Viscoelastic
     * Properties of Polymers, 3rd ed., 1980, ch. 4 — from memory). M″ is kept at least 1 % of M′ so
     * that a flat stretch still gives starts.
     */
    public static List<SweepPoint> equivalentSweep(TimeTest.Type type, List<TimeTest.Point> data) {
        int n = data.size();
        List<SweepPoint> out = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            int a = Math.max(0, i - 1);
            int b = Math.min(n - 1, i + 1);
            double dlnT = Math.log(data.get(b).timeS() / data.get(a).timeS());
            double slope = dlnT > 0 ? (data.get(b).value() - data.get(a).value()) / dlnT : 0;
            double v = data.get(i).value();
            double storage;
            double loss;
            if (type == TimeTest.Type.RELAXATION) {
                storage = v;
                loss = Math.max(-Math.PI / 2 * slope, 0.01 * v);
            } else {
                double j1 = v;
                double j2 = Math.max(Math.PI / 2 * slope, 0.01 * v);
                double d = j1 * j1 + j2 * j2;
                storage = j1 / d;
                loss = j2 / d;
            }
            double f = 1 / (2 * Math.PI * data.get(i).timeS());
            if (f > 0 && Double.isFinite(f) && storage > 0 && Double.isFinite(storage) && Double.isFinite(loss)) {
                out.add(new SweepPoint(f, storage, loss, data.get(i).line()));
            }
        }
        out.sort(java.util.Comparator.comparingDouble(SweepPoint::frequencyHz));
        return out;
    }

    /** Fits a time-domain test from the given start values (natural parameters). */
    public FitResult fitTimeFrom(String sample, ViscoelasticModel model, TimeTest.Type type, List<TimeTest.Point> data,
                                 List<double[]> startValues) {
        List<ParameterSpec> specs = model.parameters();
        int p = specs.size();
        int n = data.size();
        if (n <= p) {
            return notFitted(sample, model, n, String.format(Locale.ROOT, "%d times give %d values, too few for %d parameters", n, n, p));
        }
        double[] t = new double[n];
        double[] y = new double[n];
        double[] lnY = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = data.get(i).timeS();
            y[i] = data.get(i).value();
            lnY[i] = Math.log(y[i]);
        }
        boolean relative = weighting == Weighting.RELATIVE;
        Transform[] transforms = specs.stream().map(ParameterSpec::transform).toArray(Transform[]::new);
        double[] theta = new double[p];
        double[] shifted = new double[p];
        double[] plus = new double[n];
        double[] minus = new double[n];
        java.util.function.BiConsumer<double[], double[]> values = (u, r) -> {
            for (int j = 0; j < p; j++) {
                theta[j] = transforms[j].toNatural(u[j]);
            }
            for (int i = 0; i < n; i++) {
                double v = type == TimeTest.Type.RELAXATION ? model.relaxationModulus(t[i], theta) : model.creepCompliance(t[i], theta);
                if (!Double.isFinite(v)) {
                    v = Double.MIN_NORMAL;
                }
                r[i] = relative ? v / y[i] - 1 : Math.log(Math.max(v, Double.MIN_NORMAL)) - lnY[i];
            }
        };
        ResidualFunction f = (u, r, jac) -> {
            // the time-domain forms have no analytic derivatives here: central differences in the fitting parameters
            for (int j = 0; j < p; j++) {
                System.arraycopy(u, 0, shifted, 0, p);
                double h = 1e-6 * Math.max(1, Math.abs(u[j]));
                shifted[j] = u[j] + h;
                values.accept(shifted, plus);
                shifted[j] = u[j] - h;
                values.accept(shifted, minus);
                for (int i = 0; i < n; i++) {
                    jac[i][j] = (plus[i] - minus[i]) / (2 * h);
                }
            }
            values.accept(u, r);
        };
        return solve(sample, model, n, f, startValues, new double[] {1 / t[n - 1], 1 / t[0]});
    }

    /**
     * Among the variants of a family: a converged fit beats one that did not converge; a fit whose
     * covariance is regular (every direction determined) beats a singular one, which has redundant
     * elements; then the lower AICc wins.
     */
    private static boolean better(FitResult r, FitResult best) {
        if (r.converged() != best.converged()) {
            return r.converged();
        }
        boolean regular = r.correlation() != null;
        boolean bestRegular = best.correlation() != null;
        if (regular != bestRegular) {
            return regular;
        }
        return r.aicc() < best.aicc();
    }

    /**
     * Fits from the given start values (natural parameters), keeping the lowest residual among
     * those that converge.
     */
    public FitResult fitFrom(String sample, ViscoelasticModel model, List<SweepPoint> data, List<double[]> startValues) {
        List<ParameterSpec> specs = model.parameters();
        int p = specs.size();
        int n = 2 * data.size();
        if (n <= p) {
            return notFitted(sample, model, n, String.format(Locale.ROOT,
                    "%d frequencies give %d values, too few for %d parameters", data.size(), n, p));
        }
        int m = data.size();
        double[] omega = new double[m];
        double[] storage = new double[m];
        double[] loss = new double[m];
        for (int i = 0; i < m; i++) {
            omega[i] = data.get(i).omega();
            storage[i] = data.get(i).storage();
            loss[i] = data.get(i).loss();
        }
        double[][] scale = new double[2][m];
        if (weighting == Weighting.REPLICATE_SD) {
            String problem = replicateScales(data, scale);
            if (!problem.isEmpty()) {
                return notFitted(sample, model, n, problem);
            }
        } else {
            java.util.Arrays.fill(scale[0], 1.0);
            java.util.Arrays.fill(scale[1], 1.0);
        }
        ResidualFunction f = residuals(model, specs, omega, storage, loss, scale);
        return solve(sample, model, n, f, startValues, omegaRange(omega));
    }

    /** Solves from the start values and describes the fit, or says why there is none; window = the ω range the data show. */
    private FitResult solve(String sample, ViscoelasticModel model, int n, ResidualFunction f, List<double[]> startValues,
                            double[] window) {
        List<double[]> starts = internalStarts(model.parameters(), startValues);
        if (starts.isEmpty()) {
            return notFitted(sample, model, n, "no usable start values could be derived from the data");
        }
        Solution sol = engine.solveMultiStart(n, f, starts);
        if (!sol.converged() || !(sol.rss() >= 0) || !Double.isFinite(sol.rss())) {
            return notFitted(sample, model, n, "could not be fitted: no stable best fit was reached from these data ("
                    + (sol.message().isEmpty() ? "the fit did not converge" : sol.message()) + ")");
        }
        return describe(sample, model, sol, n, window);
    }

    /** Start values moved into the fitting parameters (log or logit space); starts that do not map are dropped. */
    private static List<double[]> internalStarts(List<ParameterSpec> specs, List<double[]> startValues) {
        List<double[]> starts = new ArrayList<>();
        for (double[] s : startValues) {
            double[] u = new double[specs.size()];
            boolean ok = true;
            for (int j = 0; j < u.length; j++) {
                u[j] = specs.get(j).transform().toInternal(s[j]);
                ok &= Double.isFinite(u[j]);
            }
            if (ok) {
                starts.add(u);
            }
        }
        return starts;
    }

    /** The residuals of this fitter's weighting and their Jacobian in the fitting parameters (package-private for the solver's tests). */
    ResidualFunction residuals(ViscoelasticModel model, List<ParameterSpec> specs, double[] omega,
                                       double[] storage, double[] loss, double[][] scale) {
        int p = specs.size();
        int m = omega.length;
        double[] lnStorage = new double[m];
        double[] lnLoss = new double[m];
        double[] weightStorage = new double[m];
        double[] weightLoss = new double[m];
        for (int i = 0; i < m; i++) {
            lnStorage[i] = Math.log(storage[i]);
            lnLoss[i] = Math.log(loss[i]);
            weightStorage[i] = 1 / scale[0][i];
            weightLoss[i] = 1 / scale[1][i];
        }
        boolean relative = weighting == Weighting.RELATIVE;
        // work arrays of this residual function; each fit builds its own, so fits may run in parallel
        double[] theta = new double[p];
        double[] dtheta = new double[p];
        double[] mod = new double[2];
        double[] ds = new double[p];
        double[] dl = new double[p];
        Transform[] transforms = new Transform[p];
        for (int j = 0; j < p; j++) {
            transforms[j] = specs.get(j).transform();
        }
        return (u, r, jac) -> {
            for (int j = 0; j < p; j++) {
                theta[j] = transforms[j].toNatural(u[j]);
                dtheta[j] = transforms[j].derivative(u[j]);
            }
            for (int i = 0; i < m; i++) {
                model.modulusAndDerivatives(omega[i], theta, mod, ds, dl);
                if (relative) {
                    r[2 * i] = mod[0] / storage[i] - 1;
                    r[2 * i + 1] = mod[1] / loss[i] - 1;
                    for (int j = 0; j < p; j++) {
                        jac[2 * i][j] = ds[j] / storage[i] * dtheta[j];
                        jac[2 * i + 1][j] = dl[j] / loss[i] * dtheta[j];
                    }
                } else {
                    double ws = weightStorage[i];
                    double wl = weightLoss[i];
                    r[2 * i] = (Math.log(mod[0]) - lnStorage[i]) * ws;
                    r[2 * i + 1] = (Math.log(mod[1]) - lnLoss[i]) * wl;
                    // ∂ ln M/∂u = (∂M/∂θ)(dθ/du)/M: one division per modulus, not one per parameter
                    double[] rowS = jac[2 * i];
                    double[] rowL = jac[2 * i + 1];
                    double cs = ws / mod[0];
                    double cl = wl / mod[1];
                    for (int j = 0; j < p; j++) {
                        rowS[j] = ds[j] * dtheta[j] * cs;
                        rowL[j] = dl[j] * dtheta[j] * cl;
                    }
                }
            }
        };
    }

    /**
     * Standard deviations of ln M′ and ln M″ over the replicates at each frequency (points whose
     * frequencies agree to 1e-9 relative are one frequency).
     *
     * @return "" or why the weights cannot be formed
     */
    private static String replicateScales(List<SweepPoint> data, double[][] scale) {
        Map<Long, List<Integer>> byFrequency = new TreeMap<>();
        for (int i = 0; i < data.size(); i++) {
            long key = Math.round(Math.log(data.get(i).frequencyHz()) * 1e9);
            byFrequency.computeIfAbsent(key, k -> new ArrayList<>()).add(i);
        }
        for (List<Integer> idx : byFrequency.values()) {
            if (idx.size() < 2) {
                return String.format(Locale.ROOT, "replicate-sd weighting needs at least two replicates at every frequency; "
                        + "%.4g Hz has one", data.get(idx.get(0)).frequencyHz());
            }
            double ss = sdOfLog(data, idx, true);
            double sl = sdOfLog(data, idx, false);
            if (!(ss > 0) || !(sl > 0)) {
                return String.format(Locale.ROOT, "replicate-sd weighting needs replicates that differ; at %.4g Hz they are identical",
                        data.get(idx.get(0)).frequencyHz());
            }
            for (int i : idx) {
                scale[0][i] = ss;
                scale[1][i] = sl;
            }
        }
        return "";
    }

    private static double sdOfLog(List<SweepPoint> data, List<Integer> idx, boolean storage) {
        double mean = 0;
        for (int i : idx) {
            mean += Math.log(storage ? data.get(i).storage() : data.get(i).loss());
        }
        mean /= idx.size();
        double ss = 0;
        for (int i : idx) {
            double d = Math.log(storage ? data.get(i).storage() : data.get(i).loss()) - mean;
            ss += d * d;
        }
        return Math.sqrt(ss / (idx.size() - 1));
    }

    private static double[] omegaRange(double[] omega) {
        double lo = Double.POSITIVE_INFINITY;
        double hi = 0;
        for (double w : omega) {
            lo = Math.min(lo, w);
            hi = Math.max(hi, w);
        }
        return new double[] {lo, hi};
    }

    private static FitResult describe(String sample, ViscoelasticModel model, Solution sol, int n, double[] window) {
        List<ParameterSpec> specs = model.parameters();
        int p = specs.size();
        double[] u = sol.params();
        double[][] cov = sol.covariance();
        double rss = Math.max(sol.rss(), Double.MIN_NORMAL);
        double tq = StudentT.quantile975(n - p);
        double[][] corr = null;
        if (cov != null) {
            corr = new double[p][p];
            for (int i = 0; i < p; i++) {
                for (int j = 0; j < p; j++) {
                    corr[i][j] = cov[i][j] / Math.sqrt(cov[i][i] * cov[j][j]);
                }
            }
        }
        List<ParameterEstimate> est = new ArrayList<>();
        double[] theta = new double[p];
        for (int j = 0; j < p; j++) {
            ParameterSpec s = specs.get(j);
            Transform t = s.transform();
            theta[j] = t.toNatural(u[j]);
            double seU = cov == null ? Double.NaN : Math.sqrt(cov[j][j]);
            double se = Math.abs(t.derivative(u[j])) * seU;
            double lo = cov == null ? Double.NaN : t.toNatural(u[j] - tq * seU);
            double hi = cov == null ? Double.NaN : t.toNatural(u[j] + tq * seU);
            est.add(new ParameterEstimate(s.name(), s.unit(), theta[j], se, lo, hi,
                    flag(s, theta[j], se, cov == null, corr, j, specs, window)));
        }
        double[][] natural = null;
        if (cov != null) {
            natural = new double[p][p];
            for (int i = 0; i < p; i++) {
                for (int j = 0; j < p; j++) {
                    natural[i][j] = specs.get(i).transform().derivative(u[i]) * specs.get(j).transform().derivative(u[j]) * cov[i][j];
                }
            }
        }
        List<Derived> quantities = model.derived();
        List<DerivedEstimate> derived = new ArrayList<>(quantities.size());
        // one stencil of central differences in u, its points moved into natural parameters once for all quantities
        DeltaMethod.Stencil stencil = cov == null || quantities.isEmpty() ? null
                : new DeltaMethod.Stencil(u, 1e-6, 1.0, x -> natural(specs, x));
        for (Derived d : quantities) {
            double value = d.value().applyAsDouble(theta);
            double se = stencil == null ? Double.NaN : DeltaMethod.standardError(stencil.gradient(d.value()), cov);
            derived.add(new DerivedEstimate(d.name(), d.unit(), value, se, derivedFlag(d.unit(), value, se, window)));
        }
        return new FitResult(sample, model.id(), est, n, rss, ModelSelection.aic(n, p, rss),
                ModelSelection.aicc(n, p, rss), ModelSelection.bic(n, p, rss), corr, true, "", model.describeVariant(), derived,
                model, natural);
    }

    private static double[] natural(List<ParameterSpec> specs, double[] u) {
        double[] t = new double[u.length];
        for (int j = 0; j < u.length; j++) {
            t[j] = specs.get(j).transform().toNatural(u[j]);
        }
        return t;
    }

    private static String flag(ParameterSpec s, double theta, double se, boolean singular, double[][] corr, int j,
                               List<ParameterSpec> specs, double[] window) {
        List<String> why = new ArrayList<>();
        if (singular) {
            why.add("these data cannot tell it apart from the other parameters (singular covariance matrix)");
        } else if (!Double.isFinite(se)) {
            why.add("its uncertainty cannot be computed");
        } else if (!(se / Math.abs(theta) <= MAX_RELATIVE_SE)) {
            why.add(String.format(Locale.ROOT, "its uncertainty (±%.0f %%) is larger than the value itself", 100 * se / Math.abs(theta)));
        }
        if (s.isTime()) {
            double tauLow = 1.0 / window[1];
            double tauHigh = 1.0 / window[0];
            if (theta < tauLow / 10 || theta > tauHigh * 10) {
                why.add(String.format(Locale.ROOT,
                        "the time lies more than ten times outside the times these frequencies can show (1/ω from %.3g s "
                                + "to %.3g s)", tauLow, tauHigh));
            }
        }
        if (corr != null) {
            for (int k = 0; k < corr.length; k++) {
                if (k != j && Math.abs(corr[j][k]) > MAX_CORRELATION) {
                    why.add(String.format(Locale.ROOT, "it moves together with %s (correlation %.3f), so the data cannot "
                            + "separate the two", specs.get(k).name(), corr[j][k]));
                }
            }
        }
        return why.isEmpty() ? "" : "not determined by the data: " + String.join("; ", why);
    }

    /**
     * Why a derived quantity is not determined by the data ("" when it is): its uncertainty cannot be
     * computed or exceeds the value, or, for a time [s] or frequency [Hz], it lies more than ten times
     * outside the range the measured angular frequencies ω can show (times 1/ω, frequencies ω/2π) —
     * the same limits as for parameters.
     */
    static String derivedFlag(String unit, double value, double se, double[] window) {
        List<String> why = new ArrayList<>();
        if (Double.isNaN(value)) {
            return ""; // not defined for these parameters (a crossover that does not exist): nothing to judge
        }
        if (Double.isInfinite(value)) {
            // no value to show: it overflowed, made of parameters that ran toward a limit of their range
            return "not determined by the data: it comes out infinite from the fitted parameters, some of which run toward "
                    + "a limit these data do not pin down";
        }
        if (!Double.isFinite(se)) {
            why.add("its uncertainty cannot be computed");
        } else if (value != 0 && !(se / Math.abs(value) <= MAX_RELATIVE_SE)) {
            why.add(String.format(Locale.ROOT, "its uncertainty (±%.0f %%) is larger than the value itself", 100 * se / Math.abs(value)));
        }
        if (unit.equals("s") && (value < 1.0 / window[1] / 10 || value > 1.0 / window[0] * 10)) {
            why.add(String.format(Locale.ROOT, "the time lies more than ten times outside the times these frequencies can show "
                    + "(1/ω from %.3g s to %.3g s)", 1.0 / window[1], 1.0 / window[0]));
        }
        double fLow = window[0] / (2 * Math.PI);
        double fHigh = window[1] / (2 * Math.PI);
        if (unit.equals("Hz") && (value < fLow / 10 || value > fHigh * 10)) {
            why.add(String.format(Locale.ROOT, "the frequency lies more than ten times outside the measured frequencies "
                    + "(%.3g Hz to %.3g Hz)", fLow, fHigh));
        }
        return why.isEmpty() ? "" : "not determined by the data: " + String.join("; ", why);
    }

    private static FitResult notFitted(String sample, ViscoelasticModel model, int n, String why) {
        List<ParameterEstimate> est = new ArrayList<>();
        for (ParameterSpec s : model.parameters()) {
            est.add(new ParameterEstimate(s.name(), s.unit(), Double.NaN, Double.NaN, Double.NaN, Double.NaN, why));
        }
        return new FitResult(sample, model.id(), est, n, Double.NaN, Double.NaN, Double.NaN, Double.NaN, null, false, why,
                model.describeVariant(), List.of(), model, null);
    }
}
