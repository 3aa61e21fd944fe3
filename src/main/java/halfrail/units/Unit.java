package halfrail.units;

import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * The units an engineering value may carry, with the symbol used when formatting and the
 * spellings accepted when parsing. One-character spellings are matched exactly (F is farad,
 * f is the femto prefix); longer spellings ignore case ({@code kOhm}, {@code KHZ}).
 *
 * <p>Besides its spellings, {@link #OHM} is also implied by the letter R of IEC 60062 value
 * codes ({@code 4R7}, {@code R47}, {@code 47R}), where R stands in for the decimal point.
 */
public enum Unit {
    /** Resistance, Ω. Accepts Ω (U+03A9), Ω (U+2126 ohm sign), ohm, ohms; R inside codes. */
    OHM("\u03A9", "\u03A9", "\u2126", "ohm", "ohms"),
    /** Capacitance, F. */
    FARAD("F", "F", "farad", "farads"),
    /** Voltage, V. */
    VOLT("V", "V", "volt", "volts"),
    /** Current, A. */
    AMPERE("A", "A", "amp", "amps", "ampere", "amperes"),
    /** Frequency, Hz. */
    HERTZ("Hz", "Hz", "hertz"),
    /** Time, s. */
    SECOND("s", "s", "sec", "second", "seconds"),
    /** Power, W. */
    WATT("W", "W", "watt", "watts"),
    /** A bare number without a unit (a ratio, a gain). Accepts no unit letters. */
    NONE("");

    private final String symbol;
    private final List<String> spellings;

    Unit(String symbol, String... spellings) {
        this.symbol = symbol;
        this.spellings = List.of(spellings);
    }

    /** The symbol used when formatting (Ω, F, V, A, Hz, s, W), empty for {@link #NONE}. */
    public String symbol() {
        return symbol;
    }

    /** Every spelling accepted after a number, the symbol first; empty for {@link #NONE}. */
    public List<String> spellings() {
        return spellings;
    }

    /** Whether {@code word} is one of this unit's spellings (exact for one character, else any case). */
    boolean isSpelledAs(String word) {
        for (String spelling : spellings) {
            boolean match = spelling.length() == 1
                    ? spelling.equals(word)
                    : spelling.toLowerCase(Locale.ROOT).equals(word.toLowerCase(Locale.ROOT));
            if (match) {
                return true;
            }
        }
        return false;
    }

    /** The unit that {@code word} spells, if any. */
    static Optional<Unit> spelledAs(String word) {
        for (Unit unit : values()) {
            if (unit.isSpelledAs(word)) {
                return Optional.of(unit);
            }
        }
        return Optional.empty();
    }
}
