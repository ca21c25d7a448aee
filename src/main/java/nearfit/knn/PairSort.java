package nearfit.knn;

import java.util.Arrays;

/** Sorts parallel double arrays by (a, b) ascending, in place: canonical summation orders. */
final class PairSort {
    private PairSort() {
    }

    static void sort(double[] a, double[] b, int from, int to) {
        if (isSorted(a, b, from, to)) {
            return; // the usual case: neighbours arrive sorted by key and distinct keys are common
        }
        if (isAscending(a, from, to)) {
            sortWithinEqual(a, b, from, to); // neighbour lists arrive sorted by key: only ties need work
            return;
        }
        quicksort(a, b, from, to);
    }

    /**
     * With a ascending, sorts b inside each run of equal a. The (a, b) order is unique but for
     * the order of -0.0 and 0.0, which changes no sum.
     */
    private static void sortWithinEqual(double[] a, double[] b, int from, int to) {
        int i = from;
        while (i < to) {
            int j = i + 1;
            while (j < to && a[j] == a[i]) {
                j++;
            }
            if (j - i > 1 && !isAscending(b, i, j)) {
                Arrays.sort(b, i, j);
            }
            i = j;
        }
    }

    private static boolean isAscending(double[] a, int from, int to) {
        for (int i = from + 1; i < to; i++) {
            if (a[i] < a[i - 1]) {
                return false;
            }
        }
        return true;
    }

    private static void quicksort(double[] a, double[] b, int from, int to) {
        while (to - from > 24) {
            int mid = (from + to) >>> 1;
            double pa = a[mid];
            double pb = b[mid];
            int i = from;
            int j = to - 1;
            while (i <= j) {
                while (less(a[i], b[i], pa, pb)) {
                    i++;
                }
                while (less(pa, pb, a[j], b[j])) {
                    j--;
                }
                if (i <= j) {
                    swap(a, b, i++, j--);
                }
            }
            if (j - from < to - i) {
                quicksort(a, b, from, j + 1);
                from = i;
            } else {
                quicksort(a, b, i, to);
                to = j + 1;
            }
        }
        for (int i = from + 1; i < to; i++) {
            double x = a[i];
            double y = b[i];
            int j = i - 1;
            while (j >= from && less(x, y, a[j], b[j])) {
                a[j + 1] = a[j];
                b[j + 1] = b[j];
                j--;
            }
            a[j + 1] = x;
            b[j + 1] = y;
        }
    }

    private static boolean isSorted(double[] a, double[] b, int from, int to) {
        for (int i = from + 1; i < to; i++) {
            if (less(a[i], b[i], a[i - 1], b[i - 1])) {
                return false;
            }
        }
        return true;
    }

    private static boolean less(double a1, double b1, double a2, double b2) {
        return a1 < a2 || (a1 == a2 && b1 < b2);
    }

    private static void swap(double[] a, double[] b, int i, int j) {
        double t = a[i];
        a[i] = a[j];
        a[j] = t;
        t = b[i];
        b[i] = b[j];
        b[j] = t;
    }
}
