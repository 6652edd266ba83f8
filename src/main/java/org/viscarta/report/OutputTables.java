package org.viscarta.report;

import org.viscarta.temperature.ActivationEnergy;
import org.viscarta.temperature.GlassTransition;
import org.viscarta.temperature.Transitions;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.AnalysisResult;
import org.viscarta.analysis.Sample;
import org.viscarta.analysis.SampleAnalysis;
import org.viscarta.analysis.Statements;
import org.viscarta.compare.DampingRanking;
import org.viscarta.compare.Matcher;
import org.viscarta.compare.ReplicateSummary;
import org.viscarta.fit.DerivedEstimate;
import org.viscarta.fit.FitResult;
import org.viscarta.fit.ModelSelection;
import org.viscarta.fit.ParameterEstimate;
import org.viscarta.fit.TimeDomain;
import org.viscarta.library.ReferenceLibrary;
import org.viscarta.quality.SweepChecks;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;
import org.viscarta.table.Medium;
import org.viscarta.table.Style;
import org.viscarta.table.Table;

/**
 * Every output table, declared once: its columns with name, unit, number style, width, and how
 * each value is taken from the result. The terminal and CSV of the verbs, the workbook sheets and
 * the page all draw these; to add a column, add one line here.
 */
public final class OutputTables {

    private OutputTables() {
    }

    /** One parameter of one model's fit to one sample. */
    public record FitRow(ModelSelection.Ranked ranked, ParameterEstimate parameter) {
        /** The fit's failure, or the family size chosen and the parameter's flag. */
        public String note() {
            FitResult f = ranked.fit();
            if (!f.converged()) {
                return f.message();
            }
            String a = f.variant();
            String b = parameter.note();
            return a.isEmpty() ? b : b.isEmpty() ? a : a + "; " + b;
        }
    }

    /** One derived quantity of one model's fit. */
    public record DerivedRow(ModelSelection.Ranked ranked, DerivedEstimate quantity) {
    }

    /** The correlation of two parameters of a best-supported fit. */
    public record CorrelationRow(FitResult fit, String parameter, String other, double correlation) {
    }

    /** One measured point as read. */
    /** One time of one sample's relaxation spectrum (sheet Spectra). */
    public record SpectrumRow(String sample, double tau, double h, double low, double high) {
    }

    public record DataRow(Sample sample, Sweep sweep, SweepPoint point) {
    }

    private static final java.util.Set<Medium> NOT_CSV = Medium.allBut(Medium.CSV);
    private static final java.util.Set<Medium> SHEET = java.util.EnumSet.of(Medium.SHEET);
    private static final java.util.Set<Medium> TERMINAL = java.util.EnumSet.of(Medium.TERMINAL);
    private static final java.util.Set<Medium> NOT_HTML = Medium.allBut(Medium.HTML);
    private static final java.util.Set<Medium> NOT_TERMINAL = Medium.allBut(Medium.TERMINAL);
    private static final java.util.Set<Medium> SHEET_CSV = java.util.EnumSet.of(Medium.SHEET, Medium.CSV);

    /** The damping ranking ({@code rank}'s terminal and CSV, sheet Damping ranking, the page). */
    public static Table<DampingRanking.Row<Sample>> ranking(AnalysisResult result) {
        double at = result.request().rankingPoint().representativeHz();
        return Table.<DampingRanking.Row<Sample>>named("Damping ranking")
                .column("rank", "rank", "", Style.INTEGER, 7, r -> r.rank() == 0 ? null : r.rank())
                .column("sample", "sample", "", Style.TEXT, 28, DampingRanking.Row::name)
                .column("group", "group", "", Style.TEXT, 16, DampingRanking.Row::group)
                .column("n_replicates", "replicates", "", Style.INTEGER, 12, DampingRanking.Row::n)
                .column("frequency_hz", "frequency", "Hz", Style.FREQUENCY, 14, r -> at, SHEET_CSV)
                .column("tan_delta", "tan δ mean", "–", Style.DECIMAL4, 14, r -> mean(r.tanDelta())).colourScale()
                .column("tan_delta_sd", "tan δ SD", "–", Style.DECIMAL4, 12, r -> r.tanDelta() == null ? null : r.tanDelta().sd(),
                        SHEET)
                .column("ci95_low", "tan δ 95 % CI low", "–", Style.DECIMAL4, 14, r -> ciLow(r.tanDelta()), NOT_TERMINAL)
                .column("ci95_high", "tan δ 95 % CI high", "–", Style.DECIMAL4, 14, r -> ciHigh(r.tanDelta()), NOT_TERMINAL)
                .column("ci95", "95 % CI", "", Style.TEXT, 18, r -> interval(r.tanDelta()), TERMINAL)
                .column("storage_modulus_pa", "storage modulus mean", "Pa", Style.SCIENTIFIC, 18, DampingRanking.Row::storage,
                        NOT_TERMINAL)
                .column("loss_modulus_pa", "loss modulus mean", "Pa", Style.SCIENTIFIC, 18, DampingRanking.Row::loss, NOT_TERMINAL)
                .column("value_from", "value from", "", Style.TEXT, 30, r -> r.source().description(), SHEET)
                .column("letters", "letters", "", Style.TEXT, 10, DampingRanking.Row::letters)
                .column("quality", "quality checks", "", Style.TEXT, 30, r -> result.quality().marker(r.subject().name()),
                        withQuality(result, java.util.EnumSet.of(Medium.SHEET, Medium.HTML)))
                .column("set", "comparable set", "", Style.TEXT, 22, r -> result.setOf(r.subject()), NOT_TERMINAL)
                .column("temperature_c", "temperature", "°C", Style.DECIMAL2, 12, r -> r.subject().temperatureC(), SHEET_CSV)
                .column("note", "note", "", Style.TEXT, 60, DampingRanking.Row::note, java.util.EnumSet.of(Medium.SHEET, Medium.HTML))
                .build();
    }

    /** The media a quality column shows in: these when the checks ran, none otherwise. */
    private static java.util.Set<Medium> withQuality(AnalysisResult result, java.util.Set<Medium> media) {
        return result.request().parts().contains(AnalysisRequest.Part.QUALITY) ? media : java.util.EnumSet.noneOf(Medium.class);
    }

    /** "[0.46, 0.57]", or "–" without an interval. */
    private static String interval(ReplicateSummary t) {
        if (t == null || !Double.isFinite(t.ci95Low())) {
            return "–";
        }
        return String.format(java.util.Locale.ROOT, "[%.4f, %.4f]", t.ci95Low(), t.ci95High());
    }

    /** One row per sample (sheet Summary, the page). */
    public static Table<SampleAnalysis> summary(AnalysisResult result) {
        AnalysisRequest request = result.request();
        Table.Builder<SampleAnalysis> b = Table.<SampleAnalysis>named("Summary")
                .column("sample", "sample", "", Style.TEXT, 28, sa -> sa.sample().name())
                .column("group", "group", "", Style.TEXT, 16, sa -> sa.sample().group());
        for (String a : attributeNames(result.samples().stream().map(sa -> sa.sample().attributes()).toList())) {
            b.column(attributeId(a), a, "", Style.TEXT, 14, sa -> sa.sample().attributes().getOrDefault(a, ""), SHEET_CSV);
        }
        return b.column("basis", "modulus basis", "", Style.TEXT, 12, sa -> sa.sample().kind() + " (" + sa.sample().kind().letter() + ")")
                .column("temperature_c", "temperature", "°C", Style.DECIMAL2, 14, sa -> sa.sample().temperatureC())
                .column("n_replicates", "replicates", "", Style.INTEGER, 11, sa -> sa.sample().replicates().size())
                .column("quality", "quality checks", "", Style.TEXT, 30, sa -> result.quality().marker(sa.sample().name()),
                        withQuality(result, Medium.allBut()))
                .column("points", "points", "", Style.INTEGER, 9, sa -> sa.sample().pointCount(), SHEET_CSV)
                .column("frequency_low_hz", "lowest frequency", "Hz", Style.FREQUENCY, 13, sa -> sa.sample().minFrequencyHz(),
                        NOT_HTML)
                .column("frequency_high_hz", "highest frequency", "Hz", Style.FREQUENCY, 13, sa -> sa.sample().maxFrequencyHz(),
                        NOT_HTML)
                .column("frequency_range", "frequency range", "Hz", Style.TEXT, 16, sa -> org.viscarta.sweep.Numbers.readable(
                        sa.sample().minFrequencyHz()) + "–" + org.viscarta.sweep.Numbers.readable(sa.sample().maxFrequencyHz()),
                        java.util.EnumSet.of(Medium.HTML))
                .column("tan_delta", Statements.rankedBy(request), "–", Style.DECIMAL4, 14,
                        sa -> result.rankOf(sa.sample()).map(r -> mean(r.tanDelta())).orElse(null)).colourScale()
                .column("ci95_low", "tan δ 95 % CI low", "–", Style.DECIMAL4, 14,
                        sa -> result.rankOf(sa.sample()).map(r -> ciLow(r.tanDelta())).orElse(null), SHEET_CSV)
                .column("ci95_high", "tan δ 95 % CI high", "–", Style.DECIMAL4, 14,
                        sa -> result.rankOf(sa.sample()).map(r -> ciHigh(r.tanDelta())).orElse(null), SHEET_CSV)
                .column("letters", "damping letter group", "", Style.TEXT, 14,
                        sa -> result.rankOf(sa.sample()).map(DampingRanking.Row::letters).orElse(""))
                .column("set", "comparable set", "", Style.TEXT, 22, sa -> result.setOf(sa.sample()), SHEET_CSV)
                .column("best_model", "best-supported model", "", Style.TEXT, 22,
                        sa -> sa.best().map(FitResult::model).orElse("none converged"))
                .column("akaike_weight", "Akaike weight of best", "–", Style.DECIMAL4, 14,
                        sa -> sa.bestRanked().map(ModelSelection.Ranked::weight).orElse(null))
                .column("rms_misfit", Statements.rmsLabel(request), "–", Style.DECIMAL4, 14,
                        sa -> sa.best().map(FitResult::rmsLogResidual).orElse(null), SHEET_CSV)
                .column("also_supported", "also supported (ΔAICc < 2)", "", Style.TEXT, 30,
                        sa -> String.join(", ", sa.alsoSupported()), SHEET_CSV)
                .column("closest_reference", "closest reference", "", Style.TEXT, 24,
                        sa -> sa.closest().map(Matcher.Match::reference).orElse(""), SHEET_CSV)
                .column("distance", "distance to it", "decades", Style.DECIMAL4, 14,
                        sa -> sa.closest().map(m -> m.result().distance()).orElse(null), SHEET_CSV)
                .column("notes", "notes", "", Style.TEXT, 60, sa -> summaryNotes(result, sa))
                .build();
    }

    /** The attribute names of these samples or sweeps, in the order first met. */
    static List<String> attributeNames(List<Map<String, String>> attributes) {
        java.util.LinkedHashSet<String> names = new java.util.LinkedHashSet<>();
        attributes.forEach(m -> names.addAll(m.keySet()));
        return List.copyOf(names);
    }

    /** An attribute's machine name: "attribute_" and its header in lower case, other characters as underscores. */
    static String attributeId(String header) {
        return "attribute_" + header.toLowerCase(java.util.Locale.ROOT).replaceAll("[^a-z0-9]+", "_").replaceAll("^_|_$", "");
    }

    private static String summaryNotes(AnalysisResult result, SampleAnalysis sa) {
        List<String> notes = new ArrayList<>();
        List<String> dropped = result.droppedReplicates().stream().filter(c -> c.sample().equals(sa.sample().name()))
                .map(org.viscarta.quality.SweepChecks.Check::replicate).toList();
        if (!dropped.isEmpty()) {
            notes.add("replicate" + (dropped.size() == 1 ? " " : "s ") + String.join(", ", dropped) + " left out as an outlier");
        }
        result.timeTestOf(sa.sample()).ifPresent(d -> notes.add("computed from " + d.tests().size() + " " + d.type().test()
                + " test(s): E′ and E″ of each replicate's fitted " + d.analysis().best().map(org.viscarta.fit.FitResult::model)
                .orElse("model") + ", not measured (sheet Time-domain tests)"));
        result.rankOf(sa.sample()).filter(r -> !r.note().isEmpty()).ifPresent(r -> notes.add(r.note()));
        if (result.request().needsFits()) {
            sa.best().ifPresentOrElse(best -> best.parameters().stream().filter(ParameterEstimate::undetermined)
                    .forEach(p -> notes.add(best.model() + " " + p.name() + ": " + p.note())), () -> notes.add("no model converged"));
        }
        return String.join("; ", notes);
    }

    /**
     * Samples against references, or candidates against a target ({@code match}'s CSV, sheets
     * Reference matches and Mimic ranking).
     */
    public static Table<Matcher.Match> matches(boolean mimic) {
        return Table.<Matcher.Match>named(mimic ? "Mimic ranking" : "Reference matches")
                .column("sample", mimic ? "target" : "sample", "", Style.TEXT, mimic ? 24 : 28, Matcher.Match::sample, NOT_TERMINAL)
                .column("rank", "rank", "", Style.INTEGER, 6, m -> m.rank() == 0 ? null : m.rank())
                .column("reference", mimic ? "candidate" : "reference", "", Style.TEXT, 24, Matcher.Match::reference)
                .column("class", mimic ? "group" : "class", "", Style.TEXT, mimic ? 14 : 12, Matcher.Match::clazz, NOT_CSV)
                .column("distance", "distance", "decades", Style.DECIMAL4, 12, m -> m.result().distance())
                .column("distance_uncertainty", "distance standard error", "decades", Style.DECIMAL4, 14, m -> m.result().uncertainty())
                .column("band_low_hz", "band low", "Hz", Style.FREQUENCY, 12, m -> m.result().bandLowHz(), NOT_TERMINAL)
                .column("band_high_hz", "band high", "Hz", Style.FREQUENCY, 12, m -> m.result().bandHighHz(), NOT_TERMINAL)
                .column("comparable", "comparable", "", Style.TEXT, 11, m -> m.result().comparable(), NOT_TERMINAL)
                .column("departure_hz", "largest departure at", "Hz", Style.FREQUENCY, 14, m -> m.result().departureHz(),
                        java.util.EnumSet.of(Medium.SHEET, Medium.HTML))
                .column("departure_decades", "largest departure", mimic ? "decades, target − candidate" : "decades", Style.DECIMAL4,
                        mimic ? 16 : 14, m -> m.result().departure(), java.util.EnumSet.of(Medium.SHEET, Medium.HTML))
                .column("note", "note", "", Style.TEXT, 50, m -> m.result().note(), NOT_TERMINAL)
                .csvOrder("sample", "reference", "rank", "distance", "distance_uncertainty", "band_low_hz", "band_high_hz",
                        "comparable", "note")
                .build();
    }

    /** Every parameter of every model fitted to every sample ({@code fit}'s CSV, sheet Model fits). */
    public static Table<FitRow> modelFits(AnalysisRequest request) {
        return Table.<FitRow>named("Model fits")
                .column("sample", "sample", "", Style.TEXT, 20, r -> r.ranked().fit().sample())
                .column("model", "model", "", Style.TEXT, 16, r -> r.ranked().fit().model())
                .column("parameter", "parameter", "", Style.TEXT, 11, r -> r.parameter().name())
                .column("unit", "unit", "", Style.TEXT, 7, r -> r.parameter().unit(), NOT_CSV)
                .column("value", "value", "", Style.SCIENTIFIC, 11, r -> r.parameter().value())
                .column("std_error", "standard error", "", Style.SCIENTIFIC, 11, r -> r.parameter().stdError())
                .column("ci95_low", "95 % CI low", "", Style.SCIENTIFIC, 11, r -> r.parameter().ci95Low())
                .column("ci95_high", "95 % CI high", "", Style.SCIENTIFIC, 11, r -> r.parameter().ci95High())
                .column("rss", Statements.rssLabel(request), "–", Style.SCIENTIFIC, 10, r -> r.ranked().fit().rss())
                .column("aicc", "AICc", "–", Style.DECIMAL2, 9, r -> r.ranked().fit().aicc())
                .column("delta_aicc", "ΔAICc", "–", Style.DECIMAL2, 8, r -> r.ranked().deltaAicc(), NOT_CSV)
                .column("akaike_weight", "Akaike weight", "–", Style.DECIMAL4, 9, r -> r.ranked().weight())
                .column("best", "best", "", Style.TEXT, 6, r -> r.ranked().best())
                .column("converged", "converged", "", Style.TEXT, 10, r -> r.ranked().fit().converged(), NOT_CSV)
                .column("note", "note", "", Style.TEXT, 40, FitRow::note)
                .build();
    }

    /** The rows of {@link #modelFits}: every parameter of every fit, sample by sample. */
    public static List<FitRow> fitRows(List<SampleAnalysis> samples) {
        List<FitRow> out = new ArrayList<>();
        for (SampleAnalysis sa : samples) {
            for (ModelSelection.Ranked rk : sa.fits()) {
                for (ParameterEstimate p : rk.fit().parameters()) {
                    out.add(new FitRow(rk, p));
                }
            }
        }
        return out;
    }

    /** Quantities derived from every fit (sheet Derived quantities). */
    public static final Table<DerivedRow> DERIVED = Table.<DerivedRow>named("Derived quantities")
            .column("sample", "sample", "", Style.TEXT, 28, r -> r.ranked().fit().sample())
            .column("model", "model", "", Style.TEXT, 24, r -> r.ranked().fit().model())
            .column("quantity", "quantity", "", Style.TEXT, 26, r -> r.quantity().name())
            .column("unit", "unit", "", Style.TEXT, 8, r -> r.quantity().unit())
            .column("value", "value", "", Style.SCIENTIFIC, 14, r -> r.quantity().value())
            .column("std_error", "standard error", "", Style.SCIENTIFIC, 14, r -> r.quantity().stdError())
            .column("best", "best", "", Style.TEXT, 8, r -> r.ranked().best())
            .column("note", "note", "", Style.TEXT, 50, r -> r.quantity().note())
            .build();

    /**
     * Every quality check, one row per sample × replicate × check (sheet Quality; {@code quality -o}
     * writes the same columns). The value of a linear-range row is a strain amplitude in %, or an
     * amplitude in its SI unit (Pa, N, m) as its message says.
     */
    public static final Table<SweepChecks.Check> QUALITY = Table.<SweepChecks.Check>named("Quality")
            .column("sample", "sample", "", Style.TEXT, 26, SweepChecks.Check::sample)
            .column("replicate", "replicate", "", Style.TEXT, 9, SweepChecks.Check::replicate)
            .column("check", "check", "", Style.TEXT, 18, SweepChecks.Check::check)
            .column("verdict", "verdict", "", Style.TEXT, 8, c -> c.verdict().toString())
            .column("value", "value", "", Style.SCIENTIFIC, 11, SweepChecks.Check::value)
            .column("limit", "limit", "", Style.SCIENTIFIC, 11, SweepChecks.Check::limit)
            .column("unit", "unit", "", Style.TEXT, 14, c -> " " + c.unit(), Medium.allBut(Medium.CSV))
            .column("message", "what it means", "", Style.TEXT, 90, SweepChecks.Check::message)
            .build();

    /**
     * One row per temperature ramp: the glass transition by the three ASTM E1640 conventions with
     * their standard errors, the tan δ peak's height and width, the plateau moduli, and the
     * sample's activation energy from its tan δ peaks (sheet Transitions; {@code transition -o}).
     */
    public static Table<GlassTransition.Result> transitions(Transitions t) {
        return Table.<GlassTransition.Result>named("Transitions")
                .column("sample", "sample", "", Style.TEXT, 22, r -> r.ramp().sample())
                .column("replicate", "replicate", "", Style.TEXT, 9, r -> r.ramp().replicate())
                .column("group", "group", "", Style.TEXT, 12, r -> r.ramp().group(), SHEET_CSV)
                .column("frequency_hz", "frequency", "Hz", Style.FREQUENCY, 10, r -> r.ramp().frequencyHz())
                .column("tg_storage_onset_c", "Tg E′ onset", "°C", Style.DECIMAL2, 11, r -> r.onset().valueC())
                .column("tg_storage_onset_std_error_c", "± std error", "°C", Style.DECIMAL2, 10, r -> r.onset().stdError())
                .column("tg_loss_peak_c", "Tg E″ peak", "°C", Style.DECIMAL2, 11, r -> r.lossPeak().valueC())
                .column("tg_loss_peak_std_error_c", "± std error", "°C", Style.DECIMAL2, 10, r -> r.lossPeak().stdError())
                .column("tg_tan_delta_peak_c", "Tg tan δ peak", "°C", Style.DECIMAL2, 11, r -> r.tanDeltaPeak().valueC())
                .column("tg_tan_delta_peak_std_error_c", "± std error", "°C", Style.DECIMAL2, 10, r -> r.tanDeltaPeak().stdError())
                .column("tan_delta_peak_height", "tan δ peak height", "–", Style.DECIMAL4, 11, GlassTransition.Result::peakHeight)
                .column("tan_delta_peak_height_std_error", "± std error", "–", Style.DECIMAL4, 10,
                        GlassTransition.Result::peakHeightSe, SHEET_CSV)
                .column("tan_delta_peak_fwhm_c", "tan δ peak width (FWHM)", "°C", Style.DECIMAL2, 12, GlassTransition.Result::fwhmC)
                .column("glassy_storage_modulus_pa", "glassy E′", "Pa", Style.SCIENTIFIC, 12, GlassTransition.Result::glassyStorage)
                .column("rubbery_storage_modulus_pa", "rubbery E′", "Pa", Style.SCIENTIFIC, 12, GlassTransition.Result::rubberyStorage)
                .column("activation_energy_kj_mol", "Ea (tan δ peak)", "kJ/mol", Style.DECIMAL2, 11,
                        r -> t.activation(r.ramp().sample(), GlassTransition.Convention.TAN_DELTA_PEAK)
                                .map(ActivationEnergy::kjPerMol).orElse(null), SHEET_CSV)
                .column("activation_energy_ci95_low_kj_mol", "Ea 95 % CI low", "kJ/mol", Style.DECIMAL2, 11,
                        r -> t.activation(r.ramp().sample(), GlassTransition.Convention.TAN_DELTA_PEAK)
                                .map(ActivationEnergy::ci95Low).orElse(null), SHEET_CSV)
                .column("activation_energy_ci95_high_kj_mol", "Ea 95 % CI high", "kJ/mol", Style.DECIMAL2, 11,
                        r -> t.activation(r.ramp().sample(), GlassTransition.Convention.TAN_DELTA_PEAK)
                                .map(ActivationEnergy::ci95High).orElse(null), SHEET_CSV)
                .column("heating_rate_k_min", "heating rate", "K/min", Style.DECIMAL2, 10,
                        r -> r.ramp().heatingRateKPerMin().isPresent() ? r.ramp().heatingRateKPerMin().getAsDouble() : null, SHEET_CSV)
                .column("notes", "windows and notes", "", Style.TEXT, 70, OutputTables::transitionNotes, SHEET_CSV)
                .build();
    }

    /** Why a convention gave no number, and the windows of those that did. */
    public static String transitionNotes(GlassTransition.Result r) {
        List<String> out = new ArrayList<>();
        for (GlassTransition.Convention c : GlassTransition.Convention.values()) {
            GlassTransition.Estimate e = r.estimate(c);
            out.add(c.label() + ": " + (e.found() ? e.window() : e.problem()));
        }
        if (!r.fwhmProblem().isEmpty() && r.tanDeltaPeak().found()) {
            out.add("width: " + r.fwhmProblem());
        }
        if (!r.rubberyWindow().isEmpty()) {
            out.add("rubbery E′ over " + r.rubberyWindow());
        }
        if (r.ramp().unsorted() > 0) {
            out.add(r.ramp().unsorted() + " point(s) sorted into temperature order");
        }
        return String.join("; ", out);
    }

    /** One row per sample and peak convention with several frequencies (sheet Activation energy). */
    public static final Table<Transitions.Activation> ACTIVATION = Table.<Transitions.Activation>named("Activation energy")
            .column("sample", "sample", "", Style.TEXT, 22, Transitions.Activation::sample)
            .column("convention", "from the", "", Style.TEXT, 14, a -> a.convention().label())
            .column("activation_energy_kj_mol", "Ea", "kJ/mol", Style.DECIMAL2, 11,
                    a -> a.energy() == null ? null : a.energy().kjPerMol())
            .column("ci95_low_kj_mol", "95 % CI low", "kJ/mol", Style.DECIMAL2, 11, a -> a.energy() == null ? null : a.energy().ci95Low())
            .column("ci95_high_kj_mol", "95 % CI high", "kJ/mol", Style.DECIMAL2, 11,
                    a -> a.energy() == null ? null : a.energy().ci95High())
            .column("n_temperatures", "temperatures", "", Style.INTEGER, 12, a -> a.energy() == null ? null : a.energy().points())
            .column("n_frequencies", "frequencies", "", Style.INTEGER, 11, a -> a.energy() == null ? null : a.energy().frequencies())
            .column("note", "note", "", Style.TEXT, 50, a -> a.energy() == null ? a.problem()
                    : Double.isNaN(a.energy().ci95High()) ? "the upper end is unbounded (a flat trend is within the interval)" : "")
            .build();

    /** A row of {@link #TRANSITION_RANKING}: one sample in one comparable set. */
    public record TransitionRankRow(Transitions.RankedSet set, Transitions.RankedRow row) {
    }

    /** The rows of {@link #TRANSITION_RANKING}, set by set. */
    public static List<TransitionRankRow> transitionRankRows(Transitions t) {
        List<TransitionRankRow> out = new ArrayList<>();
        for (Transitions.RankedSet s : t.sets()) {
            for (Transitions.RankedRow r : s.rows()) {
                out.add(new TransitionRankRow(s, r));
            }
        }
        return out;
    }

    /** Samples compared within one frequency and one convention (sheet Transition ranking). */
    public static final Table<TransitionRankRow> TRANSITION_RANKING = Table.<TransitionRankRow>named("Transition ranking")
            .column("compared", "compared", "", Style.TEXT, 26, r -> r.set().measure().label(), Medium.allBut(Medium.TERMINAL))
            .column("frequency_hz", "frequency", "Hz", Style.FREQUENCY, 10, r -> r.set().frequencyHz(), Medium.allBut(Medium.TERMINAL))
            .column("rank", "rank", "", Style.INTEGER, 6, r -> r.row().rank())
            .column("sample", "sample", "", Style.TEXT, 22, r -> r.row().sample())
            .column("group", "group", "", Style.TEXT, 12, r -> r.row().group(), SHEET_CSV)
            .column("n_replicates", "replicates", "", Style.INTEGER, 10, r -> r.row().values().n())
            .column("mean", "mean", "", Style.SCIENTIFIC, 11, r -> r.row().values().mean())
            .column("sd", "standard deviation", "", Style.SCIENTIFIC, 11, r -> r.row().values().sd())
            .column("ci95_low", "95 % CI low", "", Style.SCIENTIFIC, 11, r -> r.row().values().ci95Low(), SHEET_CSV)
            .column("ci95_high", "95 % CI high", "", Style.SCIENTIFIC, 11, r -> r.row().values().ci95High(), SHEET_CSV)
            .column("unit", "unit", "", Style.TEXT, 6, r -> r.set().measure().unit().isEmpty() ? "–" : r.set().measure().unit(),
                    Medium.allBut(Medium.TERMINAL))
            .column("letters", "letter group", "", Style.TEXT, 10, r -> r.row().letters())
            .build();

    /** The relaxation spectrum of every sample (sheet Spectra; {@code spectrum -o} writes the same columns). */
    public static final Table<SpectrumRow> SPECTRA = spectra(false);

    /** The columns of a relaxation spectrum H(τ) [Pa], or of a retardation spectrum L(τ) [1/Pa]. */
    public static Table<SpectrumRow> spectra(boolean retardation) {
        String id = retardation ? "l" : "h";
        String per = retardation ? "_per_pa" : "_pa";
        String unit = retardation ? "1/Pa" : "Pa";
        String q = retardation ? "L" : "H";
        return Table.<SpectrumRow>named(retardation ? "Retardation spectra" : "Spectra")
                .column("sample", "sample", "", Style.TEXT, 28, SpectrumRow::sample)
                .column("tau_s", (retardation ? "retardation" : "relaxation") + " time τ", "s", Style.SCIENTIFIC, 14, SpectrumRow::tau)
                .column(id + per, q + "(τ)", unit, Style.SCIENTIFIC, 14, SpectrumRow::h)
                .column(id + "_low" + per, q + " band low (noise only)", unit, Style.SCIENTIFIC, 14, SpectrumRow::low)
                .column(id + "_high" + per, q + " band high (noise only)", unit, Style.SCIENTIFIC, 14, SpectrumRow::high)
                .build();
    }

    /** The rows of {@link #SPECTRA}. */
    public static List<SpectrumRow> spectrumRows(List<SampleAnalysis> samples) {
        List<SpectrumRow> out = new ArrayList<>();
        for (SampleAnalysis sa : samples) {
            sa.spectrum().ifPresent(r -> {
                for (int j = 0; j < r.tau().length; j++) {
                    out.add(new SpectrumRow(sa.sample().name(), r.tau()[j], r.h()[j], r.low()[j], r.high()[j]));
                }
            });
        }
        return out;
    }

    /** Per sample, the spectrum's smoothing, fit and moments in words (under the Spectra table). */
    public static List<String> spectrumNotes(List<SampleAnalysis> samples) {
        List<String> out = new ArrayList<>();
        for (SampleAnalysis sa : samples) {
            sa.spectrum().ifPresent(r -> {
                double top = java.util.Arrays.stream(r.h()).max().orElse(0);
                boolean edge = r.h()[0] > 0.05 * top || r.h()[r.h().length - 1] > 0.05 * top;
                double[] eta = r.moment(1);
                double[] mean = r.meanTime();
                out.add(String.format(java.util.Locale.ROOT, "%s: smoothing λ = %s (generalised cross-validation)%s, data "
                        + "reproduced to %.1f %% RMS; equilibrium modulus %s ± %s Pa; ∫Hτ dlnτ = %s ± %s Pa·s; %s", sa.sample().name(),
                        org.viscarta.table.Cells.g4(r.lambda()), org.viscarta.spectrum.RelaxationSpectrum.lambdaAtLimit(r),
                        100 * r.rmsRelative(), org.viscarta.table.Cells.g4(r.constant()),
                        org.viscarta.table.Cells.g4(r.constantSe()), org.viscarta.table.Cells.g4(eta[0]),
                        org.viscarta.table.Cells.g4(eta[1]), edge ? "the spectrum is still large at an end of the window: "
                        + "processes outside the measured frequencies, not placed by these data" : "weight-average relaxation "
                        + "time " + org.viscarta.table.Cells.g4(mean[0]) + " s (no interval: its error estimate held the truth "
                        + "in only 88 % of synthetic tests)"));
            });
        }
        return out;
    }

    /** The rows of {@link #DERIVED}. */
    public static List<DerivedRow> derivedRows(List<SampleAnalysis> samples) {
        List<DerivedRow> out = new ArrayList<>();
        for (SampleAnalysis sa : samples) {
            for (ModelSelection.Ranked rk : sa.fits()) {
                for (DerivedEstimate d : rk.fit().derived()) {
                    out.add(new DerivedRow(rk, d));
                }
            }
        }
        return out;
    }

    /** Parameter correlations of each sample's best-supported fit (sheet Correlations). */
    public static final Table<CorrelationRow> CORRELATIONS = Table.<CorrelationRow>named("Correlations")
            .column("sample", "sample", "", Style.TEXT, 28, r -> r.fit().sample())
            .column("model", "model", "", Style.TEXT, 24, r -> r.fit().model())
            .column("parameter", "parameter", "", Style.TEXT, 14, CorrelationRow::parameter)
            .column("other_parameter", "with parameter", "", Style.TEXT, 16, CorrelationRow::other)
            .column("correlation", "correlation", "–", Style.DECIMAL4, 16, CorrelationRow::correlation)
            .build();

    /** The rows of {@link #CORRELATIONS}. */
    public static List<CorrelationRow> correlationRows(List<SampleAnalysis> samples) {
        List<CorrelationRow> out = new ArrayList<>();
        for (SampleAnalysis sa : samples) {
            sa.best().ifPresent(f -> {
                double[][] corr = f.correlation();
                if (corr == null) {
                    return;
                }
                List<ParameterEstimate> ps = f.parameters();
                for (int i = 0; i < ps.size(); i++) {
                    for (int j = i + 1; j < ps.size(); j++) {
                        out.add(new CorrelationRow(f, ps.get(i).name(), ps.get(j).name(), corr[i][j]));
                    }
                }
            });
        }
        return out;
    }

    /** Every measured point as read, with its file and line and its sweep's attributes (sheet Data). */
    public static Table<DataRow> data(List<SampleAnalysis> samples) {
        Table.Builder<DataRow> b = Table.<DataRow>named("Data")
            .column("sample", "sample", "", Style.TEXT, 22, r -> r.sample().name())
            .column("replicate", "replicate", "", Style.TEXT, 10, r -> r.sweep().replicate())
            .column("group", "group", "", Style.TEXT, 16, r -> r.sweep().group());
        for (String a : attributeNames(samples.stream().flatMap(sa -> sa.sample().replicates().stream()).map(Sweep::attributes).toList())) {
            b.column(attributeId(a), a, "", Style.TEXT, 14, r -> r.sweep().attributes().getOrDefault(a, ""));
        }
        return b.column("file", "file", "", Style.TEXT, 30, r -> r.sweep().source().toString())
            .column("line", "line", "", Style.INTEGER, 7, r -> r.point().line())
            .column("frequency_hz", "frequency", "Hz", Style.FREQUENCY, 11, r -> r.point().frequencyHz())
            .column("angular_frequency_rad_s", "angular frequency", "rad/s", Style.FREQUENCY, 12, r -> r.point().omega())
            .column("storage_modulus_pa", "storage modulus", "Pa", Style.SCIENTIFIC, 12, r -> r.point().storage())
            .column("loss_modulus_pa", "loss modulus", "Pa", Style.SCIENTIFIC, 12, r -> r.point().loss())
            .column("tan_delta", "tan δ", "–", Style.DECIMAL4, 12, r -> r.point().lossTangent())
            .column("complex_modulus_pa", "|E*| or |G*|", "Pa", Style.SCIENTIFIC, 12, r -> r.point().magnitude())
            .column("phase_angle_deg", "phase angle", "°", Style.DECIMAL2, 10, r -> Math.toDegrees(r.point().phaseAngle()))
            .column("basis", "basis", "", Style.TEXT, 10, r -> r.sweep().kind().letter())
            .column("temperature_c", "temperature", "°C", Style.DECIMAL2, 12, r -> r.sweep().temperatureC())
            .build();
    }

    /** The rows of {@link #data}: every point of every replicate of every sample. */
    public static Iterable<DataRow> dataRows(List<SampleAnalysis> samples) {
        // only measured points: the moduli computed from time-domain tests are in the Time-domain tests sheet's fits
        return () -> samples.stream().flatMap(sa -> sa.sample().replicates().stream()
                .filter(sw -> org.viscarta.analysis.TimeTests.origin(sw).isEmpty())
                .flatMap(sw -> sw.points().stream().map(p -> new DataRow(sa.sample(), sw, p)))).iterator();
    }

    /** One measured point of a time-domain test, with the best-supported model's value there. */
    public record TimeTestRow(org.viscarta.analysis.TimeTests.Derived derived, org.viscarta.sweep.TimeTest test,
                              org.viscarta.sweep.TimeTest.Point point) {

        /** The best-supported model (fitted to all replicates) at this time, or null. */
        public Double model() {
            return derived.analysis().best().filter(b -> b.fitted() != null).map(b -> test.type() == org.viscarta.sweep.TimeTest.Type.RELAXATION
                    ? b.fitted().relaxationModulus(point.timeS(), b.values()) : b.fitted().creepCompliance(point.timeS(), b.values()))
                    .orElse(null);
        }
    }

    /** Every measured point of the time-domain tests (sheet Time-domain tests). */
    public static List<TimeTestRow> timeTestRows(AnalysisResult r) {
        List<TimeTestRow> out = new ArrayList<>();
        for (org.viscarta.analysis.TimeTests.Derived d : r.timeTests()) {
            for (org.viscarta.sweep.TimeTest t : d.tests()) {
                for (org.viscarta.sweep.TimeTest.Point p : t.points()) {
                    out.add(new TimeTestRow(d, t, p));
                }
            }
        }
        return out;
    }

    /** The measured points of time-domain tests and the best model beside them. */
    public static final Table<TimeTestRow> TIME_TESTS = Table.<TimeTestRow>named("Time-domain tests")
            .column("sample", "sample", "", Style.TEXT, 28, x -> x.derived().sample().name())
            .column("test", "test", "", Style.TEXT, 16, x -> x.test().type().test())
            .column("replicate", "replicate", "", Style.TEXT, 10, x -> x.test().replicate())
            .column("time_s", "time", "s", Style.SCIENTIFIC, 12, x -> x.point().timeS())
            .column("measured", "measured M(t) [Pa] or J(t) [1/Pa]", "", Style.SCIENTIFIC, 18, x -> x.point().value())
            .column("best_model", "best-supported model there", "", Style.SCIENTIFIC, 18, TimeTestRow::model)
            .column("ln_model_over_data", "ln(model/data)", "", Style.DECIMAL4, 12,
                    x -> x.model() == null ? null : Math.log(x.model() / x.point().value()))
            .column("file", "file", "", Style.TEXT, 30, x -> x.test().source().getFileName().toString())
            .column("line", "line", "", Style.INTEGER, 8, x -> x.point().line())
            .build();

    /** Every mapped position (sheet Positions, {@code map -o}'s positions.csv). */
    public static final Table<org.viscarta.map.MapAnalysis.Point> POSITIONS = Table.<org.viscarta.map.MapAnalysis.Point>named("Positions")
            .column("sample", "specimen", "", Style.TEXT, 20, org.viscarta.map.MapAnalysis.Point::specimen)
            .column("x_m", "x", "m", Style.SCIENTIFIC, 12, org.viscarta.map.MapAnalysis.Point::xM, java.util.Set.of(Medium.CSV))
            .column("y_m", "y", "m", Style.SCIENTIFIC, 12, org.viscarta.map.MapAnalysis.Point::yM, java.util.Set.of(Medium.CSV))
            .column("x_um", "x", "µm", Style.DECIMAL2, 10, p -> p.xM() * 1e6, NOT_CSV)
            .column("y_um", "y", "µm", Style.DECIMAL2, 10, p -> p.yM() * 1e6, NOT_CSV)
            .column("image_x_px", "image column", "px", Style.DECIMAL2, 10, p -> Double.isNaN(p.imageX()) ? null : p.imageX())
            .column("image_y_px", "image row", "px", Style.DECIMAL2, 10, p -> Double.isNaN(p.imageY()) ? null : p.imageY())
            .column("region", "region", "", Style.TEXT, 16, org.viscarta.map.MapAnalysis.Point::region)
            .column("storage_modulus_pa", "E′", "Pa", Style.SCIENTIFIC, 12, p -> Double.isNaN(p.storage()) ? null : p.storage())
            .column("loss_modulus_pa", "E″", "Pa", Style.SCIENTIFIC, 12, p -> Double.isNaN(p.loss()) ? null : p.loss())
            .column("tan_delta", "tan δ", "–", Style.DECIMAL4, 9, p -> Double.isNaN(p.tanDelta()) ? null : p.tanDelta())
            .column("sweeps", "sweeps", "", Style.INTEGER, 7, org.viscarta.map.MapAnalysis.Point::sweeps)
            .column("best_model", "best model", "", Style.TEXT, 16, org.viscarta.map.MapAnalysis.Point::bestModel)
            .column("nearest_reference", "nearest reference", "", Style.TEXT, 20, org.viscarta.map.MapAnalysis.Point::nearest)
            .column("nearest_class", "its class", "", Style.TEXT, 12, org.viscarta.map.MapAnalysis.Point::nearestClass)
            .column("note", "note", "", Style.TEXT, 24, org.viscarta.map.MapAnalysis.Point::note)
            .build();

    /** A region of a mapped specimen. */
    public record RegionRow(String specimen, org.viscarta.map.MapAnalysis.RegionStat stat) {
    }

    /** Every region of every mapped specimen. */
    public static List<RegionRow> regionRows(List<org.viscarta.map.MapAnalysis.Specimen> specimens) {
        List<RegionRow> out = new ArrayList<>();
        for (org.viscarta.map.MapAnalysis.Specimen sp : specimens) {
            sp.regions().forEach(r -> out.add(new RegionRow(sp.name(), r)));
        }
        return out;
    }

    private static Double finite(double v) {
        return Double.isNaN(v) ? null : v;
    }

    /** The regions' statistics (sheet Regions, {@code map -o}'s regions.csv). */
    public static final Table<RegionRow> REGIONS = Table.<RegionRow>named("Regions")
            .column("sample", "specimen", "", Style.TEXT, 20, RegionRow::specimen)
            .column("region", "region", "", Style.TEXT, 16, r -> r.stat().region())
            .column("n_positions", "positions", "", Style.INTEGER, 9, r -> r.stat().n())
            .column("storage_modulus_median_pa", "E′ median", "Pa", Style.SCIENTIFIC, 12, r -> finite(r.stat().storage()[0]))
            .column("storage_modulus_q1_pa", "E′ Q1", "Pa", Style.SCIENTIFIC, 12, r -> finite(r.stat().storage()[1]))
            .column("storage_modulus_q3_pa", "E′ Q3", "Pa", Style.SCIENTIFIC, 12, r -> finite(r.stat().storage()[2]))
            .column("storage_modulus_geometric_mean_pa", "E′ geometric mean", "Pa", Style.SCIENTIFIC, 12, r -> finite(r.stat().storage()[3]), SHEET_CSV)
            .column("storage_modulus_ci95_low_pa", "E′ 95 % CI low", "Pa", Style.SCIENTIFIC, 12, r -> finite(r.stat().storage()[4]), SHEET_CSV)
            .column("storage_modulus_ci95_high_pa", "E′ 95 % CI high", "Pa", Style.SCIENTIFIC, 12, r -> finite(r.stat().storage()[5]), SHEET_CSV)
            .column("letters_storage", "E′ letters", "", Style.TEXT, 8, r -> r.stat().lettersStorage())
            .column("tan_delta_median", "tan δ median", "–", Style.DECIMAL4, 10, r -> finite(r.stat().tanDelta()[0]))
            .column("tan_delta_q1", "tan δ Q1", "–", Style.DECIMAL4, 9, r -> finite(r.stat().tanDelta()[1]))
            .column("tan_delta_q3", "tan δ Q3", "–", Style.DECIMAL4, 9, r -> finite(r.stat().tanDelta()[2]))
            .column("tan_delta_mean", "tan δ mean", "–", Style.DECIMAL4, 9, r -> finite(r.stat().tanDelta()[3]), SHEET_CSV)
            .column("tan_delta_ci95_low", "tan δ 95 % CI low", "–", Style.DECIMAL4, 9, r -> finite(r.stat().tanDelta()[4]), SHEET_CSV)
            .column("tan_delta_ci95_high", "tan δ 95 % CI high", "–", Style.DECIMAL4, 9, r -> finite(r.stat().tanDelta()[5]), SHEET_CSV)
            .column("letters_tan_delta", "tan δ letters", "", Style.TEXT, 8, r -> r.stat().lettersTanDelta())
            .build();

    /** E(t) and J(t) of fitted models on a time grid ({@code fit --time-domain}: terminal and CSV). */
    public static final Table<TimeDomain.Point> TIME_DOMAIN = Table.<TimeDomain.Point>named("Time domain")
            .column("sample", "sample", "", Style.TEXT, 28, TimeDomain.Point::sample, SHEET_CSV)
            .column("model", "model", "", Style.TEXT, 24, TimeDomain.Point::model, SHEET_CSV)
            .column("time_s", "time", "s", Style.SCIENTIFIC, 14, TimeDomain.Point::timeS)
            .column("relaxation_modulus_pa", "relaxation modulus E(t) or G(t)", "Pa", Style.SCIENTIFIC, 16, TimeDomain.Point::relaxation)
            .column("creep_compliance_per_pa", "creep compliance J(t)", "1/Pa", Style.SCIENTIFIC, 16, TimeDomain.Point::creep)
            .build();

    /** The reference materials of the library (sheet Reference library). */
    public static final Table<ReferenceLibrary.Entry> LIBRARY = Table.<ReferenceLibrary.Entry>named("Reference library")
            .column("name", "name", "", Style.TEXT, 30, ReferenceLibrary.Entry::name)
            .column("class", "class", "", Style.TEXT, 14, ReferenceLibrary.Entry::clazz)
            .column("temperature_c", "temperature", "°C", Style.DECIMAL2, 16, e -> e.sweep().temperatureC())
            .column("method", "method", "", Style.TEXT, 16, e -> e.sweep().meta("method").orElse(""))
            .column("frequency_low_hz", "lowest frequency", "Hz", Style.FREQUENCY, 14, e -> e.sweep().minFrequencyHz())
            .column("frequency_high_hz", "highest frequency", "Hz", Style.FREQUENCY, 14, e -> e.sweep().maxFrequencyHz())
            .column("points", "points", "", Style.INTEGER, 8, e -> e.sweep().points().size())
            .column("file", "file", "", Style.TEXT, 40, e -> e.file().toString())
            .column("sha256", "SHA-256", "", Style.TEXT, 66, ReferenceLibrary.Entry::sha256)
            .build();

    private static Double mean(ReplicateSummary t) {
        return t == null ? null : t.mean();
    }

    private static Double ciLow(ReplicateSummary t) {
        return t == null ? null : t.ci95Low();
    }

    private static Double ciHigh(ReplicateSummary t) {
        return t == null ? null : t.ci95High();
    }
}
