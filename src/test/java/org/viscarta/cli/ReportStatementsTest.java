package org.viscarta.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.apache.poi.ss.usermodel.Cell;
import org.apache.poi.ss.usermodel.CellType;
import org.apache.poi.ss.usermodel.Row;
import org.apache.poi.ss.usermodel.Sheet;
import org.apache.poi.ss.usermodel.Workbook;
import org.apache.poi.ss.usermodel.WorkbookFactory;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Regression: every statement the report makes about how the analysis was done follows the
 * settings that ran. One report with non-default settings — a band instead of 1 Hz, relative
 * residuals, fitted vertical shifts, two models, α = 0.01 — and each sentence, header and caption
 * that states a setting is checked against it, and the defaults' wording is nowhere.
 */
@Tag("regression")
class ReportStatementsTest {

    @TempDir
    static Path dir;

    static Path out;
    static CliRun run;
    static Map<String, List<List<String>>> sheets = new LinkedHashMap<>();
    static Document page;

    @BeforeAll
    static void runWithNonDefaultSettings() throws IOException {
        out = dir.resolve("report");
        run = CliRun.of("report", "demo-data/paint-light-ageing.csv", "demo-data/temperature-series", "--band", "0.5-5",
                "--weighting", "relative", "--vertical", "fitted", "--models", "zener,springpot", "--alpha", "0.01",
                "--reference-temperature", "30", "--timestamp", "2026-12-01T12:00:00Z", "--out", out.toString(), "--quiet");
        assertEquals(0, run.exitCode(), run.err());
        try (InputStream in = Files.newInputStream(out.resolve("report.xlsx")); Workbook wb = WorkbookFactory.create(in)) {
            for (Sheet s : wb) {
                List<List<String>> rows = new ArrayList<>();
                for (Row r : s) {
                    List<String> cells = new ArrayList<>();
                    for (Cell c : r) {
                        cells.add(c.getCellType() == CellType.STRING ? c.getStringCellValue() : String.valueOf(c.getNumericCellValue()));
                    }
                    rows.add(cells);
                }
                sheets.put(s.getSheetName(), rows);
            }
        }
        page = Jsoup.parse(out.resolve("report.html").toFile(), "UTF-8");
    }

    private static String text(String sheet) {
        StringBuilder sb = new StringBuilder();
        sheets.get(sheet).forEach(r -> sb.append(String.join("\t", r)).append('\n'));
        return sb.toString();
    }

    private static String setting(String name) {
        return sheets.get("Provenance").stream().filter(r -> r.size() >= 2 && r.get(0).equals(name)).map(r -> r.get(1))
                .findFirst().orElseThrow(() -> new AssertionError("no setting '" + name + "' in Provenance"));
    }

    @Test
    void readMeStatesTheBandTheResidualsAndTheLevel() {
        String readMe = text("Read me");
        assertTrue(readMe.contains("ranked by damping (tan δ at 0.5–5 Hz (geometric mean)), differences tested at α = 0.01"), readMe);
        assertTrue(readMe.contains("2 candidate viscoelastic model(s) on relative residuals"), readMe);
        assertTrue(readMe.contains("Samples ordered by tan δ at 0.5–5 Hz (geometric mean)"), readMe);
        assertTrue(readMe.contains("Residual sum of squares of the relative differences between model and data"), readMe);
    }

    @Test
    void provenanceListsEverySettingThatRan() {
        assertEquals("zener, springpot", setting("models"));
        assertEquals("0.5–5 Hz (geometric mean)", setting("damping ranked at"));
        assertEquals("0.01", setting("significance level of pairwise and group tests"));
        assertEquals("relative", setting("weighting"));
        assertTrue(setting("residuals").startsWith("the relative differences"), setting("residuals"));
        assertTrue(setting("optimiser").contains("compact solver"), setting("optimiser"));
        assertTrue(setting("optimiser").endsWith("residuals: " + setting("residuals")), setting("optimiser"));
        assertTrue(setting("master curves").contains("closest to 30 °C"), setting("master curves"));
        assertTrue(setting("master curves").contains("vertical factors b_T fitted"), setting("master curves"));
        assertEquals("none", setting("reference library"));
    }

    @Test
    void headersNameTheResidualsAndTheBand() {
        List<String> fitsHeader = sheets.get("Model fits").get(0);
        assertTrue(fitsHeader.contains("RSS (relative residuals) [–]"), fitsHeader.toString());
        List<String> summaryHeader = sheets.get("Summary").get(0);
        assertTrue(summaryHeader.contains("tan δ at 0.5–5 Hz (geometric mean) [–]"), summaryHeader.toString());
        assertTrue(summaryHeader.contains("RMS misfit of best (relative residuals) [–]"), summaryHeader.toString());
        assertTrue(sheets.get("Group comparison").stream().anyMatch(r -> r.contains("supported at α = 0.01")));
        // the ranking's frequency column is the band's geometric centre, √(0.5 × 5) Hz
        List<String> firstRanked = sheets.get("Damping ranking").get(1);
        assertEquals(Math.sqrt(0.5 * 5), Double.parseDouble(firstRanked.get(4)), 1e-12);
    }

    @Test
    void onlyTheModelsAskedForAreFitted() {
        List<List<String>> fits = sheets.get("Model fits");
        for (List<String> r : fits.subList(1, fits.size())) {
            assertTrue(List.of("zener", "springpot").contains(r.get(1)), r.toString());
        }
    }

    @Test
    void pageFiguresAndTerminalSayTheSame() {
        String intro = page.select("h1 + p").text();
        assertTrue(intro.contains("tan δ at 0.5–5 Hz (geometric mean)"), intro);
        assertTrue(page.select("figure#damping-ranking figcaption").text().contains("tan δ at 0.5–5 Hz (geometric mean)"));
        assertTrue(page.select("figure#master-acrylic-film-ts figcaption").text().contains("divided by its vertical factor b_T"));
        assertTrue(run.out().contains("ranked at 0.5–5 Hz (geometric mean)"), run.out());
    }

    @Test
    void theDefaultsWordingIsNowhere() {
        StringBuilder all = new StringBuilder(page.text());
        sheets.keySet().forEach(s -> all.append(text(s)));
        for (String stale : List.of("log residuals", "natural-log differences", "natural log of", "Commons Math", "at 1 Hz",
                "α = 0.05", "ranked at 1")) {
            assertFalse(all.toString().contains(stale), "the report still says '" + stale + "'");
        }
    }
}
