package org.viscarta.analysis;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

import org.viscarta.compare.Matcher;
import org.viscarta.fit.ModelFitter;
import org.viscarta.library.ReferenceLibrary;
import org.viscarta.map.MapAnalysis;
import org.viscarta.map.MapSetup;
import org.viscarta.model.ModelCatalogue;
import org.viscarta.model.ViscoelasticModel;
import org.viscarta.sweep.Sweep;

/**
 * The maps of every specimen among the inputs: each specimen's setup (image, registration, regions;
 * from the command line or its table's preamble) and its map.
 *
 * @param specimens each specimen mapped
 * @param models    the models fitted at each position (empty when none)
 */
public record Maps(List<Mapped> specimens, List<String> models) {

    /** The models fitted at each position when a library is given without models. */
    public static final List<String> LIBRARY_MODELS = List.of("springpot", "zener", "fractional-zener");

    /** One specimen's setup and map. */
    public record Mapped(MapSetup setup, MapAnalysis.Specimen specimen) {
    }

    /** No maps. */
    public static Maps none() {
        return new Maps(List.of(), List.of());
    }

    /**
     * @param modelIds candidate models at each position (empty: none, or {@link #LIBRARY_MODELS} with a library)
     * @param library  the reference library folder, or null
     */
    public static Maps of(List<Sweep> positioned, MapSetup.Given given, double frequencyHz, double alpha, List<String> modelIds,
                          Path library, ReadSettings reading) {
        List<String> ids = modelIds.isEmpty() && library != null ? LIBRARY_MODELS : modelIds;
        List<ViscoelasticModel> models = new ArrayList<>();
        for (String id : ids) {
            models.add(ModelCatalogue.byId(id).orElseThrow(() -> new org.viscarta.io.UsageException("unknown model '" + id
                    + "'; the models are " + String.join(", ", ModelCatalogue.ids()))));
        }
        List<Matcher.Candidate> refs = library == null ? List.of()
                : Analysis.candidates(ReferenceLibrary.open(library), models, new ModelFitter(), reading, Optional.empty());
        Map<String, List<Sweep>> bySpecimen = new LinkedHashMap<>();
        for (Sweep s : positioned) {
            bySpecimen.computeIfAbsent(s.sample(), k -> new ArrayList<>()).add(s);
        }
        List<Mapped> out = new ArrayList<>();
        for (List<Sweep> sweeps : bySpecimen.values()) {
            MapSetup setup = MapSetup.of(sweeps.get(0), given);
            MapAnalysis.Settings settings = new MapAnalysis.Settings(frequencyHz, alpha, setup.registration(), setup.regions(), models,
                    refs, MatchSettings.defaults().distance());
            out.add(new Mapped(setup, MapAnalysis.of(sweeps, settings).get(0)));
        }
        return new Maps(out, ids);
    }
}
