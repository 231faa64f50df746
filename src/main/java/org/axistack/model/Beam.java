package org.axistack.model;

import java.util.OptionalDouble;

/**
 * The beam a stack is planned for.
 *
 * @param particle   the species
 * @param energy_eV  kinetic energy where the potential is 0 V, eV, &gt; 0
 * @param startZ_m   where rays start, m (empty: the stack's left end, chosen by the optics)
 * @param objectZ_m  axial object point, m (empty: object at infinity, a parallel beam)
 * @param startRay   the central ray's offset and slope at the start ({@link StartRay#ON_AXIS}: on the axis)
 */
public record Beam(Particle particle, double energy_eV, OptionalDouble startZ_m, OptionalDouble objectZ_m,
        StartRay startRay) {

    public Beam {
        if (particle == null) {
            throw new IllegalArgumentException("beam particle is required");
        }
        if (!(energy_eV > 0) || !Double.isFinite(energy_eV)) {
            throw new IllegalArgumentException("beam energy must be positive and finite: " + energy_eV);
        }
        startZ_m = startZ_m == null ? OptionalDouble.empty() : startZ_m;
        objectZ_m = objectZ_m == null ? OptionalDouble.empty() : objectZ_m;
        startRay = startRay == null ? StartRay.ON_AXIS : startRay;
    }

    public Beam(Particle particle, double energy_eV, OptionalDouble startZ_m, OptionalDouble objectZ_m) {
        this(particle, energy_eV, startZ_m, objectZ_m, StartRay.ON_AXIS);
    }

    public Beam(Particle particle, double energy_eV) {
        this(particle, energy_eV, OptionalDouble.empty(), OptionalDouble.empty(), StartRay.ON_AXIS);
    }

    /** Kinetic energy at 0 V divided by |q|, V: the acceleration potential where phi = 0. */
    public double energyPerCharge_V() {
        return particle.energyPerCharge_V(energy_eV);
    }

    public Beam withEnergy_eV(double newEnergy_eV) {
        return new Beam(particle, newEnergy_eV, startZ_m, objectZ_m, startRay);
    }

    public Beam withParticle(Particle newParticle) {
        return new Beam(newParticle, energy_eV, startZ_m, objectZ_m, startRay);
    }

    public Beam withObjectZ_m(OptionalDouble newObjectZ_m) {
        return new Beam(particle, energy_eV, startZ_m, newObjectZ_m, startRay);
    }

    public Beam withStartRay(StartRay newStartRay) {
        return new Beam(particle, energy_eV, startZ_m, objectZ_m, newStartRay);
    }
}
