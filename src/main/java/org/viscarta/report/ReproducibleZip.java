package org.viscarta.report;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.zip.ZipEntry;
import java.util.zip.ZipFile;
import java.util.zip.ZipOutputStream;

/**
 * Rewrites a ZIP container (an .xlsx is one) with every entry stamped with the same time, so that
 * the same content always gives the same bytes.
 */
final class ReproducibleZip {

    private ReproducibleZip() {
    }

    /** Reads through the central directory (POI's streamed entries are not all readable front to back). */
    static byte[] rewrite(byte[] zip, long entryTimeMillis) throws IOException {
        Path tmp = Files.createTempFile("viscarta-", ".zip");
        try {
            Files.write(tmp, zip);
            ByteArrayOutputStream out = new ByteArrayOutputStream(zip.length);
            try (ZipFile in = new ZipFile(tmp.toFile()); ZipOutputStream z = new ZipOutputStream(out)) {
                for (ZipEntry e : java.util.Collections.list(in.entries())) {
                    ZipEntry copy = new ZipEntry(e.getName());
                    copy.setTime(entryTimeMillis);
                    z.putNextEntry(copy);
                    try (InputStream data = in.getInputStream(e)) {
                        data.transferTo(z);
                    }
                    z.closeEntry();
                }
            }
            return out.toByteArray();
        } finally {
            Files.deleteIfExists(tmp);
        }
    }
}
