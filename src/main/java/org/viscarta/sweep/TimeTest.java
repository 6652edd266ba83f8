package org.viscarta.sweep;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * One time-domain test of one replicate of one sample: a stress relaxation (the relaxation modulus
 * M(t) after a step in strain or depth) or a creep test (the creep compliance J(t) after a step in
 * stress or force), in SI units, sorted by time.
 *
 * @param sample       sample name
 * @param replicate    replicate label, "1" when the input has none
 * @param group        group label, "" when none
 * @param kind         whether M is tensile (E) or shear (G)
 * @param type         relaxation or creep
 * @param temperatureC test temperature [°C], NaN when unknown
 * @param source       the file it was read from
 * @param metadata     the file's {@code # key: value} lines, keys in lower case
 * @param points       the measured points, sorted by time
 */
public record TimeTest(String sample, String replicate, String group, ModulusKind kind, Type type, double temperatureC, Path source,
                       Map<String, String> metadata, List<Point> points) {

    /** The metadata key with which the reader marks a block of a time-domain test (its {@link Type} name). */
    public static final String TYPE_KEY = "time_domain_test";

    /** What a time-domain test measures. */
    public enum Type {
        /** M(t) [Pa] after a step in strain. */
        RELAXATION("stress relaxation", "relaxation", "relaxation modulus", "Pa"),
        /** J(t) [1/Pa] after a step in stress. */
        CREEP("creep", "creep", "creep compliance", "1/Pa");

        private final String test;
        private final String label;
        private final String quantity;
        private final String unit;

        Type(String test, String label, String quantity, String unit) {
            this.test = test;
            this.label = label;
            this.quantity = quantity;
            this.unit = unit;
        }

        /** The short word a sample computed from such tests carries in its name ("relaxation", "creep"). */
        public String label() {
            return label;
        }

        /** The test's name ("stress relaxation", "creep"). */
        public String test() {
            return test;
        }

        /** The measured function's name. */
        public String quantity() {
            return quantity;
        }

        /** The measured function's SI unit. */
        public String unit() {
            return unit;
        }
    }

    /**
     * One measured time.
     *
     * @param timeS the time since the step [s], positive
     * @param value M(t) [Pa] or J(t) [1/Pa], positive
     * @param line  the input line it came from (0 when made in memory)
     */
    public record Point(double timeS, double value, int line) {
        public Point {
            if (!(timeS > 0) || Double.isInfinite(timeS)) {
                throw new IllegalArgumentException("a time-domain point needs a finite time > 0 s, got " + timeS);
            }
            if (!(value > 0) || Double.isInfinite(value)) {
                throw new IllegalArgumentException("a relaxation modulus or creep compliance must be finite and > 0, got " + value);
            }
        }
    }

    public TimeTest {
        Objects.requireNonNull(sample, "sample");
        Objects.requireNonNull(replicate, "replicate");
        Objects.requireNonNull(group, "group");
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(type, "type");
        Objects.requireNonNull(source, "source");
        if (points.isEmpty()) {
            throw new IllegalArgumentException("a time-domain test needs at least one point");
        }
        metadata = org.viscarta.sweep.Metadata.inFileOrder(metadata);
        List<Point> sorted = new ArrayList<>(points);
        sorted.sort(Comparator.comparingDouble(Point::timeS));
        points = List.copyOf(sorted);
    }

    /** The same test with another group label. */
    public TimeTest withGroup(String newGroup) {
        return new TimeTest(sample, replicate, newGroup, kind, type, temperatureC, source, metadata, points);
    }

    /** Shortest time [s]. */
    public double minTimeS() {
        return points.get(0).timeS();
    }

    /** Longest time [s]. */
    public double maxTimeS() {
        return points.get(points.size() - 1).timeS();
    }
}
