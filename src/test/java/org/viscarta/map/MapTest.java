package org.viscarta.map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;

import javax.imageio.ImageIO;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viscarta.analysis.Inputs;
import org.viscarta.analysis.Maps;
import org.viscarta.analysis.ReadSettings;
import org.viscarta.demo.MapDemo;
import org.viscarta.io.InputException;
import org.viscarta.model.ModelCatalogue;
import org.viscarta.model.ViscoelasticModel;
import org.viscarta.sweep.ModulusKind;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;

/**
 * Maps against what can be checked from outside: registration against the transform that made the
 * landmarks, point-in-polygon and label lookups on hand-checkable cases, Moran's I against a direct
 * numpy evaluation (script and output in src/test/resources/scipy/morans_i.*), and a specimen of
 * three bands with known moduli.
 */
@Tag("validation")
class MapTest {

    @TempDir
    Path dir;

    @Test
    void landmarksRecoverTheTransformThatMadeThem() throws IOException {
        Registration truth = Registration.byPixelSize(1.5e-6, 90, 30, 12);
        SplittableRandom rng = new SplittableRandom(5);
        StringBuilder sb = new StringBuilder("x [µm],y [µm],image_x [px],image_y [px]\n");
        double[][] marks = {{0, 0}, {480, 0}, {0, 480}, {480, 480}, {240, 120}, {100, 400}};
        for (double[] m : marks) {
            double[] uv = truth.toImage(m[0] * 1e-6, m[1] * 1e-6);
            // the landmarks located by hand within ±0.3 px
            sb.append(String.format(java.util.Locale.ROOT, "%s,%s,%.4f,%.4f%n", m[0], m[1], uv[0] + 0.3 * (2 * rng.nextDouble() - 1),
                    uv[1] + 0.3 * (2 * rng.nextDouble() - 1)));
        }
        Path f = dir.resolve("marks.csv");
        Files.writeString(f, sb.toString());
        Registration r = Registration.fromLandmarks(Registration.readLandmarks(f), f);
        assertTrue(r.residualPx() < 0.3, "residual " + r.residualPx());
        for (double x = 0; x <= 480; x += 40) {
            for (double y = 0; y <= 480; y += 40) {
                double[] a = truth.toImage(x * 1e-6, y * 1e-6);
                double[] b = r.toImage(x * 1e-6, y * 1e-6);
                assertTrue(Math.hypot(a[0] - b[0], a[1] - b[1]) < 0.5, "position (" + x + ", " + y + ") µm within 0.5 px");
            }
        }
        assertEquals(1.5e-6, r.pixelSizeM(), 0.01e-6);
        double[] back = r.toSpecimen(r.toImage(100e-6, 200e-6)[0], r.toImage(100e-6, 200e-6)[1]);
        assertEquals(100e-6, back[0], 1e-12);
        assertEquals(200e-6, back[1], 1e-12);
        // two landmarks: a similarity, exact
        List<Registration.Landmark> two = List.of(new Registration.Landmark(0, 0, 90, 30, 2),
                new Registration.Landmark(480e-6, 0, truth.toImage(480e-6, 0)[0], truth.toImage(480e-6, 0)[1], 3));
        Registration sim = Registration.fromLandmarks(two, f);
        double[] p = sim.toImage(200e-6, 300e-6);
        double[] q = truth.toImage(200e-6, 300e-6);
        assertEquals(q[0], p[0], 1e-9);
        assertEquals(q[1], p[1], 1e-9);
    }

    @Test
    void tooFewCollinearOrInconsistentLandmarksAreInputErrorsNamingTheFile() throws IOException {
        Path one = dir.resolve("one.csv");
        Files.writeString(one, "x [µm],y [µm],image_x [px],image_y [px]\n0,0,10,10\n");
        InputException a = assertThrows(InputException.class, () -> Registration.fromLandmarks(Registration.readLandmarks(one), one));
        assertTrue(a.getMessage().startsWith(one.toString()) && a.getMessage().contains("at least two"), a.getMessage());
        Path line = dir.resolve("line.csv");
        Files.writeString(line, "x [µm],y [µm],image_x [px],image_y [px]\n0,0,10,10\n10,10,20,20\n20,20,30,30\n");
        InputException b = assertThrows(InputException.class, () -> Registration.fromLandmarks(Registration.readLandmarks(line), line));
        assertTrue(b.getMessage().contains("on one line"), b.getMessage());
        Path swapped = dir.resolve("swapped.csv");
        Files.writeString(swapped, "x [µm],y [µm],image_x [px],image_y [px]\n0,0,0,0\n100,0,100,0\n0,100,0,100\n100,100,0,100\n");
        InputException c = assertThrows(InputException.class, () -> Registration.fromLandmarks(Registration.readLandmarks(swapped), swapped));
        assertTrue(c.getMessage().contains("inconsistent") && c.getMessage().startsWith(swapped.toString()), c.getMessage());
        Path noUnit = dir.resolve("nounit.csv");
        Files.writeString(noUnit, "x,y,image_x,image_y\n0,0,0,0\n");
        InputException d = assertThrows(InputException.class, () -> Registration.readLandmarks(noUnit));
        assertTrue(d.getMessage().contains("length unit"), d.getMessage());
    }

    @Test
    void pointInPolygonOnHandCheckableCases() {
        double[][] square = {{0, 0}, {1, 0}, {1, 1}, {0, 1}};
        assertTrue(Regions.contains(square, 0.5, 0.5));
        assertFalse(Regions.contains(square, 1.5, 0.5));
        assertTrue(Regions.contains(square, 1, 0.5), "on an edge counts as inside");
        assertTrue(Regions.contains(square, 0, 0), "a vertex counts as inside");
        // an L: the notch (1.5, 1.5) is outside, the arm (0.5, 1.5) inside
        double[][] ell = {{0, 0}, {2, 0}, {2, 1}, {1, 1}, {1, 2}, {0, 2}};
        assertFalse(Regions.contains(ell, 1.5, 1.5));
        assertTrue(Regions.contains(ell, 0.5, 1.5));
        assertTrue(Regions.contains(ell, 1.5, 0.5));
    }

    @Test
    void aLabelImageNamesTheRegionUnderEachPosition() throws IOException {
        // 4 × 2 pixels of 10 µm: left half blue = gel, right half orange = inclusion
        BufferedImage img = new BufferedImage(4, 2, BufferedImage.TYPE_INT_RGB);
        for (int u = 0; u < 4; u++) {
            for (int v = 0; v < 2; v++) {
                img.setRGB(u, v, u < 2 ? 0x56B4E9 : 0xE69F00);
            }
        }
        Path labels = dir.resolve("labels.png");
        ImageIO.write(img, "png", labels.toFile());
        Path legend = dir.resolve("legend.csv");
        Files.writeString(legend, "# a comment\ncolour,region\n#56B4E9,gel\n#E69F00,inclusion\n");
        Regions r = Regions.labelImage(labels, legend, Registration.byPixelSize(10e-6, 0, 0, 0));
        assertEquals(List.of("gel", "inclusion"), r.names());
        assertEquals("gel", r.at(5e-6, 5e-6));
        assertEquals("gel", r.at(19e-6, 15e-6));
        assertEquals("inclusion", r.at(21e-6, 5e-6));
        assertEquals("", r.at(45e-6, 5e-6), "outside the image: no region");
    }

    @Test
    void moransIAgreesWithNumpy() throws IOException {
        Map<String, String> ref = new java.util.HashMap<>();
        for (String line : Files.readAllLines(Path.of("src/test/resources/scipy/morans_i.txt"))) {
            int sp = line.indexOf(' ');
            ref.put(line.substring(0, sp), line.substring(sp + 1));
        }
        String[] parts = ref.get("values").split(" ");
        double[] v = new double[parts.length];
        double[] xs = new double[parts.length];
        double[] ys = new double[parts.length];
        for (int k = 0; k < parts.length; k++) {
            v[k] = Double.parseDouble(parts[k]);
            xs[k] = (k % 6) * 10e-6;
            ys[k] = (k / 6) * 10e-6;
        }
        MoranI m = MoranI.of(v, xs, ys, 15e-6);
        assertEquals(Double.parseDouble(ref.get("I")), m.i(), 1e-12);
        assertEquals(Double.parseDouble(ref.get("E")), m.expected(), 1e-15);
        assertEquals(Double.parseDouble(ref.get("var")), m.variance(), 1e-12);
        assertEquals(Double.parseDouble(ref.get("z")), m.z(), 1e-9);
        assertEquals(89, m.pairs(), "closer than 15 µm on a 6 × 5 grid of 10 µm: 49 side by side and 40 diagonal (14.1 µm)");
    }

    @Test
    void moransIRejectsIndependentFieldsAtItsNominalRate() {
        // known truth: values drawn independently, so "no autocorrelation" holds and p < 0.05 should occur in about 5 % of
        // fields (the z-score's normal approximation, Cliff and Ord 1981)
        SplittableRandom rng = new SplittableRandom(8);
        double[] xs = new double[100];
        double[] ys = new double[100];
        for (int k = 0; k < 100; k++) {
            xs[k] = (k % 10) * 10e-6;
            ys[k] = (k / 10) * 10e-6;
        }
        int rejected = 0;
        int fields = 1000;
        double zSum = 0;
        for (int f = 0; f < fields; f++) {
            double[] v = new double[100];
            for (int k = 0; k < 100; k++) {
                v[k] = Math.sqrt(-2 * Math.log(1 - rng.nextDouble())) * Math.cos(2 * Math.PI * rng.nextDouble());
            }
            MoranI m = MoranI.of(v, xs, ys, 15e-6);
            rejected += m.p() < 0.05 ? 1 : 0;
            zSum += m.z();
        }
        assertTrue(rejected >= 30 && rejected <= 75, rejected + " of " + fields + " rejected at the 5 % level");
        assertEquals(0, zSum / fields, 0.1, "z centred on zero");
    }

    /** A sweep at one position: five frequencies (1 Hz among them, so no interpolation) of an exact zener. */
    private static Sweep at(String specimen, double x, double y, double[] p) {
        ViscoelasticModel z = ModelCatalogue.byId("zener").orElseThrow();
        List<SweepPoint> pts = new ArrayList<>();
        double[] out = new double[2];
        for (int k = 0; k < 5; k++) {
            double f = 0.1 * Math.pow(100, k / 4.0);
            z.modulus(2 * Math.PI * f, p, out);
            pts.add(new SweepPoint(f, out[0], out[1], 0));
        }
        return new Sweep(specimen, "1 @ " + x + "," + y, "", ModulusKind.TENSILE, 23, Path.of("bands.csv"), Map.of(), pts,
                Map.of(Sweep.X_M, Double.toString(x), Sweep.Y_M, Double.toString(y)));
    }

    @Test
    void aSpecimenOfThreeBandsLandsEachPositionInItsBandWithTheRightMediansAndLetters() throws IOException {
        double[][] bands = {{2e9, 5e8, 0.02}, {6e8, 3e8, 0.05}, {1e8, 1e8, 0.3}};
        String[] names = {"hard", "middle", "soft"};
        SplittableRandom rng = new SplittableRandom(3);
        List<Sweep> sweeps = new ArrayList<>();
        for (int i = 0; i < 12; i++) {
            for (int j = 0; j < 9; j++) {
                double x = i * 10e-6;
                double y = j * 10e-6;
                double[] p = bands[j / 3].clone();
                p[0] *= Math.exp(0.02 * (2 * rng.nextDouble() - 1));
                sweeps.add(at("bands", x, y, p));
            }
        }
        Path poly = dir.resolve("bands.csv");
        Files.writeString(poly, "region,x [µm],y [µm]\nhard,-5,-5\nhard,115,-5\nhard,115,25\nhard,-5,25\n"
                + "middle,-5,25\nmiddle,115,25\nmiddle,115,55\nmiddle,-5,55\nsoft,-5,55\nsoft,115,55\nsoft,115,85\nsoft,-5,85\n");
        Maps maps = Maps.of(sweeps, new MapSetup.Given(null, null, null, null, null, poly, null, null), 1.0, 0.05, List.of(), null,
                ReadSettings.defaults());
        MapAnalysis.Specimen s = maps.specimens().get(0).specimen();
        for (MapAnalysis.Point p : s.points()) {
            assertEquals(names[(int) Math.round(p.yM() / 10e-6) / 3], p.region(), "position " + p.xM() + ", " + p.yM());
        }
        ViscoelasticModel z = ModelCatalogue.byId("zener").orElseThrow();
        double[] out = new double[2];
        for (int b = 0; b < 3; b++) {
            MapAnalysis.RegionStat r = s.regions().get(b);
            assertEquals(names[b], r.region());
            assertEquals(36, r.n());
            z.modulus(2 * Math.PI, bands[b], out);
            assertEquals(out[0], r.storage()[0], 0.02 * out[0], names[b] + " E′ median at 1 Hz (the generator's within its 2 % spread)");
            assertEquals(String.valueOf((char) ('a' + b)), r.lettersStorage(), "stiffest first");
            assertEquals(String.valueOf((char) ('c' - b)), r.lettersTanDelta(), "the soft band damps most");
        }
        assertTrue(s.moranStorage().i() > 0.5, "bands: neighbours alike");
    }

    @Test
    void rawSignalFilesWithPositionsAreMappedOnePerPosition() throws IOException {
        String raw = Files.readString(Path.of("demo-data/raw-signals/alkyd-unaged-raw.csv"));
        Files.copy(Path.of("demo-data/raw-signals/calibration-sapphire.csv"), dir.resolve("calibration-sapphire.csv"));
        for (int k = 0; k < 3; k++) {
            Files.writeString(dir.resolve("p" + k + ".csv"), "# x: " + (20 * k) + " µm\n# y: 0 µm\n" + raw);
        }
        Inputs in = Inputs.read(List.of(dir), ReadSettings.defaults());
        assertEquals(3, in.positioned().size(), "three positions, none a sample");
        assertTrue(in.samples().isEmpty());
        Maps maps = Maps.of(in.positioned(), MapSetup.Given.none(), 1.0, 0.05, List.of(), null, ReadSettings.defaults());
        MapAnalysis.Specimen s = maps.specimens().get(0).specimen();
        assertEquals(3, s.points().size());
        assertEquals(20e-6, s.spacingM(), 1e-12);
        assertEquals(40e-6, s.points().get(2).xM(), 1e-12);
    }

    @Test
    void everyDemoPositionLandsInTheRegionTheGeneratorGaveIt() {
        Inputs in = Inputs.read(List.of(Path.of("demo-data/maps")), ReadSettings.defaults());
        Maps maps = Maps.of(in.positioned(), MapSetup.Given.none(), 1.0, 0.05, List.of(), null, ReadSettings.defaults());
        assertEquals(2, maps.specimens().size());
        int n = 0;
        for (Maps.Mapped m : maps.specimens()) {
            assertTrue(m.setup().registration().residualPx() < 0.5, m.setup().registration().describe());
            for (MapAnalysis.Point p : m.specimen().points()) {
                // a label image resolves a region to its pixels (1.5 µm): positions within two pixels of an inclusion's edge may
                // fall either side of it
                if (p.specimen().equals("tissue-phantom") && MapDemo.phantomEdgeDistanceUm(p.xM() * 1e6, p.yM() * 1e6) < 3) {
                    n++;
                    continue;
                }
                assertEquals(MapDemo.truthRegion(p.specimen(), p.xM() * 1e6, p.yM() * 1e6), p.region(), p.specimen() + " at "
                        + p.xM() * 1e6 + ", " + p.yM() * 1e6 + " µm");
                n++;
            }
        }
        assertEquals(300 + 625, n);
        double[] uv = maps.specimens().get(1).setup().registration().toImage(240e-6, 120e-6);
        double[] truth = MapDemo.PHANTOM_IMAGE.toImage(240e-6, 120e-6);
        assertEquals(truth[0], uv[0], 0.5);
        assertEquals(truth[1], uv[1], 0.5);
    }
}
