package org.viscarta.cli;

import org.viscarta.io.UsageException;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.viscarta.analysis.Inputs;
import org.viscarta.analysis.Sample;
import org.viscarta.sweep.Numbers;
import org.viscarta.io.AtomicOutput;
import org.viscarta.io.SweepTableWriter;
import org.viscarta.sweep.Sweep;
import org.viscarta.temperature.Isotherms;
import org.viscarta.temperature.ShiftAnalysis;
import org.viscarta.temperature.ShiftFits;
import org.viscarta.temperature.ShiftLaws;
import org.viscarta.table.Cells;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code viscarta shift}: a master curve from one sample's sweeps at several temperatures. */
@Command(name = "shift", mixinStandardHelpOptions = true,
        header = "Build a master curve from sweeps at several temperatures (time–temperature superposition).",
        description = "Shifts each sweep of one sample along the frequency axis onto its warmer neighbour (matching "
            + "log tan δ, which no vertical factor changes, and log |E*|), chains the shifts to the reference "
            + "temperature, fits WLF and Arrhenius laws to the shift factors, and builds the master curve at "
            + "the reference temperature. Temperature ramps at several fixed frequencies are cut into isotherms "
            + "first (a cross-plot at every --isotherm-step °C) when the sample has no frequency sweeps.")
final class ShiftCommand implements Callable<Integer> {

    @Mixin
    InputOptions input;

    @Option(names = "--reference-temperature", paramLabel = "°C", required = true,
            description = "One of the measured temperatures, in °C.")
    double reference;

    @Option(names = "--sample", paramLabel = "NAME", description = "The sample to shift, when the inputs hold several.")
    String sample;

    @Option(names = "--vertical", paramLabel = "none|entropic|fitted", defaultValue = "none",
            description = "Vertical factors b_T: none (default), entropic b_T = T/T0 (kelvin; density taken as constant), or "
                    + "fitted (horizontal shifts from tan δ alone, then the offset of log |E*|).")
    String vertical;

    @Option(names = "--min-superposition-overlap", paramLabel = "DECADES", defaultValue = "0.3",
            description = "Shortest overlap of neighbouring curves that may be superposed (default: ${DEFAULT-VALUE}).")
    double minOverlap;

    @Option(names = "--wlf-at", paramLabel = "°C", description = "Also give the WLF constants referred to this temperature.")
    Double wlfAt;

    @Option(names = "--isotherm-step", paramLabel = "°C", defaultValue = "5",
            description = "With temperature ramps: the spacing of the isotherms cut across them (default: ${DEFAULT-VALUE} °C; "
                    + "the reference temperature must be a multiple of it).")
    double isothermStep;

    @Mixin
    OutputOptions output;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        Path outDir = output.out;
        boolean force = output.force;
        if (outDir != null) {
            for (String f : List.of("shift-factors.csv", "shift-fits.csv", "master-curve.csv")) {
                AtomicOutput.checkWritable(outDir.resolve(f), force);
            }
        }
        Inputs c = input.readAndWarn(spec);
        List<Sweep> sweeps = new ArrayList<>();
        java.util.Set<String> names = new java.util.TreeSet<>();
        for (Sample s : c.samples()) {
            for (Sweep sw : s.replicates()) {
                names.add(sw.sample());
                if (sample == null || sw.sample().equals(sample)) {
                    sweeps.add(sw);
                }
            }
        }
        List<org.viscarta.sweep.Ramp> ramps = new ArrayList<>();
        for (org.viscarta.sweep.Ramp rp : c.ramps()) {
            names.add(rp.sample());
            if (sample == null || rp.sample().equals(sample)) {
                ramps.add(rp);
            }
        }
        if (sample == null && names.size() > 1) {
            throw new UsageException("the inputs hold several samples (" + String.join(", ", names)
                    + "); choose one with --sample");
        }
        PrintWriter out = spec.commandLine().getOut();
        if (sweeps.isEmpty() && !ramps.isEmpty()) {
            sweeps = Isotherms.of(ramps, isothermStep);
            if (sweeps.isEmpty()) {
                throw new UsageException("the ramps of sample '" + ramps.get(0).sample() + "' are at one frequency only, or never "
                        + "at two frequencies within " + Numbers.plain(isothermStep) + " °C of the same temperature; "
                        + "isotherms need ramps at two or more frequencies");
            }
            java.util.TreeSet<Double> temps = new java.util.TreeSet<>();
            java.util.TreeSet<Double> freqs = new java.util.TreeSet<>();
            for (Sweep sw : sweeps) {
                temps.add(sw.temperatureC());
                sw.points().forEach(p -> freqs.add(p.frequencyHz()));
            }
            out.printf("Isotherms cut across the temperature ramps: %d temperatures, %s to %s °C every %s °C, at %d frequencies "
                    + "(%s–%s Hz)%n", temps.size(), Numbers.plain(temps.first()), Numbers.plain(temps.last()),
                    Numbers.plain(isothermStep), freqs.size(), Cells.g4(freqs.first()), Cells.g4(freqs.last()));
        }
        if (sweeps.isEmpty()) {
            throw new UsageException("no sweeps of sample '" + sample + "' in the inputs");
        }
        ShiftAnalysis.Result r = new ShiftAnalysis(minOverlap, ShiftAnalysis.Vertical.parse(vertical)).analyse(sweeps, reference);
        out.printf("Shift factors of %s, reference %s °C (a_T > 1 below it)%n", sweeps.get(0).sample(), Numbers.plain(reference));
        TextTable t = new TextTable("temperature [°C]", "log10 a_T", "± SE", "a_T", "b_T", "placed");
        List<List<String>> factorRows = new ArrayList<>();
        for (ShiftAnalysis.Factor f : r.factors()) {
            t.add(Numbers.plain(f.temperatureC()), Cells.g4(f.log10aT()), Cells.g4(f.log10aTStdError()), Cells.g4(f.aT()),
                    Cells.g4(f.bT()), f.placed() ? "yes" : "no");
            factorRows.add(List.of(Cells.csv(f.temperatureC()), Cells.csv(f.placed() ? f.aT() : Double.NaN), Cells.csv(f.log10aT()),
                    Cells.csv(f.log10aTStdError()), Cells.csv(f.bT())));
        }
        t.print(out);
        List<List<String>> fitRows = new ArrayList<>();
        for (ShiftFits.Fit fit : java.util.Arrays.asList(r.wlf(), r.arrhenius())) {
            if (fit == null) {
                continue;
            }
            StringBuilder sb = new StringBuilder("  " + fit.law() + ":");
            for (ShiftFits.Parameter p : fit.parameters()) {
                sb.append(String.format(java.util.Locale.ROOT, " %s = %s ± %s %s [%s, %s];", p.name(), Cells.g4(p.value()),
                        Cells.g4(p.stdError()), p.unit().equals("-") ? "" : p.unit(), Cells.g4(p.ci95Low()), Cells.g4(p.ci95High())));
                fitRows.add(List.of(fit.law(), p.name(), Cells.csv(p.value()), Cells.csv(p.stdError()), Cells.csv(p.ci95Low()),
                        Cells.csv(p.ci95High()), p.unit()));
            }
            out.println(sb.append(" AICc ").append(Cells.g4(fit.aicc())));
        }
        if (wlfAt != null && r.wlf() != null) {
            double[] c2 = ShiftLaws.rereference(r.wlf().parameter("C1").value(), r.wlf().parameter("C2").value(), wlfAt - reference);
            out.printf("  WLF at %s °C: C1 = %s, C2 = %s K%n", Numbers.plain(wlfAt), Cells.g4(c2[0]), Cells.g4(c2[1]));
            fitRows.add(List.of("WLF at " + Numbers.plain(wlfAt) + " °C", "C1", Cells.csv(c2[0]), "", "", "", "-"));
            fitRows.add(List.of("WLF at " + Numbers.plain(wlfAt) + " °C", "C2", Cells.csv(c2[1]), "", "", "", "K"));
        }
        for (String n : r.notes()) {
            out.println(n);
        }
        out.printf("master curve: %d points, %s–%s Hz at %s °C%n", r.master().size(), Cells.g4(r.master().get(0).frequencyHz()),
                Cells.g4(r.master().get(r.master().size() - 1).frequencyHz()), Numbers.plain(reference));
        out.flush();
        if (outDir != null) {
            OutputOptions.writeCsv(outDir.resolve("shift-factors.csv"), force,
                    List.of("temperature_c", "a_t", "log10_a_t", "log10_a_t_std_error", "b_t"), factorRows);
            OutputOptions.writeCsv(outDir.resolve("shift-fits.csv"), force,
                    List.of("model", "parameter", "value", "std_error", "ci95_low", "ci95_high", "unit"), fitRows);
            Sweep template = sweeps.get(0);
            String unitLetter = template.kind().letter();
            java.util.Map<String, String> meta = new java.util.LinkedHashMap<>();
            meta.put("sample", template.sample() + " master curve");
            meta.put("temperature", Numbers.plain(reference) + " °C");
            meta.put("modulus", template.kind().toString());
            meta.put("note", "time–temperature superposition by Viscarta shift; frequencies are reduced frequencies a_T f");
            String master = SweepTableWriter.write(meta, r.master());
            AtomicOutput.write(outDir.resolve("master-curve.csv"), force,
                    o -> o.write(master.getBytes(java.nio.charset.StandardCharsets.UTF_8)));
            out.println("wrote shift-factors.csv, shift-fits.csv and master-curve.csv (" + unitLetter + " moduli) in " + outDir);
        }
        return CommandLine.ExitCode.OK;
    }
}
