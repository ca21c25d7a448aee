package nearfit.table;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.math.BigDecimal;
import java.math.BigInteger;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.List;

import org.apache.parquet.VersionParser;
import org.apache.parquet.bytes.BytesInput;
import org.apache.parquet.column.ColumnDescriptor;
import org.apache.parquet.column.ColumnReader;
import org.apache.parquet.column.Encoding;
import org.apache.parquet.column.impl.ColumnReaderImpl;
import org.apache.parquet.column.page.DataPage;
import org.apache.parquet.column.page.DataPageV1;
import org.apache.parquet.column.page.DataPageV2;
import org.apache.parquet.column.page.DictionaryPage;
import org.apache.parquet.column.page.PageReader;
import org.apache.parquet.format.ColumnChunk;
import org.apache.parquet.format.ColumnMetaData;
import org.apache.parquet.format.FileMetaData;
import org.apache.parquet.format.PageHeader;
import org.apache.parquet.format.RowGroup;
import org.apache.parquet.format.Util;
import org.apache.parquet.io.api.Binary;
import org.apache.parquet.io.api.PrimitiveConverter;
import org.apache.parquet.schema.PrimitiveType;
import org.apache.parquet.schema.Type.Repetition;

/**
 * One Parquet file: its footer (read once) and the values of a row group's flat columns, decoded from
 * pages this class reads and decompresses itself (no Hadoop file system or codec classes): plain number
 * columns by {@link ParquetDirectDecoder}, the rest by parquet-column's readers. Values go straight into the loader's {@link ColumnBuilder}s. Thread-safe: each call
 * opens its own channel.
 */
final class ParquetFile {
    private static final byte[] MAGIC = ParquetLoader.MAGIC;
    private static final long MILLIS_PER_DAY = 86_400_000L;
    /** Julian day number of 1970-01-01, for INT96 timestamps. */
    private static final long JULIAN_EPOCH_DAY = 2_440_588L;

    final Path path;
    final FileMetaData footer;
    final ParquetSchema schema;
    private final VersionParser.ParsedVersion writer;

    private ParquetFile(Path path, FileMetaData footer, ParquetSchema schema) {
        this.path = path;
        this.footer = footer;
        this.schema = schema;
        VersionParser.ParsedVersion v = null;
        try {
            v = footer.isSetCreated_by() ? VersionParser.parse(footer.getCreated_by()) : null;
        } catch (RuntimeException | VersionParser.VersionParseException e) {
            v = null; // an unknown writer: parquet-column then applies no writer-specific fixes
        }
        this.writer = v;
    }

    /** Reads the footer; a file that is not Parquet, truncated or damaged fails as IllegalArgumentException. */
    static ParquetFile open(Path path) throws IOException {
        try (FileChannel ch = FileChannel.open(path, StandardOpenOption.READ)) {
            long size = ch.size();
            if (size < 12) {
                throw new IllegalArgumentException("too short for a Parquet file (" + size + " bytes)");
            }
            ByteBuffer head = ByteBuffer.allocate(4);
            readFully(ch, head, 0);
            ByteBuffer tail = ByteBuffer.allocate(8).order(ByteOrder.LITTLE_ENDIAN);
            readFully(ch, tail, size - 8);
            if (!java.util.Arrays.equals(head.array(), MAGIC)) {
                throw new IllegalArgumentException("not a Parquet file (it does not start with PAR1)");
            }
            if (!java.util.Arrays.equals(java.util.Arrays.copyOfRange(tail.array(), 4, 8), MAGIC)) {
                throw new IllegalArgumentException("truncated or damaged: the Parquet file does not end with PAR1");
            }
            int footerLength = tail.getInt(0);
            if (footerLength <= 0 || footerLength > size - 12) {
                throw new IllegalArgumentException("truncated or damaged: a footer of " + footerLength + " bytes in a file of "
                        + size);
            }
            ByteBuffer f = ByteBuffer.allocate(footerLength);
            readFully(ch, f, size - 8 - footerLength);
            FileMetaData meta;
            try {
                meta = Util.readFileMetaData(new ByteArrayInputStream(f.array()));
            } catch (IOException | RuntimeException e) {
                throw new IllegalArgumentException("a damaged Parquet footer (" + e.getMessage() + ")");
            }
            if (meta.isSetEncryption_algorithm()) {
                throw new IllegalArgumentException("an encrypted Parquet file (not supported)");
            }
            return new ParquetFile(path, meta, ParquetSchema.of(meta.getSchema()));
        }
    }

    private static void readFully(FileChannel ch, ByteBuffer b, long at) throws IOException {
        while (b.hasRemaining()) {
            int n = ch.read(b, at + b.position());
            if (n < 0) {
                throw new IllegalArgumentException("truncated: the file ends early");
            }
        }
    }

    List<RowGroup> rowGroups() {
        return footer.getRow_groups();
    }

    long rowCount() {
        return footer.getNum_rows();
    }

    /**
     * Reads field {@code field} of row group {@code group} into {@code into}: numbers as doubles, times as
     * epoch milliseconds, labels into the dictionary; nulls (and NaN) as missing cells; an infinite number
     * as a bad cell, as in CSV. Plain numeric chunks in PLAIN or dictionary encoding go through
     * {@code direct} (the calling thread's own; null reads every chunk through parquet-column), the rest
     * through parquet-column's reader.
     */
    void read(int group, ParquetSchema.Field field, ColumnBuilder into, ParquetDirectDecoder direct) throws IOException {
        RowGroup rg = footer.getRow_groups().get(group);
        ColumnChunk cc = rg.getColumns().get(field.chunk());
        ColumnMetaData meta = cc.getMeta_data();
        if (meta == null) {
            throw new IllegalArgumentException("column " + field.name() + " has its data in another file (not supported)");
        }
        if (meta.getType() != field.type()) {
            throw new IllegalArgumentException("column " + field.name() + " is stored as " + meta.getType()
                    + " in row group " + group + " but the schema says " + field.type());
        }
        if (meta.getNum_values() != rg.getNum_rows()) {
            throw new IllegalArgumentException("column " + field.name() + " holds " + meta.getNum_values()
                    + " values in a row group of " + rg.getNum_rows() + " rows");
        }
        long start = meta.getData_page_offset();
        if (meta.isSetDictionary_page_offset() && meta.getDictionary_page_offset() > 0
                && meta.getDictionary_page_offset() < start) {
            start = meta.getDictionary_page_offset();
        }
        long length = meta.getTotal_compressed_size();
        if (length < 0 || length > Integer.MAX_VALUE - 16) {
            throw new IllegalArgumentException("column " + field.name() + " has a chunk of " + length + " bytes");
        }
        boolean useDirect = direct != null && ParquetDirectDecoder.reads(field);
        byte[] bytes = useDirect ? direct.chunkBuffer((int) length) : new byte[(int) length];
        try (FileChannel ch = FileChannel.open(path, StandardOpenOption.READ)) {
            if (start < 4 || start + length > ch.size() - 8) {
                throw new IllegalArgumentException("truncated or damaged: column " + field.name() + " of row group " + group
                        + " lies outside the file");
            }
            readFully(ch, ByteBuffer.wrap(bytes, 0, (int) length), start);
        }
        try {
            if (useDirect) {
                if (direct.read(bytes, (int) length, meta, field, rg.getNum_rows(), into)) {
                    return;
                }
                bytes = java.util.Arrays.copyOf(bytes, (int) length); // an encoding only parquet-column reads
            }
            PrimitiveType type = new PrimitiveType(field.optional() ? Repetition.OPTIONAL : Repetition.REQUIRED,
                    primitive(field.type()), field.typeLength(), field.name());
            ColumnDescriptor descriptor = new ColumnDescriptor(new String[] {field.name()}, type, 0, field.optional() ? 1 : 0);
            Pages pages = new Pages(bytes, meta, field);
            ColumnReader reader = new ColumnReaderImpl(descriptor, pages, new PrimitiveConverter() { }, writer);
            copy(reader, reader.getTotalValueCount(), field, into);
        } catch (IllegalArgumentException e) {
            throw e;
        } catch (RuntimeException e) {
            throw new IllegalArgumentException("column " + field.name() + ": cannot decode row group " + group + " ("
                    + e.getClass().getSimpleName() + (e.getMessage() == null ? "" : ": " + e.getMessage()) + ")");
        }
    }

    private static PrimitiveType.PrimitiveTypeName primitive(org.apache.parquet.format.Type t) {
        return switch (t) {
            case BOOLEAN -> PrimitiveType.PrimitiveTypeName.BOOLEAN;
            case INT32 -> PrimitiveType.PrimitiveTypeName.INT32;
            case INT64 -> PrimitiveType.PrimitiveTypeName.INT64;
            case INT96 -> PrimitiveType.PrimitiveTypeName.INT96;
            case FLOAT -> PrimitiveType.PrimitiveTypeName.FLOAT;
            case DOUBLE -> PrimitiveType.PrimitiveTypeName.DOUBLE;
            case BYTE_ARRAY -> PrimitiveType.PrimitiveTypeName.BINARY;
            case FIXED_LEN_BYTE_ARRAY -> PrimitiveType.PrimitiveTypeName.FIXED_LEN_BYTE_ARRAY;
        };
    }

    /** A failure with its own message, passed through as it is. */
    static final class ParquetException extends IllegalArgumentException {
        private static final long serialVersionUID = 1L;

        ParquetException(String message) {
            super(message);
        }
    }

    private static void copy(ColumnReader r, long n, ParquetSchema.Field f, ColumnBuilder into) {
        int max = f.optional() ? 1 : 0;
        ParquetSchema.Reading reading = f.reading();
        double scale = Math.pow(10, f.scale());
        for (long i = 0; i < n; i++) {
            if (r.getCurrentDefinitionLevel() < max) {
                into.addMissing();
                r.consume();
                continue;
            }
            switch (reading) {
                case DOUBLE -> number(into, r.getDouble());
                case FLOAT -> number(into, r.getFloat());
                case INT32 -> number(into, r.getInteger());
                case UINT32 -> number(into, Integer.toUnsignedLong(r.getInteger()));
                case INT64 -> number(into, r.getLong());
                case UINT64 -> {
                    long v = r.getLong();
                    number(into, unsignedToDouble(v));
                }
                case DECIMAL_LONG -> {
                    long v = f.type() == org.apache.parquet.format.Type.INT32 ? r.getInteger() : r.getLong();
                    number(into, decimal(v, f.scale(), scale));
                }
                case DECIMAL_BYTES -> {
                    byte[] b = r.getBinary().getBytes();
                    number(into, b.length == 0 ? Double.NaN
                            : new BigDecimal(new BigInteger(b), f.scale()).doubleValue());
                }
                case DATE -> time(into, r.getInteger() * MILLIS_PER_DAY);
                case TIMESTAMP -> time(into, Math.floorDiv(r.getLong(), f.unitsPerMilli()));
                case INT96 -> {
                    ByteBuffer b = r.getBinary().toByteBuffer().order(ByteOrder.LITTLE_ENDIAN);
                    long nanosOfDay = b.getLong(b.position());
                    long julian = Integer.toUnsignedLong(b.getInt(b.position() + 8));
                    time(into, (julian - JULIAN_EPOCH_DAY) * MILLIS_PER_DAY + Math.floorDiv(nanosOfDay, 1_000_000L));
                }
                case LABEL -> {
                    Binary v = r.getBinary();
                    byte[] b = v.getBytesUnsafe();
                    label(into, b, 0, b.length);
                }
                case BOOLEAN -> label(into, r.getBoolean() ? TRUE : FALSE, 0, r.getBoolean() ? 4 : 5);
            }
            r.consume();
        }
    }

    /**
     * The double nearest the unsigned 64-bit value of {@code v} (ties to even), as Python's float(int) gives it.
     * Above 2^63 the value is halved with its lost low bit ORed back in (a sticky bit): the conversion of the
     * halved value then rounds as the full one would, and doubling is exact. (Halving, converting and adding
     * the low bit back after rounding broke ties wrongly: 2^63 + 2^10 + 1 gave 2^63, not 2^63 + 2^11.)
     */
    static double unsignedToDouble(long v) {
        return v >= 0 ? (double) v : (double) ((v >>> 1) | (v & 1)) * 2.0;
    }

    private static final byte[] TRUE = {'t', 'r', 'u', 'e'};
    private static final byte[] FALSE = {'f', 'a', 'l', 's', 'e'};

    /**
     * An unscaled decimal as the double nearest its value when both parts are exact doubles (one correctly
     * rounded division, as the CSV reader's fast path), else through BigDecimal.
     */
    static double decimal(long unscaled, int scale, double powerOfTen) {
        if (scale == 0) {
            return unscaled;
        }
        if (scale > 0 && scale <= 22 && Math.abs(unscaled) < (1L << 53)) {
            return unscaled / powerOfTen;
        }
        return BigDecimal.valueOf(unscaled, scale).doubleValue();
    }

    private static void number(ColumnBuilder into, double v) {
        if (v != v) {
            into.addMissing();
        } else if (Double.isInfinite(v)) {
            into.addMissing();
            into.bad++; // a reading is never infinite: a bad cell, as "Infinity" in a CSV file
        } else {
            into.addNumber(v);
        }
    }

    private static void time(ColumnBuilder into, long millis) {
        into.size++;
        into.times.add(millis);
    }

    private static void label(ColumnBuilder into, byte[] b, int s, int e) {
        if (into.type == ColumnType.TEXT) {
            if (CellText.isMissing(b, s, e)) {
                into.missing++;
            }
            into.size++;
            return;
        }
        int ts = CellText.trimStart(b, s, e);
        int te = CellText.trimEnd(b, ts, e);
        if (CellText.isMissing(b, ts, te)) {
            into.addMissing();
            return;
        }
        into.size++;
        into.codes.add(into.labels.codeOf(b, ts, te));
        if (into.labels.size() > ChunkResult.MAX_LABELS) {
            into.becomeText();
        }
    }

    /** The pages of one column chunk, read in order from its bytes. */
    private static final class Pages implements PageReader {
        private final byte[] bytes;
        private final ColumnMetaData meta;
        private final ParquetSchema.Field field;
        private int at;
        private long valuesLeft;
        private DictionaryPage dictionary;

        Pages(byte[] bytes, ColumnMetaData meta, ParquetSchema.Field field) throws IOException {
            this.bytes = bytes;
            this.meta = meta;
            this.field = field;
            this.valuesLeft = meta.getNum_values();
            PageHeader first = peek();
            if (first != null && first.getType() == org.apache.parquet.format.PageType.DICTIONARY_PAGE) {
                PageHeader h = next();
                byte[] data = payload(h, true);
                dictionary = new DictionaryPage(BytesInput.from(data), h.getDictionary_page_header().getNum_values(),
                        encoding(h.getDictionary_page_header().getEncoding()));
            }
        }

        private PageHeader peek() throws IOException {
            int keep = at;
            PageHeader h = at < bytes.length ? header() : null;
            at = keep;
            return h;
        }

        private PageHeader next() throws IOException {
            return header();
        }

        private PageHeader header() throws IOException {
            ByteArrayInputStream in = new ByteArrayInputStream(bytes, at, bytes.length - at);
            int before = in.available();
            PageHeader h;
            try {
                h = Util.readPageHeader(in);
            } catch (IOException | RuntimeException e) {
                throw new IllegalArgumentException("column " + field.name() + ": a damaged page header");
            }
            at += before - in.available();
            if (h.getCompressed_page_size() < 0 || h.getCompressed_page_size() > bytes.length - at
                    || h.getUncompressed_page_size() < 0) {
                throw new IllegalArgumentException("column " + field.name() + ": a page runs past its column chunk");
            }
            return h;
        }

        private byte[] payload(PageHeader h, boolean compressed) {
            int from = at;
            at += h.getCompressed_page_size();
            return compressed ? ParquetCodec.decompress(meta.getCodec(), bytes, from, h.getCompressed_page_size(),
                    h.getUncompressed_page_size()) : java.util.Arrays.copyOfRange(bytes, from, at);
        }

        @Override
        public DictionaryPage readDictionaryPage() {
            return dictionary;
        }

        @Override
        public long getTotalValueCount() {
            return meta.getNum_values();
        }

        @Override
        public DataPage readPage() {
            try {
                while (valuesLeft > 0 && at < bytes.length) {
                    PageHeader h = next();
                    switch (h.getType()) {
                        case DATA_PAGE -> {
                            var d = h.getData_page_header();
                            byte[] data = payload(h, true);
                            valuesLeft -= d.getNum_values();
                            return new DataPageV1(BytesInput.from(data), d.getNum_values(), data.length, null,
                                    encoding(d.getRepetition_level_encoding()), encoding(d.getDefinition_level_encoding()),
                                    encoding(d.getEncoding()));
                        }
                        case DATA_PAGE_V2 -> {
                            var d = h.getData_page_header_v2();
                            int levels = d.getRepetition_levels_byte_length() + d.getDefinition_levels_byte_length();
                            if (levels < 0 || levels > h.getCompressed_page_size()) {
                                throw new IllegalArgumentException("column " + field.name() + ": a damaged page");
                            }
                            int from = at;
                            byte[] rep = java.util.Arrays.copyOfRange(bytes, from, from + d.getRepetition_levels_byte_length());
                            byte[] def = java.util.Arrays.copyOfRange(bytes, from + rep.length, from + levels);
                            int dataLength = h.getCompressed_page_size() - levels;
                            byte[] data = d.isSetIs_compressed() && !d.isIs_compressed()
                                    ? java.util.Arrays.copyOfRange(bytes, from + levels, from + levels + dataLength)
                                    : ParquetCodec.decompress(meta.getCodec(), bytes, from + levels, dataLength,
                                            h.getUncompressed_page_size() - levels);
                            at += h.getCompressed_page_size();
                            valuesLeft -= d.getNum_values();
                            return DataPageV2.uncompressed(d.getNum_rows(), d.getNum_nulls(), d.getNum_values(),
                                    BytesInput.from(rep), BytesInput.from(def), encoding(d.getEncoding()), BytesInput.from(data),
                                    null);
                        }
                        default -> at += h.getCompressed_page_size(); // index pages, a second dictionary: skipped
                    }
                }
            } catch (IOException e) {
                throw new IllegalArgumentException("column " + field.name() + ": " + e.getMessage());
            }
            return null;
        }

        private Encoding encoding(org.apache.parquet.format.Encoding e) {
            try {
                return Encoding.valueOf(e.name());
            } catch (IllegalArgumentException | NullPointerException x) {
                throw new ParquetException("column " + field.name() + ": an unsupported encoding (" + e + ")");
            }
        }
    }
}
