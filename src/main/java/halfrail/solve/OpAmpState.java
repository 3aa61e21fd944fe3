package halfrail.solve;

/**
 * One op-amp at its operating point.
 *
 * @param name             the op-amp's element name
 * @param outputVolts      output pin voltage, V
 * @param inPlusVolts      non-inverting input voltage, V
 * @param inMinusVolts     inverting input voltage, V
 * @param swingLowVolts    lowest output the part can reach at these supply voltages, V
 * @param swingHighVolts   highest output the part can reach at these supply voltages, V
 * @param commonModeLowVolts  lowest input voltage inside the common-mode range, V
 * @param commonModeHighVolts highest input voltage inside the common-mode range, V
 * @param saturated        whether the open-loop target lies beyond the swing window (the part
 *                         has left its linear region and its output sits on a limit)
 * @param commonModeOk     whether both inputs lie inside the common-mode range
 * @param outputAmps       current out of the output pin, A
 * @param supplyAmps       current drawn from the V+ pin, A
 */
public record OpAmpState(String name, double outputVolts, double inPlusVolts, double inMinusVolts,
                         double swingLowVolts, double swingHighVolts,
                         double commonModeLowVolts, double commonModeHighVolts,
                         boolean saturated, boolean commonModeOk, double outputAmps, double supplyAmps) {
}
