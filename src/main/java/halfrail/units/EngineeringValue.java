package halfrail.units;

/**
 * Reads and writes engineering values such as {@code 4.7 kΩ}, {@code 10uF} or the IEC 60062
 * value code {@code 4K7}.
 *
 * <h2>Accepted text</h2>
 * <ul>
 *   <li>Plain and scientific numbers with an optional sign: {@code 4.7}, {@code .5}, {@code 1e-6},
 *       {@code 2.2E3}, {@code -5}.</li>
 *   <li>At most one SI prefix after the number, optionally after a space: f p n µ (U+00B5 or
 *       U+03BC) u m k (or K) M G T. Case matters: <b>M is mega, m is milli</b>; this is not the
 *       SPICE suffix dialect.</li>
 *   <li>IEC 60062 value codes, where the prefix letter (or R for ohms) stands in for the
 *       decimal point: {@code 4K7} = 4700, {@code R47} = 0.47, {@code 2R2} = 2.2, {@code 47R} = 47,
 *       {@code 1M0} = 1e6, {@code 4n7} = 4.7e-9, {@code 1µ0} = 1e-6, {@code 10p} = 1e-11.</li>
 *   <li>An optional unit after the prefix or code, one of {@link Unit#spellings()}:
 *       {@code 10uF}, {@code 4k7Ω}, {@code 4.7 kohm}, {@code 3.3V}, {@code 1 kHz}.</li>
 *   <li>Surrounding whitespace (including no-break spaces), and whitespace between the number and
 *       its prefix or unit.</li>
 * </ul>
 * Anything else, including empty text, NaN, Infinity and values that overflow or underflow a
 * double, throws {@link ValueFormatException}; a result is never a silent zero.
 *
 * <p>All methods are static and thread-safe.
 */
public final class EngineeringValue {
    /** Significant digits used by {@link #format(double, Unit)} and {@link #formatCode(double)}. */
    public static final int DEFAULT_SIGNIFICANT_DIGITS = 3;

    private EngineeringValue() {
    }

    /**
     * Reads a value in any unit (or none); the unit letters, if present, are checked for
     * spelling and then dropped.
     *
     * @param text the text to read, never null
     * @return the value in the base unit (Ω, F, V, A, Hz, s or W), the double nearest to the
     *         written decimal
     * @throws ValueFormatException if the text is not a value
     */
    public static double parse(String text) {
        return ValueParser.parse(text, null);
    }

    /**
     * Reads a value that must be in {@code expected} or carry no unit at all. With
     * {@link Unit#NONE} no unit letters are accepted; with any unit other than {@link Unit#OHM}
     * an R code ({@code 4R7}) is refused, since R marks ohms.
     *
     * @param text     the text to read, never null
     * @param expected the unit the value must be in, never null
     * @return the value in the base unit of {@code expected}
     * @throws ValueFormatException if the text is not a value or names another unit
     */
    public static double parse(String text, Unit expected) {
        if (expected == null) {
            throw new NullPointerException("expected");
        }
        return ValueParser.parse(text, expected);
    }

    /**
     * Writes {@code value} to {@value #DEFAULT_SIGNIFICANT_DIGITS} significant digits with an SI
     * prefix and the unit symbol, dropping trailing zeros: 4700 Ω → "4.7 kΩ", 1e-6 F → "1 µF",
     * 0.47 Ω → "470 mΩ". Micro is written as U+00B5. Values beyond the prefixes (below 1e-15 or
     * from 1e15 on) are written as "1.5e18 Ω". The result reads back with {@link #parse}.
     *
     * @param value the value in the base unit of {@code unit}; finite
     * @param unit  the unit, never null
     * @throws IllegalArgumentException if {@code value} is NaN or infinite
     */
    public static String format(double value, Unit unit) {
        return ValueFormatter.format(value, unit, DEFAULT_SIGNIFICANT_DIGITS);
    }

    /**
     * As {@link #format(double, Unit)} with {@code significantDigits} significant digits
     * (1 to 17), rounded half up.
     *
     * @throws IllegalArgumentException if {@code value} is not finite or the digits are out of range
     */
    public static String format(double value, Unit unit, int significantDigits) {
        return ValueFormatter.format(value, unit, significantDigits);
    }

    /**
     * Writes a positive value as an IEC 60062 value code to {@value #DEFAULT_SIGNIFICANT_DIGITS}
     * significant digits: 4700 → "4K7", 0.47 → "R47", 4.7e-9 → "4n7", 1e6 → "1M0", 10 → "10R".
     * From 0.1 to below 1000 the letter is R (ohms); otherwise the SI prefix letter, with K for kilo
     * and µ (U+00B5) for micro. At least two digits are shown ("1K0", "R10"). Because R marks ohms,
     * a code for a value from 0.1 to 1000 reads back only without an expected unit or with
     * {@link Unit#OHM}.
     *
     * @param value the value, positive, from 1e-15 to below 1e15
     * @throws IllegalArgumentException if {@code value} is not positive and finite or out of range
     */
    public static String formatCode(double value) {
        return ValueFormatter.formatCode(value, DEFAULT_SIGNIFICANT_DIGITS);
    }

    /**
     * As {@link #formatCode(double)} with {@code significantDigits} significant digits (1 to 17).
     *
     * @throws IllegalArgumentException if the value or the digits are out of range
     */
    public static String formatCode(double value, int significantDigits) {
        return ValueFormatter.formatCode(value, significantDigits);
    }
}
