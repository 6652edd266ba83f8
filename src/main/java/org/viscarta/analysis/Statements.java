package org.viscarta.analysis;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;
import org.viscarta.compare.DampingRanking;
import org.viscarta.compare.RankingPoint;
import org.viscarta.fit.ModelFitter;
import org.viscarta.sweep.Numbers;

/**
 * Every sentence the outputs state about how an analysis was done, generated from its request so
 * that it cannot drift from what ran. Read me, Provenance, the page, figure captions and column
 * headers take their wording from here.
 */
public final class Statements {

    /** The confidence level of every interval the fits and the ranking report. */
    public static final String CONFIDENCE = "95 % (Student t on n − p degrees of freedom for fits, on n − 1 for replicate means)";

    private Statements() {
    }

    /** "tan δ at 1 Hz" or "tan δ at 0.5–5 Hz (geometric mean)". */
    public static String rankedBy(AnalysisRequest r) {
        return "tan δ at " + r.rankingPoint().describe();
    }

    /** The opening sentence of the Read me and the page. */
    public static String whatThisIs(AnalysisResult result) {
        AnalysisRequest r = result.request();
        StringBuilder sb = new StringBuilder("Frequency sweeps of ").append(result.samples().size()).append(" sample(s) from ")
                .append(result.inputs().files().size()).append(" file(s)");
        if (r.needsFits()) {
            sb.append(", each fitted with ").append(r.modelIds().size()).append(" candidate viscoelastic model(s) on ")
                    .append(r.weighting().residualName());
        }
        if (r.parts().contains(AnalysisRequest.Part.RANKING)) {
            sb.append(", and ranked by damping (").append(rankedBy(r)).append("), differences tested at α = ")
                    .append(Numbers.plain(r.alpha()));
        }
        return sb.append('.').toString();
    }

    /** The residual sum of squares' column header: "RSS (log residuals)". */
    public static String rssLabel(AnalysisRequest r) {
        return "RSS (" + r.weighting().residualName() + ")";
    }

    /** The RMS misfit's column header: "RMS misfit of best (log residuals)". */
    public static String rmsLabel(AnalysisRequest r) {
        return "RMS misfit of best (" + r.weighting().residualName() + ")";
    }

    /** The definition of RSS and RMS misfit in the Read me, for the weighting that ran. */
    public static String rssDefinition(AnalysisRequest r) {
        return "Residual sum of squares of " + r.weighting().describe() + "; the RMS misfit is its root mean square"
                + (r.weighting() == org.viscarta.fit.Weighting.REPLICATE_SD ? ", in units of the replicates' scatter."
                        : ", roughly the typical relative misfit (0.05 ≈ 5 %).");
    }

    /** Every setting by name, in a stable order, as Provenance lists them. */
    public static Map<String, String> settings(AnalysisRequest r) {
        ReadSettings read = r.reading();
        Map<String, String> m = new LinkedHashMap<>();
        m.put("inputs", r.inputs().stream().map(Path::toString).collect(Collectors.joining(", ")));
        m.put("models", String.join(", ", r.modelIds()));
        m.put("damping ranked at", r.rankingPoint().describe());
        m.put("significance level of pairwise and group tests", Numbers.plain(r.alpha()));
        m.put("comparable sets", r.sets().describe());
        m.put("weighting", r.weighting().label());
        m.put("residuals", r.weighting().describe());
        m.put("optimiser", new ModelFitter(r.weighting()).describe());
        m.put("confidence level", CONFIDENCE);
        m.put("value outside the measured range", r.rankingPoint() instanceof RankingPoint.Band
                ? "not reported (a band is averaged over measured points only)"
                : r.outsideRange() == DampingRanking.OutsideRange.BEST_MODEL ? "from the best-supported model, marked as such"
                : "not reported");
        m.put("basis", read.basis().map(Object::toString).orElse("as read"));
        m.put("Poisson's ratio override", read.poisson().isPresent() ? Numbers.plain(read.poisson().getAsDouble()) : "none");
        m.put("modulus kind when unstated", read.declaredKind().map(Object::toString).orElse("tensile (with a warning)"));
        m.put("column map", read.columns().isEmpty() ? "none" : read.columns().entrySet().stream()
                .map(e -> e.getKey() + " = " + e.getValue()).sorted().collect(Collectors.joining("; ")));
        m.put("groups from", read.groupBy().map(a -> "the column '" + a + "'").orElse("the group column or '# group:' line"));
        m.put("bad input files", read.badFiles() == ReadSettings.BadFiles.STOP ? "stop the run"
                : "left out and reported (a single input stops the run)");
        m.put("master curves", r.masterCurves().map(MasterCurves::describe).orElse("not built"));
        m.put("reference library", r.library().map(Path::toString).orElse("none"));
        m.put("reference distance", r.matching().describe());
        m.put("target", target(r.target()));
        m.put("time domain", r.timeGrid().isEmpty() ? "not evaluated"
                : "E(t) and J(t) of every fitted model at " + r.timeGrid().size() + " times from "
                        + Numbers.plain(r.timeGrid().get(0)) + " to " + Numbers.plain(r.timeGrid().get(r.timeGrid().size() - 1)) + " s");
        return m;
    }

    /** How the glass transitions were located, each rule with its source. */
    public static final List<String> TRANSITION_METHOD = List.of(
            "Conventions of ASTM E1640 (Assignment of the Glass Transition Temperature by Dynamic Mechanical Analysis; the "
                    + "2018 edition, from memory): onset of the E′ drop, E″ peak, tan δ peak.",
            "Each peak is located on a cubic fitted by least squares to the logarithm of E″ (or tan δ) over the points within "
                    + "20 % of the smoothed peak height (at least 7); its standard error follows from the fit by the delta method. "
                    + "A peak at the edge of the range, or one that stays within 20 % of its height to the edge, is not reported.",
            "The onset is the crossing of a straight line fitted to ln E′ on the glassy plateau (smoothed slope under 10 % of "
                    + "the steepest, below the drop) with the tangent at the inflection of a cubic fitted around the steepest "
                    + "stretch; its standard error comes from both fits.",
            "The tan δ peak's width is read at half its fitted height against zero on a local-quadratic smooth; the glassy and "
                    + "rubbery moduli are geometric means of E′ over the plateaus (slope under 10 % of the steepest) (conventions "
                    + "of this product).",
            "Activation energy: 1/T of the peaks regressed on ln f (Arrhenius), Ea = −R/slope; the 95 % interval is the "
                    + "Student-t interval of the slope carried through.",
            "Comparisons: at each frequency and convention, Welch t-tests between samples' replicates, Holm-adjusted; one-way "
                    + "ANOVA and Kruskal–Wallis across groups.");

    /** The limits the quality checks hold the data to, each with its source. */
    public static final List<String> QUALITY_LIMITS = List.of(
            "kramers-kronig: E′ and E″ fitted together by a causal, linear material (Maxwell modes on a fixed grid of times, "
                    + "after Schönleber, Klotz and Ivers-Tiffée 2014); fail where two or more neighbouring points depart by more "
                    + "than three times the noise (a convention of this product)",
            "linear-range: the amplitude where E′ leaves its small-amplitude plateau by the stated percentage (5 % by default, "
                    + "common practice); a frequency sweep measured above its sample's limit fails",
            "replicate-outlier: modified z-score of the log moduli against the other replicates above 3.5 (Iglewicz and "
                    + "Hoaglin 1993), median over the common band, spread floored at 5 % (a convention of this product)",
            "film-thickness: indentation depth at most 10 % of the film's thickness (a common rule of thumb, not a standard)",
            "points-per-decade at least 3, frequency-span at least one decade, noise at most 5 %, storage-monotonic (E′ may "
                    + "not fall with frequency beyond four times the noise): conventions of this product; loss-modulus-sign: "
                    + "E″ > 0 for any passive material");

    /** What the quality checks found, in one sentence, and which replicates were left out on request. */
    public static List<String> qualitySummary(AnalysisResult r) {
        List<org.viscarta.quality.SweepChecks.Check> all = r.quality().checks();
        long warn = all.stream().filter(c -> c.verdict() == org.viscarta.quality.Verdict.WARN).count();
        long fail = all.stream().filter(c -> c.verdict() == org.viscarta.quality.Verdict.FAIL).count();
        List<String> out = new java.util.ArrayList<>();
        out.add(all.size() + " checks: " + (all.size() - warn - fail) + " pass, " + warn + " warn, " + fail + " fail"
                + (r.quality().linearRanges().isEmpty() ? "" : "; " + r.quality().linearRanges().size() + " amplitude sweep(s)")
                + ". A warning asks for a look; a failure means the numbers concerned should not be used as they are.");
        if (!r.droppedReplicates().isEmpty()) {
            out.add("Left out of every analysis on request (--drop-outliers): " + r.droppedReplicates().stream()
                    .map(c -> c.sample() + " replicate " + c.replicate()).collect(Collectors.joining(", ")) + ".");
        }
        return out;
    }

    private static String target(Target t) {
        if (t instanceof Target.AmongInputs a) {
            return "sample '" + a.sample() + "': every other sample ranked as a mimic";
        }
        if (t instanceof Target.FromFile f) {
            return f.file() + ": every sample ranked as a mimic";
        }
        return "none";
    }
}
