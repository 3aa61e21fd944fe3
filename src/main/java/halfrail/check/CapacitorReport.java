package halfrail.check;

/**
 * One capacitor of a design at the nominal operating point.
 *
 * @param element        element name in the circuit
 * @param designPath     design path
 * @param technology     capacitor technology id
 * @param farads         capacitance, F
 * @param dcVolts        DC voltage from its plus to its minus terminal, V (negative: reversed)
 * @param signalPeakVolts peak signal voltage across it at the nominal level, V
 * @param worstVolts     the largest |DC| + signal peak over the supply range, V
 * @param ratedVolts     rated voltage, V
 * @param deratedVolts   the voltage the checks allow, V
 * @param polarised      whether reverse voltage harms it
 * @param seenOhms       resistance its terminals see in the middle of the band (geometric mean of its ends),
 *                       with every source held and every other capacitor at its impedance there — the
 *                       short-circuit time-constant method; Ω
 * @param cornerHz       its own network corner 1/(2π·R·C), Hz
 * @param limitLeakageAmps leakage at its limit value and working voltage, A
 */
public record CapacitorReport(String element, String designPath, String technology, double farads, double dcVolts,
                              double signalPeakVolts, double worstVolts, double ratedVolts, double deratedVolts,
                              boolean polarised, double seenOhms, double cornerHz, double limitLeakageAmps) {
}
