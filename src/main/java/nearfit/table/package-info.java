/**
 * Tables of equipment logs: loading CSV (plain, gzip, standard input, pipes) and Parquet (a file or a data-set
 * folder, through {@link nearfit.table.ParquetLoader}, which {@code CsvLoader} calls on the magic bytes {@code PAR1})
 * into chunked primitive columns,
 * the load report with its bad cells and line numbers, row conditions, and column summaries. Depends on no
 * other nearfit package; every other package may depend on it. Owns {@link nearfit.table.NearfitException},
 * the tool's one error type, and {@link nearfit.table.VisibleText}, the one rule for showing file-supplied
 * text on a terminal.
 *
 * <h2>Data flow</h2>
 * <pre>
 * bytes ─▶ Sniffer (delimiter, decimal comma, header) ─▶ ChunkParser per stretch of lines, on every core
 *   (PlainRowReader fast path, RowTokenizer for quoted or unusual rows) ─▶ TableAssembly ─▶ {@link nearfit.table.Table}
 * Parquet ─▶ ParquetFile (footer, ParquetSchema) ─▶ per (file, row group, column): pages (ParquetCodec) ─▶
 *   ParquetDirectDecoder (PLAIN and dictionary number pages) or parquet-column's decoders ─▶ ColumnBuilder
 *   ─▶ TableAssembly</pre>
 * <pre>
 * Table + "column op value and ..." ─▶ {@link nearfit.table.RowCondition} ─▶ {@link nearfit.table.RowSet} (sorted row ids)
 * Column ─▶ {@link nearfit.table.ColumnSummary} (linear: RankSelection for the quantiles)
 * </pre>
 *
 * <h2>Usage</h2>
 * <pre>{@code
 * LoadOptions options = LoadOptions.builder().progress(progress).build();
 * Table t = CsvLoader.load("site-log.csv.gz", options);   // "-" for standard input
 * LoadReport report = t.report();                        // rows, ragged lines, bad cells with lines, warnings
 * DecimalColumn wind = (DecimalColumn) t.column("wind_ms");
 * RowSet rows = RowCondition.parse("turbine = T05 and time >= 2025-11-01", t).select(t);
 * double[] values = wind.copyValues(rows);               // NaN where missing
 * List<ColumnSummary> s = ColumnSummary.ofAll(t.columns(), threads);
 * }</pre>
 *
 * <h2>Invariants</h2>
 * <ul>
 * <li><b>Columns</b> are immutable after the load: numbers as {@code double} (NaN missing), times as
 *     {@code long} epoch milliseconds UTC ({@link nearfit.table.TimeColumn#MISSING}), categories as
 *     {@code int} codes into a label dictionary (-1 missing), text not kept. Chunks of 32 Ki values, below
 *     G1's humongous threshold.</li>
 * <li><b>Every row keeps its source line</b> (a {@code long}, 1-based, counting the header), so every
 *     message and every flagged row can name it; a Parquet row keeps its file and 0-based row index instead,
 *     read through {@link nearfit.table.RowSource}.</li>
 * <li><b>A cell that does not parse</b> is missing and counted with its line and column; nothing is
 *     guessed or shifted.</li>
 * <li><b>Determinism.</b> The parallel parse gives the same table for any thread count; summaries are the
 *     same for any thread count.</li>
 * <li><b>Errors</b> are {@link nearfit.table.NearfitException}s that name the file, line and column; a file
 *     that changes while it is read fails or warns ({@link nearfit.table.LoadReport#warnings()}).</li>
 * </ul>
 */
package nearfit.table;
