/**
 * The k-nearest-neighbour engine: scaling, metrics, exact neighbour indexes, estimates with the
 * tie rule, bands, window widths, tuning (choosing k) and leave-one-out flags. No I/O and no UI:
 * it works on primitive arrays that the faces copy out of a table.
 *
 * <h2>Data flow</h2>
 * <pre>
 * double[] per input + response + row ids ─▶ {@link nearfit.knn.ReferenceData} (NaN rows left out, counted; canonical order)
 *   ─▶ {@link nearfit.knn.InputTransform} (z / robust / range / none; whitening for Mahalanobis)
 *   ─▶ packed coordinates ─▶ {@link nearfit.knn.NeighborIndex} (sorted for 1 input, k-d tree for 2..16, else brute force)
 *   ─▶ {@link nearfit.knn.KnnModel}: estimates, curves, votes ─▶ {@link nearfit.knn.Tuning}, {@link nearfit.knn.Flags},
 *      {@link nearfit.knn.Scoring} (new rows)
 * </pre>
 *
 * <h2>Usage</h2>
 * <pre>{@code
 * ReferenceData ref = ReferenceData.numeric(
 *         new String[] {"wind_speed", "air_density"}, new double[][] {windSpeed, density},
 *         "power_kw", power, rowIds);                 // ref.droppedPerColumn(): rows left out
 * KnnSettings settings = KnnSettings.defaults().withK(25).withWeighting(Weighting.TRICUBE);
 * KnnModel model = KnnModel.fit(ref, settings);       // NearfitException names a bad column
 *
 * Estimate e = model.estimate(9.5, 1.22);             // fit, band, local SD, window width, count
 * Curve c = model.curve(0, new double[] {0, 1.22}, grid, Progress.NONE);  // along wind_speed
 * Estimates many = model.estimateAll(columns, progress);  // one column per input, all cores
 * // a category response: model.vote(point) (ClassVote), model.voteAll(columns, progress) (ClassVotes)
 *
 * TuningTable t = Tuning.leaveOneOut(model, 100, progress);   // all k in 1..100, one pass
 * HeldOutBlocks days = HeldOutBlocks.of(new HeldOutScheme.ByBlock(Duration.ofDays(1)), n, groupCodes, epochMillis);
 * TuningTable d = Tuning.heldOut(model, 100, days, -1, 1, progress);  // rows predicted from other days only
 * KnnModel tuned = model.withSettings(settings.withK(t.oneSeK()));  // keeps the index
 *
 * FlagResult flags = Flags.leaveOneOut(tuned, progress);      // per row: fit, residual, z, flagged
 * ScoredBlock s = Scoring.score(tuned, newColumns, newResponse,   // new rows, by the same z and flag rule
 *         new ZBasis.LocalSpread(), 3.5, progress);            // or new ZBasis.NeighbourResiduals(heldOut, median, scale)
 *
 * // words of the choices, for options, files and screens: settings.metric().word() ("euclidean"),
 * // ChoiceWord.find(Band.values(), "q05-q95"), ChoiceWord.words(FlagScale.offered()) (local, reference)
 * // saving: settings(), transform() (center, scale, whitening), data() (inputs, response, row ids);
 * // loading: KnnModel.restore(ReferenceData.numeric(...stored rows...), settings, transform)
 * }</pre>
 *
 * <h2>Rules every result follows</h2>
 * <ul>
 * <li><b>Tie rule.</b> With D the k-th smallest distance, rows whose distance is within a relative
 *     1e-12 of D ({@code |r - D| <= 1e-12 D}) <em>tie</em> it; rows closer than that count fully and
 *     the tied rows share the remaining k - n&lt; places equally, for every weighting; indexes
 *     return every row that ties the k-th for that reason, and prune only cells beyond the tie
 *     bound. Keys are squared distances for Euclidean and Mahalanobis, so there the bounds are
 *     {@code D^2 (1 - 1e-12)^2} and {@code D^2 (1 + 1e-12)^2} on keys ({@link nearfit.knn.Metric}).
 *     Why: rows equally far from a query in exact arithmetic (symmetric about it on a sensor's
 *     0.01 grid) come out of scaling a few ulps apart, and an exact comparison gave one of them a
 *     whole place and the other none. The limit: the values' own rounding is relative to their
 *     size, so the split grows with value / spacing. Measured on z-scaled 0.01-step values, 200 000
 *     symmetric pairs 1 to 3 steps from the query per size: with |value| up to 300 steps no split
 *     exceeds 1e-12; up to 1 000 steps 17 pairs do, up to 2 000 steps 0.9 %, up to 3 000 steps
 *     3.4 %; those ties are still decided by rounding. The rule depends on the keys only, so it
 *     stays independent of row order and thread count.</li>
 * <li><b>Determinism.</b> Reference rows are kept in a canonical order (by inputs, then response)
 *     and all sums run in orders fixed by the data, so shuffling the rows or changing the thread
 *     count changes no result, bit for bit.</li>
 * <li><b>Long tied runs.</b> With one input, a query whose counted neighbours are exactly one
 *     run of at least 64 equal coordinates (a rounded sensor) is answered from the run's totals in
 *     O(log n): every weighting gives such a run equal weights, so fit, local SD and band are the
 *     run's mean (or definition-7 median, under {@link nearfit.knn.EstimateKind#MEDIAN}), SD and
 *     definition-7 quantiles, equal to the row-by-row result up to rounding
 *     (the local MAD still walks the rows).</li>
 * <li><b>Estimate.</b> The fit is the neighbours' weighted mean, or with
 *     {@link nearfit.knn.KnnSettings#estimate()} {@link nearfit.knn.EstimateKind#MEDIAN} their weighted
 *     median by the band's quantile rule at 0.5; leave-one-out (tuning, flags) uses the same estimate.</li>
 * <li><b>Units.</b> Window width is in the input's own units with one input and in scaled units
 *     with several. Distances in {@link nearfit.knn.NeighborList} are keys (squared for Euclidean).</li>
 * <li><b>Threads.</b> Models and indexes are immutable and shared; a {@link nearfit.knn.Searcher}
 *     holds one thread's scratch. Batch work ({@code estimateAll}, {@code curve}, tuning, flags)
 *     runs on {@link nearfit.knn.KnnSettings#threads()} threads in chunks of 1024 rows, checking
 *     {@link nearfit.knn.Progress#isCancelled()} per chunk and throwing
 *     {@link nearfit.knn.CancelledException}.</li>
 * <li><b>Errors.</b> k above the usable rows, a constant input, a zero MAD under robust scaling and
 *     a singular covariance under Mahalanobis throw {@link nearfit.table.NearfitException} naming
 *     the columns.</li>
 * <li><b>Held-out schemes.</b> {@link nearfit.knn.Tuning#heldOut} predicts each row from the rows outside
 *     its block ({@link nearfit.knn.HeldOutScheme}: leave-one-out, folds, groups, spans of time, both); the
 *     scaling stays the one fitted on all rows; SEs over blocks for groups and spans.</li>
 * <li><b>Tuning size.</b> {@link nearfit.knn.Tuning#leaveOneOut(KnnModel, int, Progress)} samples
 *     100,000 seeded rows above 200,000 reference rows (neighbours still searched among all rows).</li>
 * </ul>
 */
package nearfit.knn;
