package org.viscarta.report;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.util.zip.CRC32;
import java.util.zip.Deflater;

/**
 * One part of a ZIP entry compressed on its own, so that a sheet of the workbook is compressed by
 * the thread that writes its rows, while it writes them, and its entry is assembled afterwards
 * from parts without compressing again. Raw Deflate data (RFC 1951) may be joined: each part but
 * the last ends with a sync flush (an empty stored block, leaving the data at a byte boundary and
 * not marked final, RFC 1951 3.2.3–3.2.4 and zlib's Z_SYNC_FLUSH), the last part ends with the final
 * block. A part starts with an empty history, so it never refers back into the one before. The
 * entry's CRC-32 is combined from the parts' (zlib's crc32_combine, by Mark Adler: the CRC of the
 * first part advanced over as many zero bytes as the second part holds, by squaring the GF(2)
 * operator of one zero bit, then added to the CRC of the second part).
 */
final class DeflatedPart extends OutputStream {

    /**
     * An empty final block with fixed codes (BFINAL 1, BTYPE 01, then the end-of-block code 0000000):
     * appended to a part that ends with a sync flush, it makes that part a complete Deflate stream.
     */
    static final byte[] EMPTY_FINAL_BLOCK = {0x03, 0x00};

    private final OutputStream out;
    private final Deflater deflater = new Deflater(Deflater.BEST_SPEED, true);
    private final CRC32 crc = new CRC32();
    private final byte[] buffer = new byte[1 << 16];
    private long size;
    private long compressedSize;
    private boolean closed;

    /** @param out where the compressed bytes go; closed with this stream */
    DeflatedPart(OutputStream out) {
        this.out = out;
    }

    @Override
    public void write(int b) throws IOException {
        write(new byte[] {(byte) b}, 0, 1);
    }

    @Override
    public void write(byte[] b, int off, int len) throws IOException {
        if (closed) {
            throw new IOException("the part is closed");
        }
        crc.update(b, off, len);
        size += len;
        deflater.setInput(b, off, len);
        while (!deflater.needsInput()) {
            drain(Deflater.NO_FLUSH);
        }
    }

    /** Ends the part with a sync flush (not final), and closes the stream under it. */
    @Override
    public void close() throws IOException {
        if (closed) {
            return;
        }
        closed = true;
        try {
            while (drain(Deflater.SYNC_FLUSH) == buffer.length) {
                // a full buffer may hold back more output: ask again
            }
        } finally {
            deflater.end();
            out.close();
        }
    }

    private int drain(int flush) throws IOException {
        int n = deflater.deflate(buffer, 0, buffer.length, flush);
        if (n > 0) {
            out.write(buffer, 0, n);
            compressedSize += n;
        }
        return n;
    }

    /** Bytes written in. */
    long size() {
        return size;
    }

    /** Compressed bytes written out. */
    long compressedSize() {
        return compressedSize;
    }

    /** CRC-32 of the bytes written in. */
    long crc() {
        return crc.getValue();
    }

    /** {@code data} as a raw Deflate part: ending with a sync flush, or with the final block when {@code last}. */
    static byte[] deflate(byte[] data, boolean last) {
        Deflater d = new Deflater(Deflater.BEST_SPEED, true);
        try {
            d.setInput(data);
            if (last) {
                d.finish();
            }
            ByteArrayOutputStream out = new ByteArrayOutputStream(data.length / 4 + 64);
            byte[] buf = new byte[8192];
            while (true) {
                int n = d.deflate(buf, 0, buf.length, last ? Deflater.NO_FLUSH : Deflater.SYNC_FLUSH);
                out.write(buf, 0, n);
                if (last ? d.finished() : n < buf.length) {
                    break;
                }
            }
            return out.toByteArray();
        } finally {
            d.end();
        }
    }

    /** CRC-32 of data. */
    static long crc(byte[] data) {
        CRC32 c = new CRC32();
        c.update(data);
        return c.getValue();
    }

    /** The CRC-32 of A followed by B, from the CRC-32 of A, that of B and the length of B. */
    static long combine(long crcA, long crcB, long lengthB) {
        if (lengthB <= 0) {
            return crcA;
        }
        long[] even = new long[32]; // operator for an even power of two zero bits
        long[] odd = new long[32]; // and for an odd power
        odd[0] = 0xEDB88320L; // the CRC-32 polynomial, reflected: the operator of one zero bit
        long row = 1;
        for (int n = 1; n < 32; n++) {
            odd[n] = row;
            row <<= 1;
        }
        square(even, odd); // two zero bits
        square(odd, even); // four zero bits
        long c = crcA;
        long len = lengthB;
        do {
            square(even, odd); // the first time: one zero byte
            if ((len & 1) != 0) {
                c = times(even, c);
            }
            len >>= 1;
            if (len == 0) {
                break;
            }
            square(odd, even);
            if ((len & 1) != 0) {
                c = times(odd, c);
            }
            len >>= 1;
        } while (len != 0);
        return (c ^ crcB) & 0xFFFFFFFFL;
    }

    private static long times(long[] matrix, long vector) {
        long sum = 0;
        long v = vector;
        for (int i = 0; v != 0; i++, v >>>= 1) {
            if ((v & 1) != 0) {
                sum ^= matrix[i];
            }
        }
        return sum;
    }

    private static void square(long[] square, long[] matrix) {
        for (int n = 0; n < 32; n++) {
            square[n] = times(matrix, matrix[n]);
        }
    }
}
