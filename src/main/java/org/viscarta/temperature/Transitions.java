package org.viscarta.temperature;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.viscarta.compare.DampingComparison;
import org.viscarta.compare.ReplicateSummary;
import org.viscarta.sweep.Numbers;
import org.viscarta.sweep.Ramp;

/**
 * The glass transitions of a set of temperature ramps: each ramp's three conventions
 * ({@link GlassTransition}), each sample's apparent activation energy from its peaks at several
 * frequencies ({@link ActivationEnergy}), and the comparison of samples within comparable sets —
 * one frequency and one convention (or the tan δ peak height) — by the same Welch/Holm letters and
 * group tests as the damping ranking.
 *
 * @param results     one per ramp: samples in reading order, then by frequency and replicate
 * @param activations one per sample with ramps and per peak convention
 * @param sets        the comparable sets, by frequency then measure
 */
public record Transitions(List<GlassTransition.Result> results, List<Activation> activations, List<RankedSet> sets) {

    public Transitions {
        results = List.copyOf(results);
        activations = List.copyOf(activations);
        sets = List.copyOf(sets);
    }

    /** No ramps. */
    public static Transitions none() {
        return new Transitions(List.of(), List.of(), List.of());
    }

    public boolean isEmpty() {
        return results.isEmpty();
    }

    /** What a comparable set compares. */
    public enum Measure {
        TG_ONSET("Tg (E′ onset)", "°C", "has a higher Tg (E′ onset) than"),
        TG_LOSS_PEAK("Tg (E″ peak)", "°C", "has a higher Tg (E″ peak) than"),
        TG_TAN_DELTA_PEAK("Tg (tan δ peak)", "°C", "has a higher Tg (tan δ peak) than"),
        PEAK_HEIGHT("tan δ peak height", "", "has a higher tan δ peak than");

        private final String label;
        private final String unit;
        private final String higher;

        Measure(String label, String unit, String higher) {
            this.label = label;
            this.unit = unit;
            this.higher = higher;
        }

        public String label() {
            return label;
        }

        public String unit() {
            return unit;
        }

        DampingComparison.Wording wording() {
            return new DampingComparison.Wording(label, higher,
                    "Every sample differs from every other in " + label + "; the order is supported throughout.");
        }

        /** This measure's value in one ramp's result (NaN when not found). */
        public double of(GlassTransition.Result r) {
            return switch (this) {
                case TG_ONSET -> r.onset().valueC();
                case TG_LOSS_PEAK -> r.lossPeak().valueC();
                case TG_TAN_DELTA_PEAK -> r.tanDeltaPeak().valueC();
                case PEAK_HEIGHT -> r.peakHeight();
            };
        }
    }

    /**
     * A sample's apparent activation energy by one peak convention.
     *
     * @param sample     the sample
     * @param convention the peak whose temperatures were used
     * @param energy     the estimate, null when it cannot be made
     * @param problem    why not ("" when made)
     */
    public record Activation(String sample, GlassTransition.Convention convention, ActivationEnergy energy, String problem) {
    }

    /**
     * One sample in a comparable set.
     *
     * @param rank    1 for the highest mean
     * @param sample  the sample
     * @param group   its group ("" when none)
     * @param values  its replicate values' summary
     * @param letters its letters ("–" when it has one replicate)
     */
    public record RankedRow(int rank, String sample, String group, ReplicateSummary values, String letters) {
    }

    /**
     * One comparable set: one frequency, one measure.
     *
     * @param frequencyHz the frequency
     * @param measure     what is compared
     * @param rows        highest mean first
     * @param statements  the conclusions in words
     * @param missing     samples with ramps at this frequency but no value of the measure, with why
     */
    public record RankedSet(double frequencyHz, Measure measure, List<RankedRow> rows, List<String> statements,
                            List<String> missing) {
        public RankedSet {
            rows = List.copyOf(rows);
            statements = List.copyOf(statements);
            missing = List.copyOf(missing);
        }

        /** "Tg (tan δ peak) at 1 Hz". */
        public String label() {
            return measure.label() + " at " + Numbers.plain(frequencyHz) + " Hz";
        }
    }

    /** Analyses the ramps (in parallel) and compares the samples at significance level {@code alpha}. */
    public static Transitions of(List<Ramp> ramps, double alpha) {
        List<String> order = ramps.stream().map(Ramp::sample).distinct().toList();
        List<Ramp> sorted = new ArrayList<>(ramps);
        sorted.sort(Comparator.comparingInt((Ramp r) -> order.indexOf(r.sample())).thenComparingDouble(Ramp::frequencyHz)
                .thenComparing(Ramp::replicate));
        List<GlassTransition.Result> results = sorted.parallelStream().map(GlassTransition::of).toList();
        Map<String, List<GlassTransition.Result>> bySample = new LinkedHashMap<>();
        for (GlassTransition.Result r : results) {
            bySample.computeIfAbsent(r.ramp().sample(), k -> new ArrayList<>()).add(r);
        }
        List<Activation> activations = new ArrayList<>();
        for (Map.Entry<String, List<GlassTransition.Result>> e : bySample.entrySet()) {
            long frequencies = distinctFrequencies(e.getValue()).size();
            if (frequencies < 2) {
                continue;
            }
            for (GlassTransition.Convention c : List.of(GlassTransition.Convention.LOSS_PEAK, GlassTransition.Convention.TAN_DELTA_PEAK)) {
                List<ActivationEnergy.Point> pts = e.getValue().stream().filter(r -> r.estimate(c).found())
                        .map(r -> new ActivationEnergy.Point(r.ramp().frequencyHz(), r.estimate(c).valueC())).toList();
                ActivationEnergy ea = ActivationEnergy.of(pts);
                String problem = ea != null ? "" : pts.stream().mapToDouble(ActivationEnergy.Point::frequencyHz).distinct().count() < 2
                        ? "the " + c.label() + " was found at fewer than two frequencies"
                        : pts.size() < 3 ? "fewer than three " + c.label() + " temperatures"
                        : "the " + c.label() + " does not move to higher temperatures at higher frequencies";
                activations.add(new Activation(e.getKey(), c, ea, problem));
            }
        }
        List<RankedSet> sets = new ArrayList<>();
        for (double hz : distinctFrequencies(results)) {
            List<GlassTransition.Result> at = results.stream().filter(r -> sameFrequency(r.ramp().frequencyHz(), hz)).toList();
            for (Measure m : Measure.values()) {
                RankedSet set = rank(at, hz, m, alpha);
                if (set != null) {
                    sets.add(set);
                }
            }
        }
        return new Transitions(results, activations, sets);
    }

    private static RankedSet rank(List<GlassTransition.Result> at, double hz, Measure m, double alpha) {
        Map<String, List<Double>> values = new LinkedHashMap<>();
        Map<String, String> groups = new LinkedHashMap<>();
        List<String> missing = new ArrayList<>();
        Map<String, List<GlassTransition.Result>> bySample = new LinkedHashMap<>();
        for (GlassTransition.Result r : at) {
            bySample.computeIfAbsent(r.ramp().sample(), k -> new ArrayList<>()).add(r);
        }
        for (Map.Entry<String, List<GlassTransition.Result>> e : bySample.entrySet()) {
            List<Double> v = e.getValue().stream().map(m::of).filter(Double::isFinite).toList();
            if (v.isEmpty()) {
                GlassTransition.Result first = e.getValue().get(0);
                String why = m == Measure.PEAK_HEIGHT ? first.tanDeltaPeak().problem() : first.estimate(convention(m)).problem();
                missing.add(e.getKey() + ": " + why);
                continue;
            }
            values.put(e.getKey(), v);
            groups.put(e.getKey(), e.getValue().get(0).ramp().group());
        }
        if (values.size() < 2) {
            return null;
        }
        List<String> names = new ArrayList<>(values.keySet());
        names.sort(Comparator.comparingDouble((String n) -> -values.get(n).stream().mapToDouble(Double::doubleValue).average()
                .orElse(Double.NaN)).thenComparing(Comparator.naturalOrder()));
        List<double[]> arrays = names.stream().map(n -> values.get(n).stream().mapToDouble(Double::doubleValue).toArray()).toList();
        DampingComparison.Result cmp = DampingComparison.compare(names, names.stream().map(groups::get).toList(), arrays, alpha,
                m.wording());
        List<RankedRow> rows = new ArrayList<>();
        for (int i = 0; i < names.size(); i++) {
            rows.add(new RankedRow(i + 1, names.get(i), groups.get(names.get(i)), ReplicateSummary.of(arrays.get(i)),
                    cmp.letters().get(i)));
        }
        return new RankedSet(hz, m, rows, cmp.statements(), missing);
    }

    private static GlassTransition.Convention convention(Measure m) {
        return switch (m) {
            case TG_ONSET -> GlassTransition.Convention.STORAGE_ONSET;
            case TG_LOSS_PEAK -> GlassTransition.Convention.LOSS_PEAK;
            case TG_TAN_DELTA_PEAK, PEAK_HEIGHT -> GlassTransition.Convention.TAN_DELTA_PEAK;
        };
    }

    /** The activation energy of a sample by a convention, if estimated. */
    public java.util.Optional<ActivationEnergy> activation(String sample, GlassTransition.Convention c) {
        return activations.stream().filter(a -> a.sample().equals(sample) && a.convention() == c && a.energy() != null)
                .map(Activation::energy).findFirst();
    }

    private static List<Double> distinctFrequencies(List<GlassTransition.Result> results) {
        List<Double> out = new ArrayList<>();
        for (GlassTransition.Result r : results) {
            double hz = r.ramp().frequencyHz();
            if (out.stream().noneMatch(f -> sameFrequency(f, hz))) {
                out.add(hz);
            }
        }
        out.sort(Comparator.naturalOrder());
        return out;
    }

    private static boolean sameFrequency(double a, double b) {
        return Math.abs(a - b) <= 1e-3 * Math.max(Math.abs(a), Math.abs(b));
    }

    /** A one-line description of where a ramp's conventions came out, for terminals and notes. */
    public static String describe(GlassTransition.Result r) {
        StringBuilder sb = new StringBuilder();
        for (GlassTransition.Convention c : GlassTransition.Convention.values()) {
            GlassTransition.Estimate e = r.estimate(c);
            sb.append(sb.length() == 0 ? "" : "; ").append(c.label()).append(' ')
                    .append(e.found() ? String.format(Locale.ROOT, "%.1f ± %.1f °C", e.valueC(), e.stdError()) : "not found");
        }
        return sb.toString();
    }
}
