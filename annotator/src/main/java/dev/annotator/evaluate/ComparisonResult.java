package dev.annotator.evaluate;

/**
 * How well called intervals recover planted ones (one sequence, one label).
 *
 * @param plantedCount        planted intervals
 * @param calledCount         called intervals
 * @param plantedFound        planted intervals overlapped by at least one call
 * @param callsOnTarget       calls overlapping at least one planted interval
 * @param recall              plantedFound / plantedCount; NaN when nothing was planted
 * @param precision           callsOnTarget / calledCount; NaN when nothing was called
 * @param boundaryErrors      number of boundary errors pooled into the median: two per matched pair
 * @param medianBoundaryError median of |start difference| and |end difference| over matched pairs pooled;
 *                            NaN when no pair matched
 */
public record ComparisonResult(int plantedCount, int calledCount, int plantedFound, int callsOnTarget, double recall,
                               double precision, int boundaryErrors, double medianBoundaryError) {
}
