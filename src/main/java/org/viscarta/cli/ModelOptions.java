package org.viscarta.cli;

import java.util.ArrayList;
import java.util.List;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.fit.Weighting;
import picocli.CommandLine.Option;

/** {@code --models a,b,...} and {@code --weighting}. */
final class ModelOptions {

    @Option(names = "--models", split = ",", paramLabel = "MODEL",
            description = "Candidate models, comma-separated (default: the whole catalogue). generalized-maxwell "
                    + "chooses its number of elements by AICc; generalized-maxwell:N fixes it (1–5).")
    List<String> models = new ArrayList<>();

    @Option(names = "--weighting", paramLabel = "log|relative|replicate-sd", defaultValue = "log",
            description = "Residuals: log (ln model − ln data, default), relative ((model − data)/data), or "
                    + "replicate-sd (log residuals divided by the replicates' SD at each frequency).")
    String weighting;

    AnalysisRequest.Builder applyTo(AnalysisRequest.Builder b) {
        if (!models.isEmpty()) {
            b.models(models);
        }
        return b.weighting(Weighting.parse(weighting));
    }
}
