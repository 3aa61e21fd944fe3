package halfrail.check;

import halfrail.design.Design;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class DesignVerdictTest {
    @Test
    void healthyNineVoltStageHasNoFailingFindingAndRestsAtMidRail() {
        DesignReport r = DesignAnalysis.analyse(TestDesigns.healthyNineVolt());
        assertTrue(r.failure().isEmpty(), r.failureMessage());
        assertFalse(r.has(Severity.FAIL), () -> "unexpected: " + r.findings());
        StageReport s = r.stages().get(0);
        // 150k/100k divider on the nominal 9 V block: 9 V × 100/250 = 3.6 V; bias gain 1 (blocking capacitor in the leg).
        assertEquals(3.6, s.outputVolts(), 0.05);
        assertEquals(1.0, s.biasGain(), 1e-3);
        // Signal gain 1 + R2/R1 = 11 (any op-amp text).
        assertEquals(11.0, s.stageGain(), 0.05);
    }

    @Test
    void removingTheBlockingCapacitorAmplifiesTheBiasIntoTheRail() {
        Design d = TestDesigns.healthyNineVolt();
        Design broken = d.withStage(0, d.stages().get(0).withLegCapacitor(null));
        DesignReport r = DesignAnalysis.analyse(broken);
        assertFalse(r.findings(BiasAmplified.CODE).isEmpty(), () -> r.findings().toString());
        assertFalse(r.findings(RestsOnRail.CODE).isEmpty(), () -> r.findings().toString());
        // Bias gain 1 + R2/R1 = 11 computed with the op-amp taken as linear.
        assertEquals(11.0, r.stages().get(0).biasGain(), 0.01);
        assertTrue(r.stages().get(0).nominal().saturated());
    }

    @Test
    void anInputBehindACouplingCapacitorWithNoBiasPathIsReportedByNodeNotSolved() {
        Design d = TestDesigns.healthyNineVolt();
        Design broken = d.withStage(0, d.stages().get(0).withBiased(false));
        DesignReport r = DesignAnalysis.analyse(broken);
        assertEquals(java.util.List.of("s1.p"), r.floatingNodes());
        assertEquals(java.util.Optional.of(halfrail.solve.AnalysisException.Kind.FLOATING_NODE), r.failure());
        Finding f = r.findings(NoDcPath.CODE).get(0);
        assertEquals(Severity.FAIL, f.severity());
        assertEquals(java.util.Optional.of("boost"), f.opAmp());
        assertTrue(f.parts().contains("stages[0].inputCapacitor"), f.parts().toString());
        assertTrue(r.stages().isEmpty(), "no numbers are shown for a circuit that cannot be solved");
    }

    @Test
    void theHealthyLadderIsOrderedFromGroundToTheSupplyAndDoesNotClip() {
        DesignReport r = DesignAnalysis.analyse(TestDesigns.healthyNineVolt(), false);
        Ladder l = r.ladders().get(0);
        StageReport s = r.stages().get(0);
        assertEquals("boost", l.opAmp());
        assertEquals(9.0, l.supplyVolts(), 1e-12);
        // 9 V block end-point: 6 × 0.9 V (IEC 60086-2 via secondary sources).
        assertEquals(5.4, l.endPointSupplyVolts(), 1e-12);
        double[] upwards = {0, l.swingLowVolts(), l.envelopeLowVolts(), l.quiescentVolts(), l.envelopeHighVolts(),
                l.swingHighVolts(), l.supplyVolts()};
        for (int i = 1; i < upwards.length; i++) {
            assertTrue(upwards[i] > upwards[i - 1], () -> java.util.Arrays.toString(upwards));
        }
        assertTrue(l.endPointSwingHighVolts() < l.swingHighVolts());
        assertEquals(r.nodeVolts().get("ref"), l.midRailVolts(), 1e-12);
        assertEquals(s.nominal().signalPeakVolts(), l.envelopeHighVolts() - l.quiescentVolts(), 1e-12);
        assertEquals(s.leakageDriftVolts(), l.leakageShiftVolts(), 1e-12);
        assertFalse(l.clips());
        assertTrue(l.spreadLowVolts().isEmpty(), "filled only by a tolerance analysis");
    }

    @Test
    void aClippingStagesLadderShowsTheEnvelopeBeyondTheWindow() {
        Design d = TestDesigns.healthyNineVolt().withSource(new halfrail.design.SignalSource(0.5,
                halfrail.design.AmplitudeUnit.VOLTS_PEAK, 1e3, 20, 20e3));
        DesignReport r = DesignAnalysis.analyse(d, false);
        Ladder l = r.ladders().get(0);
        assertTrue(l.clips());
        assertTrue(l.envelopeHighVolts() > l.swingHighVolts());
        assertEquals(l.clips(), r.stages().get(0).nominal().clips());
    }
}
