package org.viscarta.quality;

import java.util.Locale;

/** The outcome of a quality check: pass, warn or fail. */
public enum Verdict {
    PASS, WARN, FAIL;

    @Override
    public String toString() {
        return name().toLowerCase(Locale.ROOT);
    }
}
