package org.viscarta.report;

import java.util.LinkedHashMap;
import java.util.Map;

/**
 * What a reader needs to trace a result back: the tool version, the exact command line, when it
 * ran (UTC), and every setting by name.
 *
 * @param toolVersion Viscarta's version
 * @param commandLine the full command line as typed (arguments quoted where they hold spaces)
 * @param runAtUtc    ISO-8601 UTC time of the run
 * @param settings    every setting, in a stable order
 */
public record Provenance(String toolVersion, String commandLine, String runAtUtc, Map<String, String> settings) {

    public Provenance {
        settings = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(settings));
    }
}
