package org.viscarta.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.viscarta.analysis.Inputs;
import org.viscarta.io.AtomicOutput;
import org.viscarta.io.UsageException;
import org.viscarta.map.MapAnalysis;
import org.viscarta.map.MapSetup;
import org.viscarta.analysis.Maps;
import org.viscarta.report.MapFigures;
import org.viscarta.report.Figure;
import org.viscarta.report.OutputTables;
import org.viscarta.report.RenderedFigure;
import org.viscarta.sweep.Numbers;
import org.viscarta.table.Cells;
import org.viscarta.table.CsvTable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code viscarta map}: viscoelastic properties over a specimen, registered to the lab's image, with region statistics. */
@Command(name = "map", mixinStandardHelpOptions = true,
        header = "Map E′, E″ and tan δ over a specimen measured at many positions, on the lab's image, with region statistics.",
        description = "Reads sweeps that carry positions (x and y columns of a tidy table, the sample column naming the specimen), "
            + "takes E′, E″ and tan δ at --at at each position (replicates averaged), places each on the lab's image (by "
            + "--pixel-size or --landmarks) and in its region (--regions polygons or a --region-image), compares the regions "
            + "(Welch t-tests with Holm's adjustment and letters, Kruskal–Wallis) and measures how alike neighbouring "
            + "positions are (Moran's I). The image, registration and regions may instead be named in the table's own "
            + "preamble ('# image: photo.png', '# pixel_size: 2 µm', '# regions: layers.csv', ...).")
final class MapCommand implements Callable<Integer> {

    @Mixin
    InputOptions input;

    @Option(names = "--at", paramLabel = "FREQUENCY", converter = FrequencyConverter.class, defaultValue = "1Hz",
            description = "The frequency of the maps (default: ${DEFAULT-VALUE}).")
    double atHz;

    @Option(names = "--alpha", paramLabel = "LEVEL", defaultValue = "0.05",
            description = "Significance level of the region comparisons (default: ${DEFAULT-VALUE}).")
    double alpha;

    @Option(names = "--models", split = ",", paramLabel = "MODEL",
            description = "Fit these models at every position and name the best-supported one (with --library and no --models: "
                    + "springpot, zener and fractional-zener).")
    List<String> models = new ArrayList<>();

    @Mixin
    LibraryOption library;

    @Option(names = "--image", paramLabel = "FILE", description = "The lab's image of the specimen (PNG, JPEG or TIFF).")
    Path image;

    @Option(names = "--pixel-size", paramLabel = "LENGTH", description = "The size of one image pixel on the specimen, e.g. 2µm.")
    String pixelSize;

    @Option(names = "--origin", paramLabel = "U,V", description = "The image pixel at the stage's origin (default: 0,0).")
    String origin;

    @Option(names = "--rotation", paramLabel = "DEG", description = "The rotation of the stage axes against the image's, in degrees.")
    Double rotation;

    @Option(names = "--landmarks", paramLabel = "FILE.csv",
            description = "Landmarks instead of a pixel size: columns 'x [µm]', 'y [µm]', 'image_x [px]', 'image_y [px]'.")
    Path landmarks;

    @Option(names = "--regions", paramLabel = "FILE.csv",
            description = "Regions as polygons: columns region, 'x [µm]', 'y [µm]' (vertices in order), optional polygon.")
    Path regions;

    @Option(names = "--region-image", paramLabel = "LABELS.png", description = "Regions as a label image in the image's registration.")
    Path regionImage;

    @Option(names = "--region-legend", paramLabel = "FILE.csv", description = "The label image's legend: columns colour (#RRGGBB), region.")
    Path regionLegend;

    @Option(names = "--opacity", paramLabel = "FRACTION", defaultValue = "0.6",
            description = "The tiles' opacity over the image, 0 to 1 (default: ${DEFAULT-VALUE}).")
    double opacity;

    @Option(names = {"-o", "--out"}, paramLabel = "DIR", description = "Write positions.csv, regions.csv and figures/ into this folder.")
    Path out;

    @Option(names = "--force", description = "Replace existing output files.")
    boolean force;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        if (!(opacity > 0 && opacity <= 1)) {
            throw new CommandLine.ParameterException(spec.commandLine(), "--opacity takes a fraction above 0 and at most 1, not " + opacity);
        }
        if (out != null) {
            for (String f : List.of("positions.csv", "regions.csv")) {
                AtomicOutput.checkWritable(out.resolve(f), force);
            }
        }
        Inputs in = input.readAndWarn(spec);
        if (in.positioned().isEmpty()) {
            throw new UsageException("no sweeps with positions in the inputs: a map needs x and y columns (with a length unit) in a "
                    + "tidy table, the sample column naming the specimen");
        }
        Double pixel = null;
        if (pixelSize != null) {
            try {
                pixel = org.viscarta.sweep.Unit.parse(pixelSize, org.viscarta.sweep.Quantity.Dimension.LENGTH).si();
            } catch (IllegalArgumentException e) {
                throw new CommandLine.ParameterException(spec.commandLine(), "--pixel-size takes a length such as 2µm, not '" + pixelSize + "'");
            }
        }
        double[] originPx = null;
        if (origin != null) {
            String[] p = origin.split(",");
            try {
                originPx = new double[] {Double.parseDouble(p[0].strip()), Double.parseDouble(p[1].strip())};
            } catch (RuntimeException e) {
                throw new CommandLine.ParameterException(spec.commandLine(), "--origin takes two pixel numbers U,V, not '" + origin + "'");
            }
        }
        MapSetup.Given given = new MapSetup.Given(image, pixel, originPx, rotation, landmarks, regions, regionImage, regionLegend);
        Maps maps = Maps.of(in.positioned(), given, atHz, alpha, models, library.folderIfNamed().orElse(null), input.read.settings());
        PrintWriter o = spec.commandLine().getOut();
        for (Maps.Mapped m : maps.specimens()) {
            print(o, m, atHz);
        }
        o.flush();
        if (out != null) {
            List<MapAnalysis.Point> points = maps.specimens().stream().flatMap(m -> m.specimen().points().stream()).toList();
            CsvTable.write(OutputTables.POSITIONS, points, out.resolve("positions.csv"), force);
            List<OutputTables.RegionRow> rows = OutputTables.regionRows(maps.specimens().stream().map(Maps.Mapped::specimen).toList());
            CsvTable.write(OutputTables.REGIONS, rows, out.resolve("regions.csv"), force);
            List<Figure> figures = new ArrayList<>();
            for (Maps.Mapped m : maps.specimens()) {
                figures.addAll(MapFigures.of(m.specimen(), m.setup().image(), m.setup().registration(), opacity, atHz,
                        org.viscarta.report.ReportFigures.slug(m.specimen().name())));
            }
            Path dir = out.resolve("figures");
            java.nio.file.Files.createDirectories(dir);
            for (RenderedFigure r : org.viscarta.report.ReportFigures.render(figures)) {
                AtomicOutput.write(dir.resolve(r.stem() + ".png"), force || true, w -> w.write(r.png()));
                AtomicOutput.write(dir.resolve(r.stem() + ".svg"), force || true,
                        w -> w.write(r.svg().getBytes(java.nio.charset.StandardCharsets.UTF_8)));
            }
            o.printf("wrote positions.csv (%d positions), regions.csv (%d regions) and %d figure(s) as PNG and SVG%nin %s%n",
                    points.size(), rows.size(), figures.size(), out);
        }
        o.flush();
        return CommandLine.ExitCode.OK;
    }

    private static void print(PrintWriter o, Maps.Mapped m, double hz) {
        MapAnalysis.Specimen s = m.specimen();
        o.printf(Locale.ROOT, "%s: %d positions, spacing %s µm, at %s Hz%n", s.name(), s.points().size(), Numbers.plain(s.spacingM() * 1e6),
                Numbers.plain(hz));
        if (m.setup().registration() != null) {
            o.println(Format.wrap("  image: " + (m.setup().imageFile() == null ? "(none)" : m.setup().imageFile().getFileName())
                    + "; registration: " + m.setup().registration().describe(), 100, "    "));
        }
        if (m.setup().regions() != null) {
            o.println("  regions: " + m.setup().regions().describe());
            double largest = s.regions().stream().mapToDouble(r -> r.storage()[0]).filter(Double::isFinite).max().orElse(1);
            String[] units = {"Pa", "kPa", "MPa", "GPa"};
            int k = 0;
            while (k < 3 && largest >= Math.pow(1000, k + 1)) {
                k++;
            }
            double scale = Math.pow(1000, k);
            TextTable t = new TextTable("region", "positions", "E′ median [" + units[k] + "]", "E′ IQR [" + units[k] + "]", "letters",
                    "tan δ median", "tan δ IQR", "letters");
            for (MapAnalysis.RegionStat r : s.regions()) {
                t.add(r.region(), Integer.toString(r.n()), Cells.g4(r.storage()[0] / scale), Cells.g4(r.storage()[1] / scale) + "–"
                        + Cells.g4(r.storage()[2] / scale),
                        r.lettersStorage(), Cells.g4(r.tanDelta()[0]), Cells.g4(r.tanDelta()[1]) + "–" + Cells.g4(r.tanDelta()[2]),
                        r.lettersTanDelta());
            }
            t.print(o);
            for (var test : new org.viscarta.compare.DampingComparison.Result[] {s.storageTest(), s.tanDeltaTest()}) {
                if (test != null) {
                    test.statements().forEach(x -> o.println(Format.wrap(x, 100, "  ")));
                }
            }
        }
        if (s.moranStorage() != null) {
            o.println(Format.wrap(String.format(Locale.ROOT, "  spatial autocorrelation (Moran's I, neighbours within %s µm): log E′ "
                    + "I = %.3f (expected %.3f, z = %.1f, p %s)%s", Numbers.plain(s.moranStorage().distanceM() * 1e6), s.moranStorage().i(),
                    s.moranStorage().expected(), s.moranStorage().z(), org.viscarta.compare.DampingComparison.pText(s.moranStorage().p()),
                    s.moranTanDelta() == null ? "" : String.format(Locale.ROOT, "; tan δ I = %.3f (z = %.1f)", s.moranTanDelta().i(),
                            s.moranTanDelta().z())), 100, "    "));
        }
        s.notes().forEach(n -> o.println(Format.wrap("  " + n, 100, "    ")));
        o.println();
    }
}
