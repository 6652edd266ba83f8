package org.viscarta.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.Locale;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;

/**
 * Files of {@link SweepReader#READ_AHEAD_BYTES} or more are read ahead on a second thread. Read that
 * way, a large table must give every point as written, the checksum of its bytes, the line and column
 * of a bad cell deep inside it, the same fall-back to windows-1252 for a byte that is not UTF-8, and
 * leave no reading thread behind.
 */
@Tag("regression")
class ReadAheadTest {

    @TempDir
    Path dir;

    /** A tidy table of {@code samples} × 20 points (about 50 bytes a line), every value written by this test. */
    private static String table(int samples) {
        StringBuilder sb = new StringBuilder("# invented for the test\nsample,frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n");
        for (int s = 0; s < samples; s++) {
            for (int i = 0; i < 20; i++) {
                sb.append(String.format(Locale.ROOT, "s%05d,%.4g,%d.%03d,%d.5e2%n", s, 0.1 * (i + 1), 1000 + s, i, 10 + i));
            }
        }
        return sb.toString();
    }

    private static String sha256(byte[] bytes) throws NoSuchAlgorithmException {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
    }

    private static void noReadingThreadLeft() {
        boolean alive = Thread.getAllStackTraces().keySet().stream().anyMatch(t -> t.getName().equals("viscarta-read-ahead") && t.isAlive());
        assertFalse(alive, "a reading thread is still running");
    }

    @Test
    void aLargeTableReadsWhole() throws IOException, NoSuchAlgorithmException {
        String text = table(2000);
        Path f = dir.resolve("large.csv");
        Files.writeString(f, text, StandardCharsets.UTF_8);
        assertTrue(Files.size(f) >= SweepReader.READ_AHEAD_BYTES, "the file is large enough to be read ahead");
        SweepFile sf = new SweepReader(null).read(f);
        assertEquals(2000, sf.sweeps().size());
        for (int s = 0; s < 2000; s += 97) {
            Sweep sw = sf.sweeps().get(s);
            assertEquals(String.format(Locale.ROOT, "s%05d", s), sw.sample());
            for (int i = 0; i < 20; i++) {
                SweepPoint p = sw.points().get(i);
                assertEquals(Double.parseDouble(String.format(Locale.ROOT, "%.4g", 0.1 * (i + 1))), p.frequencyHz(), 0);
                assertEquals(Double.parseDouble(String.format(Locale.ROOT, "%d.%03d", 1000 + s, i)), p.storage(), 0);
                assertEquals((10 + i) * 100 + 50, p.loss(), 0);
                assertEquals(3 + 20 * s + i, p.line(), "line number of the point");
            }
        }
        assertEquals(sha256(text.getBytes(StandardCharsets.UTF_8)), sf.sha256());
        assertEquals("UTF-8", sf.info().encoding());
        noReadingThreadLeft();
    }

    /** Semicolons and decimal commas, a quoted cell deep inside (split by the CSV parser, not ahead): the same points. */
    @Test
    void semicolonsDecimalCommasAndQuotesReadAsWritten() throws IOException {
        String text = table(2000).replace(",", ";").replace(".", ",");
        String[] lines = text.split("\n", -1);
        lines[25_002] = lines[25_002].replaceFirst("^(s\\d+);", "\"$1\";");
        Path f = dir.resolve("semicolons.csv");
        Files.writeString(f, String.join("\n", lines), StandardCharsets.UTF_8);
        SweepFile sf = new SweepReader(null).read(f);
        assertEquals(2000, sf.sweeps().size());
        assertEquals(';', sf.info().separator());
        assertEquals(',', sf.info().decimalMark());
        Sweep quoted = sf.sweeps().get(1250); // line 25,003 is sample 1250's first point
        assertEquals("s01250", quoted.sample());
        assertEquals(20, quoted.points().size());
        assertEquals(1250.0 + 1000, quoted.points().get(0).storage(), 0);
        assertEquals(1999.0 + 1000 + 0.019, sf.sweeps().get(1999).points().get(19).storage(), 1e-9);
        noReadingThreadLeft();
    }

    @Test
    void aBadCellDeepInsideIsNamedByLineAndColumn() throws IOException {
        String text = table(2000);
        int line = 30_000;
        String[] lines = text.split("\n", -1);
        lines[line - 1] = lines[line - 1].replaceFirst(",[^,]*$", ",12x");
        Path f = dir.resolve("bad.csv");
        Files.writeString(f, String.join("\n", lines), StandardCharsets.UTF_8);
        InputException e = assertThrows(InputException.class, () -> new SweepReader(null).read(f));
        assertEquals(line, e.line(), e.getMessage());
        assertEquals(4, e.column(), e.getMessage());
        noReadingThreadLeft();
    }

    @Test
    void aByteThatIsNotUtf8LateInTheFileMakesItWindows1252() throws IOException, NoSuchAlgorithmException {
        String text = table(2000) + "# operator: Mü\n";
        byte[] bytes = text.getBytes(StandardCharsets.ISO_8859_1); // ü as the single byte 0xFC: not UTF-8
        Path f = dir.resolve("latin.csv");
        Files.write(f, bytes);
        SweepFile sf = new SweepReader(null).read(f);
        assertEquals("windows-1252", sf.info().encoding());
        assertEquals(2000, sf.sweeps().size());
        assertEquals(sha256(bytes), sf.sha256());
        noReadingThreadLeft();
    }
}
