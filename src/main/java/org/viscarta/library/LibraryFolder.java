package org.viscarta.library;

import org.viscarta.io.UsageException;
import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.locks.ReentrantLock;
import org.viscarta.io.AtomicOutput;
import org.viscarta.io.InputCollector;
import org.viscarta.io.InputException;
import org.viscarta.io.SweepTableWriter;
import org.viscarta.io.SweepFile;
import org.viscarta.io.SweepReader;
import org.viscarta.sweep.Sweep;

/**
 * Changes to the reference-library folder: add (validated, written in the canonical form
 * atomically), remove (the file is kept in {@code .removed/}), and check. Changes hold a lock on
 * the folder ({@code .viscarta.lock}) so that two runs at once cannot corrupt it.
 */
public final class LibraryFolder {

    private static final Map<Path, ReentrantLock> IN_PROCESS = new ConcurrentHashMap<>();
    private static final String LOCK_FILE = ".viscarta.lock";
    private static final String REMOVED = ".removed";

    /** What {@code library add} is told besides the file. */
    public record Additions(String name, String clazz, String composition, String condition, String notes, String temperature,
                            String method) {
    }

    /** A problem found by {@link #check()}: the file's own location and message. */
    public record Problem(String message) {
    }

    private final Path folder;

    public LibraryFolder(Path folder) {
        this.folder = folder;
    }

    public Path folder() {
        return folder;
    }

    /** {@link #add(Path, Additions, boolean, SweepReader, boolean)} with the default reading. */
    public Path add(Path source, Additions a, boolean replace) throws IOException {
        return add(source, a, replace, new SweepReader(null), false).file();
    }

    /**
     * What {@code library add} did.
     *
     * @param file     the entry's file
     * @param warnings what the user should know (reading warnings; a basis that was not stated)
     */
    public record Added(Path file, List<String> warnings) {
    }

    /**
     * Adds a sweep file as a reference in the canonical form (SI units, complete metadata).
     *
     * @return the file written
     * @param reader     reads the source with the user's reading options (--column, --modulus)
     * @param kindGiven  whether the user stated the basis (--modulus); when neither it, the headers nor the
     *                   file say, the entry is written without a basis and a warning says so
     * @throws InputException for a bad file, missing metadata, or a name already used (without replace)
     */
    public Added add(Path source, Additions a, boolean replace, SweepReader reader, boolean kindGiven) throws IOException {
        requireFolder();
        if (a.name() == null || a.name().isBlank()) {
            throw new UsageException("a reference needs a name: pass --name");
        }
        if (a.clazz() == null || a.clazz().isBlank()) {
            throw new UsageException("a reference needs a class (gel, tissue, paint film, ...): pass --class");
        }
        checkValue("--name", a.name());
        checkValue("--class", a.clazz());
        checkValue("--composition", a.composition());
        checkValue("--condition", a.condition());
        checkValue("--notes", a.notes());
        checkValue("--temperature", a.temperature());
        checkValue("--method", a.method());
        SweepFile sf = reader.read(source);
        if (sf.sweeps().size() != 1) {
            throw new InputException(source, sf.info().headerLine(), 0, "a reference is one sweep; this file holds "
                    + sf.sweeps().size() + " (several samples, replicates or temperatures): add them one by one");
        }
        Sweep sw = sf.sweeps().get(0);
        Map<String, String> meta = new LinkedHashMap<>();
        meta.put("name", a.name().strip());
        meta.put("class", a.clazz().strip());
        String temperature = a.temperature() != null ? a.temperature() : sf.info().metadata().get("temperature");
        if (temperature == null) {
            throw new InputException(source, 1, 0, "the reference needs a test temperature: add '# temperature: 23 °C' to the file "
                    + "or pass --temperature");
        }
        meta.put("temperature", temperature.strip());
        String method = a.method() != null ? a.method() : sf.info().metadata().get("method");
        if (method == null) {
            throw new InputException(source, 1, 0, "the reference needs a test method: add '# method: dynamic indentation' "
                    + "(or DMA, rheometer, ...) to the file or pass --method");
        }
        meta.put("method", method.strip());
        List<String> warnings = new java.util.ArrayList<>();
        sf.warnings().forEach(w -> warnings.add(w.toString()));
        boolean kindStated = kindGiven || sf.info().metadata().containsKey("modulus")
                || sf.info().columns().stream().anyMatch(c -> c.kindHint() != null);
        if (kindStated) {
            meta.put("modulus", sw.kind().toString());
        } else {
            warnings.add(source + ": the entry is written without a basis (tensile or shear): neither the file nor --modulus "
                    + "says which; it is read as tensile, with a warning, until '# modulus:' is added to it");
        }
        putIf(meta, "composition", a.composition());
        putIf(meta, "condition", a.condition());
        putIf(meta, "notes", a.notes());
        for (Map.Entry<String, String> e : sf.info().metadata().entrySet()) {
            if (e.getKey().equals("modulus") && !kindStated) {
                continue;
            }
            if (e.getValue().chars().anyMatch(c -> c == ';' || Character.isISOControl(c)) || e.getKey().contains(";")) {
                continue; // a preamble note that one metadata line cannot hold
            }
            meta.putIfAbsent(e.getKey(), e.getValue());
        }
        meta.put("source_file", source.getFileName().toString());
        meta.put("source_sha256", sf.sha256());
        String table = SweepTableWriter.write(meta, sw.points());
        readsBack(table, meta, sw.points().size());
        try (AutoCloseable lock = lock()) {
            Path existing = findByName(a.name().strip());
            if (existing != null && !replace) {
                throw new InputException(existing, 0, 0, "a reference named '" + a.name().strip()
                        + "' is already in the library; pass --replace to replace it");
            }
            if (existing == null) {
                Path target = freeFile(slug(a.name()));
                AtomicOutput.write(target, false, out -> out.write(table.getBytes(StandardCharsets.UTF_8)));
                return new Added(target, warnings);
            }
            // the entry keeps its own file: write the new version over it, then keep the old one in .removed/;
            // if the old one cannot be kept, put it back
            byte[] old = Files.readAllBytes(existing);
            AtomicOutput.write(existing, true, out -> out.write(table.getBytes(StandardCharsets.UTF_8)));
            try {
                Path kept = removedFile(existing.getFileName().toString());
                Files.write(kept, old, StandardOpenOption.CREATE_NEW);
            } catch (IOException | RuntimeException e) {
                AtomicOutput.write(existing, true, out -> out.write(old));
                throw new IOException("the old version of '" + a.name().strip() + "' cannot be kept in " + folder.resolve(REMOVED)
                        + " (" + e.getMessage() + "); the library is unchanged", e);
            }
            return new Added(existing, warnings);
        } catch (IOException | RuntimeException e) {
            throw e;
        } catch (Exception e) {
            throw new IOException(e);
        }
    }

    /**
     * Refuses a metadata value that would end its line early or start another key: a line break,
     * another control character, or ';' (which separates '# key: value' pairs on one line).
     */
    private static void checkValue(String option, String value) {
        if (value == null) {
            return;
        }
        for (int i = 0; i < value.length(); i++) {
            char c = value.charAt(i);
            if (c == ';' || Character.isISOControl(c)) {
                throw new UsageException(option + " must not contain " + (c == ';' ? "';'" : "a line break or control character")
                        + " (it would end the value in the library file): '" + value.replaceAll("\\p{Cntrl}", "?") + "'");
            }
        }
    }

    /** The entry as written must read back as one sweep with the same metadata, or nothing is written. */
    private static void readsBack(String table, Map<String, String> meta, int points) throws IOException {
        Path tmp = Files.createTempFile("viscarta-library-entry", ".csv");
        try {
            Files.writeString(tmp, table);
            SweepFile back = new SweepReader(null).read(tmp);
            boolean same = back.sweeps().size() == 1 && back.sweeps().get(0).points().size() == points;
            for (Map.Entry<String, String> e : meta.entrySet()) {
                same &= e.getValue().strip().equals(back.info().metadata().get(e.getKey()));
            }
            if (!same) {
                throw new UsageException("the new entry would not read back as written; check its metadata for ';' and line breaks");
            }
        } finally {
            Files.deleteIfExists(tmp);
        }
    }

    /** A file for a new entry: {@code slug.csv}, or {@code slug-2.csv} ... when that is taken. */
    private Path freeFile(String slug) {
        Path target = folder.resolve(slug + ".csv");
        for (int k = 2; Files.exists(target); k++) {
            target = folder.resolve(slug + "-" + k + ".csv");
        }
        return target;
    }

    /**
     * Removes a reference; its file is moved to {@code .removed/} (never deleted).
     *
     * @return where the file now is
     */
    public Path remove(String name) throws IOException {
        requireFolder();
        try (AutoCloseable lock = lock()) {
            Path existing = findByName(name);
            if (existing == null) {
                throw new UsageException("no reference named '" + name + "' in " + folder);
            }
            return keepRemoved(existing);
        } catch (IOException | RuntimeException e) {
            throw e;
        } catch (Exception e) {
            throw new IOException(e);
        }
    }

    /** Validates every entry; each problem carries its file and line. */
    public List<Problem> check() {
        requireFolder();
        List<Problem> problems = new ArrayList<>();
        Map<String, Path> names = new LinkedHashMap<>();
        List<Path> files;
        try {
            files = InputCollector.collect(List.of(folder));
        } catch (InputException e) {
            return List.of(new Problem(e.getMessage()));
        }
        for (Path f : files) {
            try {
                SweepFile sf = new SweepReader(null).read(f);
                for (String key : ReferenceLibrary.REQUIRED_KEYS) {
                    String v = sf.info().metadata().get(key);
                    if (v == null || v.isBlank()) {
                        problems.add(new Problem(f + ":1: missing '# " + key + ": ...'"));
                    }
                }
                if (sf.sweeps().size() != 1) {
                    problems.add(new Problem(f + ":" + sf.info().headerLine() + ": holds " + sf.sweeps().size()
                            + " sweeps; a reference is one sweep"));
                }
                String name = sf.info().metadata().get("name");
                if (name != null) {
                    Path other = names.put(name, f);
                    if (other != null) {
                        problems.add(new Problem(f + ":1: the name '" + name + "' is also used by " + other));
                    }
                }
            } catch (InputException e) {
                problems.add(new Problem(e.getMessage()));
            }
        }
        return problems;
    }

    /** The file of the reference with this name (its '# name:' line), or null. Tolerates bad files. */
    Path findByName(String name) {
        if (!Files.isDirectory(folder)) {
            return null;
        }
        try (var s = Files.list(folder)) {
            for (Path f : s.filter(Files::isRegularFile).filter(InputCollector::looksLikeSweepTable).sorted().toList()) {
                for (String line : SweepReader.decodeText(Files.readAllBytes(f)).split("\\R")) {
                    String l = line.strip();
                    if (!l.startsWith("#")) {
                        break;
                    }
                    int colon = l.indexOf(':');
                    if (colon > 0 && l.substring(1, colon).strip().equalsIgnoreCase("name") && l.substring(colon + 1).strip().equals(name)) {
                        return f;
                    }
                }
            }
        } catch (IOException | java.io.UncheckedIOException e) {
            throw new InputException(folder, 0, 0, "cannot read the library (" + e.getMessage() + ")");
        }
        return null;
    }

    private Path keepRemoved(Path file) throws IOException {
        return Files.move(file, removedFile(file.getFileName().toString()));
    }

    /** A name in {@code .removed/} not yet taken, for a file called {@code base}. */
    private Path removedFile(String base) throws IOException {
        Path dir = folder.resolve(REMOVED);
        Files.createDirectories(dir);
        Path target = dir.resolve(base);
        for (int k = 2; Files.exists(target); k++) {
            target = dir.resolve(base.replaceFirst("(\\.[^.]*)?$", "." + k + "$1"));
        }
        return target;
    }

    private AutoCloseable lock() throws IOException {
        Path key = folder.toAbsolutePath().normalize();
        ReentrantLock inProcess = IN_PROCESS.computeIfAbsent(key, k -> new ReentrantLock());
        inProcess.lock();
        try {
            FileChannel ch = FileChannel.open(key.resolve(LOCK_FILE), StandardOpenOption.CREATE, StandardOpenOption.WRITE);
            FileLock fl = ch.lock();
            return () -> {
                try {
                    fl.release();
                    ch.close();
                } finally {
                    inProcess.unlock();
                }
            };
        } catch (IOException | RuntimeException e) {
            inProcess.unlock();
            throw e;
        }
    }

    private void requireFolder() {
        if (!Files.isDirectory(folder)) {
            throw new InputException(folder, 0, 0, "the reference library is not a folder; create it or pass another --library");
        }
    }

    private static void putIf(Map<String, String> m, String key, String value) {
        if (value != null && !value.isBlank()) {
            m.put(key, value.strip());
        }
    }

    /**
     * A file name from a reference name: letters, digits, dot, dash and underscore; others become
     * '-'; never starting with a dot, so that every entry is a visible file.
     */
    static String slug(String name) {
        String s = name.strip().toLowerCase(Locale.ROOT).replaceAll("[^a-z0-9._-]+", "-").replaceAll("^[.-]+|-+$", "");
        return s.isEmpty() ? "reference" : s;
    }
}
