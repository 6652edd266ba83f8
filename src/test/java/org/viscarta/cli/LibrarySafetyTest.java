package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.Charset;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viscarta.library.ReferenceLibrary;

/** Regression: nothing in the reference library is ever lost or made unreadable by {@code library add}. */
@Tag("regression")
class LibrarySafetyTest {

    @TempDir
    Path dir;

    Path lib;
    Path gel;

    private static final String HEADER = "frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n0.1,1000,100\n1,1200,150\n10,1500,300\n";

    @BeforeEach
    void library() throws IOException {
        lib = dir.resolve("lib");
        Files.createDirectories(lib);
        Files.writeString(lib.resolve("hand-made.csv"), "# name: Gel-A\n# class: gel\n# temperature: 23 °C\n# method: rheometer\n" + HEADER);
        Files.writeString(lib.resolve("gel-a.csv"), "# name: gel-a\n# class: gel\n# temperature: 23 °C\n# method: indentation\n" + HEADER);
        gel = dir.resolve("new.csv");
        Files.writeString(gel, "# temperature: 25 °C\n# method: rheometer\n" + HEADER.replace("1000", "2000"));
    }

    private List<String> names() {
        return ReferenceLibrary.open(lib).entries().stream().map(ReferenceLibrary.Entry::name).sorted().toList();
    }

    @Test
    void replacingAnEntryNeverWritesOverAnotherEntrysFile() throws IOException {
        String other = Files.readString(lib.resolve("gel-a.csv"));
        CliRun r = CliRun.of("library", "add", gel.toString(), "--name", "Gel-A", "--class", "gel", "--replace", "--library", lib.toString());
        assertEquals(0, r.exitCode(), r.err());
        assertEquals(other, Files.readString(lib.resolve("gel-a.csv")), "the entry 'gel-a' is untouched");
        assertEquals(List.of("Gel-A", "gel-a"), names());
        assertTrue(Files.readString(lib.resolve("hand-made.csv")).contains("2000"), "Gel-A replaced in its own file");
        try (Stream<Path> s = Files.list(lib.resolve(".removed"))) {
            assertEquals(1, s.count(), "the old Gel-A is kept in .removed/");
        }
    }

    @Test
    void aBlockedFileNameNeverCostsTheEntryBeingReplaced() throws IOException {
        // the file name the new name would slug to is blocked by a folder: Gel-A must survive whatever happens
        Files.delete(lib.resolve("gel-a.csv"));
        Files.createDirectories(lib.resolve("gel-a.csv"));
        CliRun r = CliRun.of("library", "add", gel.toString(), "--name", "Gel-A", "--class", "gel", "--replace", "--library", lib.toString());
        assertEquals(List.of("Gel-A"), names(), r.err());
        assertEquals(r.exitCode() == 0, Files.readString(lib.resolve("hand-made.csv")).contains("2000"), r.err());
    }

    @Test
    void aReplaceThatCannotRetireTheOldVersionRollsBack() throws IOException {
        String old = Files.readString(lib.resolve("hand-made.csv"));
        Files.writeString(lib.resolve(".removed"), "not a folder");
        CliRun r = CliRun.of("library", "add", gel.toString(), "--name", "Gel-A", "--class", "gel", "--replace", "--library", lib.toString());
        assertTrue(r.exitCode() != 0, "the replace cannot keep the old version, so it must not happen: " + r.out());
        assertEquals(old, Files.readString(lib.resolve("hand-made.csv")));
        assertEquals(List.of("Gel-A", "gel-a"), names());
    }

    @Test
    void metadataThatWouldBreakTheEntryIsRefusedAndTheLibraryStaysReadable() {
        for (String[] opt : List.of(new String[] {"--name", "gel-x; class: tissue"}, new String[] {"--name", "gel\rx"},
                new String[] {"--notes", "x; name: gelatin-8pct"}, new String[] {"--composition", "a\nb"})) {
            List<String> args = new java.util.ArrayList<>(List.of("library", "add", gel.toString(), "--class", "gel",
                    "--library", lib.toString()));
            if (!opt[0].equals("--name")) {
                args.addAll(List.of("--name", "gel-y"));
            }
            args.addAll(List.of(opt));
            CliRun r = CliRun.of(args.toArray(new String[0]));
            assertEquals(2, r.exitCode(), opt[0] + " " + opt[1] + ": " + r.out() + r.err());
            assertTrue(r.err().contains(opt[0]), r.err());
        }
        assertEquals(List.of("Gel-A", "gel-a"), names());
        assertEquals(0, CliRun.of("library", "check", "--library", lib.toString()).exitCode());
    }

    @Test
    void aNameStartingWithADotGivesAVisibleEntry() {
        for (String name : List.of(".hidden", "..")) {
            CliRun r = CliRun.of("library", "add", gel.toString(), "--name", name, "--class", "gel", "--library", lib.toString());
            assertEquals(0, r.exitCode(), r.err());
        }
        assertEquals(List.of("..", ".hidden", "Gel-A", "gel-a"), names());
        CliRun list = CliRun.of("library", "list", "--library", lib.toString());
        assertTrue(list.out().contains(".hidden") && list.out().contains(".."), list.out());
    }

    @Test
    void aWindows1252EntryCanBeReplacedAndRemoved() throws IOException {
        Files.write(lib.resolve("hand-made.csv"), ("# name: Gel-A\n# class: gel\n# temperature: 23 °C\n# method: rheometer\n"
                + "# notes: Müller's gel\n" + HEADER).getBytes(Charset.forName("windows-1252")));
        assertEquals(List.of("Gel-A", "gel-a"), names());
        CliRun replace = CliRun.of("library", "add", gel.toString(), "--name", "Gel-A", "--class", "gel", "--replace",
                "--library", lib.toString());
        assertEquals(0, replace.exitCode(), replace.err());
        CliRun remove = CliRun.of("library", "remove", "Gel-A", "--library", lib.toString());
        assertEquals(0, remove.exitCode(), remove.err());
        assertEquals(List.of("gel-a"), names());
    }

    @Test
    void libraryAddTakesTheReadingOptionsAndNeverWritesAnUnstatedBasisAsAFact() throws IOException {
        Path export = dir.resolve("export.csv");
        Files.writeString(export, "# temperature: 25 °C\n# method: rheometer\nfreq_hz,stor_pa,loss_pa\n0.1,1000,100\n1,1200,150\n");
        CliRun refused = CliRun.of("library", "add", export.toString(), "--name", "E1", "--class", "gel", "--library", lib.toString());
        assertEquals(2, refused.exitCode(), refused.err());
        assertTrue(refused.err().contains("--column \"stor_pa=storage_modulus [Pa]\""), "the message names the fix: " + refused.err());
        CliRun mapped = CliRun.of("library", "add", export.toString(), "--name", "E1", "--class", "gel", "--library", lib.toString(),
                "--column", "freq_hz=frequency [Hz]", "--column", "stor_pa=storage_modulus [Pa]", "--column", "loss_pa=loss_modulus [Pa]");
        assertEquals(0, mapped.exitCode(), mapped.err());
        assertTrue(mapped.err().contains("without a basis"), mapped.err());
        Path entry = lib.resolve("e1.csv");
        assertTrue(!Files.readString(entry).contains("# modulus:"), "no basis written as a fact: " + Files.readString(entry));
        CliRun shear = CliRun.of("library", "add", export.toString(), "--name", "E2", "--class", "gel", "--library", lib.toString(),
                "--modulus", "shear", "--column", "freq_hz=frequency [Hz]", "--column", "stor_pa=storage_modulus [Pa]",
                "--column", "loss_pa=loss_modulus [Pa]");
        assertEquals(0, shear.exitCode(), shear.err());
        assertTrue(Files.readString(lib.resolve("e2.csv")).contains("# modulus: shear"), "a stated basis is kept");
    }
}
