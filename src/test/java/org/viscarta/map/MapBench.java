package org.viscarta.map;

import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SplittableRandom;

import org.viscarta.analysis.Maps;
import org.viscarta.analysis.ReadSettings;
import org.viscarta.model.ModelCatalogue;
import org.viscarta.model.ViscoelasticModel;
import org.viscarta.report.Figure;
import org.viscarta.report.MapFigures;
import org.viscarta.report.ReportFigures;
import org.viscarta.sweep.ModulusKind;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;

/**
 * The map's speed (run from {@code Benchmarks} with {@code -Dexec.args="N map-only"}): an N × N grid
 * of positions, six frequencies each, in three bands drawn as polygons, on a registered image; the
 * map with its statistics, then its figures rendered as PNG and SVG.
 */
public final class MapBench {

    private MapBench() {
    }

    public static void run(int side) throws Exception {
        ViscoelasticModel z = ModelCatalogue.byId("zener").orElseThrow();
        double[][] bands = {{2e9, 5e8, 0.02}, {6e8, 3e8, 0.05}, {1e8, 1e8, 0.3}};
        SplittableRandom rng = new SplittableRandom(1);
        List<Sweep> sweeps = new ArrayList<>();
        double[] out = new double[2];
        for (int i = 0; i < side; i++) {
            for (int j = 0; j < side; j++) {
                double[] p = bands[3 * j / side].clone();
                p[0] *= Math.exp(0.03 * (2 * rng.nextDouble() - 1));
                List<SweepPoint> pts = new ArrayList<>();
                for (int k = 0; k < 6; k++) {
                    double f = 0.1 * Math.pow(100, k / 5.0);
                    z.modulus(2 * Math.PI * f, p, out);
                    pts.add(new SweepPoint(f, out[0], out[1], 0));
                }
                double x = i * 10e-6;
                double y = j * 10e-6;
                sweeps.add(new Sweep("bench", "1 @ " + x + "," + y, "", ModulusKind.TENSILE, 23, Path.of("bench.csv"), Map.of(), pts,
                        Map.of(Sweep.X_M, Double.toString(x), Sweep.Y_M, Double.toString(y))));
            }
        }
        Path dir = Files.createTempDirectory("viscarta-map-bench");
        double h = side * 10.0 / 3;
        StringBuilder poly = new StringBuilder("region,x [µm],y [µm]\n");
        String[] names = {"top", "middle", "bottom"};
        for (int b = 0; b < 3; b++) {
            poly.append(String.format(Locale.ROOT, "%s,-5,%f%n%s,%f,%f%n%s,%f,%f%n%s,-5,%f%n", names[b], b * h - 5, names[b], side * 10.0,
                    b * h - 5, names[b], side * 10.0, (b + 1) * h - 5, names[b], (b + 1) * h - 5));
        }
        Path regions = dir.resolve("bands.csv");
        Files.writeString(regions, poly.toString());
        BufferedImage img = new BufferedImage(side * 5 + 20, side * 5 + 20, BufferedImage.TYPE_INT_RGB);
        Path image = dir.resolve("image.png");
        javax.imageio.ImageIO.write(img, "png", image.toFile());
        long t0 = System.nanoTime();
        Maps maps = Maps.of(sweeps, new MapSetup.Given(image, 2e-6, new double[] {10, 10}, 0.0, null, regions, null, null), 1.0, 0.05,
                List.of(), null, ReadSettings.defaults());
        long t1 = System.nanoTime();
        List<Figure> figures = new ArrayList<>();
        for (Maps.Mapped m : maps.specimens()) {
            figures.addAll(MapFigures.of(m.specimen(), m.setup().image(), m.setup().registration(), 0.6, 1.0, "bench"));
        }
        int rendered = ReportFigures.render(figures).size();
        long t2 = System.nanoTime();
        System.out.printf(Locale.ROOT, "map of %d positions × 6 frequencies: values, regions, letters and Moran's I %.2f s; %d figures as "
                + "PNG and SVG %.2f s; total %.2f s%n", side * side, (t1 - t0) / 1e9, rendered, (t2 - t1) / 1e9, (t2 - t0) / 1e9);
    }
}
