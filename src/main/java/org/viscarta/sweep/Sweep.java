package org.viscarta.sweep;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * One frequency sweep of one replicate of one sample, in SI units, sorted by frequency.
 *
 * @param sample      sample name (replicates of one sample share it)
 * @param replicate   replicate label, "1" when the input has none
 * @param group       group label (formulation, treatment), "" when none
 * @param kind        whether the moduli are tensile (E) or shear (G)
 * @param temperatureC test temperature [°C], NaN when unknown
 * @param source      the file the sweep was read from
 * @param metadata    the file's {@code # key: value} lines, keys in lower case
 * @param points      the measured points, sorted by frequency
 * @param attributes  descriptive columns of a tidy table that are constant over the sweep
 *                    (composition, layer height, exposure ...), header as written → value, in column order
 */
public record Sweep(String sample, String replicate, String group, ModulusKind kind, double temperatureC,
                    Path source, Map<String, String> metadata, List<SweepPoint> points, Map<String, String> attributes) {

    /** A sweep without attributes. */
    /** Attribute keys of a measured position [m] (x and y columns of a table, or '# x:' and '# y:' of a raw file). */
    public static final String X_M = "x_m";
    public static final String Y_M = "y_m";
    /** Between a replicate label and the position in the label of a positioned sweep. */
    public static final String POSITION_SEPARATOR = " @ ";

    /** The measured position [m] {x, y}, or null when the sweep has none. */
    public double[] position() {
        String x = attributes.get(X_M);
        String y = attributes.get(Y_M);
        if (x == null || y == null) {
            return null;
        }
        try {
            return new double[] {Double.parseDouble(x), Double.parseDouble(y)};
        } catch (NumberFormatException e) {
            return null;
        }
    }

    /** The replicate label without the position a positioned sweep carries in it. */
    public String replicateAtPosition() {
        int i = replicate.indexOf(POSITION_SEPARATOR);
        return i < 0 ? replicate : replicate.substring(0, i);
    }

    public Sweep(String sample, String replicate, String group, ModulusKind kind, double temperatureC,
                 Path source, Map<String, String> metadata, List<SweepPoint> points) {
        this(sample, replicate, group, kind, temperatureC, source, metadata, points, Map.of());
    }

    public Sweep {
        Objects.requireNonNull(sample, "sample");
        Objects.requireNonNull(replicate, "replicate");
        Objects.requireNonNull(group, "group");
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(source, "source");
        if (points.isEmpty()) {
            throw new IllegalArgumentException("a sweep needs at least one point");
        }
        metadata = org.viscarta.sweep.Metadata.inFileOrder(metadata);
        attributes = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(attributes));
        List<SweepPoint> sorted = new ArrayList<>(points);
        sorted.sort(Comparator.comparingDouble(SweepPoint::frequencyHz));
        points = List.copyOf(sorted);
    }

    /** Lowest measured frequency [Hz]. */
    public double minFrequencyHz() {
        return points.get(0).frequencyHz();
    }

    /** Highest measured frequency [Hz]. */
    public double maxFrequencyHz() {
        return points.get(points.size() - 1).frequencyHz();
    }

    /** The metadata key under which the reader records which amplitude column the points' amplitudes come from. */
    public static final String AMPLITUDE_COLUMN = "amplitude_column";

    /** Relative spread of frequencies within which a sweep counts as measured at one frequency. */
    private static final double ONE_FREQUENCY = 1e-3;

    /**
     * The quantity of the points' amplitudes ({@code strain_amplitude} ...), when the input gave an
     * amplitude column.
     */
    public Optional<Quantity> amplitudeQuantity() {
        String c = metadata.get(AMPLITUDE_COLUMN);
        if (c == null) {
            return Optional.empty();
        }
        for (Quantity q : Quantity.values()) {
            if (q.canonical().equals(c)) {
                return Optional.of(q);
            }
        }
        return Optional.empty();
    }

    /**
     * True for an amplitude sweep: the amplitude varies (by a factor of two or more) while the
     * frequency stays put. Such a sweep is a linearity test, kept apart from frequency sweeps.
     */
    public boolean isAmplitudeSweep() {
        if (amplitudeQuantity().isEmpty() || points.size() < 3) {
            return false;
        }
        double aMin = Double.POSITIVE_INFINITY;
        double aMax = 0;
        for (SweepPoint p : points) {
            if (!(p.amplitude() > 0)) {
                return false;
            }
            aMin = Math.min(aMin, p.amplitude());
            aMax = Math.max(aMax, p.amplitude());
        }
        return aMax >= 2 * aMin && maxFrequencyHz() <= minFrequencyHz() * (1 + ONE_FREQUENCY);
    }

    /** A metadata value by (lower-case) key. */
    public Optional<String> meta(String key) {
        return Optional.ofNullable(metadata.get(key));
    }

    /** Poisson's ratio from the metadata ({@code poisson_ratio}), when given and valid. */
    public OptionalDouble poissonRatio() {
        String v = metadata.get("poisson_ratio");
        if (v == null) {
            return OptionalDouble.empty();
        }
        try {
            double nu = Double.parseDouble(v.strip());
            return nu > -1 && nu <= 0.5 ? OptionalDouble.of(nu) : OptionalDouble.empty();
        } catch (NumberFormatException e) {
            return OptionalDouble.empty();
        }
    }

    /** The same sweep with other points and modulus kind (used by basis conversion). */
    public Sweep withPoints(ModulusKind newKind, List<SweepPoint> newPoints) {
        return new Sweep(sample, replicate, group, newKind, temperatureC, source, metadata, newPoints, attributes);
    }

    /** The same sweep in another group (a sample attribute chosen as the group). */
    public Sweep withGroup(String newGroup) {
        return new Sweep(sample, replicate, newGroup, kind, temperatureC, source, metadata, points, attributes);
    }

    /** The points whose loss modulus is positive, i.e. those a fit on log moduli can use. */
    public List<SweepPoint> fittablePoints() {
        return points.stream().filter(SweepPoint::usableInLogFit).toList();
    }
}
