package org.viscarta.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.viscarta.io.InputException;
import org.viscarta.io.UsageException;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/** The {@code viscarta} command: verbs for frequency sweeps of viscoelastic materials. */
@Command(name = "viscarta",
        mixinStandardHelpOptions = true,
        versionProvider = VersionProvider.class,
        description = "Fits viscoelastic models to oscillatory frequency sweeps (E′, E″ or G′, G″ against frequency), "
                + "ranks samples by damping (tan δ) and writes a workbook a collaborator can read.",
        subcommands = {InspectCommand.class, FitCommand.class, RankCommand.class, MatchCommand.class, ShiftCommand.class, SpectrumCommand.class, QualityCommand.class, TransitionCommand.class, ModuliCommand.class, LibraryCommand.class, ReportCommand.class, MapCommand.class, ServeCommand.class,
            CommandLine.HelpCommand.class},
        exitCodeListHeading = "%nExit codes:%n",
        exitCodeList = {
            "0:success",
            "2:bad usage or bad input (one line on stderr: file:line[:column]: what is wrong and what to do)",
            "1:anything else (an internal error; add --debug for the stack trace)"},
        footer = {"", "Results describe small samples under test conditions; they are not clinical or structural verdicts.",
            "Follow local rules and licensed practice for artworks, toxic historic pigments and biological tissue."})
public final class Viscarta implements Runnable {

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        throw new CommandLine.ParameterException(spec.commandLine(), "a verb is needed: inspect, fit, rank, match, shift, moduli, library or report");
    }

    public static void main(String[] args) {
        // on a small machine the work runs in a second JVM with the options measured fastest for it (Launch)
        java.util.OptionalInt launched = Launch.run(Viscarta.class.getName(), args);
        if (launched.isPresent()) {
            System.exit(launched.getAsInt());
        }
        // POI logs through the Log4j API; without this it warns on every run that no logging backend is present.
        System.setProperty("log4j2.loggerContextFactory", "org.apache.logging.log4j.simple.SimpleLoggerContextFactory");
        System.setProperty("java.awt.headless", "true");
        System.exit(execute(args, new PrintWriter(System.out, true), new PrintWriter(System.err, true)));
    }

    /** Runs a command line with the given streams and returns the exit code (used by main and the tests). */
    public static int execute(String[] args, PrintWriter out, PrintWriter err) {
        List<String> rest = new ArrayList<>(Arrays.asList(args));
        boolean debug = rest.remove("--debug");
        CommandLine cl = new CommandLine(new Viscarta());
        cl.setOut(out);
        cl.setErr(err);
        cl.setParameterExceptionHandler((ex, a) -> {
            CommandLine c = ex.getCommandLine();
            c.getErr().println("viscarta: " + ex.getMessage());
            CommandLine.UnmatchedArgumentException.printSuggestions(ex, c.getErr());
            c.getErr().println("Try '" + c.getCommandSpec().qualifiedName() + " --help' for usage.");
            c.getErr().flush();
            return CommandLine.ExitCode.USAGE;
        });
        cl.setExecutionExceptionHandler((ex, c, parseResult) -> exitCodeOf(ex, c.getErr(), debug));
        return guardMemory(() -> cl.execute(rest.toArray(new String[0])), err);
    }

    /** Runs a command; running out of memory ends it with one line that says what to do, exit 1. */
    static int guardMemory(java.util.function.IntSupplier command, PrintWriter err) {
        try {
            return command.getAsInt();
        } catch (OutOfMemoryError e) {
            err.println("viscarta: out of memory (Java heap of " + (Runtime.getRuntime().maxMemory() >> 20) + " MB): give Java more "
                    + "with -Xmx, e.g. 'java -Xmx8g -jar viscarta.jar ...', or analyse the inputs in smaller parts");
            err.flush();
            return CommandLine.ExitCode.SOFTWARE;
        }
    }

    /**
     * The exit code of an exception that escaped a verb, with its one line on stderr: input and
     * usage errors are 2; anything else is an internal error, 1, with the stack trace only under
     * {@code --debug}.
     */
    static int exitCodeOf(Exception ex, PrintWriter e, boolean debug) {
        if (ex instanceof InputException || ex instanceof UsageException) {
            e.println(ex instanceof InputException ? ex.getMessage() : "viscarta: " + InputException.oneLine(ex.getMessage()));
            e.flush();
            return CommandLine.ExitCode.USAGE;
        }
        if (ex instanceof IOException || ex instanceof UncheckedIOException) {
            e.println("viscarta: cannot write the output: " + ex.getMessage());
        } else {
            e.println("viscarta: internal error: " + ex + (debug ? "" : " (run again with --debug for the stack trace)"));
        }
        if (debug) {
            ex.printStackTrace(e);
        }
        e.flush();
        return CommandLine.ExitCode.SOFTWARE;
    }
}
