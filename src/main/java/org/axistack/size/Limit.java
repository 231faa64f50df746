package org.axistack.size;

/** The limits a design must respect, as named in output. */
public enum Limit {
    BIAS("supply (max_bias_V)", "V"),
    SURFACE_FIELD("surface field (max_surface_field_V_per_mm)", "V/mm"),
    LENGTH("overall length (max_length_mm)", "mm"),
    BORE("bore (min_bore_radius_mm)", "mm"),
    PLACEMENT("room between object and image (the stack must lie between them)", "mm"),
    /** The voltage across the facing gap nearest its limit against the comfort voltage of the gap rule there. */
    GAP("gap rule (voltage across each facing gap, comfort)", "V");

    private final String label;
    private final String unit;

    Limit(String label, String unit) {
        this.label = label;
        this.unit = unit;
    }

    public String label() {
        return label;
    }

    /** Unit of the value and limit as shown to the user. */
    public String unit() {
        return unit;
    }
}
