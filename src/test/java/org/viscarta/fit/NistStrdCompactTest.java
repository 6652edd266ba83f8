package org.viscarta.fit;

import org.junit.jupiter.api.Tag;

/**
 * Validation: the same NIST StRD checks (datasets, both start points, certified values and
 * tolerances of DOMAIN.md) run on the compact Levenberg–Marquardt solver that model fits use.
 */
@Tag("validation")
class NistStrdCompactTest extends NistStrdTest {

    @Override
    LeastSquaresEngine engine() {
        return new LeastSquaresEngine(LeastSquaresEngine.Settings.defaults().withMethod(LeastSquaresEngine.Method.COMPACT));
    }
}

