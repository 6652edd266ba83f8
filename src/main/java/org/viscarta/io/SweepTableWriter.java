package org.viscarta.io;

import java.util.List;
import java.util.Map;
import java.util.function.DoubleFunction;
import java.util.function.Function;
import java.util.function.ToDoubleFunction;
import org.viscarta.sweep.Quantity;
import org.viscarta.sweep.Unit;

/**
 * The one writer of Viscarta's own sweep tables — what {@code moduli}, {@code shift} and
 * {@code library add} and the demo generator's references write, and what the reader reads back:
 * '# key: value' metadata lines, then {@code frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]}
 * (or kPa, MPa) and any extra columns, one row per point.
 */
public final class SweepTableWriter {

    /**
     * A column after the standard three.
     *
     * @param header its header, with the unit in brackets where it has one
     * @param cell   how a point's cell is written
     */
    public record Extra<P>(String header, Function<P, String> cell) {
    }

    private SweepTableWriter() {
    }

    /** A table of sweep points with the standard columns only. */
    public static String write(Map<String, String> metadata, List<org.viscarta.sweep.SweepPoint> points) {
        return write(metadata, points, org.viscarta.sweep.SweepPoint::frequencyHz, org.viscarta.sweep.SweepPoint::storage,
                org.viscarta.sweep.SweepPoint::loss, List.of());
    }

    /**
     * A table of any kind of point, in Pa at full precision.
     *
     * @param metadata the '# key: value' lines, in order (line breaks in values become spaces)
     */
    public static <P> String write(Map<String, String> metadata, List<P> points, ToDoubleFunction<P> frequencyHz,
                                   ToDoubleFunction<P> storagePa, ToDoubleFunction<P> lossPa, List<Extra<P>> extras) {
        return write(metadata, points, frequencyHz, storagePa, lossPa, extras, Unit.PA, Double::toString);
    }

    /**
     * A table of any kind of point, the moduli in the unit given (kPa for gels, MPa for films),
     * each number written by {@code number}.
     */
    public static <P> String write(Map<String, String> metadata, List<P> points, ToDoubleFunction<P> frequencyHz,
                                   ToDoubleFunction<P> storagePa, ToDoubleFunction<P> lossPa, List<Extra<P>> extras,
                                   Unit moduli, DoubleFunction<String> number) {
        if (moduli.dimension() != Quantity.Dimension.STRESS) {
            throw new IllegalArgumentException("moduli are written in a unit of stress, not " + moduli);
        }
        StringBuilder sb = new StringBuilder();
        for (Map.Entry<String, String> e : metadata.entrySet()) {
            sb.append("# ").append(e.getKey()).append(": ").append(e.getValue().replace('\n', ' ').replace('\r', ' ')).append('\n');
        }
        String u = moduli.symbol();
        sb.append("frequency [Hz],storage_modulus [").append(u).append("],loss_modulus [").append(u).append(']');
        for (Extra<P> x : extras) {
            sb.append(',').append(x.header());
        }
        sb.append('\n');
        for (P p : points) {
            sb.append(number.apply(frequencyHz.applyAsDouble(p))).append(',')
                    .append(number.apply(storagePa.applyAsDouble(p) / moduli.toSi())).append(',')
                    .append(number.apply(lossPa.applyAsDouble(p) / moduli.toSi()));
            for (Extra<P> x : extras) {
                sb.append(',').append(x.cell().apply(p));
            }
            sb.append('\n');
        }
        return sb.toString();
    }
}
