package org.viscarta.model;

/**
 * The map between a parameter's natural value θ and the unconstrained value u the optimiser
 * moves, which keeps θ in its domain.
 */
public enum Transform {
    /** θ = exp(u), for θ > 0. */
    LOG {
        @Override
        public double toInternal(double theta) {
            return Math.log(theta);
        }

        @Override
        public double toNatural(double u) {
            return Math.exp(u);
        }

        @Override
        public double derivative(double u) {
            return Math.exp(u);
        }
    },
    /** θ = 1/(1 + exp(−u)), for 0 < θ < 1 (exponents of fractional elements). */
    LOGIT {
        @Override
        public double toInternal(double theta) {
            return Math.log(theta / (1.0 - theta));
        }

        @Override
        public double toNatural(double u) {
            return 1.0 / (1.0 + Math.exp(-u));
        }

        @Override
        public double derivative(double u) {
            double t = toNatural(u);
            return t * (1.0 - t);
        }
    },
    /** θ = u, unconstrained. */
    IDENTITY {
        @Override
        public double toInternal(double theta) {
            return theta;
        }

        @Override
        public double toNatural(double u) {
            return u;
        }

        @Override
        public double derivative(double u) {
            return 1.0;
        }
    };

    public abstract double toInternal(double theta);

    public abstract double toNatural(double u);

    /** dθ/du at u. */
    public abstract double derivative(double u);
}
