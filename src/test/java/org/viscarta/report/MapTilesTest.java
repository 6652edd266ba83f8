package org.viscarta.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.viscarta.map.MapAnalysis;
import org.viscarta.map.Registration;

/**
 * Translucent tiles over an image: where tiles of one value meet, the figure must show their one
 * colour, not the image through a seam (antialiased edges of two tiles each left the shared pixels
 * partly uncovered). 30 × 30 positions of the same E′ and tan δ over a uniform grey image, the
 * stage square to the image and turned 10° against it (then each tile is drawn as a quadrilateral).
 */
@Tag("regression")
class MapTilesTest {

    private static MapAnalysis.Specimen uniform(Registration reg) {
        List<MapAnalysis.Point> pts = new ArrayList<>();
        double spacing = 3e-6;
        for (int i = 0; i < 30; i++) {
            for (int j = 0; j < 30; j++) {
                double x = i * spacing;
                double y = j * spacing;
                double[] uv = reg.toImage(x, y);
                pts.add(new MapAnalysis.Point("tiles", x, y, 1, 2e4, 2e3, 0.1, "", uv[0], uv[1], "", "", "", ""));
            }
        }
        return new MapAnalysis.Specimen("tiles", pts, List.of(), null, null, null, null, spacing, List.of());
    }

    @Test
    void tilesOfOneValueMeetWithoutSeams() throws IOException {
        BufferedImage grey = new BufferedImage(120, 120, BufferedImage.TYPE_INT_RGB);
        for (int u = 0; u < 120; u++) {
            for (int v = 0; v < 120; v++) {
                grey.setRGB(u, v, 0x404040);
            }
        }
        for (double turn : new double[] {0, 10}) {
            Registration reg = Registration.byPixelSize(1e-6, 15, 15, turn);
            Figure overlay = MapFigures.of(uniform(reg), grey, reg, 0.6, 1, "tiles").stream()
                    .filter(f -> f.stem().startsWith("overlay-storage")).findFirst().orElseThrow();
            BufferedImage png = ImageIO.read(new ByteArrayInputStream(overlay.png()));
            // the tiles cover image pixels 15 … 105 (turned: a square about the same centre); the
            // plot shows 0 … 120, so the middle fifth of the data area lies well inside them
            Map<Integer, Integer> colours = new HashMap<>();
            int w = png.getWidth();
            int h = png.getHeight();
            int cx = w * 43 / 100; // the data area is left of the colour scale and below the title
            int cy = h / 2;
            for (int x = cx - w / 14; x < cx + w / 14; x++) {
                for (int y = cy - h / 14; y < cy + h / 14; y++) {
                    colours.merge(png.getRGB(x, y) & 0xFFFFFF, 1, Integer::sum);
                }
            }
            assertEquals(1, colours.size(), "turned " + turn + "°: one colour inside the tiles, found " + colours.size()
                    + " (" + colours + ")");
            int c = colours.keySet().iterator().next();
            assertTrue(c != 0x404040, "turned " + turn + "°: the window lies on the tiles, not on the bare image");
        }
    }
}
