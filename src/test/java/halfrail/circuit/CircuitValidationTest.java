package halfrail.circuit;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.function.Executable;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Validation of the netlist model. The rules are the model's own contract (its javadoc); the
 * case-insensitive element names follow SPICE netlist practice (names are not case-sensitive
 * in the SPICE netlist syntax — common practice). Tests assert kind, part and field, never messages.
 */
class CircuitValidationTest {

    private static void assertRejected(CircuitException.Kind kind, String part, String field, Executable build) {
        CircuitException e = assertThrows(CircuitException.class, build);
        assertEquals(kind, e.kind(), "kind");
        assertEquals(part, e.part(), "part");
        assertEquals(field, e.field(), "field");
    }

    @Test
    void resistorToAnUndeclaredNodeIsAnUnknownNodeNamingThePartAndTerminal() {
        assertRejected(CircuitException.Kind.UNKNOWN_NODE, "R1", "b",
                () -> Circuit.builder().node("a").resistor("R1", "a", "nowhere", 1e3).build());
        assertRejected(CircuitException.Kind.UNKNOWN_NODE, "R1", "a",
                () -> Circuit.builder().node("b").resistor("R1", "nowhere", "b", 1e3).build());
    }

    @Test
    void everyTerminalOfEveryElementTypeIsNamedWhenItsNodeIsUnknown() {
        OpAmpParams p = OpAmpParams.defaults();
        assertRejected(CircuitException.Kind.UNKNOWN_NODE, "C1", "minus",
                () -> Circuit.builder().node("a").capacitor("C1", "a", "x", 1e-6).build());
        assertRejected(CircuitException.Kind.UNKNOWN_NODE, "V1", "plus",
                () -> Circuit.builder().voltageSource("V1", "x", "0", 1).build());
        assertRejected(CircuitException.Kind.UNKNOWN_NODE, "I1", "to",
                () -> Circuit.builder().node("a").currentSource("I1", "a", "x", 1e-6).build());
        String[] fields = {"inPlus", "inMinus", "vPos", "vNeg", "out"};
        for (int i = 0; i < fields.length; i++) {
            String[] t = {"a", "b", "c", "d", "e"};
            t[i] = "x";
            int k = i;
            assertRejected(CircuitException.Kind.UNKNOWN_NODE, "U1", fields[k],
                    () -> Circuit.builder().nodes("a", "b", "c", "d", "e").opAmp("U1", t[0], t[1], t[2], t[3], t[4], p).build());
        }
    }

    @Test
    void implicitNodesDeclareWhatElementsMention() {
        Circuit c = Circuit.builder().implicitNodes().resistor("R1", "a", "b", 1e3).resistor("R2", "b", "gnd", 1e3).build();
        assertEquals(List.of("a", "b"), c.nodes());
    }

    @Test
    void groundAliasesAreRewrittenToGround() {
        Circuit c = Circuit.builder().node("a").resistor("R1", "a", "GND", 1e3).voltageSource("V1", "a", "gnd", 1).build();
        Resistor r = (Resistor) c.element("R1").orElseThrow();
        assertEquals(Circuit.GROUND, r.b());
        assertEquals(Circuit.GROUND, ((VoltageSource) c.element("V1").orElseThrow()).minus());
        assertTrue(c.hasNode("gnd"));
        assertTrue(c.hasNode("0"));
        assertEquals(List.of("a"), c.nodes());
    }

    @Test
    void sourceBetweenGroundAndItsAliasIsABadConnection() {
        assertRejected(CircuitException.Kind.BAD_CONNECTION, "V1", "minus",
                () -> Circuit.builder().voltageSource("V1", "0", "gnd", 1).build());
    }

    @Test
    void duplicateElementNamesAreRejected() {
        assertRejected(CircuitException.Kind.DUPLICATE_NAME, "R1", "name",
                () -> Circuit.builder().nodes("a").resistor("R1", "a", "0", 1e3).resistor("R1", "a", "0", 2e3));
    }

    @Test
    @DisplayName("names differing only in case collide, across element types (SPICE names are case-insensitive — common practice)")
    void elementNamesDifferingOnlyInCaseAreDuplicates() {
        assertRejected(CircuitException.Kind.DUPLICATE_NAME, "r1", "name",
                () -> Circuit.builder().nodes("a").resistor("R1", "a", "0", 1e3).capacitor("r1", "a", "0", 1e-9));
    }

    @ParameterizedTest(name = "ohms = {0}")
    @ValueSource(doubles = {0, -1, -0.0, Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY})
    void nonPositiveOrNonFiniteResistanceIsABadValue(double ohms) {
        assertRejected(CircuitException.Kind.BAD_VALUE, "R1", "ohms", () -> new Resistor("R1", "a", "b", ohms));
    }

    @ParameterizedTest(name = "farads = {0}")
    @ValueSource(doubles = {0, -1e-6, Double.NaN, Double.POSITIVE_INFINITY})
    void nonPositiveOrNonFiniteCapacitanceIsABadValue(double farads) {
        assertRejected(CircuitException.Kind.BAD_VALUE, "C1", "farads", () -> new Capacitor("C1", "a", "b", farads));
    }

    @Test
    void capacitorRatingAndLeakageAreChecked() {
        assertRejected(CircuitException.Kind.BAD_VALUE, "C1", "ratedVolts",
                () -> new Capacitor("C1", "a", "b", 1e-6, 0.2, "", 0, false, 0));
        assertRejected(CircuitException.Kind.BAD_VALUE, "C1", "ratedVolts",
                () -> new Capacitor("C1", "a", "b", 1e-6, 0.2, "", Double.NaN, false, 0));
        for (double g : new double[] {-1e-9, Double.NaN, Double.POSITIVE_INFINITY}) {
            assertRejected(CircuitException.Kind.BAD_VALUE, "C1", "leakageSiemens",
                    () -> new Capacitor("C1", "a", "b", 1e-6, 0.2, "", 16, true, g));
        }
        assertRejected(CircuitException.Kind.BAD_VALUE, "C1", "tolerance",
                () -> new Capacitor("C1", "a", "b", 1e-6, 1.5, "", 16, true, 0));
        // an unknown rating is stated as infinity, by the documented convention
        assertEquals(Double.POSITIVE_INFINITY, new Capacitor("C1", "a", "b", 1e-6).ratedVolts());
    }

    @Test
    void sourceValuesMustBeFinite() {
        for (double v : new double[] {Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY}) {
            assertRejected(CircuitException.Kind.BAD_VALUE, "V1", "dcVolts", () -> new VoltageSource("V1", "a", "0", v));
            assertRejected(CircuitException.Kind.BAD_VALUE, "I1", "amps", () -> new CurrentSource("I1", "a", "0", v));
        }
        assertRejected(CircuitException.Kind.BAD_VALUE, "V1", "seriesOhms",
                () -> new VoltageSource("V1", "a", "0", 9, 0, -1, 0));
        assertRejected(CircuitException.Kind.BAD_VALUE, "V1", "seriesOhms",
                () -> new VoltageSource("V1", "a", "0", 9, 0, Double.NaN, 0));
        assertRejected(CircuitException.Kind.BAD_VALUE, "V1", "rampSeconds",
                () -> new VoltageSource("V1", "a", "0", 9, 0, 0, Double.POSITIVE_INFINITY));
        assertRejected(CircuitException.Kind.BAD_VALUE, "V1", "acMagnitude",
                () -> new VoltageSource("V1", "a", "0", 9, -1, 0, 0));
    }

    @Test
    void resistorToleranceAndTempcoAreChecked() {
        assertRejected(CircuitException.Kind.BAD_VALUE, "R1", "tolerance", () -> new Resistor("R1", "a", "b", 1e3, -0.01, 0));
        assertRejected(CircuitException.Kind.BAD_VALUE, "R1", "tolerance", () -> new Resistor("R1", "a", "b", 1e3, Double.NaN, 0));
        assertRejected(CircuitException.Kind.BAD_VALUE, "R1", "tempcoPpmPerKelvin",
                () -> new Resistor("R1", "a", "b", 1e3, 0.01, Double.NaN));
    }

    @Test
    void opAmpParametersNameTheOffendingField() {
        OpAmpParams d = OpAmpParams.defaults();
        assertRejected(CircuitException.Kind.BAD_VALUE, "op-amp parameters", "openLoopGain", () -> d.withOpenLoopGain(0));
        assertRejected(CircuitException.Kind.BAD_VALUE, "op-amp parameters", "openLoopGain", () -> d.withOpenLoopGain(Double.NaN));
        assertRejected(CircuitException.Kind.BAD_VALUE, "op-amp parameters", "gainBandwidthHz",
                () -> d.withGainBandwidth(Double.POSITIVE_INFINITY));
        assertRejected(CircuitException.Kind.BAD_VALUE, "op-amp parameters", "slewRateVoltsPerSecond", () -> d.withSlewRate(-1));
        assertRejected(CircuitException.Kind.BAD_VALUE, "op-amp parameters", "swingLowVolts", () -> d.withSwing(-0.1, 1));
        assertRejected(CircuitException.Kind.BAD_VALUE, "op-amp parameters", "swingHighVolts", () -> d.withSwing(0.1, Double.NaN));
        assertRejected(CircuitException.Kind.BAD_VALUE, "op-amp parameters", "biasAmps",
                () -> d.withInputErrors(0, Double.NaN, 0));
        assertRejected(CircuitException.Kind.BAD_VALUE, "op-amp parameters", "outputOhms", () -> d.withOutputOhms(-1));
        assertRejected(CircuitException.Kind.BAD_VALUE, "op-amp parameters", "quiescentAmps", () -> d.withQuiescent(-1e-3));
        assertRejected(CircuitException.Kind.BAD_VALUE, "op-amp parameters", "supplyMaxVolts", () -> d.withSupplyRange(5, 3));
    }

    @Test
    void opAmpWithBothSupplyPinsOnOneNodeIsABadConnection() {
        assertRejected(CircuitException.Kind.BAD_CONNECTION, "U1", "vNeg",
                () -> new OpAmp("U1", "a", "b", "vcc", "vcc", "out", OpAmpParams.defaults()));
    }

    @Test
    void blankNamesAreBadNames() {
        assertRejected(CircuitException.Kind.BAD_NAME, "", "name", () -> new Resistor(" ", "a", "b", 1));
        assertRejected(CircuitException.Kind.BAD_NAME, "R1", "b", () -> new Resistor("R1", "a", "", 1));
        assertRejected(CircuitException.Kind.BAD_NAME, "", "node", () -> Circuit.builder().node(""));
    }

    @Test
    void builtCircuitIsImmutable() {
        Circuit c = Circuit.builder().node("a").resistor("R1", "a", "0", 1e3).build();
        assertThrows(UnsupportedOperationException.class, () -> c.elements().clear());
        assertThrows(UnsupportedOperationException.class, () -> c.nodes().add("b"));
    }

    @Test
    void replaceSwapsOneElementAndKeepsTheRest() {
        Circuit c = Circuit.builder().node("a").resistor("R1", "a", "0", 1e3).voltageSource("V1", "a", "0", 1).build();
        Circuit d = c.replace("R1", e -> ((Resistor) e).withOhms(2e3));
        assertEquals(2e3, ((Resistor) d.element("R1").orElseThrow()).ohms());
        assertEquals(1e3, ((Resistor) c.element("R1").orElseThrow()).ohms());
        assertEquals(c.elements().get(1), d.elements().get(1));
    }
}
