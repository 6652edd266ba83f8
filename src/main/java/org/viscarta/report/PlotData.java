package org.viscarta.report;

import java.util.List;

import org.viscarta.analysis.Sample;
import org.viscarta.compare.FittedCurve;

/**
 * The numbers behind a sample's fit figure, for surfaces that draw it themselves (the workbench):
 * the replicate means ± SD, the best model's curve with its 95 % band, and the residuals — computed
 * exactly as {@link Figures#fit} computes them, so the page and the figure agree.
 *
 * @param frequencyHz measured frequencies (geometric mean over replicates)
 * @param storage     mean M′ [Pa] (geometric), with {@code storageLow}/{@code storageHigh} at ± one SD
 * @param loss        mean M″ [Pa], with {@code lossLow}/{@code lossHigh}
 * @param model       the best-supported model's id, or null when none converged
 * @param curveHz     frequencies of the model curve
 * @param curveStorage the model's M′ with {@code curveStorageLow}/{@code curveStorageHigh}, its 95 % band
 * @param curveLoss   the model's M″ with its band
 * @param residualStorage ln(model/data) of M′ at each measured frequency (empty without a model)
 * @param residualLoss    ln(model/data) of M″
 */
public record PlotData(double[] frequencyHz, double[] storage, double[] storageLow, double[] storageHigh, double[] loss,
                       double[] lossLow, double[] lossHigh, String model, double[] curveHz, double[] curveStorage,
                       double[] curveStorageLow, double[] curveStorageHigh, double[] curveLoss, double[] curveLossLow,
                       double[] curveLossHigh, double[] residualStorage, double[] residualLoss) {

    private static final int CURVE_POINTS = Figures.CURVE_POINTS;
    /** Normal quantile of a two-sided 95 % band (the band is on log moduli, by the delta method). */
    private static final double Z95 = 1.959963984540054;

    /** The plot of a sample and (when one converged) its best model's curve. */
    public static PlotData of(Sample s, FittedCurve curve) {
        List<Figures.Aggregate> agg = Figures.aggregate(s);
        int n = agg.size();
        double[] f = new double[n];
        double[] st = new double[n];
        double[] stLo = new double[n];
        double[] stHi = new double[n];
        double[] lo = new double[n];
        double[] loLo = new double[n];
        double[] loHi = new double[n];
        for (int i = 0; i < n; i++) {
            Figures.Aggregate a = agg.get(i);
            f[i] = a.f();
            st[i] = a.storage();
            stLo[i] = a.storageLo();
            stHi[i] = a.storageHi();
            lo[i] = a.loss();
            loLo[i] = a.lossLo();
            loHi[i] = a.lossHi();
        }
        if (curve == null) {
            double[] none = new double[0];
            return new PlotData(f, st, stLo, stHi, lo, loLo, loHi, null, none, none, none, none, none, none, none, none, none);
        }
        double[] p = curve.params();
        double[] cf = new double[CURVE_POINTS];
        double[][] c = new double[6][CURVE_POINTS];
        for (int k = 0; k < CURVE_POINTS; k++) {
            cf[k] = s.minFrequencyHz() * Math.pow(s.maxFrequencyHz() / s.minFrequencyHz(), k / (double) (CURVE_POINTS - 1));
            double[] band = Figures.logBand(curve, p, cf[k]);
            c[0][k] = band[0];
            c[1][k] = band[0] * Math.exp(-Z95 * band[1]);
            c[2][k] = band[0] * Math.exp(Z95 * band[1]);
            c[3][k] = band[2];
            c[4][k] = band[2] * Math.exp(-Z95 * band[3]);
            c[5][k] = band[2] * Math.exp(Z95 * band[3]);
        }
        double[] rs = new double[n];
        double[] rl = new double[n];
        double[] out = new double[2];
        for (int i = 0; i < n; i++) {
            curve.model().modulus(2 * Math.PI * f[i], p, out);
            rs[i] = Math.log(out[0] / st[i]);
            rl[i] = Math.log(out[1] / lo[i]);
        }
        return new PlotData(f, st, stLo, stHi, lo, loLo, loHi, curve.model().id(), cf, c[0], c[1], c[2], c[3], c[4], c[5], rs, rl);
    }
}
