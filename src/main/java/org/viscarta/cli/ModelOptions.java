package org.viscarta.cli;

import java.util.ArrayList;
import java.util.List;
import org.viscarta.Campaign;
import org.viscarta.fit.Weighting;
import org.viscarta.model.ModelCatalogue;
import picocli.CommandLine.Option;

/** {@code --models a,b,...}. */
final class ModelOptions {

    @Option(names = "--models", split = ",", paramLabel = "MODEL",
            description = "Candidate models, comma-separated (default: the whole catalogue). generalized-maxwell "
                    + "chooses its number of elements by AICc; generalized-maxwell:N fixes it (1–5).")
    List<String> models = new ArrayList<>();

    @Option(names = "--weighting", paramLabel = "log|relative|replicate-sd", defaultValue = "log",
            description = "Residuals: log (ln model − ln data, default), relative ((model − data)/data), or "
                    + "replicate-sd (log residuals divided by the replicates' SD at each frequency).")
    String weighting;

    Campaign.Settings applyTo(Campaign.Settings s) {
        Campaign.Settings m = models.isEmpty() ? s.withModels(ModelCatalogue.ids()) : s.withModels(models);
        return m.withWeighting(Weighting.parse(weighting));
    }
}
