package org.viscarta.model;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.complex.Complex;
import org.viscarta.sweep.SweepPoint;

/**
 * Zener model (standard linear solid, Maxwell form): a spring E_r in parallel with a Maxwell arm
 * (spring E_1, dashpot η_1 = E_1 τ).
 *
 * \[ M^*(\omega) = E_r + E_1\,\frac{i\omega\tau}{1 + i\omega\tau},\quad x = \omega\tau,\quad
 *    M' = E_r + E_1\frac{x^2}{1+x^2},\quad M'' = E_1\frac{x}{1+x^2} \]
 *
 * <ul>
 *   <li>E_r [Pa] &gt; 0: relaxed modulus (ω → 0);</li>
 *   <li>E_1 [Pa] &gt; 0: relaxation strength; E_r + E_1 is the unrelaxed modulus (ω → ∞);</li>
 *   <li>tau [s] &gt; 0: relaxation time at constant strain.</li>
 * </ul>
 * The loss tangent peaks at x* = sqrt(E_r/(E_r + E_1)) with tan δ_max = E_1/(2 sqrt(E_r(E_r + E_1))).
 *
 * <p>Sources: Zener, C. (1948), Elasticity and Anelasticity of Metals, University of Chicago Press;
 * Ferry, J. D. (1980), Viscoelastic Properties of Polymers, 3rd ed., Wiley; Tschoegl, N. W. (1989),
 * The Phenomenological Theory of Linear Viscoelastic Behavior, Springer. DOMAIN.md section 2.1
 * (which writes E_e for E_r).
 */
public final class Zener implements ViscoelasticModel {

    private static final List<ParameterSpec> PARAMETERS = List.of(
            ParameterSpec.positive("E_r", "Pa"),
            ParameterSpec.positive("E_1", "Pa"),
            ParameterSpec.time("tau"));

    @Override
    public String id() {
        return "zener";
    }

    @Override
    public List<ParameterSpec> parameters() {
        return PARAMETERS;
    }

    @Override
    public void modulus(double omega, double[] p, double[] out) {
        double x = omega * p[2];
        double q = 1 / (1 + x * x);
        out[0] = p[0] + p[1] * (x * x * q);
        out[1] = p[1] * (x * q);
    }

    @Override
    public void derivatives(double omega, double[] p, double[] dStorage, double[] dLoss) {
        double e1 = p[1];
        double x = omega * p[2];
        double q = 1 / (1 + x * x);
        dStorage[0] = 1;
        dStorage[1] = x * x * q;
        dStorage[2] = e1 * 2 * (x * q) * q * omega;
        dLoss[0] = 0;
        dLoss[1] = x * q;
        dLoss[2] = e1 * (1 - x * x) * q * q * omega;
    }

    /** Both at once, sharing x = ωτ and q = 1/(1 + x²): bit for bit what {@link #modulus} and {@link #derivatives} give. */
    @Override
    public void modulusAndDerivatives(double omega, double[] p, double[] out, double[] dStorage, double[] dLoss) {
        double e1 = p[1];
        double x = omega * p[2];
        double q = 1 / (1 + x * x);
        double storageShape = x * x * q;
        double lossShape = x * q;
        out[0] = p[0] + e1 * storageShape;
        out[1] = e1 * lossShape;
        dStorage[0] = 1;
        dStorage[1] = storageShape;
        dStorage[2] = e1 * 2 * lossShape * q * omega;
        dLoss[0] = 0;
        dLoss[1] = lossShape;
        dLoss[2] = e1 * (1 - x * x) * q * q * omega;
    }

    @Override
    public List<double[]> startValues(List<SweepPoint> points) {
        DataFeatures f = new DataFeatures(points);
        double er = 0.9 * f.storageMin;
        double spread = Math.max(f.storageMax - f.storageMin, 0.1 * f.storageMin);
        List<double[]> starts = new ArrayList<>();
        double[] taus = {1.0 / f.omegaAtLossPeak, 1.0 / f.omegaCentre(), 10.0 / f.omegaMin, 0.1 / f.omegaMax};
        for (double tau : taus) {
            starts.add(new double[] {er, spread, tau});
        }
        starts.add(new double[] {0.5 * f.storageMin, 2 * spread, 1.0 / f.omegaCentre()});
        return starts;
    }

    @Override
    public Complex modulusAt(Complex s, double[] p) {
        Complex x = s.multiply(p[2]);
        return x.multiply(p[1]).divide(x.add(1)).add(p[0]);
    }

    /** M(t) = E_r + E_1 e^{−t/τ} (DOMAIN.md 2.1). */
    @Override
    public double relaxationModulus(double t, double[] p) {
        return p[0] + p[1] * Math.exp(-t / p[2]);
    }

    /**
     * J(t) = 1/E_a + (1/E_b)(1 − e^{−t/τ_C}) of the equivalent Kelvin (Poynting–Thomson) form,
     * E_a = E_r + E_1, E_b = E_r(E_r + E_1)/E_1, τ_C = τ(E_r + E_1)/E_r (DOMAIN.md 2.1, exact mapping).
     */
    @Override
    public double creepCompliance(double t, double[] p) {
        double ea = p[0] + p[1];
        double eb = p[0] * ea / p[1];
        double tauC = p[2] * ea / p[0];
        return 1 / ea + (1 - Math.exp(-t / tauC)) / eb;
    }

    @Override
    public List<Derived> derived() {
        return List.of(
                new Derived("relaxed_modulus", "Pa", p -> p[0]),
                new Derived("unrelaxed_modulus", "Pa", p -> p[0] + p[1]),
                new Derived("retardation_time", "s", p -> p[2] * (p[0] + p[1]) / p[0]),
                new Derived("loss_peak_frequency", "Hz", p -> Math.sqrt(p[0] / (p[0] + p[1])) / (2 * Math.PI * p[2])),
                new Derived("loss_tangent_max", "-", p -> p[1] / (2 * Math.sqrt(p[0] * (p[0] + p[1])))));
    }
}
