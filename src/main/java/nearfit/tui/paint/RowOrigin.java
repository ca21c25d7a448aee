package nearfit.tui.paint;

import nearfit.table.RowSource;
import nearfit.table.VisibleText;

/**
 * A row's origin as the screen shows it: {@link RowSource#label}, with a Parquet data set's folder (the name the
 * explorer was opened on, shown in its title) left out, so that {@code unit=T01/part-0.parquet:17} fits where the
 * whole path would push a table's column off the screen. Exports write the whole name, as predict does.
 */
final class RowOrigin {
    private RowOrigin() {
    }

    /** The label of {@code value}, made visible, without the leading {@code folder/}. */
    static String shown(RowSource source, long value, String folder) {
        String label = source.label(value);
        if (source.isParquet() && folder != null) {
            String prefix = folder.endsWith("/") ? folder : folder + "/";
            if (label.startsWith(prefix) && label.length() > prefix.length()) {
                label = label.substring(prefix.length());
            }
        }
        return VisibleText.of(label);
    }
}
