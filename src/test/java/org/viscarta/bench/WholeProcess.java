package org.viscarta.bench;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.Writer;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.viscarta.model.Zener;

/**
 * Benchmarks of whole commands as users run them: each run is a JVM of its own
 * ({@link MeasuredRun}: the same entry point, options and files as on the command line) with the
 * heap and core count under test, and prints wall time, the time of each stage and peak resident
 * memory. Invented data (zener sweeps of 20 frequencies with 2 % noise, 50 zener references).
 *
 * <ul>
 * <li>{@code report N}: {@code report} on N sweeps × the whole catalogue × 50 references, with
 *     matching, figures, workbook and page, under -Xmx1g on 2 cores.</li>
 * <li>{@code demo R}: the README's demo report, R runs.</li>
 * <li>{@code fit N}: {@code fit --models zener -o} on N and 10·N sweeps; the marginal cost per sweep
 *     is the difference over the 9·N extra sweeps (so JVM start and warm-up cancel), set beside
 *     SciPy's fit alone ({@code src/test/resources/bench/scipy_fit_campaign.py}) on the same sweeps.</li>
 * </ul>
 */
final class WholeProcess {

    private static final Pattern PROCESSOR = Pattern.compile("processor time ([0-9.]+|NaN) s");
    private static final Pattern MEASURED = Pattern.compile(
            "measured: exit (\\d+), ([0-9.]+) s in the command, ([0-9.]+) s since the JVM started.*peak resident (\\S+ MB|unknown)");
    /** The first JVM's line when the command ran in a second one ({@link org.viscarta.cli.Launch}). */
    private static final Pattern LAUNCHED = Pattern.compile("launched: exit \\d+, ([0-9.]+) s since the first JVM started, "
            + "its own processor time ([0-9.]+|NaN) s");

    private WholeProcess() {
    }

    static void run(String what, int n) throws IOException, InterruptedException {
        Path dir = Path.of("target", "bench", "whole");
        Files.createDirectories(dir);
        switch (what) {
            case "report" -> report(dir, n);
            case "demo" -> demo(dir, n);
            case "fit" -> fit(dir, n);
            default -> throw new IllegalArgumentException(what);
        }
    }

    private static void report(Path dir, int n) throws IOException, InterruptedException {
        Path sweeps = dir.resolve("report-" + n + ".csv");
        writeSweeps(sweeps, n, 8);
        Path library = dir.resolve("library");
        writeLibrary(library);
        Result r = measured(List.of("-Xmx1g", "-XX:ActiveProcessorCount=2"), "report", sweeps.toString(), "--library",
                library.toString(), "--out", dir.resolve("report-out").toString(), "--force", "--quiet", "--timestamp",
                "2026-01-01T00:00:00Z");
        System.out.printf(Locale.ROOT, "report: %,d sweeps x the whole catalogue x 50 references, -Xmx1g, 2 cores: %.1f s from "
                + "start to end (%.1f s in the command), processor time %.1f s, peak resident %s (exit %d)%n", n, r.wall, r.seconds,
                r.processor, r.peak, r.exit);
        long size = Files.size(dir.resolve("report-out").resolve("report.xlsx"));
        long page = Files.size(dir.resolve("report-out").resolve("report.html"));
        System.out.printf(Locale.ROOT, "report: workbook %.1f MB, page %.2f MB%n", size / 1e6, page / 1e6);
    }

    private static void demo(Path dir, int rounds) throws IOException, InterruptedException {
        List<Double> times = new ArrayList<>();
        List<Double> cpu = new ArrayList<>();
        for (int k = 0; k < rounds; k++) {
            Result r = measured(List.of("-XX:ActiveProcessorCount=2"), "report", "demo-data", "--library", "reference-materials",
                    "--basis", "tensile", "--target", "target-soft-tissue", "--out", dir.resolve("demo-out").toString(), "--force",
                    "--quiet");
            times.add(r.wall);
            cpu.add(r.processor);
            System.out.printf(Locale.ROOT, "demo report, run %d: %.2f s from start to end (%.2f s in the command), processor time "
                    + "%.2f s, peak resident %s%n", k + 1, r.wall, r.seconds, r.processor, r.peak);
        }
        times.sort(null);
        cpu.sort(null);
        System.out.printf(Locale.ROOT, "demo report: median %.2f s from start to end over %d runs (2 cores), median processor "
                + "time %.2f s%n",
                times.get(times.size() / 2), rounds, cpu.get(cpu.size() / 2));
    }

    private static void fit(Path dir, int n) throws IOException, InterruptedException {
        Path small = dir.resolve("fit-small.csv");
        Path large = dir.resolve("fit-large.csv");
        writeSweeps(small, n, 11);
        writeSweeps(large, 10 * n, 11);
        List<String> jvm = List.of("-Xmx1g", "-XX:ActiveProcessorCount=2");
        double[] perSweep = new double[3];
        double[] cpuPerSweep = new double[3];
        for (int k = 0; k < 3; k++) {
            Result a = measured(jvm, "fit", small.toString(), "--models", "zener", "-o", dir.resolve("fit-small-out.csv").toString(),
                    "--force", "--quiet");
            Result b = measured(jvm, "fit", large.toString(), "--models", "zener", "-o", dir.resolve("fit-large-out.csv").toString(),
                    "--force", "--quiet");
            perSweep[k] = (b.seconds - a.seconds) / (9.0 * n) * 1e6;
            cpuPerSweep[k] = (b.processor - a.processor) / (9.0 * n) * 1e6;
            System.out.printf(Locale.ROOT, "fit --models zener -o, round %d: %,d sweeps %.2f s, %,d sweeps %.2f s (peak resident %s):"
                    + " marginal %.0f µs per sweep, %.0f µs of processor time%n", k + 1, n, a.seconds, 10 * n, b.seconds, b.peak,
                    perSweep[k], cpuPerSweep[k]);
        }
        Arrays.sort(perSweep);
        Arrays.sort(cpuPerSweep);
        System.out.printf(Locale.ROOT, "fit: marginal processor time per sweep, every thread, median of 3: %.0f µs%n", cpuPerSweep[1]);
        System.out.printf(Locale.ROOT, "fit: marginal cost per 20-point sweep, whole process on 2 cores, median of 3: %.0f µs "
                + "(%.0f sweeps per second per core)%n", perSweep[1], 1e6 / perSweep[1] / 2);
        ProcessBuilder scipy = new ProcessBuilder("python3", "src/test/resources/bench/scipy_fit_campaign.py", small.toString(),
                String.valueOf(Math.min(n, 520))).redirectErrorStream(true);
        String line = lastLine(scipy.start());
        System.out.println(line);
        Matcher m = Pattern.compile("median (\\d+) us").matcher(line);
        if (m.find()) {
            double sp = Double.parseDouble(m.group(1));
            System.out.printf(Locale.ROOT, "ratio: SciPy's fit alone / Viscarta's whole process per sweep = %.1f%n", sp / perSweep[1]);
        }
    }

    /** n zener sweeps of 20 frequencies, 0.1–20 Hz, 2 % log-normal noise on each modulus. */
    static void writeSweeps(Path file, int n, long seed) throws IOException {
        if (Files.exists(file)) {
            return;
        }
        SplittableRandom rng = new SplittableRandom(seed);
        double[] m = new double[2];
        Zener zener = new Zener();
        try (Writer w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write("# invented benchmark data, not measurements\n# modulus: tensile\n"
                    + "sample,frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n");
            for (int s = 0; s < n; s++) {
                double[] p = {1e4 * (1 + rng.nextDouble()), 3e4 * (1 + rng.nextDouble()), Math.pow(10, rng.nextDouble(-2, 0))};
                for (int i = 0; i < 20; i++) {
                    double f = 0.1 * Math.pow(200, i / 19.0);
                    zener.modulus(2 * Math.PI * f, p, m);
                    w.write(String.format(Locale.ROOT, "s%06d,%.6g,%.6g,%.6g%n", s, f, m[0] * Math.exp(0.02 * rng.nextGaussian()),
                            m[1] * Math.exp(0.02 * rng.nextGaussian())));
                }
            }
        }
    }

    /** 50 invented zener references, 15 frequencies 0.05–20 Hz. */
    static void writeLibrary(Path library) throws IOException {
        Files.createDirectories(library);
        SplittableRandom rng = new SplittableRandom(9);
        double[] m = new double[2];
        for (int r = 0; r < 50; r++) {
            double[] p = {1e4 * (1 + rng.nextDouble()), 3e4 * (1 + rng.nextDouble()), Math.pow(10, rng.nextDouble(-2, 0))};
            StringBuilder sb = new StringBuilder(String.format(Locale.ROOT, "# name: ref-%02d%n# class: gel%n# temperature: 23 °C%n"
                    + "# method: invented for the benchmark%nfrequency [Hz],storage_modulus [Pa],loss_modulus [Pa]%n", r));
            for (int i = 0; i < 15; i++) {
                double f = 0.05 * Math.pow(400, i / 14.0);
                new Zener().modulus(2 * Math.PI * f, p, m);
                sb.append(String.format(Locale.ROOT, "%.6g,%.6g,%.6g%n", f, m[0], m[1]));
            }
            Files.writeString(library.resolve(String.format(Locale.ROOT, "ref-%02d.csv", r)), sb.toString());
        }
    }

    /**
     * @param seconds   in the command (the JVM that ran it, after its start)
     * @param wall      the whole wait: from the start of the JVM the user started to the end (both JVMs' starts included)
     * @param peak      the working JVM's peak resident memory
     * @param processor every JVM's processor time
     */
    private record Result(int exit, double seconds, double wall, String peak, double processor) {
    }

    /** Runs a command line in a JVM of its own through {@link MeasuredRun}, echoing its stage timings. */
    private static Result measured(List<String> jvmOptions, String... args) throws IOException, InterruptedException {
        List<String> cmd = new ArrayList<>();
        cmd.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
        cmd.addAll(jvmOptions);
        cmd.add("-Dviscarta.timings=true");
        cmd.add("-cp");
        cmd.add(classPath());
        cmd.add(MeasuredRun.class.getName());
        cmd.addAll(List.of(args));
        Process p = new ProcessBuilder(cmd).redirectErrorStream(true).start();
        Result result = null;
        double launcherWall = Double.NaN;
        double launcherProcessor = 0;
        List<String> timings = new ArrayList<>();
        try (BufferedReader in = new BufferedReader(new InputStreamReader(p.getInputStream(), StandardCharsets.UTF_8))) {
            for (String line; (line = in.readLine()) != null; ) {
                Matcher m = MEASURED.matcher(line);
                Matcher l = LAUNCHED.matcher(line);
                if (m.find()) {
                    Matcher cpu = PROCESSOR.matcher(line);
                    result = new Result(Integer.parseInt(m.group(1)), Double.parseDouble(m.group(2)), Double.parseDouble(m.group(3)),
                            m.group(4), cpu.find() ? Double.parseDouble(cpu.group(1)) : Double.NaN);
                } else if (l.find()) {
                    launcherWall = Double.parseDouble(l.group(1));
                    launcherProcessor = Double.parseDouble(l.group(2));
                } else if (line.startsWith("timing: ")) {
                    timings.add(line.substring(8));
                } else if (line.startsWith("viscarta:")) {
                    System.out.println("  " + line);
                }
            }
        }
        p.waitFor();
        System.out.println("  stages: " + String.join(", ", timings));
        if (result == null) {
            throw new IOException("the measured run printed no measurement (exit " + p.exitValue() + ")");
        }
        if (Double.isNaN(launcherWall)) {
            System.out.println("  ran in the JVM started (no second JVM)");
            return result;
        }
        return new Result(result.exit, result.seconds, launcherWall, result.peak, result.processor + launcherProcessor);
    }

    private static String lastLine(Process p) throws IOException, InterruptedException {
        String last = "";
        try (BufferedReader in = new BufferedReader(new InputStreamReader(p.getInputStream(), StandardCharsets.UTF_8))) {
            for (String line; (line = in.readLine()) != null; ) {
                last = line;
            }
        }
        p.waitFor();
        return last;
    }

    /** The class path this benchmark runs with (exec:java's class loader, or the JVM's). */
    private static String classPath() {
        ClassLoader cl = WholeProcess.class.getClassLoader();
        if (cl instanceof URLClassLoader u) {
            List<String> parts = new ArrayList<>();
            for (URL url : u.getURLs()) {
                try {
                    parts.add(Path.of(url.toURI()).toString());
                } catch (java.net.URISyntaxException e) {
                    throw new IllegalStateException(e);
                }
            }
            return String.join(java.io.File.pathSeparator, parts);
        }
        return System.getProperty("java.class.path");
    }
}
