package org.viscarta.io;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The preamble of one block of a sweep table: '# key: value' lines and unmarked 'key: value',
 * 'key&lt;separator&gt;value' lines read into metadata (keys as Viscarta reads them, in their common
 * spellings), the rest kept as notes for the provenance.
 */
final class Preamble {
    final Path path;
    final Map<String, String> metadata = new LinkedHashMap<>();
    final Map<String, Integer> lines = new LinkedHashMap<>();
    final Map<String, String> notes = new LinkedHashMap<>();
    final List<TableStart.Line> seen = new ArrayList<>();
    boolean any;

    Preamble(Path path) {
        this.path = path;
    }

    /** A later block keeps the first block's settings but not its sample and replicate. */
    void inherit(Map<String, String> first) {
        first.forEach((k, v) -> {
            if (!k.equals("sample") && !k.equals("replicate")) {
                metadata.put(k, v);
            }
        });
    }

    void reset() {
        metadata.clear();
        lines.clear();
        notes.clear();
    }

    void hash(TableStart.Line l) {
        for (String key : parseMetadataLine(l.text().strip().substring(1), metadata)) {
            String canonical = PREAMBLE_KEYS.getOrDefault(key, key);
            if (!canonical.equals(key)) {
                if (metadata.containsKey(canonical)) {
                    continue; // the key as Viscarta writes it wins over another spelling
                }
                metadata.put(canonical, metadata.remove(key));
            }
            lines.put(canonical, l.number());
        }
    }

    /** An unmarked preamble line: 'key: value', 'key&lt;sep&gt;value [unit]', or a title. */
    void plain(TableStart.Line l, List<String> cells) {
        String key;
        String value;
        List<String> filled = cells.stream().filter(c -> !c.isEmpty()).toList();
        if (filled.isEmpty()) {
            return;
        }
        String c0 = filled.get(0);
        int colon = c0.indexOf(':');
        if (colon > 0 && (filled.size() == 1 || colon < c0.length() - 1)) {
            key = c0.substring(0, colon);
            value = (c0.substring(colon + 1) + " " + String.join(" ", filled.subList(1, filled.size()))).strip();
        } else if (filled.size() >= 2) {
            key = c0;
            value = String.join(" ", filled.subList(1, filled.size()));
        } else {
            notes.put("line_" + l.number(), c0);
            return;
        }
        Matcher unit = KEY_UNIT.matcher(key.strip());
        if (unit.matches()) {
            key = unit.group(1);
            if (!value.isEmpty() && TableStart.isPlainNumber(value.replace(',', '.'))) {
                value = value + " " + unit.group(2).strip();
            }
        }
        String k = key.strip().toLowerCase(Locale.ROOT).replaceAll("[\\s-]+", "_").replaceAll("[:.]+$", "");
        String canonical = PREAMBLE_KEYS.get(k);
        if (canonical != null && !value.isEmpty()) {
            metadata.put(canonical, value);
            lines.put(canonical, l.number());
        } else if (!k.isEmpty()) {
            notes.put(k, value);
        }
    }

    static final Pattern KEY_UNIT = Pattern.compile("^(.*?)\\s*[\\[(]([^\\])]*)[\\])]\\s*$");

    /**
     * Preamble keys understood in their common spellings (lower case, spaces as underscores), and the
     * metadata key each stands for; other keys are kept as notes.
     */
    static final Map<String, String> PREAMBLE_KEYS = Map.ofEntries(
            Map.entry("sample", "sample"), Map.entry("sample_name", "sample"), Map.entry("specimen", "sample"),
            Map.entry("specimen_name", "sample"), Map.entry("sample_id", "sample"), Map.entry("specimen_id", "sample"),
            Map.entry("temperature", "temperature"), Map.entry("temp", "temperature"), Map.entry("test_temperature", "temperature"),
            Map.entry("sample_temperature", "temperature"), Map.entry("set_temperature", "temperature"),
            Map.entry("replicate", "replicate"), Map.entry("repeat", "replicate"), Map.entry("group", "group"),
            Map.entry("geometry", "geometry"), Map.entry("measuring_system", "geometry"), Map.entry("probe", "geometry"),
            Map.entry("poisson_ratio", "poisson_ratio"), Map.entry("poisson's_ratio", "poisson_ratio"),
            Map.entry("method", "method"), Map.entry("test_method", "method"), Map.entry("modulus", "modulus"),
            Map.entry("heating_rate", "heating_rate"), Map.entry("ramp_rate", "heating_rate"), Map.entry("rate", "heating_rate"));

    /** Parses "key: value" or "key: value; key: value" (geometry lines). Keys lower-case, spaces as underscores. */
    static List<String> parseMetadataLine(String body, Map<String, String> out) {
        List<String> keys = new ArrayList<>();
        for (String part : body.split(";")) {
            int colon = part.indexOf(':');
            if (colon <= 0) {
                continue;
            }
            String key = part.substring(0, colon).strip().toLowerCase(Locale.ROOT).replaceAll("\\s+", "_");
            String value = part.substring(colon + 1).strip();
            if (!key.isEmpty()) {
                out.put(key, value);
                keys.add(key);
            }
        }
        return keys;
    }
}
