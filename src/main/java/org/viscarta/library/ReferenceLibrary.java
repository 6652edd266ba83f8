package org.viscarta.library;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.viscarta.io.InputCollector;
import org.viscarta.io.InputException;
import org.viscarta.io.SweepFile;
import org.viscarta.io.SweepReader;
import org.viscarta.sweep.Sweep;

/**
 * The folder of reference-material sweeps a lab keeps (PRODUCT.md "Reference library"): each file
 * is a sweep table whose metadata name at least {@code name}, {@code class}, {@code temperature}
 * and {@code method}. Opening the library validates every entry.
 */
public final class ReferenceLibrary {

    /** Metadata keys every reference must carry. */
    public static final List<String> REQUIRED_KEYS = List.of("name", "class", "temperature", "method");

    /**
     * One reference material.
     *
     * @param name  its unique name
     * @param clazz its class (gel, tissue, paint film, ...)
     * @param file  the sweep file it lives in
     * @param sha256 hex SHA-256 of that file
     * @param sweep the sweep itself
     */
    public record Entry(String name, String clazz, Path file, String sha256, Sweep sweep) {
    }

    private final Path folder;
    private final List<Entry> entries;

    private ReferenceLibrary(Path folder, List<Entry> entries) {
        this.folder = folder;
        this.entries = List.copyOf(entries);
    }

    /**
     * Reads and validates every sweep table under {@code folder}.
     *
     * @throws InputException for a missing folder, an unreadable entry, missing metadata or a duplicate name
     */
    public static ReferenceLibrary open(Path folder) {
        if (!Files.isDirectory(folder)) {
            throw new InputException(folder, 0, 0, "the reference library is not a folder; pass --library with the folder of reference sweeps");
        }
        SweepReader reader = new SweepReader(null);
        List<Entry> entries = new ArrayList<>();
        Map<String, Path> seen = new HashMap<>();
        for (Path file : InputCollector.collect(List.of(folder))) {
            SweepFile sf = reader.read(file);
            Map<String, String> meta = sf.info().metadata();
            for (String key : REQUIRED_KEYS) {
                String v = meta.get(key);
                if (v == null || v.isBlank()) {
                    throw new InputException(file, 1, 0, "reference material lacks '# " + key
                            + ": ...'; a library entry must name " + String.join(", ", REQUIRED_KEYS));
                }
            }
            if (sf.sweeps().size() != 1) {
                throw new InputException(file, sf.info().headerLine(), 0,
                        "a reference file holds one sweep; this one holds " + sf.sweeps().size());
            }
            String name = meta.get("name");
            Path other = seen.put(name, file);
            if (other != null) {
                throw new InputException(file, 1, 0, "reference name '" + name + "' is already used by " + other
                        + "; names in a library are unique");
            }
            entries.add(new Entry(name, meta.get("class"), file, sf.sha256(), sf.sweeps().get(0)));
        }
        return new ReferenceLibrary(folder, entries);
    }

    public Path folder() {
        return folder;
    }

    public List<Entry> entries() {
        return entries;
    }
}
