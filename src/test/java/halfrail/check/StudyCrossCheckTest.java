package halfrail.check;

import halfrail.design.Design;
import halfrail.design.UsbPort;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The studies against each other and against the design report (engine consistency). */
class StudyCrossCheckTest {
    @Test
    void everyMonteCarloBuildLiesWithinTheWorstCaseExtremes() {
        // Extreme-value corners bound every build drawn from inside the tolerance box when the rest
        // point is monotonic in each part (common practice for EVA; true for divider and bias networks).
        Design d = TestDesigns.healthyNineVolt();
        WorstCaseResult wc = WorstCase.run(d, ToleranceOptions.defaults());
        MonteCarloResult mc = MonteCarlo.run(d, ToleranceOptions.defaults(), MonteCarloOptions.defaults().withBuilds(1000));
        assertEquals(0, mc.failedToConverge());
        for (StageWorstCase w : wc.opAmps()) {
            StageDistribution s = mc.opAmp(w.label()).orElseThrow();
            double slack = 1e-6;
            assertTrue(s.minQuiescentVolts() >= w.minQuiescentVolts() - slack, () -> s + " vs " + w);
            assertTrue(s.maxQuiescentVolts() <= w.maxQuiescentVolts() + slack, () -> s + " vs " + w);
            assertTrue(w.minQuiescentVolts() < w.nominalQuiescentVolts() && w.nominalQuiescentVolts() < w.maxQuiescentVolts());
        }
    }

    @Test
    void theSweepAtTheNominalSupplyReproducesTheDesignReport() {
        Design d = TestDesigns.healthyNineVolt();
        DesignReport report = DesignAnalysis.analyse(d, false);
        double nominal = d.supply().nominalVolts();
        SupplySweepResult r = SupplySweep.run(d, SupplySweepOptions.defaults().withRange(nominal, d.supply().highVolts())
                .withPoints(2));
        StageReport s = report.stage("boost").orElseThrow();
        StageSupplySweep sw = r.opAmp("boost").orElseThrow();
        assertEquals(s.outputVolts(), sw.quiescentVolts()[0], 1e-9);
        assertEquals(s.nominal().headroomDb().orElseThrow(), sw.headroomDb()[0], 1e-9);
        assertEquals(s.nominal().swingHighVolts(), sw.swingHighVolts()[0], 1e-9);
    }

    @Test
    void aUsbPortIsSweptOverItsAllowedRange() {
        // USB 2.0: 4.75–5.25 V at the port, about 4.4 V at a low-power device (UsbPort's sources).
        Design d = StudyDesigns.gainOfEleven(new UsbPort(0, 0), 0.1);
        SupplySweepResult r = SupplySweep.run(d);
        double[] v = r.supplyVolts();
        assertEquals(SupplySweepOptions.DEFAULT_POINTS, v.length);
        assertEquals(UsbPort.LOW_VOLTS, v[0], 1e-12);
        assertEquals(UsbPort.HIGH_VOLTS, v[v.length - 1], 1e-12);
        for (int i = 1; i < v.length; i++) {
            assertTrue(v[i] > v[i - 1]);
        }
    }
}
