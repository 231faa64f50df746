package org.axistack.model;

import static org.axistack.model.Codata2018.ATOMIC_MASS_UNIT_KG;
import static org.axistack.model.Codata2018.ELECTRON_MASS_KG;
import static org.axistack.model.Codata2018.ELEMENTARY_CHARGE_C;
import static org.axistack.model.Codata2018.PROTON_MASS_KG;
import static org.axistack.model.Codata2018.SPEED_OF_LIGHT_M_PER_S;

/**
 * A charged particle species: rest mass and signed charge, SI units.
 *
 * @param label    short human-readable name ("electron", "proton", "ion 39.962 u, +1")
 * @param mass_kg  rest mass, kg, &gt; 0
 * @param charge_C signed charge, C, non-zero
 */
public record Particle(String label, double mass_kg, double charge_C) {

    public Particle {
        if (label == null || label.isBlank()) {
            throw new IllegalArgumentException("particle label must not be blank");
        }
        if (!(mass_kg > 0) || !Double.isFinite(mass_kg)) {
            throw new IllegalArgumentException("particle mass must be positive and finite: " + mass_kg);
        }
        if (charge_C == 0 || !Double.isFinite(charge_C)) {
            throw new IllegalArgumentException("particle charge must be non-zero and finite: " + charge_C);
        }
    }

    public static Particle electron() {
        return new Particle("electron", ELECTRON_MASS_KG, -ELEMENTARY_CHARGE_C);
    }

    public static Particle proton() {
        return new Particle("proton", PROTON_MASS_KG, ELEMENTARY_CHARGE_C);
    }

    /**
     * An ion of the given mass and charge state. The mass is the ion's mass as entered (the user
     * decides whether the missing or extra electrons are included).
     */
    public static Particle ion(double mass_u, int chargeState) {
        if (chargeState == 0) {
            throw new IllegalArgumentException("ion charge state must be non-zero");
        }
        String label = String.format(java.util.Locale.ROOT, "ion %.4g u, %+d", mass_u, chargeState);
        return new Particle(label, mass_u * ATOMIC_MASS_UNIT_KG, chargeState * ELEMENTARY_CHARGE_C);
    }

    /** |q|, C. */
    public double absCharge_C() {
        return Math.abs(charge_C);
    }

    /** Sign of the charge, +1 or -1. */
    public int chargeSign() {
        return charge_C > 0 ? 1 : -1;
    }

    /** Rest energy divided by |q|: m c^2 / |q|, in volts (about 511 kV for an electron). */
    public double restPotential_V() {
        return mass_kg * SPEED_OF_LIGHT_M_PER_S * SPEED_OF_LIGHT_M_PER_S / absCharge_C();
    }

    /**
     * Kinetic energy per charge, V: an energy in eV divided by the charge state (T/|q|). The one place where
     * electron-volts become volts of potential for this particle; {@link #energy_eV} is the inverse.
     */
    public double energyPerCharge_V(double energy_eV) {
        return energy_eV * ELEMENTARY_CHARGE_C / absCharge_C();
    }

    /** Kinetic energy in eV of a kinetic energy per charge in volts (the inverse of {@link #energyPerCharge_V}). */
    public double energy_eV(double energyPerCharge_V) {
        return energyPerCharge_V * absCharge_C() / ELEMENTARY_CHARGE_C;
    }

    /** Charge state in units of e (rounded), signed. */
    public int chargeNumber() {
        return (int) Math.round(charge_C / ELEMENTARY_CHARGE_C);
    }
}
