package halfrail.io.report;

import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Axis mapping and ticks; expected values worked by hand (1-2-5 steps and decades: common practice). */
class AxisTest {
    @Test
    void aLinearAxisMapsItsEndsToItsPixelEnds() {
        Axis a = Axis.linear(0, 9, 400, 40);
        assertEquals(400, a.toPixel(0), 1e-12);
        assertEquals(40, a.toPixel(9), 1e-12);
        assertEquals(220, a.toPixel(4.5), 1e-12);
        assertEquals(4.5, a.toValue(220), 1e-12);
    }

    @Test
    void aLogAxisGivesEqualRatiosEqualLengths() {
        Axis a = Axis.log(1, 1000, 0, 300);
        assertEquals(100, a.toPixel(10), 1e-9);
        assertEquals(200, a.toPixel(100), 1e-9);
        assertEquals(10, a.toValue(100), 1e-9);
    }

    @Test
    void linearTicksStepByOneTwoOrFiveTimesAPowerOfTen() {
        assertEquals(List.of(0.0, 1.0, 2.0, 3.0, 4.0, 5.0, 6.0, 7.0, 8.0, 9.0), Axis.linear(0, 9, 0, 1).ticks(10));
        assertEquals(List.of(0.0, 2.0, 4.0, 6.0, 8.0), Axis.linear(0, 9, 0, 1).ticks(6));
        List<Double> t = Axis.linear(0, 2.7, 0, 1).ticks(8);
        assertEquals(List.of(0.0, 0.5, 1.0, 1.5, 2.0, 2.5), t);
        assertEquals(0.2, Axis.niceStep(0.15), 1e-15);
        assertEquals(5, Axis.niceStep(3), 1e-15);
        assertEquals(10, Axis.niceStep(7), 1e-15);
    }

    @Test
    void logTicksAreThePowersOfTenInside() {
        List<Double> t = Axis.log(0.5, 1.5e4, 0, 1).ticks(12);
        assertEquals(5, t.size());
        assertEquals(1, t.get(0), 1e-12);
        assertEquals(1e4, t.get(4), 1e-9);
    }

    @Test
    void anEmptyOrNonPositiveRangeIsRefused() {
        assertThrows(IllegalArgumentException.class, () -> Axis.linear(1, 1, 0, 1));
        assertThrows(IllegalArgumentException.class, () -> Axis.log(0, 10, 0, 1));
        assertTrue(Axis.linear(-3, 3, 0, 1).ticks(7).contains(0.0));
    }
}
