package halfrail.convert;

/**
 * The output stage's swing at one supply voltage.
 *
 * @param label              "nominal", "fresh" (highest) or "end-point" (lowest)
 * @param supplyVolts        total supply, V
 * @param restVolts          the last stage's output at rest, V
 * @param availableLowVolts  room below the rest point before the output limits, V
 * @param availableHighVolts room above it, V
 * @param signalPeakVolts    the nominal signal's peak at that output, V
 * @param headroomDb         20·log10(smaller room / signal peak), dB (negative: clips)
 */
public record SupplyPoint(String label, double supplyVolts, double restVolts, double availableLowVolts,
                          double availableHighVolts, double signalPeakVolts, double headroomDb) {

    /** Peak-to-peak swing available around the rest point without clipping: twice the smaller room, V. */
    public double symmetricSwingVolts() {
        return 2 * Math.max(0, Math.min(availableLowVolts, availableHighVolts));
    }

    static SupplyPoint of(String label, double supply, double rest, double low, double high, double peak) {
        double availLow = rest - low;
        double availHigh = high - rest;
        double worse = Math.min(availLow, availHigh);
        double db = peak > 0 ? (worse > 0 ? 20 * Math.log10(worse / peak) : Double.NEGATIVE_INFINITY)
                : Double.POSITIVE_INFINITY;
        return new SupplyPoint(label, supply, rest, availLow, availHigh, peak, db);
    }
}
