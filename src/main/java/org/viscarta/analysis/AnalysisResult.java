package org.viscarta.analysis;

import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.viscarta.compare.DampingRanking;
import org.viscarta.compare.Matcher;
import org.viscarta.library.ReferenceLibrary;
import org.viscarta.quality.Assessment;
import org.viscarta.quality.SweepChecks;
import org.viscarta.temperature.TemperatureSeries;

/**
 * What one {@link AnalysisRequest} produced, each part computed once: every surface (terminal,
 * CSV, workbook, page, figures) renders from here and computes nothing of its own.
 */
public final class AnalysisResult {

    /**
     * The mimic ranking.
     *
     * @param target      the target's name
     * @param matches     every candidate by increasing distance, then those not comparable
     * @param targetInputs what was read for a target given as its own file (empty when it was one of the samples)
     */
    public record Mimic(String target, List<Matcher.Match> matches, Optional<Inputs> targetInputs) {
        public Mimic {
            matches = List.copyOf(matches);
        }
    }

    private final AnalysisRequest request;
    private final Inputs inputs;
    private final List<TemperatureSeries> series;
    private final List<SampleAnalysis> samples;
    private final Optional<Ranking> ranking;
    private final Optional<ReferenceLibrary> library;
    private final List<Matcher.Candidate> references;
    private final Optional<Mimic> mimic;
    private final Map<Sample, DampingRanking.Row<Sample>> rankOf = new IdentityHashMap<>();
    private final Map<Sample, String> setOf;
    private final Assessment quality;
    private final List<SweepChecks.Check> dropped;
    private final org.viscarta.temperature.Transitions transitions;
    private final List<TimeTests.Derived> timeTests;
    private final Maps maps;

    /** The maps of the specimens measured at positions (none unless asked for and such sweeps were read). */
    public Maps maps() {
        return maps;
    }

    /** The samples computed from stress-relaxation and creep tests, with their tests and fits (empty when none were read). */
    public List<TimeTests.Derived> timeTests() {
        return timeTests;
    }

    /** The time-domain origin of a sample computed from tests, or empty for a measured sample. */
    public Optional<TimeTests.Derived> timeTestOf(Sample s) {
        return timeTests.stream().filter(d -> d.sample() == s).findFirst();
    }

    AnalysisResult(AnalysisRequest request, Inputs inputs, List<TemperatureSeries> series, List<SampleAnalysis> samples,
                   Optional<Ranking> ranking, Optional<ReferenceLibrary> library,
                   List<Matcher.Candidate> references, Optional<Mimic> mimic, Assessment quality,
                   List<SweepChecks.Check> dropped, org.viscarta.temperature.Transitions transitions,
                   List<TimeTests.Derived> timeTests, Maps maps) {
        this.maps = maps;
        this.transitions = transitions;
        this.timeTests = List.copyOf(timeTests);
        this.quality = quality;
        this.dropped = List.copyOf(dropped);
        this.request = request;
        this.inputs = inputs;
        this.series = List.copyOf(series);
        this.samples = List.copyOf(samples);
        this.ranking = ranking;
        this.library = library;
        this.references = List.copyOf(references);
        this.mimic = mimic;
        ranking.ifPresent(r -> r.rows().forEach(row -> rankOf.put(row.subject(), row)));
        this.setOf = ranking.map(Ranking::setLabels).orElse(Map.of());
    }

    /** The glass transitions of the temperature ramps (none unless asked for and ramps were read). */
    public org.viscarta.temperature.Transitions transitions() {
        return transitions;
    }

    /** The quality checks (none unless asked for, or needed to leave outliers out). */
    public Assessment quality() {
        return quality;
    }

    /** The replicates left out as outliers, on request (empty otherwise). */
    public List<SweepChecks.Check> droppedReplicates() {
        return dropped;
    }

    /** What was asked. */
    public AnalysisRequest request() {
        return request;
    }

    /** The files, samples (master curves included), warnings and conversions. */
    public Inputs inputs() {
        return inputs;
    }

    /** Samples measured at several temperatures, superposed (empty unless master curves were asked for). */
    public List<TemperatureSeries> series() {
        return series;
    }

    /** Each sample with its fits, curve and matches, in reading order (master curves last). */
    public List<SampleAnalysis> samples() {
        return samples;
    }

    /** The damping ranking within comparable sets, when it was asked for. */
    public Optional<Ranking> ranking() {
        return ranking;
    }

    /** The ranking's rows, set after set, then those not ranked (empty when not asked for). */
    public List<DampingRanking.Row<Sample>> rankingRows() {
        return ranking.map(Ranking::rows).orElse(List.of());
    }

    /** The comparable set a sample was ranked in ("" when it was not ranked). */
    public String setOf(Sample s) {
        return setOf.getOrDefault(s, "");
    }

    /** The sample's row in the ranking, when ranked. */
    public Optional<DampingRanking.Row<Sample>> rankOf(Sample s) {
        return Optional.ofNullable(rankOf.get(s));
    }

    /** The reference library, when one was given. */
    public Optional<ReferenceLibrary> library() {
        return library;
    }

    /** The library's references with their fitted curves (empty without matching). */
    public List<Matcher.Candidate> references() {
        return references;
    }

    /** The mimic ranking, when a target was given. */
    public Optional<Mimic> mimic() {
        return mimic;
    }
}
