package org.viscarta.map;

import java.awt.image.BufferedImage;
import java.nio.file.Path;
import java.util.Map;

import org.viscarta.io.InputException;
import org.viscarta.io.UsageException;
import org.viscarta.sweep.Quantity;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.Unit;

/**
 * What relates a specimen's positions to its image and regions: given on the command line, or in
 * the positions table's own preamble ({@code # image: photo.png}, {@code # pixel_size: 2 µm},
 * {@code # origin: 20, 15}, {@code # rotation: 12}, {@code # landmarks: marks.csv},
 * {@code # regions: layers.csv}, {@code # region_image: labels.png}, {@code # region_legend:
 * legend.csv}; file names relative to the table's folder). The command line wins.
 *
 * @param image        the image, or null
 * @param imageFile    its file, or null
 * @param registration the registration, or null
 * @param regions      the regions, or null
 */
public record MapSetup(BufferedImage image, Path imageFile, Registration registration, Regions regions) {

    /**
     * Settings given on the command line (each may be null).
     *
     * @param pixelSizeM  the pixel size [m]
     * @param origin      the stage origin's pixel {u, v}
     * @param rotationDeg the rotation [°]
     */
    public record Given(Path image, Double pixelSizeM, double[] origin, Double rotationDeg, Path landmarks, Path regions,
                        Path regionImage, Path regionLegend) {
        /** Nothing given. */
        public static Given none() {
            return new Given(null, null, null, null, null, null, null, null);
        }
    }

    /** The setup of a specimen from its first sweep's preamble and the command line. */
    public static MapSetup of(Sweep first, Given given) {
        Map<String, String> meta = first.metadata();
        Path base = first.source().toAbsolutePath().getParent();
        Path imageFile = given.image() != null ? given.image() : file(meta, "image", base);
        Path landmarks = given.landmarks() != null ? given.landmarks() : file(meta, "landmarks", base);
        Double pixel = given.pixelSizeM() != null ? given.pixelSizeM() : length(meta, "pixel_size", first.source());
        if (given.landmarks() != null && given.pixelSizeM() != null) {
            throw new UsageException("give the registration either as --pixel-size (with --origin and --rotation) or as --landmarks, "
                    + "not both");
        }
        if (given.landmarks() != null) {
            pixel = null;
        } else if (given.pixelSizeM() != null) {
            landmarks = null;
        }
        Registration reg = null;
        if (landmarks != null) {
            reg = Registration.fromLandmarks(Registration.readLandmarks(landmarks), landmarks);
        } else if (pixel != null) {
            double[] origin = given.origin() != null ? given.origin() : pair(meta, "origin", first.source());
            Double rotation = given.rotationDeg() != null ? given.rotationDeg() : number(meta, "rotation", first.source());
            reg = Registration.byPixelSize(pixel, origin == null ? 0 : origin[0], origin == null ? 0 : origin[1],
                    rotation == null ? 0 : rotation);
        }
        BufferedImage image = null;
        if (imageFile != null) {
            if (reg == null) {
                throw new UsageException("the image " + imageFile.getFileName() + " needs its registration: --pixel-size (with --origin "
                        + "and --rotation when needed) or --landmarks FILE.csv");
            }
            image = MapImage.read(imageFile);
        }
        Path regionsFile = given.regions() != null ? given.regions() : file(meta, "regions", base);
        Path regionImage = given.regionImage() != null ? given.regionImage() : file(meta, "region_image", base);
        Path regionLegend = given.regionLegend() != null ? given.regionLegend() : file(meta, "region_legend", base);
        Regions regions = null;
        if (regionsFile != null && regionImage != null && given.regions() == null && given.regionImage() == null) {
            throw new InputException(first.source(), 0, 0, "the table names both regions (polygons) and a region image; keep one");
        }
        if (given.regions() != null || (regionsFile != null && given.regionImage() == null)) {
            regions = Regions.polygons(regionsFile);
        } else if (regionImage != null) {
            if (regionLegend == null) {
                throw new UsageException("a region image needs its legend: --region-legend FILE.csv (columns colour, region)");
            }
            if (reg == null) {
                throw new UsageException("a region image lies in the image's registration: give --pixel-size or --landmarks");
            }
            regions = Regions.labelImage(regionImage, regionLegend, reg);
        }
        return new MapSetup(image, imageFile, reg, regions);
    }

    private static Path file(Map<String, String> meta, String key, Path base) {
        String v = meta.get(key);
        return v == null || v.isBlank() ? null : base.resolve(v.strip());
    }

    private static Double length(Map<String, String> meta, String key, Path source) {
        String v = meta.get(key);
        if (v == null) {
            return null;
        }
        try {
            Unit.Valued u = Unit.parse(v.strip(), Quantity.Dimension.LENGTH);
            return u.si();
        } catch (IllegalArgumentException e) {
            throw new InputException(source, 0, 0, "'" + key + ": " + v + "' is not understood; write a length such as '2 µm'");
        }
    }

    private static Double number(Map<String, String> meta, String key, Path source) {
        String v = meta.get(key);
        if (v == null) {
            return null;
        }
        try {
            return Double.parseDouble(v.replace("°", "").replace("deg", "").strip());
        } catch (NumberFormatException e) {
            throw new InputException(source, 0, 0, "'" + key + ": " + v + "' is not understood; write a number of degrees such as 12");
        }
    }

    private static double[] pair(Map<String, String> meta, String key, Path source) {
        String v = meta.get(key);
        if (v == null) {
            return null;
        }
        String[] parts = v.split("[,;\\s]+");
        try {
            return new double[] {Double.parseDouble(parts[0]), Double.parseDouble(parts[1])};
        } catch (RuntimeException e) {
            throw new InputException(source, 0, 0, "'" + key + ": " + v + "' is not understood; write two pixel numbers such as '20, 15'");
        }
    }
}
