package org.viscarta.raw;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.viscarta.io.InputException;
import org.viscarta.io.ReadWarning;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;

/** A raw measurement turned into a sweep, with its quality per point and the warnings it raised. */
public record RawSweeps(RawReader.Measurement measurement, Geometry geometry, List<RawConverter.Point> points, Sweep sweep,
                        List<ReadWarning> warnings) {

    public RawSweeps {
        points = List.copyOf(points);
        warnings = List.copyOf(warnings);
    }

    /**
     * Converts a raw file; its calibration is {@code calibration} when given, else the file named by
     * its own {@code # calibration:} line (relative to the raw file's folder), else none.
     */
    public static RawSweeps convert(RawReader.Measurement m, RawConverter.Settings s, RawConverter.Calibration calibration) {
        RawConverter.Calibration cal = calibration;
        String named = m.metadata().get("calibration");
        if (cal == null && named != null) {
            Path p = m.file().toAbsolutePath().getParent().resolve(named);
            if (!java.nio.file.Files.isRegularFile(p)) {
                throw new InputException(m.file(), 1, 0, "the calibration file '" + named + "' is missing; it is looked for beside this file");
            }
            cal = RawConverter.calibration(RawReader.read(p), s);
        }
        Geometry g = RawConverter.geometry(m);
        List<RawConverter.Point> pts = RawConverter.convert(m, s, cal);
        List<SweepPoint> sp = new ArrayList<>();
        List<ReadWarning> warnings = new ArrayList<>();
        for (RawConverter.Point p : pts) {
            if (!(p.storage() > 0)) {
                throw new InputException(m.file(), p.firstLine(), 0, String.format(Locale.ROOT, "the %.4g Hz segment gives a storage "
                        + "modulus of %.4g Pa, not positive: check the signals' phase, calibration and units", p.frequencyHz(), p.storage()));
            }
            sp.add(new SweepPoint(p.frequencyHz(), p.storage(), p.loss(), p.firstLine()));
            if (!p.linear()) {
                warnings.add(new ReadWarning(m.file(), p.firstLine(), p.note()));
            }
        }
        Map<String, String> meta = new LinkedHashMap<>(m.metadata());
        String stem = m.file().getFileName().toString().replaceFirst("\\.[^.]*$", "");
        String sample = meta.getOrDefault("sample", stem);
        meta.put("geometry_used", g.describe());
        meta.put("calibration_used", cal == null ? "none" : named != null && calibration == null ? named : "given on the command line");
        Sweep sweep = new Sweep(sample, meta.getOrDefault("replicate", stem), meta.getOrDefault("group", ""), g.kind(),
                meta.containsKey("temperature") ? parseTemperature(m, meta.get("temperature")) : Double.NaN, m.file(), meta, sp);
        return new RawSweeps(m, g, pts, sweep, warnings);
    }

    private static double parseTemperature(RawReader.Measurement m, String text) {
        try {
            return Double.parseDouble(text.replaceAll("[^0-9.eE+-]", ""));
        } catch (NumberFormatException e) {
            throw new InputException(m.file(), 1, 0, "'# temperature: " + text + "' is not understood; write e.g. '# temperature: 23 °C'");
        }
    }

    /** The sweep table {@code moduli} writes: the standard columns and quality columns. */
    public String table() {
        StringBuilder sb = new StringBuilder();
        sb.append("# sample: ").append(sweep.sample()).append('\n');
        sb.append("# replicate: ").append(sweep.replicate()).append('\n');
        if (!sweep.group().isEmpty()) {
            sb.append("# group: ").append(sweep.group()).append('\n');
        }
        sb.append("# modulus: ").append(sweep.kind()).append('\n');
        if (Double.isFinite(sweep.temperatureC())) {
            sb.append("# temperature: ").append(sweep.metadata().get("temperature")).append('\n');
        }
        sb.append("# method: oscillation signals demodulated by Viscarta\n");
        sb.append("# geometry_used: ").append(geometry.describe()).append('\n');
        sb.append("# calibration_used: ").append(sweep.metadata().get("calibration_used")).append('\n');
        sb.append("# source_file: ").append(measurement.file().getFileName()).append('\n');
        sb.append("# source_sha256: ").append(measurement.sha256()).append('\n');
        for (String key : List.of("note", "notes")) {
            if (sweep.metadata().containsKey(key)) {
                sb.append("# ").append(key).append(": ").append(sweep.metadata().get(key)).append('\n');
            }
        }
        sb.append("frequency [Hz],storage_modulus [Pa],loss_modulus [Pa],quality_storage_std_error [Pa],quality_loss_std_error [Pa],"
                + "quality_force_distortion,quality_displacement_distortion,quality_contact_second_harmonic,quality_cycles,quality_linear\n");
        for (RawConverter.Point p : points) {
            sb.append(String.format(Locale.ROOT, "%s,%s,%s,%.4g,%.4g,%.4g,%.4g,%.4g,%d,%s%n", p.frequencyHz(), p.storage(), p.loss(),
                    p.storageStdError(), p.lossStdError(), p.forceDistortion(), p.displacementDistortion(), p.contactHarmonic(),
                    p.cycles(), p.linear() ? "yes" : "no"));
        }
        return sb.toString();
    }
}
