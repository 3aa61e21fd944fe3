package halfrail.io;

import halfrail.design.Design;
import halfrail.io.DesignFileException.Kind;
import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;

import static halfrail.io.DesignFileTexts.parse;
import static halfrail.io.DesignFileTexts.with;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Format version 0 (the draft layout, docs/design-format.md "Older versions") is migrated on reading. */
class DesignFileMigrationTest {
    static String versionZero() {
        try (InputStream in = DesignFileMigrationTest.class.getResourceAsStream("instrument-boost-version-0.json")) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    @Test
    void aVersionZeroFileReadsAsTheSameDesignAsItsVersionOneSample() {
        Design migrated = DesignFiles.read(versionZero(), "v0.json");
        Design current = DesignFiles.read(DesignFileTexts.SAMPLES.resolve("instrument-boost-9v.json"));
        assertEquals(current.stages(), migrated.stages());
        assertEquals(current.supply(), migrated.supply());
        assertEquals(new Design(current.name(), migrated.description(), current.supply(), current.reference(),
                current.stages(), current.source(), current.load(), current.thresholds(),
                current.powerOnRampSeconds()), migrated);
    }

    @Test
    void savingAMigratedDesignWritesTheCurrentVersion() {
        String written = DesignFiles.write(DesignFiles.read(versionZero(), "v0.json"));
        assertTrue(written.contains("\"formatVersion\": 1"), written);
        assertTrue(written.contains("\"stages\""), written);
        assertTrue(written.contains("\"cellsInSeries\": 1"), written);
    }

    @Test
    void errorsInAVersionZeroFileNameTheFilesOwnFields() {
        DesignFileException e = assertThrows(DesignFileException.class,
                () -> DesignFiles.read(with(versionZero(), "/chain/0/legOhms", "lots"), "v0.json"));
        assertEquals(Kind.BAD_VALUE, e.kind());
        assertEquals("$.chain[0].legOhms", e.jsonPath());
        assertTrue(e.getMessage().contains("format version 0"), e.getMessage());
        DesignFileException count = assertThrows(DesignFileException.class,
                () -> DesignFiles.read(with(versionZero(), "/supply/count", 0), "v0.json"));
        assertEquals("$.supply.count", count.jsonPath());
    }

    @Test
    void aVersionZeroFileMayNotUseTheNewNames() {
        DesignFileException stages = assertThrows(DesignFileException.class,
                () -> DesignFiles.read(with(versionZero(), "/stages", parse("[]")), "v0.json"));
        assertEquals(Kind.UNKNOWN_FIELD, stages.kind());
        assertEquals("$.stages", stages.jsonPath());
        DesignFileException cells = assertThrows(DesignFileException.class,
                () -> DesignFiles.read(with(versionZero(), "/supply/cellsInSeries", 1), "v0.json"));
        assertEquals(Kind.UNKNOWN_FIELD, cells.kind());
        assertEquals("$.supply.cellsInSeries", cells.jsonPath());
    }

    @Test
    void aVersionOneFileMayNotUseTheOldNames() {
        String v1 = DesignFileTexts.text(DesignFileTexts.SAMPLES.resolve("instrument-boost-9v.json"));
        DesignFileException e = assertThrows(DesignFileException.class,
                () -> DesignFiles.read(with(v1, "/supply/count", 1), "v1.json"));
        assertEquals(Kind.UNKNOWN_FIELD, e.kind());
        assertEquals("$.supply.count", e.jsonPath());
    }
}
