package org.viscarta.model;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.special.Gamma;
import org.viscarta.sweep.SweepPoint;

/**
 * Springpot in parallel with a dashpot: a power law with a Newtonian term ("structural damping"
 * with a viscous contribution at high frequency).
 *
 * \[ M^*(\omega) = c\,(i\omega)^\alpha + i\omega\eta,\quad M' = c\,\omega^\alpha\cos(\alpha\pi/2),\quad
 *    M'' = c\,\omega^\alpha\sin(\alpha\pi/2) + \omega\eta \]
 *
 * <ul>
 *   <li>c [Pa·s^α] &gt; 0, alpha [–] in (0, 1): the springpot;</li>
 *   <li>eta [Pa·s] &gt; 0: the Newtonian viscosity.</li>
 * </ul>
 * Relaxation (t &gt; 0): M(t) = c t^{−α}/Γ(1 − α) (plus η δ(t)); creep:
 * J(t) = (t/η) E_{1−α,2}(−(c/η) t^{1−α}) from the Laplace pair of the Mittag-Leffler function.
 *
 * <p>Sources: Fabry, Maksym, Butler, Glogauer, Navajas &amp; Fredberg (2001), "Scaling the microrheology
 * of living cells", Phys. Rev. Lett. 87:148102 (with G_0, Φ_0 in place of c: c = G_0 Γ(1 − α) Φ_0^{−α});
 * Alcaraz et al. (2003), Biophys. J. 84:2071–2079. DOMAIN.md section 2.2; the creep form is derived
 * there [D] with Podlubny (1999).
 */
public final class SpringpotDashpot implements ViscoelasticModel {

    private static final List<ParameterSpec> PARAMETERS = List.of(
            ParameterSpec.positive("c", "Pa·s^α"),
            ParameterSpec.exponent("alpha"),
            ParameterSpec.positive("eta", "Pa·s"));

    @Override
    public String id() {
        return "springpot-dashpot";
    }

    @Override
    public List<ParameterSpec> parameters() {
        return PARAMETERS;
    }

    @Override
    public void modulus(double omega, double[] p, double[] out) {
        double w = Math.pow(omega, p[1]);
        out[0] = p[0] * w * Math.cos(p[1] * Math.PI / 2);
        out[1] = p[0] * w * Math.sin(p[1] * Math.PI / 2) + omega * p[2];
    }

    @Override
    public void derivatives(double omega, double[] p, double[] dStorage, double[] dLoss) {
        double c = p[0];
        double a = p[1];
        double w = Math.pow(omega, a);
        double ca = Math.cos(a * Math.PI / 2);
        double sa = Math.sin(a * Math.PI / 2);
        double lnw = Math.log(omega);
        dStorage[0] = w * ca;
        dStorage[1] = c * w * (lnw * ca - Math.PI / 2 * sa);
        dStorage[2] = 0;
        dLoss[0] = w * sa;
        dLoss[1] = c * w * (lnw * sa + Math.PI / 2 * ca);
        dLoss[2] = omega;
    }

    @Override
    public List<double[]> startValues(List<SweepPoint> points) {
        List<double[]> starts = new ArrayList<>();
        double[] etas = new double[points.size()];
        for (int i = 0; i < etas.length; i++) {
            etas[i] = points.get(i).loss() / points.get(i).omega();
        }
        double eta = DataFeatures.median(etas);
        for (double[] sp : new Springpot().startValues(points)) {
            starts.add(new double[] {sp[0], sp[1], 0.1 * eta});
        }
        return starts;
    }

    @Override
    public Complex modulusAt(Complex s, double[] p) {
        return s.pow(p[1]).multiply(p[0]).add(s.multiply(p[2]));
    }

    @Override
    public double relaxationModulus(double t, double[] p) {
        return p[0] * Math.pow(t, -p[1]) / Gamma.gamma(1 - p[1]);
    }

    @Override
    public double creepCompliance(double t, double[] p) {
        return t / p[2] * MittagLeffler.evaluate(1 - p[1], 2, -(p[0] / p[2]) * Math.pow(t, 1 - p[1]));
    }
}
