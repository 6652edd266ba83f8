package org.viscarta.serve;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.viscarta.analysis.AnalysisResult;
import org.viscarta.analysis.Ranking;
import org.viscarta.analysis.SampleAnalysis;
import org.viscarta.analysis.Statements;
import org.viscarta.compare.Matcher;
import org.viscarta.quality.SweepChecks;
import org.viscarta.quality.Verdict;
import org.viscarta.report.OutputTables;
import org.viscarta.report.PlotData;
import org.viscarta.report.RenderedFigure;
import org.viscarta.report.Texts;
import org.viscarta.sweep.Ramp;
import org.viscarta.table.Cells;
import org.viscarta.table.Column;
import org.viscarta.table.Medium;
import org.viscarta.table.Table;
import org.viscarta.temperature.GlassTransition;
import org.viscarta.temperature.ShiftAnalysis;
import org.viscarta.temperature.TemperatureSeries;
import org.viscarta.temperature.Transitions;

/**
 * An analysis result as the page shows it: the tables the HTML report shows, declared once in
 * {@link OutputTables} and formatted by the same {@link Cells#readable} (so names, units and number
 * formats are those of the workbook and the page), the statements and cautions, and the numbers
 * behind each plot in SI units.
 */
final class ResultJson {


    private ResultJson() {
    }

    static Map<String, Object> of(Job job) {
        AnalysisResult r = job.result();
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("id", job.id);
        m.put("what", Statements.whatThisIs(r));
        m.put("demo", r.inputs().isDemo() ? Texts.DEMO : null);
        List<Map<String, String>> defs = new ArrayList<>();
        for (String[] d : Texts.definitions(r)) {
            defs.add(Map.of("term", d[0], "text", d[1]));
        }
        m.put("definitions", defs);
        m.put("cautions", Texts.cautions(r));
        List<String> warnings = new ArrayList<>();
        r.inputs().warnings().forEach(w -> warnings.add(Uploads.relative(w.toString(), job)));
        m.put("warnings", warnings);
        List<String> notes = new ArrayList<>();
        r.inputs().notes().forEach(n -> notes.add(Uploads.relative(n, job)));
        m.put("notes", notes);
        List<Map<String, Object>> tables = new ArrayList<>();
        tables.add(table(OutputTables.summary(r), r.samples(), "", List.of()));
        r.ranking().ifPresent(rk -> {
            List<String> statements = new ArrayList<>();
            for (Ranking.RankedSet set : rk.sets()) {
                statements.add(set.label() + ":");
                set.result().comparison().statements().forEach(s -> statements.add("  " + s));
            }
            Map<String, Object> t = table(OutputTables.ranking(r), rk.rows(), Statements.rankedBy(r.request())
                    + ", highest damping first, within comparable sets (" + r.request().sets().describe()
                    + "); mean over replicates with its 95 % interval.", statements);
            t.put("id", "ranking");
            tables.add(t);
        });
        if (r.request().parts().contains(org.viscarta.analysis.AnalysisRequest.Part.QUALITY)) {
            List<SweepChecks.Check> shown = new ArrayList<>(r.quality().sweepChecks().stream()
                    .filter(k -> k.verdict() != Verdict.PASS).toList());
            shown.addAll(r.quality().amplitudeChecks());
            List<String> limits = new ArrayList<>(Statements.QUALITY_LIMITS);
            tables.add(table(OutputTables.QUALITY, shown, String.join(" ", Statements.qualitySummary(r))
                    + " Shown here: the checks that did not pass and the linear range of every amplitude sweep; the workbook's "
                    + "Quality sheet lists every check.", limits));
        }
        if (r.library().isPresent()) {
            List<Matcher.Match> matches = r.samples().stream().flatMap(sa -> sa.matches().stream().limit(Matcher.SHOWN)).toList();
            tables.add(table(OutputTables.matches(false), matches, "Each sample's five closest reference materials; distance in "
                    + "decades of the E′ and E″ curves (0.1 ≈ 26 % apart).", List.of()));
        }
        r.mimic().ifPresent(mm -> tables.add(table(OutputTables.matches(true), mm.matches(), "Every other sample ranked by its "
                + "distance to the target " + mm.target() + ".", List.of("first and second distinguishable: "
                + Matcher.distinguishable(mm.matches())))));
        Transitions tr = r.transitions();
        if (!tr.isEmpty()) {
            tables.add(table(OutputTables.transitions(tr), tr.results(), "The glass transition of every temperature ramp by the "
                    + "three conventions of ASTM E1640, with the standard error of each local fit.", Statements.TRANSITION_METHOD));
            if (!tr.activations().isEmpty()) {
                tables.add(table(OutputTables.ACTIVATION, tr.activations(), "How strongly each sample's transition moves with "
                        + "frequency.", List.of()));
            }
            if (!tr.sets().isEmpty()) {
                List<String> statements = new ArrayList<>();
                for (Transitions.RankedSet set : tr.sets()) {
                    statements.add(set.label() + ":");
                    set.statements().forEach(s -> statements.add("  " + s));
                }
                tables.add(table(OutputTables.TRANSITION_RANKING, OutputTables.transitionRankRows(tr), "Samples compared within one "
                        + "frequency and one convention, highest first; samples sharing a letter are not distinguishable.",
                        statements));
            }
        }
        if (!r.maps().specimens().isEmpty()) {
            List<String> statements = new ArrayList<>();
            for (org.viscarta.analysis.Maps.Mapped mp : r.maps().specimens()) {
                statements.add(mp.specimen().name() + ": " + mp.specimen().points().size() + " positions; "
                        + org.viscarta.report.WorkbookReport.mapSetup(mp));
                mp.specimen().notes().forEach(n -> statements.add("  " + n));
            }
            tables.add(table(OutputTables.REGIONS, OutputTables.regionRows(r.maps().specimens().stream()
                    .map(org.viscarta.analysis.Maps.Mapped::specimen).toList()), "The regions of each mapped specimen (its maps are "
                    + "in Figures).", statements));
        }
        m.put("tables", tables);
        m.put("series", series(r));
        List<Map<String, Object>> samples = new ArrayList<>();
        for (SampleAnalysis sa : r.samples()) {
            samples.add(sample(r, sa));
        }
        m.put("samples", samples);
        m.put("ramps", ramps(tr));
        List<Map<String, String>> figures = new ArrayList<>();
        for (RenderedFigure f : job.figures()) {
            figures.add(Map.of("name", f.stem(), "caption", f.caption()));
        }
        m.put("figures", figures);
        return m;
    }

    /** A declared table as the HTML report shows it: headers with units, cells formatted alike. */
    static <R> Map<String, Object> table(Table<R> table, Iterable<R> items, String intro, List<String> notes) {
        List<Column<R>> cols = table.columnsFor(Medium.HTML);
        List<String> headers = new ArrayList<>();
        List<Boolean> numeric = new ArrayList<>();
        for (Column<R> c : cols) {
            headers.add(c.header());
            numeric.add(Boolean.FALSE);
        }
        List<List<String>> rows = new ArrayList<>();
        for (R item : items) {
            List<String> row = new ArrayList<>();
            for (int i = 0; i < cols.size(); i++) {
                Object v = cols.get(i).value().apply(item);
                if (v instanceof Number) {
                    numeric.set(i, Boolean.TRUE);
                }
                row.add(Cells.readable(v, cols.get(i).style()));
            }
            rows.add(row);
        }
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("id", table.name().toLowerCase(java.util.Locale.ROOT).replaceAll("[^a-z0-9]+", "-"));
        m.put("name", table.name());
        m.put("intro", intro);
        m.put("headers", headers);
        m.put("numeric", numeric);
        m.put("rows", rows);
        m.put("notes", notes);
        return m;
    }

    private static Map<String, Object> sample(AnalysisResult r, SampleAnalysis sa) {
        PlotData p = PlotData.of(sa.sample(), sa.curve().orElse(null));
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("name", sa.sample().name());
        m.put("group", sa.sample().group());
        m.put("letter", sa.sample().kind().letter());
        m.put("set", r.setOf(sa.sample()));
        m.put("master_curve", r.series().stream().anyMatch(ts -> ts.masterName().equals(sa.sample().name())));
        Map<String, Object> measured = new LinkedHashMap<>();
        measured.put("frequency_hz", p.frequencyHz());
        measured.put("storage_pa", p.storage());
        measured.put("storage_low_pa", p.storageLow());
        measured.put("storage_high_pa", p.storageHigh());
        measured.put("loss_pa", p.loss());
        measured.put("loss_low_pa", p.lossLow());
        measured.put("loss_high_pa", p.lossHigh());
        m.put("measured", measured);
        if (p.model() != null) {
            Map<String, Object> curve = new LinkedHashMap<>();
            curve.put("model", p.model());
            curve.put("frequency_hz", p.curveHz());
            curve.put("storage_pa", p.curveStorage());
            curve.put("storage_low_pa", p.curveStorageLow());
            curve.put("storage_high_pa", p.curveStorageHigh());
            curve.put("loss_pa", p.curveLoss());
            curve.put("loss_low_pa", p.curveLossLow());
            curve.put("loss_high_pa", p.curveLossHigh());
            curve.put("residual_storage", p.residualStorage());
            curve.put("residual_loss", p.residualLoss());
            m.put("curve", curve);
        }
        sa.bestRanked().ifPresent(b -> m.put("best", b.fit().model()));
        r.timeTestOf(sa.sample()).ifPresent(d -> m.put("time_test", timeTest(d)));
        m.put("also_supported", sa.alsoSupported());
        sa.closest().ifPresent(c -> m.put("closest", c.reference()));
        return m;
    }

    /** A sample computed from time-domain tests: its measured M(t) or J(t) per replicate and the best model. */
    private static Map<String, Object> timeTest(org.viscarta.analysis.TimeTests.Derived d) {
        Map<String, Object> m = new LinkedHashMap<>();
        boolean relaxation = d.type() == org.viscarta.sweep.TimeTest.Type.RELAXATION;
        m.put("test", d.type().test());
        m.put("quantity", d.type().quantity());
        m.put("symbol", relaxation ? d.sample().kind().letter() + "(t)" : "J(t)");
        m.put("unit", d.type().unit());
        List<Map<String, Object>> reps = new ArrayList<>();
        double lo = Double.POSITIVE_INFINITY;
        double hi = 0;
        for (org.viscarta.sweep.TimeTest t : d.tests()) {
            Map<String, Object> x = new LinkedHashMap<>();
            x.put("replicate", t.replicate());
            x.put("time_s", t.points().stream().mapToDouble(org.viscarta.sweep.TimeTest.Point::timeS).toArray());
            x.put("value", t.points().stream().mapToDouble(org.viscarta.sweep.TimeTest.Point::value).toArray());
            reps.add(x);
            lo = Math.min(lo, t.minTimeS());
            hi = Math.max(hi, t.maxTimeS());
        }
        m.put("replicates", reps);
        org.viscarta.fit.FitResult best = d.analysis().best().orElse(null);
        if (best != null && best.fitted() != null) {
            double[] ts = new double[60];
            double[] vs = new double[60];
            for (int k = 0; k < 60; k++) {
                ts[k] = lo * Math.pow(hi / lo, k / 59.0);
                vs[k] = relaxation ? best.fitted().relaxationModulus(ts[k], best.values()) : best.fitted().creepCompliance(ts[k], best.values());
            }
            m.put("model", best.model());
            m.put("model_time_s", ts);
            m.put("model_value", vs);
        }
        m.put("origin", d.sample().replicates().stream().map(sw -> "replicate " + sw.replicate() + ": "
                + org.viscarta.analysis.TimeTests.origin(sw).orElse("")).toList());
        return m;
    }

    private static List<Map<String, Object>> series(AnalysisResult r) {
        List<Map<String, Object>> out = new ArrayList<>();
        for (TemperatureSeries ts : r.series()) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("sample", ts.sample());
            m.put("master_curve", ts.masterName());
            m.put("reference_c", ts.result().referenceC());
            List<Map<String, Object>> factors = new ArrayList<>();
            for (ShiftAnalysis.Factor f : ts.result().factors()) {
                Map<String, Object> x = new LinkedHashMap<>();
                x.put("temperature_c", f.temperatureC());
                x.put("log10_a_t", f.placed() ? f.log10aT() : null);
                x.put("log10_a_t_std_error", f.placed() ? f.log10aTStdError() : null);
                x.put("b_t", f.bT());
                x.put("placed", f.placed());
                factors.add(x);
            }
            m.put("factors", factors);
            m.put("notes", ts.result().notes());
            out.add(m);
        }
        return out;
    }

    private static List<Map<String, Object>> ramps(Transitions t) {
        Map<String, Map<String, Object>> bySample = new LinkedHashMap<>();
        for (GlassTransition.Result g : t.results()) {
            Ramp ramp = g.ramp();
            Map<String, Object> s = bySample.computeIfAbsent(ramp.sample(), k -> {
                Map<String, Object> x = new LinkedHashMap<>();
                x.put("sample", k);
                x.put("letter", ramp.kind().letter());
                x.put("ramps", new ArrayList<Map<String, Object>>());
                return x;
            });
            Map<String, Object> one = new LinkedHashMap<>();
            one.put("replicate", ramp.replicate());
            one.put("frequency_hz", ramp.frequencyHz());
            int n = ramp.points().size();
            double[] tc = new double[n];
            double[] st = new double[n];
            double[] lo = new double[n];
            double[] tan = new double[n];
            for (int i = 0; i < n; i++) {
                Ramp.Point p = ramp.points().get(i);
                tc[i] = p.temperatureC();
                st[i] = p.storage();
                lo[i] = p.loss();
                tan[i] = p.lossTangent();
            }
            one.put("temperature_c", tc);
            one.put("storage_pa", st);
            one.put("loss_pa", lo);
            one.put("tan_delta", tan);
            one.put("tg_storage_onset_c", g.onset().found() ? g.onset().valueC() : null);
            one.put("tg_loss_peak_c", g.lossPeak().found() ? g.lossPeak().valueC() : null);
            one.put("tg_tan_delta_peak_c", g.tanDeltaPeak().found() ? g.tanDeltaPeak().valueC() : null);
            @SuppressWarnings("unchecked")
            List<Map<String, Object>> list = (List<Map<String, Object>>) s.get("ramps");
            list.add(one);
        }
        return new ArrayList<>(bySample.values());
    }
}
