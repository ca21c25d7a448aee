package nearfit.model;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import nearfit.table.ParquetCodec;
import org.apache.parquet.format.ColumnChunk;
import org.apache.parquet.format.ColumnMetaData;
import org.apache.parquet.format.CompressionCodec;
import org.apache.parquet.format.ConvertedType;
import org.apache.parquet.format.DataPageHeader;
import org.apache.parquet.format.Encoding;
import org.apache.parquet.format.FieldRepetitionType;
import org.apache.parquet.format.FileMetaData;
import org.apache.parquet.format.LogicalType;
import org.apache.parquet.format.MilliSeconds;
import org.apache.parquet.format.PageHeader;
import org.apache.parquet.format.PageType;
import org.apache.parquet.format.RowGroup;
import org.apache.parquet.format.SchemaElement;
import org.apache.parquet.format.StringType;
import org.apache.parquet.format.TimeUnit;
import org.apache.parquet.format.TimestampType;
import org.apache.parquet.format.Type;
import org.apache.parquet.format.Util;

/**
 * The Parquet form of {@link ResultSink}: the same columns as {@link ResultCsv}, as flat optional columns
 * (Apache Parquet format specification): text as UTF-8 strings, numbers as DOUBLE, whole numbers as INT64,
 * times as INT64 milliseconds adjusted to UTC; an empty cell is a null. Rows are kept in memory until
 * {@link #GROUP_ROWS} make a row group, written as one PLAIN, Snappy-compressed data page (version 1) per
 * column, with definition levels as bit-packed runs. A column's type is taken from its first non-empty cell;
 * a column chunk of nulls only holds no values, so it is valid whatever type the column turns out to have;
 * one never typed is a DOUBLE column. The footer is written by {@link #finish()}.
 */
public final class ResultParquet implements ResultSink {
    /** Rows per row group: a block of scored rows is 256 Ki rows; 64 Ki keeps a group's buffers small. */
    static final int GROUP_ROWS = 1 << 16;
    private static final byte[] MAGIC = {'P', 'A', 'R', '1'};

    private enum Kind { NONE, DOUBLE, WHOLE, TIME, TEXT }

    /** One column's cells of the current row group. */
    private static final class Cells {
        Kind kind = Kind.NONE;
        boolean[] present = new boolean[1024];
        long[] bits = new long[1024];
        ByteArrayOutputStream text = new ByteArrayOutputStream();
        int values;
        int rows;

        void add(boolean isPresent) {
            if (rows == present.length) {
                present = Arrays.copyOf(present, rows * 2);
            }
            present[rows++] = isPresent;
        }

        void value(long v) {
            if (values == bits.length) {
                bits = Arrays.copyOf(bits, values * 2);
            }
            bits[values++] = v;
        }

        void reset() {
            rows = 0;
            values = 0;
            text.reset();
        }
    }

    private final OutputStream out;
    private final String createdBy;
    private long position;
    private List<String> names;
    private Cells[] cells;
    private int cursor;
    private int groupRows;
    private long totalRows;
    private final List<List<ColumnMetaData>> groups = new ArrayList<>();
    private final List<long[]> groupSizes = new ArrayList<>();

    /** A Parquet file on {@code out}; {@code createdBy} goes into the footer (the writing program and version). */
    public ResultParquet(OutputStream out, String createdBy) throws IOException {
        this.out = out;
        this.createdBy = createdBy;
        write(MAGIC);
    }

    private void write(byte[] b) throws IOException {
        out.write(b);
        position += b.length;
    }

    @Override
    public void header(List<String> columnNames) {
        names = List.copyOf(columnNames);
        cells = new Cells[names.size()];
        for (int i = 0; i < cells.length; i++) {
            cells[i] = new Cells();
        }
    }

    private Cells next(Kind kind) {
        if (cursor >= cells.length) {
            throw new IllegalStateException("more cells than the " + cells.length + " columns");
        }
        Cells c = cells[cursor++];
        if (kind != Kind.NONE) {
            if (c.kind == Kind.NONE) {
                c.kind = kind;
            } else if (c.kind != kind) {
                throw new IllegalStateException("column " + names.get(cursor - 1) + " holds " + c.kind + ", not " + kind);
            }
        }
        c.add(kind != Kind.NONE);
        return c;
    }

    @Override
    public ResultSink text(String s) {
        if (s == null) {
            return empty();
        }
        Cells c = next(Kind.TEXT);
        byte[] b = s.getBytes(StandardCharsets.UTF_8);
        c.text.write(b.length & 0xff);
        c.text.write((b.length >>> 8) & 0xff);
        c.text.write((b.length >>> 16) & 0xff);
        c.text.write(b.length >>> 24);
        c.text.write(b, 0, b.length);
        c.values++;
        return this;
    }

    @Override
    public ResultSink number(double v) {
        if (Double.isNaN(v)) {
            return empty();
        }
        next(Kind.DOUBLE).value(Double.doubleToRawLongBits(v));
        return this;
    }

    @Override
    public ResultSink whole(long v) {
        next(Kind.WHOLE).value(v);
        return this;
    }

    @Override
    public ResultSink time(double epochMillis) {
        if (Double.isNaN(epochMillis)) {
            return empty();
        }
        next(Kind.TIME).value((long) epochMillis);
        return this;
    }

    @Override
    public ResultSink empty() {
        next(Kind.NONE);
        return this;
    }

    @Override
    public void endRow() throws IOException {
        if (cursor != cells.length) {
            throw new IllegalStateException("a row of " + cursor + " cells for " + cells.length + " columns");
        }
        cursor = 0;
        groupRows++;
        totalRows++;
        if (groupRows == GROUP_ROWS) {
            writeGroup();
        }
    }

    @Override
    public void flush() throws IOException {
        out.flush();
    }

    @Override
    public void finish() throws IOException {
        if (groupRows > 0) {
            writeGroup();
        }
        List<RowGroup> rowGroups = new ArrayList<>();
        for (int g = 0; g < groups.size(); g++) {
            List<ColumnChunk> chunks = new ArrayList<>();
            for (int j = 0; j < names.size(); j++) {
                ColumnMetaData m = groups.get(g).get(j);
                m.setType(physical(cells[j].kind));
                ColumnChunk cc = new ColumnChunk(m.getData_page_offset());
                cc.setMeta_data(m);
                chunks.add(cc);
            }
            rowGroups.add(new RowGroup(chunks, groupSizes.get(g)[0], groupSizes.get(g)[1]));
        }
        FileMetaData meta = new FileMetaData(1, schema(), totalRows, rowGroups);
        meta.setCreated_by(createdBy);
        ByteArrayOutputStream footer = new ByteArrayOutputStream();
        Util.writeFileMetaData(meta, footer);
        write(footer.toByteArray());
        int n = footer.size();
        write(new byte[] {(byte) n, (byte) (n >>> 8), (byte) (n >>> 16), (byte) (n >>> 24)});
        write(MAGIC);
        out.flush();
    }

    private List<SchemaElement> schema() {
        List<SchemaElement> schema = new ArrayList<>();
        SchemaElement root = new SchemaElement("schema");
        root.setNum_children(names.size());
        schema.add(root);
        for (int j = 0; j < names.size(); j++) {
            SchemaElement e = new SchemaElement(names.get(j));
            e.setType(physical(cells[j].kind));
            e.setRepetition_type(FieldRepetitionType.OPTIONAL);
            if (cells[j].kind == Kind.TEXT) {
                e.setLogicalType(LogicalType.STRING(new StringType()));
                e.setConverted_type(ConvertedType.UTF8);
            } else if (cells[j].kind == Kind.TIME) {
                e.setLogicalType(LogicalType.TIMESTAMP(new TimestampType(true, TimeUnit.MILLIS(new MilliSeconds()))));
                e.setConverted_type(ConvertedType.TIMESTAMP_MILLIS);
            }
            schema.add(e);
        }
        return schema;
    }

    private static Type physical(Kind k) {
        return switch (k) {
            case NONE, DOUBLE -> Type.DOUBLE;
            case WHOLE, TIME -> Type.INT64;
            case TEXT -> Type.BYTE_ARRAY;
        };
    }

    private void writeGroup() throws IOException {
        long start = position;
        List<ColumnMetaData> metas = new ArrayList<>();
        for (int j = 0; j < names.size(); j++) {
            metas.add(writeChunk(names.get(j), cells[j]));
            cells[j].reset();
        }
        groups.add(metas);
        groupSizes.add(new long[] {position - start, groupRows});
        groupRows = 0;
    }

    private ColumnMetaData writeChunk(String name, Cells c) throws IOException {
        ByteArrayOutputStream page = new ByteArrayOutputStream();
        // Definition levels: a 4-byte length, then one bit-packed run of ceil(rows / 8) groups of 8 bits.
        int groupsOf8 = (c.rows + 7) / 8;
        byte[] levels = new byte[1 + 5 + groupsOf8];
        int p = 0;
        for (int v = groupsOf8 << 1 | 1; ; v >>>= 7) { // ULEB128 header: (groups << 1) | 1 = bit-packed
            if (v < 0x80) {
                levels[p++] = (byte) v;
                break;
            }
            levels[p++] = (byte) ((v & 0x7f) | 0x80);
        }
        for (int i = 0; i < c.rows; i++) {
            if (c.present[i]) {
                levels[p + i / 8] |= (byte) (1 << (i % 8));
            }
        }
        int levelBytes = p + groupsOf8;
        page.write(levelBytes & 0xff);
        page.write((levelBytes >>> 8) & 0xff);
        page.write((levelBytes >>> 16) & 0xff);
        page.write(levelBytes >>> 24);
        page.write(levels, 0, levelBytes);
        if (c.kind == Kind.TEXT) {
            c.text.writeTo(page);
        } else {
            byte[] le = new byte[8 * c.values];
            for (int i = 0; i < c.values; i++) {
                long v = c.bits[i];
                for (int b = 0; b < 8; b++) {
                    le[8 * i + b] = (byte) (v >>> (8 * b));
                }
            }
            page.write(le);
        }
        byte[] raw = page.toByteArray();
        byte[] packed = ParquetCodec.snappyCompress(raw, raw.length);
        PageHeader h = new PageHeader(PageType.DATA_PAGE, raw.length, packed.length);
        h.setData_page_header(new DataPageHeader(c.rows, Encoding.PLAIN, Encoding.RLE, Encoding.RLE));
        ByteArrayOutputStream head = new ByteArrayOutputStream();
        Util.writePageHeader(h, head);
        long offset = position;
        write(head.toByteArray());
        write(packed);
        return new ColumnMetaData(physical(c.kind), List.of(Encoding.PLAIN, Encoding.RLE), List.of(name),
                CompressionCodec.SNAPPY, c.rows, head.size() + raw.length, head.size() + packed.length, offset);
    }
}
