package org.viscarta.fit;

/** Residuals r(θ) and their Jacobian ∂r_i/∂θ_j of a least-squares problem. */
@FunctionalInterface
public interface ResidualFunction {

    /**
     * @param params    parameter values (length p)
     * @param residuals receives r_i (length n)
     * @param jacobian  receives ∂r_i/∂θ_j (n × p)
     */
    void evaluate(double[] params, double[] residuals, double[][] jacobian);
}
