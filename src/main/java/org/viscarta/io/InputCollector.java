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
                            .filter(p -> !insideOwnOutput(in, p) && !ownOutputTable(p))
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

    /**
     * True when the file lies in a folder Viscarta wrote: a report (report.xlsx beside a figures
     * folder) or the tables of {@code shift} (shift-factors.csv beside shift-fits.csv). A report
     * written inside the inputs is not read back as data.
     */
    static boolean insideOwnOutput(Path root, Path p) {
        for (Path d = p.getParent(); d != null; d = d.getParent()) {
            if ((Files.isRegularFile(d.resolve("report.xlsx")) && Files.isDirectory(d.resolve("figures")))
                    || (Files.isRegularFile(d.resolve("shift-factors.csv")) && Files.isRegularFile(d.resolve("shift-fits.csv")))) {
                return true;
            }
            if (d.equals(root)) {
                break;
            }
        }
        return false;
    }

    /**
     * The header lines of the CSV tables {@code fit}, {@code rank} and {@code match} write with
     * {@code -o} (their column ids; InputCollectorTest writes each and checks that it is skipped).
     */
    private static final List<String> OUTPUT_HEADERS = List.of("rank,sample,group,n_replicates,", "sample,reference,rank,distance,",
            "sample,model,parameter,value,", "sample,model,time_s,", "sample,x_m,y_m,", "sample,region,n_positions,");

    /** The headers of the small tables a map names beside its positions: regions, a legend, landmarks. */
    private static final List<String> MAP_HEADERS = List.of("region,", "colour,", "color,");

    /** True for a CSV table Viscarta wrote with -o (not a sweep table). */
    static boolean ownOutputTable(Path p) {
        if (!p.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(".csv")) {
            return false;
        }
        byte[] head = new byte[256];
        int n;
        try (java.io.InputStream in = Files.newInputStream(p)) {
            n = in.readNBytes(head, 0, head.length);
        } catch (IOException e) {
            return false;
        }
        String first = new String(head, 0, n, java.nio.charset.StandardCharsets.UTF_8);
        for (String h : OUTPUT_HEADERS) {
            if (first.startsWith(h)) {
                return true;
            }
        }
        return mapTable(p);
    }

    /** True for a map's regions, legend or landmarks table (read by the map, not a sweep table). */
    static boolean mapTable(Path p) {
        try (java.io.BufferedReader r = Files.newBufferedReader(p, java.nio.charset.StandardCharsets.UTF_8)) {
            for (int k = 0; k < 20; k++) {
                String line = r.readLine();
                if (line == null) {
                    return false;
                }
                String l = line.strip().toLowerCase(Locale.ROOT);
                if (l.isEmpty() || l.startsWith("#")) {
                    continue;
                }
                return MAP_HEADERS.stream().anyMatch(l::startsWith) || l.contains("image_x");
            }
        } catch (IOException | java.io.UncheckedIOException e) {
            return false;
        }
        return false;
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
