package org.viscarta.compare;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.function.Function;
import org.viscarta.sweep.Numbers;
import org.viscarta.sweep.SweepPoint;

/**
 * The damping ranking: each subject's replicate tan δ at the ranking point, highest first, with
 * the letter groups and group tests of {@link DampingComparison}, computed once.
 */
public final class DampingRanking {

    private DampingRanking() {
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

    /** What happens when a subject's measured range does not reach the ranking point. */
    public enum OutsideRange {
        /** No value is reported (the default). */
        NOT_REPORTED,
        /** The best-supported model gives the value, marked as such (not over a band). */
        BEST_MODEL
    }

    /**
     * What the ranking needs to know of a subject.
     *
     * @param name       display name
     * @param group      group label ("" when none)
     * @param replicates each replicate's fittable points
     * @param lowHz      lowest measured frequency of all replicates
     * @param highHz     highest measured frequency
     * @param best       the best-supported fitted curve, when one is known
     */
    public record Subject(String name, String group, List<List<SweepPoint>> replicates, double lowHz, double highHz,
                          Optional<FittedCurve> best) {
        public Subject {
            replicates = List.copyOf(replicates);
        }
    }

    /**
     * One row of the ranking.
     *
     * @param rank     1 = highest damping; 0 when not ranked
     * @param subject  what was ranked
     * @param name     its name
     * @param group    its group
     * @param replicateCount its number of replicates
     * @param tanDelta replicate summary of tan δ at the ranking point (null when none)
     * @param storage  mean M′ there [Pa] (NaN when none)
     * @param loss     mean M″ there [Pa]
     * @param source   where the value came from
     * @param note     what the reader should know
     * @param values   the replicate tan δ values behind the summary
     * @param letters  letter group ("" when not ranked): subjects sharing a letter are not distinguishable
     */
    public record Row<S>(int rank, S subject, String name, String group, int replicateCount, ReplicateSummary tanDelta,
                         double storage, double loss, ValueSource source, String note, double[] values, String letters) {
        public Row {
            values = values.clone();
        }

        @Override
        public double[] values() {
            return values.clone();
        }

        /** The number of values behind the summary, or the replicates when none. */
        public int n() {
            return tanDelta == null ? replicateCount : tanDelta.n();
        }

        /** The same row listed but not ranked, with a note saying why. */
        public Row<S> unranked(String why) {
            return new Row<>(0, subject, name, group, replicateCount, tanDelta, storage, loss, source,
                    note.isEmpty() ? why : why + "; " + note, values, "");
        }

        Row<S> withRankAndLetters(int newRank, String newLetters) {
            return new Row<>(newRank, subject, name, group, replicateCount, tanDelta, storage, loss, source, note, values, newLetters);
        }
    }

    /**
     * The ranking and the comparison behind its letters.
     *
     * @param rows       ranked rows first (highest tan δ first), then those without a value
     * @param comparison pairwise tests, letters and group tests over the ranked rows
     */
    public record Result<S>(List<Row<S>> rows, DampingComparison.Result comparison) {
        public Result {
            rows = List.copyOf(rows);
        }
    }

    /**
     * Ranks subjects by mean replicate tan δ at the ranking point, highest damping first.
     *
     * @param subjects what to rank, in input order
     * @param view     what the ranking needs of each subject
     * @param point    one frequency or a band
     * @param outside  what to do when a subject's range does not cover the point
     * @param alpha    significance level of the pairwise and group tests
     */
    public static <S> Result<S> rank(List<S> subjects, Function<S, Subject> view, RankingPoint point, OutsideRange outside,
                                     double alpha) {
        List<Row<S>> rows = new ArrayList<>();
        for (S subject : subjects) {
            rows.add(row(subject, view.apply(subject), point, outside));
        }
        List<Row<S>> ranked = new ArrayList<>(rows.stream().filter(r -> r.tanDelta() != null)
                .sorted(Comparator.comparingDouble((Row<S> r) -> r.tanDelta().mean()).reversed()).toList());
        DampingComparison.Result cmp = DampingComparison.compare(ranked.stream().map(Row::name).toList(),
                ranked.stream().map(Row::group).toList(), ranked.stream().map(Row::values).toList(), alpha);
        List<Row<S>> out = new ArrayList<>();
        for (int i = 0; i < ranked.size(); i++) {
            out.add(ranked.get(i).withRankAndLetters(i + 1, cmp.letters().get(i)));
        }
        rows.stream().filter(r -> r.tanDelta() == null).forEach(out::add);
        return new Result<>(out, cmp);
    }

    private static <S> Row<S> row(S subject, Subject s, RankingPoint point, OutsideRange outside) {
        List<LossTangentAt.Value> values = new ArrayList<>();
        int missing = 0;
        for (List<SweepPoint> r : s.replicates()) {
            Optional<LossTangentAt.Value> v = point.valueOf(r);
            if (v.isPresent()) {
                values.add(v.get());
            } else {
                missing++;
            }
        }
        if (!values.isEmpty()) {
            String note = missing == 0 ? "" : String.format(Locale.ROOT, "%d of %d replicates do not cover %s and are left out",
                    missing, s.replicates().size(), point.describe());
            return valued(subject, s, values, ValueSource.MEASURED, note);
        }
        String range = String.format(Locale.ROOT, "measured %s–%s Hz", Numbers.readable(s.lowHz()), Numbers.readable(s.highHz()));
        boolean modelMaySpeak = outside == OutsideRange.BEST_MODEL && point instanceof RankingPoint.At;
        if (modelMaySpeak && s.best().isPresent()) {
            FittedCurve curve = s.best().get();
            double at = point.representativeHz();
            double[] m = curve.modulus(curve.params(), at);
            return valued(subject, s, List.of(new LossTangentAt.Value(at, m[0], m[1])), ValueSource.MODEL,
                    range + "; value from the " + curve.model().id() + " model, not from data");
        }
        String why = point instanceof RankingPoint.Band ? ""
                : modelMaySpeak ? " (no model converged)" : " (--model-outside-range lets the best model speak)";
        return new Row<>(0, subject, s.name(), s.group(), s.replicates().size(), null, Double.NaN, Double.NaN, ValueSource.NONE,
                range + "; " + point.describe() + " is outside it, so tan δ is not reported" + why, new double[0], "");
    }

    private static <S> Row<S> valued(S subject, Subject s, List<LossTangentAt.Value> values, ValueSource source, String note) {
        double[] tan = values.stream().mapToDouble(LossTangentAt.Value::lossTangent).toArray();
        double storage = values.stream().mapToDouble(LossTangentAt.Value::storage).average().orElse(Double.NaN);
        double loss = values.stream().mapToDouble(LossTangentAt.Value::loss).average().orElse(Double.NaN);
        return new Row<>(0, subject, s.name(), s.group(), s.replicates().size(), ReplicateSummary.of(tan), storage, loss, source,
                note, tan, "");
    }
}
