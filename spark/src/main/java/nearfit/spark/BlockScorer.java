package nearfit.spark;

import java.sql.Timestamp;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.Iterator;
import java.util.List;
import java.util.NoSuchElementException;
import java.util.Set;

import nearfit.knn.ClassVotes;
import nearfit.knn.KnnModel;
import nearfit.knn.Progress;
import nearfit.knn.ReferenceReach;
import nearfit.knn.ScoredBlock;
import nearfit.knn.Scoring;
import org.apache.hadoop.fs.Path;
import org.apache.spark.TaskContext;
import org.apache.spark.api.java.function.MapPartitionsFunction;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.RowFactory;

/**
 * Scores a partition's typed rows ({@link FleetInput}) in blocks through the core's one scoring call
 * ({@link Scoring#score}; for a category response the core's class votes, {@link KnnModel#voteAll}, as the
 * single-machine predict), tallies them, and hands on the rows the job writes. Each row's result depends only
 * on that row, so neither the block size nor the partitioning changes a result.
 */
final class BlockScorer implements MapPartitionsFunction<Row, Row> {
    private static final long serialVersionUID = 1L;
    /** Rows scored at a time: 64 Ki rows hold a few MB per task (inputs, estimates, z and labels). */
    static final int BLOCK_ROWS = 1 << 16;

    private final ScoringPlan plan;
    private final TallyAccumulator accumulator;

    BlockScorer(ScoringPlan plan, TallyAccumulator accumulator) {
        this.plan = plan;
        this.accumulator = accumulator;
    }

    @Override
    public Iterator<Row> call(Iterator<Row> rows) {
        return new Scored(rows);
    }

    /** Pulls a block, scores it, yields its rows to write; adds the tally once, when the partition is done. */
    private final class Scored implements Iterator<Row> {
        private final Iterator<Row> in;
        private final WorkerModel model;
        private final FleetTally tally;
        private final int d = plan.inputs();
        private final int capacity = plan.blockRows();
        private final String[] files = new String[capacity];
        private final long[] indexes = new long[capacity];
        private final double[] times = new double[capacity];
        private final String[] groups = new String[capacity];
        private final double[][] x = new double[d][capacity];
        private final double[] y = new double[capacity];
        /** A category response's label in the file at each row (null missing), or null for a number response. */
        private final String[] labels = plan.category() ? new String[capacity] : null;
        private final Set<String> knownLabels;
        private final int partition;
        private final int attempt;
        private int block;
        private final List<Row> out = new ArrayList<>();
        private int next;
        private boolean done;
        /** CSV: the file being read and the index of its next row (each CSV file is one partition, read whole). */
        private String rawFile;
        private String file;
        private long counter;

        Scored(Iterator<Row> in) {
            this.in = in;
            this.model = WorkerModel.of(plan);
            this.tally = new FleetTally(d, plan.worstCount());
            this.knownLabels = new HashSet<>(model.classLabels);
            TaskContext task = TaskContext.get();
            this.partition = task == null ? 0 : task.partitionId();
            this.attempt = task == null ? 0 : task.attemptNumber();
        }

        @Override
        public boolean hasNext() {
            while (next >= out.size() && !done) {
                out.clear();
                next = 0;
                plan.probe().beforeBlock(partition, attempt, block++);
                int n = fill();
                if (n > 0 && labels != null) {
                    vote(n);
                } else if (n > 0) {
                    score(n);
                }
                if (!in.hasNext()) {
                    done = true;
                    accumulator.add(tally);
                }
            }
            return next < out.size();
        }

        @Override
        public Row next() {
            if (!hasNext()) {
                throw new NoSuchElementException();
            }
            return out.get(next++);
        }

        private int fill() {
            int n = 0;
            while (n < capacity && in.hasNext()) {
                Row r = in.next();
                String f = r.getString(FleetInput.FILE);
                if (!f.equals(rawFile)) {
                    rawFile = f;
                    file = plainPath(f);
                    counter = 0;
                }
                long index = r.isNullAt(FleetInput.ROW) ? counter : r.getLong(FleetInput.ROW);
                counter++;
                int keep = r.getInt(FleetInput.KEEP);
                if (keep < 0) {
                    tally.malformed++;
                    continue;
                }
                if (keep == 0) {
                    continue;
                }
                tally.badCells += r.getInt(FleetInput.BAD);
                files[n] = file;
                indexes[n] = index;
                times[n] = number(r, FleetInput.TIME);
                groups[n] = r.isNullAt(FleetInput.GROUP) ? null : r.getString(FleetInput.GROUP);
                for (int j = 0; j < d; j++) {
                    x[j][n] = number(r, FleetInput.FIRST_INPUT + j);
                }
                y[n] = number(r, FleetInput.FIRST_INPUT + d);
                if (labels != null) {
                    labels[n] = r.isNullAt(FleetInput.FIRST_INPUT + d + 1) ? null : r.getString(FleetInput.FIRST_INPUT + d + 1);
                }
                n++;
            }
            return n;
        }

        /** The block's inputs, one array of its n rows per input. */
        private double[][] inputs(int n) {
            double[][] xs = new double[d][];
            for (int j = 0; j < d; j++) {
                xs[j] = n == capacity ? x[j] : Arrays.copyOf(x[j], n);
            }
            return xs;
        }

        private void score(int n) {
            double[][] xs = inputs(n);
            double[] ys = plan.hasResponse() ? (n == capacity ? y : Arrays.copyOf(y, n)) : null;
            ScoredBlock s = Scoring.score(model.engine, xs, ys, model.basis, plan.threshold(), Progress.NONE);
            double[] width = s.estimates().windowWidth();
            for (int i = 0; i < n; i++) {
                boolean out = count(s, width[i], xs, i);
                ScoringPlan.Emit emit = plan.emit();
                if (emit == ScoringPlan.Emit.ALL || emit == ScoringPlan.Emit.FLAGGED && s.flagged()[i]) {
                    this.out.add(row(s, xs, i, width[i]));
                    tally.written++;
                }
                if (!Double.isNaN(s.z()[i]) && tally.admits(Math.abs(s.z()[i]))) {
                    double[] inputs = new double[d];
                    for (int j = 0; j < d; j++) {
                        inputs[j] = xs[j][i];
                    }
                    tally.offer(new FleetTally.Worst(files[i], indexes[i], times[i], groups[i], inputs, y[i],
                            s.fit()[i], s.bandLow()[i], s.bandHigh()[i], s.z()[i], out));
                }
            }
        }

        /**
         * A category response: the core's class votes at each row, written as the single-machine predict writes
         * them (the file's class when the model knows it, the winning class and its vote share); the tally counts
         * rows and those voted (every input present) over all and per group.
         */
        private void vote(int n) {
            double[][] xs = inputs(n);
            ClassVotes votes = model.engine.voteAll(xs, Progress.NONE);
            for (int i = 0; i < n; i++) {
                tally.rows++;
                boolean voted = votes.winner()[i] >= 0;
                tally.scored += voted ? 1 : 0;
                if (groups[i] != null) {
                    long[] g = tally.group(groups[i]);
                    g[0]++;
                    g[1] += voted ? 1 : 0;
                }
                if (plan.emit() == ScoringPlan.Emit.ALL) {
                    this.out.add(voteRow(votes, xs, i));
                    tally.written++;
                }
            }
        }

        /** An output row of a category response: file, row index, [time], [group], inputs, [response], class, share, beyond. */
        private Row voteRow(ClassVotes votes, double[][] xs, int i) {
            List<Object> v = origin(xs, i);
            if (plan.hasResponse()) {
                v.add(labels[i] != null && knownLabels.contains(labels[i]) ? labels[i] : null);
            }
            int c = votes.winner()[i];
            v.add(c < 0 ? null : model.classLabels.get(c));
            v.add(boxed(votes.share()[i]));
            v.add(c < 0 ? null : model.reach.rulesMet(xs, i, votes.windowWidth()[i], null, null) != 0 ? 1L : 0L);
            return RowFactory.create(v.toArray());
        }

        /** Counts row i as the single-machine check does; whether it lies beyond the reference. */
        private boolean count(ScoredBlock s, double windowWidth, double[][] xs, int i) {
            tally.rows++;
            long[] g = groups[i] == null ? null : tally.group(groups[i]);
            if (g != null) {
                g[0]++;
            }
            if (Double.isNaN(s.z()[i])) {
                for (int j = 0; j < d; j++) {
                    tally.missing[j] += Double.isNaN(xs[j][i]) ? 1 : 0;
                }
                tally.missing[d] += Double.isNaN(y[i]) ? 1 : 0;
                return false;
            }
            tally.scored++;
            boolean flag = s.flagged()[i];
            int met = model.reach.rulesMet(xs, i, windowWidth, tally.below, tally.above);
            tally.far += (met & ReferenceReach.FAR) != 0 ? 1 : 0;
            boolean beyond = met != 0;
            tally.flagged += flag ? 1 : 0;
            tally.beyond += beyond ? 1 : 0;
            if (g != null) {
                g[1]++;
                g[2] += flag ? 1 : 0;
                g[3] += beyond ? 1 : 0;
            }
            return beyond;
        }

        /** An output row: file, row index, [time], [group], inputs, [response], fit, band, [resid, z], beyond. */
        private Row row(ScoredBlock s, double[][] xs, int i, double windowWidth) {
            List<Object> v = origin(xs, i);
            if (plan.hasResponse()) {
                v.add(boxed(y[i]));
            }
            v.add(boxed(s.fit()[i]));
            v.add(boxed(s.bandLow()[i]));
            v.add(boxed(s.bandHigh()[i]));
            if (plan.hasResponse()) {
                v.add(boxed(s.residual()[i]));
                v.add(boxed(s.z()[i]));
            }
            // As the single-machine output: the reference's one per-row rule, missing where there is no fit.
            v.add(Double.isNaN(s.fit()[i]) ? null
                    : model.reach.rulesMet(xs, i, windowWidth, null, null) != 0 ? 1L : 0L);
            return RowFactory.create(v.toArray());
        }

        /** The cells every output row starts with: file, row index, [time], [group], inputs. */
        private List<Object> origin(double[][] xs, int i) {
            List<Object> v = new ArrayList<>(8 + d);
            v.add(files[i]);
            v.add(indexes[i]);
            if (plan.writeTime()) {
                v.add(Double.isNaN(times[i]) ? null : new Timestamp((long) times[i]));
            }
            if (plan.writeGroup()) {
                v.add(groups[i]);
            }
            for (int j = 0; j < d; j++) {
                v.add(boxed(xs[j][i]));
            }
            return v;
        }
    }

    /** A missing number (null) as NaN, as the core takes it. */
    private static double number(Row r, int i) {
        return r.isNullAt(i) ? Double.NaN : r.getDouble(i);
    }

    /** NaN (missing) as null in the output, a cell Parquet marks as absent. */
    private static Double boxed(double v) {
        return Double.isNaN(v) ? null : v;
    }

    /** A local file's path as a plain path; other file systems' as their URI. */
    static String plainPath(String uri) {
        Path p = new Path(uri);
        String scheme = p.toUri().getScheme();
        return scheme == null || "file".equals(scheme) ? p.toUri().getPath() : uri;
    }
}
