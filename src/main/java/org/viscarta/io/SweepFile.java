package org.viscarta.io;

import java.nio.file.Path;
import java.util.List;
import org.viscarta.sweep.Sweep;

/**
 * Everything read from one input file.
 *
 * @param path     the file
 * @param sha256   hex SHA-256 of its bytes, for provenance
 * @param info     how it was understood
 * @param sweeps   the sweeps it holds (one per sample × replicate × temperature)
 * @param warnings what was accepted but should be known
 */
public record SweepFile(Path path, String sha256, TableInfo info, List<Sweep> sweeps, List<ReadWarning> warnings) {

    public SweepFile {
        sweeps = List.copyOf(sweeps);
        warnings = List.copyOf(warnings);
    }
}
