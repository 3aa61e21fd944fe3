package halfrail.units;

import java.util.Locale;

/**
 * Numbers with their units for messages, change lists and reports: engineering notation with
 * three significant digits ({@link EngineeringValue#format(double, Unit)}). A value that is not
 * finite is written as Java writes it ({@code NaN}, {@code Infinity}) rather than refused, so a
 * message about a broken result can still be composed.
 */
public final class Quantities {
    private Quantities() {}

    public static String volts(double v) {
        return of(v, Unit.VOLT);
    }

    public static String ohms(double v) {
        return of(v, Unit.OHM);
    }

    public static String farads(double v) {
        return of(v, Unit.FARAD);
    }

    public static String hertz(double v) {
        return of(v, Unit.HERTZ);
    }

    public static String amps(double v) {
        return of(v, Unit.AMPERE);
    }

    public static String seconds(double v) {
        return of(v, Unit.SECOND);
    }

    /** A level in decibels with one decimal, dB. */
    public static String db(double v) {
        return Double.isFinite(v) ? String.format(Locale.ROOT, "%.1f dB", v) : String.valueOf(v);
    }

    private static String of(double v, Unit unit) {
        return Double.isFinite(v) ? EngineeringValue.format(v, unit) : String.valueOf(v);
    }
}
