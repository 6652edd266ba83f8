package org.viscarta.model;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.complex.Complex;
import org.viscarta.sweep.SweepPoint;

/**
 * Fractional Zener model (Bagley–Torvik four-parameter model): a spring E_r in parallel with a
 * fractional Maxwell arm (E_1, τ, α).
 *
 * \[ M^*(\omega) = E_r + E_1\,\frac{(i\omega\tau)^\alpha}{1 + (i\omega\tau)^\alpha},\quad
 *    M' = E_r + E_1\,\frac{X^2 + X\cos(\alpha\pi/2)}{D},\quad M'' = E_1\,\frac{X\sin(\alpha\pi/2)}{D} \]
 *
 * with X = (ωτ)^α and D = 1 + 2X cos(απ/2) + X².
 * <ul>
 *   <li>E_r [Pa] &gt; 0: relaxed modulus; E_1 [Pa] &gt; 0: relaxation strength (unrelaxed E_r + E_1);</li>
 *   <li>tau [s] &gt; 0: characteristic time; alpha [–] in (0, 1): breadth of the transition (α = 1 is the zener).</li>
 * </ul>
 * Relaxation M(t) = E_r + E_1 E_α(−(t/τ)^α); creep by numerical Laplace inversion.
 *
 * <p>Sources: Bagley, R. L. &amp; Torvik, P. J. (1986), "On the fractional calculus model of
 * viscoelastic behavior", J. Rheol. 30:133–155; Bagley &amp; Torvik (1983), J. Rheol. 27:201.
 * DOMAIN.md section 2.2.
 */
public final class FractionalZener implements ViscoelasticModel {

    private static final List<ParameterSpec> PARAMETERS = List.of(
            ParameterSpec.positive("E_r", "Pa"),
            ParameterSpec.positive("E_1", "Pa"),
            ParameterSpec.time("tau"),
            ParameterSpec.exponent("alpha"));

    @Override
    public String id() {
        return "fractional-zener";
    }

    @Override
    public List<ParameterSpec> parameters() {
        return PARAMETERS;
    }

    @Override
    public void modulus(double omega, double[] p, double[] out) {
        FractionalArm arm = new FractionalArm();
        arm.evaluate(omega, p[2], p[3], false);
        out[0] = p[0] + p[1] * arm.g1;
        out[1] = p[1] * arm.g2;
    }

    @Override
    public void derivatives(double omega, double[] p, double[] dStorage, double[] dLoss) {
        modulusAndDerivatives(omega, p, new double[2], dStorage, dLoss); // one copy of the formulas
    }

    @Override
    public void modulusAndDerivatives(double omega, double[] p, double[] out, double[] dStorage, double[] dLoss) {
        FractionalArm arm = new FractionalArm();
        arm.evaluate(omega, p[2], p[3], true); // the same g1, g2 as without derivatives
        out[0] = p[0] + p[1] * arm.g1;
        out[1] = p[1] * arm.g2;
        dStorage[0] = 1;
        dStorage[1] = arm.g1;
        dStorage[2] = p[1] * arm.dg1dTau;
        dStorage[3] = p[1] * arm.dg1dAlpha;
        dLoss[0] = 0;
        dLoss[1] = arm.g2;
        dLoss[2] = p[1] * arm.dg2dTau;
        dLoss[3] = p[1] * arm.dg2dAlpha;
    }

    @Override
    public List<double[]> startValues(List<SweepPoint> points) {
        DataFeatures f = new DataFeatures(points);
        double spread = Math.max(f.storageMax - f.storageMin, 0.2 * f.storageMin);
        List<double[]> starts = new ArrayList<>();
        for (double tau : new double[] {1 / f.omegaAtLossPeak, 1 / f.omegaCentre(), 10 / f.omegaMin, 0.1 / f.omegaMax}) {
            for (double alpha : new double[] {0.3, 0.6, 0.9}) {
                starts.add(new double[] {0.8 * f.storageMin, spread, tau, alpha});
            }
        }
        return starts;
    }

    @Override
    public Complex modulusAt(Complex s, double[] p) {
        Complex x = s.multiply(p[2]).pow(p[3]);
        return x.multiply(p[1]).divide(x.add(1)).add(p[0]);
    }

    @Override
    public double relaxationModulus(double t, double[] p) {
        return p[0] + p[1] * MittagLeffler.evaluate(p[3], -Math.pow(t / p[2], p[3]));
    }

    @Override
    public List<Derived> derived() {
        return List.of(
                new Derived("relaxed_modulus", "Pa", p -> p[0]),
                new Derived("unrelaxed_modulus", "Pa", p -> p[0] + p[1]));
    }
}
