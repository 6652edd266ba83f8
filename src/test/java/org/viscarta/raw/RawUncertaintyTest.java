package org.viscarta.raw;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The standard errors of E′ and E″ from raw signals agree with the spread of repeated synthetic
 * measurements (Monte Carlo: 300 noisy copies of one known material), and every whole cycle after
 * the settling ones is used.
 */
@Tag("validation")
class RawUncertaintyTest {

    @TempDir
    Path dir;

    /** Tension, L = 10 mm, A = 5 mm²: E* = k* L / A. The material: E′ = 20 kPa, E″ = 6 kPa at 2 Hz. */
    private static final double STORAGE = 2e4;
    private static final double LOSS = 6e3;

    private Path measurement(int seed, double noise, int samplesPerCycle, int cyclesRecorded) throws IOException {
        SplittableRandom rng = new SplittableRandom(seed);
        double f = 2;
        double k = 10e-3 / 5e-6; // E = k_stiffness · L / A  ⇒  k_stiffness = E · A / L
        double kRe = STORAGE / k;
        double kIm = LOSS / k;
        double amp = 1e-6;
        StringBuilder sb = new StringBuilder("# sample: mc\n# geometry: tension; length: 10 mm; area: 5 mm²\n"
                + "time [s],force [N],displacement [m],drive_frequency [Hz]\n");
        int n = samplesPerCycle * cyclesRecorded;
        double fs = samplesPerCycle * f;
        for (int i = 0; i < n; i++) {
            double t = i / fs;
            double ph = 2 * Math.PI * f * t;
            double force = kRe * amp * Math.cos(ph) - kIm * amp * Math.sin(ph);
            double scale = Math.hypot(kRe, kIm) * amp;
            sb.append(String.format(Locale.ROOT, "%.10g,%.14g,%.14g,2%n", t, force + scale * noise * rng.nextGaussian(),
                    amp * Math.cos(ph) + amp * noise * rng.nextGaussian()));
        }
        Path p = dir.resolve("mc-" + seed + ".csv");
        Files.writeString(p, sb.toString());
        return p;
    }

    @Test
    void standardErrorsMatchTheSpreadOfRepeatedMeasurements() throws IOException {
        int runs = 300;
        double[] storage = new double[runs];
        double[] loss = new double[runs];
        double seStorage = 0;
        double seLoss = 0;
        int coveredStorage = 0;
        int coveredLoss = 0;
        for (int r = 0; r < runs; r++) {
            RawConverter.Point p = RawConverter.convert(RawReader.read(measurement(r, 0.05, 40, 6)),
                    RawConverter.Settings.defaults(), null).get(0);
            storage[r] = p.storage();
            loss[r] = p.loss();
            seStorage += p.storageStdError() / runs;
            seLoss += p.lossStdError() / runs;
            coveredStorage += Math.abs(p.storage() - STORAGE) <= 1.96 * p.storageStdError() ? 1 : 0;
            coveredLoss += Math.abs(p.loss() - LOSS) <= 1.96 * p.lossStdError() ? 1 : 0;
        }
        double sdStorage = sd(storage);
        double sdLoss = sd(loss);
        System.out.printf(Locale.ROOT, "raw SEs: E′ reported %.1f vs spread %.1f Pa; E″ reported %.1f vs spread %.1f Pa; coverage %.3f, %.3f%n",
                seStorage, sdStorage, seLoss, sdLoss, coveredStorage / (double) runs, coveredLoss / (double) runs);
        assertEquals(1, seStorage / sdStorage, 0.15, "E′: mean reported SE over the observed spread (was 1.4–1.6)");
        assertEquals(1, seLoss / sdLoss, 0.15, "E″: mean reported SE over the observed spread");
        assertTrue(coveredStorage >= 0.92 * runs && coveredStorage <= 0.98 * runs, "E′ coverage " + coveredStorage);
        assertTrue(coveredLoss >= 0.92 * runs && coveredLoss <= 0.98 * runs, "E″ coverage " + coveredLoss);
    }

    @Test
    void everyWholeCycleAfterTheSettlingOneIsUsed() throws IOException {
        // six whole cycles recorded (sample times 0 … 6 − 1/40 cycles): one settles, five are analysed
        RawConverter.Point p = RawConverter.convert(RawReader.read(measurement(1, 0.0, 40, 6)), RawConverter.Settings.defaults(), null)
                .get(0);
        assertEquals(5, p.cycles());
        assertEquals(STORAGE, p.storage(), 1e-6 * STORAGE);
        assertEquals(LOSS, p.loss(), 1e-6 * STORAGE);
    }

    private static double sd(double[] v) {
        double m = java.util.Arrays.stream(v).average().orElseThrow();
        double ss = 0;
        for (double x : v) {
            ss += (x - m) * (x - m);
        }
        return Math.sqrt(ss / (v.length - 1));
    }
}
