package org.viscarta.fit;

import java.util.List;
import java.util.Optional;
import org.viscarta.model.ViscoelasticModel;

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
 * @param fitted      the model object fitted (for a family, the member chosen), so that curves and bands are
 *                    evaluated from it and never looked up again by name; null only for a result made by hand
 * @param covariance  the parameters' covariance in natural units (linearised through the transform), null
 *                    when it is singular
 */
public record FitResult(String sample, String model, List<ParameterEstimate> parameters, int n, double rss,
                        double aic, double aicc, double bic, double[][] correlation, boolean converged,
                        String message, String variant, List<DerivedEstimate> derived, ViscoelasticModel fitted,
                        double[][] covariance) {

    public FitResult {
        parameters = List.copyOf(parameters);
        derived = List.copyOf(derived);
        correlation = correlation == null ? null : deepCopy(correlation);
        covariance = covariance == null ? null : deepCopy(covariance);
    }

    /** A result made by hand, without a model object or covariance (for model-selection checks). */
    public FitResult(String sample, String model, List<ParameterEstimate> parameters, int n, double rss, double aic, double aicc,
                     double bic, double[][] correlation, boolean converged, String message, String variant,
                     List<DerivedEstimate> derived) {
        this(sample, model, parameters, n, rss, aic, aicc, bic, correlation, converged, message, variant, derived, null, null);
    }

    @Override
    public double[][] correlation() {
        return correlation == null ? null : deepCopy(correlation);
    }

    @Override
    public double[][] covariance() {
        return covariance == null ? null : deepCopy(covariance);
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

    /** True when the data do not determine some parameter of this fit (its flags say why). */
    public boolean undetermined() {
        return parameters.stream().anyMatch(ParameterEstimate::undetermined);
    }
}
