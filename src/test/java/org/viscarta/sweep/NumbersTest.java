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
}
