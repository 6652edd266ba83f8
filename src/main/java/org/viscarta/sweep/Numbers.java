package org.viscarta.sweep;

import java.math.BigDecimal;
import java.math.MathContext;

/** Numbers written into messages and labels. */
public final class Numbers {

    private Numbers() {
    }

    /** Six significant digits without trailing zeros, e.g. 1, 0.5, 23.5; "?" for NaN. */
    public static String plain(double v) {
        if (Double.isNaN(v)) {
            return "?";
        }
        if (Double.isInfinite(v)) {
            return v > 0 ? "inf" : "-inf";
        }
        return BigDecimal.valueOf(v).round(new MathContext(6)).stripTrailingZeros().toPlainString();
    }
}
