package org.viscarta.io;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.viscarta.io.SweepReader.Summary;
import org.viscarta.io.SweepReader.SweepSummary;
import org.viscarta.sweep.ModulusKind;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;

/**
 * Where {@link SweepReader}'s validated rows go: each sweep's rows gather in a {@link Bucket}
 * (labels, temperatures, attributes), and a {@link Sink} turns the buckets of a table into its
 * result — {@link SweepSink} keeps every point ({@code read}), {@link ExtentSink} only each sweep's
 * point count and frequency range ({@code summarize}).
 */
final class SweepSinks {

    private SweepSinks() {
    }

    /** The rows of one sweep (sample, replicate, temperature) as a sink keeps them. */
    abstract static class Bucket {
        final String sample;
        final String replicate;
        final String group;
        final ModulusKind kind;
        final int firstLine;
        final int block;
        final double firstTemperature;
        double temperatureSum;
        int temperatureCount;
        final Map<String, String> attributes = new LinkedHashMap<>();
        final Map<String, String> metadata;

        Bucket(Key k, int firstLine) {
            this.metadata = k.metadata();
            this.sample = k.sample();
            this.replicate = k.replicate();
            this.group = k.group();
            this.kind = k.kind();
            this.firstTemperature = k.temperature();
            this.firstLine = firstLine;
            this.block = k.block();
        }

        /** The mean of the sweep's temperatures (NaN when not known). */
        double temperature() {
            return temperatureCount == 0 ? Double.NaN : temperatureSum / temperatureCount;
        }

        abstract void add(SweepPoint p, List<ReadWarning> warnings);

        abstract int count();
    }

    /** What a new sweep starts with. */
    record Key(String sample, String replicate, String group, ModulusKind kind, double temperature, int block,
                       Map<String, String> metadata) {
    }

    /** Where validated rows go: whole sweeps ({@link SweepSink}) or each sweep's extent ({@link ExtentSink}). */
    interface Sink<T, B extends Bucket> {
        B bucket(Key key, int line);

        /** @param attributes the descriptive columns constant over every sweep */
        T table(TableInfo info, List<B> buckets, List<String> attributes, CappedWarnings warnings);

        /** A wide table, read whole. */
        T wide(SweepFile whole);

        /** The file's checksum when the sink keeps it ("" otherwise). */
        String sha();

        /** Where the checksum comes from once the file is read (a sink that does not keep it ignores it). */
        default void checksum(java.util.function.Supplier<String> source) {
        }
    }

    /** Every point of one sweep. */
    static final class Points extends Bucket {
        final List<SweepPoint> points = new ArrayList<>();

        Points(Key key, int firstLine) {
            super(key, firstLine);
        }

        @Override
        void add(SweepPoint p, List<ReadWarning> warnings) {
            points.add(p);
        }

        @Override
        int count() {
            return points.size();
        }
    }

    /** Keeps every point: the sweeps of {@link #read}; sweep-level checks once each sweep is whole. */
    static final class SweepSink implements Sink<SweepFile, Points> {
        private final Path path;
        private String sha;
        private java.util.function.Supplier<String> source;

        SweepSink(Path path) {
            this.path = path;
        }

        SweepSink(Path path, String sha) {
            this.path = path;
            this.sha = sha;
        }

        @Override
        public void checksum(java.util.function.Supplier<String> from) {
            this.source = from;
        }

        @Override
        public Points bucket(Key key, int line) {
            return new Points(key, line);
        }

        @Override
        public SweepFile table(TableInfo info, List<Points> buckets, List<String> attributes, CappedWarnings warnings) {
            List<Sweep> sweeps = new ArrayList<>();
            for (Points b : buckets) {
                Map<String, String> attrs = new LinkedHashMap<>();
                for (String a : attributes) {
                    attrs.put(a, b.attributes.getOrDefault(a, ""));
                }
                Sweep s = new Sweep(b.sample, b.replicate, b.group, b.kind, b.temperature(), path, b.metadata, b.points, attrs);
                checkPoints(path, s, warnings);
                sweeps.add(s);
            }
            return new SweepFile(path, sha(), info, sweeps, warnings.closeOut());
        }

        @Override
        public SweepFile wide(SweepFile whole) {
            return whole;
        }

        @Override
        public String sha() {
            if (sha == null) {
                sha = source == null ? "" : source.get();
            }
            return sha;
        }
    }

    /** Only the point count and frequency range of one sweep. */
    static final class Extent extends Bucket {
        private final Path path;
        long points;
        double min = Double.POSITIVE_INFINITY;
        double max = 0;
        long warningsDropped;

        Extent(Path path, Key key, int firstLine) {
            super(key, firstLine);
            this.path = path;
        }

        @Override
        int count() {
            return (int) Math.min(Integer.MAX_VALUE, points);
        }

        @Override
        void add(SweepPoint p, List<ReadWarning> warnings) {
            points++;
            min = Math.min(min, p.frequencyHz());
            max = Math.max(max, p.frequencyHz());
            if (!(p.loss() > 0)) {
                if (warnings.size() >= MAX_WARNINGS) {
                    warningsDropped++;
                    return;
                }
                warnings.add(new ReadWarning(path, p.line(), String.format(Locale.ROOT,
                        "loss modulus %g Pa is not positive (sample '%s'); the point is kept in the data but left out of model fits",
                        p.loss(), sample)));
            }
        }
    }

    /** Keeps each sweep's extent only, so that memory does not grow with the file: the summaries of {@link #summarize}. */
    static final class ExtentSink implements Sink<Summary, Extent> {
        private final Path path;

        ExtentSink(Path path) {
            this.path = path;
        }

        @Override
        public Extent bucket(Key key, int line) {
            return new Extent(path, key, line);
        }

        @Override
        public Summary table(TableInfo info, List<Extent> buckets, List<String> attributes, CappedWarnings warnings) {
            warnings.drop(buckets.stream().mapToLong(e -> e.warningsDropped).sum());
            List<SweepSummary> out = new ArrayList<>();
            for (Extent e : buckets) {
                out.add(new SweepSummary(e.sample, e.replicate, e.group, e.kind, e.temperature(), e.points, e.min, e.max));
            }
            return new Summary(path, info, out, warnings.closeOut());
        }

        @Override
        public Summary wide(SweepFile whole) {
            return SweepReader.summaryOf(whole);
        }

        @Override
        public String sha() {
            return "";
        }
    }

    static final int MAX_WARNINGS = CappedWarnings.MAX;

    static void checkPoints(Path path, Sweep s, CappedWarnings warnings) {
        List<SweepPoint> pts = s.points();
        for (SweepPoint p : pts) {
            if (!(p.loss() > 0)) {
                if (warnings.full()) {
                    warnings.drop();
                    continue;
                }
                warnings.add(new ReadWarning(path, p.line(), String.format(Locale.ROOT,
                        "loss modulus %g Pa is not positive (sample '%s'); the point is kept in the data but left out of model fits",
                        p.loss(), s.sample())));
            }
        }
        for (int i = 1; i < pts.size() && !s.isAmplitudeSweep(); i++) {
            if (pts.get(i).frequencyHz() == pts.get(i - 1).frequencyHz()) {
                if (warnings.full()) {
                    warnings.drop();
                    continue;
                }
                warnings.add(new ReadWarning(path, pts.get(i).line(), String.format(Locale.ROOT,
                        "frequency %g Hz appears twice in sample '%s' replicate '%s'; both points are used",
                        pts.get(i).frequencyHz(), s.sample(), s.replicate())));
            }
        }
    }
}
