package org.viscarta.analysis;

import java.nio.file.Path;
import java.util.Objects;

/** The material the other samples are ranked as mimics of, when there is one. */
public sealed interface Target permits Target.None, Target.AmongInputs, Target.FromFile {

    /** No mimic ranking. */
    Target NONE = new None();

    /** No target. */
    record None() implements Target {
    }

    /**
     * One of the samples read: every other sample is a candidate.
     *
     * @param sample its name as the outputs show it
     */
    record AmongInputs(String sample) implements Target {
        public AmongInputs {
            Objects.requireNonNull(sample, "sample");
        }
    }

    /**
     * A material read from its own files (its replicates pooled): every sample read is a candidate.
     *
     * @param file its file or folder
     */
    record FromFile(Path file) implements Target {
        public FromFile {
            Objects.requireNonNull(file, "file");
        }
    }
}
