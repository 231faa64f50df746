package org.axistack.trace;

import java.util.List;
import java.util.Map;

import org.axistack.field.BiasedField;
import org.axistack.field.SectorField;
import org.axistack.model.Particle;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;

/**
 * Exact rays in the three-dimensional field of a stack with split electrodes: the round field (its own charges,
 * potential and field by element sums, {@link BiasedField#evaluate}) plus every solved harmonic of the sector
 * biases ({@link SectorField#potential_V}, element sums; its gradient by central differences in x, y and z).
 * Relativistic equations of motion dp/dt = qE with z as the independent variable (rays travel toward +z):
 * with u = p/(m c), dx/dz = u_x/u_z, du_x/dz = (q/(m c^2)) E_x gamma/u_z, and the same for y and z (Jackson,
 * Classical Electrodynamics, 3rd ed., section 12.1, cited from memory); Hipparchus' Dormand-Prince 8(5,3).
 * Much slower than the round tracer (every field value is a sum over the mesh for each harmonic): meant for a
 * few rays. Immutable.
 */
public final class SteeredRays {

    /** Relative step of the central differences, times the narrowest bore. */
    static final double STEP = 4e-5;

    private final BiasedField round;
    private final SectorField sectors;
    private final Map<Integer, List<Double>> sectorBiases_V;
    private final Particle particle;
    private final double energyPerCharge_V;
    private final double h;
    private final double relTol;

    /**
     * @param round             the round field at the electrodes' mean biases
     * @param sectors           the solved harmonics of the split electrodes
     * @param sectorBiases_V    sector biases by electrode index (absent: that electrode's harmonics are off)
     * @param energyPerCharge_V kinetic energy per charge where the potential is 0 V, V
     * @param bore_m            the narrowest bore (sets the difference step)
     * @param relTol            relative tolerance of the integration
     */
    public SteeredRays(BiasedField round, SectorField sectors, Map<Integer, List<Double>> sectorBiases_V,
            Particle particle, double energyPerCharge_V, double bore_m, double relTol) {
        this.round = round;
        this.sectors = sectors;
        this.sectorBiases_V = Map.copyOf(sectorBiases_V);
        this.particle = particle;
        this.energyPerCharge_V = energyPerCharge_V;
        this.h = STEP * bore_m;
        this.relTol = relTol;
    }

    /** The same rays with other sector biases. */
    public SteeredRays withSectorBiases(Map<Integer, List<Double>> biases_V) {
        return new SteeredRays(round, sectors, biases_V, particle, energyPerCharge_V, h / STEP, relTol);
    }

    /** Potential at (x, y, z), V. */
    public double potential_V(double x, double y, double z) {
        return round.potential_V(z, Math.hypot(x, y)) + sectors.potential_V(x, y, z, sectorBiases_V);
    }

    /** Potential (returned) and E = -grad phi into e[0..2] (x, y, z), V and V/m. */
    double field(double x, double y, double z, double[] e) {
        double r = Math.hypot(x, y);
        double[] rz = new double[2];
        double phi = round.evaluate(z, r, rz);
        double ex = 0;
        double ey = 0;
        if (r > 0) {
            ex = rz[1] * x / r;
            ey = rz[1] * y / r;
        }
        double ez = rz[0];
        if (!sectorBiases_V.isEmpty()) {
            ex -= (sectors.potential_V(x + h, y, z, sectorBiases_V) - sectors.potential_V(x - h, y, z, sectorBiases_V)) / (2 * h);
            ey -= (sectors.potential_V(x, y + h, z, sectorBiases_V) - sectors.potential_V(x, y - h, z, sectorBiases_V)) / (2 * h);
            ez -= (sectors.potential_V(x, y, z + h, sectorBiases_V) - sectors.potential_V(x, y, z - h, sectorBiases_V)) / (2 * h);
            phi += sectors.potential_V(x, y, z, sectorBiases_V);
        }
        e[0] = ex;
        e[1] = ey;
        e[2] = ez;
        return phi;
    }

    /**
     * Traces one ray from z0 with offsets and slopes {x, y, x', y'} to the planes (ascending, after z0); returns
     * {x, y, x', y'} at each plane (m, rad), and in the last row the largest relative change of the total energy
     * met along the way.
     *
     * @throws IllegalStateException if the ray turns back (u_z reaches 0)
     */
    public double[][] trace(double z0_m, double[] start, double[] planes_m) {
        double rest = particle.restPotential_V();
        double q = particle.chargeSign() / rest;
        double phi0 = potential_V(start[0], start[1], z0_m);
        double kinetic = energyPerCharge_V - particle.chargeSign() * phi0;
        if (!(kinetic > 0)) {
            throw new IllegalStateException("the ray has no kinetic energy at its start");
        }
        double gamma = 1 + kinetic / rest;
        double u = Math.sqrt(gamma * gamma - 1);
        double norm = Math.sqrt(1 + start[2] * start[2] + start[3] * start[3]);
        double[] e = new double[3];
        OrdinaryDifferentialEquation ode = new OrdinaryDifferentialEquation() {
            @Override
            public int getDimension() {
                return 5;
            }

            @Override
            public double[] computeDerivatives(double z, double[] s) {
                double[] f = new double[3];
                field(s[0], s[1], z, f);
                double uz = s[4];
                if (!(uz > 0)) {
                    throw new IllegalStateException("the ray turns back at z = " + z + " m");
                }
                double g = Math.sqrt(1 + s[2] * s[2] + s[3] * s[3] + uz * uz);
                double k = q * g / uz;
                return new double[] {s[2] / uz, s[3] / uz, k * f[0], k * f[1], k * f[2]};
            }
        };
        double span = planes_m[planes_m.length - 1] - z0_m;
        double[] abs = {relTol * h, relTol * h, relTol * u * 1e-3, relTol * u * 1e-3, relTol * u};
        double[] rel = {relTol, relTol, relTol, relTol, relTol};
        DormandPrince853Integrator integ = new DormandPrince853Integrator(span * 1e-12, span / 20, abs, rel);
        double[] worst = {0};
        double total = energyPerCharge_V;
        integ.addStepHandler(interp -> {
            ODEStateAndDerivative st = interp.getCurrentState();
            double[] s = st.getPrimaryState();
            double g = Math.sqrt(1 + s[2] * s[2] + s[3] * s[3] + s[4] * s[4]);
            double phi = field(s[0], s[1], st.getTime(), e);
            double en = (g - 1) * rest + particle.chargeSign() * phi;
            worst[0] = Math.max(worst[0], Math.abs(en - total) / Math.abs(total));
        });
        ODEState state = new ODEState(z0_m, new double[] {start[0], start[1], u * start[2] / norm,
            u * start[3] / norm, u / norm});
        double[][] out = new double[planes_m.length + 1][];
        for (int p = 0; p < planes_m.length; p++) {
            if (planes_m[p] > state.getTime()) {
                ODEStateAndDerivative end = integ.integrate(ode, state, planes_m[p]);
                state = new ODEState(end.getTime(), end.getPrimaryState());
            }
            double[] s = state.getPrimaryState();
            out[p] = new double[] {s[0], s[1], s[2] / s[4], s[3] / s[4]};
        }
        out[planes_m.length] = new double[] {worst[0]};
        return out;
    }
}
