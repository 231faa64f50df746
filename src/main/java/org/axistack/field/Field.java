package org.axistack.field;

/**
 * An axially symmetric electrostatic field that can be evaluated anywhere. SI units: metres, volts,
 * volts per metre. Implementations are immutable and safe to call from many threads.
 */
public interface Field {

    /** Electric potential at (z, r), V (by default from {@link #evaluate}, discarding the field). */
    default double potential_V(double z_m, double r_m) {
        return evaluate(z_m, r_m, new double[2]);
    }

    /**
     * Potential and field at (z, r).
     *
     * @param fieldOut receives E_z in [0] and E_r in [1], V/m (E = -grad phi)
     * @return the potential, V
     */
    double evaluate(double z_m, double r_m, double[] fieldOut);
}
