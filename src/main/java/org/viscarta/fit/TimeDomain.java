package org.viscarta.fit;

import java.util.ArrayList;
import java.util.List;
import org.viscarta.model.ViscoelasticModel;

/** The relaxation modulus M(t) and creep compliance J(t) of a fitted model on a time grid. */
public final class TimeDomain {

    private TimeDomain() {
    }

    /**
     * One time of one fit.
     *
     * @param sample     sample name
     * @param model      model identifier
     * @param timeS      t [s]
     * @param relaxation M(t) [Pa]
     * @param creep      J(t) [1/Pa]
     */
    public record Point(String sample, String model, double timeS, double relaxation, double creep) {
    }

    /**
     * @return the points, or an empty list when the fit did not converge or the model has no time domain
     */
    public static List<Point> evaluate(FitResult fit, double[] times) {
        if (!fit.converged() || fit.fitted() == null) {
            return List.of();
        }
        double[] p = fit.values();
        ViscoelasticModel m = fit.fitted();
        if (!m.hasTimeDomain()) {
            return List.of();
        }
        List<Point> out = new ArrayList<>();
        for (double t : times) {
            out.add(new Point(fit.sample(), fit.model(), t, m.relaxationModulus(t, p), m.creepCompliance(t, p)));
        }
        return out;
    }
}
