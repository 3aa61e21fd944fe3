package halfrail.check;

/**
 * One op-amp over a supply sweep: every array has one entry per supply voltage of the sweep, in
 * the sweep's order. Voltages in V, headroom in dB. Immutable: arrays are copied in and out.
 *
 * @param label              the stage's name, or "reference buffer"
 * @param designPath         the stage's design path
 * @param signal             whether it carries the signal
 * @param signalPeakVolts    the nominal signal peak at its output, V (from the AC analysis at the nominal supply, reused;
 *                           behind a clipping stage the demanded peak, as {@link DesignAnalysis} reports it)
 * @param quiescentVolts     output at rest
 * @param swingLowVolts      lowest output reachable
 * @param swingHighVolts     highest output reachable
 * @param availableLowVolts  room below the rest point
 * @param availableHighVolts room above the rest point
 * @param headroomDb         headroom at the nominal signal on the worse side, dB (negative: clips)
 * @param saturated          whether the op-amp has left its linear region at rest
 * @param passes             not saturated and (for a signal stage) headroom ≥ the design's minHeadroomDb
 * @param lowest             the lowest supply at which it still passes
 */
public record StageSupplySweep(String label, String designPath, boolean signal, double signalPeakVolts,
                               double[] quiescentVolts, double[] swingLowVolts, double[] swingHighVolts,
                               double[] availableLowVolts, double[] availableHighVolts, double[] headroomDb,
                               boolean[] saturated, boolean[] passes, LowestPassingSupply lowest) {
    public StageSupplySweep {
        quiescentVolts = quiescentVolts.clone();
        swingLowVolts = swingLowVolts.clone();
        swingHighVolts = swingHighVolts.clone();
        availableLowVolts = availableLowVolts.clone();
        availableHighVolts = availableHighVolts.clone();
        headroomDb = headroomDb.clone();
        saturated = saturated.clone();
        passes = passes.clone();
    }

    @Override
    public double[] quiescentVolts() {
        return quiescentVolts.clone();
    }

    @Override
    public double[] swingLowVolts() {
        return swingLowVolts.clone();
    }

    @Override
    public double[] swingHighVolts() {
        return swingHighVolts.clone();
    }

    @Override
    public double[] availableLowVolts() {
        return availableLowVolts.clone();
    }

    @Override
    public double[] availableHighVolts() {
        return availableHighVolts.clone();
    }

    @Override
    public double[] headroomDb() {
        return headroomDb.clone();
    }

    @Override
    public boolean[] saturated() {
        return saturated.clone();
    }

    @Override
    public boolean[] passes() {
        return passes.clone();
    }
}
