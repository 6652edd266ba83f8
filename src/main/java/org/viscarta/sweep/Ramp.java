package org.viscarta.sweep;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * One temperature ramp of one replicate of one sample at one fixed frequency, in SI units (moduli
 * in Pa), sorted by temperature.
 *
 * @param sample      sample name (replicates of one sample share it)
 * @param replicate   replicate label, "1" when the input has none
 * @param group       group label, "" when none
 * @param kind        whether the moduli are tensile (E) or shear (G)
 * @param frequencyHz the fixed oscillation frequency [Hz]
 * @param source      the file the ramp was read from
 * @param metadata    the file's {@code # key: value} lines, keys in lower case
 * @param points      the measured points, sorted by temperature
 * @param unsorted    how many points came after a higher temperature in the file (sorted here)
 */
public record Ramp(String sample, String replicate, String group, ModulusKind kind, double frequencyHz, Path source,
                   Map<String, String> metadata, List<Point> points, int unsorted) {

    /**
     * One measured temperature of a ramp.
     *
     * @param temperatureC the temperature [°C]
     * @param storage      storage modulus M′ [Pa], positive
     * @param loss         loss modulus M″ [Pa]
     * @param line         the input line it came from (0 when made in memory)
     */
    public record Point(double temperatureC, double storage, double loss, int line) {
        public Point {
            if (!Double.isFinite(temperatureC)) {
                throw new IllegalArgumentException("a ramp point needs a finite temperature, got " + temperatureC);
            }
            if (!(storage > 0) || Double.isInfinite(storage)) {
                throw new IllegalArgumentException("storage modulus must be finite and > 0 Pa, got " + storage);
            }
            if (!Double.isFinite(loss)) {
                throw new IllegalArgumentException("loss modulus must be finite, got " + loss);
            }
        }

        /** tan δ = M″/M′. */
        public double lossTangent() {
            return loss / storage;
        }
    }

    public Ramp {
        Objects.requireNonNull(sample, "sample");
        Objects.requireNonNull(replicate, "replicate");
        Objects.requireNonNull(group, "group");
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(source, "source");
        if (!(frequencyHz > 0) || Double.isInfinite(frequencyHz)) {
            throw new IllegalArgumentException("a ramp's frequency must be finite and > 0 Hz, got " + frequencyHz);
        }
        if (points.isEmpty()) {
            throw new IllegalArgumentException("a ramp needs at least one point");
        }
        metadata = org.viscarta.sweep.Metadata.inFileOrder(metadata);
        List<Point> sorted = new ArrayList<>(points);
        sorted.sort(Comparator.comparingDouble(Point::temperatureC));
        points = List.copyOf(sorted);
    }

    /** The same ramp with another group label. */
    public Ramp withGroup(String newGroup) {
        return new Ramp(sample, replicate, newGroup, kind, frequencyHz, source, metadata, points, unsorted);
    }

    /** Lowest temperature [°C]. */
    public double minTemperatureC() {
        return points.get(0).temperatureC();
    }

    /** Highest temperature [°C]. */
    public double maxTemperatureC() {
        return points.get(points.size() - 1).temperatureC();
    }

    /** The metadata key of the heating rate. */
    public static final String HEATING_RATE = "heating_rate";

    /**
     * The heating rate [K/min] the metadata give ("2 °C/min", "3 K/min", "0.05 K/s", a bare number
     * in K/min); empty when none is given.
     *
     * @throws IllegalArgumentException when the text is not understood
     */
    public OptionalDouble heatingRateKPerMin() {
        String v = metadata.get(HEATING_RATE);
        return v == null ? OptionalDouble.empty() : OptionalDouble.of(parseHeatingRate(v));
    }

    /** Parses a heating rate to K/min. */
    public static double parseHeatingRate(String text) {
        String t = text.strip().toLowerCase(Locale.ROOT).replace("°", "").replace(" ", "");
        String[][] units = {{"c/min", "1"}, {"k/min", "1"}, {"c/s", "60"}, {"k/s", "60"}, {"c/h", "0.0166666666666666667"},
            {"k/h", "0.0166666666666666667"}, {"", "1"}};
        for (String[] u : units) {
            if (t.endsWith(u[0])) {
                String number = t.substring(0, t.length() - u[0].length());
                try {
                    double v = Double.parseDouble(number) * Double.parseDouble(u[1]);
                    if (Double.isFinite(v) && v != 0) {
                        return v;
                    }
                } catch (NumberFormatException e) {
                    // try the next unit
                }
            }
        }
        throw new IllegalArgumentException("heating rate '" + text + "' is not understood; write e.g. '2 °C/min'");
    }
}
