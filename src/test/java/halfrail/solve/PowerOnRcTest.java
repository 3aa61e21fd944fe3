package halfrail.solve;

import halfrail.circuit.Circuit;
import halfrail.circuit.VoltageSource;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Power-on of a single RC section against the closed-form exponential and textbook figures. */
class PowerOnRcTest {
    private static final double R = 1e3;
    private static final double C = 1e-6;
    private static final double TAU = R * C;

    private static Circuit rc(double volts, double rampSeconds) {
        return Circuit.builder().nodes("in", "out")
                .add(new VoltageSource("V1", "in", "0", volts, 0, 0, rampSeconds))
                .resistor("R1", "in", "out", R)
                .capacitor("C1", "out", "0", C)
                .build();
    }

    @Test
    @DisplayName("RC step reaches 63.2/86.5/95.0/98.2/99.3 % at 1…5 τ (The Art of Electronics, 3rd ed., §1.4)")
    void rcStepFollowsTheTextbookPercentages() {
        PowerOnResult r = PowerOnTransient.run(rc(1.0, 0),
                PowerOnOptions.of(10 * TAU).withWatchedNodes("out").withStopWhenSettled(false)
                        .withTolerances(1e-6, 1e-9));
        double[] percent = {63.2, 86.5, 95.0, 98.2, 99.3};
        for (int k = 1; k <= 5; k++) {
            double v = r.voltageAt("out", k * TAU);
            // the book rounds to 0.1 %
            assertEquals(percent[k - 1], 100 * v, 0.05 + 0.01, "textbook at " + k + " τ");
            // exact: 1 − e^(−k); BDF2's global error is about the local tolerance times the steps per τ
            assertEquals(1 - Math.exp(-k), v, 5e-5, "exact at " + k + " τ");
        }
    }

    @Test
    @DisplayName("at default tolerances the RC step stays within 0.1 % of 1 − e^(−t/τ) (exact)")
    void defaultTolerancesKeepTheRcStepWithinATenthOfAPercent() {
        PowerOnResult r = PowerOnTransient.run(rc(1.0, 0),
                PowerOnOptions.of(10 * TAU).withWatchedNodes("out").withStopWhenSettled(false));
        for (int i = 0; i < r.pointCount(); i++) {
            double t = r.timeSeconds(i);
            assertEquals(1 - Math.exp(-t / TAU), r.voltages("out")[i], 1e-3, "at t = " + t);
        }
    }

    @Test
    @DisplayName("at default tolerances an RC step settles to 1 % after ln(100)·τ = 4.61 τ, within 1 % (exact from e^(−t/τ))")
    void rcStepSettlesToOnePercentAfterFourPointSixOneTau() {
        PowerOnResult r = PowerOnTransient.run(rc(1.0, 0),
                PowerOnOptions.of(20 * TAU).withSettleBand(0.01).withWatchedNodes("out"));
        assertTrue(r.settled());
        double settle = r.settleTimeSeconds().orElseThrow();
        assertEquals(Math.log(100) * TAU, settle, 0.01 * Math.log(100) * TAU);
        assertEquals(4.61 * TAU, settle, 0.01 * 4.61 * TAU);
    }

    @ParameterizedTest(name = "band {0} V of a 5 V step: settle time τ·ln(ΔV/band) (exact from e^(−t/τ))")
    @ValueSource(doubles = {0.5, 0.05, 0.005})
    void settleTimeForABandIsTauTimesLogOfStepOverBand(double band) {
        double step = 5.0;
        PowerOnResult r = PowerOnTransient.run(rc(step, 0),
                PowerOnOptions.of(30 * TAU).withSettleBand(band).withWatchedNodes("out")
                        .withTolerances(1e-6, 1e-9));
        double exact = TAU * Math.log(step / band);
        assertEquals(exact, r.settleTimeSeconds().orElseThrow(), 2e-3 * exact);
    }

    @Test
    @DisplayName("early stop: the run ends SETTLED once every node is within a tenth of the band (common practice)")
    void runStopsEarlyOnceEveryNodeIsNearItsFinalValue() {
        double band = 0.01;
        PowerOnResult r = PowerOnTransient.run(rc(1.0, 0), PowerOnOptions.of(1.0).withSettleBand(band));
        assertEquals(PowerOnResult.Ending.SETTLED, r.ending());
        double end = r.timeSeconds(r.pointCount() - 1);
        // e^(−t/τ) = band·EARLY_STOP_FRACTION happens at τ·ln(1 / 0.001) = 6.9 τ (exact)
        assertTrue(end < 1.0 && end >= TAU * Math.log(1 / (band * PowerOnTransient.EARLY_STOP_FRACTION)) * 0.99,
                "ended at " + end);
        double[] v = r.voltages("out");
        assertEquals(1.0, v[v.length - 1], band * PowerOnTransient.EARLY_STOP_FRACTION);
        assertEquals(1.0, r.finalPoint().voltage("out"), 1e-9);
    }

    @Test
    @DisplayName("a run that ends before settling says so: no settle time (exact: 1 − e^(−2) is 13.5 % short)")
    void runEndingUnsettledReportsNoSettleTime() {
        PowerOnResult r = PowerOnTransient.run(rc(1.0, 0),
                PowerOnOptions.of(2 * TAU).withSettleBand(0.01).withWatchedNodes("out"));
        assertEquals(PowerOnResult.Ending.STOP_TIME_REACHED, r.ending());
        assertFalse(r.settled());
        assertTrue(r.settleTimeSeconds().isEmpty());
        assertEquals(2 * TAU, r.timeSeconds(r.pointCount() - 1), 1e-15);
    }

    @Test
    @DisplayName("ramped source: RC follows the exact ramp response and steps onto the ramp's end (exact solution)")
    void rampedSourceFollowsTheExactRampResponse() {
        double ramp = 3 * TAU;
        double volts = 2.0;
        PowerOnResult r = PowerOnTransient.run(rc(volts, ramp),
                PowerOnOptions.of(12 * TAU).withWatchedNodes("out").withStopWhenSettled(false)
                        .withTolerances(1e-6, 1e-9));
        boolean hitRampEnd = false;
        for (int i = 0; i < r.pointCount(); i++) {
            if (r.timeSeconds(i) == ramp) {
                hitRampEnd = r.isBreakPoint(i);
            }
        }
        assertTrue(hitRampEnd, "a point lies exactly on the end of the ramp");
        double slope = volts / ramp;
        for (double t = 0.25 * TAU; t < 12 * TAU; t += 0.25 * TAU) {
            double exact = t <= ramp
                    ? slope * (t - TAU * (1 - Math.exp(-t / TAU)))
                    : volts - slope * TAU * (Math.exp(ramp / TAU) - 1) * Math.exp(-t / TAU);
            assertEquals(exact, r.voltageAt("out", t), 2e-5 * volts, "at t = " + t);
        }
        // right after the ramp end the first step is backward Euler again
        for (int i = 1; i < r.pointCount(); i++) {
            if (r.isBreakPoint(i - 1)) {
                assertEquals(1, r.stepOrder(i));
            }
        }
    }
}
