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

    /**
     * A measured value for reading: three significant figures, plain ("0.000604", "287", "0.1"),
     * powers of ten only beyond a million or below 1e-6.
     */
    public static String readable(double v) {
        if (!Double.isFinite(v)) {
            return plain(v);
        }
        double a = Math.abs(v);
        if (a != 0 && (a < 1e-6 || a >= 1e6)) {
            return String.format(java.util.Locale.ROOT, "%.2e", v);
        }
        return BigDecimal.valueOf(v).round(new MathContext(3)).stripTrailingZeros().toPlainString();
    }

    /**
     * v with a fixed number of decimals, the same text as {@code String.format(Locale.ROOT, "%.Nf", v)}
     * (the shortest decimal that reads back as v, rounded half up) at a fraction of its cost: the
     * quality checks compose several such messages for every sweep.
     */
    public static String fixed(double v, int decimals) {
        if (!Double.isFinite(v)) {
            return Double.isNaN(v) ? "NaN" : v > 0 ? "Infinity" : "-Infinity";
        }
        String s = BigDecimal.valueOf(v).setScale(decimals, java.math.RoundingMode.HALF_UP).toPlainString();
        return v < 0 || (v == 0 && 1 / v < 0) ? (s.startsWith("-") ? s : "-" + s) : s;
    }

    /**
     * v to {@code significant} significant digits, the same text as
     * {@code String.format(Locale.ROOT, "%.Ng", v)} (the shortest decimal that reads back as v,
     * rounded half up; plain from 1e-4 up to 10^N, else "1.235e+05"), at a fraction of its cost:
     * every number of the terminal's, the page's and the workbench's tables passes through here.
     */
    public static String general(double v, int significant) {
        if (!Double.isFinite(v)) {
            return Double.isNaN(v) ? "NaN" : v > 0 ? "Infinity" : "-Infinity";
        }
        boolean negative = v < 0 || (v == 0 && 1 / v < 0);
        StringBuilder out = new StringBuilder(16);
        if (negative) {
            out.append('-');
        }
        if (v == 0) {
            out.append('0');
            if (significant > 1) {
                out.append('.').append("0".repeat(significant - 1));
            }
            return out.toString();
        }
        BigDecimal r = BigDecimal.valueOf(Math.abs(v)).round(new MathContext(significant, java.math.RoundingMode.HALF_UP));
        int exponent = r.precision() - r.scale() - 1;
        if (exponent >= -4 && exponent < significant) {
            return out.append(r.setScale(significant - 1 - exponent, java.math.RoundingMode.UNNECESSARY).toPlainString()).toString();
        }
        StringBuilder digits = new StringBuilder(r.unscaledValue().toString());
        while (digits.length() < significant) {
            digits.append('0');
        }
        out.append(digits.charAt(0));
        if (significant > 1) {
            out.append('.').append(digits, 1, significant);
        }
        int e = Math.abs(exponent);
        return out.append(exponent < 0 ? "e-" : "e+").append(e < 10 ? "0" : "").append(e).toString();
    }

    /** A stress in the unit people read it in: Pa, kPa, MPa or GPa, three significant figures ("24.9 kPa"). */
    public static String pascals(double pa) {
        double a = Math.abs(pa);
        if (!Double.isFinite(pa)) {
            return "–";
        }
        if (a >= 1e9) {
            return String.format(java.util.Locale.ROOT, "%.3g GPa", pa / 1e9);
        }
        if (a >= 1e6) {
            return String.format(java.util.Locale.ROOT, "%.3g MPa", pa / 1e6);
        }
        if (a >= 1e3) {
            return String.format(java.util.Locale.ROOT, "%.3g kPa", pa / 1e3);
        }
        return String.format(java.util.Locale.ROOT, "%.3g Pa", pa);
    }

    /**
     * The q-quantile (0 ≤ q ≤ 1) of sorted values, linear between order statistics: Hyndman &amp;
     * Fan (1996), Am. Stat. 50:361, definition 7, numpy's default.
     */
    public static double quantile(double[] sorted, double q) {
        double h = (sorted.length - 1) * q;
        int lo = (int) Math.floor(h);
        int hi = Math.min(sorted.length - 1, lo + 1);
        return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
    }
}
