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
        register(new EmpiricalPowerLaw());
        register(new SpringpotDashpot());
        register(new Maxwell());
        register(new KelvinVoigt());
        register(new Zener());
        register(new Burgers());
        register(new GeneralizedMaxwell(0));
        register(new FractionalKelvinVoigt());
        register(new FractionalMaxwell());
        register(new FractionalZener());
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

    /**
     * The model with this identifier; {@code generalized-maxwell:N} fixes the number of elements
     * (1 to 5), plain {@code generalized-maxwell} lets AICc choose it.
     */
    public static Optional<ViscoelasticModel> byId(String id) {
        String prefix = "generalized-maxwell:";
        if (id.startsWith(prefix)) {
            try {
                int n = Integer.parseInt(id.substring(prefix.length()));
                return n >= 1 && n <= GeneralizedMaxwell.MAX_ELEMENTS ? Optional.of(new GeneralizedMaxwell(n)) : Optional.empty();
            } catch (NumberFormatException e) {
                return Optional.empty();
            }
        }
        return Optional.ofNullable(MODELS.get(id));
    }

    /** Identifiers of every implemented model. */
    public static List<String> ids() {
        return List.copyOf(MODELS.keySet());
    }
}
