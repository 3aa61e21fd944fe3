package halfrail.solve;

import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.VoltageSource;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import org.junit.jupiter.params.provider.ValueSource;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Circuits that need more than a plain Newton iteration: saturated cascades, positive feedback,
 * linear starts far outside the rails, resistances from 1 mΩ to 1 TΩ. Each must converge to a
 * solution that satisfies KCL (checked independently) or end in a typed AnalysisException;
 * never a non-finite value. Expected values come from the ideal inverting-amplifier relation
 * Vout = Vmid − (Rf/Rin)·(Vin − Vmid) clamped to the swing window (The Art of Electronics, 3rd
 * ed., ch. 4), unless stated otherwise.
 */
class DcConvergenceTest {
    private static final double MID = StageCircuits.VS / 2;
    private static final double LO = TestAmps.BIPOLAR_HEADROOM;
    private static final double HI = StageCircuits.VS - TestAmps.BIPOLAR_HEADROOM;

    private static double clamp(double v) {
        return Math.max(LO, Math.min(HI, v));
    }

    /** Ideal outputs of {@link StageCircuits#invertingCascade} with an ideal amplifier. */
    private static double[] idealCascade(int stages, double[] gains, double inputOffset) {
        double[] out = new double[stages];
        double vin = MID + inputOffset;
        for (int k = 0; k < stages; k++) {
            double target = MID - gains[k % gains.length] * (vin - MID);
            assertTrue(Math.abs(target - LO) > 0.05 && Math.abs(target - HI) > 0.05,
                    "test design: keep every target clear of the limiter's knee");
            out[k] = clamp(target);
            vin = out[k];
        }
        return out;
    }

    private static void assertCascade(Circuit c, OperatingPoint op, double[] expected) {
        for (int k = 0; k < expected.length; k++) {
            String name = "U" + (k + 1);
            assertEquals(expected[k], op.voltage("o" + (k + 1)), 1e-5, "output of stage " + (k + 1));
            boolean railed = expected[k] == LO || expected[k] == HI;
            assertEquals(railed, op.opAmp(name).orElseThrow().saturated(), "saturated flag of " + name);
        }
        KclCheck.assertHolds(c, op);
    }

    @Test
    @DisplayName("four cascaded gain-100 stages saturate on alternate rails")
    void cascadedSaturatedStagesAlternateBetweenTheRails() {
        double[] gains = {100};
        Circuit c = StageCircuits.invertingCascade(4, gains, 0.05, TestAmps.bipolarSwing());
        OperatingPoint op = DcSolver.operatingPoint(c);
        assertCascade(c, op, idealCascade(4, gains, 0.05));
        assertArrayEquals(new double[] {LO, HI, LO, HI}, idealCascade(4, gains, 0.05));
    }

    @ParameterizedTest(name = "{0} stages")
    @ValueSource(ints = {2, 6, 12})
    @DisplayName("cascades mixing saturated and linear stages converge to the clamped ideal outputs")
    void mixedSaturatedAndLinearCascadesConverge(int stages) {
        double[] gains = {100, 0.5, 3, 0.7, 1.3};
        Circuit c = StageCircuits.invertingCascade(stages, gains, 0.05, TestAmps.bipolarSwing());
        OperatingPoint op = DcSolver.operatingPoint(c);
        assertCascade(c, op, idealCascade(stages, gains, 0.05));
    }

    @Test
    @DisplayName("the same cascade with a realistic finite-gain part (gain 1e5, offsets, bias) satisfies KCL")
    void finiteGainCascadeSatisfiesKcl() {
        Circuit c = StageCircuits.invertingCascade(12, new double[] {100, 0.5, 3, 0.7, 1.3}, 0.05,
                TestAmps.bipolarFiniteGain());
        OperatingPoint op = DcSolver.operatingPoint(c);
        KclCheck.assertHolds(c, op);
        for (OpAmpState s : op.opAmps()) {
            assertTrue(s.outputVolts() >= s.swingLowVolts() - 1e-12 && s.outputVolts() <= s.swingHighVolts() + 1e-12,
                    s.name() + " output inside its swing window");
        }
    }

    @ParameterizedTest(name = "input {0} V")
    @ValueSource(doubles = {6, 4.85, 3, 4.15})
    @DisplayName("Schmitt trigger outside its hysteresis band has one solution: the rail its input calls for (AoE ch. 4)")
    void schmittTriggerOutsideItsBandGoesToTheRail(double vin) {
        // R1 = 10 kΩ, R2 = 100 kΩ: upper threshold (Vmid·(R1+R2) − LO·R1)/R2 = 4.8 V, lower (Vmid·(R1+R2) − HI·R1)/R2 = 4.2 V
        Circuit c = StageCircuits.schmitt(vin, 10e3, 100e3, TestAmps.bipolarSwing());
        OperatingPoint op = DcSolver.operatingPoint(c);
        assertEquals(vin > 4.8 ? HI : LO, op.voltage("out"), 1e-6);
        assertTrue(op.opAmp("U1").orElseThrow().saturated());
        KclCheck.assertHolds(c, op);
    }

    @ParameterizedTest(name = "input {0} V")
    @ValueSource(doubles = {4.5, 4.6, 4.3, 4.79, 4.21})
    @DisplayName("Schmitt trigger inside its band rests on a rail, a stable state, not on the unstable middle solution (AoE ch. 4)")
    void schmittTriggerInsideItsBandRestsOnARail(double vin) {
        for (OpAmpParams p : List.of(TestAmps.bipolarSwing(), TestAmps.bipolarFiniteGain())) {
            Circuit c = StageCircuits.schmitt(vin, 10e3, 100e3, p);
            OperatingPoint op = DcSolver.operatingPoint(c);
            KclCheck.assertHolds(c, op);
            double out = op.voltage("out");
            // the three DC solutions: LO, HI and the middle mid + (mid − vin)·R2/R1, where the loop gain is A·R1/(R1+R2) ≫ 1
            boolean atRail = Math.abs(out - LO) < 1e-3 || Math.abs(out - HI) < 1e-3;
            assertTrue(atRail, "output " + out + " V is not on a rail");
            assertTrue(op.opAmp("U1").orElseThrow().saturated());
            // consistency: the + input lies on the side of mid-rail that holds the output where it is
            double inp = op.voltage("inp");
            assertTrue(out > MID ? inp > op.voltage("mid") : inp < op.voltage("mid"));
        }
    }

    @Test
    @DisplayName("the unstable middle solution of a Schmitt trigger is a solution of the equations: plain Newton may find it, the solver moves off it")
    void unstableMiddleSolutionIsLeftForARail() {
        Circuit c = StageCircuits.schmitt(4.6, 10e3, 100e3, TestAmps.bipolarSwing());
        // from the linearised start Newton lands on the middle solution, mid + (mid − 4.6)·10 = 3.5 V
        MnaSystem s = MnaSystem.of(c);
        double[] x = new double[s.size()];
        double[] f = new double[s.size()];
        double[][] g = new double[s.size()][s.size()];
        s.evaluate(x, 0, Mode.DC, 1, 0, false, f, g, null, null);
        DenseLu lu = new DenseLu();
        lu.factor(g, s.size());
        for (int i = 0; i < f.length; i++) {
            x[i] = -f[i];
        }
        lu.solve(x);
        assertEquals(3.5, s.voltage(x, "out"), 1e-5);
        OperatingPoint op = DcSolver.operatingPoint(c);
        assertTrue(Math.abs(op.voltage("out") - 3.5) > 1, "moved to a rail: " + op.voltage("out"));
    }

    @Test
    @DisplayName("a comparator with gain 1e8 and 1 V of input starts 1e8 V outside the rails and still lands on the rail")
    void linearStartFarOutsideTheRailsStillConverges() {
        OpAmpParams p = TestAmps.bipolarSwing();
        Circuit c = StageCircuits.supplyAndMid().nodes("ref", "out")
                .voltageSource("VREF", "ref", "0", MID - 1)
                .opAmp("U1", "mid", "ref", "vcc", "0", "out", p)
                .resistor("RL", "out", "0", 10e3)
                .build();
        OperatingPoint op = DcSolver.operatingPoint(c);
        assertEquals(HI, op.voltage("out"), 1e-9);
        KclCheck.assertHolds(c, op);
    }

    @Test
    @DisplayName("gain-1001 non-inverting stage with its input 1 V off mid-rail: linear start 1 kV, output on the rail")
    void highGainStageWithLargeInputLandsOnTheRail() {
        Circuit c = StageCircuits.supplyAndMid().nodes("in", "inm", "out")
                .voltageSource("VIN", "in", "0", MID - 1)
                .opAmp("U1", "in", "inm", "vcc", "0", "out", TestAmps.bipolarFiniteGain())
                .resistor("R2", "out", "inm", 1e6)
                .resistor("R1", "inm", "mid", 1e3)
                .build();
        OperatingPoint op = DcSolver.operatingPoint(c);
        assertEquals(LO, op.voltage("out"), 1e-6);
        KclCheck.assertHolds(c, op);
    }

    @Test
    @DisplayName("1 mΩ against 1 TΩ: divider ratio to double precision (AoE §1.2)")
    void extremeResistanceRatioDivider() {
        for (double[] r : new double[][] {{1e-3, 1e12}, {1e12, 1e-3}, {1e12, 1e12}, {1e-3, 1e-3}}) {
            Circuit c = Circuit.builder().nodes("vcc", "mid")
                    .voltageSource("VBAT", "vcc", "0", 9)
                    .resistor("RA", "vcc", "mid", r[0])
                    .resistor("RB", "mid", "0", r[1])
                    .build();
            OperatingPoint op = DcSolver.operatingPoint(c);
            assertEquals(9 * r[1] / (r[0] + r[1]), op.voltage("mid"), 1e-12);
            assertEquals(9 / (r[0] + r[1]), op.current("VBAT"), 1e-12 * 9 / (r[0] + r[1]));
            KclCheck.assertHolds(c, op);
        }
    }

    @Test
    @DisplayName("1 pA of bias through a 1 TΩ bias resistor shifts a follower by 1 V (Ib·R, Eggleston §6.4)")
    void teraohmBiasResistorWithPicoampBias() {
        OpAmpParams p = TestAmps.bipolarSwing().withInputErrors(0, 1e-12, 0);
        Circuit c = StageCircuits.supplyAndMid().nodes("inp", "out")
                .resistor("RBIAS", "mid", "inp", 1e12)
                .opAmp("U1", "inp", "out", "vcc", "0", "out", p)
                .build();
        OperatingPoint op = DcSolver.operatingPoint(c);
        // the divider also carries the 1 pA: shift Ib·(RA‖RB + RBIAS)
        assertEquals(MID - 1e-12 * (50e3 + 1e12), op.voltage("out"), 1e-6);
        KclCheck.assertHolds(c, op);
    }

    @Test
    @DisplayName("a follower driving 1 mΩ sources its whole output current from the battery (KCL)")
    void milliohmLoadOnAnOutput() {
        Circuit c = StageCircuits.supplyAndMid().node("out")
                .opAmp("U1", "mid", "out", "vcc", "0", "out", TestAmps.bipolarSwing())
                .resistor("RL", "out", "0", 1e-3)
                .build();
        OperatingPoint op = DcSolver.operatingPoint(c);
        assertEquals(MID, op.voltage("out"), 1e-6);
        assertEquals(MID / 1e-3, op.current("U1"), 1e-3);
        assertEquals(MID / 1e-3 + 9 / 200e3, op.current("VBAT"), 1e-3);
        KclCheck.assertHolds(c, op);
    }

    @Test
    @DisplayName("two outputs with 100 Ω output resistance driven to opposite rails meet half-way (voltage divider, AoE §1.2)")
    void contendingOutputsWithOutputResistanceMeetHalfWay() {
        OpAmpParams p = TestAmps.bipolarSwing().withOutputOhms(100);
        Circuit c = StageCircuits.supplyAndMid().nodes("hi", "lo", "out")
                .voltageSource("VH", "hi", "0", 6)
                .voltageSource("VL", "lo", "0", 3)
                .opAmp("UA", "hi", "mid", "vcc", "0", "out", p)
                .opAmp("UB", "lo", "mid", "vcc", "0", "out", p)
                .build();
        OperatingPoint op = DcSolver.operatingPoint(c);
        assertEquals((HI + LO) / 2, op.voltage("out"), 1e-6);
        assertEquals((HI - LO) / 200, op.current("UA"), 1e-9);
        assertEquals(-(HI - LO) / 200, op.current("UB"), 1e-9);
        KclCheck.assertHolds(c, op);
    }

    @Test
    @DisplayName("two ideal outputs tied together end in a typed error, never a hang or NaN")
    void idealOutputsTiedTogetherEndInATypedError() {
        Circuit c = StageCircuits.supplyAndMid().nodes("hi", "lo", "out")
                .voltageSource("VH", "hi", "0", 6)
                .voltageSource("VL", "lo", "0", 3)
                .opAmp("UA", "hi", "mid", "vcc", "0", "out", TestAmps.bipolarSwing())
                .opAmp("UB", "lo", "mid", "vcc", "0", "out", TestAmps.bipolarSwing())
                .build();
        AnalysisException e = assertThrows(AnalysisException.class, () -> DcSolver.operatingPoint(c));
        assertTrue(e.kind() == AnalysisException.Kind.SINGULAR || e.kind() == AnalysisException.Kind.NO_CONVERGENCE,
                "kind " + e.kind());
    }

    @Test
    @DisplayName("a failed operating point says what each strategy tried and where it stopped")
    void theFailureNamesEveryStrategyAndWhereItStopped() {
        Circuit c = StageCircuits.supplyAndMid().nodes("hi", "lo", "out")
                .voltageSource("VH", "hi", "0", 6)
                .voltageSource("VL", "lo", "0", 3)
                .opAmp("UA", "hi", "mid", "vcc", "0", "out", TestAmps.bipolarSwing())
                .opAmp("UB", "lo", "mid", "vcc", "0", "out", TestAmps.bipolarSwing())
                .build();
        AnalysisException e = assertThrows(AnalysisException.class, () -> DcSolver.operatingPoint(c));
        String m = e.getMessage();
        for (String strategy : java.util.List.of("Newton from the linearised circuit", "limiter active-set search",
                "gain stepping", "gmin stepping", "source stepping")) {
            assertTrue(m.contains(strategy + ": "), strategy + " missing from: " + m);
        }
        assertTrue(m.contains("singular at iteration 1"), m);
    }

    @Test
    void loopOfVoltageSourcesIsSingular() {
        Circuit c = Circuit.builder().node("a")
                .voltageSource("V1", "a", "0", 5)
                .voltageSource("V2", "a", "0", 6)
                .resistor("R1", "a", "0", 1e3)
                .build();
        AnalysisException e = assertThrows(AnalysisException.class, () -> DcSolver.operatingPoint(c));
        assertEquals(AnalysisException.Kind.SINGULAR, e.kind());
    }

    @Test
    @DisplayName("a supply too low for any swing window leaves the output midway between the limits (model rule, MnaSystem)")
    void supplyBelowTheHeadroomLeavesTheOutputMidway() {
        Circuit c = Circuit.builder().nodes("vcc", "mid", "out")
                .voltageSource("VBAT", "vcc", "0", 2)
                .resistor("RA", "vcc", "mid", 100e3)
                .resistor("RB", "mid", "0", 100e3)
                .opAmp("U1", "mid", "out", "vcc", "0", "out", TestAmps.bipolarSwing())
                .build();
        OperatingPoint op = DcSolver.operatingPoint(c);
        // limits 0 + 1.5 = 1.5 V and 2 − 1.5 = 0.5 V cross; the output rests at their mean, 1.0 V
        assertEquals(1.0, op.voltage("out"), 1e-9);
        KclCheck.assertHolds(c, op);
    }

    @Test
    @DisplayName("an op-amp without any output window never rests beyond its own supply pins")
    void withoutAWindowTheOutputStaysBetweenItsSupplyPins() {
        // 1 V supply, headrooms 20 mV and 1.5 V: the limits 0.02 V and −0.5 V cross; their mean,
        // −0.24 V, lies below V−, where an unpowered output stage cannot drive its pin (common
        // practice): the output rests on V−, 0 V.
        OpAmpParams p = TestAmps.bipolarSwing().withSwing(0.02, 1.5);
        Circuit c = Circuit.builder().nodes("vcc", "mid", "out")
                .voltageSource("VBAT", "vcc", "0", 1)
                .resistor("RA", "vcc", "mid", 100e3)
                .resistor("RB", "mid", "0", 100e3)
                .resistor("RL", "out", "mid", 10e3)
                .opAmp("U1", "mid", "out", "vcc", "0", "out", p)
                .build();
        OperatingPoint op = DcSolver.operatingPoint(c);
        assertEquals(0.0, op.opAmp("U1").orElseThrow().outputVolts(), 1e-3);
        KclCheck.assertHolds(c, op);
    }

    @ParameterizedTest
    @EnumSource(OperatingPoint.Strategy.class)
    @DisplayName("each strategy on its own solves the mixed cascade to the same point and reports itself")
    void eachStrategyAloneReachesTheSamePointAndReportsItself(OperatingPoint.Strategy strategy) {
        double[] gains = {100, 0.5, 3, 0.7, 1.3};
        Circuit c = StageCircuits.invertingCascade(6, gains, 0.05, TestAmps.bipolarSwing());
        OperatingPoint op = new DcSolver(MnaSystem.of(c)).solveUsing(strategy);
        assertEquals(strategy, op.strategy());
        assertCascade(c, op, idealCascade(6, gains, 0.05));
    }

    @ParameterizedTest
    @EnumSource(OperatingPoint.Strategy.class)
    @DisplayName("each strategy on its own solves a Schmitt trigger outside its band")
    void eachStrategyAloneSolvesASchmittTrigger(OperatingPoint.Strategy strategy) {
        Circuit c = StageCircuits.schmitt(6, 10e3, 100e3, TestAmps.bipolarFiniteGain());
        OperatingPoint op = new DcSolver(MnaSystem.of(c)).solveUsing(strategy);
        assertEquals(strategy, op.strategy());
        assertEquals(HI, op.voltage("out"), 1e-3);
        KclCheck.assertHolds(c, op);
    }

    @Test
    @DisplayName("a two-op-amp loop resting in a limiter knee defeats Newton and the active-set search; gain stepping solves it and says so")
    void loopRestingInTheKneeIsSolvedByGainSteppingAndReportsIt() {
        // seed 49 of the random-network regression set: U1 and U2 close a negative loop through
        // each other's inputs, and the only operating point has U1 inside its knee
        Circuit c = RandomOpAmpNetworkTest.randomNetwork(new java.util.Random(49));
        OperatingPoint op = DcSolver.operatingPoint(c);
        assertEquals(OperatingPoint.Strategy.GAIN_STEPPING, op.strategy());
        KclCheck.assertHolds(c, op);
        assertThrows(AnalysisException.class,
                () -> new DcSolver(MnaSystem.of(c)).solveUsing(OperatingPoint.Strategy.NEWTON));
    }

    @Test
    void operatingPointCopiesItsArraysInAndOut() {
        Circuit c = StageCircuits.invertingCascade(1, new double[] {2}, 0.1, TestAmps.bipolarSwing());
        OperatingPoint op = DcSolver.operatingPoint(c);
        double[] x = op.solution();
        double before = op.voltage("o1");
        x[op.system().nodeIndex("o1")] = 99;
        assertEquals(before, op.voltage("o1"));
        assertThrows(UnsupportedOperationException.class, () -> op.nodeVolts().put("o1", 1.0));
        assertEquals(op.voltage("o1"), op.nodeVolts().get("o1"));
        assertEquals(op.current("U1"), op.branchAmps().get("U1"));
    }

    @Test
    void plainCircuitsReportPlainNewton() {
        Circuit c = StageCircuits.invertingCascade(3, new double[] {2}, 0.1, TestAmps.bipolarSwing());
        OperatingPoint op = DcSolver.operatingPoint(c);
        assertEquals(OperatingPoint.Strategy.NEWTON, op.strategy());
        assertTrue(op.iterations() <= 3, "a linear circuit converges at once; took " + op.iterations());
        KclCheck.assertHolds(c, op);
    }

    @Test
    void warmStartFromTheSolutionConvergesAtOnce() {
        Circuit c = StageCircuits.invertingCascade(6, new double[] {100, 0.5, 3}, 0.05, TestAmps.bipolarFiniteGain());
        DcSolver solver = new DcSolver(MnaSystem.of(c));
        OperatingPoint first = solver.solve();
        OperatingPoint again = solver.solveFrom(first.solution());
        assertTrue(again.iterations() <= 2, "took " + again.iterations());
        assertArrayEquals(first.solution(), again.solution(), 1e-9);
        KclCheck.assertHolds(c, again);
    }

    @Test
    void guessOfTheWrongLengthIsABadRequest() {
        Circuit c = StageCircuits.invertingCascade(1, new double[] {2}, 0.1, TestAmps.bipolarSwing());
        AnalysisException e = assertThrows(AnalysisException.class, () -> new DcSolver(MnaSystem.of(c)).solveFrom(new double[2]));
        assertEquals(AnalysisException.Kind.BAD_REQUEST, e.kind());
    }

    @Test
    @DisplayName("a sweep of the supply from fresh to flat 9 V battery warm-started point to point (IEC 60086-2 range 9.6…5.4 V)")
    void supplySweepWithWarmStartsStaysConsistent() {
        double[] gains = {100, 0.5, 3};
        Circuit base = StageCircuits.invertingCascade(6, gains, 0.05, TestAmps.bipolarFiniteGain());
        double[] guess = null;
        for (double vs = 9.6; vs >= 5.4 - 1e-9; vs -= 0.3) {
            double v = vs;
            Circuit c = base.replace("VBAT", e -> ((VoltageSource) e).withDcVolts(v));
            OperatingPoint op = new DcSolver(MnaSystem.of(c)).solveFrom(guess);
            KclCheck.assertHolds(c, op);
            assertEquals(v - TestAmps.BIPOLAR_HEADROOM, op.opAmp("U1").orElseThrow().swingHighVolts(), 1e-12);
            assertFalse(Double.isNaN(op.voltage("o6")));
            guess = op.solution();
        }
    }
}
