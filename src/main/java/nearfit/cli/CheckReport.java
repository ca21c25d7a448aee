package nearfit.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import nearfit.model.Json;
import nearfit.table.VisibleText;

/**
 * The outcome of {@code check}: counts over all rows and per group, the worst rows, and whether the
 * flagged share is within the limit. Built by {@link #tally} from per-row z values; printed as text
 * or JSON, both ending with the cautions.
 *
 * @param rows      rows read (after the row condition)
 * @param scored    rows with a finite z (inputs and response present)
 * @param flagged   scored rows with |z| above the threshold
 * @param limit     the allowed flagged share, a fraction
 * @param threshold the |z| threshold
 * @param groups    per-group counts in dictionary order, empty without a group column
 * @param worst     the rows of largest |z|, largest first
 */
record CheckReport(long rows, long scored, long flagged, double limit, double threshold,
                   List<GroupCount> groups, List<WorstRow> worst) {
    /** Counts for one group. */
    record GroupCount(String group, long rows, long scored, long flagged) {
        double share() {
            return scored == 0 ? 0.0 : (double) flagged / scored;
        }
    }

    /** One of the worst rows. */
    record WorstRow(long line, String group, double response, double fit, double z) {
    }

    /** The share of scored rows flagged; 0 when none was scored. */
    double flaggedFraction() {
        return scored == 0 ? 0.0 : (double) flagged / scored;
    }

    /** Whether the flagged share is within the limit. */
    boolean passed() {
        return flaggedFraction() <= limit;
    }

    /**
     * Counts rows, scored rows and flags. {@code z[i]} NaN means row i was not scored;
     * {@code groupCodes} may be {@code null}, and a code of -1 is a missing group.
     */
    static CheckReport tally(double[] z, double[] response, double[] fit, long[] lines, int[] groupCodes,
                             List<String> groupLabels, double threshold, double limit, int worstCount) {
        Tally t = new Tally(groupCodes == null ? List.of() : groupLabels, threshold, worstCount);
        for (int i = 0; i < z.length; i++) {
            t.add(z[i], response[i], fit[i], lines[i], groupCodes == null ? -1 : groupCodes[i]);
        }
        return t.report(limit);
    }

    /**
     * Counts rows one at a time, in row order, keeping only the counts and the worst rows, so rows can
     * be scored and tallied block by block. Ties among the worst rows keep the earlier row.
     */
    static final class Tally {
        private final List<String> groupLabels;
        private final double threshold;
        private final long[] gRows;
        private final long[] gScored;
        private final long[] gFlagged;
        private final WorstRows<WorstRow> worst;
        private long rows;
        private long scored;
        private long flagged;

        /** A tally over the given group labels (empty without a group column). */
        Tally(List<String> groupLabels, double threshold, int worstCount) {
            this.groupLabels = groupLabels;
            this.threshold = threshold;
            int groups = groupLabels.size();
            gRows = new long[groups];
            gScored = new long[groups];
            gFlagged = new long[groups];
            worst = new WorstRows<>(worstCount);
        }

        /** Counts the next row: z NaN when it was not scored, group -1 when missing. */
        void add(double z, double response, double fit, long line, int group) {
            rows++;
            if (group >= 0) {
                gRows[group]++;
            }
            if (Double.isNaN(z)) {
                return;
            }
            scored++;
            boolean flag = Math.abs(z) > threshold;
            if (group >= 0) {
                gScored[group]++;
                gFlagged[group] += flag ? 1 : 0;
            }
            flagged += flag ? 1 : 0;
            double a = Math.abs(z);
            if (worst.admits(a)) {
                worst.offer(new WorstRow(line, group < 0 ? null : groupLabels.get(group), response, fit, z), a);
            }
        }

        /** The report of the rows counted so far. */
        CheckReport report(double limit) {
            List<GroupCount> byGroup = new ArrayList<>();
            for (int g = 0; g < gRows.length; g++) {
                if (gRows[g] > 0) {
                    byGroup.add(new GroupCount(groupLabels.get(g), gRows[g], gScored[g], gFlagged[g]));
                }
            }
            return new CheckReport(rows, scored, flagged, limit, threshold, byGroup, worst.largestFirst());
        }
    }

    /** The JSON document of {@code check --format json}. */
    String toJson() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("rows", rows);
        m.put("scored", scored);
        m.put("flagged", flagged);
        m.put("flagged_fraction", flaggedFraction());
        m.put("limit", limit);
        m.put("passed", passed());
        m.put("threshold", threshold);
        Map<String, Object> byGroup = new LinkedHashMap<>();
        for (GroupCount g : groups) {
            Map<String, Object> one = new LinkedHashMap<>();
            one.put("rows", g.rows());
            one.put("scored", g.scored());
            one.put("flagged", g.flagged());
            one.put("flagged_fraction", g.share());
            byGroup.put(g.group(), one);
        }
        m.put("by_group", byGroup);
        List<Object> worstRows = new ArrayList<>();
        for (WorstRow w : worst) {
            Map<String, Object> one = new LinkedHashMap<>();
            one.put("line", w.line());
            one.put("group", w.group());
            one.put("response", w.response());
            one.put("fit", w.fit());
            one.put("z", w.z());
            worstRows.add(one);
        }
        m.put("worst", worstRows);
        m.put("caution", Cautions.TEXT);
        return Json.write(m);
    }

    /** The text report; its last paragraph is the cautions. */
    void writeText(PrintWriter out, String responseName, String groupName) {
        out.printf(Locale.ROOT, "rows %d, scored %d, flagged %d (%s %%, |z| > %s), limit %s %%: %s%n",
                rows, scored, flagged, percent(flaggedFraction()), TuneReport.significant(threshold),
                percent(limit), passed() ? "PASSED" : "FAILED");
        if (!groups.isEmpty()) {
            out.println();
            out.printf(Locale.ROOT, "%-12s %10s %10s %10s %9s%n", VisibleText.of(groupName), "rows", "scored",
                    "flagged", "share %");
            for (GroupCount g : groups) {
                out.printf(Locale.ROOT, "%-12s %10d %10d %10d %9s%n", VisibleText.of(g.group()), g.rows(), g.scored(),
                        g.flagged(), percent(g.share()));
            }
        }
        if (!worst.isEmpty()) {
            out.println();
            out.println("worst rows (by |z|):");
            out.printf(Locale.ROOT, "%10s %-12s %12s %12s %9s%n", "line", groupName == null ? "" : VisibleText.of(groupName),
                    VisibleText.of(responseName), "fit", "z");
            for (WorstRow w : worst) {
                out.printf(Locale.ROOT, "%10d %-12s %12s %12s %9s%n", w.line(), w.group() == null ? "" : VisibleText.of(w.group()),
                        TuneReport.significant(w.response()), TuneReport.significant(w.fit()),
                        String.format(Locale.ROOT, "%.2f", w.z()));
            }
        }
        out.println();
        out.println("Caution: " + Cautions.TEXT);
        out.flush();
    }

    private static String percent(double fraction) {
        return String.format(Locale.ROOT, "%.2f", 100.0 * fraction);
    }
}
