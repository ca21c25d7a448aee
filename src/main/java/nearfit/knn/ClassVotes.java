package nearfit.knn;

/**
 * Class votes at many points (a category response), one slot per point; a point with a missing
 * input has winner -1, share NaN, count 0 and window width NaN.
 *
 * @param winner         the winning class code at each point (see {@link ClassVote#winner()})
 * @param share          the winner's vote share at each point
 * @param neighbourCount neighbours counted at each point, every row tied with the k-th included
 * @param windowWidth    the distance to the k-th neighbour at each point, as {@link Estimates#windowWidth()}
 *                       reports it for a number response (what {@link ReferenceReach#far} judges)
 */
public record ClassVotes(int[] winner, double[] share, int[] neighbourCount, double[] windowWidth) {

    static ClassVotes ofSize(int n) {
        return new ClassVotes(new int[n], new double[n], new int[n], new double[n]);
    }
}
