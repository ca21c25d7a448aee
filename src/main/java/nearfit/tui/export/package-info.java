/**
 * The explorer's export menu: the curve and the flagged rows as CSV (through {@code model.ResultCsv}, the
 * tool's one CSV writer, with the columns of {@code predict}), the plot as PNG or as text.
 *
 * <h2>Invariants</h2>
 * Files are written through {@code model.SafeOutput}: atomically, never over the input, and over an existing
 * file only after the user confirmed. An export uses the latest results; one still being computed says so
 * instead of writing a partial file.
 *
 * <h2>Entry point</h2>
 * {@link nearfit.tui.export.Exporter#export}, called by the loop for a {@code keys.Effect.Export}.
 */
package nearfit.tui.export;
