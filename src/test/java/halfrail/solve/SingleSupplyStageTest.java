package halfrail.solve;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.VoltageSource;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Single-supply stages biased at mid-rail. Ideal-op-amp relations (V(in−) = V(in+) + Vos, no
 * current other than the bias currents into the inputs) from any op-amp text, e.g. The Art of
 * Electronics, 3rd ed., ch. 4; divider and Thévenin from its §1.2.
 */
class SingleSupplyStageTest {
    private static final double VS = 9;
    private static final double RA = 100e3;
    private static final double RB = 100e3;
    private static final double RBIAS = 100e3;
    private static final double R1 = 10e3;
    private static final double R2 = 100e3;
    private static final double IB = 100e-9;
    private static final double IOS = 20e-9;
    private static final double VOS = 1e-3;
    /**
     * Leakage of a 10 µF / 16 V aluminium electrolytic at its limit, max(0.01·C·U_R µA, 3 µA) = 3 µA
     * at rated voltage (IEC 60384-4, from memory via REFERENCES.md), taken as ohmic: 3 µA / 16 V.
     */
    private static final double G_LEAK = 3e-6 / 16;

    private static OpAmpParams amp() {
        return TestAmps.bipolarSwing().withInputErrors(VOS, IB, IOS);
    }

    /**
     * Non-inverting stage: divider RA/RB to mid (decoupled by CREF), RBIAS from mid to in+, R2
     * from out to in−, R1 from in− to the feedback-leg node, C1 from there to ground.
     */
    private static Circuit nonInverting(double leakSiemens, boolean withCapacitor) {
        Circuit.Builder b = Circuit.builder().nodes("vcc", "mid", "inp", "inm", "out")
                .voltageSource("VBAT", "vcc", "0", VS)
                .resistor("RA", "vcc", "mid", RA)
                .resistor("RB", "mid", "0", RB)
                .capacitor("CREF", "mid", "0", 10e-6)
                .resistor("RBIAS", "mid", "inp", RBIAS)
                .opAmp("U1", "inp", "inm", "vcc", "0", "out", amp())
                .resistor("R2", "out", "inm", R2);
        if (withCapacitor) {
            b.node("leg").resistor("R1", "inm", "leg", R1)
                    .add(new Capacitor("C1", "leg", "0", 10e-6, 0.2, "aluminium-electrolytic", 16, true, leakSiemens));
        } else {
            b.resistor("R1", "inm", "0", R1);
        }
        return b.build();
    }

    /** V(in−) of the ideal stage: mid-rail, minus Ib+ through the source resistance, plus Vos. */
    private static double invertingInput() {
        double ibp = IB + IOS / 2;
        return VS * RB / (RA + RB) - ibp * (RA * RB / (RA + RB) + RBIAS) + VOS;
    }

    @Test
    @DisplayName("blocking capacitor in the feedback leg: gain 1 for bias, the output sits at mid-rail (AoE ch. 4)")
    void stageWithBlockingCapacitorSitsAtMidRail() {
        Circuit c = nonInverting(0, true);
        OperatingPoint op = DcSolver.operatingPoint(c);
        double ibm = IB - IOS / 2;
        double expected = invertingInput() + ibm * R2;
        assertEquals(expected, op.voltage("out"), 1e-6);
        assertEquals(VS / 2, op.voltage("out"), 0.02, "within 20 mV of mid-rail");
        assertFalse(op.opAmp("U1").orElseThrow().saturated());
        KclCheck.assertHolds(c, op);
    }

    @Test
    @DisplayName("leakage through the feedback-leg capacitor shifts the output by I_leak·R2 (exact closed form; leakage per IEC 60384-4)")
    void outputShiftsByLeakageTimesFeedbackResistance() {
        Circuit ideal = nonInverting(0, true);
        Circuit leaky = nonInverting(G_LEAK, true);
        OperatingPoint a = DcSolver.operatingPoint(ideal);
        OperatingPoint b = DcSolver.operatingPoint(leaky);
        // Exact: V(leg) = V(in−)/(1 + G·R1), I_leak = G·V(in−)/(1 + G·R1),
        // V(out) = V(in−) + (I_leak + Ib−)·R2 = V(in−)·(1 + G·R2/(1 + G·R1)) + Ib−·R2.
        double vm = invertingInput();
        double iLeak = G_LEAK * vm / (1 + G_LEAK * R1);
        double ibm = IB - IOS / 2;
        assertEquals(vm * (1 + G_LEAK * R2 / (1 + G_LEAK * R1)) + ibm * R2, b.voltage("out"), 1e-6);
        double shift = b.voltage("out") - a.voltage("out");
        assertEquals(iLeak * R2, shift, 1e-6);
        // the approximation I_leak ≈ G·V(in−) holds to G·R1 (0.2 %) here: about 84 mV
        assertEquals(G_LEAK * vm * R2, shift, 0.003 * shift);
        assertEquals(0.084, shift, 0.001);
        KclCheck.assertHolds(leaky, b);
    }

    @Test
    @DisplayName("without the blocking capacitor the bias is amplified by 1 + R2/R1 into the rail: output at V+ − swing, saturated")
    void stageWithoutBlockingCapacitorSaturatesAtTheSwingLimit() {
        Circuit c = nonInverting(0, false);
        OperatingPoint op = DcSolver.operatingPoint(c);
        OpAmpState s = op.opAmp("U1").orElseThrow();
        assertTrue((1 + R2 / R1) * VS / 2 > VS, "the ideal output would lie beyond the rail");
        assertTrue(s.saturated());
        assertEquals(VS - TestAmps.BIPOLAR_HEADROOM, s.swingHighVolts(), 1e-12);
        assertEquals(s.swingHighVolts(), op.voltage("out"), 1e-6);
        assertEquals(op.voltage("out"), s.outputVolts(), 0);
        KclCheck.assertHolds(c, op);
    }

    @ParameterizedTest(name = "input {0} V away from mid-rail")
    @ValueSource(doubles = {0.1, -0.2, 0.25})
    @DisplayName("inverting stage referenced to mid-rail: Vout = Vmid − (Rf/Rin)·(Vin − Vmid) (AoE ch. 4)")
    void invertingStageReferencedToMidRailAmplifiesAboutMid(double delta) {
        double rin = 10e3;
        double rf = 100e3;
        double vmid = VS / 2;
        Circuit c = Circuit.builder().nodes("vcc", "mid", "in", "inm", "out")
                .voltageSource("VBAT", "vcc", "0", VS)
                .resistor("RA", "vcc", "mid", RA)
                .resistor("RB", "mid", "0", RB)
                .voltageSource("VIN", "in", "0", vmid + delta)
                .resistor("RIN", "in", "inm", rin)
                .resistor("RF", "out", "inm", rf)
                .opAmp("U1", "mid", "inm", "vcc", "0", "out", TestAmps.bipolarSwing())
                .build();
        OperatingPoint op = DcSolver.operatingPoint(c);
        assertEquals(vmid - rf / rin * delta, op.voltage("out"), 1e-6);
        assertEquals(vmid, op.voltage("mid"), 1e-9);
        KclCheck.assertHolds(c, op);
    }

    @Test
    @DisplayName("inverting stage fed through a coupling capacitor: no DC through Rin, output at mid-rail (AoE ch. 4)")
    void capacitorCoupledInvertingStageRestsAtMidRail() {
        double vmid = VS / 2;
        Circuit c = Circuit.builder().nodes("vcc", "mid", "in", "x", "inm", "out")
                .voltageSource("VBAT", "vcc", "0", VS)
                .resistor("RA", "vcc", "mid", RA)
                .resistor("RB", "mid", "0", RB)
                .voltageSource("VIN", "in", "0", 1.0)
                .capacitor("CIN", "in", "x", 1e-6)
                .resistor("RIN", "x", "inm", 10e3)
                .resistor("RF", "out", "inm", 100e3)
                .opAmp("U1", "mid", "inm", "vcc", "0", "out", TestAmps.bipolarSwing())
                .build();
        OperatingPoint op = DcSolver.operatingPoint(c);
        assertEquals(vmid, op.voltage("out"), 1e-6);
        assertEquals(vmid, op.voltage("x"), 1e-6);
        KclCheck.assertHolds(c, op);
    }

    /** Follower at mid-rail driving a load resistor to ground (sourcing) or to V+ (sinking). */
    private static Circuit loadedFollower(double iq, double rl, boolean loadToRail, double rs) {
        OpAmpParams p = TestAmps.bipolarSwing().withQuiescent(iq);
        return Circuit.builder().nodes("vcc", "mid", "out")
                .add(new VoltageSource("VBAT", "vcc", "0", VS, 0, rs, 0))
                .resistor("RA", "vcc", "mid", RA)
                .resistor("RB", "mid", "0", RB)
                .opAmp("U1", "mid", "out", "vcc", "0", "out", p)
                .resistor("RL", "out", loadToRail ? "vcc" : "0", rl)
                .build();
    }

    @Test
    @DisplayName("battery current = divider current + quiescent current + load current, op-amp sourcing (KCL, common practice)")
    void batteryCurrentIsDividerPlusQuiescentPlusSourcedLoad() {
        double iq = 1.5e-3;
        double rl = 10e3;
        Circuit c = loadedFollower(iq, rl, false, 0);
        OperatingPoint op = DcSolver.operatingPoint(c);
        double divider = VS / (RA + RB);
        double load = (VS / 2) / rl;
        assertEquals(divider + iq + load, op.current("VBAT"), 1e-9);
        assertEquals(load, op.current("U1"), 1e-9);
        assertEquals(iq + load, op.opAmp("U1").orElseThrow().supplyAmps(), 1e-9);
        KclCheck.assertHolds(c, op);
    }

    @Test
    @DisplayName("battery current = divider + quiescent + load current when the op-amp sinks a load tied to V+ (KCL, common practice)")
    void batteryCurrentIsDividerPlusQuiescentPlusSunkLoad() {
        double iq = 0.5e-3;
        double rl = 4.7e3;
        Circuit c = loadedFollower(iq, rl, true, 0);
        OperatingPoint op = DcSolver.operatingPoint(c);
        double divider = VS / (RA + RB);
        double load = (VS - VS / 2) / rl;
        assertEquals(divider + iq + load, op.current("VBAT"), 1e-9);
        assertEquals(-load, op.current("U1"), 1e-9);
        assertEquals(iq, op.opAmp("U1").orElseThrow().supplyAmps(), 1e-9, "a sinking output draws nothing extra from V+");
        KclCheck.assertHolds(c, op);
    }

    /** A comparator whose + input sits above its − input: output pinned high, driving RL to ground. */
    private static Circuit comparatorHigh(double vs, double rs, double iq, double rl) {
        OpAmpParams p = TestAmps.bipolarSwing().withQuiescent(iq);
        return Circuit.builder().nodes("vcc", "mid", "ref", "out")
                .add(new VoltageSource("VBAT", "vcc", "0", vs, 0, rs, 0))
                .resistor("RA", "vcc", "mid", RA)
                .resistor("RB", "mid", "0", RB)
                .voltageSource("VREF", "ref", "0", 1.0)
                .opAmp("U1", "mid", "ref", "vcc", "0", "out", p)
                .resistor("RL", "out", "0", rl)
                .build();
    }

    @ParameterizedTest(name = "supply {0} V")
    @ValueSource(doubles = {9.6, 9, 7.2, 6, 5.4})
    @DisplayName("the swing window moves with the supply: high limit V+ − swingHigh (AoE ch. 4 headroom; 9 V cell range IEC 60086-2)")
    void swingWindowMovesWithTheSupply(double vs) {
        Circuit c = comparatorHigh(vs, 0, 1e-3, 10e3);
        OperatingPoint op = DcSolver.operatingPoint(c);
        OpAmpState s = op.opAmp("U1").orElseThrow();
        assertTrue(s.saturated());
        assertEquals(vs - TestAmps.BIPOLAR_HEADROOM, s.swingHighVolts(), 1e-12);
        assertEquals(TestAmps.BIPOLAR_HEADROOM, s.swingLowVolts(), 1e-12);
        assertEquals(vs - TestAmps.BIPOLAR_HEADROOM, op.voltage("out"), 1e-6);
        KclCheck.assertHolds(c, op);
    }

    @Test
    @DisplayName("with series resistance in the supply the window follows the sagging V+ (Thévenin source, AoE §1.2)")
    void swingWindowFollowsTheSupplyAfterItsSeriesResistance() {
        double vs = 9;
        double rs = 50;
        double iq = 2e-3;
        double rl = 1e3;
        double sh = TestAmps.BIPOLAR_HEADROOM;
        Circuit c = comparatorHigh(vs, rs, iq, rl);
        OperatingPoint op = DcSolver.operatingPoint(c);
        // V+ = Vs − Rs·(Iq + (V+ − sh)/RL + V+/(RA+RB)), solved for V+:
        double vcc = (vs - rs * iq + rs * sh / rl) / (1 + rs / rl + rs / (RA + RB));
        assertEquals(vcc, op.voltage("vcc"), 1e-6);
        OpAmpState s = op.opAmp("U1").orElseThrow();
        assertEquals(op.voltage("vcc") - sh, s.swingHighVolts(), 1e-12);
        assertEquals(vcc - sh, op.voltage("out"), 1e-6);
        assertTrue(vcc < vs - 0.4, "the supply sags visibly");
        KclCheck.assertHolds(c, op);
    }
}
