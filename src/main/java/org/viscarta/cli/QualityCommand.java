package org.viscarta.cli;

import java.io.PrintWriter;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import org.viscarta.analysis.Analysis;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.AnalysisResult;
import org.viscarta.quality.SweepChecks;
import org.viscarta.quality.Verdict;
import org.viscarta.report.OutputTables;
import org.viscarta.table.CsvTable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;

/** {@code viscarta quality}: the checks a reviewer asks for, per sweep, replicate set and amplitude sweep. */
@Command(name = "quality", mixinStandardHelpOptions = true,
        header = "Check the sweeps: are E′ and E″ consistent, linear, wide and dense enough; is a replicate off; is a film too thin?",
        description = "Per frequency sweep: Kramers–Kronig consistency (a causal, linear material fitted to E′ and E″ together, "
            + "after Schönleber et al. 2014; where it cannot follow the data beyond three times their noise, the two moduli "
            + "contradict each other), points per decade, frequency span, duplicate frequencies, the sign of the loss modulus, "
            + "E′ falling with frequency, the noise level, the indentation depth against a film's thickness (10 %% rule of thumb) "
            + "and the amplitude against the linear limit of the same sample's amplitude sweep. Per sample: a replicate that "
            + "departs from the others (modified z-score, Iglewicz and Hoaglin 1993). Per amplitude sweep (a strain_amplitude, "
            + "stress_amplitude, force_amplitude or displacement_amplitude column varied at one frequency): the plateau moduli, "
            + "the limit of the linear range and the crossover E″ = E′. Verdicts are pass, warn or fail, with the value and the "
            + "limit; limits that are conventions are named as such.")
final class QualityCommand implements Callable<Integer> {

    @Mixin
    InputOptions input;

    @Mixin
    QualityOptions quality;

    @Mixin
    OutputOptions output;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    /** The CSV columns of {@code quality -o}. */
    static final String CSV_HEADER = "sample,replicate,check,verdict,value,limit,message";

    @Override
    public Integer call() throws java.io.IOException {
        output.check();
        AnalysisRequest request = Requests.build(spec, () -> quality.applyTo(input.request(), false));
        AnalysisResult result = Analysis.run(request, new Progress(spec.commandLine().getErr(), output.quiet));
        Warnings.print(spec, result.inputs());
        PrintWriter out = spec.commandLine().getOut();
        List<SweepChecks.Check> all = result.quality().checks();
        Map<String, List<SweepChecks.Check>> bySweep = new LinkedHashMap<>();
        java.util.Set<SweepChecks.Check> amplitudeRows = java.util.Collections.newSetFromMap(new java.util.IdentityHashMap<>());
        amplitudeRows.addAll(result.quality().amplitudeChecks());
        for (SweepChecks.Check c : all) {
            boolean amplitude = amplitudeRows.contains(c);
            String key = amplitude ? "amplitude sweep of " + c.sample() + " (replicate " + c.replicate() + ")"
                    : c.sample() + " replicate " + c.replicate();
            bySweep.computeIfAbsent(key, k -> new java.util.ArrayList<>()).add(c);
        }
        bySweep.forEach((key, checks) -> {
            long bad = checks.stream().filter(k -> k.verdict() != Verdict.PASS).count();
            boolean amplitude = key.startsWith("amplitude sweep");
            out.println(key + (amplitude ? ":" : ": " + (bad == 0 ? "every check passes" : bad + " check(s) to look at")));
            for (SweepChecks.Check k : checks) {
                if (k.verdict() != Verdict.PASS || amplitude) {
                    out.println(Format.wrap("  " + k.verdict() + " " + k.check() + ": " + k.message(), 100, "    "));
                }
            }
        });
        out.flush();
        if (output.out != null) {
            CsvTable.write(OutputTables.QUALITY, all, output.out, output.force);
        }
        return CommandLine.ExitCode.OK;
    }
}
