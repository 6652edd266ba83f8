package org.viscarta.raw;

import java.util.Locale;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/** Numbers with units in raw-signal metadata, to SI. */
final class Units {

    private static final Pattern VALUE = Pattern.compile("^\\s*([+-]?[0-9.]+(?:[eE][+-]?\\d+)?)\\s*(.*?)\\s*$");

    private Units() {
    }

    private static double[] parse(Map<String, String> meta, String key) {
        String v = meta.get(key);
        if (v == null) {
            throw new IllegalArgumentException("the geometry needs '" + key + ": ...'");
        }
        Matcher m = VALUE.matcher(v);
        if (!m.matches()) {
            throw new IllegalArgumentException("'" + key + ": " + v + "' is not a number with a unit");
        }
        return new double[] {Double.parseDouble(m.group(1)), 0};
    }

    private static String unit(Map<String, String> meta, String key) {
        Matcher m = VALUE.matcher(meta.get(key));
        m.matches();
        return m.group(2);
    }

    static double number(Map<String, String> meta, String key) {
        return parse(meta, key)[0];
    }

    static double length(Map<String, String> meta, String key) {
        double v = parse(meta, key)[0];
        return v * lengthFactor(unit(meta, key), key);
    }

    static double lengthFactor(String u, String key) {
        switch (u) {
            case "m": return 1;
            case "mm": return 1e-3;
            case "µm": case "μm": case "um": return 1e-6;
            case "nm": return 1e-9;
            default: throw new IllegalArgumentException("'" + key + "' needs a length unit (m, mm, µm, nm), not '" + u + "'");
        }
    }

    static double area(Map<String, String> meta, String key) {
        double v = parse(meta, key)[0];
        String u = unit(meta, key);
        switch (u) {
            case "m²": case "m2": return v;
            case "cm²": case "cm2": return v * 1e-4;
            case "mm²": case "mm2": return v * 1e-6;
            case "µm²": case "μm²": case "um2": return v * 1e-12;
            default: throw new IllegalArgumentException("'" + key + "' needs an area unit (m², cm², mm², µm²), not '" + u + "'");
        }
    }

    static double angle(Map<String, String> meta, String key) {
        double v = parse(meta, key)[0];
        String u = unit(meta, key).toLowerCase(Locale.ROOT);
        switch (u) {
            case "deg": case "°": case "degree": case "degrees": return Math.toRadians(v);
            case "rad": return v;
            default: throw new IllegalArgumentException("'" + key + "' needs an angle unit (deg, rad), not '" + u + "'");
        }
    }

    /** A stiffness in N/m (also mN/m). */
    static double stiffness(Map<String, String> meta, String key) {
        double v = parse(meta, key)[0];
        String u = unit(meta, key);
        switch (u) {
            case "N/m": return v;
            case "mN/m": return v * 1e-3;
            default: throw new IllegalArgumentException("'" + key + "' needs N/m, not '" + u + "'");
        }
    }

    /** A drag coefficient in N·s/m. */
    static double drag(Map<String, String> meta, String key) {
        double v = parse(meta, key)[0];
        String u = unit(meta, key);
        switch (u) {
            case "N·s/m": case "N s/m": case "Ns/m": case "N*s/m": return v;
            default: throw new IllegalArgumentException("'" + key + "' needs N·s/m, not '" + u + "'");
        }
    }
}
