package halfrail.units;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

import static org.junit.jupiter.api.Assertions.assertEquals;

/** Reading values: the checks name their source in the display name or a comment. */
class EngineeringValueParseTest {

    @ParameterizedTest(name = "IEC 60062 value code {0} = {1}")
    @DisplayName("IEC 60062 value codes from the reference table")
    @CsvSource({
            "4K7, 4700",        // IEC 60062: 4K7 = 4.7 kΩ
            "R47, 0.47",        // IEC 60062: R47 = 0.47 Ω
            "2R2, 2.2",         // IEC 60062: 2R2 = 2.2 Ω
            "1M0, 1e6",         // IEC 60062: 1M0 = 1 MΩ
            "4n7, 4.7e-9",      // IEC 60062: 4n7 = 4.7 nF
            "1\u00B50, 1e-6",   // IEC 60062: 1µ0 = 1 µF, micro sign U+00B5
            "1\u03BC0, 1e-6",   // IEC 60062: 1µ0 = 1 µF, Greek mu U+03BC
            "10p, 1e-11",       // IEC 60062: 10p = 10 pF
    })
    void readsTheIecValueCodes(String code, double value) {
        assertEquals(value, EngineeringValue.parse(code));
    }

    @Test
    @DisplayName("IEC 60062 codes read with the unit they mark")
    void readsCodesAgainstTheirUnit() {
        // IEC 60062: R and K codes mark resistors, p/n/µ codes capacitors
        assertEquals(4700.0, EngineeringValue.parse("4K7", Unit.OHM));
        assertEquals(0.47, EngineeringValue.parse("R47", Unit.OHM));
        assertEquals(2.2, EngineeringValue.parse("2R2", Unit.OHM));
        assertEquals(1e6, EngineeringValue.parse("1M0", Unit.OHM));
        assertEquals(4.7e-9, EngineeringValue.parse("4n7", Unit.FARAD));
        assertEquals(1e-6, EngineeringValue.parse("1\u00B50", Unit.FARAD));
        assertEquals(1e-11, EngineeringValue.parse("10p", Unit.FARAD));
    }

    @ParameterizedTest(name = "{0} = {1}")
    @DisplayName("further value codes (IEC 60062, from memory; lower-case k is common practice)")
    @CsvSource({
            "4k7, 4700", "47R, 47", "10R, 10", "100R, 100", "1K0, 1000", "R10, 0.1", "1R0, 1",
            "4m7, 4.7e-3", "p47, 0.47e-12", "\u00B547, 0.47e-6", "1u0, 1e-6", "2G2, 2.2e9", "1T0, 1e12",
            "4k99, 4990", "-4k7, -4700", "4K7\u03A9, 4700", "4k7 ohm, 4700", "4n7F, 4.7e-9", "2R2 \u03A9, 2.2"
    })
    void readsFurtherCodes(String code, double value) {
        assertEquals(value, EngineeringValue.parse(code));
    }

    @ParameterizedTest(name = "1{0} = {1}")
    @DisplayName("SI prefixes, BIPM SI Brochure 9th ed. (2019) Table 7; K for kilo from IEC 60062 codes")
    @CsvSource({
            "f, 1e-15", "p, 1e-12", "n, 1e-9", "u, 1e-6", "\u00B5, 1e-6", "\u03BC, 1e-6", "m, 1e-3",
            "k, 1e3", "K, 1e3", "M, 1e6", "G, 1e9", "T, 1e12"
    })
    void readsEachSiPrefix(String prefix, double value) {
        assertEquals(value, EngineeringValue.parse("1" + prefix));
        assertEquals(value, EngineeringValue.parse("1 " + prefix));
    }

    @Test
    @DisplayName("M is mega and m is milli (SI Brochure Table 7), unlike the SPICE suffixes")
    void tellsMegaFromMilliByCase() {
        assertEquals(1e6, EngineeringValue.parse("1M"));
        assertEquals(1e-3, EngineeringValue.parse("1m"));
        assertEquals(1e6, EngineeringValue.parse("1 MHz", Unit.HERTZ));
        assertEquals(1e-3, EngineeringValue.parse("1 mHz", Unit.HERTZ));
        assertEquals(2.2e6, EngineeringValue.parse("2.2 M\u03A9", Unit.OHM));
        assertEquals(2.2e-3, EngineeringValue.parse("2.2 m\u03A9", Unit.OHM));
    }

    @ParameterizedTest(name = "{0} = {1}")
    @DisplayName("plain and scientific notation (Java and C decimal literal syntax, common practice)")
    @CsvSource({
            "1e-6, 1e-6", "2.2E3, 2200", "2.2e+3, 2200", ".5, 0.5", "5., 5", "+5, 5", "-5, -5",
            "0, 0", "0.0k, 0", "1.5e-3k, 1.5", "1000000, 1e6", "007, 7"
    })
    void readsPlainAndScientificNotation(String text, double value) {
        assertEquals(value, EngineeringValue.parse(text));
    }

    @Test
    @DisplayName("units after the number (SI symbols, SI Brochure Table 4; word spellings common practice)")
    void readsTheUnitAfterTheValue() {
        assertEquals(1e-5, EngineeringValue.parse("10uF", Unit.FARAD));
        assertEquals(4700.0, EngineeringValue.parse("4k7\u03A9", Unit.OHM));
        assertEquals(4700.0, EngineeringValue.parse("4k7\u2126", Unit.OHM));
        assertEquals(4700.0, EngineeringValue.parse("4.7 kohm", Unit.OHM));
        assertEquals(4700.0, EngineeringValue.parse("4.7 kOhms", Unit.OHM));
        assertEquals(3.3, EngineeringValue.parse("3.3V", Unit.VOLT));
        assertEquals(1000.0, EngineeringValue.parse("1 kHz", Unit.HERTZ));
        assertEquals(0.01, EngineeringValue.parse("10 ms", Unit.SECOND));
        assertEquals(5e-3, EngineeringValue.parse("5 mA", Unit.AMPERE));
        assertEquals(0.25, EngineeringValue.parse("250 mW", Unit.WATT));
        assertEquals(1e-15, EngineeringValue.parse("1 fF", Unit.FARAD));
        assertEquals(1.0, EngineeringValue.parse("1 F", Unit.FARAD));
        assertEquals(2.0, EngineeringValue.parse("2 farads", Unit.FARAD));
        assertEquals(3.0, EngineeringValue.parse("3 seconds", Unit.SECOND));
    }

    @Test
    @DisplayName("a value without a unit is accepted whatever unit is expected (common practice)")
    void acceptsAMissingUnit() {
        for (Unit unit : Unit.values()) {
            assertEquals(4700.0, EngineeringValue.parse("4.7k", unit), unit.name());
        }
    }

    @Test
    @DisplayName("surrounding whitespace and a space before the prefix, also no-break spaces (SI Brochure 5.4.3)")
    void toleratesWhitespace() {
        assertEquals(4700.0, EngineeringValue.parse("  4.7 k\t"));
        assertEquals(4700.0, EngineeringValue.parse("4.7\u00A0k\u03A9", Unit.OHM));
        assertEquals(4700.0, EngineeringValue.parse("4.7\u202FkHz", Unit.HERTZ));
        assertEquals(4700.0, EngineeringValue.parse(" 4K7 "));
    }

    @Test
    @DisplayName("digits convert to the nearest double, as Double.parseDouble does (IEEE 754 round to nearest)")
    void convertsExactlyToTheNearestDouble() {
        assertEquals(Double.parseDouble("0.1"), EngineeringValue.parse("100m"));
        assertEquals(Double.parseDouble("4.7e-9"), EngineeringValue.parse("4.7n"));
        assertEquals(Double.parseDouble("1.2345678901234567e-300"), EngineeringValue.parse("1.2345678901234567e-300"));
        assertEquals(Double.MIN_VALUE, EngineeringValue.parse("4.9e-324"));
    }
}
