package org.viscarta.fit;

import java.util.List;
import java.util.Optional;

/**
 * The fit of one model to one sample.
 *
 * @param sample      sample name
 * @param model       model identifier
 * @param parameters  estimates in the model's parameter order
 * @param n           number of scalar residuals (2 per frequency: log M′ and log M″)
 * @param rss         residual sum of squares of the natural-log residuals
 * @param aic         n ln(RSS/n) + 2K, K = p + 1
 * @param aicc        AIC + 2K(K + 1)/(n − K − 1)
 * @param bic         n ln(RSS/n) + K ln n
 * @param correlation parameter correlation matrix, null when the covariance is singular
 * @param converged   whether the optimiser converged
 * @param message     "" or what went wrong
 * @param variant     "" or which member of a model family was chosen (e.g. "3 elements, chosen by AICc among 1–5")
 * @param derived     quantities derived from the parameters, with standard errors
 */
public record FitResult(String sample, String model, List<ParameterEstimate> parameters, int n, double rss,
                        double aic, double aicc, double bic, double[][] correlation, boolean converged,
                        String message, String variant, List<DerivedEstimate> derived) {

    public FitResult {
        parameters = List.copyOf(parameters);
        derived = List.copyOf(derived);
        correlation = correlation == null ? null : deepCopy(correlation);
    }

    @Override
    public double[][] correlation() {
        return correlation == null ? null : deepCopy(correlation);
    }

    /** A parameter by name. */
    public Optional<ParameterEstimate> parameter(String name) {
        return parameters.stream().filter(p -> p.name().equals(name)).findFirst();
    }

    /** The natural parameter values in the model's order. */
    public double[] values() {
        return parameters.stream().mapToDouble(ParameterEstimate::value).toArray();
    }

    /** Root-mean-square log residual, as a relative misfit (0.05 ≈ 5 %). */
    public double rmsLogResidual() {
        return Math.sqrt(rss / n);
    }

    private static double[][] deepCopy(double[][] m) {
        double[][] c = new double[m.length][];
        for (int i = 0; i < m.length; i++) {
            c[i] = m[i].clone();
        }
        return c;
    }
}
