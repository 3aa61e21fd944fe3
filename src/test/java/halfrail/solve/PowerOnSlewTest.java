package halfrail.solve;

import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.VoltageSource;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * A unity follower given a 6 V step (1 µs ramp) on a 10 V supply: the output slews at the part's
 * slew rate, by the definition of slew rate (the largest rate of change of the output for a large
 * input step; Sedra and Smith, Microelectronic Circuits, op-amp large-signal operation — from
 * memory), and settles at the input. Before the overdrive rate the clipped target held the output
 * to the open-loop pole (62.8 rad/s here): tens of milliseconds instead of six microseconds.
 */
class PowerOnSlewTest {
    static final double SLEW = 1e6; // 1 V/µs
    static final double STEP = 6;

    static Circuit follower() {
        OpAmpParams part = OpAmpParams.defaults().withSwing(0.5, 0.5).withCommonMode(0, 0).withSlewRate(SLEW);
        return Circuit.builder().nodes("vcc", "in", "out")
                .add(new VoltageSource("VCC", "vcc", "0", 10))
                .add(new VoltageSource("VIN", "in", "0", STEP, 0, 0, 1e-6))
                .opAmp("U1", "in", "out", "vcc", "0", "out", part)
                .resistor("RL", "out", "0", 10e3)
                .build();
    }

    @Test
    @DisplayName("the output rises at the slew rate, 1 V/µs, between 20 % and 80 % of the 6 V step, and reaches "
            + "90 % after about 5.4 µs")
    void theOutputSlews() {
        PowerOnResult r = PowerOnTransient.run(follower(), PowerOnOptions.of(1e-3).withMaxStep(0.2e-6)
                .withStopWhenSettled(false));
        double t20 = crossing(r, 0.2 * STEP);
        double t80 = crossing(r, 0.8 * STEP);
        double rate = 0.6 * STEP / (t80 - t20);
        assertEquals(SLEW, rate, 0.02 * SLEW, "rate " + rate + " V/s");
        // from 0 at t = 0 at 1 V/µs: 90 % of 6 V at 5.4 µs, give or take the ramp's start and the knee
        assertEquals(5.4e-6, crossing(r, 0.9 * STEP), 0.5e-6);
        double[] out = r.voltages("out");
        assertEquals(STEP, out[out.length - 1], 1e-3);
        assertTrue(r.railTime("U1").orElseThrow().secondsOnRail() < 1e-5);
    }

    /** First time the output reaches {@code volts}, by linear interpolation between accepted points, s. */
    static double crossing(PowerOnResult r, double volts) {
        double[] t = r.timesSeconds();
        double[] v = r.voltages("out");
        for (int i = 1; i < t.length; i++) {
            if (v[i] >= volts) {
                return t[i - 1] + (t[i] - t[i - 1]) * (volts - v[i - 1]) / (v[i] - v[i - 1]);
            }
        }
        throw new AssertionError("the output never reached " + volts + " V");
    }
}
