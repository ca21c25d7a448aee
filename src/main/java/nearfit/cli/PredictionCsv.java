package nearfit.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.Writer;
import java.nio.file.Path;
import java.util.Collection;
import java.util.List;

import nearfit.model.ResultCsv;

/**
 * Writes scored rows through {@link ResultCsv}, the one CSV writer: {@code line}, the file's first time
 * column (when it has one and it is not an input), the group, the inputs, the response, then
 * {@code fit, band_lo, band_hi, resid, z} for a number response or {@code class, share} for a category
 * response.
 */
final class PredictionCsv {
    /** Which rows of a block to write. */
    @FunctionalInterface
    interface RowFilter {
        boolean keep(ScoredRows.Block block, int i);
    }

    private final ResultCsv csv;
    private final ScoredRows source;
    private final List<String> classLabels;
    /** Whether the time column is written on its own (it is not one of the inputs). */
    private final boolean timeColumn;

    /** Starts a CSV of {@code source}'s rows on {@code w} and writes its header. */
    PredictionCsv(Writer w, ScoredRows source, String responseName, List<String> classLabels) throws IOException {
        this.csv = new ResultCsv(w);
        this.source = source;
        this.classLabels = classLabels;
        this.timeColumn = source.time() != null && !source.inputNames().contains(source.time().name());
        csv.header(ResultCsv.rowColumns(timeColumn ? source.time().name() : null,
                source.group() == null ? null : source.group().name(), source.inputNames(),
                source.hasResponse() ? responseName : null, source.categoryResponse()));
    }

    /**
     * Scores every row of {@code s} block by block and writes those {@code filter} keeps to {@code target}, or
     * to standard output when it is {@code null} or {@code -}.
     */
    static void write(ScoredRows s, String responseName, List<String> classLabels, Path target, boolean force,
                      Collection<Path> inputs, PrintWriter stdout, RowFilter filter) {
        CommandOutput.text(target, force, inputs, stdout, w -> {
            PredictionCsv csv = new PredictionCsv(w, s, responseName, classLabels);
            s.forEachBlock(b -> csv.rows(b, filter));
            csv.flush();
        });
    }

    /** Writes the rows of {@code block} that {@code filter} keeps. */
    void rows(ScoredRows.Block block, RowFilter filter) throws IOException {
        for (int i = 0; i < block.size(); i++) {
            if (filter.keep(block, i)) {
                record(block, i);
            }
        }
    }

    void flush() throws IOException {
        csv.flush();
    }

    private void record(ScoredRows.Block b, int i) throws IOException {
        csv.whole(b.lines()[i]);
        if (timeColumn) {
            csv.time(b.times()[i]);
        }
        if (b.groups() != null) {
            int g = b.groups()[i];
            csv.text(g < 0 ? "" : source.group().labels().get(g));
        }
        for (int j = 0; j < b.x().length; j++) {
            if (source.timeInput(j)) {
                csv.time(b.x()[j][i]);
            } else {
                csv.number(b.x()[j][i]);
            }
        }
        if (b.scores() != null) {
            numbers(b, i);
        } else {
            if (b.actualClass() != null) {
                int a = b.actualClass()[i];
                csv.text(a < 0 ? "" : classLabels.get(a));
            }
            int c = b.votes().winner()[i];
            csv.text(c < 0 ? "" : classLabels.get(c));
            csv.number(b.votes().share()[i]);
        }
        csv.endRow();
    }

    private void numbers(ScoredRows.Block b, int i) throws IOException {
        boolean hasResponse = b.response() != null;
        if (hasResponse) {
            csv.number(b.response()[i]);
        }
        csv.number(b.scores().fit()[i]).number(b.scores().bandLow()[i]).number(b.scores().bandHigh()[i]);
        if (hasResponse) {
            csv.number(b.scores().residual()[i]).number(b.scores().z()[i]);
        }
    }
}
