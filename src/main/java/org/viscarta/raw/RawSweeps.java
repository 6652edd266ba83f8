package org.viscarta.raw;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.viscarta.io.InputException;
import org.viscarta.io.SweepTableWriter;
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
            if (named.isBlank() || named.contains("/") || named.contains("\\") || named.equals(".") || named.equals("..")
                    || Path.of(named).isAbsolute() || named.contains(":")) {
                throw new InputException(m.file(), 1, 0, "'# calibration:' names a file beside this one, by its name alone "
                        + "(no folders): write e.g. '# calibration: calibration-sapphire.csv', or pass --calibration FILE");
            }
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
            if (!p.calibrationNote().isEmpty()) {
                warnings.add(new ReadWarning(m.file(), p.firstLine(), p.calibrationNote()));
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
        return org.viscarta.io.SweepReader.metadataTemperature(m.file(), Map.of("temperature", text), 1);
    }

    /** The sweep table {@code moduli} writes: the standard columns and quality columns. */
    public String table() {
        Map<String, String> meta = new LinkedHashMap<>();
        meta.put("sample", sweep.sample());
        meta.put("replicate", sweep.replicate());
        if (!sweep.group().isEmpty()) {
            meta.put("group", sweep.group());
        }
        meta.put("modulus", sweep.kind().toString());
        if (Double.isFinite(sweep.temperatureC())) {
            meta.put("temperature", sweep.metadata().get("temperature"));
        }
        meta.put("method", "oscillation signals demodulated by Viscarta");
        meta.put("geometry_used", geometry.describe());
        meta.put("calibration_used", sweep.metadata().get("calibration_used"));
        meta.put("source_file", measurement.file().getFileName().toString());
        meta.put("source_sha256", measurement.sha256());
        for (String key : List.of("note", "notes")) {
            if (sweep.metadata().containsKey(key)) {
                meta.put(key, sweep.metadata().get(key));
            }
        }
        return SweepTableWriter.write(meta, points, RawConverter.Point::frequencyHz, RawConverter.Point::storage,
                RawConverter.Point::loss, List.of(
                        quality("quality_storage_std_error [Pa]", RawConverter.Point::storageStdError),
                        quality("quality_loss_std_error [Pa]", RawConverter.Point::lossStdError),
                        quality("quality_force_distortion", RawConverter.Point::forceDistortion),
                        quality("quality_displacement_distortion", RawConverter.Point::displacementDistortion),
                        quality("quality_contact_second_harmonic", RawConverter.Point::contactHarmonic),
                        new SweepTableWriter.Extra<>("quality_cycles", p -> Integer.toString(p.cycles())),
                        new SweepTableWriter.Extra<>("quality_linear", p -> p.linear() ? "yes" : "no")));
    }

    private static SweepTableWriter.Extra<RawConverter.Point> quality(String header,
                                                                     java.util.function.ToDoubleFunction<RawConverter.Point> v) {
        return new SweepTableWriter.Extra<>(header, p -> String.format(Locale.ROOT, "%.4g", v.applyAsDouble(p)));
    }
}
