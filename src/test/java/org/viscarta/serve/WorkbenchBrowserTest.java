package org.viscarta.serve;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.File;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.logging.Level;
import java.util.stream.Stream;

import org.apache.poi.ss.usermodel.DataFormatter;
import org.apache.poi.ss.usermodel.Row;
import org.apache.poi.ss.usermodel.Sheet;
import org.apache.poi.xssf.usermodel.XSSFWorkbook;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.openqa.selenium.By;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.Keys;
import org.openqa.selenium.OutputType;
import org.openqa.selenium.TakesScreenshot;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.chrome.ChromeDriver;
import org.openqa.selenium.chrome.ChromeDriverService;
import org.openqa.selenium.chrome.ChromeOptions;
import org.openqa.selenium.logging.LogEntry;
import org.openqa.selenium.logging.LogType;
import org.openqa.selenium.logging.LoggingPreferences;
import org.openqa.selenium.support.ui.ExpectedConditions;
import org.openqa.selenium.support.ui.WebDriverWait;

/**
 * The workbench in a real browser: Debian's Chromium driven through its chromium-driver (found on
 * this machine, never downloaded). A person's path: open the printed address, drop the demo files
 * (through the page's file picker, as a drop cannot be scripted across the operating system), see
 * how each was read, run, read the damping ranking and a fit, and download the workbook, which POI
 * then reopens. Skips, saying why, where the browser or its driver is missing; CI installs both.
 *
 * <p>{@code -Dviscarta.screenshots=DIR} keeps screenshots of each step for a person to look at.
 */
@Tag("regression")
class WorkbenchBrowserTest {

    @TempDir
    static Path scratch;

    static WorkbenchFixture wb;
    static WebDriver driver;
    static Path downloads;
    /** Held so that its level stays set (the logging framework keeps loggers only weakly). */
    private static final java.util.logging.Logger SELENIUM_LOG = java.util.logging.Logger.getLogger("org.openqa.selenium");

    static Path find(String env, String... candidates) {
        String given = System.getenv(env);
        if (given != null && Files.isExecutable(Path.of(given))) {
            return Path.of(given);
        }
        for (String c : candidates) {
            if (Files.isExecutable(Path.of(c))) {
                return Path.of(c);
            }
        }
        return null;
    }

    @BeforeAll
    static void start() throws IOException {
        Path chromium = find("VISCARTA_CHROMIUM", "/usr/bin/chromium", "/usr/bin/chromium-browser");
        Path chromedriver = find("VISCARTA_CHROMEDRIVER", "/usr/bin/chromedriver", "/usr/lib/chromium/chromedriver");
        Assumptions.assumeTrue(chromium != null && chromedriver != null, "browser tests skipped: Debian's chromium and chromium-driver "
                + "are not installed (apt-get install chromium chromium-driver; .ci/run installs them)");
        // Selenium looks for DevTools bindings of this browser's version; the tests use none
        SELENIUM_LOG.setLevel(Level.SEVERE);
        wb = new WorkbenchFixture(scratch.resolve("server"), null, 50L << 20);
        downloads = Files.createDirectories(scratch.resolve("downloads"));
        ChromeOptions options = new ChromeOptions();
        options.setBinary(chromium.toFile());
        options.addArguments("--headless=new", "--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage", "--window-size=1280,1600",
                "--no-first-run", "--disable-extensions", "--disable-background-networking", "--disable-sync",
                "--disable-component-update", "--disable-default-apps");
        Map<String, Object> prefs = new HashMap<>();
        prefs.put("download.default_directory", downloads.toString());
        prefs.put("download.prompt_for_download", false);
        options.setExperimentalOption("prefs", prefs);
        LoggingPreferences logs = new LoggingPreferences();
        logs.enable(LogType.BROWSER, Level.ALL);
        options.setCapability("goog:loggingPrefs", logs);
        ChromeDriverService service = new ChromeDriverService.Builder().usingDriverExecutable(chromedriver.toFile()).usingAnyFreePort()
                .build();
        driver = new ChromeDriver(service, options);
    }

    @AfterAll
    static void stop() {
        if (driver != null) {
            driver.quit();
        }
        if (wb != null) {
            wb.close();
        }
    }

    private static void shot(String name) throws IOException {
        String dir = System.getProperty("viscarta.screenshots");
        if (dir != null) {
            Files.createDirectories(Path.of(dir));
            Files.write(Path.of(dir, name + ".png"), ((TakesScreenshot) driver).getScreenshotAs(OutputType.BYTES));
        }
    }

    private static void shotOf(String name, WebElement e) throws IOException {
        String dir = System.getProperty("viscarta.screenshots");
        if (dir != null) {
            ((JavascriptExecutor) driver).executeScript("arguments[0].scrollIntoView();", e);
            Files.createDirectories(Path.of(dir));
            Files.write(Path.of(dir, name + ".png"), e.getScreenshotAs(OutputType.BYTES));
        }
    }

    @Test
    void aPersonAnalysesTheDemoFilesReadsTheRankingAndAFitAndDownloadsTheWorkbook() throws Exception {
        WebDriverWait wait = new WebDriverWait(driver, Duration.ofSeconds(30));
        driver.get(wb.server.address());
        assertFalse(driver.getCurrentUrl().contains("token="), "the token leaves the address bar");
        wait.until(ExpectedConditions.presenceOfElementLocated(By.cssSelector("#table-library tbody tr")));
        assertTrue(driver.findElement(By.id("library-status")).getText().contains("reference(s)"));
        shot("1-opened");

        // every demo file and one broken file, chosen with the page's file picker
        List<String> files = new ArrayList<>();
        try (Stream<Path> s = Files.walk(Path.of("demo-data"))) {
            s.filter(Files::isRegularFile).sorted().forEach(p -> files.add(p.toAbsolutePath().toString()));
        }
        Path broken = scratch.resolve("broken.csv");
        Files.writeString(broken, "# sample: broken\nfrequency [Hz],storage_modulus [kPa],loss_modulus [kPa]\n1,abc,2\n");
        files.add(broken.toString());
        driver.findElement(By.id("pick-files")).sendKeys(String.join("\n", files));
        wait.until(ExpectedConditions.presenceOfElementLocated(By.cssSelector("#table-inspection tbody tr")));
        wait.until(d -> d.findElement(By.id("run")).isEnabled());
        String inspection = driver.findElement(By.id("table-inspection")).getText();
        assertTrue(inspection.contains("agarose-1.0pct-r1.csv") && inspection.contains("→ storage_modulus"), inspection);
        WebElement leftOut = driver.findElement(By.cssSelector("#table-inspection tr.left-out"));
        assertTrue(leftOut.getText().contains("broken.csv") && leftOut.getText().contains("broken.csv:3:2: 'abc'"),
                "the bad file's one-line message beside it: " + leftOut.getText());
        shot("2-read");

        // two models to keep the test short, the target chosen from the samples read
        ((JavascriptExecutor) driver).executeScript("document.querySelectorAll('#models input').forEach(i => "
                + "i.checked = (i.value === 'zener' || i.value === 'springpot'));");
        new org.openqa.selenium.support.ui.Select(driver.findElement(By.id("target"))).selectByValue("target-soft-tissue");
        new org.openqa.selenium.support.ui.Select(driver.findElement(By.id("basis"))).selectByValue("tensile");
        driver.findElement(By.id("run")).click();
        new WebDriverWait(driver, Duration.ofSeconds(240)).until(ExpectedConditions.visibilityOfElementLocated(By.id("results")));
        assertTrue(driver.findElement(By.id("progress-text")).getText().startsWith("Done in"),
                driver.findElement(By.id("progress-text")).getText());
        shot("3-results");

        WebElement ranking = driver.findElement(By.id("table-ranking"));
        List<WebElement> rows = ranking.findElements(By.cssSelector("tbody tr"));
        assertTrue(rows.size() >= 5, "the gels are ranked: " + ranking.getText());
        String head = ranking.findElement(By.tagName("thead")).getText();
        assertTrue(head.contains("letter") && head.contains("tan δ"), head);
        assertTrue(driver.findElement(By.id("view-ranking")).getText().contains("not distinguishable")
                || driver.findElement(By.id("view-ranking")).getText().contains("differ"), "the statements under the ranking");
        assertTrue(driver.findElement(By.id("cautions")).getText().contains("not clinical"), "the cautions are shown");

        driver.findElement(By.id("tab-samples")).click();
        wait.until(ExpectedConditions.presenceOfElementLocated(By.cssSelector("#plot-moduli canvas")));
        String legend = driver.findElement(By.id("plot-moduli")).getText();
        assertTrue(legend.contains("E′ measured") && (legend.contains("zener") || legend.contains("springpot")), legend);
        // hovering the plot shows values with their unit in the legend
        WebElement over = driver.findElement(By.cssSelector("#plot-moduli .u-over"));
        new org.openqa.selenium.interactions.Actions(driver).moveToElement(over, 10, 10).perform();
        assertTrue(driver.findElement(By.id("plot-moduli")).getText().matches("(?s).*\\d (Pa|kPa|MPa|GPa).*"),
                "values with units under the cursor: " + driver.findElement(By.id("plot-moduli")).getText());
        shot("4-fit");
        shotOf("4-fit-plot", driver.findElement(By.id("view-samples")));

        // a sample measured by stress relaxation shows its measured E(t), not computed moduli as if measured
        org.openqa.selenium.support.ui.Select pick = new org.openqa.selenium.support.ui.Select(driver.findElement(By.id("sample-pick")));
        pick.getOptions().stream().filter(o -> o.getText().contains("(relaxation)")).findFirst().orElseThrow().click();
        wait.until(d -> d.findElement(By.id("plot-moduli")).getText().contains("replicate 1 (measured)"));
        assertTrue(driver.findElement(By.id("sample-about")).getText().contains("not by oscillation"));
        shotOf("4a-relaxation", driver.findElement(By.id("view-samples")));
        pick.selectByIndex(0);

        // the tabs are reachable by keyboard
        driver.findElement(By.id("tab-samples")).sendKeys(Keys.ARROW_RIGHT);
        assertEquals("tab-matches", driver.switchTo().activeElement().getAttribute("id"));
        assertTrue(driver.findElement(By.id("view-matches")).getText().contains("Mimic ranking"));

        // the ramps' glass transitions and the figures
        driver.findElement(By.id("tab-temperature")).click();
        wait.until(ExpectedConditions.presenceOfElementLocated(By.cssSelector("#plot-ramp canvas")));
        assertTrue(driver.findElement(By.id("view-temperature")).getText().contains("Tg E″ peak"),
                "the Transitions table is on the page");
        shot("4b-temperature");
        shotOf("4b-ramp-plot", driver.findElement(By.id("ramp-box")));
        driver.findElement(By.id("tab-figures")).click();
        wait.until(d -> (Boolean) ((JavascriptExecutor) d).executeScript("const i = document.querySelector('#view-figures img'); "
                + "return i !== null && i.complete && i.naturalWidth > 0;"));
        shot("4c-figures");

        driver.findElement(By.id("dl-xlsx")).click();
        Path workbook = downloads.resolve("report.xlsx");
        new WebDriverWait(driver, Duration.ofSeconds(30)).until(d -> Files.exists(workbook) && !Files.exists(downloads.resolve("report.xlsx.crdownload")));
        try (XSSFWorkbook book = new XSSFWorkbook(workbook.toFile())) {
            Sheet sheet = book.getSheet("Damping ranking");
            assertNotNull(sheet, "the downloaded workbook has the ranking");
            DataFormatter f = new DataFormatter(java.util.Locale.ROOT);
            String first = rows.get(0).findElements(By.tagName("td")).get(1).getText();
            boolean found = false;
            for (Row r : sheet) {
                for (org.apache.poi.ss.usermodel.Cell c : r) {
                    found |= f.formatCellValue(c).equals(first);
                }
            }
            assertTrue(found, "the page's first-ranked sample '" + first + "' is in the workbook's ranking");
            assertNotNull(book.getSheet("Mimic ranking"));
        }

        List<String> problems = new ArrayList<>();
        for (LogEntry e : driver.manage().logs().get(LogType.BROWSER)) {
            if (e.getLevel().intValue() >= Level.SEVERE.intValue() || e.getMessage().contains("Content Security Policy")) {
                problems.add(e.getMessage());
            }
        }
        assertTrue(problems.isEmpty(), "no script errors or blocked content: " + problems);
    }

    @Test
    void theLibraryCanBeReadAndAddedToFromThePage() throws Exception {
        WebDriverWait wait = new WebDriverWait(driver, Duration.ofSeconds(30));
        driver.get(wb.server.address());
        wait.until(ExpectedConditions.presenceOfElementLocated(By.cssSelector("#table-library tbody tr")));
        driver.findElement(By.cssSelector("button[aria-label='Show dammar-varnish']")).click();
        wait.until(ExpectedConditions.presenceOfElementLocated(By.cssSelector("#plot-library canvas")));
        assertTrue(driver.findElement(By.id("library-show-h")).getText().contains("dammar-varnish"));
        driver.findElement(By.cssSelector("#library-add-box summary")).click();
        driver.findElement(By.id("lib-file")).sendKeys(new File("demo-data/hydrogel-screen/gelatin-5pct-r1.csv").getAbsolutePath());
        driver.findElement(By.id("lib-name")).sendKeys("gelatin-5pct-page");
        driver.findElement(By.id("lib-class")).sendKeys("gel");
        driver.findElement(By.cssSelector("#library-add button[type=submit]")).click();
        wait.until(ExpectedConditions.textToBePresentInElementLocated(By.id("library-status"), "Added 'gelatin-5pct-page'"));
        assertTrue(Files.list(wb.library).anyMatch(p -> p.getFileName().toString().contains("gelatin-5pct-page")),
                "the page wrote into the shared library folder");
        shot("5-library");
    }
}
