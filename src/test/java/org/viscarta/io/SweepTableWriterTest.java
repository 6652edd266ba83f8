package org.viscarta.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;
import org.viscarta.sweep.Unit;

/** Regression: what the one sweep-table writer writes, the reader reads back exactly (Pa at full precision) or to the digits written. */
@Tag("regression")
class SweepTableWriterTest {

    @TempDir
    Path dir;

    private static final List<SweepPoint> POINTS = List.of(new SweepPoint(0.1, 1234.5678901234, 56.789012345, 0),
            new SweepPoint(1.0, 2345.6789012345, 123.45678901, 0), new SweepPoint(10.0, 3456.7890123456, 234.56789012, 0));

    private Sweep readBack(String table) throws IOException {
        Path f = dir.resolve("t.csv");
        Files.writeString(f, table);
        SweepFile sf = new SweepReader(null).read(f);
        assertEquals(1, sf.sweeps().size());
        return sf.sweeps().get(0);
    }

    @Test
    void fullPrecisionPascalsComeBackExactlyWithTheirMetadata() throws IOException {
        Map<String, String> meta = new LinkedHashMap<>();
        meta.put("sample", "gel A");
        meta.put("modulus", "shear");
        meta.put("temperature", "37 °C");
        meta.put("notes", "two\nlines");
        Sweep s = readBack(SweepTableWriter.write(meta, POINTS));
        assertEquals("gel A", s.sample());
        assertEquals(37.0, s.temperatureC());
        assertEquals("two lines", s.metadata().get("notes"));
        for (int i = 0; i < POINTS.size(); i++) {
            assertEquals(POINTS.get(i).frequencyHz(), s.points().get(i).frequencyHz());
            assertEquals(POINTS.get(i).storage(), s.points().get(i).storage());
            assertEquals(POINTS.get(i).loss(), s.points().get(i).loss());
        }
    }

    @Test
    void kilopascalsWithSixDigitsComeBackToSixDigits() throws IOException {
        String table = SweepTableWriter.write(Map.of("sample", "g"), POINTS, SweepPoint::frequencyHz, SweepPoint::storage,
                SweepPoint::loss, List.of(), Unit.KPA, v -> String.format(Locale.ROOT, "%.6g", v));
        assertTrue(table.contains("storage_modulus [kPa]"), table);
        Sweep s = readBack(table);
        for (int i = 0; i < POINTS.size(); i++) {
            assertEquals(POINTS.get(i).storage(), s.points().get(i).storage(), 5e-6 * POINTS.get(i).storage());
        }
    }
}
