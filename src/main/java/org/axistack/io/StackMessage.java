package org.axistack.io;

import java.util.Map;
import org.axistack.model.MessageTemplate;

/**
 * The catalogue of user-facing input error messages: every message the tool prints about a bad
 * stack file or a bad command-line value comes from here. Each entry has a problem template and a
 * fix template; placeholders are written {name} and filled by {@link #format(Map)}. Lengths in the
 * messages are millimetres, potentials volts, energies electronvolts, as in the stack file.
 */
public enum StackMessage implements MessageTemplate.Entry {
    FILE_NOT_FOUND("the file does not exist",
            "check the path, or leave STACK out to use the built-in demo lens"),
    FILE_UNREADABLE("the file cannot be read ({reason})",
            "check that the path names a readable file, not a folder, and that you may read it"),
    FILE_TOO_LARGE("the file is {size} bytes, more than the limit of {limit} bytes",
            "a stack file is normally a few kilobytes; check that this is the right file, or split the stack"),
    LINE_TOO_LONG("the line has {count} characters, more than the limit of {limit}",
            "break long arrays over several lines; a stack file has short lines"),
    TOO_MANY_VALUES("the file holds {count} comma-separated values, more than the limit of {limit}",
            "a stack needs far fewer values; check that this is the right file, or describe outlines with fewer points"),
    NOT_UTF8("the file contains bytes that are not UTF-8 text (first bad byte at offset {offset})",
            "save the file as plain UTF-8 text"),
    CR_LINE_ENDINGS("{which} with a carriage return alone (the old Mac OS line ending), which TOML does not accept",
            "save the file with Unix (LF) or Windows (CR LF) line endings: most editors have a line-ending setting,"
                    + " or convert it with  tr '\\r' '\\n' < old.toml > new.toml"),
    EMPTY_FILE("the file is empty",
            "copy a stack from lens-library/ and edit it; a stack needs a [beam] table and at least one [[electrode]]"),
    NOT_TOML("the file is not valid TOML: {detail}",
            "correct the syntax at that line: keys are written name = value, text in double quotes, tables as [beam] and [[electrode]]"),
    NUMBER_TOO_LARGE("a number is too large to read ({detail})",
            "write an ordinary number within the accepted range: lengths up to 10000 mm, biases up to 10000000 V"),
    DUPLICATE_KEY("a key is given twice in the same table ({detail})",
            "keep one of the two lines; to describe a second electrode, start a new [[electrode]] table"),
    UNKNOWN_KEY("unknown key '{key}' in {table}{suggestion}",
            "remove or rename it; the keys allowed here are: {allowed}"),
    WRONG_TYPE("expected {expected}, found {found}",
            "write it as {example}"),
    MISSING_KEY("the required key '{key}' is missing",
            "add a line such as {key} = {example}"),
    NOT_FINITE("the value {value} is not a finite number",
            "write an ordinary number such as {example}"),
    OUT_OF_RANGE("{value} {unit} is outside the accepted range {min} to {max} {unit}",
            "give a value within that range ({hint})"),
    NOT_POSITIVE("the value must be greater than 0 {unit}, found {value}",
            "give a positive value such as {example}"),
    NEGATIVE("the value must not be negative, found {value} {unit}",
            "give 0 for a thin sheet, or a positive thickness such as {example}"),
    Z_ORDER("z_end_mm ({end} mm) must be greater than z_start_mm ({start} mm)",
            "swap the two values, or correct the one that is wrong"),
    HOLE_TOO_LARGE("hole_radius_mm ({hole} mm) must be smaller than outer_radius_mm ({outer} mm)",
            "make the hole smaller or the plate larger"),
    EDGE_RADIUS_NEGATIVE("edge_radius_mm must not be negative, found {value} mm",
            "give 0 (or leave it out) for sharp corners, or a positive radius such as 0.25"),
    EDGE_RADIUS_ON_SHEET("edge_radius_mm ({radius} mm) needs a solid electrode, but {key} = 0 makes a thin sheet with no corners to round",
            "give {key} at least twice the radius, or remove edge_radius_mm"),
    EDGE_RADIUS_TOO_LARGE("edge_radius_mm ({radius} mm) is more than half the {what} ({size} mm): the rounded corners would overlap",
            "give edge_radius_mm at most {max} mm, or make the {what} larger"),
    WIRE_TOO_THICK("wire_radius_mm ({wire} mm) must be smaller than radius_mm ({radius} mm)",
            "use a thinner wire or a larger ring"),
    SECTOR_KEY_WITHOUT_SECTORS("'{key}' applies only to an electrode split into sectors",
            "add sectors = N (2 to 16) to this electrode, or remove {key}"),
    CONFLICTING_SECTOR_KEYS("{first} and {second} cannot be given together",
            "give sector_biases_V alone (one bias per sector), or bias_V with deflection_x_V and deflection_y_V"),
    SECTOR_BIAS_COUNT("sector_biases_V has {count} values but the electrode has {sectors} sectors",
            "give one bias per sector: sector 1 centred on +x (turned by split_rotation_deg), numbered counter-clockwise toward +y"),
    SPLIT_ON_AXIS("electrode '{name}' reaches the axis (r = 0), so it cannot be split into sectors",
            "split only electrodes that leave the axis free (tube, aperture, ring, or an outline with a bore), or remove sectors"),
    SLIT_TOO_WIDE("slit_width_mm ({slit} mm) is not narrower than one sector at the electrode's smallest radius ({arc} mm of arc)",
            "make the slits narrower than {arc} mm, or use fewer sectors"),
    UNKNOWN_SHAPE("unknown shape '{shape}'{suggestion}",
            "use one of: {shapes}"),
    KEY_NOT_FOR_SHAPE("the key '{key}' does not apply to shape '{shape}'",
            "remove it; the keys for {shape} are: {allowed}"),
    UNKNOWN_PARTICLE("unknown particle '{particle}'{suggestion}",
            "use \"electron\", \"proton\" or \"ion\" (an ion also needs mass_u and charge_state)"),
    ION_KEY_MISSING("an ion needs '{key}'",
            "add {key} = {example} to [beam] (mass in unified atomic mass units, charge in units of e)"),
    ION_KEY_NOT_APPLICABLE("'{key}' applies only to particle = \"ion\", but the particle is '{particle}'",
            "remove {key}, or set particle = \"ion\""),
    CHARGE_STATE_ZERO("charge_state is 0: a neutral particle is not steered by electrodes",
            "give the ion's charge in units of e, for example 1 (or -1 for a negative ion)"),
    MISSING_BEAM("the file has no [beam] table",
            "add a [beam] table, for example: [beam] particle = \"electron\", energy_eV = 500.0 (one key per line)"),
    NO_ELECTRODES("the file has no [[electrode]] table",
            "add at least one electrode, for example a tube with name, shape, bias_V, radius_mm, z_start_mm and z_end_mm"),
    TOO_MANY_ELECTRODES("the file has {count} electrodes, more than the limit of {limit}",
            "a lens stack has a handful of electrodes; merge parts at the same bias into one outline"),
    TOO_MANY_POINTS("the outline has {count} points, more than the limit of {limit}",
            "describe the shape with fewer points, using arcs for curved parts"),
    TOO_MANY_POINTS_TOTAL("the outlines have {count} points in all, more than the limit of {limit}",
            "describe the shapes with fewer points, using arcs for curved parts, or use tube, aperture, disk and ring shapes"),
    TOO_FEW_POINTS("the outline has {count} point(s); it needs at least {min}",
            "list the corners as points_mm = [[z1, r1], [z2, r2], ...]"),
    DUPLICATE_NAME("the name '{name}' is already used by the electrode at line {other}",
            "give every electrode its own name (the names are used by --set)"),
    CONTROL_CHARACTER("character {index} of the text is the control character {code}, which a terminal would act on"
            + " (clear the screen, retitle the window) and files would carry",
            "remove it (in TOML it may be written as an escape such as \\u001b): names and text hold printable characters only"),
    AXIS_EDGE("the closed outline runs along the axis from z = {from} mm to z = {to} mm; a surface on the axis has no"
            + " area of revolution, so the field cannot be solved",
            "write the solid as an open outline (closed = false) that starts on the axis, goes round the shape and"
            + " ends on the axis, without the edge along r = 0"),
    BLANK_NAME("the electrode name is empty",
            "give the electrode a short name such as \"focus\""),
    BAD_POINT("point {index} is not [z, r] or [z, r, via_z, via_r] in millimetres",
            "write each point as two numbers, or four for an arc through (via_z, via_r)"),
    NEGATIVE_RADIUS("point {index} has r = {r} mm, below the axis",
            "the meridian outline lives in r >= 0 (the axis is r = 0); correct the point"),
    REPEATED_POINT("point {index} (z = {z} mm, r = {r} mm) {relation} the previous point (z = {pz} mm, r = {pr} mm)",
            "remove the point, or move it at least {min} mm from the previous one"),
    ARC_COLLINEAR("point {index}: the arc's via point lies on the straight line between its ends",
            "move the via point off the chord, or write the point as [z, r] for a straight segment"),
    SELF_CROSSING("the outline crosses or touches itself near z = {z} mm, r = {r} mm",
            "reorder the points so that the outline goes round the shape once without crossing"),
    OVERLAP("electrodes '{first}' and '{second}' (line {otherLine}) overlap near z = {z} mm, r = {r} mm",
            "move them apart, or merge them into one outline electrode if they are one part"),
    TOUCH("electrodes '{first}' ({firstBias} V) and '{second}' ({secondBias} V, line {otherLine}) touch near z = {z} mm, r = {r} mm while at different biases",
            "leave an insulating gap between them (lenses usually keep 1 mm or more), or give them the same bias"),
    MODEL_REJECTED("the values do not describe a valid {what} ({detail})",
            "check this table's numbers against the stack file format in the README"),
    START_AFTER_LENS("the beam starts at z = {start} mm, at or after the end of the lens (its last electrode ends at"
            + " z = {end} mm)", "set start_z_mm before the lens (upstream of the first electrode, or inside the lens"
            + " field if the beam really starts there), or remove it"),
    START_OFFSET_OUTSIDE_BORE("the beam starts {offset} mm from the axis, not inside the narrowest bore ({bore} mm,"
            + " electrode '{name}')", "give start_x_mm and start_y_mm so that the start lies well inside every bore"
            + " (the steering analyses are first order: offsets of a small fraction of the bore)"),
    DUPLICATE_MONITOR("the monitor name '{name}' is already used by the monitor at line {other}",
            "give each [[monitor]] its own name, or leave name out"),
    MONITOR_BEFORE_START("the monitor plane z = {z} mm is not after the beam start (start_z_mm = {start} mm)",
            "put monitors downstream of the beam start, or move start_z_mm upstream"),
    TOO_MANY_MONITORS("the stack has {count} [[monitor]] tables, more than the limit of {limit}",
            "keep the planes the bench really watches"),
    LIMITS_ORDER("the aggressive limit ({aggressive} V/mm) is below the comfort limit ({comfort} V/mm)",
            "make aggressive_surface_field_V_per_mm at least comfort_surface_field_V_per_mm"),
    GAP_LIMITS_ORDER("the gap rule's aggressive voltage at 1 mm ({aggressive} V) is below its comfort voltage ({comfort} V)",
            "make gap_aggressive_V_at_1mm at least gap_comfort_V_at_1mm"),
    GAP_EXPONENT_RANGE("gap_exponent must be greater than 0 and at most 1, found {value}",
            "give the exponent of the rule V = V1 x (gap / 1 mm)^exponent, for example 0.5 (common practice for vacuum "
            + "gaps above about a millimetre); 1 means a constant average field, more would let wide gaps hold more field"),
    SET_SYNTAX("--set '{arg}' is not of the form NAME=VOLTS",
            "write for example --set focus=-1400"),
    SET_UNKNOWN_NAME("--set names electrode '{name}', which the stack does not have{suggestion}",
            "use one of the stack's electrodes: {names}"),
    SET_BAD_NUMBER("--set {name}={value}: '{value}' is not a finite number of volts",
            "write a plain number of volts such as --set {name}=-1400"),
    SET_TWICE("--set gives electrode '{name}' two biases",
            "give each electrode at most one --set"),
    REQ_NO_TABLE("the requirements file has no [{table}] table",
            "add a [{table}] table; lens-library/requirements/ has a complete example"),
    REQ_UNKNOWN_FAMILY("unknown lens family '{family}'{suggestion}",
            "use one of: {allowed}"),
    REQ_UNKNOWN_OBJECTIVE("unknown objective '{objective}'{suggestion}",
            "use one of: {allowed}"),
    REQ_RANGE_SHAPE("expected a size in mm or a range [min, max] in mm, found {found}",
            "write {key} = [3.0, 8.0] to let the sizer vary it, or {key} = 4.0 to fix it"),
    REQ_RANGE_ORDER("the range [{min}, {max}] mm has its lower end above its upper end",
            "write the smaller value first"),
    REQ_TARGET("the target gives {detail}",
            "give image_z_mm (with object_z_mm for a finite object, without it for a parallel beam), or focal_length_mm alone"),
    REQ_IMAGE_ORDER("image_z_mm ({image} mm) must lie after object_z_mm ({object} mm)",
            "rays travel toward +z and the lens centre is at z = 0: put the object at negative z and the image at positive z");

    private final String problem;
    private final String fix;

    StackMessage(String problem, String fix) {
        this.problem = problem;
        this.fix = fix;
    }

    @Override
    public String problemTemplate() {
        return problem;
    }

    @Override
    public String fixTemplate() {
        return fix;
    }
}
