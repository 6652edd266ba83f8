package org.viscarta.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viscarta.io.InputException;
import org.viscarta.report.OutputTables;

/** Descriptive columns of a tidy table become sample attributes: in the Summary and Data tables, and usable as the group. */
@Tag("self-check")
class AttributesTest {

    @TempDir
    Path dir;

    private Path table() throws IOException {
        Path p = dir.resolve("gels.csv");
        Files.writeString(p, "sample,replicate,acrylamide (%),frequency [Hz],G' [Pa],G'' [Pa]\n"
                + "A,1,10,1,1000,100\nA,1,10,2,1100,110\nA,2,10,1,1010,101\nA,2,10,2,1110,111\n"
                + "B,1,15,1,2000,100\nB,1,15,2,2100,110\nB,2,15,1,2010,101\nB,2,15,2,2110,111\n");
        return p;
    }

    @Test
    void attributesReachTheTablesAndCanBeTheGroup() throws IOException {
        AnalysisResult r = Analysis.run(AnalysisRequest.builder(List.of(table())).groupBy("acrylamide (%)")
                .compute(AnalysisRequest.Part.RANKING).build());
        assertEquals(List.of("10", "15"), r.samples().stream().map(sa -> sa.sample().group()).toList());
        assertEquals("10", r.samples().get(0).sample().attributes().get("acrylamide (%)"));
        assertTrue(OutputTables.summary(r).csvHeader().contains("attribute_acrylamide"), OutputTables.summary(r).csvHeader().toString());
        assertTrue(OutputTables.data(r.samples()).csvHeader().contains("attribute_acrylamide"));
    }

    @Test
    void anUnknownGroupByColumnIsAnInputErrorNamingTheColumnsThereAre() throws IOException {
        InputException e = assertThrows(InputException.class, () -> Analysis.run(AnalysisRequest.builder(List.of(table()))
                .groupBy("exposure").compute(AnalysisRequest.Part.RANKING).build()));
        assertTrue(e.problem().contains("'acrylamide (%)'"), e.getMessage());
    }
}
