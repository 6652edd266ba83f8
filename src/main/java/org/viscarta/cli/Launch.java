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
 * <p>Why: on a machine with two cores, the JVM's optimising compiler spends about as much
 * processor time compiling as the demo report spends working (11 s of 17 s), on the cores the
 * work needs, and its compiled code arrives too late to earn that back; the concurrent collector's
 * own threads take another share. Measured on a 2-core machine (README, Performance): the demo
 * report 6.0–6.3 s instead of 9.3–10.2 s, and even the 10,000-sweep report 20.5 s instead of
 * 23.1 s with less memory. A JVM's options cannot be changed once it runs, and {@code java -jar}
 * takes none from the jar, so {@code main} starts the work in a second JVM with them, passes it
 * the user's own JVM options, terminal and files, and exits with its exit code.
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
     */
    static Optional<List<String>> command(List<String> jvmOptions, int cores, boolean launched, Optional<String> java,
                                          String classPath, String mainClass, List<String> args) {
        if (launched || cores > MAX_CORES || java.isEmpty() || classPath.isEmpty()
                || jvmOptions.stream().anyMatch(o -> CHOSEN.matcher(o).matches())) {
            return Optional.empty();
        }
        List<String> cmd = new ArrayList<>();
        cmd.add(java.get());
        cmd.addAll(OPTIONS);
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
        Optional<List<String>> cmd = command(ManagementFactory.getRuntimeMXBean().getInputArguments(),
                Runtime.getRuntime().availableProcessors(), Boolean.getBoolean(MARK), ProcessHandle.current().info().command(),
                System.getProperty("java.class.path", ""), mainClass, List.of(args));
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
