package org.viscarta.serve;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.ComparableSets;
import org.viscarta.analysis.MasterCurves;
import org.viscarta.analysis.QualitySettings;
import org.viscarta.analysis.ReadSettings;
import org.viscarta.analysis.Target;
import org.viscarta.compare.DampingRanking;
import org.viscarta.compare.RankingPoint;
import org.viscarta.fit.Weighting;
import org.viscarta.sweep.ModulusKind;
import org.viscarta.sweep.Unit;
import org.viscarta.temperature.ShiftAnalysis;

/**
 * The settings a page or a script sends (JSON), turned into the same typed request the command line
 * builds. Every field is optional; each default is the command line's. A value the request refuses
 * is a 400 with the message the command line would give.
 *
 * <p>Fields: {@code modulus}, {@code basis} (tensile|shear), {@code poisson}, {@code columns}
 * (header → "quantity [unit]" or "ignore"), {@code group_by}, {@code models} (ids),
 * {@code weighting}, {@code at} (a frequency such as "1 Hz"), {@code band} ("0.5-5"), {@code alpha},
 * {@code temperature_tolerance}, {@code within_groups}, {@code model_outside_range},
 * {@code drop_outliers}, {@code linear_limit_percent}, {@code target} (a sample's name),
 * {@code reference_temperature}, {@code vertical}, {@code use_library}.
 */
final class Settings {

    private final Map<String, Object> json;

    Settings(Map<String, Object> json) {
        this.json = json == null ? Map.of() : json;
    }

    /** The reading part alone (for inspecting files). */
    ReadSettings reading() {
        return buildOrRefuse(readingInto(AnalysisRequest.builder(List.of()))).reading();
    }

    /** The whole report request on these inputs; the library is used when one is given and asked for. */
    AnalysisRequest report(List<Path> inputs, Path library) {
        AnalysisRequest.Builder b = readingInto(AnalysisRequest.builder(inputs));
        List<String> models = strings("models");
        if (!models.isEmpty()) {
            b.models(models);
        }
        b.weighting(refuseBad(() -> Weighting.parse(text("weighting", "log"))));
        b.sets(refuseBad(() -> new ComparableSets(number("temperature_tolerance", 2), flag("within_groups", false))));
        b.alpha(number("alpha", 0.05));
        b.outsideRange(flag("model_outside_range", false) ? DampingRanking.OutsideRange.BEST_MODEL
                : DampingRanking.OutsideRange.NOT_REPORTED);
        String band = text("band", "").strip();
        if (band.isEmpty()) {
            b.rankingPoint(new RankingPoint.At(frequency("at", text("at", "1 Hz"))));
        } else {
            String[] parts = band.split("(?<![eE])-", 2);
            if (parts.length != 2) {
                throw ApiError.badRequest("band takes LOW-HIGH, e.g. 0.5-5 or 0.5Hz-5Hz, not '" + band + "'");
            }
            b.rankingPoint(refuseBad(() -> new RankingPoint.Band(frequency("band", parts[0]), frequency("band", parts[1]))));
        }
        b.quality(refuseBad(() -> new QualitySettings(number("linear_limit_percent", 5) / 100, flag("drop_outliers", false))));
        b.masterCurves(refuseBad(() -> new MasterCurves(number("reference_temperature", 23),
                ShiftAnalysis.Vertical.parse(text("vertical", "none")))));
        String target = text("target", "").strip();
        if (!target.isEmpty()) {
            b.target(new Target.AmongInputs(target));
        }
        b.compute(AnalysisRequest.Part.RANKING, AnalysisRequest.Part.QUALITY, AnalysisRequest.Part.FITS,
                AnalysisRequest.Part.SPECTRA, AnalysisRequest.Part.TRANSITIONS, AnalysisRequest.Part.MAPS);
        if (library != null && flag("use_library", true)) {
            b.library(library).compute(AnalysisRequest.Part.MATCHES).uncertainMatches(org.viscarta.compare.Matcher.SHOWN);
        }
        return buildOrRefuse(b);
    }

    /** The same request as a command line, for the Provenance sheet. */
    String asCommandLine(List<String> inputNames, Path library) {
        StringBuilder sb = new StringBuilder("viscarta report");
        for (String n : inputNames) {
            sb.append(' ').append(quote(n));
        }
        Map<String, String> options = new LinkedHashMap<>();
        options.put("modulus", "--modulus");
        options.put("basis", "--basis");
        options.put("poisson", "--poisson");
        options.put("group_by", "--group-by");
        options.put("weighting", "--weighting");
        options.put("at", "--at");
        options.put("band", "--band");
        options.put("alpha", "--alpha");
        options.put("temperature_tolerance", "--temperature-tolerance");
        options.put("linear_limit_percent", "--linear-limit");
        options.put("target", "--target");
        options.put("reference_temperature", "--reference-temperature");
        options.put("vertical", "--vertical");
        for (Map.Entry<String, String> e : options.entrySet()) {
            Object v = json.get(e.getKey());
            if (v != null && !String.valueOf(v).isBlank()) {
                sb.append(' ').append(e.getValue()).append(' ').append(quote(String.valueOf(v)));
            }
        }
        for (Map.Entry<String, String> e : columns().entrySet()) {
            sb.append(" --column ").append(quote(e.getKey() + "=" + e.getValue()));
        }
        List<String> models = strings("models");
        if (!models.isEmpty()) {
            sb.append(" --models ").append(String.join(",", models));
        }
        for (String[] f : new String[][] {{"within_groups", "--within-groups"}, {"model_outside_range", "--model-outside-range"},
            {"drop_outliers", "--drop-outliers"}}) {
            if (flag(f[0], false)) {
                sb.append(' ').append(f[1]);
            }
        }
        if (library != null && flag("use_library", true)) {
            sb.append(" --library ").append(quote(library.getFileName() == null ? library.toString() : library.getFileName().toString()));
        }
        return sb.append(" (run from the workbench)").toString();
    }

    private AnalysisRequest.Builder readingInto(AnalysisRequest.Builder b) {
        String modulus = text("modulus", "");
        if (!modulus.isBlank()) {
            b.declaredKind(kind(modulus, "modulus"));
        }
        String basis = text("basis", "");
        if (!basis.isBlank()) {
            b.basis(kind(basis, "basis"));
        }
        Object nu = json.get("poisson");
        if (nu != null && !String.valueOf(nu).isBlank()) {
            b.poisson(number("poisson", Double.NaN));
        }
        String groupBy = text("group_by", "");
        return b.columns(columns()).groupBy(groupBy.isBlank() ? null : groupBy).badFiles(ReadSettings.BadFiles.LEAVE_OUT);
    }

    private Map<String, String> columns() {
        Object c = json.get("columns");
        Map<String, String> out = new LinkedHashMap<>();
        if (c == null) {
            return out;
        }
        if (!(c instanceof Map<?, ?> m)) {
            throw ApiError.badRequest("columns takes an object of header → 'quantity [unit]' (or 'ignore')");
        }
        for (Map.Entry<?, ?> e : m.entrySet()) {
            String k = String.valueOf(e.getKey()).strip();
            String v = e.getValue() == null ? "" : String.valueOf(e.getValue()).strip();
            if (!k.isEmpty() && !v.isEmpty()) {
                out.put(k, v);
            }
        }
        return out;
    }

    private static ModulusKind kind(String text, String field) {
        ModulusKind k = ModulusKind.parse(text);
        if (k == null) {
            throw ApiError.badRequest(field + " takes 'tensile' or 'shear', not '" + text + "'");
        }
        return k;
    }

    private static double frequency(String field, String value) {
        try {
            return Unit.frequencyHz(value);
        } catch (IllegalArgumentException e) {
            throw ApiError.badRequest(field + ": " + e.getMessage());
        }
    }

    private String text(String field, String fallback) {
        Object v = json.get(field);
        return v == null ? fallback : String.valueOf(v);
    }

    private double number(String field, double fallback) {
        Object v = json.get(field);
        if (v == null || String.valueOf(v).isBlank()) {
            return fallback;
        }
        if (v instanceof Number n) {
            return n.doubleValue();
        }
        try {
            return Double.parseDouble(String.valueOf(v).strip().replace(',', '.'));
        } catch (NumberFormatException e) {
            throw ApiError.badRequest(field + " takes a number, not '" + v + "'");
        }
    }

    private boolean flag(String field, boolean fallback) {
        Object v = json.get(field);
        if (v == null) {
            return fallback;
        }
        if (v instanceof Boolean b) {
            return b;
        }
        String s = String.valueOf(v).strip().toLowerCase(Locale.ROOT);
        if (s.equals("true") || s.equals("on") || s.equals("yes")) {
            return true;
        }
        if (s.equals("false") || s.equals("off") || s.equals("no") || s.isEmpty()) {
            return false;
        }
        throw ApiError.badRequest(field + " takes true or false, not '" + v + "'");
    }

    private List<String> strings(String field) {
        Object v = json.get(field);
        List<String> out = new ArrayList<>();
        if (v instanceof List<?> l) {
            for (Object o : l) {
                if (o != null && !String.valueOf(o).isBlank()) {
                    out.add(String.valueOf(o).strip());
                }
            }
        } else if (v != null && !String.valueOf(v).isBlank()) {
            for (String s : String.valueOf(v).split(",")) {
                if (!s.isBlank()) {
                    out.add(s.strip());
                }
            }
        }
        return out;
    }

    private static <T> T refuseBad(java.util.function.Supplier<T> s) {
        try {
            return s.get();
        } catch (IllegalArgumentException | org.viscarta.io.UsageException e) {
            throw ApiError.badRequest(e.getMessage());
        }
    }

    private static AnalysisRequest buildOrRefuse(AnalysisRequest.Builder b) {
        try {
            return b.build();
        } catch (IllegalArgumentException e) {
            throw ApiError.badRequest(e.getMessage());
        }
    }

    private static String quote(String s) {
        return s.matches("[A-Za-z0-9._/:=+-]+") ? s : "'" + s.replace("'", "'\\''") + "'";
    }

    static boolean isFile(Path p) {
        return Files.isRegularFile(p);
    }
}
