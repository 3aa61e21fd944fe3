package halfrail.units;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.Objects;
import java.util.Optional;

/**
 * Reads one engineering value: {@code sign? (number | code) space? tail} where a number is
 * plain or scientific ({@code 4.7}, {@code .5}, {@code 2.2E3}) followed by an optional SI prefix
 * and unit, and a code is an IEC 60062 value code whose letter stands in for the decimal point
 * ({@code 4k7}, {@code R47}, {@code 47R}, {@code 1µ0}) followed by an optional unit. The digits
 * are converted exactly (through {@link BigDecimal}) so the result is the double nearest to
 * the written decimal value.
 */
final class ValueParser {
    /** The expectation reported for text that is not a number, prefix or code. */
    static final String EXPECTED_VALUE =
            "a number with at most one SI prefix or an IEC 60062 code such as 4k7";
    /** The expectation reported when the value leaves the range of a double. */
    static final String EXPECTED_IN_RANGE =
            "a finite, non-zero value within the range of a double (about 4.9e-324 to 1.8e308)";
    /** The expectation reported for an exponent letter without digits. */
    static final String EXPECTED_EXPONENT = "exponent digits such as e-6";
    /**
     * Decimal exponents beyond this magnitude cannot give a finite non-zero double for any
     * reasonable number of digits; they are rejected before any conversion is attempted.
     */
    static final long EXPONENT_LIMIT = 100_000;

    private final String text;
    /** The unit the caller expects, or null when any unit (or none) is acceptable. */
    private final Unit expected;
    private final int end;
    private int pos;

    private ValueParser(String text, Unit expected) {
        this.text = text;
        this.expected = expected;
        int last = text.length();
        while (last > 0 && isSpace(text.charAt(last - 1))) {
            last--;
        }
        this.end = last;
    }

    /**
     * @param text     the text to read, never null
     * @param expected the unit required (or absent), or null to accept any unit
     */
    static double parse(String text, Unit expected) {
        Objects.requireNonNull(text, "text");
        return new ValueParser(text, expected).read();
    }

    private double read() {
        pos = skipSpace(0);
        if (pos >= end) {
            throw fail(pos, EXPECTED_VALUE);
        }
        boolean negative = false;
        char sign = text.charAt(pos);
        if (sign == '+' || sign == '-') {
            negative = sign == '-';
            pos++;
        }
        int numberStart = pos;
        String intDigits = digits();
        char c = peek(0);
        boolean marker = c == 'R' || SiPrefix.of(c).isPresent();
        if (marker && (isDigit(peek(1)) || (c == 'R' && !intDigits.isEmpty()))) {
            return readCode(negative, numberStart, intDigits);
        }
        String fracDigits = "";
        if (c == '.') {
            pos++;
            fracDigits = digits();
        }
        if (intDigits.isEmpty() && fracDigits.isEmpty()) {
            throw fail(numberStart, EXPECTED_VALUE);
        }
        long exponent = 0;
        char e = peek(0);
        if (e == 'e' || e == 'E') {
            pos++;
            exponent = exponent();
        }
        int tailStart = skipSpace(pos);
        SiPrefix prefix = SiPrefix.NONE;
        String tail = text.substring(tailStart, end);
        if (!tail.isEmpty() && Unit.spelledAs(tail).isEmpty()) {
            Optional<SiPrefix> p = SiPrefix.of(tail.charAt(0));
            if (p.isEmpty()) {
                throw fail(tailStart, EXPECTED_VALUE);
            }
            prefix = p.get();
            tailStart++;
            tail = tail.substring(1);
            if (!tail.isEmpty() && SiPrefix.of(tail.charAt(0)).isPresent() && Unit.spelledAs(tail).isEmpty()) {
                throw fail(tailStart, EXPECTED_VALUE);
            }
        }
        checkUnit(tailStart, tail);
        return value(negative, numberStart, intDigits + fracDigits,
                exponent + prefix.exponent() - fracDigits.length());
    }

    /** An IEC 60062 code: the marker letter at {@code pos} is the decimal point and the multiplier. */
    private double readCode(boolean negative, int numberStart, String intDigits) {
        int markerPos = pos;
        char marker = text.charAt(pos++);
        String fracDigits = digits();
        if (marker == 'R' && expected != null && expected != Unit.OHM) {
            throw fail(markerPos, unitExpectation());
        }
        int multiplier = marker == 'R' ? 0 : SiPrefix.of(marker).orElseThrow().exponent();
        int tailStart = skipSpace(pos);
        String tail = text.substring(tailStart, end);
        if (!tail.isEmpty() && Unit.spelledAs(tail).isEmpty()) {
            throw fail(tailStart, EXPECTED_VALUE);
        }
        checkUnit(tailStart, tail);
        return value(negative, numberStart, intDigits + fracDigits, (long) multiplier - fracDigits.length());
    }

    /** Checks the unit spelled by {@code tail} (possibly empty) against the expected one. */
    private void checkUnit(int tailStart, String tail) {
        if (tail.isEmpty()) {
            return;
        }
        Optional<Unit> unit = Unit.spelledAs(tail);
        if (unit.isEmpty() || (expected != null && unit.get() != expected)) {
            throw fail(tailStart, unitExpectation());
        }
    }

    private String unitExpectation() {
        return unitExpectation(expected);
    }

    /** The expectation reported for a missing, misspelt or contradicting unit; null means any unit. */
    static String unitExpectation(Unit expected) {
        if (expected == null) {
            return "a unit such as \u03A9, F, V, A, Hz, s or W, or no unit";
        }
        if (expected == Unit.NONE) {
            return "a bare number without a unit";
        }
        return "a value in " + expected.symbol() + " (" + String.join(", ", expected.spellings())
                + (expected == Unit.OHM ? ", R in codes" : "") + ") or without a unit";
    }

    /** Reads an exponent after its letter; saturates far beyond {@link #EXPONENT_LIMIT}. */
    private long exponent() {
        int letterPos = pos - 1;
        boolean negative = false;
        char sign = peek(0);
        if (sign == '+' || sign == '-') {
            negative = sign == '-';
            pos++;
        }
        String digits = digits();
        if (digits.isEmpty()) {
            throw fail(letterPos, EXPECTED_EXPONENT);
        }
        String significant = digits.replaceFirst("^0+(?=.)", "");
        long magnitude = significant.length() > 9 ? 2 * EXPONENT_LIMIT : Long.parseLong(significant);
        return negative ? -magnitude : magnitude;
    }

    /** The double nearest to {@code digits × 10^power10}, or an error when out of range. */
    private double value(boolean negative, int numberStart, String digits, long power10) {
        BigInteger unscaled = new BigInteger(digits);
        if (unscaled.signum() == 0) {
            return negative ? -0.0 : 0.0;
        }
        if (Math.abs(power10) > EXPONENT_LIMIT) {
            throw fail(numberStart, EXPECTED_IN_RANGE);
        }
        double magnitude = new BigDecimal(unscaled, (int) -power10).doubleValue();
        if (Double.isInfinite(magnitude) || magnitude == 0.0) {
            throw fail(numberStart, EXPECTED_IN_RANGE);
        }
        return negative ? -magnitude : magnitude;
    }

    private String digits() {
        int start = pos;
        while (pos < end && isDigit(text.charAt(pos))) {
            pos++;
        }
        return text.substring(start, pos);
    }

    private char peek(int ahead) {
        int at = pos + ahead;
        return at < end ? text.charAt(at) : '\0';
    }

    private int skipSpace(int from) {
        int at = from;
        while (at < end && isSpace(text.charAt(at))) {
            at++;
        }
        return at;
    }

    private ValueFormatException fail(int position, String what) {
        return new ValueFormatException(text, position, what);
    }

    private static boolean isDigit(char c) {
        return c >= '0' && c <= '9';
    }

    /** Whitespace including no-break spaces (U+00A0, U+202F), as formatted text often has. */
    private static boolean isSpace(char c) {
        return Character.isWhitespace(c) || Character.isSpaceChar(c);
    }
}
