package org.axistack.ui;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.ExecutionException;
import javax.swing.JComboBox;
import javax.swing.JLabel;
import javax.swing.JOptionPane;
import javax.swing.JPanel;
import javax.swing.JTextField;
import javax.swing.SwingWorker;

import org.axistack.model.Units;
import org.axistack.model.Stack;
import org.axistack.tune.BiasTuner;
import org.axistack.model.Rounding;
import org.axistack.tune.FocusRanking;
import org.axistack.tune.FocusSensitivity;
import org.axistack.tune.FocusSolution;
import org.axistack.tune.TuneResult;

/**
 * Tune > Focus on a plane: asks for an electrode and an image plane, runs the tuning package's
 * {@link BiasTuner} on a worker (re-biasing the stored solution only), lists every bias it finds most useful first
 * ({@link FocusRanking}) with its mode, magnification, surface-field verdict and the supply stability it needs,
 * flags near-mirror ones and never offers one first, and sets the chosen one on the slider.
 */
final class FocusAction {

    private final LensWindow w;

    FocusAction(LensWindow w) {
        this.w = w;
    }

    void run() {
        if (w.session == null || w.current == null) {
            return;
        }
        Stack stack = w.current.stack();
        JComboBox<String> electrode = new JComboBox<>(stack.names().toArray(new String[0]));
        electrode.setSelectedIndex(stack.electrodes().size() / 2);
        double defaultZ = Units.mToMm(stack.screenZ_m().orElse(stack.maxZ_m()));
        JTextField z = new JTextField(UiFormat.num(defaultZ), 8);
        JPanel p = new JPanel(new java.awt.GridLayout(2, 2, 6, 4));
        p.add(new JLabel("vary the bias of"));
        p.add(electrode);
        p.add(new JLabel("image plane z (mm)"));
        p.add(z);
        if (JOptionPane.showConfirmDialog(w, p, "Focus on a plane", JOptionPane.OK_CANCEL_OPTION)
                != JOptionPane.OK_OPTION) {
            return;
        }
        double zMm;
        try {
            zMm = Double.parseDouble(z.getText().trim());
        } catch (NumberFormatException e) {
            w.status("focus: type the image plane as a number of millimetres, e.g. " + UiFormat.num(defaultZ));
            return;
        }
        String name = (String) electrode.getSelectedItem();
        w.status("searching the biases of " + name + " that image onto z = " + UiFormat.num(zMm) + " mm ...");
        LensSession session = w.session;
        new SwingWorker<FocusRanking.Ranked, Void>() {
            @Override
            protected FocusRanking.Ranked doInBackground() {
                TuneResult r = new BiasTuner(session.solution(), stack).focus(name, Units.mmToM(zMm));
                List<FocusSensitivity> budgets = new ArrayList<>();
                try {
                    for (FocusSolution s : r.solutions()) {
                        budgets.add(FocusSensitivity.of(session.solution(), stack, s.biases_V(), r.target(),
                                FocusSensitivity.DEFAULT_DEPTH_M));
                    }
                } catch (RuntimeException e) {
                    budgets.clear(); // ranked by the near-mirror flag alone
                }
                return FocusRanking.rank(r, budgets);
            }

            @Override
            protected void done() {
                try {
                    show(get(), name, zMm);
                } catch (InterruptedException | ExecutionException e) {
                    Throwable c = e.getCause() == null ? e : e.getCause();
                    w.status("focus search failed: " + c.getMessage());
                }
            }
        }.execute();
    }

    /** One line per solution, most useful first, near-mirror ones flagged with the stability they need. */
    static String describe(FocusRanking.Ranked ranked, String name, double zMm) {
        TuneResult r = ranked.result();
        StringBuilder text = new StringBuilder("Biases of " + name + " that image onto z = " + UiFormat.num(zMm)
                + " mm (paraxial), most useful first:\n\n");
        for (int i = 0; i < r.solutions().size(); i++) {
            FocusSolution s = r.solutions().get(i);
            text.append(String.format(Locale.ROOT, "%d. %s V, %s, magnification %s, largest surface field %s V/mm on"
                    + " %s (%s)", i + 1, UiFormat.num(s.bias_V()), s.mode().name().toLowerCase(Locale.ROOT),
                    UiFormat.num(s.magnification()), UiFormat.num(Units.vPerMToVPerMm(s.maxSurfaceField_V_per_m())),
                    s.worstElectrode(), s.surfaceFieldCheck().words()));
            if (!ranked.budgets().isEmpty()) {
                FocusSensitivity b = ranked.budgets().get(i);
                text.append(String.format(Locale.ROOT, "%n    image moves %s mm per volt: hold %s within +/- %s for"
                        + " +/- %s mm of focus", Rounding.sig(Math.abs(Units.mToMm(FocusRanking.tunedShift_m_per_V(s, b))),
                        Rounding.SENSITIVITY_DIGITS), name, Rounding.volts(FocusRanking.tunedTolerance_V(s, b)),
                        UiFormat.num(Units.mToMm(b.depth_m()))));
            }
            if (FocusRanking.nearMirror(s)) {
                text.append(String.format(Locale.ROOT, "%n    NEAR A MIRROR: the beam crosses the axis %d time(s) inside"
                        + " the lens before the image; usable only with that supply stability", s.axisCrossings()));
            }
            text.append(System.lineSeparator());
        }
        return text.toString();
    }

    /** The option offered first: the most useful solution unless it is near a mirror, else keeping the bias. */
    static int defaultChoice(FocusRanking.Ranked ranked) {
        List<FocusSolution> sols = ranked.result().solutions();
        return !sols.isEmpty() && !FocusRanking.nearMirror(sols.get(0)) ? 0 : sols.size();
    }

    private void show(FocusRanking.Ranked ranked, String name, double zMm) {
        TuneResult r = ranked.result();
        if (!r.found()) {
            String msg = "No bias of " + name + " in " + UiFormat.num(r.range().from_V()) + " .. "
                    + UiFormat.num(r.range().to_V()) + " V images onto z = " + UiFormat.num(zMm) + " mm.";
            if (r.nearest().isPresent()) {
                var n = r.nearest().get();
                msg += String.format(Locale.ROOT, " Nearest: %s V puts the image at %s mm.", UiFormat.num(n.bias_V()),
                        UiFormat.num(Units.mToMm(n.imageZ_m())));
            }
            JOptionPane.showMessageDialog(w, msg, "Focus on a plane", JOptionPane.INFORMATION_MESSAGE);
            w.status("focus: no solution");
            return;
        }
        List<String> options = new ArrayList<>();
        for (int i = 0; i < r.solutions().size(); i++) {
            options.add("Use " + (i + 1));
        }
        options.add("Keep the present bias");
        int choice = JOptionPane.showOptionDialog(w, describe(ranked, name, zMm), "Focus on a plane",
                JOptionPane.DEFAULT_OPTION, JOptionPane.QUESTION_MESSAGE, null, options.toArray(),
                options.get(defaultChoice(ranked)));
        if (choice >= 0 && choice < r.solutions().size()) {
            FocusSolution s = r.solutions().get(choice);
            w.biasPanel.set(w.current.stack().indexOf(name), s.bias_V(), false);
            w.status("focus: " + name + " set to " + UiFormat.num(s.bias_V()) + " V");
        }
    }
}
