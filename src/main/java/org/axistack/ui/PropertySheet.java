package org.axistack.ui;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

import org.axistack.model.Numbers;
import org.axistack.field.BiasedField;
import org.axistack.model.Units;
import org.axistack.model.Electrode;
import org.axistack.model.Stack;
import org.axistack.model.SurfaceFieldLimits;
import org.axistack.optics.Aberrations;
import org.axistack.optics.CardinalElements;
import org.axistack.optics.Imaging;
import org.axistack.optics.ParaxialOptics;
import org.axistack.report.LensChart;

/**
 * The optical properties shown beside the lens for one set of biases, as labelled rows: cardinal elements
 * (asymptotic, stack z), the image and magnification of the beam's object point, Cs and Cc (image side,
 * object at infinity; the convention of {@link Aberrations#convention()}), and each electrode's largest
 * surface field against the stack's comfort and aggressive limits. All values come from the optics and
 * field packages; nothing is computed here but unit conversion and the comparison with the limits.
 *
 * @param rows       the rows in display order
 * @param marks      cardinal points and the image for the lens view
 * @param cardinal   the cardinal elements, when the paraxial optics could be computed
 * @param imaging    the imaging of the beam's object point, when it has one and it could be computed
 * @param problem    why the optics could not be computed (empty if they could)
 */
public record PropertySheet(List<Row> rows, List<LensChart.Mark> marks, Optional<CardinalElements> cardinal,
        Optional<Imaging> imaging, String problem) {

    /** How a row should look: plain, caution (above the comfort limit) or over (above the aggressive limit). */
    public enum Level { PLAIN, CAUTION, OVER }

    /**
     * One row.
     *
     * @param label what it is, with its unit
     * @param value the value as shown
     * @param level how it should look
     */
    public record Row(String label, String value, Level level) {
    }

    public PropertySheet {
        rows = List.copyOf(rows);
        marks = List.copyOf(marks);
    }

    /** The worst level among the rows. */
    public Level worst() {
        Level w = Level.PLAIN;
        for (Row r : rows) {
            if (r.level().ordinal() > w.ordinal()) {
                w = r.level();
            }
        }
        return w;
    }

    /** The value of the row with this label, if present. */
    /** The central ray at the screen, x and y (rows of a stack with split electrodes). */
    public static final String CENTRAL_X = "central ray at the screen, x (mm)";
    public static final String CENTRAL_Y = "central ray at the screen, y (mm)";

    /** The same sheet with one more row. */
    PropertySheet withRow(Row row) {
        List<Row> r = new java.util.ArrayList<>(rows);
        r.add(row);
        return new PropertySheet(r, marks, cardinal, imaging, problem);
    }

    /**
     * The same sheet with the central ray's landing point and slopes (below a picometre or a nanoradian, round-off
     * of the sector pattern's harmonic sums, shown as 0).
     */
    PropertySheet withCentralRay(CentralRayView c) {
        double[] s = c.screen();
        for (int i = 0; i < s.length; i++) {
            s[i] = Math.abs(s[i]) < 1e-9 ? 0 : s[i];
        }
        return withRow(new Row(CENTRAL_X, UiFormat.num(s[0]), Level.PLAIN))
                .withRow(new Row(CENTRAL_Y, UiFormat.num(s[1]), Level.PLAIN))
                .withRow(new Row("central ray at the screen, slopes x, y (mrad)", UiFormat.num(s[2]) + ", "
                        + UiFormat.num(s[3]), Level.PLAIN));
    }

    public Optional<String> value(String label) {
        return rows.stream().filter(r -> r.label().equals(label)).map(Row::value).findFirst();
    }

    public static final String FOCAL_LENGTH_IMAGE = "focal length f2 (mm)";
    public static final String FOCAL_POINT_IMAGE = "image focal point F2, z (mm)";
    public static final String IMAGE_Z = "image of the object point, z (mm)";
    public static final String MAGNIFICATION = "magnification";
    public static final String CS = "spherical aberration Cs (mm)";
    public static final String CC = "chromatic aberration Cc (mm)";
    public static final String CS_OBJECT = "Cs, object side, for the object point (mm)";
    public static final String CC_OBJECT = "Cc, object side, for the object point (mm)";

    /** Computes the sheet for the stack (with the biases of the field) and its field. */
    public static PropertySheet of(Stack stack, BiasedField field) {
        return of(stack, field, o -> { });
    }

    /** The same, handing the paraxial optics it computed (if it could) to {@code optics}, so a caller reuses them. */
    static PropertySheet of(Stack stack, BiasedField field, java.util.function.Consumer<ParaxialOptics> opticsOut) {
        List<Row> rows = new ArrayList<>();
        List<LensChart.Mark> marks = new ArrayList<>();
        Optional<CardinalElements> card = Optional.empty();
        Optional<Imaging> img = Optional.empty();
        String problem = "";
        try {
            ParaxialOptics optics = ParaxialOptics.of(field, stack);
            opticsOut.accept(optics);
            CardinalElements c = optics.cardinal();
            card = Optional.of(c);
            rows.add(new Row("lens kind", c.kind().name().toLowerCase(java.util.Locale.ROOT), Level.PLAIN));
            if (c.kind() != CardinalElements.Kind.AFOCAL) {
                rows.add(mm(FOCAL_LENGTH_IMAGE, c.focalLengthImage_m()));
                rows.add(mm("focal length f1 (mm)", c.focalLengthObject_m()));
                rows.add(mm(FOCAL_POINT_IMAGE, c.focalPointImageZ_m()));
                rows.add(mm("object focal point F1, z (mm)", c.focalPointObjectZ_m()));
                rows.add(mm("principal plane H2, z (mm)", c.principalPlaneImageZ_m()));
                rows.add(mm("principal plane H1, z (mm)", c.principalPlaneObjectZ_m()));
                marks.add(new LensChart.Mark("F1", Units.mToMm(c.focalPointObjectZ_m())));
                marks.add(new LensChart.Mark("F2", Units.mToMm(c.focalPointImageZ_m())));
                marks.add(new LensChart.Mark("H1", Units.mToMm(c.principalPlaneObjectZ_m())));
                marks.add(new LensChart.Mark("H2", Units.mToMm(c.principalPlaneImageZ_m())));
            }
            if (c.realFocusImageZ_m().isPresent()) {
                rows.add(mm("real crossing after a parallel ray, z (mm)", c.realFocusImageZ_m().getAsDouble()));
            }
            if (stack.beam().objectZ_m().isPresent()) {
                double zo = stack.beam().objectZ_m().getAsDouble();
                Imaging im = optics.imaging(zo);
                img = Optional.of(im);
                rows.add(mm("object point, z (mm)", zo));
                rows.add(mm(IMAGE_Z, im.imageZ_m()));
                rows.add(new Row(MAGNIFICATION, UiFormat.num(im.lateralMagnification()), Level.PLAIN));
                if (im.realImageZ_m().isPresent()) {
                    rows.add(mm("real image (traced in the full field), z (mm)", im.realImageZ_m().getAsDouble()));
                }
                if (Double.isFinite(im.imageZ_m())) {
                    marks.add(new LensChart.Mark("image", Units.mToMm(im.imageZ_m())));
                }
            }
            rows.add(new Row("optics error estimate (of f)", Numbers.estimate(c.errorEstimate()),
                    c.errorEstimate() > org.axistack.optics.OpticsAccuracy.DEFAULT_REQUESTED ? Level.CAUTION : Level.PLAIN));
            // the same object position as the plan and optics outputs (image side)
            optics.quotedAberrations(img).ifPresent(ab -> {
                rows.add(mm(CS, ab.sphericalImage_m()));
                rows.add(mm(CC, ab.chromaticImage_m()));
                ab.sphericalObject_m().ifPresent(cs -> rows.add(mm(CS_OBJECT, cs)));
                ab.chromaticObject_m().ifPresent(cc -> rows.add(mm(CC_OBJECT, cc)));
            });
        } catch (RuntimeException e) {
            problem = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
            rows.add(new Row("optics", "not available: " + problem, Level.CAUTION));
        }
        surfaceRows(stack, field, rows);
        gapRows(stack, rows);
        return new PropertySheet(rows, marks, card, img, problem);
    }

    /** Label of a gap row: "gap focus - outlet (V across)". */
    static String gapLabel(org.axistack.tune.GapMargins.Row r) {
        return "gap " + r.pair() + " (V across)";
    }

    /**
     * One row per pair of facing electrodes with a voltage across them (issue 19): the voltage, the gap and the share
     * of the gap rule's comfort voltage, at the level of plan's verdict (tune.GapMargins, the same rows as plan).
     */
    private static void gapRows(Stack stack, List<Row> rows) {
        for (org.axistack.tune.GapMargins.Row r : org.axistack.tune.GapMargins.of(stack)) {
            Level level = switch (r.check()) {
                case ABOVE_AGGRESSIVE -> Level.OVER;
                case ABOVE_COMFORT -> Level.CAUTION;
                default -> Level.PLAIN;
            };
            rows.add(new Row(gapLabel(r), UiFormat.num(r.voltage_V()) + " over " + UiFormat.num(Units.mToMm(r.gap().gap_m()))
                    + " mm  (" + UiFormat.num(r.percentOfComfort()) + " % of the gap rule's comfort "
                    + UiFormat.num(r.comfort_V()) + " V)", level));
        }
    }

    /**
     * One row per electrode: its peak surface field against the limits, or, at a sharp corner (where the field
     * has no finite limit and the sampled value only grows with the mesh), the plain statement that it is a sharp
     * corner, as plan and the report say it.
     */
    private static void surfaceRows(Stack stack, BiasedField field, List<Row> rows) {
        SurfaceFieldLimits lim = stack.limits();
        List<org.axistack.tune.SurfaceFields.Row> peaks = org.axistack.tune.SurfaceFields.of(stack, field);
        List<Electrode> es = stack.electrodes();
        for (int i = 0; i < es.size(); i++) {
            org.axistack.field.SurfacePeak p = peaks.get(i).peak();
            if (p.sharp()) {
                rows.add(new Row("surface field " + es.get(i).name() + " (V/mm)",
                        org.axistack.tune.SurfaceFields.sharpStatement(p), Level.CAUTION));
                continue;
            }
            double e = p.field_V_per_m();
            Level level = level(e, lim);
            String margin = level == Level.PLAIN
                    ? UiFormat.num(100 * e / lim.comfort_V_per_m()) + " % of comfort limit"
                    : level == Level.CAUTION
                            ? "above comfort " + UiFormat.num(Units.vPerMToVPerMm(lim.comfort_V_per_m()))
                            : "ABOVE aggressive " + UiFormat.num(Units.vPerMToVPerMm(lim.aggressive_V_per_m()));
            rows.add(new Row("surface field " + es.get(i).name() + " (V/mm)",
                    UiFormat.num(Units.vPerMToVPerMm(e)) + "  (" + margin + ")", level));
        }
    }

    /** The level of a surface field against the limits. */
    public static Level level(double field_V_per_m, SurfaceFieldLimits lim) {
        if (field_V_per_m > lim.aggressive_V_per_m()) {
            return Level.OVER;
        }
        return field_V_per_m > lim.comfort_V_per_m() ? Level.CAUTION : Level.PLAIN;
    }

    private static Row mm(String label, double m) {
        return new Row(label, UiFormat.num(Units.mToMm(m)), Level.PLAIN);
    }
}
