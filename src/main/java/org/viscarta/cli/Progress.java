package org.viscarta.cli;

import java.io.PrintWriter;
import java.util.Locale;
import java.util.concurrent.atomic.AtomicInteger;

/**
 * "fitting 120/10000 samples" on stderr, only when stderr is a terminal and not --quiet. With the
 * system property {@code viscarta.timings} set (a developer's switch the benchmarks use), each
 * stage's wall time and the process's processor time over it (all threads; their ratio is the
 * number of cores the stage kept busy) are printed on stderr when the next begins.
 */
final class Progress implements org.viscarta.analysis.Progress {

    private static final boolean TIMINGS = Boolean.getBoolean("viscarta.timings");

    private final PrintWriter err;
    private final boolean active;
    private volatile String what = "";
    private volatile int total;
    private final AtomicInteger done = new AtomicInteger();
    private volatile long last;
    private volatile boolean printed;
    private volatile long stageStarted = System.nanoTime();
    private volatile long stageCpu = processCpu();

    Progress(PrintWriter err, boolean quiet) {
        this.err = err;
        this.active = !quiet && System.console() != null;
    }

    @Override
    public void stage(Stage stage, int items) {
        endLine();
        lap(what.isEmpty() ? "start" : what);
        what = stage.name().toLowerCase(Locale.ROOT);
        total = items;
        done.set(0);
    }

    @Override
    public void step() {
        int n = done.incrementAndGet();
        long now = System.nanoTime();
        if (active && total > 0 && (now - last > 200_000_000L || n == total)) {
            last = now;
            synchronized (err) {
                err.print("\r" + what + " " + n + "/" + total + " samples");
                err.flush();
                printed = true;
            }
        }
    }

    /** With {@code viscarta.timings}: the wall and processor time since the last lap, on stderr. */
    void lap(String name) {
        long now = System.nanoTime();
        long cpu = processCpu();
        if (TIMINGS) {
            synchronized (err) {
                err.printf(Locale.ROOT, "timing: %s %.2f s (processor %.2f s)%n", name, (now - stageStarted) / 1e9,
                        (cpu - stageCpu) / 1e9);
                err.flush();
            }
        }
        stageStarted = now;
        stageCpu = cpu;
    }

    /** The process's processor time so far [ns], every thread; 0 where the platform does not say. */
    private static long processCpu() {
        if (!TIMINGS) {
            return 0;
        }
        return java.lang.management.ManagementFactory.getOperatingSystemMXBean()
                instanceof com.sun.management.OperatingSystemMXBean os ? Math.max(0, os.getProcessCpuTime()) : 0;
    }

    private void endLine() {
        if (printed) {
            synchronized (err) {
                err.println();
                err.flush();
                printed = false;
            }
        }
    }
}
