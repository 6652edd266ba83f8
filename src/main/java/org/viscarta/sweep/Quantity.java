package org.viscarta.sweep;

import java.util.Locale;

/**
 * The physical quantities a sweep table column can hold, with their canonical spelling as used in
 * Viscarta's own files (ISO 6721-1 definitions, see DOMAIN.md section 1).
 */
public enum Quantity {
    /** Cyclic frequency f, stored in Hz. */
    FREQUENCY("frequency", Dimension.FREQUENCY),
    /** Angular frequency ω = 2πf, stored in rad/s. */
    ANGULAR_FREQUENCY("angular_frequency", Dimension.ANGULAR_FREQUENCY),
    /** Storage modulus E′ (or G′), the in-phase part of the complex modulus, stored in Pa. */
    STORAGE_MODULUS("storage_modulus", Dimension.STRESS),
    /** Loss modulus E″ (or G″), the quadrature part of the complex modulus, stored in Pa. */
    LOSS_MODULUS("loss_modulus", Dimension.STRESS),
    /** Loss tangent tan δ = E″/E′, dimensionless. */
    LOSS_TANGENT("loss_tangent", Dimension.NONE),
    /** Magnitude of the complex modulus |E*| = sqrt(E′² + E″²), stored in Pa. */
    COMPLEX_MODULUS_MAGNITUDE("complex_modulus_magnitude", Dimension.STRESS),
    /** Storage compliance J′ (J* = J′ − iJ″ = 1/M*), stored in 1/Pa. */
    STORAGE_COMPLIANCE("storage_compliance", Dimension.COMPLIANCE),
    /** Loss compliance J″, stored in 1/Pa. */
    LOSS_COMPLIANCE("loss_compliance", Dimension.COMPLIANCE),
    /** Dynamic viscosity η′ = G″/ω (η* = η′ − iη″, ISO 6721-10), stored in Pa·s. */
    DYNAMIC_VISCOSITY("dynamic_viscosity", Dimension.VISCOSITY),
    /** Out-of-phase viscosity η″ = G′/ω, stored in Pa·s. */
    OUT_OF_PHASE_VISCOSITY("out_of_phase_viscosity", Dimension.VISCOSITY),
    /** |η*| = |G*|/ω, stored in Pa·s. */
    COMPLEX_VISCOSITY_MAGNITUDE("complex_viscosity_magnitude", Dimension.VISCOSITY),
    /** Phase angle δ = atan2(E″, E′), stored in rad. */
    PHASE_ANGLE("phase_angle", Dimension.ANGLE),
    /** Test temperature, stored in °C (a relative scale kept as users write it). */
    TEMPERATURE("temperature", Dimension.TEMPERATURE),
    /** Time since the step of a relaxation or creep test [s]. */
    TIME("time", Dimension.TIME),
    /** Relaxation modulus M(t) [Pa]. */
    RELAXATION_MODULUS("relaxation_modulus", Dimension.STRESS),
    /** Creep compliance J(t) [1/Pa]. */
    CREEP_COMPLIANCE("creep_compliance", Dimension.COMPLIANCE),
    /** Sample name in a tidy multi-sample table. */
    SAMPLE("sample", Dimension.LABEL),
    /** Replicate label in a tidy multi-sample table. */
    REPLICATE("replicate", Dimension.LABEL),
    /** Group (formulation, treatment) label in a tidy multi-sample table. */
    GROUP("group", Dimension.LABEL),
    /** Position on the sample, x, stored in m. */
    POSITION_X("x", Dimension.LENGTH),
    /** Position on the sample, y, stored in m. */
    POSITION_Y("y", Dimension.LENGTH),
    /** Strain amplitude of an amplitude sweep (or of a frequency sweep, when constant), stored as a fraction (1 % = 0.01). */
    STRAIN_AMPLITUDE("strain_amplitude", Dimension.NONE),
    /** Stress amplitude, stored in Pa. */
    STRESS_AMPLITUDE("stress_amplitude", Dimension.STRESS),
    /** Force amplitude of an indenter or DMA, stored in N. */
    FORCE_AMPLITUDE("force_amplitude", Dimension.FORCE),
    /** Displacement amplitude of an indenter or DMA, stored in m. */
    DISPLACEMENT_AMPLITUDE("displacement_amplitude", Dimension.LENGTH),
    /** A quality column written by {@code moduli} (name starting with {@code quality_}): kept in the file, not used. */
    QUALITY("quality", Dimension.LABEL),
    /** A descriptive column of a tidy table (composition, exposure ...): an attribute of each sample when constant over its sweeps. */
    ATTRIBUTE("attribute", Dimension.LABEL),
    /** A column the analysis does not need (point number, strain, torque, time, a redundant tan δ ...): read past, listed once. */
    UNUSED("not used", Dimension.LABEL);

    /** What kind of unit a quantity takes. */
    public enum Dimension { FREQUENCY, ANGULAR_FREQUENCY, STRESS, NONE, ANGLE, TEMPERATURE, LABEL, LENGTH, COMPLIANCE, VISCOSITY, FORCE, TIME }

    private final String canonical;
    private final Dimension dimension;

    Quantity(String canonical, Dimension dimension) {
        this.canonical = canonical;
        this.dimension = dimension;
    }

    /** The spelling used in Viscarta's own files, e.g. {@code storage_modulus}. */
    public String canonical() {
        return canonical;
    }

    public Dimension dimension() {
        return dimension;
    }

    /** True for text columns (sample, replicate, group). */
    public boolean isLabel() {
        return dimension == Dimension.LABEL;
    }

    @Override
    public String toString() {
        return canonical.toLowerCase(Locale.ROOT);
    }
}
