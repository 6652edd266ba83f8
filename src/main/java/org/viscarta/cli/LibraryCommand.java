package org.viscarta.cli;

import org.viscarta.io.UsageException;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import org.viscarta.library.LibraryFolder;
import org.viscarta.library.ReferenceLibrary;
import org.viscarta.sweep.Sweep;
import org.viscarta.sweep.SweepPoint;
import org.viscarta.table.Cells;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code viscarta library}: the folder of reference materials the lab keeps. */
@Command(name = "library", mixinStandardHelpOptions = true,
        header = "Keep the folder of reference materials: add, list, show, remove, check.",
        description = "The reference library is a folder of sweep tables, one reference material per file, whose "
            + "metadata name at least name, class, temperature and method. It comes from --library DIR, else "
            + "the environment variable VISCARTA_LIBRARY. A lab may also copy files in by hand; 'library "
            + "check' validates them.",
        subcommands = {LibraryCommand.Add.class, LibraryCommand.ListRefs.class, LibraryCommand.Show.class,
            LibraryCommand.Remove.class, LibraryCommand.Check.class})
final class LibraryCommand implements Runnable {

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        throw new CommandLine.ParameterException(spec.commandLine(), "a library command is needed: add, list, show, remove or check");
    }

    @Command(name = "add", mixinStandardHelpOptions = true,
            header = "Validate a sweep and add it to the library in canonical form (SI units, complete metadata).")
    static final class Add implements Callable<Integer> {

        @Parameters(paramLabel = "FILE", description = "A sweep table holding one sweep.")
        Path file;

        @Option(names = "--name", required = true, paramLabel = "NAME", description = "Unique name of the reference.")
        String name;

        @Option(names = "--class", required = true, paramLabel = "CLASS", description = "gel, tissue, paint film, varnish, adhesive, elastomer, ...")
        String clazz;

        @Option(names = "--composition", paramLabel = "TEXT") String composition;
        @Option(names = "--condition", paramLabel = "TEXT", description = "Condition or age.") String condition;
        @Option(names = "--notes", paramLabel = "TEXT") String notes;
        @Option(names = "--temperature", paramLabel = "TEXT", description = "e.g. '23 °C', when the file does not say.") String temperature;
        @Option(names = "--method", paramLabel = "TEXT", description = "e.g. 'dynamic indentation', when the file does not say.") String method;

        @Option(names = "--replace", description = "Replace a reference of the same name (the old file is kept in .removed/).")
        boolean replace;

        @Mixin
        LibraryOption library;

        @Mixin
        ReadOptions read;

        @CommandLine.Spec
        CommandLine.Model.CommandSpec spec;

        @Override
        public Integer call() throws IOException {
            if (read.basis != null || read.poisson != null) {
                throw new UsageException("library add keeps a reference on the basis it was measured on; --basis and --poisson "
                        + "are not taken here (a comparison across bases says so; --basis converts the samples there)");
            }
            org.viscarta.analysis.ReadSettings rs = read.settings();
            LibraryFolder.Added added = new LibraryFolder(library.folder()).add(file,
                    new LibraryFolder.Additions(name, clazz, composition, condition, notes, temperature, method), replace,
                    new org.viscarta.io.SweepReader(rs.declaredKind().orElse(null), rs.columns()), rs.declaredKind().isPresent());
            added.warnings().forEach(w -> spec.commandLine().getErr().println("warning: " + w));
            spec.commandLine().getErr().flush();
            Path written = added.file();
            spec.commandLine().getOut().println("added '" + name + "' as " + written);
            spec.commandLine().getOut().flush();
            return CommandLine.ExitCode.OK;
        }
    }

    @Command(name = "list", mixinStandardHelpOptions = true, header = "List the references.")
    static final class ListRefs implements Callable<Integer> {

        @Option(names = "--class", paramLabel = "CLASS", description = "Only this class.")
        String clazz;

        @Mixin
        LibraryOption library;

        @CommandLine.Spec
        CommandLine.Model.CommandSpec spec;

        @Override
        public Integer call() {
            ReferenceLibrary lib = ReferenceLibrary.open(library.folder());
            TextTable t = new TextTable("name", "class", "temperature", "method", "frequency [Hz]", "points");
            int n = 0;
            for (ReferenceLibrary.Entry e : lib.entries()) {
                if (clazz != null && !e.clazz().equalsIgnoreCase(clazz)) {
                    continue;
                }
                Sweep s = e.sweep();
                t.add(e.name(), e.clazz(), s.meta("temperature").orElse(""), s.meta("method").orElse(""),
                        Cells.g4(s.minFrequencyHz()) + "–" + Cells.g4(s.maxFrequencyHz()), Integer.toString(s.points().size()));
                n++;
            }
            PrintWriter out = spec.commandLine().getOut();
            t.print(out);
            out.println(n + " reference(s)");
            out.flush();
            return CommandLine.ExitCode.OK;
        }
    }

    @Command(name = "show", mixinStandardHelpOptions = true, header = "Show one reference: its metadata and points.")
    static final class Show implements Callable<Integer> {

        @Parameters(paramLabel = "NAME")
        String name;

        @Mixin
        LibraryOption library;

        @CommandLine.Spec
        CommandLine.Model.CommandSpec spec;

        @Override
        public Integer call() {
            ReferenceLibrary.Entry e = ReferenceLibrary.open(library.folder()).entries().stream()
                    .filter(x -> x.name().equals(name)).findFirst()
                    .orElseThrow(() -> new UsageException("no reference named '" + name + "'; 'library list' shows the names"));
            PrintWriter out = spec.commandLine().getOut();
            out.println(e.file());
            e.sweep().metadata().entrySet().stream().sorted(java.util.Map.Entry.comparingByKey())
                    .forEach(m -> out.println("  " + m.getKey() + ": " + m.getValue()));
            TextTable t = new TextTable("frequency [Hz]", "storage modulus [Pa]", "loss modulus [Pa]", "tan δ");
            for (SweepPoint p : e.sweep().points()) {
                t.add(Cells.g4(p.frequencyHz()), Cells.g4(p.storage()), Cells.g4(p.loss()), Cells.g4(p.lossTangent()));
            }
            t.print(out);
            return CommandLine.ExitCode.OK;
        }
    }

    @Command(name = "remove", mixinStandardHelpOptions = true,
            header = "Remove a reference; its file is kept in the library's .removed/ folder.")
    static final class Remove implements Callable<Integer> {

        @Parameters(paramLabel = "NAME")
        String name;

        @Mixin
        LibraryOption library;

        @CommandLine.Spec
        CommandLine.Model.CommandSpec spec;

        @Override
        public Integer call() throws IOException {
            Path kept = new LibraryFolder(library.folder()).remove(name);
            spec.commandLine().getOut().println("removed '" + name + "'; the file is kept as " + kept);
            spec.commandLine().getOut().flush();
            return CommandLine.ExitCode.OK;
        }
    }

    @Command(name = "check", mixinStandardHelpOptions = true,
            header = "Validate every reference; each problem is reported with its file and line (exit 2 when any).")
    static final class Check implements Callable<Integer> {

        @Mixin
        LibraryOption library;

        @CommandLine.Spec
        CommandLine.Model.CommandSpec spec;

        @Override
        public Integer call() {
            List<LibraryFolder.Problem> problems = new LibraryFolder(library.folder()).check();
            PrintWriter err = spec.commandLine().getErr();
            for (LibraryFolder.Problem p : problems) {
                err.println(p.message());
            }
            err.flush();
            spec.commandLine().getOut().println(problems.isEmpty() ? "the library is sound" : problems.size() + " problem(s)");
            spec.commandLine().getOut().flush();
            return problems.isEmpty() ? CommandLine.ExitCode.OK : CommandLine.ExitCode.USAGE;
        }
    }
}
