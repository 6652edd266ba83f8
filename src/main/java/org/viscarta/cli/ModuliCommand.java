package org.viscarta.cli;

import org.viscarta.io.UsageException;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.viscarta.io.AtomicOutput;
import org.viscarta.io.InputCollector;
import org.viscarta.io.ReadWarning;
import org.viscarta.raw.RawConverter;
import org.viscarta.raw.RawReader;
import org.viscarta.raw.RawSweeps;
import org.viscarta.table.Cells;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code viscarta moduli}: raw oscillation signals to sweep tables. */
@Command(name = "moduli", mixinStandardHelpOptions = true,
        header = "Turn raw oscillation signals (force and displacement against time) into sweep tables.",
        description = "For each drive frequency, fits offset, drift and sine/cosine terms at the drive frequency and "
            + "its 2nd and 3rd harmonics to force and displacement over an integer number of cycles after the "
            + "settling ones, forms the complex stiffness F̂/ĥ, removes the instrument's phase (--calibration, "
            + "a measurement on a rigid reference) and any hydrodynamic drag ('# drag:'), and converts it with "
            + "the geometry of the file's '# geometry:' line.")
final class ModuliCommand implements Callable<Integer> {

    @Parameters(paramLabel = "RAW", arity = "1..*", description = "Raw-signal tables or folders of them.")
    List<Path> inputs = new ArrayList<>();

    @Option(names = "--calibration", paramLabel = "FILE",
            description = "Raw measurement on a rigid reference at the same drive frequencies (overrides a file's '# calibration:').")
    Path calibration;

    @Option(names = "--calibration-mode", paramLabel = "phase|compliance", defaultValue = "phase",
            description = "phase: subtract the instrument's phase (default); compliance: remove the measuring system's own "
                    + "compliance in series, 1/k* = 1/k*_measured − 1/k*_reference (amplitude and phase; for cantilevers and frames).")
    String calibrationMode;

    @Option(names = "--skip-cycles", paramLabel = "N", defaultValue = "1",
            description = "Settling cycles left out at the start of each segment (default: ${DEFAULT-VALUE}).")
    int skipCycles;

    @Option(names = "--distortion-limit", paramLabel = "FRACTION", defaultValue = "0.05",
            description = "Harmonic distortion above which a segment is flagged as outside the linear range, beyond what the "
                    + "contact geometry itself produces (default: ${DEFAULT-VALUE}; a lab convention, not a standard).")
    double distortionLimit;

    @Mixin
    OutputOptions output;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        if (output.out == null) {
            throw new CommandLine.ParameterException(spec.commandLine(), "moduli needs --out DIR, the folder for the sweep tables");
        }
        Path outDir = output.out;
        boolean force = output.force;
        RawConverter.Settings settings = new RawConverter.Settings(skipCycles, distortionLimit);
        RawConverter.CalibrationMode mode;
        switch (calibrationMode.strip().toLowerCase(java.util.Locale.ROOT)) {
            case "phase": mode = RawConverter.CalibrationMode.PHASE; break;
            case "compliance": mode = RawConverter.CalibrationMode.COMPLIANCE; break;
            default: throw new UsageException("--calibration-mode takes phase or compliance, not '" + calibrationMode + "'");
        }
        RawConverter.Calibration cal = calibration == null ? null
                : RawConverter.calibration(RawReader.read(calibration), settings).withMode(mode);
        List<RawSweeps> results = new ArrayList<>();
        List<Path> targets = new ArrayList<>();
        for (Path file : InputCollector.collect(inputs)) {
            RawReader.Measurement m = RawReader.read(file);
            if (m.isCalibration()) {
                continue;
            }
            RawSweeps r = RawSweeps.convert(m, settings, cal);
            Path target = outDir.resolve(file.getFileName().toString().replaceFirst("\\.[^.]*$", "") + "-moduli.csv");
            AtomicOutput.checkWritable(target, force);
            results.add(r);
            targets.add(target);
        }
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        for (int i = 0; i < results.size(); i++) {
            RawSweeps r = results.get(i);
            String table = r.table();
            AtomicOutput.write(targets.get(i), force, o -> o.write(table.getBytes(StandardCharsets.UTF_8)));
            out.printf("%s: %s, %d frequencies -> %s%n", r.measurement().file(), r.geometry().describe(), r.points().size(), targets.get(i));
            TextTable t = new TextTable("frequency [Hz]", r.sweep().kind().letter() + "′ [Pa]", r.sweep().kind().letter() + "″ [Pa]",
                    "tan δ", "force THD", "contact 2nd harmonic", "linear");
            for (RawConverter.Point p : r.points()) {
                t.add(Cells.g4(p.frequencyHz()), Cells.g4(p.storage()), Cells.g4(p.loss()), Cells.g4(p.loss() / p.storage()),
                        Cells.g4(p.forceDistortion()), Cells.g4(p.contactHarmonic()), p.linear() ? "yes" : "no");
            }
            t.print(out);
            for (ReadWarning w : r.warnings()) {
                err.println("warning: " + org.viscarta.io.InputException.oneLine(String.valueOf(w)));
            }
        }
        if (results.isEmpty()) {
            throw new UsageException("no raw measurement among the inputs (calibration files alone are not converted)");
        }
        out.flush();
        err.flush();
        return CommandLine.ExitCode.OK;
    }
}
