package org.axistack.properties;

import java.util.ArrayList;
import java.util.List;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import org.axistack.model.Beam;
import org.axistack.model.Contour;
import org.axistack.model.Electrode;
import org.axistack.model.GeometryCheck;
import org.axistack.model.MeshSettings;
import org.axistack.model.Particle;
import org.axistack.model.Segment;
import org.axistack.model.Stack;
import org.axistack.model.ZR;

/**
 * Generators of random valid stacks for the property tests: 2 to 5 electrodes of every shape (tube,
 * aperture, disk, ring, outline with straight and arc segments), placed one after another along the
 * axis with random lengths, gaps, bores, thicknesses and biases, for electrons and ions. Sizes are within
 * the physical ranges of bench lenses (bores 2.5-12 mm, gaps 0.5-6 mm, energies 20 eV-60 keV); every
 * generated stack passes {@link GeometryCheck}. The ranges are our own choice (common practice, no source).
 *
 * <p>The mesh is small (about 200 unknowns, 3 edge levels) so that one solve costs about 0.1 s; the
 * invariants compare solutions on meshes that are exact images of each other, so they hold at any mesh size.
 */
final class RandomStacks {

    /** Element budget of generated stacks (small: the invariants do not depend on it). */
    static final MeshSettings MESH = new MeshSettings(200, 3);

    private RandomStacks() {
    }

    /** Shapes; DISK closes the axis, so stacks meant for optics leave it out. */
    enum Shape { TUBE, APERTURE, DISK, RING, OUTLINE, OUTLINE_ARC }

    /** One electrode's random numbers: sizes in mm and a bias as a fraction of the beam's energy per charge. */
    record Spec(Shape shape, double length_mm, double bore_mm, double outer_mm, double thickness_mm,
            double gap_mm, double biasFraction) {
    }

    static Arbitrary<Particle> particles() {
        return Arbitraries.of(Particle.electron(), Particle.proton(), Particle.ion(39.962, 1), Particle.ion(4.0026, 2),
                Particle.ion(1.008, -1));
    }

    static Arbitrary<Spec> specs(boolean withDisk, double maxBiasFraction) {
        Arbitrary<Shape> shape = withDisk ? Arbitraries.of(Shape.class)
                : Arbitraries.of(Shape.TUBE, Shape.APERTURE, Shape.RING, Shape.OUTLINE, Shape.OUTLINE_ARC);
        Arbitrary<Double> length = Arbitraries.doubles().between(1, 25).ofScale(3);
        Arbitrary<Double> bore = Arbitraries.doubles().between(2.5, 12).ofScale(3);
        Arbitrary<Double> outer = Arbitraries.doubles().between(2, 15).ofScale(3);
        Arbitrary<Double> thick = Arbitraries.oneOf(Arbitraries.just(0.0), Arbitraries.doubles().between(0.2, 3).ofScale(3));
        Arbitrary<Double> gap = Arbitraries.doubles().between(0.5, 6).ofScale(3);
        Arbitrary<Double> bias = Arbitraries.doubles().between(-maxBiasFraction, maxBiasFraction).ofScale(4);
        return Combinators.combine(shape, length, bore, outer, thick, gap, bias).as(Spec::new);
    }

    /**
     * Random stacks. With maxBiasFraction below 1 no bias reaches the beam's energy per charge, so (by the
     * maximum principle, the axial potential lies between the lowest and highest bias and 0) the beam is never
     * reflected; above 1 mirrors occur and must be reported as such.
     */
    static Arbitrary<Stack> stacks(boolean withDisk, double maxBiasFraction) {
        Arbitrary<List<Spec>> list = specs(withDisk, maxBiasFraction).list().ofMinSize(2).ofMaxSize(5);
        Arbitrary<Double> energy = Arbitraries.doubles().between(20, 60_000).ofScale(2);
        return Combinators.combine(list, particles(), energy).as(RandomStacks::build)
                .filter(s -> GeometryCheck.check(s.electrodes()).isEmpty());
    }

    static Stack build(List<Spec> specs, Particle particle, double energy_eV) {
        Beam beam = new Beam(particle, energy_eV);
        double u0 = beam.energyPerCharge_V();
        List<Electrode> es = new ArrayList<>();
        double z = 0;
        for (int i = 0; i < specs.size(); i++) {
            Spec s = specs.get(i);
            double m = 1e-3;
            double bias = Math.round(s.biasFraction() * u0 * 1000) / 1000.0;
            double bore = s.bore_mm(), outer = bore + s.outer_mm(), t = s.thickness_mm(), len = s.length_mm();
            String name = "e" + i;
            Electrode e = switch (s.shape()) {
                case TUBE -> new Electrode.Tube(name, bias, bore * m, z * m, (z + len) * m, Math.min(t, 2) * m);
                case APERTURE -> new Electrode.Aperture(name, bias, (z + t / 2) * m, bore * m, outer * m, t * m);
                case DISK -> new Electrode.Disk(name, bias, (z + t / 2) * m, outer * m, t * m);
                case RING -> {
                    double w = Math.min(0.1 + t / 3, 0.45 * bore);
                    yield new Electrode.Ring(name, bias, (z + w) * m, (bore + w) * m, w * m);
                }
                case OUTLINE -> new Electrode.Outline(name, bias, Contour.polyline(true,
                        new ZR(z * m, (bore + 1) * m), new ZR((z + len / 2) * m, bore * m),
                        new ZR((z + len) * m, (bore + 1) * m), new ZR((z + len) * m, outer * m), new ZR(z * m, outer * m)));
                case OUTLINE_ARC -> {
                    // a round-nosed collar: an arc facing the axis, closed by three straight sides
                    double rise = Math.min(len / 2, outer - bore) * 0.9;
                    ZR a = new ZR(z * m, (bore + rise) * m), b = new ZR((z + len / 2) * m, (bore + rise * (1 - Math.sqrt(0.75))) * m);
                    ZR c = new ZR((z + len) * m, (bore + rise) * m);
                    yield new Electrode.Outline(name, bias, new Contour(List.of(new Segment.Arc(a, b, c),
                            new Segment.Line(c, new ZR((z + len) * m, (outer + rise) * m)),
                            new Segment.Line(new ZR((z + len) * m, (outer + rise) * m), new ZR(z * m, (outer + rise) * m)),
                            new Segment.Line(new ZR(z * m, (outer + rise) * m), a)), true));
                }
            };
            es.add(e);
            z = e.contour().maxZ_m() / m + s.gap_mm();
        }
        return new Stack("random " + specs.size() + "-electrode stack", beam, es, java.util.OptionalDouble.empty(), MESH,
                null);
    }
}
