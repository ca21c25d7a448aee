package nearfit.table;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.lang.invoke.MethodHandles;
import java.lang.invoke.VarHandle;
import java.nio.ByteOrder;
import java.util.ArrayList;
import java.util.List;

import org.apache.parquet.format.ColumnMetaData;
import org.apache.parquet.format.CompressionCodec;
import org.apache.parquet.format.DataPageHeader;
import org.apache.parquet.format.DataPageHeaderV2;
import org.apache.parquet.format.Encoding;
import org.apache.parquet.format.PageHeader;
import org.apache.parquet.format.PageType;
import org.apache.parquet.format.Util;

/**
 * Decodes the common numeric column chunks straight from their page bytes into a {@link ColumnBuilder}'s
 * {@code double} chunks, without parquet-column's one-call-per-value reader: flat required or optional
 * columns of physical type DOUBLE, FLOAT, INT32 or INT64 read as plain numbers (not decimals, dates or
 * timestamps), in PLAIN or dictionary (PLAIN_DICTIONARY, RLE_DICTIONARY) encoding, data pages v1 and v2,
 * definition levels in the RLE/bit-packed hybrid (Apache Parquet format specification, Encodings.md).
 * A chunk using anything else is left to the general path ({@link ParquetFile}) before a value is added;
 * both paths give the same cells (ParquetDirectDecoderTest compares them).
 *
 * <p>One instance per worker thread: it keeps its scratch arrays and decompressors from chunk to chunk.
 * Not thread-safe.
 */
final class ParquetDirectDecoder {
    private static final VarHandle INT_LE = MethodHandles.byteArrayViewVarHandle(int[].class, ByteOrder.LITTLE_ENDIAN);
    private static final VarHandle LONG_LE = MethodHandles.byteArrayViewVarHandle(long[].class, ByteOrder.LITTLE_ENDIAN);
    private static final VarHandle FLOAT_LE = MethodHandles.byteArrayViewVarHandle(float[].class, ByteOrder.LITTLE_ENDIAN);
    private static final VarHandle DOUBLE_LE = MethodHandles.byteArrayViewVarHandle(double[].class, ByteOrder.LITTLE_ENDIAN);

    private final ParquetCodec.Decompressors decompressors = new ParquetCodec.Decompressors();
    /** The column chunk's bytes as read from the file. */
    private byte[] chunk = new byte[0];
    /** One decompressed page (v1: levels and values; v2: values) or the dictionary page. */
    private byte[] page = new byte[0];
    /** A page's present values as doubles, in order. */
    private double[] values = new double[0];
    /** A page's definition levels: 1 present, 0 null. */
    private byte[] defined = new byte[0];
    /** A page's dictionary indexes. */
    private int[] indexes = new int[0];
    /** The chunk's dictionary as doubles, {@code dictionarySize} entries. */
    private double[] dictionary = new double[0];
    private int dictionarySize;
    /** Column chunks this decoder has read (the rest went to the general path); for tests. */
    int chunksDecoded;

    /** Whether this decoder reads columns of {@code field}'s kind (the encodings are checked per chunk). */
    static boolean reads(ParquetSchema.Field field) {
        return switch (field.reading()) {
            case DOUBLE, FLOAT, INT32, UINT32, INT64, UINT64 -> true;
            default -> false;
        };
    }

    /** A buffer of at least {@code length} bytes for a column chunk, reused by the next call. */
    byte[] chunkBuffer(int length) {
        if (chunk.length < length) {
            chunk = new byte[Math.max(length, chunk.length + chunk.length / 2)];
        }
        return chunk;
    }

    /** One page of the chunk: its header and where its payload starts in the chunk's bytes. */
    private record Page(PageHeader header, int at) {
    }

    /**
     * Adds the {@code rows} cells of one column chunk ({@code bytes[0, length)}, from {@link #chunkBuffer}) to
     * {@code into}, or returns false having added nothing when a page is of an encoding read only by the
     * general path. Damaged pages fail as IllegalArgumentException naming the column.
     */
    boolean read(byte[] bytes, int length, ColumnMetaData meta, ParquetSchema.Field field, long rows,
                 ColumnBuilder into) {
        switch (meta.getCodec()) {
            case UNCOMPRESSED, SNAPPY, GZIP, ZSTD, LZ4_RAW -> { }
            default -> {
                return false; // the general path refuses the codec in its own words
            }
        }
        try {
            return readPages(bytes, length, meta, field, rows, into);
        } catch (IllegalArgumentException e) {
            throw e.getMessage() != null && e.getMessage().startsWith("column ") ? e : damaged(field, e.getMessage());
        }
    }

    private boolean readPages(byte[] bytes, int length, ColumnMetaData meta, ParquetSchema.Field field, long rows,
                              ColumnBuilder into) {
        List<Page> pages = pages(bytes, length, meta.getNum_values(), field);
        if (pages == null) {
            return false;
        }
        dictionarySize = -1;
        long added = 0;
        for (Page p : pages) {
            PageHeader h = p.header();
            if (h.getType() == PageType.DICTIONARY_PAGE) {
                readDictionary(bytes, p, meta.getCodec(), field);
                continue;
            }
            int n = h.getType() == PageType.DATA_PAGE ? h.getData_page_header().getNum_values()
                    : h.getData_page_header_v2().getNum_values();
            if (n < 0 || n > rows - added) {
                throw damaged(field, "a page of " + n + " values past the " + rows + " rows of its row group");
            }
            if (h.getType() == PageType.DATA_PAGE) {
                readPageV1(bytes, p, n, meta.getCodec(), field, into);
            } else {
                readPageV2(bytes, p, n, meta.getCodec(), field, into);
            }
            added += n;
        }
        if (added != rows) {
            throw damaged(field, "the pages hold " + added + " values in a row group of " + rows + " rows");
        }
        chunksDecoded++;
        return true;
    }

    /**
     * The pages up to the column's value count, or null when one is of an encoding this decoder does not
     * read. As the general path: a dictionary only as the first page; index pages and later dictionaries
     * skipped.
     */
    private static List<Page> pages(byte[] bytes, int length, long numValues, ParquetSchema.Field field) {
        List<Page> pages = new ArrayList<>();
        int at = 0;
        long left = numValues;
        while (left > 0 && at < length) {
            ByteArrayInputStream in = new ByteArrayInputStream(bytes, at, length - at);
            PageHeader h;
            try {
                h = Util.readPageHeader(in);
            } catch (IOException | RuntimeException e) {
                throw damaged(field, "a damaged page header");
            }
            at = length - in.available();
            int size = h.getCompressed_page_size();
            if (size < 0 || size > length - at || h.getUncompressed_page_size() < 0) {
                throw damaged(field, "a page runs past its column chunk");
            }
            switch (h.getType()) {
                case DICTIONARY_PAGE -> {
                    if (pages.isEmpty()) {
                        Encoding e = h.getDictionary_page_header().getEncoding();
                        if (e != Encoding.PLAIN && e != Encoding.PLAIN_DICTIONARY) {
                            return null;
                        }
                        pages.add(new Page(h, at));
                    }
                }
                case DATA_PAGE -> {
                    DataPageHeader d = h.getData_page_header();
                    if (!valuesReadHere(d.getEncoding())
                            || (field.optional() && d.getDefinition_level_encoding() != Encoding.RLE)) {
                        return null;
                    }
                    pages.add(new Page(h, at));
                    left -= d.getNum_values();
                }
                case DATA_PAGE_V2 -> {
                    DataPageHeaderV2 d = h.getData_page_header_v2();
                    if (!valuesReadHere(d.getEncoding())) {
                        return null;
                    }
                    pages.add(new Page(h, at));
                    left -= d.getNum_values();
                }
                default -> { } // index pages: skipped, as the general path does
            }
            at += size;
        }
        return pages;
    }

    private static boolean valuesReadHere(Encoding e) {
        return e == Encoding.PLAIN || e == Encoding.PLAIN_DICTIONARY || e == Encoding.RLE_DICTIONARY;
    }

    private static IllegalArgumentException damaged(ParquetSchema.Field field, String what) {
        return new IllegalArgumentException("column " + field.name() + ": " + what);
    }

    /** The page's payload decompressed into {@link #page} ({@code size} bytes), or null when it is stored as is. */
    private byte[] decompress(CompressionCodec codec, byte[] bytes, int from, int length, int size) {
        if (codec == CompressionCodec.UNCOMPRESSED) {
            ParquetCodec.checkUncompressed(length, size);
            return null;
        }
        if (page.length < size) {
            page = new byte[Math.max(size, page.length + page.length / 2)];
        }
        ParquetCodec.decompressInto(codec, bytes, from, length, page, size, decompressors);
        return page;
    }

    private void readDictionary(byte[] bytes, Page p, CompressionCodec codec, ParquetSchema.Field field) {
        PageHeader h = p.header();
        int n = h.getDictionary_page_header().getNum_values();
        byte[] b = decompress(codec, bytes, p.at(), h.getCompressed_page_size(), h.getUncompressed_page_size());
        int at = b == null ? p.at() : 0;
        if (b == null) {
            b = bytes;
        }
        if (n < 0 || (long) n * width(field) > h.getUncompressed_page_size()) {
            throw damaged(field, "a dictionary of " + n + " values in " + h.getUncompressed_page_size() + " bytes");
        }
        if (dictionary.length < n) {
            dictionary = new double[n];
        }
        plain(b, at, n, field, dictionary);
        dictionarySize = n;
    }

    /** A v1 data page: definition levels (4-byte length, then the hybrid) and values, all compressed together. */
    private void readPageV1(byte[] bytes, Page p, int n, CompressionCodec codec, ParquetSchema.Field field,
                            ColumnBuilder into) {
        PageHeader h = p.header();
        int size = h.getUncompressed_page_size();
        byte[] b = decompress(codec, bytes, p.at(), h.getCompressed_page_size(), size);
        int at = b == null ? p.at() : 0;
        if (b == null) {
            b = bytes;
        }
        int end = at + size;
        int present = n;
        if (field.optional()) {
            if (end - at < 4) {
                throw damaged(field, "a page too short for its definition levels");
            }
            int levels = (int) INT_LE.get(b, at);
            at += 4;
            if (levels < 0 || levels > end - at) {
                throw damaged(field, "definition levels of " + levels + " bytes in a page of " + size);
            }
            present = definitionLevels(b, at, at + levels, n, field);
            at += levels;
        }
        values(b, at, end, present, h.getData_page_header().getEncoding(), field);
        append(into, n, present);
    }

    /** A v2 data page: levels stored uncompressed ahead of the values, which alone may be compressed. */
    private void readPageV2(byte[] bytes, Page p, int n, CompressionCodec codec, ParquetSchema.Field field,
                            ColumnBuilder into) {
        PageHeader h = p.header();
        DataPageHeaderV2 d = h.getData_page_header_v2();
        int repLength = d.getRepetition_levels_byte_length();
        int defLength = d.getDefinition_levels_byte_length();
        int compressed = h.getCompressed_page_size();
        if (repLength < 0 || defLength < 0 || (long) repLength + defLength > Math.min(compressed,
                h.getUncompressed_page_size())) {
            throw damaged(field, "levels of " + repLength + " + " + defLength + " bytes in a page of " + compressed);
        }
        int levelsEnd = p.at() + repLength + defLength;
        int present = n;
        if (field.optional()) {
            present = definitionLevels(bytes, p.at() + repLength, levelsEnd, n, field);
        }
        int dataLength = compressed - repLength - defLength;
        int dataSize = h.getUncompressed_page_size() - repLength - defLength;
        byte[] b = (d.isSetIs_compressed() && !d.isIs_compressed()) ? null
                : decompress(codec, bytes, levelsEnd, dataLength, dataSize);
        if (b == null) {
            ParquetCodec.checkUncompressed(dataLength, dataSize);
            values(bytes, levelsEnd, levelsEnd + dataLength, present, d.getEncoding(), field);
        } else {
            values(b, 0, dataSize, present, d.getEncoding(), field);
        }
        append(into, n, present);
    }

    /** Decodes {@code n} definition levels (bit width 1) into {@link #defined}; returns how many are 1. */
    private int definitionLevels(byte[] b, int from, int end, int n, ParquetSchema.Field field) {
        if (defined.length < n) {
            defined = new byte[n];
        }
        if (indexes.length < n) {
            indexes = new int[n];
        }
        hybrid(b, from, end, 1, n, indexes, field);
        int present = 0;
        for (int i = 0; i < n; i++) {
            int level = indexes[i];
            if (level > 1) {
                throw damaged(field, "a definition level of " + level + " in a flat column");
            }
            defined[i] = (byte) level;
            present += level;
        }
        return present;
    }

    /** Decodes {@code n} present values of a data page from {@code b[at, end)} into {@link #values}. */
    private void values(byte[] b, int at, int end, int n, Encoding encoding, ParquetSchema.Field field) {
        if (values.length < n) {
            values = new double[Math.max(n, values.length + values.length / 2)];
        }
        if (n == 0) {
            return;
        }
        if (encoding == Encoding.PLAIN) {
            if ((long) n * width(field) > end - at) {
                throw damaged(field, "a page of " + (end - at) + " bytes too short for its " + n + " values");
            }
            plain(b, at, n, field, values);
            return;
        }
        if (dictionarySize < 0) {
            throw damaged(field, "a dictionary-encoded page without a dictionary");
        }
        if (at >= end) {
            throw damaged(field, "a dictionary-encoded page without its bit width");
        }
        int bitWidth = b[at] & 0xff;
        if (bitWidth > 32) {
            throw damaged(field, "dictionary indexes of " + bitWidth + " bits");
        }
        if (indexes.length < n) {
            indexes = new int[n];
        }
        hybrid(b, at + 1, end, bitWidth, n, indexes, field);
        double[] dict = dictionary;
        int size = dictionarySize;
        double[] out = values;
        int[] idx = indexes;
        for (int i = 0; i < n; i++) {
            int k = idx[i];
            if (k < 0 || k >= size) { // unsigned: a 32-bit index above 2^31 reads as negative
                throw damaged(field, "a dictionary index " + Integer.toUnsignedString(k) + " past its " + size + " values");
            }
            out[i] = dict[k];
        }
    }

    /** Bytes per stored value. */
    private static int width(ParquetSchema.Field field) {
        return switch (field.type()) {
            case INT32, FLOAT -> 4;
            default -> 8;
        };
    }

    /** {@code n} PLAIN values from {@code b[at...]} as doubles, each as the general path converts it. */
    private static void plain(byte[] b, int at, int n, ParquetSchema.Field field, double[] out) {
        switch (field.reading()) {
            case DOUBLE -> {
                for (int i = 0; i < n; i++) {
                    out[i] = (double) DOUBLE_LE.get(b, at + 8 * i);
                }
            }
            case FLOAT -> {
                for (int i = 0; i < n; i++) {
                    out[i] = (float) FLOAT_LE.get(b, at + 4 * i);
                }
            }
            case INT32 -> {
                for (int i = 0; i < n; i++) {
                    out[i] = (int) INT_LE.get(b, at + 4 * i);
                }
            }
            case UINT32 -> {
                for (int i = 0; i < n; i++) {
                    out[i] = Integer.toUnsignedLong((int) INT_LE.get(b, at + 4 * i));
                }
            }
            case INT64 -> {
                for (int i = 0; i < n; i++) {
                    out[i] = (long) LONG_LE.get(b, at + 8 * i);
                }
            }
            case UINT64 -> {
                for (int i = 0; i < n; i++) {
                    out[i] = ParquetFile.unsignedToDouble((long) LONG_LE.get(b, at + 8 * i));
                }
            }
            default -> throw new IllegalStateException("not a direct reading: " + field.reading());
        }
    }

    /**
     * The RLE/bit-packed hybrid (Encodings.md): runs, each a ULEB128 header whose low bit says bit-packed
     * (groups of 8 values, {@code bitWidth} bits each, least significant first) or repeated (a count and
     * one little-endian value of ceil(bitWidth / 8) bytes). Decodes exactly {@code n} values into {@code out};
     * padding in a last bit-packed group is ignored.
     */
    private static void hybrid(byte[] b, int at, int end, int bitWidth, int n, int[] out, ParquetSchema.Field field) {
        int got = 0;
        long mask = (1L << bitWidth) - 1;
        int valueBytes = (bitWidth + 7) >>> 3;
        while (got < n) {
            long header = 0;
            for (int shift = 0; ; shift += 7) {
                if (at >= end || shift > 28) {
                    throw damaged(field, "levels or indexes end before their " + n + " values");
                }
                int x = b[at++] & 0xff;
                header |= (long) (x & 0x7f) << shift;
                if (x < 0x80) {
                    break;
                }
            }
            if ((header & 1) == 0) {
                long count = header >>> 1;
                if (valueBytes > end - at) {
                    throw damaged(field, "a repeated run past the end of its page");
                }
                int v = 0;
                for (int i = 0; i < valueBytes; i++) {
                    v |= (b[at + i] & 0xff) << (8 * i);
                }
                at += valueBytes;
                int k = (int) Math.min(count, n - got);
                java.util.Arrays.fill(out, got, got + k, v);
                got += k;
            } else {
                long groups = header >>> 1;
                long bytes = groups * bitWidth;
                if (bytes > end - at) {
                    throw damaged(field, "a bit-packed run past the end of its page");
                }
                int k = (int) Math.min(groups * 8, n - got);
                long buffer = 0;
                int bits = 0;
                int p = at;
                for (int i = 0; i < k; i++) {
                    while (bits < bitWidth) {
                        buffer |= (long) (b[p++] & 0xff) << bits;
                        bits += 8;
                    }
                    out[got + i] = (int) (buffer & mask);
                    buffer >>>= bitWidth;
                    bits -= bitWidth;
                }
                got += k;
                at += (int) bytes;
            }
        }
    }

    /** Adds a page's {@code n} cells, {@code present} of them values (the rest nulls, by {@link #defined}). */
    private void append(ColumnBuilder into, int n, int present) {
        if (present == n) {
            into.addNumbers(values, n);
            return;
        }
        into.addNumbersAndNulls(values, defined, n);
    }
}
