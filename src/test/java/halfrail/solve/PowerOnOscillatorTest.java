package halfrail.solve;

import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.VoltageSource;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Power-on of an op-amp astable multivibrator (a comparator with positive feedback through a
 * divider and an RC on its inverting input), which never settles: the run recognises the
 * oscillation and stops on it. Its period has the closed form T = 2RC·ln((1 + β)/(1 − β)) for an
 * output that swings symmetrically about the reference, β being the positive-feedback divider
 * ratio (Sedra and Smith, Microelectronic Circuits, the op-amp astable multivibrator; section
 * number from memory not given).
 */
class PowerOnOscillatorTest {
    static final double VCC = 9;
    static final double R = 10e3;
    static final double C = 100e-9;
    static final double RA = 10e3;
    static final double RB = 10e3;
    static final double SWING = 0.5;

    /** The astable about an ideal 4.5 V reference; out → R → inn with C to the reference, out → RA → inp → RB → ref. */
    static Circuit astable() {
        OpAmpParams part = OpAmpParams.defaults().withSwing(SWING, SWING).withCommonMode(0, 0).withSlewRate(10e6)
                .withOutputOhms(1);
        return Circuit.builder().nodes("vcc", "ref", "inp", "inn", "out")
                .add(new VoltageSource("VCC", "vcc", "0", VCC, 0, 0, 1e-4))
                .add(new VoltageSource("VREF", "ref", "0", VCC / 2, 0, 0, 1e-4))
                .resistor("R", "out", "inn", R)
                .capacitor("C", "inn", "ref", C)
                .resistor("RA", "out", "inp", RA)
                .resistor("RB", "inp", "ref", RB)
                .opAmp("U1", "inp", "inn", "vcc", "0", "out", part)
                .build();
    }

    static double closedFormPeriod() {
        double beta = RB / (RA + RB);
        return 2 * R * C * Math.log((1 + beta) / (1 - beta));
    }

    @Test
    @DisplayName("the astable is recognised as oscillating with T = 2RC·ln 3 = 2.197 ms (β = 1/2) within 2 %, "
            + "rail to rail, and the run stops on it")
    void recognisedWithTheClosedFormPeriod() {
        PowerOnResult r = PowerOnTransient.run(astable(), PowerOnOptions.of(0.1).withMaxStep(20e-6));
        assertEquals(PowerOnResult.Ending.OSCILLATING, r.ending());
        PowerOnResult.Oscillation o = r.oscillation().orElseThrow();
        assertEquals("out", o.node());
        assertEquals(closedFormPeriod(), o.periodSeconds(), 0.02 * closedFormPeriod());
        // the output swings between the limits of its window: 0.5 V and 8.5 V
        assertEquals(VCC - 2 * SWING, o.peakToPeakVolts(), 0.1);
        assertFalse(r.settled());
        assertTrue(r.settleTimeSeconds().isEmpty());
        // stopped a few periods in, long before the 100 ms stop
        double end = r.timeSeconds(r.pointCount() - 1);
        assertEquals(o.seenAtSeconds(), end, 1e-12);
        assertTrue(end < 10 * closedFormPeriod(), "ran to " + end + " s");
    }

    @Test
    @DisplayName("without the stop on oscillation the run goes to its stop time and still reports the oscillation")
    void reportedWithoutStopping() {
        PowerOnResult r = PowerOnTransient.run(astable(),
                PowerOnOptions.of(0.02).withMaxStep(20e-6).withStopWhenOscillating(false));
        assertEquals(PowerOnResult.Ending.STOP_TIME_REACHED, r.ending());
        assertEquals(0.02, r.timeSeconds(r.pointCount() - 1), 1e-12);
        assertEquals(closedFormPeriod(), r.oscillation().orElseThrow().periodSeconds(), 0.02 * closedFormPeriod());
    }

    @Test
    @DisplayName("a stable stage that rings on its way in is not called oscillating (the non-inverting stage of "
            + "PowerOnOpAmpStageTest settles)")
    void stableStageIsNot() {
        PowerOnResult r = PowerOnTransient.run(PowerOnOpAmpStageTest.stage(), PowerOnOptions.of(10));
        assertEquals(PowerOnResult.Ending.SETTLED, r.ending());
        assertTrue(r.oscillation().isEmpty());
    }
}
