package halfrail.check;

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
 * @param headroomDb         20·log10(available/peak) on the worse side, dB (negative: clips)
 * @param clipsFirst         the side with less room
 * @param largestSourcePeakVolts the source peak at which the output would reach the first limit, V
 * @param saturated          whether the op-amp has left its linear region at rest
 */
public record SwingReport(double supplyVolts, double quiescentVolts, double swingLowVolts, double swingHighVolts,
                          double availableLowVolts, double availableHighVolts, double signalPeakVolts,
                          double headroomDb, Side clipsFirst, double largestSourcePeakVolts, boolean saturated) {

    /** Build from a rest point, a window and a signal; the derived fields follow the design brief's definitions. */
    static SwingReport of(double supplyVolts, double quiescent, double low, double high, double signalPeak,
                          double sourcePeak, boolean saturated) {
        double availLow = quiescent - low;
        double availHigh = high - quiescent;
        double worse = Math.min(availLow, availHigh);
        Side side = availLow <= availHigh ? Side.LOW : Side.HIGH;
        double headroom;
        double largest;
        if (signalPeak > 0) {
            headroom = worse > 0 ? 20 * Math.log10(worse / signalPeak) : Double.NEGATIVE_INFINITY;
            largest = Math.max(0, worse) / signalPeak * sourcePeak;
        } else {
            headroom = Double.POSITIVE_INFINITY;
            largest = Double.POSITIVE_INFINITY;
        }
        return new SwingReport(supplyVolts, quiescent, low, high, availLow, availHigh, signalPeak, headroom, side,
                largest, saturated);
    }

    /** Whether the nominal signal fits inside the window with at least {@code marginDb} to spare. */
    public boolean fits(double marginDb) {
        return !saturated && headroomDb >= marginDb;
    }
}
