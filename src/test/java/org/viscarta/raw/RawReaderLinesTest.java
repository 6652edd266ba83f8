package org.viscarta.raw;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Arrays;
import java.util.Random;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/** The raw reader's line scan gives the lines the regular expression it replaced gave, on any mix of CR and LF. */
@Tag("self-check")
class RawReaderLinesTest {

    @Test
    void sameLinesAsSplittingOnOptionalCrThenLf() {
        Random r = new Random(6);
        String[] fixed = {"", "\n", "\r", "\r\n", "a", "a\n", "a\r\n", "\r\nabc", "a\n\r\n", "a\r\r\nb", "a\rb\nc", "\n\n", "x\r"};
        for (String t : fixed) {
            assertEquals(Arrays.asList(t.split("\r?\n", -1)), RawReader.lines(t), "'" + t.replace("\r", "CR").replace("\n", "LF") + "'");
        }
        char[] alphabet = {'a', '1', ',', '\r', '\n'};
        for (int k = 0; k < 20_000; k++) {
            char[] c = new char[r.nextInt(30)];
            for (int i = 0; i < c.length; i++) {
                c[i] = alphabet[r.nextInt(alphabet.length)];
            }
            String t = new String(c);
            assertEquals(Arrays.asList(t.split("\r?\n", -1)), RawReader.lines(t), t.replace("\r", "CR").replace("\n", "LF"));
        }
    }
}
