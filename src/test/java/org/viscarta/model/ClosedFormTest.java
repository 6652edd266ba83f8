package org.viscarta.model;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.math.BigDecimal;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * Validation: the four models' M′ and M″ against the check values of DOMAIN.md section 10.2 (computed
 * there with mpmath at ≥ 30 digits, reproducible with shared/domain-checks.py) and against an
 * independent evaluation of each E*(ω) in complex arithmetic (Commons Math {@link Complex}).
 *
 * <p>Tolerance: DOMAIN.md asks for 1e-9 relative on closed forms; its tables print 9–10 significant
 * digits, so each value is held to half a unit in its last printed digit or 1e-9 relative,
 * whichever is larger. The complex-arithmetic cross-check is held to 1e-12 relative.
 */
@Tag("validation")
class ClosedFormTest {

    private static final double CLOSED_FORM_TOLERANCE = 1e-9;
    private static final double COMPLEX_CROSS_CHECK_TOLERANCE = 1e-12;

    /** Asserts {@code actual} equals a value printed in DOMAIN.md as {@code printed}. */
    private static void assertPrinted(String printed, double actual, String what) {
        BigDecimal bd = new BigDecimal(printed);
        double expected = bd.doubleValue();
        double lastDigit = 0.5 * Math.pow(10, -bd.scale());
        double tol = Math.max(lastDigit, CLOSED_FORM_TOLERANCE * Math.abs(expected));
        assertEquals(expected, actual, tol, what);
    }

    private static double[] eval(ViscoelasticModel m, double omega, double... p) {
        double[] out = new double[2];
        m.modulus(omega, p, out);
        return out;
    }

    private static void check(ViscoelasticModel m, double[] p, double omega, String storage, String loss) {
        double[] v = eval(m, omega, p);
        assertPrinted(storage, v[0], m.id() + " M′ at ω = " + omega);
        assertPrinted(loss, v[1], m.id() + " M″ at ω = " + omega);
    }

    @Test
    void maxwellMatchesDomainTable() {
        // DOMAIN.md 10.2: Maxwell E = 1000 Pa, τ = 1 s
        Maxwell m = new Maxwell();
        double[] p = {1000, 1};
        check(m, p, 0.1, "9.900990099", "99.00990099");
        check(m, p, 1, "500", "500");
        check(m, p, 10, "990.0990099", "99.00990099");
    }

    @Test
    void kelvinVoigtMatchesDomainTable() {
        // DOMAIN.md 10.2: Kelvin–Voigt E = 1000 Pa, η = 100 Pa·s
        KelvinVoigt m = new KelvinVoigt();
        double[] p = {1000, 100};
        check(m, p, 0.1, "1000", "10");
        check(m, p, 1, "1000", "100");
        check(m, p, 10, "1000", "1000");
    }

    @Test
    void zenerMatchesDomainTable() {
        // DOMAIN.md 10.2: SLS E_e = 1000, E_1 = 2000, τ = 1 s
        Zener m = new Zener();
        double[] p = {1000, 2000, 1};
        check(m, p, 0.1, "1019.80198", "198.019802");
        check(m, p, 1, "2000", "1000");
        check(m, p, 10, "2980.19802", "198.019802");
    }

    @Test
    void zenerEqualsKelvinFormOfTheStandardLinearSolid() {
        // DOMAIN.md 2.1 and 10.2: the same SLS in Poynting–Thomson form, E_a = 3000, E_b = 1500, η_b = 4500:
        // E* = E_a (E_b + iωη_b)/(E_a + E_b + iωη_b), evaluated here in complex arithmetic.
        Zener m = new Zener();
        for (double w : new double[] {0.01, 0.1, 1, 10, 100}) {
            Complex num = new Complex(1500, w * 4500).multiply(3000);
            Complex e = num.divide(new Complex(3000 + 1500, w * 4500));
            double[] v = eval(m, w, 1000, 2000, 1);
            assertEquals(e.getReal(), v[0], COMPLEX_CROSS_CHECK_TOLERANCE * e.abs(), "E′ at ω = " + w);
            assertEquals(e.getImaginary(), v[1], COMPLEX_CROSS_CHECK_TOLERANCE * e.abs(), "E″ at ω = " + w);
        }
    }

    @Test
    void zenerLossPeakMatchesDomain() {
        // DOMAIN.md 10.2: SLS loss peak at x* = 0.5773502692 with tan δ_max = 0.5773502692
        double[] v = eval(new Zener(), 0.5773502692, 1000, 2000, 1);
        assertPrinted("0.5773502692", v[1] / v[0], "tan δ_max");
    }

    @Test
    void springpotMatchesDomainTable() {
        // DOMAIN.md 10.2: springpot c = 1000 Pa·s^α, α = 0.5 and α = 0.2
        Springpot m = new Springpot();
        check(m, new double[] {1000, 0.5}, 0.1, "223.6067977", "223.6067977");
        check(m, new double[] {1000, 0.5}, 1, "707.1067812", "707.1067812");
        check(m, new double[] {1000, 0.5}, 10, "2236.067977", "2236.067977");
        check(m, new double[] {1000, 0.2}, 0.1, "600.076094", "194.9765422");
        check(m, new double[] {1000, 0.2}, 1, "951.0565163", "309.0169944");
        check(m, new double[] {1000, 0.2}, 10, "1507.322998", "489.7589307");
    }

    @Test
    void springpotLossTangentIsTanAlphaPiOverTwoAtEveryFrequency() {
        // DOMAIN.md 2.2: tan δ = tan(απ/2), independent of frequency; 10.2 gives 0.3249196962 for α = 0.2
        Springpot m = new Springpot();
        for (double alpha : new double[] {0.05, 0.2, 0.5, 0.8, 0.95}) {
            for (double w : new double[] {1e-3, 0.1, 1, 10, 1e4}) {
                double[] v = eval(m, w, 1234.5, alpha);
                assertEquals(Math.tan(alpha * Math.PI / 2), v[1] / v[0], 1e-12, "α = " + alpha + ", ω = " + w);
            }
        }
        double[] v = eval(m, 3.7, 1000, 0.2);
        assertPrinted("0.3249196962", v[1] / v[0], "tan δ at α = 0.2");
    }

    @Test
    void everyModelAgreesWithComplexArithmetic() {
        // Independent evaluation of each E*(ω) as written in DOMAIN.md's model table, with Complex.pow etc.
        Complex i = Complex.I;
        for (double w : new double[] {0.003, 0.1, 1, 7, 300}) {
            Complex iw = i.multiply(w);
            assertComplex(iw.pow(0.37).multiply(850), eval(new Springpot(), w, 850, 0.37), "springpot", w);
            Complex x = iw.multiply(0.4);
            assertComplex(x.multiply(2500).divide(x.add(1)), eval(new Maxwell(), w, 2500, 0.4), "maxwell", w);
            assertComplex(new Complex(2500, 0).add(iw.multiply(33)), eval(new KelvinVoigt(), w, 2500, 33), "kelvin-voigt", w);
            assertComplex(x.multiply(900).divide(x.add(1)).add(400), eval(new Zener(), w, 400, 900, 0.4), "zener", w);
        }
    }

    private static void assertComplex(Complex expected, double[] actual, String model, double w) {
        double tol = COMPLEX_CROSS_CHECK_TOLERANCE * expected.abs();
        assertEquals(expected.getReal(), actual[0], tol, model + " M′ at ω = " + w);
        assertEquals(expected.getImaginary(), actual[1], tol, model + " M″ at ω = " + w);
    }

    @Test
    void burgersMatchesDomainTable() {
        // DOMAIN.md 10.2: Burgers E_1 = 1000, η_1 = 1000, E_2 = 500, η_2 = 50
        Burgers m = new Burgers();
        double[] p = {1000, 1000, 500, 50};
        check(m, p, 0.1, "27.42068602", "91.59117851");
        check(m, p, 1, "288.8675624", "116.1228407");
        check(m, p, 10, "383.8771593", "211.1324376");
    }

    @Test
    void fractionalModelsMatchDomainTable() {
        // DOMAIN.md 10.2: fractional KV E = 1000, c = 500, α = 0.3
        FractionalKelvinVoigt fkv = new FractionalKelvinVoigt();
        check(fkv, new double[] {1000, 500, 0.3}, 0.1, "1223.280548", "113.7671213");
        check(fkv, new double[] {1000, 500, 0.3}, 1, "1445.503262", "226.9952499");
        check(fkv, new double[] {1000, 500, 0.3}, 10, "1888.89587", "452.9150677");
        // fractional Maxwell E = 1000, τ = 1, α = 0.5
        FractionalMaxwell fm = new FractionalMaxwell();
        check(fm, new double[] {1000, 1, 0.5}, 0.1, "209.1545723", "144.522255");
        check(fm, new double[] {1000, 1, 0.5}, 1, "500", "207.1067812");
        check(fm, new double[] {1000, 1, 0.5}, 10, "790.8454277", "144.522255");
        // fractional Zener E_e = 1000, E_1 = 2000, τ = 1, α = 0.5
        FractionalZener fz = new FractionalZener();
        check(fz, new double[] {1000, 2000, 1, 0.5}, 0.1, "1418.309145", "289.04451");
        check(fz, new double[] {1000, 2000, 1, 0.5}, 1, "2000", "414.2135624");
        check(fz, new double[] {1000, 2000, 1, 0.5}, 10, "2581.690855", "289.04451");
    }

    @Test
    void generalizedMaxwellMatchesDomainTable() {
        // DOMAIN.md 10.2: E_e = 100, (E_i, τ_i) = (1000, 0.1 s), (500, 10 s); order E_inf, E_1, E_2, tau_1, tau_2
        GeneralizedMaxwell m = new GeneralizedMaxwell(2);
        double[] p = {100, 1000, 500, 0.1, 10};
        check(m, p, 0.01, "104.951495", "50.504949");
        check(m, p, 0.1, "350.09999", "259.999000");
        check(m, p, 1, "604.950495", "148.514851");
        check(m, p, 10, "1099.950005", "504.999500");
    }

    @Test
    void springpotDashpotMatchesThePowerLawWithNewtonianTerm() {
        // DOMAIN.md 10.2, power law + Newtonian: G_0 = 1000, α = 0.2, Φ_0 = 1 rad/s, μ = 1 Pa·s, which is a
        // springpot with c = G_0 Γ(1 − α) Φ_0^{−α} = 1164.229714 (DOMAIN.md 10.3) plus a dashpot η = μ.
        SpringpotDashpot m = new SpringpotDashpot();
        double[] p = {1000 * org.apache.commons.math3.special.Gamma.gamma(0.8), 0.2, 1};
        check(m, p, 0.1, "698.6264191", "227.0974839");
        check(m, p, 1, "1107.248256", "360.7667669");
        check(m, p, 10, "1754.870223", "580.1918997");
    }

    @Test
    void relaxationModuliMatchDomainTable() {
        // DOMAIN.md 10.3 (closed forms checked there against Talbot inversion with mpmath)
        double[] burgers = {1000, 1000, 500, 50};
        assertPrinted("819.0097895", new Burgers().relaxationModulus(0.01, burgers), "Burgers E(0.01)");
        assertPrinted("340.2501494", new Burgers().relaxationModulus(0.1, burgers), "Burgers E(0.1)");
        assertPrinted("230.0869085", new Burgers().relaxationModulus(1, burgers), "Burgers E(1)");
        assertPrinted("62.45340275", new Burgers().relaxationModulus(5, burgers), "Burgers E(5)");
        double[] sls = {1000, 2000, 1};
        assertPrinted("2213.061319", new Zener().relaxationModulus(0.5, sls), "SLS E(0.5)");
        assertPrinted("1735.758882", new Zener().relaxationModulus(1, sls), "SLS E(1)");
        assertPrinted("1270.670566", new Zener().relaxationModulus(2, sls), "SLS E(2)");
        double[] fm = {1000, 1, 0.5};
        assertEquals(896.45698, new FractionalMaxwell().relaxationModulus(0.01, fm), 1e-6 * 896.45698);
        assertEquals(723.5784385, new FractionalMaxwell().relaxationModulus(0.1, fm), 1e-6 * 723.5784385);
        assertEquals(427.5835762, new FractionalMaxwell().relaxationModulus(1, fm), 1e-6 * 427.5835762);
        assertEquals(170.5777183, new FractionalMaxwell().relaxationModulus(10, fm), 1e-6 * 170.5777183);
        assertPrinted("1784.124116", new Springpot().relaxationModulus(0.1, new double[] {1000, 0.5}), "springpot E(0.1)");
        assertPrinted("564.1895835", new Springpot().relaxationModulus(1, new double[] {1000, 0.5}), "springpot E(1)");
        double[] gm = {100, 1000, 500, 0.1, 10};
        assertPrinted("962.904358", new GeneralizedMaxwell(2).relaxationModulus(0.1, gm), "GM E(0.1)");
        assertPrinted("552.464109", new GeneralizedMaxwell(2).relaxationModulus(1, gm), "GM E(1)");
        assertPrinted("283.939721", new GeneralizedMaxwell(2).relaxationModulus(10, gm), "GM E(10)");
    }

    @Test
    void creepComplianceMatchesDomainTable() {
        // DOMAIN.md 10.3: fractional KV creep J(t), E = 1000, c = 500, α = 0.3 [1/Pa]; numerical (Mittag-Leffler), 1e-6
        double[] p = {1000, 500, 0.3};
        assertEquals(5.440167587e-4, new FractionalKelvinVoigt().creepCompliance(0.1, p), 1e-6 * 5.44e-4);
        assertEquals(7.097677738e-4, new FractionalKelvinVoigt().creepCompliance(1, p), 1e-6 * 7.1e-4);
        assertEquals(8.331594383e-4, new FractionalKelvinVoigt().creepCompliance(10, p), 1e-6 * 8.33e-4);
    }

    @Test
    void closedFormTimeFunctionsAgreeWithNumericalLaplaceInversion() {
        // Every closed-form M(t) and J(t) against Talbot inversion of M*(s)/s and 1/(s M*(s)) (the route
        // DOMAIN.md used to verify its closed forms), at 1e-6 relative (DOMAIN.md: numerically evaluated), plus
        // 1e-12 of the function's early value: Talbot's error is absolute in double precision, which matters
        // only where M(t) has decayed by many orders (Maxwell at t = 20τ).
        java.util.Map<ViscoelasticModel, double[]> cases = new java.util.LinkedHashMap<>();
        cases.put(new Springpot(), new double[] {1000, 0.4});
        cases.put(new SpringpotDashpot(), new double[] {1000, 0.3, 20});
        cases.put(new Maxwell(), new double[] {1000, 0.5});
        cases.put(new KelvinVoigt(), new double[] {1000, 100});
        cases.put(new Zener(), new double[] {1000, 2000, 0.7});
        cases.put(new Burgers(), new double[] {1000, 1000, 500, 50});
        cases.put(new GeneralizedMaxwell(2), new double[] {100, 1000, 500, 0.1, 10});
        cases.put(new FractionalKelvinVoigt(), new double[] {1000, 500, 0.3});
        cases.put(new FractionalMaxwell(), new double[] {1000, 1, 0.5});
        cases.put(new FractionalZener(), new double[] {1000, 2000, 1, 0.6});
        for (java.util.Map.Entry<ViscoelasticModel, double[]> e : cases.entrySet()) {
            ViscoelasticModel m = e.getKey();
            double[] p = e.getValue();
            double early = Math.abs(LaplaceInversion.invert(s -> m.modulusAt(s, p).divide(s), 0.01));
            for (double t : new double[] {0.01, 0.1, 1, 10}) {
                double relax = LaplaceInversion.invert(s -> m.modulusAt(s, p).divide(s), t);
                double creep = LaplaceInversion.invert(s -> m.modulusAt(s, p).multiply(s).reciprocal(), t);
                if (!(m instanceof KelvinVoigt) && !(m instanceof SpringpotDashpot)) {
                    // (their M(t) holds a Dirac term at t = 0 that the closed form leaves out; inversion sees only t > 0 too)
                    assertEquals(relax, m.relaxationModulus(t, p), 1e-6 * Math.abs(relax) + 1e-12 * early, m.id() + " M(" + t + ")");
                }
                assertEquals(creep, m.creepCompliance(t, p), 1e-6 * Math.abs(creep), m.id() + " J(" + t + ")");
            }
        }
    }
}
