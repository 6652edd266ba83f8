package org.viscarta.io;

import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.viscarta.sweep.ModulusKind;
import org.viscarta.sweep.Quantity;
import org.viscarta.sweep.Unit;

/**
 * Recognises a column header such as {@code storage_modulus [MPa]}, {@code E' (kPa)} or
 * {@code G″ [Pa]} as a quantity and a unit.
 */
final class HeaderRecognizer {

    private static final Pattern NAME_AND_UNIT = Pattern.compile("^(.*?)\\s*[\\[(]([^\\])]*)[\\])]\\s*$");

    /** Header names (lower case, spaces and hyphens as underscores) and what they mean. */
    private static final Map<String, Named> NAMES = Map.ofEntries(
            Map.entry("frequency", named(Quantity.FREQUENCY, null)),
            Map.entry("f", named(Quantity.FREQUENCY, null)),
            Map.entry("freq", named(Quantity.FREQUENCY, null)),
            Map.entry("angular_frequency", named(Quantity.ANGULAR_FREQUENCY, null)),
            Map.entry("omega", named(Quantity.ANGULAR_FREQUENCY, null)),
            Map.entry("ω", named(Quantity.ANGULAR_FREQUENCY, null)),
            Map.entry("storage_modulus", named(Quantity.STORAGE_MODULUS, null)),
            Map.entry("shear_storage_modulus", named(Quantity.STORAGE_MODULUS, ModulusKind.SHEAR)),
            Map.entry("tensile_storage_modulus", named(Quantity.STORAGE_MODULUS, ModulusKind.TENSILE)),
            Map.entry("storage_modulus_g'", named(Quantity.STORAGE_MODULUS, ModulusKind.SHEAR)),
            Map.entry("storage_modulus_e'", named(Quantity.STORAGE_MODULUS, ModulusKind.TENSILE)),
            Map.entry("shear_loss_modulus", named(Quantity.LOSS_MODULUS, ModulusKind.SHEAR)),
            Map.entry("tensile_loss_modulus", named(Quantity.LOSS_MODULUS, ModulusKind.TENSILE)),
            Map.entry("loss_modulus_g''", named(Quantity.LOSS_MODULUS, ModulusKind.SHEAR)),
            Map.entry("loss_modulus_e''", named(Quantity.LOSS_MODULUS, ModulusKind.TENSILE)),
            Map.entry("complex_modulus", named(Quantity.COMPLEX_MODULUS_MAGNITUDE, null)),
            Map.entry("e*", named(Quantity.COMPLEX_MODULUS_MAGNITUDE, ModulusKind.TENSILE)),
            Map.entry("g*", named(Quantity.COMPLEX_MODULUS_MAGNITUDE, ModulusKind.SHEAR)),
            Map.entry("complex_shear_modulus", named(Quantity.COMPLEX_MODULUS_MAGNITUDE, ModulusKind.SHEAR)),
            Map.entry("phase", named(Quantity.PHASE_ANGLE, null)),
            Map.entry("phase_angle_δ", named(Quantity.PHASE_ANGLE, null)),
            Map.entry("sample_name", named(Quantity.SAMPLE, null)),
            Map.entry("specimen", named(Quantity.SAMPLE, null)),
            Map.entry("sample_id", named(Quantity.SAMPLE, null)),
            Map.entry("repeat", named(Quantity.REPLICATE, null)),
            Map.entry("sample_temperature", named(Quantity.TEMPERATURE, null)),
            Map.entry("e'", named(Quantity.STORAGE_MODULUS, ModulusKind.TENSILE)),
            Map.entry("e′", named(Quantity.STORAGE_MODULUS, ModulusKind.TENSILE)),
            Map.entry("e_prime", named(Quantity.STORAGE_MODULUS, ModulusKind.TENSILE)),
            Map.entry("g'", named(Quantity.STORAGE_MODULUS, ModulusKind.SHEAR)),
            Map.entry("g′", named(Quantity.STORAGE_MODULUS, ModulusKind.SHEAR)),
            Map.entry("g_prime", named(Quantity.STORAGE_MODULUS, ModulusKind.SHEAR)),
            Map.entry("loss_modulus", named(Quantity.LOSS_MODULUS, null)),
            Map.entry("e''", named(Quantity.LOSS_MODULUS, ModulusKind.TENSILE)),
            Map.entry("e″", named(Quantity.LOSS_MODULUS, ModulusKind.TENSILE)),
            Map.entry("e_double_prime", named(Quantity.LOSS_MODULUS, ModulusKind.TENSILE)),
            Map.entry("g''", named(Quantity.LOSS_MODULUS, ModulusKind.SHEAR)),
            Map.entry("g″", named(Quantity.LOSS_MODULUS, ModulusKind.SHEAR)),
            Map.entry("g_double_prime", named(Quantity.LOSS_MODULUS, ModulusKind.SHEAR)),
            Map.entry("loss_tangent", named(Quantity.LOSS_TANGENT, null)),
            Map.entry("tan_δ", named(Quantity.LOSS_TANGENT, null)),
            Map.entry("tan_delta", named(Quantity.LOSS_TANGENT, null)),
            Map.entry("tan(delta)", named(Quantity.LOSS_TANGENT, null)),
            Map.entry("tan(δ)", named(Quantity.LOSS_TANGENT, null)),
            Map.entry("tan_(delta)", named(Quantity.LOSS_TANGENT, null)),
            Map.entry("tan_(δ)", named(Quantity.LOSS_TANGENT, null)),
            Map.entry("tan_d", named(Quantity.LOSS_TANGENT, null)),
            Map.entry("tand", named(Quantity.LOSS_TANGENT, null)),
            Map.entry("tan_δ_(1)", named(Quantity.LOSS_TANGENT, null)),
            Map.entry("tanδ", named(Quantity.LOSS_TANGENT, null)),
            Map.entry("loss_factor", named(Quantity.LOSS_TANGENT, null)),
            Map.entry("complex_modulus_magnitude", named(Quantity.COMPLEX_MODULUS_MAGNITUDE, null)),
            Map.entry("|e*|", named(Quantity.COMPLEX_MODULUS_MAGNITUDE, ModulusKind.TENSILE)),
            Map.entry("|g*|", named(Quantity.COMPLEX_MODULUS_MAGNITUDE, ModulusKind.SHEAR)),
            Map.entry("phase_angle", named(Quantity.PHASE_ANGLE, null)),
            Map.entry("δ", named(Quantity.PHASE_ANGLE, null)),
            Map.entry("delta", named(Quantity.PHASE_ANGLE, null)),
            Map.entry("storage_compliance", named(Quantity.STORAGE_COMPLIANCE, null)),
            Map.entry("j'", named(Quantity.STORAGE_COMPLIANCE, null)),
            Map.entry("j′", named(Quantity.STORAGE_COMPLIANCE, null)),
            Map.entry("loss_compliance", named(Quantity.LOSS_COMPLIANCE, null)),
            Map.entry("j''", named(Quantity.LOSS_COMPLIANCE, null)),
            Map.entry("j″", named(Quantity.LOSS_COMPLIANCE, null)),
            Map.entry("dynamic_viscosity", named(Quantity.DYNAMIC_VISCOSITY, ModulusKind.SHEAR)),
            Map.entry("η'", named(Quantity.DYNAMIC_VISCOSITY, ModulusKind.SHEAR)),
            Map.entry("η′", named(Quantity.DYNAMIC_VISCOSITY, ModulusKind.SHEAR)),
            Map.entry("eta'", named(Quantity.DYNAMIC_VISCOSITY, ModulusKind.SHEAR)),
            Map.entry("out_of_phase_viscosity", named(Quantity.OUT_OF_PHASE_VISCOSITY, ModulusKind.SHEAR)),
            Map.entry("η''", named(Quantity.OUT_OF_PHASE_VISCOSITY, ModulusKind.SHEAR)),
            Map.entry("η″", named(Quantity.OUT_OF_PHASE_VISCOSITY, ModulusKind.SHEAR)),
            Map.entry("eta''", named(Quantity.OUT_OF_PHASE_VISCOSITY, ModulusKind.SHEAR)),
            Map.entry("complex_viscosity_magnitude", named(Quantity.COMPLEX_VISCOSITY_MAGNITUDE, ModulusKind.SHEAR)),
            Map.entry("complex_viscosity", named(Quantity.COMPLEX_VISCOSITY_MAGNITUDE, ModulusKind.SHEAR)),
            Map.entry("|η*|", named(Quantity.COMPLEX_VISCOSITY_MAGNITUDE, ModulusKind.SHEAR)),
            Map.entry("|eta*|", named(Quantity.COMPLEX_VISCOSITY_MAGNITUDE, ModulusKind.SHEAR)),
            Map.entry("temperature", named(Quantity.TEMPERATURE, null)),
            Map.entry("temp", named(Quantity.TEMPERATURE, null)),
            Map.entry("sample", named(Quantity.SAMPLE, null)),
            Map.entry("replicate", named(Quantity.REPLICATE, null)),
            Map.entry("rep", named(Quantity.REPLICATE, null)),
            Map.entry("group", named(Quantity.GROUP, null)),
            Map.entry("strain_amplitude", named(Quantity.STRAIN_AMPLITUDE, null)),
            Map.entry("shear_strain_amplitude", named(Quantity.STRAIN_AMPLITUDE, ModulusKind.SHEAR)),
            Map.entry("stress_amplitude", named(Quantity.STRESS_AMPLITUDE, null)),
            Map.entry("shear_stress_amplitude", named(Quantity.STRESS_AMPLITUDE, ModulusKind.SHEAR)),
            Map.entry("force_amplitude", named(Quantity.FORCE_AMPLITUDE, null)),
            Map.entry("displacement_amplitude", named(Quantity.DISPLACEMENT_AMPLITUDE, null)),
            Map.entry("time", named(Quantity.TIME, null)),
            Map.entry("elapsed_time", named(Quantity.TIME, null)),
            Map.entry("time_since_step", named(Quantity.TIME, null)),
            Map.entry("test_time", named(Quantity.TIME, null)),
            Map.entry("relaxation_modulus", named(Quantity.RELAXATION_MODULUS, null)),
            Map.entry("stress_relaxation_modulus", named(Quantity.RELAXATION_MODULUS, null)),
            Map.entry("shear_relaxation_modulus", named(Quantity.RELAXATION_MODULUS, ModulusKind.SHEAR)),
            Map.entry("tensile_relaxation_modulus", named(Quantity.RELAXATION_MODULUS, ModulusKind.TENSILE)),
            Map.entry("e(t)", named(Quantity.RELAXATION_MODULUS, ModulusKind.TENSILE)),
            Map.entry("g(t)", named(Quantity.RELAXATION_MODULUS, ModulusKind.SHEAR)),
            Map.entry("creep_compliance", named(Quantity.CREEP_COMPLIANCE, null)),
            Map.entry("shear_creep_compliance", named(Quantity.CREEP_COMPLIANCE, ModulusKind.SHEAR)),
            Map.entry("tensile_creep_compliance", named(Quantity.CREEP_COMPLIANCE, ModulusKind.TENSILE)),
            Map.entry("j(t)", named(Quantity.CREEP_COMPLIANCE, null)),
            Map.entry("d(t)", named(Quantity.CREEP_COMPLIANCE, ModulusKind.TENSILE)),
            Map.entry("x", named(Quantity.POSITION_X, null)),
            Map.entry("y", named(Quantity.POSITION_Y, null)));

    private record Named(Quantity quantity, ModulusKind kind) {
    }

    private static Named named(Quantity q, ModulusKind k) {
        return new Named(q, k);
    }

    private HeaderRecognizer() {
    }

    /**
     * Whether a header names a time (whatever its unit says): a clock column of an export with a unit
     * Viscarta does not read (hh:mm:ss) is read past beside a sweep instead of stopping the reading.
     */
    static boolean isTime(String header) {
        String name = header.replaceFirst("\\s*[\\[(].*$", "");
        Result r = recognize(0, name + " [s]");
        return r.column() != null && r.column().quantity() == Quantity.TIME;
    }

    /**
     * The outcome: a column, or the reason it could not be understood.
     *
     * @param nameKnown whether the name was recognised (then a problem concerns its unit)
     */
    record Result(ColumnSpec column, String problem, boolean nameKnown) {
        Result(ColumnSpec column, String problem) {
            this(column, problem, true);
        }
    }

    /**
     * Names of columns lab exports carry that the analysis does not need (common practice of
     * instrument exports: point numbers, drive and load signals, times): a header whose name is one
     * of these, or begins with one and an underscore, is read past.
     */
    private static final java.util.Set<String> UNNEEDED = java.util.Set.of("point", "pt", "no", "nr", "number", "index", "#",
            "n", "strain", "shear_strain", "stress", "shear_stress", "torque", "normal_force", "normal_stress", "force", "axial_force",
            "gap", "time", "step", "step_time", "interval", "displacement", "amplitude", "deflection", "status", "shear_rate",
            "raw_phase", "cycle", "oscillation_strain", "osc._strain", "osc_strain", "deformation", "velocity", "speed",
            "static_force", "dynamic_force", "motor", "date", "clock");

    /** True when a header names a column lab exports carry but the analysis does not need. */
    static boolean unneeded(String rawHeader) {
        String k = key(nameOf(rawHeader));
        if (UNNEEDED.contains(k)) {
            return true;
        }
        for (String u : UNNEEDED) {
            if (k.startsWith(u + "_") && u.length() > 2) {
                return true;
            }
        }
        return false;
    }

    private static String nameOf(String rawHeader) {
        Matcher m = NAME_AND_UNIT.matcher(rawHeader.strip());
        return m.matches() ? m.group(1) : rawHeader.strip();
    }

    private static String key(String name) {
        String k = name.strip().toLowerCase(Locale.ROOT).replace('’', '\'').replaceAll("[\\s-]+", "_");
        while (k.endsWith(".") || k.endsWith(":")) {
            k = k.substring(0, k.length() - 1);
        }
        return k;
    }

    static Result recognize(int index, String rawHeader) {
        String header = rawHeader.strip();
        String name = header;
        String unitText = null;
        Matcher m = NAME_AND_UNIT.matcher(header);
        if (m.matches()) {
            name = m.group(1);
            unitText = m.group(2).strip();
        }
        String key = key(name);
        if (key.startsWith("quality_") || key.equals("ignore")) {
            return new Result(new ColumnSpec(index, header, Quantity.QUALITY, null, null), null);
        }
        Named n = NAMES.get(key);
        if (n == null && unitText == null) {
            // "frequency_Hz", "storage_modulus_kPa": the unit written after the name
            int cut = Math.max(header.lastIndexOf('_'), header.lastIndexOf(' '));
            if (cut > 0 && NAMES.containsKey(key(header.substring(0, cut)))
                    && Unit.anyDimension(header.substring(cut + 1)).isPresent()) {
                name = header.substring(0, cut);
                unitText = header.substring(cut + 1);
                key = key(name);
                n = NAMES.get(key);
            }
        }
        if (n == null && unitText != null && NAMES.containsKey(key(header))) {
            key = key(header); // "Tan(delta)": the parentheses are part of the name
            n = NAMES.get(key);
            unitText = null;
        }
        if (n == null) {
            return new Result(null, "unknown column header " + InputException.quote(header) + "; name it like 'frequency [Hz]', "
                    + "'storage_modulus [Pa]', 'loss_modulus [Pa]', 'loss_tangent', 'complex_modulus_magnitude [Pa]', "
                    + "'phase_angle [deg]', 'temperature [°C]', 'sample', 'replicate' or 'group'", false);
        }
        Quantity q = n.quantity();
        if (q.isLabel()) {
            return new Result(new ColumnSpec(index, header, q, null, null), null);
        }
        Optional<Unit> unit;
        if (unitText == null) {
            if (q == Quantity.STRAIN_AMPLITUDE) {
                return new Result(null, "column header " + InputException.quote(header) + " gives no unit; a strain amplitude is "
                        + "written in % or as a fraction: 'strain_amplitude [%]' or 'strain_amplitude [-]'");
            } else if (q.dimension() == Quantity.Dimension.NONE) {
                unit = Optional.of(Unit.DIMENSIONLESS);
            } else if (q == Quantity.ANGULAR_FREQUENCY && !key.equals("angular_frequency")) {
                unit = Optional.of(Unit.RAD_PER_S);
            } else {
                return new Result(null, "column header " + InputException.quote(header) + " gives no unit; write it with a unit in "
                        + "square brackets, e.g. '" + q.canonical() + " [" + Unit.symbolsOf(q.dimension()).get(0) + "]'");
            }
        } else {
            unit = Unit.find(unitText, q.dimension());
            if (unit.isEmpty() && q == Quantity.FREQUENCY) {
                unit = Unit.find(unitText, Quantity.Dimension.ANGULAR_FREQUENCY);
                if (unit.isPresent()) {
                    q = Quantity.ANGULAR_FREQUENCY;
                }
            }
        }
        if (unit.isEmpty()) {
            return new Result(null, "unknown unit " + InputException.quote(unitText) + " in column header " + InputException.quote(header) + "; use one of "
                    + String.join(", ", Unit.symbolsOf(q.dimension())));
        }
        return new Result(new ColumnSpec(index, header, q, unit.get(), n.kind()), null);
    }
}
