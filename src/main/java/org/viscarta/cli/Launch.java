package org.viscarta.cli;

import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.concurrent.TimeUnit;
import java.util.regex.Pattern;

/**
 * Runs a command in a Java virtual machine of its own, started with the options that were
 * measured fastest for Viscarta's work on small machines: the quick compiler only
 * ({@code -XX:TieredStopAtLevel=1}) and the serial collector ({@code -XX:+UseSerialGC}).
 *
 * <p>Why: on a machine with two cores, the JVM's compilers spent 11.2 s of the demo report's
 * 17.5 s of processor time (8.2 s of it the optimising compiler), on the cores the work needs, and
 * the optimised code arrives too late to earn that back; the concurrent collector's
 * own threads take another share. Measured on a 2-core machine (README, Performance): the demo
 * report 6.0–6.3 s instead of 9.3–10.2 s, and even the 10,000-sweep report 20.5 s instead of
 * 23.1 s with less memory. A JVM's options cannot be changed once it runs, and {@code java -jar}
 * takes none from the jar, so {@code main} starts the work in a second JVM with them, passes it
 * the user's own JVM options, terminal and files, and exits with its exit code.
 *
 * <p>Inputs above {@link #LARGE_INPUT_BYTES} keep the optimising compiler (text is read three
 * times faster with it), with the serial collector.
 *
 * <p>It runs the command in the JVM it was started in instead when: it is that second JVM already
 * (system property {@value #MARK}), the machine has more than {@value #MAX_CORES} cores (not
 * measured there: the defaults are kept), the user chose a compiler or collector or attached an
 * agent or debugger (their choice is kept), or a second JVM cannot be started.
 *
 * <p>Used by {@link Viscarta#main} and by the benchmarks' measured runs, which start the same way.
 */
public final class Launch {

    /** Set in the second JVM; setting it on the first runs the command there. */
    static final String MARK = "viscarta.launched";

    /** Largest core count the options are used on (measured on 2 cores). */
    static final int MAX_CORES = 2;

    /** The second JVM's options, before the user's own. */
    static final List<String> OPTIONS = List.of("-XX:TieredStopAtLevel=1", "-XX:+UseSerialGC");

    /**
     * Inputs larger than this [bytes] keep the optimising compiler (the serial collector still):
     * the quick compiler's code reads text about three times slower (17 against 50 MB/s, measured),
     * which on a 200 MB table outweighed the optimising compiler's few seconds of work (26.0 s
     * against 19.5 s), while on 13 MB (20,000 sweeps) the quick compiler still won (3.5 s against
     * 5.2–6.0 s). The crossover, about 4 s of compiling against 40 ms a megabyte, is near 100 MB.
     */
    static final long LARGE_INPUT_BYTES = 100_000_000L;

    /** The second JVM's options for inputs of this size. */
    static List<String> options(long inputBytes) {
        return inputBytes > LARGE_INPUT_BYTES ? List.of("-XX:+UseSerialGC") : OPTIONS;
    }

    /** Options whose value is an output, not an input: left out of {@link #inputBytes}. */
    private static final java.util.Set<String> OUTPUTS = java.util.Set.of("-o", "--out");

    /** Most folder entries looked at when adding up the inputs' size. */
    private static final int MAX_ENTRIES = 100_000;

    /**
     * The size of the files a command line names [bytes]: arguments that are files, and the files
     * under arguments that are folders, except the values of {@code -o}/{@code --out}; counted only
     * until it passes {@link #LARGE_INPUT_BYTES} or {@value #MAX_ENTRIES} entries have been seen.
     */
    static long inputBytes(List<String> args) {
        long bytes = 0;
        int entries = 0;
        for (int i = 0; i < args.size() && bytes <= LARGE_INPUT_BYTES; i++) {
            String a = args.get(i);
            if (OUTPUTS.contains(a)) {
                i++;
                continue;
            }
            if (a.startsWith("-")) {
                continue;
            }
            java.nio.file.Path p;
            try {
                p = java.nio.file.Path.of(a);
            } catch (java.nio.file.InvalidPathException notAPath) {
                continue;
            }
            if (java.nio.file.Files.isRegularFile(p)) {
                bytes += size(p);
            } else if (java.nio.file.Files.isDirectory(p)) {
                try (java.util.stream.Stream<java.nio.file.Path> walk = java.nio.file.Files.walk(p)) {
                    java.util.Iterator<java.nio.file.Path> it = walk.iterator();
                    while (it.hasNext() && bytes <= LARGE_INPUT_BYTES && entries++ < MAX_ENTRIES) {
                        java.nio.file.Path f = it.next();
                        if (java.nio.file.Files.isRegularFile(f)) {
                            bytes += size(f);
                        }
                    }
                } catch (IOException | java.io.UncheckedIOException | SecurityException unreadable) {
                    // the command itself will say what is wrong with it
                }
            }
        }
        return bytes;
    }

    private static long size(java.nio.file.Path f) {
        try {
            return java.nio.file.Files.size(f);
        } catch (IOException | SecurityException e) {
            return 0;
        }
    }

    /** JVM options by which the user chose the compiler or collector, or attached something a second JVM would repeat. */
    private static final Pattern CHOSEN = Pattern.compile("-XX:[+-]Use\\w*GC|-XX:TieredStopAtLevel=.*|-XX:[+-]TieredCompilation"
            + "|-Xint|-Xcomp|-Xmixed|-agentlib:.*|-agentpath:.*|-javaagent:.*|-Xdebug|-Xrunjdwp:.*|-XX:Flags=.*|-XX:VMOptionsFile=.*");

    /** How long a stopped run's second JVM gets to clear its staging files before the first exits. */
    private static final long STOP_SECONDS = 30;

    private Launch() {
    }

    /**
     * The second JVM's command line, or empty to run the command in this JVM.
     *
     * @param jvmOptions this JVM's options as given (passed on after {@link #OPTIONS}, so the user's own win)
     * @param cores      processors available to this JVM
     * @param launched   whether this JVM is the second one already
     * @param java       this JVM's executable, where known
     * @param classPath  this JVM's class path
     * @param mainClass  the class whose {@code main} the second JVM runs
     * @param args       the command line's arguments
     * @param inputBytes the size of the files they name ({@link #inputBytes}), asked for only when a second JVM is to run
     */
    static Optional<List<String>> command(List<String> jvmOptions, int cores, boolean launched, Optional<String> java,
                                          String classPath, String mainClass, List<String> args,
                                          java.util.function.LongSupplier inputBytes) {
        if (launched || cores > MAX_CORES || java.isEmpty() || classPath.isEmpty()
                || jvmOptions.stream().anyMatch(o -> CHOSEN.matcher(o).matches())) {
            return Optional.empty();
        }
        List<String> cmd = new ArrayList<>();
        cmd.add(java.get());
        cmd.addAll(options(inputBytes.getAsLong()));
        cmd.addAll(jvmOptions);
        cmd.add("-D" + MARK + "=true");
        cmd.add("-cp");
        cmd.add(classPath);
        cmd.add(mainClass);
        cmd.addAll(args);
        return Optional.of(cmd);
    }

    /**
     * Runs {@code mainClass} with {@code args} in a second JVM when {@link #command} gives one,
     * with this process's standard input, output and error, and waits for it.
     *
     * @return its exit code, or empty when the command is to run in this JVM
     */
    public static OptionalInt run(String mainClass, String[] args) {
        if (Boolean.getBoolean(MARK) || Runtime.getRuntime().availableProcessors() > MAX_CORES) {
            return OptionalInt.empty(); // the cheap rules of command first: the second JVM itself looks up nothing more
        }
        List<String> arguments = List.of(args);
        Optional<List<String>> cmd = command(ManagementFactory.getRuntimeMXBean().getInputArguments(),
                Runtime.getRuntime().availableProcessors(), Boolean.getBoolean(MARK), ProcessHandle.current().info().command(),
                System.getProperty("java.class.path", ""), mainClass, arguments, () -> inputBytes(arguments));
        if (cmd.isEmpty()) {
            return OptionalInt.empty();
        }
        Process child;
        try {
            child = new ProcessBuilder(cmd.get()).inheritIO().start();
        } catch (IOException | SecurityException | UnsupportedOperationException e) {
            return OptionalInt.empty();
        }
        // stopped (Ctrl-C, a kill): the second JVM is stopped too and given time to clear what it staged
        Thread stop = new Thread(() -> {
            child.destroy();
            try {
                child.waitFor(STOP_SECONDS, TimeUnit.SECONDS);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }, "viscarta-stop");
        Runtime.getRuntime().addShutdownHook(stop);
        boolean interrupted = false;
        int code;
        while (true) {
            try {
                code = child.waitFor();
                break;
            } catch (InterruptedException e) {
                interrupted = true;
            }
        }
        try {
            Runtime.getRuntime().removeShutdownHook(stop);
        } catch (IllegalStateException shuttingDown) {
            // the hook runs anyway and finds the second JVM ended
        }
        if (interrupted) {
            Thread.currentThread().interrupt();
        }
        return OptionalInt.of(code);
    }
}
