package org.axistack.trace;

import org.axistack.model.PhysicsMessage;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import org.axistack.model.Particle;

/**
 * A set of rays of one particle species, numbered 1..N, with a short description for reports.
 * Immutable; variations by {@link #withEnergyOffsets} and {@link #withGaussianEnergy}.
 *
 * @param particle    the species
 * @param rays        the rays (at least one)
 * @param description what the set is, in words
 */
public record RaySet(Particle particle, List<RayStart> rays, String description) {

    public RaySet {
        if (particle == null) {
            throw new IllegalArgumentException("a ray set needs a particle");
        }
        rays = List.copyOf(rays);
        if (rays.isEmpty()) {
            throw new IllegalArgumentException("the ray set is empty: ask for at least one ray");
        }
        description = description == null ? "" : description;
    }

    public int size() {
        return rays.size();
    }

    /**
     * Every ray repeated once per energy offset (eV, added to its energy), renumbered 1..N. Offsets
     * that leave a ray without energy are refused.
     */
    public RaySet withEnergyOffsets(List<Double> offsets_eV) {
        if (offsets_eV.isEmpty()) {
            throw PhysicsMessage.ENERGY_OFFSETS_EMPTY.exception();
        }
        List<RayStart> out = new ArrayList<>();
        int id = 1;
        for (double d : offsets_eV) {
            if (!Double.isFinite(d)) {
                throw PhysicsMessage.ENERGY_OFFSET_NOT_FINITE.exception("offset", d);
            }
            for (RayStart r : rays) {
                double e = r.energy_eV() + d;
                if (!(e > 0)) {
                    throw PhysicsMessage.ENERGY_OFFSET_TOO_LOW.exception("offset", d, "ray", r.id(), "energy", r.energy_eV());
                }
                out.add(r.withEnergy_eV(e).withId(id++));
            }
        }
        return new RaySet(particle, out, description + ", energy offsets " + offsets_eV + " eV");
    }

    /**
     * Every ray's energy drawn from a normal distribution around its own energy, standard deviation
     * sigma (eV, &gt;= 0), with a seeded generator so that runs repeat. Draws that would leave a ray
     * without energy are redrawn.
     */
    public RaySet withGaussianEnergy(double sigma_eV, long seed) {
        if (!(sigma_eV >= 0) || !Double.isFinite(sigma_eV)) {
            throw PhysicsMessage.ENERGY_SPREAD_NEGATIVE.exception("spread", sigma_eV);
        }
        Random rnd = new Random(seed);
        List<RayStart> out = new ArrayList<>();
        for (RayStart r : rays) {
            double e;
            int tries = 0;
            do {
                e = r.energy_eV() + sigma_eV * rnd.nextGaussian();
                if (++tries > 1000) {
                    // a draw is positive with probability above 1/2, so this cannot happen in practice
                    throw new IllegalStateException("energy spread " + sigma_eV + " eV: 1000 draws without energy");
                }
            } while (!(e > 0));
            out.add(r.withEnergy_eV(e));
        }
        return new RaySet(particle, out, description + ", Gaussian energy spread sigma " + Fmt.num(sigma_eV) + " eV");
    }
}
