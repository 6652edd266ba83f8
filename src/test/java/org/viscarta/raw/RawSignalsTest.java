package org.viscarta.raw;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SplittableRandom;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viscarta.io.InputException;
import org.viscarta.model.Zener;

/**
 * Raw signals to moduli: the demodulation against DOMAIN.md 10.6, the geometries against 10.4, and
 * recovery of a known E*(ω) from synthetic signals through every geometry.
 */
@Tag("validation")
class RawSignalsTest {

    @TempDir
    Path dir;

    @Test
    void demodulationWithDriftMatchesDomainExample() {
        // DOMAIN.md 10.6: fs = 1000 Hz, f = 10 Hz, N = 1037 (non-integer cycles); h = 1e−7 + 5e−9 t + 2e−8 cos(ωt − 0.1),
        // F = 3e−9 + 1e−10 t + 4e−10 cos(ωt + 0.2) ⇒ k* = 0.0191067298 + 0.0059104041i N/m, |k*| = 0.02, δ = 0.3
        int n = 1037;
        double[] t = new double[n];
        double[] h = new double[n];
        double[] f = new double[n];
        double w = 2 * Math.PI * 10;
        for (int k = 0; k < n; k++) {
            t[k] = k / 1000.0;
            h[k] = 1e-7 + 5e-9 * t[k] + 2e-8 * Math.cos(w * t[k] - 0.1);
            f[k] = 3e-9 + 1e-10 * t[k] + 4e-10 * Math.cos(w * t[k] + 0.2);
        }
        Demodulator.Phasor ph = Demodulator.fit(t, h, 10);
        Demodulator.Phasor pf = Demodulator.fit(t, f, 10);
        assertEquals(2.0e-8, ph.amplitude(), 1e-20);
        assertEquals(-0.1, ph.phase(), 1e-12);
        Complex k = new Complex(pf.re(), pf.im()).divide(new Complex(ph.re(), ph.im()));
        assertEquals(0.0191067298, k.getReal(), 5e-11);
        assertEquals(0.0059104041, k.getImaginary(), 5e-11);
        assertEquals(0.3, k.getArgument(), 1e-12);
    }

    @Test
    void distortionMatchesDomainExample() {
        // DOMAIN.md 10.6: y = cos ωt + 0.1 cos(2ωt + 0.5) + 0.05 cos 3ωt ⇒ THD = sqrt(0.01 + 0.0025) = 0.1118033989
        int n = 2000;
        double[] t = new double[n];
        double[] y = new double[n];
        double w = 2 * Math.PI * 5;
        for (int k = 0; k < n; k++) {
            t[k] = k / 1000.0;
            y[k] = Math.cos(w * t[k]) + 0.1 * Math.cos(2 * w * t[k] + 0.5) + 0.05 * Math.cos(3 * w * t[k]);
        }
        assertEquals(0.1118033989, Demodulator.fit(t, y, 5).distortion(), 1e-10);
    }

    @Test
    void geometriesMatchTheirPublishedForms() {
        // DOMAIN.md 10.4 Hertz: R = 5 µm, h = 1 µm, ν = 0.5, E* = 10000 + 3000i Pa ⇒ k* = 0.0596284794 + 0.0178885438i N/m
        Geometry sphere = new Geometry.Sphere(5e-6, 1e-6, 0.5);
        Complex e = sphere.modulus(new Complex(0.0596284794, 0.0178885438));
        assertEquals(10000, e.getReal(), 5e-6); // the printed k* has 9–10 significant digits
        assertEquals(3000, e.getImaginary(), 5e-6);
        // DOMAIN.md 10.4 flat punch a = 50 µm, E = 1 MPa, ν = 0.5: S = 133.3333 N/m (Sneddon)
        assertEquals(1e6, new Geometry.FlatPunch(50e-6, 0.5).modulus(new Complex(400.0 / 3, 0)).getReal(), 1e-6);
        // the cone's general relation with A = πa² is Sneddon's flat punch again (Pharr, Oliver & Brotzen 1992):
        // a cone of half-angle 45° at depth 50 µm has contact radius 50 µm
        assertEquals(1e6, new Geometry.Cone(Math.PI / 4, 50e-6, 0.5, 1).modulus(new Complex(400.0 / 3, 0)).getReal(), 1e-3);
        // DOMAIN.md 10.4 tension bar L0/A0 = 2000 m⁻¹: k* = 100 + 20i N/m ⇒ E* = 2e5 + 4e4i Pa
        Complex bar = new Geometry.Tension(10e-3, 5e-6).modulus(new Complex(100, 20));
        assertEquals(2e5, bar.getReal(), 1e-6);
        assertEquals(4e4, bar.getImaginary(), 1e-6);
        // DOMAIN.md 10.4 double shear sandwich: A = 1 cm², h = 1 mm, x = 10 µm, F = 0.01 N ⇒ G = 5000 Pa with two layers;
        // one layer of 2 cm² in simple shear is the same: G = (F/x)·h/A
        assertEquals(5000, new Geometry.PlateShear(1e-3, 2e-4).modulus(new Complex(0.01 / 10e-6, 0)).getReal(), 1e-9);
        // Hertz second harmonic A₂/A₁ = ε/8 (DOMAIN.md 4.2): ε = 0.02 ⇒ 0.0025
        assertEquals(0.0025, sphere.contactSecondHarmonic(0.02e-6), 1e-15);
    }

    /** A raw file of a zener material through a geometry: drift, a settling transient, noise and a phase lag. */
    private Path rawFile(String name, String geometryLine, Geometry g, double noise, double lag, double secondHarmonic) throws IOException {
        SplittableRandom rng = new SplittableRandom(name.hashCode());
        StringBuilder sb = new StringBuilder("# sample: " + name + "\n" + geometryLine + "\ntime [s],force [N],displacement [m],drive_frequency [Hz]\n");
        double t = 0;
        for (double f : new double[] {0.5, 2, 8}) {
            Complex e = zener(f);
            Complex k = e.divide(g.modulus(Complex.ONE));
            double amp = 20e-9;
            double fs = 200 * f;
            int n = (int) Math.round(6.3 * fs / f);
            for (int i = 0; i < n; i++) {
                double tt = i / fs;
                double ph = 2 * Math.PI * f * tt;
                double h = 4e-6 + 1e-9 * tt + amp * Math.cos(ph) + 2e-9 * Math.exp(-tt * f * 3);
                double force = k.getReal() * amp * Math.cos(ph + lag) - k.getImaginary() * amp * Math.sin(ph + lag)
                        + k.abs() * amp * secondHarmonic * Math.cos(2 * ph) + 1e-6 + 1e-9 * tt;
                sb.append(String.format(Locale.ROOT, "%.9g,%.12g,%.12g,%s%n", t + tt,
                        force + k.abs() * amp * noise * rng.nextGaussian(), h + amp * noise * rng.nextGaussian(), f));
            }
            t += n / fs + 1;
        }
        Path p = dir.resolve(name + ".csv");
        Files.writeString(p, sb.toString());
        return p;
    }

    private static Complex zener(double f) {
        double[] out = new double[2];
        new Zener().modulus(2 * Math.PI * f, new double[] {1e4, 3e4, 0.1}, out);
        return new Complex(out[0], out[1]);
    }

    @Test
    void recoversTheModuliThroughEveryGeometryWithinHalfAPercent() throws IOException {
        Map<String, Geometry> geometries = Map.of(
                "# geometry: sphere; tip_radius: 50 µm; indentation_depth: 4 µm; poisson_ratio: 0.5", new Geometry.Sphere(50e-6, 4e-6, 0.5),
                "# geometry: flat_punch; punch_radius: 0.5 mm; poisson_ratio: 0.45", new Geometry.FlatPunch(0.5e-3, 0.45),
                "# geometry: cone; half_angle: 70.3 deg; indentation_depth: 2 µm; poisson_ratio: 0.5; beta: 1.034",
                new Geometry.Cone(Math.toRadians(70.3), 2e-6, 0.5, 1.034),
                "# geometry: tension; length: 10 mm; area: 5 mm²", new Geometry.Tension(10e-3, 5e-6),
                "# geometry: plate_shear; gap: 1 mm; area: 1 cm²", new Geometry.PlateShear(1e-3, 1e-4));
        int k = 0;
        for (Map.Entry<String, Geometry> e : geometries.entrySet()) {
            Path p = rawFile("g" + k++, e.getKey(), e.getValue(), 0.002, 0, 0);
            List<RawConverter.Point> pts = RawConverter.convert(RawReader.read(p), RawConverter.Settings.defaults(), null);
            assertEquals(3, pts.size());
            for (RawConverter.Point pt : pts) {
                Complex truth = zener(pt.frequencyHz());
                assertEquals(truth.getReal(), pt.storage(), 0.005 * truth.getReal(), e.getKey() + " E′ at " + pt.frequencyHz());
                assertEquals(truth.getImaginary(), pt.loss(), 0.005 * truth.getImaginary(), e.getKey() + " E″ at " + pt.frequencyHz());
                assertTrue(pt.linear(), pt.note());
            }
        }
    }

    @Test
    void aPurePhaseLagIsRemovedExactlyByCalibration() throws IOException {
        double lag = 0.05;
        Path sample = rawFile("lagged", "# geometry: tension; length: 10 mm; area: 5 mm²", new Geometry.Tension(10e-3, 5e-6), 0, lag, 0);
        // the rigid, elastic reference: E* real, measured through the same lag
        StringBuilder sb = new StringBuilder("# role: calibration\ntime [s],force [N],displacement [m],drive_frequency [Hz]\n");
        double t = 0;
        for (double f : new double[] {0.5, 2, 8}) {
            double fs = 200 * f;
            for (int i = 0; i < 1400; i++) {
                double tt = i / fs;
                double ph = 2 * Math.PI * f * tt;
                sb.append(String.format(Locale.ROOT, "%.9g,%.12g,%.12g,%s%n", t + tt, 1e5 * 1e-8 * Math.cos(ph + lag), 1e-8 * Math.cos(ph), f));
            }
            t += 1400 / fs + 1;
        }
        Path cal = dir.resolve("cal.csv");
        Files.writeString(cal, sb.toString());
        RawConverter.Calibration c = RawConverter.calibration(RawReader.read(cal), RawConverter.Settings.defaults());
        for (double phi : c.phase()) {
            assertEquals(lag, phi, 1e-9);
        }
        // the same material measured without the lag (same drift and transient): calibration must give it exactly
        Path unlagged = rawFile("unlagged", "# geometry: tension; length: 10 mm; area: 5 mm²", new Geometry.Tension(10e-3, 5e-6), 0, 0, 0);
        List<RawConverter.Point> corrected = RawConverter.convert(RawReader.read(sample), RawConverter.Settings.defaults(), c);
        List<RawConverter.Point> reference = RawConverter.convert(RawReader.read(unlagged), RawConverter.Settings.defaults(), null);
        for (int i = 0; i < corrected.size(); i++) {
            double scale = Math.hypot(reference.get(i).storage(), reference.get(i).loss());
            assertEquals(reference.get(i).storage(), corrected.get(i).storage(), 1e-9 * scale);
            assertEquals(reference.get(i).loss(), corrected.get(i).loss(), 1e-9 * scale);
        }
    }

    @Test
    void distortionAboveTheLimitIsFlaggedAndTheContactFloorSeparated() throws IOException {
        Path p = rawFile("distorted", "# geometry: tension; length: 10 mm; area: 5 mm²", new Geometry.Tension(10e-3, 5e-6), 0, 0, 0.08);
        List<RawConverter.Point> pts = RawConverter.convert(RawReader.read(p), RawConverter.Settings.defaults(), null);
        for (RawConverter.Point pt : pts) {
            assertEquals(0.08, pt.forceDistortion(), 0.002, "distortion equals the injected harmonic ratio");
            assertFalse(pt.linear());
            assertTrue(pt.note().contains("outside the linear range"), pt.note());
        }
        // a sphere's own ε/8 floor is not counted against the material: ε = 20 nm/4 µm = 0.005 ⇒ 0.000625
        Path s = rawFile("sphere", "# geometry: sphere; tip_radius: 50 µm; indentation_depth: 4 µm; poisson_ratio: 0.5",
                new Geometry.Sphere(50e-6, 4e-6, 0.5), 0, 0, 0.000625);
        for (RawConverter.Point pt : RawConverter.convert(RawReader.read(s), RawConverter.Settings.defaults(), null)) {
            assertEquals(0.000625, pt.contactHarmonic(), 1e-7);
            assertTrue(pt.linear());
        }
    }

    @Test
    void aFrequencyOutsideTheCalibrationIsAnError() throws IOException {
        Path p = rawFile("outside", "# geometry: tension; length: 10 mm; area: 5 mm²", new Geometry.Tension(10e-3, 5e-6), 0, 0, 0);
        RawConverter.Calibration c = new RawConverter.Calibration(new double[] {1, 5}, new double[] {0, 0});
        InputException e = assertThrows(InputException.class,
                () -> RawConverter.convert(RawReader.read(p), RawConverter.Settings.defaults(), c));
        assertTrue(e.problem().contains("outside the calibration's range"), e.problem());
    }

    @Test
    void badRawFilesNameFileLineAndColumn() throws IOException {
        Path p = dir.resolve("bad.csv");
        Files.writeString(p, "# geometry: tension; length: 10 mm; area: 5 mm²\ntime [s],force [N],displacement [m],drive_frequency [Hz]\n"
                + "0,1,2,3\n0.1,x,2,3\n");
        InputException e = assertThrows(InputException.class, () -> RawReader.read(p));
        assertEquals(4, e.line());
        assertEquals(2, e.column());
        Path g = dir.resolve("nogeo.csv");
        Files.writeString(g, "time [s],force [N],displacement [m],drive_frequency [Hz]\n0,1,2,3\n");
        InputException ge = assertThrows(InputException.class,
                () -> RawConverter.convert(RawReader.read(g), RawConverter.Settings.defaults(), null));
        assertTrue(ge.problem().contains("geometry"), ge.problem());
    }

    @Test
    void aSegmentColumnWithListedFrequenciesReadsLikeADriveFrequencyColumn() throws IOException {
        Path p = rawFile("bycolumn", "# geometry: tension; length: 10 mm; area: 5 mm²", new Geometry.Tension(10e-3, 5e-6), 0.001, 0, 0);
        List<String> lines = Files.readAllLines(p);
        StringBuilder sb = new StringBuilder();
        java.util.Map<String, String> segOf = new java.util.LinkedHashMap<>();
        for (String l : lines) {
            if (l.startsWith("#")) {
                sb.append(l).append('\n');
            } else if (l.startsWith("time")) {
                sb.append("# drive_frequencies: 0.5, 2, 8 Hz\ntime [s],force [N],displacement [m],segment\n");
            } else {
                String[] c = l.split(",");
                segOf.putIfAbsent(c[3], Integer.toString(segOf.size() + 1));
                sb.append(c[0]).append(',').append(c[1]).append(',').append(c[2]).append(',').append(segOf.get(c[3])).append('\n');
            }
        }
        Path q = dir.resolve("segments.csv");
        Files.writeString(q, sb.toString());
        List<RawConverter.Point> a = RawConverter.convert(RawReader.read(p), RawConverter.Settings.defaults(), null);
        List<RawConverter.Point> b = RawConverter.convert(RawReader.read(q), RawConverter.Settings.defaults(), null);
        assertEquals(a.size(), b.size());
        for (int i = 0; i < a.size(); i++) {
            assertEquals(a.get(i).frequencyHz(), b.get(i).frequencyHz());
            assertEquals(a.get(i).storage(), b.get(i).storage(), 1e-12 * a.get(i).storage());
        }
    }

    @Test
    void complianceCalibrationRemovesASeriesSpring() throws IOException {
        // The sample seen through a frame of stiffness 2e5 N/m with a small loss: 1/k_meas = 1/k_sample + 1/k_frame.
        Complex frame = new Complex(2e5, 2e3);
        Geometry g = new Geometry.Tension(10e-3, 5e-6);
        StringBuilder sb = new StringBuilder("# geometry: tension; length: 10 mm; area: 5 mm²\ntime [s],force [N],displacement [m],drive_frequency [Hz]\n");
        StringBuilder cal = new StringBuilder("# role: calibration\ntime [s],force [N],displacement [m],drive_frequency [Hz]\n");
        double t0 = 0;
        for (double f : new double[] {0.5, 2, 8}) {
            Complex ks = zener(f).divide(g.modulus(Complex.ONE));
            Complex km = ks.reciprocal().add(frame.reciprocal()).reciprocal();
            for (int i = 0; i < 1400; i++) {
                double tt = i / (200 * f);
                double ph = 2 * Math.PI * f * tt;
                double h = 1e-8 * Math.cos(ph);
                sb.append(String.format(Locale.ROOT, "%.9g,%.12g,%.12g,%s%n", t0 + tt, 1e-8 * (km.getReal() * Math.cos(ph)
                        - km.getImaginary() * Math.sin(ph)), h, f));
                cal.append(String.format(Locale.ROOT, "%.9g,%.12g,%.12g,%s%n", t0 + tt, 1e-8 * (frame.getReal() * Math.cos(ph)
                        - frame.getImaginary() * Math.sin(ph)), h, f));
            }
            t0 += 1400 / (200 * f) + 1;
        }
        Path p = dir.resolve("framed.csv");
        Path c = dir.resolve("frame-cal.csv");
        Files.writeString(p, sb.toString());
        Files.writeString(c, cal.toString());
        RawConverter.Calibration calibration = RawConverter.calibration(RawReader.read(c), RawConverter.Settings.defaults())
                .withMode(RawConverter.CalibrationMode.COMPLIANCE);
        for (RawConverter.Point pt : RawConverter.convert(RawReader.read(p), RawConverter.Settings.defaults(), calibration)) {
            Complex truth = zener(pt.frequencyHz());
            assertEquals(truth.getReal(), pt.storage(), 1e-6 * truth.abs());
            assertEquals(truth.getImaginary(), pt.loss(), 1e-6 * truth.abs());
        }
    }

    @Test
    void aContactPointGivesTheStaticDepth() throws IOException {
        // rawFile's displacement oscillates about 4 µm (+ 1 nm/s drift and a small transient); with the contact at 1 µm the static
        // depth is about 3 µm, so the sphere's contact radius is sqrt(50 µm · 3 µm)
        Path p = rawFile("contact", "# geometry: sphere; tip_radius: 50 µm; contact_point: 1 µm; poisson_ratio: 0.5",
                new Geometry.Sphere(50e-6, 3e-6, 0.5), 0, 0, 0);
        Geometry g = RawConverter.geometry(RawReader.read(p));
        assertEquals(3e-6, ((Geometry.Sphere) g).staticDepth(), 0.01e-6);
    }
}
