package org.axistack.ui;

import java.awt.Color;
import java.awt.Component;
import java.util.List;
import javax.swing.JTable;
import javax.swing.table.AbstractTableModel;
import javax.swing.table.DefaultTableCellRenderer;

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
        setDefaultRenderer(Object.class, new DefaultTableCellRenderer() {
            @Override
            public Component getTableCellRendererComponent(JTable t, Object v, boolean sel, boolean focus, int row,
                    int col) {
                Component c = super.getTableCellRendererComponent(t, v, false, false, row, col);
                PropertySheet.Level level = model.rows.get(row).level();
                c.setBackground(level == PropertySheet.Level.OVER ? OVER
                        : level == PropertySheet.Level.CAUTION ? CAUTION : Color.WHITE);
                c.setForeground(level == PropertySheet.Level.OVER ? Color.WHITE : Color.BLACK);
                return c;
            }
        });
    }

    void show(PropertySheet sheet) {
        model.rows = sheet.rows();
        model.fireTableDataChanged();
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
