package org.viscarta.report;

import java.io.File;
import java.io.FileOutputStream;
import java.io.IOException;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import org.apache.poi.xssf.streaming.SheetDataWriter;

/**
 * The streamed sheets' XML writer: POI's own ({@link SheetDataWriter}), with its characters buffered
 * without a lock. POI writes a sheet attribute by attribute, a few characters at a time, into a
 * {@link java.io.BufferedWriter}, which takes its lock on every call; on a 330,000-row sheet those
 * calls were about a third of the time spent writing rows. One sheet is written by one thread, so
 * {@link org.viscarta.io.UnlockedWriter} buffers them instead.
 */
final class SheetWriter extends SheetDataWriter {

    SheetWriter() throws IOException {
        super();
    }

    @Override
    public Writer createWriter(File fd) throws IOException {
        FileOutputStream file = new FileOutputStream(fd);
        try {
            return new org.viscarta.io.UnlockedWriter(new OutputStreamWriter(decorateOutputStream(file), StandardCharsets.UTF_8));
        } catch (IOException | RuntimeException e) {
            file.close();
            throw e;
        }
    }
}
