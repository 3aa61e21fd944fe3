package halfrail.design;

import java.util.OptionalDouble;

/** Where the single rail comes from. All voltages are totals across the supply, V. */
public sealed interface Supply permits CellPack, FixedRail, UsbPort {
    /** The nominal voltage, V. */
    double nominalVolts();

    /** The highest voltage in normal use (a fresh battery, the top of a tolerance band), V. */
    double highVolts();

    /** The lowest voltage in normal use (a battery's end-point, the bottom of a tolerance band), V. */
    double lowVolts();

    /** The supply's series resistance, Ω. */
    double internalOhms();

    /** Ripple amplitude on the rail, V peak (0 for a battery). */
    default double rippleVoltsPeak() {
        return 0;
    }

    /** Ripple frequency, Hz (meaningless without ripple). */
    default double rippleHz() {
        return 0;
    }

    /** Capacity for runtime estimates, A·h, when the supply has one. */
    default OptionalDouble capacityAmpHours() {
        return OptionalDouble.empty();
    }

    /** The caution that goes with this kind of supply, in plain words. */
    String safetyNote();
}
