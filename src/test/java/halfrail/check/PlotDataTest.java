package halfrail.check;

import halfrail.design.Design;
import halfrail.design.DesignCircuits;
import halfrail.design.Stage;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

import java.util.Arrays;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The plot data the reports and the app draw: the power-on trace and the response curves. */
class PlotDataTest {
    private static Design design;
    private static DesignReport report;

    @BeforeAll
    static void analyse() {
        design = TestDesigns.healthyNineVolt();
        report = DesignAnalysis.analyse(design);
    }

    @Test
    void aSettledTraceEndsAtTheDcOperatingPoint() {
        // common practice: once every capacitor has charged, the transient sits at the DC solution
        PowerOnReport p = report.powerOn().orElseThrow();
        assertTrue(p.settled());
        PowerOnTrace t = p.trace().orElseThrow();
        double[] load = t.loadVolts();
        String loadNode = DesignCircuits.nominal(design).loadNode();
        assertEquals(report.nodeVolts().get(loadNode), load[load.length - 1], p.bandVolts());
        double[] out = t.outputVolts("boost");
        assertEquals(report.stage("boost").orElseThrow().outputVolts(), out[out.length - 1], p.bandVolts());
        // 1 µV: the samples are interpolated between accepted steps (quadratic through three points)
        assertEquals(0, load[0], 1e-6, "every capacitor empty and the supply at 0 V at switch-on");
    }

    @Test
    void theTraceIsDownsampledOverTheWholeRunInRisingTime() {
        PowerOnReport p = report.powerOn().orElseThrow();
        double[] t = p.trace().orElseThrow().timesSeconds();
        assertTrue(t.length >= 2 && t.length <= PowerOnTrace.MAX_SAMPLES);
        assertEquals(0, t[0]);
        assertEquals(p.simulatedSeconds(), t[t.length - 1], 1e-12);
        for (int i = 1; i < t.length; i++) {
            assertTrue(t[i] > t[i - 1]);
        }
    }

    @Test
    void theLoadCurveAgreesWithTheChainsPeakAndLowerCorner() {
        // the chain's peak and corner are searched on the complex response; the curve samples the same response
        ChainReport c = report.chain().orElseThrow();
        ResponseCurve load = c.loadResponse().orElseThrow();
        double peakDb = Arrays.stream(load.gainDb()).max().orElseThrow();
        assertEquals(20 * Math.log10(c.peakGain()), peakDb, 0.1);
        assertEquals(c.lowerCornerHz().getAsDouble(), load.lowerCornerHz().getAsDouble(),
                1e-3 * c.lowerCornerHz().getAsDouble());
        double[] hz = load.frequenciesHz();
        assertTrue(hz[0] <= c.bandLowHz() / 10 && hz[hz.length - 1] >= c.bandHighHz() * 10, "beyond the band");
        assertEquals(List.of("boost", ResponseCurve.LOAD_LABEL), c.responses().stream().map(ResponseCurve::label).toList());
    }

    @Test
    void aStageNamedLoadKeepsItsOwnTraceAndCurve() {
        Stage s = design.stages().get(0);
        Design named = design.withStage(0, new Stage("load", s.kind(), s.opAmp(), s.feedbackOhms(), s.legOhms(),
                s.legCapacitor(), s.inputCapacitor(), s.biased()));
        DesignReport r = DesignAnalysis.analyse(named);
        PowerOnTrace t = r.powerOn().orElseThrow().trace().orElseThrow();
        assertEquals(List.of("load"), t.labels());
        assertFalse(Arrays.equals(t.outputVolts("load"), t.loadVolts()), "the stage's output is not the load");
        ChainReport c = r.chain().orElseThrow();
        assertFalse(c.response("load").orElseThrow().atLoad());
        assertTrue(c.loadResponse().orElseThrow().atLoad());
    }
}
