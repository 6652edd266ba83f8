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
import org.viscarta.sweep.Ramp;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;
import org.viscarta.sweep.TimeTest;

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

        /** Up to {@link #FEW_FREQUENCIES} + 1 distinct frequencies seen (more are not counted). */
        final double[] frequencies = new double[FEW_FREQUENCIES + 1];
        int distinctFrequencies;

        /** Counts the point's frequency among the few distinct ones a ramp has. */
        final void noteFrequency(double hz) {
            for (int i = 0; i < distinctFrequencies; i++) {
                if (sameFrequency(frequencies[i], hz)) {
                    return;
                }
            }
            if (distinctFrequencies < frequencies.length) {
                frequencies[distinctFrequencies++] = hz;
            }
        }

        /** @param temperature the row's temperature [°C] (NaN when the table gives none) */
        abstract void add(SweepPoint p, double temperature, List<ReadWarning> warnings);

        abstract int count();
    }

    /** A temperature ramp is measured at this many fixed frequencies at most. */
    static final int FEW_FREQUENCIES = 5;

    /** Frequencies within 0.1 % are one fixed frequency of a ramp (exports log the set value with rounding). */
    static boolean sameFrequency(double a, double b) {
        return Math.abs(a - b) <= 1e-3 * Math.max(Math.abs(a), Math.abs(b));
    }

    /** What a new sweep starts with. */
    record Key(String sample, String replicate, String group, ModulusKind kind, double temperature, int block,
                       Map<String, String> metadata) {
    }

    /** Where validated rows go: whole sweeps ({@link SweepSink}) or each sweep's extent ({@link ExtentSink}). */
    interface Sink<T, B extends Bucket> {
        B bucket(Key key, int line);

        /**
         * @param attributes the descriptive columns constant over every sweep
         * @param ramps      the sample and replicate pairs whose buckets are temperature ramps
         */
        T table(TableInfo info, List<B> buckets, List<String> attributes, java.util.Set<List<String>> ramps,
                CappedWarnings warnings);

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
        private double[] temperatures = new double[8];

        Points(Key key, int firstLine) {
            super(key, firstLine);
        }

        @Override
        void add(SweepPoint p, double temperature, List<ReadWarning> warnings) {
            if (points.size() == temperatures.length) {
                temperatures = java.util.Arrays.copyOf(temperatures, temperatures.length * 2);
            }
            temperatures[points.size()] = temperature;
            points.add(p);
        }

        double temperatureOf(int i) {
            return temperatures[i];
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
        public SweepFile table(TableInfo info, List<Points> buckets, List<String> attributes, java.util.Set<List<String>> ramps,
                               CappedWarnings warnings) {
            List<Sweep> sweeps = new ArrayList<>();
            List<TimeTest> timeTests = new ArrayList<>();
            Map<List<String>, List<Points>> rampBuckets = new LinkedHashMap<>();
            for (Points b : buckets) {
                String test = b.metadata.get(TimeTest.TYPE_KEY);
                if (test != null) {
                    timeTests.add(timeTest(path, b, TimeTest.Type.valueOf(test), warnings));
                    continue;
                }
                if (ramps.contains(List.of(b.sample, b.replicate))) {
                    rampBuckets.computeIfAbsent(List.of(b.sample, b.replicate), k -> new ArrayList<>()).add(b);
                    continue;
                }
                Map<String, String> attrs = new LinkedHashMap<>();
                for (String a : attributes) {
                    attrs.put(a, b.attributes.getOrDefault(a, ""));
                }
                Sweep s = new Sweep(b.sample, b.replicate, b.group, b.kind, b.temperature(), path, b.metadata, b.points, attrs);
                checkPoints(path, s, warnings);
                sweeps.add(s);
            }
            List<Ramp> out = new ArrayList<>();
            for (List<Points> list : rampBuckets.values()) {
                out.addAll(ramps(path, list, warnings));
            }
            return new SweepFile(path, sha(), info, sweeps, out, timeTests, warnings.closeOut());
        }

        /** A time-domain test from its bucket (points carried as time, value, value); out-of-order and repeated times reported. */
        private static TimeTest timeTest(Path path, Points b, TimeTest.Type type, CappedWarnings warnings) {
            List<TimeTest.Point> pts = new ArrayList<>();
            int unsorted = 0;
            for (int i = 0; i < b.points.size(); i++) {
                SweepPoint p = b.points.get(i);
                if (i > 0 && p.frequencyHz() < b.points.get(i - 1).frequencyHz()) {
                    unsorted++;
                }
                pts.add(new TimeTest.Point(p.frequencyHz(), p.storage(), p.line()));
            }
            Map<String, String> meta = new LinkedHashMap<>(b.metadata);
            meta.remove(TimeTest.TYPE_KEY);
            TimeTest t = new TimeTest(b.sample, b.replicate, b.group, b.kind, type, b.temperature(), path, meta, pts);
            if (unsorted > 0) {
                warnings.add(new ReadWarning(path, b.firstLine, "the " + type.test() + " test of " + b.sample + " (replicate "
                        + b.replicate + ") has " + unsorted + " time(s) out of order; sorted by time"));
            }
            int repeated = 0;
            for (int i = 1; i < t.points().size(); i++) {
                if (t.points().get(i).timeS() == t.points().get(i - 1).timeS()) {
                    repeated++;
                }
            }
            if (repeated > 0) {
                warnings.add(new ReadWarning(path, b.firstLine, "the " + type.test() + " test of " + b.sample + " (replicate "
                        + b.replicate + ") repeats " + repeated + " time(s); each point is kept"));
            }
            return t;
        }

        /** The ramps of one sample and replicate, one per fixed frequency, points in file order before sorting. */
        private static List<Ramp> ramps(Path path, List<Points> buckets, CappedWarnings warnings) {
            record Row(int line, double hz, Ramp.Point point) {
            }
            List<Row> rows = new ArrayList<>();
            for (Points b : buckets) {
                for (int i = 0; i < b.points.size(); i++) {
                    SweepPoint p = b.points.get(i);
                    rows.add(new Row(p.line(), p.frequencyHz(), new Ramp.Point(b.temperatureOf(i), p.storage(), p.loss(), p.line())));
                }
            }
            rows.sort(java.util.Comparator.comparingInt(Row::line));
            List<Double> hz = new ArrayList<>();
            List<List<Ramp.Point>> byHz = new ArrayList<>();
            for (Row r : rows) {
                int k = 0;
                while (k < hz.size() && !sameFrequency(hz.get(k), r.hz())) {
                    k++;
                }
                if (k == hz.size()) {
                    hz.add(r.hz());
                    byHz.add(new ArrayList<>());
                }
                byHz.get(k).add(r.point());
            }
            Points first = buckets.get(0);
            List<Ramp> out = new ArrayList<>();
            for (int k = 0; k < hz.size(); k++) {
                List<Ramp.Point> pts = byHz.get(k);
                int unsorted = 0;
                double highest = Double.NEGATIVE_INFINITY;
                for (Ramp.Point p : pts) {
                    if (p.temperatureC() < highest) {
                        unsorted++;
                    }
                    highest = Math.max(highest, p.temperatureC());
                }
                Ramp r = new Ramp(first.sample, first.replicate, first.group, first.kind, hz.get(k), path, first.metadata, pts,
                        unsorted);
                if (unsorted > 0 && !warnings.full()) {
                    warnings.add(new ReadWarning(path, pts.get(0).line(), String.format(Locale.ROOT, "the ramp of sample '%s' "
                            + "replicate '%s' at %s Hz has %d point(s) below a temperature already passed; they were sorted by "
                            + "temperature", r.sample(), r.replicate(), org.viscarta.sweep.Numbers.plain(r.frequencyHz()), unsorted)));
                }
                for (Ramp.Point p : pts) {
                    if (!(p.loss() > 0) && !warnings.full()) {
                        warnings.add(new ReadWarning(path, p.line(), String.format(Locale.ROOT, "loss modulus %g Pa is not positive "
                                + "(ramp of sample '%s'); the point is left out of the loss peaks", p.loss(), r.sample())));
                    }
                }
                out.add(r);
            }
            return out;
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
        void add(SweepPoint p, double temperature, List<ReadWarning> warnings) {
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
        public Summary table(TableInfo info, List<Extent> buckets, List<String> attributes, java.util.Set<List<String>> ramps,
                             CappedWarnings warnings) {
            warnings.drop(buckets.stream().mapToLong(e -> e.warningsDropped).sum());
            List<SweepSummary> out = new ArrayList<>();
            Map<List<String>, Extent> rampStart = new LinkedHashMap<>();
            Map<List<String>, long[]> rampPoints = new LinkedHashMap<>();
            Map<List<String>, double[]> rampRange = new LinkedHashMap<>();
            for (Extent e : buckets) {
                List<String> key = List.of(e.sample, e.replicate);
                String test = e.metadata.get(TimeTest.TYPE_KEY);
                if (test != null) {
                    TimeTest.Type type = TimeTest.Type.valueOf(test);
                    out.add(new SweepSummary(e.sample, e.replicate, e.group, e.kind, e.temperature(), e.points, Double.NaN, Double.NaN,
                            String.format(java.util.Locale.ROOT, "%s test, %s from %.4g s to %.4g s", type.test(), type.quantity(),
                                    e.min, e.max)));
                    continue;
                }
                if (ramps.contains(key)) {
                    rampStart.putIfAbsent(key, e);
                    rampPoints.computeIfAbsent(key, k -> new long[1])[0] += e.points;
                    double[] r = rampRange.computeIfAbsent(key, k -> new double[] {Double.POSITIVE_INFINITY, 0});
                    r[0] = Math.min(r[0], e.min);
                    r[1] = Math.max(r[1], e.max);
                    continue;
                }
                out.add(new SweepSummary(e.sample, e.replicate, e.group, e.kind, e.temperature(), e.points, e.min, e.max));
            }
            for (Map.Entry<List<String>, Extent> r : rampStart.entrySet()) {
                Extent e = r.getValue();
                double[] range = rampRange.get(r.getKey());
                // a ramp: one line for all its temperatures (NaN), its fixed frequencies as the range
                out.add(new SweepSummary(e.sample, e.replicate, e.group, e.kind, Double.NaN, rampPoints.get(r.getKey())[0],
                        range[0], range[1]));
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
