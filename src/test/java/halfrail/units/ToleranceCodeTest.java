package halfrail.units;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.EnumSource;

import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ToleranceCodeTest {

    @ParameterizedTest(name = "{0} = ±{1} %")
    @DisplayName("tolerance letters F G J K M (IEC 60062), looked up both ways")
    @CsvSource({"F, 1", "G, 2", "J, 5", "K, 10", "M, 20"})
    void readsTheIecLettersBothWays(char letter, double percent) {
        ToleranceCode code = ToleranceCode.forLetter(letter).orElseThrow();
        assertEquals(letter, code.letter());
        assertEquals(percent, code.minusPercent());
        assertEquals(percent, code.plusPercent());
        assertEquals(Optional.of(code), ToleranceCode.forPercent(percent));
    }

    @ParameterizedTest(name = "{0} = -{1} % / +{2} %")
    @DisplayName("further letters (IEC 60062, from memory)")
    @CsvSource({"L, 0.01, 0.01", "W, 0.05, 0.05", "B, 0.1, 0.1", "C, 0.25, 0.25", "D, 0.5, 0.5",
            "N, 30, 30", "S, 20, 50", "Z, 20, 80"})
    void readsFurtherLetters(char letter, double minus, double plus) {
        ToleranceCode code = ToleranceCode.forLetter(letter).orElseThrow();
        assertEquals(minus, code.minusPercent());
        assertEquals(plus, code.plusPercent());
        assertEquals(minus == plus, code.isSymmetric());
    }

    @ParameterizedTest
    @EnumSource(ToleranceCode.class)
    void everyLetterNamesItsOwnCode(ToleranceCode code) {
        assertEquals(Optional.of(code), ToleranceCode.forLetter(code.letter()));
        assertEquals(Optional.of(code), ToleranceCode.forLetter(Character.toLowerCase(code.letter())));
        assertEquals(code.name(), String.valueOf(code.letter()));
        if (code.isSymmetric()) {
            assertEquals(Optional.of(code), ToleranceCode.forPercent(code.minusPercent()));
        }
    }

    @Test
    void unknownLettersAndPercentagesFindNothing() {
        assertTrue(ToleranceCode.forLetter('X').isEmpty());
        assertTrue(ToleranceCode.forLetter('1').isEmpty());
        assertTrue(ToleranceCode.forPercent(3).isEmpty());
        assertTrue(ToleranceCode.forPercent(-5).isEmpty());
        assertTrue(ToleranceCode.forPercent(Double.NaN).isEmpty());
        assertFalse(ToleranceCode.forPercent(80).isPresent()); // Z is −20/+80, not ±80
    }

    @Test
    @DisplayName("each E-series tolerance has a letter: E6 M, E12 K, E24 J, E48 G, E96 F, E192 D (IEC 60062 with IEC 60063; E48/E192 from memory)")
    void eachSeriesToleranceHasALetter() {
        assertEquals(ToleranceCode.M, ToleranceCode.forPercent(ESeries.E6.tolerancePercent()).orElseThrow());
        assertEquals(ToleranceCode.K, ToleranceCode.forPercent(ESeries.E12.tolerancePercent()).orElseThrow());
        assertEquals(ToleranceCode.J, ToleranceCode.forPercent(ESeries.E24.tolerancePercent()).orElseThrow());
        assertEquals(ToleranceCode.G, ToleranceCode.forPercent(ESeries.E48.tolerancePercent()).orElseThrow());
        assertEquals(ToleranceCode.F, ToleranceCode.forPercent(ESeries.E96.tolerancePercent()).orElseThrow());
        assertEquals(ToleranceCode.D, ToleranceCode.forPercent(ESeries.E192.tolerancePercent()).orElseThrow());
    }
}
