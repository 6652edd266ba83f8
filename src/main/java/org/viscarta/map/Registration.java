package org.viscarta.map;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.QRDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.SingularValueDecomposition;
import org.viscarta.io.InputException;
import org.viscarta.sweep.Numbers;

/**
 * Where a specimen position (x, y in metres, as the instrument's stage gives them) lies in the lab's
 * image (column u and row v in pixels, v downward): u = a·x + b·y + c, v = d·x + e·y + f.
 *
 * <p>Given by a pixel size (with the pixel at which the stage's origin lies and the rotation of the
 * stage axes against the image's, counter-clockwise as seen on the image), or fitted to landmarks —
 * positions found both on the stage and in the image: two pairs fix a similarity (scale, rotation,
 * shift), three or more an affine map by least squares, whose residual is reported.
 *
 * @param a          ∂u/∂x [px/m]
 * @param b          ∂u/∂y [px/m]
 * @param c          u at the origin [px]
 * @param d          ∂v/∂x [px/m]
 * @param e          ∂v/∂y [px/m]
 * @param f          v at the origin [px]
 * @param residualPx RMS distance of the landmarks from where the map puts them [px] (0 when given or exact)
 * @param describe   how it was made, in words
 */
public record Registration(double a, double b, double c, double d, double e, double f, double residualPx, String describe) {

    /** The image position {u, v} [px] of a specimen position [m]. */
    public double[] toImage(double x, double y) {
        return new double[] {a * x + b * y + c, d * x + e * y + f};
    }

    /** The specimen position {x, y} [m] of an image position [px]. */
    public double[] toSpecimen(double u, double v) {
        double det = a * e - b * d;
        double du = u - c;
        double dv = v - f;
        return new double[] {(e * du - b * dv) / det, (-d * du + a * dv) / det};
    }

    /** The mean size of a pixel on the specimen [m]: the square root of the area one pixel covers. */
    public double pixelSizeM() {
        return 1 / Math.sqrt(Math.abs(a * e - b * d));
    }

    /** The residual in specimen units [m]. */
    public double residualM() {
        return residualPx * pixelSizeM();
    }

    /**
     * @param pixelSizeM the size of a pixel on the specimen [m]
     * @param originU    the image column of the stage's origin [px]
     * @param originV    the image row of the stage's origin [px]
     * @param rotationDeg the rotation of the stage axes against the image axes [°]
     */
    public static Registration byPixelSize(double pixelSizeM, double originU, double originV, double rotationDeg) {
        if (!(pixelSizeM > 0) || Double.isInfinite(pixelSizeM)) {
            throw new IllegalArgumentException("the pixel size must be a positive length");
        }
        double th = Math.toRadians(rotationDeg);
        double k = 1 / pixelSizeM;
        return new Registration(k * Math.cos(th), -k * Math.sin(th), originU, k * Math.sin(th), k * Math.cos(th), originV, 0,
                String.format(Locale.ROOT, "pixel size %s µm, stage origin at pixel (%s, %s), rotation %s°",
                        Numbers.plain(pixelSizeM * 1e6), Numbers.plain(originU), Numbers.plain(originV), Numbers.plain(rotationDeg)));
    }

    /** A landmark: a position on the stage [m] and in the image [px], with its line in the file. */
    public record Landmark(double x, double y, double u, double v, int line) {
    }

    /** Largest RMS landmark residual accepted, as a fraction of the landmarks' spread in the image (common practice: a few %). */
    static final double MAX_RESIDUAL_FRACTION = 0.02;

    /**
     * Fitted to landmarks.
     *
     * @throws InputException naming the file, for too few, coincident, collinear or inconsistent landmarks
     */
    public static Registration fromLandmarks(List<Landmark> marks, Path file) {
        if (marks.size() < 2) {
            throw new InputException(file, 1, 0, "a registration needs at least two landmarks (positions found both on the stage "
                    + "and in the image); found " + marks.size());
        }
        if (marks.size() == 2) {
            Landmark p = marks.get(0);
            Landmark q = marks.get(1);
            double zx = q.x() - p.x();
            double zy = q.y() - p.y();
            double wx = q.u() - p.u();
            double wy = q.v() - p.v();
            double n = zx * zx + zy * zy;
            if (!(n > 0) || !(wx * wx + wy * wy > 0)) {
                throw new InputException(file, q.line(), 0, "the two landmarks coincide on the stage or in the image; "
                        + "give two landmarks apart");
            }
            // w = s z with s = w / z as complex numbers: a similarity
            double sr = (wx * zx + wy * zy) / n;
            double si = (wy * zx - wx * zy) / n;
            double c = p.u() - (sr * p.x() - si * p.y());
            double f = p.v() - (si * p.x() + sr * p.y());
            return new Registration(sr, -si, c, si, sr, f, 0, String.format(Locale.ROOT, "two landmarks in %s (a similarity: "
                    + "scale, rotation and shift; exact)", file.getFileName()));
        }
        int n = marks.size();
        double mx = marks.stream().mapToDouble(Landmark::x).average().orElseThrow();
        double my = marks.stream().mapToDouble(Landmark::y).average().orElseThrow();
        double[][] centred = new double[n][2];
        for (int i = 0; i < n; i++) {
            centred[i][0] = marks.get(i).x() - mx;
            centred[i][1] = marks.get(i).y() - my;
        }
        double[] sv = new SingularValueDecomposition(new Array2DRowRealMatrix(centred)).getSingularValues();
        if (!(sv[1] > 1e-6 * sv[0])) {
            throw new InputException(file, marks.get(n - 1).line(), 0, "the landmarks lie on one line on the stage, so they fix no "
                    + "rotation or shear; give one off that line (or give only two for a similarity)");
        }
        RealMatrix design = new Array2DRowRealMatrix(n, 3);
        RealMatrix target = new Array2DRowRealMatrix(n, 2);
        for (int i = 0; i < n; i++) {
            Landmark m = marks.get(i);
            design.setRow(i, new double[] {m.x(), m.y(), 1});
            target.setRow(i, new double[] {m.u(), m.v()});
        }
        RealMatrix sol = new QRDecomposition(design).getSolver().solve(target);
        Registration r0 = new Registration(sol.getEntry(0, 0), sol.getEntry(1, 0), sol.getEntry(2, 0), sol.getEntry(0, 1),
                sol.getEntry(1, 1), sol.getEntry(2, 1), 0, "");
        double ss = 0;
        double mu = marks.stream().mapToDouble(Landmark::u).average().orElseThrow();
        double mv = marks.stream().mapToDouble(Landmark::v).average().orElseThrow();
        double spread = 0;
        int worst = 0;
        double worstD = 0;
        for (int i = 0; i < n; i++) {
            Landmark m = marks.get(i);
            double[] uv = r0.toImage(m.x(), m.y());
            double d2 = (uv[0] - m.u()) * (uv[0] - m.u()) + (uv[1] - m.v()) * (uv[1] - m.v());
            ss += d2;
            spread = Math.max(spread, Math.hypot(m.u() - mu, m.v() - mv));
            if (d2 > worstD) {
                worstD = d2;
                worst = i;
            }
        }
        double rms = Math.sqrt(ss / n);
        if (rms > Math.max(1.0, MAX_RESIDUAL_FRACTION * spread)) {
            throw new InputException(file, marks.get(worst).line(), 0, String.format(Locale.ROOT, "the landmarks are inconsistent: "
                    + "no affine map puts them within %.1f px of where the image shows them (RMS %.1f px; the one on this line is "
                    + "%.1f px off); check that each row pairs the same feature", Math.max(1.0, MAX_RESIDUAL_FRACTION * spread), rms,
                    Math.sqrt(worstD)));
        }
        if (r0.a() * r0.e() - r0.b() * r0.d() == 0) {
            throw new InputException(file, 1, 0, "the landmarks give a degenerate map (no area)");
        }
        return new Registration(r0.a(), r0.b(), r0.c(), r0.d(), r0.e(), r0.f(), rms, String.format(Locale.ROOT,
                "%d landmarks in %s (affine, least squares; RMS residual %.2f px = %.2f µm)", n, file.getFileName(), rms,
                rms * r0.pixelSizeM() * 1e6));
    }

    /** Reads landmarks: columns {@code x}, {@code y} with a length unit, {@code image_x}, {@code image_y} in px. */
    public static List<Landmark> readLandmarks(Path file) {
        List<Landmark> out = new ArrayList<>();
        try (Reader in = Files.newBufferedReader(file, StandardCharsets.UTF_8);
             CSVParser p = CSVParser.parse(in, Columns.FORMAT)) {
            Columns cols = Columns.of(file, p.getHeaderNames(), "x", "y", "image_x", "image_y");
            for (CSVRecord r : p) {
                int line = (int) r.getParser().getCurrentLineNumber();
                out.add(new Landmark(cols.length(r, 0, line), cols.length(r, 1, line), cols.number(r, 2, line), cols.number(r, 3, line),
                        line));
            }
        } catch (IOException | java.io.UncheckedIOException e) {
            throw new InputException(file, 0, 0, "cannot read the landmarks (" + e.getMessage() + ")");
        }
        return out;
    }
}
