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
        return switch (codec) {
            case UNCOMPRESSED -> {
                if (length != size) {
                    throw new IllegalArgumentException("an uncompressed page of " + length + " bytes should hold " + size);
                }
                yield java.util.Arrays.copyOfRange(in, offset, offset + length);
            }
            case SNAPPY -> snappy(in, offset, length, size);
            case GZIP -> gzip(in, offset, length, size);
            case ZSTD -> airlift(new io.airlift.compress.zstd.ZstdDecompressor(), in, offset, length, size);
            case LZ4_RAW -> airlift(new io.airlift.compress.lz4.Lz4Decompressor(), in, offset, length, size);
            default -> throw new IllegalArgumentException("pages compressed with " + codec + " are not supported "
                    + "(SNAPPY, GZIP, ZSTD, LZ4_RAW or none are)");
        };
    }

    private static byte[] airlift(io.airlift.compress.Decompressor d, byte[] in, int offset, int length, int size) {
        byte[] out = new byte[size];
        int n;
        try {
            n = d.decompress(in, offset, length, out, 0, size);
        } catch (RuntimeException e) {
            throw new IllegalArgumentException("a damaged compressed page (" + e.getMessage() + ")");
        }
        if (n != size) {
            throw new IllegalArgumentException("a page decompressed to " + n + " bytes instead of " + size);
        }
        return out;
    }

    private static byte[] gzip(byte[] in, int offset, int length, int size) {
        byte[] out = new byte[size];
        try (GZIPInputStream z = new GZIPInputStream(new java.io.ByteArrayInputStream(in, offset, length))) {
            int n = z.readNBytes(out, 0, size);
            if (n != size) {
                throw new IllegalArgumentException("a page decompressed to " + n + " bytes instead of " + size);
            }
        } catch (java.io.IOException e) {
            throw new IllegalArgumentException("a damaged gzip page (" + e.getMessage() + ")");
        }
        return out;
    }

    /** Snappy's raw format: a varint length, then literals and back-references (copies). */
    static byte[] snappy(byte[] in, int offset, int length, int size) {
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
        byte[] out = new byte[size];
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
        return out;
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
