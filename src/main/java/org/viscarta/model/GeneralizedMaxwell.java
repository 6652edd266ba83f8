package org.viscarta.model;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.complex.Complex;
import org.viscarta.sweep.SweepPoint;

/**
 * Generalized Maxwell model (Prony series): a spring E_inf in parallel with N Maxwell arms
 * (E_i, τ_i).
 *
 * \[ M^*(\omega) = E_\infty + \sum_{i=1}^{N} E_i\,\frac{i\omega\tau_i}{1 + i\omega\tau_i},\quad
 *    M' = E_\infty + \sum E_i\frac{\omega^2\tau_i^2}{1+\omega^2\tau_i^2},\quad
 *    M'' = \sum E_i\frac{\omega\tau_i}{1+\omega^2\tau_i^2} \]
 *
 * Parameters in the order E_inf, E_1 … E_N, tau_1 … tau_N (all &gt; 0; moduli in Pa, times in s).
 * Relaxation M(t) = E_inf + Σ E_i e^{−t/τ_i}; creep by numerical Laplace inversion.
 * When the number of elements is not fixed, the catalogue's {@code generalized-maxwell} fits
 * N = 1 … 5 and keeps the lowest AICc ({@link #variants()}).
 *
 * <p>Sources: Ferry, J. D. (1980), Viscoelastic Properties of Polymers, 3rd ed., Wiley;
 * Tschoegl, N. W. (1989), The Phenomenological Theory of Linear Viscoelastic Behavior, Springer;
 * Park &amp; Schapery (1999), Int. J. Solids Struct. 36:1653. DOMAIN.md section 2.1.
 */
public final class GeneralizedMaxwell implements ViscoelasticModel {

    /** Largest number of elements tried when it is chosen by AICc. */
    public static final int MAX_ELEMENTS = 5;

    private final int elements;
    private final List<ParameterSpec> parameters;

    /**
     * @param elements N in 1 … 5, or 0 for "choose N by AICc" (a family whose {@link #variants()}
     *                 are the fixed-N models)
     */
    public GeneralizedMaxwell(int elements) {
        if (elements < 0 || elements > MAX_ELEMENTS) {
            throw new IllegalArgumentException("generalized-maxwell takes 1 to " + MAX_ELEMENTS + " elements, got " + elements);
        }
        this.elements = elements;
        List<ParameterSpec> ps = new ArrayList<>();
        ps.add(ParameterSpec.positive("E_inf", "Pa"));
        for (int i = 1; i <= elements; i++) {
            ps.add(ParameterSpec.positive("E_" + i, "Pa"));
        }
        for (int i = 1; i <= elements; i++) {
            ps.add(ParameterSpec.time("tau_" + i));
        }
        this.parameters = List.copyOf(ps);
    }

    /** The number of elements, 0 for the auto-selecting family. */
    public int elements() {
        return elements;
    }

    @Override
    public String id() {
        return "generalized-maxwell";
    }

    @Override
    public List<ParameterSpec> parameters() {
        return parameters;
    }

    @Override
    public List<ViscoelasticModel> variants() {
        if (elements > 0) {
            return List.of(this);
        }
        List<ViscoelasticModel> v = new ArrayList<>();
        for (int n = 1; n <= MAX_ELEMENTS; n++) {
            v.add(new GeneralizedMaxwell(n));
        }
        return v;
    }

    @Override
    public String describeVariant() {
        return elements == 1 ? "1 element" : elements + " elements";
    }

    @Override
    public void modulus(double omega, double[] p, double[] out) {
        double s = p[0];
        double l = 0;
        for (int i = 1; i <= elements; i++) {
            double x = omega * p[elements + i];
            double d = 1 + x * x;
            s += p[i] * x * x / d;
            l += p[i] * x / d;
        }
        out[0] = s;
        out[1] = l;
    }

    @Override
    public void derivatives(double omega, double[] p, double[] dStorage, double[] dLoss) {
        dStorage[0] = 1;
        dLoss[0] = 0;
        for (int i = 1; i <= elements; i++) {
            double x = omega * p[elements + i];
            double d = 1 + x * x;
            dStorage[i] = x * x / d;
            dLoss[i] = x / d;
            dStorage[elements + i] = p[i] * 2 * x / (d * d) * omega;
            dLoss[elements + i] = p[i] * (1 - x * x) / (d * d) * omega;
        }
    }

    /**
     * About one relaxation time per decade of frequency can be resolved (Baumgaertel &amp; Winter 1989,
     * Rheol. Acta 28:511, suggest one to two; DOMAIN.md section 7): N may not exceed 1 + the decades spanned.
     */
    @Override
    public String unsuitable(List<SweepPoint> points) {
        DataFeatures f = new DataFeatures(points);
        double decades = Math.log10(f.omegaMax / f.omegaMin);
        if (elements > 1 + decades) {
            return String.format(java.util.Locale.ROOT, "%d relaxation times need at least %d decades of frequency; the sweep spans %.1f",
                    elements, elements - 1, decades);
        }
        return "";
    }

    /** τ_i spread evenly in log over the window (and over the window widened by a decade each side). */
    @Override
    public List<double[]> startValues(List<SweepPoint> points) {
        DataFeatures f = new DataFeatures(points);
        List<double[]> starts = new ArrayList<>();
        double spread = Math.max(f.storageMax - f.storageMin, 0.2 * f.storageMax);
        for (double widen : new double[] {1, 10}) {
            double tauLo = 1 / (f.omegaMax * widen);
            double tauHi = widen / f.omegaMin;
            double[] s = new double[1 + 2 * elements];
            s[0] = 0.5 * f.storageMin;
            for (int i = 1; i <= elements; i++) {
                s[i] = spread / elements;
                double w = elements == 1 ? 0.5 : (i - 1) / (double) (elements - 1);
                s[elements + i] = tauLo * Math.pow(tauHi / tauLo, w);
            }
            starts.add(s);
        }
        return starts;
    }

    @Override
    public Complex modulusAt(Complex s, double[] p) {
        Complex m = new Complex(p[0], 0);
        for (int i = 1; i <= elements; i++) {
            Complex x = s.multiply(p[elements + i]);
            m = m.add(x.multiply(p[i]).divide(x.add(1)));
        }
        return m;
    }

    @Override
    public double relaxationModulus(double t, double[] p) {
        double m = p[0];
        for (int i = 1; i <= elements; i++) {
            m += p[i] * Math.exp(-t / p[elements + i]);
        }
        return m;
    }

    @Override
    public List<Derived> derived() {
        int n = elements;
        return List.of(
                new Derived("relaxed_modulus", "Pa", p -> p[0]),
                new Derived("unrelaxed_modulus", "Pa", p -> {
                    double e = p[0];
                    for (int i = 1; i <= n; i++) {
                        e += p[i];
                    }
                    return e;
                }),
                new Derived("sum_of_arm_viscosities", "Pa·s", p -> {
                    double eta = 0;
                    for (int i = 1; i <= n; i++) {
                        eta += p[i] * p[n + i];
                    }
                    return eta;
                }));
    }
}
