package org.axistack.io;

import static org.axistack.io.StackMessage.*;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;

/**
 * The table of malformed stack files used by the malformed-input tests: each case is a small file,
 * the catalogue entry it must produce, the line it must name (0: no line), the field it must name
 * (null: none) and a piece of text the message must contain.
 */
final class MalformedStacks {

    /** One malformed file. */
    record Case(String label, byte[] bytes, StackMessage id, int line, String field, String contains) {
        @Override
        public String toString() {
            return label;
        }
    }

    /** A valid two-tube stack; line numbers are fixed (see the comments of the cases). */
    static final String BASE = String.join("\n",
            "title = \"t\"",            // 1
            "[beam]",                   // 2
            "particle = \"electron\"",  // 3
            "energy_eV = 500.0",        // 4
            "",                         // 5
            "[[electrode]]",            // 6
            "name = \"a\"",             // 7
            "shape = \"tube\"",         // 8
            "bias_V = 0.0",             // 9
            "radius_mm = 5.0",          // 10
            "z_start_mm = -20.0",       // 11
            "z_end_mm = -1.0",          // 12
            "",                         // 13
            "[[electrode]]",            // 14
            "name = \"b\"",             // 15
            "shape = \"tube\"",         // 16
            "bias_V = -300.0",          // 17
            "radius_mm = 5.0",          // 18
            "z_start_mm = 1.0",         // 19
            "z_end_mm = 20.0",          // 20
            "");

    private static final String BEAM_END = "energy_eV = 500.0\n";

    private MalformedStacks() {
    }

    /** BASE with the first occurrence of {@code from} replaced. */
    static String edit(String from, String to) {
        if (!BASE.contains(from)) {
            throw new IllegalArgumentException(from);
        }
        return BASE.replaceFirst(java.util.regex.Pattern.quote(from), java.util.regex.Matcher.quoteReplacement(to));
    }

    /** BASE with lines added after line 20 (they start at line 21). */
    static String append(String more) {
        return BASE + more;
    }

    /** BASE with electrode b's sizes (lines 16-20) replaced by the given lines, starting at line 16. */
    static String replaceB(String shapeAndSizes) {
        int i = BASE.indexOf("shape = \"tube\"", BASE.indexOf("name = \"b\""));
        return BASE.substring(0, i) + shapeAndSizes + "\n";
    }

    static List<Case> cases() {
        List<Case> c = new ArrayList<>();
        // files that are not stack files at all
        add(c, "empty file", "", EMPTY_FILE, 0, null, "empty");
        add(c, "blank lines only", "\n\n   \n\t\n", EMPTY_FILE, 0, null, "empty");
        add(c, "comments only", "# nothing here\n# still nothing\n", EMPTY_FILE, 0, null, "empty");
        add(c, "old Mac line endings (CR only)", BASE.replace("\n", "\r"), CR_LINE_ENDINGS, 1, null, "every line ends with a carriage return alone");
        add(c, "one CR-only line in a LF file", edit("[beam]\n", "[beam]\r"), CR_LINE_ENDINGS, 2, null, "this line ends");
        add(c, "HTML, not TOML", "<html><body>lens</body></html>\n", NOT_TOML, 1, null, "not valid TOML");
        add(c, "JSON, not TOML", "{\"beam\": {\"particle\": \"electron\"}}\n", NOT_TOML, 1, null, "not valid TOML");
        add(c, "truncated inside a string", BASE.substring(0, BASE.indexOf("name = \"b\"") + 9), NOT_TOML, 15, null, "TOML");
        add(c, "truncated table header", BASE.substring(0, BASE.lastIndexOf("[[electrode]]") + 6), NOT_TOML, 14, null, "TOML");
        add(c, "key given twice", edit(BEAM_END, BEAM_END + "energy_eV = 600.0\n"), DUPLICATE_KEY, 5, null, "previously defined");
        add(c, "float too large for TOML", edit("radius_mm = 5.0", "radius_mm = 1e400"), NUMBER_TOO_LARGE, 10, null, "too large");
        add(c, "integer too large for TOML", edit("bias_V = 0.0", "bias_V = 99999999999999999999"), NUMBER_TOO_LARGE, 9, null, "too large");
        // structure
        add(c, "missing beam", BASE.replace("[beam]\nparticle = \"electron\"\nenergy_eV = 500.0\n", ""), MISSING_BEAM, 0, null, "[beam]");
        add(c, "beam is a number", edit("[beam]\nparticle = \"electron\"\nenergy_eV = 500.0\n", "beam = 3\n"), WRONG_TYPE, 2, "beam", "table");
        add(c, "no electrodes", BASE.substring(0, BASE.indexOf("[[electrode]]")), NO_ELECTRODES, 0, null, "[[electrode]]");
        add(c, "electrode as a single table", BASE.substring(0, BASE.indexOf("[[electrode]]"))
                + "[electrode]\nname = \"a\"\n", WRONG_TYPE, 6, "electrode", "double brackets");
        add(c, "unknown top-level key", edit("title = \"t\"", "titel = \"t\""), UNKNOWN_KEY, 1, "titel", "did you mean 'title'");
        add(c, "title is a number", edit("title = \"t\"", "title = 12"), WRONG_TYPE, 1, "title", "text in double quotes");
        // beam
        add(c, "misspelt energy key", edit("energy_eV = 500.0", "enrgy_eV = 500.0"), UNKNOWN_KEY, 4, "enrgy_eV", "did you mean 'energy_eV'");
        add(c, "energy key with wrong case of unit", edit("energy_eV = 500.0", "energy_keV = 0.5"), UNKNOWN_KEY, 4, "energy_keV", "did you mean 'energy_eV'");
        add(c, "misspelt particle", edit("\"electron\"", "\"electorn\""), UNKNOWN_PARTICLE, 3, "particle", "did you mean 'electron'");
        add(c, "ion without mass", edit("\"electron\"", "\"ion\"\ncharge_state = 1"), ION_KEY_MISSING, 2, "mass_u", "mass_u");
        add(c, "ion without charge state", edit("\"electron\"", "\"ion\"\nmass_u = 39.962"), ION_KEY_MISSING, 2, "charge_state", "charge_state");
        add(c, "ion with charge state 0", edit("\"electron\"", "\"ion\"\nmass_u = 39.962\ncharge_state = 0"), CHARGE_STATE_ZERO, 5, "charge_state", "neutral");
        add(c, "ion with fractional charge", edit("\"electron\"", "\"ion\"\nmass_u = 39.962\ncharge_state = 1.5"), WRONG_TYPE, 5, "charge_state", "whole number");
        add(c, "ion with negative mass", edit("\"electron\"", "\"ion\"\nmass_u = -4.0\ncharge_state = 1"), OUT_OF_RANGE, 4, "mass_u", "-4");
        add(c, "electron given a mass", edit("\"electron\"", "\"electron\"\nmass_u = 1.0"), ION_KEY_NOT_APPLICABLE, 4, "mass_u", "only to particle");
        add(c, "zero energy", edit("energy_eV = 500.0", "energy_eV = 0.0"), NOT_POSITIVE, 4, "energy_eV", "greater than 0 eV");
        add(c, "negative energy", edit("energy_eV = 500.0", "energy_eV = -50"), NOT_POSITIVE, 4, "energy_eV", "-50");
        add(c, "energy is nan", edit("energy_eV = 500.0", "energy_eV = nan"), NOT_FINITE, 4, "energy_eV", "NaN");
        add(c, "energy is text", edit("energy_eV = 500.0", "energy_eV = \"500\""), WRONG_TYPE, 4, "energy_eV", "a number");
        add(c, "energy missing", edit("energy_eV = 500.0\n", ""), MISSING_KEY, 2, "energy_eV", "energy_eV");
        add(c, "energy absurdly large", edit("energy_eV = 500.0", "energy_eV = 1e30"), OUT_OF_RANGE, 4, "energy_eV", "range");
        add(c, "start after the lens", edit(BEAM_END, BEAM_END + "start_z_mm = 20.0\n"), START_AFTER_LENS, 5, "start_z_mm",
                "after the end of the lens");
        add(c, "start z is text", edit(BEAM_END, BEAM_END + "start_z_mm = \"left\"\n"), WRONG_TYPE, 5, "start_z_mm", "a number");
        // electrode values
        add(c, "radius is inf", edit("radius_mm = 5.0", "radius_mm = inf"), NOT_FINITE, 10, "radius_mm", "Infinity");
        add(c, "radius is -inf", edit("radius_mm = 5.0", "radius_mm = -inf"), NOT_FINITE, 10, "radius_mm", "finite");
        add(c, "negative radius", edit("radius_mm = 5.0", "radius_mm = -5.0"), NOT_POSITIVE, 10, "radius_mm", "greater than 0 mm");
        add(c, "zero radius", edit("radius_mm = 5.0", "radius_mm = 0"), NOT_POSITIVE, 10, "radius_mm", "greater than 0 mm");
        add(c, "huge radius", edit("radius_mm = 5.0", "radius_mm = 1e300"), OUT_OF_RANGE, 10, "radius_mm", "10000");
        add(c, "huge bias", edit("bias_V = 0.0", "bias_V = 1e12"), OUT_OF_RANGE, 9, "bias_V", "10000000");
        add(c, "bias is a boolean", edit("bias_V = 0.0", "bias_V = true"), WRONG_TYPE, 9, "bias_V", "boolean");
        add(c, "z_end before z_start", edit("z_end_mm = -1.0", "z_end_mm = -30.0"), Z_ORDER, 12, "z_end_mm", "greater than z_start_mm");
        add(c, "zero-length tube", edit("z_end_mm = -1.0", "z_end_mm = -20.0"), Z_ORDER, 12, "z_end_mm", "swap");
        add(c, "negative wall", edit("z_end_mm = -1.0", "z_end_mm = -1.0\nwall_mm = -1.0"), NEGATIVE, 13, "wall_mm", "not be negative");
        // edge radius (a rounded section needs room: at most half the wall and half the length; only on solids)
        add(c, "negative edge radius", edit("z_end_mm = -1.0", "z_end_mm = -1.0\nwall_mm = 1.0\nedge_radius_mm = -0.2"),
                EDGE_RADIUS_NEGATIVE, 14, "edge_radius_mm", "-0.2");
        add(c, "edge radius on a sheet tube", edit("z_end_mm = -1.0", "z_end_mm = -1.0\nedge_radius_mm = 0.2"),
                EDGE_RADIUS_ON_SHEET, 13, "edge_radius_mm", "wall_mm = 0");
        add(c, "edge radius more than half the wall", edit("z_end_mm = -1.0", "z_end_mm = -1.0\nwall_mm = 1.0\nedge_radius_mm = 0.6"),
                EDGE_RADIUS_TOO_LARGE, 14, "edge_radius_mm", "at most 0.5 mm");
        add(c, "edge radius more than half a short tube", edit("z_start_mm = -20.0", "z_start_mm = -1.5")
                .replaceFirst("z_end_mm = -1.0", "z_end_mm = -1.0\nwall_mm = 2.0\nedge_radius_mm = 0.4"),
                EDGE_RADIUS_TOO_LARGE, 14, "edge_radius_mm", "length");
        add(c, "aperture edge radius more than half its thickness", replaceB("shape = \"aperture\"\nbias_V = 1.0\nz_mm = 5.0\nhole_radius_mm = 1.0\nouter_radius_mm = 8.0\nthickness_mm = 0.5\nedge_radius_mm = 0.3"),
                EDGE_RADIUS_TOO_LARGE, 22, "edge_radius_mm", "thickness_mm");
        add(c, "bias missing", edit("bias_V = 0.0\n", ""), MISSING_KEY, 6, "bias_V", "bias_V");
        add(c, "name missing", edit("name = \"a\"\n", ""), MISSING_KEY, 6, "name", "name");
        add(c, "blank name", edit("name = \"a\"", "name = \"  \""), BLANK_NAME, 7, "name", "empty");
        add(c, "name with an escape sequence", edit("name = \"a\"", "name = \"a\\u001b]0;owned\\u0007\""), CONTROL_CHARACTER, 7, "name", "U+001B (escape)");
        add(c, "name with a NUL", edit("name = \"a\"", "name = \"a\\u0000\""), CONTROL_CHARACTER, 7, "name", "U+0000 (NUL)");
        add(c, "name with a bidi override", edit("name = \"a\"", "name = \"a\\u202Eb\""), CONTROL_CHARACTER, 7, "name", "U+202E");
        add(c, "title with a bell", edit("title = \"t\"", "title = \"lens\\u0007\""), CONTROL_CHARACTER, 1, "title", "U+0007 (bell)");
        add(c, "name is a number", edit("name = \"a\"", "name = 7"), WRONG_TYPE, 7, "name", "the number 7");
        add(c, "duplicate names", edit("name = \"b\"", "name = \"a\""), DUPLICATE_NAME, 15, "name", "line 6");
        add(c, "unknown electrode key", edit("radius_mm = 5.0", "radius_m = 5.0"), UNKNOWN_KEY, 10, "radius_m", "did you mean 'radius_mm'");
        add(c, "key of another shape", edit("radius_mm = 5.0", "radius_mm = 5.0\nhole_radius_mm = 1.0"), KEY_NOT_FOR_SHAPE, 11, "hole_radius_mm", "does not apply");
        add(c, "misspelt shape", edit("shape = \"tube\"", "shape = \"tub\""), UNKNOWN_SHAPE, 8, "shape", "did you mean 'tube'");
        add(c, "shape missing", edit("shape = \"tube\"\n", ""), MISSING_KEY, 6, "shape", "shape");
        add(c, "aperture hole as large as plate", replaceB("shape = \"aperture\"\nbias_V = 1.0\nz_mm = 5.0\nhole_radius_mm = 8.0\nouter_radius_mm = 8.0"),
                HOLE_TOO_LARGE, 19, "hole_radius_mm", "smaller than outer_radius_mm");
        add(c, "aperture negative thickness", replaceB("shape = \"aperture\"\nbias_V = 1.0\nz_mm = 5.0\nhole_radius_mm = 1.0\nouter_radius_mm = 8.0\nthickness_mm = -0.5"),
                NEGATIVE, 21, "thickness_mm", "-0.5");
        add(c, "ring wire thicker than ring", replaceB("shape = \"ring\"\nbias_V = 1.0\nz_mm = 5.0\nradius_mm = 2.0\nwire_radius_mm = 3.0"),
                WIRE_TOO_THICK, 20, "wire_radius_mm", "thinner wire");
        add(c, "disk radius missing", replaceB("shape = \"disk\"\nbias_V = 1.0\nz_mm = 5.0"), MISSING_KEY, 14, "radius_mm", "radius_mm");
        // split electrodes (sectors)
        add(c, "deflection without sectors", replaceB("shape = \"tube\"\nbias_V = 1.0\nradius_mm = 5.0\nz_start_mm = 1.0\nz_end_mm = 20.0\ndeflection_x_V = 3.0"),
                SECTOR_KEY_WITHOUT_SECTORS, 21, "deflection_x_V", "sectors = N");
        add(c, "bias and sector biases", replaceB("shape = \"tube\"\nbias_V = 1.0\nradius_mm = 5.0\nz_start_mm = 1.0\nz_end_mm = 20.0\nsectors = 4\nsector_biases_V = [1.0, 2.0, 3.0, 4.0]"),
                CONFLICTING_SECTOR_KEYS, 17, "bias_V", "cannot be given together");
        add(c, "too few sector biases", replaceB("shape = \"tube\"\nradius_mm = 5.0\nz_start_mm = 1.0\nz_end_mm = 20.0\nsectors = 4\nsector_biases_V = [1.0, 2.0, 3.0]"),
                SECTOR_BIAS_COUNT, 21, "sector_biases_V", "has 3 values but the electrode has 4 sectors");
        add(c, "split disk on the axis", replaceB("shape = \"disk\"\nbias_V = 1.0\nz_mm = 25.0\nradius_mm = 8.0\nsectors = 2"),
                SPLIT_ON_AXIS, 20, "sectors", "reaches the axis");
        add(c, "slit wider than a sector", replaceB("shape = \"tube\"\nbias_V = 1.0\nradius_mm = 5.0\nz_start_mm = 1.0\nz_end_mm = 20.0\nsectors = 16\nslit_width_mm = 2.5"),
                SLIT_TOO_WIDE, 22, "slit_width_mm", "narrower than 1.963");
        add(c, "too many sectors", replaceB("shape = \"tube\"\nbias_V = 1.0\nradius_mm = 5.0\nz_start_mm = 1.0\nz_end_mm = 20.0\nsectors = 17"),
                OUT_OF_RANGE, 21, "sectors", "17");
        add(c, "sector bias not a number", replaceB("shape = \"tube\"\nradius_mm = 5.0\nz_start_mm = 1.0\nz_end_mm = 20.0\nsectors = 2\nsector_biases_V = [1.0, \"x\"]"),
                WRONG_TYPE, 21, "sector_biases_V", "number");
        // the central ray's start and the monitor planes
        add(c, "start offset outside the bore", edit(BEAM_END, BEAM_END + "start_x_mm = 4.0\nstart_y_mm = 3.5\n"),
                START_OFFSET_OUTSIDE_BORE, 5, "start_x_mm", "narrowest bore (5 mm, electrode 'a')");
        add(c, "start slope beyond paraxial", edit(BEAM_END, BEAM_END + "start_slope_y_mrad = 150.0\n"),
                OUT_OF_RANGE, 5, "start_slope_y_mrad", "150");
        add(c, "two monitors with one name", append("[[monitor]]\nname = \"viewer\"\nz_mm = 30.0\n[[monitor]]\nname = \"viewer\"\nz_mm = 40.0\n"),
                DUPLICATE_MONITOR, 25, "name", "line 21");
        add(c, "monitor before the beam start", edit(BEAM_END, BEAM_END + "start_z_mm = -30.0\n") + "[[monitor]]\nz_mm = -40.0\n",
                MONITOR_BEFORE_START, 23, "z_mm", "not after the beam start");
        add(c, "monitor without a plane", append("[[monitor]]\nname = \"wire\"\n"), MISSING_KEY, 21, "z_mm", "z_mm");
        add(c, "monitor given as a table", append("[monitor]\nz_mm = 30.0\n"), WRONG_TYPE, 21, "monitor", "[[monitor]]");
        add(c, "too many monitors", append("[[monitor]]\nz_mm = 30.0\n".repeat(51)), TOO_MANY_MONITORS, 21, "monitor", "51");
        // geometry between electrodes
        add(c, "thick tubes overlapping", edit("z_end_mm = -1.0", "z_end_mm = 5.0\nwall_mm = 1.0").replace("z_end_mm = 20.0", "z_end_mm = 20.0\nwall_mm = 1.0"),
                OVERLAP, 6, null, "overlap");
        add(c, "tubes touching at different biases", edit("z_end_mm = -1.0", "z_end_mm = 1.0"), TOUCH, 6, "bias_V", "different biases");
        add(c, "outline crossing a tube", replaceB("shape = \"outline\"\nbias_V = 1.0\nclosed = true\npoints_mm = [[-10.0, 3.0], [-5.0, 3.0], [-5.0, 7.0], [-10.0, 7.0]]"),
                OVERLAP, 6, null, "'a' and 'b'");
        // outlines
        add(c, "self-crossing outline", replaceB("shape = \"outline\"\nbias_V = 1.0\nclosed = true\npoints_mm = [[5.0, 8.0], [9.0, 12.0], [9.0, 8.0], [5.0, 12.0]]"),
                SELF_CROSSING, 14, "points_mm", "crosses");
        add(c, "outline point below the axis", replaceB("shape = \"outline\"\nbias_V = 1.0\nclosed = false\npoints_mm = [\n  [5.0, 8.0],\n  [9.0, -2.0],\n]"),
                NEGATIVE_RADIUS, 21, "points_mm", "point 2");
        add(c, "outline point with three numbers", replaceB("shape = \"outline\"\nbias_V = 1.0\nclosed = false\npoints_mm = [[5.0, 8.0], [9.0, 8.0, 1.0]]"),
                BAD_POINT, 19, "points_mm", "point 2");
        add(c, "outline point as text", replaceB("shape = \"outline\"\nbias_V = 1.0\nclosed = false\npoints_mm = [[5.0, 8.0], \"9, 8\"]"),
                BAD_POINT, 19, "points_mm", "point 2");
        add(c, "outline with one point", replaceB("shape = \"outline\"\nbias_V = 1.0\nclosed = false\npoints_mm = [[5.0, 8.0]]"),
                TOO_FEW_POINTS, 19, "points_mm", "at least 2");
        add(c, "outline repeats a point", replaceB("shape = \"outline\"\nbias_V = 1.0\nclosed = false\npoints_mm = [[5.0, 8.0], [5.0, 8.0], [9.0, 8.0]]"),
                REPEATED_POINT, 19, "points_mm", "point 2");
        add(c, "outline point 0.5 um from the previous", replaceB("shape = \"outline\"\nbias_V = 1.0\nclosed = false\npoints_mm = [[5.0, 8.0], [5.0005, 8.0], [9.0, 8.0]]"),
                REPEATED_POINT, 19, "points_mm", "point 2 (z = 5.0005 mm, r = 8 mm) is only 0.0005 mm, less than the smallest size of 0.001 mm, from the previous point (z = 5 mm, r = 8 mm)");
        add(c, "closed outline with an edge on the axis", replaceB("shape = \"outline\"\nbias_V = 1.0\nclosed = true\npoints_mm = [[5.0, 0.0], [9.0, 0.0], [9.0, 3.0], [5.0, 3.0]]"),
                AXIS_EDGE, 19, "points_mm", "open outline (closed = false)");
        add(c, "outline arc with collinear via", replaceB("shape = \"outline\"\nbias_V = 1.0\nclosed = false\npoints_mm = [[5.0, 8.0], [9.0, 8.0, 7.0, 8.0]]"),
                ARC_COLLINEAR, 19, "points_mm", "via point");
        add(c, "outline without closed", replaceB("shape = \"outline\"\nbias_V = 1.0\npoints_mm = [[5.0, 8.0], [9.0, 8.0]]"),
                MISSING_KEY, 14, "closed", "closed");
        add(c, "outline closed is text", replaceB("shape = \"outline\"\nbias_V = 1.0\nclosed = \"yes\"\npoints_mm = [[5.0, 8.0], [9.0, 8.0]]"),
                WRONG_TYPE, 18, "closed", "true or false");
        add(c, "outline points not an array", replaceB("shape = \"outline\"\nbias_V = 1.0\nclosed = false\npoints_mm = 5.0"),
                WRONG_TYPE, 19, "points_mm", "array of points");
        StringBuilder many = new StringBuilder("shape = \"outline\"\nbias_V = 1.0\nclosed = false\npoints_mm = [");
        for (int i = 0; i < 600; i++) {
            many.append(i == 0 ? "" : ", ").append("[").append(5.0 + i * 0.01).append(", 8.0]");
        }
        add(c, "outline with too many points", replaceB(many + "]"), TOO_MANY_POINTS, 19, "points_mm", "600");
        // other tables
        add(c, "mesh budget too large", append("[mesh]\ntarget_elements = 100000\n"), OUT_OF_RANGE, 22, "target_elements", "12000");
        add(c, "mesh budget a million", append("[mesh]\ntarget_elements = 1000000\n"), OUT_OF_RANGE, 22, "target_elements", "1000000 is outside the accepted range 8 to 12000. Fix");
        add(c, "mesh budget fractional", append("[mesh]\ntarget_elements = 1200.5\n"), WRONG_TYPE, 22, "target_elements", "whole number");
        add(c, "mesh accuracy loose", append("[mesh]\naccuracy = 0.5\n"), OUT_OF_RANGE, 22, "accuracy", "outside the accepted range");
        add(c, "mesh accuracy text", append("[mesh]\naccuracy = \"fine\"\n"), WRONG_TYPE, 22, "accuracy", "1e-7");
        add(c, "mesh key misspelt", append("[mesh]\nedge_level = 10\n"), UNKNOWN_KEY, 22, "edge_level", "did you mean 'edge_levels'");
        add(c, "limits in the wrong order", append("[limits]\ncomfort_surface_field_V_per_mm = 8000.0\naggressive_surface_field_V_per_mm = 4000.0\n"),
                LIMITS_ORDER, 23, "aggressive_surface_field_V_per_mm", "below the comfort limit");
        add(c, "gap rule limits in the wrong order", append("[limits]\ngap_comfort_V_at_1mm = 8000.0\ngap_aggressive_V_at_1mm = 6000.0\n"),
                GAP_LIMITS_ORDER, 23, "gap_aggressive_V_at_1mm", "below its comfort voltage");
        add(c, "gap rule exponent above 1", append("[limits]\ngap_exponent = 1.5\n"), GAP_EXPONENT_RANGE, 22, "gap_exponent", "at most 1");
        add(c, "gap rule exponent zero", append("[limits]\ngap_exponent = 0.0\n"), GAP_EXPONENT_RANGE, 22, "gap_exponent", "found 0");
        add(c, "gap rule voltage negative", append("[limits]\ngap_comfort_V_at_1mm = -5000.0\n"), NOT_POSITIVE, 22, "gap_comfort_V_at_1mm", "V");
        add(c, "gap rule key misspelt", append("[limits]\ngap_exponant = 0.5\n"), UNKNOWN_KEY, 22, "gap_exponant", "did you mean 'gap_exponent'");
        add(c, "negative comfort limit", append("[limits]\ncomfort_surface_field_V_per_mm = -1.0\n"), NOT_POSITIVE, 22, "comfort_surface_field_V_per_mm", "V/mm");
        add(c, "screen z is nan", append("[screen]\nz_mm = nan\n"), NOT_FINITE, 22, "z_mm", "NaN");
        add(c, "screen key without unit", append("[screen]\nz = 40.0\n"), UNKNOWN_KEY, 22, "z", "did you mean 'z_mm'");
        // sizes and encodings
        StringBuilder tooMany = new StringBuilder(BASE);
        for (int i = 0; i < 201; i++) {
            tooMany.append("[[electrode]]\nname = \"e").append(i).append("\"\nshape = \"ring\"\nbias_V = 0.0\nz_mm = ")
                    .append(30 + i).append(".0\nradius_mm = 9.0\nwire_radius_mm = 0.1\n");
        }
        add(c, "too many electrodes", tooMany.toString(), TOO_MANY_ELECTRODES, 0, null, "limit of 200");
        StringBuilder manyOutlines = new StringBuilder(BASE);
        for (int e = 0; e < 3; e++) {
            manyOutlines.append("[[electrode]]\nname = \"o").append(e).append("\"\nshape = \"outline\"\nbias_V = 0.0\nclosed = false\npoints_mm = [");
            for (int i = 0; i < 450; i++) {
                manyOutlines.append(i == 0 ? "" : ", ").append("[").append(30 + e * 10 + i * 0.01).append(", 8.0]");
            }
            manyOutlines.append("]\n");
        }
        add(c, "too many outline points in all", manyOutlines.toString(), TOO_MANY_POINTS_TOTAL, 0, "points_mm", "1350 points in all");
        add(c, "a 900 kB line", BASE + "# " + "x".repeat(900_000) + "\n", LINE_TOO_LONG, 21, null, "900002 characters");
        StringBuilder values = new StringBuilder(BASE + "[screen]\nz_mm = 1.0\nextra = [\n");
        for (int i = 0; i < 100_000; i++) {
            values.append("1,\n");
        }
        add(c, "a hundred thousand array values", values + "]\n", TOO_MANY_VALUES, 0, null, "100000 comma-separated values");
        add(c, "file over 1 MiB", BASE + "# " + "x".repeat(1 << 20) + "\n", FILE_TOO_LARGE, 0, null, "1048576");
        byte[] latin1 = edit("title = \"t\"", "title = \"Linse f\u00fcr Ionen\"").getBytes(StandardCharsets.ISO_8859_1);
        c.add(new Case("non-UTF-8 bytes", latin1, NOT_UTF8, 1, null, "UTF-8"));
        byte[] bin = {(byte) 0x89, 'P', 'N', 'G', 13, 10, 26, 10, 0, 0, 0, 13};
        c.add(new Case("a PNG image", bin, NOT_UTF8, 1, null, "offset 0"));
        return c;
    }

    private static void add(List<Case> c, String label, String text, StackMessage id, int line, String field, String contains) {
        c.add(new Case(label, text.getBytes(StandardCharsets.UTF_8), id, line, field, contains));
    }
}
