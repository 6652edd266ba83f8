package org.viscarta.report;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.stream.Stream;
import org.viscarta.io.InputException;

/**
 * The report as files in one folder: report.xlsx, report.html and figures/ (PNG and SVG). The set
 * is written into a staging folder beside the output folder and moved into place only when whole,
 * so that a run stopped at any moment leaves either the old set or the new one, never a mix; the
 * old set is kept aside until the new one is in place, and put back if the move fails.
 *
 * @param folder the output folder (created when needed)
 */
public record ReportFiles(Path folder) {

    /** Held by a running report in its staging and set-aside folders; a folder whose lock can be taken was left by a stopped run. */
    private static final String LOCK = ".lock";

    private static final String WORKBOOK = "report.xlsx";
    private static final String PAGE = "report.html";
    private static final String FIGURES = "figures";

    /**
     * Loads and initialises what writing a report needs — POI's workbook model and its XML schema
     * types, the chart library, Java2D and the fonts — by making a one-cell workbook and a small
     * figure (PNG under {@link Figure}'s drawing lock, and SVG) that are thrown away. Started on a
     * spare core while the analysis runs, it takes that class loading (about 1.7 s of one core on
     * the demo, measured) off the report's own path: in nine alternated pairs of demo reports it was
     * faster in eight, by about 0.2 s on average (4.57–5.81 s against 4.82–5.87 s). Writes nothing.
     */
    public static void warmUp() throws IOException {
        try (org.apache.poi.xssf.usermodel.XSSFWorkbook wb = new org.apache.poi.xssf.usermodel.XSSFWorkbook()) {
            org.apache.poi.ss.usermodel.CellStyle style = wb.createCellStyle();
            org.apache.poi.ss.usermodel.Font bold = wb.createFont();
            bold.setBold(true);
            style.setFont(bold);
            style.setDataFormat(wb.createDataFormat().getFormat("0.000"));
            org.apache.poi.ss.usermodel.Sheet sheet = wb.createSheet("warm-up");
            org.apache.poi.ss.usermodel.Cell cell = sheet.createRow(0).createCell(0);
            cell.setCellValue(1.5);
            cell.setCellStyle(style);
            sheet.createRow(1).createCell(0).setCellValue("tan δ");
            wb.write(OutputStream.nullOutputStream());
        }
        org.jfree.data.xy.XYSeries points = new org.jfree.data.xy.XYSeries("E′");
        points.add(0.1, 1.0);
        points.add(10, 100.0);
        org.jfree.chart.plot.XYPlot plot = new org.jfree.chart.plot.XYPlot(new org.jfree.data.xy.XYSeriesCollection(points),
                new org.jfree.chart.axis.LogAxis("frequency [Hz]"), new org.jfree.chart.axis.LogAxis("E′ [Pa]"),
                new org.jfree.chart.renderer.xy.XYLineAndShapeRenderer());
        Figure figure = new Figure("warm-up", "", new org.jfree.chart.JFreeChart("warm-up", plot));
        figure.png();
        figure.svg();
    }

    /** Starts {@link #warmUp} on a daemon thread of its own and returns the thread; a failure only loses the head start. */
    public static Thread warmUpAside() {
        Thread t = new Thread(() -> {
            try {
                warmUp();
            } catch (IOException | RuntimeException e) {
                // only a head start: the report loads what it needs itself
            }
        }, "viscarta-warm-up");
        t.setDaemon(true);
        t.start();
        return t;
    }

    public Path workbook() {
        return folder.resolve(WORKBOOK);
    }

    public Path page() {
        return folder.resolve(PAGE);
    }

    public Path figures() {
        return folder.resolve(FIGURES);
    }

    /**
     * Fails before any work when the output cannot be written: an existing report without
     * replacing asked for, an output that is a file rather than a folder, or a folder that cannot
     * be written.
     *
     * @throws InputException naming the real path and the reason
     */
    public void checkWritable(boolean force) {
        Path abs = folder.toAbsolutePath().normalize();
        if (Files.exists(abs) && !Files.isDirectory(abs)) {
            throw new InputException(abs, 0, 0, "--out names a file, not a folder; give a folder for the report");
        }
        Path existing = abs;
        while (existing != null && !Files.exists(existing)) {
            existing = existing.getParent();
        }
        if (existing == null || !Files.isDirectory(existing) || !Files.isWritable(existing)) {
            throw new InputException(existing == null ? abs : existing, 0, 0, "the report cannot be written here (no write "
                    + "permission); choose another --out");
        }
        if (!force && (Files.exists(workbook()) || Files.exists(page()) || Files.isDirectory(figures()))) {
            throw new InputException(Files.exists(workbook()) ? workbook() : Files.exists(page()) ? page() : figures(), 0, 0,
                    "the output already exists; choose another --out or pass --force to replace the report");
        }
    }

    /**
     * What was written: the figures, and for each table longer than a workbook sheet holds, how much of
     * it its sheet shows (the sheet's last row says so too).
     */
    public record Written(List<RenderedFigure> figures, List<String> cutTables) {
    }

    /** Draws the figures and writes every file. */
    public Written write(ReportContent content, boolean force) throws IOException {
        return write(content, force, step -> {
        });
    }

    /** As {@link #write(ReportContent, boolean)}, telling {@code done} the name of each step as it ends (for timings). */
    public Written write(ReportContent content, boolean force, java.util.function.Consumer<String> done)
            throws IOException {
        Path target = folder.toAbsolutePath().normalize();
        Path parent = target.getParent();
        Files.createDirectories(parent);
        String prefix = "." + target.getFileName() + ".";
        recoverStopped(parent, prefix, target);
        List<Figure> charts = ReportFigures.build(content.result());
        // the figures are drawn on a pool of their own, one thread a core, while this thread writes the workbook's tables
        java.util.concurrent.ForkJoinPool pool = new java.util.concurrent.ForkJoinPool(Runtime.getRuntime().availableProcessors());
        java.util.concurrent.CompletableFuture<List<RenderedFigure>> drawing = java.util.concurrent.CompletableFuture.supplyAsync(() -> {
            try {
                return ReportFigures.render(charts);
            } catch (IOException e) {
                throw new java.io.UncheckedIOException(e);
            }
        }, pool);
        WorkbookReport.FigureSource figures = () -> {
            try {
                return drawing.join();
            } catch (java.util.concurrent.CompletionException e) {
                if (e.getCause() instanceof java.io.UncheckedIOException io) {
                    throw io.getCause();
                }
                throw e.getCause() instanceof RuntimeException r ? r : e;
            }
        };
        Path stage = Files.createTempDirectory(parent, prefix + "staging-");
        List<String> cut;
        try (FileChannel ch = FileChannel.open(stage.resolve(LOCK), StandardOpenOption.CREATE, StandardOpenOption.WRITE);
             FileLock held = ch.lock()) {
            Path stagedFigures = Files.createDirectory(stage.resolve(FIGURES));
            // POI's own temporary files (streamed sheets) go into the staging folder too, so that a stopped run's are cleared with it
            org.apache.poi.util.TempFile.setTempFileCreationStrategy(
                    new org.apache.poi.util.DefaultTempFileCreationStrategy(Files.createDirectory(stage.resolve("poi")).toFile()));
            try {
                cut = WorkbookReport.write(content, figures, stage.resolve(WORKBOOK));
                done.accept("workbook and figures");
            } finally {
                org.apache.poi.util.TempFile.setTempFileCreationStrategy(new org.apache.poi.util.DefaultTempFileCreationStrategy());
            }
            for (RenderedFigure f : figures.get()) {
                Files.write(stagedFigures.resolve(f.stem() + ".png"), f.png());
                Files.writeString(stagedFigures.resolve(f.stem() + ".svg"), f.svg(), StandardCharsets.UTF_8);
            }
            try (java.io.Writer page = new org.viscarta.io.Utf8Writer(Files.newOutputStream(stage.resolve(PAGE)))) {
                HtmlReport.write(content, figures.get(), page);
            }
            done.accept("page");
            checkWritable(force);
            moveIntoPlace(stage, target, parent, prefix);
        } finally {
            drawing.cancel(false);
            pool.shutdown();
            delete(stage);
        }
        return new Written(figures.get(), cut);
    }

    /** Sets the old set aside, moves the new one in, then drops the old; on failure puts the old one back. */
    private static void moveIntoPlace(Path stage, Path target, Path parent, String prefix) throws IOException {
        Files.createDirectories(target);
        Path aside = Files.createTempDirectory(parent, prefix + "replaced-");
        List<String> setAside = new ArrayList<>();
        List<String> movedIn = new ArrayList<>();
        try (FileChannel ch = FileChannel.open(aside.resolve(LOCK), StandardOpenOption.CREATE, StandardOpenOption.WRITE);
             FileLock held = ch.lock()) {
            for (String name : List.of(FIGURES, WORKBOOK, PAGE)) {
                if (Files.exists(target.resolve(name))) {
                    move(target.resolve(name), aside.resolve(name));
                    setAside.add(name);
                }
            }
            for (String name : List.of(FIGURES, WORKBOOK, PAGE)) {
                move(stage.resolve(name), target.resolve(name));
                movedIn.add(name);
            }
        } catch (IOException | RuntimeException e) {
            for (String name : movedIn) {
                delete(target.resolve(name));
            }
            for (String name : setAside) {
                move(aside.resolve(name), target.resolve(name));
            }
            throw e;
        } finally {
            delete(aside);
        }
    }

    private static void move(Path from, Path to) throws IOException {
        try {
            Files.move(from, to, StandardCopyOption.ATOMIC_MOVE);
        } catch (java.nio.file.AtomicMoveNotSupportedException e) {
            Files.move(from, to);
        }
    }

    /**
     * Clears what an earlier run that was stopped left behind: its staging folder is removed; if it
     * was stopped while moving the new set in, the old set it had put aside is restored whole (the
     * new pieces already moved in are removed), so the folder never holds a mix of two runs.
     * A folder whose lock is still held belongs to a run in progress and is left alone.
     */
    private static void recoverStopped(Path parent, String prefix, Path target) throws IOException {
        List<Path> stopped = new ArrayList<>();
        try (Stream<Path> s = Files.list(parent)) {
            for (Path p : s.filter(p -> p.getFileName().toString().startsWith(prefix)).filter(Files::isDirectory).toList()) {
                String rest = p.getFileName().toString().substring(prefix.length());
                if ((rest.startsWith("staging-") || rest.startsWith("replaced-")) && abandoned(p)) {
                    stopped.add(p);
                }
            }
        }
        for (Path p : stopped) {
            if (p.getFileName().toString().substring(prefix.length()).startsWith("replaced-")) {
                boolean whole = Stream.of(FIGURES, WORKBOOK, PAGE).allMatch(n -> Files.exists(target.resolve(n)));
                if (!whole) {
                    for (String name : List.of(FIGURES, WORKBOOK, PAGE)) {
                        if (Files.exists(p.resolve(name))) {
                            delete(target.resolve(name));
                            move(p.resolve(name), target.resolve(name));
                        } else {
                            delete(target.resolve(name));
                        }
                    }
                }
            }
            delete(p);
        }
    }

    /** True when nobody holds the folder's lock (its run was stopped), or it has none. */
    private static boolean abandoned(Path folder) throws IOException {
        Path lock = folder.resolve(LOCK);
        if (!Files.exists(lock)) {
            return true;
        }
        try (FileChannel ch = FileChannel.open(lock, StandardOpenOption.WRITE); FileLock l = ch.tryLock()) {
            return l != null;
        } catch (java.nio.channels.OverlappingFileLockException e) {
            return false;
        }
    }

    private static void delete(Path tree) throws IOException {
        if (!Files.exists(tree)) {
            return;
        }
        try (Stream<Path> s = Files.walk(tree)) {
            for (Path p : s.sorted(Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(p);
            }
        }
    }
}
