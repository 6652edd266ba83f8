package org.viscarta.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viscarta.analysis.Analysis;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.AnalysisResult;

/**
 * The workbook's tables are written by several threads, one sheet each; the file must be the one a
 * single thread writes, byte for byte (80 invented samples, two models, spectra: several sheets of
 * hundreds of rows, each past the 200 rows the streamed workbook keeps in memory).
 */
@Tag("regression")
class WorkbookThreadsTest {

    @TempDir
    Path dir;

    @Test
    void sheetsWrittenSideBySideGiveTheBytesOfOneThread() throws IOException {
        StringBuilder sb = new StringBuilder("# modulus: tensile\nsample,frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n");
        for (int k = 1; k <= 80; k++) {
            for (int i = 0; i < 12; i++) {
                double f = 0.1 * Math.pow(200, i / 11.0);
                double storage = 1e4 * Math.pow(f, 0.1 + k / 1000.0);
                sb.append(String.format(Locale.ROOT, "s%03d,%.6g,%.6g,%.6g%n", k, f, storage, storage * (0.05 + k / 200.0)));
            }
        }
        Path file = Files.writeString(dir.resolve("campaign.csv"), sb.toString());
        AnalysisResult r = Analysis.run(AnalysisRequest.builder(List.of(file)).models(List.of("springpot", "zener"))
                .compute(AnalysisRequest.Part.FITS, AnalysisRequest.Part.RANKING, AnalysisRequest.Part.SPECTRA).build());
        ReportContent c = new ReportContent(r, new Provenance("test", "viscarta report campaign.csv", "2026-12-01T12:00:00Z"));
        Path one = dir.resolve("one.xlsx");
        Path four = dir.resolve("four.xlsx");
        WorkbookReport.write(c, List::of, one, 1, WorkbookReport.SHEET_ROWS);
        WorkbookReport.write(c, List::of, four, 4, WorkbookReport.SHEET_ROWS);
        byte[] a = Files.readAllBytes(one);
        assertTrue(a.length > 20_000, "a workbook of some size: " + a.length + " bytes");
        assertArrayEquals(a, Files.readAllBytes(four));
    }
}
