package halfrail.io;

import java.math.BigDecimal;
import java.util.Locale;

/**
 * Numbers in the SPICE value form: a decimal mantissa with an optional exponent, an optional
 * scale suffix and optional unit letters, in any case: {@code 10k}, {@code 4.7kohm},
 * {@code 100nF}, {@code 1meg}, {@code 2.2µ}, {@code 1e-6}, {@code -3.3}.
 *
 * <p>Scale suffixes: f 1e-15, p 1e-12, n 1e-9, u (also µ and μ) 1e-6, m 1e-3, k 1e3, meg 1e6,
 * g 1e9, t 1e12. {@code m} is milli and {@code meg} is mega, whatever the case, so {@code 1M}
 * is one thousandth. Letters after the suffix are a unit and are ignored; a digit after the
 * suffix is refused, because {@code 4k7} means 4.7 kΩ on a schematic but 4 kΩ to a SPICE
 * reader.
 *
 * <p>The value is computed by one correctly rounded decimal conversion (the suffix moves the
 * decimal exponent), so {@link #format(double)} followed by {@link #parse(String)} gives back
 * the same double.
 */
public final class SpiceValues {
    /** Largest number of digits accepted in an exponent; longer ones are refused rather than parsed. */
    public static final int MAX_EXPONENT_DIGITS = 5;
    /** Longest value token accepted, in characters. */
    public static final int MAX_TOKEN_LENGTH = 200;

    private static final String[] SUFFIX_NAMES = {"f", "p", "n", "u", "m", "", "k", "meg", "g", "t"};

    private SpiceValues() {}

    /**
     * Parse one value token.
     *
     * @throws NetlistException of kind BAD_VALUE (line and column 0; the reader adds them) when
     *                          the token is not a finite SPICE value
     */
    public static double parse(String token) {
        String s = token == null ? "" : token;
        if (s.isEmpty() || s.length() > MAX_TOKEN_LENGTH) {
            throw bad(s, s.isEmpty() ? "an empty value" : "a value of " + s.length() + " characters");
        }
        int i = 0;
        int n = s.length();
        StringBuilder mantissa = new StringBuilder();
        if (s.charAt(i) == '+' || s.charAt(i) == '-') {
            mantissa.append(s.charAt(i));
            i++;
        }
        int digits = 0;
        while (i < n && isDigit(s.charAt(i))) {
            mantissa.append(s.charAt(i));
            i++;
            digits++;
        }
        if (i < n && s.charAt(i) == '.') {
            mantissa.append('.');
            i++;
            while (i < n && isDigit(s.charAt(i))) {
                mantissa.append(s.charAt(i));
                i++;
                digits++;
            }
        }
        if (digits == 0) {
            throw bad(s, "no digits");
        }
        long exponent = 0;
        if (i < n && (s.charAt(i) == 'e' || s.charAt(i) == 'E')) {
            int j = i + 1;
            boolean negative = false;
            if (j < n && (s.charAt(j) == '+' || s.charAt(j) == '-')) {
                negative = s.charAt(j) == '-';
                j++;
            }
            int start = j;
            while (j < n && isDigit(s.charAt(j))) {
                j++;
            }
            if (j > start) {
                if (j - start > MAX_EXPONENT_DIGITS) {
                    throw bad(s, "an exponent of more than " + MAX_EXPONENT_DIGITS + " digits");
                }
                exponent = Long.parseLong(s.substring(start, j));
                if (negative) {
                    exponent = -exponent;
                }
                i = j;
            }
        }
        String rest = s.substring(i);
        String lower = rest.toLowerCase(Locale.ROOT);
        int scale = 0;
        int used = 0;
        if (lower.startsWith("meg")) {
            scale = 6;
            used = 3;
        } else if (!lower.isEmpty()) {
            switch (lower.charAt(0)) {
                case 'f' -> { scale = -15; used = 1; }
                case 'p' -> { scale = -12; used = 1; }
                case 'n' -> { scale = -9; used = 1; }
                case 'u', '\u00b5', '\u03bc' -> { scale = -6; used = 1; }
                case 'm' -> { scale = -3; used = 1; }
                case 'k' -> { scale = 3; used = 1; }
                case 'g' -> { scale = 9; used = 1; }
                case 't' -> { scale = 12; used = 1; }
                default -> { }
            }
        }
        String unit = rest.substring(used);
        for (int k = 0; k < unit.length(); k++) {
            char c = unit.charAt(k);
            if (!Character.isLetter(c)) {
                if (isDigit(c) && used > 0) {
                    throw bad(s, "a digit after the scale suffix ('4k7' style is not SPICE; write 4.7k)");
                }
                throw bad(s, "'" + c + "' after the number, where only a scale suffix and unit letters may follow");
            }
        }
        double value = Double.parseDouble(mantissa + "e" + (exponent + scale));
        if (!Double.isFinite(value)) {
            throw bad(s, "a value beyond the range of a double");
        }
        return value;
    }

    /**
     * Format a finite value so that {@link #parse(String)} returns exactly {@code value}: with a
     * scale suffix between f and t ({@code 4.7k}, {@code 1meg}, {@code 100n}), in exponent form
     * outside that range ({@code 1e-18}).
     *
     * @throws IllegalArgumentException for NaN or an infinity
     */
    public static String format(double value) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("not a finite value: " + value);
        }
        if (value == 0) {
            return Double.doubleToRawLongBits(value) == 0 ? "0" : "-0";
        }
        BigDecimal exact = new BigDecimal(Double.toString(value));
        double magnitude = Math.abs(value);
        int engineering = (int) Math.floor(Math.log10(magnitude) / 3) * 3;
        if (engineering < -15 || engineering > 12) {
            BigDecimal unscaled = exact.stripTrailingZeros();
            int exp = unscaled.precision() - unscaled.scale() - 1;
            String digits = unscaled.movePointLeft(exp).toPlainString();
            return digits + "e" + exp;
        }
        int index = (engineering + 15) / 3;
        String mantissa = exact.movePointLeft(engineering).stripTrailingZeros().toPlainString();
        return mantissa + SUFFIX_NAMES[index];
    }

    private static boolean isDigit(char c) {
        return c >= '0' && c <= '9';
    }

    private static NetlistException bad(String token, String problem) {
        return new NetlistException(NetlistException.Kind.BAD_VALUE, 0, 0,
                "bad value '" + NetlistException.oneLine(token) + "': " + problem,
                "a number such as 4.7k, 100n, 1meg or 1e-6");
    }
}
