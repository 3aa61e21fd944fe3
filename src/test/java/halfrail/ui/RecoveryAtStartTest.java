package halfrail.ui;

import halfrail.design.Design;
import javafx.application.Application;
import javafx.scene.control.Button;
import javafx.scene.control.ButtonType;
import javafx.scene.control.DialogPane;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.testfx.api.FxRobot;
import org.testfx.api.FxToolkit;
import org.testfx.util.WaitForAsyncUtils;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import java.util.concurrent.TimeUnit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Restoring unsaved work at start: the decision as a plain model ({@link RecoveryPrompt}) and the
 * real application started on a state folder holding a recovery file, its question answered by
 * clicking the dialog's buttons (headless, Monocle).
 */
class RecoveryAtStartTest {
    @TempDir
    Path dir;

    private final JsonDesignFiles files = new JsonDesignFiles();
    private Application app;

    @AfterEach
    void close() throws Exception {
        if (app != null) {
            FxToolkit.cleanupApplication(app);
        }
        FxToolkit.cleanupStages();
        HalfrailApp.useFileActions(null);
        HalfrailApp.useStateFolder(null);
    }

    private static Design edited() {
        Design d = SampleDesigns.instrumentBoost();
        Design e = d.withStage(0, d.stages().get(0).withFeedbackOhms(47e3));
        return new Design("kept after a crash", e.description(), e.supply(), e.reference(), e.stages(), e.source(),
                e.load(), e.thresholds(), e.powerOnRampSeconds());
    }

    private WorkbenchModel model() {
        return new WorkbenchModel(new SynchronousAnalysisExecutor(), SampleDesigns.instrumentBoost(), Optional.of(files));
    }

    // ---- the decision, without the toolkit ----

    @Test
    void withNoRecoveryFileThereIsNothingToAsk() {
        assertEquals(Optional.empty(), RecoveryPrompt.atStart(new RecoveryStore(dir, files), model()));
    }

    @Test
    void acceptingShowsTheKeptDesignMarkedUnsavedAndKeepsTheFileUntilSaved() throws IOException {
        RecoveryStore store = new RecoveryStore(dir, files);
        store.save(edited());
        WorkbenchModel m = model();
        RecoveryPrompt p = RecoveryPrompt.atStart(store, m).orElseThrow();
        assertTrue(p.message().contains("kept after a crash"), p.message());
        p.accept();
        assertEquals(edited(), m.designProperty().get());
        assertTrue(m.dirtyProperty().get(), "the restored design has no file yet: unsaved");
        assertEquals(null, m.fileProperty().get());
        assertTrue(Files.exists(store.file()), "kept until the work is saved or the app closes normally");
    }

    @Test
    void decliningRemovesTheRecoveryFileAndLeavesTheDesignAlone() throws IOException {
        RecoveryStore store = new RecoveryStore(dir, files);
        store.save(edited());
        WorkbenchModel m = model();
        Design before = m.designProperty().get();
        RecoveryPrompt.atStart(store, m).orElseThrow().decline();
        assertFalse(Files.exists(store.file()));
        assertEquals(before, m.designProperty().get());
        assertFalse(m.dirtyProperty().get());
    }

    @Test
    void anUnreadableRecoveryFileIsToldAndLeftWithoutAQuestion() throws IOException {
        RecoveryStore store = new RecoveryStore(dir, files);
        Files.writeString(store.file(), "{\"format\": \"halfrail-design\", \"stages\": [", StandardCharsets.UTF_8);
        WorkbenchModel m = model();
        assertEquals(Optional.empty(), RecoveryPrompt.atStart(store, m));
        assertTrue(m.statusProperty().get().contains("could not be read"), m.statusProperty().get());
        assertTrue(Files.exists(store.file()));
    }

    // ---- the real app ----

    private HalfrailApp startWithRecoveryFile() throws Exception {
        new RecoveryStore(dir, files).save(edited());
        HalfrailApp.useFileActions(files);
        HalfrailApp.useStateFolder(dir);
        FxToolkit.registerPrimaryStage();
        app = FxToolkit.setupApplication(HalfrailApp.class);
        FxRobot robot = new FxRobot();
        WaitForAsyncUtils.waitFor(30, TimeUnit.SECONDS,
                () -> robot.lookup("#" + HalfrailApp.RECOVERY_DIALOG_ID).tryQuery().isPresent());
        return (HalfrailApp) app;
    }

    private static void answer(ButtonType which) {
        FxRobot robot = new FxRobot();
        DialogPane pane = robot.lookup("#" + HalfrailApp.RECOVERY_DIALOG_ID).queryAs(DialogPane.class);
        assertTrue(pane.getContentText().contains("kept after a crash"), pane.getContentText());
        robot.clickOn((Button) pane.lookupButton(which));
        WaitForAsyncUtils.waitForFxEvents();
    }

    @Test
    void theAppOffersTheKeptDesignAndYesShowsItUnsaved() throws Exception {
        HalfrailApp halfrail = startWithRecoveryFile();
        answer(ButtonType.YES);
        WaitForAsyncUtils.waitFor(30, TimeUnit.SECONDS, () -> edited().equals(halfrail.model().designProperty().get()));
        assertTrue(halfrail.model().dirtyProperty().get());
        assertFalse(new FxRobot().lookup("#" + HalfrailApp.RECOVERY_DIALOG_ID).tryQuery().isPresent(), "the question is gone");
    }

    @Test
    void theAppOffersTheKeptDesignAndNoRemovesTheRecoveryFile() throws Exception {
        HalfrailApp halfrail = startWithRecoveryFile();
        Path kept = new RecoveryStore(dir, files).file();
        answer(ButtonType.NO);
        WaitForAsyncUtils.waitFor(30, TimeUnit.SECONDS, () -> !Files.exists(kept));
        assertEquals(SampleDesigns.instrumentBoost(), halfrail.model().designProperty().get());
        assertFalse(halfrail.model().dirtyProperty().get());
    }
}
