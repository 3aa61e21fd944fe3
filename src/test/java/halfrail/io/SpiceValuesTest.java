package halfrail.io;

import net.jqwik.api.ForAll;
import net.jqwik.api.Label;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

/**
 * Scale factors and unit letters as the SPICE3 user's manual defines them (T G MEG K M U N P F;
 * "letters immediately following a number that are not scale factors are ignored", so 10, 10V
 * and 10Hz are one number and M, MA, MSec are one scale factor) — Quarles, SPICE3 Version 3f3
 * User's Manual, UC Berkeley (1993), section 2.1, from memory. µ for micro is our addition.
 */
class SpiceValuesTest {

    @ParameterizedTest(name = "{0} reads as {1}")
    @DisplayName("each scale suffix multiplies by its power of ten (SPICE3 manual §2.1)")
    @CsvSource({
            "1f, 1e-15", "1p, 1e-12", "1n, 1e-9", "1u, 1e-6", "1m, 1e-3", "1k, 1e3", "1meg, 1e6", "1g, 1e9",
            "1t, 1e12", "2.2u, 2.2e-6", "4.7k, 4700", "100n, 1e-7", "-3.3, -3.3", "+5, 5", ".5, 0.5", "5., 5"})
    void eachScaleSuffixMultipliesByItsPowerOfTen(String text, double expected) {
        assertEquals(expected, SpiceValues.parse(text));
    }

    @Test
    @DisplayName("m is milli and meg is mega, in any case (SPICE3 manual §2.1)")
    void mIsMilliAndMegIsMegaInAnyCase() {
        assertEquals(1e-3, SpiceValues.parse("1M"));
        assertEquals(1e-3, SpiceValues.parse("1m"));
        assertEquals(1e6, SpiceValues.parse("1MEG"));
        assertEquals(1e6, SpiceValues.parse("1Meg"));
        assertEquals(2.2e6, SpiceValues.parse("2.2megohm"));
    }

    @Test
    @DisplayName("the micro sign and the Greek mu both mean micro (our addition to SPICE)")
    void theMicroSignAndTheGreekMuBothMeanMicro() {
        assertEquals(1e-5, SpiceValues.parse("10\u00b5"));
        assertEquals(1e-5, SpiceValues.parse("10\u03bcF"));
    }

    @ParameterizedTest(name = "{0} reads as {1}")
    @DisplayName("unit letters after the number or the suffix are ignored (SPICE3 manual §2.1)")
    @CsvSource({"10uF, 1e-5", "4.7kohm, 4700", "10V, 10", "10Volts, 10", "1kHz, 1000", "5mA, 0.005",
            "100nF, 1e-7", "2.2k\u03a9, 2200"})
    void unitLettersAreIgnored(String text, double expected) {
        assertEquals(expected, SpiceValues.parse(text));
    }

    @Test
    @DisplayName("a bare F is femto, not farad: 1F reads as 1e-15 (SPICE3 manual §2.1)")
    void aBareFIsFemto() {
        assertEquals(1e-15, SpiceValues.parse("1F"));
    }

    @ParameterizedTest(name = "{0} reads as {1}")
    @DisplayName("exponents combine with suffixes (SPICE3 manual §2.1)")
    @CsvSource({"1e-6, 1e-6", "1E6, 1e6", "2.5e+3, 2500", "1e3k, 1e6", "1e, 1"})
    void exponentsCombineWithSuffixes(String text, double expected) {
        assertEquals(expected, SpiceValues.parse(text));
    }

    @ParameterizedTest(name = "''{0}'' is refused")
    @DisplayName("text that is not a SPICE value is refused with BAD_VALUE")
    @ValueSource(strings = {"", "k", "abc", "4k7", "1.2.3", "1e99999", "1e400", "--1", "1k-", "=", "1_000"})
    void textThatIsNotAValueIsRefused(String text) {
        NetlistException e = assertThrows(NetlistException.class, () -> SpiceValues.parse(text));
        assertEquals(NetlistException.Kind.BAD_VALUE, e.kind());
    }

    @ParameterizedTest(name = "{0} is written {1}")
    @DisplayName("values are written with the SPICE suffix of their decade group, meg for mega")
    @CsvSource({"4700, 4.7k", "1e6, 1meg", "1e-7, 100n", "2.2e-6, 2.2u", "0.001, 1m", "0, 0", "-9, -9",
            "1e-18, 1e-18", "3.3e15, 3.3e15", "1e12, 1t", "1e-15, 1f", "0.1, 100m"})
    void valuesAreWrittenWithTheSuffixOfTheirDecadeGroup(double value, String text) {
        assertEquals(text, SpiceValues.format(value));
    }

    @Property(seed = "124022121797569")
    @Label("every finite double reads back exactly after writing")
    void everyFiniteDoubleReadsBackExactly(@ForAll double value) {
        if (Double.isFinite(value)) {
            assertEquals(value, SpiceValues.parse(SpiceValues.format(value)));
        }
    }

    @Property(seed = "81279387408195")
    @Label("component-sized values read back exactly after writing")
    void componentSizedValuesReadBackExactly(@ForAll @DoubleRange(min = 1, max = 10) double mantissa,
                                             @ForAll @IntRange(min = -16, max = 13) int exponent) {
        double value = mantissa * Math.pow(10, exponent);
        assertEquals(value, SpiceValues.parse(SpiceValues.format(value)));
    }
}
