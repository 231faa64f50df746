package org.axistack.field;

import java.util.List;
import java.util.Locale;

import org.axistack.model.Numbers;
import org.axistack.model.Electrode;
import org.axistack.model.GeometryCheck;

/**
 * The solved capacitance matrix held against two laws it must obey whatever the geometry (Green's reciprocity
 * theorem and the sign of induced charge; J. D. Jackson, Classical Electrodynamics, 3rd ed., sec. 1.13 and
 * problem 1.12): it is symmetric, and its off-diagonal terms are not positive (a conductor at 0 V takes charge
 * of the opposite sign from a neighbour at +1 V). The collocation method imposes neither, so the check measures
 * the discretisation where the collocation residual cannot: a mesh too coarse for a narrow gap solves its own
 * equations to 1e-13 and still returns the wrong charges.
 *
 * <p>Both figures are relative to sqrt(C_ii C_jj) of the pair. Policy (ours; common practice, no source): the
 * solution is refused ({@link #refused()}) when an off-diagonal term is positive by more than
 * {@link #WARN_ASYMMETRY} or the asymmetry exceeds {@link #REFUSE_ASYMMETRY} (the charges are then wrong at the
 * per-mille level or worse, and every later number with them); it is flagged ({@link #warned()}) when the
 * asymmetry exceeds {@link #WARN_ASYMMETRY}, a mesh coarse for the geometry, named with the pair and the fix.
 *
 * @param first       index of the first electrode of the worst pair (-1 for a single electrode)
 * @param second      index of the second electrode of the worst pair
 * @param asymmetry   largest |C_ij - C_ji| / sqrt(C_ii C_jj)
 * @param offDiagonal largest C_ij / sqrt(C_ii C_jj) over i != j (negative for a sound matrix)
 * @param positive    whether the worst pair is named for a positive off-diagonal term (else for its asymmetry)
 */
public record CapacitanceCheck(int first, int second, double asymmetry, double offDiagonal, boolean positive) {

    /** Asymmetry (relative) above which the matrix is flagged; also the tolerance on a positive off-diagonal term. */
    public static final double WARN_ASYMMETRY = 1e-6;
    /** Asymmetry (relative) above which the solution is refused. */
    public static final double REFUSE_ASYMMETRY = 1e-3;

    /** Checks a capacitance matrix (square, positive diagonal expected). */
    public static CapacitanceCheck of(double[][] c) {
        int fa = -1, sa = -1, fp = -1, sp = -1;
        double asym = 0, off = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < c.length; i++) {
            for (int j = 0; j < c.length; j++) {
                if (i == j) {
                    continue;
                }
                double scale = Math.sqrt(Math.abs(c[i][i] * c[j][j]));
                double a = Math.abs(c[i][j] - c[j][i]) / scale;
                double o = c[i][j] / scale;
                if (!(a <= asym)) {
                    asym = a;
                    fa = Math.min(i, j);
                    sa = Math.max(i, j);
                }
                if (!(o <= off)) {
                    off = o;
                    fp = Math.min(i, j);
                    sp = Math.max(i, j);
                }
            }
        }
        boolean positive = !(off <= WARN_ASYMMETRY);
        return positive ? new CapacitanceCheck(fp, sp, asym, off, true) : new CapacitanceCheck(fa, sa, asym, off, false);
    }

    /** Whether the matrix breaks a law badly enough that the solution must not be used. */
    public boolean refused() {
        return positive || !(asymmetry <= REFUSE_ASYMMETRY);
    }

    /** Whether the matrix is further from symmetric than {@link #WARN_ASYMMETRY} (refused ones included). */
    public boolean warned() {
        return refused() || asymmetry > WARN_ASYMMETRY;
    }

    /** What is wrong, with the pair, their gap and the fix; empty text for a sound matrix. */
    public String message(List<Electrode> electrodes) {
        if (!warned() || first < 0) {
            return "";
        }
        Electrode a = electrodes.get(first), b = electrodes.get(second);
        double gap_um = GeometryCheck.gap_m(a, b) * 1e6;
        String what = positive
                ? String.format(Locale.ROOT, "a positive mutual capacitance between '%s' and '%s' (%.2g of sqrt(C_ii C_jj);"
                        + " physically it is never positive)", a.name(), b.name(), offDiagonal)
                : String.format(Locale.ROOT, "a capacitance matrix %s away from symmetric between '%s' and '%s' (allowed"
                        + " %s)", Numbers.estimate(asymmetry), a.name(), b.name(), Numbers.tolerance(WARN_ASYMMETRY));
        return String.format(Locale.ROOT, "the boundary-element mesh gives %s: the charges are %s; the two"
                + " electrodes are %s micrometres apart at their closest. Fix: raise [mesh] target_elements (try twice"
                + " the present value) or widen the gap between '%s' and '%s'", what,
                refused() ? "not to be trusted" : "less accurate than the residual suggests",
                new java.math.BigDecimal(gap_um).round(new java.math.MathContext(3)).stripTrailingZeros().toPlainString(),
                a.name(), b.name());
    }
}
