package nearfit.knn;

/**
 * The neighbours' vote for a category response.
 *
 * @param winner         the class with the largest share; among equal shares the class whose
 *                       nearest counted member is closest, then the lowest code
 * @param shares         the vote share of every class (tie-rule shares times weights), sums to 1
 * @param neighbourCount neighbours counted, including every row tied with the k-th
 */
public record ClassVote(int winner, double[] shares, int neighbourCount) {
}
