package halfrail.units;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

/** Writing values. */
class EngineeringValueFormatTest {

    @Test
    @DisplayName("prefix and unit symbol after a space (BIPM SI Brochure 9th ed. §5.4.3, Table 7)")
    void writesShortestReadableForm() {
        assertEquals("4.7 k\u03A9", EngineeringValue.format(4700, Unit.OHM));
        assertEquals("1 \u00B5F", EngineeringValue.format(1e-6, Unit.FARAD));
        assertEquals("470 m\u03A9", EngineeringValue.format(0.47, Unit.OHM));
        assertEquals("3.3 V", EngineeringValue.format(3.3, Unit.VOLT));
        assertEquals("1 kHz", EngineeringValue.format(1000, Unit.HERTZ));
        assertEquals("100 ns", EngineeringValue.format(1e-7, Unit.SECOND));
        assertEquals("250 mW", EngineeringValue.format(0.25, Unit.WATT));
        assertEquals("-12 mA", EngineeringValue.format(-0.012, Unit.AMPERE));
        assertEquals("100 \u03A9", EngineeringValue.format(100, Unit.OHM));
        assertEquals("0 V", EngineeringValue.format(0, Unit.VOLT));
        assertEquals("1 f", EngineeringValue.format(1e-15, Unit.NONE));
        assertEquals("999 G\u03A9", EngineeringValue.format(999e9, Unit.OHM));
    }

    @Test
    @DisplayName("three significant digits by default, rounded half up before the prefix is chosen (common practice)")
    void roundsToThreeSignificantDigits() {
        assertEquals("4.99 k\u03A9", EngineeringValue.format(4990, Unit.OHM));
        assertEquals("1.23 k\u03A9", EngineeringValue.format(1234.5, Unit.OHM));
        assertEquals("1 k\u03A9", EngineeringValue.format(999.7, Unit.OHM));
        assertEquals("10 k\u03A9", EngineeringValue.format(9999, Unit.OHM));
        assertEquals("2.5 V", EngineeringValue.format(2.5, Unit.VOLT));
    }

    @Test
    void honoursTheRequestedSignificantDigits() {
        assertEquals("5 k\u03A9", EngineeringValue.format(4990, Unit.OHM, 1));
        assertEquals("4.99 k\u03A9", EngineeringValue.format(4990, Unit.OHM, 4));
        assertEquals("1.2346 k\u03A9", EngineeringValue.format(1234.56, Unit.OHM, 5));
        assertEquals("100.00000000000001 m", EngineeringValue.format(0.1, Unit.NONE, 17));
    }

    @Test
    @DisplayName("beyond femto and tera the value is written in scientific notation (our choice)")
    void writesScientificNotationBeyondThePrefixes() {
        assertEquals("1.5e18 \u03A9", EngineeringValue.format(1.5e18, Unit.OHM));
        assertEquals("1e15", EngineeringValue.format(1e15, Unit.NONE));
        assertEquals("2e-18 F", EngineeringValue.format(2e-18, Unit.FARAD));
    }

    @Test
    void refusesNonFiniteValuesAndBadDigits() {
        assertThrows(IllegalArgumentException.class, () -> EngineeringValue.format(Double.NaN, Unit.OHM));
        assertThrows(IllegalArgumentException.class, () -> EngineeringValue.format(Double.POSITIVE_INFINITY, Unit.OHM));
        assertThrows(IllegalArgumentException.class, () -> EngineeringValue.format(1, Unit.OHM, 0));
        assertThrows(IllegalArgumentException.class, () -> EngineeringValue.format(1, Unit.OHM, 18));
        assertThrows(NullPointerException.class, () -> EngineeringValue.format(1, null));
    }

    @ParameterizedTest(name = "{0} -> {1}")
    @DisplayName("IEC 60062 value codes from the reference table")
    @CsvSource({
            "4700, 4K7",        // IEC 60062: 4K7 = 4.7 kΩ
            "0.47, R47",        // IEC 60062: R47 = 0.47 Ω
            "2.2, 2R2",         // IEC 60062: 2R2 = 2.2 Ω
            "1e6, 1M0",         // IEC 60062: 1M0 = 1 MΩ
            "4.7e-9, 4n7",      // IEC 60062: 4n7 = 4.7 nF
            "1e-6, 1\u00B50",   // IEC 60062: 1µ0 = 1 µF
            "1e-11, 10p",       // IEC 60062: 10p = 10 pF
    })
    void writesTheIecValueCodes(double value, String code) {
        assertEquals(code, EngineeringValue.formatCode(value));
    }

    @ParameterizedTest(name = "{0} -> {1}")
    @DisplayName("further IEC 60062 codes, at least two digits shown (IEC 60062 code table, from memory)")
    @CsvSource({
            "0.1, R10", "1, 1R0", "10, 10R", "100, 100R", "1000, 1K0", "10000, 10K", "100000, 100K",
            "1e7, 10M", "1e9, 1G0", "1e12, 1T0", "0.047, 47m", "0.001, 1m0", "4990, 4K99",
            "1e-12, 1p0", "1e-15, 1f0", "1e-7, 100n", "999.7, 1K0"
    })
    void writesFurtherCodes(double value, String code) {
        assertEquals(code, EngineeringValue.formatCode(value));
    }

    @Test
    void writesCodesWithTheRequestedDigits() {
        assertEquals("4K99", EngineeringValue.formatCode(4990, 3));
        assertEquals("5K0", EngineeringValue.formatCode(4990, 1));
        assertEquals("4K987", EngineeringValue.formatCode(4987, 4));
    }

    @Test
    void refusesCodesForValuesThatCannotBeMarked() {
        assertThrows(IllegalArgumentException.class, () -> EngineeringValue.formatCode(0));
        assertThrows(IllegalArgumentException.class, () -> EngineeringValue.formatCode(-4700));
        assertThrows(IllegalArgumentException.class, () -> EngineeringValue.formatCode(Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> EngineeringValue.formatCode(1e16));
        assertThrows(IllegalArgumentException.class, () -> EngineeringValue.formatCode(1e-16));
        assertThrows(IllegalArgumentException.class, () -> EngineeringValue.formatCode(1, 0));
    }
}
