package halfrail.io.report;

import halfrail.check.Ladder;
import halfrail.check.LadderLevel;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.OptionalDouble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Where the ladder levels land. Expected rows are worked by hand from the linear map
 * y = bottom − (v − vLow)·(bottom − top)/(vHigh − vLow) (common practice for a plot scale).
 */
class LadderGeometryTest {
    static final double TOP = 64;
    static final double BOTTOM = 420;

    /** A 10 V rail: output 0.2–8.5 V, inputs 0–8 V, rest 5 V, ±2 V of signal; invented values. */
    static Ladder tenVolt(double envelopeLow, double envelopeHigh) {
        return new Ladder("pre", "stages[0]", 10, 7, 0.2, 8.5, 5.5, 0, 8, 5, 5, envelopeLow, envelopeHigh,
                OptionalDouble.empty(), OptionalDouble.empty(), 0.5);
    }

    @Test
    void groundSitsOnTheBottomRowAndTheSupplyOnTheTopRow() {
        LadderGeometry g = new LadderGeometry(List.of(tenVolt(3, 7)), TOP, BOTTOM);
        assertEquals(BOTTOM, g.y(0), 1e-9);
        assertEquals(TOP, g.y(10), 1e-9);
    }

    @Test
    void everyLevelLandsAtItsHandWorkedRow() {
        Ladder l = tenVolt(3, 7);
        LadderGeometry g = new LadderGeometry(List.of(l), TOP, BOTTOM);
        // 35.6 px per volt: (420 − 64) / 10 V
        assertEquals(420 - 35.6 * 5, g.mark(l, LadderLevel.QUIESCENT).orElseThrow().y(), 1e-9);
        assertEquals(420 - 35.6 * 8.5, g.mark(l, LadderLevel.SWING_HIGH).orElseThrow().y(), 1e-9);
        assertEquals(420 - 35.6 * 0.2, g.mark(l, LadderLevel.SWING_LOW).orElseThrow().y(), 1e-9);
        assertEquals(420 - 35.6 * 7, g.mark(l, LadderLevel.END_POINT_SUPPLY).orElseThrow().y(), 1e-9);
        assertEquals(420 - 35.6 * 8, g.mark(l, LadderLevel.COMMON_MODE_HIGH).orElseThrow().y(), 1e-9);
        double[] env = g.envelope(l);
        assertEquals(420 - 35.6 * 7, env[0], 1e-9);
        assertEquals(420 - 35.6 * 3, env[1], 1e-9);
        double[] leak = g.leakageShift(l);
        assertEquals(420 - 35.6 * 5, leak[0], 1e-9);
        assertEquals(420 - 35.6 * 5.5, leak[1], 1e-9);
    }

    @Test
    void aSignalBeyondTheRailsWidensTheScaleSoTheClippedPartShows() {
        Ladder l = tenVolt(-1, 11.5);
        LadderGeometry g = new LadderGeometry(List.of(l), TOP, BOTTOM);
        assertEquals(BOTTOM, g.y(-1), 1e-9);
        assertEquals(TOP, g.y(11.5), 1e-9);
        assertTrue(g.y(0) < BOTTOM && g.y(10) > TOP, "ground and supply move inwards");
    }

    @Test
    void aSpreadIsPlacedOnlyWhenTheLadderHasOne() {
        Ladder l = tenVolt(3, 7);
        LadderGeometry g = new LadderGeometry(List.of(l), TOP, BOTTOM);
        assertTrue(g.spread(l).isEmpty());
        double[] s = g.spread(l.withSpread(4.5, 5.5)).orElseThrow();
        assertEquals(420 - 35.6 * 5.5, s[0], 1e-9);
        assertEquals(420 - 35.6 * 4.5, s[1], 1e-9);
    }

    @Test
    void noLadderIsRefused() {
        assertThrows(IllegalArgumentException.class, () -> new LadderGeometry(List.of(), TOP, BOTTOM));
    }
}
