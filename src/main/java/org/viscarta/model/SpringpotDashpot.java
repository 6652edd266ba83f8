package org.viscarta.model;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.complex.Complex;
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

    private static final Springpot POWER_LAW = new Springpot();

    /** The springpot part (c, alpha come first, as in {@link Springpot}) plus iωη. */
    @Override
    public void modulus(double omega, double[] p, double[] out) {
        POWER_LAW.modulus(omega, p, out);
        out[1] += omega * p[2];
    }

    @Override
    public void derivatives(double omega, double[] p, double[] dStorage, double[] dLoss) {
        POWER_LAW.derivatives(omega, p, dStorage, dLoss);
        dStorage[2] = 0;
        dLoss[2] = omega;
    }

    @Override
    public void modulusAndDerivatives(double omega, double[] p, double[] out, double[] dStorage, double[] dLoss) {
        POWER_LAW.modulusAndDerivatives(omega, p, out, dStorage, dLoss);
        out[1] += omega * p[2];
        dStorage[2] = 0;
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
        for (double[] sp : POWER_LAW.startValues(points)) {
            starts.add(new double[] {sp[0], sp[1], 0.1 * eta});
        }
        return starts;
    }

    @Override
    public Complex modulusAt(Complex s, double[] p) {
        return POWER_LAW.modulusAt(s, p).add(s.multiply(p[2]));
    }

    /** The springpot's c t^{−α}/Γ(1 − α); the dashpot adds only η δ(t) at t = 0. */
    @Override
    public double relaxationModulus(double t, double[] p) {
        return POWER_LAW.relaxationModulus(t, p);
    }

    @Override
    public double creepCompliance(double t, double[] p) {
        return t / p[2] * MittagLeffler.evaluate(1 - p[1], 2, -(p[0] / p[2]) * Math.pow(t, 1 - p[1]));
    }
}
