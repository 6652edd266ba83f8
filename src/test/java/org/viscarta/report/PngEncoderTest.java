package org.viscarta.report;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.awt.Color;
import java.awt.Graphics2D;
import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.util.SplittableRandom;
import javax.imageio.ImageIO;
import javax.imageio.ImageReader;
import javax.imageio.metadata.IIOMetadata;
import javax.imageio.stream.ImageInputStream;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * The figures' PNG files decode, with the JDK's own PNG reader (an independent implementation of
 * the W3C specification), to exactly the pixels drawn, and carry the resolution they were drawn at.
 */
@Tag("validation")
class PngEncoderTest {

    @Test
    void decodesToTheSamePixelsWithItsResolution() throws Exception {
        BufferedImage img = new BufferedImage(257, 131, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, 257, 131);
        g.setColor(new Color(0x0072B2));
        g.drawLine(0, 0, 256, 130);
        g.dispose();
        SplittableRandom rng = new SplittableRandom(3);
        for (int k = 0; k < 2000; k++) { // noise, so that every filter difference and byte value occurs
            img.setRGB(rng.nextInt(257), rng.nextInt(131), rng.nextInt(1 << 24));
        }
        byte[] png = PngEncoder.encode(img, 300);
        try (ImageInputStream in = ImageIO.createImageInputStream(new ByteArrayInputStream(png))) {
            ImageReader reader = ImageIO.getImageReadersByFormatName("png").next();
            reader.setInput(in);
            BufferedImage back = reader.read(0);
            assertEquals(257, back.getWidth());
            assertEquals(131, back.getHeight());
            for (int y = 0; y < 131; y++) {
                for (int x = 0; x < 257; x++) {
                    assertEquals(img.getRGB(x, y), back.getRGB(x, y), "pixel " + x + "," + y);
                }
            }
            IIOMetadata meta = reader.getImageMetadata(0);
            org.w3c.dom.Node phys = ((org.w3c.dom.Element) meta.getAsTree("javax_imageio_png_1.0")).getElementsByTagName("pHYs").item(0);
            // 300 dots per inch = 300 / 0.0254 = 11811.02 dots per metre, written rounded
            assertEquals("11811", phys.getAttributes().getNamedItem("pixelsPerUnitXAxis").getNodeValue());
            assertEquals("meter", phys.getAttributes().getNamedItem("unitSpecifier").getNodeValue());
        }
    }
}
