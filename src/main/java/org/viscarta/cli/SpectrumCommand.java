package org.viscarta.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.viscarta.analysis.Inputs;
import org.viscarta.analysis.Sample;
import org.viscarta.fit.FitResult;
import org.viscarta.fit.ModelFitter;
import org.viscarta.fit.ParameterEstimate;
import org.viscarta.io.UsageException;
import org.viscarta.model.GeneralizedMaxwell;
import org.viscarta.report.OutputTables;
import org.viscarta.report.OutputTables.SpectrumRow;
import org.viscarta.spectrum.RelaxationSpectrum;
import org.viscarta.table.Cells;
import org.viscarta.table.CsvTable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code viscarta spectrum}: the continuous relaxation (or retardation) spectrum each sample's sweeps support. */
@Command(name = "spectrum", mixinStandardHelpOptions = true,
        header = "The distribution of relaxation times H(τ) (or retardation times L(τ)) the data support.",
        description = "Per sample, from E′ and E″ of all replicates together: H(τ) on a log-spaced grid over the measured window "
            + "(widened by half a decade each side) by Tikhonov-regularised non-negative least squares, the smoothing chosen "
            + "by generalised cross-validation, with a band from the noise alone; the equilibrium modulus and the zero-frequency "
            + "viscosity with standard errors, the weight-average relaxation time; and, for comparison, the discrete spectrum of the "
            + "generalized-Maxwell fit. --retardation gives L(τ) from the compliances instead.")
final class SpectrumCommand implements Callable<Integer> {

    @Mixin
    InputOptions input;

    @Option(names = "--retardation", description = "The retardation spectrum L(τ) from J′ and J″ instead of H(τ).")
    boolean retardation;

    @Mixin
    OutputOptions output;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws java.io.IOException {
        output.check();
        Inputs c = input.readAndWarn(spec);
        PrintWriter out = spec.commandLine().getOut();
        RelaxationSpectrum.Kind kind = retardation ? RelaxationSpectrum.Kind.RETARDATION : RelaxationSpectrum.Kind.RELAXATION;
        List<SpectrumRow> rows = new ArrayList<>();
        for (Sample s : c.samples()) {
            RelaxationSpectrum.Result r;
            try {
                r = RelaxationSpectrum.of(s.pooledFittablePoints(), kind);
            } catch (IllegalArgumentException e) {
                out.println(s.name() + ": " + e.getMessage());
                out.println();
                continue;
            }
            print(out, s, r);
            for (int j = 0; j < r.tau().length; j++) {
                rows.add(new SpectrumRow(s.name(), r.tau()[j], r.h()[j], r.low()[j], r.high()[j]));
            }
        }
        out.flush();
        if (rows.isEmpty()) {
            throw new UsageException("no sample has the " + RelaxationSpectrum.MIN_FREQUENCIES + " distinct frequencies with positive "
                    + "moduli a spectrum needs");
        }
        if (output.out != null) {
            CsvTable.write(OutputTables.spectra(retardation), rows, output.out, output.force);
        }
        return CommandLine.ExitCode.OK;
    }

    private void print(PrintWriter out, Sample s, RelaxationSpectrum.Result r) {
        String m = s.kind().letter();
        line(out, String.format(Locale.ROOT, "%s (%d replicate(s), %d points): %s spectrum on %d times %s–%s s", s.name(),
                s.replicates().size(), r.points() / 2, retardation ? "retardation" : "relaxation", r.tau().length,
                Cells.g4(r.tau()[0]), Cells.g4(r.tau()[r.tau().length - 1])));
        line(out, String.format(Locale.ROOT, "  smoothing λ = %s (generalised cross-validation)%s; data reproduced to %.1f %% RMS",
                Cells.g4(r.lambda()), RelaxationSpectrum.lambdaAtLimit(r), 100 * r.rmsRelative()));
        double top = java.util.Arrays.stream(r.h()).max().orElse(0);
        int last = r.h().length - 1;
        boolean shortEdge = r.h()[0] > 0.05 * top;
        boolean longEdge = r.h()[last] > 0.05 * top;
        if (shortEdge || longEdge) {
            line(out, "  (!) the spectrum is still large at the " + (shortEdge && longEdge ? "shortest and longest"
                    : shortEdge ? "shortest" : "longest") + " times of the grid: there are processes outside the measured "
                    + "frequencies, which these data cannot place; the moments below count only what lies inside");
        }
        if (!retardation) {
            double[] eta = r.moment(1);
            double[] mean = r.meanTime();
            line(out, String.format(Locale.ROOT, "  equilibrium modulus %s_e = %s ± %s Pa", m, Cells.g4(r.constant()),
                    Cells.g4(r.constantSe())));
            line(out, String.format(Locale.ROOT, "  ∫H dlnτ = %s Pa (the modulus that relaxes within the window)",
                    Cells.g4(r.moment(0)[0])));
            line(out, String.format(Locale.ROOT, "  zero-frequency viscosity ∫Hτ dlnτ = %s ± %s Pa·s%s", Cells.g4(eta[0]),
                    Cells.g4(eta[1]), r.constant() > 2 * r.constantSe() ? " (the material has an equilibrium modulus: a solid has "
                            + "no zero-frequency viscosity; this is the part within the window)" : ""));
            line(out, shortEdge || longEdge
                    ? "  weight-average relaxation time: not determined by the data (the spectrum reaches the edge of the grid)"
                    : String.format(Locale.ROOT, "  weight-average relaxation time ∫Hτ² dlnτ / ∫Hτ dlnτ = %s s (no interval: "
                    + "its delta-method error held the truth in only 88 %% of synthetic tests)", Cells.g4(mean[0])));
        } else {
            line(out, String.format(Locale.ROOT, "  glassy compliance J_g = %s 1/Pa; fluidity 1/η0 = %s 1/(Pa·s) (no intervals: "
                    + "not yet checked for coverage)", Cells.g4(r.constant()), Cells.g4(r.fluidity())));
        }
        List<String> peaks = new ArrayList<>();
        for (int j = 1; j + 1 < r.h().length; j++) {
            if (r.h()[j] > r.h()[j - 1] && r.h()[j] >= r.h()[j + 1] && r.h()[j] > 0.05 * top) {
                peaks.add(Cells.g4(r.tau()[j]) + " s");
            }
        }
        line(out, "  peaks of the spectrum at: " + (peaks.isEmpty() ? "none inside the grid" : String.join(", ", peaks)));
        if (!retardation) {
            FitResult gm = new ModelFitter().fit(s.name(), new GeneralizedMaxwell(0), s.pooledFittablePoints());
            if (gm.converged()) {
                List<String> modes = new ArrayList<>();
                int n = ((GeneralizedMaxwell) gm.fitted()).elements();
                List<ParameterEstimate> p = gm.parameters();
                int off = ((GeneralizedMaxwell) gm.fitted()).liquid() ? 0 : 1;
                for (int i = 0; i < n; i++) {
                    modes.add(Cells.g4(p.get(off + i).value()) + " Pa at " + Cells.g4(p.get(off + n + i).value()) + " s");
                }
                line(out, "  discrete spectrum of the generalized-Maxwell fit (" + gm.variant() + "): "
                        + String.join("; ", modes) + (gm.undetermined() ? " (!) not all determined by the data" : ""));
            }
        }
        out.println();
    }

    /** A line wrapped to the terminal's 100 columns. */
    private static void line(PrintWriter out, String text) {
        out.println(Format.wrap(text, 100, "    "));
    }
}
