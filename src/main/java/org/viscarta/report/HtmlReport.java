package org.viscarta.report;

import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.viscarta.Campaign;
import org.viscarta.compare.DampingComparison;
import org.viscarta.compare.Matcher;
import org.viscarta.compare.ReplicateSummary;
import org.viscarta.fit.FitResult;
import org.viscarta.fit.ParameterEstimate;
import org.viscarta.io.SweepFile;

/**
 * The report as one self-contained HTML page: inline CSS and SVG figures, no script, nothing
 * fetched from anywhere, so it opens offline and prints well. The Read me text comes first, the
 * provenance last.
 */
public final class HtmlReport {

    private static final String CSS = "body{font-family:Georgia,'DejaVu Serif',serif;max-width:60rem;margin:2rem auto;padding:0 1rem;"
            + "color:#111;line-height:1.45}h1,h2,h3{font-family:'DejaVu Sans',Arial,sans-serif}h2{border-bottom:1px solid #999;"
            + "margin-top:2.2rem}table{border-collapse:collapse;margin:.8rem 0;font-size:.88rem}th,td{border:1px solid #bbb;"
            + "padding:.2rem .45rem;text-align:left;vertical-align:top}th{background:#eee}td.n{text-align:right;"
            + "font-variant-numeric:tabular-nums}dt{font-weight:bold;margin-top:.5rem}.caution{border-left:4px solid #D55E00;"
            + "padding-left:.8rem}.demo{background:#fff3d6;padding:.5rem .8rem}figure{margin:1.5rem 0;page-break-inside:avoid}"
            + "figure svg{width:100%;height:auto}figcaption{font-size:.9rem;color:#333}@media print{body{max-width:none}}";

    private HtmlReport() {
    }

    public static String write(WorkbookReport.Content c, List<RenderedFigure> figures, boolean demo) {
        StringBuilder h = new StringBuilder(64 * 1024);
        h.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n<title>Viscarta report</title>\n<style>")
                .append(CSS).append("</style>\n</head>\n<body>\n");
        h.append("<h1>Viscarta report: oscillatory measurements of soft, lossy materials</h1>\n");
        h.append("<p>Frequency sweeps of ").append(c.campaign().samples().size()).append(" sample(s) from ")
                .append(c.campaign().files().size()).append(" file(s), fitted with viscoelastic models and ranked by damping "
                        + "(tan δ) at ").append(esc(c.campaign().settings().rankingFrequency()))
                .append(". The workbook report.xlsx beside this page holds every number, including every measured point with its "
                        + "file and line.</p>\n");
        if (demo) {
            h.append("<p class=\"demo\">The inputs say they are invented demo data, generated from known models with noise. "
                    + "They are not measurements of real materials.</p>\n");
        }
        h.append("<h2>Read me</h2>\n<dl>\n");
        for (String[] d : Texts.DEFINITIONS) {
            h.append("<dt>").append(esc(d[0])).append("</dt><dd>").append(esc(d[1])).append("</dd>\n");
        }
        h.append("</dl>\n<h3>Cautions</h3>\n<div class=\"caution\">\n");
        for (String caution : Texts.CAUTIONS) {
            h.append("<p>").append(esc(caution)).append("</p>\n");
        }
        h.append("</div>\n");
        summary(h, c);
        ranking(h, c);
        matches(h, c);
        series(h, c);
        if (!figures.isEmpty()) {
            h.append("<h2>Figures</h2>\n");
            for (RenderedFigure f : figures) {
                h.append("<figure id=\"").append(esc(f.stem())).append("\">\n").append(f.svg()).append("\n<figcaption>")
                        .append(esc(f.caption())).append("</figcaption>\n</figure>\n");
            }
        }
        provenance(h, c);
        h.append("</body>\n</html>\n");
        return h.toString();
    }

    private static void summary(StringBuilder h, WorkbookReport.Content c) {
        h.append("<h2>Summary</h2>\n<table>\n<tr><th>sample</th><th>group</th><th>replicates</th><th>frequency [Hz]</th>"
                + "<th>best-supported model</th><th>Akaike weight [–]</th><th>not determined by the data</th></tr>\n");
        for (Campaign.SampleFits sf : c.fits()) {
            Campaign.Sample s = sf.sample();
            FitResult best = sf.best().orElse(null);
            long flagged = best == null ? 0 : best.parameters().stream().filter(ParameterEstimate::undetermined).count();
            double weight = sf.fits().stream().filter(r -> r.best()).mapToDouble(r -> r.weight()).findFirst().orElse(Double.NaN);
            h.append("<tr><td>").append(esc(s.name())).append("</td><td>").append(esc(s.group())).append("</td><td class=\"n\">")
                    .append(s.replicates().size()).append("</td><td class=\"n\">").append(num(s.minFrequencyHz())).append("–")
                    .append(num(s.maxFrequencyHz())).append("</td><td>").append(best == null ? "none converged" : esc(best.model()))
                    .append("</td><td class=\"n\">").append(num(weight)).append("</td><td>")
                    .append(flagged == 0 ? "" : flagged + " parameter(s)").append("</td></tr>\n");
        }
        h.append("</table>\n");
    }

    private static void ranking(StringBuilder h, WorkbookReport.Content c) {
        h.append("<h2>Damping ranking</h2>\n<p>tan δ at ").append(esc(c.campaign().settings().rankingFrequency()))
                .append(", highest damping first; mean over replicates with its 95 % interval.</p>\n<table>\n<tr><th>rank</th>"
                        + "<th>sample</th><th>group</th><th>replicates</th><th>tan δ [–]</th><th>95 % interval [–]</th>"
                        + "<th>letters</th><th>note</th></tr>\n");
        for (Campaign.RankRow r : c.ranking()) {
            ReplicateSummary t = r.tanDelta();
            h.append("<tr><td class=\"n\">").append(r.rank() == 0 ? "" : r.rank()).append("</td><td>").append(esc(r.sample().name()))
                    .append("</td><td>").append(esc(r.sample().group())).append("</td><td class=\"n\">")
                    .append(t == null ? r.sample().replicates().size() : t.n()).append("</td><td class=\"n\">")
                    .append(t == null ? "–" : num(t.mean())).append("</td><td class=\"n\">")
                    .append(t == null || t.n() < 2 ? "–" : num(t.ci95Low()) + " – " + num(t.ci95High())).append("</td><td>")
                    .append(esc(r.letters())).append("</td><td>").append(esc(r.note())).append("</td></tr>\n");
        }
        h.append("</table>\n");
        DampingComparison.Result cmp = c.comparison();
        for (String statement : cmp.statements()) {
            h.append("<p>").append(esc(statement)).append("</p>\n");
        }
    }

    private static void matches(StringBuilder h, WorkbookReport.Content c) {
        if (c.library() != null) {
            h.append("<h2>Closest reference materials</h2>\n<p>Distance: the typical difference of the E′ and E″ curves on a "
                    + "logarithmic scale over the frequencies both were measured at, in decades (0.1 ≈ 26 % apart).</p>\n<table>\n"
                    + "<tr><th>sample</th><th>closest</th><th>distance [decades]</th><th>second</th><th>distance [decades]</th>"
                    + "<th>first and second distinguishable</th></tr>\n");
            for (int i = 0; i < c.fits().size(); i++) {
                List<Matcher.Match> m = c.matchesOf(i);
                Matcher.Match a = m.size() > 0 && m.get(0).rank() == 1 ? m.get(0) : null;
                Matcher.Match b = m.size() > 1 && m.get(1).rank() == 2 ? m.get(1) : null;
                h.append("<tr><td>").append(esc(c.fits().get(i).sample().name())).append("</td><td>")
                        .append(a == null ? "–" : esc(a.reference())).append("</td><td class=\"n\">")
                        .append(a == null ? "–" : num(a.result().distance()) + " ± " + num(a.result().uncertainty()))
                        .append("</td><td>").append(b == null ? "–" : esc(b.reference())).append("</td><td class=\"n\">")
                        .append(b == null ? "–" : num(b.result().distance())).append("</td><td>")
                        .append(esc(Matcher.distinguishable(m))).append("</td></tr>\n");
            }
            h.append("</table>\n");
        }
        if (c.target() != null) {
            h.append("<h2>Best mimic of ").append(esc(c.target())).append("</h2>\n<table>\n<tr><th>rank</th><th>candidate</th>"
                    + "<th>distance [decades]</th><th>differs most at [Hz]</th><th>note</th></tr>\n");
            for (Matcher.Match m : c.mimic()) {
                h.append("<tr><td class=\"n\">").append(m.rank() == 0 ? "" : m.rank()).append("</td><td>").append(esc(m.reference()))
                        .append("</td><td class=\"n\">").append(num(m.result().distance())).append(" ± ")
                        .append(num(m.result().uncertainty())).append("</td><td class=\"n\">").append(num(m.result().departureHz()))
                        .append("</td><td>").append(esc(m.result().note())).append("</td></tr>\n");
            }
            h.append("</table>\n<p>").append(esc("First and second distinguishable: " + Matcher.distinguishable(c.mimic())))
                    .append("</p>\n");
        }
    }

    private static void series(StringBuilder h, WorkbookReport.Content c) {
        for (org.viscarta.temperature.TemperatureSeries ts : c.series()) {
            var r = ts.result();
            h.append("<h2>Temperature series: ").append(esc(ts.sample())).append("</h2>\n<p>Master curve at ")
                    .append(num(r.referenceC())).append(" °C, analysed as the sample ").append(esc(ts.masterName()))
                    .append(".</p>\n<table>\n<tr><th>temperature [°C]</th><th>log10 a_T [–]</th><th>± SE</th></tr>\n");
            for (var f : r.factors()) {
                h.append("<tr><td class=\"n\">").append(num(f.temperatureC())).append("</td><td class=\"n\">")
                        .append(f.placed() ? num(f.log10aT()) : "not placed").append("</td><td class=\"n\">")
                        .append(num(f.log10aTStdError())).append("</td></tr>\n");
            }
            h.append("</table>\n");
            for (var fit : java.util.Arrays.asList(r.wlf(), r.arrhenius())) {
                if (fit == null) {
                    continue;
                }
                StringBuilder sb = new StringBuilder(fit.law() + ":");
                for (var p : fit.parameters()) {
                    sb.append(' ').append(p.name()).append(" = ").append(num(p.value())).append(" [").append(num(p.ci95Low()))
                            .append(", ").append(num(p.ci95High())).append("] ").append(p.unit().equals("-") ? "" : p.unit()).append(';');
                }
                h.append("<p>").append(esc(sb.toString())).append("</p>\n");
            }
            for (String n : r.notes()) {
                h.append("<p>").append(esc(n)).append("</p>\n");
            }
        }
    }

    private static void provenance(StringBuilder h, WorkbookReport.Content c) {
        Provenance p = c.provenance();
        h.append("<h2>Provenance</h2>\n<table>\n<tr><th>tool</th><td>Viscarta ").append(esc(p.toolVersion())).append("</td></tr>\n")
                .append("<tr><th>command line</th><td><code>").append(esc(p.commandLine())).append("</code></td></tr>\n")
                .append("<tr><th>run at (UTC)</th><td>").append(esc(p.runAtUtc())).append("</td></tr>\n");
        for (Map.Entry<String, String> e : p.settings().entrySet()) {
            h.append("<tr><th>").append(esc(e.getKey())).append("</th><td>").append(esc(e.getValue())).append("</td></tr>\n");
        }
        h.append("</table>\n<table>\n<tr><th>input file</th><th>SHA-256</th></tr>\n");
        for (SweepFile f : c.campaign().files()) {
            h.append("<tr><td>").append(esc(f.path().toString())).append("</td><td><code>").append(f.sha256()).append("</code></td></tr>\n");
        }
        h.append("</table>\n");
        if (!c.campaign().warnings().isEmpty() || !c.campaign().notes().isEmpty()) {
            h.append("<h3>Warnings and conversions</h3>\n<ul>\n");
            c.campaign().warnings().forEach(w -> h.append("<li>").append(esc(w.toString())).append("</li>\n"));
            c.campaign().notes().forEach(n -> h.append("<li>").append(esc(n)).append("</li>\n"));
            h.append("</ul>\n");
        }
    }

    private static String num(double v) {
        return Double.isFinite(v) ? String.format(Locale.ROOT, "%.4g", v) : "–";
    }

    static String esc(String s) {
        StringBuilder b = new StringBuilder(s.length());
        for (char ch : s.toCharArray()) {
            switch (ch) {
                case '<': b.append("&lt;"); break;
                case '>': b.append("&gt;"); break;
                case '&': b.append("&amp;"); break;
                case '"': b.append("&quot;"); break;
                default: b.append(ch);
            }
        }
        return b.toString();
    }
}
