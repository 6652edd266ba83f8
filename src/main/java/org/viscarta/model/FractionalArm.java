package org.viscarta.model;

/**
 * The shape shared by the fractional Maxwell and fractional Zener models:
 * (iωτ)^α/(1 + (iωτ)^α) = g1 + i g2 with X = (ωτ)^α, c = cos(απ/2), s = sin(απ/2),
 * D = 1 + 2Xc + X², g1 = (X² + Xc)/D, g2 = Xs/D (DOMAIN.md 2.2), and the partial derivatives of
 * g1 and g2 with respect to τ and α.
 */
final class FractionalArm {

    double g1;
    double g2;
    double dg1dTau;
    double dg1dAlpha;
    double dg2dTau;
    double dg2dAlpha;

    void evaluate(double omega, double tau, double alpha, boolean withDerivatives) {
        double lnx = Math.log(omega * tau);
        double x = Math.exp(alpha * lnx);
        double c = Math.cos(alpha * Math.PI / 2);
        double s = Math.sin(alpha * Math.PI / 2);
        double d = 1 + 2 * x * c + x * x;
        g1 = (x * x + x * c) / d;
        g2 = x * s / d;
        if (!withDerivatives) {
            return;
        }
        double d2 = d * d;
        double dg1dX = ((2 * x + c) * d - (x * x + x * c) * (2 * c + 2 * x)) / d2;
        double dg1dC = (x * d - (x * x + x * c) * 2 * x) / d2;
        double dg2dX = (s * d - x * s * (2 * c + 2 * x)) / d2;
        double dg2dS = x / d;
        double dg2dC = -x * s * 2 * x / d2;
        double dXdTau = alpha * x / tau;
        double dXdAlpha = x * lnx;
        double dCdAlpha = -Math.PI / 2 * s;
        double dSdAlpha = Math.PI / 2 * c;
        dg1dTau = dg1dX * dXdTau;
        dg1dAlpha = dg1dX * dXdAlpha + dg1dC * dCdAlpha;
        dg2dTau = dg2dX * dXdTau;
        dg2dAlpha = dg2dX * dXdAlpha + dg2dC * dCdAlpha + dg2dS * dSdAlpha;
    }
}
