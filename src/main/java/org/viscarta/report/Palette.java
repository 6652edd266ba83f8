package org.viscarta.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Shape;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;

/**
 * The one palette of every figure: the Okabe–Ito colours, distinguishable by colour-blind readers
 * (Okabe &amp; Ito 2008, "Color Universal Design"), each paired with its own marker shape and dash so
 * that a greyscale print still tells the series apart.
 */
final class Palette {

    private static final Color[] COLOURS = {
        new Color(0x00, 0x72, 0xB2), new Color(0xD5, 0x5E, 0x00), new Color(0x00, 0x9E, 0x73), new Color(0xCC, 0x79, 0xA7),
        new Color(0xE6, 0x9F, 0x00), new Color(0x56, 0xB4, 0xE9), new Color(0x00, 0x00, 0x00)};

    static final Font TITLE = new Font("SansSerif", Font.BOLD, 13);
    static final Font LABEL = new Font("SansSerif", Font.PLAIN, 11);
    static final Font TICK = new Font("SansSerif", Font.PLAIN, 10);

    private Palette() {
    }

    /** How many series one plot can tell apart by colour alone. */
    static int colours() {
        return COLOURS.length;
    }

    static Color colour(int i) {
        return COLOURS[Math.floorMod(i, COLOURS.length)];
    }

    /** A translucent version for confidence bands. */
    static Color band(int i) {
        Color c = colour(i);
        return new Color(c.getRed(), c.getGreen(), c.getBlue(), 60);
    }

    static Shape shape(int i) {
        double s = 7;
        switch (Math.floorMod(i, 6)) {
            case 0:
                return new Ellipse2D.Double(-s / 2, -s / 2, s, s);
            case 1:
                return new Rectangle2D.Double(-s / 2, -s / 2, s, s);
            case 2:
                return triangle(s, false);
            case 3:
                return diamond(s);
            case 4:
                return triangle(s, true);
            default:
                return new Ellipse2D.Double(-s / 3, -s / 3, s / 1.5, s / 1.5);
        }
    }

    static BasicStroke line(int i) {
        float[][] dashes = {null, {6f, 3f}, {2f, 2f}, {8f, 3f, 2f, 3f}};
        float[] d = dashes[Math.floorMod(i, dashes.length)];
        return d == null ? new BasicStroke(1.6f) : new BasicStroke(1.6f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, d, 0f);
    }

    private static Shape triangle(double s, boolean down) {
        Path2D.Double p = new Path2D.Double();
        double h = down ? -s / 2 : s / 2;
        p.moveTo(0, -h);
        p.lineTo(s / 2, h);
        p.lineTo(-s / 2, h);
        p.closePath();
        return p;
    }

    private static Shape diamond(double s) {
        Path2D.Double p = new Path2D.Double();
        p.moveTo(0, -s / 2);
        p.lineTo(s / 2, 0);
        p.lineTo(0, s / 2);
        p.lineTo(-s / 2, 0);
        p.closePath();
        return p;
    }
}
