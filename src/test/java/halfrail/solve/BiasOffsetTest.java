package halfrail.solve;

import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmpParams;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

/**
 * Output offset of an inverting amplifier with its input grounded, on a ±15 V supply, from the
 * op-amp's offset voltage and input currents.
 *
 * <p>With the model's convention (in+ takes Ib + Ios/2, in− takes Ib − Ios/2, Vos added to
 * V(in+) − V(in−)), an ideal op-amp gives V(in−) = V(in+) + Vos, V(in+) = −(Ib + Ios/2)·Rc and
 * KCL at in−: Vout = (1 + Rf/R1)·(Vos − (Ib + Ios/2)·Rc) + (Ib − Ios/2)·Rf. With Rc = R1‖Rf the
 * bias terms cancel and Vout = (1 + Rf/R1)·Vos − Rf·Ios; with Rc = 0, Vout = (1 + Rf/R1)·Vos + (Ib − Ios/2)·Rf.
 */
class BiasOffsetTest {
    private static final double R1 = 5e3;
    private static final double RF = 500e3;
    /** Compensating resistor at +: R1‖Rf. */
    private static final double RC = R1 * RF / (R1 + RF);

    /** Inverting stage, input grounded through R1, + input to ground through {@code rc} (0: direct). */
    private static Circuit invertingStage(OpAmpParams p, double rc) {
        String plus = rc > 0 ? "inp" : "0";
        Circuit.Builder b = Circuit.builder().nodes("vp", "vn", "inm", "out")
                .voltageSource("VPOS", "vp", "0", 15)
                .voltageSource("VNEG", "0", "vn", 15)
                .resistor("R1", "inm", "0", R1)
                .resistor("RF", "out", "inm", RF)
                .opAmp("U1", plus, "inm", "vp", "vn", "out", p);
        if (rc > 0) {
            b.node("inp").resistor("RC", "inp", "0", rc);
        }
        return b.build();
    }

    private static double outputOffset(double vos, double ib, double ios, double rc) {
        OpAmpParams p = TestAmps.ideal().withInputErrors(vos, ib, ios);
        Circuit c = invertingStage(p, rc);
        OperatingPoint op = DcSolver.operatingPoint(c);
        KclCheck.assertHolds(c, op);
        assertFalse(op.opAmp("U1").orElseThrow().saturated());
        return op.voltage("out");
    }

    /** Bias current of the example's part; it cancels with the compensating resistor (value invented for the check). */
    private static final double IB = 500e-9;

    @Test
    @DisplayName("Sivakumar, Linear Integrated Circuits, Ex. 5.1: offset voltage alone gives (1+Rf/R1)·Vos = 404 mV")
    void offsetVoltageAloneGives404Millivolts() {
        assertEquals(0.404, outputOffset(4e-3, IB, 0, RC), 1e-6);
    }

    @Test
    @DisplayName("Sivakumar, Ex. 5.1: offset current alone gives Rf·Ios = 75 mV in magnitude (sign: −Rf·Ios)")
    void offsetCurrentAloneGives75Millivolts() {
        assertEquals(0.075, outputOffset(0, IB, -150e-9, RC), 1e-6);
        assertEquals(-0.075, outputOffset(0, IB, 150e-9, RC), 1e-6);
    }

    @Test
    @DisplayName("Sivakumar, Ex. 5.1: worst case 404 mV + 75 mV = 479 mV with Vos and Ios of opposite sign")
    void worstCaseSumIs479MillivoltsWhenTheErrorsAdd() {
        // Vout = 101·Vos − Rf·Ios: the errors add when Vos and Ios have opposite signs.
        assertEquals(0.479, outputOffset(4e-3, IB, -150e-9, RC), 1e-6);
        assertEquals(-0.479, outputOffset(-4e-3, IB, 150e-9, RC), 1e-6);
        // The same signs subtract: 404 − 75 = 329 mV, so the sign choice above is the worst case.
        assertEquals(0.329, outputOffset(4e-3, IB, 150e-9, RC), 1e-6);
    }

    @Test
    @DisplayName("Eggleston, Basic Electronics for Scientists and Engineers §6.4: uncompensated offset is Ib·Rf")
    void uncompensatedBiasCurrentGivesIbTimesRf() {
        double ib = 100e-9;
        assertEquals(ib * RF, outputOffset(0, ib, 0, 0), 1e-6);
        // with an offset current the in− current Ib − Ios/2 is what flows through Rf
        assertEquals((ib - 10e-9) * RF, outputOffset(0, ib, 20e-9, 0), 1e-6);
    }

    @Test
    @DisplayName("Eggleston §6.4: with R1‖Rf at the + input only Rf·Ios remains, independent of Ib")
    void compensatingResistorLeavesOnlyOffsetCurrentTimesRf() {
        double ios = 20e-9;
        double a = outputOffset(0, 100e-9, ios, RC);
        double b = outputOffset(0, 1e-6, ios, RC);
        assertEquals(-RF * ios, a, 1e-6);
        assertEquals(a, b, 1e-6);
    }

    @Test
    @DisplayName("finite open-loop gain: inverting stage with grounded input matches Vos·A/(1 + A·β) exactly (any op-amp text)")
    void finiteGainOffsetMatchesTheClosedLoopFormula() {
        double gain = 1e4;
        OpAmpParams p = OpAmpParams.defaults().withOpenLoopGain(gain).withInputErrors(4e-3, 0, 0);
        Circuit c = invertingStage(p, RC);
        OperatingPoint op = DcSolver.operatingPoint(c);
        double beta = R1 / (R1 + RF);
        assertEquals(4e-3 * gain / (1 + gain * beta), op.voltage("out"), 1e-9);
        KclCheck.assertHolds(c, op);
    }
}
