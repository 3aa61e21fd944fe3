package halfrail.units;

import java.util.Optional;

/**
 * The SI prefixes this package reads and writes, femto to tera. Case matters: M is mega and
 * m is milli (this is not the SPICE dialect). K is accepted for kilo because IEC 60062 resistor
 * codes write it in capitals ({@code 4K7}); u, U+00B5 and U+03BC are all accepted for micro.
 */
enum SiPrefix {
    FEMTO(-15, 'f', "f"),
    PICO(-12, 'p', "p"),
    NANO(-9, 'n', "n"),
    MICRO(-6, '\u00B5', "\u00B5\u03BCu"),
    MILLI(-3, 'm', "m"),
    NONE(0, '\0', ""),
    KILO(3, 'k', "kK"),
    MEGA(6, 'M', "M"),
    GIGA(9, 'G', "G"),
    TERA(12, 'T', "T");

    /** The smallest and largest power of ten a prefix stands for. */
    static final int MIN_EXPONENT = -15;
    static final int MAX_EXPONENT = 12;

    private final int exponent;
    private final char symbol;
    private final String accepted;

    SiPrefix(int exponent, char symbol, String accepted) {
        this.exponent = exponent;
        this.symbol = symbol;
        this.accepted = accepted;
    }

    /** The power of ten this prefix stands for. */
    int exponent() {
        return exponent;
    }

    /** The symbol written when formatting; U+00B5 for micro. Empty for {@link #NONE}. */
    String symbol() {
        return this == NONE ? "" : String.valueOf(symbol);
    }

    /** The prefix spelled by {@code c}, if any. */
    static Optional<SiPrefix> of(char c) {
        for (SiPrefix prefix : values()) {
            if (prefix.accepted.indexOf(c) >= 0) {
                return Optional.of(prefix);
            }
        }
        return Optional.empty();
    }

    /** The prefix for {@code exponent}, a multiple of 3 in [{@link #MIN_EXPONENT}, {@link #MAX_EXPONENT}]. */
    static SiPrefix forExponent(int exponent) {
        for (SiPrefix prefix : values()) {
            if (prefix.exponent == exponent) {
                return prefix;
            }
        }
        throw new IllegalArgumentException("no SI prefix for 10^" + exponent);
    }
}
