package halfrail.io;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.circuit.CurrentSource;
import halfrail.circuit.OpAmp;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.Resistor;
import halfrail.circuit.VoltageSource;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The netlist subset of docs/netlist.md. The general rules (title line, * comments, + continuation,
 * case-insensitivity, .end, node 0 as ground, element lines R/C/V/I with [DC] and AC) follow the
 * SPICE3 user's manual (Quarles, SPICE3 Version 3f3 User's Manual, UC Berkeley 1993, §2 and §3,
 * from memory); the op-amp element and its .model parameters are Halfrail's own.
 */
class NetlistReaderTest {

    private static Netlist parse(String... lines) {
        return NetlistReader.parse(String.join("\n", lines) + "\n");
    }

    private static NetlistException error(String... lines) {
        return assertThrows(NetlistException.class, () -> parse(lines));
    }

    @Test
    @DisplayName("the first line is the title, even when it looks like an element (SPICE3 manual §2.1)")
    void theFirstLineIsTheTitle() {
        Netlist n = parse("R1 a 0 1k", "R2 a 0 2k", ".end");
        assertEquals("R1 a 0 1k", n.circuit().title());
        assertEquals(1, n.circuit().elements().size());
    }

    @Test
    @DisplayName("resistors, capacitors and sources read with their values and terminal order")
    void elementsReadWithValuesAndTerminalOrder() {
        Circuit c = parse("t", "V1 vcc 0 DC 9", "I1 vcc out 1m", "R1 vcc out 4.7k", "C1 out 0 100n", ".end")
                .circuit();
        assertEquals(List.of(new VoltageSource("V1", "vcc", "0", 9), new CurrentSource("I1", "vcc", "out", 1e-3),
                new Resistor("R1", "vcc", "out", 4700), new Capacitor("C1", "out", "0", 1e-7)), c.elements());
        assertEquals(List.of("vcc", "out"), c.nodes());
    }

    @Test
    @DisplayName("a voltage source takes DC optionally and an AC magnitude (SPICE3 manual §3.4)")
    void aVoltageSourceTakesDcOptionallyAndAnAcMagnitude() {
        Circuit c = parse("t", "V1 a 0 5", "V2 b 0 DC 3 AC 1", "V3 c 0 AC 0.5", "V4 d 0 dc -2 ac 10m",
                "R1 a b 1k", "R2 b c 1k", "R3 c d 1k", ".end").circuit();
        assertEquals(new VoltageSource("V1", "a", "0", 5, 0, 0, 0), c.element("V1").orElseThrow());
        assertEquals(new VoltageSource("V2", "b", "0", 3, 1, 0, 0), c.element("V2").orElseThrow());
        assertEquals(new VoltageSource("V3", "c", "0", 0, 0.5, 0, 0), c.element("V3").orElseThrow());
        assertEquals(new VoltageSource("V4", "d", "0", -2, 0.01, 0, 0), c.element("V4").orElseThrow());
    }

    @Test
    @DisplayName("a current source takes DC optionally")
    void aCurrentSourceTakesDcOptionally() {
        Circuit c = parse("t", "I1 a 0 DC 2u", "I2 a 0 3u", "R1 a 0 1k", ".end").circuit();
        assertEquals(2e-6, ((CurrentSource) c.element("I1").orElseThrow()).amps());
        assertEquals(3e-6, ((CurrentSource) c.element("I2").orElseThrow()).amps());
    }

    @Test
    @DisplayName("values take SPICE suffixes: meg is mega and m is milli, µ is micro, unit letters are ignored")
    void valuesTakeSpiceSuffixes() {
        Circuit c = parse("t", "R1 a 0 1meg", "R2 a 0 1M", "C1 a 0 10µF", "R3 a 0 4.7kohm", "C2 a 0 1e-9",
                "V1 a 0 DC 1", ".end").circuit();
        assertEquals(1e6, ((Resistor) c.element("R1").orElseThrow()).ohms());
        assertEquals(1e-3, ((Resistor) c.element("R2").orElseThrow()).ohms());
        assertEquals(1e-5, ((Capacitor) c.element("C1").orElseThrow()).farads());
        assertEquals(4700, ((Resistor) c.element("R3").orElseThrow()).ohms());
        assertEquals(1e-9, ((Capacitor) c.element("C2").orElseThrow()).farads());
    }

    @Test
    @DisplayName("a + line continues the line before it, across comments and blank lines (SPICE3 manual §2.1)")
    void aPlusLineContinuesTheLineBeforeIt() {
        Circuit c = parse("t", "R1 a", "* a comment between", "", "+ 0", "  +   2.2k", "V1 a 0 1", ".end").circuit();
        assertEquals(new Resistor("R1", "a", "0", 2200), c.element("R1").orElseThrow());
    }

    @Test
    @DisplayName("comment lines and indented comments are skipped")
    void commentLinesAreSkipped() {
        Circuit c = parse("t", "* R9 a 0 1k", "   * V9 a 0 1", "R1 a 0 1k", "V1 a 0 1", ".end").circuit();
        assertEquals(2, c.elements().size());
    }

    @Test
    @DisplayName("keywords, node names and model names are case-insensitive; nodes keep their first spelling")
    void namesAreCaseInsensitive() {
        Netlist n = parse("t", "v1 OUT 0 dc 1", "r1 out Mid 1K", "R2 MID gnd 1k", "X1 mid OUT out 0 mid gp",
                ".MODEL GP OPAMP (AVOL=1E5)", ".END");
        Circuit c = n.circuit();
        assertEquals(List.of("OUT", "Mid"), c.nodes());
        assertEquals(new Resistor("R2", "Mid", "0", 1000), c.element("R2").orElseThrow());
        assertEquals("Mid", ((OpAmp) c.element("X1").orElseThrow()).out());
        assertEquals(List.of("GP"), n.modelNames());
        assertEquals("GP", n.opAmpModels().get("X1"));
    }

    @Test
    @DisplayName("node 0 and gnd, in any case, are ground")
    void nodeZeroAndGndAreGround() {
        Circuit c = parse("t", "V1 a gnd 1", "R1 a GND 1k", "R2 a 0 1k", ".end").circuit();
        assertEquals(List.of("a"), c.nodes());
        assertEquals("0", ((VoltageSource) c.element("V1").orElseThrow()).minus());
        assertEquals("0", ((Resistor) c.element("R1").orElseThrow()).b());
    }

    @Test
    @DisplayName("an op-amp reads its five nodes in order and its parameters from a .model defined after it")
    void anOpAmpReadsItsModelDefinedAfterIt() {
        Circuit c = parse("t", "V1 vcc 0 9", "X1 inp inm vcc 0 out part", "R1 out inm 10k", "R2 inp 0 10k",
                ".model part opamp (avol=200k gbw=3meg sr=1meg vos=2m ib=20n ios=2n",
                "+ swing_low=1.2 swing_high=1.5 cm_low=0.1 cm_high=1.4 rout=50 iq=500u)", ".end").circuit();
        OpAmp o = (OpAmp) c.element("X1").orElseThrow();
        assertEquals(List.of("inp", "inm", "vcc", "0", "out"), o.terminals());
        OpAmpParams p = o.params();
        assertEquals(2e5, p.openLoopGain());
        assertEquals(3e6, p.gainBandwidthHz());
        assertEquals(1e6, p.slewRateVoltsPerSecond());
        assertEquals(2e-3, p.offsetVolts());
        assertEquals(20e-9, p.biasAmps());
        assertEquals(2e-9, p.offsetCurrentAmps());
        assertEquals(1.2, p.swingLowVolts());
        assertEquals(1.5, p.swingHighVolts());
        assertEquals(0.1, p.commonModeLowVolts());
        assertEquals(1.4, p.commonModeHighVolts());
        assertEquals(50, p.outputOhms());
        assertEquals(500e-6, p.quiescentAmps());
    }

    @Test
    @DisplayName("model parameters need no parentheses, come in any order, allow spaces round '=', and default as in issue 5")
    void modelParametersInAnyOrderWithDefaults() {
        Circuit c = parse("t", "V1 vcc 0 9", "X1 a b vcc 0 b m1", "X2 a c vcc 0 c m2", "R1 a 0 1k",
                ".model m1 opamp ib = 1n avol= 5e4", ".model m2 opamp", ".end").circuit();
        OpAmpParams p = ((OpAmp) c.element("X1").orElseThrow()).params();
        assertEquals(OpAmpParams.defaults().withOpenLoopGain(5e4).withInputErrors(0, 1e-9, 0), p);
        assertEquals(OpAmpParams.defaults(), ((OpAmp) c.element("X2").orElseThrow()).params());
        assertEquals(1e5, OpAmpParams.defaults().openLoopGain(), "issue 5: avol defaults to 1e5");
        assertEquals(1e6, OpAmpParams.defaults().gainBandwidthHz(), "issue 5: gbw defaults to 1 MHz");
    }

    @Test
    @DisplayName("an * output: comment names the output node, spelt as in the circuit")
    void anOutputCommentNamesTheOutputNode() {
        Netlist n = parse("t", "*   OUTPUT:  Load  the load resistor", "V1 load 0 1", "R1 LOAD 0 1k", ".end");
        assertEquals(Optional.of("load"), n.outputNode());
        assertEquals(Optional.empty(), parse("t", "V1 a 0 1", "R1 a 0 1k", ".end").outputNode());
    }

    @Test
    @DisplayName("analysis directives are accepted and reported as notes with their line")
    void analysisDirectivesBecomeNotes() {
        Netlist n = parse("t", "V1 a 0 1", ".op", ".TRAN 1u 1m", ".ac dec 10 1 100k", ".dc V1 0 1 0.1",
                ".print v(a)", ".plot v(a)", ".options reltol=1e-4", "R1 a 0 1k", ".end");
        assertEquals(List.of(3, 4, 5, 6, 7, 8, 9), n.notes().stream().map(Netlist.Note::line).toList());
        assertTrue(n.notes().get(1).text().contains(".tran"));
    }

    @Test
    @DisplayName("text after .end is ignored with a note; a missing .end is noted")
    void textAfterEndIsIgnored() {
        Netlist n = parse("t", "V1 a 0 1", "R1 a 0 1k", ".end", "R2 a 0 junk");
        assertEquals(2, n.circuit().elements().size());
        assertEquals(5, n.notes().get(0).line());
        Netlist open = parse("t", "V1 a 0 1", "R1 a 0 1k");
        assertTrue(open.notes().get(0).text().contains(".end"));
    }

    @Test
    @DisplayName("Windows line ends and a byte-order mark are accepted")
    void windowsLineEndsAndAByteOrderMarkAreAccepted() {
        Netlist n = NetlistReader.parse("\uFEFFtitle\r\nV1 a 0 1\r\nR1 a 0 1k\r\n.end\r\n");
        assertEquals("title", n.circuit().title());
        assertEquals(2, n.circuit().elements().size());
    }

    // ---- errors: kind and line

    @Test
    void aContinuationWithNothingBeforeItIsAnErrorOnItsLine() {
        NetlistException e = error("t", "+ R1 a 0 1k");
        assertEquals(NetlistException.Kind.ORPHAN_CONTINUATION, e.kind());
        assertEquals(2, e.line());
    }

    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"L1 a 0 1u", "D1 a 0 dmod", "Q1 a b 0 npn", "E1 a 0 b 0 10", "M1 a b 0 0 nmos"})
    void elementTypesOutsideTheSubsetAreErrorsOnTheirLine(String line) {
        NetlistException e = error("t", "V1 a 0 1", line, ".end");
        assertEquals(NetlistException.Kind.UNSUPPORTED_ELEMENT, e.kind());
        assertEquals(3, e.line());
        assertEquals(1, e.column());
    }

    @Test
    void aSubcircuitIsAnUnsupportedDirective() {
        NetlistException e = error("t", "V1 a 0 1", ".subckt amp a b", ".ends", ".end");
        assertEquals(NetlistException.Kind.UNSUPPORTED_DIRECTIVE, e.kind());
        assertEquals(3, e.line());
    }

    @Test
    void anUnknownDirectiveIsAnErrorNamingItsLine() {
        NetlistException e = error("t", "V1 a 0 1", "R1 a 0 1k", ".frobnicate 3", ".end");
        assertEquals(NetlistException.Kind.UNKNOWN_DIRECTIVE, e.kind());
        assertEquals(4, e.line());
        assertTrue(e.getMessage().startsWith("line 4"), e.getMessage());
    }

    @Test
    void aBadValueIsAnErrorWithLineColumnAndWhatWasExpected() {
        NetlistException e = error("t", "V1 a 0 1", "R1 a 0 4k7", ".end");
        assertEquals(NetlistException.Kind.BAD_VALUE, e.kind());
        assertEquals(3, e.line());
        assertEquals(8, e.column());
        assertFalse(e.expected().isEmpty());
    }

    @Test
    void aValueOnAContinuationLineIsReportedOnThatLine() {
        NetlistException e = error("t", "V1 a 0 1", "R1 a 0", "+ abc", ".end");
        assertEquals(NetlistException.Kind.BAD_VALUE, e.kind());
        assertEquals(4, e.line());
        assertEquals(3, e.column());
    }

    @Test
    void aLineThatEndsEarlyIsAMissingField() {
        NetlistException e = error("t", "V1 a 0 1", "R1 a 0", ".end");
        assertEquals(NetlistException.Kind.MISSING_FIELD, e.kind());
        assertEquals(3, e.line());
        assertEquals(NetlistException.Kind.MISSING_FIELD, error("t", "V1 a 0", ".end").kind());
        assertEquals(NetlistException.Kind.MISSING_FIELD, error("t", "V1 a 0 1", "X1 a b c d e", ".end").kind());
        assertEquals(NetlistException.Kind.MISSING_FIELD, error("t", "V1 a 0 DC", ".end").kind());
    }

    @Test
    void extraFieldsAreUnexpectedTokens() {
        NetlistException e = error("t", "V1 a 0 1", "R1 a 0 1k tc1=0.001", ".end");
        assertEquals(NetlistException.Kind.UNEXPECTED_TOKEN, e.kind());
        assertEquals(3, e.line());
        assertEquals(11, e.column());
    }

    @Test
    void aTransientSourceSpecificationIsRefused() {
        NetlistException e = error("t", "V1 a 0 PULSE(0 1 0 1n 1n 1u 2u)", "R1 a 0 1k", ".end");
        assertEquals(NetlistException.Kind.BAD_VALUE, e.kind());
        assertEquals(2, e.line());
    }

    @Test
    void aNameWithForbiddenCharactersIsABadName() {
        NetlistException e = error("t", "V1 a 0 1", "R1 a;b 0 1k", ".end");
        assertEquals(NetlistException.Kind.BAD_NAME, e.kind());
        assertEquals(3, e.line());
    }

    @Test
    void aModelOfAnotherTypeIsUnsupported() {
        NetlistException e = error("t", "V1 a 0 1", "R1 a 0 1k", ".model d1 D (is=1e-14)", ".end");
        assertEquals(NetlistException.Kind.UNSUPPORTED_MODEL, e.kind());
        assertEquals(4, e.line());
    }

    @Test
    void anOpAmpWithoutItsModelIsAnErrorOnTheOpAmpLine() {
        NetlistException e = error("t", "V1 v 0 9", "R1 a 0 1k", "X1 a b v 0 b nosuch", ".end");
        assertEquals(NetlistException.Kind.UNKNOWN_MODEL, e.kind());
        assertEquals(4, e.line());
        assertEquals(14, e.column());
    }

    @Test
    void twoModelsOfOneNameAreAnErrorOnTheSecond() {
        NetlistException e = error("t", "V1 v 0 9", "R1 v 0 1k", ".model m opamp", ".model M opamp", ".end");
        assertEquals(NetlistException.Kind.DUPLICATE_MODEL, e.kind());
        assertEquals(5, e.line());
        assertEquals(NetlistException.Kind.DUPLICATE_MODEL,
                error("t", "V1 v 0 9", ".model m opamp avol=1 avol=2", ".end").kind());
    }

    @Test
    void anUnknownModelParameterIsNamed() {
        NetlistException e = error("t", "V1 v 0 9", ".model m opamp (avol=1e5 level=3)", ".end");
        assertEquals(NetlistException.Kind.UNKNOWN_PARAMETER, e.kind());
        assertEquals(3, e.line());
        assertTrue(e.getMessage().contains("level"));
    }

    @Test
    void aModelParameterWithoutEqualsIsAnUnexpectedToken() {
        NetlistException e = error("t", "V1 v 0 9", ".model m opamp avol 1e5", ".end");
        assertEquals(NetlistException.Kind.UNEXPECTED_TOKEN, e.kind());
    }

    @Test
    void aModelParameterOutsideItsRangeIsABadElementOnTheModelLine() {
        NetlistException e = error("t", "V1 v 0 9", "R1 v 0 1k", ".model m opamp (gbw=-1)", ".end");
        assertEquals(NetlistException.Kind.BAD_ELEMENT, e.kind());
        assertEquals(4, e.line());
    }

    @Test
    @DisplayName("a refusal by the circuit model names the element's line: zero resistance, shorted source, duplicate name")
    void aRefusalByTheCircuitModelNamesTheLine() {
        NetlistException zero = error("t", "V1 a 0 1", "R1 a 0 0", ".end");
        assertEquals(NetlistException.Kind.BAD_ELEMENT, zero.kind());
        assertEquals(3, zero.line());
        NetlistException shorted = error("t", "R1 a 0 1k", "V1 a a 1", ".end");
        assertEquals(NetlistException.Kind.BAD_ELEMENT, shorted.kind());
        assertEquals(3, shorted.line());
        NetlistException twice = error("t", "V1 a 0 1", "R1 a 0 1k", "r1 a 0 2k", ".end");
        assertEquals(NetlistException.Kind.BAD_ELEMENT, twice.kind());
        assertEquals(4, twice.line());
        NetlistException negativeAc = error("t", "V1 a 0 DC 1 AC -1", "R1 a 0 1k", ".end");
        assertEquals(2, negativeAc.line());
    }

    @Test
    void anOutputCommentNamingNoNodeIsAnErrorOnItsLine() {
        NetlistException unknown = error("t", "* output: nowhere", "V1 a 0 1", "R1 a 0 1k", ".end");
        assertEquals(NetlistException.Kind.UNKNOWN_NODE, unknown.kind());
        assertEquals(2, unknown.line());
        assertEquals(NetlistException.Kind.UNKNOWN_NODE,
                error("t", "* output: gnd", "V1 a 0 1", ".end").kind());
        assertEquals(NetlistException.Kind.MISSING_FIELD, error("t", "* output:", "V1 a 0 1", ".end").kind());
        NetlistException twice = error("t", "* output: a", "V1 a 0 1", "* output: a", ".end");
        assertEquals(NetlistException.Kind.DUPLICATE_OUTPUT, twice.kind());
        assertEquals(4, twice.line());
    }

    @Test
    void aNetlistWithoutElementsIsEmpty() {
        assertEquals(NetlistException.Kind.EMPTY, error("title only").kind());
        assertEquals(NetlistException.Kind.EMPTY, assertThrows(NetlistException.class,
                () -> NetlistReader.parse("")).kind());
        assertEquals(NetlistException.Kind.EMPTY, error("t", "* nothing", ".op", ".end").kind());
    }

    @Test
    void textAboveTheSizeLimitIsRefusedBeforeParsing() {
        String big = "t\n" + "*".repeat((int) NetlistReader.MAX_BYTES);
        assertEquals(NetlistException.Kind.TOO_LARGE,
                assertThrows(NetlistException.class, () -> NetlistReader.parse(big)).kind());
    }

    @Test
    void aFileAboveTheSizeLimitIsRefusedBeforeReading(@TempDir Path dir) throws IOException {
        Path f = dir.resolve("big.cir");
        try (var ch = Files.newByteChannel(f, java.nio.file.StandardOpenOption.CREATE_NEW,
                java.nio.file.StandardOpenOption.WRITE, java.nio.file.StandardOpenOption.SPARSE)) {
            ch.position(NetlistReader.MAX_BYTES);
            ch.write(java.nio.ByteBuffer.wrap(new byte[] {'\n'}));
        }
        assertEquals(NetlistException.Kind.TOO_LARGE,
                assertThrows(NetlistException.class, () -> NetlistReader.read(f)).kind());
    }

    @Test
    void aMissingFileIsUnreadable(@TempDir Path dir) {
        NetlistException e = assertThrows(NetlistException.class, () -> NetlistReader.read(dir.resolve("no.cir")));
        assertEquals(NetlistException.Kind.UNREADABLE, e.kind());
        assertEquals(NetlistException.Kind.UNREADABLE,
                assertThrows(NetlistException.class, () -> NetlistReader.read(dir)).kind());
    }

    @Test
    void aFileThatIsNotUtf8IsABadEncoding(@TempDir Path dir) throws IOException {
        Path f = dir.resolve("latin1.cir");
        Files.write(f, "t\nC1 a 0 10\u00b5\nV1 a 0 1\n".getBytes(StandardCharsets.ISO_8859_1));
        assertEquals(NetlistException.Kind.BAD_ENCODING,
                assertThrows(NetlistException.class, () -> NetlistReader.read(f)).kind());
    }
}
