package halfrail.io;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.circuit.Element;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.VoltageSource;
import halfrail.solve.DcSolver;
import halfrail.solve.OperatingPoint;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Label;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Circuit → netlist text → circuit, and netlist → analysis, give back what went in. */
class NetlistRoundTripTest {

    private static void assertSameCircuit(Circuit expected, Circuit actual) {
        assertEquals(expected.title(), actual.title());
        assertEquals(expected.nodes(), actual.nodes());
        assertEquals(expected.elements(), actual.elements());
    }

    private static final List<String> NODES = List.of("0", "n1", "n2", "Out", "vcc", "ref");

    @Provide
    Arbitrary<Circuit> circuits() {
        Arbitrary<String> node = Arbitraries.of(NODES);
        Arbitrary<Double> value = Combinators.combine(Arbitraries.doubles().between(1, 10),
                Arbitraries.integers().between(-14, 11)).as((m, e) -> m * Math.pow(10, e));
        Arbitrary<Double> signed = Combinators.combine(value, Arbitraries.of(1.0, -1.0, 0.0)).as((v, s) -> v * s);
        Arbitrary<OpAmpParams> params = Combinators.combine(value, value, value, signed, signed, signed, signed,
                        value)
                .as((gain, gbw, sr, vos, ib, cm, swing, rout) -> OpAmpParams.defaults().withOpenLoopGain(gain)
                        .withGainBandwidth(gbw).withSlewRate(sr).withInputErrors(vos, ib, -ib / 7)
                        .withCommonMode(cm, -cm).withSwing(Math.abs(swing), 0).withOutputOhms(rout)
                        .withQuiescent(rout * 1e-9));
        Arbitrary<OpAmpParams> someParams = Arbitraries.oneOf(params, Arbitraries.just(OpAmpParams.defaults()));
        Arbitrary<List<Object[]>> specs = Combinators.combine(Arbitraries.integers().between(0, 4),
                        node.list().ofSize(5), signed, value, someParams)
                .as((type, nodes, s, v, p) -> new Object[] {type, nodes, s, v, p}).list().ofMinSize(1).ofMaxSize(12);
        Arbitrary<String> title = Arbitraries.strings().alpha().numeric().withChars(' ', '-').ofMaxLength(30)
                .map(String::strip);
        return Combinators.combine(title, specs).as((t, list) -> {
            Circuit.Builder b = Circuit.builder().title(t).implicitNodes();
            int i = 0;
            for (Object[] spec : list) {
                i++;
                @SuppressWarnings("unchecked")
                List<String> n = (List<String>) spec[1];
                double s = (Double) spec[2];
                double v = (Double) spec[3];
                String a = n.get(0);
                String c = n.get(1).equals(a) ? (a.equals("0") ? "n1" : "0") : n.get(1);
                switch ((Integer) spec[0]) {
                    case 0 -> b.resistor("R" + i, a, c, v);
                    case 1 -> b.capacitor("C" + i, a, c, v);
                    case 2 -> b.add(new VoltageSource("V" + i, a, c, s, v > 1 ? 0 : v, 0, 0));
                    case 3 -> b.currentSource("I" + i, a, c, s);
                    default -> b.opAmp("X" + i, n.get(2), n.get(3), a, c, n.get(4), (OpAmpParams) spec[4]);
                }
            }
            return b.build();
        });
    }

    @Property(tries = 400, seed = "22832588725447")
    @Label("a circuit written as a netlist reads back equal")
    void aCircuitWrittenAsANetlistReadsBackEqual(@ForAll("circuits") Circuit circuit) {
        assertSameCircuit(circuit, NetlistReader.parse(NetlistWriter.write(circuit)).circuit());
    }

    @ParameterizedTest(name = "{0}")
    @DisplayName("each sample reads, writes and reads back to an equal circuit with its output node and model names")
    @ValueSource(strings = {"nine-volt-boost.cir", "usb-line-driver.cir", "faulty-review.cir"})
    void eachSampleRoundTrips(String name) {
        Netlist first = NetlistReader.read(Path.of("samples", name));
        Netlist second = NetlistReader.parse(NetlistWriter.write(first));
        assertSameCircuit(first.circuit(), second.circuit());
        assertEquals(first.outputNode(), second.outputNode());
        assertEquals(first.opAmpModels(), second.opAmpModels());
    }

    @ParameterizedTest(name = "{0}")
    @DisplayName("a netlist written and read back gives the same DC operating point")
    @ValueSource(strings = {"nine-volt-boost.cir", "usb-line-driver.cir"})
    void aWrittenNetlistGivesTheSameOperatingPoint(String name) {
        Circuit original = NetlistReader.read(Path.of("samples", name)).circuit();
        Circuit again = NetlistReader.parse(NetlistWriter.write(original)).circuit();
        OperatingPoint a = DcSolver.operatingPoint(original);
        OperatingPoint b = DcSolver.operatingPoint(again);
        assertEquals(a.nodeVolts(), b.nodeVolts());
        assertEquals(a.opAmps(), b.opAmps());
    }

    @Test
    @DisplayName("series resistance and leakage are written as resistors and keep the DC operating point")
    void seriesResistanceAndLeakageKeepTheOperatingPoint() {
        // A 9 V source with 10 Ω inside feeding a divider; a leaky 10 µF capacitor (1 µA at 1 V,
        // 1 µS) across the lower leg. Independent check: lower leg 10k ‖ 1 MΩ = 9900.99 Ω,
        // V(mid) = 9 · 9900.99 / (9900.99 + 10000 + 10) — Ohm's law and the divider rule.
        Circuit c = Circuit.builder().title("leaky").implicitNodes()
                .add(new VoltageSource("V1", "vcc", "0", 9, 0, 10, 1e-3))
                .resistor("R1", "vcc", "mid", 10e3)
                .resistor("R2", "mid", "0", 10e3)
                .add(new Capacitor("C1", "mid", "0", 10e-6, 0.2, "aluminium-electrolytic", 16, true, 1e-6))
                .build();
        String text = NetlistWriter.write(c);
        assertTrue(text.contains("RV1_series"), text);
        assertTrue(text.contains("RC1_leak mid 0 1meg"), text);
        assertTrue(text.contains("* C1: tolerance 0.2, technology aluminium-electrolytic, rated 16.0 V"), text);
        assertTrue(text.contains("* V1: power-on ramp"), text);
        Circuit back = NetlistReader.parse(text).circuit();
        double lower = 1 / (1 / 10e3 + 1e-6);
        double expected = 9 * lower / (lower + 10e3 + 10);
        assertEquals(expected, DcSolver.operatingPoint(c).voltage("mid"), 1e-9);
        assertEquals(expected, DcSolver.operatingPoint(back).voltage("mid"), 1e-9);
    }

    @Test
    @DisplayName("op-amps with equal parameters share one .model; distinct sets get one each")
    void equalParametersShareOneModel() {
        OpAmpParams p = OpAmpParams.defaults().withSwing(0.1, 0.1);
        Circuit c = Circuit.builder().title("t").implicitNodes().voltageSource("V1", "vcc", "0", 5)
                .resistor("R1", "a", "0", 1e3)
                .opAmp("X1", "a", "o1", "vcc", "0", "o1", p)
                .opAmp("X2", "a", "o2", "vcc", "0", "o2", p)
                .opAmp("X3", "a", "o3", "vcc", "0", "o3", OpAmpParams.defaults())
                .build();
        String text = NetlistWriter.write(c);
        assertEquals(2, text.lines().filter(l -> l.startsWith(".model")).count(), text);
        Netlist back = NetlistReader.parse(text);
        assertEquals(back.opAmpModels().get("X1"), back.opAmpModels().get("X2"));
        assertSameCircuit(c, back.circuit());
    }

    @Test
    @DisplayName("model names and the output node of a read netlist are written back")
    void modelNamesAndOutputNodeAreKept() {
        Netlist n = NetlistReader.parse("t\n* output: o\nV1 v 0 5\nR1 a 0 1k\nX1 a o v 0 o Mine\n"
                + ".model Mine opamp gbw=10meg\n.end\n");
        String text = NetlistWriter.write(n);
        assertTrue(text.contains(".model Mine opamp (avol=100k gbw=10meg)"), text);
        assertTrue(text.contains("* output: o"), text);
        assertEquals(Optional.of("o"), NetlistReader.parse(text).outputNode());
    }

    @Test
    @DisplayName("an element whose name lacks its type letter gets it put in front")
    void anElementNameGetsItsTypeLetter() {
        Circuit c = Circuit.builder().title("t").implicitNodes().voltageSource("supply", "a", "0", 1)
                .resistor("load", "a", "0", 1e3).build();
        Circuit back = NetlistReader.parse(NetlistWriter.write(c)).circuit();
        List<String> names = new ArrayList<>();
        for (Element e : back.elements()) {
            names.add(e.name());
        }
        assertEquals(List.of("Vsupply", "Rload"), names);
    }

    @Test
    @DisplayName("nodes differing only in case cannot be written: netlist names are case-insensitive")
    void nodesDifferingOnlyInCaseAreNotExpressible() {
        Circuit c = Circuit.builder().title("t").implicitNodes().voltageSource("V1", "a", "0", 1)
                .resistor("R1", "a", "A", 1e3).resistor("R2", "A", "0", 1e3).build();
        NetlistException e = assertThrows(NetlistException.class, () -> NetlistWriter.write(c));
        assertEquals(NetlistException.Kind.NOT_EXPRESSIBLE, e.kind());
        Circuit spaced = Circuit.builder().title("t").implicitNodes().resistor("R1", "a b", "0", 1).build();
        assertEquals(NetlistException.Kind.NOT_EXPRESSIBLE,
                assertThrows(NetlistException.class, () -> NetlistWriter.write(spaced)).kind());
    }

    @Test
    @DisplayName("values are written with meg for mega, never M")
    void valuesAreWrittenWithMeg() {
        Circuit c = Circuit.builder().title("t").implicitNodes().voltageSource("V1", "a", "0", 1)
                .resistor("R1", "a", "0", 2.2e6).build();
        String text = NetlistWriter.write(c);
        assertTrue(text.contains("R1 a 0 2.2meg"), text);
        assertEquals(Map.of("a", 1.0), DcSolver.operatingPoint(NetlistReader.parse(text).circuit()).nodeVolts());
    }
}
