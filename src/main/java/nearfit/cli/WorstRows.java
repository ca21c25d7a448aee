package nearfit.cli;

/**
 * Keeps the row ids of the {@code capacity} largest scores seen, in a small array (capacity is a few
 * dozen at most, so insertion into a sorted array beats a heap). Ties keep the earlier row.
 */
final class WorstRows {
    private final int[] rows;
    private final double[] scores;
    private int size;

    WorstRows(int capacity) {
        rows = new int[capacity];
        scores = new double[capacity];
    }

    /** Considers row {@code row} with score {@code score}; invariant: scores[0..size) descending. */
    void offer(int row, double score) {
        if (rows.length == 0 || (size == rows.length && score <= scores[size - 1])) {
            return;
        }
        int at = size == rows.length ? size - 1 : size++;
        while (at > 0 && scores[at - 1] < score) {
            scores[at] = scores[at - 1];
            rows[at] = rows[at - 1];
            at--;
        }
        scores[at] = score;
        rows[at] = row;
    }

    /** The rows kept, largest score first. */
    int[] rowsLargestFirst() {
        return java.util.Arrays.copyOf(rows, size);
    }
}
