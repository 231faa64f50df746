package org.axistack.size;

import java.util.List;
import java.util.OptionalDouble;

import org.axistack.model.Beam;

/**
 * What a lens must do and the limits it must respect, with the family to search. SI units; the lens centre
 * (the middle of the stack) is at z = 0.
 *
 * @param title                  free text
 * @param beam                   particle and energy
 * @param objectZ_m              axial object point, m (empty: a parallel beam from infinity)
 * @param imageZ_m               where the image (or, for a parallel beam, the focus) must lie, m; empty when a
 *                               focal length is asked for instead
 * @param focalLength_m          image-side focal length asked for, m (empty when an image plane is given)
 * @param minBore_m              least bore radius, m
 * @param maxLength_m            largest overall stack length, m
 * @param maxBias_V              largest bias magnitude the supply gives, V
 * @param maxSurfaceField_V_per_m largest electrode surface field allowed, V/m
 * @param family                 the lens family
 * @param parameters             one entry per family parameter, in family order
 * @param objective              what to minimise
 * @param search                 search budget and mesh
 */
public record Requirements(String title, Beam beam, OptionalDouble objectZ_m, OptionalDouble imageZ_m,
        OptionalDouble focalLength_m, double minBore_m, double maxLength_m, double maxBias_V,
        double maxSurfaceField_V_per_m, Family family, List<Parameter> parameters, Objective objective,
        SearchSettings search) {

    public Requirements {
        parameters = List.copyOf(parameters);
        if (parameters.size() != family.parameters().size()) {
            throw new IllegalArgumentException("need one parameter per family parameter");
        }
        for (int i = 0; i < parameters.size(); i++) {
            if (!parameters.get(i).name().equals(family.parameters().get(i))) {
                throw new IllegalArgumentException("parameters out of family order");
            }
        }
        if (imageZ_m.isPresent() == focalLength_m.isPresent()) {
            throw new IllegalArgumentException("give an image plane or a focal length, not both");
        }
        if (objectZ_m.isPresent() && focalLength_m.isPresent()) {
            throw new IllegalArgumentException("a focal length is asked for a parallel beam (no object)");
        }
        if (!(minBore_m > 0) || !(maxLength_m > 0) || !(maxBias_V > 0) || !(maxSurfaceField_V_per_m > 0)) {
            throw new IllegalArgumentException("limits must be positive");
        }
    }

    /** Indices of the varied parameters. */
    public int[] varied() {
        return java.util.stream.IntStream.range(0, parameters.size()).filter(i -> parameters.get(i).varied()).toArray();
    }

    /** Every length multiplied by k, the surface-field limit divided by k: the same problem at another scale. */
    public Requirements scaled(double k) {
        return new Requirements(title, beam, map(objectZ_m, k), map(imageZ_m, k), map(focalLength_m, k), minBore_m * k,
                maxLength_m * k, maxBias_V, maxSurfaceField_V_per_m / k, family,
                parameters.stream().map(p -> p.scaled(k)).toList(), objective, search);
    }

    private static OptionalDouble map(OptionalDouble v, double k) {
        return v.isPresent() ? OptionalDouble.of(v.getAsDouble() * k) : v;
    }

    public Requirements withSearch(SearchSettings s) {
        return new Requirements(title, beam, objectZ_m, imageZ_m, focalLength_m, minBore_m, maxLength_m, maxBias_V,
                maxSurfaceField_V_per_m, family, parameters, objective, s);
    }

    public Requirements withObjective(Objective o) {
        return new Requirements(title, beam, objectZ_m, imageZ_m, focalLength_m, minBore_m, maxLength_m, maxBias_V,
                maxSurfaceField_V_per_m, family, parameters, o, search);
    }
}
