package halfrail.check;

import java.util.OptionalDouble;

/**
 * One divider value of a battery trade-off, solved at the nominal supply with typical leakage.
 *
 * @param upperOhms              the divider's upper resistor, Ω
 * @param lowerOhms              the divider's lower resistor, Ω (equal to upper, except for the design's own row)
 * @param theveninOhms           Ra‖Rb, Ω
 * @param dividerAmps            current through the divider, A
 * @param totalAmps              everything the supply delivers, A
 * @param runtimeHours           capacity over total current, h; empty for a supply without capacity
 * @param biasShiftVolts         largest shift, over the signal stages, of a rest point by the op-amps'
 *                               input bias and offset currents through the divider and bias resistors, V
 *                               (signed: the operating point less the same circuit with those currents at zero)
 * @param referenceNoiseVoltsRms thermal noise of the reference network at the load over the band, V rms
 * @param timeConstantSeconds    (Ra‖Rb)·C of the reference's decoupling capacitor, s; empty when undecoupled
 * @param settleSeconds          time for the reference node to come within the settle band of its final
 *                               value after switch-on, from a power-on transient, s; empty when no
 *                               transient was run for this value, or it did not settle within the run
 * @param transientRun           whether a power-on transient was run for this value
 * @param current                whether this is the design's own divider
 */
public record DividerChoice(double upperOhms, double lowerOhms, double theveninOhms, double dividerAmps,
                            double totalAmps, OptionalDouble runtimeHours, double biasShiftVolts,
                            double referenceNoiseVoltsRms, OptionalDouble timeConstantSeconds,
                            OptionalDouble settleSeconds, boolean transientRun, boolean current) {
}
