package org.viscarta.analysis;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.viscarta.compare.FittedCurve;
import org.viscarta.compare.Matcher;
import org.viscarta.fit.FitResult;
import org.viscarta.fit.ModelSelection;
import org.viscarta.fit.TimeDomain;

/**
 * Everything computed for one sample.
 *
 * @param sample  the sample
 * @param fits    every candidate model's fit with its AICc rank and Akaike weight (empty when fits were not asked for)
 * @param curve   the best-supported fitted curve, when a model converged
 * @param matches its closest references, closest first (empty without matching)
 * @param timeDomain every fitted model's E(t) and J(t) on the request's time grid (empty without one)
 */
public record SampleAnalysis(Sample sample, List<ModelSelection.Ranked> fits, Optional<FittedCurve> curve,
                             List<Matcher.Match> matches, List<TimeDomain.Point> timeDomain,
                             Optional<org.viscarta.spectrum.RelaxationSpectrum.Result> spectrum) {

    public SampleAnalysis {
        fits = List.copyOf(fits);
        matches = List.copyOf(matches);
        timeDomain = List.copyOf(timeDomain);
    }

    /** Without a spectrum. */
    public SampleAnalysis(Sample sample, List<ModelSelection.Ranked> fits, Optional<FittedCurve> curve,
                          List<Matcher.Match> matches, List<TimeDomain.Point> timeDomain) {
        this(sample, fits, curve, matches, timeDomain, Optional.empty());
    }

    SampleAnalysis withSpectrum(Optional<org.viscarta.spectrum.RelaxationSpectrum.Result> s) {
        return new SampleAnalysis(sample, fits, curve, matches, timeDomain, s);
    }

    /** The time-domain points of the best-supported model (empty when it has none). */
    public List<TimeDomain.Point> bestTimeDomain() {
        return best().map(b -> timeDomain.stream().filter(p -> p.model().equals(b.model())).toList()).orElse(List.of());
    }

    /** The best-supported model's entry, when any converged. */
    public Optional<ModelSelection.Ranked> bestRanked() {
        return fits.stream().filter(ModelSelection.Ranked::best).findFirst();
    }

    /** The best-supported fit, when any converged. */
    public Optional<FitResult> best() {
        return bestRanked().map(ModelSelection.Ranked::fit);
    }

    /** Models other than the best within ΔAICc &lt; 2 of it. */
    public List<String> alsoSupported() {
        List<String> out = new ArrayList<>();
        for (ModelSelection.Ranked rk : fits) {
            if (!rk.best() && rk.deltaAicc() < 2) {
                out.add(rk.fit().model());
            }
        }
        return out;
    }

    /** The closest comparable reference, when there is one. */
    public Optional<Matcher.Match> closest() {
        return matches.stream().filter(m -> m.rank() == 1).findFirst();
    }

    SampleAnalysis withMatches(List<Matcher.Match> m) {
        return new SampleAnalysis(sample, fits, curve, m, timeDomain, spectrum);
    }
}
