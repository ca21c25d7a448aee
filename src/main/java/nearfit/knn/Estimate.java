package nearfit.knn;

/**
 * The estimate at one point.
 *
 * @param fit            the weighted k-nearest-neighbour fit: the neighbours' weighted mean or
 *                       median ({@link KnnSettings#estimate()})
 * @param bandLow        the band's lower edge (NaN for {@link Band#NONE})
 * @param bandHigh       the band's upper edge (NaN for {@link Band#NONE})
 * @param localSd        weighted population SD of the neighbours' responses about their weighted mean
 * @param windowWidth    distance to the k-th neighbour: in the input's own units with one input,
 *                       in scaled units with several
 * @param neighbourCount neighbours counted, including every row tied with the k-th
 */
public record Estimate(double fit, double bandLow, double bandHigh, double localSd, double windowWidth,
                       int neighbourCount) {
}
