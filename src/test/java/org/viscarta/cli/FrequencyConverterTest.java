package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;
import picocli.CommandLine;

/** {@code --at}: a number with or without unit, into Hz (ω = 2πf, SI definition of the hertz). */
@Tag("validation")
class FrequencyConverterTest {

    @ParameterizedTest(name = "''{0}'' = {1} Hz")
    @CsvSource({"1,1", "1Hz,1", "0.5 Hz,0.5", "2kHz,2000", "6.283185307179586rad/s,1", "6.28rad/s,0.9994930426171028",
        "1e-2 hz,0.01"})
    void parsesFrequencies(String text, double hz) {
        assertEquals(hz, new FrequencyConverter().convert(text), 1e-12 * hz);
    }

    /** Every spelling a column header accepts for a frequency is accepted here too (one unit parser). */
    @ParameterizedTest(name = "''{0}'' = {1} Hz")
    @CsvSource({"6.283185307179586 rad/sec,1", "6.283185307179586 rad s-1,1", "1 s-1,1", "0.001 KHZ,1"})
    void acceptsTheSpellingsHeadersAccept(String text, double hz) {
        assertEquals(hz, new FrequencyConverter().convert(text), 1e-12 * hz);
    }

    @ParameterizedTest
    @ValueSource(strings = {"", "Hz", "0", "-1Hz", "1 furlong", "1,5", "NaN"})
    void rejectsWhatIsNotAPositiveFrequency(String text) {
        assertThrows(CommandLine.TypeConversionException.class, () -> new FrequencyConverter().convert(text));
    }
}
