package org.viscarta.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/** Measured values written for reading: three significant figures, plain where a person reads them plainly. */
@Tag("regression")
class NumbersTest {

    @Test
    void readableValuesHaveThreeSignificantFigures() {
        // the demo master curve's reduced frequency range, once written "0.000603751–286.987"
        assertEquals("0.000604", Numbers.readable(0.000603751));
        assertEquals("287", Numbers.readable(286.987));
        assertEquals("0.1", Numbers.readable(0.1));
        assertEquals("20", Numbers.readable(20.0));
        assertEquals("1.23e+06", Numbers.readable(1234567));
        assertEquals("-0.0123", Numbers.readable(-0.012345));
        assertEquals("0", Numbers.readable(0));
    }

    @Test
    void fixedDecimalsReadAsTheJdkFormatterWrites() {
        // the JDK's Formatter is the reference: %.Nf on the same doubles, including halves, negatives,
        // negative zero, huge and tiny values and the non-finite ones
        java.util.Random r = new java.util.Random(3);
        double[] edge = {0, -0.0, 0.05, 0.15, 0.25, 2.5, -2.5, 0.045, 1e-9, -1e-9, 123456789.125, 1e20, -0.04,
                Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.MIN_VALUE, 99.95, 9.995};
        assertAsFormatter('f', new int[] {0, 1, 2, 3}, edge, 20_000, k -> {
            double v = (r.nextBoolean() ? -1 : 1) * Math.pow(10, -4 + 10 * r.nextDouble());
            return k % 4 == 0 ? Math.round(v * 1000) / 1000.0 : v; // short decimals, where half-way cases live
        }, Numbers::fixed);
    }

    @Test
    void significantDigitsReadAsTheJdkFormatterWrites() {
        // %.4g (and %.3g, %.6g) of the JDK's Formatter as the reference, on the same doubles: every decade
        // from 1e-12 to 1e15 with both forms and the switch between them (1e-4, 10^N), values that round up
        // into the next decade (9999.5), halves, negatives, zeros and the non-finite ones
        java.util.Random r = new java.util.Random(11);
        double[] edge = {0, -0.0, 1, -1, 0.0001, 0.00009999, 0.000099995, 9999.5, 9999.4, 99995, 1e4, 1e-4, 123456789, 1e20, 1e-20,
                2.5, 0.125, 1.0005, 1.00049, 12.345, Double.MIN_VALUE, Double.MAX_VALUE, Double.NaN, Double.POSITIVE_INFINITY,
                Double.NEGATIVE_INFINITY};
        assertAsFormatter('g', new int[] {3, 4, 6}, edge, 30_000, k -> {
            double v = (r.nextBoolean() ? -1 : 1) * Math.pow(10, -12 + 27 * r.nextDouble());
            return k % 3 == 0 ? Math.round(v * 1e4) / 1e4 : v;
        }, Numbers::general);
    }

    /** ours(v, n) against String.format(Locale.ROOT, "%.n" + conversion, v) on the edge values and {@code count} drawn ones, for each n. */
    private static void assertAsFormatter(char conversion, int[] digits, double[] edge, int count,
                                          java.util.function.IntToDoubleFunction draw,
                                          java.util.function.BiFunction<Double, Integer, String> ours) {
        for (int n : digits) {
            String format = "%." + n + conversion;
            for (double v : edge) {
                assertEquals(String.format(java.util.Locale.ROOT, format, v), ours.apply(v, n), v + " as " + format);
            }
            for (int k = 0; k < count; k++) {
                double v = draw.applyAsDouble(k);
                assertEquals(String.format(java.util.Locale.ROOT, format, v), ours.apply(v, n), v + " as " + format);
            }
        }
    }
}
