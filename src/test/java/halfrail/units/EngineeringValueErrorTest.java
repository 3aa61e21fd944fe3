package halfrail.units;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Malformed text is refused with a {@link ValueFormatException} that says where and what was
 * expected; never a silent zero. The grammar is our own (see {@link EngineeringValue}); the
 * positions follow from it.
 */
class EngineeringValueErrorTest {
    private static final String VALUE = ValueParser.EXPECTED_VALUE;
    private static final String IN_RANGE = ValueParser.EXPECTED_IN_RANGE;
    private static final String EXPONENT = ValueParser.EXPECTED_EXPONENT;

    static Stream<Arguments> malformed() {
        return Stream.of(
                Arguments.of("4k7k", null, 3, VALUE),        // a second prefix after a code
                Arguments.of("", null, 0, VALUE),
                Arguments.of("   ", null, 0, VALUE),
                Arguments.of("NaN", null, 0, VALUE),
                Arguments.of("Infinity", null, 0, VALUE),
                Arguments.of("-Infinity", null, 1, VALUE),
                Arguments.of("abc", null, 0, VALUE),
                Arguments.of("k", null, 0, VALUE),
                Arguments.of("R", null, 0, VALUE),
                Arguments.of(".", null, 0, VALUE),
                Arguments.of("--5", null, 1, VALUE),
                Arguments.of("- 5", null, 1, VALUE),
                Arguments.of("1.2.3", null, 3, VALUE),
                Arguments.of("4,7k", null, 1, VALUE),
                Arguments.of("1kk", null, 2, VALUE),
                Arguments.of("4k7.5", null, 3, VALUE),
                Arguments.of("4k7e3", null, 3, VALUE),
                Arguments.of("4.7R", null, 3, VALUE),
                Arguments.of("1e", null, 1, EXPONENT),
                Arguments.of("1e+", null, 1, EXPONENT),
                Arguments.of("1e400", null, 0, IN_RANGE),
                Arguments.of("1e-400", null, 0, IN_RANGE),
                Arguments.of("-1e99999999999", null, 1, IN_RANGE),
                Arguments.of("1e-330", null, 0, IN_RANGE),
                Arguments.of("1 x", null, 2, VALUE),
                Arguments.of("4.7 k \u03A9", null, 5, ValueParser.unitExpectation(null)),
                Arguments.of("1 kohmx", null, 3, ValueParser.unitExpectation(null)),
                Arguments.of("10uF", Unit.OHM, 3, ValueParser.unitExpectation(Unit.OHM)),
                Arguments.of("4.7 kF", Unit.OHM, 5, ValueParser.unitExpectation(Unit.OHM)),
                Arguments.of("4k7\u03A9", Unit.FARAD, 3, ValueParser.unitExpectation(Unit.FARAD)),
                Arguments.of("2R2", Unit.FARAD, 1, ValueParser.unitExpectation(Unit.FARAD)),
                Arguments.of("5 V", Unit.NONE, 2, ValueParser.unitExpectation(Unit.NONE)),
                Arguments.of("1 kHz", Unit.SECOND, 3, ValueParser.unitExpectation(Unit.SECOND))
        );
    }

    /** A null unit means {@link EngineeringValue#parse(String)}, which accepts any unit. */
    @ParameterizedTest(name = "\"{0}\" as {1}: position {2}")
    @MethodSource("malformed")
    void refusesMalformedTextSayingWhereAndWhat(String text, Unit unit, int position, String expected) {
        ValueFormatException e = assertThrows(ValueFormatException.class,
                () -> read(text, unit));
        assertEquals(text, e.text());
        assertEquals(position, e.position());
        assertEquals(expected, e.expected());
    }

    private static double read(String text, Unit unit) {
        return unit == null ? EngineeringValue.parse(text) : EngineeringValue.parse(text, unit);
    }

    @Test
    @DisplayName("the message quotes the text and says what was expected")
    void messageQuotesTextAndExpectation() {
        ValueFormatException e = assertThrows(ValueFormatException.class, () -> EngineeringValue.parse("4k7k"));
        assertTrue(e.getMessage().contains("\"4k7k\""), e.getMessage());
        assertTrue(e.getMessage().contains(e.expected()), e.getMessage());
    }

    @Test
    void theUnitExpectationNamesTheExpectedUnit() {
        assertTrue(ValueParser.unitExpectation(Unit.OHM).contains("\u03A9"));
        assertTrue(ValueParser.unitExpectation(Unit.FARAD).contains("F"));
    }

    @Test
    void nullTextOrUnitIsAProgrammingError() {
        assertThrows(NullPointerException.class, () -> EngineeringValue.parse(null));
        assertThrows(NullPointerException.class, () -> EngineeringValue.parse("1", null));
    }
}
