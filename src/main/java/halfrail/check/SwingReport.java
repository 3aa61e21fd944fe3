package halfrail.check;

import java.util.OptionalDouble;

/**
 * One op-amp's swing at one supply voltage.
 *
 * @param supplyVolts        the supply it was solved at, V
 * @param quiescentVolts     the output at rest, V
 * @param swingLowVolts      the lowest output the part reaches here, V
 * @param swingHighVolts     the highest output the part reaches here, V
 * @param availableLowVolts  room below the quiescent point, V (negative when the rest point is outside the window)
 * @param availableHighVolts room above the quiescent point, V
 * @param signalPeakVolts    signal peak at the output at the nominal source level (largest over the band), V
 * @param headroomDb         20·log10(available/peak) on the worse side, dB (negative: clips); empty when it
 *                           has no finite value: the output carries no signal ({@code signalPeakVolts} 0,
 *                           nothing to clip), or the rest point has no room on its worse side (it clips
 *                           at any level). Empty rather than infinite, so that every reported number is finite.
 * @param clipsFirst         the side with less room
 * @param largestSourcePeakVolts the source peak at which the output would reach the first limit, V (0 when
 *                           there is no room); empty when the output carries no signal (no level clips)
 * @param saturated          whether the op-amp has left its linear region at rest
 */
public record SwingReport(double supplyVolts, double quiescentVolts, double swingLowVolts, double swingHighVolts,
                          double availableLowVolts, double availableHighVolts, double signalPeakVolts,
                          OptionalDouble headroomDb, Side clipsFirst, OptionalDouble largestSourcePeakVolts,
                          boolean saturated) {

    /** Build from a rest point, a window and a signal; the derived fields follow the design brief's definitions. */
    static SwingReport of(double supplyVolts, double quiescent, double low, double high, double signalPeak,
                          double sourcePeak, boolean saturated) {
        double availLow = quiescent - low;
        double availHigh = high - quiescent;
        double worse = Math.min(availLow, availHigh);
        Side side = availLow <= availHigh ? Side.LOW : Side.HIGH;
        OptionalDouble headroom = OptionalDouble.empty();
        OptionalDouble largest = OptionalDouble.empty();
        if (signalPeak > 0) {
            if (worse > 0) {
                headroom = OptionalDouble.of(20 * Math.log10(worse / signalPeak));
            }
            largest = OptionalDouble.of(Math.max(0, worse) / signalPeak * sourcePeak);
        }
        return new SwingReport(supplyVolts, quiescent, low, high, availLow, availHigh, signalPeak, headroom, side,
                largest, saturated);
    }

    /**
     * The peak the output actually swings to around its rest point, V: the signal peak, or, when
     * that is more than the window allows, the larger room (a clipping output still runs to its
     * limit on that side). What the slew rate has to follow.
     */
    public double deliveredPeakVolts() {
        return Math.min(signalPeakVolts, Math.max(0, Math.max(availableLowVolts, availableHighVolts)));
    }

    /**
     * Headroom as a plain number for arrays of many solves (sweeps, Monte Carlo histograms), dB:
     * {@link Double#POSITIVE_INFINITY} when the output carries no signal (it never clips),
     * {@link Double#NEGATIVE_INFINITY} when there is no room at all.
     */
    public double headroomDbOrInfinite() {
        if (headroomDb.isPresent()) {
            return headroomDb.getAsDouble();
        }
        return hasSignal() ? Double.NEGATIVE_INFINITY : Double.POSITIVE_INFINITY;
    }

    /** Whether the output carries any signal at the nominal level. */
    public boolean hasSignal() {
        return signalPeakVolts > 0;
    }

    /**
     * Whether the nominal signal reaches a swing limit here: the op-amp is saturated at rest, or
     * the signal's peak exceeds the room on the worse side (no room at all counts).
     */
    public boolean clips() {
        if (saturated) {
            return true;
        }
        if (!hasSignal()) {
            return false;
        }
        return headroomDb.isEmpty() || headroomDb.getAsDouble() < 0;
    }

    /** Whether the nominal signal fits inside the window with at least {@code marginDb} to spare. */
    public boolean fits(double marginDb) {
        if (saturated) {
            return false;
        }
        if (!hasSignal()) {
            return Math.min(availableLowVolts, availableHighVolts) > 0;
        }
        return headroomDb.isPresent() && headroomDb.getAsDouble() >= marginDb;
    }
}
