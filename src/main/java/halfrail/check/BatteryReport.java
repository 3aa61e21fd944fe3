package halfrail.check;

import java.util.OptionalDouble;

/**
 * What the design draws from its supply at the nominal voltage.
 *
 * @param totalAmps    everything the supply delivers, A (the supply's branch current)
 * @param dividerAmps  through the mid-rail divider, A
 * @param opAmpAmps    into the op-amps' supply pins (quiescent plus output current), A
 * @param leakageAmps  through the capacitors' leakage at typical values, A
 * @param capacityAmpHours the supply's capacity, when it has one, A·h
 * @param runtimeHours capacity over total current, h
 */
public record BatteryReport(double totalAmps, double dividerAmps, double opAmpAmps, double leakageAmps,
                            OptionalDouble capacityAmpHours, OptionalDouble runtimeHours) {
}
