package halfrail.cli;

import com.fasterxml.jackson.databind.JsonNode;
import halfrail.check.DesignAnalysis;
import halfrail.check.Severity;
import halfrail.design.Design;
import halfrail.io.DesignFiles;
import halfrail.units.ESeries;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ConvertCommandTest {
    private static final String SAMPLE = "samples/convert/two-stage-preamp-to-aa-cells.json";

    @Test
    void theSampleConvertsCleanlyExitsZeroAndWritesADesignFile(@TempDir Path dir) {
        Path out = dir.resolve("preamp.json");
        CheckCommandTest.Run r = CheckCommandTest.run("convert", SAMPLE, "-o", out.toString());
        assertEquals(ExitCodes.PASS, r.code(), r.out() + r.err());
        assertTrue(r.out().contains("Conflicts (0)"), r.out());
        assertTrue(r.out().contains("REFERENCE_ADDED"), r.out());
        Design d = DesignFiles.read(out);
        assertEquals("Two-stage preamp on three AA cells", d.name());
        assertFalse(DesignAnalysis.analyse(d).has(Severity.FAIL), "the written design passes the checks on its own");
        assertTrue(ESeries.E24.contains(d.reference().biasOhms()));
    }

    @Test
    void jsonOutputCarriesTheComparisonChangesConflictsAndCurve() {
        CheckCommandTest.Run r = CheckCommandTest.run("convert", SAMPLE, "--format", "json");
        assertEquals(ExitCodes.PASS, r.code(), r.err());
        JsonNode j = r.json();
        assertTrue(j.get("succeeded").asBoolean());
        assertTrue(j.get("designFile").isNull());
        JsonNode before = j.get("comparison").get("before");
        JsonNode after = j.get("comparison").get("after");
        assertEquals("dual-rail original", before.get("version").asText());
        assertTrue(before.get("lowerCornerHz").isNull(), "the DC-coupled original has no lower corner");
        assertTrue(after.get("lowerCornerHz").asDouble() <= 20);
        assertEquals(3, after.get("points").size());
        assertEquals("end-point", after.get("points").get(2).get("label").asText());
        assertTrue(after.get("points").get(2).get("headroomDb").asDouble() > 0);
        assertTrue(j.get("changes").size() >= 6);
        assertTrue(j.get("changes").get(0).has("reason"));
        assertEquals(0, j.get("conflicts").size());
        assertEquals(halfrail.convert.Converter.TRADE_OFF_POINTS, j.get("tradeOff").size());
        assertTrue(j.get("tradeOff").get(0).has("settleSeconds"));
    }

    @Test
    void anImpossibleRequestFromOptionsExitsOneAndStatesTheMiss() {
        CheckCommandTest.Run r = CheckCommandTest.run("convert", "--stage",
                "non-inverting:10k:100k:classic-bipolar-dual-supply", "--dual-rail", "15", "--cells",
                "alkaline-9v-block:1", "--band", "1:20k", "--signal", "100 mV", "--source-ohms", "1k", "--load", "10k",
                "--max-settle", "10 ms", "--format", "json");
        assertEquals(ExitCodes.FINDING, r.code(), r.out() + r.err());
        JsonNode c = r.json().get("conflicts").get(0);
        assertEquals("CORNER_VERSUS_SETTLE", c.get("kind").asText());
        assertEquals("s", c.get("unit").asText());
        assertEquals(0.01, c.get("limit").asDouble(), 1e-15);
        assertTrue(c.get("missedBy").asDouble() > 0.1, c.toString());
        assertFalse(r.json().get("limitsMet").asBoolean());
    }

    @Test
    void aTwoStageChainGivenAsOptionsMovesOntoAUsbPort(@TempDir Path dir) {
        Path out = dir.resolve("usb.json");
        CheckCommandTest.Run r = CheckCommandTest.run("convert", "--stage", "non-inverting:10k:47k:cmos-rrio-low-voltage",
                "--stage", "inverting:10k:22k:cmos-rrio-low-voltage", "--dual-rail", "5", "--usb", "--band", "20:20k",
                "--signal", "20m", "--source-ohms", "100", "--load", "10k", "-o", out.toString());
        assertEquals(ExitCodes.PASS, r.code(), r.out() + r.err());
        Design d = DesignFiles.read(out);
        assertEquals(2, d.stages().size());
        assertTrue(d.supply() instanceof halfrail.design.UsbPort, d.supply().toString());
        // the stages keep their resistors: gains 1 + 47k/10k = 5.7 and −22k/10k = −2.2 (closed forms)
        assertEquals(5.7, d.stages().get(0).nominalGain(), 1e-12);
        assertEquals(-2.2, d.stages().get(1).nominalGain(), 1e-12);
        assertFalse(DesignAnalysis.analyse(d).has(Severity.FAIL));
    }

    @Test
    void badInputExitsTwoWithOneLineNamingThePath(@TempDir Path dir) throws IOException {
        Path f = dir.resolve("bad.json");
        Files.writeString(f, Files.readString(Path.of(SAMPLE)).replace("\"r2Ohms\": \"100k\"", "\"r2Ohms\": \"-1\""));
        CheckCommandTest.Run r = CheckCommandTest.run("convert", f.toString());
        assertEquals(ExitCodes.BAD_INPUT, r.code());
        assertTrue(r.err().contains("original.stages[0].r2Ohms"), r.err());
        assertEquals(1, r.err().strip().lines().count(), r.err());
    }

    @Test
    void fileAndCircuitOptionsTogetherOrNeitherAreBadInput() {
        assertEquals(ExitCodes.BAD_INPUT, CheckCommandTest.run("convert", SAMPLE, "--usb").code());
        assertEquals(ExitCodes.BAD_INPUT, CheckCommandTest.run("convert").code());
        assertEquals(ExitCodes.BAD_INPUT, CheckCommandTest.run("convert", "--stage", "inverting:10k:22k:no-such-part",
                "--dual-rail", "12", "--usb", "--band", "20:20k", "--signal", "0.1", "--load", "10k").code());
        assertEquals(ExitCodes.BAD_INPUT, CheckCommandTest.run("convert", "--stage", "inverting:10k:22k:micropower",
                "--dual-rail", "12", "--usb", "--cells", "li-ion:1", "--band", "20:20k", "--signal", "0.1",
                "--load", "10k").code());
        assertEquals(ExitCodes.BAD_INPUT, CheckCommandTest.run("convert", "no-such-file.json").code());
    }

    @Test
    void anUnwritableOutputIsBadInput(@TempDir Path dir) {
        Path out = dir.resolve("missing-folder").resolve("x.json");
        assertEquals(ExitCodes.BAD_INPUT, CheckCommandTest.run("convert", SAMPLE, "-o", out.toString()).code());
    }
}
