package org.viscarta.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.apache.poi.ss.usermodel.Sheet;
import org.apache.poi.ss.usermodel.Workbook;
import org.apache.poi.ss.usermodel.WorkbookFactory;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viscarta.analysis.Analysis;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.AnalysisResult;

/**
 * A table longer than a sheet holds (1,048,576 rows in the format; here a limit of 100 stands in for
 * it) is cut so that its header, rows, note and footer fit, its last row says how many rows are not
 * shown, and the writer returns one line per cut table in the workbook's order. Before, a campaign's
 * rows past the format's limit were written as rows the format does not allow, and the report then
 * failed on the footer's row (a 53,000-sweep campaign's Spectra sheet at row 1,855,000).
 */
@Tag("regression")
class SheetRowsTest {

    @TempDir
    Path dir;

    @Test
    void aTableLongerThanASheetIsCutWithANoteAndEverythingElseStays() throws IOException {
        // 30 invented samples of 12 frequencies: 360 data rows; springpot (2 parameters) and zener (3): 150 fit rows
        StringBuilder sb = new StringBuilder("# invented test data\n# modulus: tensile\n"
                + "sample,frequency [Hz],storage_modulus [Pa],loss_modulus [Pa]\n");
        for (int k = 1; k <= 30; k++) {
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

        Path whole = dir.resolve("whole.xlsx");
        assertEquals(List.of(), WorkbookReport.write(c, List::of, whole, 2, WorkbookReport.SHEET_ROWS));
        Path cut = dir.resolve("cut.xlsx");
        List<String> notes = WorkbookReport.write(c, List::of, cut, 2, 100);

        // the header, 98 rows and the note: 100 rows (no footer on these tables); the spectra's footer of 31 lines
        // (a blank row first) leaves 67; 30 samples' spectra of 35 relaxation times each
        assertEquals(List.of("Model fits: the first 98 of 150 rows (a sheet holds at most 100)",
                "Derived quantities: the first 98 of 180 rows (a sheet holds at most 100)",
                "Spectra: the first 67 of 1,050 rows (a sheet holds at most 100)",
                "Data: the first 98 of 360 rows (a sheet holds at most 100)"), notes);
        try (Workbook a = WorkbookFactory.create(whole.toFile(), null, true);
             Workbook b = WorkbookFactory.create(cut.toFile(), null, true)) {
            Sheet data = b.getSheet("Data");
            assertEquals(99, data.getLastRowNum());
            assertEquals("Not shown: the table's last 262 rows (a sheet holds at most 100). Whole tables: the command line's CSV "
                    + "outputs (-o); the data: the input files.", data.getRow(99).getCell(0).getStringCellValue());
            Sheet fits = b.getSheet("Model fits");
            assertEquals(99, fits.getLastRowNum());
            assertTrue(fits.getRow(99).getCell(0).getStringCellValue().startsWith("Not shown: the table's last 52 rows "));
            // the rows shown are the whole table's first rows
            Sheet wholeData = a.getSheet("Data");
            assertEquals(360, wholeData.getLastRowNum());
            for (int row = 0; row < 99; row++) {
                assertEquals(wholeData.getRow(row).getCell(0).toString(), data.getRow(row).getCell(0).toString(), "row " + row);
                assertEquals(wholeData.getRow(row).getCell(1).toString(), data.getRow(row).getCell(1).toString(), "row " + row);
            }
            // a table with a footer keeps it inside the sheet; a table that fits is as before
            Sheet spectra = b.getSheet("Spectra");
            assertTrue(spectra.getLastRowNum() <= 99, "spectra to row " + spectra.getLastRowNum());
            String lastWhole = a.getSheet("Spectra").getRow(a.getSheet("Spectra").getLastRowNum()).getCell(0).getStringCellValue();
            assertEquals(lastWhole, spectra.getRow(spectra.getLastRowNum()).getCell(0).getStringCellValue(), "the footer's last line");
            assertEquals(a.getSheet("Summary").getLastRowNum(), b.getSheet("Summary").getLastRowNum());
            assertEquals(30, b.getSheet("Summary").getLastRowNum());
        }
    }
}
