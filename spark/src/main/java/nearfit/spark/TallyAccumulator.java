package nearfit.spark;

import org.apache.spark.util.AccumulatorV2;

/**
 * Gathers the tasks' tallies on the driver. Tasks add their tally once, when their partition is done, inside
 * the write (the job's last stage), where Spark applies each partition's update once however often a task is
 * retried.
 */
final class TallyAccumulator extends AccumulatorV2<FleetTally, FleetTally> {
    private static final long serialVersionUID = 1L;
    private final int inputs;
    private final int worstCount;
    private FleetTally tally;

    TallyAccumulator(int inputs, int worstCount) {
        this.inputs = inputs;
        this.worstCount = worstCount;
        this.tally = new FleetTally(inputs, worstCount);
    }

    @Override
    public boolean isZero() {
        return tally.isZero();
    }

    @Override
    public AccumulatorV2<FleetTally, FleetTally> copy() {
        TallyAccumulator c = new TallyAccumulator(inputs, worstCount);
        c.tally = tally.copy();
        return c;
    }

    @Override
    public void reset() {
        tally = new FleetTally(inputs, worstCount);
    }

    @Override
    public void add(FleetTally v) {
        tally.merge(v);
    }

    @Override
    public void merge(AccumulatorV2<FleetTally, FleetTally> other) {
        tally.merge(other.value());
    }

    @Override
    public FleetTally value() {
        return tally;
    }
}
