package halfrail.check;

/**
 * One op-amp over the converged builds of a Monte Carlo study. Voltages in V, headroom in dB.
 *
 * @param label                the stage's name, or "reference buffer"
 * @param designPath           the stage's design path
 * @param signal               whether it carries the signal
 * @param meanQuiescentVolts   mean rest point
 * @param sdQuiescentVolts     sample standard deviation of the rest point (n − 1 in the denominator)
 * @param minQuiescentVolts    lowest rest point of any build
 * @param maxQuiescentVolts    highest rest point of any build
 * @param lowPercentileVolts   rest point at the {@link MonteCarlo#SPREAD_LOW_PERCENT} percentile
 * @param highPercentileVolts  rest point at the {@link MonteCarlo#SPREAD_HIGH_PERCENT} percentile
 * @param quiescentVolts       histogram of the rest point, V
 * @param headroomDb           histogram of the headroom at the nominal signal, dB
 * @param failingBuilds        converged builds in which this op-amp does not pass
 * @param saturatedBuilds      converged builds in which it has left its linear region at rest
 */
public record StageDistribution(String label, String designPath, boolean signal, double meanQuiescentVolts,
                                double sdQuiescentVolts, double minQuiescentVolts, double maxQuiescentVolts,
                                double lowPercentileVolts, double highPercentileVolts, Histogram quiescentVolts,
                                Histogram headroomDb, long failingBuilds, long saturatedBuilds) {
}
