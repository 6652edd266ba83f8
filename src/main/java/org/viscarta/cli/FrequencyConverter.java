package org.viscarta.cli;

import org.viscarta.sweep.Unit;
import picocli.CommandLine;

/**
 * Parses a frequency with or without unit — {@code 1}, {@code 1Hz}, {@code 0.5 Hz}, {@code 2 kHz},
 * {@code 6.28rad/s} — into Hz, with the same units as column headers accept ({@link Unit#parse}).
 * A bare number is in Hz.
 */
final class FrequencyConverter implements CommandLine.ITypeConverter<Double> {

    @Override
    public Double convert(String value) {
        try {
            return Unit.frequencyHz(value);
        } catch (IllegalArgumentException e) {
            throw new CommandLine.TypeConversionException(e.getMessage());
        }
    }
}
