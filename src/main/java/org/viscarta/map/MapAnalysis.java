package org.viscarta.map;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

import org.viscarta.compare.DampingComparison;
import org.viscarta.compare.FittedCurve;
import org.viscarta.compare.LossTangentAt;
import org.viscarta.compare.Matcher;
import org.viscarta.compare.ReferenceDistance;
import org.viscarta.compare.ReplicateSummary;
import org.viscarta.fit.FitResult;
import org.viscarta.fit.ModelFitter;
import org.viscarta.fit.ModelSelection;
import org.viscarta.model.ViscoelasticModel;
import org.viscarta.sweep.Numbers;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;

/**
 * Maps of a heterogeneous specimen: E′, E″ and tan δ at one frequency at every measured position
 * (replicates at a position averaged), the region of each, the regions compared, and the spatial
 * autocorrelation that says how far positions are independent measurements.
 */
public final class MapAnalysis {

    private MapAnalysis() {
    }

    /**
     * One position of a specimen.
     *
     * @param specimen        the specimen (the table's sample)
     * @param xM              x [m]
     * @param yM              y [m]
     * @param sweeps          sweeps measured there (averaged)
     * @param storage         E′ at the map frequency [Pa] (geometric mean over the sweeps), NaN when not measured there
     * @param loss            E″ [Pa]
     * @param tanDelta        E″/E′
     * @param region          its region, "" when none
     * @param imageX          its image column [px], NaN without an image
     * @param imageY          its image row [px]
     * @param bestModel       the best-supported model (with --models), "" otherwise
     * @param nearest         the nearest reference (with a library), "" otherwise
     * @param nearestClass    its class
     * @param note            why a value is missing, or "" when none is
     */
    public record Point(String specimen, double xM, double yM, int sweeps, double storage, double loss, double tanDelta, String region,
                        double imageX, double imageY, String bestModel, String nearest, String nearestClass, String note) {
    }

    /**
     * The statistics of one region.
     *
     * @param region   the region's name
     * @param n        positions with a value
     * @param storage  E′ median, first and third quartiles [Pa] (index 0, 1, 2), and the geometric mean with its 95 % interval (3, 4, 5)
     * @param tanDelta tan δ median, quartiles, and the mean with its 95 % interval
     * @param lettersStorage letters of the comparison of log E′ between regions
     * @param lettersTanDelta letters of the comparison of tan δ
     */
    public record RegionStat(String region, int n, double[] storage, double[] tanDelta, String lettersStorage, String lettersTanDelta) {
    }

    /**
     * A mapped specimen.
     *
     * @param name        the specimen
     * @param points      its positions
     * @param regions     per region (empty without regions)
     * @param storageTest the comparison of log E′ between regions, or null
     * @param tanDeltaTest the comparison of tan δ between regions, or null
     * @param moranStorage Moran's I of log E′ over the positions, or null
     * @param moranTanDelta Moran's I of tan δ, or null
     * @param spacingM    the typical distance to the nearest position [m]
     * @param notes       what a reader must know
     */
    public record Specimen(String name, List<Point> points, List<RegionStat> regions, DampingComparison.Result storageTest,
                           DampingComparison.Result tanDeltaTest, MoranI moranStorage, MoranI moranTanDelta, double spacingM,
                           List<String> notes) {
    }

    /**
     * What to compute.
     *
     * @param frequencyHz  the map frequency
     * @param alpha        the significance level of the region comparisons
     * @param registration the image registration, or null
     * @param regions      the regions, or null
     * @param models       candidate models per position (empty: none fitted)
     * @param references   library candidates (empty: no nearest reference); they need models
     * @param distance     the reference distance
     */
    public record Settings(double frequencyHz, double alpha, Registration registration, Regions regions, List<ViscoelasticModel> models,
                           List<Matcher.Candidate> references, ReferenceDistance distance) {
    }

    /** Every specimen's map from its positioned sweeps. */
    public static List<Specimen> of(List<Sweep> positioned, Settings s) {
        Map<String, Map<String, List<Sweep>>> bySpecimen = new LinkedHashMap<>();
        for (Sweep sw : positioned) {
            double[] p = sw.position();
            bySpecimen.computeIfAbsent(sw.sample(), k -> new LinkedHashMap<>()).computeIfAbsent(p[0] + "," + p[1], k -> new ArrayList<>())
                    .add(sw);
        }
        List<Specimen> out = new ArrayList<>();
        for (Map.Entry<String, Map<String, List<Sweep>>> e : bySpecimen.entrySet()) {
            out.add(specimen(e.getKey(), new ArrayList<>(e.getValue().values()), s));
        }
        return out;
    }

    private static Specimen specimen(String name, List<List<Sweep>> positions, Settings s) {
        ModelFitter fitter = new ModelFitter();
        List<Point> points = positions.parallelStream().map(list -> point(name, list, s, fitter)).toList();
        List<String> notes = new ArrayList<>();
        long repeated = positions.stream().filter(l -> l.size() > 1).count();
        if (repeated > 0) {
            notes.add(repeated + " position(s) measured more than once: their sweeps are averaged (geometric mean of E′ and E″)");
        }
        long missing = points.stream().filter(p -> Double.isNaN(p.tanDelta())).count();
        if (missing > 0) {
            notes.add(String.format(Locale.ROOT, "%d position(s) not measured at %s Hz: left blank in the maps", missing,
                    Numbers.plain(s.frequencyHz())));
        }
        double spacing = spacing(points);
        List<Point> valued = points.stream().filter(p -> !Double.isNaN(p.tanDelta())).toList();
        double[] xs = valued.stream().mapToDouble(Point::xM).toArray();
        double[] ys = valued.stream().mapToDouble(Point::yM).toArray();
        MoranI moranE = MoranI.of(valued.stream().mapToDouble(p -> Math.log10(p.storage())).toArray(), xs, ys, 1.5 * spacing);
        MoranI moranT = MoranI.of(valued.stream().mapToDouble(Point::tanDelta).toArray(), xs, ys, 1.5 * spacing);
        List<RegionStat> stats = new ArrayList<>();
        DampingComparison.Result testE = null;
        DampingComparison.Result testT = null;
        if (s.regions() != null) {
            Map<String, List<Point>> byRegion = new LinkedHashMap<>();
            for (String r : s.regions().names()) {
                byRegion.put(r, new ArrayList<>());
            }
            long outside = 0;
            for (Point p : valued) {
                if (p.region().isEmpty()) {
                    outside++;
                } else {
                    byRegion.computeIfAbsent(p.region(), k -> new ArrayList<>()).add(p);
                }
            }
            if (outside > 0) {
                notes.add(outside + " position(s) lie in no region and are left out of the region statistics");
            }
            List<String> names = byRegion.entrySet().stream().filter(x -> x.getValue().size() >= 1).map(Map.Entry::getKey).toList();
            Comparison ce = letters(names, byRegion, p -> Math.log10(p.storage()), s.alpha(),
                    new DampingComparison.Wording("log10 E′", "is stiffer than", "Every region differs in stiffness from every other.",
                            "Regions", "the regions' positions", "regions"));
            Comparison ct = letters(names, byRegion, Point::tanDelta, s.alpha(), new DampingComparison.Wording("tan δ", "damps more than",
                    "Every region damps differently from every other.", "Regions", "the regions' positions", "regions"));
            Map<String, String> lettersE = ce.letters();
            Map<String, String> lettersT = ct.letters();
            testE = ce.result();
            testT = ct.result();
            for (String r : byRegion.keySet()) {
                List<Point> ps = byRegion.get(r);
                stats.add(new RegionStat(r, ps.size(), summary(ps.stream().mapToDouble(Point::storage).toArray(), true),
                        summary(ps.stream().mapToDouble(Point::tanDelta).toArray(), false), lettersE.getOrDefault(r, ""),
                        lettersT.getOrDefault(r, "")));
            }
            if (moranE != null && moranE.p() < s.alpha()) {
                notes.add(String.format(Locale.ROOT, "Neighbouring positions resemble each other (Moran's I of log E′ = %.2f, z = %.1f; "
                        + "of tan δ = %s): positions are not independent measurements, so the region comparisons, which treat them as "
                        + "if they were, overstate how sure the differences are. Read the letters as a description of this specimen; "
                        + "to generalise, compare regions over several specimens.", moranE.i(), moranE.z(),
                        moranT == null ? "–" : String.format(Locale.ROOT, "%.2f", moranT.i())));
            }
        }
        return new Specimen(name, points, stats, testE, testT, moranE, moranT, spacing, notes);
    }

    /** A comparison between regions and each region's letters. */
    private record Comparison(Map<String, String> letters, DampingComparison.Result result) {
    }

    private static Comparison letters(List<String> names, Map<String, List<Point>> byRegion,
                                               java.util.function.ToDoubleFunction<Point> value, double alpha,
                                               DampingComparison.Wording wording) {
        List<String> eligible = names.stream().filter(n -> byRegion.get(n).size() >= 1).sorted(Comparator.comparingDouble(
                (String n) -> -byRegion.get(n).stream().mapToDouble(value).average().orElse(0))).toList();
        if (eligible.size() < 2) {
            return new Comparison(Map.of(), null);
        }
        List<double[]> values = new ArrayList<>();
        for (String n : eligible) {
            values.add(byRegion.get(n).stream().mapToDouble(value).toArray());
        }
        DampingComparison.Result r = DampingComparison.compare(eligible, eligible, values, alpha, wording);
        Map<String, String> out = new LinkedHashMap<>();
        for (int i = 0; i < eligible.size(); i++) {
            out.put(eligible.get(i), r.letters().get(i));
        }
        return new Comparison(out, r);
    }

    /** Median, quartiles, and the mean with its 95 % interval (of log10 for moduli, given back in Pa). */
    static double[] summary(double[] v, boolean logarithmic) {
        if (v.length == 0) {
            return new double[] {Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN};
        }
        double[] sorted = v.clone();
        Arrays.sort(sorted);
        double[] q = {quantile(sorted, 0.5), quantile(sorted, 0.25), quantile(sorted, 0.75)};
        double[] w = logarithmic ? Arrays.stream(v).map(Math::log10).toArray() : v;
        ReplicateSummary rs = ReplicateSummary.of(w);
        double[] m = {rs.mean(), rs.ci95Low(), rs.ci95High()};
        if (logarithmic) {
            for (int i = 0; i < 3; i++) {
                m[i] = Math.pow(10, m[i]);
            }
        }
        return new double[] {q[0], q[1], q[2], m[0], m[1], m[2]};
    }

    /** The quantile by linear interpolation between order statistics (Hyndman and Fan 1996, definition 7, as R and numpy default). */
    static double quantile(double[] sorted, double p) {
        double h = (sorted.length - 1) * p;
        int lo = (int) Math.floor(h);
        int hi = Math.min(lo + 1, sorted.length - 1);
        return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
    }

    /** The median distance from each position to its nearest neighbour [m]. */
    static double spacing(List<Point> points) {
        int n = points.size();
        if (n < 2) {
            return Double.NaN;
        }
        double[] xs = points.stream().mapToDouble(Point::xM).toArray();
        double[] ys = points.stream().mapToDouble(Point::yM).toArray();
        Integer[] order = new Integer[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        Arrays.sort(order, Comparator.comparingDouble(i -> xs[i]));
        double[] nearest = new double[n];
        for (int a = 0; a < n; a++) {
            int i = order[a];
            double best = Double.POSITIVE_INFINITY;
            // outwards along x in both directions, until the x gap alone exceeds the nearest found
            for (int step : new int[] {1, -1}) {
                for (int b = a + step; b >= 0 && b < n; b += step) {
                    int j = order[b];
                    double dx = Math.abs(xs[j] - xs[i]);
                    if (dx >= best) {
                        break;
                    }
                    best = Math.min(best, Math.hypot(dx, ys[j] - ys[i]));
                }
            }
            nearest[i] = best;
        }
        double[] finite = Arrays.stream(nearest).filter(Double::isFinite).sorted().toArray();
        return finite.length == 0 ? Double.NaN : quantile(finite, 0.5);
    }

    private static Point point(String specimen, List<Sweep> sweeps, Settings s, ModelFitter fitter) {
        double[] pos = sweeps.get(0).position();
        double logE1 = 0;
        double logE2 = 0;
        int n = 0;
        List<SweepPoint> pooled = new ArrayList<>();
        for (Sweep sw : sweeps) {
            pooled.addAll(sw.fittablePoints());
            Optional<LossTangentAt.Value> v = LossTangentAt.interpolate(sw.fittablePoints(), s.frequencyHz());
            if (v.isPresent()) {
                logE1 += Math.log(v.get().storage());
                logE2 += Math.log(v.get().loss());
                n++;
            }
        }
        double storage = n == 0 ? Double.NaN : Math.exp(logE1 / n);
        double loss = n == 0 ? Double.NaN : Math.exp(logE2 / n);
        String region = s.regions() == null ? "" : s.regions().at(pos[0], pos[1]);
        double[] uv = s.registration() == null ? new double[] {Double.NaN, Double.NaN} : s.registration().toImage(pos[0], pos[1]);
        String best = "";
        String nearest = "";
        String nearestClass = "";
        if (!s.models().isEmpty() && !pooled.isEmpty()) {
            pooled.sort(Comparator.comparingDouble(SweepPoint::frequencyHz));
            List<FitResult> fits = new ArrayList<>();
            for (ViscoelasticModel m : s.models()) {
                fits.add(fitter.fit(specimen, m, pooled));
            }
            Optional<ModelSelection.Ranked> b = ModelSelection.rank(fits).stream().filter(ModelSelection.Ranked::best).findFirst();
            if (b.isPresent()) {
                best = b.get().fit().model();
                double lo = pooled.get(0).frequencyHz();
                double hi = pooled.get(pooled.size() - 1).frequencyHz();
                Optional<FittedCurve> curve = FittedCurve.of(b.get().fit(), lo, hi, sweeps.get(0).temperatureC(), sweeps.get(0).kind());
                if (curve.isPresent() && !s.references().isEmpty()) {
                    List<Matcher.Match> m = Matcher.rank(specimen, curve.get(), s.references(), s.distance());
                    if (!m.isEmpty() && m.get(0).rank() > 0) {
                        nearest = m.get(0).reference();
                        nearestClass = m.get(0).clazz();
                    }
                }
            }
        }
        String note = n == 0 ? String.format(Locale.ROOT, "not measured at %s Hz", Numbers.plain(s.frequencyHz())) : "";
        return new Point(specimen, pos[0], pos[1], sweeps.size(), storage, loss, n == 0 ? Double.NaN : loss / storage, region,
                uv[0], uv[1], best, nearest, nearestClass, note);
    }
}
