package org.viscarta.analysis;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.IdentityHashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Function;
import org.viscarta.compare.DampingRanking;
import org.viscarta.compare.RankingPoint;
import org.viscarta.sweep.Numbers;

/**
 * The damping ranking within comparable sets: samples on the same modulus basis, measured at
 * temperatures within a tolerance of each other (and, when asked, in the same group), each set
 * ranked with its own letters and group tests. Samples of a temperature series are the series'
 * own data and are listed, not ranked; a sample alone in its set is listed and says so.
 *
 * @param sets     the sets with two or more samples, largest first
 * @param unranked the samples listed but not ranked, each with a note saying why
 */
public record Ranking(List<RankedSet> sets, List<DampingRanking.Row<Sample>> unranked) {

    /**
     * One comparable set and its ranking.
     *
     * @param label  what the set is, e.g. "23 °C, tensile"
     * @param result its ranking, letters and group tests
     */
    public record RankedSet(String label, DampingRanking.Result<Sample> result) {
    }

    public Ranking {
        sets = List.copyOf(sets);
        unranked = List.copyOf(unranked);
    }

    /** Every row: each set's in ranking order, set after set, then the samples not ranked. */
    public List<DampingRanking.Row<Sample>> rows() {
        List<DampingRanking.Row<Sample>> out = new ArrayList<>();
        sets.forEach(s -> out.addAll(s.result().rows()));
        out.addAll(unranked);
        return out;
    }

    /** The label of the set a sample was ranked in, when it was. */
    public Map<Sample, String> setLabels() {
        Map<Sample, String> out = new IdentityHashMap<>();
        for (RankedSet s : sets) {
            s.result().rows().forEach(r -> out.put(r.subject(), s.label()));
        }
        return out;
    }

    /**
     * Ranks the samples set by set.
     *
     * @param samples   every sample, in reading order
     * @param series    samples that are one temperature of a temperature series (not ranked)
     * @param view      what the ranking needs of each sample
     * @param point     where tan δ is taken
     * @param outside   what to do outside a sample's measured range
     * @param alpha     significance level
     * @param tolerance largest temperature difference within a set [°C]
     * @param byGroup   whether a set holds one group only
     */
    static Ranking of(List<Sample> samples, java.util.Set<Sample> series, Function<Sample, DampingRanking.Subject> view,
                      RankingPoint point, DampingRanking.OutsideRange outside, double alpha, double tolerance, boolean byGroup) {
        Map<String, List<Sample>> byKey = new LinkedHashMap<>();
        List<DampingRanking.Row<Sample>> unranked = new ArrayList<>();
        List<Sample> seriesMembers = new ArrayList<>();
        for (Sample s : samples) {
            if (series.contains(s)) {
                seriesMembers.add(s);
                continue;
            }
            byKey.computeIfAbsent(s.kind() + (byGroup ? "\u0000" + s.group() : ""), k -> new ArrayList<>()).add(s);
        }
        List<RankedSet> sets = new ArrayList<>();
        for (List<Sample> sameBasis : byKey.values()) {
            for (List<Sample> set : byTemperature(sameBasis, tolerance)) {
                String label = label(set, byGroup);
                if (set.size() < 2) {
                    DampingRanking.Result<Sample> alone = DampingRanking.rank(set, view, point, outside, alpha);
                    alone.rows().forEach(r -> unranked.add(r.unranked("no other sample in its comparable set (" + label
                            + ") to rank it against")));
                    continue;
                }
                sets.add(new RankedSet(label, DampingRanking.rank(set, view, point, outside, alpha)));
            }
        }
        if (!seriesMembers.isEmpty()) {
            DampingRanking.Result<Sample> own = DampingRanking.rank(seriesMembers, view, point, outside, alpha);
            own.rows().forEach(r -> unranked.add(r.unranked("one temperature of a temperature series: the series' own data, "
                    + "not ranked (its master curve is)")));
        }
        sets.sort(Comparator.comparingInt((RankedSet s) -> -s.result().rows().size()));
        return new Ranking(sets, unranked);
    }

    /** Splits samples into runs of temperatures within {@code tolerance} of the run's lowest; unknown temperatures together. */
    private static List<List<Sample>> byTemperature(List<Sample> samples, double tolerance) {
        List<Sample> known = samples.stream().filter(s -> Double.isFinite(s.temperatureC()))
                .sorted(Comparator.comparingDouble(Sample::temperatureC)).toList();
        List<List<Sample>> out = new ArrayList<>();
        List<Sample> current = new ArrayList<>();
        for (Sample s : known) {
            if (!current.isEmpty() && s.temperatureC() - current.get(0).temperatureC() > tolerance) {
                out.add(current);
                current = new ArrayList<>();
            }
            current.add(s);
        }
        if (!current.isEmpty()) {
            out.add(current);
        }
        List<Sample> unknown = samples.stream().filter(s -> !Double.isFinite(s.temperatureC())).toList();
        if (!unknown.isEmpty()) {
            out.add(unknown);
        }
        // keep reading order within a set (the ranking orders them by tan δ)
        List<List<Sample>> ordered = new ArrayList<>();
        for (List<Sample> set : out) {
            java.util.Set<Sample> members = java.util.Collections.newSetFromMap(new IdentityHashMap<>());
            members.addAll(set);
            ordered.add(samples.stream().filter(members::contains).toList());
        }
        return ordered;
    }

    private static String label(List<Sample> set, boolean byGroup) {
        double lo = set.stream().mapToDouble(Sample::temperatureC).min().orElse(Double.NaN);
        double hi = set.stream().mapToDouble(Sample::temperatureC).max().orElse(Double.NaN);
        String t = !Double.isFinite(lo) ? "temperature not stated"
                : lo == hi ? Numbers.plain(lo) + " °C" : Numbers.plain(lo) + "–" + Numbers.plain(hi) + " °C";
        String group = byGroup && !set.get(0).group().isEmpty() ? ", group " + set.get(0).group() : "";
        return t + ", " + set.get(0).kind() + group;
    }
}
