package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viscarta.library.ReferenceLibrary;

/** The library verbs on a copy of reference-materials/. */
@Tag("regression")
class LibraryCommandTest {

    @TempDir
    Path dir;

    Path lib;

    @BeforeEach
    void copyLibrary() throws IOException {
        lib = dir.resolve("lib");
        Files.createDirectories(lib);
        try (Stream<Path> s = Files.list(Path.of("reference-materials"))) {
            for (Path p : s.toList()) {
                Files.copy(p, lib.resolve(p.getFileName()));
            }
        }
    }

    private Path sweep(String name, String body) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, body);
        return p;
    }

    private static final String GEL = "# temperature: 25 °C\n# method: rheometer\nfrequency [Hz],G' [kPa],G'' [kPa]\n0.1,1.0,0.1\n1,1.2,0.15\n10,1.5,0.3\n";

    @Test
    void addWritesTheCanonicalFormAndRefusesADuplicateName() throws IOException {
        Path in = sweep("soft.csv", GEL);
        CliRun r = CliRun.of("library", "add", in.toString(), "--name", "soft gel 1", "--class", "gel", "--condition", "fresh",
                "--library", lib.toString());
        assertEquals(0, r.exitCode(), r.err());
        Path written = lib.resolve("soft-gel-1.csv");
        String text = Files.readString(written);
        assertTrue(text.contains("# name: soft gel 1\n# class: gel\n# temperature: 25 °C\n# method: rheometer\n# modulus: shear\n"), text);
        assertTrue(text.contains("frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n0.1,1000.0,100.0\n"), text);
        assertTrue(text.contains("# source_sha256: "), text);
        assertEquals(10, ReferenceLibrary.open(lib).entries().size());
        CliRun again = CliRun.of("library", "add", in.toString(), "--name", "soft gel 1", "--class", "gel", "--library", lib.toString());
        assertEquals(2, again.exitCode());
        assertTrue(again.err().contains("--replace"), again.err());
        assertEquals(0, CliRun.of("library", "add", in.toString(), "--name", "soft gel 1", "--class", "tissue", "--replace",
                "--library", lib.toString()).exitCode());
        assertTrue(Files.readString(written).contains("# class: tissue"));
    }

    @Test
    void aBadFileOrMissingMetadataIsRefusedAndNothingIsWritten() throws IOException {
        Path bad = sweep("bad.csv", "frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n1,abc,2\n");
        CliRun r = CliRun.of("library", "add", bad.toString(), "--name", "x", "--class", "gel", "--library", lib.toString());
        assertEquals(2, r.exitCode());
        assertTrue(r.err().startsWith(bad + ":2:2: "), r.err());
        Path noTemp = sweep("notemp.csv", "# method: rheometer\nfrequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n1,100,10\n10,120,20\n");
        CliRun t = CliRun.of("library", "add", noTemp.toString(), "--name", "y", "--class", "gel", "--library", lib.toString());
        assertEquals(2, t.exitCode());
        assertTrue(t.err().contains("--temperature"), t.err());
        assertFalse(Files.exists(lib.resolve("x.csv")) || Files.exists(lib.resolve("y.csv")));
        assertEquals(9, ReferenceLibrary.open(lib).entries().size());
    }

    @Test
    void removeKeepsTheFileAndListAndShowWork() throws IOException {
        CliRun list = CliRun.of("library", "list", "--class", "gel", "--library", lib.toString());
        assertEquals(0, list.exitCode(), list.err());
        assertTrue(list.out().contains("3 reference(s)"), list.out());
        CliRun show = CliRun.of("library", "show", "dammar-varnish", "--library", lib.toString());
        assertTrue(show.out().contains("class: varnish"), show.out());
        String before = Files.readString(lib.resolve("dammar-varnish.csv"));
        CliRun rm = CliRun.of("library", "remove", "dammar-varnish", "--library", lib.toString());
        assertEquals(0, rm.exitCode(), rm.err());
        assertEquals(before, Files.readString(lib.resolve(".removed").resolve("dammar-varnish.csv")), "nothing is lost");
        assertEquals(8, ReferenceLibrary.open(lib).entries().size());
        assertEquals(2, CliRun.of("library", "remove", "dammar-varnish", "--library", lib.toString()).exitCode());
    }

    @Test
    void checkReportsEachProblemWithFileAndLine() throws IOException {
        assertEquals(0, CliRun.of("library", "check", "--library", lib.toString()).exitCode());
        Files.writeString(lib.resolve("broken.csv"), "# name: broken\n# class: gel\nfrequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n1,x,1\n");
        CliRun r = CliRun.of("library", "check", "--library", lib.toString());
        assertEquals(2, r.exitCode());
        assertTrue(r.err().contains(lib.resolve("broken.csv") + ":4:2: "), r.err());
    }

    @Test
    void concurrentAddsLoseNoEntry() throws Exception {
        Path in = sweep("soft.csv", GEL);
        ExecutorService pool = Executors.newFixedThreadPool(4);
        List<Future<CliRun>> runs = new ArrayList<>();
        for (int i = 0; i < 12; i++) {
            String name = "gel-" + i;
            runs.add(pool.submit(() -> CliRun.of("library", "add", in.toString(), "--name", name, "--class", "gel",
                    "--library", lib.toString())));
        }
        for (Future<CliRun> f : runs) {
            assertEquals(0, f.get().exitCode(), f.get().err());
        }
        pool.shutdown();
        assertEquals(9 + 12, ReferenceLibrary.open(lib).entries().size());
        assertEquals(0, CliRun.of("library", "check", "--library", lib.toString()).exitCode());
    }

    @Test
    void withoutALibraryTheErrorSaysHowToSetOne() {
        CliRun r = CliRun.of("library", "list");
        if (System.getenv("VISCARTA_LIBRARY") == null) {
            assertEquals(2, r.exitCode());
            assertTrue(r.err().contains("VISCARTA_LIBRARY"), r.err());
        } else {
            assertEquals(0, r.exitCode(), "VISCARTA_LIBRARY is set in this environment: " + r.err());
        }
    }
}
