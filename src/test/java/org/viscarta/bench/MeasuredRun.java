package org.viscarta.bench;

import java.io.IOException;
import java.io.PrintWriter;
import java.lang.management.ManagementFactory;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import org.viscarta.cli.Launch;
import org.viscarta.cli.Viscarta;

/**
 * Runs one command line of {@code viscarta} exactly as a user would (same entry point, same
 * options) and prints its wall time, processor time and peak resident memory, so that benchmarks measure the
 * command and not a subset of it. Started in a JVM of its own by {@link Benchmarks} with the heap
 * and core count under test; like {@code main}, it runs the command in a second JVM where
 * {@link Launch} would, and then says how long the whole wait was, from the first JVM's start.
 */
public final class MeasuredRun {

    private MeasuredRun() {
    }

    public static void main(String[] args) throws IOException {
        long jvmStart = ManagementFactory.getRuntimeMXBean().getStartTime();
        // started as main starts the work: in a second JVM where main would use one, measured there, the whole wait measured here
        java.util.OptionalInt launched = Launch.run(MeasuredRun.class.getName(), args);
        if (launched.isPresent()) {
            System.out.printf(Locale.ROOT, "launched: exit %d, %.2f s since the first JVM started, its own processor time %.2f s%n",
                    launched.getAsInt(), (System.currentTimeMillis() - jvmStart) / 1e3, processorSeconds());
            System.exit(launched.getAsInt());
        }
        long t0 = System.nanoTime();
        int code = Viscarta.execute(args, new PrintWriter(System.out, true), new PrintWriter(System.err, true));
        double seconds = (System.nanoTime() - t0) / 1e9;
        double sinceJvm = (System.currentTimeMillis() - jvmStart) / 1e3;
        System.out.printf(Locale.ROOT, "measured: exit %d, %.2f s in the command, %.2f s since the JVM started, processor time %.2f s, "
                + "peak resident %s%n", code, seconds, sinceJvm, processorSeconds(), peakResident());
        System.exit(code);
    }

    /**
     * Processor time of the whole JVM so far, every thread (the command's, the collector's and the
     * compiler's): on a shared machine it wanders less than wall time, so two builds compare better
     * by it; NaN where the JVM does not say.
     */
    static double processorSeconds() {
        if (ManagementFactory.getOperatingSystemMXBean() instanceof com.sun.management.OperatingSystemMXBean os) {
            long ns = os.getProcessCpuTime();
            return ns < 0 ? Double.NaN : ns / 1e9;
        }
        return Double.NaN;
    }

    /** VmHWM of /proc/self/status (Linux), else "unknown". */
    static String peakResident() throws IOException {
        Path status = Path.of("/proc/self/status");
        if (!Files.isReadable(status)) {
            return "unknown";
        }
        for (String line : Files.readAllLines(status)) {
            if (line.startsWith("VmHWM:")) {
                long kb = Long.parseLong(line.replaceAll("[^0-9]", ""));
                return String.format(Locale.ROOT, "%d MB", kb >> 10);
            }
        }
        return "unknown";
    }
}
