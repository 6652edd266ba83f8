package org.viscarta.io;

import org.viscarta.sweep.ModulusKind;
import org.viscarta.sweep.Quantity;
import org.viscarta.sweep.Unit;

/**
 * How one column of a sweep table was understood.
 *
 * @param index    0-based field index
 * @param header   the header text as written
 * @param quantity the quantity it holds
 * @param unit     its unit (null for text columns)
 * @param kindHint SHEAR for G′/G″ headers, TENSILE for E′/E″ headers, null when the header does not say
 */
public record ColumnSpec(int index, String header, Quantity quantity, Unit unit, ModulusKind kindHint) {

    /** e.g. {@code storage_modulus [MPa]}. */
    public String describe() {
        return unit == null ? quantity.canonical() : quantity.canonical() + " [" + unit.symbol() + "]";
    }
}
