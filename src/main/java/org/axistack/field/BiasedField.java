package org.axistack.field;

import java.util.List;

import org.axistack.mesh.BoundaryMesh;
import org.axistack.mesh.Panel;

/**
 * The field of a solved stack at one set of biases: potential and field anywhere by superposing the
 * rings of the surface charge (far panels by their Gauss nodes, near panels by the graded rule of
 * {@link PanelQuadrature}), the axial potential and its derivatives from the solution's piecewise Chebyshev
 * expansion (the exact ring sums, derivatives of 1/rho by the Legendre recurrence, where the expansion does not
 * reach), electrode charges and surface fields. Immutable and thread-safe.
 */
public final class BiasedField implements Field, AxialField {

    private final FieldSolution solution;
    private final double[] biases;
    private final double[] strength;
    /** sigma/eps0 times |dy/dtau| at each node: the smooth quantity the near rule interpolates. */
    private final double[] densityJac;
    private final double[] density;
    /** Axial expansion coefficients for these biases, made on first use (benign race: same value). */
    private volatile double[][][] combined;

    BiasedField(FieldSolution solution, double[] biases, double[] strength, double[] density) {
        this.solution = solution;
        this.biases = biases;
        this.strength = strength;
        this.density = density;
        BoundaryMesh mesh = solution.mesh();
        densityJac = new double[density.length];
        for (int j = 0; j < density.length; j++) {
            densityJac[j] = density[j] * mesh.nodeJacobian(j);
        }
    }

    public FieldSolution solution() {
        return solution;
    }

    /** Biases, volts, in electrode order. */
    public double[] biases_V() {
        return biases.clone();
    }

    @Override
    public double potential_V(double z_m, double r_m) {
        double[] acc = new double[3];
        accumulate(z_m, r_m, acc);
        return acc[0];
    }

    @Override
    public double evaluate(double z_m, double r_m, double[] fieldOut) {
        double[] acc = new double[3];
        accumulate(z_m, r_m, acc);
        fieldOut[0] = acc[1];
        fieldOut[1] = acc[2];
        return acc[0];
    }

    private void accumulate(double z, double r, double[] acc) {
        RingSums.field(solution, z, r, strength, densityJac, acc);
    }

    /**
     * Axial potential and derivatives. Inside the stack's neighbourhood and up to order
     * {@link AxialExpansion#ORDER} this uses the piecewise Chebyshev expansion of the exact values (relative
     * error below {@link #axialExpansionError()}); elsewhere the exact Legendre-form sum of {@link #exactAxial}.
     */
    @Override
    public void axial(double z_m, int order, double[] out) {
        if (order < 0 || order > MAX_ORDER) {
            throw new IllegalArgumentException("derivative order must be 0.." + MAX_ORDER);
        }
        if (order <= AxialExpansion.ORDER) {
            FarField ff = far();
            if (ff.covers(z_m)) {
                ff.axial(z_m, order, out);
                return;
            }
            AxialExpansion x = solution.axialExpansion();
            if (z_m >= x.zMin() && z_m <= x.zMax()) {
                double[][][] c = combined;
                if (c == null) {
                    c = x.combine(biases);
                    combined = c;
                }
                if (x.evaluate(c, z_m, order, out)) {
                    return;
                }
            }
        }
        exactAxial(z_m, order, out);
    }

    @Override
    public boolean insideTube(double z_m) {
        for (org.axistack.model.Electrode e : solution.electrodes()) {
            org.axistack.model.Contour c = e.contour();
            double bore = c.minR_m();
            if (bore > 0 && c.minZ_m() <= z_m - bore && c.maxZ_m() >= z_m + bore) {
                return true;
            }
        }
        return false;
    }

    @Override
    public boolean axisBlocked(double from_m, double to_m) {
        for (org.axistack.model.Electrode e : solution.electrodes()) {
            org.axistack.model.Contour c = e.contour();
            if (c.minR_m() <= 0 && c.maxZ_m() >= from_m && c.minZ_m() <= to_m) {
                return true;
            }
        }
        return false;
    }

    private volatile FarField far;

    /**
     * The multipole expansion of this field's charges, used on the axis beyond
     * {@link FarField#startDistance_m()} from its centre (there it equals the exact sum to round-off).
     */
    @Override
    public java.util.Optional<FarField> farField() {
        return java.util.Optional.of(far());
    }

    private FarField far() {
        FarField f = far;
        if (f == null) {
            f = solution.farField(biases);
            far = f;
        }
        return f;
    }

    /** Exact axial potential (no expansion), V. */
    public double exactAxial0(double z_m) {
        double[] o = new double[1];
        exactAxial(z_m, 0, o);
        return o[0];
    }

    /** Number of Chebyshev intervals of the axial expansion. */
    public int axialExpansionIntervals() {
        return solution.axialExpansion().intervals();
    }

    /** Largest relative error of the axial expansion measured against the exact sum when it was built. */
    public double axialExpansionError() {
        return solution.axialExpansion().maxError();
    }

    /**
     * Axial potential and derivatives by the exact sum over the surface-charge rings,
     * d^n/dz^n (1/rho) = (-1)^n n! P_n(cos t)/rho^(n+1), near panels by the graded rule.
     */
    public void exactAxial(double z_m, int order, double[] out) {
        if (order < 0 || order > MAX_ORDER) {
            throw new IllegalArgumentException("derivative order must be 0.." + MAX_ORDER);
        }
        RingSums.axial(solution, z_m, order, new double[][] {strength}, new double[][] {densityJac}, new double[][] {out});
    }

    /**
     * Distance from (z, r) to the nearest electrode surface, m (exact for straight and circular outline pieces).
     * The near-axis series converges inside this distance.
     */
    public double clearance_m(double z_m, double r_m) {
        double best = Double.POSITIVE_INFINITY;
        List<Panel> panels = solution.mesh().panels();
        for (int p = 0; p < panels.size(); p++) {
            PanelQuadrature.Bounds b = solution.bounds(p);
            double lower = Math.hypot(z_m - b.zc(), r_m - b.rc()) - b.radius();
            if (lower >= best) {
                continue;
            }
            Panel pan = panels.get(p);
            var q = pan.at(pan.closestTau(z_m, r_m));
            best = Math.min(best, Math.hypot(q.z_m() - z_m, q.r_m() - r_m));
        }
        return best;
    }

    /** Charge on each electrode, C. */
    public double[] charges_C() {
        return solution.electrodeCharges_C(strength);
    }

    /** sigma/eps0 at node j (total over both faces for a sheet), V/m. */
    public double nodeDensity_V_per_m(int j) {
        return density[j];
    }

    /**
     * Electrode surface field magnitude at every node, V/m: |sigma|/eps0 on closed conductors; for thin
     * sheets the larger of the two faces, each found by evaluating the field a ten-thousandth of the
     * element length off the face (error of that order relative to the field gradient's effect).
     */
    public double[] surfaceFields_V_per_m() {
        BoundaryMesh mesh = solution.mesh();
        int n = mesh.size();
        double[] out = new double[n];
        double[] tau = mesh.nodeTau();
        java.util.stream.IntStream.range(0, n).parallel().forEach(j -> {
            Panel p = mesh.panelOf(j);
            if (!p.sheet()) {
                out[j] = Math.abs(density[j]);
                return;
            }
            double[] t = p.tangent(tau[j % mesh.order()]);
            double dn = 1e-4 * p.length_m();
            double[] f = new double[2];
            double best = 0;
            for (int side = -1; side <= 1; side += 2) {
                double zq = mesh.nodeZ(j) - side * t[1] * dn;
                double rq = mesh.nodeR(j) + side * t[0] * dn;
                evaluate(zq, rq, f);
                best = Math.max(best, Math.hypot(f[0], f[1]));
            }
            out[j] = best;
        });
        return out;
    }

    /**
     * The largest surface field on each electrode with where it sits, and whether it sits at a sharp corner
     * (the node of the largest field lies on a panel that touches a singular point: a convex corner or a free
     * sheet edge, where the field has no finite limit).
     */
    public SurfacePeak[] surfacePeaks() {
        double[] all = surfaceFields_V_per_m();
        BoundaryMesh mesh = solution.mesh();
        int ne = solution.electrodes().size();
        int[] at = new int[ne];
        java.util.Arrays.fill(at, -1);
        for (int j = 0; j < all.length; j++) {
            int e = mesh.electrodeOf(j);
            if (at[e] < 0 || all[j] > all[at[e]]) {
                at[e] = j;
            }
        }
        SurfacePeak[] out = new SurfacePeak[ne];
        for (int e = 0; e < ne; e++) {
            int j = at[e];
            if (j < 0) {
                out[e] = new SurfacePeak(e, 0, Double.NaN, Double.NaN, false);
                continue;
            }
            Panel p = mesh.panelOf(j);
            if (p.singularEnd() != 0) {
                org.axistack.model.ZR corner = p.at(p.singularEnd() < 0 ? 0 : 1);
                out[e] = new SurfacePeak(e, all[j], corner.z_m(), corner.r_m(), true);
                continue;
            }
            out[e] = new SurfacePeak(e, all[j], mesh.nodeZ(j), mesh.nodeR(j), false);
            // Between the nodes: on a solid conductor's smooth panel the density is the panel's interpolating
            // polynomial; its largest value on the panel of the largest node and on the two beside it.
            int order = mesh.order();
            int pj = j / order;
            for (int q = Math.max(0, pj - 1); q <= Math.min(mesh.panels().size() - 1, pj + 1); q++) {
                Panel pq = mesh.panels().get(q);
                if (pq.sheet() || pq.singularEnd() != 0 || pq.electrode() != e) {
                    continue;
                }
                double[] best = panelMaximum(mesh, q);
                if (best[0] > out[e].field_V_per_m()) {
                    org.axistack.model.ZR where = pq.at(best[1]);
                    out[e] = new SurfacePeak(e, best[0], where.z_m(), where.r_m(), false);
                }
            }
        }
        return out;
    }

    /** Samples between the panel's ends at which the interpolated density is examined. */
    private static final int PEAK_SAMPLES = 64;

    /** {largest |sigma|/eps0 of the panel's interpolating polynomial over tau in [0, 1], the tau where it is}. */
    private double[] panelMaximum(BoundaryMesh mesh, int panel) {
        int order = mesh.order();
        double[] tau = mesh.nodeTau();
        int base = panel * order;
        double best = 0;
        double bestTau = 0;
        for (int k = 0; k <= PEAK_SAMPLES; k++) {
            double t = (double) k / PEAK_SAMPLES;
            double v = 0;
            for (int a = 0; a < order; a++) {
                double l = 1;
                for (int b = 0; b < order; b++) {
                    if (b != a) {
                        l *= (t - tau[b]) / (tau[a] - tau[b]);
                    }
                }
                v += l * density[base + a];
            }
            if (Math.abs(v) > best) {
                best = Math.abs(v);
                bestTau = t;
            }
        }
        return new double[] {best, bestTau};
    }

    /** Largest surface field on each electrode, V/m (see {@link #surfaceFields_V_per_m()}). */
    public double[] maxSurfaceFieldPerElectrode_V_per_m() {
        double[] all = surfaceFields_V_per_m();
        double[] max = new double[solution.electrodes().size()];
        BoundaryMesh mesh = solution.mesh();
        for (int j = 0; j < all.length; j++) {
            int e = mesh.electrodeOf(j);
            max[e] = Math.max(max[e], all[j]);
        }
        return max;
    }
}
