package org.viscarta.raw;

import java.util.Locale;
import java.util.Map;
import org.apache.commons.math3.complex.Complex;
import org.viscarta.sweep.ModulusKind;

/**
 * How a contact or specimen turns the complex stiffness k* = F̂/ĥ [N/m] into a complex modulus
 * (DOMAIN.md section 4). Each member names its published source.
 */
public sealed interface Geometry permits Geometry.Sphere, Geometry.FlatPunch, Geometry.Cone, Geometry.Tension, Geometry.PlateShear {

    /** The complex modulus [Pa] from the complex stiffness [N/m]. */
    Complex modulus(Complex kStar);

    /** Tensile (E) or shear (G). */
    ModulusKind kind();

    /** The contact's own second harmonic A₂/A₁ of force for a displacement amplitude, or 0 when it has none. */
    default double contactSecondHarmonic(double displacementAmplitude) {
        return 0;
    }

    /** In words, with dimensions. */
    String describe();

    /**
     * Sphere indentation, linearised Hertz contact (Hertz 1882, J. reine angew. Math. 92:156–171;
     * Johnson 1985, Contact Mechanics) about a static depth h0, correspondence principle:
     * E* = (1 − ν²) k* /(2 sqrt(R h0)). The Hertz force F ∝ h^{3/2} adds a second harmonic
     * A₂/A₁ = ε/8 for h = h0(1 + ε cos ωt) (DOMAIN.md section 4.2), a floor of the contact, not of the material.
     */
    record Sphere(double radius, double staticDepth, double poisson) implements Geometry {
        @Override
        public Complex modulus(Complex k) {
            return k.multiply((1 - poisson * poisson) / (2 * Math.sqrt(radius * staticDepth)));
        }

        @Override
        public ModulusKind kind() {
            return ModulusKind.TENSILE;
        }

        @Override
        public double contactSecondHarmonic(double amplitude) {
            return amplitude / staticDepth / 8;
        }

        @Override
        public String describe() {
            return String.format(Locale.ROOT, "sphere indentation, R = %s, h0 = %s, ν = %.3g (linearised Hertz)", length(radius),
                    length(staticDepth), poisson);
        }
    }

    /**
     * Flat cylindrical punch of radius a (Sneddon 1965, Int. J. Eng. Sci. 3:47–57): E* = (1 − ν²) k* /(2a).
     */
    record FlatPunch(double radius, double poisson) implements Geometry {
        @Override
        public Complex modulus(Complex k) {
            return k.multiply((1 - poisson * poisson) / (2 * radius));
        }

        @Override
        public ModulusKind kind() {
            return ModulusKind.TENSILE;
        }

        @Override
        public String describe() {
            return String.format(Locale.ROOT, "flat punch, a = %s, ν = %.3g (Sneddon)", length(radius), poisson);
        }
    }

    /**
     * Cone of half-angle θ at contact depth h_c, by the general stiffness relation S = β (2/√π) E_r √A
     * (Pharr, Oliver &amp; Brotzen 1992, J. Mater. Res. 7:613–617; Oliver &amp; Pharr 1992, J. Mater. Res.
     * 7:1564–1583) with A = π (h_c tan θ)²: E* = (1 − ν²) √π k* /(2β √A).
     */
    record Cone(double halfAngleRad, double contactDepth, double poisson, double beta) implements Geometry {
        @Override
        public Complex modulus(Complex k) {
            double a = Math.PI * Math.pow(contactDepth * Math.tan(halfAngleRad), 2);
            return k.multiply((1 - poisson * poisson) * Math.sqrt(Math.PI) / (2 * beta * Math.sqrt(a)));
        }

        @Override
        public ModulusKind kind() {
            return ModulusKind.TENSILE;
        }

        @Override
        public String describe() {
            return String.format(Locale.ROOT, "cone, half-angle %.4g°, h_c = %s, ν = %.3g, β = %.3g (Oliver–Pharr)",
                    Math.toDegrees(halfAngleRad), length(contactDepth), poisson, beta);
        }
    }

    /** Tension or compression specimen of length L and cross-section A: E* = k* L/A (DOMAIN.md section 4.3). */
    record Tension(double length, double area) implements Geometry {
        @Override
        public Complex modulus(Complex k) {
            return k.multiply(length / area);
        }

        @Override
        public ModulusKind kind() {
            return ModulusKind.TENSILE;
        }

        @Override
        public String describe() {
            return String.format(Locale.ROOT, "tension/compression, L = %s, A = %.4g m²", Geometry.length(length), area);
        }
    }

    /** A layer of thickness h and area A in simple shear between parallel plates: G* = k* h/A (DOMAIN.md section 4.3). */
    record PlateShear(double gap, double area) implements Geometry {
        @Override
        public Complex modulus(Complex k) {
            return k.multiply(gap / area);
        }

        @Override
        public ModulusKind kind() {
            return ModulusKind.SHEAR;
        }

        @Override
        public String describe() {
            return String.format(Locale.ROOT, "parallel-plate shear, h = %s, A = %.4g m²", length(gap), area);
        }
    }

    /**
     * Reads a geometry from metadata such as {@code geometry: sphere; tip_radius: 50 µm;
     * indentation_depth: 4 µm; poisson_ratio: 0.35}.
     *
     * @throws IllegalArgumentException naming what is missing
     */
    /** A length in the unit people know it by: nm, µm, mm or m, four significant digits. */
    static String length(double metres) {
        double a = Math.abs(metres);
        if (a > 0 && a < 1e-6) {
            return String.format(Locale.ROOT, "%.4g nm", metres * 1e9);
        }
        if (a < 1e-3) {
            return String.format(Locale.ROOT, "%.4g µm", metres * 1e6);
        }
        if (a < 1) {
            return String.format(Locale.ROOT, "%.4g mm", metres * 1e3);
        }
        return String.format(Locale.ROOT, "%.4g m", metres);
    }

    /** A geometry value that must be finite and greater than zero. */
    private static double positive(Map<String, String> meta, String key, double v) {
        if (!(v > 0) || Double.isInfinite(v)) {
            throw new IllegalArgumentException("'" + key + ": " + meta.get(key) + "' must be a finite value greater than zero");
        }
        return v;
    }

    private static double poisson(Map<String, String> meta) {
        double nu = Units.number(meta, "poisson_ratio");
        if (!(nu > -1 && nu <= 0.5)) {
            throw new IllegalArgumentException("'poisson_ratio: " + meta.get("poisson_ratio") + "' must lie in (-1, 0.5]");
        }
        return nu;
    }

    static Geometry from(Map<String, String> meta) {
        String g = meta.get("geometry");
        if (g == null) {
            throw new IllegalArgumentException("no '# geometry:' line; write e.g. '# geometry: sphere; tip_radius: 50 µm; "
                    + "indentation_depth: 4 µm; poisson_ratio: 0.5'");
        }
        switch (g.strip().toLowerCase(Locale.ROOT).replace(' ', '_')) {
            case "sphere":
                return new Sphere(positive(meta, "tip_radius", Units.length(meta, "tip_radius")),
                        positive(meta, "indentation_depth", Units.length(meta, "indentation_depth")), poisson(meta));
            case "flat_punch":
                return new FlatPunch(positive(meta, "punch_radius", Units.length(meta, "punch_radius")), poisson(meta));
            case "cone":
                double half = positive(meta, "half_angle", Units.angle(meta, "half_angle"));
                if (!(half < Math.PI / 2)) {
                    throw new IllegalArgumentException("'half_angle: " + meta.get("half_angle") + "' must lie between 0 and 90°");
                }
                return new Cone(half, positive(meta, "indentation_depth", Units.length(meta, "indentation_depth")), poisson(meta),
                        meta.containsKey("beta") ? positive(meta, "beta", Units.number(meta, "beta")) : 1.0);
            case "tension":
            case "compression":
                return new Tension(positive(meta, "length", Units.length(meta, "length")), positive(meta, "area", Units.area(meta, "area")));
            case "plate_shear":
            case "parallel_plate_shear":
                return new PlateShear(positive(meta, "gap", Units.length(meta, "gap")), positive(meta, "area", Units.area(meta, "area")));
            default:
                throw new IllegalArgumentException("geometry '" + g + "' is not known; use sphere, flat_punch, cone, tension or plate_shear");
        }
    }
}
