package org.axistack.model;

import java.util.LinkedHashMap;
import java.util.Map;

/**
 * The catalogue of physics failures a user can meet: a request the physics cannot carry out (a beam that cannot
 * reach its start plane, a ray placed inside an electrode, an energy spread wider than the beam's energy) or an
 * outcome that ends the work (the lens does not converge the aberration rays). Each entry has a problem and a fix,
 * written like the input-file catalogue ({@link MessageTemplate}); lengths in millimetres, angles in mrad,
 * potentials in volts, energies in eV, currents in amperes, as the user gives them.
 *
 * <p>Checks that only a programming error can fail (a null field, a negative thread count from code) stay plain
 * {@link IllegalArgumentException}s: the command line reports those as a bug, not as the user's mistake.
 */
public enum PhysicsMessage implements MessageTemplate.Entry {
    // beam envelope
    CURRENT_NEGATIVE(Kind.REQUEST, "beam current must be a finite number >= 0 A, got {current} A",
            "give the magnitude of the current (the sign of the charge comes from the particle)"),
    CURRENT_SCAN_TOP(Kind.REQUEST, "the top of a current scan must be a finite number > 0 A, got {current} A",
            "give the largest current to scan as a positive number of amperes"),
    CURRENT_SCAN_STEPS(Kind.REQUEST, "a current scan needs between 1 and 10000 steps, got {steps}",
            "give a step count in that range"),
    EMITTANCE_NEGATIVE(Kind.REQUEST, "emittance must be a finite number >= 0, got {emittance} mm mrad",
            "give the edge (or rms) emittance as a positive number"),
    START_RADIUS(Kind.REQUEST, "start radius of the envelope must be finite and > 0 when current or emittance is"
            + " non-zero, got {radius} mm", "give the beam radius at the start plane"),
    START_SLOPE(Kind.REQUEST, "start slope of the envelope must be finite, got {slope} mrad",
            "give a finite slope of the envelope edge (0 for a parallel beam)"),
    SOURCE_DIVERGENCE(Kind.REQUEST, "source divergence must be a finite half-angle >= 0 mrad, got {divergence} mrad",
            "give the half-angle of the source's cone of rays (0 for a parallel beam)"),
    ENVELOPE_RANGE(Kind.REQUEST, "envelope range must run forward with finite ends: from {from} mm to {to} mm",
            "choose an end plane after the start plane"),
    NOT_REACHING_START(Kind.OUTCOME, "the beam cannot reach the start plane z = {z} mm: its kinetic energy there would"
            + " be {energy} eV per unit charge (<= 0)", "move the start plane or raise the beam energy"),

    // rays
    TRACE_TOLERANCE(Kind.REQUEST, "trace tolerance must lie between 1e-15 and 1e-3, got {tolerance}",
            "give a relative tolerance in that range (1e-9 is the default)"),
    SCREEN_OUTSIDE_REGION(Kind.REQUEST, "screen at z = {z} mm lies outside the traced region ({region})",
            "put the screen inside it"),
    PLANE_OUTSIDE_REGION(Kind.REQUEST, "plane at z = {z} mm lies outside the traced region ({region})",
            "choose planes inside it"),
    PLANE_BEYOND_SCREEN(Kind.REQUEST, "plane at z = {z} mm lies beyond the screen at z = {screen} mm: rays stop at the"
            + " screen", "move the screen or drop the plane"),
    RAY_OUTSIDE_REGION(Kind.REQUEST, "ray {ray} starts at z = {z} mm, r = {r} mm, outside the traced region ({region})",
            "start it inside"),
    RAY_INSIDE_ELECTRODE(Kind.REQUEST, "ray {ray} starts inside electrode '{electrode}' at z = {z} mm, r = {r} mm",
            "start rays in the open bore"),
    RAY_AT_SCREEN(Kind.REQUEST, "ray {ray} starts at z = {z} mm, at or beyond the screen at z = {screen} mm",
            "start rays before the screen"),
    PLANE_BEFORE_START(Kind.REQUEST, "plane at z = {z} mm lies before the start of ray {ray} at z = {start} mm",
            "choose planes after the start"),
    RAY_NO_ENERGY(Kind.REQUEST, "ray {ray} cannot start at z = {z} mm, r = {r} mm: the potential there ({potential} V)"
            + " leaves it no kinetic energy (energy {energy} eV at 0 V)",
            "start it where the potential lets it move, or raise its energy"),
    RAY_START_NOT_FINITE(Kind.REQUEST, "ray {ray} has a start value that is not a finite number ({value})",
            "give finite start positions, angles and energies"),
    RAY_START_BACKWARD(Kind.REQUEST, "ray {ray} does not start towards +z (its angle from the axis is 90 degrees or"
            + " more)", "give start angles below 90 degrees from the axis"),
    RAY_ENERGY(Kind.REQUEST, "ray {ray} has energy {energy} eV; a ray needs a positive energy",
            "give a positive beam energy"),
    RAY_COUNT(Kind.REQUEST, "{what}: asked for {count} rays", "ask for at least one ray"),
    RAY_SET_NEGATIVE(Kind.REQUEST, "{what} must be zero or positive, got {value} {unit}", "give zero or a positive value"),
    FAN_ANGLE(Kind.REQUEST, "fan half-angle {angle} mrad is not below 90 degrees", "give a half-angle below 1570 mrad"),
    GAUSSIAN_CUTOFF(Kind.REQUEST, "Gaussian beam cutoff {cutoff} mm is too small for sigma {sigma} mm",
            "use a cutoff of at least 0.1 sigma (3 sigma is usual)"),
    ENERGY_OFFSETS_EMPTY(Kind.REQUEST, "no energy offsets were given", "give at least one value (0 for the nominal"
            + " energy)"),
    ENERGY_OFFSET_NOT_FINITE(Kind.REQUEST, "energy offset {offset} is not a finite number", "give offsets in eV as"
            + " ordinary numbers"),
    ENERGY_OFFSET_TOO_LOW(Kind.REQUEST, "energy offset {offset} eV leaves ray {ray} with no energy ({energy} eV)",
            "use offsets above -{energy} eV"),
    ENERGY_SPREAD_NEGATIVE(Kind.REQUEST, "energy spread must be zero or positive, got {spread} eV",
            "give the standard deviation of the energy in eV, or 0"),
    FIELD_MAP_TOO_FINE(Kind.REQUEST, "a field map step of {step} mm would make {nodes} nodes, more than the limit of"
            + " {limit}", "use a step of at least {minimum} mm, or trace exactly in the direct field"),
    ABERRATION_HEIGHT(Kind.REQUEST, "the largest aberration ray height must be positive, got {height} mm",
            "give a positive ray height well inside the bore"),
    ABERRATION_RAY_LOST(Kind.OUTCOME, "the aberration ray at height {height} mm did not reach z = {z} mm ({status})",
            "lower the largest ray height"),
    ABERRATION_NOT_CONVERGING(Kind.OUTCOME, "the lens does not converge the ray at height {height} mm: traced"
            + " aberration coefficients need a converging lens", "set biases that focus, or leave out the traced"
            + " aberrations"),

    // probe
    PROBE_BRIGHTNESS(Kind.REQUEST, "the reduced brightness must be a positive number of A/(m^2 sr V), got {value}",
            "give the source's reduced brightness from its data sheet or a measurement"),
    PROBE_ENERGY_SPREAD(Kind.REQUEST, "the energy spread must be finite and >= 0 eV, got {value} eV",
            "give the source's energy spread (FWHM) in eV, or 0"),
    PROBE_SOURCE_SIZE(Kind.REQUEST, "the virtual source size must be a positive number of nm, got {value} nm",
            "give the source's virtual size (FW50), or leave it out to let the aperture angle set the magnification"),
    PROBE_NOT_CONVERGING(Kind.OUTCOME, "the lens is {kind} at these biases: it forms no real probe",
            "set biases that focus (tune finds them)"),
    PROBE_OBJECT_IN_FIELD(Kind.REQUEST, "the object at z = {z} mm lies inside the field (after the object-side reference"
            + " plane at {plane} mm)", "put the source in field-free space before the lens"),
    PROBE_NO_REAL_IMAGE(Kind.OUTCOME, "the object at z = {z} mm has no real image (magnification {m}): no probe",
            "move the object farther from the lens than its focal point, or strengthen the lens"),
    PROBE_ANGLE_RANGE(Kind.REQUEST, "the aperture angle range must satisfy 0 < min < max, got {min} to {max} mrad",
            "give two positive angles, the smaller first"),
    PROBE_CURRENT_RANGE(Kind.REQUEST, "the current range must satisfy 0 < min < max, got {min} to {max} A",
            "give two positive currents, the smaller first"),
    PROBE_CURVE_POINTS(Kind.REQUEST, "the probe curve needs 2 to 10000 points, got {points}",
            "give a point count in that range"),

    // tuning
    BIAS_RANGE(Kind.REQUEST, "a bias range needs finite ends with from < to, got {from} V to {to} V",
            "give the lower bias first and make the two different"),
    UNKNOWN_ELECTRODE(Kind.REQUEST, "no electrode named '{name}' in the stack", "use one of: {names}"),
    SAME_ELECTRODE_TWICE(Kind.REQUEST, "two conditions need two different electrodes, but both are '{name}'",
            "name a second electrode to vary"),
    MAGNIFICATION_VALUE(Kind.REQUEST, "magnification must be finite and non-zero, got {value}",
            "give the wanted lateral magnification, negative for a real inverted image (for example -2)"),
    FOCAL_LENGTH_VALUE(Kind.REQUEST, "focal length must be finite and non-zero, got {value} mm",
            "give the wanted image-side focal length in mm"),
    MAGNIFICATION_NEEDS_OBJECT(Kind.REQUEST, "a magnification needs a finite object position",
            "give the object position (object_z_mm in [beam], or --object-z)"),
    IMAGE_PLANE(Kind.REQUEST, "the image plane must be a finite z, got {z} mm", "give the image plane in mm"),
    OBJECT_AFTER_IMAGE(Kind.REQUEST, "the object at z = {object} mm does not lie before the image plane at z = {image}"
            + " mm", "put the object upstream of the image plane");

    /** Whether the user asked for something the physics cannot do, or the physics ended the work. */
    public enum Kind {
        /** The request cannot be carried out as given (the command line exits 2, as for bad input). */
        REQUEST,
        /** The work ran and the physics says no (the command line exits 3). */
        OUTCOME
    }

    private final Kind kind;
    private final String problem;
    private final String fix;

    PhysicsMessage(Kind kind, String problem, String fix) {
        this.kind = kind;
        this.problem = problem;
        this.fix = fix;
    }

    public Kind kind() {
        return kind;
    }

    @Override
    public String problemTemplate() {
        return problem;
    }

    @Override
    public String fixTemplate() {
        return fix;
    }

    /**
     * The exception to throw, with the placeholder values given as name, value pairs (numbers in the units the
     * templates name).
     */
    public PhysicsException exception(Object... namesAndValues) {
        if (namesAndValues.length % 2 != 0) {
            throw new IllegalArgumentException("message " + name() + ": names and values come in pairs");
        }
        Map<String, Object> values = new LinkedHashMap<>();
        for (int i = 0; i < namesAndValues.length; i += 2) {
            values.put((String) namesAndValues[i], namesAndValues[i + 1]);
        }
        return new PhysicsException(this, values);
    }
}
