package org.viscarta.demo;

import java.awt.Color;
import java.awt.image.BufferedImage;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SplittableRandom;

import javax.imageio.ImageIO;

import org.viscarta.map.Registration;
import org.viscarta.model.ModelCatalogue;
import org.viscarta.model.ViscoelasticModel;

/**
 * The two invented map scenarios: a paint cross-section (ground, two paint layers, varnish) indented
 * on a grid, with a synthetic image registered by its pixel size and the layers drawn as polygons;
 * and a soft-tissue phantom with two stiffer inclusions, its synthetic image rotated against the
 * stage and registered by landmarks, its regions given as a label image. Every position's sweep
 * comes from its region's zener with a smooth spatial variation and noise, so the truth is known:
 * {@link #truthRegion}.
 */
public final class MapDemo {

    private MapDemo() {
    }

    /** A binary demo file (an image). */
    public record DemoImage(String folder, String relativePath, byte[] png) {
    }

    /** The folder of the scenarios under demo-data. */
    public static final String FOLDER = "maps";

    /** Zener parameters {E_r, E_1, tau} of each paint layer [Pa, Pa, s]. */
    public static final Map<String, double[]> LAYERS = new LinkedHashMap<>();
    /** Zener parameters of the phantom's matrix and inclusions. */
    public static final Map<String, double[]> PHANTOM = new LinkedHashMap<>();

    static {
        LAYERS.put("varnish", new double[] {2e8, 1.5e8, 0.3});
        LAYERS.put("paint-2", new double[] {6e8, 3e8, 0.05});
        LAYERS.put("paint-1", new double[] {1.2e9, 4e8, 0.02});
        LAYERS.put("ground", new double[] {3e9, 4e8, 0.01});
        PHANTOM.put("matrix", new double[] {8e3, 3e3, 0.05});
        PHANTOM.put("inclusion", new double[] {40e3, 6e3, 0.03});
    }

    /** Layer boundaries y = b + 0.05 x [µm], from the top: varnish | paint-2 | paint-1 | ground (no grid position lies on one). */
    private static final double[] BOUNDARIES_UM = {45.5, 115.5, 195.5};
    private static final double SLOPE = 0.05;
    /** The cross-section image: 2 µm pixels, the stage origin at pixel (20, 15), no rotation. */
    public static final Registration CROSS_SECTION = Registration.byPixelSize(2e-6, 20, 15, 0);
    /** The phantom image: 1.5 µm pixels, origin at (90, 30), rotated 12°. */
    public static final Registration PHANTOM_IMAGE = Registration.byPixelSize(1.5e-6, 90, 30, 12);
    /** The inclusions: centre x, y and radius [µm]. */
    private static final double[][] INCLUSIONS = {{150, 150, 70}, {340, 330, 90}};

    /** The region the generator put a specimen position in ("" outside every region). */
    public static String truthRegion(String specimen, double xUm, double yUm) {
        if (specimen.equals("paint-cross-section")) {
            String[] names = LAYERS.keySet().toArray(new String[0]);
            for (int k = 0; k < BOUNDARIES_UM.length; k++) {
                if (yUm < BOUNDARIES_UM[k] + SLOPE * xUm) {
                    return names[k];
                }
            }
            return names[names.length - 1];
        }
        for (double[] c : INCLUSIONS) {
            if (Math.hypot(xUm - c[0], yUm - c[1]) <= c[2]) {
                return "inclusion";
            }
        }
        return "matrix";
    }

    /** How far a position of the phantom lies from the nearest inclusion's edge [µm] (a label image resolves regions to a pixel). */
    public static double phantomEdgeDistanceUm(double xUm, double yUm) {
        double d = Double.POSITIVE_INFINITY;
        for (double[] c : INCLUSIONS) {
            d = Math.min(d, Math.abs(Math.hypot(xUm - c[0], yUm - c[1]) - c[2]));
        }
        return d;
    }

    /** Writes both scenarios' files into the lists. */
    static void generate(SplittableRandom rng, List<DemoData.DemoFile> files, List<DemoImage> images, String note) {
        crossSection(rng, files, images, note);
        phantom(rng, files, images, note);
    }

    private static void crossSection(SplittableRandom rng, List<DemoData.DemoFile> files, List<DemoImage> images, String note) {
        String dir = FOLDER + "/paint-cross-section/";
        StringBuilder sb = new StringBuilder();
        sb.append("# title: dynamic nanoindentation map of a paint cross-section\n");
        sb.append("# note: ").append(note).append('\n');
        sb.append("# sample: paint-cross-section\n# group: cross-section\n# modulus: tensile\n# temperature: 23 °C\n");
        sb.append("# method: dynamic indentation on a grid, 20 µm spacing\n");
        sb.append("# image: cross-section.png\n# pixel_size: 2 µm\n# origin: 20, 15\n# regions: layers.csv\n");
        sb.append("x [µm],y [µm],frequency [Hz],storage_modulus [MPa],loss_modulus [MPa]\n");
        for (int j = 0; j < 15; j++) {
            for (int i = 0; i < 20; i++) {
                double x = 20 * i;
                double y = 20 * j;
                double[] p = LAYERS.get(truthRegion("paint-cross-section", x, y)).clone();
                double field = 1 + 0.08 * Math.sin(x / 80.0) * Math.cos(y / 120.0);
                p[0] *= field * Math.exp(0.03 * DemoData.gaussian(rng));
                p[1] *= field * Math.exp(0.03 * DemoData.gaussian(rng));
                sweep(sb, x, y, p, rng, 1e6);
            }
        }
        files.add(new DemoData.DemoFile("demo-data", dir + "positions.csv", sb.toString()));
        StringBuilder poly = new StringBuilder("# note: " + note + "\n# the layers as drawn on the cross-section, stage coordinates\n"
                + "region,x [µm],y [µm]\n");
        String[] names = LAYERS.keySet().toArray(new String[0]);
        double left = -40;
        double right = 420;
        for (int k = 0; k < names.length; k++) {
            double topLeft = k == 0 ? -30 : BOUNDARIES_UM[k - 1] + SLOPE * left;
            double topRight = k == 0 ? -30 : BOUNDARIES_UM[k - 1] + SLOPE * right;
            double botLeft = k == names.length - 1 ? 330 : BOUNDARIES_UM[k] + SLOPE * left;
            double botRight = k == names.length - 1 ? 330 : BOUNDARIES_UM[k] + SLOPE * right;
            poly.append(String.format(Locale.ROOT, "%s,%s,%s%n%s,%s,%s%n%s,%s,%s%n%s,%s,%s%n", names[k], n(left), n(topLeft), names[k],
                    n(right), n(topRight), names[k], n(right), n(botRight), names[k], n(left), n(botLeft)));
        }
        files.add(new DemoData.DemoFile("demo-data", dir + "layers.csv", poly.toString()));
        Map<String, Color> colours = Map.of("varnish", new Color(0xE3, 0xC1, 0x6F), "paint-2", new Color(0xA8, 0x32, 0x2D),
                "paint-1", new Color(0x2F, 0x5D, 0x9B), "ground", new Color(0xEE, 0xEA, 0xDF));
        BufferedImage img = new BufferedImage(240, 180, BufferedImage.TYPE_INT_RGB);
        SplittableRandom tex = new SplittableRandom(17);
        for (int v = 0; v < img.getHeight(); v++) {
            for (int u = 0; u < img.getWidth(); u++) {
                double[] xy = CROSS_SECTION.toSpecimen(u + 0.5, v + 0.5);
                double xUm = xy[0] * 1e6;
                double yUm = xy[1] * 1e6;
                Color c = yUm < -20 ? new Color(0x3A, 0x3A, 0x40) : yUm > 320 ? new Color(0x55, 0x55, 0x5C)
                        : colours.get(truthRegion("paint-cross-section", xUm, yUm));
                img.setRGB(u, v, textured(c, tex, 10));
            }
        }
        images.add(new DemoImage("demo-data", dir + "cross-section.png", png(img, note)));
    }

    private static void phantom(SplittableRandom rng, List<DemoData.DemoFile> files, List<DemoImage> images, String note) {
        String dir = FOLDER + "/tissue-phantom/";
        StringBuilder sb = new StringBuilder();
        sb.append("# title: dynamic indentation map of a soft-tissue phantom with two stiffer inclusions\n");
        sb.append("# note: ").append(note).append('\n');
        sb.append("# sample: tissue-phantom\n# group: phantom\n# modulus: tensile\n# temperature: 23 °C\n");
        sb.append("# method: dynamic indentation on a grid, 20 µm spacing\n");
        sb.append("# image: phantom.png\n# landmarks: landmarks.csv\n# region_image: phantom-labels.png\n# region_legend: legend.csv\n");
        sb.append("x [µm],y [µm],frequency [Hz],storage_modulus [kPa],loss_modulus [kPa]\n");
        for (int j = 0; j < 25; j++) {
            for (int i = 0; i < 25; i++) {
                double x = 20 * i;
                double y = 20 * j;
                double[] p = PHANTOM.get(truthRegion("tissue-phantom", x, y)).clone();
                double field = 1 + 0.1 * Math.sin(x / 100.0 + y / 150.0);
                p[0] *= field * Math.exp(0.04 * DemoData.gaussian(rng));
                p[1] *= field * Math.exp(0.04 * DemoData.gaussian(rng));
                sweep(sb, x, y, p, rng, 1e3);
            }
        }
        files.add(new DemoData.DemoFile("demo-data", dir + "positions.csv", sb.toString()));
        StringBuilder marks = new StringBuilder("# note: " + note + "\n# four fiducial marks: where the stage put them and where "
                + "the image shows them\nx [µm],y [µm],image_x [px],image_y [px]\n");
        for (double[] m : new double[][] {{0, 0}, {480, 0}, {0, 480}, {480, 480}}) {
            double[] uv = PHANTOM_IMAGE.toImage(m[0] * 1e-6, m[1] * 1e-6);
            marks.append(String.format(Locale.ROOT, "%s,%s,%.3f,%.3f%n", n(m[0]), n(m[1]), uv[0], uv[1]));
        }
        files.add(new DemoData.DemoFile("demo-data", dir + "landmarks.csv", marks.toString()));
        files.add(new DemoData.DemoFile("demo-data", dir + "legend.csv", "# note: " + note + "\ncolour,region\n#56B4E9,matrix\n"
                + "#E69F00,inclusion\n"));
        BufferedImage img = new BufferedImage(420, 420, BufferedImage.TYPE_INT_RGB);
        BufferedImage labels = new BufferedImage(420, 420, BufferedImage.TYPE_INT_RGB);
        SplittableRandom tex = new SplittableRandom(23);
        for (int v = 0; v < img.getHeight(); v++) {
            for (int u = 0; u < img.getWidth(); u++) {
                double[] xy = PHANTOM_IMAGE.toSpecimen(u + 0.5, v + 0.5);
                double xUm = xy[0] * 1e6;
                double yUm = xy[1] * 1e6;
                boolean inside = xUm >= -10 && xUm <= 490 && yUm >= -10 && yUm <= 490;
                String region = truthRegion("tissue-phantom", xUm, yUm);
                Color c = !inside ? new Color(0x20, 0x20, 0x24) : region.equals("inclusion") ? new Color(0xD8, 0xB4, 0xC8)
                        : new Color(0xB0, 0x6E, 0x8E);
                img.setRGB(u, v, textured(c, tex, 14));
                labels.setRGB(u, v, !inside ? 0 : region.equals("inclusion") ? 0xE69F00 : 0x56B4E9);
            }
        }
        images.add(new DemoImage("demo-data", dir + "phantom.png", png(img, note)));
        images.add(new DemoImage("demo-data", dir + "phantom-labels.png", png(labels, note)));
    }

    /** One position's sweep at six frequencies, 1 % noise on each modulus, written in the table's unit. */
    private static void sweep(StringBuilder sb, double x, double y, double[] p, SplittableRandom rng, double unit) {
        ViscoelasticModel z = ModelCatalogue.byId("zener").orElseThrow();
        double[] out = new double[2];
        for (int k = 0; k < 6; k++) {
            double f = 0.1 * Math.pow(100, k / 5.0);
            z.modulus(2 * Math.PI * f, p, out);
            sb.append(n(x)).append(',').append(n(y)).append(',').append(n(f)).append(',')
                    .append(n(out[0] * Math.exp(0.01 * DemoData.gaussian(rng)) / unit)).append(',')
                    .append(n(out[1] * Math.exp(0.01 * DemoData.gaussian(rng)) / unit)).append('\n');
        }
    }

    private static int textured(Color c, SplittableRandom tex, int amplitude) {
        int d = tex.nextInt(2 * amplitude + 1) - amplitude;
        int r = Math.max(0, Math.min(255, c.getRed() + d));
        int g = Math.max(0, Math.min(255, c.getGreen() + d));
        int b = Math.max(0, Math.min(255, c.getBlue() + d));
        return (r << 16) | (g << 8) | b;
    }

    /** PNG bytes with the note in a text chunk (no font is drawn, so the bytes are the same on every machine). */
    static byte[] png(BufferedImage img, String note) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        try {
            javax.imageio.ImageWriter w = ImageIO.getImageWritersByFormatName("png").next();
            javax.imageio.metadata.IIOMetadata meta = w.getDefaultImageMetadata(
                    javax.imageio.ImageTypeSpecifier.createFromRenderedImage(img), w.getDefaultWriteParam());
            javax.imageio.metadata.IIOMetadataNode entry = new javax.imageio.metadata.IIOMetadataNode("tEXtEntry");
            entry.setAttribute("keyword", "Comment");
            entry.setAttribute("value", note);
            javax.imageio.metadata.IIOMetadataNode text = new javax.imageio.metadata.IIOMetadataNode("tEXt");
            text.appendChild(entry);
            javax.imageio.metadata.IIOMetadataNode root = new javax.imageio.metadata.IIOMetadataNode("javax_imageio_png_1.0");
            root.appendChild(text);
            meta.mergeTree("javax_imageio_png_1.0", root);
            try (javax.imageio.stream.ImageOutputStream ios = ImageIO.createImageOutputStream(out)) {
                w.setOutput(ios);
                w.write(new javax.imageio.IIOImage(img, null, meta));
            }
            w.dispose();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return out.toByteArray();
    }

    private static String n(double v) {
        return DemoData.num(v);
    }
}
