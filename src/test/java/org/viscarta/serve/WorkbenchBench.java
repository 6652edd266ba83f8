package org.viscarta.serve;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Stream;

import org.viscarta.analysis.Analysis;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.AnalysisResult;
import org.viscarta.report.Provenance;
import org.viscarta.report.ReportContent;
import org.viscarta.report.ReportFiles;

/**
 * The workbench's speed (run from {@code Benchmarks} with {@code -Dexec.args="N workbench-only"}):
 * how long the page takes to arrive (its document, scripts, styles and first API answers over
 * HTTP, not the browser's drawing), and the whole demo analysis through the API against the same
 * analysis and report written the way {@code report} writes them.
 */
public final class WorkbenchBench {

    private WorkbenchBench() {
    }

    public static void run(int rounds) throws Exception {
        Path scratch = Files.createTempDirectory("viscarta-workbench-bench");
        try (WorkbenchFixture wb = new WorkbenchFixture(scratch, null, 500L << 20)) {
            double[] page = new double[20];
            for (int i = 0; i < page.length; i++) {
                long t0 = System.nanoTime();
                for (String p : List.of("/", "/assets/app.css", "/assets/uplot.css", "/assets/uplot.js", "/assets/app.js", "/api/about",
                        "/api/library")) {
                    if (wb.get(p, wb.server.token()).statusCode() != 200) {
                        throw new AssertionError(p);
                    }
                }
                page[i] = (System.nanoTime() - t0) / 1e6;
            }
            System.out.printf(Locale.ROOT, "workbench page and its first answers over HTTP: median %.1f ms (of %d)%n", median(page),
                    page.length);
            browserLoad(wb);
            Map<String, byte[]> files = new LinkedHashMap<>();
            Path demo = Path.of("demo-data");
            try (Stream<Path> s = Files.walk(demo)) {
                for (Path p : s.filter(Files::isRegularFile).sorted().toList()) {
                    files.put(demo.relativize(p).toString().replace('\\', '/'), Files.readAllBytes(p));
                }
            }
            String settings = "{\"basis\": \"tensile\", \"target\": \"target-soft-tissue\"}";
            double[] api = new double[rounds];
            double[] direct = new double[rounds];
            for (int i = 0; i < rounds; i++) {
                long t0 = System.nanoTime();
                String id = String.valueOf(wb.map(wb.upload("/api/uploads", files, Map.of()).body()).get("upload"));
                Map<String, Object> s = wb.analyse("\"upload\": \"" + id + "\"", settings);
                if (!"done".equals(s.get("state"))) {
                    throw new AssertionError(s.toString());
                }
                wb.get("/api/analyses/" + s.get("id") + "/result", wb.server.token());
                api[i] = (System.nanoTime() - t0) / 1e9;
                long t1 = System.nanoTime();
                AnalysisRequest request = new Settings(wb.map(settings)).report(List.of(demo), wb.library);
                AnalysisResult r = Analysis.run(request);
                new ReportFiles(scratch.resolve("direct-" + i)).write(new ReportContent(r,
                        new Provenance("bench", "bench", Instant.now().toString())), true);
                direct[i] = (System.nanoTime() - t1) / 1e9;
                System.out.printf(Locale.ROOT, "round %d: through the workbench %.2f s (upload, analysis, report files, result JSON); "
                        + "the same analysis and report in-process %.2f s%n", i + 1, api[i], direct[i]);
            }
            System.out.printf(Locale.ROOT, "demo analysis: workbench median %.2f s, in-process median %.2f s%n", median(api), median(direct));
        } finally {
            Uploads.deleteTree(scratch);
        }
    }

    /** Opening to a usable page in headless Chromium (navigation timing), where the browser and its driver are installed. */
    private static void browserLoad(WorkbenchFixture wb) {
        java.nio.file.Path chromium = WorkbenchBrowserTest.find("VISCARTA_CHROMIUM", "/usr/bin/chromium");
        java.nio.file.Path driverExe = WorkbenchBrowserTest.find("VISCARTA_CHROMEDRIVER", "/usr/bin/chromedriver");
        if (chromium == null || driverExe == null) {
            System.out.println("browser timing skipped: chromium and chromium-driver are not installed");
            return;
        }
        java.util.logging.Logger.getLogger("org.openqa.selenium").setLevel(java.util.logging.Level.SEVERE);
        org.openqa.selenium.chrome.ChromeOptions options = new org.openqa.selenium.chrome.ChromeOptions();
        options.setBinary(chromium.toFile());
        options.addArguments("--headless=new", "--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage");
        org.openqa.selenium.chrome.ChromeDriver driver = new org.openqa.selenium.chrome.ChromeDriver(
                new org.openqa.selenium.chrome.ChromeDriverService.Builder().usingDriverExecutable(driverExe.toFile())
                        .usingAnyFreePort().build(), options);
        try {
            double[] ready = new double[10];
            for (int i = 0; i < ready.length; i++) {
                long t0 = System.nanoTime();
                driver.get(wb.server.address());
                new org.openqa.selenium.support.ui.WebDriverWait(driver, java.time.Duration.ofSeconds(30)).until(
                        org.openqa.selenium.support.ui.ExpectedConditions.presenceOfElementLocated(
                                org.openqa.selenium.By.cssSelector("#table-library tbody tr")));
                ready[i] = (System.nanoTime() - t0) / 1e6;
            }
            System.out.printf(Locale.ROOT, "workbench in headless Chromium, opening the address to the library listed (the last "
                    + "element the page fills): median %.0f ms, slowest %.0f ms (of %d)%n", median(ready),
                    Arrays.stream(ready).max().orElse(0), ready.length);
        } finally {
            driver.quit();
        }
    }

    private static double median(double[] v) {
        double[] c = v.clone();
        Arrays.sort(c);
        return c.length % 2 == 1 ? c[c.length / 2] : (c[c.length / 2 - 1] + c[c.length / 2]) / 2;
    }
}
