package org.axistack.trace;

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
            throw new IllegalArgumentException("energy offsets: give at least one value (0 for the nominal energy)");
        }
        List<RayStart> out = new ArrayList<>();
        int id = 1;
        for (double d : offsets_eV) {
            if (!Double.isFinite(d)) {
                throw new IllegalArgumentException("energy offsets must be finite: " + d);
            }
            for (RayStart r : rays) {
                double e = r.energy_eV() + d;
                if (!(e > 0)) {
                    throw new IllegalArgumentException("energy offset " + Fmt.num(d) + " eV leaves ray " + r.id()
                            + " with no energy (" + Fmt.num(r.energy_eV()) + " eV): use offsets above -"
                            + Fmt.num(r.energy_eV()) + " eV");
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
            throw new IllegalArgumentException("energy spread must be zero or positive, eV: " + sigma_eV);
        }
        Random rnd = new Random(seed);
        List<RayStart> out = new ArrayList<>();
        for (RayStart r : rays) {
            double e;
            int tries = 0;
            do {
                e = r.energy_eV() + sigma_eV * rnd.nextGaussian();
                if (++tries > 1000) {
                    throw new IllegalArgumentException("energy spread " + Fmt.num(sigma_eV)
                            + " eV is too wide for a beam of " + Fmt.num(r.energy_eV()) + " eV: narrow it");
                }
            } while (!(e > 0));
            out.add(r.withEnergy_eV(e));
        }
        return new RaySet(particle, out, description + ", Gaussian energy spread sigma " + Fmt.num(sigma_eV) + " eV");
    }
}
