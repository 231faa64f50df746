package org.axistack.ui;

import java.awt.GridBagConstraints;
import java.awt.GridBagLayout;
import java.awt.Insets;
import java.util.LinkedHashMap;
import java.util.Map;
import javax.swing.BorderFactory;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JSlider;
import javax.swing.JTextField;

import org.axistack.model.PhysicsException;
import org.axistack.model.Sectors;
import org.axistack.model.Stack;

/**
 * The steering controls of a stack with split electrodes: per split electrode a slider and a number field for its
 * x and for its y differential bias (sector s gets the electrode's bias + dx cos(theta_s) + dy sin(theta_s)).
 * Moving one reports the change; the window then redraws the central ray's x and y and its landing point.
 */
final class SteeringPanel extends JPanel {

    private final Map<String, double[]> values = new LinkedHashMap<>();
    private final Runnable onChange;
    private final java.util.function.Consumer<String> onError;
    private boolean updating;

    SteeringPanel(Stack stack, Runnable onChange, java.util.function.Consumer<String> onError) {
        super(new GridBagLayout());
        this.onChange = onChange;
        this.onError = onError;
        double u = stack.beam().energyPerCharge_V();
        setBorder(BorderFactory.createTitledBorder("Steering: x and y differential biases of split electrodes (V)"));
        GridBagConstraints c = new GridBagConstraints();
        c.insets = new Insets(2, 4, 2, 4);
        c.anchor = GridBagConstraints.WEST;
        int row = 0;
        for (Map.Entry<String, Sectors> e : stack.sectors().entrySet()) {
            Sectors s = e.getValue();
            // the projections carry round-off of the sector angles' cosines (1e-11 V at equal sector biases): shown as 0
            double[] v = {snap(s.xDifferential_V(), s.common_V()), snap(s.yDifferential_V(), s.common_V())};
            values.put(e.getKey(), v);
            // a differential of a tenth of the beam's energy per charge already steers hard (common practice, no source)
            BiasScale scale = BiasScale.forStack(Math.max(Math.max(Math.abs(v[0]), Math.abs(v[1])), 0.1 * Math.abs(u)),
                    0);
            for (int axis = 0; axis < 2; axis++) {
                String label = e.getKey() + (axis == 0 ? " x" : " y");
                addRow(c, row++, label, e.getKey(), axis, scale);
            }
        }
    }

    private void addRow(GridBagConstraints c, int row, String label, String name, int axis, BiasScale scale) {
        double[] v = values.get(name);
        JSlider s = new JSlider(-scale.steps(), scale.steps(), scale.position(v[axis]));
        s.setName("steer-slider-" + label.replace(' ', '-'));
        s.getAccessibleContext().setAccessibleName(label + " differential bias");
        JTextField f = new JTextField(UiFormat.volts(v[axis]), 8);
        f.setName("steer-field-" + label.replace(' ', '-'));
        f.setHorizontalAlignment(JTextField.RIGHT);
        f.setMinimumSize(f.getPreferredSize());
        s.addChangeListener(ev -> {
            if (!updating) {
                v[axis] = scale.bias_V(s.getValue());
                updating = true;
                f.setText(UiFormat.volts(v[axis]));
                updating = false;
                onChange.run();
            }
        });
        Runnable typed = () -> {
            try {
                double x = BiasScale.parse(label, f.getText());
                if (x != v[axis]) {
                    v[axis] = x;
                    updating = true;
                    s.setValue(scale.position(x));
                    updating = false;
                    onChange.run();
                }
            } catch (IllegalArgumentException | PhysicsException ex) {
                onError.accept(ex.getMessage());
                f.setText(UiFormat.volts(v[axis]));
            }
        };
        BiasPanel.onCommit(f, typed);
        BiasPanel.addRow(this, c, row, new JLabel(label), s, f);
    }

    private static double snap(double v, double common) {
        return Math.abs(v) < 1e-9 * Math.max(1, Math.abs(common)) ? 0 : v;
    }

    /** The x and y differential biases by split electrode, V (copies). */
    Map<String, double[]> differentials() {
        Map<String, double[]> out = new LinkedHashMap<>();
        values.forEach((k, v) -> out.put(k, v.clone()));
        return out;
    }
}
