package org.viscarta.report;

import java.awt.image.BufferedImage;
import java.awt.image.DataBufferInt;
import java.io.ByteArrayOutputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.zip.CRC32;
import java.util.zip.Deflater;
import java.util.zip.DeflaterOutputStream;

/**
 * PNG files of the report's figures, written straight from the image's pixels. The JDK's ImageIO
 * writer reads pixels through the general raster interface and tries every row filter, which made
 * PNG encoding most of a report's time (about 90 ms a figure at 300 dpi); figures are flat colours
 * and thin lines, for which one fixed filter and fast Deflate compress about as well.
 *
 * <p>Format: W3C, Portable Network Graphics (PNG) Specification, 2nd ed. (ISO/IEC 15948:2003):
 * the signature, IHDR (8-bit RGB, no interlace), pHYs (the resolution, so that a word processor
 * places the figure at its intended size), IDAT (zlib stream of the rows, each with filter type 2,
 * "Up": the byte minus the byte above; the first row with filter 0), IEND; each chunk with its
 * CRC-32 over type and data.
 */
final class PngEncoder {

    private static final byte[] SIGNATURE = {(byte) 0x89, 'P', 'N', 'G', '\r', '\n', 0x1A, '\n'};

    private PngEncoder() {
    }

    /**
     * @param image an image of type {@link BufferedImage#TYPE_INT_RGB}
     * @param dpi   its resolution, written into pHYs
     */
    static byte[] encode(BufferedImage image, double dpi) throws IOException {
        if (image.getType() != BufferedImage.TYPE_INT_RGB) {
            throw new IllegalArgumentException("expected an RGB image of ints, got type " + image.getType());
        }
        int w = image.getWidth();
        int h = image.getHeight();
        int[] pixels = ((DataBufferInt) image.getRaster().getDataBuffer()).getData();
        ByteArrayOutputStream file = new ByteArrayOutputStream(w * h / 4);
        DataOutputStream out = new DataOutputStream(file);
        out.write(SIGNATURE);
        ByteArrayOutputStream ihdr = new ByteArrayOutputStream();
        DataOutputStream d = new DataOutputStream(ihdr);
        d.writeInt(w);
        d.writeInt(h);
        d.writeByte(8); // bits per sample
        d.writeByte(2); // colour type: RGB
        d.writeByte(0); // compression: deflate
        d.writeByte(0); // filter method 0
        d.writeByte(0); // no interlace
        chunk(out, "IHDR", ihdr.toByteArray());
        ByteArrayOutputStream phys = new ByteArrayOutputStream();
        d = new DataOutputStream(phys);
        int perMetre = (int) Math.round(dpi / 0.0254);
        d.writeInt(perMetre);
        d.writeInt(perMetre);
        d.writeByte(1); // unit: metre
        chunk(out, "pHYs", phys.toByteArray());
        ByteArrayOutputStream idat = new ByteArrayOutputStream(w * h / 8);
        Deflater deflater = new Deflater(Deflater.BEST_SPEED);
        try (DeflaterOutputStream z = new DeflaterOutputStream(idat, deflater, 1 << 16)) {
            byte[] row = new byte[1 + 3 * w];
            for (int y = 0; y < h; y++) {
                filterRow(pixels, w, y, row);
                z.write(row);
            }
        } finally {
            deflater.end();
        }
        chunk(out, "IDAT", idat.toByteArray());
        chunk(out, "IEND", new byte[0]);
        out.flush();
        return file.toByteArray();
    }

    /**
     * Row y as PNG bytes: filter 0 (none) for the first row, else filter 2 (Up), each byte minus the
     * byte above; a method of its own so that the compiler optimises it after a few rows.
     */
    private static void filterRow(int[] pixels, int w, int y, byte[] row) {
        int base = y * w;
        int o = 1;
        if (y == 0) {
            row[0] = 0;
            for (int x = 0; x < w; x++) {
                int p = pixels[base + x];
                row[o++] = (byte) (p >>> 16);
                row[o++] = (byte) (p >>> 8);
                row[o++] = (byte) p;
            }
            return;
        }
        row[0] = 2;
        int up = base - w;
        for (int x = 0; x < w; x++) {
            int p = pixels[base + x];
            int q = pixels[up + x];
            row[o++] = (byte) ((p >>> 16) - (q >>> 16));
            row[o++] = (byte) ((p >>> 8) - (q >>> 8));
            row[o++] = (byte) (p - q);
        }
    }

    private static void chunk(DataOutputStream out, String type, byte[] data) throws IOException {
        byte[] t = type.getBytes(StandardCharsets.US_ASCII);
        CRC32 crc = new CRC32();
        crc.update(t);
        crc.update(data);
        out.writeInt(data.length);
        out.write(t);
        out.write(data);
        out.writeInt((int) crc.getValue());
    }
}
