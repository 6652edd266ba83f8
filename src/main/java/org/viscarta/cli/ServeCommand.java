package org.viscarta.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import java.util.concurrent.CountDownLatch;

import org.viscarta.io.UsageException;
import org.viscarta.serve.Workbench;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code viscarta serve}: the workbench, a local web page that does the whole job. */
@Command(name = "serve", mixinStandardHelpOptions = true,
        header = "Open the workbench: a local web page that does the whole job, for people who do not use a terminal.",
        description = "Starts a web server on this computer and opens the workbench in the default browser: drop files or "
            + "a folder, see how each was read, choose the settings, run, read the ranking, fits, matches, master curves "
            + "and glass transitions, and download the workbook, the page and the figures. Nothing is sent anywhere: the "
            + "server answers only this computer (unless --host says otherwise) and only requests that carry its access "
            + "token, which is in the address it prints. Stop it with Ctrl+C; its uploads are deleted then.")
final class ServeCommand implements Callable<Integer> {

    @Option(names = "--port", paramLabel = "N", defaultValue = "0",
            description = "The port to serve on (default: a free one).")
    int port;

    @Option(names = "--host", paramLabel = "ADDRESS", defaultValue = "127.0.0.1",
            description = "The address to serve on (default: ${DEFAULT-VALUE}, this computer only). Another address, e.g. "
                    + "0.0.0.0, serves the lab network: anyone there with the token can use the workbench.")
    String host;

    @CommandLine.Mixin
    LibraryOption library;

    @Option(names = "--data", paramLabel = "DIR",
            description = "A folder whose contents (and sub-folders) the page may read; without it, only uploaded files.")
    Path data;

    @Option(names = "--max-upload", paramLabel = "MB", defaultValue = "200",
            description = "The largest upload, all files of one drop together, in MB (default: ${DEFAULT-VALUE}).")
    double maxUploadMb;

    @Option(names = "--parallel", paramLabel = "N", defaultValue = "2",
            description = "How many analyses may run at once (default: ${DEFAULT-VALUE}).")
    int parallel;

    @Option(names = "--no-browser", description = "Do not open a browser; just print the address.")
    boolean noBrowser;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws Exception {
        Path lib = library.folderIfNamed().orElse(null);
        if (lib != null && !Files.isDirectory(lib)) {
            throw new UsageException("--library: '" + lib + "' is not a folder");
        }
        if (data != null && !Files.isDirectory(data)) {
            throw new UsageException("--data: '" + data + "' is not a folder");
        }
        if (!(maxUploadMb > 0) || maxUploadMb > 100_000) {
            throw new UsageException("--max-upload takes a size in MB between 0 and 100000, not " + maxUploadMb);
        }
        if (parallel < 1 || parallel > 64) {
            throw new UsageException("--parallel takes 1 to 64, not " + parallel);
        }
        System.setProperty("org.slf4j.simpleLogger.defaultLogLevel", "warn");
        Workbench w = new Workbench(new Workbench.Options(host, port, lib, data, (long) (maxUploadMb * 1024 * 1024), parallel));
        CountDownLatch stopped = new CountDownLatch(1);
        Runtime.getRuntime().addShutdownHook(new Thread(() -> {
            w.close();
            stopped.countDown();
        }, "viscarta-serve-stop"));
        PrintWriter out = spec.commandLine().getOut();
        out.println("Viscarta workbench: open " + w.address());
        if (!host.equals("127.0.0.1") && !host.equals("localhost") && !host.equals("::1")) {
            out.println(Format.wrap("Serving " + host + ": anyone on that network who has the address above, with its token, "
                    + "can use the workbench and its library. Share it only with your lab.", 100, ""));
        }
        out.println(lib == null ? "No reference library (start with --library DIR to match against one)."
                : "Reference library: " + lib);
        out.println(data == null ? "The page reads only files dropped on it." : "The page may read files below " + data);
        out.println("Stop with Ctrl+C; uploaded files and results are deleted then.");
        out.flush();
        if (!noBrowser) {
            openBrowser(w.address(), spec.commandLine().getErr());
        }
        // while the user picks files: what writing a report needs is loaded, so that the first report is not the slow one
        org.viscarta.report.ReportFiles.warmUpAside();
        stopped.await();
        return CommandLine.ExitCode.OK;
    }

    private static void openBrowser(String address, PrintWriter err) {
        try {
            if (!java.awt.GraphicsEnvironment.isHeadless() && java.awt.Desktop.isDesktopSupported()
                    && java.awt.Desktop.getDesktop().isSupported(java.awt.Desktop.Action.BROWSE)) {
                java.awt.Desktop.getDesktop().browse(java.net.URI.create(address));
                return;
            }
        } catch (Exception | Error e) {
            // fall through to the message
        }
        err.println("(no browser could be opened here: open the address above in one)");
        err.flush();
    }
}
