package org.axistack.optics;

import org.axistack.model.Numbers;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The words every front end uses to say how good a set of cardinal elements is and how the field was taken to
 * end: one place, so the optics, tune, sweep, plan and size outputs say the same thing.
 */
public final class OpticsAccuracy {

    /** The accuracy the tools ask for by default: 1e-5 of the focal length. */
    public static final double DEFAULT_REQUESTED = 1e-5;
    /** Above this share of the result coming from beyond the traced range, the user is told how to close the lens. */
    public static final double LARGE_FAR_FIELD = 1e-3;

    private OpticsAccuracy() {
    }

    /** One line per side: how the field ends there, and where. */
    public static List<String> ends(CardinalElements c) {
        List<String> out = new ArrayList<>();
        out.add(side("object side", c.objectEnd()));
        out.add(side("image side", c.imageEnd()));
        return out;
    }

    private static String side(String which, FieldEnd end) {
        String where = org.axistack.model.Numbers.plain(end.z_m() * 1e3, org.axistack.model.Numbers.MESSAGE_DIGITS);
        return switch (end.rule()) {
            case FAR_FIELD -> which + ": " + end.rule().description() + " beyond z = " + where + " mm";
            default -> which + ": " + end.rule().description() + ", at z = " + where + " mm";
        };
    }

    /**
     * What the error estimate covers, in words: the integration and where the field is taken as ended, not the
     * boundary-element discretisation (on the demo and the open three-plate lens a doubled mesh moves f by about
     * 5e-9, above the estimate but far below the default accuracy asked).
     */
    public static final String SCOPE = "integration and the field's ends; the mesh's own error is not in it and is"
            + " stated on its own";

    /** The words before the far field's share of the results, in every statement of the estimate. */
    public static final String FAR_FIELD_WORDS = "; the far field beyond the traced range contributes ";

    /** The words before the change when the ended planes move inward. */
    public static final String PLANE_WORDS = "; moving the ended planes inward changes the results by ";

    /** A sentence giving the estimated error and what it comes from. */
    public static String estimate(CardinalElements c) {
        String s = "estimated error " + Numbers.estimate(c.errorEstimate()) + " of f (" + SCOPE;
        if (c.planeSensitivity() > 0) {
            s += "; moving the ended planes 10 % inward changes the results by " + Numbers.estimate(c.planeSensitivity());
        }
        if (c.farFieldShare() > 0) {
            s += FAR_FIELD_WORDS + Numbers.estimate(c.farFieldShare());
        }
        return s + ")";
    }

    /** Empty when the requested accuracy is met, else the warning. */
    public static java.util.Optional<String> shortfall(CardinalElements c, double requested) {
        if (c.errorEstimate() <= requested) {
            return java.util.Optional.empty();
        }
        String why = c.planeSensitivity() >= c.errorEstimate()
                ? "the field has not died away where it is taken as ended (inside a drift tube): lengthen the tube, or"
                        + " move the beam start and screen deeper into it"
                : "the integration did not settle: tighten the tolerance";
        return java.util.Optional.of(String.format(Locale.ROOT,
                "the cardinal elements carry an estimated error of %s of f, more than the %s asked for: %s",
                Numbers.estimate(c.errorEstimate()), Numbers.tolerance(requested), why));
    }

    /** Advice to close an open lens, when its far field matters. */
    public static java.util.Optional<String> closeTheLens(CardinalElements c) {
        if (c.farFieldShare() <= LARGE_FAR_FIELD) {
            return java.util.Optional.empty();
        }
        return java.util.Optional.of(String.format(Locale.ROOT,
                "the lens is open: its electrodes carry a net charge, so its axial potential falls off only like 1/|z|,"
                        + " and %s (relative) of these results comes from the field more than z = %.4g .. %.4g mm away;"
                        + " in the instrument the chamber walls and nearby parts will shape that field instead. Model"
                        + " what closes the lens there (a grounded enclosure, or grounded end plates or tubes before"
                        + " and after the lens) as electrodes of the stack",
                Numbers.estimate(c.farFieldShare()), c.zStart_m() * 1e3, c.zEnd_m() * 1e3));
    }
}
