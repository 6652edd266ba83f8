package org.viscarta.io;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.stream.Stream;

/**
 * Turns the INPUT arguments of a verb into a list of files: a file is taken as it is, a folder is
 * searched recursively for sweep tables (.csv, .tsv, .txt, .xlsx, .xls), in name order, skipping hidden files
 * and folders.
 */
public final class InputCollector {

    private InputCollector() {
    }

    /** Files whose names end like this are read from folders. */
    public static boolean looksLikeSweepTable(Path p) {
        String n = p.getFileName().toString().toLowerCase(Locale.ROOT);
        return n.endsWith(".csv") || n.endsWith(".tsv") || n.endsWith(".txt") || n.endsWith(".xlsx") || n.endsWith(".xls");
    }

    /**
     * @param inputs files and folders as the user gave them
     * @return the files to read, each once, in a stable order
     * @throws InputException when an input does not exist or a folder holds no sweep table
     */
    public static List<Path> collect(List<Path> inputs) {
        Set<Path> out = new LinkedHashSet<>();
        for (Path in : inputs) {
            if (Files.isRegularFile(in)) {
                out.add(in);
            } else if (Files.isDirectory(in)) {
                List<Path> found = new ArrayList<>();
                try (Stream<Path> walk = Files.walk(in)) {
                    walk.filter(Files::isRegularFile)
                            .filter(p -> !isHidden(in, p))
                            .filter(InputCollector::looksLikeSweepTable)
                            .sorted()
                            .forEach(found::add);
                } catch (IOException e) {
                    throw new InputException(in, 0, 0, "cannot list the folder (" + e.getMessage() + ")");
                }
                if (found.isEmpty()) {
                    throw new InputException(in, 0, 0, "the folder holds no sweep tables (.csv, .tsv or .txt files)");
                }
                out.addAll(found);
            } else {
                throw new InputException(in, 0, 0, "no such file or folder; check the path");
            }
        }
        return List.copyOf(out);
    }

    private static boolean isHidden(Path root, Path p) {
        for (Path part : root.relativize(p)) {
            if (part.toString().startsWith(".")) {
                return true;
            }
        }
        return false;
    }
}
