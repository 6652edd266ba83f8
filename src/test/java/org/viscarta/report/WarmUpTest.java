package org.viscarta.report;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Set;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * The report's warm-up (run beside the analysis by {@code viscarta report}, its failures swallowed
 * there as it is only a head start) runs through, and leaves nothing in the temporary folder.
 */
@Tag("regression")
class WarmUpTest {

    @Test
    void warmsUpWithoutFailingAndWritesNothing() throws IOException {
        Path tmp = Path.of(System.getProperty("java.io.tmpdir"));
        Set<Path> before = tree(tmp);
        ReportFiles.warmUp();
        Set<Path> after = tree(tmp);
        after.removeAll(before);
        assertEquals(Set.of(), after.stream().filter(p -> p.toString().contains("poi")).collect(Collectors.toSet()),
                "files POI left behind");
    }

    private static Set<Path> tree(Path dir) throws IOException {
        try (Stream<Path> s = Files.walk(dir, 2)) {
            return s.collect(Collectors.toSet());
        } catch (java.io.UncheckedIOException e) {
            return new java.util.HashSet<>();
        }
    }
}
