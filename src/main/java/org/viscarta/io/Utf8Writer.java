package org.viscarta.io;

import java.io.IOException;
import java.io.OutputStream;
import java.io.Writer;

/**
 * Characters encoded as UTF-8 straight into a byte buffer of its own, handed on to a stream in
 * blocks of 32 KiB: the same bytes as an {@link java.io.OutputStreamWriter} for UTF-8 (a lone
 * surrogate becomes '?', its replacement, as there), without its lock on every call and without the
 * slow path the JDK's encoder takes for the rest of a block once it meets a character outside ASCII
 * (a δ or ′ in a header). For the writers of large outputs handed a few characters at a time by one
 * thread (the workbook's sheets, the CSV tables). Not for use by two threads at once.
 */
public final class Utf8Writer extends Writer {

    private static final byte REPLACEMENT = '?';

    private final OutputStream out;
    private final byte[] bytes = new byte[1 << 15];
    private final char[] chars = new char[1 << 12];
    private int used;
    /** A high surrogate waiting for the low one that follows it (0: none). */
    private char high;

    public Utf8Writer(OutputStream out) {
        this.out = out;
    }

    @Override
    public void write(int c) throws IOException {
        if (used > bytes.length - 4) {
            drain();
        }
        put((char) c);
    }

    @Override
    public void write(char[] c, int off, int len) throws IOException {
        for (int i = off, end = off + len; i < end; i++) {
            if (used > bytes.length - 4) {
                drain();
            }
            put(c[i]);
        }
    }

    @Override
    public void write(String s, int off, int len) throws IOException {
        while (len > 0) {
            int n = Math.min(len, chars.length);
            s.getChars(off, off + n, chars, 0);
            write(chars, 0, n);
            off += n;
            len -= n;
        }
    }

    @Override
    public void write(String s) throws IOException {
        write(s, 0, s.length());
    }

    /** One character (and a surrogate waiting before it): four bytes at most, and room for four is there. */
    private void put(char c) {
        if (high != 0) {
            char h = high;
            high = 0;
            if (Character.isLowSurrogate(c)) {
                int cp = Character.toCodePoint(h, c);
                bytes[used++] = (byte) (0xF0 | cp >> 18);
                bytes[used++] = (byte) (0x80 | cp >> 12 & 0x3F);
                bytes[used++] = (byte) (0x80 | cp >> 6 & 0x3F);
                bytes[used++] = (byte) (0x80 | cp & 0x3F);
                return;
            }
            bytes[used++] = REPLACEMENT; // a high surrogate without its low one; with c, four bytes at most
        }
        if (c < 0x80) {
            bytes[used++] = (byte) c;
        } else if (c < 0x800) {
            bytes[used++] = (byte) (0xC0 | c >> 6);
            bytes[used++] = (byte) (0x80 | c & 0x3F);
        } else if (Character.isHighSurrogate(c)) {
            high = c;
        } else if (Character.isLowSurrogate(c)) {
            bytes[used++] = REPLACEMENT; // a low surrogate without its high one
        } else {
            bytes[used++] = (byte) (0xE0 | c >> 12);
            bytes[used++] = (byte) (0x80 | c >> 6 & 0x3F);
            bytes[used++] = (byte) (0x80 | c & 0x3F);
        }
    }

    private void drain() throws IOException {
        if (used > 0) {
            out.write(bytes, 0, used);
            used = 0;
        }
    }

    /** Hands on what is encoded; a high surrogate waits for the next character, as in OutputStreamWriter. */
    @Override
    public void flush() throws IOException {
        drain();
        out.flush();
    }

    /** A high surrogate still waiting is written as its replacement, then the stream is closed. */
    @Override
    public void close() throws IOException {
        try {
            if (high != 0) {
                high = 0;
                if (used > bytes.length - 4) {
                    drain();
                }
                bytes[used++] = REPLACEMENT;
            }
            drain();
        } finally {
            out.close();
        }
    }
}
