package nearfit.knn.bench;

import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import nearfit.knn.KnnModel;
import nearfit.knn.KnnSettings;
import nearfit.knn.Metric;
import nearfit.knn.NeighborIndex;
import nearfit.knn.NeighborList;
import nearfit.knn.ReferenceData;
import nearfit.knn.Searcher;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * JMH benchmarks of one search (k = 10, single thread) and of building an index, over uniform
 * random rows in 1 and 3 inputs. Run with scripts/bench-jmh.
 */
@State(Scope.Benchmark)
@Fork(value = 1, jvmArgs = {"-Xmx4g"})
@Warmup(iterations = 2, time = 2)
@Measurement(iterations = 3, time = 2)
public class IndexBenchmark {
    @Param({"1", "3"})
    public int dims;

    @Param({"1000000"})
    public int rows;

    private KnnModel model;
    private double[] packed;
    private double[][] queries;

    @Setup(Level.Trial)
    public void setUp() {
        SplittableRandom r = new SplittableRandom(7);
        double[][] x = new double[dims][rows];
        double[] y = new double[rows];
        String[] names = new String[dims];
        for (int j = 0; j < dims; j++) {
            names[j] = "x" + j;
            for (int i = 0; i < rows; i++) {
                x[j][i] = r.nextDouble();
            }
        }
        for (int i = 0; i < rows; i++) {
            y[i] = r.nextDouble();
        }
        model = KnnModel.fit(ReferenceData.numeric(names, x, "y", y, null), KnnSettings.defaults());
        packed = model.transform().pack(model.data());
        queries = new double[4096][dims];
        for (double[] q : queries) {
            for (int j = 0; j < dims; j++) {
                q[j] = r.nextDouble();
            }
        }
    }

    /** Per-thread query state. */
    @State(Scope.Thread)
    public static class Scratch {
        Searcher searcher;
        int next;

        @Setup(Level.Trial)
        public void setUp(IndexBenchmark b) {
            searcher = b.model.searcher();
        }
    }

    @Benchmark
    @BenchmarkMode(Mode.AverageTime)
    @OutputTimeUnit(TimeUnit.MICROSECONDS)
    public int searchTenNeighbours(Scratch s) {
        double[] q = queries[s.next++ & 4095];
        NeighborList nl = s.searcher.neighbors(q);
        return nl.position(0);
    }

    @Benchmark
    @BenchmarkMode(Mode.SingleShotTime)
    @OutputTimeUnit(TimeUnit.MILLISECONDS)
    @Warmup(iterations = 3)
    @Measurement(iterations = 5)
    public int buildIndex() {
        return NeighborIndex.build(packed, dims, Metric.EUCLIDEAN, Runtime.getRuntime().availableProcessors()).size();
    }
}
