package org.viscarta.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viscarta.io.InputException;
import org.viscarta.sweep.Quantity;
import org.viscarta.sweep.Sweep;

/** Amplitude sweeps are read with their amplitudes and kept apart from frequency sweeps. */
@Tag("regression")
class AmplitudeSweepReadingTest {

    @TempDir
    Path dir;

    @Test
    void anAmplitudeSweepIsKeptApartAndAFrequencySweepKeepsItsAmplitude() throws IOException {
        Files.writeString(dir.resolve("gel-amplitude.csv"), """
                # sample: gel
                # frequency: 1 Hz
                strain_amplitude [%],G' [Pa],G'' [Pa]
                0.1,1000,100
                1,990,101
                10,800,150
                100,300,320
                """);
        Files.writeString(dir.resolve("gel-1.csv"), """
                # sample: gel
                strain_amplitude [%],frequency [Hz],G' [Pa],G'' [Pa]
                1,0.1,900,90
                1,1,1000,100
                1,10,1100,110
                """);
        Inputs in = Inputs.read(List.of(dir), ReadSettings.defaults());
        assertEquals(1, in.amplitudeSweeps().size());
        Sweep a = in.amplitudeSweeps().get(0);
        assertEquals(Quantity.STRAIN_AMPLITUDE, a.amplitudeQuantity().orElseThrow());
        assertEquals(1.0, a.minFrequencyHz(), 0);
        assertEquals(0.001, a.points().get(0).amplitude(), 1e-15, "0.1 % is 0.001");
        assertEquals(1, in.samples().size());
        Sweep f = in.samples().get(0).replicates().get(0);
        assertTrue(!f.isAmplitudeSweep());
        assertEquals(0.01, f.points().get(1).amplitude(), 1e-15);
        assertTrue(in.notes().stream().anyMatch(n -> n.contains("1 amplitude sweep")), in.notes().toString());
    }

    @Test
    void aStrainWithoutUnitOrAnAmplitudeSweepWithoutFrequencyIsRefused() throws IOException {
        Path noUnit = dir.resolve("a.csv");
        Files.writeString(noUnit, "frequency [Hz],strain_amplitude,G' [Pa],G'' [Pa]\n1,0.1,1000,100\n1,1,990,100\n");
        InputException e = assertThrows(InputException.class, () -> Inputs.read(List.of(noUnit), ReadSettings.defaults()));
        assertTrue(e.getMessage().contains("strain_amplitude [%]"), e.getMessage());
        assertEquals(1, e.line());
        Path noFrequency = dir.resolve("b.csv");
        Files.writeString(noFrequency, "strain_amplitude [%],G' [Pa],G'' [Pa]\n0.1,1000,100\n1,990,100\n");
        InputException e2 = assertThrows(InputException.class, () -> Inputs.read(List.of(noFrequency), ReadSettings.defaults()));
        assertTrue(e2.getMessage().contains("# frequency: 1 Hz"), e2.getMessage());
    }
}
