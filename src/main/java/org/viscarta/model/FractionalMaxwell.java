package org.viscarta.model;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.special.Gamma;
import org.viscarta.sweep.SweepPoint;

/**
 * Fractional Maxwell model: a spring E in series with a springpot c = E τ^α.
 *
 * \[ M^*(\omega) = E\,\frac{(i\omega\tau)^\alpha}{1 + (i\omega\tau)^\alpha},\quad X = (\omega\tau)^\alpha,\quad
 *    D = 1 + 2X\cos(\alpha\pi/2) + X^2,\quad M' = E\,\frac{X^2 + X\cos(\alpha\pi/2)}{D},\quad
 *    M'' = E\,\frac{X\sin(\alpha\pi/2)}{D} \]
 *
 * <ul>
 *   <li>E [Pa] &gt; 0: unrelaxed modulus (ω → ∞);</li>
 *   <li>tau [s] &gt; 0: characteristic time; at ωτ = 1, M′ = E/2 and M″ = (E/2) tan(απ/4);</li>
 *   <li>alpha [–] in (0, 1).</li>
 * </ul>
 * Relaxation M(t) = E E_α(−(t/τ)^α); creep J(t) = 1/E + t^α/(c Γ(1 + α)).
 * M′ = M″ where X = sin(απ/2) − cos(απ/2), which exists for α &gt; 1/2.
 *
 * <p>Sources: Schiessel, Metzler, Blumen &amp; Nonnenmacher (1995), "Generalized viscoelastic models:
 * their fractional equations with solutions", J. Phys. A 28:6567; Friedrich (1991), Rheol. Acta
 * 30:151; Bonfanti et al. (2020), Soft Matter 16:6002. DOMAIN.md section 2.2.
 */
public final class FractionalMaxwell implements ViscoelasticModel {

    private static final List<ParameterSpec> PARAMETERS = List.of(
            ParameterSpec.positive("E", "Pa"),
            ParameterSpec.time("tau"),
            ParameterSpec.exponent("alpha"));

    @Override
    public String id() {
        return "fractional-maxwell";
    }

    @Override
    public List<ParameterSpec> parameters() {
        return PARAMETERS;
    }

    @Override
    public void modulus(double omega, double[] p, double[] out) {
        FractionalArm arm = new FractionalArm();
        arm.evaluate(omega, p[1], p[2], false);
        out[0] = p[0] * arm.g1;
        out[1] = p[0] * arm.g2;
    }

    @Override
    public void derivatives(double omega, double[] p, double[] dStorage, double[] dLoss) {
        modulusAndDerivatives(omega, p, new double[2], dStorage, dLoss); // one copy of the formulas
    }

    @Override
    public void modulusAndDerivatives(double omega, double[] p, double[] out, double[] dStorage, double[] dLoss) {
        FractionalArm arm = new FractionalArm();
        arm.evaluate(omega, p[1], p[2], true); // the same g1, g2 as without derivatives
        out[0] = p[0] * arm.g1;
        out[1] = p[0] * arm.g2;
        dStorage[0] = arm.g1;
        dStorage[1] = p[0] * arm.dg1dTau;
        dStorage[2] = p[0] * arm.dg1dAlpha;
        dLoss[0] = arm.g2;
        dLoss[1] = p[0] * arm.dg2dTau;
        dLoss[2] = p[0] * arm.dg2dAlpha;
    }

    @Override
    public List<double[]> startValues(List<SweepPoint> points) {
        DataFeatures f = new DataFeatures(points);
        List<double[]> starts = new ArrayList<>();
        double alphaFromTan = DataFeatures.clamp(2.0 / Math.PI * Math.atan(f.medianTanDelta), 0.05, 0.95);
        for (double tau : new double[] {1 / f.omegaAtLossPeak, 1 / f.omegaCentre(), 10 / f.omegaMin, 0.1 / f.omegaMax}) {
            for (double alpha : new double[] {alphaFromTan, 0.5, 0.9}) {
                starts.add(new double[] {1.5 * f.storageMax, tau, alpha});
            }
        }
        return starts;
    }

    @Override
    public Complex modulusAt(Complex s, double[] p) {
        Complex x = s.multiply(p[1]).pow(p[2]);
        return x.multiply(p[0]).divide(x.add(1));
    }

    @Override
    public double relaxationModulus(double t, double[] p) {
        return p[0] * MittagLeffler.evaluate(p[2], -Math.pow(t / p[1], p[2]));
    }

    @Override
    public double creepCompliance(double t, double[] p) {
        double c = p[0] * Math.pow(p[1], p[2]);
        return 1 / p[0] + Math.pow(t, p[2]) / (c * Gamma.gamma(1 + p[2]));
    }

    @Override
    public List<Derived> derived() {
        return List.of(
                new Derived("unrelaxed_modulus", "Pa", p -> p[0]),
                new Derived("crossover_frequency", "Hz", p -> {
                    double x = Math.sin(p[2] * Math.PI / 2) - Math.cos(p[2] * Math.PI / 2);
                    return x > 0 ? Math.pow(x, 1 / p[2]) / (2 * Math.PI * p[1]) : Double.NaN;
                }));
    }
}
