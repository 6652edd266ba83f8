package org.viscarta.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.SequenceInputStream;
import java.util.SplittableRandom;
import java.util.zip.CRC32;
import java.util.zip.Inflater;
import java.util.zip.InflaterInputStream;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * Compressed parts joined into one entry: checked against the JDK's zlib (java.util.zip), the
 * reference for both the Deflate format (RFC 1951) and CRC-32.
 */
@Tag("validation")
class DeflatedPartTest {

    /** Text like a sheet's XML, with runs that compress and digits that do not. */
    private static byte[] xmlLike(SplittableRandom r, int n) {
        StringBuilder sb = new StringBuilder();
        while (sb.length() < n) {
            sb.append("<c r=\"B").append(r.nextInt(1_000_000)).append("\" s=\"3\"><v>").append(r.nextDouble() * 1e4).append("</v></c>");
        }
        return sb.substring(0, n).getBytes(java.nio.charset.StandardCharsets.UTF_8);
    }

    private static long crc(byte[] a) {
        CRC32 c = new CRC32();
        c.update(a);
        return c.getValue();
    }

    @Test
    void combinedCrcIsTheCrcOfTheJoinedBytes() {
        SplittableRandom r = new SplittableRandom(3);
        for (int k = 0; k < 300; k++) {
            byte[] a = new byte[r.nextInt(k % 10 == 0 ? 1 : 5000)];
            byte[] b = new byte[k % 7 == 0 ? 0 : r.nextInt(1, 70_000)];
            r.nextBytes(a);
            r.nextBytes(b);
            byte[] ab = new byte[a.length + b.length];
            System.arraycopy(a, 0, ab, 0, a.length);
            System.arraycopy(b, 0, ab, a.length, b.length);
            assertEquals(crc(ab), DeflatedPart.combine(crc(a), crc(b), b.length), "lengths " + a.length + " and " + b.length);
        }
    }

    @Test
    void partsJoinedInflateToTheJoinedText() throws IOException {
        SplittableRandom r = new SplittableRandom(5);
        for (int k = 0; k < 40; k++) {
            byte[] head = xmlLike(r, r.nextInt(0, 3000));
            byte[] body = xmlLike(r, k % 9 == 0 ? 0 : r.nextInt(1, 400_000));
            byte[] tail = xmlLike(r, r.nextInt(0, 3000));
            ByteArrayOutputStream bodyDeflated = new ByteArrayOutputStream();
            DeflatedPart part = new DeflatedPart(bodyDeflated);
            for (int at = 0; at < body.length; ) { // written in pieces, as a writer hands them on
                int len = Math.min(body.length - at, r.nextInt(1, 20_000));
                part.write(body, at, len);
                at += len;
            }
            part.close();
            assertEquals(body.length, part.size());
            assertEquals(bodyDeflated.size(), part.compressedSize());
            assertEquals(crc(body), part.crc());
            ByteArrayOutputStream joined = new ByteArrayOutputStream();
            joined.write(DeflatedPart.deflate(head, false));
            bodyDeflated.writeTo(joined);
            joined.write(DeflatedPart.deflate(tail, true));
            Inflater inflater = new Inflater(true);
            byte[] out;
            try (InflaterInputStream in = new InflaterInputStream(new ByteArrayInputStream(joined.toByteArray()), inflater)) {
                out = in.readAllBytes();
            }
            ByteArrayOutputStream want = new ByteArrayOutputStream();
            want.write(head);
            want.write(body);
            want.write(tail);
            assertArrayEquals(want.toByteArray(), out, "case " + k);
            assertEquals(true, inflater.finished(), "the last part ends the Deflate stream");
            assertEquals(crc(want.toByteArray()), DeflatedPart.combine(DeflatedPart.combine(DeflatedPart.crc(head), part.crc(),
                    part.size()), DeflatedPart.crc(tail), tail.length));
        }
    }

    @Test
    void aPartWithTheEmptyFinalBlockIsAWholeStream() throws IOException {
        byte[] body = xmlLike(new SplittableRandom(8), 100_000);
        ByteArrayOutputStream deflated = new ByteArrayOutputStream();
        try (DeflatedPart part = new DeflatedPart(deflated)) {
            part.write(body);
        }
        Inflater inflater = new Inflater(true);
        try (InflaterInputStream in = new InflaterInputStream(new SequenceInputStream(new ByteArrayInputStream(deflated.toByteArray()),
                new ByteArrayInputStream(DeflatedPart.EMPTY_FINAL_BLOCK)), inflater)) {
            assertArrayEquals(body, in.readAllBytes());
        }
        assertEquals(true, inflater.finished());
    }
}
