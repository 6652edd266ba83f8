package org.viscarta.fit;

/**
 * One fitted parameter in SI units.
 *
 * @param name       parameter name (DOMAIN.md)
 * @param unit       SI unit
 * @param value      estimate
 * @param stdError   standard error (delta method through the fitting transform); NaN when not determined
 * @param ci95Low    lower end of the 95 % interval (Student t on n − p degrees of freedom, built in the
 *                   fitting parameterisation and transformed back, so it stays in the parameter's domain)
 * @param ci95High   upper end of that interval
 * @param note       "" or why the data do not determine the parameter
 */
public record ParameterEstimate(String name, String unit, double value, double stdError, double ci95Low,
                                double ci95High, String note) {

    /** True when the 95 % interval contains {@code v}. */
    public boolean intervalContains(double v) {
        return v >= ci95Low && v <= ci95High;
    }

    /** True when the fit flagged this parameter. */
    public boolean undetermined() {
        return !note.isEmpty();
    }
}
