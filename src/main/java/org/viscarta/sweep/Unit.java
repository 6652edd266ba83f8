package org.viscarta.sweep;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * Units recognised in column headers, each with the factor that converts a value to SI
 * (Hz, rad/s, Pa, rad, m; temperatures stay in °C). Conversion is {@code si = value * factor}.
 */
public enum Unit {
    HZ(Quantity.Dimension.FREQUENCY, 1.0, "Hz", "hz", "1/s", "s^-1", "s-1"),
    KHZ(Quantity.Dimension.FREQUENCY, 1.0e3, "kHz", "khz"),
    RAD_PER_S(Quantity.Dimension.ANGULAR_FREQUENCY, 1.0, "rad/s", "rad s-1", "rad·s⁻¹", "rad/sec"),
    PA(Quantity.Dimension.STRESS, 1.0, "Pa", "pa", "N/m²", "N/m2", "N m-2"),
    KPA(Quantity.Dimension.STRESS, 1.0e3, "kPa", "kpa"),
    MPA(Quantity.Dimension.STRESS, 1.0e6, "MPa", "mpa", "N/mm²", "N/mm2"),
    GPA(Quantity.Dimension.STRESS, 1.0e9, "GPa", "gpa"),
    DIMENSIONLESS(Quantity.Dimension.NONE, 1.0, "-", "", "1", "–"),
    PERCENT(Quantity.Dimension.NONE, 0.01, "%"),
    DEGREE(Quantity.Dimension.ANGLE, Math.PI / 180.0, "°", "deg", "degree", "degrees"),
    RADIAN(Quantity.Dimension.ANGLE, 1.0, "rad", "radian", "radians"),
    CELSIUS(Quantity.Dimension.TEMPERATURE, 1.0, "°C", "degC", "C", "deg C", "celsius"),
    PER_PA(Quantity.Dimension.COMPLIANCE, 1.0, "1/Pa", "Pa^-1", "Pa-1", "Pa⁻¹"),
    PER_KPA(Quantity.Dimension.COMPLIANCE, 1.0e-3, "1/kPa", "kPa^-1", "kPa-1", "kPa⁻¹"),
    PER_MPA(Quantity.Dimension.COMPLIANCE, 1.0e-6, "1/MPa", "MPa^-1", "MPa-1", "MPa⁻¹"),
    PER_GPA(Quantity.Dimension.COMPLIANCE, 1.0e-9, "1/GPa", "GPa^-1", "GPa-1", "GPa⁻¹"),
    PA_S(Quantity.Dimension.VISCOSITY, 1.0, "Pa·s", "Pa.s", "Pa s", "Pas", "Pa*s"),
    MPA_S(Quantity.Dimension.VISCOSITY, 1.0e-3, "mPa·s", "mPa.s", "mPa s", "mPas", "cP"),
    KPA_S(Quantity.Dimension.VISCOSITY, 1.0e3, "kPa·s", "kPa.s", "kPa s"),
    METRE(Quantity.Dimension.LENGTH, 1.0, "m"),
    MILLIMETRE(Quantity.Dimension.LENGTH, 1.0e-3, "mm"),
    MICROMETRE(Quantity.Dimension.LENGTH, 1.0e-6, "µm", "μm", "um", "micron"),
    NANOMETRE(Quantity.Dimension.LENGTH, 1.0e-9, "nm"),
    NEWTON(Quantity.Dimension.FORCE, 1.0, "N"),
    MILLINEWTON(Quantity.Dimension.FORCE, 1.0e-3, "mN"),
    MICRONEWTON(Quantity.Dimension.FORCE, 1.0e-6, "µN", "μN", "uN"),
    SECOND(Quantity.Dimension.TIME, 1.0, "s", "sec", "seconds"),
    MILLISECOND(Quantity.Dimension.TIME, 1.0e-3, "ms"),
    MINUTE(Quantity.Dimension.TIME, 60.0, "min"),
    HOUR(Quantity.Dimension.TIME, 3600.0, "h");

    private final Quantity.Dimension dimension;
    private final double toSi;
    private final List<String> spellings;

    Unit(Quantity.Dimension dimension, double toSi, String... spellings) {
        this.dimension = dimension;
        this.toSi = toSi;
        this.spellings = List.of(spellings);
    }

    public Quantity.Dimension dimension() {
        return dimension;
    }

    /** Multiply a value in this unit by this factor to get SI. */
    public double toSi() {
        return toSi;
    }

    /** The way Viscarta writes this unit. */
    public String symbol() {
        return spellings.get(0);
    }

    /** Finds a unit of the given dimension spelled as {@code text} (case matters only for Pa prefixes). */
    public static Optional<Unit> find(String text, Quantity.Dimension dimension) {
        String t = text.strip();
        for (Unit u : values()) {
            if (u.dimension == dimension && u.spellings.contains(t)) {
                return Optional.of(u);
            }
        }
        for (Unit u : values()) {
            if (u.dimension != dimension) {
                continue;
            }
            for (String s : u.spellings) {
                // a lower-case match is accepted only when it cannot confuse mPa with MPa
                if (!s.isEmpty() && s.equalsIgnoreCase(t) && !t.equals("mPa") && !t.startsWith("mPa")) {
                    return Optional.of(u);
                }
            }
        }
        return Optional.empty();
    }

    /** A unit of any dimension spelled as {@code text}, brackets or parentheses around it allowed (a units row's cell). */
    public static Optional<Unit> anyDimension(String text) {
        String t = text.strip();
        if (t.length() >= 2 && (t.charAt(0) == '[' || t.charAt(0) == '(')) {
            t = t.substring(1, t.length() - 1).strip();
        }
        if (t.isEmpty()) {
            return Optional.empty();
        }
        for (Quantity.Dimension d : Quantity.Dimension.values()) {
            Optional<Unit> u = find(t, d);
            if (u.isPresent()) {
                return u;
            }
        }
        return Optional.empty();
    }

    /**
     * A frequency with or without unit — {@code 1}, {@code 1Hz}, {@code 0.5 Hz}, {@code 2 kHz},
     * {@code 6.28rad/s} — in Hz (a bare number is in Hz), as options and settings give it.
     *
     * @throws IllegalArgumentException saying what a frequency looks like, or that it must be positive
     */
    public static double frequencyHz(String value) {
        Valued v;
        try {
            v = parse(value, Quantity.Dimension.FREQUENCY, Quantity.Dimension.ANGULAR_FREQUENCY);
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException(e.getMessage() + " (a frequency: e.g. 1, 1Hz, 0.5 Hz or 6.28rad/s)");
        }
        double hz = v.dimension() == Quantity.Dimension.ANGULAR_FREQUENCY ? v.si() / (2 * Math.PI) : v.si();
        if (!(hz > 0) || Double.isInfinite(hz)) {
            throw new IllegalArgumentException("frequency must be greater than zero, got '" + value + "'");
        }
        return hz;
    }

    /**
     * A value with its unit, such as {@code 0.5 Hz}, {@code 2kHz} or {@code 6.28 rad/sec}, in SI units of
     * its dimension — the one parser behind column headers and option values. The unit must be of
     * one of the given dimensions (an empty unit is the first dimension's SI unit).
     *
     * @return the SI value and the unit's dimension
     * @throws IllegalArgumentException naming what is not understood and the units accepted
     */
    public static Valued parse(String text, Quantity.Dimension... dimensions) {
        java.util.regex.Matcher m = VALUE_WITH_UNIT.matcher(text);
        if (!m.matches()) {
            throw new IllegalArgumentException("'" + text + "' is not a number with a unit");
        }
        double v = Double.parseDouble(m.group(1));
        String unit = m.group(2) == null ? "" : m.group(2).strip();
        if (unit.isEmpty()) {
            return new Valued(v, dimensions[0]);
        }
        List<String> accepted = new ArrayList<>();
        for (Quantity.Dimension d : dimensions) {
            Optional<Unit> u = find(unit, d);
            if (u.isPresent()) {
                return new Valued(v * u.get().toSi(), d);
            }
            accepted.addAll(symbolsOf(d));
        }
        throw new IllegalArgumentException("unknown unit '" + unit + "' in '" + text + "'; use " + String.join(", ", accepted));
    }

    /**
     * A value in SI units.
     *
     * @param si        the value in the SI unit of its dimension
     * @param dimension its dimension
     */
    public record Valued(double si, Quantity.Dimension dimension) {
    }

    private static final java.util.regex.Pattern VALUE_WITH_UNIT =
            java.util.regex.Pattern.compile("^\\s*([+-]?(?:\\d+\\.?\\d*|\\.\\d+)(?:[eE][+-]?\\d+)?)\\s*(\\S.*?)?\\s*$");

    /** The spellings accepted for a dimension, for error messages. */
    public static List<String> symbolsOf(Quantity.Dimension dimension) {
        List<String> out = new ArrayList<>();
        for (Unit u : values()) {
            if (u.dimension == dimension) {
                out.add(u.symbol());
            }
        }
        return out;
    }

    @Override
    public String toString() {
        return symbol().toLowerCase(Locale.ROOT).isEmpty() ? "-" : symbol();
    }
}
