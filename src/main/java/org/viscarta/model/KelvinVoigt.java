package org.viscarta.model;

import java.util.List;
import org.apache.commons.math3.complex.Complex;
import org.viscarta.sweep.SweepPoint;

/**
 * Kelvin–Voigt model: a spring E in parallel with a dashpot η.
 *
 * \[ M^*(\omega) = E + i\omega\eta,\quad M' = E,\quad M'' = \omega\eta,\quad
 *    \tan\delta = \omega\tau,\ \tau = \eta/E \]
 *
 * <ul>
 *   <li>E [Pa] &gt; 0: the (frequency-independent) storage modulus;</li>
 *   <li>eta [Pa·s] &gt; 0: the viscosity of the dashpot.</li>
 * </ul>
 * As ω → ∞ the loss modulus grows without bound (instantaneous response needs infinite stress).
 *
 * <p>Sources: Ferry, J. D. (1980), Viscoelastic Properties of Polymers, 3rd ed., Wiley;
 * Tschoegl, N. W. (1989), The Phenomenological Theory of Linear Viscoelastic Behavior, Springer.
 * DOMAIN.md section 2.1.
 */
public final class KelvinVoigt implements ViscoelasticModel {

    private static final List<ParameterSpec> PARAMETERS = List.of(
            ParameterSpec.positive("E", "Pa"),
            ParameterSpec.positive("eta", "Pa·s"));

    @Override
    public String id() {
        return "kelvin-voigt";
    }

    @Override
    public List<ParameterSpec> parameters() {
        return PARAMETERS;
    }

    @Override
    public void modulus(double omega, double[] p, double[] out) {
        out[0] = p[0];
        out[1] = omega * p[1];
    }

    @Override
    public void derivatives(double omega, double[] p, double[] dStorage, double[] dLoss) {
        dStorage[0] = 1;
        dStorage[1] = 0;
        dLoss[0] = 0;
        dLoss[1] = omega;
    }

    @Override
    public List<double[]> startValues(List<SweepPoint> points) {
        double[] etas = new double[points.size()];
        for (int i = 0; i < etas.length; i++) {
            etas[i] = points.get(i).loss() / points.get(i).omega();
        }
        DataFeatures f = new DataFeatures(points);
        return List.of(new double[] {f.medianStorage, DataFeatures.median(etas)});
    }

    @Override
    public Complex modulusAt(Complex s, double[] p) {
        return s.multiply(p[1]).add(p[0]);
    }

    /** M(t) = E for t &gt; 0 (plus η δ(t), left out) (DOMAIN.md 2.1). */
    @Override
    public double relaxationModulus(double t, double[] p) {
        return p[0];
    }

    /** J(t) = (1/E)(1 − e^{−t/τ}), τ = η/E (DOMAIN.md 2.1). */
    @Override
    public double creepCompliance(double t, double[] p) {
        return (1 - Math.exp(-t * p[0] / p[1])) / p[0];
    }

    @Override
    public List<Derived> derived() {
        return List.of(
                new Derived("retardation_time", "s", p -> p[1] / p[0]),
                new Derived("crossover_frequency", "Hz", p -> p[0] / (2 * Math.PI * p[1])),
                new Derived("relaxed_modulus", "Pa", p -> p[0]));
    }
}
