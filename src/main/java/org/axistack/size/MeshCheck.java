package org.axistack.size;

/**
 * What the coarse search mesh costs: the winner re-solved on the fine mesh and re-focused, relative changes.
 *
 * @param coarseUnknowns   unknowns of the search mesh
 * @param fineUnknowns     unknowns of the fine mesh
 * @param biasChange       |bias_fine / bias_coarse - 1|
 * @param sphericalChange  |Cs_fine / Cs_coarse - 1|
 * @param chromaticChange  |Cc_fine / Cc_coarse - 1|
 * @param fieldChange      |E_fine / E_coarse - 1| of the largest surface field
 */
public record MeshCheck(int coarseUnknowns, int fineUnknowns, double biasChange, double sphericalChange,
        double chromaticChange, double fieldChange) {

    static MeshCheck of(Design coarse, Design fine) {
        return new MeshCheck(coarse.unknowns(), fine.unknowns(), rel(fine.bias_V(), coarse.bias_V()),
                rel(fine.spherical_m(), coarse.spherical_m()), rel(fine.chromatic_m(), coarse.chromatic_m()),
                rel(fine.maxSurfaceField_V_per_m(), coarse.maxSurfaceField_V_per_m()));
    }

    private static double rel(double a, double b) {
        return Math.abs(a / b - 1);
    }

    public double largest() {
        return Math.max(Math.max(biasChange, sphericalChange), Math.max(chromaticChange, fieldChange));
    }
}
