package org.viscarta.temperature;

/**
 * The temperature laws of horizontal shift factors (DOMAIN.md section 6), log10 a_T with a_T &gt; 1
 * below the reference temperature.
 */
public final class ShiftLaws {

    /** Molar gas constant R [J mol⁻¹ K⁻¹] (CODATA 2018, exact since the 2019 SI redefinition). */
    public static final double GAS_CONSTANT = 8.314462618;
    /** 0 °C in kelvin. */
    public static final double KELVIN_OFFSET = 273.15;

    private ShiftLaws() {
    }

    /**
     * WLF: log10 a_T = −C1 (T − T0)/(C2 + T − T0) (Williams, Landel &amp; Ferry 1955, "The temperature
     * dependence of relaxation mechanisms in amorphous polymers and other glass-forming liquids",
     * J. Am. Chem. Soc. 77:3701–3707; form as in IUPAC 2013, Pure Appl. Chem. 85:1017).
     *
     * @param c1 C1 [–] at T0
     * @param c2 C2 [K] at T0
     * @param deltaT T − T0 [K]
     */
    public static double wlf(double c1, double c2, double deltaT) {
        return -c1 * deltaT / (c2 + deltaT);
    }

    /**
     * Arrhenius: log10 a_T = (E_a/(R ln 10)) (1/T − 1/T0), temperatures in kelvin.
     *
     * @param eaJoulePerMol apparent activation energy [J/mol]
     */
    public static double arrhenius(double eaJoulePerMol, double tKelvin, double t0Kelvin) {
        return eaJoulePerMol / (GAS_CONSTANT * Math.log(10)) * (1 / tKelvin - 1 / t0Kelvin);
    }

    /**
     * WLF constants referred to another temperature (exact; DOMAIN.md section 6):
     * C1′ = C1 C2/(C2 + T1 − T0), C2′ = C2 + T1 − T0.
     *
     * @return {C1′, C2′}
     */
    public static double[] rereference(double c1, double c2, double newMinusOld) {
        return new double[] {c1 * c2 / (c2 + newMinusOld), c2 + newMinusOld};
    }
}
