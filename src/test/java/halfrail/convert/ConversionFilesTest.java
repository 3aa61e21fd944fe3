package halfrail.convert;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import halfrail.design.AmplitudeUnit;
import halfrail.design.CellPack;
import halfrail.design.StageKind;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.function.Consumer;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ConversionFilesTest {
    static final Path SAMPLE = Path.of("samples", "convert", "two-stage-preamp-to-aa-cells.json");
    private static final ObjectMapper JSON = new ObjectMapper();

    @Test
    void theSampleReadsWithEveryField() {
        ConversionRequest r = ConversionFiles.read(SAMPLE);
        assertEquals("Two-stage preamp on three AA cells", r.name());
        assertEquals(2, r.original().stages().size());
        DualRailStage s = r.original().stages().get(0);
        assertEquals(StageKind.NON_INVERTING, s.kind());
        assertEquals(10e3, s.r1Ohms());
        assertEquals(100e3, s.r2Ohms());
        assertEquals(12, r.original().negativeVolts());
        assertEquals(new CellPack("alkaline-aa", 3), r.supply());
        assertEquals(20, r.signal().bandLowHz());
        assertEquals(20e3, r.signal().bandHighHz());
        assertEquals(AmplitudeUnit.VOLTS_PEAK, r.signal().unit());
        assertEquals(0.03, r.signal().amplitude(), 1e-15);
        assertEquals(47e3, r.loadOhms());
        assertEquals(1.0, r.limits().maxSettleSeconds().getAsDouble());
        assertEquals(1e-3, r.limits().maxSupplyAmps().getAsDouble(), 1e-15);
    }

    @Test
    void theFormatDocumentsExampleIsTheSample() throws IOException {
        String doc = Files.readString(Path.of("docs", "convert-format.md"));
        Matcher m = Pattern.compile("```json\\n(.*?)```", Pattern.DOTALL).matcher(doc);
        assertTrue(m.find(), "no JSON example in docs/convert-format.md");
        assertEquals(JSON.readTree(Files.readString(SAMPLE)), JSON.readTree(m.group(1)));
    }

    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
            "unknown field       | original.stages[0].colour",
            "null field          | load.farads",
            "wrong type          | original.stages[0].r2Ohms",
            "negative resistor   | original.stages[1].r1Ohms",
            "bad kind            | original.stages[0].kind",
            "unknown part        | original.stages[1].opAmp",
            "unknown chemistry   | supply.chemistry",
            "missing band end    | band.highHz",
            "band upside down    | band.highHz",
            "bad unit            | signal.sourceOhms",
            "bad priority        | limits.priority",
            "runtime without cells | limits.minRuntimeHours",
            "wrong format        | format",
            "newer version       | formatVersion"})
    void errorsNameTheJsonPath(String what, String path) throws IOException {
        ObjectNode root = (ObjectNode) JSON.readTree(Files.readString(SAMPLE));
        Consumer<ObjectNode> change = switch (what.strip()) {
            case "unknown field" -> r -> stage(r, 0).put("colour", "red");
            case "null field" -> r -> ((ObjectNode) r.get("load")).putNull("farads");
            case "wrong type" -> r -> stage(r, 0).put("r2Ohms", true);
            case "negative resistor" -> r -> stage(r, 1).put("r1Ohms", -10);
            case "bad kind" -> r -> stage(r, 0).put("kind", "differential");
            case "unknown part" -> r -> stage(r, 1).put("opAmp", "no-such-part");
            case "unknown chemistry" -> r -> ((ObjectNode) r.get("supply")).put("chemistry", "unobtainium");
            case "missing band end" -> r -> ((ObjectNode) r.get("band")).remove("highHz");
            case "band upside down" -> r -> ((ObjectNode) r.get("band")).put("highHz", "10 Hz");
            case "bad unit" -> r -> ((ObjectNode) r.get("signal")).put("sourceOhms", "10 µF");
            case "bad priority" -> r -> ((ObjectNode) r.get("limits")).put("priority", "both");
            case "runtime without cells" -> r -> {
                r.putObject("supply").put("kind", "usb");
                ((ObjectNode) r.get("limits")).put("minRuntimeHours", "10 h");
            };
            case "wrong format" -> r -> r.put("format", "halfrail-design");
            case "newer version" -> r -> r.put("formatVersion", 2);
            default -> throw new IllegalArgumentException(what);
        };
        change.accept(root);
        ConversionException e = assertThrows(ConversionException.class,
                () -> ConversionFiles.read(JSON.writeValueAsString(root)));
        assertEquals(path.strip(), e.path(), e.getMessage());
        assertTrue(e.getMessage().startsWith(path.strip() + ": "), e.getMessage());
    }

    @Test
    void duplicateFieldsAndBrokenJsonAreRefused() {
        assertThrows(ConversionException.class, () -> ConversionFiles.read("{\"format\": 1, \"format\": 2}"));
        assertThrows(ConversionException.class, () -> ConversionFiles.read("{\"format\": "));
        assertEquals("", assertThrows(ConversionException.class, () -> ConversionFiles.read("[1, 2]")).path());
    }

    @Test
    void aCustomOpAmpAndDbLevelsRead() throws IOException {
        ObjectNode root = (ObjectNode) JSON.readTree(Files.readString(SAMPLE));
        ObjectNode p = stage(root, 0).putObject("opAmp");
        p.put("openLoopGain", 1e5).put("gainBandwidthHz", "1 MHz").put("slewRateVoltsPerSecond", "0.5 V/µs")
                .put("offsetVolts", "1 mV").put("biasAmps", "10 pA").put("offsetCurrentAmps", 0)
                .put("commonModeLowVolts", -0.1).put("commonModeHighVolts", -0.1).put("swingLowVolts", "20 mV")
                .put("swingHighVolts", "20 mV").put("outputOhms", 100).put("quiescentAmps", "100 µA")
                .put("supplyMinVolts", "1.8 V").put("supplyMaxVolts", "5.5 V");
        ((ObjectNode) root.get("signal")).put("amplitude", "-30 dBV").put("amplitudeUnit", "dBV");
        ConversionRequest r = ConversionFiles.read(JSON.writeValueAsString(root));
        assertEquals(5e5, r.original().stages().get(0).opAmp().custom().slewRateVoltsPerSecond(), 1e-6);
        // −30 dBV = 31.6 mV rms (0 dBV = 1 V rms, standard definition) = 44.7 mV peak
        assertEquals(Math.pow(10, -30 / 20.0) * Math.sqrt(2), r.signal().voltsPeak(), 1e-12);
    }

    private static ObjectNode stage(ObjectNode root, int i) {
        return (ObjectNode) ((ArrayNode) root.get("original").get("stages")).get(i);
    }
}
