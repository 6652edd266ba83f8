package org.viscarta.sweep;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;

/** The {@code # key: value} lines of a file, kept. */
public final class Metadata {

    private Metadata() {
    }

    /**
     * An unmodifiable copy that keeps the order of the given map (the file's order, as the reader
     * gathers it). {@code Map.copyOf} would not: its order changes from one run of the JVM to the
     * next, and the report's Provenance, which lists these lines, then differed between two runs
     * on the same files.
     */
    public static Map<String, String> inFileOrder(Map<String, String> metadata) {
        Map<String, String> copy = new LinkedHashMap<>();
        metadata.forEach((k, v) -> copy.put(Objects.requireNonNull(k, "metadata key"), Objects.requireNonNull(v, "metadata value")));
        return Collections.unmodifiableMap(copy);
    }
}
