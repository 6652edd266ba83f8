package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.Reader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code map} on the demo scenarios: its tables, figures and words, and what it refuses. */
@Tag("regression")
class MapCommandTest {

    @TempDir
    Path dir;

    @Test
    void theDemoMapsGiveTheirTablesFiguresAndRegionLetters() throws IOException {
        Path out = dir.resolve("maps");
        CliRun r = CliRun.of("map", "demo-data/maps", "-o", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.out().contains("paint-cross-section: 300 positions") && r.out().contains("tissue-phantom: 625 positions"), r.out());
        assertTrue(r.out().contains("Moran's I"), r.out());
        r.out().lines().forEach(l -> assertTrue(l.codePointCount(0, l.length()) <= 100, "within 100 columns: " + l));
        List<CSVRecord> regions;
        try (Reader in = Files.newBufferedReader(out.resolve("regions.csv"));
             CSVParser p = CSVParser.parse(in, CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).get())) {
            assertTrue(p.getHeaderNames().containsAll(List.of("sample", "region", "n_positions", "storage_modulus_median_pa",
                    "storage_modulus_q1_pa", "storage_modulus_q3_pa", "tan_delta_median", "tan_delta_q1", "tan_delta_q3", "letters_storage",
                    "letters_tan_delta")), p.getHeaderNames().toString());
            regions = p.getRecords();
        }
        assertEquals(6, regions.size(), "four layers and two phantom regions");
        // the layers are made stiffer downwards: the ground stiffest (a), the varnish softest and most lossy
        CSVRecord ground = regions.stream().filter(x -> x.get("region").equals("ground")).findFirst().orElseThrow();
        CSVRecord varnish = regions.stream().filter(x -> x.get("region").equals("varnish")).findFirst().orElseThrow();
        assertEquals("a", ground.get("letters_storage"));
        assertEquals("a", varnish.get("letters_tan_delta"));
        try (Reader in = Files.newBufferedReader(out.resolve("positions.csv"));
             CSVParser p = CSVParser.parse(in, CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).get())) {
            assertTrue(p.getHeaderNames().containsAll(List.of("sample", "x_m", "y_m", "image_x_px", "image_y_px", "region",
                    "storage_modulus_pa", "loss_modulus_pa", "tan_delta", "nearest_reference", "nearest_class")));
            assertEquals(925, p.getRecords().size());
        }
        for (String f : List.of("map-storage-paint-cross-section.png", "overlay-tan-delta-tissue-phantom.svg",
                "regions-storage-paint-cross-section.png")) {
            assertTrue(Files.isRegularFile(out.resolve("figures").resolve(f)), f);
        }
    }

    @Test
    void withoutPositionsOrWithAnImageButNoRegistrationItSaysWhy() throws IOException {
        CliRun none = CliRun.of("map", "demo-data/hydrogel-screen/agarose-1.0pct-r1.csv");
        assertEquals(2, none.exitCode());
        assertTrue(none.err().contains("no sweeps with positions"), none.err());
        Path table = dir.resolve("grid.csv");
        Files.writeString(table, "# sample: s\nx [µm],y [µm],frequency [Hz],E' [Pa],E'' [Pa]\n0,0,1,100,10\n10,0,1,110,12\n");
        Path png = dir.resolve("photo.png");
        javax.imageio.ImageIO.write(new java.awt.image.BufferedImage(4, 4, java.awt.image.BufferedImage.TYPE_INT_RGB), "png", png.toFile());
        CliRun noReg = CliRun.of("map", table.toString(), "--image", png.toString());
        assertEquals(2, noReg.exitCode());
        assertTrue(noReg.err().contains("needs its registration"), noReg.err());
    }
}
