package halfrail.check;

import java.util.Optional;
import java.util.OptionalDouble;

/**
 * One capacitor of a design at the nominal operating point.
 *
 * @param element        element name in the circuit
 * @param designPath     design path
 * @param technology     capacitor technology id
 * @param farads         capacitance, F
 * @param dcVolts        DC voltage from its plus to its minus terminal, V (negative: reversed)
 * @param signalPeakVolts peak signal voltage across it at the nominal level, V: the linear figure, reduced behind a
 *                       clipping stage and bounded by the swing of the stage that drives it ({@link DesignAnalysis})
 * @param worstVolts     the largest |DC| + signal peak over the supply range, V
 * @param ratedVolts     rated voltage, V
 * @param deratedVolts   the voltage the checks allow, V
 * @param polarised      whether reverse voltage harms it
 * @param seenOhms       resistance its terminals see in the middle of the band (geometric mean of its ends),
 *                       with every source held and every other capacitor at its impedance there — the
 *                       short-circuit time-constant method; Ω. Empty when the circuit with the capacitor
 *                       taken out is singular there (the capacitor closes the only finite path, or a loop
 *                       round it has so much gain that the figure means nothing)
 * @param cornerHz       its own network corner 1/(2π·R·C), Hz; empty with {@code seenOhms}
 * @param limitLeakageAmps leakage at its limit value and working voltage, A
 * @param drivenByClipped the label of the clipping stage whose output limits {@code signalPeakVolts}, when the
 *                       figure is below the linear one for that reason (empty: the linear figure)
 */
public record CapacitorReport(String element, String designPath, String technology, double farads, double dcVolts,
                              double signalPeakVolts, double worstVolts, double ratedVolts, double deratedVolts,
                              boolean polarised, OptionalDouble seenOhms, OptionalDouble cornerHz, double limitLeakageAmps,
                              Optional<String> drivenByClipped) {
}
