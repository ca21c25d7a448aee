package nearfit.cli;

import java.io.PrintWriter;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

import nearfit.model.JsonText;
import nearfit.table.BadCell;
import nearfit.table.ColumnSummary;
import nearfit.table.ColumnType;
import nearfit.table.LoadOptions;
import nearfit.table.LoadProgress;
import nearfit.table.LoadReport;
import nearfit.table.Table;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code nearfit describe FILE}: what a file holds, column by column, and what loading it found. */
@Command(name = "describe", mixinStandardHelpOptions = true,
        description = "Summarise each column of a CSV file (plain, gzip or - for standard input) and report "
                + "ragged rows and bad cells.")
final class DescribeCommand extends PlainLine.Streams implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "FILE", description = "The CSV file (plain or gzip), Parquet file, or folder of Parquet files; - for standard input.")
    String file;

    @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "table",
            converter = OptionChoices.DescribeFormatWords.class,
            completionCandidates = OptionChoices.DescribeFormatWords.class,
            description = "table (default) or json.")
    OptionChoices.DescribeFormat format;

    @Option(names = "--quiet", description = "No progress on standard error.")
    boolean quiet;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        return givenOut() != null ? run(givenOut(), givenErr())
                : run(spec.commandLine().getOut(), spec.commandLine().getErr());
    }

    /** Runs with output to {@code out} and warnings and progress to {@code err}; the exit status. */
    int run(PrintWriter out, PrintWriter err) {
        boolean progress = !quiet && System.console() != null;
        LoadOptions options = LoadOptions.builder().progress(progress ? progressTo(err) : LoadProgress.NONE).build();
        Table table = SourceTable.loadTable(file, "-".equals(file) ? null : ArgumentPath.of(file), options);
        if (progress) {
            err.print("\r\033[K");
        }
        // Warnings are about the data, not progress: on standard error even with --quiet, and in the report.
        SourceTable.printWarnings(table.report(), err);
        List<ColumnSummary> summaries = ColumnSummary.ofAll(table.columns(), Runtime.getRuntime().availableProcessors());
        out.print(format == OptionChoices.DescribeFormat.JSON ? json(table.report(), summaries) + "\n" : text(table.report(), summaries));
        out.flush();
        return 0;
    }

    private static LoadProgress progressTo(PrintWriter err) {
        return (bytes, total, rows) -> {
            synchronized (err) {
                err.printf(Locale.ROOT, "\rloading: %,d rows, %.0f MB%s", rows, bytes / 1e6,
                        total > 0 ? String.format(Locale.ROOT, " of %.0f MB", total / 1e6) : "");
                err.flush();
            }
        };
    }

    /** The one JSON object of {@code --format json}, fields in this order. */
    record DescribeJson(long rows, long droppedRows, long raggedRows, List<ColumnJson> columns, List<String> warnings) {
    }

    /** One column of {@link DescribeJson}. */
    record ColumnJson(String name, String type, long count, long missing, long bad, double min, double max,
                      double mean, double sd, double median) {
    }

    /** The one JSON object of {@code --format json}; times in epoch milliseconds, absent values null. */
    static String json(LoadReport report, List<ColumnSummary> summaries) {
        List<ColumnJson> columns = new ArrayList<>();
        for (ColumnSummary s : summaries) {
            columns.add(new ColumnJson(s.name(), s.type().label(), s.count(), s.missing(), s.bad(), s.min(), s.max(),
                    s.mean(), s.sd(), s.median()));
        }
        return JsonText.write(new DescribeJson(report.rows(), report.droppedRows(), report.raggedRows(), columns,
                report.warnings()));
    }

    private static final String[] HEAD = {"column", "type", "count", "missing", "bad", "min", "p01", "p25",
        "median", "p75", "p99", "max", "mean", "sd"};

    /** The human-readable report: one row per column, aligned, then the load report. */
    static String text(LoadReport r, List<ColumnSummary> summaries) {
        List<String[]> rows = new ArrayList<>();
        rows.add(HEAD);
        List<String> categories = new ArrayList<>();
        for (ColumnSummary s : summaries) {
            rows.add(cells(s));
            if (s.type() == ColumnType.CATEGORY) {
                StringBuilder sb = new StringBuilder("  " + shown(s.name()) + ": " + s.distinct()
                        + " distinct; most frequent");
                for (ColumnSummary.LabelCount lc : s.top()) {
                    sb.append(' ').append(shown(lc.label())).append(" (").append(lc.count()).append(')');
                }
                categories.add(sb.toString());
            }
        }
        StringBuilder out = new StringBuilder();
        // Concatenation, not String.format: see NumberText.
        out.append(shown(r.source())).append(": ").append(r.rows()).append(" rows kept, ").append(r.droppedRows())
                .append(" dropped, ").append(summaries.size()).append(" columns, ");
        if (r.delimiter() == LoadReport.PARQUET) {
            out.append("Parquet");
        } else {
            out.append("delimiter ").append(r.delimiterName()).append(", ")
                    .append(r.headerPresent() ? "header row" : "no header row")
                    .append(r.decimalComma() ? ", decimal comma" : "");
        }
        out.append('\n');
        out.append(align(rows));
        for (String c : categories) {
            out.append(c).append('\n');
        }
        appendReport(out, r);
        return out.toString();
    }

    private static void appendReport(StringBuilder out, LoadReport r) {
        out.append("ragged rows: ").append(r.raggedRows()).append(" dropped (").append(r.shortRows()).append(" short, ")
                .append(r.longRows()).append(" long; none of their cells is used)\n");
        for (BadCell c : r.raggedExamples()) {
            out.append("  line ").append(c.line()).append(": ").append(shown(c.text())).append('\n');
        }
        out.append("bad cells: ").append(r.badCells()).append(" (read as missing)\n");
        for (BadCell c : r.badExamples()) {
            out.append("  line ").append(c.line()).append(", column ").append(shown(c.column())).append(": \"")
                    .append(shown(c.text())).append("\"\n");
        }
        out.append("loaded ").append(NumberText.fixed(r.bytes() / 1e6, 1)).append(" MB in ")
                .append(NumberText.fixed(r.seconds(), 2)).append(" s (").append(NumberText.fixed(r.megabytesPerSecond(), 0))
                .append(" MB/s)\n");
        for (String w : r.warnings()) {
            out.append("warning: ").append(shown(w)).append('\n');
        }
    }

    private static String[] cells(ColumnSummary s) {
        double[] v = {s.min(), s.p01(), s.p25(), s.median(), s.p75(), s.p99(), s.max(), s.mean()};
        String[] out = new String[HEAD.length];
        out[0] = shown(s.name());
        out[1] = s.type().label();
        out[2] = Long.toString(s.count());
        out[3] = Long.toString(s.missing());
        out[4] = Long.toString(s.bad());
        for (int i = 0; i < v.length; i++) {
            out[5 + i] = s.type() == ColumnType.TIME ? time(v[i]) : number(v[i]);
        }
        out[13] = s.type() == ColumnType.TIME && !Double.isNaN(s.sd())
                ? number(s.sd() / 3_600_000.0) + " h" : number(s.sd());
        return out;
    }

    /**
     * A value to six significant digits, trailing zeros of the fraction dropped ({@code 2.5}, {@code 100000},
     * {@code 1e+20}, {@code -1.5e-20}); NaN as {@code -}. Only the digits after a decimal point are trimmed,
     * never an integer's zeros or the exponent's.
     */
    static String number(double d) {
        if (Double.isNaN(d)) {
            return "-";
        }
        String s = NumberText.significant6(d);
        int e = s.indexOf('e');
        String mantissa = e < 0 ? s : s.substring(0, e);
        String exponent = e < 0 ? "" : s.substring(e);
        if (mantissa.indexOf('.') >= 0) {
            int end = mantissa.length();
            while (mantissa.charAt(end - 1) == '0') {
                end--;
            }
            if (mantissa.charAt(end - 1) == '.') {
                end--;
            }
            mantissa = mantissa.substring(0, end);
        }
        return mantissa + exponent;
    }

    /** Text from the file (or its name) with control characters made visible, so it cannot drive the terminal. */
    private static String shown(String fromFile) {
        return nearfit.table.VisibleText.of(fromFile);
    }

    private static String time(double ms) {
        return Double.isNaN(ms) ? "-" : Instant.ofEpochMilli(Math.round(ms)).toString();
    }

    private static String align(List<String[]> rows) {
        int[] width = new int[HEAD.length];
        for (String[] r : rows) {
            for (int i = 0; i < r.length; i++) {
                width[i] = Math.max(width[i], r[i].length());
            }
        }
        StringBuilder sb = new StringBuilder();
        for (String[] r : rows) {
            for (int i = 0; i < r.length; i++) {
                // Names and types to the left, numbers to the right.
                sb.append(i == 0 ? "" : "  ");
                if (i >= 2) {
                    sb.append(" ".repeat(width[i] - r[i].length()));
                }
                sb.append(r[i]);
                if (i < 2) {
                    sb.append(" ".repeat(width[i] - r[i].length()));
                }
            }
            int end = sb.length();
            while (end > 0 && sb.charAt(end - 1) == ' ') { // no spaces at a line's end
                end--;
            }
            sb.setLength(end);
            sb.append('\n');
        }
        return sb.toString();
    }
}
