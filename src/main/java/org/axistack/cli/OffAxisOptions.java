package org.axistack.cli;

import java.util.OptionalDouble;
import org.axistack.model.Units;
import picocli.CommandLine;
import picocli.CommandLine.Option;

/**
 * The shared off-axis options of {@code optics} and {@code plan}: the object height and the object-side aperture
 * half-angle at which the off-axis aberrations' effects are given. Use with {@code @Mixin OffAxisOptions offAxis;}
 * and call {@link #check(CommandLine)} before any work.
 */
public final class OffAxisOptions {

    @Option(names = "--object-height-mm", paramLabel = "H",
            description = "Object height in mm for the off-axis aberrations' effects at the image (needs a finite object:"
                    + " [beam] object_z_mm, or --object-z where the command has it).")
    Double objectHeight_mm;

    @Option(names = "--aperture-mrad", paramLabel = "MRAD",
            description = "Object-side aperture half-angle in mrad for the off-axis blur (with --object-height-mm).")
    Double aperture_mrad;

    /** Refuses values that are not positive, and an angle without a height (usage errors, before any solve). */
    void check(CommandLine cl) {
        if (objectHeight_mm != null && !(objectHeight_mm > 0 && Double.isFinite(objectHeight_mm))) {
            throw new CommandLine.ParameterException(cl, "--object-height-mm must be a positive number of millimetres,"
                    + " got " + objectHeight_mm);
        }
        if (aperture_mrad != null && !(aperture_mrad > 0 && Double.isFinite(aperture_mrad))) {
            throw new CommandLine.ParameterException(cl, "--aperture-mrad must be a positive angle in mrad, got "
                    + aperture_mrad);
        }
        if (aperture_mrad != null && objectHeight_mm == null) {
            throw new CommandLine.ParameterException(cl,
                    "--aperture-mrad needs --object-height-mm (the off-axis blur depends on both)");
        }
    }

    /** Whether an object height was given. */
    boolean given() {
        return objectHeight_mm != null;
    }

    /** The object height in metres, if given. */
    OptionalDouble height_m() {
        return objectHeight_mm == null ? OptionalDouble.empty() : OptionalDouble.of(Units.mmToM(objectHeight_mm));
    }

    /** The aperture half-angle in radians, if given. */
    OptionalDouble aperture_rad() {
        return aperture_mrad == null ? OptionalDouble.empty() : OptionalDouble.of(aperture_mrad * 1e-3);
    }
}
