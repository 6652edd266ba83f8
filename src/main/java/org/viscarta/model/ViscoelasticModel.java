package org.viscarta.model;

import java.util.List;
import org.apache.commons.math3.complex.Complex;
import org.viscarta.sweep.SweepPoint;

/**
 * A linear viscoelastic model: its complex modulus M*(ω) = M′(ω) + iM″(ω) under the e^{+iωt}
 * convention (DOMAIN.md section 0), named parameters, an analytic Jacobian and start values
 * derived from data. All values in SI units; ω in rad/s.
 *
 * <p>To add a model: implement this interface as a final class in this package, add it to the
 * {@code permits} list, and register it in {@link ModelCatalogue}.
 */
public sealed interface ViscoelasticModel permits Springpot, EmpiricalPowerLaw, SpringpotDashpot, Maxwell, KelvinVoigt,
        Zener, Burgers, GeneralizedMaxwell, FractionalKelvinVoigt, FractionalMaxwell, FractionalZener {

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
     * {@link #modulus} and {@link #derivatives} at once, for the fits, which need both at every
     * frequency of every iteration. Models whose two methods share costly work (powers, logarithms,
     * cosines) override it to do that work once; the numbers must be those of the two methods, bit
     * for bit (JacobianTest checks every model and variant).
     */
    default void modulusAndDerivatives(double omega, double[] p, double[] out, double[] dStorage, double[] dLoss) {
        modulus(omega, p, out);
        derivatives(omega, p, dStorage, dLoss);
    }

    /**
     * Start values for the fit, derived from the data (plateaus, the loss peak, log–log slopes);
     * several candidates spread over the plausible range so that the result does not hang on one guess.
     *
     * @param points measured points with positive moduli, sorted by frequency
     */
    List<double[]> startValues(List<SweepPoint> points);

    /**
     * The complex modulus as a Laplace-domain function, M*(s) with iω → s, for the numerical
     * inversion of the time-domain functions. Null for models without a time domain.
     */
    Complex modulusAt(Complex s, double[] p);

    /**
     * Relaxation modulus M(t) [Pa] for t &gt; 0 (a Dirac term at t = 0, as in a dashpot, is left out).
     * The default inverts M*(s)/s numerically (Talbot); models override it with closed forms.
     */
    default double relaxationModulus(double t, double[] p) {
        return LaplaceInversion.invert(s -> modulusAt(s, p).divide(s), t);
    }

    /**
     * Creep compliance J(t) [1/Pa] for t &gt; 0. The default inverts 1/(s M*(s)) numerically (Talbot);
     * models override it with closed forms.
     */
    default double creepCompliance(double t, double[] p) {
        return LaplaceInversion.invert(s -> modulusAt(s, p).multiply(s).reciprocal(), t);
    }

    /** False for descriptive models that have no time domain (empirical-power-law). */
    default boolean hasTimeDomain() {
        return true;
    }

    /** Quantities derived from the parameters, where the model defines them. */
    default List<Derived> derived() {
        return List.of();
    }

    /**
     * The concrete models to fit for this entry: itself, or, for a family whose size is chosen by
     * AICc (generalized-maxwell without a fixed number of elements), one model per size.
     */
    default List<ViscoelasticModel> variants() {
        return List.of(this);
    }

    /**
     * The size step of this variant within its family (the number of elements), 0 outside a
     * family: a family stops growing when no variant of a step improves on the smaller ones.
     */
    default int variantStep() {
        return 0;
    }

    /**
     * True for a variant tried only when the variant before it in {@link #variants()} did not
     * determine all its parameters (e.g. the generalized-Maxwell liquid after the solid whose E_inf
     * ran to zero).
     */
    default boolean fallback() {
        return false;
    }

    /** What distinguishes this variant within its family (e.g. "3 elements"), or "". */
    default String describeVariant() {
        return "";
    }

    /**
     * Why this model cannot be fitted meaningfully to these points, or "" when it can (e.g. a
     * generalized Maxwell model with more relaxation times than the window has decades).
     */
    default String unsuitable(List<SweepPoint> points) {
        return "";
    }

    /** Number of parameters. */
    default int parameterCount() {
        return parameters().size();
    }
}
