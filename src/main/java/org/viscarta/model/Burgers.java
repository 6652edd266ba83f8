package org.viscarta.model;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.complex.Complex;
import org.viscarta.sweep.SweepPoint;

/**
 * Burgers model: a Maxwell element (E_1, η_1) in series with a Kelvin–Voigt element (E_2, η_2).
 * Written through the complex compliance J* = J′ − iJ″:
 *
 * \[ J' = \frac{1}{E_1} + \frac{E_2}{E_2^2 + \omega^2\eta_2^2},\quad
 *    J'' = \frac{1}{\omega\eta_1} + \frac{\omega\eta_2}{E_2^2 + \omega^2\eta_2^2},\quad
 *    M' = \frac{J'}{J'^2 + J''^2},\quad M'' = \frac{J''}{J'^2 + J''^2} \]
 *
 * <ul>
 *   <li>E_1 [Pa]: instantaneous (unrelaxed) modulus; eta_1 [Pa·s]: the viscosity of steady flow;</li>
 *   <li>E_2 [Pa], eta_2 [Pa·s]: the delayed-elastic (Kelvin–Voigt) element, retardation time η_2/E_2.</li>
 * </ul>
 * Creep: J(t) = 1/E_1 + t/η_1 + (1/E_2)(1 − e^{−E_2 t/η_2}); relaxation from the operator form
 * σ + p_1σ̇ + p_2σ̈ = q_1ε̇ + q_2ε̈ (DOMAIN.md 2.1).
 *
 * <p>Sources: Findley, Lai &amp; Onaran (1976), Creep and Relaxation of Nonlinear Viscoelastic
 * Materials, North-Holland (operator form); Ferry (1980), Viscoelastic Properties of Polymers,
 * 3rd ed., Wiley. DOMAIN.md section 2.1 [D].
 */
public final class Burgers implements ViscoelasticModel {

    private static final List<ParameterSpec> PARAMETERS = List.of(
            ParameterSpec.positive("E_1", "Pa"),
            ParameterSpec.positive("eta_1", "Pa·s"),
            ParameterSpec.positive("E_2", "Pa"),
            ParameterSpec.positive("eta_2", "Pa·s"));

    @Override
    public String id() {
        return "burgers";
    }

    @Override
    public List<ParameterSpec> parameters() {
        return PARAMETERS;
    }

    @Override
    public void modulus(double omega, double[] p, double[] out) {
        double d = p[2] * p[2] + omega * omega * p[3] * p[3];
        double jp = 1 / p[0] + p[2] / d;
        double jpp = 1 / (omega * p[1]) + omega * p[3] / d;
        double n = jp * jp + jpp * jpp;
        out[0] = jp / n;
        out[1] = jpp / n;
    }

    @Override
    public void derivatives(double omega, double[] p, double[] dStorage, double[] dLoss) {
        modulusAndDerivatives(omega, p, new double[2], dStorage, dLoss); // one copy of the formulas
    }

    /** The compliances and their norm computed once for the modulus and its derivatives (the same expressions as the two methods). */
    @Override
    public void modulusAndDerivatives(double omega, double[] p, double[] out, double[] dStorage, double[] dLoss) {
        double e1 = p[0];
        double eta1 = p[1];
        double e2 = p[2];
        double eta2 = p[3];
        double w2 = omega * omega;
        double d = e2 * e2 + w2 * eta2 * eta2;
        double d2 = d * d;
        double jp = 1 / e1 + e2 / d;
        double jpp = 1 / (omega * eta1) + omega * eta2 / d;
        double n = jp * jp + jpp * jpp;
        out[0] = jp / n;
        out[1] = jpp / n;
        double n2 = n * n;
        // d(J′)/dθ_j and d(J″)/dθ_j as scalars (arrays here were allocated on every call: the compiler did not remove
        // them); the same expressions, in the same order, as for every j: (dJ′ (J″² − J′²) − 2 J′ J″ dJ″) / n²
        double a = jpp * jpp - jp * jp;
        double c = jp * jp - jpp * jpp;
        double b = 2 * jp * jpp;
        double djp0 = -1 / (e1 * e1);
        double djpp1 = -1 / (omega * eta1 * eta1);
        double djp2 = (w2 * eta2 * eta2 - e2 * e2) / d2;
        double djpp2 = -omega * eta2 * 2 * e2 / d2;
        double djp3 = -e2 * 2 * w2 * eta2 / d2;
        double djpp3 = omega * (e2 * e2 - w2 * eta2 * eta2) / d2;
        dStorage[0] = (djp0 * a - b * 0.0) / n2;
        dLoss[0] = (0.0 * c - b * djp0) / n2;
        dStorage[1] = (0.0 * a - b * djpp1) / n2;
        dLoss[1] = (djpp1 * c - b * 0.0) / n2;
        dStorage[2] = (djp2 * a - b * djpp2) / n2;
        dLoss[2] = (djpp2 * c - b * djp2) / n2;
        dStorage[3] = (djp3 * a - b * djpp3) / n2;
        dLoss[3] = (djpp3 * c - b * djp3) / n2;
    }

    @Override
    public List<double[]> startValues(List<SweepPoint> points) {
        DataFeatures f = new DataFeatures(points);
        List<double[]> starts = new ArrayList<>();
        double e1 = 1.5 * f.storageMax;
        double e2 = Math.max(f.storageMin, 0.1 * f.storageMax);
        for (double tauFlow : new double[] {10 / f.omegaMin, 1 / f.omegaCentre()}) {
            for (double tauRet : new double[] {1 / f.omegaCentre(), 1 / f.omegaMax, 1 / f.omegaAtLossPeak}) {
                starts.add(new double[] {e1, e1 * tauFlow, e2, e2 * tauRet});
            }
        }
        return starts;
    }

    @Override
    public Complex modulusAt(Complex s, double[] p) {
        Complex j = s.multiply(p[1]).reciprocal().add(1 / p[0]).add(s.multiply(p[3]).add(p[2]).reciprocal());
        return j.reciprocal();
    }

    @Override
    public double relaxationModulus(double t, double[] p) {
        double e1 = p[0];
        double eta1 = p[1];
        double e2 = p[2];
        double eta2 = p[3];
        double p1 = eta1 / e1 + (eta1 + eta2) / e2;
        double p2 = eta1 * eta2 / (e1 * e2);
        double q1 = eta1;
        double q2 = eta1 * eta2 / e2;
        double a = Math.sqrt(p1 * p1 - 4 * p2);
        double r1 = (p1 - a) / (2 * p2);
        double r2 = (p1 + a) / (2 * p2);
        return ((q1 - q2 * r1) * Math.exp(-r1 * t) - (q1 - q2 * r2) * Math.exp(-r2 * t)) / a;
    }

    @Override
    public double creepCompliance(double t, double[] p) {
        return 1 / p[0] + t / p[1] + (1 - Math.exp(-p[2] * t / p[3])) / p[2];
    }

    @Override
    public List<Derived> derived() {
        return List.of(
                new Derived("unrelaxed_modulus", "Pa", p -> p[0]),
                new Derived("zero_frequency_viscosity", "Pa·s", p -> p[1]),
                new Derived("maxwell_time", "s", p -> p[1] / p[0]),
                new Derived("retardation_time", "s", p -> p[3] / p[2]));
    }
}
