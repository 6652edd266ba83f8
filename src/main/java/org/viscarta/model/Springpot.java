package org.viscarta.model;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.special.Gamma;
import org.apache.commons.math3.complex.Complex;
import org.viscarta.sweep.SweepPoint;

/**
 * Springpot (Scott Blair element, "power law"): σ = c d^αε/dt^α.
 *
 * \[ M^*(\omega) = c\,(i\omega)^\alpha,\quad M' = c\,\omega^\alpha\cos(\alpha\pi/2),\quad
 *    M'' = c\,\omega^\alpha\sin(\alpha\pi/2),\quad \tan\delta = \tan(\alpha\pi/2) \]
 *
 * <ul>
 *   <li>c [Pa·s^α] &gt; 0: the quasi-property (modulus at ω = 1 rad/s divided by |i^α| = 1);</li>
 *   <li>alpha [–] in (0, 1): α → 0 is a spring, α → 1 a dashpot.</li>
 * </ul>
 * The loss tangent does not depend on frequency; M′ and M″ are straight lines of slope α in log–log
 * axes, so the model has no plateau as ω → 0 or ω → ∞.
 *
 * <p>Sources: Scott Blair, G. W. (1947), "The role of psychophysics in rheology", J. Colloid Sci. 2:21–32;
 * Koeller, R. C. (1984), "Applications of fractional calculus to the theory of viscoelasticity",
 * J. Appl. Mech. 51:299–307; review in Bonfanti, Kaplan, Charras &amp; Kabla (2020), "Fractional
 * viscoelastic models for power-law materials", Soft Matter 16:6002. DOMAIN.md section 2.2.
 */
public final class Springpot implements ViscoelasticModel {

    private static final List<ParameterSpec> PARAMETERS = List.of(
            ParameterSpec.positive("c", "Pa·s^α"),
            ParameterSpec.exponent("alpha"));

    @Override
    public String id() {
        return "springpot";
    }

    @Override
    public List<ParameterSpec> parameters() {
        return PARAMETERS;
    }

    @Override
    public void modulus(double omega, double[] p, double[] out) {
        powerLaw(omega, p[0], p[1], out);
    }

    /** c ω^α cos(απ/2) and c ω^α sin(απ/2) into out[0], out[1]: the springpot term other models add to. */
    static void powerLaw(double omega, double c, double a, double[] out) {
        double w = Math.pow(omega, a);
        out[0] = c * w * Math.cos(a * Math.PI / 2);
        out[1] = c * w * Math.sin(a * Math.PI / 2);
    }

    @Override
    public void derivatives(double omega, double[] p, double[] dStorage, double[] dLoss) {
        powerLawDerivatives(omega, p[0], p[1], dStorage, dLoss, 0);
    }

    @Override
    public void modulusAndDerivatives(double omega, double[] p, double[] out, double[] dStorage, double[] dLoss) {
        powerLawAndDerivatives(omega, p[0], p[1], out, dStorage, dLoss, 0);
    }

    /** {@link #powerLaw} and {@link #powerLawDerivatives} at once: the power, cosine and sine computed once. */
    static void powerLawAndDerivatives(double omega, double c, double a, double[] out, double[] dStorage, double[] dLoss, int at) {
        double w = Math.pow(omega, a);
        double ca = Math.cos(a * Math.PI / 2);
        double sa = Math.sin(a * Math.PI / 2);
        out[0] = c * w * ca;
        out[1] = c * w * sa;
        double lnw = Math.log(omega);
        dStorage[at] = w * ca;
        dStorage[at + 1] = c * w * (lnw * ca - Math.PI / 2 * sa);
        dLoss[at] = w * sa;
        dLoss[at + 1] = c * w * (lnw * sa + Math.PI / 2 * ca);
    }

    /** ∂/∂c and ∂/∂α of the springpot term, written at indices {@code at} and {@code at + 1}. */
    static void powerLawDerivatives(double omega, double c, double a, double[] dStorage, double[] dLoss, int at) {
        double w = Math.pow(omega, a);
        double ca = Math.cos(a * Math.PI / 2);
        double sa = Math.sin(a * Math.PI / 2);
        double lnw = Math.log(omega);
        dStorage[at] = w * ca;
        dStorage[at + 1] = c * w * (lnw * ca - Math.PI / 2 * sa);
        dLoss[at] = w * sa;
        dLoss[at + 1] = c * w * (lnw * sa + Math.PI / 2 * ca);
    }

    @Override
    public List<double[]> startValues(List<SweepPoint> points) {
        DataFeatures f = new DataFeatures(points);
        List<double[]> starts = new ArrayList<>();
        double alphaFromTan = DataFeatures.clamp(2.0 / Math.PI * Math.atan(f.medianTanDelta), 0.02, 0.98);
        for (double alpha : new double[] {alphaFromTan, 0.1, 0.5, 0.9}) {
            double[] mags = new double[points.size()];
            for (int i = 0; i < mags.length; i++) {
                SweepPoint pt = points.get(i);
                mags[i] = pt.magnitude() / Math.pow(pt.omega(), alpha);
            }
            starts.add(new double[] {DataFeatures.median(mags), alpha});
        }
        return starts;
    }

    @Override
    public Complex modulusAt(Complex s, double[] p) {
        return s.pow(p[1]).multiply(p[0]);
    }

    /** M(t) = c t^{−α}/Γ(1 − α) (DOMAIN.md 2.2). */
    @Override
    public double relaxationModulus(double t, double[] p) {
        return p[0] * Math.pow(t, -p[1]) / Gamma.gamma(1 - p[1]);
    }

    /** J(t) = t^α/(c Γ(1 + α)) (DOMAIN.md 2.2). */
    @Override
    public double creepCompliance(double t, double[] p) {
        return Math.pow(t, p[1]) / (p[0] * Gamma.gamma(1 + p[1]));
    }

    @Override
    public List<Derived> derived() {
        return List.of(new Derived("loss_tangent", "-", p -> Math.tan(p[1] * Math.PI / 2)));
    }
}
