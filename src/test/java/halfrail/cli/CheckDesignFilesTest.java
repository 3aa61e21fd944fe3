package halfrail.cli;

import com.fasterxml.jackson.databind.JsonNode;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** {@code check} and {@code netlist} on design files, as a review pipeline runs them. */
class CheckDesignFilesTest {
    private static final String USB = "samples/usb-line-driver.json";
    private static final String FAULTS = "samples/review-faults.json";

    @Test
    @DisplayName("a healthy design passes; its JSON carries the operating point, corner and settle-up time")
    void aHealthyDesignPasses() {
        CheckCommandTest.Run r = CheckCommandTest.run("check", "--format", "json", USB);
        assertEquals(ExitCodes.PASS, r.code(), r.err());
        JsonNode f = r.file(0);
        assertEquals(USB, f.get("file").asText());
        assertEquals("pass", f.get("verdict").asText());
        // 47k/47k divider on the 5 V nominal port: the reference at half the supply (divider rule).
        double vcc = f.get("nodes").get("vcc").asDouble();
        assertEquals(vcc / 2, f.get("nodes").get("ref").asDouble(), 0.01);
        JsonNode stage = f.get("opamps").get(0);
        assertEquals(vcc / 2, stage.get("output").asDouble(), 0.02);
        assertFalse(stage.get("saturated").asBoolean());
        assertTrue(stage.get("commonModeOk").asBoolean());
        assertTrue(f.get("lowerCornerHz").asDouble() > 0 && f.get("lowerCornerHz").asDouble() < 20,
                f.get("lowerCornerHz").toString());
        assertTrue(f.get("settleTime").asDouble() > 0, f.get("settleTime").toString());
        assertEquals(0, f.get("floating").size());
    }

    @Test
    @DisplayName("the review case fails with exit 1, names the floating node and shows no numbers for it")
    void theReviewCaseFails() {
        CheckCommandTest.Run r = CheckCommandTest.run("check", "--format", "json", FAULTS);
        assertEquals(ExitCodes.FINDING, r.code(), r.err());
        JsonNode f = r.file(0);
        assertEquals("fail", f.get("verdict").asText());
        assertEquals("NO_DC_PATH", f.get("findings").get(0).get("code").asText());
        assertTrue(f.get("floating").size() > 0);
        assertTrue(f.get("lowerCornerHz").isNull());
        assertTrue(f.get("settleTime").isNull());
    }

    @Test
    @DisplayName("a design file with an unknown field is bad input: exit 2, one line naming the file and JSON path")
    void anUnknownFieldIsBadInput(@TempDir Path dir) throws IOException {
        String text = Files.readString(Path.of(USB)).replaceFirst("\"name\"", "\"nmae\"");
        Path bad = dir.resolve("bad.json");
        Files.writeString(bad, text);
        CheckCommandTest.Run r = CheckCommandTest.run("check", bad.toString());
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertEquals(1, r.err().strip().lines().count(), r.err());
        assertTrue(r.err().contains(bad.toString()) && r.err().contains("$.nmae"), r.err());
        assertFalse(r.err().contains("Exception"), r.err());
    }

    @Test
    @DisplayName("a directory of samples mixes designs and netlists and fails because of the review cases")
    void aDirectoryOfSamples() {
        CheckCommandTest.Run r = CheckCommandTest.run("check", "--format", "json", "samples");
        assertEquals(ExitCodes.FINDING, r.code(), r.err());
        JsonNode files = r.json().get("files");
        boolean design = false;
        boolean netlist = false;
        for (JsonNode f : files) {
            design |= f.get("file").asText().endsWith(".json");
            netlist |= f.get("file").asText().endsWith(".cir");
        }
        assertTrue(design && netlist, files.toString());
    }

    @Test
    @DisplayName("--fail-on warn turns a design with only warnings into exit 1; notes never do")
    void failOnWarn() {
        assertEquals(ExitCodes.PASS, CheckCommandTest.run("check", "samples/handheld-recorder-mic-preamp.json").code());
        assertEquals(ExitCodes.FINDING, CheckCommandTest.run("check", "--fail-on", "warn",
                "samples/handheld-recorder-mic-preamp.json").code());
        assertEquals(ExitCodes.PASS, CheckCommandTest.run("check", "--fail-on", "warn", USB).code());
    }

    @Test
    @DisplayName("netlist of a design file writes its circuit, which reads back to the same operating point")
    void netlistOfADesignFile() throws IOException {
        CheckCommandTest.Run r = CheckCommandTest.run("netlist", USB);
        assertEquals(ExitCodes.PASS, r.code(), r.err());
        halfrail.io.Netlist n = halfrail.io.NetlistReader.parse(r.out());
        halfrail.solve.OperatingPoint fromText = halfrail.solve.DcSolver.operatingPoint(n.circuit());
        halfrail.design.DesignCircuit dc = halfrail.design.DesignCircuits.nominal(halfrail.io.DesignFiles.read(Path.of(USB)));
        halfrail.solve.OperatingPoint direct = halfrail.solve.DcSolver.operatingPoint(dc.circuit());
        for (String node : dc.circuit().nodes()) {
            assertEquals(direct.voltage(node), fromText.voltage(node), 1e-6, node);
        }
    }
}
