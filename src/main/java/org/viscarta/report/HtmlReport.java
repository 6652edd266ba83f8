package org.viscarta.report;

import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.viscarta.analysis.AnalysisResult;
import org.viscarta.analysis.SampleAnalysis;
import org.viscarta.analysis.Statements;
import org.viscarta.compare.Matcher;
import org.viscarta.io.SweepFile;
import org.viscarta.table.Cells;
import org.viscarta.table.Column;
import org.viscarta.table.Medium;
import org.viscarta.table.Table;

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
            + "figure svg{width:100%;height:auto}table.wide{display:block;overflow-x:auto}td.long{min-width:16rem}@page{size:A4 landscape;margin:12mm}@media print{table.wide{display:table;font-size:.62rem}}figcaption{font-size:.9rem;color:#333}@media print{body{max-width:none}figure svg{max-height:160mm}}"
            + "td.gap{text-align:left;font-style:italic;color:#555}p.gap{text-align:center;font-style:italic;color:#555}";

    private HtmlReport() {
    }

    /**
     * Writes the page into {@code out}: its text made in memory with a table of contents, the
     * figures' SVG (most of a page's bytes) copied in where they belong on the way out.
     */
    public static void write(ReportContent c, List<RenderedFigure> figures, java.io.Writer out) throws java.io.IOException {
        String page = withContents(text(c, !figures.isEmpty()));
        int at = page.indexOf(FIGURES_HERE);
        if (at < 0) {
            out.write(page);
            return;
        }
        out.write(page, 0, at);
        for (RenderedFigure f : figures) {
            out.write("<figure id=\"");
            out.write(esc(f.stem()));
            out.write("\">\n");
            out.write(f.svg());
            out.write("\n<figcaption>");
            out.write(esc(f.caption()));
            out.write("</figcaption>\n</figure>\n");
        }
        int after = at + FIGURES_HERE.length();
        out.write(page, after, page.length() - after);
    }

    /** Where the figures go in the page's text: a comment, which no escaped text can contain. */
    private static final String FIGURES_HERE = "<!-- figures -->";

    /** The page without its figures ({@link #FIGURES_HERE} where they go) and without its table of contents. */
    private static String text(ReportContent c, boolean figures) {
        AnalysisResult r = c.result();
        StringBuilder h = new StringBuilder(64 * 1024);
        h.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n<title>Viscarta report</title>\n<style>")
                .append(CSS).append("</style>\n</head>\n<body>\n");
        h.append("<h1>Viscarta report: oscillatory measurements of soft, lossy materials</h1>\n");
        h.append("<p>").append(esc(Statements.whatThisIs(r))).append(" The workbook report.xlsx beside this page holds every "
                + "number, including every measured point with its file and line.</p>\n");
        if (r.inputs().isDemo()) {
            h.append("<p class=\"demo\">").append(esc(Texts.DEMO)).append("</p>\n");
        }
        h.append("<h2>Read me</h2>\n<dl>\n");
        for (String[] d : Texts.definitions(r)) {
            h.append("<dt>").append(esc(d[0])).append("</dt><dd>").append(esc(d[1])).append("</dd>\n");
        }
        h.append("</dl>\n<h3>Cautions</h3>\n<div class=\"caution\">\n");
        for (String caution : Texts.cautions(r)) {
            h.append("<p>").append(esc(caution)).append("</p>\n");
        }
        h.append("</div>\n");
        table(h, OutputTables.summary(r), r.samples(), "");
        r.ranking().ifPresent(rk -> {
            table(h, OutputTables.ranking(r), rk.rows(), Statements.rankedBy(r.request())
                    + ", highest damping first, within comparable sets (" + r.request().sets().describe()
                    + "); mean over replicates with its 95 % interval.");
            for (org.viscarta.analysis.Ranking.RankedSet set : rk.sets()) {
                h.append("<h3>").append(esc(set.label())).append("</h3>\n");
                List<String> statements = set.result().comparison().statements();
                for (String statement : shownRows(statements)) {
                    h.append(statement == null ? "<p class=\"gap\">" + esc(String.format(java.util.Locale.ROOT, "⋮ %,d statements "
                            + "between (%,d in all): every one is in the workbook's Group comparison sheet",
                            statements.size() - MAX_PAGE_ROWS, statements.size())) + "</p>\n" : "<p>" + esc(statement) + "</p>\n");
                }
            }
        });
        if (r.request().parts().contains(org.viscarta.analysis.AnalysisRequest.Part.QUALITY)) {
            List<org.viscarta.quality.SweepChecks.Check> shown = new java.util.ArrayList<>(r.quality().sweepChecks().stream()
                    .filter(k -> k.verdict() != org.viscarta.quality.Verdict.PASS).toList());
            shown.addAll(r.quality().amplitudeChecks());
            table(h, OutputTables.QUALITY, shown, String.join(" ", Statements.qualitySummary(r)) + " Shown here: the checks that "
                    + "did not pass and the linear range of every amplitude sweep; the workbook's Quality sheet lists every check.");
            h.append("<ul class=\"limits\">\n");
            for (String limit : Statements.QUALITY_LIMITS) {
                h.append("<li>").append(esc(limit)).append("</li>\n");
            }
            h.append("</ul>\n");
        }
        matches(h, r);
        series(h, r);
        transitions(h, r);
        timeTests(h, r);
        maps(h, r);
        if (figures) {
            h.append("<h2>Figures</h2>\n").append(FIGURES_HERE);
        }
        provenance(h, c);
        h.append("</body>\n</html>\n");
        return h.toString();
    }

    /** The glass transitions: each ramp, the activation energies, the comparisons (when ramps were read). */
    private static void transitions(StringBuilder h, AnalysisResult r) {
        org.viscarta.temperature.Transitions t = r.transitions();
        if (t.isEmpty()) {
            return;
        }
        table(h, OutputTables.transitions(t), t.results(), "The glass transition of every temperature ramp by the three "
                + "conventions of ASTM E1640, with the standard error of each local fit (see 'Why three Tg values' and 'Which Tg "
                + "to quote' in the Read me).");
        h.append("<h3>The windows of the local fits, and why a convention gave no number</h3>\n<ul class=\"limits\">\n");
        for (org.viscarta.temperature.GlassTransition.Result g : t.results()) {
            h.append("<li><strong>").append(esc(g.ramp().sample() + ", replicate " + g.ramp().replicate() + ", "
                    + org.viscarta.sweep.Numbers.plain(g.ramp().frequencyHz()) + " Hz")).append("</strong>: ")
                    .append(esc(OutputTables.transitionNotes(g))).append("</li>\n");
        }
        h.append("</ul>\n");
        h.append("<ul class=\"limits\">\n");
        for (String line : Statements.TRANSITION_METHOD) {
            h.append("<li>").append(esc(line)).append("</li>\n");
        }
        h.append("</ul>\n");
        if (!t.activations().isEmpty()) {
            table(h, OutputTables.ACTIVATION, t.activations(), "How strongly each sample's transition moves with frequency.");
        }
        if (!t.sets().isEmpty()) {
            table(h, OutputTables.TRANSITION_RANKING, OutputTables.transitionRankRows(t), "Samples compared within one frequency "
                    + "and one convention, highest first; samples sharing a letter are not distinguishable.");
            for (org.viscarta.temperature.Transitions.RankedSet set : t.sets()) {
                h.append("<h3>").append(esc(set.label())).append("</h3>\n");
                for (String statement : set.statements()) {
                    h.append("<p>").append(esc(statement)).append("</p>\n");
                }
                for (String missing : set.missing()) {
                    h.append("<p>Not compared: ").append(esc(missing)).append("</p>\n");
                }
            }
        }
    }

    /** The mapped specimens: how the positions were placed, and the regions compared. */
    private static void maps(StringBuilder h, AnalysisResult r) {
        if (r.maps().specimens().isEmpty()) {
            return;
        }
        h.append("<h2>Maps</h2>\n<p>").append(esc("Specimens measured at many positions: E′, E″ and tan δ at each position "
                + "(figures below: one tile per position, no interpolation), the region each lies in, and the regions compared. "
                + "Neighbouring positions are not independent measurements (Moran's I below); the letters describe this specimen."))
                .append("</p>\n");
        for (org.viscarta.analysis.Maps.Mapped m : r.maps().specimens()) {
            h.append("<h3>").append(esc(m.specimen().name())).append("</h3>\n<p>").append(esc(m.specimen().points().size()
                    + " positions; " + WorkbookReport.mapSetup(m))).append("</p>\n");
        }
        table(h, OutputTables.REGIONS, OutputTables.regionRows(r.maps().specimens().stream()
                .map(org.viscarta.analysis.Maps.Mapped::specimen).toList()), "Each region's positions: medians with quartiles, means "
                + "with 95 % intervals, and letters (regions sharing one are not distinguishable; E′ compared on a log scale).");
        h.append("<ul class=\"limits\">\n");
        for (org.viscarta.analysis.Maps.Mapped m : r.maps().specimens()) {
            for (String line : WorkbookReport.regionStatements(m.specimen())) {
                h.append("<li>").append(esc(line.strip())).append("</li>\n");
            }
            m.specimen().notes().forEach(n -> h.append("<li>").append(esc(n)).append("</li>\n"));
        }
        h.append("</ul>\n");
    }

    /** The samples measured by stress relaxation or creep: what was fitted and how their moduli were computed. */
    private static void timeTests(StringBuilder h, AnalysisResult r) {
        if (r.timeTests().isEmpty()) {
            return;
        }
        h.append("<h2>Time-domain tests</h2>\n<p>").append(esc(Texts.TIME_TESTS.get(1)[1])).append("</p>\n");
        for (org.viscarta.analysis.TimeTests.Derived d : r.timeTests()) {
            h.append("<h3>").append(esc(d.sample().name())).append("</h3>\n<ul class=\"limits\">\n");
            d.analysis().bestRanked().ifPresent(b -> h.append("<li>").append(esc("Best-supported model, fitted to all "
                    + d.tests().size() + " replicate(s) in the time domain: " + b.fit().model() + " (Akaike weight "
                    + org.viscarta.table.Cells.g4(b.weight()) + ")")).append("</li>\n"));
            for (org.viscarta.sweep.Sweep sw : d.sample().replicates()) {
                h.append("<li>").append(esc("replicate " + sw.replicate() + ": " + org.viscarta.analysis.TimeTests.origin(sw).orElse("")))
                        .append("</li>\n");
            }
            h.append("</ul>\n");
        }
    }

    private static final java.util.regex.Pattern SECTION = java.util.regex.Pattern.compile("<h2>(.*?)</h2>");

    /** The page with an anchor on every section heading and a table of contents before the first. */
    private static String withContents(String page) {
        java.util.regex.Matcher m = SECTION.matcher(page);
        StringBuilder body = new StringBuilder(page.length() + 2048);
        StringBuilder nav = new StringBuilder("<nav>\n<p><strong>Contents</strong></p>\n<ol>\n");
        int k = 0;
        int firstAt = -1;
        while (m.find()) {
            k++;
            if (firstAt < 0) {
                firstAt = m.start();
            }
            nav.append("<li><a href=\"#section-").append(k).append("\">").append(m.group(1)).append("</a></li>\n");
            m.appendReplacement(body, java.util.regex.Matcher.quoteReplacement("<h2 id=\"section-" + k + "\">" + m.group(1) + "</h2>"));
        }
        m.appendTail(body);
        if (firstAt < 0) {
            return page;
        }
        nav.append("</ol>\n</nav>\n");
        int insertAt = body.indexOf("<h2 id=\"section-1\">");
        return body.insert(insertAt, nav).toString();
    }

    /**
     * Most rows a table of the page shows; a longer table shows its first and last half of this
     * many, with a row saying how many lie between and where they are (the workbook holds every row),
     * so that the page stays readable and small for campaigns of thousands of samples.
     */
    static final int MAX_PAGE_ROWS = 200;

    /** The rows a page table shows: all, or the first and last {@link #MAX_PAGE_ROWS}/2 with null for the gap between. */
    static <R> List<R> shownRows(List<R> rows) {
        if (rows.size() <= MAX_PAGE_ROWS) {
            return rows;
        }
        List<R> out = new java.util.ArrayList<>(rows.subList(0, MAX_PAGE_ROWS / 2));
        out.add(null);
        out.addAll(rows.subList(rows.size() - MAX_PAGE_ROWS / 2, rows.size()));
        return out;
    }

    /** The row standing for the rows a long table leaves out. */
    private static void gapRow(StringBuilder h, int columns, int total, String sheet) {
        h.append("<tr><td class=\"gap\" colspan=\"").append(columns).append("\">").append(esc(String.format(java.util.Locale.ROOT,
                "⋮ %,d rows between (%,d in all): every row is in the workbook's %s sheet", total - MAX_PAGE_ROWS, total, sheet)))
                .append("</td></tr>\n");
    }

    /** Draws a declared table: a heading, an optional sentence, a header row with units, numbers right-aligned. */
    private static <R> void table(StringBuilder h, Table<R> table, List<R> items, String intro) {
        List<Column<R>> cols = table.columnsFor(Medium.HTML);
        h.append("<h2>").append(esc(table.name())).append("</h2>\n");
        if (!intro.isEmpty()) {
            h.append("<p>").append(esc(intro)).append("</p>\n");
        }
        h.append("<table class=\"wide\">\n<tr>");
        for (Column<R> col : cols) {
            h.append("<th>").append(esc(col.header())).append("</th>");
        }
        h.append("</tr>\n");
        for (R item : shownRows(items)) {
            if (item == null) {
                gapRow(h, cols.size(), items.size(), table.name());
                continue;
            }
            h.append("<tr>");
            for (Column<R> col : cols) {
                Object v = col.value().apply(item);
                h.append(v instanceof Number ? "<td class=\"n\">" : col.width() >= 30 ? "<td class=\"long\">" : "<td>")
                        .append(esc(Cells.readable(v, col.style()))).append("</td>");
            }
            h.append("</tr>\n");
        }
        h.append("</table>\n");
    }

    private static void matches(StringBuilder h, AnalysisResult r) {
        if (r.library().isPresent()) {
            h.append("<h2>Closest reference materials</h2>\n<p>Distance: the typical difference of the E′ and E″ curves on a "
                    + "logarithmic scale over the frequencies both were measured at, in decades (0.1 ≈ 26 % apart).</p>\n<table>\n"
                    + "<tr><th>sample</th><th>closest</th><th>distance [decades]</th><th>second</th><th>distance [decades]</th>"
                    + "<th>first and second distinguishable</th></tr>\n");
            for (SampleAnalysis sa : shownRows(r.samples())) {
                if (sa == null) {
                    gapRow(h, 6, r.samples().size(), "Reference matches");
                    continue;
                }
                List<Matcher.Match> m = sa.matches();
                Matcher.Match a = m.size() > 0 && m.get(0).rank() == 1 ? m.get(0) : null;
                Matcher.Match b = m.size() > 1 && m.get(1).rank() == 2 ? m.get(1) : null;
                h.append("<tr><td>").append(esc(sa.sample().name())).append("</td><td>")
                        .append(a == null ? "–" : esc(a.reference())).append("</td><td class=\"n\">")
                        .append(a == null ? "–" : num(a.result().distance()) + " ± " + num(a.result().uncertainty()))
                        .append("</td><td>").append(b == null ? "–" : esc(b.reference())).append("</td><td class=\"n\">")
                        .append(b == null ? "–" : num(b.result().distance())).append("</td><td>")
                        .append(esc(Matcher.distinguishable(m))).append("</td></tr>\n");
            }
            h.append("</table>\n");
        }
        r.mimic().ifPresent(mimic -> {
            h.append("<h2>Best mimic of ").append(esc(mimic.target())).append("</h2>\n<table>\n<tr><th>rank</th><th>candidate</th>"
                    + "<th>distance [decades]</th><th>differs most at [Hz]</th><th>note</th></tr>\n");
            for (Matcher.Match m : mimic.matches()) {
                h.append("<tr><td class=\"n\">").append(m.rank() == 0 ? "" : m.rank()).append("</td><td>").append(esc(m.reference()))
                        .append("</td><td class=\"n\">").append(num(m.result().distance())).append(" ± ")
                        .append(num(m.result().uncertainty())).append("</td><td class=\"n\">").append(num(m.result().departureHz()))
                        .append("</td><td>").append(esc(m.result().note())).append("</td></tr>\n");
            }
            h.append("</table>\n<p>").append(esc("First and second distinguishable: " + Matcher.distinguishable(mimic.matches())))
                    .append("</p>\n");
        });
    }

    private static void series(StringBuilder h, AnalysisResult res) {
        for (org.viscarta.temperature.TemperatureSeries ts : res.series()) {
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

    private static void provenance(StringBuilder h, ReportContent c) {
        Provenance p = c.provenance();
        h.append("<h2>Provenance</h2>\n<table>\n<tr><th>tool</th><td>Viscarta ").append(esc(p.toolVersion())).append("</td></tr>\n")
                .append("<tr><th>command line</th><td><code>").append(esc(p.commandLine())).append("</code></td></tr>\n")
                .append("<tr><th>run at (UTC)</th><td>").append(esc(p.runAtUtc())).append("</td></tr>\n");
        for (Map.Entry<String, String> e : Statements.settings(c.result().request()).entrySet()) {
            h.append("<tr><th>").append(esc(e.getKey())).append("</th><td>").append(esc(e.getValue())).append("</td></tr>\n");
        }
        h.append("</table>\n<table>\n<tr><th>input file</th><th>SHA-256</th></tr>\n");
        for (SweepFile f : c.result().inputs().files()) {
            h.append("<tr><td>").append(esc(f.path().toString())).append("</td><td><code>").append(f.sha256()).append("</code></td></tr>\n");
        }
        h.append("</table>\n");
        List<String> warnings = c.result().inputs().warningTexts();
        if (!warnings.isEmpty()) {
            h.append("<h3>Warnings and conversions</h3>\n<ul>\n");
            warnings.forEach(w -> h.append("<li>").append(esc(w)).append("</li>\n"));
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
