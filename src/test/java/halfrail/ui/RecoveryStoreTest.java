package halfrail.ui;

import halfrail.design.Design;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Lost work: the recovery file, autosave, and saving or opening that fails — with the real design
 * files and a synchronous executor, no toolkit.
 */
class RecoveryStoreTest {
    @TempDir
    Path dir;

    private final JsonDesignFiles files = new JsonDesignFiles();

    private WorkbenchModel model() {
        return new WorkbenchModel(new SynchronousAnalysisExecutor(), SampleDesigns.instrumentBoost(), Optional.of(files));
    }

    private static Design edited(Design d) {
        return d.withStage(0, d.stages().get(0).withFeedbackOhms(47e3));
    }

    @Test
    void aSavedRecoveryCopyIsOfferedBackUntilItIsCleared() throws IOException {
        RecoveryStore store = new RecoveryStore(dir.resolve("cache"), files);
        assertEquals(Optional.empty(), store.pending(), "nothing left before any autosave");
        Design d = edited(SampleDesigns.instrumentBoost());
        assertTrue(store.save(d));
        assertFalse(store.save(d), "the same design is not written twice");
        assertEquals(Optional.of(d), store.pending());
        // a new session (a new store on the same folder) finds it: the last one did not close normally
        assertEquals(Optional.of(d), new RecoveryStore(dir.resolve("cache"), files).pending());
        store.clear();
        assertEquals(Optional.empty(), store.pending());
    }

    @Test
    void aDamagedRecoveryFileIsReportedAndLeftInPlace() throws IOException {
        RecoveryStore store = new RecoveryStore(dir, files);
        byte[] junk = "{\"format\": \"halfrail-design\", \"stages\": [".getBytes(StandardCharsets.UTF_8);
        Files.write(store.file(), junk);
        assertThrows(IOException.class, store::pending);
        assertArrayEquals(junk, Files.readAllBytes(store.file()));
    }

    @Test
    void theRecoveryFolderIsTheUsersCacheFolder() {
        // XDG Base Directory Specification: $XDG_CACHE_HOME, defaulting to $HOME/.cache; a relative value is ignored
        assertEquals(Path.of("/x/cache/halfrail"), RecoveryStore.defaultFolder(Map.of("XDG_CACHE_HOME", "/x/cache"), "/home/u"));
        assertEquals(Path.of("/home/u/.cache/halfrail"), RecoveryStore.defaultFolder(Map.of(), "/home/u"));
        assertEquals(Path.of("/home/u/.cache/halfrail"), RecoveryStore.defaultFolder(Map.of("XDG_CACHE_HOME", "rel"), "/home/u"));
    }

    @Test
    void autosaveKeepsOnlyUnsavedWorkAndSavingRemovesTheCopy() throws IOException {
        WorkbenchModel m = model();
        RecoveryStore store = new RecoveryStore(dir.resolve("cache"), files);
        m.useRecovery(store);
        m.autosave();
        assertFalse(Files.exists(store.file()), "no unsaved edits, nothing kept");
        m.edit("R2", RecoveryStoreTest::edited);
        m.autosave();
        assertEquals(Optional.of(m.design()), store.pending());
        m.saveAs(dir.resolve("mine.json"));
        assertFalse(m.dirtyProperty().get());
        assertFalse(Files.exists(store.file()), "saved: the recovery copy is gone");
        m.edit("R2 again", d -> d.withStage(0, d.stages().get(0).withFeedbackOhms(56e3)));
        m.autosave();
        m.edit("R2 once more", d -> d.withStage(0, d.stages().get(0).withFeedbackOhms(68e3)));
        m.autosave();
        m.closing();
        assertFalse(Files.exists(store.file()), "a normal close leaves no recovery file");
        assertFalse(Files.exists(halfrail.io.DesignFiles.backupOf(store.file())), "nor the backup of an older copy");
    }

    @Test
    void savingIntoAVanishedFolderIsReportedAndTheUnsavedDesignStaysOpen() {
        WorkbenchModel m = model();
        m.edit("R2", RecoveryStoreTest::edited);
        Design before = m.design();
        m.saveAs(dir.resolve("gone").resolve("mine.json"));
        assertTrue(m.statusProperty().get().startsWith("Could not save mine.json (the design stays open, unsaved)"),
                m.statusProperty().get());
        assertNotNull(m.saveFailureProperty().get());
        assertSame(before, m.design());
        assertTrue(m.dirtyProperty().get());
        assertEquals(null, m.fileProperty().get());
    }

    @Test
    void savingWhereTheFolderIsAFileIsReportedAndTheUnsavedDesignStaysOpen() throws IOException {
        // a folder that cannot be written to even by the superuser: its "parent" is a plain file
        Path blocker = Files.writeString(dir.resolve("not-a-folder"), "x");
        WorkbenchModel m = model();
        m.edit("R2", RecoveryStoreTest::edited);
        m.saveAs(blocker.resolve("mine.json"));
        assertTrue(m.statusProperty().get().startsWith("Could not save"), m.statusProperty().get());
        assertTrue(m.dirtyProperty().get());
        assertEquals("x", Files.readString(blocker));
    }

    @Test
    void openingADamagedFileShowsTheErrorAndLeavesTheFileAndTheDesignAlone() throws IOException {
        WorkbenchModel m = model();
        Design before = m.design();
        Path bad = dir.resolve("bad.json");
        byte[] junk = "{\"format\": \"halfrail-design\", \"version\": 1, \"supply\": 7}".getBytes(StandardCharsets.UTF_8);
        Files.write(bad, junk);
        m.open(bad);
        assertTrue(m.statusProperty().get().startsWith("Could not open bad.json (the file is left as it is)"),
                m.statusProperty().get());
        assertNotNull(m.openFailureProperty().get());
        assertArrayEquals(junk, Files.readAllBytes(bad));
        assertSame(before, m.design());
    }
}
