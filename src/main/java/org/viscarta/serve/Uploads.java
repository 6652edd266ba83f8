package org.viscarta.serve;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.stream.Stream;

/** Names and folders: what a request may name, and how a server folder is shown to the person. */
final class Uploads {

    private Uploads() {
    }

    /**
     * A relative name sent with an upload ("gels/agarose-r1.csv"), checked: no absolute path, no
     * drive letter, no "." or ".." step, no control character.
     */
    static Path safeRelative(String name) {
        if (name == null || name.isBlank() || name.length() > 1000) {
            throw ApiError.badRequest("a file was sent without a usable name");
        }
        String n = name.replace('\\', '/');
        if (n.startsWith("/") || n.matches("^[A-Za-z]:.*")) {
            throw ApiError.badRequest("'" + name + "': an uploaded file's name must be relative");
        }
        List<String> parts = new ArrayList<>();
        for (String p : n.split("/")) {
            if (p.isEmpty() || p.equals(".") || p.equals("..") || p.chars().anyMatch(c -> c < 0x20 || c == 0x7f)) {
                throw ApiError.badRequest("'" + name + "': a name may not step out of its folder or hold control characters");
            }
            parts.add(p);
        }
        return Path.of(parts.get(0), parts.subList(1, parts.size()).toArray(new String[0]));
    }

    /**
     * A folder named relative to {@code root} (a folder below --data), refused when it leaves the
     * root, directly or through a link.
     */
    static Path inside(Path root, String relative) throws IOException {
        Path realRoot = root.toRealPath();
        String rel = relative == null ? "" : relative.strip().replace('\\', '/');
        while (rel.startsWith("/")) {
            rel = rel.substring(1);
        }
        Path candidate = rel.isEmpty() ? realRoot : realRoot.resolve(rel).normalize();
        if (!candidate.startsWith(realRoot)) {
            throw ApiError.forbidden("'" + relative + "' is outside the data folder this server may read");
        }
        if (!Files.exists(candidate, LinkOption.NOFOLLOW_LINKS) && !Files.exists(candidate)) {
            throw ApiError.notFound("'" + relative + "' does not exist in the data folder");
        }
        Path real = candidate.toRealPath();
        if (!real.startsWith(realRoot)) {
            throw ApiError.forbidden("'" + relative + "' leads outside the data folder this server may read");
        }
        return real;
    }

    /** A message with the job's private folders replaced by the names the person gave. */
    static String relative(String message, Job job) {
        return job == null ? message : relative(message, job.inputRoot);
    }

    /** A message with {@code root}'s path left out ("…/upload-3/gels/a.csv:7" → "gels/a.csv:7"). */
    static String relative(String message, Path root) {
        if (root == null) {
            return message;
        }
        String abs = root.toAbsolutePath().normalize().toString();
        return message.replace(abs + java.io.File.separator, "").replace(abs, ".");
    }

    /** Deletes a folder tree; what cannot be deleted is left. */
    static void deleteTree(Path tree) {
        if (tree == null || !Files.exists(tree, LinkOption.NOFOLLOW_LINKS)) {
            return;
        }
        try (Stream<Path> s = Files.walk(tree)) {
            for (Path p : s.sorted(Comparator.reverseOrder()).toList()) {
                try {
                    Files.deleteIfExists(p);
                } catch (IOException e) {
                    // left for the system's temporary-file cleaning
                }
            }
        } catch (IOException e) {
            // nothing more to do
        }
    }
}
