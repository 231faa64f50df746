package org.axistack.ui;

import java.awt.GridBagConstraints;
import java.awt.GridBagLayout;
import java.awt.Insets;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Consumer;
import javax.swing.BorderFactory;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JSlider;
import javax.swing.JTextField;

import org.axistack.model.PhysicsException;
import org.axistack.model.Electrode;
import org.axistack.model.Stack;

/**
 * One row per electrode: its name, a slider over {@link BiasScale} and a number field for the exact value.
 * Moving the slider or confirming a typed value (Enter or leaving the field) reports the new biases.
 */
final class BiasPanel extends JPanel {

    private final List<JSlider> sliders = new ArrayList<>();
    private final List<JTextField> fields = new ArrayList<>();
    private final List<String> names = new ArrayList<>();
    private final double[] biases;
    private BiasScale scale;
    private final double energyPerCharge_V;
    private final Consumer<double[]> onChange;
    private final Consumer<String> onError;
    private boolean updating;

    BiasPanel(Stack stack, Consumer<double[]> onChange, Consumer<String> onError) {
        super(new GridBagLayout());
        this.onChange = onChange;
        this.onError = onError;
        this.biases = stack.biases_V();
        double maxAbs = 0;
        for (double b : biases) {
            maxAbs = Math.max(maxAbs, Math.abs(b));
        }
        energyPerCharge_V = stack.beam().energyPerCharge_V();
        scale = BiasScale.forStack(maxAbs, energyPerCharge_V);
        setBorder(BorderFactory.createTitledBorder(title()));
        GridBagConstraints c = new GridBagConstraints();
        c.insets = new Insets(2, 4, 2, 4);
        c.anchor = GridBagConstraints.WEST;
        int row = 0;
        for (Electrode e : stack.electrodes()) {
            int k = row;
            names.add(e.name());
            JLabel label = new JLabel(e.name());
            JSlider s = new JSlider(-scale.steps(), scale.steps(), scale.position(e.bias_V()));
            s.setName("bias-slider-" + e.name());
            s.getAccessibleContext().setAccessibleName("bias of " + e.name());
            JTextField f = new JTextField(UiFormat.volts(e.bias_V()), 8);
            f.setName("bias-field-" + e.name());
            f.setHorizontalAlignment(JTextField.RIGHT);
            f.setMinimumSize(f.getPreferredSize());
            s.addChangeListener(ev -> {
                if (!updating) {
                    set(k, scale.bias_V(s.getValue()), true);
                }
            });
            onCommit(f, () -> typed(k));
            sliders.add(s);
            fields.add(f);
            addRow(this, c, row, label, s, f);
            row++;
        }
    }

    /** Runs {@code commit} when a number field's value is confirmed: Enter, or leaving the field. */
    static void onCommit(JTextField f, Runnable commit) {
        f.addActionListener(ev -> commit.run());
        f.addFocusListener(new java.awt.event.FocusAdapter() {
            @Override
            public void focusLost(java.awt.event.FocusEvent ev) {
                commit.run();
            }
        });
    }

    /** Lays out one control row of a bias panel: name, slider (stretching), number field, "V". */
    static void addRow(JPanel p, GridBagConstraints c, int row, JLabel label, JSlider s, JTextField f) {
        c.gridy = row;
        c.gridx = 0;
        c.weightx = 0;
        c.fill = GridBagConstraints.NONE;
        p.add(label, c);
        c.gridx = 1;
        c.weightx = 1;
        c.fill = GridBagConstraints.HORIZONTAL;
        p.add(s, c);
        c.gridx = 2;
        c.weightx = 0;
        p.add(f, c);
        c.gridx = 3;
        p.add(new JLabel("V"), c);
    }

    private void typed(int k) {
        JTextField f = fields.get(k);
        try {
            double v = BiasScale.parse(names.get(k), f.getText());
            if (v != biases[k]) {
                set(k, v, false);
            }
        } catch (IllegalArgumentException | PhysicsException e) {
            onError.accept(e.getMessage());
            f.setText(UiFormat.volts(biases[k]));
        }
    }

    private String title() {
        return "Electrode biases (V), slider range +/- " + UiFormat.num(scale.limit_V()) + " V";
    }

    /**
     * Widens every slider's range when a bias beyond it is set (typed, or a focusing bias from Tune), so no
     * slider pins at its end: the range follows the biases in use ({@link BiasScale#forStack}).
     */
    private void fit(double v) {
        if (Math.abs(v) <= scale.limit_V()) {
            return;
        }
        double maxAbs = Math.abs(v);
        for (double b : biases) {
            maxAbs = Math.max(maxAbs, Math.abs(b));
        }
        scale = BiasScale.forStack(maxAbs, energyPerCharge_V);
        for (int i = 0; i < sliders.size(); i++) {
            sliders.get(i).setValue(scale.position(biases[i]));
        }
        ((javax.swing.border.TitledBorder) getBorder()).setTitle(title());
        repaint();
    }

    /** Sets one bias as if the user had moved its control, and reports the change. */
    void set(int k, double v, boolean fromSlider) {
        biases[k] = v;
        updating = true;
        try {
            fit(v);
            if (!fromSlider) {
                sliders.get(k).setValue(scale.position(v));
            }
            fields.get(k).setText(UiFormat.volts(v));
        } finally {
            updating = false;
        }
        onChange.accept(biases.clone());
    }

    double[] biases() {
        return biases.clone();
    }

    JSlider slider(int k) {
        return sliders.get(k);
    }

    BiasScale scale() {
        return scale;
    }
}
