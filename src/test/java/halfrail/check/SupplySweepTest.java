package halfrail.check;

import halfrail.design.Design;
import halfrail.design.FixedRail;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class SupplySweepTest {
    /** Headroom asked for by the default thresholds, dB. */
    private static final double MARGIN_DB = 3.0;

    @Test
    void lowestPassingSupplyOfAGainOfElevenStageMatchesTheHandCalculation() {
        // Hand calculation (definition of headroom in the design brief): the stage rests at V/2
        // and swings to within s = 0.1 V of each rail; at 0.15 V peak in, G = 11 gives 1.65 V peak
        // out. It passes while V/2 − s ≥ 1.65 · 10^(3/20), so V_min = 2·(0.1 + 1.65·1.41254) = 4.8614 V.
        double vp = 0.15;
        double expected = 2 * (StudyDesigns.SWING_VOLTS + vp * 11 * Math.pow(10, MARGIN_DB / 20));
        Design d = StudyDesigns.gainOfEleven(StudyDesigns.fourAa(), vp);
        SupplySweepResult r = SupplySweep.run(d);
        StageSupplySweep amp = r.opAmp("amp").orElseThrow();
        LowestPassingSupply lowest = amp.lowest();
        assertEquals(LowestPassingSupply.Verdict.FAILS_BELOW, lowest.verdict());
        assertEquals(expected, lowest.volts().getAsDouble(), 0.005);
        // Where that falls in the discharge: 4.8614 V / 4 cells = 1.2154 V per cell, between the
        // curve points (0.5, 1.24 V) and (0.6, 1.19 V) of the alkaline curve in cell-chemistries.json:
        // used = 0.5 + 0.1·(1.24 − 1.2154)/0.05 = 0.5493, so 45.1 % left (linear interpolation by hand).
        double perCell = expected / 4;
        double used = 0.5 + 0.1 * (1.24 - perCell) / (1.24 - 1.19);
        assertEquals(100 * (1 - used), lowest.capacityLeftPercent().getAsDouble(), 0.2);
    }

    @Test
    void theRestPointFollowsHalfTheSupplyAndTheWindowFollowsTheRails() {
        // Equal divider: rest point V/2; window [s, V − s] (definition of the op-amp model).
        Design d = StudyDesigns.gainOfEleven(StudyDesigns.fourAa(), 0.15);
        SupplySweepResult r = SupplySweep.run(d, SupplySweepOptions.defaults().withPoints(7));
        double[] v = r.supplyVolts();
        assertEquals(7, v.length);
        assertEquals(3.6, v[0], 1e-12);
        assertEquals(6.4, v[6], 1e-12);
        StageSupplySweep amp = r.opAmp("amp").orElseThrow();
        for (int i = 0; i < v.length; i++) {
            assertEquals(v[i] / 2, amp.quiescentVolts()[i], 1e-3 * v[i]);
            assertEquals(v[i] - StudyDesigns.SWING_VOLTS, amp.swingHighVolts()[i], 1e-3);
            assertEquals(StudyDesigns.SWING_VOLTS, amp.swingLowVolts()[i], 1e-3);
            assertEquals(amp.quiescentVolts()[i] - amp.swingLowVolts()[i], amp.availableLowVolts()[i], 1e-12);
        }
        // Fresh cells: all capacity left; end-point: none (ends of the discharge curve).
        double[] left = r.capacityLeftPercent().orElseThrow();
        assertEquals(0, left[0], 1e-9);
        assertEquals(100, left[6], 1e-9);
    }

    @Test
    void aStageThatFitsEverywherePassesThroughoutAndOneThatNeverFitsFailsAtTheTop() {
        Design small = StudyDesigns.gainOfEleven(StudyDesigns.fourAa(), 0.01);
        assertEquals(LowestPassingSupply.Verdict.PASSES_THROUGHOUT,
                SupplySweep.run(small).opAmp("amp").orElseThrow().lowest().verdict());
        // 0.5 V peak · 11 = 5.5 V peak cannot fit in any window below 11 V.
        Design large = StudyDesigns.gainOfEleven(StudyDesigns.fourAa(), 0.5);
        StageSupplySweep amp = SupplySweep.run(large).opAmp("amp").orElseThrow();
        assertEquals(LowestPassingSupply.Verdict.FAILS_AT_TOP, amp.lowest().verdict());
        assertTrue(amp.lowest().volts().isEmpty());
        assertFalse(amp.passes()[amp.passes().length - 1]);
    }

    @Test
    void aFixedRailIsSweptOverItsToleranceAndHasNoDischargeFigure() {
        Design d = StudyDesigns.gainOfEleven(new FixedRail(5, 0.1, 0, 0, 0), 0.05);
        SupplySweepResult r = SupplySweep.run(d, SupplySweepOptions.defaults().withPoints(3));
        assertArrayEquals(new double[] {4.5, 5.0, 5.5}, r.supplyVolts(), 1e-12);
        assertTrue(r.capacityLeftPercent().isEmpty());
        assertTrue(r.opAmps().get(0).lowest().capacityLeftPercent().isEmpty());
    }

    @Test
    void resultArraysAreCopies() {
        SupplySweepResult r = SupplySweep.run(StudyDesigns.gainOfEleven(StudyDesigns.fourAa(), 0.1),
                SupplySweepOptions.defaults().withPoints(3));
        r.supplyVolts()[0] = -1;
        r.opAmps().get(0).quiescentVolts()[0] = -1;
        assertEquals(3.6, r.supplyVolts()[0], 1e-12);
        assertTrue(r.opAmps().get(0).quiescentVolts()[0] > 0);
    }

    @Test
    void aRangeOutsideTheSupplyOrTooFewPointsIsRejectedNamingTheField() {
        Design d = StudyDesigns.gainOfEleven(StudyDesigns.fourAa(), 0.1);
        StudyOptionsException low = assertThrows(StudyOptionsException.class,
                () -> SupplySweep.run(d, SupplySweepOptions.defaults().withRange(3.0, 6.0)));
        assertEquals("sweep.fromVolts", low.field());
        StudyOptionsException high = assertThrows(StudyOptionsException.class,
                () -> SupplySweep.run(d, SupplySweepOptions.defaults().withRange(4.0, 7.0)));
        assertEquals("sweep.toVolts", high.field());
        assertEquals("sweep.points", assertThrows(StudyOptionsException.class,
                () -> SupplySweepOptions.defaults().withPoints(1)).field());
        assertEquals("sweep.toVolts", assertThrows(StudyOptionsException.class,
                () -> SupplySweepOptions.defaults().withRange(5.0, 4.0)).field());
    }
}
