package org.viscarta.io;

import java.nio.file.Path;

/**
 * Something in an input that Viscarta accepted but that the user should know about; it is printed
 * on stderr and copied into the report.
 *
 * @param file    the input file
 * @param line    1-based line, 0 when it concerns the whole file
 * @param message what was noticed and what was done about it
 */
public record ReadWarning(Path file, int line, String message) {

    @Override
    public String toString() {
        return InputException.format(file, line, 0, message);
    }
}
