package org.viscarta.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.viscarta.model.Zener;
import org.viscarta.sweep.SweepPoint;

/**
 * Validation: a zener fit on log residuals against SciPy 1.17.1's least_squares(method="lm") on
 * the same data, residuals and parameterisation (src/test/resources/bench/scipy_zener_fit.py;
 * fixture scipy/zener-sweep.csv, SciPy's output scipy/zener-sweep.out). DOMAIN.md asks for 1e-4
 * relative on parameters; both optimisers converge to the same minimum, so this holds 1e-6.
 */
@Tag("validation")
class ScipyCrossCheckTest {

    private static final double SCIPY_TOLERANCE = 1e-6;

    private static List<String> lines(String resource) throws IOException {
        try (InputStream in = ScipyCrossCheckTest.class.getResourceAsStream(resource)) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8).lines().toList();
        }
    }

    private static double value(List<String> out, String key) {
        return out.stream().filter(l -> l.startsWith(key + " ")).map(l -> Double.parseDouble(l.substring(key.length() + 1)))
                .findFirst().orElseThrow();
    }

    @Test
    void zenerFitAgreesWithScipyLeastSquares() throws IOException {
        List<SweepPoint> pts = new ArrayList<>();
        for (String l : lines("/scipy/zener-sweep.csv").subList(1, 21)) {
            String[] f = l.split(",");
            pts.add(new SweepPoint(Double.parseDouble(f[0]), Double.parseDouble(f[1]), Double.parseDouble(f[2]), 0));
        }
        List<String> scipy = lines("/scipy/zener-sweep.out");
        FitResult r = new ModelFitter().fit("s", new Zener(), pts);
        assertTrue(r.converged(), r.message());
        for (String name : List.of("E_r", "E_1", "tau")) {
            double expected = value(scipy, name);
            assertEquals(expected, r.parameter(name).orElseThrow().value(), SCIPY_TOLERANCE * expected, name);
        }
        assertEquals(value(scipy, "rss"), r.rss(), SCIPY_TOLERANCE * value(scipy, "rss"));
    }
}
