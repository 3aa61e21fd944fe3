package halfrail.cli;

/**
 * One op-amp as {@code check} reports it, in V.
 *
 * @param name           element name (netlists) or stage label (designs)
 * @param output         output at rest
 * @param inPlus         non-inverting input at rest
 * @param inMinus        inverting input at rest
 * @param swingLow       lowest reachable output
 * @param swingHigh      highest reachable output
 * @param commonModeLow  lowest usable input
 * @param commonModeHigh highest usable input
 * @param saturated      whether it has left its linear region at rest
 * @param commonModeOk   whether both inputs lie in the common-mode range at rest
 */
public record OpAmpRow(String name, double output, double inPlus, double inMinus, double swingLow, double swingHigh,
                       double commonModeLow, double commonModeHigh, boolean saturated, boolean commonModeOk) {
}
