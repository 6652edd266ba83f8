package org.viscarta.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.viscarta.analysis.Inputs;
import org.viscarta.analysis.Sample;
import org.viscarta.quality.SweepChecks;
import org.viscarta.quality.Verdict;
import org.viscarta.sweep.Sweep;
import org.viscarta.table.CsvTable;
import org.viscarta.table.Style;
import org.viscarta.table.Table;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;

/** {@code viscarta quality}: the checks a reviewer asks for, per sweep. */
@Command(name = "quality", mixinStandardHelpOptions = true,
        header = "Check each sweep: are E′ and E″ consistent, is the sweep wide and dense enough, how noisy is it?",
        description = "Per sweep: Kramers–Kronig consistency (a causal, linear material fitted to E′ and E″ together, after "
            + "Schönleber et al. 2014; where it cannot follow the data beyond three times their noise, the two moduli contradict "
            + "each other), points per decade, frequency span, the sign of the loss modulus and the noise level. Verdicts are "
            + "pass, warn or fail, with the value and the limit (conventions of this product, named as such).")
final class QualityCommand implements Callable<Integer> {

    @Mixin
    InputOptions input;

    @Mixin
    OutputOptions output;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    static final Table<SweepChecks.Check> TABLE = Table.<SweepChecks.Check>named("Quality")
            .column("sample", "sample", "", Style.TEXT, 28, SweepChecks.Check::sample)
            .column("replicate", "replicate", "", Style.TEXT, 10, SweepChecks.Check::replicate)
            .column("check", "check", "", Style.TEXT, 18, SweepChecks.Check::check)
            .column("verdict", "verdict", "", Style.TEXT, 8, c -> c.verdict().toString())
            .column("value", "value", "", Style.SCIENTIFIC, 12, SweepChecks.Check::value)
            .column("limit", "limit", "", Style.SCIENTIFIC, 12, SweepChecks.Check::limit)
            .column("message", "message", "", Style.TEXT, 60, SweepChecks.Check::message)
            .build();

    @Override
    public Integer call() throws java.io.IOException {
        output.check();
        Inputs c = input.readAndWarn(spec);
        PrintWriter out = spec.commandLine().getOut();
        List<SweepChecks.Check> all = new ArrayList<>();
        for (Sample s : c.samples()) {
            for (Sweep sw : s.replicates()) {
                List<SweepChecks.Check> checks = SweepChecks.of(sw);
                all.addAll(checks);
                long bad = checks.stream().filter(k -> k.verdict() != Verdict.PASS).count();
                out.println(s.name() + " replicate " + sw.replicate() + ": " + (bad == 0 ? "every check passes" : bad + " check(s) to look at"));
                for (SweepChecks.Check k : checks) {
                    if (k.verdict() != Verdict.PASS) {
                        out.println(Format.wrap("  " + k.verdict() + " " + k.check() + ": " + k.message(), 100, "    "));
                    }
                }
            }
        }
        out.flush();
        if (output.out != null) {
            CsvTable.write(TABLE, all, output.out, output.force);
        }
        return CommandLine.ExitCode.OK;
    }
}
