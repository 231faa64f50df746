package org.axistack.field;

import java.util.Arrays;
import java.util.List;
import java.util.stream.IntStream;

import org.axistack.mesh.BoundaryMesh;
import org.axistack.mesh.Panel;
import org.axistack.model.Electrode;

/**
 * First-order response of a biased stack to a rigid motion of each electrode: a decentre along x and a tilt
 * about the y axis through the electrode's centre (middle of its z extent). Derivation in the design note
 * misalignment.md; summary: electrode k moved rigidly by the small displacement field u keeps its round
 * density carried along with it (its self-interaction is unchanged by a rigid motion) and the stack gets a
 * density correction dsigma cos(phi) that obeys the harmonic-1 operator with the smooth right-hand side
 * b = -u . grad phi_others on electrode k (phi_others: the potential of every charge but k's) and
 * b = +u . grad phi_k on every other electrode (minus the change that moving k's charges makes there). The
 * potential change at a fixed point is the field of dsigma plus -u . grad phi_k (k's moved charges). For a
 * decentre u = d x-hat and for a tilt u = theta ((z - z_c) x-hat - x z-hat), u . grad of a round function is
 * cos(phi) times a meridian function: every motion of every electrode is one more right-hand side of one
 * factored harmonic-1 system.
 *
 * <p>Responses are per unit motion: per metre of decentre and per radian of tilt. Near the axis the change of
 * potential is x Phi_1(z) + O(r^3), {@link #dipoles} gives Phi_1 (V/m per m, V/m per rad). Linear in the
 * biases. Immutable and thread-safe.
 */
public final class MisalignmentResponse {

    /** The two rigid motions of an electrode. */
    public enum Motion {
        /** Translation along x, per metre. */
        DECENTRE,
        /** Rotation about the y axis through the electrode's centre, x-hat toward +z tilt, per radian. */
        TILT
    }

    private final BiasedField field;
    private final HarmonicOperator dipole;
    private final double[] centreZ;
    /** dsigma/eps0 per unit motion: [2k + motion][node]. */
    private final double[][] correction;
    /** Node ring strengths of the corrections (V m per unit motion), [2k + motion][node]. */
    private final double[][] correctionStrength;
    /** Biased density sigma/eps0 times |dy/dtau| of electrode k only, [k][node]. */
    private final double[][] ownDensityJac;
    /** Node ring strengths of electrode k's own charges (V m), [k][node]. */
    private final double[][] ownStrength;
    private final double seconds;

    private MisalignmentResponse(BiasedField field, HarmonicOperator dipole, double[] centreZ, double[][] correction,
            double[][] ownDensityJac, double[][] ownStrength, double seconds) {
        this.field = field;
        this.dipole = dipole;
        this.centreZ = centreZ;
        this.correction = correction;
        this.ownDensityJac = ownDensityJac;
        this.ownStrength = ownStrength;
        this.seconds = seconds;
        BoundaryMesh mesh = field.solution().mesh();
        correctionStrength = new double[correction.length][mesh.size()];
        for (int c = 0; c < correction.length; c++) {
            for (int j = 0; j < mesh.size(); j++) {
                correctionStrength[c][j] = 0.5 * mesh.nodeWeight(j) * mesh.nodeJacobian(j) * mesh.nodeR(j)
                        * correction[c][j];
            }
        }
    }

    /**
     * Solves the responses of every electrode to both motions for the biased field.
     *
     * @param dipole the harmonic-1 operator factored on {@code field}'s solution (shared with other users)
     */
    public static MisalignmentResponse solve(BiasedField field, HarmonicOperator dipole) {
        FieldSolution sol = field.solution();
        if (dipole.order() != 1 || dipole.round() != sol) {
            throw new IllegalArgumentException("need the harmonic-1 operator of the same solved stack");
        }
        long t0 = System.nanoTime();
        BoundaryMesh mesh = sol.mesh();
        int n = mesh.size();
        List<Electrode> electrodes = sol.electrodes();
        int ne = electrodes.size();
        double[] centre = new double[ne];
        for (int k = 0; k < ne; k++) {
            centre[k] = 0.5 * (electrodes.get(k).contour().minZ_m() + electrodes.get(k).contour().maxZ_m());
        }
        double[][] ownDj = new double[ne][n];
        double[][] ownS = new double[ne][n];
        for (int j = 0; j < n; j++) {
            int e = mesh.electrodeOf(j);
            double d = field.nodeDensity_V_per_m(j);
            ownDj[e][j] = d * mesh.nodeJacobian(j);
            ownS[e][j] = 0.5 * mesh.nodeWeight(j) * mesh.nodeJacobian(j) * mesh.nodeR(j) * d;
        }
        // grad of each electrode's own charges at every node of the other electrodes: [node][e][E_z, E_r]
        double[][][] grad = new double[n][][];
        IntStream.range(0, n).parallel().forEach(i -> grad[i] = fieldOfEachElectrode(sol, ownS, ownDj,
                mesh.nodeZ(i), mesh.nodeR(i), mesh.electrodeOf(i)));
        double[][] rhs = new double[2 * ne][n];
        for (int i = 0; i < n; i++) {
            int own = mesh.electrodeOf(i);
            double z = mesh.nodeZ(i);
            double r = mesh.nodeR(i);
            double othersEz = 0;
            double othersEr = 0;
            for (int e = 0; e < ne; e++) {
                if (e != own) {
                    othersEz += grad[i][e][1];
                    othersEr += grad[i][e][2];
                }
            }
            for (int k = 0; k < ne; k++) {
                // u . grad f = cos(phi) [a_r d_r f + a_z d_z f]: decentre a_r = 1, a_z = 0; tilt a_r = z - z_c,
                // a_z = -r. With E = -grad: on k, b = -u.grad phi_others = a_r E_r + a_z E_z of the others;
                // elsewhere b = +u.grad phi_k = -(a_r E_r + a_z E_z) of k's charges.
                double ez = k == own ? othersEz : -grad[i][k][1];
                double er = k == own ? othersEr : -grad[i][k][2];
                rhs[2 * k][i] = er;
                rhs[2 * k + 1][i] = (z - centre[k]) * er - r * ez;
            }
        }
        double[][] corr = dipole.solve(rhs);
        return new MisalignmentResponse(field, dipole, centre, corr, ownDj, ownS, (System.nanoTime() - t0) * 1e-9);
    }

    /**
     * Potential and field (acc[e][0..2] = phi, E_z, E_r) at (z, r) of each electrode's own charges, skipping
     * electrode {@code skip} (the one the point lies on).
     */
    private static double[][] fieldOfEachElectrode(FieldSolution sol, double[][] strength, double[][] densityJac,
            double z, double r, int skip) {
        BoundaryMesh mesh = sol.mesh();
        List<Panel> panels = mesh.panels();
        int order = mesh.order();
        RingSums.Scratch s = RingSums.SCRATCH.get();
        PanelQuadrature quad = sol.quadrature();
        double[][] acc = new double[sol.electrodes().size()][3];
        for (int p = 0; p < panels.size(); p++) {
            int e = panels.get(p).electrode();
            if (e == skip) {
                continue;
            }
            int base = p * order;
            double[] dj = densityJac[e];
            if (sol.bounds(p).near(z, r)) {
                quad.build(panels.get(p), z, r, Double.NaN, s.rule);
                PanelQuadrature.Rule rule = s.rule;
                for (int q = 0; q < rule.size; q++) {
                    quad.basis(rule.t[q], s.basis);
                    double f = 0;
                    for (int j = 0; j < order; j++) {
                        f += s.basis[j] * dj[base + j];
                    }
                    RingKernel.accumulate(z, r, rule.z[q], rule.r[q], 0.5 * rule.w[q] * f * rule.r[q], acc[e], s.ke);
                }
            } else {
                for (int j = base; j < base + order; j++) {
                    RingKernel.accumulate(z, r, mesh.nodeZ(j), mesh.nodeR(j), strength[e][j], acc[e], s.ke);
                }
            }
        }
        return acc;
    }

    /** The biased round field the responses belong to. */
    public BiasedField field() {
        return field;
    }

    /** Number of electrodes. */
    public int electrodes() {
        return centreZ.length;
    }

    /** z of the point a tilt of electrode k turns about (middle of its z extent), m. */
    public double centreZ_m(int k) {
        return centreZ[k];
    }

    /** Wall-clock seconds for the right-hand sides and the solves (after the round solve and the factorisation). */
    public double seconds() {
        return seconds;
    }

    /** The density correction dsigma/eps0 (V/m per unit motion) at every node, cos(phi) amplitude. */
    public double[] correction(int electrode, Motion motion) {
        return correction[2 * electrode + motion.ordinal()].clone();
    }

    /**
     * Dipole axial functions Phi_1(z) of every response at z (potential change x Phi_1(z) near the axis):
     * out[k][0] per metre of decentre of electrode k (V/m^2), out[k][1] per radian of its tilt (V/m). The field
     * of the correction (a ring of cos(phi) density sigma' at radius a contributes lambda a / (2 rho^3),
     * lambda = sigma' a ds / 2, rho^2 = a^2 + (z - z')^2) plus that of k's moved charges:
     * Phi_k''/2 for a decentre and (z - z_c) Phi_k''/2 + Phi_k' for a tilt, Phi_k the axial potential of
     * k's own charges.
     */
    public void dipoles(double z, double[][] out) {
        double[][][] d = new double[centreZ.length][2][1];
        axial(z, 0, d);
        for (int k = 0; k < centreZ.length; k++) {
            out[k][0] = d[k][0][0];
            out[k][1] = d[k][1][0];
        }
    }

    /**
     * Phi_1 of every response at z and its first two z derivatives: out[k][motion][n] = d^n Phi_1/dz^n, n = 0..2
     * (the misalignment aberrations need the r^3 term of the dipole, -x r^2 Phi_1''/8). The kernel a/(2 rho^3) of
     * the correction differentiated in closed form, k's moved charges through the axial derivatives of Phi_k up
     * to the fourth.
     */
    public void dipoleDerivatives(double z, double[][][] out) {
        axial(z, 2, out);
    }

    private void axial(double z, int order, double[][][] out) {
        FieldSolution sol = field.solution();
        BoundaryMesh mesh = sol.mesh();
        List<Panel> panels = mesh.panels();
        int basisOrder = mesh.order();
        int ne = centreZ.length;
        RingSums.Scratch s = RingSums.SCRATCH.get();
        PanelQuadrature quad = sol.quadrature();
        double[][] dip = new double[2 * ne][order + 1];
        double[][] own = new double[ne][order + 3];
        double[] one = new double[order + 3];
        double[] kern = new double[order + 1];
        for (int p = 0; p < panels.size(); p++) {
            int base = p * basisOrder;
            int e = panels.get(p).electrode();
            if (sol.bounds(p).near(z, 0)) {
                quad.build(panels.get(p), z, 0, Double.NaN, s.rule);
                PanelQuadrature.Rule rule = s.rule;
                for (int q = 0; q < rule.size; q++) {
                    quad.basis(rule.t[q], s.basis);
                    double a = rule.r[q];
                    double w = 0.5 * rule.w[q] * a;
                    dipoleKernel(z - rule.z[q], a, w, kern);
                    for (int c = 0; c < dip.length; c++) {
                        double f = 0;
                        for (int j = 0; j < basisOrder; j++) {
                            f += s.basis[j] * correction[c][base + j] * mesh.nodeJacobian(base + j);
                        }
                        for (int n = 0; n <= order; n++) {
                            dip[c][n] += f * kern[n];
                        }
                    }
                    double f = 0;
                    for (int j = 0; j < basisOrder; j++) {
                        f += s.basis[j] * ownDensityJac[e][base + j];
                    }
                    Arrays.fill(one, 0);
                    RingKernel.accumulateAxial(z, rule.z[q], a, w * f, order + 2, one);
                    for (int m = 0; m < one.length; m++) {
                        own[e][m] += one[m];
                    }
                }
            } else {
                for (int j = base; j < base + basisOrder; j++) {
                    dipoleKernel(z - mesh.nodeZ(j), mesh.nodeR(j), 1, kern);
                    for (int c = 0; c < dip.length; c++) {
                        for (int n = 0; n <= order; n++) {
                            dip[c][n] += correctionStrength[c][j] * kern[n];
                        }
                    }
                    RingKernel.accumulateAxial(z, mesh.nodeZ(j), mesh.nodeR(j), ownStrength[e][j], order + 2, own[e]);
                }
            }
        }
        for (int k = 0; k < ne; k++) {
            double dz = z - centreZ[k];
            double[] o = own[k];
            // decentre: Phi_k''/2 and its derivatives; tilt: (z - z_c) Phi_k''/2 + Phi_k' and its derivatives
            out[k][0][0] = dip[2 * k][0] + 0.5 * o[2];
            out[k][1][0] = dip[2 * k + 1][0] + 0.5 * dz * o[2] + o[1];
            if (order >= 2) {
                out[k][0][1] = dip[2 * k][1] + 0.5 * o[3];
                out[k][0][2] = dip[2 * k][2] + 0.5 * o[4];
                out[k][1][1] = dip[2 * k + 1][1] + 1.5 * o[2] + 0.5 * dz * o[3];
                out[k][1][2] = dip[2 * k + 1][2] + 2 * o[3] + 0.5 * dz * o[4];
            }
        }
    }

    /**
     * w a / (2 rho^3) and its first two derivatives in z (d = z - z', rho^2 = a^2 + d^2), as many as kern holds:
     * d/dz = -3 a d / (2 rho^5), d^2/dz^2 = 3 a (5 d^2/rho^2 - 1) / (2 rho^5).
     */
    private static void dipoleKernel(double d, double a, double w, double[] kern) {
        double rho2 = a * a + d * d;
        double inv3 = 1 / (rho2 * Math.sqrt(rho2));
        kern[0] = w * a * inv3 / 2;
        if (kern.length > 1) {
            double inv5 = inv3 / rho2;
            kern[1] = -1.5 * w * a * d * inv5;
            kern[2] = 1.5 * w * a * (5 * d * d / rho2 - 1) * inv5;
        }
    }

    /** Phi_1(z) of one response, V/m per unit motion (see {@link #dipoles}). */
    public double dipole(int electrode, Motion motion, double z) {
        double[][] out = new double[centreZ.length][2];
        dipoles(z, out);
        return out[electrode][motion.ordinal()];
    }

    /** The harmonic-1 operator the corrections were solved with. */
    public HarmonicOperator operator() {
        return dipole;
    }
}
