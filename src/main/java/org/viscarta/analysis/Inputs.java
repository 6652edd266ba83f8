package org.viscarta.analysis;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Collectors;
import org.viscarta.io.InputCollector;
import org.viscarta.io.InputException;
import org.viscarta.io.Layout;
import org.viscarta.io.ReadWarning;
import org.viscarta.io.SweepFile;
import org.viscarta.io.SweepReader;
import org.viscarta.io.TableInfo;
import org.viscarta.raw.RawConverter;
import org.viscarta.raw.RawReader;
import org.viscarta.raw.RawSweeps;
import org.viscarta.sweep.BasisConversion;
import org.viscarta.sweep.Ramp;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.TimeTest;
import org.viscarta.sweep.Numbers;

/**
 * Everything read from a set of inputs: the files, the sweeps grouped into samples (on one basis
 * when asked), the warnings and the conversions applied.
 *
 * @param files    the files read (calibration tables and files left out are not among them)
 * @param samples  the samples, in reading order
 * @param warnings warnings from reading, including the files left out
 * @param notes    conversions that were applied
 * @param amplitudeSweeps amplitude sweeps (linearity tests at one frequency), kept apart from the samples
 * @param ramps    temperature ramps (one per sample, replicate and fixed frequency), kept apart from the samples
 * @param timeTests stress-relaxation and creep tests, kept apart from the samples until the analysis fits them
 * @param positioned sweeps measured at positions over a specimen (x and y), kept apart for maps
 */
public record Inputs(List<SweepFile> files, List<Sample> samples, List<ReadWarning> warnings, List<String> notes,
                     List<Sweep> amplitudeSweeps, List<Ramp> ramps, List<TimeTest> timeTests, List<Sweep> positioned) {

    public Inputs {
        positioned = List.copyOf(positioned);
        ramps = List.copyOf(ramps);
        timeTests = List.copyOf(timeTests);
        files = List.copyOf(files);
        samples = List.copyOf(samples);
        amplitudeSweeps = List.copyOf(amplitudeSweeps);
        warnings = List.copyOf(warnings);
        notes = List.copyOf(notes);
    }

    /**
     * The same inputs without the given replicates (sample display name and replicate), a sample
     * keeping at least its other replicates; a note says which were left out.
     */
    Inputs withoutReplicates(List<org.viscarta.quality.SweepChecks.Check> leftOut) {
        if (leftOut.isEmpty()) {
            return this;
        }
        List<Sample> kept = new ArrayList<>();
        List<String> more = new ArrayList<>(notes);
        for (Sample s : samples) {
            List<Sweep> reps = s.replicates().stream().filter(r -> leftOut.stream()
                    .noneMatch(c -> c.sample().equals(s.name()) && c.replicate().equals(r.replicate()))).toList();
            if (reps.size() < s.replicates().size() && !reps.isEmpty()) {
                List<String> gone = s.replicates().stream().map(Sweep::replicate).filter(r -> reps.stream()
                        .noneMatch(k -> k.replicate().equals(r))).toList();
                more.add("sample '" + s.name() + "': replicate" + (gone.size() == 1 ? " " : "s ") + String.join(", ", gone)
                        + " left out of every analysis as an outlier (--drop-outliers)");
                kept.add(new Sample(s.name(), s.group(), s.kind(), s.temperatureC(), reps));
            } else {
                kept.add(s);
            }
        }
        return new Inputs(files, kept, warnings, more, amplitudeSweeps, ramps, timeTests, positioned);
    }

    /** The same inputs with more samples (master curves built from temperature series), analysed like the others. */
    Inputs withSamples(List<Sample> extra) {
        return withSamples(extra, List.of());
    }

    /** The same inputs with more samples and notes (samples computed from time-domain tests). */
    Inputs withSamples(List<Sample> extra, List<String> moreNotes) {
        List<Sample> all = new ArrayList<>(samples);
        all.addAll(extra);
        List<String> n = new ArrayList<>(notes);
        n.addAll(moreNotes);
        return new Inputs(files, all, warnings, n, amplitudeSweeps, ramps, timeTests, positioned);
    }

    /**
     * Reads every input (files, or folders read recursively) and groups the sweeps into samples.
     * Raw oscillation signals are converted to moduli here, so "is this a raw file or a table" is
     * decided in one place.
     *
     * @throws InputException for the first bad input (or any, with {@link ReadSettings.BadFiles#STOP})
     */
    public static Inputs read(List<Path> inputs, ReadSettings settings) {
        SweepReader reader = new SweepReader(settings.declaredKind().orElse(null), settings.columns());
        List<InputException> skipped = new ArrayList<>();
        List<SweepFile> files = new ArrayList<>();
        List<ReadWarning> warnings = new ArrayList<>();
        List<String> notes = new ArrayList<>();
        Map<String, List<Sweep>> bySample = new LinkedHashMap<>();
        Map<String, Path> replicateSeen = new LinkedHashMap<>();
        List<Sweep> amplitudeSweeps = new ArrayList<>();
        List<Ramp> ramps = new ArrayList<>();
        Map<String, Path> rampSeen = new LinkedHashMap<>();
        List<TimeTest> timeTests = new ArrayList<>();
        Map<String, Path> timeTestSeen = new LinkedHashMap<>();
        List<Sweep> positioned = new ArrayList<>();
        List<Path> all = InputCollector.collect(inputs);
        // the files are read side by side, then taken in their order as if read one after another
        List<Read> read = all.parallelStream().map(file -> {
            List<String> own = new ArrayList<>();
            try {
                return new Read(readOne(file, reader, own), null, own);
            } catch (InputException e) {
                return new Read(null, e, own);
            }
        }).toList();
        for (int i = 0; i < all.size(); i++) {
            Path file = all.get(i);
            Read one = read.get(i);
            notes.addAll(one.notes());
            SweepFile sf = one.file();
            if (one.error() != null) {
                InputException e = one.error();
                if (settings.badFiles() == ReadSettings.BadFiles.STOP || all.size() == 1) {
                    throw e;
                }
                skipped.add(e);
                warnings.add(new ReadWarning(file, e.line(), "left out: " + e.getMessage()));
                continue;
            }
            if (sf == null) {
                continue;
            }
            files.add(sf);
            warnings.addAll(sf.warnings());
            for (TimeTest t : sf.timeTests()) {
                if (settings.groupBy().isPresent()) {
                    throw new InputException(file, sf.info().headerLine(), 0, "--group-by does not apply to relaxation and creep "
                            + "tests; give the tests a group column or a '# group:' line");
                }
                String key = t.sample() + "\u0000" + t.replicate() + "\u0000" + t.type() + "\u0000" + t.temperatureC();
                Path prev = timeTestSeen.put(key, file);
                if (prev != null) {
                    throw new InputException(file, t.points().get(0).line(), 0, "the " + t.type().test() + " test of sample '"
                            + t.sample() + "' replicate '" + t.replicate() + "' is also in " + prev + "; give each replicate its own "
                            + "label (a '# replicate:' line or a replicate column)");
                }
                timeTests.add(t);
            }
            for (Ramp r : sf.ramps()) {
                Ramp ramp = r;
                if (settings.groupBy().isPresent()) {
                    throw new InputException(file, sf.info().headerLine(), 0, "--group-by does not apply to temperature ramps; "
                            + "give the ramps a group column or a '# group:' line");
                }
                String key = r.sample() + "\u0000" + r.replicate() + "\u0000" + r.frequencyHz();
                Path prev = rampSeen.put(key, file);
                if (prev != null) {
                    throw new InputException(file, r.points().get(0).line(), 0, "the ramp of sample '" + r.sample()
                            + "' replicate '" + r.replicate() + "' at " + Numbers.plain(r.frequencyHz()) + " Hz is also in "
                            + prev + "; give each replicate its own label (a '# replicate:' line or a replicate column)");
                }
                try {
                    r.heatingRateKPerMin();
                } catch (IllegalArgumentException e) {
                    throw new InputException(file, 0, 0, e.getMessage());
                }
                ramps.add(ramp);
            }
            for (Sweep s : sf.sweeps()) {
                if (s.isAmplitudeSweep()) {
                    amplitudeSweeps.add(s);
                    continue;
                }
                if (s.position() != null) {
                    positioned.add(settings.basis().isPresent() ? basis(s, settings, file, sf, notes) : s);
                    continue;
                }
                Sweep sweep = s;
                if (settings.groupBy().isPresent()) {
                    String attribute = settings.groupBy().get();
                    String value = s.attributes().get(attribute);
                    if (value == null) {
                        throw new InputException(file, sf.info().headerLine(), 0, "--group-by " + InputException.quote(attribute)
                                + ": the file has no such descriptive column" + (s.attributes().isEmpty() ? ""
                                : " (it has " + String.join(", ", s.attributes().keySet().stream().map(InputException::quote).toList()) + ")"));
                    }
                    sweep = sweep.withGroup(value);
                }
                if (settings.basis().isPresent()) {
                    try {
                        BasisConversion.Converted c = BasisConversion.toBasis(sweep, settings.basis().get(), settings.poisson());
                        sweep = c.sweep();
                        if (!c.note().isEmpty()) {
                            notes.add(file + ": sample '" + s.sample() + "': " + c.note());
                        }
                    } catch (IllegalArgumentException e) {
                        throw new InputException(file, sf.info().headerLine(), 0, e.getMessage());
                    }
                }
                String key = s.sample() + "\u0000" + s.temperatureC();
                String repKey = key + "\u0000" + s.replicate();
                Path prev = replicateSeen.put(repKey, file);
                if (prev != null) {
                    throw new InputException(file, sweep.points().get(0).line(), 0, "sample '" + s.sample()
                            + "' replicate '" + s.replicate() + "' is also in " + prev
                            + "; give each replicate its own label (a '# replicate:' line or a replicate column)");
                }
                bySample.computeIfAbsent(key, k -> new ArrayList<>()).add(sweep);
            }
        }
        if (files.isEmpty() && !skipped.isEmpty()) {
            throw skipped.get(0);
        }
        if (!amplitudeSweeps.isEmpty()) {
            notes.add(amplitudeSweeps.size() + (amplitudeSweeps.size() == 1 ? " amplitude sweep" : " amplitude sweeps")
                    + " (amplitude varied at one frequency) read as linearity tests and kept apart from the frequency sweeps");
        }
        if (!ramps.isEmpty()) {
            long series = ramps.stream().map(r -> r.sample() + "\u0000" + r.replicate()).distinct().count();
            notes.add(ramps.size() + (ramps.size() == 1 ? " temperature ramp" : " temperature ramps") + " (" + series
                    + " sample replicate" + (series == 1 ? "" : "s") + " at fixed frequencies) read for the glass transition "
                    + "and kept apart from the frequency sweeps");
        }
        if (!timeTests.isEmpty()) {
            long relaxation = timeTests.stream().filter(t -> t.type() == TimeTest.Type.RELAXATION).count();
            notes.add(String.format(Locale.ROOT, "%d time-domain test(s) read (%d stress relaxation, %d creep): each sample's tests "
                    + "are fitted in the time domain and compared with the frequency sweeps through their fitted models",
                    timeTests.size(), relaxation, timeTests.size() - relaxation));
        }
        if (!positioned.isEmpty()) {
            long specimens = positioned.stream().map(Sweep::sample).distinct().count();
            notes.add(String.format(Locale.ROOT, "%d sweep(s) measured at positions over %d specimen(s) read for maps and kept apart "
                    + "from the samples ('viscarta map', and the Maps part of 'viscarta report')", positioned.size(), specimens));
        }
        return assemble(settings, files, bySample, warnings, notes, amplitudeSweeps, ramps, timeTests, positioned);
    }

    private static Sweep basis(Sweep s, ReadSettings settings, Path file, SweepFile sf, List<String> notes) {
        try {
            BasisConversion.Converted c = BasisConversion.toBasis(s, settings.basis().get(), settings.poisson());
            if (!c.note().isEmpty() && notes.stream().noneMatch(n -> n.startsWith(file + ": specimen '" + s.sample() + "'"))) {
                notes.add(file + ": specimen '" + s.sample() + "': " + c.note());
            }
            return c.sweep();
        } catch (IllegalArgumentException e) {
            throw new InputException(file, sf.info().headerLine(), 0, e.getMessage());
        }
    }

    /**
     * The one place that decides whether a file is a raw-signal table or a sweep table, and reads
     * it as one or the other.
     */
    private static <T> T either(Path file, java.util.function.Function<Path, T> table,
                                java.util.function.Function<RawReader.Measurement, T> raw) {
        return RawReader.isRaw(file) ? raw.apply(RawReader.read(file)) : table.apply(file);
    }

    /**
     * What {@code inspect} shows of one file, read in one streaming pass for sweep tables (memory
     * independent of the file's size), converted for raw signals.
     */
    public static SweepReader.Summary summarize(Path file, ReadSettings settings) {
        SweepReader reader = new SweepReader(settings.declaredKind().orElse(null), settings.columns());
        return either(file, reader::summarize, m -> {
            if (m.isCalibration()) {
                return new SweepReader.Summary(file, new TableInfo(new Layout.RawSignals(": a calibration on a rigid reference"),
                        ',', '.', "UTF-8", 0, List.of(), m.metadata()), List.of(), List.of());
            }
            if (m.stepTest().isPresent()) {
                org.viscarta.raw.StepResponse.Converted c = org.viscarta.raw.StepResponse.convert(m);
                TimeTest t = c.test();
                return new SweepReader.Summary(file, new TableInfo(new Layout.RawSignals(Layout.RawSignals.STEP + " (" + c.geometry() + ")"), ',',
                        '.', "UTF-8", 0, List.of(), m.metadata()), List.of(new SweepReader.SweepSummary(t.sample(), t.replicate(),
                        t.group(), t.kind(), t.temperatureC(), t.points().size(), Double.NaN, Double.NaN, String.format(Locale.ROOT,
                        "%s test from a raw record, %s from %.4g s to %.4g s (%d samples in %d log-spaced points; %s)",
                        t.type().test(), t.type().quantity(), t.minTimeS(), t.maxTimeS(), c.samples(), t.points().size(),
                        t.metadata().get("step")))), c.warnings());
            }
            RawSweeps rs = RawSweeps.convert(m, RawConverter.Settings.defaults(), null);
            Sweep s = rs.sweep();
            return new SweepReader.Summary(file, new TableInfo(new Layout.RawSignals(" (" + rs.geometry().describe() + ")"), ',',
                    '.', "UTF-8", 0, List.of(), m.metadata()), List.of(new SweepReader.SweepSummary(s.sample(), s.replicate(),
                    s.group(), s.kind(), s.temperatureC(), s.points().size(), s.minFrequencyHz(), s.maxFrequencyHz())),
                    rs.warnings());
        });
    }

    /** Reads one file: a raw-signal table (converted) or a sweep table; null for a calibration table. */
    /** One file read: its content (null for a file that is not analysed, e.g. a calibration) or why it could not be, and its notes. */
    private record Read(SweepFile file, InputException error, List<String> notes) {
    }

    private static SweepFile readOne(Path file, SweepReader reader, List<String> notes) {
        return either(file, reader::read, m -> raw(file, m, notes));
    }

    private static SweepFile raw(Path file, RawReader.Measurement m, List<String> notes) {
        if (m.isCalibration()) {
            notes.add(file + ": a calibration measurement, used by the raw files that name it, not analysed as a sample");
            return null;
        }
        if (m.stepTest().isPresent()) {
            org.viscarta.raw.StepResponse.Converted c = org.viscarta.raw.StepResponse.convert(m);
            notes.add(file + ": raw " + c.test().type().test() + " record converted to the " + c.test().type().quantity() + " ("
                    + c.geometry() + "; " + c.test().metadata().get("step") + "; " + c.samples() + " samples averaged into "
                    + c.test().points().size() + " log-spaced points)");
            return new SweepFile(file, m.sha256(), new TableInfo(new Layout.RawSignals(""), ',', '.', "UTF-8", 0, List.of(),
                    m.metadata()), List.of(), List.of(), List.of(c.test()), c.warnings());
        }
        RawSweeps rs = RawSweeps.convert(m, RawConverter.Settings.defaults(), null);
        notes.add(file + ": raw signals converted to moduli (" + rs.geometry().describe() + ", calibration: "
                + rs.sweep().metadata().get("calibration_used") + ")");
        return new SweepFile(file, m.sha256(), new TableInfo(new Layout.RawSignals(""), ',', '.', "UTF-8", 0, List.of(),
                m.metadata()), List.of(positioned(file, m.metadata(), rs.sweep())), rs.warnings());
    }

    /**
     * A raw file's sweep at the position its '# x:' and '# y:' lines give (one raw file per position of
     * a map), or the sweep as it is without them.
     */
    private static Sweep positioned(Path file, Map<String, String> meta, Sweep s) {
        if (!meta.containsKey("x") || !meta.containsKey("y")) {
            return s;
        }
        double[] xy = new double[2];
        String[] keys = {"x", "y"};
        for (int k = 0; k < 2; k++) {
            try {
                xy[k] = org.viscarta.sweep.Unit.parse(meta.get(keys[k]).strip(), org.viscarta.sweep.Quantity.Dimension.LENGTH).si();
            } catch (IllegalArgumentException e) {
                throw new InputException(file, 0, 0, "'" + keys[k] + ": " + meta.get(keys[k]) + "' is not understood; write a position "
                        + "with its unit, e.g. '" + keys[k] + ": 120 µm'");
            }
        }
        Map<String, String> attrs = new LinkedHashMap<>(s.attributes());
        attrs.put(Sweep.X_M, Double.toString(xy[0]));
        attrs.put(Sweep.Y_M, Double.toString(xy[1]));
        return new Sweep(s.sample(), s.replicate() + Sweep.POSITION_SEPARATOR + xy[0] + "," + xy[1], s.group(), s.kind(), s.temperatureC(),
                s.source(), s.metadata(), s.points(), attrs);
    }

    private static Inputs assemble(ReadSettings settings, List<SweepFile> files, Map<String, List<Sweep>> bySample,
                                   List<ReadWarning> warnings, List<String> notes, List<Sweep> amplitudeSweeps,
                                   List<Ramp> ramps, List<TimeTest> timeTests, List<Sweep> positioned) {
        Map<String, Long> temperaturesPerName = bySample.values().stream()
                .collect(Collectors.groupingBy(l -> l.get(0).sample(), Collectors.counting()));
        List<Sample> samples = new ArrayList<>();
        for (List<Sweep> reps : bySample.values()) {
            Sweep first = reps.get(0);
            String name = first.sample();
            if (temperaturesPerName.get(name) > 1) {
                name = String.format(Locale.ROOT, "%s @ %s °C", name, Numbers.plain(first.temperatureC()));
            }
            for (Sweep r : reps) {
                if (!r.group().equals(first.group())) {
                    throw new InputException(r.source(), r.points().get(0).line(), 0, "sample '" + first.sample()
                            + "' is in group '" + first.group() + "' in " + first.source() + " but in group '"
                            + r.group() + "' here; a sample belongs to one group");
                }
            }
            samples.add(new Sample(name, first.group(), first.kind(), first.temperatureC(), reps));
        }
        long kinds = samples.stream().map(Sample::kind).distinct().count();
        if (kinds > 1 && settings.basis().isEmpty()) {
            warnings.add(new ReadWarning(Path.of("(inputs)"), 0, "the inputs mix tensile (E) and shear (G) moduli; "
                    + "tan δ compares fine, but moduli do not: pass --basis tensile or --basis shear (with --poisson) to convert"));
        }
        return new Inputs(files, samples, warnings, notes, amplitudeSweeps, ramps, timeTests, positioned);
    }

    /** True when an input says it is invented demo data. */
    public boolean isDemo() {
        for (SweepFile f : files) {
            for (String v : f.info().metadata().values()) {
                if (v.toLowerCase(Locale.ROOT).contains("demo data")) {
                    return true;
                }
            }
        }
        return false;
    }

    /** The warnings, then the conversions, as lines of text. */
    public List<String> warningTexts() {
        List<String> out = new ArrayList<>();
        for (ReadWarning w : warnings) {
            out.add(w.toString());
        }
        out.addAll(notes);
        return out;
    }
}
