package org.viscarta.io;

import java.nio.file.Path;
import java.util.List;
import org.viscarta.sweep.Ramp;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.TimeTest;

/**
 * Everything read from one input file.
 *
 * @param path     the file
 * @param sha256   hex SHA-256 of its bytes, for provenance
 * @param info     how it was understood
 * @param sweeps   the sweeps it holds (one per sample × replicate × temperature)
 * @param ramps    the temperature ramps it holds (one per sample × replicate × fixed frequency)
 * @param warnings what was accepted but should be known
 */
public record SweepFile(Path path, String sha256, TableInfo info, List<Sweep> sweeps, List<Ramp> ramps,
                        List<TimeTest> timeTests, List<ReadWarning> warnings) {

    /** A file without ramps or time-domain tests. */
    public SweepFile(Path path, String sha256, TableInfo info, List<Sweep> sweeps, List<ReadWarning> warnings) {
        this(path, sha256, info, sweeps, List.of(), List.of(), warnings);
    }

    /** A file without time-domain tests. */
    public SweepFile(Path path, String sha256, TableInfo info, List<Sweep> sweeps, List<Ramp> ramps, List<ReadWarning> warnings) {
        this(path, sha256, info, sweeps, ramps, List.of(), warnings);
    }

    public SweepFile {
        sweeps = List.copyOf(sweeps);
        ramps = List.copyOf(ramps);
        timeTests = List.copyOf(timeTests);
        warnings = List.copyOf(warnings);
    }
}
