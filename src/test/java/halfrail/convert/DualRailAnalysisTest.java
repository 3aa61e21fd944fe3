package halfrail.convert;

import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmpParams;
import halfrail.design.AmplitudeUnit;
import halfrail.design.OpAmpChoice;
import halfrail.design.SignalSource;
import halfrail.design.StageKind;
import halfrail.parts.PartsLibrary;
import halfrail.solve.AcAnalysis;
import halfrail.solve.DcSolver;
import halfrail.solve.OperatingPoint;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class DualRailAnalysisTest {
    /** Open-loop gain of the near-ideal part, V/V: the closed-loop error G/A stays below 1e-6. */
    private static final double HUGE_GAIN = 1e8;
    private static final SignalSource SOURCE = new SignalSource(0.1, AmplitudeUnit.VOLTS_PEAK, 1e3, 20, 20e3);

    /** A near-ideal part: huge gain, no offsets or bias currents, output 1 V from each rail. */
    private static OpAmpChoice ideal() {
        return OpAmpChoice.custom(OpAmpParams.defaults().withOpenLoopGain(HUGE_GAIN).withGainBandwidth(1e12)
                .withSwing(1, 1).withCommonMode(1, 1).withQuiescent(1e-3));
    }

    @Test
    @DisplayName("non-inverting original: gain 1 + R2/R1 and the output at 0 V at rest (closed form, any op-amp text)")
    void nonInvertingOriginalHasTheClosedFormGainAndRestsAtZero() {
        DualRailChain chain = new DualRailChain(List.of(new DualRailStage("g", StageKind.NON_INVERTING, 10e3, 100e3,
                ideal())), 15, 15);
        Circuit c = DualRailAnalysis.circuit(chain, SOURCE, 10e3, 0);
        OperatingPoint op = DcSolver.operatingPoint(c);
        assertEquals(0, op.voltage(DualRailAnalysis.outputNode(chain)), 1e-9);
        AcAnalysis ac = new AcAnalysis(op);
        var h = ac.response(DualRailAnalysis.SIGNAL, DualRailAnalysis.outputNode(chain), 1e3);
        assertEquals(1 + 100e3 / 10e3, h.re(), 11 * 1e-6);
        assertEquals(0, h.im(), 1e-3);
        ChainFigures f = DualRailAnalysis.analyse(chain, SOURCE, 10e3, 0);
        assertEquals(11, f.gain(), 11e-6);
        assertTrue(f.lowerCornerHz().isEmpty(), "a DC-coupled chain has no lower corner");
        // window ±(15 − 1) V around 0 V; signal 1.1 V peak → 20·log10(14/1.1) = 22.1 dB
        assertEquals(20 * Math.log10(14 / 1.1), f.point("nominal").headroomDb(), 1e-3);
    }

    @Test
    @DisplayName("inverting original: gain −R2/R1 (closed form, any op-amp text)")
    void invertingOriginalHasTheClosedFormGain() {
        DualRailChain chain = new DualRailChain(List.of(new DualRailStage("i", StageKind.INVERTING, 10e3, 47e3,
                ideal())), 12, 12);
        SignalSource ideal = new SignalSource(0.1, AmplitudeUnit.VOLTS_PEAK, 0, 20, 20e3);
        Circuit c = DualRailAnalysis.circuit(chain, ideal, 10e3, 0);
        OperatingPoint op = DcSolver.operatingPoint(c);
        assertEquals(0, op.voltage(DualRailAnalysis.outputNode(chain)), 1e-9);
        var h = new AcAnalysis(op).response(DualRailAnalysis.SIGNAL, DualRailAnalysis.outputNode(chain), 1e3);
        assertEquals(-47e3 / 10e3, h.re(), 4.7e-6);
        assertEquals(0, h.im(), 1e-3);
    }

    @Test
    @DisplayName("with the classic part the rest output is (1 + R2/R1)(Vos − I+·Rs) + I−·R2 (bias-current offset, Eggleston §6.4)")
    void restOutputOfTheClassicPartFollowsTheOffsetClosedForm() {
        OpAmpParams p = PartsLibrary.builtIn().requireOpAmpArchetype("classic-bipolar-dual-supply").typical();
        DualRailChain chain = ConversionRequests.nonInvertingOnFifteenVolts();
        OperatingPoint op = DcSolver.operatingPoint(DualRailAnalysis.circuit(chain, SOURCE, 10e3, 0));
        double iPlus = p.biasAmps() + p.offsetCurrentAmps() / 2;
        double iMinus = p.biasAmps() - p.offsetCurrentAmps() / 2;
        double expected = 11 * (p.offsetVolts() - iPlus * SOURCE.sourceOhms()) + iMinus * 100e3;
        assertEquals(expected, op.voltage(DualRailAnalysis.outputNode(chain)), 1e-5);
    }

    @Test
    void bothRailsCarryTheQuiescentCurrent() {
        DualRailChain chain = new DualRailChain(List.of(new DualRailStage("g", StageKind.NON_INVERTING, 10e3, 100e3,
                ideal())), 15, 15);
        ChainFigures f = DualRailAnalysis.analyse(chain, SOURCE, 10e3, 0);
        assertEquals(1e-3, f.supplyAmps(), 1e-6);
        assertEquals(1e-3, f.negativeRailAmps(), 1e-6);
    }

    @Test
    void aChainMultipliesTheStageGains() {
        DualRailChain chain = new DualRailChain(List.of(
                new DualRailStage("a", StageKind.NON_INVERTING, 4.7e3, 47e3, ideal()),
                new DualRailStage("b", StageKind.INVERTING, 10e3, 22e3, ideal()),
                new DualRailStage("c", StageKind.FOLLOWER, 0, 0, ideal())), 15, 15);
        assertEquals(-11 * 2.2, chain.gain(), 1e-12);
        ChainFigures f = DualRailAnalysis.analyse(chain, new SignalSource(0.01, AmplitudeUnit.VOLTS_PEAK, 0, 20, 20e3),
                10e3, 0);
        assertEquals(11 * 2.2, f.gain(), 24.2 * 1e-6);
    }
}
