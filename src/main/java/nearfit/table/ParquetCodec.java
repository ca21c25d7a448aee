package nearfit.table;

import java.io.ByteArrayOutputStream;
import java.util.zip.Deflater;
import java.util.zip.GZIPInputStream;
import java.util.zip.GZIPOutputStream;

import org.apache.parquet.format.CompressionCodec;

/**
 * Page compression of Parquet files: UNCOMPRESSED, SNAPPY (our own raw-format decoder and a greedy encoder,
 * after the Snappy format description in google/snappy's format_description.txt), GZIP (the JDK's zlib),
 * ZSTD and LZ4_RAW (the pure-Java decoders of aircompressor). Others (LZO, BROTLI, the framed LZ4) are
 * refused with the codec's name. A damaged page fails as an {@link IllegalArgumentException} the loader
 * turns into one line naming the file.
 */
public final class ParquetCodec {
    private ParquetCodec() {
    }

    /** Decompresses {@code length} bytes of {@code in} from {@code offset} into exactly {@code size} bytes. */
    static byte[] decompress(CompressionCodec codec, byte[] in, int offset, int length, int size) {
        if (codec == CompressionCodec.UNCOMPRESSED) {
            checkUncompressed(length, size);
            return java.util.Arrays.copyOfRange(in, offset, offset + length);
        }
        byte[] out = new byte[size];
        decompressInto(codec, in, offset, length, out, size, null);
        return out;
    }

    /**
     * Decompresses {@code length} bytes of {@code in} from {@code offset} into exactly {@code size} bytes at the
     * start of {@code out} (at least {@code size} long), with the ZSTD and LZ4_RAW decoders of {@code reused}
     * (one per thread; null makes new ones). Not for UNCOMPRESSED pages: those are read where they lie.
     */
    static void decompressInto(CompressionCodec codec, byte[] in, int offset, int length, byte[] out, int size,
                               Decompressors reused) {
        switch (codec) {
            case UNCOMPRESSED -> {
                checkUncompressed(length, size);
                System.arraycopy(in, offset, out, 0, length);
            }
            case SNAPPY -> snappyInto(in, offset, length, out, size);
            case GZIP -> gzip(in, offset, length, out, size);
            case ZSTD -> airlift(reused == null ? new io.airlift.compress.zstd.ZstdDecompressor() : reused.zstd(),
                    in, offset, length, out, size);
            case LZ4_RAW -> airlift(reused == null ? new io.airlift.compress.lz4.Lz4Decompressor() : reused.lz4(),
                    in, offset, length, out, size);
            default -> throw new IllegalArgumentException("pages compressed with " + codec + " are not supported "
                    + "(SNAPPY, GZIP, ZSTD, LZ4_RAW or none are)");
        }
    }

    static void checkUncompressed(int length, int size) {
        if (length != size) {
            throw new IllegalArgumentException("an uncompressed page of " + length + " bytes should hold " + size);
        }
    }

    /** The library decoders one thread reuses from page to page (each holds tables worth keeping); not thread-safe. */
    static final class Decompressors {
        private io.airlift.compress.zstd.ZstdDecompressor zstd;
        private io.airlift.compress.lz4.Lz4Decompressor lz4;

        io.airlift.compress.Decompressor zstd() {
            if (zstd == null) {
                zstd = new io.airlift.compress.zstd.ZstdDecompressor();
            }
            return zstd;
        }

        io.airlift.compress.Decompressor lz4() {
            if (lz4 == null) {
                lz4 = new io.airlift.compress.lz4.Lz4Decompressor();
            }
            return lz4;
        }
    }

    private static void airlift(io.airlift.compress.Decompressor d, byte[] in, int offset, int length, byte[] out, int size) {
        int n;
        try {
            n = d.decompress(in, offset, length, out, 0, size);
        } catch (RuntimeException e) {
            throw new IllegalArgumentException("a damaged compressed page (" + e.getMessage() + ")");
        }
        if (n != size) {
            throw new IllegalArgumentException("a page decompressed to " + n + " bytes instead of " + size);
        }
    }

    private static void gzip(byte[] in, int offset, int length, byte[] out, int size) {
        try (GZIPInputStream z = new GZIPInputStream(new java.io.ByteArrayInputStream(in, offset, length))) {
            int n = z.readNBytes(out, 0, size);
            if (n != size) {
                throw new IllegalArgumentException("a page decompressed to " + n + " bytes instead of " + size);
            }
        } catch (java.io.IOException e) {
            throw new IllegalArgumentException("a damaged gzip page (" + e.getMessage() + ")");
        }
    }

    static byte[] snappy(byte[] in, int offset, int length, int size) {
        byte[] out = new byte[size];
        snappyInto(in, offset, length, out, size);
        return out;
    }

    /** Snappy's raw format: a varint length, then literals and back-references (copies); into {@code out[0, size)}. */
    private static void snappyInto(byte[] in, int offset, int length, byte[] out, int size) {
        int p = offset;
        int end = offset + length;
        long declared = 0;
        for (int shift = 0; ; shift += 7) {
            if (p >= end || shift > 28) {
                throw new IllegalArgumentException("a damaged snappy page (bad length)");
            }
            int b = in[p++] & 0xff;
            declared |= (long) (b & 0x7f) << shift;
            if (b < 0x80) {
                break;
            }
        }
        if (declared != size) {
            throw new IllegalArgumentException("a snappy page of " + declared + " bytes should hold " + size);
        }
        int o = 0;
        try {
            while (p < end) {
                int tag = in[p++] & 0xff;
                int kind = tag & 3;
                if (kind == 0) {
                    int len = tag >>> 2;
                    if (len >= 60) {
                        int bytes = len - 59;
                        len = 0;
                        for (int i = 0; i < bytes; i++) {
                            len |= (in[p++] & 0xff) << (8 * i);
                        }
                    }
                    len++;
                    if (len <= 0 || len > end - p || len > size - o) {
                        throw new IllegalArgumentException("a damaged snappy page (literal past the end)");
                    }
                    System.arraycopy(in, p, out, o, len);
                    p += len;
                    o += len;
                    continue;
                }
                int len;
                int distance;
                if (kind == 1) {
                    len = ((tag >>> 2) & 7) + 4;
                    distance = ((tag >>> 5) << 8) | (in[p++] & 0xff);
                } else if (kind == 2) {
                    len = (tag >>> 2) + 1;
                    distance = (in[p] & 0xff) | (in[p + 1] & 0xff) << 8;
                    p += 2;
                } else {
                    len = (tag >>> 2) + 1;
                    distance = (in[p] & 0xff) | (in[p + 1] & 0xff) << 8 | (in[p + 2] & 0xff) << 16 | (in[p + 3] & 0xff) << 24;
                    p += 4;
                }
                if (distance <= 0 || distance > o || len > size - o) {
                    throw new IllegalArgumentException("a damaged snappy page (copy out of range)");
                }
                for (int i = 0; i < len; i++) { // byte by byte: an overlapping copy repeats a pattern
                    out[o + i] = out[o - distance + i];
                }
                o += len;
            }
        } catch (ArrayIndexOutOfBoundsException e) {
            throw new IllegalArgumentException("a damaged snappy page (ends inside an element)");
        }
        if (o != size) {
            throw new IllegalArgumentException("a snappy page decompressed to " + o + " bytes instead of " + size);
        }
    }

    /**
     * Snappy's raw format, greedy: a 4-byte hash table of the last position of each hashed word, copies of
     * at least 4 bytes within 64 KiB blocks, literals otherwise. Not the reference encoder's output, but
     * any Snappy decoder reads it.
     */
    public static byte[] snappyCompress(byte[] in, int length) {
        ByteArrayOutputStream out = new ByteArrayOutputStream(length / 2 + 16);
        for (int v = length; ; v >>>= 7) {
            if (v < 0x80) {
                out.write(v);
                break;
            }
            out.write((v & 0x7f) | 0x80);
        }
        int[] table = new int[1 << 14];
        for (int block = 0; block < length; block += 1 << 16) {
            int blockEnd = Math.min(length, block + (1 << 16));
            java.util.Arrays.fill(table, -1);
            int literal = block;
            int p = block;
            while (p + 4 <= blockEnd) {
                int word = (in[p] & 0xff) | (in[p + 1] & 0xff) << 8 | (in[p + 2] & 0xff) << 16 | (in[p + 3] & 0xff) << 24;
                int h = (word * 0x1e35a7bd) >>> 18;
                int candidate = table[h];
                table[h] = p;
                if (candidate >= block && in[candidate] == in[p] && in[candidate + 1] == in[p + 1]
                        && in[candidate + 2] == in[p + 2] && in[candidate + 3] == in[p + 3]) {
                    writeLiteral(out, in, literal, p - literal);
                    int len = 4;
                    while (p + len < blockEnd && in[candidate + len] == in[p + len]) {
                        len++;
                    }
                    writeCopy(out, p - candidate, len);
                    p += len;
                    literal = p;
                } else {
                    p++;
                }
            }
            writeLiteral(out, in, literal, blockEnd - literal);
        }
        return out.toByteArray();
    }

    private static void writeLiteral(ByteArrayOutputStream out, byte[] in, int from, int len) {
        if (len == 0) {
            return;
        }
        int n = len - 1;
        if (n < 60) {
            out.write(n << 2);
        } else if (n < 1 << 8) {
            out.write(60 << 2);
            out.write(n);
        } else {
            out.write(61 << 2);
            out.write(n & 0xff);
            out.write(n >>> 8);
        }
        out.write(in, from, len);
    }

    private static void writeCopy(ByteArrayOutputStream out, int distance, int len) {
        while (len > 0) {
            int n = Math.min(len, 64);
            if (len - n > 0 && len - n < 4) {
                n = len - 4; // leave at least 4 for the next copy
            }
            out.write(((n - 1) << 2) | 2);
            out.write(distance & 0xff);
            out.write(distance >>> 8);
            len -= n;
        }
    }

    /** Gzip at the fastest level, for a check against readers that expect GZIP pages. */
    static byte[] gzipCompress(byte[] in, int length) {
        ByteArrayOutputStream b = new ByteArrayOutputStream(length / 2 + 32);
        try (GZIPOutputStream z = new GZIPOutputStream(b) {
            {
                def.setLevel(Deflater.BEST_SPEED);
            }
        }) {
            z.write(in, 0, length);
        } catch (java.io.IOException e) {
            throw new IllegalStateException("writing to memory cannot fail", e);
        }
        return b.toByteArray();
    }

}
