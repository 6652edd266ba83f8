package org.viscarta.cli;

import java.util.ArrayList;
import java.util.List;
import org.viscarta.Campaign;
import org.viscarta.model.ModelCatalogue;
import picocli.CommandLine.Option;

/** {@code --models a,b,...}. */
final class ModelOptions {

    @Option(names = "--models", split = ",", paramLabel = "MODEL",
            description = "Candidate models, comma-separated (default: all: springpot, maxwell, kelvin-voigt, zener).")
    List<String> models = new ArrayList<>();

    Campaign.Settings applyTo(Campaign.Settings s) {
        return models.isEmpty() ? s.withModels(ModelCatalogue.ids()) : s.withModels(models);
    }
}
