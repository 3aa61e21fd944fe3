package halfrail.units;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Looking up standard values; the expected values are read off the IEC 60063 tables. */
class ESeriesLookupTest {

    @Test
    @DisplayName("4.8 kΩ in E24: nearest 4.7 k, next higher 5.1 k, next lower 4.7 k (IEC 60063 E24 table)")
    void e24AroundFourPointEightKilohms() {
        assertEquals(4700.0, ESeries.E24.nearest(4800));
        assertEquals(5100.0, ESeries.E24.nextHigher(4800));
        assertEquals(4700.0, ESeries.E24.nextLower(4800));
    }

    @Test
    @DisplayName("999 Ω in E12: next higher 1 k, next lower 820 (IEC 60063 E12 table)")
    void e12JustBelowADecade() {
        assertEquals(1000.0, ESeries.E12.nextHigher(999));
        assertEquals(820.0, ESeries.E12.nextLower(999));
        assertEquals(1000.0, ESeries.E12.nearest(999));
    }

    @Test
    @DisplayName("a standard value is its own nearest, next higher and next lower (IEC 60063 tables)")
    void aStandardValueMapsToItself() {
        assertEquals(1000.0, ESeries.E12.nextHigher(1000));
        assertEquals(1000.0, ESeries.E12.nextLower(1000));
        assertEquals(4.7e-9, ESeries.E6.nearest(4.7e-9));
        assertEquals(4.7e-9, ESeries.E6.nextHigher(4.7e-9));
        assertEquals(4.99e3, ESeries.E96.nextLower(4.99e3));
    }

    @Test
    @DisplayName("values below 1 and above 1e9 (IEC 60063 tables, every decade)")
    void worksInEveryDecade() {
        assertEquals(0.47, ESeries.E24.nearest(0.48));
        assertEquals(0.1, ESeries.E12.nextHigher(0.0999));
        assertEquals(4.87e-9, ESeries.E96.nextHigher(4.8e-9));
        assertEquals(4.75e-12, ESeries.E96.nextLower(4.8e-12));
        assertEquals(5.1e9, ESeries.E24.nextHigher(4.8e9));
        assertEquals(1e13, ESeries.E6.nextHigher(7e12));
        assertEquals(6.8e12, ESeries.E6.nextLower(9.99e12));
        assertEquals(9.2e-100, ESeries.E192.nearest(9.2e-100));
        assertEquals(1e300, ESeries.E6.nextHigher(9e299));
    }

    @Test
    @DisplayName("nearest is by ratio: E6 1.23 goes to 1.5 as 1.5/1.23 < 1.23/1.0; 1.22 goes to 1.0 (geometric mean √1.5 = 1.2247)")
    void nearestIsByRatioNotDifference() {
        assertEquals(1.5, ESeries.E6.nearest(1.23));
        assertEquals(1.0, ESeries.E6.nearest(1.22));
        assertEquals(1.5e3, ESeries.E6.nearest(1.23e3));
        // √(4.7·5.1) k = 4.8959 k: 4.896 k lies just above it and goes to 5.1 k, 4.895 k just below
        assertEquals(5100.0, ESeries.E24.nearest(4896));
        assertEquals(4700.0, ESeries.E24.nearest(4895));
    }

    @Test
    @DisplayName("contains allows only rounding noise (relative 1e-9)")
    void containsAllowsOnlyRoundingNoise() {
        assertTrue(ESeries.E24.contains(4700));
        assertTrue(ESeries.E24.contains(0.47 * 1e4));
        assertTrue(ESeries.E24.contains(4700 * (1 + 1e-12)));
        assertFalse(ESeries.E24.contains(4701));
        assertFalse(ESeries.E24.contains(4800));
        assertTrue(ESeries.E12.contains(1.8e-6));
        assertFalse(ESeries.E12.contains(2.0e-6));
        assertTrue(ESeries.E24.contains(2.0e-6));
    }

    @Test
    @DisplayName("values in a range, ascending (IEC 60063 E6 and E12 tables)")
    void listsValuesInARange() {
        assertEquals(List.of(1000.0, 1500.0, 2200.0, 3300.0, 4700.0, 6800.0, 10000.0), ESeries.E6.values(1000, 10000));
        assertEquals(List.of(1.0, 1.2), ESeries.E12.values(0.9, 1.3));
        assertEquals(List.of(), ESeries.E12.values(5000, 5000));
        assertEquals(List.of(4700.0), ESeries.E12.values(4700, 4700));
        assertEquals(List.of(0.68, 1.0, 1.5), ESeries.E6.values(0.5, 1.5));
        assertEquals(6 * 4 + 1, ESeries.E6.values(1e-9, 1e-5).size());
    }

    @ParameterizedTest
    @ValueSource(doubles = {0.0, -1.0, -0.0, Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, 1e-301, 1e301})
    void refusesBadArguments(double bad) {
        for (ESeries s : ESeries.values()) {
            IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> s.nearest(bad));
            assertTrue(e.getMessage().startsWith("x "), e.getMessage());
            assertThrows(IllegalArgumentException.class, () -> s.nextHigher(bad));
            assertThrows(IllegalArgumentException.class, () -> s.nextLower(bad));
            assertThrows(IllegalArgumentException.class, () -> s.contains(bad));
            assertThrows(IllegalArgumentException.class, () -> s.values(bad, 1.0));
        }
    }

    @Test
    void refusesAnInvertedRange() {
        assertThrows(IllegalArgumentException.class, () -> ESeries.E12.values(10, 1));
    }
}
