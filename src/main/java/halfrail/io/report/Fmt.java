package halfrail.io.report;

import halfrail.units.EngineeringValue;
import halfrail.units.Unit;

import java.util.Locale;

/** Number formatting for documents and pictures: engineering notation with units, "—" for no value. */
final class Fmt {
    static final String NONE = "\u2014";

    private Fmt() {}

    static String of(double v, Unit unit) {
        if (!Double.isFinite(v)) {
            return v > 0 ? "\u221E" : v < 0 ? "\u2212\u221E" : NONE;
        }
        if (v == 0) {
            return "0 " + unit.symbol();
        }
        return EngineeringValue.format(v, unit).replace('-', '\u2212');
    }

    static String volts(double v) {
        return of(v, Unit.VOLT);
    }

    static String signedVolts(double v) {
        return (v > 0 ? "+" : "") + volts(v);
    }

    static String amps(double v) {
        return of(v, Unit.AMPERE);
    }

    static String hertz(double v) {
        return of(v, Unit.HERTZ);
    }

    static String seconds(double v) {
        return of(v, Unit.SECOND);
    }

    /** A power-on run that did not settle: it keeps oscillating (with its period), or not within the run. */
    static String notSettled(halfrail.check.PowerOnReport p) {
        return p.oscillation().map(o -> "keeps oscillating, period " + seconds(o.periodSeconds()))
                .orElse("not settled within " + seconds(p.simulatedSeconds()));
    }

    static String ohms(double v) {
        return of(v, Unit.OHM);
    }

    static String farads(double v) {
        return of(v, Unit.FARAD);
    }

    static String db(double v) {
        if (!Double.isFinite(v)) {
            return v > 0 ? "no signal" : "clips at rest";
        }
        return String.format(Locale.ROOT, "%.1f dB", v).replace('-', '\u2212');
    }

    static String hours(double h) {
        if (h >= 48) {
            return String.format(Locale.ROOT, "%.0f h (%.0f days)", h, h / 24);
        }
        return String.format(Locale.ROOT, "%.3g h", h);
    }

    static String gain(double g) {
        return String.format(Locale.ROOT, "%.3g", g);
    }
}
