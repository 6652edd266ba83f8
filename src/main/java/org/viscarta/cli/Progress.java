package org.viscarta.cli;

import java.io.PrintWriter;
import java.util.concurrent.atomic.AtomicInteger;

/** "fitting 120/10000 samples" on stderr, only when stderr is a terminal and not --quiet. */
final class Progress {

    private final PrintWriter err;
    private final boolean active;
    private final int total;
    private final AtomicInteger done = new AtomicInteger();
    private volatile long last;

    Progress(PrintWriter err, boolean quiet, int total) {
        this.err = err;
        this.active = !quiet && System.console() != null && total > 0;
        this.total = total;
    }

    void done() {
        int n = done.incrementAndGet();
        long now = System.nanoTime();
        if (active && (now - last > 200_000_000L || n == total)) {
            last = now;
            synchronized (err) {
                err.print("\rfitting " + n + "/" + total + " samples");
                err.flush();
            }
        }
    }

    void finish() {
        if (active) {
            err.println();
            err.flush();
        }
    }
}
