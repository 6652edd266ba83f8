package org.viscarta.io;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;

/**
 * Writes an output file atomically: into a temporary file beside the target, then a rename. A
 * failure leaves no half-written target; an existing target is replaced only when allowed.
 */
public final class AtomicOutput {

    /** Writes content to a stream. */
    @FunctionalInterface
    public interface Content {
        void writeTo(OutputStream out) throws IOException;
    }

    private static final java.security.SecureRandom RANDOM = new java.security.SecureRandom();

    private AtomicOutput() {
    }

    /**
     * Checks, before any work is done, that {@code target} may be written.
     *
     * @throws InputException when it exists and {@code overwrite} is false
     */
    public static void checkWritable(Path target, boolean overwrite) {
        if (Files.exists(target) && !overwrite) {
            throw new InputException(target, 0, 0, "the output already exists; choose another name or pass --force to replace it");
        }
        if (Files.isDirectory(target)) {
            throw new InputException(target, 0, 0, "the output is a folder; give a file name");
        }
    }

    /**
     * Writes {@code content} to {@code target} through a temporary file in the same folder.
     *
     * @param overwrite whether an existing target may be replaced
     */
    public static void write(Path target, boolean overwrite, Content content) throws IOException {
        checkWritable(target, overwrite);
        Path abs = target.toAbsolutePath();
        Path dir = abs.getParent();
        Files.createDirectories(dir);
        // created as any new file is, so that it gets the user's usual permissions (umask), not a temporary file's 0600
        Path tmp = dir.resolve("." + abs.getFileName() + "." + Long.toUnsignedString(RANDOM.nextLong(), 36) + ".part");
        try {
            try (OutputStream out = Files.newOutputStream(tmp, java.nio.file.StandardOpenOption.CREATE_NEW,
                    java.nio.file.StandardOpenOption.WRITE)) {
                content.writeTo(out);
            }
            try {
                if (overwrite) {
                    Files.move(tmp, abs, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
                } else {
                    Files.move(tmp, abs, StandardCopyOption.ATOMIC_MOVE);
                }
            } catch (AtomicMoveNotSupportedException e) {
                if (overwrite) {
                    Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING);
                } else {
                    Files.move(tmp, abs);
                }
            }
        } catch (FileAlreadyExistsException e) {
            throw new InputException(target, 0, 0, "the output appeared while it was being written; pass --force to replace it");
        } finally {
            Files.deleteIfExists(tmp);
        }
    }
}
