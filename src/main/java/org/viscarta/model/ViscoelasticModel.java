package org.viscarta.model;

import java.util.List;
import org.viscarta.sweep.SweepPoint;

/**
 * A linear viscoelastic model: its complex modulus M*(ω) = M′(ω) + iM″(ω) under the e^{+iωt}
 * convention (DOMAIN.md section 0), named parameters, an analytic Jacobian and start values
 * derived from data. All values in SI units; ω in rad/s.
 *
 * <p>To add a model: implement this interface as a final class in this package, add it to the
 * {@code permits} list, and register it in {@link ModelCatalogue}.
 */
public sealed interface ViscoelasticModel permits Springpot, Maxwell, KelvinVoigt, Zener {

    /** The identifier used on the command line and in outputs, e.g. {@code zener}. */
    String id();

    /** The parameters in the order of every {@code double[]} this model takes or returns. */
    List<ParameterSpec> parameters();

    /**
     * Evaluates M′ and M″.
     *
     * @param omega angular frequency [rad/s], > 0
     * @param p     natural parameter values, in the order of {@link #parameters()}
     * @param out   receives out[0] = M′ [Pa], out[1] = M″ [Pa]
     */
    void modulus(double omega, double[] p, double[] out);

    /**
     * Partial derivatives of M′ and M″ with respect to each natural parameter.
     *
     * @param dStorage receives ∂M′/∂p_j
     * @param dLoss    receives ∂M″/∂p_j
     */
    void derivatives(double omega, double[] p, double[] dStorage, double[] dLoss);

    /**
     * Start values for the fit, derived from the data (plateaus, the loss peak, log–log slopes);
     * several candidates spread over the plausible range so that the result does not hang on one guess.
     *
     * @param points measured points with positive moduli, sorted by frequency
     */
    List<double[]> startValues(List<SweepPoint> points);

    /** Number of parameters. */
    default int parameterCount() {
        return parameters().size();
    }
}
