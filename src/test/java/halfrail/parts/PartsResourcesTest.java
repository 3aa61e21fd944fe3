package halfrail.parts;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Loading is strict. Each malformed resource under src/test/resources/halfrail/parts is a copy
 * of a built-in resource with one defect; the error must name the resource and the JSON path.
 */
class PartsResourcesTest {

    private static PartsException loadFails(String name, Class<? extends PartEntry> type) {
        String resource = "halfrail/parts/" + name;
        PartsException e = assertThrows(PartsException.class, () -> PartsResources.load(resource, type));
        assertEquals(PartsException.Kind.BAD_DATA, e.kind());
        assertEquals(resource, e.resource());
        assertTrue(e.getMessage().contains(resource), e.getMessage());
        assertTrue(e.getMessage().contains(e.jsonPath()), e.getMessage());
        return e;
    }

    @ParameterizedTest(name = "{0} fails at {1}")
    @CsvSource({
            // file,                             JSON path,                                   words in the message
            "malformed-extra-field.json,         $.entries[1].leakage.colour,                 Unrecognized field",
            "malformed-extra-top-field.json,     $.entries[2].dielectric,                     Unrecognized field",
            "malformed-misspelt-field.json,      $.entries[1].leakage.floorAmps,              Missing creator property",
            "malformed-missing-field.json,       $.entries[0].polarised,                      Missing creator property",
            "malformed-number-as-text.json,      $.entries[1].voltageDerating,                String value",
            "malformed-bad-value.json,           $.entries[3].voltageDerating,                got 1.5",
            "malformed-unknown-kind.json,        $.entries[2].leakage,                        resistance",
            "malformed-duplicate-id.json,        $.entries[5].id,                             already used by $.entries[4]",
            "malformed-syntax.json,              $.entries[2],                                line 46",
    })
    void capacitorResourceDefectsAreNamedByPath(String file, String path, String words) {
        PartsException e = loadFails(file, CapacitorTechnology.class);
        assertEquals(path, e.jsonPath());
        assertTrue(e.getMessage().contains(words), e.getMessage());
    }

    @Test
    void aRisingDischargeCurveIsNamedDownToThePoint() {
        PartsException e = loadFails("malformed-rising-curve.json", CellChemistry.class);
        assertEquals("$.entries[2].dischargeCurve[6]", e.jsonPath());
        assertTrue(e.getMessage().contains("nimh-aa"), e.getMessage());
    }

    @Test
    void invalidOpAmpParametersAreNamedByTheCircuitLayersField() {
        PartsException e = loadFails("malformed-opamp-params.json", OpAmpArchetype.class);
        assertEquals("$.entries[1].typical.gainBandwidthHz", e.jsonPath());
    }

    @Test
    void aMisspeltBasisKeyFails() {
        PartsException e = loadFails("malformed-basis-key.json", SupplyStandard.class);
        assertEquals("$.entries[0].basis.portRnage", e.jsonPath());
    }

    @Test
    void aDuplicateKeyInOneObjectFails() {
        PartsException e = loadFails("malformed-duplicate-key.json", SupplyStandard.class);
        assertEquals("$.entries[0]", e.jsonPath());
        assertTrue(e.getMessage().contains("nominalVolts"), e.getMessage());
    }

    @Test
    void anUnknownFormatVersionFails() {
        assertEquals("$.formatVersion", loadFails("malformed-format-version.json", SupplyStandard.class).jsonPath());
    }

    @Test
    void aMissingResourceIsNamed() {
        PartsException e = loadFails("no-such-resource.json", SupplyStandard.class);
        assertEquals("", e.jsonPath());
    }

    @Test
    void theBuiltInResourcesLoadCleanly() {
        assertEquals(6, PartsResources.load(PartsResources.CAPACITOR_TECHNOLOGIES, CapacitorTechnology.class).size());
        assertEquals(5, PartsResources.load(PartsResources.OPAMP_ARCHETYPES, OpAmpArchetype.class).size());
        assertEquals(5, PartsResources.load(PartsResources.CELL_CHEMISTRIES, CellChemistry.class).size());
        assertEquals(1, PartsResources.load(PartsResources.SUPPLY_STANDARDS, SupplyStandard.class).size());
    }

    @Test
    void relativeFieldsJoinThePathWithADotOrABracket() {
        assertEquals("$.entries[0].basis", PartsResources.withField("$.entries[0]", "basis"));
        assertEquals("$.entries[0][3]", PartsResources.withField("$.entries[0]", "[3]"));
        assertEquals("$.entries[0]", PartsResources.withField("$.entries[0]", ""));
    }
}
