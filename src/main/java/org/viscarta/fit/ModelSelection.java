package org.viscarta.fit;

import java.util.ArrayList;
import java.util.List;

/**
 * Information criteria and Akaike weights for least-squares fits with unknown error variance
 * (Burnham &amp; Anderson 2002, Model Selection and Multimodel Inference, 2nd ed., Springer; AICc
 * from Hurvich &amp; Tsai 1989, Biometrika 76:297–307; BIC from Schwarz 1978, Ann. Stat. 6:461–464).
 * K counts the p model parameters plus σ² (DOMAIN.md section 8 and section 11 item 8).
 */
public final class ModelSelection {

    /**
     * AICc differences below this are ties (two parameterisations of one model, such as zener and a
     * one-element generalized Maxwell, differ only by rounding); a tie goes to the model listed first.
     */
    private static final double TIE = 1e-9;

    private ModelSelection() {
    }

    /** AIC = n ln(RSS/n) + 2K. */
    public static double aic(int n, int p, double rss) {
        int k = p + 1;
        return n * Math.log(rss / n) + 2.0 * k;
    }

    /** AICc = AIC + 2K(K + 1)/(n − K − 1); +∞ when n ≤ K + 1. */
    public static double aicc(int n, int p, double rss) {
        int k = p + 1;
        if (n - k - 1 <= 0) {
            return Double.POSITIVE_INFINITY;
        }
        return aic(n, p, rss) + 2.0 * k * (k + 1) / (n - k - 1);
    }

    /** BIC = n ln(RSS/n) + K ln n. */
    public static double bic(int n, int p, double rss) {
        int k = p + 1;
        return n * Math.log(rss / n) + k * Math.log(n);
    }

    /** A fit with its Akaike weight and whether it is the best supported. */
    public record Ranked(FitResult fit, double deltaAicc, double weight, boolean best) {
    }

    /**
     * Akaike weights w_i = exp(−Δ_i/2)/Σ exp(−Δ_j/2) over the converged fits with finite AICc;
     * the others get weight NaN and are never best. The best is the first fit within {@link #TIE} of the
     * lowest AICc.
     */
    public static List<Ranked> rank(List<FitResult> fits) {
        double min = Double.POSITIVE_INFINITY;
        for (FitResult f : fits) {
            if (eligible(f)) {
                min = Math.min(min, f.aicc());
            }
        }
        double sum = 0;
        for (FitResult f : fits) {
            if (eligible(f)) {
                sum += Math.exp(-(f.aicc() - min) / 2);
            }
        }
        List<Ranked> out = new ArrayList<>();
        boolean bestTaken = false;
        for (FitResult f : fits) {
            if (eligible(f)) {
                double delta = f.aicc() - min;
                boolean best = !bestTaken && delta <= TIE;
                bestTaken |= best;
                out.add(new Ranked(f, delta, Math.exp(-delta / 2) / sum, best));
            } else {
                out.add(new Ranked(f, Double.NaN, Double.NaN, false));
            }
        }
        return out;
    }

    private static boolean eligible(FitResult f) {
        return f.converged() && Double.isFinite(f.aicc());
    }
}
