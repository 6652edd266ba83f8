package org.viscarta.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.XYPlot;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.viscarta.analysis.Analysis;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.AnalysisResult;
import org.viscarta.compare.FittedCurve;

/** The figures carry the series they promise. */
@Tag("regression")
class FiguresTest {

    private static final AnalysisResult CAMPAIGN = Analysis.run(AnalysisRequest.builder(List.of(Path.of("demo-data",
            "paint-light-ageing.csv"))).models(List.of("zener", "springpot"))
            .compute(AnalysisRequest.Part.FITS, AnalysisRequest.Part.RANKING).build());

    @Test
    void fitFigureHasMeasuredModelAndResidualSeries() throws Exception {
        FittedCurve curve = CAMPAIGN.samples().get(0).curve().orElseThrow();
        Figure f = Figures.fit(CAMPAIGN.samples().get(0).sample(), curve, "fit-test");
        CombinedDomainXYPlot plot = (CombinedDomainXYPlot) f.chart().getPlot();
        XYPlot top = plot.getSubplots().get(0);
        XYPlot residuals = plot.getSubplots().get(1);
        assertEquals(2, top.getDataset(0).getSeriesCount(), "E′ and E″ measured");
        assertEquals(12, top.getDataset(0).getItemCount(0), "12 frequencies, replicates averaged");
        assertEquals(2, top.getDataset(1).getSeriesCount(), "E′ and E″ of the model");
        assertEquals(2, residuals.getDataset().getSeriesCount());
        // moduli of paint films (tens of MPa) read in MPa with plain tick labels, not "1E7"
        org.jfree.chart.axis.LogAxis moduli = (org.jfree.chart.axis.LogAxis) top.getRangeAxis();
        assertTrue(moduli.getLabel().endsWith("[MPa]"), moduli.getLabel());
        assertEquals("10", moduli.getNumberFormatOverride().format(1e7));
        assertEquals("0.5", moduli.getNumberFormatOverride().format(5e5));
        assertTrue(f.png().length > 10_000);
        assertTrue(f.svg().startsWith("<svg"));
    }

    @Test
    void theResidualPanelShowsEveryResidualWithRoomForItsMarker() {
        FittedCurve curve = CAMPAIGN.samples().get(0).curve().orElseThrow();
        Figure f = Figures.fit(CAMPAIGN.samples().get(0).sample(), curve, "fit-test");
        XYPlot residuals = ((CombinedDomainXYPlot) f.chart().getPlot()).getSubplots().get(1);
        double largest = 0;
        for (int series = 0; series < 2; series++) {
            for (int i = 0; i < residuals.getDataset().getItemCount(series); i++) {
                largest = Math.max(largest, Math.abs(residuals.getDataset().getYValue(series, i)));
            }
        }
        org.jfree.data.Range range = residuals.getRangeAxis().getRange();
        assertTrue(range.getUpperBound() >= 1.2 * largest && range.getLowerBound() <= -1.2 * largest, range + " vs " + largest);
        assertEquals(0.05, Figures.niceStep(0.031), 1e-15);
        assertEquals(0.2, Figures.niceStep(0.15), 1e-15);
    }

    @Test
    void overviewFiguresHaveASeriesPerSampleAndAPointPerRankedSample() {
        // nine films in three groups, more than the palette's colours: one panel per group, a series per sample
        Figure tan = Figures.tanDelta(CAMPAIGN.inputs().samples());
        List<XYPlot> panels = ((CombinedDomainXYPlot) tan.chart().getPlot()).getSubplots();
        assertEquals(3, panels.size());
        assertEquals(9, panels.stream().mapToInt(p -> p.getDataset().getSeriesCount()).sum());
        Figure few = Figures.tanDelta(CAMPAIGN.inputs().samples().subList(0, 3));
        assertEquals(3, ((XYPlot) few.chart().getPlot()).getDataset().getSeriesCount(), "few samples: one plot");
        Figure ranking = Figures.ranking(CAMPAIGN.ranking().orElseThrow(), "1 Hz");
        org.jfree.chart.axis.SymbolAxis names = (org.jfree.chart.axis.SymbolAxis) ((XYPlot) ranking.chart().getPlot()).getRangeAxis();
        assertEquals(9, names.getSymbols().length, "every ranked sample named");
        assertEquals(1.0, names.getTickUnit().getSize(), "a tick, so a label, for every sample");
        assertTrue(ranking.heightPt() >= 9 * Figures.ROW_PT, "the figure grows with the samples");
        assertEquals(9, ((XYPlot) ranking.chart().getPlot()).getDataset().getItemCount(0));
    }

    /** Log axes never show a lone tick: 1-2-5 in each decade over short spans, finer below a decade, decades over long ones. */
    @Test
    void logAxesTickAtOneTwoFiveAndNeverAlone() {
        Figures.ReadableLogAxis axis = new Figures.ReadableLogAxis("frequency [Hz]");
        axis.setRange(0.1, 10);
        assertEquals(List.of("0.1", "0.2", "0.5", "1", "2", "5", "10"), labels(axis));
        axis.setRange(3, 5.5);
        assertEquals(List.of("3", "4", "5"), labels(axis));
        axis.setRange(1e-3, 1e3);
        assertEquals(List.of("0.001", "0.01", "0.1", "1", "10", "100", "1000"), labels(axis));
        axis.setRange(0.0566, 0.0592);
        assertEquals(3, labels(axis).size(), "a span too short for round numbers still gets labelled ticks: " + labels(axis));
    }

    private static List<String> labels(Figures.ReadableLogAxis axis) {
        return axis.ticks(org.jfree.chart.ui.TextAnchor.TOP_CENTER).stream()
                .map(t -> ((org.jfree.chart.axis.NumberTick) t)).filter(t -> t.getTickType() == org.jfree.chart.axis.TickType.MAJOR)
                .map(org.jfree.chart.axis.NumberTick::getText).toList();
    }
    private static org.viscarta.analysis.Sample rising(String name, double fromHz, double toHz) {
        List<org.viscarta.sweep.SweepPoint> pts = new java.util.ArrayList<>();
        for (int i = 0; i <= 10; i++) {
            double f = fromHz * Math.pow(toHz / fromHz, i / 10.0);
            pts.add(new org.viscarta.sweep.SweepPoint(f, 1000, 1000 * 0.01 * Math.pow(10, 2 * i / 10.0), i + 2));
        }
        org.viscarta.sweep.Sweep sw = new org.viscarta.sweep.Sweep(name, "1", "g", org.viscarta.sweep.ModulusKind.TENSILE, 23,
                Path.of(name + ".csv"), java.util.Map.of(), pts);
        return new org.viscarta.analysis.Sample(name, "g", org.viscarta.sweep.ModulusKind.TENSILE, 23, List.of(sw));
    }

    /**
     * A panel's legend goes where the data leave room: tan δ rising from 0.01 to 1 over 1–100 Hz,
     * on a shared axis from 0.01 Hz, fills the top right; the top left is free.
     */
    @Test
    void aPanelLegendTakesTheCornerTheDataLeaveFree() {
        double[] corner = Figures.freestCorner(List.of(rising("a", 1, 100)), 0.01, 100, 0.3, 0.3);
        assertTrue(corner[0] < 0.5 && corner[1] > 0.5, "top left: " + java.util.Arrays.toString(corner));
        double[] spread = Figures.freestCorner(List.of(rising("b", 0.01, 1)), 0.01, 100, 0.3, 0.3);
        assertTrue(spread[0] > 0.5 && spread[1] > 0.5, "data low on the left leave the top right: " + java.util.Arrays.toString(spread));
    }

    /**
     * The spectra's case: a master curve high across the whole panel and a sample's curve falling
     * from the top left leave only the bottom free; of the two bottom corners the right comes first.
     */
    @Test
    void aLegendLeavesTheTopWhenCurvesRunAlongIt() {
        List<double[]> pts = new java.util.ArrayList<>();
        for (int i = 0; i <= 50; i++) {
            pts.add(new double[] {i / 50.0, 0.9 + 0.05 * Math.sin(i / 8.0)}); // along the top
            if (i <= 25) {
                pts.add(new double[] {i / 50.0, 0.9 - i / 50.0}); // falling from the top left to the middle
            }
        }
        double[] corner = Figures.freestCorner(pts, 0.4, 0.3);
        assertTrue(corner[0] > 0.5 && corner[1] < 0.5, "bottom right: " + java.util.Arrays.toString(corner));
        pts.add(new double[] {0.95, 0.1});
        double[] other = Figures.freestCorner(pts, 0.4, 0.3);
        assertTrue(other[0] < 0.5 && other[1] < 0.5, "a point under the bottom right leaves the bottom left: "
                + java.util.Arrays.toString(other));
    }

    @Test
    void svgCoordinatesAreTheHundredthOfAPointNearest() {
        // the text of Math.round(100 v)/100 against BigDecimal's plain text of the same hundredths, trailing zeros dropped
        java.util.Random r = new java.util.Random(9);
        for (int k = 0; k < 50_000; k++) {
            double v = (r.nextBoolean() ? -1 : 1) * (k % 3 == 0 ? r.nextInt(100_000) / 100.0 : r.nextDouble() * Math.pow(10, r.nextInt(7) - 2));
            String got = Figure.hundredths(v);
            java.math.BigDecimal want = new java.math.BigDecimal(Math.round(v * 100)).movePointLeft(2).stripTrailingZeros();
            assertEquals(want.signum() == 0 ? "0" : want.toPlainString(), got, "value " + v);
        }
        assertEquals("13.07", Figure.hundredths(13.06689453125));
        assertEquals("-0.5", Figure.hundredths(-0.5));
        assertEquals("0", Figure.hundredths(-0.001));
        assertEquals("302", Figure.hundredths(302.0));
        String svg = Figures.fit(CAMPAIGN.samples().get(0).sample(), CAMPAIGN.samples().get(0).curve().orElseThrow(), "fit-test").svg();
        // a viewBox on the root, so that the page's width:100% scales the drawing rather than leaving blank space
        String root = svg.substring(0, svg.indexOf('>'));
        assertTrue(root.contains("viewBox=\"0 0 468 302\"") || root.contains("viewBox='0 0 468 302'"), root);
        java.util.regex.Matcher paths = java.util.regex.Pattern.compile(" d='([^']*)'").matcher(svg);
        int seen = 0;
        while (paths.find()) {
            seen++;
            assertTrue(!java.util.regex.Pattern.compile("[0-9]\\.[0-9]{3}").matcher(paths.group(1)).find(), paths.group(1));
        }
        assertTrue(seen > 10, "the figure's paths were found: " + seen);
    }
}
