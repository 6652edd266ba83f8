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
            Map.entry("x", named(Quantity.POSITION_X, null)),
            Map.entry("y", named(Quantity.POSITION_Y, null)));

    private record Named(Quantity quantity, ModulusKind kind) {
    }

    private static Named named(Quantity q, ModulusKind k) {
        return new Named(q, k);
    }

    private HeaderRecognizer() {
    }

    /** The outcome: a column, or the reason it could not be understood. */
    record Result(ColumnSpec column, String problem) {
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
        String key = name.strip().toLowerCase(Locale.ROOT).replace('’', '\'').replaceAll("[\\s-]+", "_");
        if (key.startsWith("quality_") || key.equals("ignore")) {
            return new Result(new ColumnSpec(index, header, Quantity.QUALITY, null, null), null);
        }
        Named n = NAMES.get(key);
        if (n == null) {
            return new Result(null, "unknown column header '" + header + "'; name it like 'frequency [Hz]', "
                    + "'storage_modulus [Pa]', 'loss_modulus [Pa]', 'loss_tangent', 'complex_modulus_magnitude [Pa]', "
                    + "'phase_angle [deg]', 'temperature [°C]', 'sample', 'replicate' or 'group'");
        }
        Quantity q = n.quantity();
        if (q.isLabel()) {
            return new Result(new ColumnSpec(index, header, q, null, null), null);
        }
        Optional<Unit> unit;
        if (unitText == null) {
            if (q.dimension() == Quantity.Dimension.NONE) {
                unit = Optional.of(Unit.DIMENSIONLESS);
            } else if (q == Quantity.ANGULAR_FREQUENCY && !key.equals("angular_frequency")) {
                unit = Optional.of(Unit.RAD_PER_S);
            } else {
                return new Result(null, "column header '" + header + "' gives no unit; write it with a unit in "
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
            return new Result(null, "unknown unit '" + unitText + "' in column header '" + header + "'; use one of "
                    + String.join(", ", Unit.symbolsOf(q.dimension())));
        }
        return new Result(new ColumnSpec(index, header, q, unit.get(), n.kind()), null);
    }
}
