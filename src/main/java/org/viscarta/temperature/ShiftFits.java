package org.viscarta.temperature;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.viscarta.fit.LeastSquaresEngine;
import org.viscarta.fit.Solution;
import org.viscarta.fit.StudentT;

/**
 * WLF and Arrhenius fits to shift factors, weighted by the factors' standard errors, with 95 %
 * intervals (Student t on n − p degrees of freedom, covariance scaled by χ²/(n − p)); the law the
 * data support is the one with the lower AICc on χ² (AICc = χ² + 2p + 2p(p + 1)/(n − p − 1), DOMAIN.md
 * section 8 for known σ_i, here estimated).
 */
public final class ShiftFits {

    /** A fitted parameter. */
    public record Parameter(String name, String unit, double value, double stdError, double ci95Low, double ci95High) {
    }

    /**
     * @param law        "WLF" or "Arrhenius"
     * @param parameters C1 [–], C2 [K] at the reference temperature; or Ea [kJ/mol]
     * @param chi2       weighted sum of squares
     * @param n          number of shift factors fitted (the reference's zero is not one)
     * @param aicc       AICc on χ²
     */
    public record Fit(String law, List<Parameter> parameters, double chi2, int n, double aicc) {
        public Fit {
            parameters = List.copyOf(parameters);
        }

        public Parameter parameter(String name) {
            return parameters.stream().filter(p -> p.name().equals(name)).findFirst().orElseThrow();
        }
    }

    private ShiftFits() {
    }

    private static List<ShiftAnalysis.Factor> usable(List<ShiftAnalysis.Factor> factors, double refC) {
        List<ShiftAnalysis.Factor> out = new ArrayList<>();
        for (ShiftAnalysis.Factor f : factors) {
            if (f.placed() && f.temperatureC() != refC && f.log10aTStdError() > 0) {
                out.add(f);
            }
        }
        return out;
    }

    /** WLF fit of C1 and C2 at the reference temperature; null with fewer than three usable factors. */
    public static Fit wlf(List<ShiftAnalysis.Factor> factors, double refC) {
        List<ShiftAnalysis.Factor> fs = usable(factors, refC);
        int n = fs.size();
        if (n < 3) {
            return null;
        }
        double[] dt = new double[n];
        double[] y = new double[n];
        double[] w = new double[n];
        for (int i = 0; i < n; i++) {
            dt[i] = fs.get(i).temperatureC() - refC;
            y[i] = fs.get(i).log10aT();
            w[i] = 1 / fs.get(i).log10aTStdError();
        }
        // start from the linearised form −ΔT/log a = C2/C1 + ΔT/C1 (DOMAIN.md section 6), unweighted
        double sx = 0;
        double sy = 0;
        double sxx = 0;
        double sxy = 0;
        for (int i = 0; i < n; i++) {
            double yy = -dt[i] / y[i];
            sx += dt[i];
            sy += yy;
            sxx += dt[i] * dt[i];
            sxy += dt[i] * yy;
        }
        double slope = (n * sxy - sx * sy) / (n * sxx - sx * sx);
        double icpt = (sy - slope * sx) / n;
        double c1 = slope != 0 && Double.isFinite(slope) ? 1 / slope : 10;
        double c2 = Double.isFinite(icpt * c1) && icpt * c1 > 0 ? icpt * c1 : 50;
        LeastSquaresEngine engine = new LeastSquaresEngine(LeastSquaresEngine.Settings.defaults()
                .withMethod(LeastSquaresEngine.Method.COMPACT).withMaxEvaluations(500));
        Solution s = engine.solveMultiStart(n, (p, r, jac) -> {
            for (int i = 0; i < n; i++) {
                double d = p[1] + dt[i];
                r[i] = (-p[0] * dt[i] / d - y[i]) * w[i];
                jac[i][0] = -dt[i] / d * w[i];
                jac[i][1] = p[0] * dt[i] / (d * d) * w[i];
            }
        }, List.of(new double[] {c1, c2}, new double[] {17.44, 51.6}, new double[] {8.86, 101.6}));
        if (s == null || !s.converged()) {
            return null;
        }
        double[] p = s.params();
        double[][] cov = s.covariance();
        double tq = n > 2 ? StudentT.quantile975(n - 2) : Double.NaN;
        List<Parameter> ps = new ArrayList<>();
        String[] names = {"C1", "C2"};
        String[] units = {"-", "K"};
        for (int j = 0; j < 2; j++) {
            double se = cov == null ? Double.NaN : Math.sqrt(cov[j][j]);
            ps.add(new Parameter(names[j], units[j], p[j], se, p[j] - tq * se, p[j] + tq * se));
        }
        return new Fit("WLF", ps, s.rss(), n, aicc(s.rss(), n, 2));
    }

    /** Arrhenius fit of the apparent activation energy [kJ/mol]; null with fewer than two usable factors. */
    public static Fit arrhenius(List<ShiftAnalysis.Factor> factors, double refC) {
        List<ShiftAnalysis.Factor> fs = usable(factors, refC);
        int n = fs.size();
        if (n < 2) {
            return null;
        }
        double t0 = refC + ShiftLaws.KELVIN_OFFSET;
        double swxx = 0;
        double swxy = 0;
        double[] x = new double[n];
        double[] y = new double[n];
        double[] w2 = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = (1 / (fs.get(i).temperatureC() + ShiftLaws.KELVIN_OFFSET) - 1 / t0) / (ShiftLaws.GAS_CONSTANT * Math.log(10));
            y[i] = fs.get(i).log10aT();
            w2[i] = 1 / (fs.get(i).log10aTStdError() * fs.get(i).log10aTStdError());
            swxx += w2[i] * x[i] * x[i];
            swxy += w2[i] * x[i] * y[i];
        }
        double ea = swxy / swxx;
        double chi2 = 0;
        for (int i = 0; i < n; i++) {
            chi2 += w2[i] * (y[i] - ea * x[i]) * (y[i] - ea * x[i]);
        }
        double se = Math.sqrt(chi2 / (n - 1) / swxx);
        double tq = StudentT.quantile975(n - 1);
        Parameter p = new Parameter("Ea", "kJ/mol", ea / 1000, se / 1000, (ea - tq * se) / 1000, (ea + tq * se) / 1000);
        return new Fit("Arrhenius", List.of(p), chi2, n, aicc(chi2, n, 1));
    }

    private static double aicc(double chi2, int n, int p) {
        return n - p - 1 > 0 ? chi2 + 2 * p + 2.0 * p * (p + 1) / (n - p - 1) : Double.POSITIVE_INFINITY;
    }

    /** Which law the shift factors support, in words. */
    public static String whichSupported(Fit wlf, Fit arrhenius) {
        if (wlf == null && arrhenius == null) {
            return "Too few shift factors to fit a temperature law.";
        }
        if (wlf == null || !Double.isFinite(wlf.aicc())) {
            return "Arrhenius fitted; too few shift factors to compare it with WLF.";
        }
        if (arrhenius == null || !Double.isFinite(arrhenius.aicc())) {
            return "WLF fitted; too few shift factors to compare it with Arrhenius.";
        }
        double d = arrhenius.aicc() - wlf.aicc();
        if (Math.abs(d) < 2) {
            return String.format(Locale.ROOT, "WLF and Arrhenius describe the shift factors about equally well (ΔAICc = %.2f).", Math.abs(d));
        }
        return String.format(Locale.ROOT, "The shift factors support %s (ΔAICc = %.2f in its favour).", d > 0 ? "WLF" : "Arrhenius",
                Math.abs(d));
    }
}
