package org.viscarta;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.stream.Collectors;
import org.viscarta.compare.DampingComparison;
import org.viscarta.compare.FittedCurve;
import org.viscarta.compare.Matcher;
import org.viscarta.compare.ReferenceDistance;
import org.viscarta.compare.LossTangentAt;
import org.viscarta.compare.ReplicateSummary;
import org.viscarta.fit.FitResult;
import org.viscarta.fit.ModelFitter;
import org.viscarta.fit.ModelSelection;
import org.viscarta.fit.Weighting;
import org.viscarta.io.InputCollector;
import org.viscarta.io.InputException;
import org.viscarta.io.ReadWarning;
import org.viscarta.io.SweepFile;
import org.viscarta.io.SweepReader;
import org.viscarta.io.TableInfo;
import org.viscarta.raw.RawConverter;
import org.viscarta.raw.RawReader;
import org.viscarta.raw.RawSweeps;
import org.viscarta.library.ReferenceLibrary;
import org.viscarta.model.ModelCatalogue;
import org.viscarta.model.ViscoelasticModel;
import org.viscarta.sweep.BasisConversion;
import org.viscarta.sweep.ModulusKind;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;

/**
 * The analysis of a set of samples: read every input, put the moduli on one basis when asked,
 * fit the candidate models to each sample, and rank the samples by damping. This is what
 * {@code report} runs; {@code fit} and {@code rank} reuse parts of it.
 */
public final class Campaign {

    /** What the analysis was asked to do; every field goes into the report's provenance. */
    public record Settings(List<String> modelIds, double atHz, boolean modelOutsideRange, ModulusKind basis,
                           OptionalDouble poisson, ModulusKind declaredKind, Weighting weighting, double bandLowHz,
                           double bandHighHz, double alpha, Map<String, String> columns, boolean strict) {

        public Settings {
            columns = Map.copyOf(columns);
            if (!Double.isNaN(bandLowHz) && !(bandLowHz > 0 && bandHighHz > bandLowHz && Double.isFinite(bandHighHz))) {
                throw new IllegalArgumentException("the band must run from a lower to a higher positive frequency, got "
                        + bandLowHz + "–" + bandHighHz + " Hz");
            }
            if (!(alpha > 0 && alpha < 1)) {
                throw new IllegalArgumentException("the significance level must lie in (0, 1), got " + alpha);
            }
            modelIds = List.copyOf(modelIds);
            Objects.requireNonNull(poisson, "poisson");
            Objects.requireNonNull(weighting, "weighting");
            if (!(atHz > 0) || Double.isInfinite(atHz)) {
                throw new IllegalArgumentException("reference frequency must be finite and > 0 Hz, got " + atHz);
            }
            if (modelIds.isEmpty()) {
                throw new IllegalArgumentException("at least one model is needed");
            }
            for (String id : modelIds) {
                if (ModelCatalogue.byId(id).isEmpty()) {
                    throw new IllegalArgumentException("unknown model '" + id + "'; choose from "
                            + String.join(", ", ModelCatalogue.ids()));
                }
            }
        }

        /** All implemented models, 1 Hz, no extrapolation, no basis conversion, log residuals. */
        public static Settings defaults() {
            return new Settings(ModelCatalogue.ids(), 1.0, false, null, OptionalDouble.empty(), null, Weighting.LOG, Double.NaN, Double.NaN, 0.05, Map.of(), false);
        }

        public Settings withModels(List<String> ids) {
            return new Settings(ids, atHz, modelOutsideRange, basis, poisson, declaredKind, weighting, bandLowHz, bandHighHz, alpha, columns, strict);
        }

        public Settings withAt(double hz) {
            return new Settings(modelIds, hz, modelOutsideRange, basis, poisson, declaredKind, weighting, bandLowHz, bandHighHz, alpha, columns, strict);
        }

        public Settings withModelOutsideRange(boolean allow) {
            return new Settings(modelIds, atHz, allow, basis, poisson, declaredKind, weighting, bandLowHz, bandHighHz, alpha, columns, strict);
        }

        public Settings withBasis(ModulusKind kind, OptionalDouble nu) {
            return new Settings(modelIds, atHz, modelOutsideRange, kind, nu, declaredKind, weighting, bandLowHz, bandHighHz, alpha, columns, strict);
        }

        public Settings withDeclaredKind(ModulusKind kind) {
            return new Settings(modelIds, atHz, modelOutsideRange, basis, poisson, kind, weighting, bandLowHz, bandHighHz, alpha, columns, strict);
        }

        public Settings withWeighting(Weighting w) {
            return new Settings(modelIds, atHz, modelOutsideRange, basis, poisson, declaredKind, w, bandLowHz, bandHighHz, alpha, columns, strict);
        }

        /** Rank by the geometric mean of tan δ over [low, high] Hz instead of its value at one frequency. */
        public Settings withBand(double lowHz, double highHz) {
            return new Settings(modelIds, atHz, modelOutsideRange, basis, poisson, declaredKind, weighting, lowHz, highHz, alpha, columns, strict);
        }

        public Settings withAlpha(double a) {
            return new Settings(modelIds, atHz, modelOutsideRange, basis, poisson, declaredKind, weighting, bandLowHz, bandHighHz, a, columns, strict);
        }

        /** Headers (as written) mapped to what they hold, e.g. "Gstar_abs_Pa" to "complex_modulus_magnitude [Pa]". */
        public Settings withColumns(Map<String, String> map) {
            return new Settings(modelIds, atHz, modelOutsideRange, basis, poisson, declaredKind, weighting, bandLowHz, bandHighHz, alpha,
                    map, strict);
        }

        /** With strict, the first bad file stops the run; without, bad files are reported and left out. */
        public Settings withStrict(boolean s) {
            return new Settings(modelIds, atHz, modelOutsideRange, basis, poisson, declaredKind, weighting, bandLowHz, bandHighHz, alpha,
                    columns, s);
        }

        /** True when ranking over a band. */
        public boolean hasBand() {
            return !Double.isNaN(bandLowHz);
        }

        /** "1 Hz" or "0.5–5 Hz (geometric mean)". */
        public String rankingFrequency() {
            return hasBand() ? plain(bandLowHz) + "–" + plain(bandHighHz) + " Hz (geometric mean)" : plain(atHz) + " Hz";
        }
    }

    /**
     * A sample: all replicate sweeps that share a name (and temperature).
     *
     * @param name       display name (with the temperature appended when one sample was measured at several)
     * @param group      its group label
     * @param kind       the modulus basis of its sweeps
     * @param temperatureC test temperature [°C] or NaN
     * @param replicates its sweeps
     */
    public record Sample(String name, String group, ModulusKind kind, double temperatureC, List<Sweep> replicates) {
        public Sample {
            replicates = List.copyOf(replicates);
        }

        /** All points of all replicates that can enter a log fit, sorted by frequency. */
        public List<SweepPoint> pooledFittablePoints() {
            return replicates.stream().flatMap(s -> s.fittablePoints().stream())
                    .sorted(Comparator.comparingDouble(SweepPoint::frequencyHz)).toList();
        }

        public double minFrequencyHz() {
            return replicates.stream().mapToDouble(Sweep::minFrequencyHz).min().orElse(Double.NaN);
        }

        public double maxFrequencyHz() {
            return replicates.stream().mapToDouble(Sweep::maxFrequencyHz).max().orElse(Double.NaN);
        }
    }

    /** The fits of every candidate model to one sample, with Akaike weights. */
    public record SampleFits(Sample sample, List<ModelSelection.Ranked> fits) {
        public SampleFits {
            fits = List.copyOf(fits);
        }

        /** The best-supported fit, when any converged. */
        public Optional<FitResult> best() {
            return fits.stream().filter(ModelSelection.Ranked::best).map(ModelSelection.Ranked::fit).findFirst();
        }
    }

    /** Where a ranking value came from. */
    public enum ValueSource {
        MEASURED("measured, interpolated in log–log between neighbouring points"),
        MODEL("best-supported model, outside the measured range"),
        NONE("outside the measured range: not reported");

        private final String description;

        ValueSource(String description) {
            this.description = description;
        }

        public String description() {
            return description;
        }
    }

    /**
     * One row of the damping ranking.
     *
     * @param rank      1 = highest damping; 0 when not ranked
     * @param sample    the sample
     * @param tanDelta  replicate summary of tan δ at the reference frequency (null when none)
     * @param storage   mean M′ at the reference frequency [Pa] (NaN when none)
     * @param loss      mean M″ [Pa]
     * @param source    where the value came from
     * @param note      what the user should know
     * @param values    the replicate tan δ values behind the summary
     * @param letters   letter group ("" when not ranked): samples sharing a letter are not distinguishable
     */
    public record RankRow(int rank, Sample sample, ReplicateSummary tanDelta, double storage, double loss,
                          ValueSource source, String note, double[] values, String letters) {
        public RankRow {
            values = values.clone();
        }

        @Override
        public double[] values() {
            return values.clone();
        }

        RankRow withRankAndLetters(int newRank, String newLetters) {
            return new RankRow(newRank, sample, tanDelta, storage, loss, source, note, values, newLetters);
        }
    }

    private final Settings settings;
    private final List<SweepFile> files;
    private final List<Sample> samples;
    private final List<ReadWarning> warnings;
    private final List<String> notes;

    private Campaign(Settings settings, List<SweepFile> files, List<Sample> samples, List<ReadWarning> warnings,
                     List<String> notes) {
        this.settings = settings;
        this.files = List.copyOf(files);
        this.samples = List.copyOf(samples);
        this.warnings = List.copyOf(warnings);
        this.notes = List.copyOf(notes);
    }

    /**
     * Reads every input (files, or folders read recursively) and groups the sweeps into samples.
     *
     * @throws InputException for the first bad input
     */
    public static Campaign read(List<Path> inputs, Settings settings) {
        SweepReader reader = new SweepReader(settings.declaredKind(), settings.columns());
        List<InputException> skipped = new ArrayList<>();
        List<SweepFile> files = new ArrayList<>();
        List<ReadWarning> warnings = new ArrayList<>();
        List<String> notes = new ArrayList<>();
        Map<String, List<Sweep>> bySample = new LinkedHashMap<>();
        Map<String, Path> replicateSeen = new LinkedHashMap<>();
        List<Path> all = InputCollector.collect(inputs);
        for (Path file : all) {
            SweepFile sf;
            try {
                sf = readOne(file, reader, notes);
            } catch (InputException e) {
                if (settings.strict() || all.size() == 1) {
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
            for (Sweep s : sf.sweeps()) {
                Sweep sweep = s;
                if (settings.basis() != null) {
                    try {
                        BasisConversion.Converted c = BasisConversion.toBasis(s, settings.basis(), settings.poisson());
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
        return assemble(settings, files, bySample, warnings, notes);
    }

    /** Reads one file: a raw-signal table (converted) or a sweep table; null for a calibration table. */
    private static SweepFile readOne(Path file, SweepReader reader, List<String> notes) {
        if (!RawReader.isRaw(file)) {
            return reader.read(file);
        }
        RawReader.Measurement m = RawReader.read(file);
        if (m.isCalibration()) {
            notes.add(file + ": a calibration measurement, used by the raw files that name it, not analysed as a sample");
            return null;
        }
        RawSweeps rs = RawSweeps.convert(m, RawConverter.Settings.defaults(), null);
        notes.add(file + ": raw signals converted to moduli (" + rs.geometry().describe() + ", calibration: "
                + rs.sweep().metadata().get("calibration_used") + ")");
        return new SweepFile(file, m.sha256(), new TableInfo("raw oscillation signals", ',', '.', "UTF-8", 0, List.of(),
                m.metadata()), List.of(rs.sweep()), rs.warnings());
    }

    private static Campaign assemble(Settings settings, List<SweepFile> files, Map<String, List<Sweep>> bySample,
                                     List<ReadWarning> warnings, List<String> notes) {
        Map<String, Long> temperaturesPerName = bySample.values().stream()
                .collect(Collectors.groupingBy(l -> l.get(0).sample(), Collectors.counting()));
        List<Sample> samples = new ArrayList<>();
        for (List<Sweep> reps : bySample.values()) {
            Sweep first = reps.get(0);
            String name = first.sample();
            if (temperaturesPerName.get(name) > 1) {
                name = String.format(Locale.ROOT, "%s @ %s °C", name, plain(first.temperatureC()));
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
        if (kinds > 1 && settings.basis() == null) {
            warnings.add(new ReadWarning(Path.of("(inputs)"), 0, "the inputs mix tensile (E) and shear (G) moduli; "
                    + "tan δ compares fine, but moduli do not: pass --basis tensile or --basis shear (with --poisson) to convert"));
        }
        return new Campaign(settings, files, samples, warnings, notes);
    }

    public Settings settings() {
        return settings;
    }

    /** The same campaign with more samples (e.g. master curves built from temperature series), analysed like the others. */
    public Campaign withSamples(List<Sample> extra) {
        List<Sample> all = new ArrayList<>(samples);
        all.addAll(extra);
        return new Campaign(settings, files, all, warnings, notes);
    }

    public List<SweepFile> files() {
        return files;
    }

    public List<Sample> samples() {
        return samples;
    }

    /** Warnings from reading. */
    public List<ReadWarning> warnings() {
        return warnings;
    }

    /** Conversions that were applied. */
    public List<String> notes() {
        return notes;
    }

    /** Fits every candidate model to every sample (replicates pooled), in parallel over samples. */
    public List<SampleFits> fit() {
        return fit(() -> { });
    }

    /**
     * The same, calling {@code onSampleDone} (from any thread) as each sample is finished, for progress.
     */
    public List<SampleFits> fit(Runnable onSampleDone) {
        ModelFitter fitter = new ModelFitter(settings.weighting());
        List<ViscoelasticModel> models = settings.modelIds().stream()
                .map(id -> ModelCatalogue.byId(id).orElseThrow()).toList();
        return samples.parallelStream().map(s -> {
            List<SweepPoint> pts = s.pooledFittablePoints();
            List<FitResult> fits = new ArrayList<>();
            for (ViscoelasticModel m : models) {
                fits.add(fitter.fit(s.name(), m, pts));
            }
            onSampleDone.run();
            return new SampleFits(s, ModelSelection.rank(fits));
        }).toList();
    }

    /**
     * Ranks samples by mean tan δ at the reference frequency, highest damping first.
     *
     * @param fits the fits (needed only when the model may speak outside the measured range; may be empty)
     */
    public List<RankRow> rank(List<SampleFits> fits) {
        Map<Sample, SampleFits> fitBySample = new java.util.IdentityHashMap<>();
        for (SampleFits f : fits) {
            fitBySample.put(f.sample(), f);
        }
        double at = settings.atHz();
        List<RankRow> rows = new ArrayList<>();
        for (Sample s : samples) {
            List<LossTangentAt.Value> values = new ArrayList<>();
            int outside = 0;
            for (Sweep r : s.replicates()) {
                Optional<LossTangentAt.Value> v = settings.hasBand()
                        ? LossTangentAt.overBand(r.fittablePoints(), settings.bandLowHz(), settings.bandHighHz())
                        : LossTangentAt.interpolate(r.fittablePoints(), at);
                if (v.isPresent()) {
                    values.add(v.get());
                } else {
                    outside++;
                }
            }
            if (!values.isEmpty()) {
                String note = outside == 0 ? "" : String.format(Locale.ROOT,
                        "%d of %d replicates do not cover %s and are left out", outside, s.replicates().size(),
                        settings.rankingFrequency());
                rows.add(row(s, values, ValueSource.MEASURED, note));
                continue;
            }
            String range = String.format(Locale.ROOT, "measured %s–%s Hz", plain(s.minFrequencyHz()), plain(s.maxFrequencyHz()));
            SampleFits sf = fitBySample.get(s);
            Optional<FitResult> best = sf == null ? Optional.empty() : sf.best();
            if (settings.modelOutsideRange() && best.isPresent() && !settings.hasBand()) {
                double[] p = best.get().values();
                ViscoelasticModel m = ModelCatalogue.concrete(best.get().model(), p.length).orElseThrow();
                double[] out = new double[2];
                m.modulus(2 * Math.PI * at, p, out);
                rows.add(row(s, List.of(new LossTangentAt.Value(at, out[0], out[1])), ValueSource.MODEL,
                        range + "; value from the " + m.id() + " model, not from data"));
            } else {
                rows.add(new RankRow(0, s, null, Double.NaN, Double.NaN, ValueSource.NONE,
                        range + "; " + settings.rankingFrequency() + " is outside it, so tan δ is not reported"
                                + (settings.hasBand() ? "" : settings.modelOutsideRange() ? " (no model converged)"
                                        : " (--model-outside-range lets the best model speak)"), new double[0], ""));
            }
        }
        List<RankRow> ranked = new ArrayList<>(rows.stream().filter(r -> r.tanDelta() != null)
                .sorted(Comparator.comparingDouble((RankRow r) -> r.tanDelta().mean()).reversed()).toList());
        DampingComparison.Result cmp = compare(ranked);
        List<RankRow> out = new ArrayList<>();
        for (int i = 0; i < ranked.size(); i++) {
            out.add(ranked.get(i).withRankAndLetters(i + 1, cmp.letters().get(i)));
        }
        rows.stream().filter(r -> r.tanDelta() == null).forEach(out::add);
        return out;
    }

    /**
     * Which differences between the ranked samples are supported: pairwise Welch tests with Holm's
     * adjustment, letter groups, and group tests when samples carry groups.
     *
     * @param ranking the rows of {@link #rank}; those without a value are left out
     */
    public DampingComparison.Result compare(List<RankRow> ranking) {
        List<RankRow> ranked = ranking.stream().filter(r -> r.tanDelta() != null).toList();
        return DampingComparison.compare(ranked.stream().map(r -> r.sample().name()).toList(),
                ranked.stream().map(r -> r.sample().group()).toList(),
                ranked.stream().map(RankRow::values).toList(), settings.alpha());
    }

    private static RankRow row(Sample s, List<LossTangentAt.Value> values, ValueSource source, String note) {
        double[] tan = values.stream().mapToDouble(LossTangentAt.Value::lossTangent).toArray();
        double storage = values.stream().mapToDouble(LossTangentAt.Value::storage).average().orElse(Double.NaN);
        double loss = values.stream().mapToDouble(LossTangentAt.Value::loss).average().orElse(Double.NaN);
        return new RankRow(0, s, ReplicateSummary.of(tan), storage, loss, source, note, tan, "");
    }

    /** Each sample's best-supported curve (null when no model converged), in sample order. */
    public List<FittedCurve> curves(List<SampleFits> fits) {
        List<FittedCurve> out = new ArrayList<>();
        for (SampleFits sf : fits) {
            Sample s = sf.sample();
            out.add(sf.best().flatMap(b -> FittedCurve.of(b, s.minFrequencyHz(), s.maxFrequencyHz(), s.temperatureC(), s.kind()))
                    .orElse(null));
        }
        return out;
    }

    /** Every sample's ranked matches against the candidates, in sample order (samples in parallel). */
    public List<List<Matcher.Match>> matchAll(List<SampleFits> fits, List<Matcher.Candidate> candidates, ReferenceDistance rd) {
        List<FittedCurve> curves = curves(fits);
        return java.util.stream.IntStream.range(0, fits.size()).parallel()
                .mapToObj(i -> Matcher.rank(fits.get(i).sample().name(), curves.get(i), candidates, rd)).toList();
    }

    /** The samples as candidates of a mimic search (class = group). */
    public List<Matcher.Candidate> asCandidates(List<SampleFits> fits) {
        List<FittedCurve> curves = curves(fits);
        List<Matcher.Candidate> out = new ArrayList<>();
        for (int i = 0; i < fits.size(); i++) {
            Sample s = fits.get(i).sample();
            out.add(new Matcher.Candidate(s.name(), s.group(), curves.get(i)));
        }
        return out;
    }

    /**
     * The references of a library as candidates: each put on the requested basis (when one is set)
     * and fitted with the candidate models.
     *
     * @param clazz only references of this class, or null for all
     */
    public List<Matcher.Candidate> referenceCandidates(ReferenceLibrary library, String clazz) {
        ModelFitter fitter = new ModelFitter(settings.weighting());
        List<ViscoelasticModel> models = settings.modelIds().stream().map(id -> ModelCatalogue.byId(id).orElseThrow()).toList();
        return library.entries().parallelStream()
                .filter(e -> clazz == null || e.clazz().equalsIgnoreCase(clazz))
                .map(e -> {
                    Sweep sw = e.sweep();
                    if (settings.basis() != null) {
                        try {
                            sw = BasisConversion.toBasis(sw, settings.basis(), settings.poisson()).sweep();
                        } catch (IllegalArgumentException ex) {
                            throw new InputException(e.file(), 0, 0, ex.getMessage());
                        }
                    }
                    return new Matcher.Candidate(e.name(), e.clazz(),
                            FittedCurve.fit(e.name(), sw.fittablePoints(), models, fitter, sw.temperatureC(), sw.kind()).orElse(null));
                }).toList();
    }

    /** A number without trailing zeros, e.g. 1, 0.5, 23.5 ({@link org.viscarta.sweep.Numbers#plain}). */
    public static String plain(double v) {
        return org.viscarta.sweep.Numbers.plain(v);
    }
}
