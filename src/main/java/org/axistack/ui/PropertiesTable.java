package org.axistack.ui;

import java.awt.Color;
import java.awt.Component;
import java.util.List;
import javax.swing.JTable;
import javax.swing.table.AbstractTableModel;
import javax.swing.JTextArea;
import javax.swing.table.TableCellRenderer;

/**
 * The property rows as a two-column table. Surface fields above the comfort limit are drawn on amber,
 * above the aggressive limit in white on brick red: our own warning colours.
 */
final class PropertiesTable extends JTable {

    /** Amber: above the comfort limit. */
    static final Color CAUTION = new Color(0xF4C04E);
    /** Brick red: above the aggressive limit. */
    static final Color OVER = new Color(0xA8321E);

    private final Model model = new Model();

    PropertiesTable() {
        setModel(model);
        setName("properties");
        setFillsViewportHeight(true);
        setRowSelectionAllowed(false);
        getColumnModel().getColumn(0).setPreferredWidth(230);
        getColumnModel().getColumn(1).setPreferredWidth(190);
        // cells wrap at word boundaries and rows grow to fit, so a long value ("optics: not available: the beam
        // is reflected at ...") is read whole, never cut with an ellipsis; the full text is also the tooltip
        setDefaultRenderer(Object.class, new TableCellRenderer() {
            private final JTextArea area = new JTextArea();

            @Override
            public Component getTableCellRendererComponent(JTable t, Object v, boolean sel, boolean focus, int row,
                    int col) {
                area.setLineWrap(true);
                area.setWrapStyleWord(true);
                area.setFont(t.getFont());
                area.setText(v == null ? "" : v.toString());
                area.setToolTipText(v == null ? null : v.toString());
                PropertySheet.Level level = model.rows.get(row).level();
                area.setBackground(level == PropertySheet.Level.OVER ? OVER
                        : level == PropertySheet.Level.CAUTION ? CAUTION : Color.WHITE);
                area.setForeground(level == PropertySheet.Level.OVER ? Color.WHITE : Color.BLACK);
                return area;
            }
        });
    }

    void show(PropertySheet sheet) {
        model.rows = sheet.rows();
        model.fireTableDataChanged();
        fitRows();
    }

    @Override
    public void doLayout() {
        super.doLayout();
        fitRows();
    }

    /** Row heights that show every cell's wrapped text whole. */
    private void fitRows() {
        for (int row = 0; row < getRowCount(); row++) {
            int h = 16;
            for (int col = 0; col < getColumnCount(); col++) {
                Component c = prepareRenderer(getCellRenderer(row, col), row, col);
                int w = getColumnModel().getColumn(col).getWidth();
                if (w > 0) {
                    c.setSize(w, Short.MAX_VALUE);
                }
                h = Math.max(h, c.getPreferredSize().height);
            }
            if (getRowHeight(row) != h) {
                setRowHeight(row, h);
            }
        }
    }

    @Override
    public String getToolTipText(java.awt.event.MouseEvent e) {
        int row = rowAtPoint(e.getPoint());
        int col = columnAtPoint(e.getPoint());
        return row < 0 || col < 0 ? null : String.valueOf(getValueAt(row, col));
    }

    List<PropertySheet.Row> rows() {
        return model.rows;
    }

    private static final class Model extends AbstractTableModel {
        List<PropertySheet.Row> rows = List.of();

        @Override
        public int getRowCount() {
            return rows.size();
        }

        @Override
        public int getColumnCount() {
            return 2;
        }

        @Override
        public String getColumnName(int c) {
            return c == 0 ? "property" : "value";
        }

        @Override
        public Object getValueAt(int r, int c) {
            return c == 0 ? rows.get(r).label() : rows.get(r).value();
        }
    }
}
