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

import org.axistack.io.Units;
import org.axistack.model.Stack;
import org.axistack.tune.BiasTuner;
import org.axistack.tune.FocusSolution;
import org.axistack.tune.TuneResult;

/**
 * Tune > Focus on a plane: asks for an electrode and an image plane, runs the tuning package's
 * {@link BiasTuner} on a worker (re-biasing the stored solution only), lists every bias it finds with its mode,
 * magnification and surface-field verdict, and sets the chosen one on the slider.
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
        new SwingWorker<TuneResult, Void>() {
            @Override
            protected TuneResult doInBackground() {
                return new BiasTuner(session.solution(), stack).focus(name, Units.mmToM(zMm));
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

    private void show(TuneResult r, String name, double zMm) {
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
        StringBuilder text = new StringBuilder("Biases of " + name + " that image onto z = " + UiFormat.num(zMm)
                + " mm (paraxial):\n\n");
        int i = 1;
        for (FocusSolution s : r.solutions()) {
            text.append(String.format(Locale.ROOT, "%d. %s V, %s, magnification %s, largest surface field %s V/mm on"
                    + " %s (%s)%n", i, UiFormat.num(s.bias_V()), s.mode().name().toLowerCase(Locale.ROOT),
                    UiFormat.num(s.magnification()), UiFormat.num(Units.vPerMToVPerMm(s.maxSurfaceField_V_per_m())),
                    s.worstElectrode(), s.surfaceFieldCheck()));
            options.add("Use " + i);
            i++;
        }
        options.add("Keep the present bias");
        int choice = JOptionPane.showOptionDialog(w, text.toString(), "Focus on a plane", JOptionPane.DEFAULT_OPTION,
                JOptionPane.QUESTION_MESSAGE, null, options.toArray(), options.get(0));
        if (choice >= 0 && choice < r.solutions().size()) {
            FocusSolution s = r.solutions().get(choice);
            w.biasPanel.set(w.current.stack().indexOf(name), s.bias_V(), false);
            w.status("focus: " + name + " set to " + UiFormat.num(s.bias_V()) + " V");
        }
    }
}
