package org.viscarta.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Paint;
import java.awt.image.BufferedImage;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.ToDoubleFunction;

import org.jfree.chart.JFreeChart;
import org.jfree.chart.LegendItem;
import org.jfree.chart.LegendItemCollection;
import org.jfree.chart.annotations.XYLineAnnotation;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.axis.CategoryAxis;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.PaintScale;
import org.jfree.chart.renderer.category.BoxAndWhiskerRenderer;
import org.jfree.chart.renderer.xy.XYBlockRenderer;
import org.jfree.chart.title.PaintScaleLegend;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.statistics.DefaultBoxAndWhiskerCategoryDataset;
import org.jfree.data.xy.DefaultXYZDataset;
import org.viscarta.map.MapAnalysis;
import org.viscarta.map.Registration;
import org.viscarta.sweep.Numbers;

/**
 * The figures of a mapped specimen: E′ (log colour scale) and tan δ drawn as one tile per measured
 * position (no interpolation), the nearest reference's class as a categorical map, each with a
 * colour bar and a scale bar, and, when the lab's image is registered, each again over that image;
 * box plots of the regions. Continuous maps use viridis, a perceptually uniform map readable with the
 * common colour-vision deficiencies and in greyscale (its lightness rises monotonically); classes
 * use the Okabe–Ito palette of the other figures.
 */
public final class MapFigures {

    private MapFigures() {
    }

    /** The 256 colours of viridis (van der Walt and Smith 2015), from matplotlib's table. */
    static final Color[] VIRIDIS = table("viridis");

    static Color[] table(String name) {
        List<Color> out = new ArrayList<>();
        try (InputStream in = MapFigures.class.getResourceAsStream("/org/viscarta/map/" + name + ".txt");
             BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
            for (String line = r.readLine(); line != null; line = r.readLine()) {
                if (line.startsWith("#") && line.length() == 7) {
                    out.add(new Color(Integer.parseInt(line.substring(1), 16)));
                }
            }
        } catch (IOException | NullPointerException e) {
            throw new IllegalStateException("the colour table " + name + " is missing from the jar", e);
        }
        return out.toArray(new Color[0]);
    }

    /** A continuous colour scale over [lo, hi], logarithmic or linear, with transparency alpha. */
    private record Scale(double lo, double hi, boolean log, int alpha) implements PaintScale {
        @Override
        public double getLowerBound() {
            return lo;
        }

        @Override
        public double getUpperBound() {
            return hi;
        }

        @Override
        public Paint getPaint(double v) {
            if (Double.isNaN(v)) {
                return new Color(0, 0, 0, 0);
            }
            double t = log ? Math.log(v / lo) / Math.log(hi / lo) : (v - lo) / (hi - lo);
            if (!(hi > lo)) {
                t = 0.5;
            }
            Color c = VIRIDIS[(int) Math.round(Math.max(0, Math.min(1, t)) * (VIRIDIS.length - 1))];
            return alpha == 255 ? c : new Color(c.getRed(), c.getGreen(), c.getBlue(), alpha);
        }
    }

    /** A categorical scale: index → Okabe–Ito colour. */
    private record Classes(int n, int alpha) implements PaintScale {
        @Override
        public double getLowerBound() {
            return 0;
        }

        @Override
        public double getUpperBound() {
            return Math.max(1, n - 1);
        }

        @Override
        public Paint getPaint(double v) {
            if (Double.isNaN(v)) {
                return new Color(0, 0, 0, 0);
            }
            Color c = Palette.colour((int) Math.round(v));
            return new Color(c.getRed(), c.getGreen(), c.getBlue(), alpha);
        }
    }

    /**
     * The maps of one specimen.
     *
     * @param image        the registered image, or null
     * @param registration its registration, or null
     * @param opacity      the tiles' opacity over the image, in (0, 1]
     * @param frequencyHz  the map frequency
     * @param slug         the specimen's file-name part
     */
    public static List<Figure> of(MapAnalysis.Specimen s, BufferedImage image, Registration registration, double opacity,
                                  double frequencyHz, String slug) {
        List<MapAnalysis.Point> pts = s.points().stream().filter(p -> !Double.isNaN(p.tanDelta())).toList();
        List<Figure> out = new ArrayList<>();
        if (pts.isEmpty()) {
            return out;
        }
        String f = Numbers.plain(frequencyHz) + " Hz";
        out.add(continuous(s, pts, MapAnalysis.Point::storage, true, "storage modulus E′ at " + f, "E′ [Pa]", null, null, 1, slug,
                "map-storage-"));
        out.add(continuous(s, pts, MapAnalysis.Point::tanDelta, false, "loss tangent tan δ at " + f, "tan δ [–]", null, null, 1, slug,
                "map-tan-delta-"));
        boolean classes = pts.stream().anyMatch(p -> !p.nearestClass().isEmpty());
        if (classes) {
            out.add(categorical(s, pts, null, null, 1, slug));
        }
        if (image != null && registration != null) {
            out.add(continuous(s, pts, MapAnalysis.Point::storage, true, "storage modulus E′ at " + f + " over the image", "E′ [Pa]",
                    image, registration, opacity, slug, "overlay-storage-"));
            out.add(continuous(s, pts, MapAnalysis.Point::tanDelta, false, "loss tangent tan δ at " + f + " over the image", "tan δ [–]",
                    image, registration, opacity, slug, "overlay-tan-delta-"));
            if (classes) {
                out.add(categorical(s, pts, image, registration, opacity, slug));
            }
        }
        if (!s.regions().isEmpty()) {
            out.add(boxes(s, true, f, slug));
            out.add(boxes(s, false, f, slug));
        }
        return out;
    }

    private static Figure continuous(MapAnalysis.Specimen s, List<MapAnalysis.Point> pts, ToDoubleFunction<MapAnalysis.Point> value,
                                     boolean log, String what, String unitLabel, BufferedImage image, Registration reg, double opacity,
                                     String slug, String prefix) {
        double lo = pts.stream().mapToDouble(value).min().orElseThrow();
        double hi = pts.stream().mapToDouble(value).max().orElseThrow();
        if (!(hi > lo)) {
            // every position the same value: a scale either side of it (a factor of two on a logarithmic
            // one, which then has round ticks; 5 % on a linear one), the tiles in its middle colour
            // (a scale of no length cannot be drawn)
            double d = log ? 0 : Math.max(Math.abs(lo) * 0.05, 1e-12);
            lo = log ? lo / 2 : lo - d;
            hi = log ? hi * 2 : hi + d;
        }
        Scale scale = new Scale(lo, hi, log, image == null ? 255 : (int) Math.round(255 * opacity));
        XYPlot plot = tiles(s, pts, value, scale, image, reg);
        JFreeChart c = new JFreeChart(s.name() + ": " + what, Palette.TITLE, plot, false);
        ValueAxis axis;
        if (log) {
            LogAxis la = new Figures.ReadableLogAxis(unitLabel);
            Figures.inModulusUnit(la, "E′", hi);
            axis = la;
        } else {
            axis = new NumberAxis(unitLabel);
        }
        axis.setRange(lo, hi);
        axis.setLabelFont(Palette.LABEL);
        axis.setTickLabelFont(Palette.TICK);
        PaintScaleLegend bar = new PaintScaleLegend(new Scale(lo, hi, log, 255), axis);
        bar.setPosition(RectangleEdge.RIGHT);
        bar.setStripWidth(12);
        bar.setSubdivisionCount(256);
        // top and bottom margins hold half a tick label, whose text is centred on the scale's ends
        bar.setMargin(new RectangleInsets(8, 8, 10, 4));
        bar.setBackgroundPaint(Color.WHITE);
        c.addSubtitle(bar);
        c.setBackgroundPaint(Color.WHITE);
        String caption = String.format(Locale.ROOT, "%s of specimen %s: one tile per measured position (%d positions, spacing %s µm; "
                + "no interpolation between them), viridis colour scale%s, %s.%s", capital(what), s.name(), pts.size(),
                Numbers.plain(s.spacingM() * 1e6), log ? " on a logarithmic axis" : "", "with a scale bar",
                image == null ? "" : " Tiles at " + Math.round(100 * opacity) + " % opacity over the lab's image, registered by "
                        + reg.describe() + ".");
        return new Figure(prefix + slug, caption, c, 360);
    }

    private static Figure categorical(MapAnalysis.Specimen s, List<MapAnalysis.Point> pts, BufferedImage image, Registration reg,
                                      double opacity, String slug) {
        Map<String, Integer> index = new LinkedHashMap<>();
        for (MapAnalysis.Point p : pts) {
            if (!p.nearestClass().isEmpty()) {
                index.putIfAbsent(p.nearestClass(), index.size());
            }
        }
        Classes scale = new Classes(index.size(), image == null ? 255 : (int) Math.round(255 * opacity));
        XYPlot plot = tiles(s, pts, p -> p.nearestClass().isEmpty() ? Double.NaN : index.get(p.nearestClass()), scale, image, reg);
        LegendItemCollection items = new LegendItemCollection();
        for (Map.Entry<String, Integer> e : index.entrySet()) {
            items.add(new LegendItem(e.getKey(), Palette.colour(e.getValue())));
        }
        plot.setFixedLegendItems(items);
        JFreeChart c = new JFreeChart(s.name() + ": class of the nearest reference material" + (image == null ? "" : " over the image"),
                Palette.TITLE, plot, true);
        c.getLegend().setItemFont(Palette.TICK);
        c.setBackgroundPaint(Color.WHITE);
        return new Figure((image == null ? "map-class-" : "overlay-class-") + slug, "The class of the nearest reference material at "
                + "each position of specimen " + s.name() + " (Okabe–Ito colours, one tile per position); a position's nearest "
                + "reference comes from its best-supported model's curve.", c, 360);
    }

    /**
     * Translucent tiles (over an image) filled, centred on their positions, without an outline and
     * without antialiasing; opaque ones as JFreeChart draws them.
     * JFreeChart's block renderer also strokes each block's outline in its colour (so that opaque
     * blocks leave no gaps); in translucent tiles over an image those outlines overlap the fill
     * and one another, and showed as a grid of lighter lines. Antialiased edges would leave the
     * pixels along a shared edge partly uncovered, showing the image through as faint seams.
     * Filled by pixel centres, tiles that share an edge share no pixel and leave none out.
     */
    private static final class SeamlessBlocks extends XYBlockRenderer {
        private static final long serialVersionUID = 1L;

        @Override
        public void drawItem(java.awt.Graphics2D g2, org.jfree.chart.renderer.xy.XYItemRendererState state,
                             java.awt.geom.Rectangle2D dataArea, org.jfree.chart.plot.PlotRenderingInfo info, XYPlot plot,
                             org.jfree.chart.axis.ValueAxis domainAxis, org.jfree.chart.axis.ValueAxis rangeAxis,
                             org.jfree.data.xy.XYDataset dataset, int series, int item,
                             org.jfree.chart.plot.CrosshairState crosshairState, int pass) {
            double x = dataset.getXValue(series, item);
            double y = dataset.getYValue(series, item);
            double z = dataset instanceof org.jfree.data.xy.XYZDataset d ? d.getZValue(series, item) : 0;
            java.awt.Paint paint = getPaintScale().getPaint(z);
            if (!(paint instanceof Color c) || c.getAlpha() == 255) {
                // opaque tiles as JFreeChart draws them: their outlines also close the hairline gaps
                // between positions a little further apart than the tile size
                super.drawItem(g2, state, dataArea, info, plot, domainAxis, rangeAxis, dataset, series, item, crosshairState, pass);
                return;
            }
            double w = getBlockWidth();
            double h = getBlockHeight();
            // the block anchor is the centre (set where the renderer is made)
            double x0 = domainAxis.valueToJava2D(x - w / 2, dataArea, plot.getDomainAxisEdge());
            double x1 = domainAxis.valueToJava2D(x + w / 2, dataArea, plot.getDomainAxisEdge());
            double y0 = rangeAxis.valueToJava2D(y - h / 2, dataArea, plot.getRangeAxisEdge());
            double y1 = rangeAxis.valueToJava2D(y + h / 2, dataArea, plot.getRangeAxisEdge());
            withoutAntialiasing(g2, () -> {
                g2.setPaint(paint);
                g2.fill(new java.awt.geom.Rectangle2D.Double(Math.min(x0, x1), Math.min(y0, y1), Math.abs(x1 - x0), Math.abs(y1 - y0)));
            });
        }
    }

    /** Draws with antialiasing off, then sets the hint back as it was. */
    private static void withoutAntialiasing(java.awt.Graphics2D g2, Runnable draw) {
        Object aa = g2.getRenderingHint(java.awt.RenderingHints.KEY_ANTIALIASING);
        g2.setRenderingHint(java.awt.RenderingHints.KEY_ANTIALIASING, java.awt.RenderingHints.VALUE_ANTIALIAS_OFF);
        try {
            draw.run();
        } finally {
            g2.setRenderingHint(java.awt.RenderingHints.KEY_ANTIALIASING, aa);
        }
    }

    /** A tile drawn as the quadrilateral it covers in the image, filled as {@link SeamlessBlocks} fills. */
    private static final class SeamlessTile extends org.jfree.chart.annotations.XYPolygonAnnotation {
        private static final long serialVersionUID = 1L;

        SeamlessTile(double[] corners, java.awt.Paint fill) {
            super(corners, null, null, fill);
        }

        @Override
        public void draw(java.awt.Graphics2D g2, XYPlot plot, java.awt.geom.Rectangle2D dataArea,
                         org.jfree.chart.axis.ValueAxis domainAxis, org.jfree.chart.axis.ValueAxis rangeAxis, int rendererIndex,
                         org.jfree.chart.plot.PlotRenderingInfo info) {
            withoutAntialiasing(g2, () -> super.draw(g2, plot, dataArea, domainAxis, rangeAxis, rendererIndex, info));
        }
    }

    /** Tiles at the positions: in µm without an image, in the image's pixels over it with one. */
    private static XYPlot tiles(MapAnalysis.Specimen s, List<MapAnalysis.Point> pts, ToDoubleFunction<MapAnalysis.Point> value,
                                PaintScale scale, BufferedImage image, Registration reg) {
        double[][] data = new double[3][pts.size()];
        for (int i = 0; i < pts.size(); i++) {
            MapAnalysis.Point p = pts.get(i);
            data[0][i] = image == null ? p.xM() * 1e6 : p.imageX();
            data[1][i] = image == null ? p.yM() * 1e6 : p.imageY();
            data[2][i] = value.applyAsDouble(p);
        }
        DefaultXYZDataset ds = new DefaultXYZDataset();
        ds.addSeries("values", data);
        XYBlockRenderer r = new SeamlessBlocks();
        double side = image == null ? s.spacingM() * 1e6 : s.spacingM() / reg.pixelSizeM();
        if (!(side > 0) || Double.isInfinite(side)) {
            side = 1;
        }
        r.setBlockWidth(side);
        r.setBlockHeight(side);
        r.setBlockAnchor(org.jfree.chart.ui.RectangleAnchor.CENTER);
        r.setPaintScale(scale);
        NumberAxis x = new NumberAxis(image == null ? "x [µm]" : "image column [px]");
        NumberAxis y = new NumberAxis(image == null ? "y [µm]" : "image row [px]");
        y.setInverted(true); // rows down, as the image shows them
        for (NumberAxis a : List.of(x, y)) {
            a.setLabelFont(Palette.LABEL);
            a.setTickLabelFont(Palette.TICK);
            a.setAutoRangeIncludesZero(false);
        }
        XYPlot plot = new XYPlot(ds, x, y, r);
        if (image != null && (Math.abs(reg.b()) > 1e-9 * Math.abs(reg.a()) || Math.abs(reg.d()) > 1e-9 * Math.abs(reg.e()))) {
            // the stage is rotated (or sheared) against the image: each tile drawn as the quadrilateral it covers there
            XYBlockRenderer none = new XYBlockRenderer();
            none.setPaintScale(new Classes(1, 0));
            plot.setRenderer(none);
            double half = s.spacingM() / 2;
            double[][] corners = {{-half, -half}, {half, -half}, {half, half}, {-half, half}};
            for (int i = 0; i < pts.size(); i++) {
                MapAnalysis.Point p = pts.get(i);
                double[] c = new double[8];
                for (int k = 0; k < 4; k++) {
                    double[] uv = reg.toImage(p.xM() + corners[k][0], p.yM() + corners[k][1]);
                    c[2 * k] = uv[0];
                    c[2 * k + 1] = uv[1];
                }
                plot.addAnnotation(new SeamlessTile(c, scale.getPaint(data[2][i])), false);
            }
        }
        plot.setBackgroundPaint(Color.WHITE);
        plot.setDomainGridlinesVisible(false);
        plot.setRangeGridlinesVisible(false);
        double barLengthUm;
        double xmin;
        double xmax;
        double ymin;
        double ymax;
        if (image != null) {
            x.setRange(0, image.getWidth());
            y.setRange(0, image.getHeight());
            plot.setBackgroundImage(image);
            plot.setBackgroundImageAlpha(1f);
            xmin = 0;
            xmax = image.getWidth();
            ymin = 0;
            ymax = image.getHeight();
        } else {
            xmin = min(data[0]) - side;
            xmax = max(data[0]) + side;
            ymin = min(data[1]) - side;
            ymax = max(data[1]) + side;
            x.setRange(xmin, xmax);
            y.setRange(ymin, ymax);
        }
        double unitsPerUm = image == null ? 1 : 1e-6 / reg.pixelSizeM();
        barLengthUm = niceLength((xmax - xmin) / unitsPerUm / 5);
        double x0 = xmin + 0.05 * (xmax - xmin);
        double y0 = ymax - 0.06 * (ymax - ymin);
        double x1 = x0 + barLengthUm * unitsPerUm;
        Color ink = image == null ? Color.BLACK : Color.WHITE;
        plot.addAnnotation(new XYLineAnnotation(x0, y0, x1, y0, new BasicStroke(3f), ink), false);
        XYTextAnnotation label = new XYTextAnnotation(Numbers.plain(barLengthUm) + " µm", (x0 + x1) / 2, y0 - 0.025 * (ymax - ymin));
        label.setFont(new Font("SansSerif", Font.BOLD, 10));
        label.setPaint(ink);
        label.setTextAnchor(TextAnchor.BOTTOM_CENTER);
        plot.addAnnotation(label, false);
        return plot;
    }

    private static Figure boxes(MapAnalysis.Specimen s, boolean storage, String f, String slug) {
        DefaultBoxAndWhiskerCategoryDataset ds = new DefaultBoxAndWhiskerCategoryDataset();
        for (MapAnalysis.RegionStat r : s.regions()) {
            List<Double> v = s.points().stream().filter(p -> p.region().equals(r.region()) && !Double.isNaN(p.tanDelta()))
                    .map(p -> storage ? p.storage() : p.tanDelta()).toList();
            if (!v.isEmpty()) {
                ds.add(v, storage ? "E′" : "tan δ", r.region() + " (" + (storage ? r.lettersStorage() : r.lettersTanDelta()) + ")");
            }
        }
        CategoryAxis cat = new CategoryAxis("region (letters: regions sharing one are not distinguishable)");
        cat.setLabelFont(Palette.LABEL);
        cat.setTickLabelFont(Palette.TICK);
        ValueAxis val;
        if (storage) {
            LogAxis la = new Figures.ReadableLogAxis("E′");
            Figures.inModulusUnit(la, "storage modulus E′ at " + f, s.regions().stream().mapToDouble(r -> r.storage()[2])
                    .filter(Double::isFinite).max().orElse(1));
            val = la;
        } else {
            val = new NumberAxis("loss tangent tan δ at " + f + " [–]");
        }
        val.setLabelFont(Palette.LABEL);
        val.setTickLabelFont(Palette.TICK);
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (MapAnalysis.Point p : s.points()) {
            if (!p.region().isEmpty() && !Double.isNaN(p.tanDelta())) {
                double v = storage ? p.storage() : p.tanDelta();
                lo = Math.min(lo, v);
                hi = Math.max(hi, v);
            }
        }
        if (hi > lo) {
            // every position in view, outliers included
            val.setRange(storage ? lo / 1.15 : lo - 0.08 * (hi - lo), storage ? hi * 1.15 : hi + 0.08 * (hi - lo));
        }
        BoxAndWhiskerRenderer r = new BoxAndWhiskerRenderer();
        r.setMaximumBarWidth(0.12);
        r.setSeriesPaint(0, Palette.colour(storage ? 0 : 1));
        r.setMeanVisible(false);
        // JFreeChart draws outliers as large circles far from their values: left out, and said so in the caption
        r.setMaxOutlierVisible(false);
        r.setMinOutlierVisible(false);
        CategoryPlot plot = new CategoryPlot(ds, cat, val, r);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setRangeGridlinePaint(new Color(0xDDDDDD));
        JFreeChart c = new JFreeChart(s.name() + ": " + (storage ? "E′" : "tan δ") + " by region", Palette.TITLE, plot, false);
        c.setBackgroundPaint(Color.WHITE);
        return new Figure((storage ? "regions-storage-" : "regions-tan-delta-") + slug, "Box plots of " + (storage ? "E′" : "tan δ")
                + " at " + f + " over the positions of each region of specimen " + s.name() + " (box: quartiles, line: median, "
                + "whiskers: the furthest positions within 1.5 × the interquartile range; positions beyond them are not drawn, the "
                + "Positions sheet lists every one), with each region's letters from Welch t-tests between regions with Holm's "
                + "adjustment" + (storage ? " on log E′" : "") + "; neighbouring positions are not independent (see Moran's I).", c, 300);
    }

    private static double min(double[] v) {
        double m = Double.POSITIVE_INFINITY;
        for (double x : v) {
            m = Math.min(m, x);
        }
        return m;
    }

    private static double max(double[] v) {
        double m = Double.NEGATIVE_INFINITY;
        for (double x : v) {
            m = Math.max(m, x);
        }
        return m;
    }

    /** 1, 2 or 5 × a power of ten, at most the given length. */
    static double niceLength(double at) {
        double p = Math.pow(10, Math.floor(Math.log10(at)));
        for (double m : new double[] {5, 2, 1}) {
            if (m * p <= at) {
                return m * p;
            }
        }
        return p;
    }

    private static String capital(String s) {
        return s.isEmpty() ? s : Character.toUpperCase(s.charAt(0)) + s.substring(1);
    }
}
