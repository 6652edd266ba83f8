package org.viscarta.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.text.DecimalFormat;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.NumberTickUnit;
import org.jfree.chart.axis.SymbolAxis;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.DeviationRenderer;
import org.jfree.chart.renderer.xy.XYErrorRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.XYIntervalSeries;
import org.jfree.data.xy.XYIntervalSeriesCollection;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;
import org.viscarta.analysis.Sample;
import org.viscarta.analysis.SampleAnalysis;
import org.viscarta.compare.DampingRanking;
import org.viscarta.sweep.Numbers;
import org.viscarta.compare.FittedCurve;
import org.viscarta.fit.DeltaMethod;
import org.viscarta.compare.Matcher;
import org.viscarta.compare.ReplicateSummary;
import org.viscarta.sweep.Sweep;
import org.viscarta.temperature.ShiftAnalysis;
import org.viscarta.temperature.ShiftLaws;
import org.viscarta.temperature.TemperatureSeries;
import org.viscarta.sweep.SweepPoint;

/**
 * Builds the report's figures: per sample, E′ and E″ against frequency with replicate error bars,
 * the best-supported model and its 95 % band, and the fit's residuals; per sample, the sample
 * against its closest references; tan δ against frequency for all samples; and the damping ranking
 * as intervals with letter groups. Axes name quantity and unit; series differ by colour, marker
 * and dash ({@link Palette}).
 */
public final class Figures {

    /** Points of a model curve across a measured range. */
    static final int CURVE_POINTS = 60;

    private Figures() {
    }

    /** Replicate mean and SD of ln M′, ln M″ and tan δ at each measured frequency. */
    record Aggregate(double f, double storage, double storageLo, double storageHi, double loss, double lossLo, double lossHi,
                     double tanDelta) {
    }

    static List<Aggregate> aggregate(Sample s) {
        Map<Long, List<SweepPoint>> byF = new TreeMap<>();
        for (Sweep r : s.replicates()) {
            for (SweepPoint p : r.fittablePoints()) {
                byF.computeIfAbsent(Math.round(Math.log10(p.frequencyHz()) * 1e6), k -> new ArrayList<>()).add(p);
            }
        }
        List<Aggregate> out = new ArrayList<>();
        for (List<SweepPoint> pts : byF.values()) {
            double[] ls = pts.stream().mapToDouble(p -> Math.log(p.storage())).toArray();
            double[] ll = pts.stream().mapToDouble(p -> Math.log(p.loss())).toArray();
            double[] lt = pts.stream().mapToDouble(p -> Math.log(p.lossTangent())).toArray();
            ReplicateSummary rs = ReplicateSummary.of(ls);
            ReplicateSummary rl = ReplicateSummary.of(ll);
            double sdS = Double.isNaN(rs.sd()) ? 0 : rs.sd();
            double sdL = Double.isNaN(rl.sd()) ? 0 : rl.sd();
            double f = Math.exp(pts.stream().mapToDouble(p -> Math.log(p.frequencyHz())).average().orElseThrow());
            out.add(new Aggregate(f, Math.exp(rs.mean()), Math.exp(rs.mean() - sdS), Math.exp(rs.mean() + sdS), Math.exp(rl.mean()),
                    Math.exp(rl.mean() - sdL), Math.exp(rl.mean() + sdL), Math.exp(ReplicateSummary.of(lt).mean())));
        }
        return out;
    }

    private static LogAxis frequencyAxis() {
        return frequencyAxis(false);
    }

    /** @param reduced the data are a master curve: the axis is the reduced frequency a_T·f */
    private static LogAxis frequencyAxis(boolean reduced) {
        return domainLogAxis(reduced ? "reduced frequency a_T·f [Hz]" : "frequency [Hz]");
    }

    /**
     * The residual panel's axis label: short enough for the panel's height (the full
     * "ln(model/data)" ran up beside the moduli axis's label, as if it were part of it); the
     * captions say what the residual is.
     */
    private static final String RESIDUAL_LABEL = "residual";

    /** What a residual is, for the captions ("the residuals of the fit, …"). */
    private static final String RESIDUAL_MEANING = "ln(model/data) (0.01 is a misfit of about 1 %)";

    /** A figure of a main panel over a residual panel, sharing the x axis. */
    private static JFreeChart withResiduals(String title, LogAxis x, XYPlot top, XYPlot residuals) {
        CombinedDomainXYPlot plot = new CombinedDomainXYPlot(x);
        plot.setGap(6);
        plot.add(top, 3);
        plot.add(residuals, 1);
        JFreeChart c = new JFreeChart(title, Palette.TITLE, plot, true);
        finish(c, top);
        finish(c, residuals);
        c.setBackgroundPaint(Color.WHITE);
        return c;
    }

    /** A logarithmic x axis with plain-number ticks. */
    private static LogAxis domainLogAxis(String label) {
        LogAxis x = new ReadableLogAxis(label);
        x.setTickUnit(new NumberTickUnit(1.0));
        x.setMinorTickMarksVisible(true);
        x.setNumberFormatOverride(new DecimalFormat("0.####"));
        x.setLabelFont(Palette.LABEL);
        x.setTickLabelFont(Palette.TICK);
        return x;
    }

    private static LogAxis logAxis(String label) {
        LogAxis y = new ReadableLogAxis(label);
        y.setTickUnit(new NumberTickUnit(1.0));
        y.setMinorTickMarksVisible(true);
        y.setNumberFormatOverride(new DecimalFormat("0.#####", java.text.DecimalFormatSymbols.getInstance(Locale.ROOT)));
        y.setLabelFont(Palette.LABEL);
        y.setTickLabelFont(Palette.TICK);
        return y;
    }

    private static JFreeChart chart(String title, XYPlot plot, boolean legend) {
        JFreeChart c = new JFreeChart(title, Palette.TITLE, plot, legend);
        finish(c, plot);
        return c;
    }

    private static void finish(JFreeChart c, XYPlot plot) {
        c.setBackgroundPaint(Color.WHITE);
        c.setAntiAlias(true);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setDomainGridlinePaint(new Color(0xDDDDDD));
        plot.setRangeGridlinePaint(new Color(0xDDDDDD));
        if (c.getLegend() != null) {
            c.getLegend().setItemFont(Palette.TICK);
        }
    }

    /**
     * A residual panel: the points of each series in its figure colour and shape (not repeated in the
     * legend), on an axis symmetric about zero with room for the largest and ticks at ± half of it.
     */
    private static void showResiduals(XYPlot plot, NumberAxis ry, XYSeriesCollection res) {
        plot.setDataset(res);
        double largest = 0;
        for (int i = 0; i < res.getSeriesCount(); i++) {
            XYSeries sr = res.getSeries(i);
            if (sr.getItemCount() > 0) {
                largest = Math.max(largest, Math.max(Math.abs(sr.getMinY()), Math.abs(sr.getMaxY())));
            }
        }
        if (largest > 0 && Double.isFinite(largest)) {
            ry.setRange(-1.3 * largest, 1.3 * largest);
            ry.setTickUnit(new NumberTickUnit(niceStep(largest / 2)));
        }
        XYLineAndShapeRenderer rr = new XYLineAndShapeRenderer(false, true);
        for (int i = 0; i < res.getSeriesCount(); i++) {
            rr.setSeriesPaint(i, Palette.colour(i));
            rr.setSeriesShape(i, Palette.shape(i));
            rr.setSeriesVisibleInLegend(i, false);
        }
        plot.setRenderer(rr);
    }

    /**
     * A sample's stress-relaxation or creep tests: the measured M(t) or J(t) of each replicate against
     * time (log–log), the best-supported model fitted to all of them, and the residuals below.
     */
    public static Figure timeTest(org.viscarta.analysis.TimeTests.Derived d, String stem) {
        org.viscarta.sweep.TimeTest.Type type = d.type();
        boolean relaxation = type == org.viscarta.sweep.TimeTest.Type.RELAXATION;
        String m = d.sample().kind().letter();
        String symbol = relaxation ? m + "(t)" : "J(t)";
        XYSeriesCollection measured = new XYSeriesCollection();
        XYSeriesCollection residuals = new XYSeriesCollection();
        org.viscarta.fit.FitResult best = d.analysis().best().orElse(null);
        double tLow = Double.POSITIVE_INFINITY;
        double tHigh = 0;
        double largest = 0;
        for (org.viscarta.sweep.TimeTest t : d.tests()) {
            XYSeries sr = new XYSeries("replicate " + t.replicate() + " (measured)");
            XYSeries rr = new XYSeries("replicate " + t.replicate() + " residual");
            for (org.viscarta.sweep.TimeTest.Point p : t.points()) {
                sr.add(p.timeS(), p.value());
                largest = Math.max(largest, p.value());
                if (best != null && best.fitted() != null) {
                    double v = relaxation ? best.fitted().relaxationModulus(p.timeS(), best.values())
                            : best.fitted().creepCompliance(p.timeS(), best.values());
                    rr.add(p.timeS(), Math.log(v / p.value()));
                }
            }
            tLow = Math.min(tLow, t.minTimeS());
            tHigh = Math.max(tHigh, t.maxTimeS());
            measured.addSeries(sr);
            residuals.addSeries(rr);
        }
        int reps = measured.getSeriesCount();
        LogAxis y = logAxis(symbol);
        if (relaxation) {
            inModulusUnit(y, symbol, largest);
        } else {
            y.setLabel(symbol + " [1/Pa]");
            y.setNumberFormatOverride(new DecimalFormat("0.##E0", java.text.DecimalFormatSymbols.getInstance(Locale.ROOT)));
        }
        XYPlot top = new XYPlot();
        top.setRangeAxis(y);
        top.setDataset(0, measured);
        XYLineAndShapeRenderer points = new XYLineAndShapeRenderer(false, true);
        for (int i = 0; i < reps; i++) {
            points.setSeriesPaint(i, Palette.colour(i));
            points.setSeriesShape(i, Palette.shape(i));
        }
        top.setRenderer(0, points);
        String title = shortName(d.sample().name());
        if (best != null && best.fitted() != null) {
            XYSeriesCollection model = new XYSeriesCollection();
            XYSeries cs = new XYSeries(best.model() + ", fitted to all replicates");
            for (int k = 0; k < CURVE_POINTS; k++) {
                double t = tLow * Math.pow(tHigh / tLow, k / (double) (CURVE_POINTS - 1));
                cs.add(t, relaxation ? best.fitted().relaxationModulus(t, best.values()) : best.fitted().creepCompliance(t, best.values()));
            }
            model.addSeries(cs);
            top.setDataset(1, model);
            XYLineAndShapeRenderer line = new XYLineAndShapeRenderer(true, false);
            line.setSeriesPaint(0, Color.BLACK);
            line.setSeriesStroke(0, new BasicStroke(1.6f));
            top.setRenderer(1, line);
            title += ": " + best.model() + " (best supported)";
        }
        XYPlot bottom = new XYPlot();
        NumberAxis ry = new NumberAxis(RESIDUAL_LABEL);
        ry.setLabelFont(Palette.LABEL);
        ry.setTickLabelFont(Palette.TICK);
        bottom.setRangeAxis(ry);
        bottom.addRangeMarker(new ValueMarker(0, Color.GRAY, new BasicStroke(0.8f)));
        showResiduals(bottom, ry, residuals);
        JFreeChart c = withResiduals(title, domainLogAxis("time since the step [s]"), top, bottom);
        return new Figure(stem, "The " + type.test() + " test of " + shortName(d.sample().name()) + ": the measured " + type.quantity()
                + " " + symbol + " of each replicate against time, " + (best == null ? "no model converged"
                : "the best-supported model " + best.model() + " fitted to all of them") + ", and the residuals of that fit, "
                + RESIDUAL_MEANING + ". The E′ and "
                + "E″ that rank and match this sample are computed from each replicate's fitted model, not measured.", c);
    }

    /**
     * E′ and E″ (or G′, G″) against frequency with replicate means ± SD, the best-supported model
     * with its 95 % band, and a residual panel below.
     */
    public static Figure fit(Sample s, FittedCurve curve, String stem) {
        return fit(s, curve, stem, false);
    }

    /**
     * A sample's measured moduli with the best model's curve and band, and the residuals.
     *
     * @param reduced the sample is a master curve: frequencies are reduced frequencies a_T·f
     */
    public static Figure fit(Sample s, FittedCurve curve, String stem, boolean reduced) {
        String m = s.kind().letter();
        PlotData pd = PlotData.of(s, curve);
        YIntervalSeriesCollection measured = new YIntervalSeriesCollection();
        YIntervalSeries ms = new YIntervalSeries(m + "′ measured (mean ± SD of replicates)");
        YIntervalSeries ml = new YIntervalSeries(m + "″ measured");
        for (int i = 0; i < pd.frequencyHz().length; i++) {
            ms.add(pd.frequencyHz()[i], pd.storage()[i], pd.storageLow()[i], pd.storageHigh()[i]);
            ml.add(pd.frequencyHz()[i], pd.loss()[i], pd.lossLow()[i], pd.lossHigh()[i]);
        }
        measured.addSeries(ms);
        measured.addSeries(ml);
        XYPlot top = new XYPlot();
        LogAxis moduli = logAxis("moduli");
        inModulusUnit(moduli, "moduli " + m + "′, " + m + "″", largest(measured, true));
        top.setRangeAxis(moduli);
        top.setDataset(0, measured);
        XYErrorRenderer points = new XYErrorRenderer();
        points.setDrawXError(false);
        points.setDefaultLinesVisible(false);
        for (int i = 0; i < 2; i++) {
            points.setSeriesPaint(i, Palette.colour(i));
            points.setSeriesShape(i, Palette.shape(i));
        }
        points.setErrorPaint(Color.DARK_GRAY);
        top.setRenderer(0, points);
        XYPlot residuals = new XYPlot();
        NumberAxis ry = new NumberAxis(RESIDUAL_LABEL);
        ry.setLabelFont(Palette.LABEL);
        ry.setTickLabelFont(Palette.TICK);
        residuals.setRangeAxis(ry);
        residuals.addRangeMarker(new ValueMarker(0, Color.GRAY, new BasicStroke(0.8f)));
        String title = shortName(s.name());
        if (curve != null) {
            YIntervalSeriesCollection model = new YIntervalSeriesCollection();
            YIntervalSeries cs = new YIntervalSeries(curve.model().id() + " " + m + "′ (95 % band)");
            YIntervalSeries cl = new YIntervalSeries(curve.model().id() + " " + m + "″");
            for (int k = 0; k < pd.curveHz().length; k++) {
                cs.add(pd.curveHz()[k], pd.curveStorage()[k], pd.curveStorageLow()[k], pd.curveStorageHigh()[k]);
                cl.add(pd.curveHz()[k], pd.curveLoss()[k], pd.curveLossLow()[k], pd.curveLossHigh()[k]);
            }
            model.addSeries(cs);
            model.addSeries(cl);
            top.setDataset(1, model);
            DeviationRenderer lines = new DeviationRenderer(true, false);
            lines.setDrawSeriesLineAsPath(true);
            for (int i = 0; i < 2; i++) {
                lines.setSeriesPaint(i, Palette.colour(i));
                lines.setSeriesFillPaint(i, Palette.band(i));
                lines.setSeriesStroke(i, Palette.line(i));
            }
            lines.setAlpha(0.25f);
            top.setRenderer(1, lines);
            XYSeriesCollection res = new XYSeriesCollection();
            XYSeries rs = new XYSeries(m + "′ residual");
            XYSeries rl = new XYSeries(m + "″ residual");
            for (int i = 0; i < pd.frequencyHz().length; i++) {
                rs.add(pd.frequencyHz()[i], pd.residualStorage()[i]);
                rl.add(pd.frequencyHz()[i], pd.residualLoss()[i]);
            }
            res.addSeries(rs);
            res.addSeries(rl);
            showResiduals(residuals, ry, res);
            title = shortName(s.name()) + ": " + curve.model().id() + (curve.covariance() == null
                    ? " (best supported; parameters not determined by the data)" : " (best supported)");
        }
        JFreeChart c = withResiduals(title, frequencyAxis(reduced), top, residuals);
        return new Figure(stem, "Storage and loss moduli of " + shortName(s.name()) + " against frequency (replicate mean ± SD), the "
                + (curve == null ? "no model converged" : "best-supported model " + curve.model().id() + " with its 95 % band")
                + ", and the residuals of the fit, " + RESIDUAL_MEANING + ".", c);
    }

    /**
     * Puts a moduli axis in the unit that suits its data — Pa, kPa, MPa or GPa, from the largest value
     * shown — with tick labels in plain numbers of that unit (1, 10, 100 rather than 1E3).
     *
     * @param label the quantity, e.g. "moduli E′, E″"; the unit is added in brackets
     */
    static void inModulusUnit(LogAxis axis, String label, double largestPa) {
        String[] units = {"Pa", "kPa", "MPa", "GPa"};
        int k = 0;
        while (k < units.length - 1 && largestPa >= Math.pow(1000, k + 1)) {
            k++;
        }
        double factor = Math.pow(1000, k);
        axis.setLabel(label + " [" + units[k] + "]");
        axis.setNumberFormatOverride(new Scaled(factor));
    }

    /** The largest finite value of a dataset's y (or x) values. */
    static double largest(org.jfree.data.xy.XYDataset d, boolean y) {
        double max = 0;
        for (int sr = 0; sr < d.getSeriesCount(); sr++) {
            for (int i = 0; i < d.getItemCount(sr); i++) {
                double v = y ? d.getYValue(sr, i) : d.getXValue(sr, i);
                if (Double.isFinite(v)) {
                    max = Math.max(max, v);
                }
            }
        }
        return max;
    }

    /**
     * A logarithmic axis whose ticks a reader can use whatever the span: every decade when the data
     * span more than 2.5 decades (with unlabelled minor ticks between), 1-2-5 in each decade down
     * to one decade, and 1, 1.5, 2, 3, 4, 5, 7 below that — never a lone tick. Labels come from the
     * axis's number format (plain numbers, in the unit the axis states).
     */
    static final class ReadableLogAxis extends LogAxis {
        private static final long serialVersionUID = 1L;

        ReadableLogAxis(String label) {
            super(label);
        }

        @Override
        protected java.util.List refreshTicksHorizontal(java.awt.Graphics2D g2, java.awt.geom.Rectangle2D dataArea,
                                                        org.jfree.chart.ui.RectangleEdge edge) {
            org.jfree.chart.ui.TextAnchor anchor = edge == org.jfree.chart.ui.RectangleEdge.TOP
                    ? org.jfree.chart.ui.TextAnchor.BOTTOM_CENTER : org.jfree.chart.ui.TextAnchor.TOP_CENTER;
            return ticks(anchor);
        }

        @Override
        protected java.util.List refreshTicksVertical(java.awt.Graphics2D g2, java.awt.geom.Rectangle2D dataArea,
                                                      org.jfree.chart.ui.RectangleEdge edge) {
            org.jfree.chart.ui.TextAnchor anchor = edge == org.jfree.chart.ui.RectangleEdge.RIGHT
                    ? org.jfree.chart.ui.TextAnchor.CENTER_LEFT : org.jfree.chart.ui.TextAnchor.CENTER_RIGHT;
            return ticks(anchor);
        }

        /** The ticks for the current range. */
        java.util.List<org.jfree.chart.axis.ValueTick> ticks(org.jfree.chart.ui.TextAnchor anchor) {
            double lo = getRange().getLowerBound();
            double hi = getRange().getUpperBound();
            java.util.List<org.jfree.chart.axis.ValueTick> out = new ArrayList<>();
            if (!(lo > 0) || !(hi > lo) || Double.isInfinite(hi)) {
                return out;
            }
            double span = Math.log10(hi / lo);
            double[] labelled = span > 2.5 ? new double[] {1} : span >= 1 ? new double[] {1, 2, 5} : new double[] {1, 1.5, 2, 3, 4, 5, 7};
            java.text.NumberFormat fmt = getNumberFormatOverride() != null ? getNumberFormatOverride()
                    : new DecimalFormat("0.#####", java.text.DecimalFormatSymbols.getInstance(Locale.ROOT));
            for (int k = (int) Math.floor(Math.log10(lo)) - 1; k <= (int) Math.ceil(Math.log10(hi)); k++) {
                double decade = Math.pow(10, k);
                for (int m = 1; m <= 9; m++) {
                    double v = m * decade;
                    if (v < lo * (1 - 1e-9) || v > hi * (1 + 1e-9)) {
                        continue;
                    }
                    final int mult = m;
                    boolean label = java.util.Arrays.stream(labelled).anyMatch(x -> x == mult);
                    if (label) {
                        out.add(new org.jfree.chart.axis.NumberTick(org.jfree.chart.axis.TickType.MAJOR, v, fmt.format(v), anchor,
                                anchor, 0.0));
                    } else if (span > 2.5) {
                        out.add(new org.jfree.chart.axis.NumberTick(org.jfree.chart.axis.TickType.MINOR, v, "", anchor, anchor, 0.0));
                    }
                }
                if (labelled.length == 7) {
                    double v = 1.5 * decade;
                    if (v >= lo && v <= hi) {
                        out.add(new org.jfree.chart.axis.NumberTick(org.jfree.chart.axis.TickType.MAJOR, v, fmt.format(v), anchor,
                                anchor, 0.0));
                    }
                }
            }
            if (out.stream().filter(t -> t.getTickType() == org.jfree.chart.axis.TickType.MAJOR).count() < 2) {
                // a span too short for round numbers: the ends and the middle, to two significant figures more than they differ
                out.clear();
                for (double v : new double[] {lo * Math.pow(hi / lo, 0.1), Math.sqrt(lo * hi), hi * Math.pow(lo / hi, 0.1)}) {
                    out.add(new org.jfree.chart.axis.NumberTick(org.jfree.chart.axis.TickType.MAJOR, v,
                            String.format(Locale.ROOT, "%.3g", v), anchor, anchor, 0.0));
                }
            }
            return out;
        }
    }

    /** Tick labels of values divided by a unit factor, in plain notation. */
    static final class Scaled extends java.text.NumberFormat {
        private static final long serialVersionUID = 1L;
        private final double factor;
        private final DecimalFormat plain = new DecimalFormat("0.####", java.text.DecimalFormatSymbols.getInstance(Locale.ROOT));

        Scaled(double factor) {
            this.factor = factor;
        }

        @Override
        public StringBuffer format(double number, StringBuffer to, java.text.FieldPosition pos) {
            return plain.format(number / factor, to, pos);
        }

        @Override
        public StringBuffer format(long number, StringBuffer to, java.text.FieldPosition pos) {
            return plain.format(number / factor, to, pos);
        }

        @Override
        public Number parse(String source, java.text.ParsePosition pos) {
            return null;
        }
    }

    /** Names longer than this are shortened in titles, legends, axis labels and captions (tables keep them whole). */
    static final int NAME_IN_FIGURE = 60;

    /** A name as a figure shows it: whole up to {@value #NAME_IN_FIGURE} characters, else its start and "…". */
    static String shortName(String name) {
        return name.length() <= NAME_IN_FIGURE ? name : name.substring(0, NAME_IN_FIGURE - 1) + "…";
    }

    /** The 1, 2 or 5 times a power of ten nearest above {@code x}, a readable tick step. */
    static double niceStep(double x) {
        double p = Math.pow(10, Math.floor(Math.log10(x)));
        double m = x / p;
        return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * p;
    }

    /** ln M′ and its SE, ln M″ and its SE, from the curve's covariance (delta method); SE 0 when unknown. */
    static double[] logBand(FittedCurve curve, double[] p, double f) {
        double w = 2 * Math.PI * f;
        double[] base = new double[2];
        curve.model().modulus(w, p, base);
        double[][] cov = curve.covariance();
        if (cov == null) {
            return new double[] {base[0], 0, base[1], 0};
        }
        double[] m = new double[2];
        double[] gs = DeltaMethod.gradient(x -> {
            curve.model().modulus(w, x, m);
            return Math.log(m[0]);
        }, p, 1e-6, 1e-12);
        double[] gl = DeltaMethod.gradient(x -> {
            curve.model().modulus(w, x, m);
            return Math.log(m[1]);
        }, p, 1e-6, 1e-12);
        return new double[] {base[0], Math.sqrt(Math.max(DeltaMethod.variance(gs, cov), 0)), base[1],
            Math.sqrt(Math.max(DeltaMethod.variance(gl, cov), 0))};
    }

    /**
     * tan δ against frequency, one series (replicate geometric mean) per sample; when there are more
     * samples than colours and they carry groups, one panel per group, so that no colour repeats
     * within a panel.
     */
    public static Figure tanDelta(List<Sample> samples) {
        return tanDelta(samples, 0);
    }

    /**
     * As {@link #tanDelta(List)}, where {@code seriesLeftOut} temperatures of temperature series were
     * left out of {@code samples} (their master curves stay): the caption says where they are shown.
     */
    public static Figure tanDelta(List<Sample> samples, int seriesLeftOut) {
        Map<String, List<Sample>> byGroup = new java.util.LinkedHashMap<>();
        for (Sample s : samples) {
            byGroup.computeIfAbsent(s.group().isEmpty() ? "no group" : s.group(), g -> new ArrayList<>()).add(s);
        }
        String caption = "Loss tangent tan δ = E″/E′ against frequency for every sample (geometric mean of replicates); higher "
                + "means more damping."
                + (seriesLeftOut > 0 ? " The " + seriesLeftOut + " single temperatures of temperature series are shown in their "
                + "master-curve and van Gurp–Palmen figures; their master curves (at reduced frequency a_T·f) are here." : "");
        if (samples.size() <= Palette.colours() || byGroup.size() < 2) {
            XYPlot plot = tanDeltaPlot(samples, logAxis("loss tangent tan δ [–]"));
            return new Figure("tan-delta", caption, chart("Loss tangent of every sample", plot, samples.size() <= 24));
        }
        CombinedDomainXYPlot combined = new CombinedDomainXYPlot(frequencyAxis());
        combined.setGap(8);
        double fLow = Double.POSITIVE_INFINITY;
        double fHigh = 0;
        for (Sample s : samples) {
            for (Aggregate a : aggregate(s)) {
                fLow = Math.min(fLow, a.f());
                fHigh = Math.max(fHigh, a.f());
            }
        }
        int panelsHeight = 0;
        for (Map.Entry<String, List<Sample>> e : byGroup.entrySet()) {
            XYPlot panel = tanDeltaPlot(e.getValue(), logAxis(shortName(e.getKey()) + ": tan δ [–]"));
            org.jfree.chart.title.LegendTitle legend = panelLegend(panel);
            // a panel is tall enough for its legend, which goes into the corner the data leave freest
            int entries = e.getValue().size();
            int height = Math.max(150, 24 + LEGEND_LINE_PT * entries);
            int longest = e.getValue().stream().mapToInt(x -> shortName(x.name()).length()).max().orElse(10);
            double w = Math.min(1, (24 + 6.0 * longest) / DATA_WIDTH_PT);
            double h = Math.min(1, (8.0 + LEGEND_LINE_PT * entries) / (height - 10));
            double[] corner = freestCorner(e.getValue(), fLow, fHigh, w, h);
            panel.addAnnotation(atCorner(legend, corner));
            combined.add(panel, height);
            panelsHeight += height + 8;
        }
        JFreeChart c = stacked("Loss tangent of every sample, by group", combined);
        int height = Math.max(Figure.HEIGHT_PT, 80 + panelsHeight);
        return new Figure("tan-delta", caption + " One panel per group.", c, height);
    }

    /** Width of the bins in which many samples' curves are summarised [decades]. */
    static final double BIN_DECADES = 0.2;
    /** Fewest samples a bin needs before its quantiles are drawn. */
    static final int BIN_MIN_SAMPLES = 5;

    /** One curve of a sample: x and y values, both positive (drawn on log axes). */
    record Curve(String group, double[] x, double[] y) {
    }

    /**
     * The distribution of many samples' curves: for each group (all samples pooled when there are
     * more groups than colours), in bins of {@value #BIN_DECADES} decade of x, each sample's
     * geometric mean in the bin (its arithmetic mean where it has zeros), and across the samples
     * the median or, with {@code mean}, the mean (a line), the quartiles (a band) and the 10th and 90th percentiles (thin dashed
     * lines). A bin is drawn where at least {@value #BIN_MIN_SAMPLES} samples have points in it.
     *
     * @param floor values below it are drawn at it (a log axis cannot show zero); 0 for none
     * @return the plot: one band and two dashed lines per group
     */
    private static XYPlot distributionPlot(List<Curve> curves, LogAxis x, LogAxis y, double floor, boolean mean) {
        Map<String, List<Curve>> byGroup = new java.util.LinkedHashMap<>();
        for (Curve c : curves) {
            byGroup.computeIfAbsent(c.group().isEmpty() ? "no group" : c.group(), g -> new ArrayList<>()).add(c);
        }
        if (byGroup.size() > Palette.colours()) {
            byGroup = Map.of("all samples", curves);
        }
        YIntervalSeriesCollection bands = new YIntervalSeriesCollection();
        XYSeriesCollection tails = new XYSeriesCollection();
        for (Map.Entry<String, List<Curve>> e : byGroup.entrySet()) {
            Map<Long, List<double[]>> bins = new TreeMap<>();
            for (Curve c : e.getValue()) {
                Map<Long, double[]> own = new java.util.HashMap<>(); // bin → {Σ ln x, Σ y, Σ ln y, n, zeros}
                for (int i = 0; i < c.x().length; i++) {
                    if (!(c.x()[i] > 0) || !(c.y()[i] >= 0) || !Double.isFinite(c.y()[i])) {
                        continue;
                    }
                    long bin = (long) Math.floor(Math.log10(c.x()[i]) / BIN_DECADES);
                    double[] acc = own.computeIfAbsent(bin, b -> new double[5]);
                    acc[0] += Math.log(c.x()[i]);
                    acc[1] += c.y()[i];
                    acc[2] += c.y()[i] > 0 ? Math.log(c.y()[i]) : 0;
                    acc[3]++;
                    acc[4] += c.y()[i] > 0 ? 0 : 1;
                }
                own.forEach((bin, acc) -> bins.computeIfAbsent(bin, b -> new ArrayList<>())
                        .add(new double[] {acc[0] / acc[3], acc[4] > 0 ? acc[1] / acc[3] : Math.exp(acc[2] / acc[3])}));
            }
            String key = shortName(e.getKey()) + String.format(Locale.ROOT, " (%,d): ", e.getValue().size())
                    + (mean ? "mean, quartiles" : "median, quartiles");
            YIntervalSeries band = new YIntervalSeries(key);
            XYSeries p10 = new XYSeries(e.getKey() + " p10");
            XYSeries p90 = new XYSeries(e.getKey() + " p90");
            for (List<double[]> bin : bins.values()) {
                if (bin.size() < BIN_MIN_SAMPLES) {
                    continue;
                }
                double xm = Math.exp(bin.stream().mapToDouble(v -> v[0]).average().orElseThrow());
                double[] v = bin.stream().mapToDouble(b -> Math.max(b[1], floor)).sorted().toArray();
                double centre = mean ? java.util.Arrays.stream(v).average().orElseThrow() : org.viscarta.sweep.Numbers.quantile(v, 0.5);
                band.add(xm, centre, org.viscarta.sweep.Numbers.quantile(v, 0.25), org.viscarta.sweep.Numbers.quantile(v, 0.75));
                p10.add(xm, org.viscarta.sweep.Numbers.quantile(v, 0.10));
                p90.add(xm, org.viscarta.sweep.Numbers.quantile(v, 0.90));
            }
            bands.addSeries(band);
            tails.addSeries(p10);
            tails.addSeries(p90);
        }
        XYPlot plot = new XYPlot(bands, x, y, null);
        DeviationRenderer lines = new DeviationRenderer(true, false);
        lines.setDrawSeriesLineAsPath(true);
        XYLineAndShapeRenderer dashed = new XYLineAndShapeRenderer(true, false);
        for (int i = 0; i < bands.getSeriesCount(); i++) {
            lines.setSeriesPaint(i, Palette.colour(i));
            lines.setSeriesFillPaint(i, Palette.band(i));
            lines.setSeriesStroke(i, Palette.line(i));
            for (int t = 0; t < 2; t++) {
                dashed.setSeriesPaint(2 * i + t, Palette.colour(i));
                dashed.setSeriesStroke(2 * i + t, new java.awt.BasicStroke(0.6f, java.awt.BasicStroke.CAP_BUTT,
                        java.awt.BasicStroke.JOIN_MITER, 10f, new float[] {2f, 2f}, 0f));
                dashed.setSeriesVisibleInLegend(2 * i + t, false);
            }
        }
        lines.setAlpha(0.25f);
        plot.setRenderer(0, lines);
        plot.setDataset(1, tails);
        plot.setRenderer(1, dashed);
        return plot;
    }

    /** Words for a distribution figure's caption. */
    private static String distributionWords(int samples, boolean mean) {
        return " With " + String.format(Locale.ROOT, "%,d", samples) + " samples, the figure shows their distribution instead of one "
                + "curve each: in bins of " + BIN_DECADES + " decade, the " + (mean ? "mean" : "median") + " across samples (line"
                + (mean ? "; the spectrum of the samples' mean modulus, as E* is linear in H" : "") + "), the quartiles (band) and "
                + "the 10th and 90th percentiles (dashed), where at least " + BIN_MIN_SAMPLES + " samples have points; every "
                + "sample's values are in the workbook.";
    }

    /** tan δ against frequency of many samples as a distribution (see {@link #distributionPlot}). */
    public static Figure tanDeltaDistribution(List<Sample> samples, int seriesLeftOut) {
        List<Curve> curves = new ArrayList<>();
        for (Sample s : samples) {
            List<Aggregate> agg = aggregate(s);
            curves.add(new Curve(s.group(), agg.stream().mapToDouble(Aggregate::f).toArray(),
                    agg.stream().mapToDouble(Aggregate::tanDelta).toArray()));
        }
        XYPlot plot = distributionPlot(curves, frequencyAxis(), logAxis("loss tangent tan δ [–]"), 0, false);
        String caption = "Loss tangent tan δ = E″/E′ against frequency (geometric mean of each sample's replicates); higher means "
                + "more damping." + distributionWords(samples.size(), false)
                + (seriesLeftOut > 0 ? " The " + seriesLeftOut + " single temperatures of temperature series are left out; their "
                + "master curves are in." : "");
        return new Figure("tan-delta", caption, chart("Loss tangent of " + String.format(Locale.ROOT, "%,d", samples.size())
                + " samples: distribution", plot, true));
    }

    /** Relaxation spectra of many samples as a distribution (see {@link #distributionPlot}). */
    public static Figure spectraDistribution(List<SampleAnalysis> samples) {
        List<Curve> curves = new ArrayList<>();
        double top = 0;
        for (SampleAnalysis sa : samples) {
            var r = sa.spectrum().orElseThrow();
            curves.add(new Curve(sa.sample().group(), r.tau(), r.h()));
            top = Math.max(top, java.util.Arrays.stream(r.h()).max().orElse(0));
        }
        LogAxis tauAxis = logAxis("relaxation time τ [s]");
        tauAxis.setNumberFormatOverride(new DecimalFormat("0.####", java.text.DecimalFormatSymbols.getInstance(Locale.ROOT)));
        LogAxis y = logAxis("H(τ)");
        inModulusUnit(y, "H(τ)", top);
        XYPlot plot = distributionPlot(curves, tauAxis, y, FLOOR * top, true);
        y.setLowerBound(FLOOR * top * 0.8);
        y.setAutoRange(false);
        y.setUpperBound(top * 1.5);
        return new Figure("spectra", "Relaxation spectra H(τ): how much modulus relaxes near each relaxation time τ, from E′ and "
                + "E″ by regularised non-negative least squares over the measured window and half a decade beyond; peaks are "
                + "relaxation processes; the bottom of the panel stands for zero." + distributionWords(samples.size(), true),
                chart("Relaxation spectra of " + String.format(Locale.ROOT, "%,d", samples.size()) + " samples: distribution", plot,
                        true));
    }

    /** A panel's own legend, one entry a line, on a half-transparent white ground (placed by a {@link CornerTitle}). */
    private static org.jfree.chart.title.LegendTitle panelLegend(XYPlot panel) {
        org.jfree.chart.title.LegendTitle legend = new org.jfree.chart.title.LegendTitle(panel,
                new org.jfree.chart.block.ColumnArrangement(), new org.jfree.chart.block.ColumnArrangement());
        legend.setItemFont(Palette.TICK);
        legend.setBackgroundPaint(new Color(255, 255, 255, 150));
        return legend;
    }

    /** A chart of panels stacked over one shared axis, each panel with its legend inside. */
    private static JFreeChart stacked(String title, CombinedDomainXYPlot combined) {
        JFreeChart c = new JFreeChart(title, Palette.TITLE, combined, false);
        for (Object p : combined.getSubplots()) {
            finish(c, (XYPlot) p);
        }
        c.setBackgroundPaint(Color.WHITE);
        return c;
    }

    /** Where a spectrum's zero is drawn, relative to the largest H of its panel (a log axis cannot show zero). */
    private static final double FLOOR = 1e-3;

    /**
     * The relaxation spectra H(τ) of the samples that have one, one panel per group (log–log; H below
     * a thousandth of a panel's largest, zero included, is drawn at that floor).
     */
    public static Figure spectra(List<SampleAnalysis> samples) {
        Map<String, List<SampleAnalysis>> byGroup = new java.util.LinkedHashMap<>();
        for (SampleAnalysis sa : samples) {
            if (sa.spectrum().isPresent()) {
                byGroup.computeIfAbsent(sa.sample().group().isEmpty() ? "no group" : sa.sample().group(), g -> new ArrayList<>()).add(sa);
            }
        }
        LogAxis tauAxis = logAxis("relaxation time τ [s]");
        tauAxis.setNumberFormatOverride(new DecimalFormat("0.####", java.text.DecimalFormatSymbols.getInstance(Locale.ROOT)));
        CombinedDomainXYPlot combined = new CombinedDomainXYPlot(tauAxis);
        combined.setGap(8);
        double tauLow = Double.POSITIVE_INFINITY;
        double tauHigh = 0;
        for (List<SampleAnalysis> group : byGroup.values()) {
            for (SampleAnalysis sa : group) {
                for (double t : sa.spectrum().get().tau()) {
                    tauLow = Math.min(tauLow, t);
                    tauHigh = Math.max(tauHigh, t);
                }
            }
        }
        double tauSpan = Math.log(tauHigh / tauLow);
        int panelsHeight = 0;
        for (Map.Entry<String, List<SampleAnalysis>> e : byGroup.entrySet()) {
            XYSeriesCollection data = new XYSeriesCollection();
            java.util.Set<String> keys = new java.util.HashSet<>();
            double top = 0;
            for (SampleAnalysis sa : e.getValue()) {
                top = Math.max(top, java.util.Arrays.stream(sa.spectrum().get().h()).max().orElse(0));
            }
            for (SampleAnalysis sa : e.getValue()) {
                String key = shortName(sa.sample().name());
                for (int k = 2; !keys.add(key); k++) {
                    key = shortName(sa.sample().name()) + " (" + k + ")";
                }
                XYSeries series = new XYSeries(key);
                var r = sa.spectrum().get();
                for (int j = 0; j < r.tau().length; j++) {
                    series.add(r.tau()[j], Math.max(r.h()[j], FLOOR * top)); // zero drawn at the panel's floor
                }
                data.addSeries(series);
            }
            LogAxis y = logAxis("H(τ)");
            inModulusUnit(y, shortName(e.getKey()) + ": H(τ)", largest(data, true));
            y.setLowerBound(FLOOR * top * 0.8);
            y.setAutoRange(false);
            y.setUpperBound(top * 1.5);
            XYPlot panel = new XYPlot(data, null, y, null);
            XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, false);
            for (int i = 0; i < data.getSeriesCount(); i++) {
                r.setSeriesPaint(i, Palette.colour(i));
                r.setSeriesStroke(i, Palette.line(i));
            }
            panel.setRenderer(r);
            org.jfree.chart.title.LegendTitle legend = panelLegend(panel);
            int height = Math.max(150, 24 + LEGEND_LINE_PT * data.getSeriesCount());
            // the legend goes into the corner the curves leave freest (positions on the shared τ axis,
            // which pads its range by 5 % each side, and on the panel's own H axis)
            List<double[]> unit = new ArrayList<>();
            double hSpan = Math.log(y.getUpperBound() / y.getLowerBound());
            int longest = 10;
            for (int i = 0; i < data.getSeriesCount(); i++) {
                XYSeries series = data.getSeries(i);
                longest = Math.max(longest, series.getKey().toString().length());
                for (int j = 0; j < series.getItemCount(); j++) {
                    double t = series.getX(j).doubleValue();
                    double hv = series.getY(j).doubleValue();
                    unit.add(new double[] {tauSpan > 0 ? (Math.log(t / tauLow) / tauSpan + 0.05) / 1.1 : 0.5,
                        Math.log(hv / y.getLowerBound()) / hSpan});
                }
            }
            double w = Math.min(1, (24 + 6.0 * longest) / DATA_WIDTH_PT);
            double h = Math.min(1, (8.0 + LEGEND_LINE_PT * data.getSeriesCount()) / (height - 10));
            panel.addAnnotation(atCorner(legend, freestCorner(unit, w, h)));
            combined.add(panel, height);
            panelsHeight += height + 8;
        }
        JFreeChart c = stacked("Relaxation spectra H(τ), by group", combined);
        return new Figure("spectra", "Relaxation spectra H(τ): how much modulus relaxes near each relaxation time τ, from E′ and "
                + "E″ by regularised non-negative least squares over the measured window and half a decade beyond; peaks are "
                + "relaxation processes, a curve still high at an end reaches beyond the measured frequencies; the bottom of each "
                + "panel stands for zero. The single temperatures of a temperature series are left out (their master curve "
                + "is shown).", c,
                Math.max(Figure.HEIGHT_PT, 80 + panelsHeight));
    }

    /**
     * A title (a panel's legend) drawn at a position relative to the data area. JFreeChart's
     * XYTitleAnnotation interpolates its relative position in data units, which on a log axis puts
     * "the left edge" in the middle of the panel.
     */
    static final class CornerTitle extends org.jfree.chart.annotations.AbstractXYAnnotation {
        private static final long serialVersionUID = 1L;
        private final double x;
        private final double y;
        private final org.jfree.chart.title.Title title;
        private final org.jfree.chart.ui.RectangleAnchor anchor;

        /** @param x, y the anchor's position, 0 … 1 from the left and from the bottom of the data area */
        CornerTitle(double x, double y, org.jfree.chart.title.Title title, org.jfree.chart.ui.RectangleAnchor anchor) {
            this.x = x;
            this.y = y;
            this.title = title;
            this.anchor = anchor;
        }

        @Override
        public void draw(java.awt.Graphics2D g2, XYPlot plot, java.awt.geom.Rectangle2D dataArea,
                         org.jfree.chart.axis.ValueAxis domainAxis, org.jfree.chart.axis.ValueAxis rangeAxis, int rendererIndex,
                         org.jfree.chart.plot.PlotRenderingInfo info) {
            org.jfree.chart.block.RectangleConstraint rc = new org.jfree.chart.block.RectangleConstraint(
                    new org.jfree.data.Range(0, dataArea.getWidth()), new org.jfree.data.Range(0, dataArea.getHeight()));
            org.jfree.chart.ui.Size2D size = title.arrange(g2, rc);
            double ax = dataArea.getX() + x * dataArea.getWidth();
            double ay = dataArea.getY() + (1 - y) * dataArea.getHeight();
            title.draw(g2, org.jfree.chart.ui.RectangleAnchor.createRectangle(size, ax, ay, anchor));
        }
    }

    /** Height of one legend line [points], and the approximate width of a panel's data area. */
    private static final int LEGEND_LINE_PT = 15;
    private static final double DATA_WIDTH_PT = Figure.WIDTH_PT - 80;

    /**
     * The corner of a tan δ panel where a legend box of relative size w × h covers the fewest
     * measured points (ties: top right, then top left, bottom right, bottom left), as the relative
     * position of the box's outer corner. Positions are taken on the log scales of the shared
     * frequency range and of the panel's own tan δ range.
     */
    static double[] freestCorner(List<Sample> samples, double fLow, double fHigh, double w, double h) {
        double tLow = Double.POSITIVE_INFINITY;
        double tHigh = 0;
        List<double[]> points = new ArrayList<>();
        for (Sample s : samples) {
            for (Aggregate a : aggregate(s)) {
                if (a.tanDelta() > 0 && Double.isFinite(a.tanDelta())) {
                    points.add(new double[] {a.f(), a.tanDelta()});
                    tLow = Math.min(tLow, a.tanDelta());
                    tHigh = Math.max(tHigh, a.tanDelta());
                }
            }
        }
        double fSpan = Math.log(fHigh / fLow);
        double tSpan = Math.log(tHigh / tLow);
        List<double[]> unit = new ArrayList<>(points.size());
        for (double[] p : points) {
            unit.add(new double[] {fSpan > 0 ? Math.log(p[0] / fLow) / fSpan : 0.5,
                tSpan > 0 ? 0.05 + 0.9 * Math.log(p[1] / tLow) / tSpan : 0.5}); // the axis pads its range
        }
        return freestCorner(unit, w, h);
    }

    /**
     * The corner where a legend box of relative size w × h covers the fewest of the points, given
     * as positions 0 … 1 across and up the data area (ties: top right, then top left, bottom right,
     * bottom left), as the relative position of the box's outer corner.
     */
    static double[] freestCorner(List<double[]> unitPoints, double w, double h) {
        double[][] corners = {{0.995, 0.98}, {0.005, 0.98}, {0.995, 0.02}, {0.005, 0.02}};
        double[] best = corners[0];
        int fewest = Integer.MAX_VALUE;
        for (double[] c : corners) {
            int covered = 0;
            for (double[] p : unitPoints) {
                boolean inX = c[0] > 0.5 ? p[0] >= 1 - w - 0.02 : p[0] <= w + 0.02;
                boolean inY = c[1] > 0.5 ? p[1] >= 1 - h - 0.03 : p[1] <= h + 0.03;
                if (inX && inY) {
                    covered++;
                }
            }
            if (covered < fewest) {
                fewest = covered;
                best = c;
            }
        }
        return best;
    }

    /** A legend annotation anchored at a corner chosen by {@link #freestCorner(List, double, double)}. */
    private static CornerTitle atCorner(org.jfree.chart.title.LegendTitle legend, double[] corner) {
        return new CornerTitle(corner[0], corner[1], legend,
                corner[0] > 0.5 ? (corner[1] > 0.5 ? org.jfree.chart.ui.RectangleAnchor.TOP_RIGHT
                        : org.jfree.chart.ui.RectangleAnchor.BOTTOM_RIGHT)
                        : (corner[1] > 0.5 ? org.jfree.chart.ui.RectangleAnchor.TOP_LEFT
                        : org.jfree.chart.ui.RectangleAnchor.BOTTOM_LEFT));
    }

    private static XYPlot tanDeltaPlot(List<Sample> samples, LogAxis y) {
        XYSeriesCollection data = new XYSeriesCollection();
        java.util.Set<String> keys = new java.util.HashSet<>();
        for (Sample s : samples) {
            String key = shortName(s.name());
            for (int k = 2; !keys.add(key); k++) {
                key = shortName(s.name()) + " (" + k + ")";
            }
            XYSeries series = new XYSeries(key);
            for (Aggregate a : aggregate(s)) {
                series.add(a.f(), a.tanDelta());
            }
            data.addSeries(series);
        }
        XYPlot plot = new XYPlot(data, frequencyAxis(), y, null);
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, true);
        r.setDrawSeriesLineAsPath(true);
        for (int i = 0; i < samples.size(); i++) {
            r.setSeriesPaint(i, Palette.colour(i));
            r.setSeriesShape(i, Palette.shape(i));
            r.setSeriesStroke(i, Palette.line(i / Palette.colours()));
        }
        plot.setRenderer(r);
        return plot;
    }

    /**
     * The damping ranking: mean tan δ with its 95 % interval per ranked sample, labelled with the
     * letter group, one colour and marker per comparable set (letters count within a set only).
     * The figure grows with the number of samples so that every one is named.
     */
    public static Figure ranking(org.viscarta.analysis.Ranking ranking, String at) {
        return ranking(ranking, at, java.util.Set.of());
    }

    /**
     * The same, with "(!)" after the samples whose quality checks did not all pass.
     *
     * @param flagged display names of the samples with a quality concern
     */
    public static Figure ranking(org.viscarta.analysis.Ranking ranking, String at, java.util.Set<String> flagged) {
        int total = 0;
        for (org.viscarta.analysis.Ranking.RankedSet set : ranking.sets()) {
            total += (int) set.result().rows().stream().filter(r -> r.rank() > 0).count();
        }
        // a long ranking is drawn as the top and bottom of each set, with a row saying how many lie between
        int perEnd = total <= RANKING_ROWS_DRAWN ? Integer.MAX_VALUE
                : Math.max(3, RANKING_ROWS_DRAWN / 2 / Math.max(1, ranking.sets().size()));
        List<List<DampingRanking.Row<Sample>>> drawn = new ArrayList<>();
        int rows = 0;
        int between = 0;
        for (org.viscarta.analysis.Ranking.RankedSet set : ranking.sets()) {
            List<DampingRanking.Row<Sample>> ranked = set.result().rows().stream().filter(r -> r.rank() > 0).toList();
            List<DampingRanking.Row<Sample>> kept = new ArrayList<>();
            for (int k = 0; k < ranked.size(); k++) {
                if (k < perEnd || k >= ranked.size() - perEnd) {
                    kept.add(ranked.get(k));
                } else if (k == perEnd) {
                    kept.add(null); // the gap
                }
            }
            between += ranked.size() - (kept.contains(null) ? kept.size() - 1 : kept.size());
            rows += kept.size();
            drawn.add(kept);
        }
        XYIntervalSeriesCollection data = new XYIntervalSeriesCollection();
        String[] labels = new String[rows];
        int i = 0;
        int s = 0;
        for (org.viscarta.analysis.Ranking.RankedSet set : ranking.sets()) {
            XYIntervalSeries series = new XYIntervalSeries(set.label());
            List<DampingRanking.Row<Sample>> kept = drawn.get(s++);
            int inSet = (int) set.result().rows().stream().filter(r -> r.rank() > 0).count();
            for (DampingRanking.Row<Sample> r : kept) {
                double y = rows - 1 - i;
                if (r == null) {
                    labels[rows - 1 - i] = "⋮ " + String.format(Locale.ROOT, "%,d", inSet - (kept.size() - 1))
                            + " more, see the Damping ranking sheet";
                    i++;
                    continue;
                }
                ReplicateSummary t = r.tanDelta();
                double lo = Double.isNaN(t.ci95Low()) ? t.mean() : t.ci95Low();
                double hi = Double.isNaN(t.ci95High()) ? t.mean() : t.ci95High();
                series.add(t.mean(), lo, hi, y, y, y);
                labels[rows - 1 - i] = (perEnd < Integer.MAX_VALUE ? r.rank() + ". " : "") + shortName(r.name())
                        + (flagged.contains(r.subject().name()) ? " (!)" : "") + (r.letters().isEmpty() ? "" : "  [" + r.letters() + "]");
                i++;
            }
            data.addSeries(series);
        }
        final int drawnRows = rows;
        final int leftBetween = between;
        NumberAxis x = new NumberAxis("loss tangent tan δ at " + at + " [–]");
        x.setLabelFont(Palette.LABEL);
        x.setTickLabelFont(Palette.TICK);
        x.setAutoRangeIncludesZero(true);
        SymbolAxis y = new SymbolAxis(null, labels);
        y.setTickLabelFont(Palette.TICK);
        y.setGridBandsVisible(false);
        // every sample named: one tick per row, the figure tall enough for the labels not to overlap
        y.setAutoTickUnitSelection(false);
        y.setTickUnit(new NumberTickUnit(1));
        XYErrorRenderer r = new XYErrorRenderer();
        r.setDrawYError(false);
        r.setDefaultLinesVisible(false);
        for (int k = 0; k < data.getSeriesCount(); k++) {
            r.setSeriesPaint(k, Palette.colour(k));
            r.setSeriesShape(k, Palette.shape(k));
        }
        XYPlot plot = new XYPlot(data, x, y, r);
        JFreeChart c = chart("Damping ranking (within a set, samples sharing a letter are not distinguishable)", plot,
                data.getSeriesCount() > 1);
        int height = Math.max(Figure.HEIGHT_PT, 90 + ROW_PT * drawnRows);
        return new Figure("damping-ranking", "Mean tan δ at " + at + " of each ranked sample with its 95 % interval over "
                + "replicates, highest damping at the top of each comparable set; the letters in brackets are the letter "
                + "groups, comparable within a set only." + (flagged.isEmpty() ? "" : " (!) marks a sample whose quality checks "
                + "did not all pass (see Quality).") + (leftBetween == 0 ? "" : " With " + String.format(Locale.ROOT, "%,d", total)
                + " ranked samples, the figure shows the top and bottom " + perEnd + " of each comparable set, numbered by rank; the "
                + String.format(Locale.ROOT, "%,d", leftBetween) + " between are in the Damping ranking sheet."), c, height);
    }

    /** Most rows the ranking figure draws; a longer ranking shows the top and bottom of each set. */
    static final int RANKING_ROWS_DRAWN = 60;

    /** Height given to each sample's row in the ranking figure [points]: room for its label. */
    static final int ROW_PT = 18;

    /** A sample's measured E′ and E″ against the fitted curves of its closest references. */
    public static Figure references(Sample s, List<Matcher.Match> matches, Map<String, FittedCurve> references,
                                    int shown, String stem, boolean reduced) {
        XYSeriesCollection data = new XYSeriesCollection();
        String m = s.kind().letter();
        XYSeries ms = new XYSeries("measured " + m + "′");
        XYSeries ml = new XYSeries("measured " + m + "″");
        for (Aggregate a : aggregate(s)) {
            ms.add(a.f(), a.storage());
            ml.add(a.f(), a.loss());
        }
        data.addSeries(ms);
        data.addSeries(ml);
        int k = 0;
        for (Matcher.Match match : matches) {
            FittedCurve c = references.get(match.reference());
            if (match.rank() == 0 || c == null || k >= shown) {
                continue;
            }
            XYSeries rs = new XYSeries(String.format(Locale.ROOT, "%d. %s (d = %.3f)", match.rank(), shortName(match.reference()),
                    match.result().distance()));
            XYSeries rl = new XYSeries(String.format(Locale.ROOT, "%d. %s %s″", match.rank(), shortName(match.reference()), m));
            double[] out = new double[2];
            double[] p = c.params();
            for (int i = 0; i < CURVE_POINTS; i++) {
                double f = c.lowHz() * Math.pow(c.highHz() / c.lowHz(), i / (double) (CURVE_POINTS - 1));
                c.model().modulus(2 * Math.PI * f, p, out);
                rs.add(f, out[0]);
                rl.add(f, out[1]);
            }
            data.addSeries(rs);
            data.addSeries(rl);
            k++;
        }
        LogAxis moduli = logAxis("moduli");
        inModulusUnit(moduli, "moduli " + m + "′ (solid), " + m + "″ (dashed)", largest(data, true));
        XYPlot plot = new XYPlot(data, frequencyAxis(reduced), moduli, null);
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer();
        // one path per curve, so that the dashes of loss curves run on over densely sampled points
        r.setDrawSeriesLineAsPath(true);
        r.setSeriesLinesVisible(0, false);
        r.setSeriesLinesVisible(1, false);
        r.setSeriesPaint(0, Color.BLACK);
        r.setSeriesPaint(1, Color.BLACK);
        r.setSeriesShape(0, Palette.shape(0));
        r.setSeriesShape(1, Palette.shape(1));
        for (int i = 2; i < data.getSeriesCount(); i++) {
            int ref = (i - 2) / 2;
            r.setSeriesShapesVisible(i, false);
            r.setSeriesPaint(i, Palette.colour(ref + 1));
            r.setSeriesStroke(i, Palette.line((i - 2) % 2 == 0 ? 0 : 1));
            r.setSeriesVisibleInLegend(i, (i - 2) % 2 == 0); // one legend entry a reference: its colour; the axis says which line is which
        }
        plot.setRenderer(r);
        return new Figure(stem, "Measured moduli of " + shortName(s.name()) + " (markers) against the fitted curves of its " + k
                + " closest references (solid: storage, dashed: loss), each within its measured range.",
                chart(shortName(s.name()) + " and its closest references", plot, true));
    }

    /** The master curve: every temperature's E′ and E″ against reduced frequency a_T f, one colour and marker per temperature. */
    public static Figure master(TemperatureSeries ts, String stem) {
        ShiftAnalysis.Result r = ts.result();
        XYSeriesCollection data = new XYSeriesCollection();
        String m = ts.sweeps().get(0).kind().letter();
        for (ShiftAnalysis.Factor f : r.factors()) {
            if (!f.placed()) {
                continue;
            }
            XYSeries ss = new XYSeries(Numbers.plain(f.temperatureC()) + " °C " + m + "′");
            XYSeries sl = new XYSeries(Numbers.plain(f.temperatureC()) + " °C " + m + "″");
            for (Sweep s : ts.sweeps()) {
                if (s.temperatureC() != f.temperatureC()) {
                    continue;
                }
                for (SweepPoint p : s.fittablePoints()) {
                    ss.add(p.frequencyHz() * f.aT(), p.storage() / f.bT());
                    sl.add(p.frequencyHz() * f.aT(), p.loss() / f.bT());
                }
            }
            data.addSeries(ss);
            data.addSeries(sl);
        }
        boolean vertical = r.factors().stream().anyMatch(f -> f.placed() && f.bT() != 1.0);
        LogAxis x = frequencyAxis();
        x.setLabel("reduced frequency a_T·f [Hz] at " + Numbers.plain(r.referenceC()) + " °C");
        LogAxis moduli = logAxis("moduli");
        inModulusUnit(moduli, "moduli " + m + "′ (filled), " + m + "″ (open)" + (vertical ? " divided by b_T" : ""), largest(data, true));
        XYPlot plot = new XYPlot(data, x, moduli, null);
        XYLineAndShapeRenderer rr = new XYLineAndShapeRenderer(false, true);
        for (int i = 0; i < data.getSeriesCount(); i++) {
            rr.setSeriesPaint(i, Palette.colour(i / 2));
            rr.setSeriesShape(i, Palette.shape(i / 2));
            rr.setSeriesShapesFilled(i, i % 2 == 0);
            rr.setSeriesVisibleInLegend(i, i % 2 == 0);
        }
        rr.setUseFillPaint(false);
        plot.setRenderer(rr);
        return new Figure(stem, "Master curve of " + shortName(ts.sample()) + " at " + Numbers.plain(r.referenceC()) + " °C: each temperature's "
                + "storage (filled markers) and loss moduli (open markers) shifted along the frequency axis by its factor a_T"
                + (vertical ? " and divided by its vertical factor b_T." : " (no vertical shift)."),
                chart(shortName(ts.sample()) + ": master curve", plot, true));
    }

    /**
     * A sample's temperature ramps: E′ (filled) and E″ (open) on a logarithmic axis above, tan δ
     * below, one colour per frequency (every replicate's points); vertical lines mark the three
     * glass transition conventions at each frequency (mean of the replicates that gave one), labelled
     * at the frequency nearest 1 Hz.
     */
    public static Figure transition(String sample, List<org.viscarta.temperature.GlassTransition.Result> ramps, String stem) {
        List<Double> freqs = ramps.stream().map(r -> r.ramp().frequencyHz()).distinct().sorted().toList();
        boolean shear = ramps.get(0).ramp().kind() == org.viscarta.sweep.ModulusKind.SHEAR;
        String m = shear ? "G" : "E";
        XYSeriesCollection moduli = new XYSeriesCollection();
        XYSeriesCollection tan = new XYSeriesCollection();
        for (double hz : freqs) {
            XYSeries st = new XYSeries(Numbers.plain(hz) + " Hz", false, true);
            XYSeries lo = new XYSeries(Numbers.plain(hz) + " Hz " + m + "″", false, true);
            XYSeries td = new XYSeries(Numbers.plain(hz) + " Hz", false, true);
            for (org.viscarta.temperature.GlassTransition.Result r : ramps) {
                if (r.ramp().frequencyHz() != hz) {
                    continue;
                }
                for (org.viscarta.sweep.Ramp.Point p : r.ramp().points()) {
                    st.add(p.temperatureC(), p.storage());
                    if (p.loss() > 0) {
                        lo.add(p.temperatureC(), p.loss());
                        td.add(p.temperatureC(), p.lossTangent());
                    }
                }
            }
            moduli.addSeries(st);
            moduli.addSeries(lo);
            tan.addSeries(td);
        }
        NumberAxis temperature = new NumberAxis("temperature [°C]");
        temperature.setLabelFont(Palette.LABEL);
        temperature.setTickLabelFont(Palette.TICK);
        temperature.setAutoRangeIncludesZero(false);
        CombinedDomainXYPlot combined = new CombinedDomainXYPlot(temperature);
        combined.setGap(6);
        LogAxis my = logAxis("moduli");
        inModulusUnit(my, m + "′ (filled), " + m + "″ (open)", largest(moduli, true));
        XYPlot top = new XYPlot(moduli, null, my, null);
        java.awt.Shape dot = new java.awt.geom.Ellipse2D.Double(-1.6, -1.6, 3.2, 3.2);
        XYLineAndShapeRenderer rm = new XYLineAndShapeRenderer(false, true);
        for (int i = 0; i < moduli.getSeriesCount(); i++) {
            rm.setSeriesPaint(i, Palette.colour(i / 2));
            rm.setSeriesShape(i, dot);
            rm.setSeriesShapesFilled(i, i % 2 == 0);
            rm.setSeriesVisibleInLegend(i, i % 2 == 0);
        }
        rm.setUseFillPaint(false);
        top.setRenderer(rm);
        NumberAxis ty = new NumberAxis("tan δ [–]");
        ty.setLabelFont(Palette.LABEL);
        ty.setTickLabelFont(Palette.TICK);
        XYPlot bottom = new XYPlot(tan, null, ty, null);
        XYLineAndShapeRenderer rt = new XYLineAndShapeRenderer(false, true);
        for (int i = 0; i < tan.getSeriesCount(); i++) {
            rt.setSeriesPaint(i, Palette.colour(i));
            rt.setSeriesShape(i, dot);
            rt.setSeriesVisibleInLegend(i, false);
        }
        bottom.setRenderer(rt);
        double labelled = freqs.stream().min(java.util.Comparator.comparingDouble(f -> Math.abs(Math.log(f)))).orElse(1.0);
        float[][] dashes = {{2f, 3f}, {7f, 4f}, {10f, 3f, 2f, 3f}};
        String[] styles = {"dotted", "dashed", "dash-dot"};
        List<String> named = new ArrayList<>();
        for (int k = 0; k < freqs.size(); k++) {
            double hz = freqs.get(k);
            for (org.viscarta.temperature.GlassTransition.Convention c : org.viscarta.temperature.GlassTransition.Convention.values()) {
                double mean = ramps.stream().filter(r -> r.ramp().frequencyHz() == hz && r.estimate(c).found())
                        .mapToDouble(r -> r.estimate(c).valueC()).average().orElse(Double.NaN);
                if (Double.isNaN(mean)) {
                    continue;
                }
                if (hz == labelled) {
                    named.add(c.label(shear) + " " + String.format(Locale.ROOT, "%.1f °C", mean) + " (" + styles[c.ordinal()] + ")");
                }
                for (XYPlot panel : List.of(top, bottom)) {
                    panel.addDomainMarker(new ValueMarker(mean, Palette.colour(k), new BasicStroke(1.2f, BasicStroke.CAP_BUTT,
                            BasicStroke.JOIN_MITER, 10f, dashes[c.ordinal()], 0f)));
                }
            }
        }
        combined.add(top, 3);
        combined.add(bottom, 2);
        JFreeChart c = new JFreeChart(shortName(sample) + ": temperature ramps", Palette.TITLE, combined, true);
        finish(c, top);
        finish(c, bottom);
        if (!named.isEmpty()) {
            c.addSubtitle(new org.jfree.chart.title.TextTitle("Tg at " + Numbers.plain(labelled) + " Hz, replicate means:\n"
                    + String.join(", ", named),
                    Palette.TICK));
        }
        return new Figure(stem, "Temperature ramps of " + shortName(sample) + ": storage (filled) and loss moduli (open) above, "
                + "tan δ below, one colour per frequency, every replicate. Vertical lines mark the glass transition by the "
                + "three ASTM E1640 conventions at each frequency (dotted: onset of the " + m + "′ drop; dashed: " + m
                + "″ peak; dash-dot: tan δ peak; replicate means); their values at " + Numbers.plain(labelled) + " Hz are under the title.",
                c, 400);
    }

    /** log10 a_T against temperature with its standard errors and the WLF and Arrhenius fits. */
    public static Figure shiftFactors(TemperatureSeries ts, String stem) {
        ShiftAnalysis.Result r = ts.result();
        YIntervalSeriesCollection points = new YIntervalSeriesCollection();
        YIntervalSeries pts = new YIntervalSeries("log10 a_T ± SE");
        double tMin = Double.POSITIVE_INFINITY;
        double tMax = Double.NEGATIVE_INFINITY;
        for (ShiftAnalysis.Factor f : r.factors()) {
            if (f.placed()) {
                pts.add(f.temperatureC(), f.log10aT(), f.log10aT() - f.log10aTStdError(), f.log10aT() + f.log10aTStdError());
                tMin = Math.min(tMin, f.temperatureC());
                tMax = Math.max(tMax, f.temperatureC());
            }
        }
        points.addSeries(pts);
        NumberAxis x = new NumberAxis("temperature [°C]");
        x.setAutoRangeIncludesZero(false);
        x.setLabelFont(Palette.LABEL);
        NumberAxis y = new NumberAxis("log10 a_T [–]");
        y.setAutoRangeIncludesZero(false);
        y.setLabelFont(Palette.LABEL);
        XYErrorRenderer er = new XYErrorRenderer();
        er.setDrawXError(false);
        er.setDefaultLinesVisible(false);
        er.setSeriesPaint(0, Color.BLACK);
        er.setSeriesShape(0, Palette.shape(0));
        XYPlot plot = new XYPlot(points, x, y, er);
        XYSeriesCollection laws = new XYSeriesCollection();
        double t0 = r.referenceC();
        if (r.wlf() != null) {
            XYSeries w = new XYSeries(String.format(Locale.ROOT, "WLF, C1 = %.3g, C2 = %.3g K", r.wlf().parameter("C1").value(),
                    r.wlf().parameter("C2").value()));
            for (int k = 0; k <= 40; k++) {
                double t = tMin + (tMax - tMin) * k / 40.0;
                w.add(t, ShiftLaws.wlf(r.wlf().parameter("C1").value(), r.wlf().parameter("C2").value(), t - t0));
            }
            laws.addSeries(w);
        }
        if (r.arrhenius() != null) {
            double ea = r.arrhenius().parameter("Ea").value() * 1000;
            XYSeries a = new XYSeries(String.format(Locale.ROOT, "Arrhenius, Ea = %.3g kJ/mol", ea / 1000));
            for (int k = 0; k <= 40; k++) {
                double t = tMin + (tMax - tMin) * k / 40.0;
                a.add(t, ShiftLaws.arrhenius(ea, t + ShiftLaws.KELVIN_OFFSET, t0 + ShiftLaws.KELVIN_OFFSET));
            }
            laws.addSeries(a);
        }
        plot.setDataset(1, laws);
        XYLineAndShapeRenderer lr = new XYLineAndShapeRenderer(true, false);
        lr.setDrawSeriesLineAsPath(true);
        for (int i = 0; i < 2; i++) {
            lr.setSeriesPaint(i, Palette.colour(i));
            lr.setSeriesStroke(i, Palette.line(i));
        }
        plot.setRenderer(1, lr);
        return new Figure(stem, "Shift factors of " + shortName(ts.sample()) + " against temperature (reference " + Numbers.plain(t0)
                + " °C) with the WLF and Arrhenius fits.", chart(shortName(ts.sample()) + ": shift factors", plot, true));
    }

    /**
     * The van Gurp–Palmen plot: phase angle against |E*| for every temperature. Curves that fall on one
     * line support thermorheological simplicity (van Gurp &amp; Palmen 1998, Rheol. Bull. 67:5).
     */
    public static Figure vanGurpPalmen(TemperatureSeries ts, String stem) {
        XYSeriesCollection data = new XYSeriesCollection();
        java.util.TreeMap<Double, XYSeries> byT = new java.util.TreeMap<>();
        for (Sweep s : ts.sweeps()) {
            XYSeries series = byT.computeIfAbsent(s.temperatureC(), t -> new XYSeries(Numbers.plain(t) + " °C", true, true));
            for (SweepPoint p : s.fittablePoints()) {
                series.add(p.magnitude(), Math.toDegrees(p.phaseAngle()));
            }
        }
        byT.values().forEach(data::addSeries);
        NumberAxis y = new NumberAxis("phase angle δ [°]");
        y.setLabelFont(Palette.LABEL);
        y.setAutoRangeIncludesZero(false);
        String m = ts.sweeps().get(0).kind().letter();
        LogAxis magnitude = logAxis("|" + m + "*|");
        inModulusUnit(magnitude, "|" + m + "*|", largest(data, false));
        XYPlot plot = new XYPlot(data, magnitude, y, null);
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, true);
        r.setDrawSeriesLineAsPath(true);
        for (int i = 0; i < data.getSeriesCount(); i++) {
            r.setSeriesPaint(i, Palette.colour(i));
            r.setSeriesShape(i, Palette.shape(i));
        }
        plot.setRenderer(r);
        return new Figure(stem, "van Gurp–Palmen plot of " + shortName(ts.sample()) + ": phase angle against |" + m + "*| at every temperature; "
                + "if the curves fall on one line, time–temperature superposition holds.", chart(shortName(ts.sample()) + ": van Gurp–Palmen check",
                plot, true));
    }
}
