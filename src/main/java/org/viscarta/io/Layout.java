package org.viscarta.io;

import java.util.Objects;

/** How an input file lays out its sweeps: the family every reader decides among, in one place each. */
public sealed interface Layout permits Layout.OneSample, Layout.Tidy, Layout.Wide, Layout.WorkbookSheets, Layout.RawSignals,
        Layout.Blocks {

    /** The layout in words, as {@code inspect} and Provenance state it. */
    String describe();

    /** One sample per file: the sample named by '# sample:' or the file name. */
    record OneSample() implements Layout {
        @Override
        public String describe() {
            return "one sample per file";
        }
    }

    /** A tidy table: sample (and replicate, group, temperature) columns, one row per point. */
    record Tidy() implements Layout {
        @Override
        public String describe() {
            return "tidy multi-sample table";
        }
    }

    /** One frequency column, then a storage and a loss column per sample. */
    record Wide() implements Layout {
        @Override
        public String describe() {
            return "wide table (a storage and a loss column per sample)";
        }
    }

    /**
     * An XLSX or XLS workbook, every sheet a table of its own.
     *
     * @param sheets how many sheets hold data
     * @param first  the layout of the first of them
     */
    record WorkbookSheets(int sheets, Layout first) implements Layout {
        public WorkbookSheets {
            Objects.requireNonNull(first, "first");
        }

        @Override
        public String describe() {
            return "workbook, " + sheets + " sheet(s): " + first.describe();
        }
    }

    /**
     * Raw oscillation signals, converted to moduli.
     *
     * @param detail the geometry, or that the file is a calibration ("" for none)
     */
    record RawSignals(String detail) implements Layout {
        /** The detail that starts a step test's description. */
        public static final String STEP = " of a step test";

        public RawSignals {
            Objects.requireNonNull(detail, "detail");
        }

        @Override
        public String describe() {
            if (detail.startsWith(STEP)) {
                return "raw force and displacement record" + detail;
            }
            return detail.isEmpty() ? "raw oscillation signals" : "raw oscillation signals" + detail;
        }
    }

    /**
     * Several tables one after another in one file or sheet, each with its own preamble or sample line.
     *
     * @param tables how many
     * @param first  the layout of the first of them
     */
    record Blocks(int tables, Layout first) implements Layout {
        public Blocks {
            Objects.requireNonNull(first, "first");
        }

        @Override
        public String describe() {
            return tables + " tables one after another: " + first.describe();
        }
    }
}
