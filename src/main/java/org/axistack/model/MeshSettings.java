package org.axistack.model;

/**
 * How finely electrode outlines are cut into boundary elements: a fixed element count, or an accuracy the solver
 * refines to (accuracy-driven meshing, see src/site/markdown/meshing.md).
 *
 * @param targetElements approximate total number of elements (unknowns) over all electrodes; with an accuracy, the
 *                       most unknowns a refinement may reach (an expert cap)
 * @param edgeLevels     least number of geometric refinement levels toward each edge and corner (each
 *                       level halves the element length); the mesher adds levels where another surface is
 *                       closer to an edge than the elements are long
 * @param accuracy       NaN for the fixed element count; else the accuracy of the potential to refine to, relative
 *                       to the largest bias difference (the biases and ground)
 */
public record MeshSettings(int targetElements, int edgeLevels, double accuracy) {

    /** Default element budget: fine enough for 1e-6 axial accuracy on typical lenses. */
    public static final int DEFAULT_TARGET_ELEMENTS = 1200;
    public static final int DEFAULT_EDGE_LEVELS = 4;
    /** Largest element count the tool accepts (dense matrix of 8 N^2 bytes, see DEVELOPERS.md). */
    public static final int MAX_ELEMENTS = 12_000;
    /** The cap of an accuracy-driven refinement when no element count is given. */
    public static final int DEFAULT_ACCURACY_CAP = 6000;
    /** Tightest and loosest accuracy accepted (relative to the largest bias difference). */
    public static final double MIN_ACCURACY = 1e-12;
    public static final double MAX_ACCURACY = 1e-2;

    public MeshSettings {
        if (targetElements < 8 || targetElements > MAX_ELEMENTS) {
            throw new IllegalArgumentException("target elements must be between 8 and " + MAX_ELEMENTS);
        }
        if (edgeLevels < 0 || edgeLevels > 40) {
            throw new IllegalArgumentException("edge levels must be between 0 and 40");
        }
        if (!Double.isNaN(accuracy) && !(accuracy >= MIN_ACCURACY && accuracy <= MAX_ACCURACY)) {
            throw new IllegalArgumentException("accuracy must be between " + MIN_ACCURACY + " and " + MAX_ACCURACY);
        }
    }

    /** A fixed element count. */
    public MeshSettings(int targetElements, int edgeLevels) {
        this(targetElements, edgeLevels, Double.NaN);
    }

    public static MeshSettings defaults() {
        return new MeshSettings(DEFAULT_TARGET_ELEMENTS, DEFAULT_EDGE_LEVELS);
    }

    /** Whether the solver refines to {@link #accuracy()} (else it meshes to {@link #targetElements()}). */
    public boolean accuracyDriven() {
        return !Double.isNaN(accuracy);
    }

    public MeshSettings withTargetElements(int n) {
        return new MeshSettings(n, edgeLevels, accuracy);
    }

    public MeshSettings withEdgeLevels(int levels) {
        return new MeshSettings(targetElements, levels, accuracy);
    }

    /** The same settings refining to the given accuracy (NaN: back to the fixed element count). */
    public MeshSettings withAccuracy(double relative) {
        return new MeshSettings(targetElements, edgeLevels, relative);
    }
}
