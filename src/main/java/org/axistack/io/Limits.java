package org.axistack.io;

/**
 * Bounds on stack-file input: what the tool accepts before it spends memory or time. Sizes in the
 * units of the stack file.
 */
public final class Limits {
    /** Largest stack file, bytes (1 MiB); checked before the file is read. */
    public static final long MAX_FILE_BYTES = 1L << 20;
    /** Longest line, characters (a 500-point outline with arcs fits on one line). */
    public static final int MAX_LINE_CHARS = 40_000;
    /**
     * Most commas in a file: bounds the number of array values, which the TOML parser handles in
     * super-linear time (about 5 s for 20 000 values, 1.5 s for 6000, on this class of machine). A
     * full stack of 1000 arc points needs about 5000.
     */
    public static final int MAX_COMMAS = 6_000;
    /** Most electrodes in one stack. */
    public static final int MAX_ELECTRODES = 200;
    /** Most points in one outline. */
    public static final int MAX_OUTLINE_POINTS = 500;
    /** Most outline points in one stack, all outlines together (bounds the geometry checks' work). */
    public static final int MAX_TOTAL_POINTS = 1000;
    /** Largest |coordinate| or size, mm (10 m). */
    public static final double MAX_LENGTH_MM = 10_000.0;
    /** Smallest non-zero size, mm (1 micrometre). */
    public static final double MIN_SIZE_MM = 0.001;
    /** Largest |bias|, V (10 MV). */
    public static final double MAX_BIAS_V = 1e7;
    /** Largest kinetic energy, eV (10 GeV). */
    public static final double MAX_ENERGY_EV = 1e10;
    /** Ion mass range, u. */
    public static final double MIN_MASS_U = 1e-4;
    public static final double MAX_MASS_U = 1e6;
    /** Largest |charge state|. */
    public static final int MAX_CHARGE_STATE = 200;
    /** Largest surface-field limit, V/mm. */
    public static final double MAX_FIELD_V_PER_MM = 1e6;

    private Limits() {
    }
}
