package org.viscarta.analysis;

import org.viscarta.sweep.Numbers;

/**
 * Which samples may be ranked against each other: the same modulus basis, test temperatures
 * within a tolerance, and, when asked, the same group.
 *
 * @param temperatureToleranceC largest temperature difference within a set [°C], ≥ 0
 * @param withinGroups          whether a set holds samples of one group only
 */
public record ComparableSets(double temperatureToleranceC, boolean withinGroups) {

    public ComparableSets {
        if (!(temperatureToleranceC >= 0) || Double.isInfinite(temperatureToleranceC)) {
            throw new IllegalArgumentException("the temperature tolerance must be ≥ 0 °C, got " + temperatureToleranceC);
        }
    }

    /** Same basis, within 2 °C, groups mixed. */
    public static ComparableSets defaults() {
        return new ComparableSets(2, false);
    }

    /** The rule in words, as Provenance states it. */
    public String describe() {
        return "samples on the same modulus basis measured within " + Numbers.plain(temperatureToleranceC) + " °C of each other"
                + (withinGroups ? ", in the same group" : "") + "; each set ranked and tested on its own; the separate "
                + "temperatures of a temperature series are not ranked";
    }
}
