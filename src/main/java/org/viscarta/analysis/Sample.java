package org.viscarta.analysis;

import java.util.Comparator;
import java.util.List;
import org.viscarta.compare.DampingRanking;
import org.viscarta.compare.FittedCurve;
import org.viscarta.sweep.ModulusKind;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;

/**
 * A sample: all replicate sweeps that share a name (and temperature).
 *
 * @param name         display name (with the temperature appended when one sample was measured at several)
 * @param group        its group label
 * @param kind         the modulus basis of its sweeps
 * @param temperatureC test temperature [°C] or NaN
 * @param replicates   its sweeps
 */
public record Sample(String name, String group, ModulusKind kind, double temperatureC, List<Sweep> replicates) {

    public Sample {
        replicates = List.copyOf(replicates);
    }

    /** All points of all replicates that can enter a log fit, sorted by frequency. */
    public List<SweepPoint> pooledFittablePoints() {
        return replicates.stream().flatMap(s -> s.fittablePoints().stream())
                .sorted(Comparator.comparingDouble(SweepPoint::frequencyHz)).toList();
    }

    public double minFrequencyHz() {
        return replicates.stream().mapToDouble(Sweep::minFrequencyHz).min().orElse(Double.NaN);
    }

    public double maxFrequencyHz() {
        return replicates.stream().mapToDouble(Sweep::maxFrequencyHz).max().orElse(Double.NaN);
    }

    /**
     * The descriptive columns of its sweeps (composition, exposure ...), header → value; a value
     * that differs between replicates is given as the distinct values joined by " / ".
     */
    public java.util.Map<String, String> attributes() {
        java.util.Map<String, java.util.LinkedHashSet<String>> seen = new java.util.LinkedHashMap<>();
        for (Sweep s : replicates) {
            s.attributes().forEach((k, v) -> seen.computeIfAbsent(k, x -> new java.util.LinkedHashSet<>()).add(v));
        }
        java.util.Map<String, String> out = new java.util.LinkedHashMap<>();
        seen.forEach((k, v) -> out.put(k, String.join(" / ", v)));
        return out;
    }

    /** Points measured, over all replicates. */
    public int pointCount() {
        return replicates.stream().mapToInt(x -> x.points().size()).sum();
    }

    /** What the damping ranking needs of this sample, with its best-supported curve when one is known. */
    DampingRanking.Subject rankingSubject(java.util.Optional<FittedCurve> best) {
        return new DampingRanking.Subject(name, group, replicates.stream().map(Sweep::fittablePoints).toList(),
                minFrequencyHz(), maxFrequencyHz(), best);
    }
}
