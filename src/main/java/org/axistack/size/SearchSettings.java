package org.axistack.size;

/**
 * Budget and resolution of a sizing search.
 *
 * @param evaluations   largest number of candidate geometries (field solves) in the search
 * @param meshElements  boundary-element target per candidate (a coarse mesh: the accuracy it costs is
 *                      measured on the winner, see {@link SizingResult#meshCheck()})
 * @param finalElements boundary-element target for the written designs and the tolerance study
 * @param biasSamples   bias samples per candidate when bracketing the focusing biases
 * @param threads       worker threads (candidates evaluated at once)
 */
public record SearchSettings(int evaluations, int meshElements, int finalElements, int biasSamples, int threads) {
    public SearchSettings {
        if (evaluations < 4 || meshElements < 40 || finalElements < 40 || biasSamples < 8 || threads < 1) {
            throw new IllegalArgumentException("search settings out of range");
        }
    }

    public static SearchSettings defaults() {
        return new SearchSettings(30, 250, 600, 16, Runtime.getRuntime().availableProcessors());
    }

    public SearchSettings withMesh(int coarse, int fine) {
        return new SearchSettings(evaluations, coarse, fine, biasSamples, threads);
    }
}
