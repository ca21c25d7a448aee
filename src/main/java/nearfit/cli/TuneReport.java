package nearfit.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.util.Locale;

import nearfit.model.JsonText;
import nearfit.model.ResultCsv;
import nearfit.model.TuningSummary;

/** Writes a tuning table as an aligned text table, CSV or JSON. */
final class TuneReport {
    private TuneReport() {
    }

    static void write(TuningSummary t, OptionChoices.TuneFormat format, PrintWriter out) {
        switch (format) {
            case JSON -> out.println(JsonText.write(t.toJson()));
            case CSV -> writeCsv(t, out);
            default -> writeTable(t, out);
        }
        out.flush();
    }

    private static String[] header(TuningSummary t) {
        return t.forCategories() ? new String[] {"k", "error_rate", "error_rate_se"}
                : new String[] {"k", "rmse", "rmse_se", "mae", "press", "r2_pred"};
    }

    private static double[] row(TuningSummary t, int i) {
        return t.forCategories() ? new double[] {t.errorRate()[i], t.errorRateSe()[i]}
                : new double[] {t.rmse()[i], t.rmseSe()[i], t.mae()[i], t.press()[i], t.r2Pred()[i]};
    }

    private static void writeCsv(TuningSummary t, PrintWriter out) {
        try {
            ResultCsv csv = new ResultCsv(out);
            csv.header(java.util.List.of(header(t)));
            for (int i = 0; i < t.k().length; i++) {
                csv.whole(t.k()[i]);
                for (double v : row(t, i)) {
                    csv.number(v);
                }
                csv.endRow();
            }
            csv.flush();
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }

    private static void writeTable(TuningSummary t, PrintWriter out) {
        String[] names = t.forCategories() ? new String[] {"k", "error rate", "SE"}
                : new String[] {"k", "RMSE", "RMSE SE", "MAE", "PRESS", "pred R2"};
        StringBuilder line = new StringBuilder();
        for (String name : names) {
            line.append(String.format(Locale.ROOT, "%12s", name));
        }
        out.println(line.toString().stripTrailing());
        for (int i = 0; i < t.k().length; i++) {
            line.setLength(0);
            line.append(String.format(Locale.ROOT, "%12d", t.k()[i]));
            for (double v : row(t, i)) {
                line.append(String.format(Locale.ROOT, "%12s", significant(v)));
            }
            String mark = (t.k()[i] == t.bestK() ? " best" : "") + (t.k()[i] == t.oneSeK() ? " one-SE" : "");
            out.println(line + mark);
        }
        out.printf(Locale.ROOT, "rows %d%s; lowest %s at k = %d; one-SE k = %d%n", t.rows(),
                t.sampled() < 0 ? "" : " (" + t.sampled() + " sampled rows evaluated)",
                t.forCategories() ? "error rate" : "RMSE", t.bestK(), t.oneSeK());
        String held = heldOutLine(t);
        if (held != null) {
            out.println(held);
        }
        String edge = edgeNote(t);
        if (edge != null) {
            out.println(edge);
        }
    }

    /**
     * How rows were held out, with the blocks, the rows evaluated and the SE basis, and that the scaling was fitted
     * once on all reference rows; null when the table does not record it.
     */
    static String heldOutLine(TuningSummary t) {
        if (t.seBasis() == null) {
            return null;
        }
        long evaluated = t.sampled() < 0 ? t.rows() : t.sampled();
        String rule = "blocks".equals(t.seBasis()) ? " (one-SE k: each k against the best on the same blocks)" : "";
        return String.format(Locale.ROOT, "held out: %s (--cv %s); %d blocks, %d rows evaluated; SEs over %s%s; "
                + "scaling fitted once on all reference rows", t.scheme(), t.cv(), t.blocks(), evaluated, t.seBasis(),
                rule);
    }

    /**
     * The line that says a choice lies at the largest k tried, or null when none does: the figures may still
     * fall beyond the range, so the choice is the range's, not the data's.
     */
    static String edgeNote(TuningSummary t) {
        if (!t.bestAtEdge() && !t.oneSeAtEdge()) {
            return null;
        }
        String which = t.bestAtEdge() && t.oneSeAtEdge() ? "the lowest " + (t.forCategories() ? "error rate" : "RMSE")
                + " and the one-SE k are" : t.bestAtEdge() ? "the lowest " + (t.forCategories() ? "error rate" : "RMSE")
                + " is" : "the one-SE k is";
        return String.format(Locale.ROOT, "note: %s at the largest k tried (%d); a larger k may do better: "
                + "try --kmax %d", which, t.largestK(), (int) Math.min(2L * t.largestK(), t.rows() - 1));
    }

    /** Five significant digits, no exponent for ordinary magnitudes; NaN as a dash. */
    static String significant(double v) {
        if (!Double.isFinite(v)) {
            return "-";
        }
        double a = Math.abs(v);
        if (a != 0 && (a >= 1e7 || a < 1e-4)) {
            return String.format(Locale.ROOT, "%.4e", v);
        }
        return new java.math.BigDecimal(v).round(new java.math.MathContext(5)).stripTrailingZeros()
                .toPlainString();
    }
}
