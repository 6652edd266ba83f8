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

    private Matcher() {
    }

    /**
     * @return comparable candidates by increasing distance, then the others (rank 0) with the reason
     */
    public static List<Match> rank(String sampleName, FittedCurve sample, List<Candidate> candidates, ReferenceDistance rd) {
        List<Match> comparable = new ArrayList<>();
        List<Match> others = new ArrayList<>();
        for (Candidate c : candidates) {
            if (sample == null) {
                others.add(new Match(sampleName, c.name(), c.clazz(), 0, missing("no model converged for the sample")));
            } else if (c.curve() == null) {
                others.add(new Match(sampleName, c.name(), c.clazz(), 0, missing("no model converged for the reference")));
            } else {
                ReferenceDistance.Result r = rd.between(sample, c.curve());
                (r.comparable() ? comparable : others).add(new Match(sampleName, c.name(), c.clazz(), 0, r));
            }
        }
        comparable.sort(Comparator.comparingDouble(m -> m.result().distance()));
        List<Match> out = new ArrayList<>();
        for (int i = 0; i < comparable.size(); i++) {
            Match m = comparable.get(i);
            out.add(new Match(m.sample(), m.reference(), m.clazz(), i + 1, m.result()));
        }
        out.addAll(others);
        return out;
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
