package org.viscarta.cli;

import java.io.PrintWriter;
import java.util.Locale;
import java.util.concurrent.atomic.AtomicInteger;

/** "fitting 120/10000 samples" on stderr, only when stderr is a terminal and not --quiet. */
final class Progress implements org.viscarta.analysis.Progress {

    private final PrintWriter err;
    private final boolean active;
    private volatile String what = "";
    private volatile int total;
    private final AtomicInteger done = new AtomicInteger();
    private volatile long last;
    private volatile boolean printed;

    Progress(PrintWriter err, boolean quiet) {
        this.err = err;
        this.active = !quiet && System.console() != null;
    }

    @Override
    public void stage(Stage stage, int items) {
        endLine();
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
