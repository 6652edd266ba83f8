package org.viscarta.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * {@link TableStart#plainValue} against the JDK's own correctly rounded reader,
 * {@link Double#parseDouble} (its results compared bit for bit, the sign of zero included), and
 * against {@link TableStart#isPlainNumber} for which texts are numbers at all. The edge cases sit at
 * the limits of Clinger's fast path (PLDI '90): 2⁵³ for the digits, 10²² for the power of ten.
 */
@Tag("validation")
class PlainValueTest {

    private static void same(String text) {
        double expected = Double.parseDouble(text);
        double got = TableStart.plainValue(text);
        assertEquals(Double.doubleToRawLongBits(expected), Double.doubleToRawLongBits(got),
                () -> text + ": Double.parseDouble gives " + expected + ", plainValue " + got);
    }

    @Test
    void theLimitsOfTheFastPathGiveWhatTheJdkGives() {
        String[] cases = {"0", "-0", "+0", "0.0", "-0.0e5", "0e999999999", "1", "-1", ".5", "5.", "-.5e-3", "+7E+2",
            "9007199254740992", "9007199254740993", "9007199254740991", "-9007199254740993", "90071992547409.93e2",
            "1e22", "1e23", "1e-22", "1e-23", "9.999999999999999e22", "123456789012345678e-22", "123456789012345678e-23",
            "4.9e-324", "2.4703282292062327e-324", "2.4703282292062328e-324", "1.7976931348623157e308",
            "1.7976931348623159e308", "1e309", "1e-400", "1e999999999", "00000000000000000000001.5", "0.000000000000000000000000123",
            "1.0000000000000000000001", "123456789012345678901234567890", "0.30000000000000004", "0.1", "0.2", "0.3",
            "2.2250738585072011e-308", "2.2250738585072012e-308", "1E0", "3.14159265358979323846264338327950288"};
        for (String c : cases) {
            same(c);
        }
    }

    /** The reader skips the look-up of missing-value marks for cells that start with a digit or a point. */
    @Test
    void noMissingValueMarkStartsWithADigitOrAPoint() {
        for (String mark : TableStart.NOT_A_NUMBER) {
            assertTrue(mark.isEmpty() || !(Character.isDigit(mark.charAt(0)) || mark.charAt(0) == '.'), mark);
        }
    }

    /** Random numbers of every shape the reader meets and many it rarely does: up to 20 digits, exponents to ±350. */
    @Test
    void randomNumbersGiveWhatTheJdkGivesBitForBit() {
        SplittableRandom rng = new SplittableRandom(20261203);
        StringBuilder sb = new StringBuilder();
        for (int k = 0; k < 300_000; k++) {
            sb.setLength(0);
            int sign = rng.nextInt(3);
            if (sign == 1) {
                sb.append('-');
            } else if (sign == 2) {
                sb.append('+');
            }
            int whole = rng.nextInt(rng.nextBoolean() ? 4 : 21);
            for (int i = 0; i < whole; i++) {
                sb.append((char) ('0' + rng.nextInt(10)));
            }
            int fraction = 0;
            if (whole == 0 || rng.nextBoolean()) {
                sb.append('.');
                fraction = rng.nextInt(whole == 0 ? 1 : 0, 21);
                for (int i = 0; i < fraction; i++) {
                    sb.append((char) ('0' + rng.nextInt(10)));
                }
            }
            if (rng.nextInt(3) == 0) {
                sb.append(rng.nextBoolean() ? 'e' : 'E');
                int e = rng.nextInt(4) == 0 ? rng.nextInt(-350, 351) : rng.nextInt(-30, 31);
                if (e >= 0 && rng.nextBoolean()) {
                    sb.append('+');
                }
                sb.append(e);
            }
            same(sb.toString());
        }
    }

    @Test
    void textsThatAreNotPlainNumbersAreNaN() {
        String[] cases = {"", "+", "-", ".", "+.", "e5", ".e5", "1e", "1e+", "1e-", "NaN", "Infinity", "-Infinity", "0x1p3", "1d", "1f",
            "1,5", " 1", "1 ", "1..2", "1.2.3", "1e5.5", "--1", "+-1", "١٢", "1e5e5", "12a", "∞"};
        for (String c : cases) {
            assertTrue(Double.isNaN(TableStart.plainValue(c)), () -> "'" + c + "' taken as a number");
            assertEquals(false, TableStart.isPlainNumber(c), c);
        }
        // and whatever isPlainNumber accepts has a value: mutations of numbers
        SplittableRandom rng = new SplittableRandom(7);
        String alphabet = "0123456789.+-eE, x";
        for (int k = 0; k < 100_000; k++) {
            int len = rng.nextInt(1, 9);
            StringBuilder sb = new StringBuilder();
            for (int i = 0; i < len; i++) {
                sb.append(alphabet.charAt(rng.nextInt(alphabet.length())));
            }
            String t = sb.toString();
            double v = TableStart.plainValue(t);
            assertEquals(TableStart.isPlainNumber(t), !Double.isNaN(v), () -> "'" + t + "': plainValue " + v);
            if (!Double.isNaN(v)) {
                same(t);
            }
        }
    }
}
