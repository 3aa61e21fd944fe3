package halfrail.io;

import halfrail.io.DesignFileException.Kind;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.stream.Stream;

import static halfrail.io.DesignFileTexts.parse;
import static halfrail.io.DesignFileTexts.rich;
import static halfrail.io.DesignFileTexts.with;
import static halfrail.io.DesignFileTexts.without;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.params.provider.Arguments.arguments;

/** Every kind of bad input gives its kind and names the JSON path (the format: docs/design-format.md). */
class DesignFileErrorTest {

    static DesignFileException refused(String json) {
        return assertThrows(DesignFileException.class, () -> DesignFiles.read(json, "test.json"));
    }

    static Stream<Arguments> badValues() {
        String r = rich();
        return Stream.of(
                // unknown fields, including a misspelt one that would otherwise be "missing"
                arguments("top-level field", with(r, "/colour", "red"), Kind.UNKNOWN_FIELD, "$.colour"),
                arguments("misspelt field", with(r, "/stages/0/legOhm", "10k"), Kind.UNKNOWN_FIELD, "$.stages[0].legOhm"),
                arguments("field of another supply kind", with(r, "/supply/volts", "5 V"), Kind.UNKNOWN_FIELD, "$.supply.volts"),
                arguments("unknown op-amp parameter", with(r, "/stages/1/opAmp/noise", 1), Kind.UNKNOWN_FIELD,
                        "$.stages[1].opAmp.noise"),
                arguments("odd field name", with(r, "/load/a b", 1), Kind.UNKNOWN_FIELD, "$.load['a b']"),
                // missing fields
                arguments("capacitance", without(r, "/stages/0/legCapacitor/farads"), Kind.MISSING_FIELD,
                        "$.stages[0].legCapacitor.farads"),
                arguments("chemistry", without(r, "/supply/chemistry"), Kind.MISSING_FIELD, "$.supply.chemistry"),
                arguments("band", without(r, "/source/bandLowHz"), Kind.MISSING_FIELD, "$.source.bandLowHz"),
                arguments("buffer of a buffered reference", without(r, "/reference/buffer"), Kind.MISSING_FIELD,
                        "$.reference.buffer"),
                arguments("feedback resistor", without(r, "/stages/1/feedbackOhms"), Kind.MISSING_FIELD,
                        "$.stages[1].feedbackOhms"),
                arguments("op-amp parameter", without(r, "/stages/1/opAmp/gainBandwidthHz"), Kind.MISSING_FIELD,
                        "$.stages[1].opAmp.gainBandwidthHz"),
                arguments("format version", without(r, "/formatVersion"), Kind.MISSING_FIELD, "$.formatVersion"),
                // wrong types
                arguments("boolean capacitance", with(r, "/stages/0/legCapacitor/farads", parse("true")),
                        Kind.WRONG_TYPE, "$.stages[0].legCapacitor.farads"),
                arguments("stages as an object", with(r, "/stages", parse("{}")), Kind.WRONG_TYPE, "$.stages"),
                arguments("stage as a number", with(r, "/stages/1", parse("3")), Kind.WRONG_TYPE, "$.stages[1]"),
                arguments("biased as text", with(r, "/stages/0/biased", "no"), Kind.WRONG_TYPE, "$.stages[0].biased"),
                arguments("fractional cell count", with(r, "/supply/cellsInSeries", 2.5), Kind.WRONG_TYPE,
                        "$.supply.cellsInSeries"),
                arguments("cell count as text", with(r, "/supply/cellsInSeries", "2"), Kind.WRONG_TYPE,
                        "$.supply.cellsInSeries"),
                arguments("op-amp as a number", with(r, "/stages/0/opAmp", 5), Kind.WRONG_TYPE, "$.stages[0].opAmp"),
                arguments("null", with(r, "/load/ohms", parse("null")), Kind.WRONG_TYPE, "$.load.ohms"),
                arguments("name as a number", with(r, "/name", 1), Kind.WRONG_TYPE, "$.name"),
                // bad values: text the unit parser refuses, values the design model refuses, unknown ids
                arguments("wrong unit", with(r, "/stages/0/legCapacitor/farads", "10 µV"), Kind.BAD_VALUE,
                        "$.stages[0].legCapacitor.farads"),
                arguments("not a value", with(r, "/stages/0/feedbackOhms", "lots"), Kind.BAD_VALUE,
                        "$.stages[0].feedbackOhms"),
                arguments("text NaN", with(r, "/load/ohms", "NaN"), Kind.BAD_VALUE, "$.load.ohms"),
                arguments("number beyond a double", with(r, "/load/ohms", parse("1e400")), Kind.BAD_VALUE, "$.load.ohms"),
                arguments("negative capacitance", with(r, "/stages/0/legCapacitor/farads", -1e-6), Kind.BAD_VALUE,
                        "$.stages[0].legCapacitor.farads"),
                arguments("zero resistor", with(r, "/reference/upperOhms", 0), Kind.BAD_VALUE, "$.reference.upperOhms"),
                arguments("no cells", with(r, "/supply/cellsInSeries", 0), Kind.BAD_VALUE, "$.supply.cellsInSeries"),
                arguments("huge cell count", with(r, "/supply/cellsInSeries", parse("99999999999")), Kind.BAD_VALUE,
                        "$.supply.cellsInSeries"),
                arguments("band upside down", with(r, "/source/bandHighHz", "1 Hz"), Kind.BAD_VALUE, "$.source.bandHighHz"),
                arguments("duplicate stage name", with(r, "/stages/1/name", "gain"), Kind.BAD_VALUE, "$.stages[1].name"),
                arguments("negative swing of a custom op-amp", with(r, "/stages/1/opAmp/swingLowVolts", "-1 V"),
                        Kind.BAD_VALUE, "$.stages[1].opAmp.swingLowVolts"),
                arguments("unknown technology", with(r, "/stages/0/legCapacitor/technology", "paper"), Kind.BAD_VALUE,
                        "$.stages[0].legCapacitor.technology"),
                arguments("unknown archetype", with(r, "/stages/0/opAmp", "ideal"), Kind.BAD_VALUE, "$.stages[0].opAmp"),
                arguments("unknown chemistry", with(r, "/supply/chemistry", "coal"), Kind.BAD_VALUE, "$.supply.chemistry"),
                arguments("unknown supply kind", with(r, "/supply/kind", "mains"), Kind.BAD_VALUE, "$.supply.kind"),
                arguments("unknown stage kind", with(r, "/stages/0/kind", "differential"), Kind.BAD_VALUE,
                        "$.stages[0].kind"),
                arguments("dB level in the other dB unit", with(with(r, "/source/amplitudeUnit", "dBV"),
                        "/source/amplitude", "-10 dBu"), Kind.BAD_VALUE, "$.source.amplitude"),
                arguments("tolerance above 100 %", with(with(r, "/supply", parse("{\"kind\":\"fixed\",\"volts\":\"5 V\"}")),
                        "/supply/tolerance", "150 %"), Kind.BAD_VALUE, "$.supply.tolerance"),
                arguments("format version below 0", with(r, "/formatVersion", -1), Kind.BAD_VALUE, "$.formatVersion"),
                // other files and other versions
                arguments("another format", with(r, "/format", "some-other-format"), Kind.NOT_A_DESIGN, "$.format"),
                arguments("no format at all", "{\"colour\": \"red\"}", Kind.NOT_A_DESIGN, "$"),
                arguments("a newer version", with(r, "/formatVersion", 2), Kind.NEWER_VERSION, "$.formatVersion"));
    }

    @ParameterizedTest(name = "{0}: {2} at {3}")
    @MethodSource("badValues")
    void eachBadInputGivesItsKindAndPath(String what, String json, Kind kind, String path) {
        DesignFileException e = refused(json);
        assertEquals(kind, e.kind(), e::getMessage);
        assertEquals(path, e.jsonPath(), e::getMessage);
        assertTrue(e.getMessage().startsWith("test.json: " + path + ": "), e.getMessage());
        assertTrue(e.getMessage().indexOf('\n') < 0, "one line: " + e.getMessage());
    }

    @Test
    void anUnknownFieldNamesTheFieldsThatAreAllowed() {
        DesignFileException e = refused(with(rich(), "/stages/0/legOhm", "10k"));
        assertTrue(e.expected().contains("legOhms"), e.expected());
    }

    @Test
    void aValueInTheWrongUnitSaysWhichUnitWasExpected() {
        DesignFileException e = refused(with(rich(), "/stages/0/legCapacitor/farads", "10 µV"));
        assertTrue(e.expected().contains("capacitance in F"), e.expected());
        assertTrue(e.getMessage().contains("10 µV"), e.getMessage());
    }

    @Test
    void aNewerVersionIsRefusedWithAClearMessage() {
        DesignFileException e = refused(with(rich(), "/formatVersion", 7));
        assertTrue(e.getMessage().contains("format version 7, written by a newer Halfrail"), e.getMessage());
    }

    @Test
    void aSyntaxErrorGivesItsLineAndColumn() {
        String json = "{\n  \"format\": \"halfrail-design\",\n  \"formatVersion\": 1,,\n}";
        DesignFileException e = refused(json);
        assertEquals(Kind.SYNTAX, e.kind());
        assertEquals(3, e.line(), e::getMessage);
        assertEquals(22, e.column(), e::getMessage); // the second comma
        assertTrue(e.getMessage().startsWith("test.json: line 3, column 22: "), e.getMessage());
    }

    @Test
    void theNonNumberLiteralNaNIsASyntaxError() {
        String json = rich().replace("\"ohms\": \"100k\"", "\"ohms\": NaN");
        assertEquals(Kind.SYNTAX, refused(json).kind());
    }

    @Test
    void emptyTextAndTrailingContentAreSyntaxErrors() {
        assertEquals(Kind.SYNTAX, refused("").kind());
        assertEquals(Kind.SYNTAX, refused("   \n ").kind());
        assertEquals(Kind.SYNTAX, refused(rich() + " {}").kind());
    }

    @Test
    void aFieldGivenTwiceIsRefused() {
        String json = rich().replace("\"ohms\": \"100k\"", "\"ohms\": \"100k\", \"ohms\": \"1k\"");
        DesignFileException e = refused(json);
        assertEquals(Kind.DUPLICATE_FIELD, e.kind(), e::getMessage);
        assertTrue(e.line() > 0, e::getMessage);
        assertEquals("$.load.ohms", e.jsonPath(), e::getMessage);
    }

    @Test
    void aLineBreakInAFieldNameDoesNotBreakTheMessage() {
        DesignFileException e = refused(with(rich(), "/load/two\nlines", 1));
        assertEquals(Kind.UNKNOWN_FIELD, e.kind());
        assertTrue(e.getMessage().contains("two\\u000Alines"), e.getMessage());
    }

    @Test
    void aRootThatIsNotAnObjectIsTheWrongType() {
        DesignFileException e = refused("[1, 2]");
        assertEquals(Kind.WRONG_TYPE, e.kind());
        assertEquals("$", e.jsonPath());
    }

    @Test
    void nestingBeyondTheLimitIsRefusedWhileParsing() {
        String deep = "[".repeat(DesignFiles.MAX_NESTING_DEPTH + 1) + "]".repeat(DesignFiles.MAX_NESTING_DEPTH + 1);
        DesignFileException e = refused(rich().replaceFirst("\\{", "{\"deep\": " + deep + ","));
        assertEquals(Kind.TOO_LARGE, e.kind(), e::getMessage);
    }

    @Test
    void aTextLongerThanTheLimitIsRefused() {
        String json = with(rich(), "/description", "x".repeat(DesignFiles.MAX_STRING_LENGTH + 1));
        assertEquals(Kind.TOO_LARGE, refused(json).kind());
    }

    @Test
    void textAboveTheSizeLimitIsRefusedBeforeParsing() {
        // Not JSON at all: the size is checked first, so the kind is TOO_LARGE, not SYNTAX.
        String json = "#".repeat(DesignFiles.MAX_FILE_BYTES + 1);
        assertEquals(Kind.TOO_LARGE, refused(json).kind());
        // Counted in UTF-8 bytes: 2-byte characters reach the limit at half as many characters.
        String micro = "µ".repeat(DesignFiles.MAX_FILE_BYTES / 2 + 1);
        assertEquals(Kind.TOO_LARGE, refused(micro).kind());
    }
}
