package org.viscarta.model;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.special.Gamma;
import org.viscarta.sweep.SweepPoint;

/**
 * Fractional Kelvin–Voigt model: a spring E in parallel with a springpot (c, α).
 *
 * \[ M^*(\omega) = E + c\,(i\omega)^\alpha,\quad M' = E + c\,\omega^\alpha\cos(\alpha\pi/2),\quad
 *    M'' = c\,\omega^\alpha\sin(\alpha\pi/2) \]
 *
 * <ul>
 *   <li>E [Pa] &gt; 0: the equilibrium (relaxed) modulus;</li>
 *   <li>c [Pa·s^α] &gt; 0, alpha [–] in (0, 1): the springpot.</li>
 * </ul>
 * Relaxation M(t) = E + c t^{−α}/Γ(1 − α); creep J(t) = (1/E)[1 − E_α(−(E/c) t^α)].
 *
 * <p>Sources: Bonfanti, Kaplan, Charras &amp; Kabla (2020), "Fractional viscoelastic models for
 * power-law materials", Soft Matter 16:6002; Lewandowski &amp; Chorążyczewski (2010), "Identification
 * of the parameters of the Kelvin–Voigt and the Maxwell fractional models, used to modeling of
 * viscoelastic dampers", Computers &amp; Structures 88:1–17. DOMAIN.md section 2.2.
 */
public final class FractionalKelvinVoigt implements ViscoelasticModel {

    private static final List<ParameterSpec> PARAMETERS = List.of(
            ParameterSpec.positive("E", "Pa"),
            ParameterSpec.positive("c", "Pa·s^α"),
            ParameterSpec.exponent("alpha"));

    @Override
    public String id() {
        return "fractional-kelvin-voigt";
    }

    @Override
    public List<ParameterSpec> parameters() {
        return PARAMETERS;
    }

    /** E plus the springpot term (c, α). */
    @Override
    public void modulus(double omega, double[] p, double[] out) {
        Springpot.powerLaw(omega, p[1], p[2], out);
        out[0] += p[0];
    }

    @Override
    public void derivatives(double omega, double[] p, double[] dStorage, double[] dLoss) {
        dStorage[0] = 1;
        dLoss[0] = 0;
        Springpot.powerLawDerivatives(omega, p[1], p[2], dStorage, dLoss, 1);
    }

    @Override
    public void modulusAndDerivatives(double omega, double[] p, double[] out, double[] dStorage, double[] dLoss) {
        Springpot.powerLawAndDerivatives(omega, p[1], p[2], out, dStorage, dLoss, 1);
        out[0] += p[0];
        dStorage[0] = 1;
        dLoss[0] = 0;
    }

    @Override
    public List<double[]> startValues(List<SweepPoint> points) {
        DataFeatures f = new DataFeatures(points);
        List<double[]> starts = new ArrayList<>();
        for (double e : new double[] {0.8 * f.storageMin, 0.3 * f.storageMin}) {
            for (double alpha : new double[] {0.2, 0.5, 0.8}) {
                double sa = Math.sin(alpha * Math.PI / 2);
                double[] cs = new double[points.size()];
                for (int i = 0; i < cs.length; i++) {
                    cs[i] = points.get(i).loss() / (Math.pow(points.get(i).omega(), alpha) * sa);
                }
                starts.add(new double[] {e, DataFeatures.median(cs), alpha});
            }
        }
        return starts;
    }

    @Override
    public Complex modulusAt(Complex s, double[] p) {
        return s.pow(p[2]).multiply(p[1]).add(p[0]);
    }

    @Override
    public double relaxationModulus(double t, double[] p) {
        return p[0] + p[1] * Math.pow(t, -p[2]) / Gamma.gamma(1 - p[2]);
    }

    @Override
    public double creepCompliance(double t, double[] p) {
        return (1 - MittagLeffler.evaluate(p[2], -(p[0] / p[1]) * Math.pow(t, p[2]))) / p[0];
    }

    @Override
    public List<Derived> derived() {
        return List.of(
                new Derived("relaxed_modulus", "Pa", p -> p[0]),
                new Derived("characteristic_time", "s", p -> Math.pow(p[1] / p[0], 1 / p[2])));
    }
}
