package org.viscarta.report;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.time.Instant;
import java.time.ZoneOffset;
import java.time.ZonedDateTime;

/**
 * Stamps every entry of a ZIP container (an .xlsx is one) with the same time, in place, so that
 * the same content always gives the same bytes. Only the time fields change: the compressed data
 * are not touched, so the container is compressed once, when it is written. The layout is that of
 * PKWARE's APPNOTE.TXT (6.3): end of central directory (4.3.16, and its ZIP64 form 4.3.14–15),
 * central directory headers (4.3.12), local file headers (4.3.7), the ZIP64 extra field (4.5.3)
 * and the extended timestamp extra field 0x5455 (4.6.1 lists it; its layout is Info-ZIP's).
 */
final class ReproducibleZip {

    private static final int EOCD = 0x06054b50;
    private static final int ZIP64_LOCATOR = 0x07064b50;
    private static final int ZIP64_EOCD = 0x06064b50;
    private static final int CEN = 0x02014b50;
    private static final int LOC = 0x04034b50;
    private static final long MAX32 = 0xFFFFFFFFL;

    private ReproducibleZip() {
    }

    /** The MS-DOS date and time of an instant, read as UTC (APPNOTE 4.4.6); before 1980 is 1980-01-01. */
    static int[] dosTime(Instant t) {
        ZonedDateTime z = t.atZone(ZoneOffset.UTC);
        if (z.getYear() < 1980) {
            return new int[] {(1 << 5) | 1, 0};
        }
        int date = ((z.getYear() - 1980) << 9) | (z.getMonthValue() << 5) | z.getDayOfMonth();
        int time = (z.getHour() << 11) | (z.getMinute() << 5) | (z.getSecond() / 2);
        return new int[] {date, time};
    }

    /**
     * Sets the modification time of every entry of the ZIP file to {@code t}, in place.
     *
     * @throws IOException when the file is not a ZIP container this can read
     */
    static void restamp(Path zip, Instant t) throws IOException {
        int[] dos = dosTime(t);
        try (FileChannel ch = FileChannel.open(zip, StandardOpenOption.READ, StandardOpenOption.WRITE)) {
            long size = ch.size();
            int tailLength = (int) Math.min(size, 22 + 65535 + 20);
            ByteBuffer tail = read(ch, size - tailLength, tailLength);
            int eocd = -1;
            for (int i = tailLength - 22; i >= 0; i--) {
                if (tail.getInt(i) == EOCD) {
                    eocd = i;
                    break;
                }
            }
            if (eocd < 0) {
                throw new IOException(zip + ": no end of central directory");
            }
            long entries = tail.getShort(eocd + 10) & 0xFFFF;
            long cdSize = tail.getInt(eocd + 12) & MAX32;
            long cdOffset = tail.getInt(eocd + 16) & MAX32;
            if ((entries == 0xFFFF || cdOffset == MAX32 || cdSize == MAX32) && eocd >= 20 && tail.getInt(eocd - 20) == ZIP64_LOCATOR) {
                ByteBuffer z64 = read(ch, tail.getLong(eocd - 20 + 8), 56);
                if (z64.getInt(0) != ZIP64_EOCD) {
                    throw new IOException(zip + ": no ZIP64 end of central directory where its locator points");
                }
                entries = z64.getLong(32);
                cdSize = z64.getLong(40);
                cdOffset = z64.getLong(48);
            }
            ByteBuffer cd = read(ch, cdOffset, Math.toIntExact(cdSize));
            int p = 0;
            for (long e = 0; e < entries; e++) {
                if (cd.getInt(p) != CEN) {
                    throw new IOException(zip + ": central directory header " + e + " is not where expected");
                }
                cd.putShort(p + 12, (short) dos[1]);
                cd.putShort(p + 14, (short) dos[0]);
                long compressed = cd.getInt(p + 20) & MAX32;
                long uncompressed = cd.getInt(p + 24) & MAX32;
                int nameLength = cd.getShort(p + 28) & 0xFFFF;
                int extraLength = cd.getShort(p + 30) & 0xFFFF;
                int commentLength = cd.getShort(p + 32) & 0xFFFF;
                long local = cd.getInt(p + 42) & MAX32;
                int extra = p + 46 + nameLength;
                for (int x = extra; x + 4 <= extra + extraLength; ) {
                    int id = cd.getShort(x) & 0xFFFF;
                    int length = cd.getShort(x + 2) & 0xFFFF;
                    if (id == 0x0001 && local == MAX32) {
                        int at = x + 4 + (uncompressed == MAX32 ? 8 : 0) + (compressed == MAX32 ? 8 : 0);
                        local = cd.getLong(at);
                    }
                    stampExtended(cd, id, x, length, t);
                    x += 4 + length;
                }
                restampLocal(ch, local, dos, t, zip);
                p = extra + extraLength + commentLength;
            }
            cd.rewind();
            ch.write(cd, cdOffset);
        }
    }

    /** The local header at {@code at}: its time fields and any extended timestamp in its extra field. */
    private static void restampLocal(FileChannel ch, long at, int[] dos, Instant t, Path zip) throws IOException {
        ByteBuffer head = read(ch, at, 30);
        if (head.getInt(0) != LOC) {
            throw new IOException(zip + ": no local file header at " + at);
        }
        head.putShort(10, (short) dos[1]);
        head.putShort(12, (short) dos[0]);
        head.rewind();
        ch.write(head, at);
        int nameLength = head.getShort(26) & 0xFFFF;
        int extraLength = head.getShort(28) & 0xFFFF;
        if (extraLength == 0) {
            return;
        }
        ByteBuffer extra = read(ch, at + 30 + nameLength, extraLength);
        boolean changed = false;
        for (int x = 0; x + 4 <= extraLength; ) {
            int id = extra.getShort(x) & 0xFFFF;
            int length = extra.getShort(x + 2) & 0xFFFF;
            changed |= stampExtended(extra, id, x, length, t);
            x += 4 + length;
        }
        if (changed) {
            extra.rewind();
            ch.write(extra, at + 30 + nameLength);
        }
    }

    /** An extended timestamp field (0x5455): every time it holds set to t [s since 1970]; true when it was one. */
    private static boolean stampExtended(ByteBuffer b, int id, int at, int length, Instant t) {
        if (id != 0x5455 || length < 1) {
            return false;
        }
        int seconds = (int) Math.max(0, Math.min(Integer.MAX_VALUE, t.getEpochSecond()));
        for (int k = at + 5; k + 4 <= at + 4 + length; k += 4) {
            b.putInt(k, seconds);
        }
        return true;
    }

    private static ByteBuffer read(FileChannel ch, long at, int length) throws IOException {
        ByteBuffer b = ByteBuffer.allocate(length).order(ByteOrder.LITTLE_ENDIAN);
        while (b.hasRemaining()) {
            if (ch.read(b, at + b.position()) < 0) {
                throw new IOException("the ZIP file ends early");
            }
        }
        b.flip();
        return b;
    }
}
