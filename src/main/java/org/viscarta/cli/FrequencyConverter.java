package org.viscarta.cli;

import org.viscarta.sweep.Quantity;
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
        Unit.Valued v;
        try {
            v = Unit.parse(value, Quantity.Dimension.FREQUENCY, Quantity.Dimension.ANGULAR_FREQUENCY);
        } catch (IllegalArgumentException e) {
            throw new CommandLine.TypeConversionException(e.getMessage() + " (a frequency: e.g. 1, 1Hz, 0.5 Hz or 6.28rad/s)");
        }
        double hz = v.dimension() == Quantity.Dimension.ANGULAR_FREQUENCY ? v.si() / (2 * Math.PI) : v.si();
        if (!(hz > 0) || Double.isInfinite(hz)) {
            throw new CommandLine.TypeConversionException("frequency must be greater than zero, got '" + value + "'");
        }
        return hz;
    }
}
