package org.axistack.model;

/**
 * Physical constants, CODATA 2018 recommended values (E. Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021)).
 * The one place in the project where these numbers live.
 */
public final class Codata2018 {
    /** Elementary charge, C (exact since the 2019 SI redefinition). */
    public static final double ELEMENTARY_CHARGE_C = 1.602176634e-19;
    /** Speed of light in vacuum, m/s (exact). */
    public static final double SPEED_OF_LIGHT_M_PER_S = 299_792_458.0;
    /** Planck constant, J s (exact since the 2019 SI redefinition). */
    public static final double PLANCK_J_S = 6.62607015e-34;
    /** Vacuum electric permittivity, F/m. */
    public static final double EPSILON0_F_PER_M = 8.8541878128e-12;
    /** Electron mass, kg. */
    public static final double ELECTRON_MASS_KG = 9.1093837015e-31;
    /** Proton mass, kg. */
    public static final double PROTON_MASS_KG = 1.67262192369e-27;
    /** Atomic mass constant (unified atomic mass unit), kg. */
    public static final double ATOMIC_MASS_UNIT_KG = 1.66053906660e-27;

    private Codata2018() {
    }
}
