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
 * <p>The liquid variant has no E_inf (a material without an equilibrium modulus: E′ ∝ ω² and
 * E″ ∝ ω at low frequency) and the parameters E_1 … E_N, tau_1 … tau_N. It is tried for each N
 * when the solid fit of that N cannot pin E_inf down (it runs to zero, and the covariance turns
 * singular), so that a liquid is fitted with as many elements as its data support rather than
 * falling back to one.
 *
 * <p>Sources: Ferry, J. D. (1980), Viscoelastic Properties of Polymers, 3rd ed., Wiley;
 * Tschoegl, N. W. (1989), The Phenomenological Theory of Linear Viscoelastic Behavior, Springer;
 * Park &amp; Schapery (1999), Int. J. Solids Struct. 36:1653. DOMAIN.md section 2.1.
 */
public final class GeneralizedMaxwell implements ViscoelasticModel {

    /** Largest number of elements tried when it is chosen by AICc. */
    public static final int MAX_ELEMENTS = 5;

    private final int elements;
    private final boolean liquid;
    /** Index of E_1 in the parameter array: 1 after E_inf, 0 for the liquid. */
    private final int off;
    private final List<ParameterSpec> parameters;

    /**
     * @param elements N in 1 … 5, or 0 for "choose N by AICc" (a family whose {@link #variants()}
     *                 are the fixed-N models)
     */
    public GeneralizedMaxwell(int elements) {
        this(elements, false);
    }

    /**
     * @param elements N in 1 … 5, or 0 for the auto-selecting family
     * @param liquid   without E_inf (no equilibrium modulus)
     */
    public GeneralizedMaxwell(int elements, boolean liquid) {
        if (elements < 0 || elements > MAX_ELEMENTS) {
            throw new IllegalArgumentException("generalized-maxwell takes 1 to " + MAX_ELEMENTS + " elements, got " + elements);
        }
        this.elements = elements;
        this.liquid = liquid && elements > 0;
        this.off = this.liquid ? 0 : 1;
        List<ParameterSpec> ps = new ArrayList<>();
        if (!this.liquid) {
            ps.add(ParameterSpec.positive("E_inf", "Pa"));
        }
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

    /** True for the variant without E_inf. */
    public boolean liquid() {
        return liquid;
    }

    /** For each N (all of 1 … 5 for the family, else the one given): the solid, then the liquid as its fallback. */
    @Override
    public List<ViscoelasticModel> variants() {
        if (liquid) {
            return List.of(this);
        }
        List<ViscoelasticModel> v = new ArrayList<>();
        for (int n = elements > 0 ? elements : 1; n <= (elements > 0 ? elements : MAX_ELEMENTS); n++) {
            v.add(new GeneralizedMaxwell(n));
            v.add(new GeneralizedMaxwell(n, true));
        }
        return v;
    }

    @Override
    public int variantStep() {
        return elements;
    }

    @Override
    public boolean fallback() {
        return liquid;
    }

    @Override
    public String describeVariant() {
        return (elements == 1 ? "1 element" : elements + " elements") + (liquid ? ", no equilibrium modulus (a liquid)" : "");
    }

    @Override
    public void modulus(double omega, double[] p, double[] out) {
        double s = liquid ? 0 : p[0];
        double l = 0;
        for (int i = 1; i <= elements; i++) {
            double x = omega * p[off + elements + i - 1];
            double d = 1 + x * x;
            s += p[off + i - 1] * x * x / d;
            l += p[off + i - 1] * x / d;
        }
        out[0] = s;
        out[1] = l;
    }

    @Override
    public void derivatives(double omega, double[] p, double[] dStorage, double[] dLoss) {
        modulusAndDerivatives(omega, p, new double[2], dStorage, dLoss); // one copy of the formulas
    }

    @Override
    public void modulusAndDerivatives(double omega, double[] p, double[] out, double[] dStorage, double[] dLoss) {
        double s = liquid ? 0 : p[0];
        double l = 0;
        if (!liquid) {
            dStorage[0] = 1;
            dLoss[0] = 0;
        }
        for (int i = 1; i <= elements; i++) {
            int e = off + i - 1;
            int t = off + elements + i - 1;
            double x = omega * p[t];
            double d = 1 + x * x;
            s += p[e] * x * x / d;
            l += p[e] * x / d;
            dStorage[e] = x * x / d;
            dLoss[e] = x / d;
            dStorage[t] = p[e] * 2 * x / (d * d) * omega;
            dLoss[t] = p[e] * (1 - x * x) / (d * d) * omega;
        }
        out[0] = s;
        out[1] = l;
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

    /**
     * τ_i spread evenly in log over the window (and over the window widened by a decade each side).
     * One element sits at the window's centre in both, so its second start puts it at the loss peak
     * instead: two different starts, so that two starts reaching the same minimum confirm it.
     */
    @Override
    public List<double[]> startValues(List<SweepPoint> points) {
        DataFeatures f = new DataFeatures(points);
        List<double[]> starts = new ArrayList<>();
        double spread = Math.max(f.storageMax - f.storageMin, 0.2 * f.storageMax);
        for (double widen : new double[] {1, 10}) {
            double tauLo = 1 / (f.omegaMax * widen);
            double tauHi = widen / f.omegaMin;
            double[] s = new double[off + 2 * elements];
            if (!liquid) {
                s[0] = 0.5 * f.storageMin;
            }
            for (int i = 1; i <= elements; i++) {
                s[off + i - 1] = (liquid ? f.storageMax : spread) / elements;
                double w = elements == 1 ? 0.5 : (i - 1) / (double) (elements - 1);
                s[off + elements + i - 1] = elements == 1 && widen > 1 ? 1 / f.omegaAtLossPeak : tauLo * Math.pow(tauHi / tauLo, w);
            }
            starts.add(s);
        }
        return starts;
    }

    @Override
    public Complex modulusAt(Complex s, double[] p) {
        Complex m = new Complex(liquid ? 0 : p[0], 0);
        for (int i = 1; i <= elements; i++) {
            Complex x = s.multiply(p[off + elements + i - 1]);
            m = m.add(x.multiply(p[off + i - 1]).divide(x.add(1)));
        }
        return m;
    }

    @Override
    public double relaxationModulus(double t, double[] p) {
        double m = liquid ? 0 : p[0];
        for (int i = 1; i <= elements; i++) {
            m += p[off + i - 1] * Math.exp(-t / p[off + elements + i - 1]);
        }
        return m;
    }

    @Override
    public List<Derived> derived() {
        int n = elements;
        int o = off;
        Derived unrelaxed = new Derived("unrelaxed_modulus", "Pa", p -> {
            double e = o == 1 ? p[0] : 0;
            for (int i = 0; i < n; i++) {
                e += p[o + i];
            }
            return e;
        });
        Derived viscosity = new Derived(liquid ? "zero_frequency_viscosity" : "sum_of_arm_viscosities", "Pa·s", p -> {
            double eta = 0;
            for (int i = 0; i < n; i++) {
                eta += p[o + i] * p[o + n + i];
            }
            return eta;
        });
        return liquid ? List.of(unrelaxed, viscosity) : List.of(new Derived("relaxed_modulus", "Pa", p -> p[0]), unrelaxed, viscosity);
    }
}
