package halfrail.check;

/**
 * The converged build of a Monte Carlo study closest to failing, or furthest past it.
 *
 * @param buildIndex     its index (0-based); with the same seed the study draws it again
 * @param marginDb       the smallest headroom less the required margin over the signal stages, dB
 *                       (−∞ when an op-amp is saturated at rest)
 * @param opAmp          label of the op-amp with that smallest margin (the first saturated one, if any)
 * @param quiescentVolts every op-amp's rest point in this build, V, in the result's op-amp order
 * @param build          its values, written into a design that can be opened
 */
public record WorstBuild(long buildIndex, double marginDb, String opAmp, double[] quiescentVolts, BuildDesign build) {
    public WorstBuild {
        quiescentVolts = quiescentVolts.clone();
    }

    @Override
    public double[] quiescentVolts() {
        return quiescentVolts.clone();
    }
}
