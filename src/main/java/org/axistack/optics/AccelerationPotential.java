package org.axistack.optics;

import org.axistack.model.Relativity;

import org.axistack.field.AxialField;
import org.axistack.model.Beam;

/**
 * The acceleration potential along the axis seen by one particle species: U(z) = T(z)/|q| =
 * T0/|q| - sign(q) V(z), its z-derivatives, and the relativistic forms U* = U (1 + U/(2 Vr)) and
 * g = d(U*)/dU = 1 + U/Vr with Vr = m c^2/|q| (physics brief, "Conventions"). Everything the optics
 * needs is expressed through U, so electrons and ions share one code path. SI units. Immutable.
 *
 * <p>Method: direct evaluation of the field's axial derivatives; relativistic acceleration potential as in
 * P. W. Hawkes and E. Kasper, Principles of Electron Optics, vol. 1, ch. 2 (the "relativistically
 * corrected potential").
 */
public final class AccelerationPotential {

    private final AxialField field;
    private final double u0_V;
    private final double sign;
    private final double restPotential_V;

    /**
     * @param field axial potential of the lens (potential 0 V at infinity)
     * @param beam  particle and kinetic energy where the potential is 0 V
     */
    public AccelerationPotential(AxialField field, Beam beam) {
        this(field, beam.energyPerCharge_V(), beam.particle().chargeSign(), beam.particle().restPotential_V());
    }

    AccelerationPotential(AxialField field, double u0_V, double sign, double restPotential_V) {
        if (field == null) {
            throw new IllegalArgumentException("axial field is required");
        }
        this.field = field;
        this.u0_V = u0_V;
        this.sign = sign;
        this.restPotential_V = restPotential_V;
    }

    /** The same field and particle with every acceleration potential raised by dU_V (an energy change dT = |q| dU). */
    public AccelerationPotential shifted(double dU_V) {
        return new AccelerationPotential(field, u0_V + dU_V, sign, restPotential_V);
    }

    /** The same particle treated without the relativistic correction (rest potential taken as infinite). */
    public AccelerationPotential nonRelativistic() {
        return new AccelerationPotential(field, u0_V, sign, Double.POSITIVE_INFINITY);
    }

    /** Rest potential m c^2 / |q|, V (infinite when non-relativistic). */
    public double restPotential_V() {
        return restPotential_V;
    }

    /** Acceleration potential where the field potential is 0 V, V. */
    public double u0_V() {
        return u0_V;
    }

    /** +1 for positive charges, -1 for negative. */
    public double chargeSign() {
        return sign;
    }

    public AxialField field() {
        return field;
    }

    /**
     * U and its derivatives at z: out[k] = d^k U/dz^k for k = 0..order.
     *
     * @param out array of length at least order + 1
     */
    public void derivatives(double z_m, int order, double[] out) {
        field.axial(z_m, order, out);
        out[0] = u0_V - sign * out[0];
        for (int k = 1; k <= order; k++) {
            out[k] = -sign * out[k];
        }
    }

    /** U(z), V. */
    public double u_V(double z_m) {
        return u0_V - sign * field.axialPotential_V(z_m);
    }

    /** Relativistic acceleration potential U* = U (1 + U/(2 Vr)), V. */
    public double uStar(double u_V) {
        return Relativity.relativisticPotential_V(u_V, restPotential_V);
    }

    /** g = d(U*)/dU = 1 + U/Vr. */
    public double g(double u_V) {
        return Relativity.gamma(u_V, restPotential_V);
    }
}
