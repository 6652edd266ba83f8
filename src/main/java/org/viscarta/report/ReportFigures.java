package org.viscarta.report;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.viscarta.Campaign;
import org.viscarta.compare.FittedCurve;
import org.viscarta.compare.Matcher;

/** Chooses and builds the figures of a report. */
public final class ReportFigures {

    /** Above this many samples, per-sample figures are left out (the overview figures remain). */
    public static final int MAX_SAMPLE_FIGURES = 60;
    /** References drawn against each sample. */
    private static final int REFERENCES_SHOWN = 3;

    private ReportFigures() {
    }

    /**
     * @param references the library's candidates (for their curves); empty without a library
     */
    public static List<RenderedFigure> render(List<Figure> figures) throws java.io.IOException {
        List<RenderedFigure> out = new ArrayList<>();
        for (Figure f : figures) {
            out.add(new RenderedFigure(f.stem(), f.caption(), f.png(), f.svg()));
        }
        return out;
    }

    public static List<Figure> build(WorkbookReport.Content c, List<Matcher.Candidate> references) {
        List<Figure> out = new ArrayList<>();
        out.add(Figures.ranking(c.ranking(), c.campaign().settings().rankingFrequency()));
        out.add(Figures.tanDelta(c.campaign().samples()));
        for (org.viscarta.temperature.TemperatureSeries ts : c.series()) {
            String slug = slug(ts.sample());
            out.add(Figures.master(ts, "master-" + slug));
            out.add(Figures.shiftFactors(ts, "shift-factors-" + slug));
            out.add(Figures.vanGurpPalmen(ts, "van-gurp-palmen-" + slug));
        }
        if (c.fits().size() > MAX_SAMPLE_FIGURES) {
            return out;
        }
        Map<String, FittedCurve> refCurves = new HashMap<>();
        for (Matcher.Candidate r : references) {
            if (r.curve() != null) {
                refCurves.put(r.name(), r.curve());
            }
        }
        List<FittedCurve> curves = c.campaign().curves(c.fits());
        java.util.Set<String> used = new java.util.HashSet<>();
        for (int i = 0; i < c.fits().size(); i++) {
            Campaign.Sample s = c.fits().get(i).sample();
            String slug = slug(s.name());
            for (int k = 2; !used.add(slug); k++) {
                slug = slug(s.name()) + "-" + k;
            }
            out.add(Figures.fit(s, curves.get(i), "fit-" + slug));
            if (!c.matchesOf(i).isEmpty()) {
                out.add(Figures.references(s, c.matchesOf(i), refCurves, REFERENCES_SHOWN, "references-" + slug));
            }
        }
        return out;
    }

    static String slug(String name) {
        String s = name.toLowerCase(Locale.ROOT).replaceAll("[^a-z0-9._-]+", "-").replaceAll("^-+|-+$", "");
        return s.isEmpty() ? "sample" : s;
    }
}
