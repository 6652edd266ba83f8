package org.viscarta.report;

import java.io.IOException;
import java.io.OutputStream;
import java.util.ArrayList;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.apache.poi.ss.usermodel.Cell;
import org.apache.poi.ss.usermodel.CellStyle;
import org.apache.poi.ss.usermodel.Font;
import org.apache.poi.ss.usermodel.Row;
import org.apache.poi.ss.usermodel.Sheet;
import org.apache.poi.ss.usermodel.Workbook;
import org.apache.poi.xssf.streaming.SXSSFWorkbook;
import org.viscarta.Campaign;
import org.viscarta.compare.DampingComparison;
import org.viscarta.compare.Matcher;
import org.viscarta.compare.ReferenceDistance;
import org.viscarta.compare.ReplicateSummary;
import org.viscarta.temperature.ShiftAnalysis;
import org.viscarta.temperature.ShiftFits;
import org.viscarta.temperature.TemperatureSeries;
import org.viscarta.fit.DerivedEstimate;
import org.viscarta.fit.FitResult;
import org.viscarta.fit.ModelSelection;
import org.viscarta.fit.ParameterEstimate;
import org.viscarta.io.ReadWarning;
import org.viscarta.io.SweepFile;
import org.viscarta.library.ReferenceLibrary;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;

/**
 * Writes the report workbook: Read me, Summary, Damping ranking, Group comparison, Reference
 * matches, Mimic ranking (with a target), Model fits, Derived quantities, Correlations, Data,
 * Reference library and Provenance. Numbers are numeric cells; every header carries its unit. Streams rows
 * (SXSSF) so that large campaigns fit in memory.
 */
public final class WorkbookReport {

    /** Everything the workbook shows. */
    public record Content(Campaign campaign, List<Campaign.SampleFits> fits, List<Campaign.RankRow> ranking,
                          DampingComparison.Result comparison, ReferenceLibrary library, List<List<Matcher.Match>> matches,
                          String target, List<Matcher.Match> mimic, List<TemperatureSeries> series, Provenance provenance) {
        public Content {
            matches = List.copyOf(matches);
            mimic = List.copyOf(mimic);
            series = List.copyOf(series);
        }

        /** The matches of the i-th sample of {@code fits}, or an empty list. */
        List<Matcher.Match> matchesOf(int i) {
            return i < matches.size() ? matches.get(i) : List.of();
        }
    }

    /** Columns (12 characters wide) and rows a figure spans in the Figures sheet: about 6.5 × 4.2 inches. */
    private static final int FIGURE_COLUMNS = 9;
    private static final int FIGURE_ROWS = 21;

    /** References listed per sample in Reference matches. */
    private static final int MATCHES_SHOWN = 5;

    /** Column widths of the Read me sheet, in characters. */
    private static final int LABEL_WIDTH = 34;
    private static final int TEXT_WIDTH = 100;

    private WorkbookReport() {
    }

    /** Writes the workbook without figures. */
    public static void write(Content c, OutputStream out) throws IOException {
        write(c, List.of(), out);
    }

    /**
     * Writes the workbook to {@code out} (the caller closes it). The same content gives the same
     * bytes: the document's creation time is the run time stated in Provenance, and every ZIP entry
     * carries that time too.
     */
    public static void write(Content c, List<RenderedFigure> figures, OutputStream out) throws IOException {
        java.time.Instant stated = java.time.Instant.parse(c.provenance().runAtUtc());
        java.io.ByteArrayOutputStream buffer = new java.io.ByteArrayOutputStream();
        try (SXSSFWorkbook wb = new SXSSFWorkbook(200)) {
            var core = wb.getXSSFWorkbook().getProperties().getCoreProperties();
            core.setCreated(java.util.Optional.of(java.util.Date.from(stated)));
            core.setCreator("Viscarta " + c.provenance().toolVersion());
            Styles st = new Styles(wb);
            readMe(wb, st, c);
            summary(wb, st, c);
            ranking(wb, st, c);
            groupComparison(wb, st, c);
            referenceMatches(wb, st, c);
            if (c.target() != null) {
                mimic(wb, st, c);
            }
            if (!c.series().isEmpty()) {
                temperatureSeries(wb, st, c);
            }
            modelFits(wb, st, c);
            derived(wb, st, c);
            correlations(wb, st, c);
            data(wb, st, c);
            library(wb, st, c);
            if (!figures.isEmpty()) {
                figures(wb, st, figures);
            }
            provenance(wb, st, c);
            wb.write(buffer);
            wb.dispose();
        }
        out.write(ReproducibleZip.rewrite(buffer.toByteArray(), stated.toEpochMilli()));
    }

    private static void figures(SXSSFWorkbook wb, Styles st, List<RenderedFigure> figures) {
        Sheet s = wb.createSheet("Figures");
        Rows rows = new Rows(s);
        rows.styled(st.title, "Figures (also written as PNG at 300 dpi and SVG under figures/)");
        org.apache.poi.ss.usermodel.Drawing<?> drawing = s.createDrawingPatriarch();
        org.apache.poi.ss.usermodel.CreationHelper helper = wb.getCreationHelper();
        int row = 2;
        for (RenderedFigure f : figures) {
            Row caption = s.createRow(row);
            caption.createCell(0).setCellValue(f.stem() + ": " + f.caption());
            int picture = wb.addPicture(f.png(), Workbook.PICTURE_TYPE_PNG);
            org.apache.poi.ss.usermodel.ClientAnchor a = helper.createClientAnchor();
            a.setCol1(0);
            a.setRow1(row + 1);
            a.setCol2(FIGURE_COLUMNS);
            a.setRow2(row + 1 + FIGURE_ROWS);
            drawing.createPicture(a, picture);
            row += FIGURE_ROWS + 3;
        }
        widths(s, 12, 12, 12, 12, 12, 12, 12, 12, 12);
    }

    /** Cell styles, created once per workbook. */
    private static final class Styles {
        final CellStyle title;
        final CellStyle header;
        final CellStyle wrap;
        final CellStyle bold;
        /** Significant figures for moduli and parameters of any scale. */
        final CellStyle sci;
        /** Four decimals for tan δ and weights. */
        final CellStyle dec4;
        /** Two decimals for AICc, temperatures, angles. */
        final CellStyle dec2;
        /** Frequencies: up to four decimals. */
        final CellStyle freq;
        final CellStyle integer;

        Styles(Workbook wb) {
            sci = numberStyle(wb, "0.0000E+00");
            dec4 = numberStyle(wb, "0.0000");
            dec2 = numberStyle(wb, "0.00");
            freq = numberStyle(wb, "0.0###");
            integer = numberStyle(wb, "0");
            Font big = wb.createFont();
            big.setBold(true);
            big.setFontHeightInPoints((short) 14);
            title = wb.createCellStyle();
            title.setFont(big);
            Font b = wb.createFont();
            b.setBold(true);
            header = wb.createCellStyle();
            header.setFont(b);
            header.setWrapText(true);
            bold = wb.createCellStyle();
            bold.setFont(b);
            bold.setWrapText(true);
            bold.setVerticalAlignment(org.apache.poi.ss.usermodel.VerticalAlignment.TOP);
            wrap = wb.createCellStyle();
            wrap.setWrapText(true);
            wrap.setVerticalAlignment(org.apache.poi.ss.usermodel.VerticalAlignment.TOP);
        }
    }

    private static CellStyle numberStyle(Workbook wb, String format) {
        CellStyle cs = wb.createCellStyle();
        cs.setDataFormat(wb.createDataFormat().getFormat(format));
        return cs;
    }

    /** Appends rows to a sheet; numbers go in as numeric cells, NaN as an empty cell. */
    private static final class Rows {
        private final Sheet sheet;
        private final CellStyle[] numberStyles;
        private int next;

        /**
         * @param numberStyles the display format of numbers in each column (null: General); the
         *                     stored value keeps full precision
         */
        Rows(Sheet sheet, CellStyle... numberStyles) {
            this.sheet = sheet;
            this.numberStyles = numberStyles;
        }

        Row row(Object... values) {
            Row r = sheet.createRow(next++);
            for (int i = 0; i < values.length; i++) {
                Object v = values[i];
                if (v == null) {
                    continue;
                }
                Cell cell = r.createCell(i);
                if (v instanceof Number n) {
                    double d = n.doubleValue();
                    if (Double.isFinite(d)) {
                        cell.setCellValue(d);
                        if (i < numberStyles.length && numberStyles[i] != null) {
                            cell.setCellStyle(numberStyles[i]);
                        }
                    }
                } else if (v instanceof Boolean b) {
                    cell.setCellValue(b);
                } else {
                    cell.setCellValue(v.toString());
                }
            }
            return r;
        }

        Row styled(CellStyle style, Object... values) {
            Row r = row(values);
            for (Cell cell : r) {
                cell.setCellStyle(style);
            }
            return r;
        }

        void blank() {
            next++;
        }

        /** Index of the last row written. */
        int last() {
            return next - 1;
        }

        /**
         * A label and a wrapped paragraph. SXSSF cannot measure text, so the row height is
         * estimated from the text length and the column widths (in characters).
         */
        Row paragraph(CellStyle labelStyle, CellStyle textStyle, String label, String text, int labelWidth, int textWidth) {
            Row r = row(label, text);
            r.getCell(0).setCellStyle(labelStyle);
            r.getCell(1).setCellStyle(textStyle);
            int lines = Math.max(linesOf(label, labelWidth), linesOf(text, textWidth));
            r.setHeightInPoints(Math.max(1, lines) * 15f);
            return r;
        }

        private static int linesOf(String text, int width) {
            return (int) Math.ceil(text.length() * 1.1 / Math.max(1, width - 2));
        }
    }

    /**
     * Sets column widths in characters. Called after a sheet's rows are written: with column
     * definitions present, POI looks up a default style for every new cell, which is slow.
     */
    private static void widths(Sheet s, int... widths) {
        printSetup(s);
        for (int i = 0; i < widths.length; i++) {
            s.setColumnWidth(i, widths[i] * 256);
        }
    }

    private static void freezeHeader(Sheet s) {
        s.createFreezePane(0, 1);
        s.setRepeatingRows(org.apache.poi.ss.util.CellRangeAddress.valueOf("1:1"));
    }

    /** An autofilter over a table that starts with its header in row 0 and spans columns 0 … lastColumn. */
    private static void table(Sheet s, Rows rows, int lastColumn) {
        if (rows.last() >= 1) {
            s.setAutoFilter(new org.apache.poi.ss.util.CellRangeAddress(0, rows.last(), 0, lastColumn));
        }
    }

    /**
     * A colour scale on a column of tan δ values: white for the lowest, dark blue for the highest
     * damping (a sequential blue scale, readable by colour-blind readers and in greyscale).
     */
    private static void tanDeltaScale(Sheet s, Rows rows, int column) {
        if (rows.last() < 1) {
            return;
        }
        var scf = s.getSheetConditionalFormatting();
        var rule = scf.createConditionalFormattingColorScaleRule();
        var scale = rule.getColorScaleFormatting();
        scale.setNumControlPoints(3);
        scale.getThresholds()[0].setRangeType(org.apache.poi.ss.usermodel.ConditionalFormattingThreshold.RangeType.MIN);
        scale.getThresholds()[1].setRangeType(org.apache.poi.ss.usermodel.ConditionalFormattingThreshold.RangeType.PERCENTILE);
        scale.getThresholds()[1].setValue(50d);
        scale.getThresholds()[2].setRangeType(org.apache.poi.ss.usermodel.ConditionalFormattingThreshold.RangeType.MAX);
        scale.setColors(new org.apache.poi.ss.usermodel.Color[] {rgb(0xFF, 0xFF, 0xFF), rgb(0x9E, 0xCA, 0xE1), rgb(0x31, 0x82, 0xBD)});
        scf.addConditionalFormatting(new org.apache.poi.ss.util.CellRangeAddress[] {
            new org.apache.poi.ss.util.CellRangeAddress(1, rows.last(), column, column)}, rule);
    }

    private static org.apache.poi.xssf.usermodel.XSSFColor rgb(int r, int g, int b) {
        return new org.apache.poi.xssf.usermodel.XSSFColor(new byte[] {(byte) r, (byte) g, (byte) b}, null);
    }

    /** Landscape, one page wide, so that a printed or PDF sheet keeps its columns together. */
    private static void printSetup(Sheet s) {
        s.setFitToPage(true);
        s.getPrintSetup().setLandscape(true);
        s.getPrintSetup().setFitWidth((short) 1);
        s.getPrintSetup().setFitHeight((short) 0);
    }

    private static void readMe(Workbook wb, Styles st, Content c) {
        Sheet s = wb.createSheet("Read me");
        Rows rows = new Rows(s);
        rows.styled(st.title, "Viscarta report: oscillatory measurements of soft, lossy materials");
        rows.blank();
        rows.paragraph(st.bold, st.wrap, "What this is", "Frequency sweeps of " + c.campaign().samples().size()
                + " sample(s) from " + c.campaign().files().size() + " file(s), each fitted with viscoelastic models, and "
                + "ranked by damping (tan δ) at " + Campaign.plain(c.campaign().settings().atHz()) + " Hz. Every number can "
                + "be traced to its input file and line (sheet Data) and to the command that made it (sheet Provenance).",
                LABEL_WIDTH, TEXT_WIDTH);
        if (isDemo(c)) {
            rows.paragraph(st.bold, st.wrap, "Demo data", "The inputs say they are invented demo data, generated from known "
                    + "models with noise. They are not measurements of real materials.", LABEL_WIDTH, TEXT_WIDTH);
        }
        rows.blank();
        rows.styled(st.header, "Sheet", "What it holds");
        for (String[] sh : Texts.SHEETS) {
            rows.paragraph(st.wrap, st.wrap, sh[0], sh[1], LABEL_WIDTH, TEXT_WIDTH);
        }
        rows.blank();
        rows.styled(st.header, "Term", "Meaning");
        for (String[] d : Texts.DEFINITIONS) {
            rows.paragraph(st.bold, st.wrap, d[0], d[1], LABEL_WIDTH, TEXT_WIDTH);
        }
        rows.blank();
        rows.styled(st.header, "Cautions");
        for (String caution : Texts.CAUTIONS) {
            rows.paragraph(st.wrap, st.wrap, "", caution, LABEL_WIDTH, TEXT_WIDTH);
        }
        List<String> warnings = warningTexts(c);
        if (!warnings.isEmpty()) {
            rows.blank();
            rows.styled(st.header, "Warnings and notes", "(" + warnings.size() + "; also listed in Provenance)");
            for (String w : warnings) {
                rows.paragraph(st.wrap, st.wrap, "", w, LABEL_WIDTH, TEXT_WIDTH);
            }
        }
        widths(s, LABEL_WIDTH, TEXT_WIDTH);
    }

    /** True when an input says it is invented demo data. */
    public static boolean isDemo(Content c) {
        for (SweepFile f : c.campaign().files()) {
            for (String v : f.info().metadata().values()) {
                if (v.toLowerCase(Locale.ROOT).contains("demo data")) {
                    return true;
                }
            }
        }
        return false;
    }

    private static List<String> warningTexts(Content c) {
        List<String> out = new ArrayList<>();
        for (ReadWarning w : c.campaign().warnings()) {
            out.add(w.toString());
        }
        out.addAll(c.campaign().notes());
        return out;
    }

    private static String atHeader(Content c, String what) {
        return what + " at " + c.campaign().settings().rankingFrequency();
    }

    private static void summary(Workbook wb, Styles st, Content c) {
        Sheet s = wb.createSheet("Summary");
        Rows rows = new Rows(s, null, null, null, st.dec2, st.integer, st.integer, st.freq, st.freq, st.dec4, st.dec4, st.dec4, null,
                null, st.dec4, st.dec4, null, null, st.dec4);
        rows.styled(st.header, "sample", "group", "modulus basis", "temperature [°C]", "replicates", "points",
                "lowest frequency [Hz]", "highest frequency [Hz]", atHeader(c, "tan δ [–]"), "tan δ 95 % CI low [–]",
                "tan δ 95 % CI high [–]", "damping letter group", "best-supported model", "Akaike weight of best [–]",
                "RMS log misfit of best [–]", "also supported (ΔAICc < 2)", "closest reference", "distance to it [decades]", "notes");
        freezeHeader(s);
        Map<Campaign.Sample, Campaign.RankRow> rankOf = new IdentityHashMap<>();
        for (Campaign.RankRow r : c.ranking()) {
            rankOf.put(r.sample(), r);
        }
        for (int i = 0; i < c.fits().size(); i++) {
            Campaign.SampleFits sf = c.fits().get(i);
            Campaign.Sample smp = sf.sample();
            Campaign.RankRow rr = rankOf.get(smp);
            Matcher.Match closest = c.matchesOf(i).stream().filter(m -> m.rank() == 1).findFirst().orElse(null);
            ReplicateSummary t = rr == null ? null : rr.tanDelta();
            ModelSelection.Ranked best = sf.fits().stream().filter(ModelSelection.Ranked::best).findFirst().orElse(null);
            List<String> notes = new ArrayList<>();
            if (rr != null && !rr.note().isEmpty()) {
                notes.add(rr.note());
            }
            if (best == null) {
                notes.add("no model converged");
            } else {
                best.fit().parameters().stream().filter(ParameterEstimate::undetermined)
                        .forEach(p -> notes.add(best.fit().model() + " " + p.name() + ": " + p.note()));
            }
            int points = smp.replicates().stream().mapToInt(x -> x.points().size()).sum();
            rows.row(smp.name(), smp.group(), smp.kind() + " (" + smp.kind().letter() + ")", smp.temperatureC(),
                    smp.replicates().size(), points, smp.minFrequencyHz(), smp.maxFrequencyHz(),
                    t == null ? null : t.mean(), t == null ? null : t.ci95Low(), t == null ? null : t.ci95High(),
                    rr == null ? "" : rr.letters(), best == null ? "none converged" : best.fit().model(),
                    best == null ? null : best.weight(), best == null ? null : best.fit().rmsLogResidual(),
                    String.join(", ", alsoSupported(sf)), closest == null ? "" : closest.reference(),
                    closest == null ? null : closest.result().distance(), String.join("; ", notes));
        }
        table(s, rows, 18);
        tanDeltaScale(s, rows, 8);
        widths(s, 28, 16, 12, 14, 11, 9, 13, 13, 14, 14, 14, 10, 22, 14, 14, 30, 24, 14, 60);
    }

    private static List<String> alsoSupported(Campaign.SampleFits sf) {
        List<String> out = new ArrayList<>();
        for (ModelSelection.Ranked rk : sf.fits()) {
            if (!rk.best() && rk.deltaAicc() < 2) {
                out.add(rk.fit().model());
            }
        }
        return out;
    }

    private static void ranking(Workbook wb, Styles st, Content c) {
        Sheet s = wb.createSheet("Damping ranking");
        Rows rows = new Rows(s, st.integer, null, null, st.integer, st.freq, st.dec4, st.dec4, st.dec4, st.dec4, st.sci, st.sci);
        rows.styled(st.header, "rank", "sample", "group", "replicates", "frequency [Hz]", "tan δ mean [–]", "tan δ SD [–]",
                "tan δ 95 % CI low [–]", "tan δ 95 % CI high [–]", "storage modulus mean [Pa]", "loss modulus mean [Pa]",
                "value from", "letter group", "note");
        freezeHeader(s);
        for (Campaign.RankRow r : c.ranking()) {
            ReplicateSummary t = r.tanDelta();
            rows.row(r.rank() == 0 ? null : r.rank(), r.sample().name(), r.sample().group(),
                    t == null ? r.sample().replicates().size() : t.n(), rankingFrequencyHz(c),
                    t == null ? null : t.mean(), t == null ? null : t.sd(), t == null ? null : t.ci95Low(),
                    t == null ? null : t.ci95High(), r.storage(), r.loss(), r.source().description(), r.letters(), r.note());
        }
        table(s, rows, 13);
        tanDeltaScale(s, rows, 5);
        widths(s, 7, 28, 16, 12, 14, 14, 12, 14, 14, 18, 18, 30, 60);
    }

    private static double rankingFrequencyHz(Content c) {
        Campaign.Settings st = c.campaign().settings();
        return st.hasBand() ? Math.sqrt(st.bandLowHz() * st.bandHighHz()) : st.atHz();
    }

    private static void groupComparison(Workbook wb, Styles st, Content c) {
        Sheet s = wb.createSheet("Group comparison");
        Rows rows = new Rows(s, null, null, st.dec4, st.dec4, st.dec4, st.dec4);
        DampingComparison.Result cmp = c.comparison();
        rows.styled(st.title, "Which differences in damping are supported");
        for (String statement : cmp.statements()) {
            rows.paragraph(st.wrap, st.wrap, "", statement, 4, 150);
        }
        rows.blank();
        rows.styled(st.header, "sample", "other sample", "Welch t [–]", "degrees of freedom [–]", "p [–]", "Holm-adjusted p [–]",
                "supported at α = " + Campaign.plain(cmp.alpha()));
        for (DampingComparison.Pair p : cmp.pairs()) {
            rows.row(p.first(), p.second(), p.welch().t(), p.welch().df(), p.welch().p(), p.pHolm(), p.significant() ? "yes" : "no");
        }
        if (!cmp.groups().isEmpty()) {
            rows.blank();
            rows.styled(st.header, "group", "samples", "tan δ mean [–]", "tan δ SD [–]", "tan δ 95 % CI low [–]", "tan δ 95 % CI high [–]",
                    "values");
            for (DampingComparison.GroupSummary g : cmp.groups()) {
                rows.row(g.group(), g.samples(), g.values().mean(), g.values().sd(), g.values().ci95Low(), g.values().ci95High(),
                        g.values().n());
            }
            if (cmp.anova() != null) {
                rows.blank();
                rows.styled(st.header, "test across groups", "statistic", "df1 [–]", "df2 [–]", "p [–]");
                rows.row("one-way ANOVA (F)", "", cmp.anova().statistic(), cmp.anova().df1(), cmp.anova().df2(), cmp.anova().p());
                rows.row("Kruskal–Wallis (H)", "", cmp.kruskal().statistic(), cmp.kruskal().df1(), null, cmp.kruskal().p());
            }
        }
        widths(s, 28, 28, 14, 14, 14, 16, 14);
    }

    private static void referenceMatches(Workbook wb, Styles st, Content c) {
        Sheet s = wb.createSheet("Reference matches");
        Rows rows = new Rows(s, null, st.integer, null, null, st.dec4, st.dec4, st.freq, st.freq, null, st.freq, st.dec4);
        rows.styled(st.header, "sample", "rank", "reference", "class", "distance [decades]", "distance standard error [decades]",
                "band low [Hz]", "band high [Hz]", "comparable", "largest departure at [Hz]", "largest departure [decades]", "note");
        freezeHeader(s);
        if (c.library() == null) {
            rows.row("(no reference library was given: pass --library DIR)");
        }
        for (int i = 0; i < c.fits().size(); i++) {
            int shown = 0;
            for (Matcher.Match m : c.matchesOf(i)) {
                if (shown++ >= MATCHES_SHOWN) {
                    break;
                }
                matchRow(rows, m);
            }
        }
        table(s, rows, 11);
        widths(s, 28, 6, 24, 12, 12, 14, 12, 12, 11, 14, 14, 50);
    }

    private static void matchRow(Rows rows, Matcher.Match m) {
        ReferenceDistance.Result r = m.result();
        rows.row(m.sample(), m.rank() == 0 ? null : m.rank(), m.reference(), m.clazz(), r.distance(), r.uncertainty(), r.bandLowHz(),
                r.bandHighHz(), r.comparable() ? "yes" : "no", r.departureHz(), r.departure(), r.note());
    }

    private static void mimic(Workbook wb, Styles st, Content c) {
        Sheet s = wb.createSheet("Mimic ranking");
        Rows rows = new Rows(s, null, st.integer, null, null, st.dec4, st.dec4, st.freq, st.freq, null, st.freq, st.dec4);
        rows.styled(st.header, "target", "rank", "candidate", "group", "distance [decades]", "distance standard error [decades]",
                "band low [Hz]", "band high [Hz]", "comparable", "largest departure at [Hz]", "largest departure [decades, target − candidate]",
                "note");
        freezeHeader(s);
        for (Matcher.Match m : c.mimic()) {
            matchRow(rows, m);
        }
        rows.blank();
        rows.row("first and second distinguishable: " + Matcher.distinguishable(c.mimic()));
        table(s, rows, 11);
        widths(s, 24, 6, 24, 14, 12, 14, 12, 12, 11, 14, 16, 50);
    }

    private static void temperatureSeries(Workbook wb, Styles st, Content c) {
        Sheet s = wb.createSheet("Temperature series");
        Rows rows = new Rows(s, st.dec2, st.dec4, st.dec4, st.sci, st.dec4, null);
        for (TemperatureSeries ts : c.series()) {
            ShiftAnalysis.Result r = ts.result();
            rows.styled(st.title, ts.sample() + ": time–temperature superposition at " + Campaign.plain(r.referenceC()) + " °C");
            for (String n : r.notes()) {
                rows.paragraph(st.wrap, st.wrap, "", n, 14, 110);
            }
            rows.row("The master curve is analysed as the sample '" + ts.masterName() + "' in the other sheets.");
            rows.styled(st.header, "temperature [°C]", "log10 a_T [–]", "log10 a_T standard error [–]", "a_T [–]", "b_T [–]", "placed");
            for (ShiftAnalysis.Factor f : r.factors()) {
                rows.row(f.temperatureC(), f.log10aT(), f.log10aTStdError(), f.placed() ? f.aT() : null, f.bT(), f.placed() ? "yes" : "no");
            }
            rows.styled(st.header, "law", "parameter", "value", "standard error", "95 % CI low", "95 % CI high", "unit", "AICc [–]");
            for (ShiftFits.Fit fit : java.util.Arrays.asList(r.wlf(), r.arrhenius())) {
                if (fit == null) {
                    continue;
                }
                for (ShiftFits.Parameter p : fit.parameters()) {
                    rows.row(fit.law(), p.name(), p.value(), p.stdError(), p.ci95Low(), p.ci95High(), p.unit(), fit.aicc());
                }
            }
            rows.blank();
        }
        widths(s, 16, 14, 16, 14, 14, 14, 10, 12);
    }

    private static void modelFits(Workbook wb, Styles st, Content c) {
        Sheet s = wb.createSheet("Model fits");
        Rows rows = new Rows(s, null, null, null, null, st.sci, st.sci, st.sci, st.sci, st.sci, st.dec2, st.dec2, st.dec4);
        rows.styled(st.header, "sample", "model", "parameter", "unit", "value", "standard error", "95 % CI low",
                "95 % CI high", "RSS (log residuals) [–]", "AICc [–]", "ΔAICc [–]", "Akaike weight [–]", "best",
                "converged", "note");
        freezeHeader(s);
        for (Campaign.SampleFits sf : c.fits()) {
            for (ModelSelection.Ranked rk : sf.fits()) {
                FitResult f = rk.fit();
                for (ParameterEstimate p : f.parameters()) {
                    String note = !f.converged() ? f.message()
                            : f.variant().isEmpty() ? p.note() : p.note().isEmpty() ? f.variant() : f.variant() + "; " + p.note();
                    rows.row(f.sample(), f.model(), p.name(), p.unit(), p.value(), p.stdError(), p.ci95Low(), p.ci95High(),
                            f.rss(), f.aicc(), rk.deltaAicc(), rk.weight(), rk.best() ? "yes" : "no", f.converged() ? "yes" : "no",
                            note);
                }
            }
        }
        table(s, rows, 14);
        widths(s, 28, 16, 10, 10, 14, 14, 14, 14, 12, 12, 10, 12, 8, 11, 70);
    }

    private static void derived(Workbook wb, Styles st, Content c) {
        Sheet s = wb.createSheet("Derived quantities");
        Rows rows = new Rows(s, null, null, null, null, st.sci, st.sci, null);
        rows.styled(st.header, "sample", "model", "quantity", "unit", "value", "standard error", "best");
        freezeHeader(s);
        for (Campaign.SampleFits sf : c.fits()) {
            for (ModelSelection.Ranked rk : sf.fits()) {
                for (DerivedEstimate d : rk.fit().derived()) {
                    rows.row(rk.fit().sample(), rk.fit().model(), d.name(), d.unit(), d.value(), d.stdError(), rk.best() ? "yes" : "no");
                }
            }
        }
        table(s, rows, 6);
        widths(s, 28, 24, 26, 8, 14, 14, 8);
    }

    private static void correlations(Workbook wb, Styles st, Content c) {
        Sheet s = wb.createSheet("Correlations");
        Rows rows = new Rows(s, null, null, null, null, st.dec4);
        rows.styled(st.header, "sample", "model", "parameter", "with parameter", "correlation [–]");
        freezeHeader(s);
        for (Campaign.SampleFits sf : c.fits()) {
            for (ModelSelection.Ranked rk : sf.fits()) {
                double[][] corr = rk.fit().correlation();
                if (corr == null || !rk.best()) {
                    continue;
                }
                List<ParameterEstimate> ps = rk.fit().parameters();
                for (int i = 0; i < ps.size(); i++) {
                    for (int j = i + 1; j < ps.size(); j++) {
                        rows.row(rk.fit().sample(), rk.fit().model(), ps.get(i).name(), ps.get(j).name(), corr[i][j]);
                    }
                }
            }
        }
        table(s, rows, 4);
        widths(s, 28, 24, 14, 16, 16);
    }

    private static void data(Workbook wb, Styles st, Content c) {
        Sheet s = wb.createSheet("Data");
        Rows rows = new Rows(s, null, null, null, null, st.integer, st.freq, st.freq, st.sci, st.sci, st.dec4, st.sci, st.dec2, null, st.dec2);
        rows.styled(st.header, "sample", "replicate", "group", "file", "line", "frequency [Hz]",
                "angular frequency [rad/s]", "storage modulus [Pa]", "loss modulus [Pa]", "tan δ [–]", "|E*| or |G*| [Pa]",
                "phase angle [°]", "basis", "temperature [°C]");
        freezeHeader(s);
        for (Campaign.Sample smp : c.campaign().samples()) {
            for (Sweep sw : smp.replicates()) {
                String file = sw.source().toString();
                for (SweepPoint p : sw.points()) {
                    rows.row(smp.name(), sw.replicate(), sw.group(), file, p.line(), p.frequencyHz(), p.omega(),
                            p.storage(), p.loss(), p.lossTangent(), p.magnitude(), Math.toDegrees(p.phaseAngle()),
                            sw.kind().letter(), sw.temperatureC());
                }
            }
        }
        table(s, rows, 13);
        widths(s, 28, 10, 16, 34, 7, 14, 16, 16, 16, 12, 16, 12, 10, 14);
    }

    private static void library(Workbook wb, Styles st, Content c) {
        Sheet s = wb.createSheet("Reference library");
        Rows rows = new Rows(s, null, null, st.dec2, null, st.freq, st.freq, st.integer);
        rows.styled(st.header, "name", "class", "temperature [°C]", "method", "lowest frequency [Hz]",
                "highest frequency [Hz]", "points", "file", "SHA-256");
        freezeHeader(s);
        if (c.library() == null) {
            rows.row("(no reference library was given: pass --library DIR)");
            widths(s, 30, 14, 16, 16, 14, 14, 8, 40, 66);
            return;
        }
        for (ReferenceLibrary.Entry e : c.library().entries()) {
            Sweep sw = e.sweep();
            rows.row(e.name(), e.clazz(), sw.temperatureC(), sw.meta("method").orElse(""), sw.minFrequencyHz(),
                    sw.maxFrequencyHz(), sw.points().size(), e.file().toString(), e.sha256());
        }
        table(s, rows, 8);
        widths(s, 30, 14, 16, 16, 14, 14, 8, 40, 66);
    }

    private static void provenance(Workbook wb, Styles st, Content c) {
        Sheet s = wb.createSheet("Provenance");
        Rows rows = new Rows(s, null, null, null, null, null, null, st.integer);
        Provenance p = c.provenance();
        rows.styled(st.title, "Provenance");
        rows.row("tool", "Viscarta " + p.toolVersion());
        rows.paragraph(st.wrap, st.wrap, "command line", p.commandLine(), 30, 60);
        rows.row("run at (UTC)", p.runAtUtc());
        rows.row("Java runtime", System.getProperty("java.version"));
        rows.blank();
        rows.styled(st.header, "setting", "value");
        for (Map.Entry<String, String> e : p.settings().entrySet()) {
            rows.row(e.getKey(), e.getValue());
        }
        rows.blank();
        rows.styled(st.header, "input file", "SHA-256", "layout", "separator", "decimal mark", "encoding", "sweeps");
        for (SweepFile f : c.campaign().files()) {
            rows.row(f.path().toString(), f.sha256(), f.info().layout(), f.info().separatorName(),
                    String.valueOf(f.info().decimalMark()), f.info().encoding(), f.sweeps().size());
        }
        rows.blank();
        List<String> warnings = warningTexts(c);
        rows.styled(st.header, "warnings and conversions (" + warnings.size() + ")");
        for (String w : warnings) {
            rows.row(w);
        }
        widths(s, 30, 60, 24, 12, 12, 14, 66);
    }
}
