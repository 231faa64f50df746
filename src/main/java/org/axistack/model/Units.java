package org.axistack.model;

/**
 * The one place where user units meet SI: stack files, command-line values and printed output use
 * millimetres, volts per millimetre and milliradians; everything inside is metres, V/m and radians. In the model
 * package so that physics code that words a number for a message converts here too.
 */
public final class Units {
    private Units() {
    }

    /** Millimetres to metres. */
    public static double mmToM(double mm) {
        return mm / 1000.0;
    }

    /** Metres to millimetres. */
    public static double mToMm(double m) {
        return m * 1000.0;
    }

    /** Volts per millimetre to volts per metre. */
    public static double vPerMmToVPerM(double vPerMm) {
        return vPerMm * 1000.0;
    }

    /** Volts per metre to volts per millimetre. */
    public static double vPerMToVPerMm(double vPerM) {
        return vPerM / 1000.0;
    }

    /** Milliradians to radians. */
    public static double mradToRad(double mrad) {
        return mrad / 1000.0;
    }

    /** Radians to milliradians. */
    public static double radToMrad(double rad) {
        return rad * 1000.0;
    }
}
