package org.viscarta.realdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.viscarta.analysis.Analysis;
import org.viscarta.analysis.AnalysisRequest;
import org.viscarta.analysis.AnalysisResult;
import org.viscarta.analysis.SampleAnalysis;

/**
 * Real measured sweeps from ../shared/real-data (measured by others; read in place, never copied,
 * as its README asks; skipped where it is absent): Viscarta reads the exports with a column map and
 * gives answers that agree with what the sources say about the materials.
 */
@Tag("validation")
class RealDataTest {

    private static final Path CONDENSATES = Path.of("..", "shared", "real-data", "condensate-microrheology", "condensate_moduli_by_set.csv");

    @Test
    void condensatesReadAndDampAsTheirModuliSay() {
        assumeTrue(Files.exists(CONDENSATES), "../shared/real-data is not here");
        AnalysisResult c = Analysis.run(AnalysisRequest.builder(List.of(CONDENSATES)).columns(Map.of(
                "condensate", "sample", "set", "replicate", "angular_frequency_rad_s", "angular_frequency [rad/s]",
                "G_storage_Pa", "G' [Pa]", "G_loss_Pa", "G'' [Pa]"))
                .compute(AnalysisRequest.Part.FITS, AnalysisRequest.Part.RANKING).build());
        assertEquals(4, c.samples().size(), "four condensate materials (SOURCE.md)");
        // the first rows of the file: SL at 3.14 rad/s has G′ ≈ 10–11 Pa and G″ ≈ 32–34 Pa, a liquid (G″ > G′)
        Map<String, Double> tan = c.rankingRows().stream().filter(r -> r.tanDelta() != null)
                .collect(Collectors.toMap(r -> r.name(), r -> r.tanDelta().mean()));
        assertTrue(tan.get("SL") > 1, "SL is liquid-like at 1 Hz: tan δ = " + tan.get("SL"));
        for (SampleAnalysis sf : c.samples()) {
            assertTrue(sf.best().isPresent(), sf.sample().name() + ": some model converges");
        }
    }
}
