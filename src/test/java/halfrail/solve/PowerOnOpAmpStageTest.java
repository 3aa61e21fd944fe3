package halfrail.solve;

import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.VoltageSource;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Power-on of a single-supply non-inverting stage: mid-rail divider with decoupling, bias
 * resistor, input coupling capacitor, feedback-leg blocking capacitor, output coupling capacitor
 * and load. The reference comes up faster than the feedback-leg capacitor charges, so the output
 * pins to the high limit of its swing window until that capacitor catches up.
 */
class PowerOnOpAmpStageTest {
    static final double VCC = 9;
    static final double SWING_HEADROOM = 1.5;
    static final double R1 = 10e3;
    static final double R2 = 100e3;
    static final double CF = 10e-6;

    private static Circuit circuit;
    private static PowerOnResult result;

    /** The stage, with a classic bipolar part: 1.5 V output headroom at each rail (The Art of Electronics, 3rd ed., ch. 4 — from memory). */
    static Circuit stage() {
        OpAmpParams part = OpAmpParams.defaults().withSwing(SWING_HEADROOM, SWING_HEADROOM).withSlewRate(0.5e6);
        return Circuit.builder().nodes("vcc", "ref", "inp", "inn", "fb", "out", "sig", "load")
                .add(new VoltageSource("VCC", "vcc", "0", VCC, 0, 0, 1e-3))
                .resistor("RA", "vcc", "ref", 100e3)
                .resistor("RB", "ref", "0", 100e3)
                .capacitor("CREF", "ref", "0", 1e-6)
                .resistor("RBIAS", "ref", "inp", 100e3)
                .capacitor("CIN", "sig", "inp", 0.1e-6)
                .resistor("RS", "sig", "0", 1e3)
                .resistor("R2", "out", "inn", R2)
                .resistor("R1", "inn", "fb", R1)
                .capacitor("CF", "fb", "0", CF)
                .capacitor("COUT", "out", "load", 10e-6)
                .resistor("RL", "load", "0", 10e3)
                .opAmp("U1", "inp", "inn", "vcc", "0", "out", part)
                .build();
    }

    @BeforeAll
    static void run() {
        circuit = stage();
        result = PowerOnTransient.run(circuit, PowerOnOptions.of(10).withLoadNodes("load"));
    }

    @Test
    @DisplayName("the stage settles to the DC operating point, which sits at mid-rail with gain 1 for the bias (design brief: feedback-leg blocking capacitor)")
    void stageSettlesToTheDcOperatingPoint() {
        OperatingPoint dc = DcSolver.operatingPoint(circuit);
        double[] out = result.voltages("out");
        assertEquals(PowerOnResult.Ending.SETTLED, result.ending());
        assertEquals(dc.voltage("out"), out[out.length - 1],
                PowerOnTransient.EARLY_STOP_FRACTION * result.settleBandVolts());
        assertEquals(dc.voltage("out"), result.finalPoint().voltage("out"), 1e-12);
        // mid-rail divider Vs·Rb/(Ra+Rb) = 4.5 V, repeated with gain 1 (design brief)
        assertEquals(VCC / 2, dc.voltage("out"), 1e-3);
        assertTrue(result.settled());
        assertTrue(result.settleTimeSeconds().isPresent());
        // the internal state is the unloaded output; with no output resistance it equals V(out)
        double[] state = result.opAmpStates("U1");
        assertEquals(dc.solution()[dc.system().stateIndex("U1")], state[state.length - 1],
                PowerOnTransient.EARLY_STOP_FRACTION * result.settleBandVolts());
        assertEquals(out[out.length / 2], state[state.length / 2], 1e-6);
    }

    @Test
    @DisplayName("the output pins to the high limit Vcc − 1.5 V for a while during power-on (swing headroom of the part)")
    void outputSitsOnTheHighRailForAWhile() {
        PowerOnResult.RailTime rail = result.railTime("U1").orElseThrow();
        assertTrue(rail.reachedRail());
        assertTrue(rail.secondsOnRail() > 0);
        double highest = 0;
        for (double v : result.voltages("out")) {
            highest = Math.max(highest, v);
        }
        double limit = VCC - SWING_HEADROOM;
        // The limiter's target never passes the limit; the output, arriving within the unity-gain
        // time constant, may step past it by the integration's local error (relative 1e-4).
        double overshoot = PowerOnOptions.DEFAULT_RELATIVE_TOLERANCE * limit;
        assertTrue(highest <= limit + overshoot && highest >= limit - 2 * MnaSystem.KNEE_VOLTS, "highest " + highest);
        // settle-up cannot end before the output has left the rail: the rail is 3 V from the final value
        assertTrue(result.settleTimeSeconds().orElseThrow() > rail.lastOnRailSeconds().orElseThrow());
    }

    @Test
    @DisplayName("time on the rail matches a hand estimate: CF charging through R1 + R2 towards the high limit (common practice)")
    void timeOnTheRailMatchesTheFeedbackLegCharge() {
        double high = VCC - SWING_HEADROOM;
        // The output leaves the rail when Vin + (Vin − V(fb))·R2/R1 falls below the limit, Vin = 4.5 V.
        double exitFb = ((1 + R2 / R1) * VCC / 2 - high) / (R2 / R1);
        double estimate = (R1 + R2) * CF * Math.log(high / (high - exitFb));
        double onRail = result.railTime("U1").orElseThrow().secondsOnRail();
        assertEquals(estimate, onRail, 0.15 * estimate, "hand estimate " + estimate + " s");
    }

    @Test
    @DisplayName("the load's largest step is bounded by the total travel of the output (exact for a first-order high-pass)")
    void loadStepIsBoundedByTheOutputsTravel() {
        double[] out = result.voltages("out");
        double travel = 0;
        for (int i = 1; i < out.length; i++) {
            travel += Math.abs(out[i] - out[i - 1]);
        }
        PowerOnResult.LoadStep step = result.loadStep("load").orElseThrow();
        assertTrue(step.peakDeviationVolts() > 1.0, "the load sees a step of volts: " + step);
        assertTrue(step.peakDeviationVolts() <= travel, "peak " + step.peakDeviationVolts() + " travel " + travel);
        double[] load = result.voltages("load");
        double peak = 0;
        for (double v : load) {
            peak = Math.max(peak, Math.abs(v - result.finalPoint().voltage("load")));
        }
        assertEquals(peak, step.peakDeviationVolts(), 0);
    }

    @Test
    @DisplayName("step statistics are sane: steps grow over decades, few rejections (common practice)")
    void stepStatisticsAreSane() {
        PowerOnResult.StepStatistics s = result.statistics();
        assertTrue(s.acceptedSteps() < 1000, s.toString());
        assertTrue(s.rejectedSteps() < s.acceptedSteps() / 5, s.toString());
        assertTrue(s.largestStepSeconds() / s.smallestStepSeconds() > 1e5, s.toString());
    }
}
