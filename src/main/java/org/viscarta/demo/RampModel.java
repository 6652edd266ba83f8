package org.viscarta.demo;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.viscarta.sweep.Ramp;

/**
 * An invented material for temperature ramps: a Cole–Cole relaxation in modulus form,
 * M*(x) = M_r + (M_g − M_r) (ix)^α ∕ (1 + (ix)^α) with x = ωτ(T) (the fractional Zener of the
 * model catalogue), and an Arrhenius relaxation time τ(T) = τ_ref exp[(E_a∕R)(1∕T − 1∕T_ref)].
 * Its loss modulus depends on T only through x and is symmetric in ln x about x = 1, so the loss
 * peak at frequency f lies exactly where 2πf τ(T) = 1; the peaks move with frequency by E_a.
 *
 * @param glassyPa   M_g [Pa]
 * @param rubberyPa  M_r [Pa]
 * @param alpha      Cole–Cole exponent in (0, 1]; smaller is broader
 * @param lossPeakC  the loss-peak temperature at 1 Hz [°C] (fixes τ_ref with T_ref = this temperature)
 * @param eaJPerMol  E_a [J/mol]
 * @param background a loss tangent added throughout (M″ += background·M′, standing for the secondary
 *                   relaxations that keep real glassy and rubbery films lossy); with 0 the loss peak is
 *                   exactly at x = 1, with more it moves slightly
 */
public record RampModel(double glassyPa, double rubberyPa, double alpha, double lossPeakC, double eaJPerMol, double background) {

    /** A material without background loss: its loss peak lies exactly at x = 1. */
    public RampModel(double glassyPa, double rubberyPa, double alpha, double lossPeakC, double eaJPerMol) {
        this(glassyPa, rubberyPa, alpha, lossPeakC, eaJPerMol, 0);
    }

    private static final double R = 8.314462618;
    private static final double K = 273.15;

    /** x = ωτ(T) at frequency f [Hz] and temperature T [°C]. */
    public double x(double hz, double temperatureC) {
        double tauRef = 1 / (2 * Math.PI);
        return 2 * Math.PI * hz * tauRef * Math.exp(eaJPerMol / R * (1 / (temperatureC + K) - 1 / (lossPeakC + K)));
    }

    /** {M′, M″} [Pa]. */
    public double[] modulus(double hz, double temperatureC) {
        double x = x(hz, temperatureC);
        double xa = Math.pow(x, alpha);
        double c = Math.cos(alpha * Math.PI / 2);
        double s = Math.sin(alpha * Math.PI / 2);
        // (ix)^α = xa (c + i s); z = w/(1+w)
        double wr = xa * c;
        double wi = xa * s;
        double dr = 1 + wr;
        double den = dr * dr + wi * wi;
        double zr = (wr * dr + wi * wi) / den;
        double zi = (wi * dr - wr * wi) / den;
        double delta = glassyPa - rubberyPa;
        double storage = rubberyPa + delta * zr;
        return new double[] {storage, delta * zi + background * storage};
    }

    /** The loss-peak temperature at f [°C], exactly (x = 1) without background loss. */
    public double lossPeakC(double hz) {
        return 1 / (1 / (lossPeakC + K) - R * Math.log(hz) / eaJPerMol) - K;
    }

    /**
     * A ramp from {@code fromC} to {@code toC} in steps of {@code stepC} at {@code hz}, each modulus
     * multiplied by (1 + noise·N(0,1)).
     */
    public List<Ramp.Point> ramp(double hz, double fromC, double toC, double stepC, double noise, Random rng) {
        List<Ramp.Point> out = new ArrayList<>();
        int n = (int) Math.round((toC - fromC) / stepC);
        for (int i = 0; i <= n; i++) {
            double t = fromC + i * stepC;
            double[] m = modulus(hz, t);
            out.add(new Ramp.Point(t, m[0] * (1 + noise * rng.nextGaussian()), m[1] * (1 + noise * rng.nextGaussian()), 0));
        }
        return out;
    }
}
