package halfrail.ui;

import halfrail.circuit.OpAmpParams;
import halfrail.units.EngineeringValue;
import halfrail.units.Unit;

/**
 * The fourteen figures of a custom op-amp as a form shows them, in the order of
 * {@link OpAmpParams}'s components: label, unit, help, and how a figure is shown (the slew rate
 * in V/µs, an unlimited supply range as {@value #NO_LIMIT}).
 */
final class OpAmpFigures {
    private OpAmpFigures() {}

    /** Shown for a custom op-amp's unlimited supply range. */
    static final String NO_LIMIT = "no limit";
    /** Index of the slew rate, shown in V/µs. */
    static final int SLEW = 2;
    /** Index of the highest supply, which may be unlimited. */
    static final int SUPPLY_MAX = 13;

    static final String[] LABELS = {"open-loop gain", "gain-bandwidth", "slew rate, V/µs", "input offset",
        "input bias current", "input offset current", "input floor above V−", "input top below V+",
        "output floor above V−", "output top below V+", "output resistance", "quiescent current", "supply, lowest",
        "supply, highest"};
    static final Unit[] UNITS = {Unit.NONE, Unit.HERTZ, Unit.NONE, Unit.VOLT, Unit.AMPERE, Unit.AMPERE, Unit.VOLT,
        Unit.VOLT, Unit.VOLT, Unit.VOLT, Unit.OHM, Unit.AMPERE, Unit.VOLT, Unit.VOLT};
    /** The component names of {@link OpAmpParams}, as its constructor's errors name them. */
    static final String[] FIELDS = {"openLoopGain", "gainBandwidthHz", "slewRateVoltsPerSecond", "offsetVolts",
        "biasAmps", "offsetCurrentAmps", "commonModeLowVolts", "commonModeHighVolts", "swingLowVolts",
        "swingHighVolts", "outputOhms", "quiescentAmps", "supplyMinVolts", "supplyMaxVolts"};
    static final String[] HELP = {"DC open-loop gain, V/V.", "Gain-bandwidth product.", "Output slew-rate limit in V/µs.",
        "Input offset voltage.", "Input bias current into each input.", "Input offset current.",
        "Lowest usable input, as headroom above the negative rail (negative: below it).",
        "Highest usable input, as headroom below the positive rail (negative: above it).",
        "Lowest output, as headroom above the negative rail.", "Highest output, as headroom below the positive rail.",
        "Open-loop output resistance.", "Supply current with no load.", "Lowest total supply the part is specified for.",
        "Highest total supply the part is specified for (\"no limit\" for none)."};

    /** The figures of {@code p} in SI units, in component order. */
    static double[] of(OpAmpParams p) {
        return new double[] {p.openLoopGain(), p.gainBandwidthHz(), p.slewRateVoltsPerSecond(), p.offsetVolts(),
            p.biasAmps(), p.offsetCurrentAmps(), p.commonModeLowVolts(), p.commonModeHighVolts(), p.swingLowVolts(),
            p.swingHighVolts(), p.outputOhms(), p.quiescentAmps(), p.supplyMinVolts(), p.supplyMaxVolts()};
    }

    /** The parameters from figures in SI units. @throws halfrail.circuit.CircuitException naming the component refused */
    static OpAmpParams params(double[] v) {
        return new OpAmpParams(v[0], v[1], v[2], v[3], v[4], v[5], v[6], v[7], v[8], v[9], v[10], v[11], v[12], v[13]);
    }

    /** Figure {@code i} of {@code siValue} as a form shows it. */
    static String text(int i, double siValue) {
        if (Double.isInfinite(siValue)) {
            return NO_LIMIT;
        }
        return EngineeringValue.format(i == SLEW ? siValue * 1e-6 : siValue, UNITS[i]);
    }

    /** Figure {@code i} read from {@code text} in SI units. @throws IllegalArgumentException when it cannot be read */
    static double value(int i, String text) {
        if (i == SUPPLY_MAX && text.trim().equalsIgnoreCase(NO_LIMIT)) {
            return Double.POSITIVE_INFINITY;
        }
        double v = EngineeringValue.parse(text.trim(), UNITS[i]);
        return i == SLEW ? v * 1e6 : v;
    }
}
