package nearfit.knn;

import java.util.function.IntConsumer;
import nearfit.table.NearfitException;

/**
 * A fitted model, a value: the reference rows, the settings, the fitted {@link InputTransform},
 * the packed scaled coordinates (row-major n*d, canonical order) and the index over them.
 * Immutable and safe to share between threads; per-thread query state lives in a {@link Searcher}.
 */
public final class KnnModel {
    private final ReferenceData data;
    private final KnnSettings settings;
    private final InputTransform transform;
    private final double[] coords;
    private final NeighborIndex index;
    private final double[] classValues;
    private final TiedRuns tiedRuns;

    private KnnModel(ReferenceData data, KnnSettings settings, InputTransform transform, double[] coords,
                     NeighborIndex index, TiedRuns tiedRuns) {
        this.data = data;
        this.settings = settings;
        this.transform = transform;
        this.coords = coords;
        this.index = index;
        this.classValues = data.isCategory() ? codesAsValues(data.classes()) : null;
        this.tiedRuns = tiedRuns;
    }

    /** The long tied runs of a one-input index over a numeric response, or null. */
    private static TiedRuns tiedRunsOf(NeighborIndex index, ReferenceData data) {
        if (index instanceof SortedIndex sorted && !data.isCategory()) {
            return TiedRuns.of(sorted.coordinates(), data.response(), sorted.metric());
        }
        return null;
    }

    /** The long tied runs of the index (one input, numeric response), or null: see {@link TiedRuns}. */
    TiedRuns tiedRuns() {
        return tiedRuns;
    }

    private static double[] codesAsValues(int[] codes) {
        double[] v = new double[codes.length];
        for (int i = 0; i < codes.length; i++) {
            v[i] = codes[i];
        }
        return v;
    }

    /** Class codes as doubles, for the estimator's (key, value) order; null for a numeric response. */
    double[] classValues() {
        return classValues;
    }

    /**
     * Fits the scaling on the reference rows, packs the coordinates and builds the index.
     *
     * @throws NearfitException when k exceeds the usable rows, a column is constant, or the
     *                          Mahalanobis covariance is singular
     */
    public static KnnModel fit(ReferenceData data, KnnSettings settings) {
        if (data.size() == 0) {
            throw new NearfitException("no usable reference rows: " + whatIsMissing(data));
        }
        checkK(settings.k(), data.size());
        InputTransform t = InputTransform.fit(data, settings.scaling(), settings.metric());
        return restore(data, settings, t);
    }

    /** Rebuilds a model from stored rows, settings and transform (as read from a model file). */
    public static KnnModel restore(ReferenceData data, KnnSettings settings, InputTransform transform) {
        checkK(settings.k(), data.size());
        if (transform.dimensions() != data.dimensions()) {
            throw new NearfitException("the stored scaling has " + transform.dimensions() + " inputs, the rows " + data.dimensions());
        }
        double[] coords = transform.pack(data);
        requireFinite(coords, data.dimensions());
        NeighborIndex index = NeighborIndex.build(coords, data.dimensions(), settings.metric(), settings.threads());
        return new KnnModel(data, settings, transform, coords, index, tiedRunsOf(index, data));
    }

    /** A non-finite coordinate would stall the index search (no key compares equal), so none is let in. */
    private static void requireFinite(double[] coords, int d) {
        for (int i = 0; i < coords.length; i++) {
            if (!Double.isFinite(coords[i])) {
                throw new NearfitException("the stored scaling makes coordinate " + (i % d + 1) + " of reference row "
                        + (i / d + 1) + " " + coords[i] + "; the model's scaling is damaged");
            }
        }
    }

    /** Which columns left the rows out, e.g. {@code power_kw is missing in all 30 rows}. */
    private static String whatIsMissing(ReferenceData data) {
        int rows = data.droppedRows();
        if (rows == 0) {
            return "there are no rows";
        }
        StringBuilder sb = new StringBuilder();
        int[] dropped = data.droppedPerColumn();
        for (int j = 0; j < dropped.length; j++) {
            if (dropped[j] > 0) {
                String name = j < data.dimensions() ? data.inputNames()[j] : data.responseName();
                sb.append(sb.length() == 0 ? "" : "; ").append(name).append(" is missing in ")
                        .append(dropped[j] == rows ? "all " + rows : dropped[j] + " of " + rows).append(" rows");
            }
        }
        return sb.toString();
    }

    static void checkK(int k, int rows) {
        if (k > rows) {
            throw new NearfitException("k = " + k + " is more than the " + rows + " usable reference rows; choose k <= " + rows);
        }
    }

    /**
     * The model with other settings: keeps the index when metric and scaling are unchanged
     * (a change of k, weighting, band, flags or threads is cheap), otherwise refits and rebuilds.
     */
    public KnnModel withSettings(KnnSettings s) {
        if (s.sameIndexAs(settings)) {
            checkK(s.k(), data.size());
            return new KnnModel(data, s, transform, coords, index, tiedRuns);
        }
        return fit(data, s);
    }

    /** The reference rows (inputs, responses, row ids: what a model file stores). */
    public ReferenceData data() {
        return data;
    }

    /** The settings. */
    public KnnSettings settings() {
        return settings;
    }

    /** The fitted scaling parameters (what a model file stores to reproduce the coordinates). */
    public InputTransform transform() {
        return transform;
    }

    /** The index. */
    public NeighborIndex index() {
        return index;
    }

    double[] coords() {
        return coords;
    }

    /** A per-thread query object. */
    public Searcher searcher() {
        return new Searcher(this);
    }

    /** The estimate at one raw point (one value per input); numeric response only. */
    public Estimate estimate(double... point) {
        requireNumeric();
        return searcher().estimate(point);
    }

    /** The class vote at one raw point; category response only. */
    public ClassVote vote(double... point) {
        requireCategory();
        return searcher().vote(point);
    }

    /**
     * Estimates at many raw points given as one column per input, in parallel on
     * {@link KnnSettings#threads()} threads; a point with a NaN coordinate gets NaN and count 0.
     */
    public Estimates estimateAll(double[][] columns, Progress progress) {
        requireNumeric();
        Estimates out = Estimates.ofSize(columns[0].length);
        forEachPoint(columns, progress, (s, p, i) -> s.estimateAt(p, -1, out, i), i -> markMissing(out, i));
        return out;
    }

    /**
     * As {@link #estimateAll(double[][], Progress)}, and at each point the weighted median ({@code centre}) and
     * 1.4826 times the weighted MAD ({@code spread}) of {@code values} (one per reference position, canonical
     * order) over the point's counted neighbours, with the fit's share weights
     * ({@link Searcher#neighbourSpread}); NaN at a point with a missing coordinate.
     */
    Estimates estimateAll(double[][] columns, double[] values, double[] centre, double[] spread, Progress progress) {
        requireNumeric();
        if (values.length != data.size()) {
            throw new IllegalArgumentException(values.length + " values for " + data.size() + " reference rows");
        }
        Estimates out = Estimates.ofSize(columns[0].length);
        int k = settings.k();
        forEachPoint(columns, progress, (s, p, i) -> {
            s.estimateAt(p, -1, out, i);
            s.neighbourSpread(p, k, -1, values, centre, spread, i);
        }, i -> {
            markMissing(out, i);
            centre[i] = Double.NaN;
            spread[i] = Double.NaN;
        });
        return out;
    }

    /**
     * Class votes at many raw points given as one column per input, in parallel on
     * {@link KnnSettings#threads()} threads; category response only.
     */
    public ClassVotes voteAll(double[][] columns, Progress progress) {
        requireCategory();
        ClassVotes out = ClassVotes.ofSize(columns[0].length);
        forEachPoint(columns, progress, (s, p, i) -> s.voteAt(p, out, i), i -> {
            out.winner()[i] = -1;
            out.share()[i] = Double.NaN;
            out.windowWidth()[i] = Double.NaN;
        });
        return out;
    }

    /** The work at one point: scaled coordinates p of point i, with the thread's searcher. */
    private interface PointWork {
        void at(Searcher s, double[] p, int i);
    }

    /**
     * Runs {@code work} at every point with all coordinates present, {@code missing} at the others,
     * in Morton order of the points on {@link KnnSettings#threads()} threads; each point writes only
     * its own slots.
     */
    private void forEachPoint(double[][] columns, Progress progress, PointWork work, IntConsumer missing) {
        int n = columns[0].length;
        int d = data.dimensions();
        double[] q = transformAll(columns);
        int[] order = QueryOrder.of(q, d, n);
        Workers.run(n, settings.threads(), () -> new Object[] {searcher(), new double[d]}, (sc, c, from, to) -> {
            Searcher s = (Searcher) sc[0];
            double[] p = (double[]) sc[1];
            for (int r = from; r < to; r++) {
                int i = order[r];
                if (!point(q, i, p)) {
                    missing.accept(i);
                } else {
                    work.at(s, p, i);
                }
            }
        }, progress);
    }

    /**
     * The first k neighbours (k from the settings) of many raw points given as one column per
     * input, in parallel; a point with a NaN coordinate gets row id -1, distance NaN, count 0.
     */
    public NeighborTable neighborsAll(double[][] columns, Progress progress) {
        int n = columns[0].length;
        int d = data.dimensions();
        int k = settings.k();
        double[] q = transformAll(columns);
        int[] order = QueryOrder.of(q, d, n);
        int[] ids = new int[n * k];
        double[] dist = new double[n * k];
        int[] counted = new int[n];
        int[] rowIds = data.rowIds();
        Metric metric = settings.metric();
        Workers.run(n, settings.threads(), () -> new Object[] {new NeighborList(), new double[d]}, (sc, c, from, to) -> {
            NeighborList list = (NeighborList) sc[0];
            double[] p = (double[]) sc[1];
            for (int r = from; r < to; r++) {
                int i = order[r];
                if (!point(q, i, p)) {
                    java.util.Arrays.fill(ids, i * k, i * k + k, -1);
                    java.util.Arrays.fill(dist, i * k, i * k + k, Double.NaN);
                    continue;
                }
                index.search(p, k, -1, list);
                for (int j = 0; j < k; j++) {
                    ids[i * k + j] = rowIds[list.position(j)];
                    dist[i * k + j] = metric.distanceOfKey(list.key(j));
                }
                counted[i] = list.count();
            }
        }, progress);
        return new NeighborTable(k, ids, dist, counted);
    }

    /** Raw columns to packed coordinates (n*d); NaN stays NaN. */
    private double[] transformAll(double[][] columns) {
        int d = data.dimensions();
        int n = columns[0].length;
        double[] q = new double[n * d];
        double[] raw = new double[d];
        double[] out = new double[d];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < d; j++) {
                raw[j] = columns[j][i];
            }
            transform.apply(raw, out);
            System.arraycopy(out, 0, q, i * d, d);
        }
        return q;
    }

    /** Copies query i into p; false when a coordinate is NaN. */
    private static boolean point(double[] q, int i, double[] p) {
        int d = p.length;
        boolean ok = true;
        for (int j = 0; j < d; j++) {
            p[j] = q[i * d + j];
            ok &= !Double.isNaN(p[j]);
        }
        return ok;
    }

    private static void markMissing(Estimates out, int i) {
        out.fit()[i] = Double.NaN;
        out.bandLow()[i] = Double.NaN;
        out.bandHigh()[i] = Double.NaN;
        out.localSd()[i] = Double.NaN;
        out.windowWidth()[i] = Double.NaN;
        out.neighbourCount()[i] = 0;
    }

    /**
     * The curve along {@code displayInput} at the grid values {@code x}, the other inputs held at
     * {@code held} (raw units, length d; the display slot is ignored), evaluated in parallel.
     */
    public Curve curve(int displayInput, double[] held, double[] x, Progress progress) {
        int d = data.dimensions();
        double[][] columns = new double[d][x.length];
        for (int j = 0; j < d; j++) {
            if (j == displayInput) {
                System.arraycopy(x, 0, columns[j], 0, x.length);
            } else {
                java.util.Arrays.fill(columns[j], held[j]);
            }
        }
        return new Curve(displayInput, held.clone(), x.clone(), estimateAll(columns, progress));
    }

    /** Converts a key to the window width: raw units of the input with one input, scaled otherwise. */
    double windowWidthOfKey(double key) {
        double dist = settings.metric().distanceOfKey(key);
        if (data.dimensions() == 1) {
            double w = transform.whitening() == null ? 1 : transform.whitening()[0];
            return dist / w * transform.scale()[0];
        }
        return dist;
    }

    private void requireCategory() {
        if (!data.isCategory()) {
            throw new NearfitException("the response " + data.responseName() + " is a number, not a category");
        }
    }

    private void requireNumeric() {
        if (data.isCategory()) {
            throw new NearfitException("the response " + data.responseName() + " is a category; use vote");
        }
    }
}
