package org.viscarta.report;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.viscarta.io.AtomicOutput;
import org.viscarta.io.InputException;

/**
 * The report as files in one folder: report.xlsx, report.html and figures/ (PNG and SVG), each
 * written through a temporary file and a rename.
 *
 * @param folder the output folder (created when needed)
 */
public record ReportFiles(Path folder) {

    public Path workbook() {
        return folder.resolve("report.xlsx");
    }

    public Path page() {
        return folder.resolve("report.html");
    }

    public Path figures() {
        return folder.resolve("figures");
    }

    /**
     * Fails before any work when an output exists and replacing was not asked for.
     *
     * @throws InputException naming the output that exists
     */
    public void checkWritable(boolean force) {
        AtomicOutput.checkWritable(workbook(), force);
        AtomicOutput.checkWritable(page(), force);
        if (Files.isDirectory(figures()) && !force) {
            throw new InputException(figures(), 0, 0,
                    "the figures folder already exists; choose another --out or pass --force to replace its figures");
        }
    }

    /**
     * Draws the figures and writes every file.
     *
     * @return the figures written
     */
    public List<RenderedFigure> write(ReportContent content, boolean force) throws IOException {
        List<RenderedFigure> figures = ReportFigures.render(ReportFigures.build(content.result()));
        Files.createDirectories(figures());
        for (RenderedFigure f : figures) {
            AtomicOutput.write(figures().resolve(f.stem() + ".png"), true, o -> o.write(f.png()));
            AtomicOutput.write(figures().resolve(f.stem() + ".svg"), true, o -> o.write(f.svg().getBytes(StandardCharsets.UTF_8)));
        }
        AtomicOutput.write(workbook(), force, o -> WorkbookReport.write(content, figures, o));
        String html = HtmlReport.write(content, figures);
        AtomicOutput.write(page(), force, o -> o.write(html.getBytes(StandardCharsets.UTF_8)));
        return figures;
    }
}
