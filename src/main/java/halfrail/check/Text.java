package halfrail.check;

import halfrail.units.EngineeringValue;
import halfrail.units.Unit;

/** Number formatting for finding messages. */
final class Text {
    private Text() {}

    static String volts(double v) {
        return EngineeringValue.format(v, Unit.VOLT);
    }

    static String ohms(double v) {
        return EngineeringValue.format(v, Unit.OHM);
    }

    static String farads(double v) {
        return EngineeringValue.format(v, Unit.FARAD);
    }

    static String hertz(double v) {
        return EngineeringValue.format(v, Unit.HERTZ);
    }

    static String amps(double v) {
        return EngineeringValue.format(v, Unit.AMPERE);
    }

    static String seconds(double v) {
        return EngineeringValue.format(v, Unit.SECOND);
    }

    static String db(double v) {
        return String.format(java.util.Locale.ROOT, "%.1f dB", v);
    }
}
