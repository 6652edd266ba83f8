package org.viscarta.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.time.Instant;
import java.util.zip.ZipEntry;
import java.util.zip.ZipFile;
import java.util.zip.ZipOutputStream;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Entries restamped in place: two containers of the same content written at different times
 * become the same bytes, the content still reads back with its CRC checked, and the time fields
 * hold the stamped time in MS-DOS form (APPNOTE.TXT 4.4.6, worked by hand: 2026-03-04 05:06:08
 * is date (46 &lt;&lt; 9) | (3 &lt;&lt; 5) | 4 = 23652, time (5 &lt;&lt; 11) | (6 &lt;&lt; 5) | 4 = 10436).
 */
@Tag("validation")
class ReproducibleZipTest {

    private static Path container(Path dir, String name, Instant written) throws IOException {
        Path zip = dir.resolve(name);
        try (OutputStream o = Files.newOutputStream(zip); ZipOutputStream z = new ZipOutputStream(o)) {
            for (int k = 0; k < 3; k++) {
                ZipEntry e = new ZipEntry("part" + k + ".xml");
                e.setLastModifiedTime(FileTime.from(written.plusSeconds(k))); // also writes an extended timestamp
                z.putNextEntry(e);
                z.write(("<x>" + "content ".repeat(100 * (k + 1)) + "</x>").getBytes(StandardCharsets.UTF_8));
                z.closeEntry();
            }
        }
        return zip;
    }

    @Test
    void sameContentWrittenAtDifferentTimesBecomesTheSameBytes(@TempDir Path dir) throws IOException {
        Path a = container(dir, "a.zip", Instant.parse("2025-07-01T10:00:00Z"));
        Path b = container(dir, "b.zip", Instant.parse("2026-11-30T23:59:59Z"));
        assertFalse(java.util.Arrays.equals(Files.readAllBytes(a), Files.readAllBytes(b)), "different before");
        Instant stamp = Instant.parse("2026-03-04T05:06:08Z");
        ReproducibleZip.restamp(a, stamp);
        ReproducibleZip.restamp(b, stamp);
        assertArrayEquals(Files.readAllBytes(a), Files.readAllBytes(b));
        try (ZipFile z = new ZipFile(a.toFile())) {
            int n = 0;
            for (ZipEntry e : java.util.Collections.list(z.entries())) {
                String text = new String(z.getInputStream(e).readAllBytes(), StandardCharsets.UTF_8); // CRC checked on read
                assertEquals(stamp, e.getLastModifiedTime().toInstant(), e.getName());
                assertEquals(true, text.startsWith("<x>content"));
                n++;
            }
            assertEquals(3, n);
        }
        byte[] raw = Files.readAllBytes(a);
        java.nio.ByteBuffer buf = java.nio.ByteBuffer.wrap(raw).order(java.nio.ByteOrder.LITTLE_ENDIAN);
        assertEquals(0x04034b50, buf.getInt(0));
        assertEquals(10436, buf.getShort(10) & 0xFFFF, "DOS time of the first local header");
        assertEquals(23652, buf.getShort(12) & 0xFFFF, "DOS date of the first local header");
    }

    @Test
    void aFileThatIsNotAZipIsRefused(@TempDir Path dir) throws IOException {
        Path p = dir.resolve("x.zip");
        Files.writeString(p, "not a zip at all");
        assertThrows(IOException.class, () -> ReproducibleZip.restamp(p, Instant.EPOCH));
    }
}
