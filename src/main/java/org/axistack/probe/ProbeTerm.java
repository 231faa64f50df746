package org.axistack.probe;

/** The partial contributions to the probe diameter. */
public enum ProbeTerm {
    /** Geometric image of the source. */
    SOURCE("source image"),
    /** Diffraction at the aperture. */
    DIFFRACTION("diffraction"),
    /** Third-order spherical aberration. */
    SPHERICAL("spherical aberration"),
    /** First-order chromatic aberration from the energy spread. */
    CHROMATIC("chromatic aberration");

    private final String words;

    ProbeTerm(String words) {
        this.words = words;
    }

    /** The term in words, for reports. */
    public String words() {
        return words;
    }
}
