package org.viscarta.cli;

import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.viscarta.io.ColumnSpec;
import org.viscarta.io.ReadWarning;
import org.viscarta.io.SweepReader;

/** The JSON that {@code inspect -o} writes: how each file was understood. Hand-written: one small, fixed shape. */
final class Json {

    private Json() {
    }

    static String inspect(List<SweepReader.Summary> files, List<String> leftOut) {
        StringBuilder b = new StringBuilder("{\n  \"files\": [");
        for (int i = 0; i < files.size(); i++) {
            SweepReader.Summary f = files.get(i);
            b.append(i == 0 ? "\n" : ",\n").append("    {\"path\": ").append(str(f.path().toString()))
                    .append(", \"layout\": ").append(str(f.info().layout()))
                    .append(", \"separator\": ").append(str(f.info().separatorName()))
                    .append(", \"decimal_mark\": ").append(str(String.valueOf(f.info().decimalMark())))
                    .append(", \"encoding\": ").append(str(f.info().encoding()))
                    .append(", \"header_line\": ").append(f.info().headerLine())
                    .append(",\n     \"columns\": [");
            List<ColumnSpec> cols = f.info().columns();
            for (int k = 0; k < cols.size(); k++) {
                ColumnSpec col = cols.get(k);
                b.append(k == 0 ? "" : ", ").append("{\"column\": ").append(col.index() + 1).append(", \"header\": ")
                        .append(str(col.header())).append(", \"quantity\": ").append(str(col.quantity().canonical()))
                        .append(", \"unit\": ").append(col.unit() == null ? "null" : str(col.unit().symbol())).append('}');
            }
            b.append("],\n     \"metadata\": {");
            int k = 0;
            for (Map.Entry<String, String> e : f.info().metadata().entrySet()) {
                b.append(k++ == 0 ? "" : ", ").append(str(e.getKey())).append(": ").append(str(e.getValue()));
            }
            b.append("},\n     \"sweeps\": [");
            k = 0;
            for (SweepReader.SweepSummary s : f.sweeps()) {
                b.append(k++ == 0 ? "" : ", ").append("{\"sample\": ").append(str(s.sample())).append(", \"replicate\": ")
                        .append(str(s.replicate())).append(", \"group\": ").append(str(s.group())).append(", \"basis\": ")
                        .append(str(s.kind().toString())).append(", \"points\": ").append(s.points())
                        .append(", \"frequency_min_hz\": ").append(num(s.minFrequencyHz())).append(", \"frequency_max_hz\": ")
                        .append(num(s.maxFrequencyHz())).append(", \"temperature_c\": ").append(num(s.temperatureC()))
                        .append(s.test().isEmpty() ? "" : ", \"test\": " + str(s.test())).append('}');
            }
            b.append("],\n     \"warnings\": [");
            k = 0;
            for (ReadWarning w : f.warnings()) {
                b.append(k++ == 0 ? "" : ", ").append(str(w.toString()));
            }
            b.append("]}");
        }
        b.append("\n  ],\n  \"left_out\": [");
        int k = 0;
        for (String l : leftOut) {
            b.append(k++ == 0 ? "" : ", ").append(str(l));
        }
        return b.append("]\n}\n").toString();
    }

    private static String num(double v) {
        return Double.isFinite(v) ? String.format(Locale.ROOT, "%s", v) : "null";
    }

    static String str(String s) {
        StringBuilder b = new StringBuilder("\"");
        for (char ch : s.toCharArray()) {
            switch (ch) {
                case '"': b.append("\\\""); break;
                case '\\': b.append("\\\\"); break;
                case '\n': b.append("\\n"); break;
                case '\r': b.append("\\r"); break;
                case '\t': b.append("\\t"); break;
                default:
                    if (ch < 0x20) {
                        b.append(String.format(Locale.ROOT, "\\u%04x", (int) ch));
                    } else {
                        b.append(ch);
                    }
            }
        }
        return b.append('"').toString();
    }
}
