package org.viscarta.io;

import java.io.IOException;
import java.io.OutputStream;
import java.io.Writer;

/**
 * Characters encoded as UTF-8 straight into a byte buffer of its own, handed on to a stream in
 * blocks of 32 KiB: the same bytes as an {@link java.io.OutputStreamWriter} for UTF-8 (a lone
 * surrogate becomes '?', its replacement, as there), without its lock on every call and without the
 * slow path its charset encoder takes for the rest of a block once it meets a character outside
 * ASCII (a δ or ′ in a header); texts go through {@link String#getBytes}, characters one at a time
 * through {@link #put}. For the writers of large outputs handed a few characters at a time by one
 * thread (the workbook's sheets, the CSV tables). Not for use by two threads at once.
 */
public final class Utf8Writer extends Writer {

    private static final byte REPLACEMENT = '?';

    private final OutputStream out;
    private final byte[] bytes = new byte[1 << 15];
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

    /**
     * A text in pieces of up to {@value #PIECE} characters, each encoded by the JDK's own encoder
     * (which copies text of ASCII characters as it is, where a loop over the characters costs several
     * times more on the JVM's quick compiler), the same bytes: a high surrogate at a piece's end is
     * kept for the character after it, in this text or the next, as {@link #put} does.
     */
    @Override
    public void write(String s, int off, int len) throws IOException {
        while (len > 0) {
            int n = Math.min(len, PIECE);
            if (high == 0 && Character.isHighSurrogate(s.charAt(off + n - 1))) {
                n--; // kept for the character after it
            }
            if (high != 0 || n == 0) {
                if (used > bytes.length - 4) {
                    drain();
                }
                put(s.charAt(off));
                off++;
                len--;
                continue;
            }
            byte[] b = s.substring(off, off + n).getBytes(java.nio.charset.StandardCharsets.UTF_8);
            if (used + b.length > bytes.length) {
                drain();
            }
            System.arraycopy(b, 0, bytes, used, b.length);
            used += b.length;
            off += n;
            len -= n;
        }
    }

    /** Most characters encoded at once by {@link #write(String, int, int)}: three bytes each at most, within the buffer. */
    private static final int PIECE = 4096;

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
