package org.axistack.model;

/**
 * How finely electrode outlines are cut into boundary elements.
 *
 * @param targetElements approximate total number of elements (unknowns) over all electrodes
 * @param edgeLevels     least number of geometric refinement levels toward each edge and corner (each
 *                       level halves the element length); the mesher adds levels where another surface is
 *                       closer to an edge than the elements are long
 */
public record MeshSettings(int targetElements, int edgeLevels) {

    /** Default element budget: fine enough for 1e-6 axial accuracy on typical lenses. */
    public static final int DEFAULT_TARGET_ELEMENTS = 1200;
    public static final int DEFAULT_EDGE_LEVELS = 4;
    /** Largest element count the tool accepts (dense matrix of 8 N^2 bytes, see DEVELOPERS.md). */
    public static final int MAX_ELEMENTS = 12_000;

    public MeshSettings {
        if (targetElements < 8 || targetElements > MAX_ELEMENTS) {
            throw new IllegalArgumentException("target elements must be between 8 and " + MAX_ELEMENTS);
        }
        if (edgeLevels < 0 || edgeLevels > 40) {
            throw new IllegalArgumentException("edge levels must be between 0 and 40");
        }
    }

    public static MeshSettings defaults() {
        return new MeshSettings(DEFAULT_TARGET_ELEMENTS, DEFAULT_EDGE_LEVELS);
    }

    public MeshSettings withTargetElements(int n) {
        return new MeshSettings(n, edgeLevels);
    }

    public MeshSettings withEdgeLevels(int levels) {
        return new MeshSettings(targetElements, levels);
    }
}
