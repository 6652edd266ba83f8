package org.viscarta.io;

import java.io.IOException;
import java.io.Writer;

/**
 * Characters gathered in a buffer of its own and handed on to another writer in blocks of 16,384,
 * without the lock {@link java.io.BufferedWriter} takes on every call: for the writers of large
 * outputs (sheets of the workbook, CSV tables) that are handed a few characters at a time by one
 * thread. Not for use by two threads at once.
 */
public final class UnlockedWriter extends Writer {

    private final Writer out;
    private final char[] buffer = new char[1 << 14];
    private int used;

    public UnlockedWriter(Writer out) {
        this.out = out;
    }

    @Override
    public void write(int c) throws IOException {
        if (used == buffer.length) {
            drain();
        }
        buffer[used++] = (char) c;
    }

    @Override
    public void write(char[] c, int off, int len) throws IOException {
        if (len > buffer.length - used) {
            drain();
            if (len >= buffer.length) {
                out.write(c, off, len);
                return;
            }
        }
        System.arraycopy(c, off, buffer, used, len);
        used += len;
    }

    @Override
    public void write(String s, int off, int len) throws IOException {
        if (len > buffer.length - used) {
            drain();
            if (len >= buffer.length) {
                out.write(s, off, len);
                return;
            }
        }
        s.getChars(off, off + len, buffer, used);
        used += len;
    }

    @Override
    public void write(String s) throws IOException {
        write(s, 0, s.length());
    }

    private void drain() throws IOException {
        if (used > 0) {
            out.write(buffer, 0, used);
            used = 0;
        }
    }

    @Override
    public void flush() throws IOException {
        drain();
        out.flush();
    }

    @Override
    public void close() throws IOException {
        try {
            drain();
        } finally {
            out.close();
        }
    }
}
