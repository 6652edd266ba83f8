package org.viscarta.map;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

import javax.imageio.ImageIO;

import org.viscarta.io.InputException;

/** The lab's image of a specimen (PNG, JPEG or TIFF, read by the JDK's own image readers). */
public final class MapImage {

    private MapImage() {
    }

    /** Reads an image, or says in one line why it cannot be. */
    public static BufferedImage read(Path file) {
        if (!Files.isRegularFile(file)) {
            throw new InputException(file, 0, 0, "no such image file");
        }
        try {
            BufferedImage img = ImageIO.read(file.toFile());
            if (img == null) {
                throw new InputException(file, 0, 0, "not an image this product reads; save it as PNG, JPEG or TIFF");
            }
            return img;
        } catch (IOException e) {
            throw new InputException(file, 0, 0, "the image cannot be read (" + e.getMessage() + ")");
        }
    }
}
