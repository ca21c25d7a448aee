package nearfit.table;

import java.util.ArrayList;
import java.util.List;

import org.apache.parquet.format.ConvertedType;
import org.apache.parquet.format.FieldRepetitionType;
import org.apache.parquet.format.LogicalType;
import org.apache.parquet.format.SchemaElement;
import org.apache.parquet.format.Type;

/**
 * The top-level columns of a Parquet file's schema as nearfit reads them (Apache Parquet format
 * specification, LogicalTypes.md): each flat column with how its values become numbers, times or labels,
 * and the names of those left out (nested, list, map and repeated columns, and types with no reading here).
 *
 * @param fields   the flat columns kept in the file's order
 * @param leftOut  the columns left out, each as {@code name (why)}
 */
record ParquetSchema(List<Field> fields, List<String> leftOut) {

    /** How a column's stored values are read. */
    enum Reading {
        DOUBLE, FLOAT, INT32, INT64, UINT32, UINT64,
        /** INT32 or INT64 holding an unscaled decimal. */
        DECIMAL_LONG,
        /** FIXED_LEN_BYTE_ARRAY or BYTE_ARRAY holding a big-endian two's-complement unscaled decimal. */
        DECIMAL_BYTES,
        /** INT32 days since 1970-01-01. */
        DATE,
        /** INT64 units since the epoch, {@link Field#unitsPerMilli} to a millisecond. */
        TIMESTAMP,
        /** The legacy 12-byte timestamp: nanoseconds of the day, then the Julian day. */
        INT96,
        /** BYTE_ARRAY text (UTF-8 strings, enums, JSON) read as labels. */
        LABEL,
        BOOLEAN;

        ColumnType columnType() {
            return switch (this) {
                case DATE, TIMESTAMP, INT96 -> ColumnType.TIME;
                case LABEL, BOOLEAN -> ColumnType.CATEGORY;
                default -> ColumnType.NUMBER;
            };
        }
    }

    /**
     * One flat column.
     *
     * @param name          its name
     * @param chunk         its index among a row group's column chunks
     * @param type          the physical type
     * @param typeLength    the width of a fixed-length byte array, else 0
     * @param optional      whether it may hold nulls (definition level 1)
     * @param reading       how values are read
     * @param scale         a decimal's scale, else 0
     * @param unitsPerMilli a timestamp's units per millisecond (1, 1000 or 1 000 000), else 0
     */
    record Field(String name, int chunk, Type type, int typeLength, boolean optional, Reading reading, int scale,
                 long unitsPerMilli) {
    }

    /** Reads the schema list of a file's footer (depth first, the root first). */
    static ParquetSchema of(List<SchemaElement> elements) {
        if (elements.isEmpty()) {
            throw new IllegalArgumentException("the footer has no schema");
        }
        List<Field> fields = new ArrayList<>();
        List<String> leftOut = new ArrayList<>();
        int topLevel = elements.get(0).getNum_children();
        int at = 1;
        int chunk = 0;
        for (int f = 0; f < topLevel; f++) {
            if (at >= elements.size()) {
                throw new IllegalArgumentException("the footer's schema ends early");
            }
            SchemaElement e = elements.get(at);
            if (e.isSetNum_children() && e.getNum_children() > 0) {
                int[] end = {at, 0};
                skipGroup(elements, end);
                leftOut.add(e.getName() + " (" + groupKind(e) + ")");
                at = end[0];
                chunk += end[1];
                continue;
            }
            at++;
            if (e.getRepetition_type() == FieldRepetitionType.REPEATED) {
                leftOut.add(e.getName() + " (repeated)");
            } else {
                Reading r = readingOf(e);
                if (r == null) {
                    leftOut.add(e.getName() + " (" + describe(e) + ")");
                } else {
                    long units = 0;
                    if (r == Reading.TIMESTAMP) {
                        units = unitsPerMilli(e);
                    }
                    fields.add(new Field(e.getName(), chunk, e.getType(), e.isSetType_length() ? e.getType_length() : 0,
                            e.getRepetition_type() != FieldRepetitionType.REQUIRED, r, scaleOf(e), units));
                }
            }
            chunk++;
        }
        return new ParquetSchema(List.copyOf(fields), List.copyOf(leftOut));
    }

    /** Moves {@code pos[0]} past the group at it, counting its leaves in {@code pos[1]}. */
    private static void skipGroup(List<SchemaElement> elements, int[] pos) {
        SchemaElement g = elements.get(pos[0]++);
        for (int c = 0; c < g.getNum_children(); c++) {
            if (pos[0] >= elements.size()) {
                throw new IllegalArgumentException("the footer's schema ends early");
            }
            SchemaElement child = elements.get(pos[0]);
            if (child.isSetNum_children() && child.getNum_children() > 0) {
                skipGroup(elements, pos);
            } else {
                pos[0]++;
                pos[1]++;
            }
        }
    }

    private static String groupKind(SchemaElement e) {
        LogicalType l = e.isSetLogicalType() ? e.getLogicalType() : null;
        if ((l != null && l.isSetLIST()) || e.getConverted_type() == ConvertedType.LIST) {
            return "list";
        }
        if ((l != null && l.isSetMAP()) || e.getConverted_type() == ConvertedType.MAP
                || e.getConverted_type() == ConvertedType.MAP_KEY_VALUE) {
            return "map";
        }
        return "nested";
    }

    private static String describe(SchemaElement e) {
        LogicalType l = e.isSetLogicalType() ? e.getLogicalType() : null;
        if (l != null && l.isSet(l.getSetField())) {
            return String.valueOf(l.getSetField()).toLowerCase(java.util.Locale.ROOT).replace('_', ' ');
        }
        if (e.isSetConverted_type()) {
            return e.getConverted_type().name().toLowerCase(java.util.Locale.ROOT);
        }
        return e.isSetType() ? e.getType().name().toLowerCase(java.util.Locale.ROOT) : "no type";
    }

    private static int scaleOf(SchemaElement e) {
        if (e.isSetLogicalType() && e.getLogicalType().isSetDECIMAL()) {
            return e.getLogicalType().getDECIMAL().getScale();
        }
        return e.isSetScale() ? e.getScale() : 0;
    }

    private static long unitsPerMilli(SchemaElement e) {
        if (e.isSetLogicalType() && e.getLogicalType().isSetTIMESTAMP()) {
            var unit = e.getLogicalType().getTIMESTAMP().getUnit();
            return unit.isSetNANOS() ? 1_000_000 : unit.isSetMICROS() ? 1_000 : 1;
        }
        return e.getConverted_type() == ConvertedType.TIMESTAMP_MICROS ? 1_000 : 1;
    }

    /** How a flat column is read, or null when nearfit has no reading for it. */
    private static Reading readingOf(SchemaElement e) {
        if (!e.isSetType()) {
            return null;
        }
        LogicalType l = e.isSetLogicalType() ? e.getLogicalType() : null;
        ConvertedType c = e.isSetConverted_type() ? e.getConverted_type() : null;
        boolean decimal = (l != null && l.isSetDECIMAL()) || c == ConvertedType.DECIMAL;
        return switch (e.getType()) {
            case DOUBLE -> Reading.DOUBLE;
            case FLOAT -> l == null || l.isSetUNKNOWN() ? Reading.FLOAT : null;
            case BOOLEAN -> Reading.BOOLEAN;
            case INT96 -> Reading.INT96;
            case INT32 -> {
                if (decimal) {
                    yield Reading.DECIMAL_LONG;
                }
                if ((l != null && l.isSetDATE()) || c == ConvertedType.DATE) {
                    yield Reading.DATE;
                }
                if (l != null && l.isSetINTEGER()) {
                    yield l.getINTEGER().isIsSigned() ? Reading.INT32 : Reading.UINT32;
                }
                if (c == ConvertedType.UINT_8 || c == ConvertedType.UINT_16 || c == ConvertedType.UINT_32) {
                    yield Reading.UINT32;
                }
                yield l == null && (c == null || c == ConvertedType.INT_8 || c == ConvertedType.INT_16
                        || c == ConvertedType.INT_32) ? Reading.INT32 : null;
            }
            case INT64 -> {
                if (decimal) {
                    yield Reading.DECIMAL_LONG;
                }
                if ((l != null && l.isSetTIMESTAMP()) || c == ConvertedType.TIMESTAMP_MILLIS
                        || c == ConvertedType.TIMESTAMP_MICROS) {
                    yield Reading.TIMESTAMP;
                }
                if (l != null && l.isSetINTEGER()) {
                    yield l.getINTEGER().isIsSigned() ? Reading.INT64 : Reading.UINT64;
                }
                if (c == ConvertedType.UINT_64) {
                    yield Reading.UINT64;
                }
                yield l == null && (c == null || c == ConvertedType.INT_64) ? Reading.INT64 : null;
            }
            case FIXED_LEN_BYTE_ARRAY -> decimal ? Reading.DECIMAL_BYTES : null;
            case BYTE_ARRAY -> {
                if (decimal) {
                    yield Reading.DECIMAL_BYTES;
                }
                boolean text = l == null ? c == null || c == ConvertedType.UTF8 || c == ConvertedType.ENUM
                        || c == ConvertedType.JSON : l.isSetSTRING() || l.isSetENUM() || l.isSetJSON();
                yield text ? Reading.LABEL : null;
            }
        };
    }
}
