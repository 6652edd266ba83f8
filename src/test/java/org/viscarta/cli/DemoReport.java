package org.viscarta.cli;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.stream.Stream;

/**
 * The README's quick-start report on the demo data, made once per test run and shared by every
 * test that reads it (a full demo report is the most expensive fixture of the suite). The command
 * is the README's, with {@code --timestamp} added so that a second run can be compared byte for byte.
 */
final class DemoReport {

    /** The run time the report states. */
    static final String STATED = "2026-12-01T12:00:00Z";

    private static Path folder;
    private static CliRun run;

    private DemoReport() {
    }

    /** The quick-start arguments writing into {@code out}. */
    static String[] args(Path out) {
        return new String[] {"report", "demo-data", "--library", "reference-materials", "--basis", "tensile", "--target",
            "target-soft-tissue", "--out", out.toString(), "--force", "--timestamp", STATED};
    }

    /** The folder holding report.xlsx, report.html and figures/, made on first use. */
    static synchronized Path folder() {
        if (folder == null) {
            try {
                Path tmp = Files.createTempDirectory("viscarta-demo-report");
                Runtime.getRuntime().addShutdownHook(new Thread(() -> delete(tmp)));
                Path out = tmp.resolve("demo-report");
                run = CliRun.of(args(out));
                if (run.exitCode() != 0) {
                    throw new IllegalStateException("the demo report failed: " + run.err());
                }
                folder = out;
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }
        return folder;
    }

    /** What the run printed. */
    static synchronized CliRun run() {
        folder();
        return run;
    }

    private static void delete(Path tree) {
        try (Stream<Path> s = Files.walk(tree)) {
            s.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        } catch (IOException e) {
            // a temporary folder the system cleans up anyway
        }
    }
}
