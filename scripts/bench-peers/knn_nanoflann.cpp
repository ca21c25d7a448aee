// The nanoflann side of scripts/bench-knn (built by the script: g++ -O3 -march=native -fopenmp).
//   run DIR N Q LOO_N KMAX REPS  times the in-process cases on the raw little-endian files KnnBench writes
//                                (x3.bin, y.bin, q3.bin) and prints "case seconds" lines, as the other sides do;
//   tune CSV KMAX                whole process: reads a CSV (header; inputs first, response last), z-scales,
//                                leave-one-out RMSE for every k in 1..KMAX; prints rows, best k, RMSE at k = 10.
// Scaling: z with the population SD (a common factor on every column leaves neighbour order unchanged).
// Build: one thread (this library version has no parallel build); queries and leave-one-out: OpenMP, all cores.
#include <nanoflann.hpp>
#include <omp.h>
#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <fstream>
#include <memory>
#include <string>
#include <vector>

struct Cloud {
    const double* p;
    size_t n;
    size_t d;
    size_t kdtree_get_point_count() const { return n; }
    double kdtree_get_pt(size_t i, size_t j) const { return p[i * d + j]; }
    template <class B> bool kdtree_get_bbox(B&) const { return false; }
};
using Tree = nanoflann::KDTreeSingleIndexAdaptor<nanoflann::L2_Simple_Adaptor<double, Cloud>, Cloud, -1, uint32_t>;

static std::vector<double> readBin(const std::string& path) {
    std::ifstream f(path, std::ios::binary | std::ios::ate);
    if (!f) { std::fprintf(stderr, "cannot read %s\n", path.c_str()); std::exit(2); }
    size_t bytes = f.tellg();
    std::vector<double> v(bytes / 8);
    f.seekg(0);
    f.read(reinterpret_cast<char*>(v.data()), bytes);  // little-endian host assumed (x86-64)
    return v;
}

// z-scale packed rows (n x d) with the mean and population SD of the first n rows of `src` (stride sd).
static std::vector<double> zscale(const double* src, size_t n, size_t sd, size_t d,
                                  const double* other = nullptr, size_t on = 0, std::vector<double>* otherOut = nullptr) {
    std::vector<double> out(n * d);
    for (size_t j = 0; j < d; j++) {
        double s = 0, ss = 0;
        for (size_t i = 0; i < n; i++) s += src[i * sd + j];
        double mu = s / n;
        for (size_t i = 0; i < n; i++) { double e = src[i * sd + j] - mu; ss += e * e; }
        double sdv = std::sqrt(ss / n);
        for (size_t i = 0; i < n; i++) out[i * d + j] = (src[i * sd + j] - mu) / sdv;
        if (other) for (size_t i = 0; i < on; i++) (*otherOut)[i * d + j] = (other[i * sd + j] - mu) / sdv;
    }
    return out;
}

static double now() {
    return std::chrono::duration<double>(std::chrono::steady_clock::now().time_since_epoch()).count();
}

template <class F> static void timed(const char* name, int reps, F f) {
    volatile double sink = f();  // warm-up
    std::vector<double> t;
    for (int r = 0; r < reps; r++) {
        double t0 = now();
        sink = sink + f();
        t.push_back(now() - t0);
    }
    std::sort(t.begin(), t.end());
    std::printf("%s %.4f\n", name, t[t.size() / 2]);
    std::fflush(stdout);
}

// Leave-one-out RMSE for every k in 1..kmax: one search with k = kmax + 1 per row, drop the row itself,
// running sums of the neighbours' responses.
static std::vector<double> looAllK(const std::vector<double>& x, const double* y, size_t n, size_t d, size_t kmax) {
    Cloud c{x.data(), n, d};
    Tree tree(d, c, nanoflann::KDTreeSingleIndexAdaptorParams(10));
    std::vector<double> sse(kmax, 0.0);
#pragma omp parallel
    {
        std::vector<uint32_t> idx(kmax + 1);
        std::vector<double> dist(kmax + 1);
        std::vector<double> local(kmax, 0.0);
#pragma omp for schedule(dynamic, 1024)
        for (size_t i = 0; i < n; i++) {
            size_t got = tree.knnSearch(&x[i * d], kmax + 1, idx.data(), dist.data());
            double sum = 0;
            size_t k = 0;
            for (size_t m = 0; m < got && k < kmax; m++) {
                if (idx[m] == i) continue;
                sum += y[idx[m]];
                k++;
                double e = y[i] - sum / k;
                local[k - 1] += e * e;
            }
        }
#pragma omp critical
        for (size_t k = 0; k < kmax; k++) sse[k] += local[k];
    }
    for (size_t k = 0; k < kmax; k++) sse[k] = std::sqrt(sse[k] / n);
    return sse;
}

static size_t bestK(const std::vector<double>& rmse) {
    return std::min_element(rmse.begin(), rmse.end()) - rmse.begin() + 1;  // first (smallest) k on a tie
}

// The sum over queries of the k-th neighbour's distance (the check figure; it also keeps the work live).
static double queryAll(const Tree& tree, const std::vector<double>& q, size_t nq, size_t d, size_t k) {
    double total = 0;
#pragma omp parallel reduction(+ : total)
    {
        std::vector<uint32_t> idx(k);
        std::vector<double> dist(k);
#pragma omp for schedule(dynamic, 1024)
        for (size_t i = 0; i < nq; i++) {
            tree.knnSearch(&q[i * d], k, idx.data(), dist.data());
            total += std::sqrt(dist[k - 1]);
        }
    }
    return total;
}

static int run(int argc, char** argv) {
    std::string dir = argv[2];
    size_t n = std::atol(argv[3]), nq = std::atol(argv[4]), nl = std::atol(argv[5]), kmax = std::atol(argv[6]);
    int reps = std::atoi(argv[7]);
    std::vector<double> x3 = readBin(dir + "/x3.bin"), y = readBin(dir + "/y.bin"), q3 = readBin(dir + "/q3.bin");
    std::vector<double> q3s(nq * 3), q1s(nq);
    std::vector<double> x3s = zscale(x3.data(), n, 3, 3, q3.data(), nq, &q3s);
    std::vector<double> x1s = zscale(x3.data(), n, 3, 1, q3.data(), nq, &q1s);
    Cloud c1{x1s.data(), n, 1}, c3{x3s.data(), n, 3};
    nanoflann::KDTreeSingleIndexAdaptorParams params(10);
    timed("fit_1d", reps, [&] { Tree t(1, c1, params); return (double) t.size(t); });
    timed("fit_3d", reps, [&] { Tree t(3, c3, params); return (double) t.size(t); });
    timed("index_3d", reps, [&] { Tree t(3, c3, params); return (double) t.size(t); });
    Tree t1(1, c1, params), t3(3, c3, params);
    timed("query_1d", reps, [&] { return queryAll(t1, q1s, nq, 1, 10); });
    timed("query_3d", reps, [&] { return queryAll(t3, q3s, nq, 3, 10); });
    std::vector<double> xl = zscale(x3.data(), nl, 3, 3);  // scaled on the leave-one-out rows, as nearfit does
    timed("loo_allk_3d", reps, [&] { return looAllK(xl, y.data(), nl, 3, kmax).back(); });
    std::vector<double> r = looAllK(xl, y.data(), nl, 3, kmax);
    std::printf("check_loo_rmse_k10 %.9f\ncheck_best_k %zu\n", r[9], bestK(r));
    std::printf("check_query_3d_kdist %.9f\n", queryAll(t3, q3s, nq, 3, 10) / nq);
    return 0;
}

static int tune(int argc, char** argv) {
    FILE* f = std::fopen(argv[2], "r");
    if (!f) { std::fprintf(stderr, "cannot read %s\n", argv[2]); return 2; }
    size_t kmax = std::atol(argv[3]);
    std::vector<char> buf(1 << 16);
    if (!std::fgets(buf.data(), buf.size(), f)) return 2;
    size_t cols = 1;
    for (char* p = buf.data(); *p; p++) cols += *p == ',';
    size_t d = cols - 1;
    std::vector<double> raw, y;
    while (std::fgets(buf.data(), buf.size(), f)) {
        char* p = buf.data();
        for (size_t j = 0; j < cols; j++) {
            char* end;
            double v = std::strtod(p, &end);
            (j < d ? raw : y).push_back(v);
            p = end + 1;
        }
    }
    std::fclose(f);
    size_t n = y.size();
    std::vector<double> x = zscale(raw.data(), n, d, d);
    std::vector<double> r = looAllK(x, y.data(), n, d, kmax);
    std::printf("rows %zu\nbest_k %zu\nrmse_k10 %.9f\n", n, bestK(r), r[9]);
    return 0;
}

int main(int argc, char** argv) {
    if (argc == 8 && std::strcmp(argv[1], "run") == 0) return run(argc, argv);
    if (argc == 4 && std::strcmp(argv[1], "tune") == 0) return tune(argc, argv);
    std::fprintf(stderr, "usage: run DIR N Q LOO_N KMAX REPS | tune CSV KMAX\n");
    return 2;
}
