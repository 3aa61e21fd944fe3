package halfrail.ui;

import halfrail.check.Ladder;
import halfrail.check.LadderLevel;
import halfrail.check.Side;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.OptionalDouble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Layout and hit-testing of the ladder, without any toolkit. Ladders here are invented values. */
class LadderGeometryTest {
    static final double W = 300;
    static final double H = 600;

    /** An invented 9 V ladder: window 1–8 V, inputs 0–7.5 V, rest 4.5 V, ±2 V of signal, 30 mV of leakage shift. */
    static Ladder healthy() {
        return new Ladder("boost", "stages[0]", 9, 6, 1, 8, 5, 0, 7.5, 4.5, 4.5, 2.5, 6.5,
                OptionalDouble.empty(), OptionalDouble.empty(), 0.03);
    }

    static LadderGeometry layout(Ladder l) {
        return new LadderGeometry(l, W, H, 10, 6);
    }

    @Test
    void groundSitsAtTheBottomOfTheScaleAndTheScaleTopAtItsTop() {
        LadderGeometry g = layout(healthy());
        assertEquals(g.plotBottom(), g.y(0), 1e-9);
        assertEquals(g.plotTop(), g.y(10), 1e-9);
        // linear scale (common practice for a voltage axis): half the voltage, half the height
        assertEquals((g.plotTop() + g.plotBottom()) / 2, g.y(5), 1e-9);
        assertEquals(3.3, g.volts(g.y(3.3)), 1e-9);
    }

    @Test
    void higherVoltagesAreDrawnHigherUp() {
        LadderGeometry g = layout(healthy());
        assertTrue(g.y(8) < g.y(4.5));
        assertTrue(g.mark(LadderLevel.SUPPLY).orElseThrow().y() < g.mark(LadderLevel.SWING_HIGH).orElseThrow().y());
    }

    @Test
    void forbiddenBandsRunFromEachRailToTheSwingLimits() {
        LadderGeometry g = layout(healthy());
        assertEquals(g.y(9), g.forbiddenOutputHigh().top(), 1e-9);
        assertEquals(g.y(8), g.forbiddenOutputHigh().bottom(), 1e-9);
        assertEquals(g.y(1), g.forbiddenOutputLow().top(), 1e-9);
        assertEquals(g.y(0), g.forbiddenOutputLow().bottom(), 1e-9);
        // inputs reach ground here, so the low input band is empty; the high one covers 7.5–9 V
        assertEquals(0, g.forbiddenInputLow().height(), 1e-9);
        assertEquals(g.y(7.5), g.forbiddenInputHigh().bottom(), 1e-9);
    }

    @Test
    void labelsNeverOverlapEvenWhenLevelsCoincide() {
        // mid-rail and the rest point coincide, and the leakage shift is a few mV: their labels must still separate
        LadderGeometry g = layout(healthy());
        List<LadderGeometry.Mark> marks = g.marks();
        marks.sort(java.util.Comparator.comparingDouble(LadderGeometry.Mark::labelY));
        for (int i = 1; i < marks.size(); i++) {
            assertTrue(marks.get(i).labelY() - marks.get(i - 1).labelY() >= LadderGeometry.LABEL_HEIGHT - 1e-9,
                    () -> "overlap in " + marks);
        }
    }

    @Test
    void labelsStayOnTheirLevelsWhenThereIsRoom() {
        LadderGeometry g = layout(healthy());
        LadderGeometry.Mark supply = g.mark(LadderLevel.SUPPLY).orElseThrow();
        assertEquals(supply.y(), supply.labelY(), 1e-9);
    }

    @Test
    void pointingAtTheRestPointOnTheOutputShaftHitsTheQuiescentLevel() {
        LadderGeometry g = layout(healthy());
        double x = g.output().centre();
        // the rest point and mid-rail coincide; the rest point is drawn on top, so it is what the user points at
        assertEquals(LadderLevel.QUIESCENT, g.hit(x, g.y(4.5) + 1).orElseThrow());
        assertEquals(LadderLevel.SWING_HIGH, g.hit(x, g.y(8) - 2).orElseThrow());
        assertEquals(LadderLevel.SIGNAL_ENVELOPE, g.hit(x, g.y(5.5)).orElseThrow());
    }

    @Test
    void commonModeLimitsAreHitOnTheInputsShaftOnly() {
        LadderGeometry g = layout(healthy());
        assertEquals(LadderLevel.COMMON_MODE_HIGH, g.hit(g.inputs().centre(), g.y(7.5)).orElseThrow());
        assertFalse(g.hit(g.output().centre(), g.y(7.5) - 0.5 * (g.y(7.5) - g.y(8)) + 3)
                .filter(l -> l == LadderLevel.COMMON_MODE_HIGH).isPresent());
    }

    @Test
    void pointingAtALabelHitsItsLevel() {
        LadderGeometry g = layout(healthy());
        LadderGeometry.Mark m = g.mark(LadderLevel.END_POINT_SUPPLY).orElseThrow();
        assertEquals(LadderLevel.END_POINT_SUPPLY, g.hit(g.labelX() + 20, m.labelY()).orElseThrow());
    }

    @Test
    void emptySpaceHitsNothing() {
        LadderGeometry g = layout(healthy());
        assertTrue(g.hit(2, g.y(3)).isEmpty());
        assertTrue(g.hit(g.output().centre(), g.y(2)).isEmpty());
    }

    @Test
    void aHealthyLadderDoesNotClip() {
        LadderGeometry g = layout(healthy());
        assertTrue(g.clipSide().isEmpty());
        assertTrue(g.clippedHigh().isEmpty());
        assertTrue(g.clippedLow().isEmpty());
    }

    @Test
    void anEnvelopePastTheTopOfTheWindowClipsOnTheHighSide() {
        Ladder l = new Ladder("hot", "stages[0]", 9, 6, 1, 8, 5, 0, 7.5, 4.5, 6, 3, 9,
                OptionalDouble.empty(), OptionalDouble.empty(), 0);
        LadderGeometry g = layout(l);
        assertEquals(Side.HIGH, g.clipSide().orElseThrow());
        LadderGeometry.Span s = g.clippedHigh().orElseThrow();
        assertEquals(g.y(8), s.bottom(), 1e-9);
        assertEquals(g.y(9), s.top(), 1e-9);
        assertTrue(g.clippedLow().isEmpty());
        // an excursion far past the rail is cut off just outside it
        Ladder wild = new Ladder("wild", "stages[0]", 9, 6, 1, 8, 5, 0, 7.5, 4.5, 6, -20, 40,
                OptionalDouble.empty(), OptionalDouble.empty(), 0);
        LadderGeometry w = layout(wild);
        assertEquals(w.y(9) - LadderGeometry.OVERSHOOT, w.envelope().top(), 1e-9);
    }

    @Test
    void anEnvelopeBelowTheFloorClipsOnTheLowSideAndIsCutOffJustBelowGround() {
        Ladder l = new Ladder("cold", "stages[0]", 9, 6, 1, 8, 5, 0, 7.5, 4.5, 1.5, -2, 5,
                OptionalDouble.empty(), OptionalDouble.empty(), 0);
        LadderGeometry g = layout(l);
        assertEquals(Side.LOW, g.clipSide().orElseThrow());
        assertEquals(g.y(0) + LadderGeometry.OVERSHOOT, g.envelope().bottom(), 1e-9);
    }

    @Test
    void theToleranceSpreadIsShownOnlyWhenAnalysed() {
        assertTrue(layout(healthy()).spread().isEmpty());
        LadderGeometry g = layout(healthy().withSpread(4.2, 4.9));
        LadderGeometry.Span s = g.spread().orElseThrow();
        assertEquals(g.y(4.9), s.top(), 1e-9);
        assertEquals(g.y(4.2), s.bottom(), 1e-9);
        assertEquals(LadderLevel.TOLERANCE_SPREAD, g.hit(g.spreadX(), g.y(4.3)).orElseThrow());
    }

    @Test
    void theLeakageShiftMovesTheRestPointBySignedVolts() {
        Ladder l = new Ladder("leaky", "stages[0]", 9, 6, 1, 8, 5, 0, 7.5, 4.5, 4.5, 3.5, 5.5,
                OptionalDouble.empty(), OptionalDouble.empty(), -0.9);
        LadderGeometry g = layout(l);
        assertEquals(g.y(3.6), g.shiftedQuiescentY(), 1e-9);
        assertTrue(g.mark(LadderLevel.LEAKAGE_SHIFT).orElseThrow().label().startsWith("leak −"));
    }

    @Test
    void tickStepsAreOneTwoOrFiveTimesAPowerOfTen() {
        assertEquals(2, LadderGeometry.tickStep(10), 1e-12);
        assertEquals(0.5, LadderGeometry.tickStep(3.6), 1e-12);
        assertEquals(5, LadderGeometry.tickStep(25), 1e-12);
        assertEquals(1, LadderGeometry.tickStep(5.5), 1e-12);
        LadderGeometry g = layout(healthy());
        assertEquals(0, g.ticks().get(0).volts(), 1e-12);
        assertEquals(10, g.ticks().get(g.ticks().size() - 1).volts(), 1e-9);
    }

    @Test
    void aStuckOutputRestsOnTheSideOfItsRail() {
        Ladder l = new Ladder("stuck", "stages[0]", 9, 6, 1, 8, 5, 0, 7.5, 4.5, 7.99, 7.99, 7.99,
                OptionalDouble.empty(), OptionalDouble.empty(), 0);
        assertEquals(Side.HIGH, layout(l).restSide());
    }
}
