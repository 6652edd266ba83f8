package org.viscarta.compare;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.viscarta.fit.FitResult;
import org.viscarta.fit.ModelFitter;
import org.viscarta.fit.ModelSelection;
import org.viscarta.model.ViscoelasticModel;
import org.viscarta.sweep.ModulusKind;
import org.viscarta.sweep.SweepPoint;

/**
 * A material's best-supported fitted curve, usable inside its measured range only, with the
 * parameters' covariance for propagating uncertainty.
 *
 * @param name         sample or reference name
 * @param model        the best-supported model
 * @param params       its parameters (natural, SI)
 * @param covariance   their covariance (natural), null when the fit's covariance is singular
 * @param lowHz        lowest measured frequency
 * @param highHz       highest measured frequency
 * @param temperatureC test temperature, NaN when unknown
 * @param kind         modulus basis
 */
public record FittedCurve(String name, ViscoelasticModel model, double[] params, double[][] covariance, double lowHz,
                          double highHz, double temperatureC, ModulusKind kind) {

    public FittedCurve {
        params = params.clone();
    }

    @Override
    public double[] params() {
        return params.clone();
    }

    /** M′ and M″ at f [Hz] with the given parameters. */
    double[] modulus(double[] p, double fHz) {
        double[] out = new double[2];
        model.modulus(2 * Math.PI * fHz, p, out);
        return out;
    }

    /**
     * The curve of a fit result (its best-supported model), or empty when it did not converge.
     */
    public static Optional<FittedCurve> of(FitResult best, double lowHz, double highHz, double temperatureC, ModulusKind kind) {
        if (!best.converged() || best.fitted() == null) {
            return Optional.empty();
        }
        return Optional.of(new FittedCurve(best.sample(), best.fitted(), best.values(), best.covariance(), lowHz, highHz,
                temperatureC, kind));
    }

    /** Fits every candidate model to the points and returns the curve of the best-supported one. */
    public static Optional<FittedCurve> fit(String name, List<SweepPoint> points, List<ViscoelasticModel> models, ModelFitter fitter,
                                            double temperatureC, ModulusKind kind) {
        if (points.isEmpty()) {
            return Optional.empty();
        }
        List<FitResult> fits = new ArrayList<>();
        for (ViscoelasticModel m : models) {
            fits.add(fitter.fit(name, m, points));
        }
        double lo = points.stream().mapToDouble(SweepPoint::frequencyHz).min().orElseThrow();
        double hi = points.stream().mapToDouble(SweepPoint::frequencyHz).max().orElseThrow();
        return ModelSelection.rank(fits).stream().filter(ModelSelection.Ranked::best).findFirst()
                .flatMap(r -> of(r.fit(), lo, hi, temperatureC, kind));
    }
}
