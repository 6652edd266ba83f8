package org.viscarta.analysis;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;

import org.viscarta.compare.FittedCurve;
import org.viscarta.fit.FitResult;
import org.viscarta.fit.ModelFitter;
import org.viscarta.fit.ModelSelection;
import org.viscarta.io.InputException;
import org.viscarta.model.ViscoelasticModel;
import org.viscarta.sweep.ModulusKind;
import org.viscarta.sweep.Numbers;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;
import org.viscarta.sweep.TimeTest;

/**
 * Time-domain tests made comparable with frequency sweeps. The tests of one sample, type and
 * temperature are fitted with every candidate model (replicates pooled) in the time domain; the
 * best-supported model is then fitted to each replicate alone, and each replicate's fitted model
 * gives E′ and E″ at the frequencies 1/(2πt) of its measured times. Those computed sweeps make a
 * sample of their own, named with its origin ("gel (relaxation)", "gel (creep)"), that is ranked and matched
 * like any other, while its fits, figure and Time-domain sheet show the measured M(t) or J(t).
 */
public final class TimeTests {

    /** The metadata key of a computed sweep that says where its moduli came from. */
    public static final String ORIGIN = "origin";
    private static final int POINTS_PER_DECADE = 5;

    private TimeTests() {
    }

    /**
     * A sample made from time-domain tests.
     *
     * @param sample   the computed sample (one replicate per test)
     * @param analysis its fits (time domain, replicates pooled) and the best model's curve
     * @param tests    the tests, as read (on the requested basis)
     * @param replicateFits each replicate's fit of the best-supported model, in test order
     */
    public record Derived(Sample sample, SampleAnalysis analysis, List<TimeTest> tests, List<FitResult> replicateFits) {

        /** The test type of all its tests. */
        public TimeTest.Type type() {
            return tests.get(0).type();
        }
    }

    /** The display name of the sample made from a sample's tests of this type. */
    public static String displayName(String sample, TimeTest.Type type) {
        return sample + " (" + type.label() + ")";
    }

    /** Where a computed sweep's moduli came from, or empty for a measured sweep. */
    public static Optional<String> origin(Sweep s) {
        return Optional.ofNullable(s.metadata().get(ORIGIN));
    }

    /**
     * Every sample's tests fitted and turned into computed sweeps.
     *
     * @param notes receives a line for each group whose tests no model could fit (those are left out)
     */
    static List<Derived> of(List<TimeTest> tests, List<ViscoelasticModel> models, ModelFitter fitter, ReadSettings reading,
                            List<String> notes) {
        Map<String, List<TimeTest>> groups = new LinkedHashMap<>();
        for (TimeTest t0 : tests) {
            TimeTest t = reading.basis().isPresent() ? toBasis(t0, reading.basis().get(), reading.poisson(), notes) : t0;
            String key = t.sample() + "\u0000" + t.type() + "\u0000" + (Double.isNaN(t.temperatureC()) ? "" : Math.round(t.temperatureC()));
            groups.computeIfAbsent(key, k -> new ArrayList<>()).add(t);
        }
        return groups.values().parallelStream().map(g -> derive(g, models, fitter, notes)).filter(d -> d != null).toList();
    }

    private static Derived derive(List<TimeTest> tests, List<ViscoelasticModel> models, ModelFitter fitter, List<String> notes) {
        TimeTest first = tests.get(0);
        String name = displayName(first.sample(), first.type());
        List<TimeTest.Point> pooled = new ArrayList<>();
        tests.forEach(t -> pooled.addAll(t.points()));
        pooled.sort(Comparator.comparingDouble(TimeTest.Point::timeS));
        List<FitResult> fits = new ArrayList<>();
        for (ViscoelasticModel m : models) {
            fits.add(fitter.fitTime(name, m, first.type(), pooled));
        }
        List<ModelSelection.Ranked> ranked = ModelSelection.rank(fits);
        Optional<ModelSelection.Ranked> best = ranked.stream().filter(ModelSelection.Ranked::best).findFirst();
        if (best.isEmpty() || best.get().fit().fitted() == null) {
            synchronized (notes) {
                notes.add("sample '" + first.sample() + "': its " + first.type().test() + " test could not be fitted by any "
                        + "candidate model, so it is not ranked or matched");
            }
            return null;
        }
        FitResult bestFit = best.get().fit();
        List<Sweep> replicates = new ArrayList<>();
        List<FitResult> replicateFits = new ArrayList<>();
        double temperature = tests.stream().mapToDouble(TimeTest::temperatureC).filter(Double::isFinite).average().orElse(Double.NaN);
        for (TimeTest t : tests) {
            FitResult own = fitter.fitTime(name, bestFit.fitted(), t.type(), t.points());
            boolean usable = own.converged() && own.fitted() != null;
            FitResult used = usable ? own : bestFit;
            replicateFits.add(own);
            double fLow = 1 / (2 * Math.PI * t.maxTimeS());
            double fHigh = 1 / (2 * Math.PI * t.minTimeS());
            int n = Math.max(5, (int) Math.ceil(Math.log10(fHigh / fLow) * POINTS_PER_DECADE) + 1);
            List<SweepPoint> pts = new ArrayList<>();
            double[] out = new double[2];
            for (int i = 0; i < n; i++) {
                double f = fLow * Math.pow(fHigh / fLow, i / (double) (n - 1));
                used.fitted().modulus(2 * Math.PI * f, used.values(), out);
                if (f > 0 && Double.isFinite(f) && out[0] > 0 && Double.isFinite(out[0]) && Double.isFinite(out[1])) {
                    pts.add(new SweepPoint(f, out[0], out[1], 0));
                }
            }
            if (pts.size() < 2) {
                continue;
            }
            Map<String, String> meta = new LinkedHashMap<>(t.metadata());
            meta.put(ORIGIN, String.format(Locale.ROOT, "computed from the %s test in %s (replicate %s, %d points, %s–%s s): "
                    + "E′ and E″ of %s %s fitted to it, at the frequencies 1/(2πt) of its times; not measured", t.type().test(),
                    t.source().getFileName(), t.replicate(), t.points().size(), Numbers.plain(t.minTimeS()),
                    Numbers.plain(t.maxTimeS()), usable ? "its own" : "the pooled", bestFit.model()));
            replicates.add(new Sweep(name, t.replicate(), t.group(), t.kind(), temperature, t.source(), meta, pts));
        }
        if (replicates.isEmpty()) {
            return null;
        }
        Sample sample = new Sample(name, first.group(), first.kind(), temperature, replicates);
        Optional<FittedCurve> curve = FittedCurve.of(bestFit, sample.minFrequencyHz(), sample.maxFrequencyHz(), temperature,
                first.kind());
        return new Derived(sample, new SampleAnalysis(sample, ranked, curve, List.of(), List.of()), List.copyOf(tests),
                List.copyOf(replicateFits));
    }

    /**
     * A test on the requested basis: M(t) scales as the moduli do, E(t) = 2(1 + ν)G(t), and J(t)
     * inversely — the same isotropic, frequency-independent ν as for sweeps.
     */
    static TimeTest toBasis(TimeTest t, ModulusKind target, OptionalDouble poissonOverride, List<String> notes) {
        if (t.kind() == target) {
            return t;
        }
        OptionalDouble nu = poissonOverride;
        if (nu.isEmpty() && t.metadata().containsKey("poisson_ratio")) {
            try {
                double v = Double.parseDouble(t.metadata().get("poisson_ratio").strip());
                nu = v > -1 && v <= 0.5 ? OptionalDouble.of(v) : OptionalDouble.empty();
            } catch (NumberFormatException e) {
                nu = OptionalDouble.empty();
            }
        }
        if (nu.isEmpty()) {
            throw new InputException(t.source(), t.points().get(0).line(), 0, "sample '" + t.sample() + "' holds a " + t.kind()
                    + " " + t.type().test() + " test and no Poisson's ratio is known to convert it to " + target
                    + "; add '# poisson_ratio: 0.5' to the file or pass --poisson");
        }
        double factor = 2.0 * (1.0 + nu.getAsDouble());
        double modulusFactor = target == ModulusKind.TENSILE ? factor : 1.0 / factor;
        double applied = t.type() == TimeTest.Type.RELAXATION ? modulusFactor : 1.0 / modulusFactor;
        List<TimeTest.Point> pts = new ArrayList<>();
        for (TimeTest.Point p : t.points()) {
            pts.add(new TimeTest.Point(p.timeS(), p.value() * applied, p.line()));
        }
        synchronized (notes) {
            notes.add(String.format(Locale.ROOT, "%s: sample '%s': %s %s converted to %s with E = 2(1 + ν)G, ν = %s", t.source(),
                    t.sample(), t.kind(), t.type().quantity(), target, Numbers.plain(nu.getAsDouble())));
        }
        return new TimeTest(t.sample(), t.replicate(), t.group(), target, t.type(), t.temperatureC(), t.source(), t.metadata(), pts);
    }

    /** The path of a test's file, for messages. */
    static Path sourceOf(Derived d) {
        return d.tests().get(0).source();
    }
}
