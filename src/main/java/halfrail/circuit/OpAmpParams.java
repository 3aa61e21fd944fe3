package halfrail.circuit;

/**
 * The parameters that describe an operational amplifier to the solver and the checks. Every
 * limit relative to a rail is a headroom: {@code swingLowVolts} is how far above V− the output
 * can reach down to, {@code swingHighVolts} how far below V+ it can reach up to, and likewise
 * for the input common-mode range.
 *
 * @param openLoopGain      DC open-loop gain (V/V), positive
 * @param gainBandwidthHz   gain-bandwidth product in Hz, positive; the dominant pole lies at GBW / gain
 * @param slewRateVoltsPerSecond output slew-rate limit in V/s, positive
 * @param offsetVolts       input offset voltage in V, added to V(in+) − V(in−)
 * @param biasAmps          input bias current in A, flowing into each input pin
 * @param offsetCurrentAmps input offset current in A: in+ takes Ib + Ios/2, in− takes Ib − Ios/2
 * @param commonModeLowVolts  lowest input voltage, as headroom above V−, in V (negative: below V−)
 * @param commonModeHighVolts highest input voltage, as headroom below V+, in V (negative: above V+)
 * @param swingLowVolts     lowest output voltage, as headroom above V−, in V, not negative
 * @param swingHighVolts    highest output voltage, as headroom below V+, in V, not negative
 * @param outputOhms        open-loop output resistance in Ω, not negative
 * @param quiescentAmps     supply current drawn from V+ to V− with no load, in A
 * @param supplyMinVolts    lowest total supply (V+ − V−) the part is specified for, in V
 * @param supplyMaxVolts    highest total supply the part is specified for, in V
 */
public record OpAmpParams(double openLoopGain, double gainBandwidthHz, double slewRateVoltsPerSecond,
                          double offsetVolts, double biasAmps, double offsetCurrentAmps,
                          double commonModeLowVolts, double commonModeHighVolts,
                          double swingLowVolts, double swingHighVolts,
                          double outputOhms, double quiescentAmps,
                          double supplyMinVolts, double supplyMaxVolts) {

    /** Default open-loop gain of the netlist dialect, V/V. */
    public static final double DEFAULT_OPEN_LOOP_GAIN = 1e5;
    /** Default gain-bandwidth of the netlist dialect, Hz. */
    public static final double DEFAULT_GBW_HZ = 1e6;
    /** Default slew rate when none is given: fast enough not to matter (1 V/ns). */
    public static final double DEFAULT_SLEW_RATE = 1e9;

    public OpAmpParams {
        String p = "op-amp parameters";
        Check.positive(p, "openLoopGain", openLoopGain, "V/V");
        Check.positive(p, "gainBandwidthHz", gainBandwidthHz, "Hz");
        Check.positive(p, "slewRateVoltsPerSecond", slewRateVoltsPerSecond, "V/s");
        Check.finite(p, "offsetVolts", offsetVolts, "V");
        Check.finite(p, "biasAmps", biasAmps, "A");
        Check.finite(p, "offsetCurrentAmps", offsetCurrentAmps, "A");
        Check.finite(p, "commonModeLowVolts", commonModeLowVolts, "V");
        Check.finite(p, "commonModeHighVolts", commonModeHighVolts, "V");
        Check.nonNegative(p, "swingLowVolts", swingLowVolts, "V");
        Check.nonNegative(p, "swingHighVolts", swingHighVolts, "V");
        Check.nonNegative(p, "outputOhms", outputOhms, "Ω");
        Check.nonNegative(p, "quiescentAmps", quiescentAmps, "A");
        Check.nonNegative(p, "supplyMinVolts", supplyMinVolts, "V");
        if (Double.isNaN(supplyMaxVolts) || supplyMaxVolts < supplyMinVolts) {
            throw new CircuitException(CircuitException.Kind.BAD_VALUE, p, "supplyMaxVolts",
                    "supplyMaxVolts must be at least supplyMinVolts, got " + supplyMaxVolts);
        }
    }

    /**
     * The netlist dialect's defaults: gain 1e5, GBW 1 MHz, no slew limit to speak of, zero
     * offsets and currents, outputs and inputs reaching both rails, no output resistance,
     * no supply range limit.
     */
    public static OpAmpParams defaults() {
        return new OpAmpParams(DEFAULT_OPEN_LOOP_GAIN, DEFAULT_GBW_HZ, DEFAULT_SLEW_RATE, 0, 0, 0,
                0, 0, 0, 0, 0, 0, 0, Double.POSITIVE_INFINITY);
    }

    /** Dominant-pole frequency in Hz: GBW divided by the open-loop gain. */
    public double dominantPoleHz() {
        return gainBandwidthHz / openLoopGain;
    }

    public OpAmpParams withOpenLoopGain(double v) {
        return new OpAmpParams(v, gainBandwidthHz, slewRateVoltsPerSecond, offsetVolts, biasAmps, offsetCurrentAmps,
                commonModeLowVolts, commonModeHighVolts, swingLowVolts, swingHighVolts, outputOhms, quiescentAmps,
                supplyMinVolts, supplyMaxVolts);
    }

    public OpAmpParams withGainBandwidth(double hz) {
        return new OpAmpParams(openLoopGain, hz, slewRateVoltsPerSecond, offsetVolts, biasAmps, offsetCurrentAmps,
                commonModeLowVolts, commonModeHighVolts, swingLowVolts, swingHighVolts, outputOhms, quiescentAmps,
                supplyMinVolts, supplyMaxVolts);
    }

    public OpAmpParams withSlewRate(double voltsPerSecond) {
        return new OpAmpParams(openLoopGain, gainBandwidthHz, voltsPerSecond, offsetVolts, biasAmps, offsetCurrentAmps,
                commonModeLowVolts, commonModeHighVolts, swingLowVolts, swingHighVolts, outputOhms, quiescentAmps,
                supplyMinVolts, supplyMaxVolts);
    }

    public OpAmpParams withInputErrors(double vos, double ib, double ios) {
        return new OpAmpParams(openLoopGain, gainBandwidthHz, slewRateVoltsPerSecond, vos, ib, ios,
                commonModeLowVolts, commonModeHighVolts, swingLowVolts, swingHighVolts, outputOhms, quiescentAmps,
                supplyMinVolts, supplyMaxVolts);
    }

    public OpAmpParams withSwing(double low, double high) {
        return new OpAmpParams(openLoopGain, gainBandwidthHz, slewRateVoltsPerSecond, offsetVolts, biasAmps,
                offsetCurrentAmps, commonModeLowVolts, commonModeHighVolts, low, high, outputOhms, quiescentAmps,
                supplyMinVolts, supplyMaxVolts);
    }

    public OpAmpParams withCommonMode(double low, double high) {
        return new OpAmpParams(openLoopGain, gainBandwidthHz, slewRateVoltsPerSecond, offsetVolts, biasAmps,
                offsetCurrentAmps, low, high, swingLowVolts, swingHighVolts, outputOhms, quiescentAmps,
                supplyMinVolts, supplyMaxVolts);
    }

    public OpAmpParams withOutputOhms(double ohms) {
        return new OpAmpParams(openLoopGain, gainBandwidthHz, slewRateVoltsPerSecond, offsetVolts, biasAmps,
                offsetCurrentAmps, commonModeLowVolts, commonModeHighVolts, swingLowVolts, swingHighVolts, ohms,
                quiescentAmps, supplyMinVolts, supplyMaxVolts);
    }

    public OpAmpParams withQuiescent(double amps) {
        return new OpAmpParams(openLoopGain, gainBandwidthHz, slewRateVoltsPerSecond, offsetVolts, biasAmps,
                offsetCurrentAmps, commonModeLowVolts, commonModeHighVolts, swingLowVolts, swingHighVolts, outputOhms,
                amps, supplyMinVolts, supplyMaxVolts);
    }

    public OpAmpParams withSupplyRange(double min, double max) {
        return new OpAmpParams(openLoopGain, gainBandwidthHz, slewRateVoltsPerSecond, offsetVolts, biasAmps,
                offsetCurrentAmps, commonModeLowVolts, commonModeHighVolts, swingLowVolts, swingHighVolts, outputOhms,
                quiescentAmps, min, max);
    }
}
