package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Regression: mutated corpus and demo files through the reading verbs, and degenerate numbers
 * through {@code fit} with the whole catalogue, give a reading or a clean input error only, and
 * never change an input ({@link Fuzz}). Bounded to 40 s of trials; the long run is a benchmark.
 */
@Tag("regression")
class FuzzTest {

    @TempDir
    Path dir;

    @Test
    void everyMutatedInputIsReadOrCleanlyRefusedAndNoneIsChanged() throws IOException {
        Fuzz.Outcome o = Fuzz.run(20261202L, 2000, Duration.ofSeconds(30), dir);
        System.out.printf("fuzz: %d inputs, %d read, %d refused cleanly, %d other outcomes%n", o.trials(), o.read(), o.refused(),
                o.failures().size());
        assertEquals(List.of(), o.failures());
        assertTrue(o.read() >= 5 && o.refused() >= 50, "both outcomes exercised: " + o);
    }
}
