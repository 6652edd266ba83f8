package org.viscarta.model;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/** The one registry of models by identifier. */
public final class ModelCatalogue {

    private static final Map<String, ViscoelasticModel> MODELS = new LinkedHashMap<>();

    static {
        register(new Springpot());
        register(new Maxwell());
        register(new KelvinVoigt());
        register(new Zener());
    }

    private ModelCatalogue() {
    }

    private static void register(ViscoelasticModel m) {
        MODELS.put(m.id(), m);
    }

    /** Every implemented model, in catalogue order. */
    public static List<ViscoelasticModel> all() {
        return List.copyOf(MODELS.values());
    }

    /** The model with this identifier. */
    public static Optional<ViscoelasticModel> byId(String id) {
        return Optional.ofNullable(MODELS.get(id));
    }

    /** Identifiers of every implemented model. */
    public static List<String> ids() {
        return List.copyOf(MODELS.keySet());
    }
}
