package halfrail.check;

import java.util.OptionalDouble;

/**
 * Everything a voltage ladder draws for one op-amp: a vertical scale from ground to the supply
 * with the levels that decide whether the stage clips, and on which side. Plain data; the
 * app and the reports only draw it. All values in V.
 *
 * @param opAmp             label of the op-amp (the stage's name, or "reference buffer")
 * @param designPath        design path of the stage
 * @param supplyVolts       the supply rail at the analysed (nominal) supply
 * @param endPointSupplyVolts the supply at the battery's end-point (or the rail's low tolerance)
 * @param swingLowVolts     lowest output reachable at the analysed supply (forbidden band below)
 * @param swingHighVolts    highest output reachable at the analysed supply (forbidden band above)
 * @param endPointSwingHighVolts highest output reachable at the end-point supply
 * @param commonModeLowVolts  lowest usable input voltage
 * @param commonModeHighVolts highest usable input voltage
 * @param midRailVolts      the reference the stages are biased from
 * @param quiescentVolts    the output at rest
 * @param envelopeLowVolts  lowest excursion of the nominal signal around the rest point: the rest point less the
 *                          demanded peak (unclipped by this stage's window; reduced behind an earlier clipping
 *                          stage, see {@link DesignAnalysis})
 * @param envelopeHighVolts highest excursion of the nominal signal
 * @param spreadLowVolts    lowest rest point over tolerances, when a tolerance analysis was run
 * @param spreadHighVolts   highest rest point over tolerances, when a tolerance analysis was run
 * @param leakageShiftVolts how far limit leakage moves the rest point (signed)
 */
public record Ladder(String opAmp, String designPath, double supplyVolts, double endPointSupplyVolts,
                     double swingLowVolts, double swingHighVolts, double endPointSwingHighVolts,
                     double commonModeLowVolts, double commonModeHighVolts, double midRailVolts,
                     double quiescentVolts, double envelopeLowVolts, double envelopeHighVolts,
                     OptionalDouble spreadLowVolts, OptionalDouble spreadHighVolts, double leakageShiftVolts) {

    /** Copy with a tolerance spread filled in. */
    public Ladder withSpread(double low, double high) {
        return new Ladder(opAmp, designPath, supplyVolts, endPointSupplyVolts, swingLowVolts, swingHighVolts,
                endPointSwingHighVolts, commonModeLowVolts, commonModeHighVolts, midRailVolts, quiescentVolts,
                envelopeLowVolts, envelopeHighVolts, OptionalDouble.of(low), OptionalDouble.of(high),
                leakageShiftVolts);
    }

    /** Whether the signal envelope crosses a swing limit (the stage clips at the nominal signal). */
    public boolean clips() {
        return envelopeLowVolts < swingLowVolts || envelopeHighVolts > swingHighVolts;
    }
}
