package org.viscarta.io;

import java.nio.file.Path;
import java.util.ArrayList;

/**
 * The warnings of one file as it is read: the first {@value #MAX} are kept, the rest only counted
 * (a file with a warning on every row must not cost memory or time per row), and {@link #closeOut}
 * adds one line saying how many more there were.
 */
final class CappedWarnings extends ArrayList<ReadWarning> {

    private static final long serialVersionUID = 1L;

    /** Warnings kept per file. */
    static final int MAX = 50;

    private final transient Path file;
    private long dropped;

    CappedWarnings(Path file) {
        this.file = file;
    }

    /** True when a further warning would only be counted: callers may skip composing its text. */
    boolean full() {
        return size() >= MAX;
    }

    /** Counts a warning that was not composed because the list is full. */
    void drop() {
        dropped++;
    }

    /** Counts {@code n} warnings that were not composed. */
    void drop(long n) {
        dropped += n;
    }

    @Override
    public boolean add(ReadWarning w) {
        if (full()) {
            dropped++;
            return false;
        }
        return super.add(w);
    }

    /** Adds the line that counts the warnings left out, when there were any; returns this list. */
    CappedWarnings closeOut() {
        if (dropped > 0) {
            super.add(new ReadWarning(file, 0, dropped + " more warnings like the above"));
            dropped = 0;
        }
        return this;
    }
}
