package halfrail.io;

import halfrail.units.EngineeringValue;
import halfrail.units.Unit;
import halfrail.units.ValueFormatException;

import java.util.List;

/**
 * The kinds of value a design file holds, how each is read from text and how it is written.
 * Values with a unit of {@link Unit} are written as engineering text ("4.7 kΩ"); the others as
 * JSON numbers. Any value may also be given as a JSON number in SI units.
 */
enum Quantity {
    /** Resistance, Ω. */
    OHMS(Unit.OHM, "a resistance in Ω (a number, or text such as 4k7, 4.7 kΩ)"),
    /** Capacitance, F. */
    FARADS(Unit.FARAD, "a capacitance in F (a number, or text such as 10µ, 4n7, 100 nF)"),
    /** Voltage, V. */
    VOLTS(Unit.VOLT, "a voltage in V (a number, or text such as 100 mV, 3.3 V)"),
    /** Current, A. */
    AMPS(Unit.AMPERE, "a current in A (a number, or text such as 45 nA)"),
    /** Frequency, Hz. */
    HERTZ(Unit.HERTZ, "a frequency in Hz (a number, or text such as 20 Hz, 1 MHz)"),
    /** Time, s. */
    SECONDS(Unit.SECOND, "a time in s (a number, or text such as 1 ms)"),
    /** A ratio, V/V; text may end in V/V. */
    GAIN(null, "a ratio in V/V (a number, or text such as 100k, 50 V/V)", new Suffix("V/V", 1, 1)),
    /** A slew rate, V/s; text may end in V/s or V/µs. */
    SLEW(null, "a slew rate in V/s (a number, or text such as 500k, 0.5 V/µs)",
            new Suffix("V/s", 1, 1), new Suffix("V/\u00B5s", 1e6, 1), new Suffix("V/\u03BCs", 1e6, 1),
            new Suffix("V/us", 1e6, 1)),
    /** A fraction; text may end in % (5 % is 0.05). */
    FRACTION(null, "a fraction (a number such as 0.05, or text such as 5 %)", new Suffix("%", 1, 100)),
    /** A level in dB; text may end in dB. */
    DECIBELS(null, "a level in dB (a number, or text such as 3 dB)", new Suffix("dB", 1, 1)),
    /** A time in hours; text may end in h. */
    HOURS(null, "a time in hours (a number, or text such as 100 h)", new Suffix("h", 1, 1));

    /** The most significant digits tried when writing a value; 17 always reproduce a double. */
    static final int MAX_FORMAT_DIGITS = 17;

    /** A unit word that may end a value's text; the value read is multiplied and divided by these. */
    record Suffix(String text, double multiplier, double divisor) {}

    /** The unit EngineeringValue reads, or null for values read as bare numbers with a suffix. */
    private final Unit unit;
    private final String expected;
    private final List<Suffix> suffixes;

    Quantity(Unit unit, String expected, Suffix... suffixes) {
        this.unit = unit;
        this.expected = expected;
        this.suffixes = List.of(suffixes);
    }

    /** What a value of this kind looks like, in words. */
    String expected() {
        return expected;
    }

    /**
     * Reads text such as "4k7" or "5 %".
     *
     * @throws ValueFormatException when the text is not a value of this kind
     */
    double parse(String text) {
        if (unit != null) {
            return EngineeringValue.parse(text, unit);
        }
        String trimmed = text.strip();
        for (Suffix s : suffixes) {
            if (trimmed.endsWith(s.text())) {
                String number = trimmed.substring(0, trimmed.length() - s.text().length());
                double v = EngineeringValue.parse(number, Unit.NONE);
                return v * s.multiplier() / s.divisor();
            }
        }
        return EngineeringValue.parse(trimmed, Unit.NONE);
    }

    /**
     * The text written for {@code value}: the shortest engineering text that reads back as exactly
     * {@code value}, or null when the value is better written as a JSON number (a quantity with
     * no unit symbol, or a value no text of up to {@value #MAX_FORMAT_DIGITS} digits reproduces).
     */
    String format(double value) {
        if (unit == null || !Double.isFinite(value)) {
            return null;
        }
        for (int digits = 1; digits <= MAX_FORMAT_DIGITS; digits++) {
            String text = EngineeringValue.format(value, unit, digits);
            try {
                if (Double.compare(EngineeringValue.parse(text, unit), value) == 0) {
                    return text;
                }
            } catch (ValueFormatException e) {
                return null;
            }
        }
        return null;
    }
}
