package org.viscarta.analysis;

import java.util.ArrayList;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.stream.IntStream;
import org.viscarta.compare.FittedCurve;
import org.viscarta.compare.Matcher;
import org.viscarta.compare.ReferenceDistance;
import org.viscarta.fit.FitResult;
import org.viscarta.fit.ModelFitter;
import org.viscarta.fit.ModelSelection;
import org.viscarta.fit.TimeDomain;
import org.viscarta.io.InputException;
import org.viscarta.io.UsageException;
import org.viscarta.library.ReferenceLibrary;
import org.viscarta.model.ModelCatalogue;
import org.viscarta.model.ViscoelasticModel;
import org.viscarta.quality.Assessment;
import org.viscarta.quality.SweepChecks;
import org.viscarta.sweep.BasisConversion;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;
import org.viscarta.temperature.ShiftAnalysis;
import org.viscarta.temperature.TemperatureSeries;

/**
 * The one analysis behind every surface: read, convert, build master curves, fit, rank with
 * statistics, match against references and rank mimics — each once — and return the result.
 */
public final class Analysis {

    private Analysis() {
    }

    /** Runs a request without progress reports. */
    public static AnalysisResult run(AnalysisRequest request) {
        return run(request, Progress.NONE);
    }

    /**
     * Runs a request.
     *
     * @throws InputException   for a bad input file or reference library
     * @throws UsageException   when the request cannot be carried out as asked
     */
    public static AnalysisResult run(AnalysisRequest request, Progress progress) {
        Optional<ReferenceLibrary> library = request.library().map(ReferenceLibrary::open);
        progress.stage(Progress.Stage.READING, 0);
        Inputs inputs = Inputs.read(request.inputs(), request.reading());
        Assessment quality = Assessment.none();
        List<SweepChecks.Check> dropped = List.of();
        if (request.parts().contains(AnalysisRequest.Part.QUALITY) || request.quality().dropOutliers()) {
            progress.stage(Progress.Stage.CHECKING, 0);
            quality = assess(inputs, request.quality());
            if (request.quality().dropOutliers()) {
                dropped = quality.outliers();
                inputs = inputs.withoutReplicates(dropped);
            }
        }
        if (inputs.samples().isEmpty() && inputs.timeTests().isEmpty() && !inputs.ramps().isEmpty() && inputs.positioned().isEmpty()
                && !request.parts().contains(AnalysisRequest.Part.TRANSITIONS)) {
            throw new UsageException("the inputs hold temperature ramps only (" + inputs.ramps().size() + " ramps, no frequency "
                    + "sweep): 'viscarta transition' finds their glass transitions, and 'viscarta report' includes them");
        }
        org.viscarta.temperature.Transitions transitions = org.viscarta.temperature.Transitions.none();
        if (request.parts().contains(AnalysisRequest.Part.TRANSITIONS) && !inputs.ramps().isEmpty()) {
            progress.stage(Progress.Stage.TRANSITIONS, 0);
            transitions = org.viscarta.temperature.Transitions.of(inputs.ramps(), request.alpha());
        }
        List<TemperatureSeries> series = List.of();
        if (request.masterCurves().isPresent()) {
            progress.stage(Progress.Stage.MASTER_CURVES, 0);
            MasterCurves mc = request.masterCurves().get();
            series = TemperatureSeries.find(inputs.samples().stream().flatMap(s -> s.replicates().stream()).toList(),
                    mc.preferredReferenceC(), mc.analysis());
            List<Sample> masters = new ArrayList<>();
            for (TemperatureSeries ts : series) {
                Sweep m = ShiftAnalysis.masterSweep(ts.result(), ts.sweeps().get(0), ts.masterName());
                masters.add(new Sample(ts.masterName(), m.group(), m.kind(), m.temperatureC(), List.of(m)));
            }
            inputs = inputs.withSamples(masters);
        }
        List<SampleAnalysis> samples = fitAll(inputs.samples(), request, progress);
        List<TimeTests.Derived> timeTests = List.of();
        if (!inputs.timeTests().isEmpty() && (request.needsFits() || request.parts().contains(AnalysisRequest.Part.RANKING))) {
            progress.stage(Progress.Stage.FITTING, 0);
            List<String> notes = java.util.Collections.synchronizedList(new ArrayList<>());
            timeTests = TimeTests.of(inputs.timeTests(), models(request), new ModelFitter(request.weighting()), request.reading(),
                    notes);
            List<SampleAnalysis> all = new ArrayList<>(samples);
            timeTests.forEach(d -> all.add(d.analysis()));
            samples = all;
            inputs = inputs.withSamples(timeTests.stream().map(TimeTests.Derived::sample).toList(), notes);
        }
        if (request.parts().contains(AnalysisRequest.Part.SPECTRA)) {
            progress.stage(Progress.Stage.SPECTRA, 0);
            samples = samples.parallelStream().map(sa -> {
                try {
                    return sa.withSpectrum(Optional.of(org.viscarta.spectrum.RelaxationSpectrum.of(sa.sample().pooledFittablePoints(),
                            org.viscarta.spectrum.RelaxationSpectrum.Kind.RELAXATION)));
                } catch (IllegalArgumentException tooFewPoints) {
                    return sa;
                }
            }).toList();
        }
        Optional<Ranking> ranking = Optional.empty();
        if (request.parts().contains(AnalysisRequest.Part.RANKING)) {
            progress.stage(Progress.Stage.RANKING, 0);
            Map<Sample, Optional<FittedCurve>> curveOf = new IdentityHashMap<>();
            samples.forEach(sa -> curveOf.put(sa.sample(), sa.curve()));
            ranking = Optional.of(Ranking.of(inputs.samples(), seriesMembers(inputs.samples()),
                    s -> s.rankingSubject(curveOf.get(s)), request.rankingPoint(), request.outsideRange(), request.alpha(),
                    request.sets().temperatureToleranceC(), request.sets().withinGroups()));
        }
        ReferenceDistance distance = request.matching().distance();
        List<Matcher.Candidate> references = List.of();
        if (request.parts().contains(AnalysisRequest.Part.MATCHES)) {
            progress.stage(Progress.Stage.MATCHING, samples.size());
            List<Matcher.Candidate> refs = referenceCandidates(library.orElseThrow(), request);
            references = refs;
            List<SampleAnalysis> fitted = samples;
            samples = IntStream.range(0, fitted.size()).parallel().mapToObj(i -> {
                SampleAnalysis sa = fitted.get(i);
                List<Matcher.Match> m = Matcher.rank(sa.sample().name(), sa.curve().orElse(null), refs, distance,
                        request.uncertainMatches());
                progress.step();
                return sa.withMatches(m);
            }).toList();
        }
        Optional<AnalysisResult.Mimic> mimic = mimic(request, samples, distance);
        Maps maps = Maps.none();
        if (request.parts().contains(AnalysisRequest.Part.MAPS) && !inputs.positioned().isEmpty()) {
            progress.stage(Progress.Stage.MAPS, 0);
            double hz = request.rankingPoint() instanceof org.viscarta.compare.RankingPoint.At at ? at.hz() : 1.0;
            maps = Maps.of(inputs.positioned(), org.viscarta.map.MapSetup.Given.none(), hz, request.alpha(), List.of(),
                    request.library().orElse(null), request.reading());
        }
        progress.stage(Progress.Stage.DONE, 0);
        return new AnalysisResult(request, inputs, series, samples, ranking, library, references, mimic, quality, dropped,
                transitions, timeTests, maps);
    }

    /** Every quality check of the samples as read (by display name) and of the amplitude sweeps. */
    private static Assessment assess(Inputs inputs, QualitySettings settings) {
        Map<String, List<Sweep>> bySample = new java.util.LinkedHashMap<>();
        for (Sample s : inputs.samples()) {
            bySample.put(s.name(), s.replicates());
        }
        return Assessment.of(bySample, inputs.amplitudeSweeps(), settings.linearDeparture());
    }

    /**
     * The samples that are one temperature of a temperature series: a sample name measured at
     * {@link TemperatureSeries#MIN_TEMPERATURES} or more temperatures.
     */
    private static java.util.Set<Sample> seriesMembers(List<Sample> samples) {
        java.util.Set<String> series = TemperatureSeries.names(samples.stream().flatMap(s -> s.replicates().stream()).toList());
        java.util.Set<Sample> out = java.util.Collections.newSetFromMap(new IdentityHashMap<>());
        for (Sample s : samples) {
            if (series.contains(s.replicates().get(0).sample())) {
                out.add(s);
            }
        }
        return out;
    }

    /** Every candidate model fitted to every sample (replicates pooled), samples in parallel; empty fits when not needed. */
    private static List<SampleAnalysis> fitAll(List<Sample> samples, AnalysisRequest request, Progress progress) {
        if (!request.needsFits()) {
            return samples.stream().map(s -> new SampleAnalysis(s, List.of(), Optional.empty(), List.of(), List.of())).toList();
        }
        progress.stage(Progress.Stage.FITTING, samples.size());
        ModelFitter fitter = new ModelFitter(request.weighting());
        List<ViscoelasticModel> models = models(request);
        double[] times = request.timeGrid().stream().mapToDouble(Double::doubleValue).toArray();
        return samples.parallelStream().map(s -> {
            SampleAnalysis sa = fitted(s, models, fitter, times);
            progress.step();
            return sa;
        }).toList();
    }

    /** Every model fitted to the sample's pooled replicates, ranked by AICc, and the curve of the best-supported one. */
    private static SampleAnalysis fitted(Sample s, List<ViscoelasticModel> models, ModelFitter fitter, double[] times) {
        List<SweepPoint> points = s.pooledFittablePoints();
        List<FitResult> fits = new ArrayList<>();
        for (ViscoelasticModel m : models) {
            fits.add(fitter.fit(s.name(), m, points));
        }
        List<ModelSelection.Ranked> ranked = ModelSelection.rank(fits);
        Optional<FittedCurve> curve = ranked.stream().filter(ModelSelection.Ranked::best).findFirst()
                .flatMap(b -> FittedCurve.of(b.fit(), s.minFrequencyHz(), s.maxFrequencyHz(), s.temperatureC(), s.kind()));
        List<TimeDomain.Point> timeDomain = new ArrayList<>();
        if (times.length > 0) {
            for (ModelSelection.Ranked rk : ranked) {
                timeDomain.addAll(TimeDomain.evaluate(rk.fit(), times));
            }
        }
        return new SampleAnalysis(s, ranked, curve, List.of(), timeDomain);
    }

    private static List<ViscoelasticModel> models(AnalysisRequest request) {
        return request.modelIds().stream().map(id -> ModelCatalogue.byId(id).orElseThrow()).toList();
    }

    /**
     * The references of a library as candidates: each put on the requested basis (when one is set)
     * and fitted with the candidate models.
     */
    private static List<Matcher.Candidate> referenceCandidates(ReferenceLibrary library, AnalysisRequest request) {
        return candidates(library, models(request), new ModelFitter(request.weighting()), request.reading(),
                request.matching().referenceClass());
    }

    /** The references of a library, each on the reading's basis and fitted with these models. */
    static List<Matcher.Candidate> candidates(ReferenceLibrary library, List<ViscoelasticModel> models, ModelFitter fitter,
                                              ReadSettings reading, Optional<String> clazz) {
        List<Matcher.Candidate> out = library.entries().parallelStream()
                .filter(e -> clazz.isEmpty() || e.clazz().equalsIgnoreCase(clazz.get()))
                .map(e -> {
                    Sweep sw = e.sweep();
                    if (reading.basis().isPresent()) {
                        try {
                            sw = BasisConversion.toBasis(sw, reading.basis().get(), reading.poisson()).sweep();
                        } catch (IllegalArgumentException ex) {
                            throw new InputException(e.file(), 0, 0, ex.getMessage());
                        }
                    }
                    return new Matcher.Candidate(e.name(), e.clazz(),
                            FittedCurve.fit(e.name(), sw.fittablePoints(), models, fitter, sw.temperatureC(), sw.kind()).orElse(null));
                }).toList();
        if (out.isEmpty()) {
            throw new UsageException("the library holds no reference" + clazz.map(c -> " of class '" + c + "'").orElse(""));
        }
        return out;
    }

    private static Optional<AnalysisResult.Mimic> mimic(AnalysisRequest request, List<SampleAnalysis> samples,
                                                        ReferenceDistance distance) {
        Target target = request.target();
        if (target instanceof Target.AmongInputs among) {
            SampleAnalysis t = null;
            for (SampleAnalysis sa : samples) {
                if (sa.sample().name().equals(among.sample())) {
                    t = sa;
                }
            }
            if (t == null) {
                throw new UsageException("--target '" + among.sample() + "' is not among the samples read");
            }
            String name = t.sample().name();
            List<Matcher.Candidate> others = candidates(samples, name);
            return Optional.of(new AnalysisResult.Mimic(name, Matcher.rank(name, t.curve().orElse(null), others, distance),
                    Optional.empty()));
        }
        if (target instanceof Target.FromFile fromFile) {
            Inputs read = Inputs.read(List.of(fromFile.file()), request.reading());
            if (read.samples().size() != 1) {
                throw new UsageException(fromFile.file() + " holds " + read.samples().size() + " samples; the target must be one");
            }
            SampleAnalysis t = fitted(read.samples().get(0), models(request), new ModelFitter(request.weighting()), new double[0]);
            String name = t.sample().name();
            return Optional.of(new AnalysisResult.Mimic(name, Matcher.rank(name, t.curve().orElse(null),
                    candidates(samples, name), distance), Optional.of(read)));
        }
        return Optional.empty();
    }

    /** The samples other than the target as mimic candidates (class = group). */
    private static List<Matcher.Candidate> candidates(List<SampleAnalysis> samples, String targetName) {
        return samples.stream().filter(sa -> !sa.sample().name().equals(targetName))
                .map(sa -> new Matcher.Candidate(sa.sample().name(), sa.sample().group(), sa.curve().orElse(null))).toList();
    }
}
