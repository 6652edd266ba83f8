package org.viscarta.cli;

import org.viscarta.io.UsageException;
import java.nio.file.Path;
import picocli.CommandLine.Option;

/** {@code --library DIR}, else the environment variable VISCARTA_LIBRARY. */
final class LibraryOption {

    /** The environment variable that names the reference library when --library is not given. */
    static final String LIBRARY_ENV = "VISCARTA_LIBRARY";

    @Option(names = "--library", paramLabel = "DIR",
            description = "Folder of reference-material sweeps (default: $" + LIBRARY_ENV + ").")
    Path library;

    /** The folder, when the option or the variable names one. */
    java.util.Optional<Path> folderIfNamed() {
        if (library != null) {
            return java.util.Optional.of(library);
        }
        String env = System.getenv(LIBRARY_ENV);
        return env == null || env.isBlank() ? java.util.Optional.empty() : java.util.Optional.of(Path.of(env));
    }

    /** The folder, or an error that says how to name one. */
    Path folder() {
        Path p = folderIfNamed().orElse(null);
        if (p == null) {
            throw new UsageException("no reference library: pass --library DIR or set the environment variable "
                    + LIBRARY_ENV + " to the folder of reference sweeps");
        }
        return p;
    }
}
