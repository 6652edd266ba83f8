package org.viscarta.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.jfree.chart.axis.SymbolAxis;
import org.jfree.chart.plot.XYPlot;
import org.jfree.data.xy.YIntervalSeriesCollection;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viscarta.analysis.Analysis;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.AnalysisResult;

/**
 * Above {@link ReportFigures#MAX_SAMPLE_FIGURES} samples the overview figures summarise instead of
 * drawing a series per sample. 100 invented samples, sample k with tan δ = k/100 at every frequency,
 * so that the quantiles across samples are known by hand (linear interpolation between order
 * statistics, Hyndman &amp; Fan 1996, Am. Stat. 50:361, definition 7, which is also numpy's default):
 * median of 0.01 … 1.00 = 0.505, quartiles 0.2575 and 0.7525, 10th and 90th percentiles 0.109 and 0.901
 * (to 1e-5: the moduli are written with six significant digits).
 */
@Tag("regression")
class CampaignFiguresTest {

    @TempDir
    static Path dir;
    private static List<Figure> figures;

    @BeforeAll
    static void campaign() throws IOException {
        StringBuilder sb = new StringBuilder("# modulus: tensile\nsample,frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n");
        for (int k = 1; k <= 100; k++) {
            for (int i = 0; i < 12; i++) {
                double f = 0.1 * Math.pow(200, i / 11.0);
                double storage = 1e4 * Math.pow(f, 0.1 + k / 1000.0);
                sb.append(String.format(Locale.ROOT, "s%03d,%.6g,%.6g,%.6g%n", k, f, storage, storage * k / 100.0));
            }
        }
        Path file = Files.writeString(dir.resolve("campaign.csv"), sb.toString());
        AnalysisResult r = Analysis.run(AnalysisRequest.builder(List.of(file)).models(List.of("springpot"))
                .compute(AnalysisRequest.Part.FITS, AnalysisRequest.Part.RANKING, AnalysisRequest.Part.SPECTRA).build());
        figures = ReportFigures.build(r);
    }

    private static Figure figure(String stem) {
        return figures.stream().filter(f -> f.stem().equals(stem)).findFirst().orElseThrow();
    }

    @Test
    void tanDeltaOfManySamplesIsTheirDistributionWithQuantilesKnownByHand() {
        Figure f = figure("tan-delta");
        XYPlot plot = (XYPlot) f.chart().getPlot();
        YIntervalSeriesCollection band = (YIntervalSeriesCollection) plot.getDataset(0);
        assertEquals(1, band.getSeriesCount(), "one band for the one group, not 100 series");
        assertTrue(band.getItemCount(0) >= 10, "bins over 0.1–20 Hz: " + band.getItemCount(0));
        for (int i = 0; i < band.getItemCount(0); i++) {
            assertEquals(0.505, band.getYValue(0, i), 1e-5, "median");
            assertEquals(0.2575, band.getStartYValue(0, i), 1e-5, "lower quartile");
            assertEquals(0.7525, band.getEndYValue(0, i), 1e-5, "upper quartile");
            assertEquals(0.109, plot.getDataset(1).getYValue(0, i), 1e-5, "10th percentile");
            assertEquals(0.901, plot.getDataset(1).getYValue(1, i), 1e-5, "90th percentile");
        }
        assertTrue(f.caption().contains("With 100 samples, the figure shows their distribution"), f.caption());
    }

    @Test
    void theRankingOfManySamplesShowsItsTopAndBottomAndSaysHowManyLieBetween() {
        Figure f = figure("damping-ranking");
        SymbolAxis labels = (SymbolAxis) ((XYPlot) f.chart().getPlot()).getRangeAxis();
        String[] rows = labels.getSymbols();
        assertEquals(61, rows.length, "the top 30, a row for the 40 between, the bottom 30");
        assertTrue(rows[rows.length - 1].startsWith("1. s100"), "highest damping at the top: " + rows[rows.length - 1]);
        assertTrue(rows[30].startsWith("⋮ 40 more"), rows[30]);
        assertTrue(rows[0].startsWith("100. s001"), rows[0]);
        assertTrue(f.caption().contains("the top and bottom 30 of each comparable set"), f.caption());
    }

    @Test
    void spectraOfManySamplesAreTheirDistributionAndNoPerSampleFigureIsDrawn() {
        Figure f = figure("spectra");
        assertEquals(1, ((XYPlot) f.chart().getPlot()).getDataset(0).getSeriesCount());
        assertTrue(f.caption().contains("the mean across samples"), f.caption());
        assertEquals(List.of("damping-ranking", "tan-delta", "spectra"), figures.stream().map(Figure::stem).toList());
    }
}
