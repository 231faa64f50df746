package org.axistack.size;

/** What the sizer minimises among designs that meet every requirement. */
public enum Objective {
    SPHERICAL("spherical", "least spherical aberration Cs"),
    CHROMATIC("chromatic", "least chromatic aberration Cc"),
    BIAS("bias", "least bias magnitude"),
    FIELD_MARGIN("field_margin", "largest surface-field margin"),
    LENGTH("length", "shortest stack");

    private final String keyword;
    private final String description;

    Objective(String keyword, String description) {
        this.keyword = keyword;
        this.description = description;
    }

    public String keyword() {
        return keyword;
    }

    public String description() {
        return description;
    }

    /** The value to minimise (positive; compared on a log scale by the optimiser). */
    public double score(Design d) {
        return switch (this) {
            case SPHERICAL -> d.spherical_m();
            case CHROMATIC -> d.chromatic_m();
            case BIAS -> d.maxAbsBias_V();
            case FIELD_MARGIN -> d.maxSurfaceField_V_per_m();
            case LENGTH -> d.length_m();
        };
    }

    public static Objective byKeyword(String k) {
        for (Objective o : values()) {
            if (o.keyword.equals(k)) {
                return o;
            }
        }
        return null;
    }
}
