package org.viscarta.report;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.viscarta.analysis.AnalysisResult;
import org.viscarta.analysis.Sample;
import org.viscarta.analysis.SampleAnalysis;
import org.viscarta.compare.FittedCurve;
import org.viscarta.compare.Matcher;
import org.viscarta.sweep.Sweep;
import org.viscarta.temperature.TemperatureSeries;

/** Chooses and builds the figures of a report. */
public final class ReportFigures {

    /**
     * Above this many samples, per-sample figures are left out, the overview figures of tan δ and
     * spectra show distributions across samples, and the ranking figure the top and bottom of
     * each comparable set.
     */
    public static final int MAX_SAMPLE_FIGURES = 60;
    /** References drawn against each sample. */
    private static final int REFERENCES_SHOWN = 3;

    private ReportFigures() {
    }

    /** Draws every figure as PNG and SVG, figures in parallel (each chart is drawn by one thread only), in their order. */
    public static List<RenderedFigure> render(List<Figure> figures) throws java.io.IOException {
        try {
            return figures.parallelStream().map(f -> {
                try {
                    return new RenderedFigure(f.stem(), f.caption(), f.png(), f.svg(), f.heightPt() / (double) Figure.WIDTH_PT);
                } catch (java.io.IOException e) {
                    throw new java.io.UncheckedIOException(e);
                }
            }).toList();
        } catch (java.io.UncheckedIOException e) {
            throw e.getCause();
        }
    }

    /** Said in small print on every figure made from inputs that call themselves demo data. */
    static final String DEMO_MARK = "Invented demo data, not measurements of real materials";

    /**
     * The figures of a result: the ranking, tan δ of all samples, each temperature series, each
     * sample's fit and references. Figures of demo data say so, so that they travel alone into slides.
     */
    /** The tiles' opacity over a registered image in the report. */
    static final double MAP_OPACITY = 0.6;

    public static List<Figure> build(AnalysisResult r) {
        List<Figure> out = figures(r);
        if (r.inputs().isDemo()) {
            for (Figure f : out) {
                org.jfree.chart.title.TextTitle mark = new org.jfree.chart.title.TextTitle(DEMO_MARK, Palette.TICK);
                mark.setPosition(org.jfree.chart.ui.RectangleEdge.BOTTOM);
                mark.setHorizontalAlignment(org.jfree.chart.ui.HorizontalAlignment.RIGHT);
                mark.setPaint(java.awt.Color.GRAY);
                mark.setPadding(2, 2, 2, 12); // clear of the figure's right edge
                f.chart().addSubtitle(mark);
            }
        }
        return out;
    }

    private static List<Figure> figures(AnalysisResult r) {
        List<Figure> out = new ArrayList<>();
        r.ranking().filter(rk -> !rk.sets().isEmpty())
                .ifPresent(rk -> out.add(Figures.ranking(rk, r.request().rankingPoint().describe(), r.samples().stream()
                        .map(sa -> sa.sample().name()).filter(n -> !r.quality().marker(n).isEmpty())
                        .collect(java.util.stream.Collectors.toSet()))));
        // the single temperatures of a series are its own data, shown in its figures; its master curve stays
        Set<Sweep> inSeries = java.util.Collections.newSetFromMap(new java.util.IdentityHashMap<>());
        r.series().forEach(ts -> inSeries.addAll(ts.sweeps()));
        List<Sample> shown = r.samples().stream().map(SampleAnalysis::sample)
                .filter(s -> s.replicates().stream().noneMatch(inSeries::contains)).toList();
        if (!shown.isEmpty()) {
            out.add(shown.size() > MAX_SAMPLE_FIGURES ? Figures.tanDeltaDistribution(shown, r.samples().size() - shown.size())
                    : Figures.tanDelta(shown, r.samples().size() - shown.size()));
        }
        Map<String, List<org.viscarta.temperature.GlassTransition.Result>> ramps = new java.util.LinkedHashMap<>();
        r.transitions().results().forEach(t -> ramps.computeIfAbsent(t.ramp().sample(), k -> new ArrayList<>()).add(t));
        Set<String> rampSlugs = new HashSet<>();
        for (Map.Entry<String, List<org.viscarta.temperature.GlassTransition.Result>> e : ramps.entrySet()) {
            String slug = slug(e.getKey());
            for (int k = 2; !rampSlugs.add(slug); k++) {
                slug = slug(e.getKey()) + "-" + k;
            }
            out.add(Figures.transition(e.getKey(), e.getValue(), "transition-" + slug));
        }
        double mapHz = r.request().rankingPoint() instanceof org.viscarta.compare.RankingPoint.At at ? at.hz() : 1.0;
        for (org.viscarta.analysis.Maps.Mapped m : r.maps().specimens()) {
            out.addAll(MapFigures.of(m.specimen(), m.setup().image(), m.setup().registration(), MAP_OPACITY, mapHz,
                    slug(m.specimen().name())));
        }
        List<SampleAnalysis> withSpectra = r.samples().stream()
                .filter(sa -> sa.spectrum().isPresent() && sa.sample().replicates().stream().noneMatch(inSeries::contains)).toList();
        if (!withSpectra.isEmpty()) {
            out.add(withSpectra.size() > MAX_SAMPLE_FIGURES ? Figures.spectraDistribution(withSpectra) : Figures.spectra(withSpectra));
        }
        for (TemperatureSeries ts : r.series()) {
            String slug = slug(ts.sample());
            out.add(Figures.master(ts, "master-" + slug));
            out.add(Figures.shiftFactors(ts, "shift-factors-" + slug));
            out.add(Figures.vanGurpPalmen(ts, "van-gurp-palmen-" + slug));
        }
        if (r.samples().size() > MAX_SAMPLE_FIGURES) {
            return out;
        }
        Map<String, FittedCurve> refCurves = new HashMap<>();
        for (Matcher.Candidate ref : r.references()) {
            if (ref.curve() != null) {
                refCurves.put(ref.name(), ref.curve());
            }
        }
        Set<String> masters = new HashSet<>();
        r.series().forEach(ts -> masters.add(ts.masterName()));
        Set<String> used = new HashSet<>();
        for (SampleAnalysis sa : r.samples()) {
            boolean reduced = masters.contains(sa.sample().name());
            String slug = slug(sa.sample().name());
            for (int k = 2; !used.add(slug); k++) {
                slug = slug(sa.sample().name()) + "-" + k;
            }
            java.util.Optional<org.viscarta.analysis.TimeTests.Derived> test = r.timeTestOf(sa.sample());
            out.add(test.isPresent() ? Figures.timeTest(test.get(), "fit-" + slug)
                    : Figures.fit(sa.sample(), sa.curve().orElse(null), "fit-" + slug, reduced));
            if (!sa.matches().isEmpty()) {
                out.add(Figures.references(sa.sample(), sa.matches(), refCurves, REFERENCES_SHOWN, "references-" + slug, reduced));
            }
        }
        return out;
    }

    /** Longest file-name stem made from a name (file systems allow 255 bytes; the prefix and a counter need room). */
    private static final int SLUG_LENGTH = 80;

    public static String slug(String name) {
        String s = name.toLowerCase(Locale.ROOT).replaceAll("[^a-z0-9._-]+", "-").replaceAll("^[.-]+|-+$", "");
        if (s.length() > SLUG_LENGTH) {
            s = s.substring(0, SLUG_LENGTH).replaceAll("-+$", "");
        }
        return s.isEmpty() ? "sample" : s;
    }
}
