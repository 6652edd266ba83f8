package org.viscarta.report;

import java.awt.Graphics2D;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.io.IOException;
import org.jfree.chart.JFreeChart;
import org.jfree.svg.SVGGraphics2D;

/**
 * One figure of the report: a chart, a file stem, a caption, and its renderings as PNG (200 dpi)
 * and SVG. Both renderings are deterministic: the same chart gives the same bytes.
 *
 * @param stem    file name without extension, e.g. {@code tan-delta}
 * @param caption what the figure shows, in a sentence
 * @param chart   the chart
 * @param heightPt its height on the page [points]; the width is always {@value #WIDTH_PT}
 */
public record Figure(String stem, String caption, JFreeChart chart, int heightPt) {

    /** Size on the page: 6.5 × 4.2 inches, unless a figure needs to be taller. */
    static final int WIDTH_PT = 468;
    static final int HEIGHT_PT = 302;

    /** A figure of the usual size. */
    public Figure(String stem, String caption, JFreeChart chart) {
        this(stem, caption, chart, HEIGHT_PT);
    }
    private static final double DPI = 200;

    /**
     * Charts are drawn into PNG one at a time (their PNG encoding and their SVG documents made side
     * by side). Drawn side by side, a figure now and then came out laid out wrongly (a legend's rows nearly
     * three times too tall and the plot squeezed, the same chart's SVG right; two of eight cold demo
     * reports). The cause is in the JDK: text is measured through a shared cache of font "strikes",
     * and the first thread to make a strike publishes its metrics before converting them from
     * device to user space (FileFontStrike.getFontMetrics, OpenJDK 17), so a second thread measuring
     * at that moment keeps values 200/72 times too large. Making every strike first, on one thread,
     * was tried: measuring the fonts alone (SansSerif and Dialog, every style, 6–24 pt, turned as
     * labels are) still let one cold report in thirty draw twelve figures wrongly, and measuring
     * text in every such strike as well cost about 3 s of processor time, more than drawing in
     * parallel saves on two cores. One at a time the same figures come out the same in every run.
     * An SVG is drawn outside the lock: it measures text without a device transform (JFreeSVG's own
     * identity-transform graphics), so its strikes have nothing to convert.
     */
    private static final Object DRAWING = new Object();

    /** PNG at 200 dots per inch: sharp on slides and printed documents at the figure's size; the SVG is for print at any size. */
    public byte[] png() throws IOException {
        double scale = DPI / 72.0;
        int w = (int) Math.round(WIDTH_PT * scale);
        int h = (int) Math.round(heightPt * scale);
        BufferedImage img = new BufferedImage(w, h, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        try {
            g.scale(scale, scale);
            synchronized (DRAWING) {
                chart.draw(g, new Rectangle2D.Double(0, 0, WIDTH_PT, heightPt));
            }
        } finally {
            g.dispose();
        }
        return PngEncoder.encode(img, DPI);
    }

    /** SVG, with definition keys fixed so that two runs write the same text. */
    public String svg() {
        SVGGraphics2D g = new SVGGraphics2D(WIDTH_PT, heightPt);
        g.setDefsKeyPrefix(stem.replaceAll("[^A-Za-z0-9]", "_") + "_");
        g.setGeomDoubleConverter(Figure::hundredths);
        // not under the lock: an SVG measures text without a device transform, so its strikes have nothing to convert
        chart.draw(g, new Rectangle2D.Double(0, 0, WIDTH_PT, heightPt));
        // a viewBox as well as the size, so that a page that sets the width (the report's figures fill
        // their column) scales the drawing instead of leaving it at its natural size in a larger box
        return g.getSVGElement(null, true, new org.jfree.svg.ViewBox(0, 0, WIDTH_PT, heightPt), null, null);
    }

    /**
     * A coordinate of the SVG in points, to the hundredth (3.5 µm on paper, below any printer's dot):
     * the shortest exact decimal of every double, which SVG writers give by default, made the demo's
     * SVG files 2.5 times the size of their PNG files and slower to write and to open.
     */
    static String hundredths(double v) {
        if (!Double.isFinite(v) || Math.abs(v) >= 1e13) {
            return Double.toString(v);
        }
        long c = Math.round(v * 100);
        if (c == 0) {
            return "0";
        }
        StringBuilder b = new StringBuilder(16);
        if (c < 0) {
            b.append('-');
            c = -c;
        }
        b.append(c / 100);
        long f = c % 100;
        if (f != 0) {
            b.append('.').append(f / 10);
            if (f % 10 != 0) {
                b.append(f % 10);
            }
        }
        return b.toString();
    }
}
