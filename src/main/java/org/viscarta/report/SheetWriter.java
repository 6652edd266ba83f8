package org.viscarta.report;

import java.io.ByteArrayInputStream;
import java.io.File;
import java.io.FileInputStream;
import java.io.FileOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.SequenceInputStream;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.util.zip.Inflater;
import java.util.zip.InflaterInputStream;
import org.apache.poi.xssf.streaming.SheetDataWriter;

/**
 * The streamed sheets' XML writer: POI's own ({@link SheetDataWriter}), with two changes.
 * <ul>
 * <li>Its characters are buffered without a lock. POI writes a sheet attribute by attribute, a few
 * characters at a time, into a {@link java.io.BufferedWriter}, which takes its lock on every call;
 * on a 330,000-row sheet those calls were about a third of the time spent writing rows. One sheet
 * is written by one thread at a time, so {@link org.viscarta.io.UnlockedWriter} buffers them instead.</li>
 * <li>Its temporary file holds the rows already compressed, as a raw Deflate part
 * ({@link DeflatedPart}): by the thread that writes the rows, while it writes them, so that the
 * workbook's container is assembled from compressed parts instead of compressing hundreds of
 * megabytes of XML on one thread at the end (and the temporary file is a sixth of the size).</li>
 * </ul>
 */
final class SheetWriter extends SheetDataWriter {

    /**
     * The compressed rows. Set while the superclass's constructor opens the file, so it has no
     * initialiser of its own (one would run after that constructor and clear it).
     */
    private DeflatedPart part;

    SheetWriter() throws IOException {
        super();
    }

    @Override
    public Writer createWriter(File fd) throws IOException {
        FileOutputStream file = new FileOutputStream(fd);
        try {
            return new org.viscarta.io.UnlockedWriter(new OutputStreamWriter(decorateOutputStream(file), StandardCharsets.UTF_8));
        } catch (RuntimeException e) {
            file.close();
            throw e;
        }
    }

    @Override
    protected OutputStream decorateOutputStream(FileOutputStream fos) {
        part = new DeflatedPart(new java.io.BufferedOutputStream(fos, 1 << 16));
        return part;
    }

    /** The rows' XML, read back from the compressed part (POI's own way of reading a sheet). */
    @Override
    protected InputStream decorateInputStream(FileInputStream fis) {
        return new InflaterInputStream(new SequenceInputStream(fis, new ByteArrayInputStream(DeflatedPart.EMPTY_FINAL_BLOCK)),
                new Inflater(true), 1 << 16);
    }

    /** The compressed rows, complete once the writer is closed. */
    DeflatedPart part() {
        return part;
    }

    /** The temporary file that holds them. */
    File file() {
        return getTempFile();
    }
}
