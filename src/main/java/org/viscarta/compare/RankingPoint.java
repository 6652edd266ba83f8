package org.viscarta.compare;

import java.util.List;
import java.util.Optional;
import org.viscarta.sweep.Numbers;
import org.viscarta.sweep.SweepPoint;

/**
 * Where samples are ranked by damping: at one frequency, or by the geometric mean of tan δ over a
 * band. One of the two is always set; there is no "not set" value.
 */
public sealed interface RankingPoint permits RankingPoint.At, RankingPoint.Band {

    /** The 1 Hz default. */
    RankingPoint DEFAULT = new At(1.0);

    /** tan δ of one replicate at this point, when its measured range covers it. */
    Optional<LossTangentAt.Value> valueOf(List<SweepPoint> points);

    /** "1 Hz" or "0.5–5 Hz (geometric mean)": how the outputs name it. */
    String describe();

    /** The frequency a table states for the ranking [Hz]: the point itself, or the geometric centre of the band. */
    double representativeHz();

    /**
     * One frequency.
     *
     * @param hz the frequency [Hz], finite and &gt; 0
     */
    record At(double hz) implements RankingPoint {
        public At {
            if (!(hz > 0) || Double.isInfinite(hz)) {
                throw new IllegalArgumentException("reference frequency must be finite and > 0 Hz, got " + hz);
            }
        }

        @Override
        public Optional<LossTangentAt.Value> valueOf(List<SweepPoint> points) {
            return LossTangentAt.interpolate(points, hz);
        }

        @Override
        public String describe() {
            return Numbers.plain(hz) + " Hz";
        }

        @Override
        public double representativeHz() {
            return hz;
        }
    }

    /**
     * A band over which the geometric mean of tan δ is taken.
     *
     * @param lowHz  lower edge [Hz], &gt; 0
     * @param highHz upper edge [Hz], finite and &gt; lowHz
     */
    record Band(double lowHz, double highHz) implements RankingPoint {
        public Band {
            if (!(lowHz > 0 && highHz > lowHz && Double.isFinite(highHz))) {
                throw new IllegalArgumentException("the band must run from a lower to a higher positive frequency, got "
                        + lowHz + "–" + highHz + " Hz");
            }
        }

        @Override
        public Optional<LossTangentAt.Value> valueOf(List<SweepPoint> points) {
            return LossTangentAt.overBand(points, lowHz, highHz);
        }

        @Override
        public String describe() {
            return Numbers.plain(lowHz) + "–" + Numbers.plain(highHz) + " Hz (geometric mean)";
        }

        @Override
        public double representativeHz() {
            return Math.sqrt(lowHz * highHz);
        }
    }
}
