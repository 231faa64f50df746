package org.axistack.properties;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.axistack.field.BiasedField;
import org.axistack.field.FieldSolution;
import org.axistack.model.Beam;
import org.axistack.model.Particle;
import org.axistack.model.Stack;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.CardinalElements.Kind;

/**
 * Symmetries of electrostatic lens optics on random stacks (tubes, apertures, rings and outlines; no disk,
 * which would close the axis; biases below the beam's energy per charge, so no mirror). Each compares the
 * full pipeline (mesh, solve, axial expansion, automatic reference planes, ray integration, aberration
 * integrals) on a stack and on its image under the symmetry. Meshes of the two stacks are exact images of
 * each other, so the invariants hold to round-off: the tolerance is 1e-7 of the focal length (measured
 * differences: 1e-10 at most). Sources: the invariances follow from Laplace's equation and the paraxial ray
 * equation (P. W. Hawkes and E. Kasper, Principles of Electron Optics, vol. 1, ch. 15-16, and any text on
 * electrostatics): the potential of a translated, scaled or reflected set of conductors is the translated,
 * scaled or reflected potential, and the ray equation involves U only through U'/U and U''/U.
 */
class OpticsInvariantProperties {

    static final double ROUND_OFF = 1e-7;

    @Provide
    Arbitrary<Stack> lenses() {
        return RandomStacks.stacks(false, 0.9);
    }

    @Provide
    Arbitrary<Double> shifts_m() {
        return Arbitraries.doubles().between(-0.2, 0.2).ofScale(5);
    }

    @Provide
    Arbitrary<Double> factors() {
        return Arbitraries.doubles().between(0.3, 4).ofScale(3);
    }

    private static void sameKind(Lens a, Lens b) {
        assertThat(b.c().kind()).isEqualTo(a.c().kind());
    }

    /** z -> z + c moves F1, F2, H1, H2 by c and keeps f1, f2, Cs and Cc. */
    @Property(seed = "20261201")
    void translationMovesCardinalPointsOnly(@ForAll("lenses") Stack s, @ForAll("shifts_m") double dz) {
        Lens a = Lens.of(Lens.solve(s).biased(), s);
        Stack t = s.shifted(dz);
        Lens b = Lens.of(Lens.solve(t).biased(), t);
        sameKind(a, b);
        if (a.c().kind() == Kind.AFOCAL) {
            return;
        }
        double tol = ROUND_OFF * a.size();
        CardinalElements p = a.c(), q = b.c();
        assertThat(q.focalPointObjectZ_m()).isCloseTo(p.focalPointObjectZ_m() + dz, within(tol));
        assertThat(q.focalPointImageZ_m()).isCloseTo(p.focalPointImageZ_m() + dz, within(tol));
        assertThat(q.principalPlaneObjectZ_m()).isCloseTo(p.principalPlaneObjectZ_m() + dz, within(tol));
        assertThat(q.principalPlaneImageZ_m()).isCloseTo(p.principalPlaneImageZ_m() + dz, within(tol));
        assertThat(b.f1()).isCloseTo(a.f1(), within(tol));
        assertThat(b.f2()).isCloseTo(a.f2(), within(tol));
        assertThat(b.a().sphericalImage_m()).isCloseTo(a.a().sphericalImage_m(), within(ROUND_OFF * Math.abs(a.a().sphericalImage_m())));
        assertThat(b.a().chromaticImage_m()).isCloseTo(a.a().chromaticImage_m(), within(ROUND_OFF * Math.abs(a.a().chromaticImage_m())));
    }

    /** Every length x k (mesh scaled with it): F, H, f, Cs and Cc x k; the lens kind is kept. */
    @Property(seed = "20261201")
    void scalingScalesEveryLength(@ForAll("lenses") Stack s, @ForAll("factors") double k) {
        Lens a = Lens.of(Lens.solve(s).biased(), s);
        Stack t = s.scaled(k);
        Lens b = Lens.of(Lens.solve(t).biased(), t);
        sameKind(a, b);
        if (a.c().kind() == Kind.AFOCAL) {
            return;
        }
        double tol = ROUND_OFF * k * a.size();
        CardinalElements p = a.c(), q = b.c();
        assertThat(q.focalPointObjectZ_m()).isCloseTo(k * p.focalPointObjectZ_m(), within(tol));
        assertThat(q.focalPointImageZ_m()).isCloseTo(k * p.focalPointImageZ_m(), within(tol));
        assertThat(q.principalPlaneObjectZ_m()).isCloseTo(k * p.principalPlaneObjectZ_m(), within(tol));
        assertThat(q.principalPlaneImageZ_m()).isCloseTo(k * p.principalPlaneImageZ_m(), within(tol));
        assertThat(b.f1()).isCloseTo(k * a.f1(), within(tol));
        assertThat(b.f2()).isCloseTo(k * a.f2(), within(tol));
        double cs = a.a().sphericalImage_m(), cc = a.a().chromaticImage_m();
        assertThat(b.a().sphericalImage_m()).isCloseTo(k * cs, within(ROUND_OFF * k * Math.abs(cs)));
        assertThat(b.a().chromaticImage_m()).isCloseTo(k * cc, within(ROUND_OFF * k * Math.abs(cc)));
    }

    /**
     * z -> -z swaps object and image sides (reversibility of rays): f1' = f2, f2' = f1, F1' = -F2, F2' = -F1,
     * H1' = -H2, H2' = -H1.
     */
    @Property(seed = "20261201")
    void mirrorSwapsObjectAndImageSides(@ForAll("lenses") Stack s) {
        Lens a = Lens.of(Lens.solve(s).biased(), s);
        Stack t = s.mirrored();
        Lens b = Lens.of(Lens.solve(t).biased(), t);
        sameKind(a, b);
        if (a.c().kind() == Kind.AFOCAL) {
            return;
        }
        double tol = ROUND_OFF * a.size();
        CardinalElements p = a.c(), q = b.c();
        assertThat(q.focalPointObjectZ_m()).isCloseTo(-p.focalPointImageZ_m(), within(tol));
        assertThat(q.focalPointImageZ_m()).isCloseTo(-p.focalPointObjectZ_m(), within(tol));
        assertThat(q.principalPlaneObjectZ_m()).isCloseTo(-p.principalPlaneImageZ_m(), within(tol));
        assertThat(q.principalPlaneImageZ_m()).isCloseTo(-p.principalPlaneObjectZ_m(), within(tol));
        assertThat(b.f1()).isCloseTo(a.f2(), within(tol));
        assertThat(b.f2()).isCloseTo(a.f1(), within(tol));
    }

    /**
     * Biases and beam energy x k. Without the relativistic correction the ray equation sees only U'/U and
     * U''/U, so nothing changes (to round-off, 1e-9 of f). With it, the correction depends on U/Vr (Vr = m c^2/q):
     * writing f_rel = f_nr (1 + Delta(k)), Delta is a power series in k U0/Vr whose first term is linear, so
     * f_rel(k)/f_rel(1) - 1 = (k - 1) Delta(1) to first order, the remainder being of relative size k U_max/Vr
     * (derived here; U_max the largest axial acceleration potential, below 1.9 U0 in these stacks).
     */
    @Property(seed = "20261201")
    void voltageScalingKeepsNonRelativisticOpticsAndMovesRelativisticOnesByTheDerivedAmount(
            @ForAll("lenses") Stack s, @ForAll("factors") double k) {
        FieldSolution sol = Lens.solve(s);
        BiasedField f1 = sol.biased();
        double[] b = s.biases_V();
        for (int i = 0; i < b.length; i++) {
            b[i] *= k;
        }
        BiasedField fk = sol.withBiases(b);
        Stack sk = s.withBiases(b).withBeam(s.beam().withEnergy_eV(s.beam().energy_eV() * k));
        Lens nr1 = Lens.nonRelativistic(f1, s, s.beam()), nrk = Lens.nonRelativistic(fk, sk, sk.beam());
        sameKind(nr1, nrk);
        if (nr1.c().kind() == Kind.AFOCAL) {
            return;
        }
        assertThat(nrk.f2()).isCloseTo(nr1.f2(), within(1e-9 * nr1.size()));
        assertThat(nrk.c().focalPointImageZ_m()).isCloseTo(nr1.c().focalPointImageZ_m(), within(1e-9 * nr1.size()));
        assertThat(nrk.a().sphericalImage_m()).isCloseTo(nr1.a().sphericalImage_m(),
                within(1e-8 * Math.abs(nr1.a().sphericalImage_m())));
        Lens r1 = Lens.of(f1, s), rk = Lens.of(fk, sk);
        double delta1 = r1.f2() / nr1.f2() - 1;
        double deltaK = rk.f2() / r1.f2() - 1;
        double epsMax = 1.9 * k * s.beam().energyPerCharge_V() / s.beam().particle().restPotential_V();
        assertThat(deltaK).isCloseTo((k - 1) * delta1, within(2 * epsMax * Math.abs((k - 1) * delta1) + 1e-10));
    }

    /**
     * Charge sign: the force is q E, so a particle of the opposite charge in the field of opposite biases
     * moves exactly alike (same mass: relativistic optics identical); an electron and an ion of the same
     * energy per charge, biases reversed, have the same paraxial optics in the non-relativistic limit.
     */
    @Property(seed = "20261201")
    void oppositeChargeWithOppositeBiasesFollowsTheSamePaths(@ForAll("lenses") Stack s) {
        FieldSolution sol = Lens.solve(s);
        double[] minus = s.biases_V();
        for (int i = 0; i < minus.length; i++) {
            minus[i] = -minus[i];
        }
        Particle p = s.beam().particle();
        Particle anti = new Particle("opposite of " + p.label(), p.mass_kg(), -p.charge_C());
        Stack flipped = s.withBiases(minus).withBeam(s.beam().withParticle(anti));
        Lens a = Lens.of(sol.biased(), s), b = Lens.of(sol.withBiases(minus), flipped);
        sameKind(a, b);
        if (a.c().kind() != Kind.AFOCAL) {
            double tol = 1e-9 * a.size();
            assertThat(b.f2()).isCloseTo(a.f2(), within(tol));
            assertThat(b.c().focalPointImageZ_m()).isCloseTo(a.c().focalPointImageZ_m(), within(tol));
            assertThat(b.c().principalPlaneObjectZ_m()).isCloseTo(a.c().principalPlaneObjectZ_m(), within(tol));
        }
        // an electron against a positive ion (or the reverse), same energy per charge, non-relativistic
        Particle other = p.chargeSign() > 0 ? Particle.electron() : Particle.proton();
        double u0 = s.beam().energyPerCharge_V();
        Beam ob = new Beam(other, u0 * other.absCharge_C() / org.axistack.model.Codata2018.ELEMENTARY_CHARGE_C);
        double[] forOther = other.chargeSign() == p.chargeSign() ? s.biases_V() : minus;
        Lens c = Lens.nonRelativistic(sol.biased(), s, s.beam());
        Lens d = Lens.nonRelativistic(sol.withBiases(forOther), s, ob);
        sameKind(c, d);
        if (c.c().kind() != Kind.AFOCAL) {
            double tol = 1e-9 * c.size();
            assertThat(d.f1()).isCloseTo(c.f1(), within(tol));
            assertThat(d.f2()).isCloseTo(c.f2(), within(tol));
            assertThat(d.c().focalPointObjectZ_m()).isCloseTo(c.c().focalPointObjectZ_m(), within(tol));
            assertThat(d.c().focalPointImageZ_m()).isCloseTo(c.c().focalPointImageZ_m(), within(tol));
        }
    }
}
