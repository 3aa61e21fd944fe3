package halfrail.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The check and netlist commands run through picocli with captured output, as a pipeline would run them. */
class CheckCommandTest {
    private static final String BOOST = "samples/nine-volt-boost.cir";
    private static final String USB = "samples/usb-line-driver.cir";
    private static final String FAULTY = "samples/faulty-review.cir";

    /** Exit code, standard output and standard error of one run. */
    record Run(int code, String out, String err) {
        JsonNode json() {
            try {
                return new ObjectMapper().readTree(out);
            } catch (IOException e) {
                throw new AssertionError("not JSON: " + out, e);
            }
        }

        JsonNode file(int i) {
            return json().get("files").get(i);
        }
    }

    static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        CommandLine cl = HalfrailCommand.newCommandLine();
        cl.setOut(new PrintWriter(out));
        cl.setErr(new PrintWriter(err));
        int code = cl.execute(args);
        return new Run(code, out.toString(), err.toString());
    }

    private static List<String> codes(JsonNode file) {
        List<String> out = new ArrayList<>();
        file.get("findings").forEach(f -> out.add(f.get("code").asText()));
        return out;
    }

    private static Path write(Path dir, String name, String text) throws IOException {
        Path f = dir.resolve(name);
        Files.writeString(f, text);
        return f;
    }

    @Test
    @DisplayName("the healthy nine-volt sample passes with exit 0 and a readable operating point")
    void theNineVoltSamplePasses() {
        Run r = run("check", BOOST);
        assertEquals(ExitCodes.PASS, r.code(), r.err());
        assertTrue(r.out().contains("vcc   9.0000 V"), r.out());
        assertTrue(r.out().contains("verdict: pass"), r.out());
        assertEquals("", r.err());
    }

    @Test
    @DisplayName("JSON of the nine-volt sample: divider and bias-current drops as closed forms predict")
    void jsonOfTheNineVoltSample() {
        Run r = run("check", "--format", "json", BOOST);
        assertEquals(ExitCodes.PASS, r.code(), r.err());
        JsonNode f = r.file(0);
        assertEquals(BOOST, f.get("file").asText());
        JsonNode nodes = f.get("nodes");
        // Bias current into in+ is Ib + Ios/2 = 21 nA (OpAmpParams convention). It flows from the
        // 100k/100k divider (Thevenin 4.5 V behind 50 kΩ) through R3 = 1 MΩ: ref = 4.5 − 21n·50k,
        // inp = ref − 21n·1M — Ohm's law; bias-current offset as in Eggleston, Basic Electronics
        // for Scientists and Engineers (2011) §6.4.
        assertEquals(4.5 - 21e-9 * 50e3, nodes.get("ref").asDouble(), 1e-6);
        assertEquals(4.5 - 21e-9 * 1.05e6, nodes.get("inp").asDouble(), 1e-6);
        // DC gain 1 (C3 blocks R5): in− follows in+ plus Vos = 2 mV, and out sits (Ib − Ios/2)·R4 =
        // 19 nA · 100 kΩ above in−; the load node is 0 V behind C4.
        assertEquals(nodes.get("inp").asDouble() + 2e-3, nodes.get("inm").asDouble(), 1e-4);
        assertEquals(nodes.get("inm").asDouble() + 19e-9 * 100e3, nodes.get("out").asDouble(), 1e-6);
        assertEquals(0, nodes.get("load").asDouble(), 1e-9);
        assertEquals(9.0, nodes.get("vcc").asDouble());
        JsonNode x1 = f.get("opamps").get(0);
        assertEquals("X1", x1.get("name").asText());
        assertEquals(nodes.get("out").asDouble(), x1.get("output").asDouble());
        assertEquals(nodes.get("inp").asDouble(), x1.get("inPlus").asDouble());
        assertEquals(nodes.get("inm").asDouble(), x1.get("inMinus").asDouble());
        assertEquals(1.2, x1.get("swingLow").asDouble(), 1e-12, "swing_low is headroom above V− = 0 V");
        assertEquals(7.5, x1.get("swingHigh").asDouble(), 1e-12, "swing_high 1.5 V below V+ = 9 V");
        assertFalse(x1.get("saturated").asBoolean());
        assertTrue(x1.get("commonModeOk").asBoolean());
        assertEquals(0, f.get("floating").size());
        // Three near-identical first-order corners at 1/(2π·RC) = 1.59 Hz (C2·R3 with 100 nF and 1 MΩ,
        // C3·R5 and C4·R6 with 10 µF and 10 kΩ): identical buffered high-pass poles give the cascade's
        // −3 dB point at f0/√(2^(1/3) − 1) = 3.12 Hz (exact); the real network lies within 5 % of it.
        double f0 = 1 / (2 * Math.PI * 10e-6 * 10e3);
        assertEquals(f0 / Math.sqrt(Math.cbrt(2) - 1), f.get("lowerCornerHz").asDouble(), 0.05 * 3.12);
        // The output follows the reference (DC gain 1), which charges through 100k‖100k into 10 µF:
        // it cannot settle within 1 % of 9 V before τ·ln(4.5 V / 90 mV) = 1.96 s (exact from e^(−t/τ)).
        double tau = 50e3 * 10e-6;
        double settle = f.get("settleTime").asDouble();
        assertTrue(settle >= tau * Math.log(4.5 / 0.09) && settle < 10 * tau * Math.log(4.5 / 0.09),
                "settle-up " + settle + " s");
        assertEquals(0, f.get("findings").size());
        assertEquals("load", f.get("outputNode").asText());
        assertEquals("pass", f.get("verdict").asText());
    }

    @Test
    @DisplayName("the USB line driver rests at half the 5 V rail and passes")
    void theUsbLineDriverPasses() {
        Run r = run("check", "--format", "json", USB);
        assertEquals(ExitCodes.PASS, r.code(), r.err());
        JsonNode f = r.file(0);
        // 47k/47k divider of 5 V; a 1 pA bias current shifts it by well under a microvolt.
        assertEquals(2.5, f.get("nodes").get("ref").asDouble(), 1e-6);
        // Follower at DC with finite gain: out = A·(in+ + Vos)/(1 + A), A = 1e5, Vos = 1 mV
        // (standard closed-loop gain expression, e.g. any op-amp text).
        // in+ sits 1 pA · (470k + 47k‖47k) below the 2.5 V reference.
        double a = 1e5;
        double inPlus = 2.5 - 1e-12 * (470e3 + 23.5e3);
        assertEquals(inPlus, f.get("opamps").get(0).get("inPlus").asDouble(), 1e-9);
        assertEquals(a * (inPlus + 1e-3) / (1 + a), f.get("opamps").get(0).get("output").asDouble(), 1e-8);
        assertEquals(0, f.get("findings").size());
    }

    @Test
    @DisplayName("the faulty sample fails: a floating input and a stage that amplifies its bias into the rail")
    void theFaultySampleFails() {
        Run r = run("check", "--format", "json", FAULTY);
        assertEquals(ExitCodes.FINDING, r.code(), r.err());
        JsonNode f = r.file(0);
        assertEquals(List.of("NO_DC_PATH", "REST_ON_RAIL"), codes(f));
        assertEquals("inpa", f.get("floating").get(0).asText());
        assertTrue(f.get("nodes").get("inpa").isNull());
        JsonNode floatingFinding = f.get("findings").get(0);
        assertEquals("fail", floatingFinding.get("severity").asText());
        assertEquals("CA1", floatingFinding.get("parts").get(0).asText());
        JsonNode saturated = f.get("findings").get(1);
        assertEquals("XB", saturated.get("parts").get(0).asText());
        JsonNode xb = f.get("opamps").get(1);
        assertTrue(xb.get("saturated").asBoolean());
        // Gain 1 + 100k/10k = 11 times a 4.48 V bias is far above the rail, so the output sits on
        // the upper limit 9 − 1.5 = 7.5 V (within the solver's 10 mV knee).
        assertEquals(7.5, xb.get("output").asDouble(), 0.01);
        assertEquals("fail", f.get("verdict").asText());
    }

    @Test
    @DisplayName("an output near a limit warns; --fail-on warn turns the warning into exit 1")
    void anOutputNearALimitWarns(@TempDir Path dir) throws IOException {
        // Follower biased at 5 V · 3k / 50k = 0.3 V; swing window 0.05..4.95 V, 10 % of it is 0.49 V.
        Path f = write(dir, "low.cir", "low rest\nV1 vcc 0 5\nR1 vcc inp 47k\nR2 inp 0 3k\n"
                + "X1 inp out vcc 0 out rr\nR3 out 0 10k\n.model rr opamp swing_low=50m swing_high=50m\n.end\n");
        Run lenient = run("check", "--format", "json", f.toString());
        assertEquals(ExitCodes.PASS, lenient.code(), lenient.err());
        assertEquals(List.of("REST_NEAR_RAIL"), codes(lenient.file(0)));
        assertEquals("warn", lenient.file(0).get("findings").get(0).get("severity").asText());
        assertEquals(ExitCodes.FINDING, run("check", "--fail-on", "warn", f.toString()).code());
        assertEquals(ExitCodes.FINDING, run("check", "--fail-on", "WARN", f.toString()).code());
    }

    @Test
    @DisplayName("an op-amp astable keeps oscillating after power-on: a warning with its period, "
            + "T = 2RC·ln 3 = 2.2 ms for a divider of one half (Sedra and Smith, Microelectronic Circuits, astable "
            + "multivibrator; from memory)")
    void anAstableKeepsOscillating(@TempDir Path dir) throws IOException {
        Path f = write(dir, "astable.cir", "astable\nV1 vcc 0 9\nVREF ref 0 4.5\nR1 out inn 10k\nC1 inn ref 100n\n"
                + "R2 out inp 10k\nR3 inp ref 10k\nX1 inp inn vcc 0 out fast\n"
                + ".model fast opamp sr=10meg swing_low=0.5 swing_high=0.5\n.end\n");
        Run r = run("check", "--format", "json", f.toString());
        assertEquals(ExitCodes.PASS, r.code(), r.err());
        assertEquals(List.of("KEEPS_OSCILLATING"), codes(r.file(0)));
        JsonNode finding = r.file(0).get("findings").get(0);
        assertEquals("warn", finding.get("severity").asText());
        assertTrue(finding.get("message").asText().contains("2.2"), finding.get("message").asText());
        assertTrue(r.file(0).get("settleTime").isNull());
        JsonNode o = r.file(0).get("oscillation");
        assertEquals("out", o.get("node").asText());
        // T = 2RC·ln((1 + β)/(1 − β)) = 2 · 10 kΩ · 100 nF · ln 3 = 2.197 ms, β = 1/2
        assertEquals(2 * 10e3 * 100e-9 * Math.log(3), o.get("periodSeconds").asDouble(), 0.02 * 2.197e-3);
        // rail to rail: 9 V less 0.5 V of swing headroom at each end
        assertEquals(8, o.get("peakToPeakVolts").asDouble(), 0.2);
        assertTrue(run("check", f.toString()).out().contains("keeps oscillating at out"));
    }

    @Test
    @DisplayName("an input above the common-mode range fails")
    void anInputAboveTheCommonModeRangeFails(@TempDir Path dir) throws IOException {
        // Follower biased at 5 V · 4k / 5k = 4 V; the inputs reach only to 5 − 1.5 = 3.5 V.
        Path f = write(dir, "cm.cir", "cm\nV1 vcc 0 5\nR1 vcc inp 1k\nR2 inp 0 4k\n"
                + "X1 inp out vcc 0 out classic\n.model classic opamp swing_low=0.5 swing_high=0.5 cm_high=1.5\n");
        Run r = run("check", "--format", "json", f.toString());
        assertEquals(ExitCodes.FINDING, r.code(), r.err());
        assertEquals(List.of("COMMON_MODE"), codes(r.file(0)));
        assertFalse(r.file(0).get("opamps").get(0).get("commonModeOk").asBoolean());
    }

    @Test
    @DisplayName("a directory is checked file by file in name order")
    void aDirectoryIsCheckedInNameOrder() {
        Run r = run("check", "--format", "json", "samples");
        assertEquals(ExitCodes.FINDING, r.code(), r.err());
        List<String> files = new ArrayList<>();
        r.json().get("files").forEach(f -> files.add(Path.of(f.get("file").asText()).getFileName().toString()));
        List<String> sorted = new ArrayList<>(files);
        java.util.Collections.sort(sorted);
        assertEquals(sorted, files);
        assertTrue(files.containsAll(List.of("faulty-review.cir", "nine-volt-boost.cir", "usb-line-driver.cir",
                "review-faults.json")), files.toString());
        // Verdicts as samples/README.md states them: 4 fail (faulty-review.cir, review-faults.json,
        // review-faults-second-pass.json, instrument-boost-9v.json), 1 warn, 4 pass.
        assertTrue(run("check", "samples").out().contains("9 files: 4 fail, 4 pass, 1 warn"),
                run("check", "samples").out());
    }

    @Test
    @DisplayName("markdown output has a node table and the findings")
    void markdownOutput() {
        Run r = run("check", "--format", "markdown", FAULTY);
        assertEquals(ExitCodes.FINDING, r.code());
        assertTrue(r.out().contains("| node | DC (V) |"), r.out());
        assertTrue(r.out().contains("`REST_ON_RAIL`"), r.out());
    }

    @Test
    @DisplayName("an unknown option is bad input: exit 2 and one line on stderr")
    void anUnknownOptionIsBadInput() {
        Run r = run("check", "--bogus", BOOST);
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertEquals(1, r.err().lines().count(), r.err());
        assertTrue(r.err().contains("--bogus"), r.err());
        assertEquals(ExitCodes.BAD_INPUT, run("check", "--format", "pdf", BOOST).code());
        assertEquals(ExitCodes.BAD_INPUT, run("check").code());
    }

    @Test
    @DisplayName("an unreadable file is bad input naming the file")
    void anUnreadableFileIsBadInput(@TempDir Path dir) {
        String missing = dir.resolve("missing.cir").toString();
        Run r = run("check", missing);
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertEquals(1, r.err().lines().count(), r.err());
        assertTrue(r.err().startsWith(missing + ": "), r.err());
    }

    @Test
    @DisplayName("a parse error is bad input naming the file and the line, without a stack trace")
    void aParseErrorNamesFileAndLine(@TempDir Path dir) throws IOException {
        Path f = write(dir, "bad.cir", "bad\nV1 a 0 1\nR1 a 0 4k7\n.end\n");
        Run r = run("check", f.toString());
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertEquals(1, r.err().lines().count(), r.err());
        assertTrue(r.err().startsWith(f + ": line 3, column 8: "), r.err());
        assertFalse(r.err().contains("at halfrail"), r.err());
    }

    @Test
    @DisplayName("one bad file among good ones gives exit 2 and still reports the good ones")
    void oneBadFileAmongGoodOnes(@TempDir Path dir) throws IOException {
        Path f = write(dir, "bad.cir", "bad\nQ1 a b c npn\n");
        Run r = run("check", "--format", "json", BOOST, f.toString());
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertEquals("pass", r.file(0).get("verdict").asText());
        assertTrue(r.file(1).get("error").asText().contains("line 2"));
    }

    @Test
    @DisplayName("netlist options are validated: unknown output or watch node, unknown source, bad ramp")
    void netlistOptionsAreValidated() {
        assertEquals(ExitCodes.BAD_INPUT, run("check", "--output", "nowhere", BOOST).code());
        assertEquals(ExitCodes.BAD_INPUT, run("check", "--watch", "out,nowhere", BOOST).code());
        assertEquals(ExitCodes.BAD_INPUT, run("check", "--input", "R1", BOOST).code());
        assertEquals(ExitCodes.BAD_INPUT, run("check", "--ramp", "-1m", BOOST).code());
        assertEquals(ExitCodes.BAD_INPUT, run("check", "--ramp", "soon", BOOST).code());
        assertEquals(ExitCodes.BAD_INPUT, run("check", "--settle-band", "0", BOOST).code());
        Run ok = run("check", "--format", "json", "--input", "vin", "--output", "OUT", "--watch", "ref,inp",
                "--ramp", "2m", "--settle-band", "10mV", BOOST);
        assertEquals(ExitCodes.PASS, ok.code(), ok.err());
        assertEquals("out", ok.file(0).get("outputNode").asText());
    }

    @Test
    @DisplayName("the netlist command writes a normalised netlist; a missing file is bad input")
    void theNetlistCommandWritesANormalisedNetlist() {
        Run r = run("netlist", BOOST);
        assertEquals(ExitCodes.PASS, r.code(), r.err());
        assertTrue(r.out().startsWith("Nine-volt instrument boost"), r.out());
        assertTrue(r.out().contains("R3 ref inp 1meg"), r.out());
        assertTrue(r.out().strip().endsWith(".end"), r.out());
        assertEquals(ExitCodes.BAD_INPUT, run("netlist", "no/such/file.cir").code());
    }

    @Test
    @DisplayName("no command prints the usage and exits 2; --version and --help exit 0")
    void noCommandPrintsUsage() {
        Run r = run();
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertTrue(r.err().contains("Usage: halfrail"), r.err());
        Run v = run("--version");
        assertEquals(ExitCodes.PASS, v.code());
        assertTrue(v.out().contains(HalfrailCommand.VERSION));
        assertEquals(ExitCodes.PASS, run("check", "--help").code());
    }
}
