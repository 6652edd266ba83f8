package org.viscarta.model;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.complex.Complex;
import org.viscarta.sweep.SweepPoint;

/**
 * Maxwell model: a spring E in series with a dashpot η = Eτ.
 *
 * \[ M^*(\omega) = E\,\frac{i\omega\tau}{1 + i\omega\tau},\quad x = \omega\tau,\quad
 *    M' = E\,\frac{x^2}{1+x^2},\quad M'' = E\,\frac{x}{1+x^2},\quad \tan\delta = 1/x \]
 *
 * <ul>
 *   <li>E [Pa] &gt; 0: the unrelaxed (high-frequency) modulus;</li>
 *   <li>tau [s] &gt; 0: the relaxation time; the crossover M′ = M″ = E/2 lies at ω = 1/τ.</li>
 * </ul>
 * As ω → 0, M′ ∝ ω² and M″ ∝ ω (a liquid, zero-frequency viscosity η0 = Eτ); as ω → ∞, M′ → E, M″ → 0.
 *
 * <p>Sources: Ferry, J. D. (1980), Viscoelastic Properties of Polymers, 3rd ed., Wiley, ch. 1;
 * Tschoegl, N. W. (1989), The Phenomenological Theory of Linear Viscoelastic Behavior, Springer.
 * DOMAIN.md section 2.1.
 */
public final class Maxwell implements ViscoelasticModel {

    private static final List<ParameterSpec> PARAMETERS = List.of(
            ParameterSpec.positive("E", "Pa"),
            ParameterSpec.time("tau"));

    @Override
    public String id() {
        return "maxwell";
    }

    @Override
    public List<ParameterSpec> parameters() {
        return PARAMETERS;
    }

    @Override
    public void modulus(double omega, double[] p, double[] out) {
        double x = omega * p[1];
        double d = 1 + x * x;
        out[0] = p[0] * x * x / d;
        out[1] = p[0] * x / d;
    }

    @Override
    public void derivatives(double omega, double[] p, double[] dStorage, double[] dLoss) {
        double e = p[0];
        double x = omega * p[1];
        double d = 1 + x * x;
        dStorage[0] = x * x / d;
        dStorage[1] = e * 2 * x / (d * d) * omega;
        dLoss[0] = x / d;
        dLoss[1] = e * (1 - x * x) / (d * d) * omega;
    }

    @Override
    public List<double[]> startValues(List<SweepPoint> points) {
        // tan δ = 1/(ωτ) gives τ at every point; |M*| = E x / sqrt(1 + x²) then gives E.
        double[] taus = new double[points.size()];
        for (int i = 0; i < taus.length; i++) {
            SweepPoint pt = points.get(i);
            taus[i] = 1.0 / (pt.omega() * pt.lossTangent());
        }
        DataFeatures f = new DataFeatures(points);
        List<double[]> starts = new ArrayList<>();
        for (double tau : new double[] {DataFeatures.median(taus), 1.0 / f.omegaCentre(), 1.0 / f.omegaMin, 1.0 / f.omegaMax}) {
            double[] es = new double[points.size()];
            for (int i = 0; i < es.length; i++) {
                SweepPoint pt = points.get(i);
                double x = pt.omega() * tau;
                es[i] = pt.magnitude() * Math.sqrt(1 + x * x) / x;
            }
            starts.add(new double[] {DataFeatures.median(es), tau});
        }
        return starts;
    }

    @Override
    public Complex modulusAt(Complex s, double[] p) {
        Complex x = s.multiply(p[1]);
        return x.multiply(p[0]).divide(x.add(1));
    }

    /** M(t) = E e^{−t/τ} (DOMAIN.md 2.1). */
    @Override
    public double relaxationModulus(double t, double[] p) {
        return p[0] * Math.exp(-t / p[1]);
    }

    /** J(t) = 1/E + t/η, η = Eτ (DOMAIN.md 2.1). */
    @Override
    public double creepCompliance(double t, double[] p) {
        return 1 / p[0] + t / (p[0] * p[1]);
    }

    @Override
    public List<Derived> derived() {
        return List.of(
                new Derived("crossover_frequency", "Hz", p -> 1 / (2 * Math.PI * p[1])),
                new Derived("zero_frequency_viscosity", "Pa·s", p -> p[0] * p[1]),
                new Derived("unrelaxed_modulus", "Pa", p -> p[0]));
    }
}
