package halfrail.solve;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Nodes without a DC path to a defined voltage. Rule: every op-amp input and every node behind
 * a coupling capacitor needs a DC path for its bias current (design brief; The Art of
 * Electronics, 3rd ed., ch. 4, "inputs need a DC return" — from memory). The solver must name
 * the nodes, kind FLOATING_NODE, never SINGULAR.
 */
class FloatingNodesTest {

    private static Circuit.Builder supplyAndMid() {
        return Circuit.builder().nodes("vcc", "mid")
                .voltageSource("VBAT", "vcc", "0", 9)
                .resistor("RA", "vcc", "mid", 100e3)
                .resistor("RB", "mid", "0", 100e3);
    }

    private static void assertFloating(Circuit c, List<String> expected) {
        assertEquals(expected, FloatingNodes.find(c));
        AnalysisException e = assertThrows(AnalysisException.class, () -> DcSolver.operatingPoint(c));
        assertEquals(AnalysisException.Kind.FLOATING_NODE, e.kind());
        assertEquals(expected, e.nodes());
    }

    @Test
    void nodeBehindACouplingCapacitorWithNoBiasResistorFloats() {
        Circuit c = supplyAndMid().nodes("in", "x")
                .voltageSource("VIN", "in", "0", 1)
                .capacitor("CIN", "in", "x", 1e-6)
                .resistor("RX", "x", "mid", 10e3) // keeps x tied to mid: not floating
                .build();
        assertTrue(FloatingNodes.find(c).isEmpty());
        Circuit open = supplyAndMid().nodes("in", "x")
                .voltageSource("VIN", "in", "0", 1)
                .capacitor("CIN", "in", "x", 1e-6)
                .capacitor("CX", "x", "0", 1e-9)
                .build();
        assertFloating(open, List.of("x"));
    }

    @Test
    void opAmpInputFedOnlyThroughACapacitorFloats() {
        Circuit c = supplyAndMid().nodes("in", "inp", "out")
                .voltageSource("VIN", "in", "0", 1)
                .capacitor("CIN", "in", "inp", 1e-6)
                .opAmp("U1", "inp", "out", "vcc", "0", "out", TestAmps.bipolarSwing())
                .build();
        assertFloating(c, List.of("inp"));
    }

    @Test
    void twoNodesJoinedOnlyByAResistorFloatTogether() {
        Circuit c = supplyAndMid().nodes("p", "q", "r")
                .capacitor("C1", "mid", "p", 1e-6)
                .resistor("R1", "p", "q", 10e3)
                .capacitor("C2", "q", "0", 1e-6)
                .resistor("R2", "r", "0", 1e3)
                .build();
        assertFloating(c, List.of("p", "q"));
    }

    @Test
    @DisplayName("a node held only by capacitor leakage counts as floating (documented rule of FloatingNodes)")
    void nodeHeldOnlyByCapacitorLeakageCountsAsFloating() {
        Circuit c = supplyAndMid().node("leg")
                .add(new Capacitor("C1", "mid", "leg", 10e-6, 0.2, "aluminium-electrolytic", 16, true, 1e-7))
                .add(new Capacitor("C2", "leg", "0", 10e-6, 0.2, "aluminium-electrolytic", 16, true, 1e-7))
                .build();
        assertFloating(c, List.of("leg"));
    }

    @Test
    void islandHeldByAVoltageSourceButNotGroundedFloats() {
        Circuit c = supplyAndMid().nodes("a", "b")
                .voltageSource("VX", "a", "b", 1)
                .resistor("RX", "a", "b", 1e3)
                .capacitor("CX", "b", "mid", 1e-6)
                .build();
        assertFloating(c, List.of("a", "b"));
    }

    @Test
    void currentSourceIsNoDcPath() {
        Circuit c = supplyAndMid().node("x").currentSource("I1", "mid", "x", 1e-6).build();
        assertFloating(c, List.of("x"));
    }

    @Test
    void opAmpSupplyPinWithNoSourceFloats() {
        Circuit c = supplyAndMid().nodes("vee", "out")
                .opAmp("U1", "mid", "out", "vcc", "vee", "out", TestAmps.bipolarSwing())
                .build();
        assertFloating(c, List.of("vee"));
    }

    @Test
    void declaredNodeWithNothingConnectedFloats() {
        assertFloating(supplyAndMid().node("spare").build(), List.of("spare"));
    }

    @Test
    void opAmpOutputIsDrivenAndItsFeedbackNetworkIsNotFloating() {
        Circuit c = supplyAndMid().nodes("inm", "out")
                .opAmp("U1", "mid", "inm", "vcc", "0", "out", TestAmps.bipolarSwing())
                .resistor("RF", "out", "inm", 100e3)
                .build();
        assertTrue(FloatingNodes.find(c).isEmpty());
        OperatingPoint op = DcSolver.operatingPoint(c);
        assertEquals(4.5, op.voltage("out"), 1e-6);
        KclCheck.assertHolds(c, op);
    }

    @Test
    void severalFloatingNodesAreReportedInDeclarationOrder() {
        Circuit c = supplyAndMid().nodes("z", "inp", "a", "out")
                .capacitor("CZ", "z", "mid", 1e-6)
                .capacitor("CI", "inp", "mid", 1e-6)
                .opAmp("U1", "inp", "out", "vcc", "0", "out", TestAmps.bipolarSwing())
                .capacitor("CA", "a", "out", 1e-6)
                .build();
        assertFloating(c, List.of("z", "inp", "a"));
    }
}
