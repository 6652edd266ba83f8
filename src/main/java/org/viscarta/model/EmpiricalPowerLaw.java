package org.viscarta.model;

import java.util.List;
import org.apache.commons.math3.complex.Complex;
import org.viscarta.sweep.SweepPoint;

/**
 * Empirical power law, fitted separately to each modulus:
 *
 * \[ M'(f) = A\,(f/1\,\mathrm{Hz})^{a},\qquad M''(f) = B\,(f/1\,\mathrm{Hz})^{b} \]
 *
 * <ul>
 *   <li>A [Pa], B [Pa] &gt; 0: the moduli at 1 Hz;</li>
 *   <li>a [–], b [–]: the log–log slopes (unconstrained).</li>
 * </ul>
 * Descriptive only: with a ≠ b the pair is not Kramers–Kronig consistent, so it has no time domain
 * (DOMAIN.md, model table; common practice for summarising sweeps [P]).
 */
public final class EmpiricalPowerLaw implements ViscoelasticModel {

    private static final List<ParameterSpec> PARAMETERS = List.of(
            ParameterSpec.positive("A", "Pa"),
            new ParameterSpec("a", "-", Transform.IDENTITY, false),
            ParameterSpec.positive("B", "Pa"),
            new ParameterSpec("b", "-", Transform.IDENTITY, false));

    @Override
    public String id() {
        return "empirical-power-law";
    }

    @Override
    public List<ParameterSpec> parameters() {
        return PARAMETERS;
    }

    @Override
    public void modulus(double omega, double[] p, double[] out) {
        double f = omega / (2 * Math.PI);
        out[0] = p[0] * Math.pow(f, p[1]);
        out[1] = p[2] * Math.pow(f, p[3]);
    }

    @Override
    public void derivatives(double omega, double[] p, double[] dStorage, double[] dLoss) {
        double f = omega / (2 * Math.PI);
        double lnf = Math.log(f);
        double fa = Math.pow(f, p[1]);
        double fb = Math.pow(f, p[3]);
        dStorage[0] = fa;
        dStorage[1] = p[0] * fa * lnf;
        dStorage[2] = 0;
        dStorage[3] = 0;
        dLoss[0] = 0;
        dLoss[1] = 0;
        dLoss[2] = fb;
        dLoss[3] = p[2] * fb * lnf;
    }

    /** Start values from straight-line fits of ln M′ and ln M″ against ln f. */
    @Override
    public List<double[]> startValues(List<SweepPoint> points) {
        double[] s = lineFit(points, true);
        double[] l = lineFit(points, false);
        return List.of(new double[] {Math.exp(s[0]), s[1], Math.exp(l[0]), l[1]});
    }

    private static double[] lineFit(List<SweepPoint> points, boolean storage) {
        int n = points.size();
        double sx = 0;
        double sy = 0;
        double sxx = 0;
        double sxy = 0;
        for (SweepPoint p : points) {
            double x = Math.log(p.frequencyHz());
            double y = Math.log(storage ? p.storage() : p.loss());
            sx += x;
            sy += y;
            sxx += x * x;
            sxy += x * y;
        }
        double den = n * sxx - sx * sx;
        double slope = den == 0 ? 0 : (n * sxy - sx * sy) / den;
        return new double[] {(sy - slope * sx) / n, slope};
    }

    @Override
    public Complex modulusAt(Complex s, double[] p) {
        return null;
    }

    @Override
    public boolean hasTimeDomain() {
        return false;
    }

    @Override
    public double relaxationModulus(double t, double[] p) {
        return Double.NaN;
    }

    @Override
    public double creepCompliance(double t, double[] p) {
        return Double.NaN;
    }
}
