package org.viscarta.quality;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.viscarta.sweep.Numbers;
import org.viscarta.sweep.Quantity;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;
import org.viscarta.sweep.Unit;

/**
 * Every quality check of a set of inputs: each frequency sweep's own checks, its film thickness,
 * its amplitude against the linear limit of the same sample's amplitude sweep, the replicates of
 * each sample against each other, and the linear range of each amplitude sweep.
 *
 */
public final class Assessment {

    private final List<SweepChecks.Check> sweepChecks;
    private final List<SweepChecks.Check> amplitudeChecks;
    private final List<LinearRange.Result> linearRanges;
    /** The frequency sweeps' checks by sample (display name), for the markers of large tables. */
    private final Map<String, List<SweepChecks.Check>> bySample = new java.util.HashMap<>();

    public Assessment(List<SweepChecks.Check> sweepChecks, List<SweepChecks.Check> amplitudeChecks,
                      List<LinearRange.Result> linearRanges) {
        this.sweepChecks = List.copyOf(sweepChecks);
        this.amplitudeChecks = List.copyOf(amplitudeChecks);
        this.linearRanges = List.copyOf(linearRanges);
        for (SweepChecks.Check c : this.sweepChecks) {
            bySample.computeIfAbsent(c.sample(), k -> new ArrayList<>()).add(c);
        }
    }

    /** The checks of the frequency sweeps, sample by sample, in input order. */
    public List<SweepChecks.Check> sweepChecks() {
        return sweepChecks;
    }

    /** One linear-range check per amplitude sweep. */
    public List<SweepChecks.Check> amplitudeChecks() {
        return amplitudeChecks;
    }

    /** The amplitude sweeps' results. */
    public List<LinearRange.Result> linearRanges() {
        return linearRanges;
    }

    private List<SweepChecks.Check> of(String sample) {
        return bySample.getOrDefault(sample, List.of());
    }

    /** Nothing checked. */
    public static Assessment none() {
        return new Assessment(List.of(), List.of(), List.of());
    }

    /** Every check: the frequency sweeps' first, then the amplitude sweeps'. */
    public List<SweepChecks.Check> checks() {
        List<SweepChecks.Check> all = new ArrayList<>(sweepChecks);
        all.addAll(amplitudeChecks);
        return all;
    }

    /**
     * @param samples         display name → the sample's replicate sweeps, in order
     * @param amplitudeSweeps amplitude sweeps read beside them
     * @param departure       the departure from the plateau that ends the linear range (0.05 for 5 %)
     */
    public static Assessment of(Map<String, List<Sweep>> samples, List<Sweep> amplitudeSweeps, double departure) {
        List<LinearRange.Result> ranges = new ArrayList<>();
        List<SweepChecks.Check> amplitudeRows = new ArrayList<>();
        for (Sweep a : amplitudeSweeps) {
            LinearRange.Result r = LinearRange.of(a, departure);
            ranges.add(r);
            amplitudeRows.add(rangeCheck(r));
        }
        // samples in parallel (each sweep's Kramers–Kronig fit is the cost), rows kept in input order
        List<SweepChecks.Check> out = new ArrayList<>(samples.entrySet().parallelStream().map(e -> {
            String name = e.getKey();
            List<SweepChecks.Check> rows = new ArrayList<>();
            Map<String, SweepChecks.Check> outliers = new LinkedHashMap<>();
            for (SweepChecks.Check c : ReplicateOutliers.of(e.getValue())) {
                outliers.put(c.replicate(), c.withSample(name));
            }
            for (Sweep s : e.getValue()) {
                for (SweepChecks.Check c : SweepChecks.of(s)) {
                    rows.add(c.withSample(name));
                }
                FilmThickness.of(s).ifPresent(c -> rows.add(c.withSample(name)));
                amplitudeCheck(s, ranges).ifPresent(c -> rows.add(c.withSample(name)));
                SweepChecks.Check o = outliers.get(s.replicate());
                if (o != null) {
                    rows.add(o);
                }
            }
            return rows;
        }).flatMap(List::stream).toList());
        return new Assessment(out, amplitudeRows, ranges);
    }

    /** The checks of one sample (by display name) that did not pass. */
    public List<SweepChecks.Check> concerns(String sample) {
        return of(sample).stream().filter(c -> c.verdict() != Verdict.PASS).toList();
    }

    /** What the checks say of an amplitude sweep, in a few words: its linear limit. */
    public String amplitudeMarker(String sample, String replicate) {
        for (int i = 0; i < linearRanges.size(); i++) {
            LinearRange.Result r = linearRanges.get(i);
            if (r.sample().equals(sample) && r.replicate().equals(replicate)) {
                SweepChecks.Check c = amplitudeChecks.get(i);
                return !r.hasPlateau() ? "amplitude sweep, " + c.verdict() + ": no linear plateau"
                        : r.linearThroughout() ? "amplitude sweep, linear throughout"
                        : "amplitude sweep, linear up to " + LinearRange.amplitudeText(r.quantity(), r.limit());
            }
        }
        return "";
    }

    /**
     * What the checks say of one frequency sweep, in a few words: "pass", or the worst verdict and
     * the checks concerned ("warn: replicate-outlier").
     */
    public String sweepMarker(String sample, String replicate) {
        List<SweepChecks.Check> mine = of(sample).stream().filter(c -> c.replicate().equals(replicate)).toList();
        if (mine.isEmpty()) {
            return "";
        }
        List<SweepChecks.Check> bad = mine.stream().filter(c -> c.verdict() != Verdict.PASS).toList();
        if (bad.isEmpty()) {
            return "pass";
        }
        Verdict worst = bad.stream().map(SweepChecks.Check::verdict).max(Enum::compareTo).orElseThrow();
        return worst + ": " + String.join(", ", bad.stream().map(SweepChecks.Check::check).distinct().toList());
    }

    /** The replicates flagged as outliers, as (sample display name, replicate). */
    public List<SweepChecks.Check> outliers() {
        return sweepChecks.stream().filter(c -> c.check().equals("replicate-outlier") && c.verdict() != Verdict.PASS).toList();
    }

    /**
     * A short marker for a sample in the Summary and the ranking: the worst verdict and the checks
     * concerned, e.g. "warn: replicate-outlier (replicate 2)"; "" when every check passed.
     */
    public String marker(String sample) {
        List<SweepChecks.Check> c = concerns(sample);
        if (c.isEmpty()) {
            return "";
        }
        Verdict worst = c.stream().map(SweepChecks.Check::verdict).max(Enum::compareTo).orElseThrow();
        Map<String, List<String>> byCheck = new LinkedHashMap<>();
        for (SweepChecks.Check k : c) {
            byCheck.computeIfAbsent(k.check(), x -> new ArrayList<>()).add(k.replicate());
        }
        long replicates = of(sample).stream().map(SweepChecks.Check::replicate).distinct().count();
        StringBuilder sb = new StringBuilder(worst.toString()).append(':');
        int[] n = {0};
        byCheck.forEach((k, reps) -> sb.append(n[0]++ == 0 ? " " : ", ").append(k).append(reps.size() == replicates && replicates > 1
                ? " (every replicate)" : replicates == 1 ? "" : " (replicate" + (reps.size() == 1 ? " " : "s ") + String.join(", ", reps) + ")"));
        return sb.toString();
    }

    private static SweepChecks.Check rangeCheck(LinearRange.Result r) {
        String at = String.format(Locale.ROOT, "amplitude sweep at %.3g Hz", r.frequencyHz());
        if (!r.hasPlateau()) {
            return new SweepChecks.Check(r.sample(), r.replicate(), "linear-range", Verdict.WARN, Double.NaN, Double.NaN, LinearRange.reportedUnit(r.quantity()),
                    at + ": E′ changes from the smallest amplitude on (" + LinearRange.amplitudeText(r.quantity(), r.minAmplitude())
                            + "), so no linear plateau was measured; start the sweep at a smaller amplitude");
        }
        String plateau = String.format(Locale.ROOT, "plateau E′ %s, E″ %s over %d points", Numbers.pascals(r.plateauStorage()),
                Numbers.pascals(r.plateauLoss()), r.plateauPoints());
        String cross = Double.isNaN(r.crossover()) ? "E″ stays below E′" : "E″ = E′ at " + LinearRange.amplitudeText(r.quantity(),
                r.crossover());
        if (r.linearThroughout()) {
            return new SweepChecks.Check(r.sample(), r.replicate(), "linear-range", Verdict.PASS, Double.NaN, Double.NaN, LinearRange.reportedUnit(r.quantity()),
                    String.format(Locale.ROOT, "%s: E′ stays within %.0f %% of its plateau up to the largest amplitude, %s; %s; %s",
                            at, 100 * r.departure(), LinearRange.amplitudeText(r.quantity(), r.maxAmplitude()), plateau, cross));
        }
        return new SweepChecks.Check(r.sample(), r.replicate(), "linear-range", Verdict.PASS,
                LinearRange.reported(r.quantity(), r.limit()), Double.NaN, LinearRange.reportedUnit(r.quantity()),
                String.format(Locale.ROOT,
                "%s: linear up to %s, where E′ leaves its plateau by %.0f %% (a common convention); %s; %s", at,
                LinearRange.amplitudeText(r.quantity(), r.limit()), 100 * r.departure(), plateau, cross));
    }

    /**
     * A frequency sweep's amplitude (constant points of an amplitude column, or a preamble line such
     * as {@code strain_amplitude: 1 %}) against the smallest linear limit of the same sample's
     * amplitude sweeps in the same quantity.
     */
    private static Optional<SweepChecks.Check> amplitudeCheck(Sweep s, List<LinearRange.Result> ranges) {
        for (Quantity q : List.of(Quantity.STRAIN_AMPLITUDE, Quantity.STRESS_AMPLITUDE, Quantity.FORCE_AMPLITUDE,
                Quantity.DISPLACEMENT_AMPLITUDE)) {
            double amplitude = amplitudeOf(s, q);
            if (Double.isNaN(amplitude)) {
                continue;
            }
            double limit = Double.POSITIVE_INFINITY;
            boolean any = false;
            for (LinearRange.Result r : ranges) {
                if (r.sample().equals(s.sample()) && r.quantity() == q && r.hasPlateau()) {
                    any = true;
                    limit = Math.min(limit, Double.isNaN(r.limit()) ? r.maxAmplitude() : r.limit());
                }
            }
            if (!any) {
                continue;
            }
            boolean above = amplitude > limit;
            return Optional.of(new SweepChecks.Check(s.sample(), s.replicate(), "linear-range", above ? Verdict.FAIL : Verdict.PASS,
                    LinearRange.reported(q, amplitude), LinearRange.reported(q, limit), LinearRange.reportedUnit(q),
                    String.format(Locale.ROOT,
                    "measured at %s; the linear range of this sample's amplitude sweep%s ends at %s%s",
                    LinearRange.amplitudeText(q, amplitude), ranges.stream().filter(r -> r.sample().equals(s.sample())).count() > 1
                            ? "s (the smallest)" : "", LinearRange.amplitudeText(q, limit),
                    above ? ": the sweep was measured outside the linear range and its moduli are not linear viscoelastic properties"
                            : "")));
        }
        return Optional.empty();
    }

    /** The sweep's amplitude in quantity q: the median of its points' amplitudes, or a preamble line; NaN when not stated. */
    static double amplitudeOf(Sweep s, Quantity q) {
        if (s.amplitudeQuantity().orElse(null) == q) {
            double[] a = s.points().stream().mapToDouble(SweepPoint::amplitude).filter(Double::isFinite).sorted().toArray();
            if (a.length > 0) {
                return a[a.length / 2];
            }
        }
        String v = s.metadata().get(q.canonical());
        if (v == null || (q == Quantity.STRAIN_AMPLITUDE && !v.contains("%") && !v.contains("-") && !v.contains("–"))) {
            return Double.NaN; // a strain without its unit (% or a fraction) is not guessed
        }
        try {
            return Unit.parse(v.strip(), q.dimension()).si();
        } catch (IllegalArgumentException e) {
            return Double.NaN;
        }
    }
}
