package org.viscarta.temperature;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.viscarta.sweep.Sweep;

/**
 * A sample measured at several temperatures, its superposition, and its master curve.
 *
 * @param sample     the sample name
 * @param sweeps     its sweeps at every temperature
 * @param result     the superposition
 * @param masterName the name the master curve carries as a sample of its own
 */
public record TemperatureSeries(String sample, List<Sweep> sweeps, ShiftAnalysis.Result result, String masterName) {

    public TemperatureSeries {
        sweeps = List.copyOf(sweeps);
    }

    /** The names of the samples measured at {@link #MIN_TEMPERATURES} or more temperatures: the temperature series. */
    public static java.util.Set<String> names(List<Sweep> all) {
        java.util.Set<String> out = new java.util.LinkedHashSet<>();
        byName(all).forEach((name, sweeps) -> {
            if (sweeps.stream().map(Sweep::temperatureC).filter(Double::isFinite).distinct().count() >= MIN_TEMPERATURES) {
                out.add(name);
            }
        });
        return out;
    }

    private static Map<String, List<Sweep>> byName(List<Sweep> all) {
        Map<String, List<Sweep>> byName = new LinkedHashMap<>();
        for (Sweep s : all) {
            byName.computeIfAbsent(s.sample(), k -> new ArrayList<>()).add(s);
        }
        return byName;
    }

    /** Temperatures at which a sample must have been measured to be superposed in a report. */
    public static final int MIN_TEMPERATURES = 3;

    /**
     * Finds every sample measured at {@link #MIN_TEMPERATURES} or more temperatures and superposes it
     * at the preferred reference temperature when that was measured, else at the measured temperature
     * closest to it.
     */
    public static List<TemperatureSeries> find(List<Sweep> all, double preferredReferenceC, ShiftAnalysis analysis) {
        Map<String, List<Sweep>> byName = byName(all);
        java.util.Set<String> series = names(all);
        List<TemperatureSeries> out = new ArrayList<>();
        for (Map.Entry<String, List<Sweep>> e : byName.entrySet()) {
            if (!series.contains(e.getKey())) {
                continue;
            }
            List<Double> temps = e.getValue().stream().map(Sweep::temperatureC).filter(Double::isFinite).distinct().sorted().toList();
            double ref = temps.stream().min((a, b) -> Double.compare(Math.abs(a - preferredReferenceC), Math.abs(b - preferredReferenceC)))
                    .orElseThrow();
            ShiftAnalysis.Result r = analysis.analyse(e.getValue(), ref);
            String master = String.format(Locale.ROOT, "%s master @ %s °C", e.getKey(), org.viscarta.sweep.Numbers.plain(ref));
            out.add(new TemperatureSeries(e.getKey(), e.getValue(), r, master));
        }
        return out;
    }
}
