package nearfit.knn;

/**
 * The first k neighbours of many queries, ascending by distance (ties in canonical row order):
 * query i's j-th neighbour is at {@code i * k + j}. {@code counted[i]} is the number of rows
 * within the k-th distance, ties included (at least k), for callers that apply the tie rule.
 *
 * @param k         neighbours per query
 * @param rowIds    table row ids, n*k
 * @param distances distances in scaled units (not keys), n*k
 * @param counted   per query, the rows within the k-th distance including ties
 */
public record NeighborTable(int k, int[] rowIds, double[] distances, int[] counted) {
}
