package nearfit.table;

import java.util.List;

/**
 * What the sniffer decided about a file, shared read-only by every parser thread.
 *
 * @param delimiter     the field delimiter
 * @param decimalComma  whether numbers use a decimal comma (only with the semicolon delimiter)
 * @param header        whether the first row is a header
 * @param width         the number of fields a row should have
 * @param names         the names of the kept columns, unique
 * @param fields        for each kept column, its field index in a row
 * @param types         for each kept column, its type
 * @param dataOffset    the byte offset where the data rows start (after BOM and header)
 * @param dataLine      the 1-based line where the data rows start
 * @param notes         warnings about the header for the load report (columns renamed), usually empty
 */
record Layout(char delimiter, boolean decimalComma, boolean header, int width, List<String> names,
        int[] fields, ColumnType[] types, long dataOffset, long dataLine, List<String> notes) {
    /** A layout with no notes. */
    Layout(char delimiter, boolean decimalComma, boolean header, int width, List<String> names,
            int[] fields, ColumnType[] types, long dataOffset, long dataLine) {
        this(delimiter, decimalComma, header, width, names, fields, types, dataOffset, dataLine, List.of());
    }
}
