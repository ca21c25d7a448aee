package nearfit.knn;

import java.time.Duration;

/**
 * How tuning holds rows out: a row is predicted only from reference rows outside its own block
 * (itself, its fold, its group, its span of time). {@link HeldOutBlocks#of} turns a scheme into one
 * block id per reference row. Scaling and the Mahalanobis whitening stay the ones fitted on all
 * reference rows whatever the scheme.
 */
public sealed interface HeldOutScheme {

    /** Each row is its own block: leave-one-out (duplicates of the row still count as neighbours). */
    record LeaveOneOut() implements HeldOutScheme {
    }

    /**
     * Seeded random folds: row i of a seeded permutation goes to fold {@code i mod count}.
     *
     * @param count folds, at least 2
     * @param seed  the permutation's seed
     */
    record Folds(int count, long seed) implements HeldOutScheme {
        public Folds {
            if (count < 2) {
                throw new IllegalArgumentException("folds must be at least 2, got " + count);
            }
        }
    }

    /** Leave one group out: all rows of a group (such as a turbine) form one block. */
    record ByGroup() implements HeldOutScheme {
    }

    /**
     * Leave one span of time out: contiguous spans of {@code period} aligned to the UTC epoch
     * (1 day: UTC calendar days).
     */
    record ByBlock(Duration period) implements HeldOutScheme {
        public ByBlock {
            requirePositive(period);
        }
    }

    /** A group's span of time is one block (a turbine's day). */
    record GroupAndBlock(Duration period) implements HeldOutScheme {
        public GroupAndBlock {
            requirePositive(period);
        }
    }

    /** Whether the SE is taken over blocks (groups and spans of time) rather than over rows. */
    default boolean seOverBlocks() {
        return this instanceof ByGroup || this instanceof ByBlock || this instanceof GroupAndBlock;
    }

    /** Whether the scheme needs a group column. */
    default boolean needsGroups() {
        return this instanceof ByGroup || this instanceof GroupAndBlock;
    }

    /** The span of time of a blocked scheme, or null. */
    default Duration period() {
        if (this instanceof ByBlock b) {
            return b.period();
        }
        return this instanceof GroupAndBlock g ? g.period() : null;
    }

    /** Words for output: {@code leave-one-out}, {@code 5 folds}, {@code by group}, {@code blocks of 1d}, {@code group+blocks of 1d}. */
    default String describe() {
        if (this instanceof LeaveOneOut) {
            return "leave-one-out";
        }
        if (this instanceof Folds f) {
            return f.count() + "-fold cross-validation";
        }
        if (this instanceof ByGroup) {
            return "leave-one-group-out";
        }
        if (this instanceof ByBlock b) {
            return "leave-one-block-out, blocks of " + periodWords(b.period());
        }
        return "leave-one-block-out, blocks of one group's " + periodWords(period());
    }

    /** The scheme's words as {@code --cv} takes them: loo, folds:5, group, block:1d, group+block:12h. */
    default String word() {
        if (this instanceof LeaveOneOut) {
            return "loo";
        }
        if (this instanceof Folds f) {
            return "folds:" + f.count();
        }
        if (this instanceof ByGroup) {
            return "group";
        }
        return (this instanceof ByBlock ? "block:" : "group+block:") + periodWords(period());
    }

    /** A period as the short words {@code 1d}, {@code 12h}, {@code 90m}, {@code 30s}, else ISO 8601. */
    static String periodWords(Duration p) {
        long s = p.getSeconds();
        if (p.getNano() != 0) {
            return p.toString();
        }
        if (s % 86_400 == 0) {
            return s / 86_400 + "d";
        }
        if (s % 3_600 == 0) {
            return s / 3_600 + "h";
        }
        if (s % 60 == 0) {
            return s / 60 + "m";
        }
        return s + "s";
    }

    /**
     * The default scheme: blocks of one day when the rows carry times spanning at least ten days,
     * leave-one-out otherwise.
     *
     * @param minTime earliest time in epoch milliseconds (ignored without times)
     * @param maxTime latest time in epoch milliseconds
     * @param hasTimes whether the rows carry a time column with at least one value
     */
    static HeldOutScheme auto(boolean hasTimes, long minTime, long maxTime) {
        if (hasTimes && maxTime - minTime >= AUTO_MIN_SPAN.toMillis()) {
            return new ByBlock(Duration.ofDays(1));
        }
        return new LeaveOneOut();
    }

    /** The span of time from which {@link #auto} holds days out. */
    Duration AUTO_MIN_SPAN = Duration.ofDays(10);

    private static void requirePositive(Duration period) {
        if (period == null || period.isNegative() || period.isZero() || period.toMillis() < 1) {
            throw new IllegalArgumentException("a block's period must be at least 1 ms, got " + period);
        }
    }
}
