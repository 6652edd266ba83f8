package org.viscarta.analysis;

/** What a running analysis tells its caller about its progress; called from any thread. */
public interface Progress {

    /** The stages of an analysis, in the order they run. */
    enum Stage {
        READING, CHECKING, TRANSITIONS, MASTER_CURVES, FITTING, SPECTRA, RANKING, MATCHING, MAPS, DONE
    }

    /** Says nothing. */
    Progress NONE = new Progress() {
    };

    /** A stage begins; {@code items} is how many steps it has (0 when not counted). */
    default void stage(Stage stage, int items) {
    }

    /** One step of the current stage is done. */
    default void step() {
    }
}
