package org.viscarta.compare;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;

/** Ranks candidate materials (references, or mimic candidates) by their distance to a sample. */
public final class Matcher {

    /**
     * A material to compare against.
     *
     * @param name  its name
     * @param clazz its class ("" when unknown)
     * @param curve its fitted curve, or null when no model converged
     */
    public record Candidate(String name, String clazz, FittedCurve curve) {
    }

    /**
     * One sample–candidate comparison.
     *
     * @param sample    sample name
     * @param reference candidate name
     * @param clazz     candidate class
     * @param rank      1 = closest; 0 when not comparable
     * @param result    the distance and its band
     */
    public record Match(String sample, String reference, String clazz, int rank, ReferenceDistance.Result result) {
    }

    /** References listed per sample in a report's tables and the workbench (the closest ones). */
    public static final int SHOWN = 5;

    private Matcher() {
    }

    /**
     * @return comparable candidates by increasing distance, then the others (rank 0) with the reason
     */
    public static List<Match> rank(String sampleName, FittedCurve sample, List<Candidate> candidates, ReferenceDistance rd) {
        return rank(sampleName, sample, candidates, rd, Integer.MAX_VALUE);
    }

    /**
     * As {@link #rank(String, FittedCurve, List, ReferenceDistance)}, with the distance's standard
     * error computed for the {@code uncertain} closest candidates only (NaN for the others): the
     * ranking is by distance alone, so it does not change.
     */
    public static List<Match> rank(String sampleName, FittedCurve sample, List<Candidate> candidates, ReferenceDistance rd,
                                   int uncertain) {
        List<Pending> comparable = new ArrayList<>();
        List<Match> others = new ArrayList<>();
        for (Candidate c : candidates) {
            if (sample == null) {
                others.add(new Match(sampleName, c.name(), c.clazz(), 0, missing("no model converged for the sample")));
            } else if (c.curve() == null) {
                others.add(new Match(sampleName, c.name(), c.clazz(), 0, missing("no model converged for the reference")));
            } else {
                ReferenceDistance.Result r = rd.between(sample, c.curve(), false);
                if (r.comparable()) {
                    comparable.add(new Pending(c, r));
                } else {
                    others.add(new Match(sampleName, c.name(), c.clazz(), 0, r));
                }
            }
        }
        comparable.sort(Comparator.comparingDouble(p -> p.result().distance()));
        List<Match> out = new ArrayList<>();
        for (int i = 0; i < comparable.size(); i++) {
            Pending p = comparable.get(i);
            ReferenceDistance.Result r = i < uncertain ? rd.withUncertainty(sample, p.candidate().curve(), p.result()) : p.result();
            out.add(new Match(sampleName, p.candidate().name(), p.candidate().clazz(), i + 1, r));
        }
        out.addAll(others);
        return out;
    }

    /** A comparable candidate before ranking. */
    private record Pending(Candidate candidate, ReferenceDistance.Result result) {
    }

    /**
     * Whether the closest and the second-closest candidate are distinguishable: their distances
     * differ by more than 1.96 combined standard errors (treating the two as independent, an
     * approximation: they share the sample's uncertainty).
     */
    public static String distinguishable(List<Match> ranked) {
        if (ranked.size() < 2 || ranked.get(1).rank() != 2) {
            return ranked.isEmpty() || ranked.get(0).rank() != 1 ? "no comparable candidate" : "only one comparable candidate";
        }
        ReferenceDistance.Result a = ranked.get(0).result();
        ReferenceDistance.Result b = ranked.get(1).result();
        if (!Double.isFinite(a.uncertainty()) || !Double.isFinite(b.uncertainty())) {
            return "unknown (a fit's covariance is singular)";
        }
        double z = (b.distance() - a.distance()) / Math.hypot(a.uncertainty(), b.uncertainty());
        return z > 1.96 ? String.format(Locale.ROOT, "yes: %s is closer than %s by %.2f standard errors",
                ranked.get(0).reference(), ranked.get(1).reference(), z)
                : String.format(Locale.ROOT, "no: %s and %s are within %.2f standard errors", ranked.get(0).reference(),
                ranked.get(1).reference(), z);
    }

    private static ReferenceDistance.Result missing(String why) {
        return new ReferenceDistance.Result(Double.NaN, Double.NaN, Double.NaN, Double.NaN, false, Double.NaN, Double.NaN,
                "not comparable: " + why);
    }
}
