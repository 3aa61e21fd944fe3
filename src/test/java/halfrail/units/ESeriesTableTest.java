package halfrail.units;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The tables of IEC 60063:2015, Preferred number series for resistors and capacitors. */
class ESeriesTableTest {

    /** 10^(n/N) rounded half up to three significant figures, in hundredths: the closed form. */
    private static int formulaHundredths(int n, int perDecade) {
        return new BigDecimal(Math.pow(10, (double) n / perDecade)).setScale(2, RoundingMode.HALF_UP)
                .movePointRight(2).intValueExact();
    }

    private static Set<Double> members(ESeries series) {
        return new HashSet<>(series.mantissas());
    }

    @Test
    @DisplayName("E6 = 1.0 1.5 2.2 3.3 4.7 6.8 (IEC 60063)")
    void e6MatchesTheStandard() {
        assertEquals(List.of(1.0, 1.5, 2.2, 3.3, 4.7, 6.8), ESeries.E6.mantissas());
    }

    @Test
    @DisplayName("E12 = 1.0 1.2 1.5 1.8 2.2 2.7 3.3 3.9 4.7 5.6 6.8 8.2 (IEC 60063)")
    void e12MatchesTheStandard() {
        assertEquals(List.of(1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2), ESeries.E12.mantissas());
    }

    @Test
    @DisplayName("E24 = 1.0 1.1 1.2 1.3 1.5 1.6 1.8 2.0 2.2 2.4 2.7 3.0 3.3 3.6 3.9 4.3 4.7 5.1 5.6 6.2 6.8 7.5 8.2 9.1 (IEC 60063)")
    void e24MatchesTheStandard() {
        assertEquals(List.of(1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0,
                3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1), ESeries.E24.mantissas());
    }

    @Test
    @DisplayName("E24 departs from rounded 10^(n/24) exactly at 2.7 3.0 3.3 3.6 3.9 4.3 4.7 8.2 (IEC 60063)")
    void e24DepartsFromTheFormulaWhereTheStandardSays() {
        int[] table = ESeries.E24.hundredths();
        List<Integer> departures = new ArrayList<>();
        for (int n = 0; n < 24; n++) {
            int formula = new BigDecimal(Math.pow(10, n / 24.0)).setScale(1, RoundingMode.HALF_UP)
                    .movePointRight(2).intValueExact();
            if (formula != table[n]) {
                departures.add(table[n]);
            }
        }
        assertEquals(List.of(270, 300, 330, 360, 390, 430, 470, 820), departures);
    }

    @ParameterizedTest(name = "{0} is round(10^(n/N)) to 3 significant figures, except E192 n=185")
    @EnumSource(value = ESeries.class, names = {"E48", "E96", "E192"})
    @DisplayName("E48/E96/E192 follow the formula (IEC 60063)")
    void finerSeriesFollowTheFormula(ESeries series) {
        int[] table = series.hundredths();
        int perDecade = series.valuesPerDecade();
        assertEquals(perDecade, table.length);
        for (int n = 0; n < perDecade; n++) {
            int expected = series == ESeries.E192 && n == 185 ? 920 : formulaHundredths(n, perDecade);
            assertEquals(expected, table[n], series + " n=" + n);
        }
    }

    @Test
    @DisplayName("E192 n=185 is the published 9.20 although the formula gives 9.19 (IEC 60063)")
    void e192HasThePublishedExceptionAt185() {
        assertEquals(919, formulaHundredths(185, 192));
        assertEquals(920, ESeries.E192.hundredths()[185]);
        assertTrue(ESeries.E192.contains(9.20));
        assertTrue(ESeries.E192.contains(9.20e3));
        assertTrue(!ESeries.E192.contains(9.19));
    }

    @Test
    @DisplayName("E96 spot values 1.02, 3.01, 4.99, 9.76 (IEC 60063, from memory)")
    void e96SpotValues() {
        for (double v : new double[] {1.02, 3.01, 4.99, 9.76}) {
            assertTrue(ESeries.E96.mantissas().contains(v), () -> "E96 lacks " + v);
        }
    }

    @Test
    @DisplayName("the coarser series nest: E24 ⊃ E12 ⊃ E6, E192 ⊃ E96 ⊃ E48 (IEC 60063 construction)")
    void coarserSeriesAreContainedInFinerOnes() {
        assertTrue(members(ESeries.E12).containsAll(members(ESeries.E6)));
        assertTrue(members(ESeries.E24).containsAll(members(ESeries.E12)));
        assertTrue(members(ESeries.E96).containsAll(members(ESeries.E48)));
        assertTrue(members(ESeries.E192).containsAll(members(ESeries.E96)));
        // E48 takes every second E96 value, E96 every second E192 value (IEC 60063 construction)
        for (int n = 0; n < 48; n++) {
            assertEquals(ESeries.E96.hundredths()[2 * n], ESeries.E48.hundredths()[n]);
        }
        for (int n = 0; n < 96; n++) {
            assertEquals(ESeries.E192.hundredths()[2 * n], ESeries.E96.hundredths()[n]);
        }
        // and the two families are different: E48 does not contain E24's 4.7
        assertTrue(!members(ESeries.E48).contains(4.7));
    }

    @ParameterizedTest
    @EnumSource(ESeries.class)
    void mantissasAscendWithinOneDecade(ESeries series) {
        List<Double> m = series.mantissas();
        assertEquals(series.valuesPerDecade(), m.size());
        assertEquals(1.0, m.get(0));
        for (int i = 1; i < m.size(); i++) {
            assertTrue(m.get(i) > m.get(i - 1), series + " at " + i);
        }
        assertTrue(m.get(m.size() - 1) < 10.0);
        assertThrows(UnsupportedOperationException.class, () -> m.add(2.0));
    }

    @Test
    @DisplayName("tolerance per series: E6 20 %, E12 10 %, E24 5 %, E96 1 % (IEC 60063); E48 2 %, E192 0.5 % (from memory)")
    void tolerancePerSeries() {
        assertEquals(20.0, ESeries.E6.tolerancePercent());
        assertEquals(10.0, ESeries.E12.tolerancePercent());
        assertEquals(5.0, ESeries.E24.tolerancePercent());
        assertEquals(2.0, ESeries.E48.tolerancePercent());
        assertEquals(1.0, ESeries.E96.tolerancePercent());
        assertEquals(0.5, ESeries.E192.tolerancePercent());
        assertNotEquals(ESeries.E6.valuesPerDecade(), ESeries.E12.valuesPerDecade());
    }
}
