package org.viscarta.map;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.viscarta.io.InputException;

/** Which region of the specimen a position lies in: polygons on the stage, or a label image in the registration. */
public interface Regions {

    /** The region at a specimen position [m], or "" when none. */
    String at(double x, double y);

    /** The region names, in the order given. */
    List<String> names();

    /** Where the regions came from, in words. */
    String describe();

    /**
     * Polygons: columns {@code region}, {@code x} and {@code y} (with a length unit), each region's
     * vertices in order; an optional {@code polygon} column lets a region have several. A position on
     * an edge belongs to the polygon (within 1e-12 of its size); where polygons overlap, the first listed wins.
     */
    static Regions polygons(Path file) {
        Map<String, Map<String, List<double[]>>> byRegion = new LinkedHashMap<>();
        try (Reader in = Files.newBufferedReader(file, StandardCharsets.UTF_8);
             CSVParser p = CSVParser.parse(in, Columns.FORMAT)) {
            Columns cols = Columns.of(file, p.getHeaderNames(), "region", "x", "y", "polygon?");
            for (CSVRecord r : p) {
                int line = (int) r.getParser().getCurrentLineNumber();
                String region = cols.text(r, 0, line);
                if (region.isEmpty()) {
                    throw new InputException(file, line, 1, "a vertex without a region name");
                }
                String polygon = cols.has(3) ? cols.text(r, 3, line) : "1";
                byRegion.computeIfAbsent(region, k -> new LinkedHashMap<>()).computeIfAbsent(polygon, k -> new ArrayList<>())
                        .add(new double[] {cols.length(r, 1, line), cols.length(r, 2, line), line});
            }
        } catch (IOException | java.io.UncheckedIOException e) {
            throw new InputException(file, 0, 0, "cannot read the regions (" + e.getMessage() + ")");
        }
        if (byRegion.isEmpty()) {
            throw new InputException(file, 1, 0, "no region vertices in the file");
        }
        List<String> names = new ArrayList<>();
        List<String> owner = new ArrayList<>();
        List<double[][]> polys = new ArrayList<>();
        for (Map.Entry<String, Map<String, List<double[]>>> e : byRegion.entrySet()) {
            names.add(e.getKey());
            for (List<double[]> v : e.getValue().values()) {
                if (v.size() < 3) {
                    throw new InputException(file, (int) v.get(v.size() - 1)[2], 0, "region '" + e.getKey() + "' has a polygon of "
                            + v.size() + " vertices; a polygon needs at least three");
                }
                owner.add(e.getKey());
                polys.add(v.toArray(new double[0][]));
            }
        }
        String described = String.format(Locale.ROOT, "%d region(s) drawn as polygons in %s", names.size(), file.getFileName());
        return new Regions() {
            @Override
            public String at(double x, double y) {
                for (int i = 0; i < polys.size(); i++) {
                    if (contains(polys.get(i), x, y)) {
                        return owner.get(i);
                    }
                }
                return "";
            }

            @Override
            public List<String> names() {
                return List.copyOf(names);
            }

            @Override
            public String describe() {
                return described;
            }
        };
    }

    /**
     * Whether a polygon (vertices {x, y, ...} in order) holds a point: the even–odd rule by a ray
     * cast along +x (Shimrat, Comm. ACM 5 (1962) 434), with points on an edge counted inside.
     */
    static boolean contains(double[][] poly, double x, double y) {
        int n = poly.length;
        double size = 0;
        for (double[] v : poly) {
            size = Math.max(size, Math.max(Math.abs(v[0]), Math.abs(v[1])));
        }
        double tol = 1e-12 * Math.max(size, 1e-30);
        boolean inside = false;
        for (int i = 0, j = n - 1; i < n; j = i++) {
            double xi = poly[i][0];
            double yi = poly[i][1];
            double xj = poly[j][0];
            double yj = poly[j][1];
            // on the edge (i, j)?
            double cross = (x - xi) * (yj - yi) - (y - yi) * (xj - xi);
            if (Math.abs(cross) <= tol * Math.hypot(xj - xi, yj - yi) && x >= Math.min(xi, xj) - tol && x <= Math.max(xi, xj) + tol
                    && y >= Math.min(yi, yj) - tol && y <= Math.max(yi, yj) + tol) {
                return true;
            }
            if ((yi > y) != (yj > y) && x < (xj - xi) * (y - yi) / (yj - yi) + xi) {
                inside = !inside;
            }
        }
        return inside;
    }

    /**
     * A label image in the same registration as the lab's image: each colour a region, named by a
     * legend with columns {@code colour} ("#RRGGBB") and {@code region}; a colour not in the legend is no region.
     */
    static Regions labelImage(Path image, Path legend, Registration registration) {
        BufferedImage img = MapImage.read(image);
        Map<Integer, String> names = new LinkedHashMap<>();
        // a colour row starts with '#' too: only lines that are not "#RRGGBB," are comments here
        List<String> kept = new ArrayList<>();
        List<Integer> lineOf = new ArrayList<>();
        try {
            List<String> lines = Files.readAllLines(legend, StandardCharsets.UTF_8);
            for (int i = 0; i < lines.size(); i++) {
                String l = lines.get(i).strip();
                if (l.isEmpty() || (l.startsWith("#") && !l.matches("#[0-9A-Fa-f]{6}\\s*,.*"))) {
                    continue;
                }
                kept.add(lines.get(i));
                lineOf.add(i + 1);
            }
        } catch (IOException | java.io.UncheckedIOException e) {
            throw new InputException(legend, 0, 0, "cannot read the legend (" + e.getMessage() + ")");
        }
        try (Reader in = new java.io.StringReader(String.join("\n", kept));
             CSVParser p = CSVParser.parse(in, Columns.FORMAT.builder().setCommentMarker(null).get())) {
            Columns cols = Columns.of(legend, p.getHeaderNames(), "colour", "region");
            for (CSVRecord r : p) {
                int line = lineOf.get((int) r.getRecordNumber());
                String c = cols.text(r, 0, line);
                if (!c.matches("#?[0-9A-Fa-f]{6}")) {
                    throw new InputException(legend, line, 1, "'" + c + "' is not a colour; write it as #RRGGBB, e.g. #E69F00");
                }
                String prev = names.put(Integer.parseInt(c.replace("#", ""), 16), cols.text(r, 1, line));
                if (prev != null) {
                    throw new InputException(legend, line, 1, "colour " + c + " is listed twice");
                }
            }
        } catch (IOException | java.io.UncheckedIOException e) {
            throw new InputException(legend, 0, 0, "cannot read the legend (" + e.getMessage() + ")");
        }
        List<String> ordered = names.values().stream().distinct().toList();
        String described = String.format(Locale.ROOT, "%d region(s) from the label image %s (legend %s)", ordered.size(),
                image.getFileName(), legend.getFileName());
        return new Regions() {
            @Override
            public String at(double x, double y) {
                double[] uv = registration.toImage(x, y);
                int u = (int) Math.floor(uv[0]);
                int v = (int) Math.floor(uv[1]);
                if (u < 0 || v < 0 || u >= img.getWidth() || v >= img.getHeight()) {
                    return "";
                }
                return names.getOrDefault(img.getRGB(u, v) & 0xFFFFFF, "");
            }

            @Override
            public List<String> names() {
                return ordered;
            }

            @Override
            public String describe() {
                return described;
            }
        };
    }
}
