package nearfit.tui.keys;

/**
 * The steps of k taken by {@code +} and {@code -}: 1 2 3 5 7, then 10 15 20 30 50 70 and on by decades.
 * A k between two steps moves to the next step in the direction asked.
 */
public final class KLadder {
    private static final int[] DECADE = {10, 15, 20, 30, 50, 70};

    private KLadder() {
    }

    /** The step of the ladder at position {@code i} (0 gives 1). */
    static long step(int i) {
        if (i < 5) {
            return new int[] {1, 2, 3, 5, 7}[i];
        }
        int j = i - 5;
        long scale = 1;
        for (int d = 0; d < j / DECADE.length; d++) {
            scale *= 10;
        }
        return DECADE[j % DECADE.length] * scale;
    }

    /** The smallest step above {@code k}, at most {@code max}. */
    public static int up(int k, int max) {
        for (int i = 0; ; i++) {
            long s = step(i);
            if (s > k) {
                return (int) Math.min(s, Math.max(max, 1));
            }
        }
    }

    /** The largest step below {@code k}, at least 1. */
    public static int down(int k) {
        long best = 1;
        for (int i = 0; ; i++) {
            long s = step(i);
            if (s >= k) {
                return (int) best;
            }
            best = s;
        }
    }
}
