package nearfit.cli;

import java.util.ArrayList;
import java.util.List;

/**
 * Keeps the {@code capacity} items of largest score seen, in a small array (capacity is a few dozen at
 * most, so insertion into a sorted array beats a heap). Ties keep the earlier item.
 *
 * @param <T> what is kept for each row, built only when {@link #admits} says it would be kept
 */
final class WorstRows<T> {
    private final Object[] items;
    private final double[] scores;
    private int size;

    WorstRows(int capacity) {
        items = new Object[capacity];
        scores = new double[capacity];
    }

    /** Whether an item of this score would be kept now (so the caller can skip building it). */
    boolean admits(double score) {
        return items.length > 0 && (size < items.length || score > scores[size - 1]);
    }

    /** Considers {@code item} with {@code score}; invariant: scores[0..size) descending. */
    void offer(T item, double score) {
        if (!admits(score)) {
            return;
        }
        int at = size == items.length ? size - 1 : size++;
        while (at > 0 && scores[at - 1] < score) {
            scores[at] = scores[at - 1];
            items[at] = items[at - 1];
            at--;
        }
        scores[at] = score;
        items[at] = item;
    }

    /** The items kept, largest score first. */
    @SuppressWarnings("unchecked")
    List<T> largestFirst() {
        List<T> out = new ArrayList<>(size);
        for (int i = 0; i < size; i++) {
            out.add((T) items[i]);
        }
        return out;
    }
}
