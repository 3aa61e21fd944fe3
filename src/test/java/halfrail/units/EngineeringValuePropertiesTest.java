package halfrail.units;

import net.jqwik.api.ForAll;
import net.jqwik.api.Label;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Writing then reading a value gives it back within the rounding of the digits written. The
 * bound is exact arithmetic: rounding x to d significant digits moves it by at most half a unit
 * in the d-th digit, 0.5·10^(1−d)·|x|, and reading the decimal back adds at most half an ulp.
 */
class EngineeringValuePropertiesTest {

    /** A value spread evenly over the decades, 10^exponent. */
    private static double decades(double exponent) {
        return Math.pow(10, exponent);
    }

    private static void assertWithinRounding(double x, double back, int digits, String text) {
        double bound = 0.5 * Math.pow(10, 1 - digits) * Math.abs(x) + 2 * Math.ulp(x);
        assertTrue(Math.abs(back - x) <= bound, () -> x + " -> \"" + text + "\" -> " + back);
    }

    @Property(seed = "92907239601119")
    @Label("format then parse returns the value within 3-digit rounding, 1e-15 to 1e12, every unit")
    void formatThenParseRoundTrips(@ForAll @DoubleRange(min = -15, max = 12) double exponent, @ForAll Unit unit) {
        double x = decades(exponent);
        String text = EngineeringValue.format(x, unit);
        assertWithinRounding(x, EngineeringValue.parse(text, unit), EngineeringValue.DEFAULT_SIGNIFICANT_DIGITS, text);
        assertWithinRounding(x, EngineeringValue.parse(text), EngineeringValue.DEFAULT_SIGNIFICANT_DIGITS, text);
    }

    @Property(seed = "232356646207130")
    @Label("format with d digits then parse returns the value within d-digit rounding, signed values too")
    void formatWithDigitsThenParseRoundTrips(@ForAll @DoubleRange(min = -15, max = 12) double exponent,
                                             @ForAll Unit unit, @ForAll boolean negative,
                                             @ForAll @IntRange(min = 1, max = 17) int digits) {
        double x = negative ? -decades(exponent) : decades(exponent);
        String text = EngineeringValue.format(x, unit, digits);
        assertWithinRounding(x, EngineeringValue.parse(text, unit), digits, text);
    }

    @Property(seed = "48568199997660")
    @Label("17 significant digits reproduce the double exactly (IEEE 754-2019 §5.12.2)")
    void seventeenDigitsAreExact(@ForAll @DoubleRange(min = -40, max = 40) double exponent, @ForAll Unit unit) {
        double x = decades(exponent);
        String text = EngineeringValue.format(x, unit, 17);
        assertEquals(x, EngineeringValue.parse(text, unit), text);
    }

    @Property(seed = "48594303049519")
    @Label("formatCode then parse (as ohms) returns the value within 3-digit rounding, 1e-15 to 1e14")
    void codeThenParseRoundTrips(@ForAll @DoubleRange(min = -15, max = 14.99) double exponent) {
        double x = decades(exponent);
        String code = EngineeringValue.formatCode(x);
        assertWithinRounding(x, EngineeringValue.parse(code, Unit.OHM), EngineeringValue.DEFAULT_SIGNIFICANT_DIGITS, code);
    }
}
