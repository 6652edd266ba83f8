package org.viscarta.bench;

import java.io.IOException;
import java.io.OutputStream;
import java.io.Writer;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.viscarta.analysis.Analysis;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.AnalysisResult;
import org.viscarta.report.ReportContent;
import org.viscarta.fit.LeastSquaresEngine;
import org.viscarta.fit.ModelFitter;
import org.viscarta.io.SweepFile;
import org.viscarta.io.SweepReader;
import org.viscarta.model.Zener;
import org.viscarta.report.Provenance;
import org.viscarta.report.WorkbookReport;
import org.viscarta.sweep.SweepPoint;

/**
 * Benchmarks for the targets of PRODUCT.md "Numbers it must reach". Not a test: it measures and
 * prints. Run from the repository's top folder with
 *
 * <pre>mvn -q -B test-compile exec:java -Dexec.mainClass=org.viscarta.bench.Benchmarks -Dexec.classpathScope=test</pre>
 *
 * and, for the SciPy comparison, {@code python3 src/test/resources/bench/scipy_zener_fit.py target/bench/zener-sweep.csv}.
 * Optional argument: the number of sweeps in the campaign benchmark (default 10000).
 */
public final class Benchmarks {

    private Benchmarks() {
    }

    public static void main(String[] args) throws IOException {
        System.setProperty("log4j2.loggerContextFactory", "org.apache.logging.log4j.simple.SimpleLoggerContextFactory");
        int campaignSweeps = args.length > 0 ? Integer.parseInt(args[0]) : 10000;
        Path out = Path.of("target", "bench");
        Files.createDirectories(out);
        System.out.printf(Locale.ROOT, "machine: %d cores available to the JVM, max heap %d MB, Java %s, %s %s%n",
                Runtime.getRuntime().availableProcessors(), Runtime.getRuntime().maxMemory() >> 20,
                System.getProperty("java.version"), System.getProperty("os.name"), System.getProperty("os.arch"));
        if (args.length >= 2 && List.of("report-only", "demo-only", "fit-only").contains(args[1])) {
            try {
                WholeProcess.run(args[1].replace("-only", ""), Integer.parseInt(args[0]));
            } catch (InterruptedException e) {
                throw new IOException(e);
            }
            return;
        }
        if (args.length >= 2 && args[1].equals("map-only")) {
            try {
                org.viscarta.map.MapBench.run(Integer.parseInt(args[0]));
            } catch (Exception e) {
                throw new IOException(e);
            }
            return;
        }
        if (args.length >= 2 && args[1].equals("workbench-only")) {
            try {
                org.viscarta.serve.WorkbenchBench.run(Integer.parseInt(args[0]));
            } catch (Exception e) {
                throw new IOException(e);
            }
            return;
        }
        if (args.length >= 2 && args[1].equals("stream-only")) {
            streaming(out, Long.parseLong(args[0]));
            return;
        }
        if (args.length >= 2 && args[1].equals("read-only")) {
            fullRead(out, Long.parseLong(args[0]));
            return;
        }
        if (args.length >= 2 && args[1].equals("spectrum-coverage-only")) {
            spectrumCoverage(Integer.parseInt(args[0]));
            return;
        }
        if (args.length >= 2 && args[1].equals("workbook-only")) {
            workbook(out, Integer.parseInt(args[0]));
            return;
        }
        if (args.length >= 2 && args[1].equals("raw-only")) {
            raw(out);
            return;
        }
        if (args.length >= 2 && args[1].equals("fuzz-only")) {
            Path work = Files.createTempDirectory("viscarta-fuzz");
            long t0 = System.nanoTime();
            var o = org.viscarta.cli.Fuzz.run(20261203L, Integer.parseInt(args[0]), java.time.Duration.ofHours(2), work);
            System.out.printf(Locale.ROOT, "fuzz: %d inputs in %.0f s: %d read, %d refused cleanly with file:line, %d other outcomes%s%n",
                    o.trials(), (System.nanoTime() - t0) / 1e9, o.read(), o.refused(), o.failures().size(),
                    o.failures().isEmpty() ? "" : ": " + o.failures());
            return;
        }
        if (args.length >= 2 && args[1].equals("letters-only")) {
            letters(Integer.parseInt(args[0]));
            return;
        }
        if (args.length < 2 || !args[1].equals("campaign-only")) {
            singleFit(out);
            catalogue(out);
            reading(out);
        }
        campaign(out, campaignSweeps);
    }

    /**
     * The damping comparison (Welch tests, Holm, letters, statements) of n samples × 3 replicates on
     * a gentle gradient of tan δ, the case that once made the letter display run for minutes.
     */
    static void letters(int n) {
        var samples = org.viscarta.compare.GradientSamples.of(n, 0.3 / n);
        for (int round = 0; round < 3; round++) {
            long t0 = System.nanoTime();
            var r = samples.compare();
            long t1 = System.nanoTime();
            System.out.printf(Locale.ROOT, "letters: %d samples x 3 replicates on a gradient: %.2f s (%d pairs; letters %s)%n", n,
                    (t1 - t0) / 1e9, r.pairs().size(), r.letters().get(0).isEmpty() ? "replaced by the pairwise table" : "shown");
        }
    }

    /** One zener sweep, 20 frequencies 0.01–100 Hz, 2 % noise; also written for the SciPy script. */
    static List<SweepPoint> zenerSweep() {
        SplittableRandom rng = new SplittableRandom(99);
        double[] p = {2.0e5, 8.0e5, 0.02};
        List<SweepPoint> pts = new ArrayList<>();
        double[] m = new double[2];
        for (int i = 0; i < 20; i++) {
            double f = 0.01 * Math.pow(1e4, i / 19.0);
            new Zener().modulus(2 * Math.PI * f, p, m);
            pts.add(new SweepPoint(f, m[0] * Math.exp(0.02 * rng.nextGaussian()), m[1] * Math.exp(0.02 * rng.nextGaussian()), 0));
        }
        return pts;
    }

    private static void singleFit(Path out) throws IOException {
        List<SweepPoint> pts = zenerSweep();
        StringBuilder sb = new StringBuilder("frequency_hz,storage_pa,loss_pa\n");
        for (SweepPoint p : pts) {
            sb.append(p.frequencyHz()).append(',').append(p.storage()).append(',').append(p.loss()).append('\n');
        }
        Files.writeString(out.resolve("zener-sweep.csv"), sb.toString());
        // the Commons Math path, for comparison with the compact solver that model fits use
        ModelFitter fitter = new ModelFitter(new LeastSquaresEngine(LeastSquaresEngine.Settings.defaults().withMaxEvaluations(1000)));
        Zener zener = new Zener();
        for (int i = 0; i < 3000; i++) {
            fitter.fit("b", zener, pts);
        }
        int reps = 2000;
        long[] ns = new long[reps];
        double sink = 0;
        for (int i = 0; i < reps; i++) {
            long t0 = System.nanoTime();
            sink += fitter.fit("b", zener, pts).rss();
            ns[i] = System.nanoTime() - t0;
        }
        Arrays.sort(ns);
        System.out.printf(Locale.ROOT, "zener fit on the Commons Math path, 20 frequencies, all %d data-derived starts: median %.1f µs, "
                + "p90 %.1f µs over %d runs (checksum %.6g)%n", zener.startValues(pts).size(), ns[reps / 2] / 1e3,
                ns[reps * 9 / 10] / 1e3, reps, sink);
        var first = zener.startValues(pts).get(0);
        for (int i = 0; i < reps; i++) {
            long t0 = System.nanoTime();
            sink += singleStart(fitter, zener, pts, first);
            ns[i] = System.nanoTime() - t0;
        }
        Arrays.sort(ns);
        System.out.printf(Locale.ROOT, "zener fit on the Commons Math path, one start: median %.1f µs, p90 %.1f µs (checksum %.6g)%n",
                ns[reps / 2] / 1e3, ns[reps * 9 / 10] / 1e3, sink);
    }

    /** Every model of the catalogue on a 20-frequency sweep of its own; also written for the SciPy script. */
    private static void catalogue(Path out) throws IOException {
        Object[][] cases = {
            {"springpot", new double[] {1e4, 0.3}},
            {"empirical-power-law", new double[] {1e4, 0.2, 2e3, 0.4}},
            {"springpot-dashpot", new double[] {1e4, 0.2, 5}},
            {"maxwell", new double[] {1e5, 0.05}},
            {"kelvin-voigt", new double[] {1e4, 50}},
            {"zener", new double[] {1e4, 3e4, 0.05}},
            {"burgers", new double[] {1e5, 1e4, 5e4, 5e2}},
            {"generalized-maxwell:2", new double[] {1e3, 1e4, 5e3, 0.01, 1}},
            {"fractional-kelvin-voigt", new double[] {1e4, 3e3, 0.4}},
            {"fractional-maxwell", new double[] {1e5, 0.05, 0.6}},
            {"fractional-zener", new double[] {1e4, 3e4, 0.05, 0.6}}};
        SplittableRandom rng = new SplittableRandom(31);
        StringBuilder sweeps = new StringBuilder("case,model,frequency_hz,storage_pa,loss_pa\n");
        StringBuilder times = new StringBuilder("case,model,viscarta_median_us_all_starts,viscarta_median_us_one_start,starts\n");
        ModelFitter fitter = new ModelFitter();
        System.out.println("per model, 20 frequencies, 3 % noise (median of 2,000 fits once warm: medians of successive rounds within 2 %; one thread):");
        for (int k = 0; k < cases.length; k++) {
            String id = (String) cases[k][0];
            double[] truth = (double[]) cases[k][1];
            var model = org.viscarta.model.ModelCatalogue.byId(id).orElseThrow();
            List<SweepPoint> pts = new ArrayList<>();
            double[] m = new double[2];
            for (int i = 0; i < 20; i++) {
                double f = 0.01 * Math.pow(1e4, i / 19.0);
                model.modulus(2 * Math.PI * f, truth, m);
                pts.add(new SweepPoint(f, m[0] * Math.exp(0.03 * rng.nextGaussian()), m[1] * Math.exp(0.03 * rng.nextGaussian()), 0));
            }
            for (SweepPoint p : pts) {
                sweeps.append(k).append(',').append(model.id()).append(',').append(p.frequencyHz()).append(',')
                        .append(p.storage()).append(',').append(p.loss()).append('\n');
            }
            List<double[]> starts = model.startValues(pts);
            List<double[]> first = List.of(starts.get(0));
            double all = medianMicros(() -> fitter.fit("b", model, pts).rss());
            double one = medianMicros(() -> fitter.fitFrom("b", model, pts, first).rss());
            System.out.printf(Locale.ROOT, "  %-24s %8.1f µs (%d starts, %6.0f fits/s)   %7.1f µs from one start%n", id, all,
                    starts.size(), 1e6 / all, one);
            times.append(k).append(',').append(model.id()).append(',').append(all).append(',').append(one).append(',')
                    .append(starts.size()).append('\n');
        }
        Files.writeString(out.resolve("catalogue-sweeps.csv"), sweeps.toString());
        Files.writeString(out.resolve("viscarta-fit-times.csv"), times.toString());
    }

    /**
     * The median time of one call in the steady state: warmed up in rounds of 500 calls until two
     * rounds in a row have medians within 2 % of the round before (the JIT has compiled what the call
     * runs) or 5 s have passed, then the median of 2,000 calls. A few hundred calls are not enough:
     * the optimising compiler was still at work, and medians after 300 warm-up calls were about twice
     * the steady state's.
     */
    private static double medianMicros(java.util.function.DoubleSupplier fit) {
        double sink = 0;
        long[] round = new long[500];
        double last = Double.NaN;
        int steady = 0;
        long start = System.nanoTime();
        while (steady < 2 && System.nanoTime() - start < 5_000_000_000L) {
            for (int i = 0; i < round.length; i++) {
                long t0 = System.nanoTime();
                sink += fit.getAsDouble();
                round[i] = System.nanoTime() - t0;
            }
            Arrays.sort(round);
            double median = round[round.length / 2];
            steady = Math.abs(median - last) <= 0.02 * last ? steady + 1 : 0;
            last = median;
        }
        long[] ns = new long[2000];
        for (int i = 0; i < ns.length; i++) {
            long t0 = System.nanoTime();
            sink += fit.getAsDouble();
            ns[i] = System.nanoTime() - t0;
        }
        Arrays.sort(ns);
        if (Double.isNaN(sink)) {
            System.out.print("");
        }
        return ns[ns.length / 2] / 1e3;
    }

    private static double singleStart(ModelFitter fitter, Zener zener, List<SweepPoint> pts, double[] start) {
        return fitter.fitFrom("b", zener, pts, List.of(start)).rss();
    }

    /**
     * The full read the analysing verbs use (every point kept) of a tidy table of the given size,
     * twice (the second timed), with the peak heap.
     */
    private static void fullRead(Path out, long megabytes) throws IOException {
        Path file = bigTidy(out, megabytes);
        long size = Files.size(file);
        new SweepReader(null).read(file);
        System.gc();
        resetPeakHeap();
        long t0 = System.nanoTime();
        int sweeps = new SweepReader(null).read(file).sweeps().size();
        double sec = (System.nanoTime() - t0) / 1e9;
        long heap = peakHeap();
        System.out.printf(Locale.ROOT, "full read of a %.0f MB tidy table (%d sweeps, every point kept): %.1f s = %.1f MB/s (the reader's thread and its read-ahead thread); "
                + "peak heap %d MB with max heap %d MB%n", size / 1e6, sweeps, sec, size / 1e6 / sec, heap >> 20,
                Runtime.getRuntime().maxMemory() >> 20);
    }

    private static void resetPeakHeap() {
        for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
            pool.resetPeakUsage();
        }
    }

    /** Peak heap use since {@link #resetPeakHeap} [bytes]. */
    private static long peakHeap() {
        long heap = 0;
        for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
            if (pool.getType() == MemoryType.HEAP) {
                heap += pool.getPeakUsage().getUsed();
            }
        }
        return heap;
    }

    /** A tidy table of about {@code megabytes} MB: 10,000 samples × 3 replicates × 20 frequencies, repeated. */
    static Path bigTidy(Path out, long megabytes) throws IOException {
        Path file = out.resolve("big-" + megabytes + "mb.csv");
        if (!Files.exists(file)) {
            try (Writer w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
                w.write("sample,replicate,group,frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n");
                long bytes = 0;
                StringBuilder sb = new StringBuilder(128);
                for (long row = 0; bytes < megabytes * 1_000_000L; row++) {
                    sb.setLength(0);
                    long s = row / 20;
                    sb.append("sample-").append(s % 10_000).append(',').append(1 + (s / 10_000) % 3).append(",g").append(s % 10_000 % 7).append(',')
                            .append(0.1 * (1 + row % 20)).append(',').append(10_000 + row % 977).append(',').append(1_000 + row % 331)
                            .append('\n');
                    w.write(sb.toString());
                    bytes += sb.length();
                }
            }
        }
        return file;
    }

    /**
     * Streaming a large tidy table ({@code inspect}'s pass): writes a file of about {@code megabytes}
     * MB (unless it is there), then summarises it; run with a small heap (-Xmx256m) to show that
     * memory does not grow with the file.
     */
    private static void streaming(Path out, long megabytes) throws IOException {
        Path file = bigTidy(out, megabytes);
        long size = Files.size(file);
        resetPeakHeap();
        long t0 = System.nanoTime();
        SweepReader.Summary s = new SweepReader(null).summarize(file);
        double sec = (System.nanoTime() - t0) / 1e9;
        long heap = peakHeap();
        System.out.printf(Locale.ROOT, "streaming summary of a %.0f MB tidy table (%d sweeps): %.1f s = %.1f MB/s (the reader's thread and its read-ahead thread); "
                + "peak heap %d MB with max heap %d MB%n", size / 1e6, s.sweeps().size(), sec, size / 1e6 / sec, heap >> 20,
                Runtime.getRuntime().maxMemory() >> 20);
    }

    /**
     * A tidy workbook sheet of {@code thousands} × 1,000 rows (samples × replicates × 20 frequencies)
     * read by the streaming workbook reader, twice (the second timed), with the peak heap; then, for
     * contrast, the peak heap of POI's object model merely opening a tenth of it.
     */
    private static void workbook(Path out, int thousands) throws IOException {
        Path file = bigWorkbook(out, thousands);
        Path tenth = bigWorkbook(out, Math.max(1, thousands / 10));
        new SweepReader(null).read(file);
        System.gc();
        resetPeakHeap();
        long t0 = System.nanoTime();
        SweepFile f = new SweepReader(null).read(file);
        double sec = (System.nanoTime() - t0) / 1e9;
        long heap = peakHeap();
        long points = f.sweeps().stream().mapToLong(x -> x.points().size()).sum();
        System.out.printf(Locale.ROOT, "streamed workbook read: %.1f MB XLSX, %d rows, %d sweeps: %.1f s = %.0f rows/s on one thread "
                + "(plus the sheet's XML parsed on a second); peak heap %d MB with max heap %d MB%n", Files.size(file) / 1e6,
                points, f.sweeps().size(), sec, points / sec, heap >> 20, Runtime.getRuntime().maxMemory() >> 20);
        f = null;
        System.gc();
        resetPeakHeap();
        try (var wb = org.apache.poi.ss.usermodel.WorkbookFactory.create(tenth.toFile(), null, true)) {
            System.out.printf(Locale.ROOT, "for contrast, POI's object model opening a %d-row copy: peak heap %d MB%n",
                    wb.getSheetAt(0).getLastRowNum(), peakHeap() >> 20);
        }
    }

    /**
     * Coverage of the spectrum's reported intervals over {@code runs} seeded synthetic sweeps with
     * known truth (two Maxwell modes, 1e5 Pa at 0.01 s and 2e4 Pa at 1 s, E_e = 1e3 Pa, 41 frequencies
     * 0.01–100 Hz, 2 % noise): how often value ± 1.96 SE holds E_e, η0 = Σ E_i τ_i and the
     * weight-average time Σ E_i τ_i² / η0. Too slow for the test suite (GCV over 26 λ per sweep).
     */
    static void spectrumCoverage(int runs) {
        double[] e = {1e5, 2e4};
        double[] t = {0.01, 1.0};
        double ee = 1e3;
        double eta = e[0] * t[0] + e[1] * t[1];
        double tw = (e[0] * t[0] * t[0] + e[1] * t[1] * t[1]) / eta;
        int cEe = 0;
        int cEta = 0;
        int cTime = 0;
        for (int k = 0; k < runs; k++) {
            SplittableRandom rng = new SplittableRandom(1000 + k);
            List<org.viscarta.sweep.SweepPoint> data = new ArrayList<>();
            for (int i = 0; i < 41; i++) {
                double f = 0.01 * Math.pow(1e4, i / 40.0);
                double w = 2 * Math.PI * f;
                double re = ee;
                double im = 0;
                for (int j = 0; j < 2; j++) {
                    double x = w * t[j];
                    re += e[j] * x * x / (1 + x * x);
                    im += e[j] * x / (1 + x * x);
                }
                data.add(new org.viscarta.sweep.SweepPoint(f, re * Math.exp(0.02 * rng.nextGaussian()), im * Math.exp(0.02 * rng.nextGaussian()), i));
            }
            var r = org.viscarta.spectrum.RelaxationSpectrum.of(data, org.viscarta.spectrum.RelaxationSpectrum.Kind.RELAXATION);
            double[] m1 = r.moment(1);
            double[] mt = r.meanTime();
            cEe += Math.abs(r.constant() - ee) <= 1.96 * r.constantSe() ? 1 : 0;
            cEta += Math.abs(m1[0] - eta) <= 1.96 * m1[1] ? 1 : 0;
            cTime += Math.abs(mt[0] - tw) <= 1.96 * mt[1] ? 1 : 0;
        }
        System.out.printf(Locale.ROOT, "spectrum intervals over %d seeded sweeps: E_e covered %.1f %%, η0 %.1f %%, weight-average time %.1f %%%n",
                runs, 100.0 * cEe / runs, 100.0 * cEta / runs, 100.0 * cTime / runs);
    }

    static Path bigWorkbook(Path out, int thousands) throws IOException {
        Path file = out.resolve("big-" + thousands + "k-rows.xlsx");
        if (!Files.exists(file)) {
            try (var wb = new org.apache.poi.xssf.streaming.SXSSFWorkbook(200)) {
                var sheet = wb.createSheet("sweeps");
                String[] head = {"sample", "replicate", "frequency [Hz]", "storage_modulus [Pa]", "loss_modulus [Pa]"};
                var h = sheet.createRow(0);
                for (int c = 0; c < head.length; c++) {
                    h.createCell(c).setCellValue(head[c]);
                }
                for (int row = 0; row < thousands * 1000; row++) {
                    int s = row / 20;
                    var r = sheet.createRow(row + 1);
                    r.createCell(0).setCellValue("sample-" + s % 10_000);
                    r.createCell(1).setCellValue(1 + (s / 10_000) % 3);
                    r.createCell(2).setCellValue(0.1 * (1 + row % 20));
                    r.createCell(3).setCellValue(10_000 + row % 977);
                    r.createCell(4).setCellValue(1_000 + row % 331);
                }
                try (var w = Files.newOutputStream(file)) {
                    wb.write(w);
                }
                wb.dispose();
            }
        }
        return file;
    }

    /** Raw signals: 10 drive frequencies × 100,000 samples of force and displacement, read and demodulated. */
    private static void raw(Path out) throws IOException {
        Path file = out.resolve("raw-signals.csv");
        SplittableRandom rng = new SplittableRandom(12);
        try (Writer w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write("# geometry: tension; length: 10 mm; area: 5 mm²\ntime [s],force [N],displacement [m],drive_frequency [Hz]\n");
            double t0 = 0;
            for (int k = 0; k < 10; k++) {
                double f = 0.5 * Math.pow(2, k);
                for (int i = 0; i < 100_000; i++) {
                    double t = i / (1000.0 * f);
                    double ph = 2 * Math.PI * f * t;
                    w.write(String.format(Locale.ROOT, "%.9g,%.9g,%.9g,%s%n", t0 + t, 1e-3 * Math.cos(ph + 0.2) + 1e-6 * rng.nextGaussian(),
                            1e-6 * Math.cos(ph) + 1e-9 * rng.nextGaussian(), f));
                }
                t0 += 100.0 / f + 1;
            }
        }
        long bytes = Files.size(file);
        for (int warm = 0; warm < 2; warm++) {
            org.viscarta.raw.RawConverter.convert(org.viscarta.raw.RawReader.read(file), org.viscarta.raw.RawConverter.Settings.defaults(), null);
        }
        long t0 = System.nanoTime();
        var m = org.viscarta.raw.RawReader.read(file);
        long t1 = System.nanoTime();
        org.viscarta.raw.RawConverter.convert(m, org.viscarta.raw.RawConverter.Settings.defaults(), null);
        long t2 = System.nanoTime();
        System.out.printf(Locale.ROOT, "raw signals: %.1f MB, 1,000,000 samples: read %.2f s (%.1f MB/s), demodulated %.2f s "
                + "(%.2g samples/s), one thread%n", bytes / 1e6, (t1 - t0) / 1e9, bytes / 1e6 / ((t1 - t0) / 1e9), (t2 - t1) / 1e9,
                1e6 / ((t2 - t1) / 1e9));
    }

    private static void reading(Path out) throws IOException {
        Path file = out.resolve("big-tidy.csv");
        SplittableRandom rng = new SplittableRandom(5);
        try (Writer w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write("sample,replicate,group,frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n");
            for (int s = 0; s < 20000; s++) {
                for (int i = 0; i < 20; i++) {
                    w.write(String.format(Locale.ROOT, "sample-%d,%d,g%d,%.6g,%.6g,%.6g%n", s, 1 + s % 3, s % 7,
                            0.1 * Math.pow(10, i / 10.0), 1e4 * (1 + rng.nextDouble()), 1e3 * (1 + rng.nextDouble())));
                }
            }
        }
        long bytes = Files.size(file);
        SweepReader reader = new SweepReader(null);
        reader.read(file);
        long t0 = System.nanoTime();
        int sweeps = reader.read(file).sweeps().size();
        double s = (System.nanoTime() - t0) / 1e9;
        System.out.printf(Locale.ROOT, "reading a tidy table: %.1f MB, %d sweeps in %.2f s = %.1f MB/s (the reader's thread and its read-ahead thread)%n",
                bytes / 1e6, sweeps, s, bytes / 1e6 / s);
    }

    private static void campaign(Path out, int n) throws IOException {
        Path dir = out.resolve("campaign");
        Files.createDirectories(dir);
        Path file = dir.resolve("sweeps.csv");
        SplittableRandom rng = new SplittableRandom(8);
        try (Writer w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write("# modulus: tensile\nsample,frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n");
            double[] m = new double[2];
            for (int s = 0; s < n; s++) {
                double[] p = {1e4 * (1 + rng.nextDouble()), 3e4 * (1 + rng.nextDouble()), Math.pow(10, rng.nextDouble(-2, 0))};
                for (int i = 0; i < 12; i++) {
                    double f = 0.1 * Math.pow(200, i / 11.0);
                    new Zener().modulus(2 * Math.PI * f, p, m);
                    w.write(String.format(Locale.ROOT, "s%05d,%.6g,%.6g,%.6g%n", s, f, m[0] * Math.exp(0.02 * rng.nextGaussian()),
                            m[1] * Math.exp(0.02 * rng.nextGaussian())));
                }
            }
        }
        Path library = dir.resolve("library");
        Files.createDirectories(library);
        for (int r = 0; r < 50; r++) {
            double[] p = {1e4 * (1 + rng.nextDouble()), 3e4 * (1 + rng.nextDouble()), Math.pow(10, rng.nextDouble(-2, 0))};
            StringBuilder sb = new StringBuilder(String.format(Locale.ROOT, "# name: ref-%02d%n# class: gel%n# temperature: 23 °C%n"
                    + "# method: synthetic%nfrequency [Hz],storage_modulus [Pa],loss_modulus [Pa]%n", r));
            double[] m = new double[2];
            for (int i = 0; i < 15; i++) {
                double f = 0.05 * Math.pow(400, i / 14.0);
                new Zener().modulus(2 * Math.PI * f, p, m);
                sb.append(String.format(Locale.ROOT, "%.6g,%.6g,%.6g%n", f, m[0], m[1]));
            }
            Files.writeString(library.resolve(String.format(Locale.ROOT, "ref-%02d.csv", r)), sb.toString());
        }
        resetPeakHeap();
        java.util.Map<org.viscarta.analysis.Progress.Stage, Long> started = new java.util.concurrent.ConcurrentHashMap<>();
        org.viscarta.analysis.Progress timing = new org.viscarta.analysis.Progress() {
            @Override
            public void stage(Stage stage, int items) {
                started.put(stage, System.nanoTime());
            }
        };
        long t0 = System.nanoTime();
        AnalysisRequest request = AnalysisRequest.builder(List.of(file)).library(library)
                .compute(AnalysisRequest.Part.FITS, AnalysisRequest.Part.RANKING, AnalysisRequest.Part.MATCHES,
                        AnalysisRequest.Part.QUALITY).build();
        AnalysisResult c = Analysis.run(request, timing);
        long t2c = System.nanoTime();
        Provenance prov = new Provenance("bench", "benchmark", "2026-01-01T00:00:00Z");
        WorkbookReport.write(new ReportContent(c, prov), List.of(), dir.resolve("report.xlsx"));
        long t3 = System.nanoTime();
        long t1 = started.get(org.viscarta.analysis.Progress.Stage.FITTING);
        long tc = started.getOrDefault(org.viscarta.analysis.Progress.Stage.CHECKING, t1);
        long t2 = started.get(org.viscarta.analysis.Progress.Stage.RANKING);
        long t2b = started.get(org.viscarta.analysis.Progress.Stage.MATCHING);
        long heap = peakHeap();
        System.out.printf(Locale.ROOT, "campaign: quality checks %.2f s%n", (t1 - tc) / 1e9);
        System.out.printf(Locale.ROOT, "campaign: %d sweeps x %d models, matched against %d references: read %.2f s, fit %.2f s, "
                + "rank and letters %.2f s, references fitted and matched %.2f s, workbook %.2f s, total %.2f s wall; "
                + "peak heap (sum of pool peaks) %d MB%n", n, request.modelIds().size(), c.library().orElseThrow().entries().size(),
                (tc - t0) / 1e9, (t2 - t1) / 1e9, (t2b - t2) / 1e9, (t2c - t2b) / 1e9, (t3 - t2c) / 1e9, (t3 - t0) / 1e9, heap >> 20);
    }
}
