package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Whether and how {@code main} starts the work in a JVM of its own ({@link Launch}). */
@Tag("regression")
class LaunchTest {

    private static final Optional<String> JAVA = Optional.of("/opt/jdk/bin/java");

    private static Optional<List<String>> command(List<String> jvmOptions, int cores, boolean launched) {
        return Launch.command(jvmOptions, cores, launched, JAVA, "viscarta.jar", "org.viscarta.cli.Viscarta", List.of("report", "data"),
                () -> 0);
    }

    @Test
    void onTwoCoresTheWorkRunsInASecondJvmWithTheQuickCompilerAndTheSerialCollectorThenTheUsersOptions() {
        assertEquals(Optional.of(List.of("/opt/jdk/bin/java", "-XX:TieredStopAtLevel=1", "-XX:+UseSerialGC", "-Xmx1g",
                        "-Dviscarta.launched=true", "-cp", "viscarta.jar", "org.viscarta.cli.Viscarta", "report", "data")),
                command(List.of("-Xmx1g"), 2, false));
        assertTrue(command(List.of(), 1, false).isPresent(), "one core");
    }

    @Test
    void runsHereWhenAlreadyLaunchedOnMoreCoresOrWithoutAJavaExecutable() {
        assertEquals(Optional.empty(), command(List.of(), 2, true), "the second JVM must not start a third");
        assertEquals(Optional.empty(), command(List.of(), 3, false), "not measured above two cores: defaults kept");
        assertEquals(Optional.empty(), Launch.command(List.of(), 2, false, Optional.empty(), "viscarta.jar", "M", List.of(), () -> 0));
        assertEquals(Optional.empty(), Launch.command(List.of(), 2, false, JAVA, "", "M", List.of(), () -> 0));
    }

    @Test
    void largeInputsKeepTheOptimisingCompiler() {
        List<String> large = Launch.command(List.of(), 2, false, JAVA, "viscarta.jar", "M", List.of("fit", "big.csv"),
                () -> Launch.LARGE_INPUT_BYTES + 1).orElseThrow();
        assertEquals(List.of("/opt/jdk/bin/java", "-XX:+UseSerialGC", "-Dviscarta.launched=true", "-cp", "viscarta.jar", "M", "fit",
                "big.csv"), large);
        assertTrue(Launch.command(List.of(), 2, false, JAVA, "viscarta.jar", "M", List.of(), () -> Launch.LARGE_INPUT_BYTES).orElseThrow()
                .contains("-XX:TieredStopAtLevel=1"), "at the limit, still the quick compiler");
    }

    /** The inputs' size: files and folders named, the values of -o and --out (outputs) left out, options skipped. */
    @Test
    void theInputsSizeCountsTheFilesAndFoldersNamedButNotTheOutputs(@TempDir Path dir) throws IOException {
        Path file = Files.write(dir.resolve("a.csv"), new byte[1000]);
        Path folder = Files.createDirectories(dir.resolve("in").resolve("deeper"));
        Files.write(folder.resolve("b.csv"), new byte[300]);
        Files.write(folder.getParent().resolve("c.csv"), new byte[20]);
        Path out = Files.createDirectories(dir.resolve("out"));
        Files.write(out.resolve("report.xlsx"), new byte[5000]);
        Path csv = Files.write(dir.resolve("old-fits.csv"), new byte[7000]);
        assertEquals(1320, Launch.inputBytes(List.of("report", file.toString(), folder.getParent().toString(), "--basis", "tensile",
                "--out", out.toString(), "-o", csv.toString(), "--force", dir.resolve("missing.csv").toString())));
        assertEquals(0, Launch.inputBytes(List.of("--version")));
    }

    @Test
    void theUsersOwnChoiceOfCompilerCollectorAgentOrDebuggerIsKept() {
        for (String chosen : List.of("-XX:+UseG1GC", "-XX:+UseParallelGC", "-XX:-UseSerialGC", "-XX:TieredStopAtLevel=4",
                "-XX:-TieredCompilation", "-Xint", "-Xcomp", "-agentlib:jdwp=transport=dt_socket,server=y,address=5005",
                "-javaagent:/x/agent.jar", "-agentpath:/x/lib.so", "-Xdebug", "-XX:Flags=.hotspotrc")) {
            assertEquals(Optional.empty(), command(List.of("-Xmx2g", chosen), 2, false), chosen);
        }
        // options that choose neither are passed on
        assertTrue(command(List.of("-XX:ActiveProcessorCount=2", "-Dfile.encoding=UTF-8", "-XX:MaxRAMPercentage=50"), 2, false)
                .orElseThrow().containsAll(List.of("-XX:ActiveProcessorCount=2", "-Dfile.encoding=UTF-8", "-XX:MaxRAMPercentage=50")));
    }

    /**
     * The whole path through a real second JVM: a bad input's one line reaches the user's error
     * stream once, its exit code 2 comes back, and standard output passes through.
     */
    @Test
    void aSecondJvmPassesOnTheStreamsAndTheExitCode(@TempDir Path dir) throws IOException, InterruptedException {
        Path missing = dir.resolve("missing.csv");
        Run bad = java(dir, "inspect", missing.toString());
        assertEquals(2, bad.exit, bad.err);
        List<String> lines = bad.err.lines().filter(l -> !l.isBlank()).toList();
        assertEquals(1, lines.size(), bad.err);
        assertTrue(lines.get(0).startsWith(missing.toString() + ": "), bad.err);
        Run version = java(dir, "--version");
        assertEquals(0, version.exit, version.err);
        assertTrue(version.out.startsWith("Viscarta "), version.out);
    }

    private record Run(int exit, String out, String err) {
    }

    /** {@code java -XX:ActiveProcessorCount=2 -cp <this class path> org.viscarta.cli.Viscarta args}: two cores, so that it launches. */
    private static Run java(Path dir, String... args) throws IOException, InterruptedException {
        List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-XX:ActiveProcessorCount=2", "-cp", System.getProperty("java.class.path"), Viscarta.class.getName()));
        cmd.addAll(List.of(args));
        Path out = dir.resolve("out.txt");
        Path err = dir.resolve("err.txt");
        Process p = new ProcessBuilder(cmd).redirectOutput(out.toFile()).redirectError(err.toFile()).start();
        int exit = p.waitFor();
        return new Run(exit, Files.readString(out, StandardCharsets.UTF_8), Files.readString(err, StandardCharsets.UTF_8));
    }
}
