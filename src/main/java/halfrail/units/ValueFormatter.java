package halfrail.units;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.Objects;

/**
 * Writes engineering values, rounding half up to a number of significant digits first and
 * choosing the prefix afterwards (so 999.7 Ω at 3 digits becomes "1 kΩ", not "1000 Ω").
 */
final class ValueFormatter {
    /** The most significant digits a double can meaningfully carry. */
    static final int MAX_SIGNIFICANT_DIGITS = 17;

    private ValueFormatter() {
    }

    /** {@code value} with an SI prefix and unit symbol, e.g. "4.7 kΩ"; see {@link EngineeringValue#format}. */
    static String format(double value, Unit unit, int significantDigits) {
        Objects.requireNonNull(unit, "unit");
        requireDigits(significantDigits);
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("cannot format " + value + ": not a finite number");
        }
        if (value == 0.0) {
            return join("0", SiPrefix.NONE, unit);
        }
        BigDecimal rounded = round(value, significantDigits);
        int exponent = exponentOf(rounded);
        int prefixExponent = Math.floorDiv(exponent, 3) * 3;
        if (prefixExponent < SiPrefix.MIN_EXPONENT || prefixExponent > SiPrefix.MAX_EXPONENT) {
            return join(plain(rounded.scaleByPowerOfTen(-exponent)) + "e" + exponent, SiPrefix.NONE, unit);
        }
        return join(plain(rounded.scaleByPowerOfTen(-prefixExponent)), SiPrefix.forExponent(prefixExponent), unit);
    }

    /** An IEC 60062 value code, e.g. "4K7"; see {@link EngineeringValue#formatCode}. */
    static String formatCode(double value, int significantDigits) {
        requireDigits(significantDigits);
        if (!Double.isFinite(value) || value <= 0.0) {
            throw new IllegalArgumentException("cannot write " + value + " as a value code: codes mark positive values");
        }
        BigDecimal rounded = round(value, significantDigits);
        int exponent = exponentOf(rounded);
        int letterExponent;
        String letter;
        if (exponent >= -1 && exponent <= 2) {
            letterExponent = 0;
            letter = "R";
        } else {
            letterExponent = Math.floorDiv(exponent, 3) * 3;
            if (letterExponent < SiPrefix.MIN_EXPONENT || letterExponent > SiPrefix.MAX_EXPONENT) {
                throw new IllegalArgumentException("cannot write " + value + " as a value code: outside 1e-15 to 1e15");
            }
            SiPrefix prefix = SiPrefix.forExponent(letterExponent);
            letter = prefix == SiPrefix.KILO ? "K" : prefix.symbol();
        }
        String mantissa = plain(rounded.scaleByPowerOfTen(-letterExponent));
        int dot = mantissa.indexOf('.');
        String whole = dot < 0 ? mantissa : mantissa.substring(0, dot);
        String fraction = dot < 0 ? "" : mantissa.substring(dot + 1);
        if (whole.equals("0")) {
            whole = "";
        }
        if (whole.length() + fraction.length() < 2) {
            fraction = fraction + "0";
        }
        return whole + letter + fraction;
    }

    private static BigDecimal round(double value, int significantDigits) {
        return new BigDecimal(value).round(new MathContext(significantDigits, RoundingMode.HALF_UP));
    }

    /** The power of ten of the leading digit of a non-zero decimal. */
    private static int exponentOf(BigDecimal nonZero) {
        return nonZero.precision() - nonZero.scale() - 1;
    }

    private static String plain(BigDecimal value) {
        return value.stripTrailingZeros().toPlainString();
    }

    private static String join(String number, SiPrefix prefix, Unit unit) {
        String suffix = prefix.symbol() + unit.symbol();
        return suffix.isEmpty() ? number : number + " " + suffix;
    }

    private static void requireDigits(int significantDigits) {
        if (significantDigits < 1 || significantDigits > MAX_SIGNIFICANT_DIGITS) {
            throw new IllegalArgumentException("significant digits must be 1 to " + MAX_SIGNIFICANT_DIGITS
                    + ", got " + significantDigits);
        }
    }
}
