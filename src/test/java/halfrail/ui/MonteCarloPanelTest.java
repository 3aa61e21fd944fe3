package halfrail.ui;

import javafx.scene.control.Label;
import javafx.stage.Stage;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.testfx.api.FxRobot;
import org.testfx.framework.junit5.ApplicationExtension;
import org.testfx.framework.junit5.Start;
import org.testfx.util.WaitForAsyncUtils;

import java.util.Optional;
import java.util.concurrent.TimeUnit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The Monte Carlo tab in a real window (TestFX, headless Monocle) with the app's background
 * executor for studies: the FX thread keeps answering while a study runs (a pulse posted every
 * {@value #PULSE_MS} ms records how long the FX thread took to run it; see {@link FxThreadProbe} for
 * what is subtracted on a loaded machine), and the stop button ends a running study. The sample
 * (one stage) keeps the 10,000-build run short.
 */
@ExtendWith(ApplicationExtension.class)
class MonteCarloPanelTest {
    /** The longest the FX thread may be held up, ms (issue 6: the window stays responsive during Monte Carlo). */
    static final long MAX_GAP_MS = 100;
    /** How often the probe asks the FX thread to run, ms. */
    static final long PULSE_MS = 20;

    /** Time given to the window to draw its first frames before the probe starts, ms. */
    static final long SETTLE_MS = 500;

    private WorkbenchView view;
    private BackgroundAnalysisExecutor studies;

    @Start
    void start(Stage stage) {
        studies = new BackgroundAnalysisExecutor();
        WorkbenchModel model = new WorkbenchModel(new SynchronousAnalysisExecutor(), studies,
                SampleDesigns.instrumentBoost(), Optional.empty());
        view = new WorkbenchView(model);
        stage.setScene(HalfrailApp.scene(view));
        stage.show();
        view.bottomTabs().getSelectionModel().select(2);
    }

    @AfterEach
    void stop() {
        view.model().monteCarlo().shutdown();
        studies.shutdown();
    }

    private MonteCarloModel mc() {
        return view.model().monteCarlo();
    }

    @Test
    @halfrail.solve.WithoutSolveAudit("a latency measured on the machine: auditing 10 000 builds on the study's threads"
            + " takes processor time from the FX thread; the builds' solves are audited in MonteCarloTest")
    void theFxThreadIsNeverHeldUpForMoreThanATenthOfASecondDuringATenThousandBuildStudy(FxRobot robot) throws Exception {
        robot.interact(() -> mc().buildsProperty().set(10_000));
        // the window's first frames are drawn before the probe starts: it measures the study, not the start-up
        WaitForAsyncUtils.waitForFxEvents();
        Thread.sleep(SETTLE_MS);
        long heldUp;
        long latency;
        boolean subtracted;
        try (FxThreadProbe probe = new FxThreadProbe(PULSE_MS)) {
            robot.interact(() -> mc().run());
            WaitForAsyncUtils.waitFor(180, TimeUnit.SECONDS, () -> mc().stateProperty().get() != MonteCarloModel.State.RUNNING);
            WaitForAsyncUtils.waitForFxEvents();
            Thread.sleep(3 * PULSE_MS);
            assertTrue(probe.pulses() > 10, "the probe ran: " + probe.pulses() + " pulses");
            heldUp = probe.largestHeldUpMs();
            latency = probe.largestLatencyMs();
            subtracted = probe.subtractsMachineLoad();
        }
        assertEquals(MonteCarloModel.State.DONE, mc().stateProperty().get(), mc().messageProperty().get());
        assertEquals(10_000, mc().resultProperty().get().builds());
        assertTrue(heldUp < MAX_GAP_MS, "the FX thread was held up for " + heldUp + " ms (" + latency
                + " ms on the clock" + (subtracted ? ", less its and the renderer's wait for a processor" : "") + " and the collector's pauses" + ")");
        // the result is on screen: rest point and headroom histograms of the one stage, the yield in words
        assertEquals(2, view.monteCarlo().canvases().size());
        assertTrue(robot.lookup("#mc-summary").queryAs(Label.class).getText().startsWith("Yield "));
    }

    @Test
    void theStopButtonEndsARunningStudyBeforeItsLastBuild(FxRobot robot) throws Exception {
        robot.interact(() -> mc().buildsProperty().set(1_000_000));
        // the buttons are fired rather than clicked: a click depends on where the window lies on the test screen
        robot.interact(() -> robot.lookup("#mc-run").queryButton().fire());
        WaitForAsyncUtils.waitFor(60, TimeUnit.SECONDS, () -> mc().doneProperty().get() > 0);
        robot.interact(() -> robot.lookup("#mc-cancel").queryButton().fire());
        WaitForAsyncUtils.waitFor(60, TimeUnit.SECONDS, () -> mc().stateProperty().get() == MonteCarloModel.State.CANCELLED);
        long done = mc().doneProperty().get();
        assertTrue(done > 0 && done < 1_000_000, "stopped after " + done);
        assertTrue(robot.lookup("#mc-cancel").query().isDisabled(), "stop is disabled once stopped");
        assertTrue(robot.lookup("#mc-message").queryAs(Label.class).getText().startsWith("Stopped after"));
    }
}
