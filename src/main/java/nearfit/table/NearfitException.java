package nearfit.table;

/**
 * The one error type for the tool's own failures: bad input, bad options, damaged files.
 *
 * <p>It carries where the problem is, so the message a user sees names the file, the line and the
 * column when they are known, for example
 * {@code site-log.csv:1043: column power_kw: "12,5,3" is not a number}. Faces print
 * {@link #getMessage()} on one line and exit with status 2; stack traces only with {@code --debug}.
 */
public class NearfitException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /** Marks an unknown line number. */
    public static final long NO_LINE = -1;

    private final String file;
    private final long line;
    private final String column;
    private final String detail;

    /**
     * @param file   the file concerned as the user named it, or {@code null}
     * @param line   the 1-based source line, or {@link #NO_LINE}
     * @param column the column name, or {@code null}
     * @param detail what is wrong, in words a user can act on
     * @param cause  the underlying exception, or {@code null}
     */
    public NearfitException(String file, long line, String column, String detail, Throwable cause) {
        super(format(file, line, column, detail), cause);
        this.file = file;
        this.line = line;
        this.column = column;
        this.detail = detail;
    }

    /** A failure with no file position, such as a bad option. */
    public NearfitException(String detail) {
        this(null, NO_LINE, null, detail, null);
    }

    /** A failure concerning one file as a whole. */
    public static NearfitException inFile(String file, String detail) {
        return new NearfitException(file, NO_LINE, null, detail, null);
    }

    /** A failure concerning one file as a whole, with its cause. */
    public static NearfitException inFile(String file, String detail, Throwable cause) {
        return new NearfitException(file, NO_LINE, null, detail, cause);
    }

    /** A failure at one line of a file. */
    public static NearfitException atLine(String file, long line, String detail) {
        return new NearfitException(file, line, null, detail, null);
    }

    /** A failure concerning one column, with no particular line. */
    public static NearfitException inColumn(String column, String detail) {
        return new NearfitException(null, NO_LINE, column, detail, null);
    }

    /** The file as the user named it, or {@code null}. */
    public String file() {
        return file;
    }

    /** The 1-based source line, or {@link #NO_LINE}. */
    public long line() {
        return line;
    }

    /** The column name, or {@code null}. */
    public String column() {
        return column;
    }

    /** The message without the position prefix. */
    public String detail() {
        return detail;
    }

    private static String format(String file, long line, String column, String detail) {
        StringBuilder sb = new StringBuilder();
        if (file != null) {
            sb.append(file);
            if (line != NO_LINE) {
                sb.append(':').append(line);
            }
            sb.append(": ");
        } else if (line != NO_LINE) {
            sb.append("line ").append(line).append(": ");
        }
        if (column != null) {
            sb.append("column ").append(column).append(": ");
        }
        return sb.append(detail).toString();
    }
}
