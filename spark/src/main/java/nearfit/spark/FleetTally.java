package nearfit.spark;

import java.io.Serializable;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * A job's counts, per task and then merged on the driver: rows, scored, flagged and beyond the reference over
 * all and per group, rows beyond per input, unscored rows per missing column, bad cells, malformed lines, and
 * the worst rows. The same counts as the single-machine check's tally; here they add up across partitions,
 * so the worst rows are ordered by |z|, then file and row index (the earlier row wins a tie, as there).
 */
final class FleetTally implements Serializable {
    private static final long serialVersionUID = 1L;

    /** One of the worst rows: its file and row index, time (epoch ms, NaN none), group, inputs and scores. */
    record Worst(String file, long row, double time, String group, double[] inputs, double response, double fit,
                 double bandLow, double bandHigh, double z, boolean beyond) implements Serializable {
    }

    static final Comparator<Worst> ORDER = Comparator.comparingDouble((Worst w) -> -Math.abs(w.z()))
            .thenComparing(Worst::file).thenComparingLong(Worst::row);

    long rows;
    long scored;
    long flagged;
    long far;
    long beyond;
    long badCells;
    long malformed;
    long written;
    final long[] below;
    final long[] above;
    /** Unscored rows with input j missing (j < inputs), or the response missing (j = inputs). */
    final long[] missing;
    /** Per group label: rows, scored, flagged, beyond; sorted by label. */
    final TreeMap<String, long[]> groups = new TreeMap<>();
    private final int capacity;
    private final ArrayList<Worst> worst = new ArrayList<>();

    FleetTally(int inputs, int worstCount) {
        below = new long[inputs];
        above = new long[inputs];
        missing = new long[inputs + 1];
        capacity = worstCount;
    }

    /** The counts of a group, created at its first row. */
    long[] group(String label) {
        return groups.computeIfAbsent(label, g -> new long[4]);
    }

    /** Whether a row of this |z| could be among the worst now (ties may win on their file and row). */
    boolean admits(double absZ) {
        return capacity > 0 && (worst.size() < capacity || absZ >= Math.abs(worst.get(worst.size() - 1).z()));
    }

    void offer(Worst w) {
        int at = worst.size();
        while (at > 0 && ORDER.compare(worst.get(at - 1), w) > 0) {
            at--;
        }
        if (at < capacity) {
            worst.add(at, w);
            if (worst.size() > capacity) {
                worst.remove(worst.size() - 1);
            }
        }
    }

    List<Worst> worst() {
        return worst;
    }

    /** Adds another tally's counts to this one. */
    void merge(FleetTally o) {
        rows += o.rows;
        scored += o.scored;
        flagged += o.flagged;
        far += o.far;
        beyond += o.beyond;
        badCells += o.badCells;
        malformed += o.malformed;
        written += o.written;
        for (int j = 0; j < below.length; j++) {
            below[j] += o.below[j];
            above[j] += o.above[j];
        }
        for (int j = 0; j < missing.length; j++) {
            missing[j] += o.missing[j];
        }
        for (Map.Entry<String, long[]> e : o.groups.entrySet()) {
            long[] mine = group(e.getKey());
            for (int i = 0; i < mine.length; i++) {
                mine[i] += e.getValue()[i];
            }
        }
        for (Worst w : o.worst) {
            offer(w);
        }
    }

    FleetTally copy() {
        FleetTally c = new FleetTally(below.length, capacity);
        c.merge(this);
        return c;
    }

    boolean isZero() {
        return rows == 0 && malformed == 0 && badCells == 0 && written == 0 && groups.isEmpty();
    }
}
