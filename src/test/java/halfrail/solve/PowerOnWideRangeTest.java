package halfrail.solve;

import halfrail.circuit.Circuit;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Time constants of 1 µs and 2 s in one circuit, 10 s of circuit time. */
class PowerOnWideRangeTest {
    private static final double VS = 5;
    private static final double TAU_FAST = 1e3 * 1e-9;
    private static final double TAU_SLOW = 200e3 * 10e-6;

    static Circuit twoScales() {
        return Circuit.builder().nodes("vs", "fast", "slow")
                .voltageSource("VS", "vs", "0", VS)
                .resistor("RF", "vs", "fast", 1e3)
                .capacitor("CF", "fast", "0", 1e-9)
                .resistor("RS", "vs", "slow", 200e3)
                .capacitor("CS", "slow", "0", 10e-6)
                .build();
    }

    @Test
    @DisplayName("1 µs and 2 s sections both follow V·(1 − e^(−t/τ)) (exact) over 10 s, in a few hundred steps")
    void bothTimeScalesAreAccurateInOneRun() {
        PowerOnResult r = PowerOnTransient.run(twoScales(),
                PowerOnOptions.of(10).withWatchedNodes("fast", "slow").withStopWhenSettled(false));
        assertEquals(PowerOnResult.Ending.STOP_TIME_REACHED, r.ending());
        assertEquals(10, r.timeSeconds(r.pointCount() - 1), 0);
        for (double k : new double[] {0.5, 1, 2, 3, 5}) {
            double t = k * TAU_FAST;
            assertEquals(VS * (1 - Math.exp(-k)), r.voltageAt("fast", t), 1e-3 * VS, "fast at " + k + " τ");
        }
        for (double t : new double[] {0.1, 1, 2, 4, 6, 10}) {
            assertEquals(VS * (1 - Math.exp(-t / TAU_SLOW)), r.voltageAt("slow", t), 1e-3 * VS, "slow at " + t + " s");
            assertEquals(VS, r.voltageAt("fast", t), 1e-6, "fast at " + t + " s");
        }
        PowerOnResult.StepStatistics s = r.statistics();
        assertTrue(s.acceptedSteps() < 500, s.toString());
        assertTrue(s.rejectedSteps() <= s.acceptedSteps() / 10, s.toString());
        assertTrue(s.smallestStepSeconds() < TAU_FAST / 10, s.toString());
        assertTrue(s.largestStepSeconds() > TAU_SLOW / 100, s.toString());
    }
}
