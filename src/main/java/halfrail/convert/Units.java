package halfrail.convert;

import halfrail.units.EngineeringValue;
import halfrail.units.Unit;

/** Numbers with their units for change lists and conflict messages. */
final class Units {
    private Units() {}

    static String ohms(double v) {
        return EngineeringValue.format(v, Unit.OHM);
    }

    static String farads(double v) {
        return EngineeringValue.format(v, Unit.FARAD);
    }

    static String volts(double v) {
        return Double.isFinite(v) ? EngineeringValue.format(v, Unit.VOLT) : String.valueOf(v);
    }

    static String amps(double v) {
        return EngineeringValue.format(v, Unit.AMPERE);
    }

    static String hertz(double v) {
        return EngineeringValue.format(v, Unit.HERTZ);
    }

    static String seconds(double v) {
        return EngineeringValue.format(v, Unit.SECOND);
    }

    static String db(double v) {
        return Double.isFinite(v) ? String.format(java.util.Locale.ROOT, "%.1f dB", v) : String.valueOf(v);
    }
}
