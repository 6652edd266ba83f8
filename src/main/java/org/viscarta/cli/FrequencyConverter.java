package org.viscarta.cli;

import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import picocli.CommandLine;

/**
 * Parses a frequency with or without unit — {@code 1}, {@code 1Hz}, {@code 0.5 Hz}, {@code 2 kHz},
 * {@code 6.28rad/s} — into Hz. A bare number is in Hz.
 */
final class FrequencyConverter implements CommandLine.ITypeConverter<Double> {

    private static final Pattern FORM = Pattern.compile("^\\s*([+-]?(?:\\d+\\.?\\d*|\\.\\d+)(?:[eE][+-]?\\d+)?)\\s*([A-Za-z/]*)\\s*$");

    @Override
    public Double convert(String value) {
        Matcher m = FORM.matcher(value);
        if (!m.matches()) {
            throw new CommandLine.TypeConversionException("'" + value + "' is not a frequency; write e.g. 1, 1Hz, 0.5 Hz or 6.28rad/s");
        }
        double v = Double.parseDouble(m.group(1));
        String unit = m.group(2).toLowerCase(Locale.ROOT);
        double hz;
        switch (unit) {
            case "": case "hz":
                hz = v;
                break;
            case "khz":
                hz = v * 1e3;
                break;
            case "rad/s":
                hz = v / (2 * Math.PI);
                break;
            default:
                throw new CommandLine.TypeConversionException("unknown frequency unit '" + m.group(2) + "' in '" + value
                        + "'; use Hz, kHz or rad/s");
        }
        if (!(hz > 0) || Double.isInfinite(hz)) {
            throw new CommandLine.TypeConversionException("frequency must be greater than zero, got '" + value + "'");
        }
        return hz;
    }
}
