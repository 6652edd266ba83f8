package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Path;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.viscarta.io.InputException;
import org.viscarta.io.UsageException;

/** Regression: only input and usage errors exit 2; anything unexpected exits 1, its stack trace only with --debug. */
@Tag("regression")
class ExitCodeTest {

    private static String[] run(Exception ex, boolean debug) {
        StringWriter err = new StringWriter();
        int code = Viscarta.exitCodeOf(ex, new PrintWriter(err, true), debug);
        return new String[] {Integer.toString(code), err.toString()};
    }

    @Test
    void inputAndUsageErrorsAreOneLineWithExitTwo() {
        String[] input = run(new InputException(Path.of("a.csv"), 3, 2, "frequency must be > 0"), false);
        assertEquals("2", input[0]);
        assertEquals("a.csv:3:2: frequency must be > 0", input[1].strip());
        String[] usage = run(new UsageException("--target 'x' is not among the samples read"), false);
        assertEquals("2", usage[0]);
        assertEquals(1, usage[1].strip().lines().count(), usage[1]);
    }

    @Test
    void anIllegalArgumentFromInsideIsAnInternalErrorWithExitOne() {
        String[] quiet = run(new IllegalArgumentException("a bug"), false);
        assertEquals("1", quiet[0]);
        assertTrue(quiet[1].contains("internal error") && quiet[1].contains("--debug"), quiet[1]);
        assertFalse(quiet[1].contains("\tat "), "no stack trace without --debug");
        String[] debug = run(new IllegalStateException("a bug"), true);
        assertEquals("1", debug[0]);
        assertTrue(debug[1].contains("\tat org.viscarta.cli.ExitCodeTest"), "the stack trace with --debug:\n" + debug[1]);
    }

    @Test
    void aBadOptionValueIsStillAUsageError() {
        CliRun r = CliRun.of("rank", "demo-data/paint-light-ageing.csv", "--weighting", "cubic");
        assertEquals(2, r.exitCode(), r.err());
        assertTrue(r.err().contains("weighting 'cubic' is not known"), r.err());
        CliRun m = CliRun.of("rank", "demo-data/paint-light-ageing.csv", "--models", "zener,spring");
        assertEquals(2, m.exitCode(), m.err());
        assertTrue(m.err().contains("unknown model 'spring'"), m.err());
    }
}
