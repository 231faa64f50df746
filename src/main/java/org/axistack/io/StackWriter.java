package org.axistack.io;

import org.axistack.model.Units;
import java.io.IOException;
import java.nio.file.Path;
import org.axistack.model.Beam;
import org.axistack.model.Codata2018;
import org.axistack.model.Electrode;
import org.axistack.model.MeshSettings;
import org.axistack.model.Monitor;
import org.axistack.model.Particle;
import org.axistack.model.Segment;
import org.axistack.model.Sectors;
import org.axistack.model.Stack;
import org.axistack.model.StartRay;
import org.axistack.model.SurfaceFieldLimits;
import org.axistack.model.ZR;

/**
 * Writes a {@link Stack} as stack-file TOML (the format {@link StackReader} reads), metres converted
 * back to millimetres. Numbers are written with 15 significant digits, so a file read and written
 * again gives back the numbers it was written with.
 */
public final class StackWriter {

    private StackWriter() {
    }

    /** Writes the stack to a file atomically. */
    public static void write(Stack stack, Path file) throws IOException {
        AtomicFiles.writeString(file, toToml(stack));
    }

    /** The stack as TOML text. */
    public static String toToml(Stack s) {
        StringBuilder sb = new StringBuilder();
        sb.append("# Axistack stack file (lengths in mm, potentials in V, energies in eV)\n");
        sb.append("title = ").append(quote(s.title())).append("\n\n");
        beam(sb, s.beam());
        for (Electrode e : s.electrodes()) {
            sb.append("\n[[electrode]]\n");
            sb.append("name = ").append(quote(e.name())).append('\n');
            sb.append("shape = ").append(quote(e.shape())).append('\n');
            Sectors sec = s.sectors().get(e.name());
            if (sec == null) {
                sb.append("bias_V = ").append(num(e.bias_V())).append('\n');
            } else {
                sectors(sb, sec);
            }
            electrode(sb, e);
        }
        if (s.screenZ_m().isPresent()) {
            sb.append("\n[screen]\nz_mm = ").append(mm(s.screenZ_m().getAsDouble())).append('\n');
        }
        for (Monitor m : s.monitors()) {
            sb.append("\n[[monitor]]\n");
            if (!m.name().isEmpty()) {
                sb.append("name = ").append(quote(m.name())).append('\n');
            }
            sb.append("z_mm = ").append(mm(m.z_m())).append('\n');
        }
        if (!s.mesh().equals(MeshSettings.defaults())) {
            sb.append("\n[mesh]\ntarget_elements = ").append(s.mesh().targetElements())
                    .append("\nedge_levels = ").append(s.mesh().edgeLevels()).append('\n');
            if (s.mesh().accuracyDriven()) {
                sb.append("accuracy = ").append(num(s.mesh().accuracy())).append('\n');
            }
        }
        if (!s.limits().equals(SurfaceFieldLimits.defaults())) {
            sb.append("\n[limits]\ncomfort_surface_field_V_per_mm = ")
                    .append(num(Units.vPerMToVPerMm(s.limits().comfort_V_per_m())))
                    .append("\naggressive_surface_field_V_per_mm = ")
                    .append(num(Units.vPerMToVPerMm(s.limits().aggressive_V_per_m()))).append('\n');
            if (!s.limits().gapRule().equals(org.axistack.model.GapRule.defaults())) {
                sb.append("gap_comfort_V_at_1mm = ").append(num(s.limits().gapRule().comfortAt1mm_V()))
                        .append("\ngap_aggressive_V_at_1mm = ").append(num(s.limits().gapRule().aggressiveAt1mm_V()))
                        .append("\ngap_exponent = ").append(num(s.limits().gapRule().exponent())).append('\n');
            }
        }
        return sb.toString();
    }

    private static void beam(StringBuilder sb, Beam b) {
        Particle p = b.particle();
        sb.append("[beam]\n");
        if (p.equals(Particle.electron())) {
            sb.append("particle = \"electron\"\n");
        } else if (p.equals(Particle.proton())) {
            sb.append("particle = \"proton\"\n");
        } else {
            sb.append("particle = \"ion\"\n");
            sb.append("mass_u = ").append(num(p.mass_kg() / Codata2018.ATOMIC_MASS_UNIT_KG)).append('\n');
            sb.append("charge_state = ").append(p.chargeNumber()).append('\n');
        }
        sb.append("energy_eV = ").append(num(b.energy_eV())).append('\n');
        if (b.startZ_m().isPresent()) {
            sb.append("start_z_mm = ").append(mm(b.startZ_m().getAsDouble())).append('\n');
        }
        if (b.objectZ_m().isPresent()) {
            sb.append("object_z_mm = ").append(mm(b.objectZ_m().getAsDouble())).append('\n');
        }
        StartRay r = b.startRay();
        if (r.x_m() != 0) {
            sb.append("start_x_mm = ").append(mm(r.x_m())).append('\n');
        }
        if (r.y_m() != 0) {
            sb.append("start_y_mm = ").append(mm(r.y_m())).append('\n');
        }
        if (r.slopeX_rad() != 0) {
            sb.append("start_slope_x_mrad = ").append(num(Units.radToMrad(r.slopeX_rad()))).append('\n');
        }
        if (r.slopeY_rad() != 0) {
            sb.append("start_slope_y_mrad = ").append(num(Units.radToMrad(r.slopeY_rad()))).append('\n');
        }
    }

    private static void edgeRadius(StringBuilder sb, double edgeRadius_m) {
        if (edgeRadius_m > 0) {
            sb.append("edge_radius_mm = ").append(mm(edgeRadius_m)).append('\n');
        }
    }

    private static void electrode(StringBuilder sb, Electrode e) {
        if (e instanceof Electrode.Tube t) {
            sb.append("radius_mm = ").append(mm(t.radius_m()))
                    .append("\nz_start_mm = ").append(mm(t.zStart_m()))
                    .append("\nz_end_mm = ").append(mm(t.zEnd_m()))
                    .append("\nwall_mm = ").append(mm(t.wall_m())).append('\n');
            edgeRadius(sb, t.edgeRadius_m());
        } else if (e instanceof Electrode.Aperture a) {
            sb.append("z_mm = ").append(mm(a.z_m()))
                    .append("\nhole_radius_mm = ").append(mm(a.holeRadius_m()))
                    .append("\nouter_radius_mm = ").append(mm(a.outerRadius_m()))
                    .append("\nthickness_mm = ").append(mm(a.thickness_m())).append('\n');
            edgeRadius(sb, a.edgeRadius_m());
        } else if (e instanceof Electrode.Disk d) {
            sb.append("z_mm = ").append(mm(d.z_m()))
                    .append("\nradius_mm = ").append(mm(d.radius_m()))
                    .append("\nthickness_mm = ").append(mm(d.thickness_m())).append('\n');
        } else if (e instanceof Electrode.Ring r) {
            sb.append("z_mm = ").append(mm(r.z_m()))
                    .append("\nradius_mm = ").append(mm(r.radius_m()))
                    .append("\nwire_radius_mm = ").append(mm(r.wireRadius_m())).append('\n');
        } else if (e instanceof Electrode.Outline o) {
            outline(sb, o);
        } else {
            throw new IllegalArgumentException("no writer for shape " + e.shape());
        }
    }

    private static void outline(StringBuilder sb, Electrode.Outline o) {
        sb.append("closed = ").append(o.outline().closed()).append('\n');
        sb.append("points_mm = [\n");
        sb.append("  ").append(point(o.outline().segments().get(0).start())).append(",\n");
        for (Segment s : o.outline().segments()) {
            sb.append("  ");
            if (s instanceof Segment.Arc a) {
                sb.append('[').append(mm(a.end().z_m())).append(", ").append(mm(a.end().r_m())).append(", ")
                        .append(mm(a.via().z_m())).append(", ").append(mm(a.via().r_m())).append(']');
            } else {
                sb.append(point(s.end()));
            }
            sb.append(",\n");
        }
        sb.append("]\n");
    }

    private static String point(ZR p) {
        return "[" + mm(p.z_m()) + ", " + mm(p.r_m()) + "]";
    }

    private static String mm(double m) {
        return num(Units.mToMm(m));
    }

    /** A TOML float with 15 significant digits. */
    private static void sectors(StringBuilder sb, Sectors sec) {
        sb.append("sectors = ").append(sec.count()).append('\n');
        sb.append("sector_biases_V = [");
        for (int i = 0; i < sec.count(); i++) {
            sb.append(i == 0 ? "" : ", ").append(num(sec.biases_V().get(i)));
        }
        sb.append("]\n");
        if (sec.rotation_rad() != 0) {
            sb.append("split_rotation_deg = ").append(num(Math.toDegrees(sec.rotation_rad()))).append('\n');
        }
        if (sec.slitWidth_m() != 0) {
            sb.append("slit_width_mm = ").append(mm(sec.slitWidth_m())).append('\n');
        }
    }

    static String num(double x) {
        String s = org.axistack.model.Numbers.plain(x, org.axistack.model.Numbers.TOML_DIGITS);
        return s.contains(".") ? s : s + ".0";
    }

    /** A TOML basic string. */
    static String quote(String s) {
        StringBuilder sb = new StringBuilder("\"");
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '"' -> sb.append("\\\"");
                case '\\' -> sb.append("\\\\");
                case '\n' -> sb.append("\\n");
                case '\t' -> sb.append("\\t");
                case '\r' -> sb.append("\\r");
                default -> {
                    if (c < 0x20 || c == 0x7f) {
                        sb.append(String.format("\\u%04X", (int) c));
                    } else {
                        sb.append(c);
                    }
                }
            }
        }
        return sb.append('"').toString();
    }
}
