package org.viscarta.quality;

import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.viscarta.sweep.Quantity;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.Unit;

/**
 * Substrate influence on a thin film: the indentation depth against the film's thickness, held to
 * the common rule of thumb that the depth stay under a tenth of the thickness (common practice in
 * nanoindentation of coatings, often attributed to Bückle; a rule of thumb, not a standard, and
 * soft films on hard substrates may need less).
 *
 * <p>The thickness is read from a {@code thickness}, {@code film_thickness} or {@code layer_thickness}
 * line of the preamble or a descriptive column of that name; the depth from {@code indentation_depth}
 * (or {@code depth}), or, for a sphere, from a {@code contact_radius} a and the {@code tip_radius} R
 * as a²/R (Hertz contact).
 */
public final class FilmThickness {

    /** The rule of thumb: depth at most 10 % of the film's thickness. */
    public static final double MAX_RATIO = 0.10;

    private static final String[] THICKNESS = {"thickness", "film_thickness", "layer_thickness"};
    private static final String[] DEPTH = {"indentation_depth", "depth"};

    private FilmThickness() {
    }

    /** The check of one sweep, when it states a thickness and a depth (or a contact radius and tip radius). */
    public static Optional<SweepChecks.Check> of(Sweep s) {
        Optional<Double> h = length(s, THICKNESS);
        if (h.isEmpty()) {
            return Optional.empty();
        }
        Optional<Double> d = length(s, DEPTH);
        String how = "indentation depth";
        if (d.isEmpty()) {
            Optional<Double> a = length(s, new String[] {"contact_radius"});
            Optional<Double> r = length(s, new String[] {"tip_radius"});
            if (a.isPresent() && r.isPresent()) {
                d = Optional.of(a.get() * a.get() / r.get());
                how = "depth a²/R from the contact radius and tip radius";
            }
        }
        if (d.isEmpty()) {
            return Optional.of(new SweepChecks.Check(s.sample(), s.replicate(), "film-thickness", Verdict.WARN, Double.NaN,
                    100 * MAX_RATIO, String.format(Locale.ROOT, "the film is %s thick but the input gives no indentation depth "
                            + "(or contact radius and tip radius): substrate influence cannot be checked", micrometres(h.get()))));
        }
        double ratio = d.get() / h.get();
        boolean ok = ratio <= MAX_RATIO;
        String msg = String.format(Locale.ROOT, "%s %s in a film %s thick: %.1f %% of the thickness%s", how, micrometres(d.get()),
                micrometres(h.get()), 100 * ratio, ok ? " (at most 10 %, the common rule of thumb)"
                        : "; above the common 10 % rule of thumb, the substrate may stiffen the measured moduli — "
                        + "indent less deep or measure a thicker film");
        return Optional.of(new SweepChecks.Check(s.sample(), s.replicate(), "film-thickness", ok ? Verdict.PASS : Verdict.WARN,
                100 * ratio, 100 * MAX_RATIO, msg));
    }

    private static String micrometres(double m) {
        return String.format(Locale.ROOT, "%.3g µm", m * 1e6);
    }

    /** A length from the metadata or a descriptive column (header name, unit in brackets or in the value). */
    static Optional<Double> length(Sweep s, String[] keys) {
        for (String k : keys) {
            String v = s.metadata().get(k);
            if (v != null) {
                return parse(v, "");
            }
        }
        for (Map.Entry<String, String> e : s.attributes().entrySet()) {
            String header = e.getKey().strip();
            String name = header;
            String unit = "";
            int b = header.indexOf('[');
            if (b < 0) {
                b = header.indexOf('(');
            }
            if (b > 0) {
                name = header.substring(0, b).strip();
                unit = header.substring(b + 1).replaceAll("[\\])]\\s*$", "").strip();
            }
            String key = name.toLowerCase(Locale.ROOT).replaceAll("[\\s-]+", "_");
            for (String k : keys) {
                if (key.equals(k)) {
                    return parse(e.getValue(), unit);
                }
            }
        }
        return Optional.empty();
    }

    private static Optional<Double> parse(String value, String unit) {
        try {
            String text = unit.isEmpty() ? value.strip() : value.strip() + " " + unit;
            if (!text.matches(".*[a-zA-Zµμ].*")) {
                return Optional.empty(); // a length without its unit is not guessed
            }
            Unit.Valued v = Unit.parse(text, Quantity.Dimension.LENGTH);
            return v.si() > 0 && Double.isFinite(v.si()) ? Optional.of(v.si()) : Optional.empty();
        } catch (IllegalArgumentException e) {
            return Optional.empty();
        }
    }
}
