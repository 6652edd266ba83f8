package org.viscarta.fit;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.viscarta.model.ParameterSpec;
import org.viscarta.model.Transform;
import org.viscarta.model.ViscoelasticModel;
import org.viscarta.sweep.SweepPoint;

/**
 * Fits a viscoelastic model jointly to M′ and M″ on log residuals:
 * r = (ln M′_model − ln M′_data, ln M″_model − ln M″_data) at every frequency, so that every
 * point weighs by its relative misfit whatever its magnitude. Parameters are moved in their
 * transformed space (log for positive values, logit for exponents), with the model's analytic
 * Jacobian carried through the chain rule, from every start the model proposes.
 *
 * <p>Uncertainty: Cov(u) = s²(JᵀJ)⁻¹ with s² = RSS/(n − p) in the transformed parameters u
 * (Bates &amp; Watts 1988; Seber &amp; Wild 1989); the standard error of θ = g(u) by the delta method,
 * se(θ) = |g′(u)| se(u); the 95 % interval g(u ± t_{0.975, n−p} se(u)), exact under the monotone
 * transform (DOMAIN.md section 8).
 */
public final class ModelFitter {

    /** A parameter whose relative standard error exceeds this is flagged (100 %, issue text). */
    private static final double MAX_RELATIVE_SE = 1.0;
    /** Correlation beyond which two parameters are flagged as not separately determined. */
    private static final double MAX_CORRELATION = 0.99;

    private final LeastSquaresEngine engine;

    public ModelFitter(LeastSquaresEngine engine) {
        this.engine = engine;
    }

    public ModelFitter() {
        this(new LeastSquaresEngine(LeastSquaresEngine.Settings.defaults().withMaxEvaluations(1000)));
    }

    /**
     * @param sample name written into the result
     * @param model  the model
     * @param data   points with positive moduli (use {@code Sweep.fittablePoints()})
     */
    public FitResult fit(String sample, ViscoelasticModel model, List<SweepPoint> data) {
        if (2 * data.size() <= model.parameterCount()) {
            return fitFrom(sample, model, data, List.of());
        }
        return fitFrom(sample, model, data, model.startValues(data));
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
        double[] lnStorage = new double[m];
        double[] lnLoss = new double[m];
        for (int i = 0; i < m; i++) {
            omega[i] = data.get(i).omega();
            lnStorage[i] = Math.log(data.get(i).storage());
            lnLoss[i] = Math.log(data.get(i).loss());
        }
        ResidualFunction f = (u, r, jac) -> {
            double[] theta = new double[p];
            double[] dtheta = new double[p];
            for (int j = 0; j < p; j++) {
                Transform t = specs.get(j).transform();
                theta[j] = t.toNatural(u[j]);
                dtheta[j] = t.derivative(u[j]);
            }
            double[] mod = new double[2];
            double[] ds = new double[p];
            double[] dl = new double[p];
            for (int i = 0; i < m; i++) {
                model.modulus(omega[i], theta, mod);
                model.derivatives(omega[i], theta, ds, dl);
                r[2 * i] = Math.log(mod[0]) - lnStorage[i];
                r[2 * i + 1] = Math.log(mod[1]) - lnLoss[i];
                for (int j = 0; j < p; j++) {
                    jac[2 * i][j] = ds[j] / mod[0] * dtheta[j];
                    jac[2 * i + 1][j] = dl[j] / mod[1] * dtheta[j];
                }
            }
        };
        List<double[]> starts = new ArrayList<>();
        for (double[] s : startValues) {
            double[] u = new double[p];
            boolean ok = true;
            for (int j = 0; j < p; j++) {
                u[j] = specs.get(j).transform().toInternal(s[j]);
                ok &= Double.isFinite(u[j]);
            }
            if (ok) {
                starts.add(u);
            }
        }
        if (starts.isEmpty()) {
            return notFitted(sample, model, n, "no usable start values could be derived from the data");
        }
        Solution sol = engine.solveMultiStart(n, f, starts);
        if (!sol.converged() || !(sol.rss() >= 0) || !Double.isFinite(sol.rss())) {
            return notFitted(sample, model, n, sol.message().isEmpty() ? "the fit did not converge" : sol.message());
        }
        return describe(sample, model, sol, n, omegaRange(omega));
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
        for (int j = 0; j < p; j++) {
            ParameterSpec s = specs.get(j);
            Transform t = s.transform();
            double theta = t.toNatural(u[j]);
            double seU = cov == null ? Double.NaN : Math.sqrt(cov[j][j]);
            double se = Math.abs(t.derivative(u[j])) * seU;
            double lo = cov == null ? Double.NaN : t.toNatural(u[j] - tq * seU);
            double hi = cov == null ? Double.NaN : t.toNatural(u[j] + tq * seU);
            est.add(new ParameterEstimate(s.name(), s.unit(), theta, se, lo, hi,
                    flag(s, theta, se, cov == null, corr, j, specs, window)));
        }
        return new FitResult(sample, model.id(), est, n, rss, ModelSelection.aic(n, p, rss),
                ModelSelection.aicc(n, p, rss), ModelSelection.bic(n, p, rss), corr, true, "");
    }

    private static String flag(ParameterSpec s, double theta, double se, boolean singular, double[][] corr, int j,
                               List<ParameterSpec> specs, double[] window) {
        List<String> why = new ArrayList<>();
        if (singular) {
            why.add("the covariance matrix is singular");
        } else if (!(se / Math.abs(theta) <= MAX_RELATIVE_SE)) {
            why.add(String.format(Locale.ROOT, "relative standard error %.0f %% exceeds 100 %%", 100 * se / Math.abs(theta)));
        }
        if (s.isTime()) {
            double tauLow = 1.0 / window[1];
            double tauHigh = 1.0 / window[0];
            if (theta < tauLow / 10 || theta > tauHigh * 10) {
                why.add(String.format(Locale.ROOT,
                        "the time lies more than a decade outside the measured window (1/ω from %.3g s to %.3g s)", tauLow, tauHigh));
            }
        }
        if (corr != null) {
            for (int k = 0; k < corr.length; k++) {
                if (k != j && Math.abs(corr[j][k]) > MAX_CORRELATION) {
                    why.add(String.format(Locale.ROOT, "correlation %.3f with %s", corr[j][k], specs.get(k).name()));
                }
            }
        }
        return why.isEmpty() ? "" : "not determined by the data: " + String.join("; ", why);
    }

    private static FitResult notFitted(String sample, ViscoelasticModel model, int n, String why) {
        List<ParameterEstimate> est = new ArrayList<>();
        for (ParameterSpec s : model.parameters()) {
            est.add(new ParameterEstimate(s.name(), s.unit(), Double.NaN, Double.NaN, Double.NaN, Double.NaN, why));
        }
        return new FitResult(sample, model.id(), est, n, Double.NaN, Double.NaN, Double.NaN, Double.NaN, null, false, why);
    }
}
