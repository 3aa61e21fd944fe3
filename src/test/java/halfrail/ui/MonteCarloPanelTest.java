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
 * executor for studies: the FX thread keeps answering while a study runs, and the stop button ends a
 * running study. The sample (one stage) keeps the 10,000-build run short.
 *
 * <p>"Answering" is measured three ways, each robust to a loaded 2-core machine (see
 * {@link FxThreadProbe}): every callback and progress update the study executor posts to the FX
 * thread, and every layout pass of the window, is timed on the FX thread less that thread's wait
 * for a processor and the collector's pauses; and a pulse posted every {@value #PULSE_MS} ms records
 * how much processor time the FX thread spent before it could run the pulse (any work done on the
 * FX thread, wherever it came from, such as a study run in a button's handler). Each must stay under
 * {@value #MAX_GAP_MS} ms. The clock's view of the pulses, which also holds the machine's hiccups,
 * is reported in the message only.
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
    /** What the study executor does to each FX-thread task: set to the probe's timer while a test measures. */
    private volatile java.util.function.UnaryOperator<Runnable> fxTasks = java.util.function.UnaryOperator.identity();

    @Start
    void start(Stage stage) {
        studies = new BackgroundAnalysisExecutor(task -> fxTasks.apply(task));
        WorkbenchModel model = new WorkbenchModel(new SynchronousAnalysisExecutor(), studies,
                SampleDesigns.instrumentBoost(), Optional.empty());
        view = new WorkbenchView(model);
        stage.setScene(HalfrailApp.scene(view));
        stage.show();
        view.bottomTabs().getSelectionModel().select(view.bottomTabs().getTabs().stream()
                .filter(t -> "monte-carlo-tab".equals(t.getId())).findFirst().orElseThrow());
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
        long busy;
        long task;
        long layout;
        String clock;
        try (FxThreadProbe probe = new FxThreadProbe(PULSE_MS)) {
            probe.watch(view.getScene());
            fxTasks = probe::timed;
            robot.interact(() -> mc().run());
            WaitForAsyncUtils.waitFor(180, TimeUnit.SECONDS, () -> mc().stateProperty().get() != MonteCarloModel.State.RUNNING);
            WaitForAsyncUtils.waitForFxEvents();
            Thread.sleep(3 * PULSE_MS);
            fxTasks = java.util.function.UnaryOperator.identity();
            assertTrue(probe.pulses() > 10, "the probe ran: " + probe.pulses() + " pulses");
            assertTrue(probe.tasks() >= 2, "the study's progress and result were timed: " + probe.tasks() + " tasks");
            assertTrue(probe.layouts() > 0, "the window's layout passes were timed");
            busy = probe.largestBusyMs();
            task = probe.largestTaskMs();
            layout = probe.largestLayoutMs();
            clock = " (pulses waited up to " + probe.largestLatencyMs() + " ms on the clock, " + probe.largestHeldUpMs()
                    + " ms less the processor waits" + (probe.subtractsMachineLoad() ? "" : " [not available here]")
                    + " and the collector's pauses; " + probe.tasks() + " tasks, " + probe.layouts() + " layout passes)";
        }
        assertEquals(MonteCarloModel.State.DONE, mc().stateProperty().get(), mc().messageProperty().get());
        assertEquals(10_000, mc().resultProperty().get().builds());
        assertTrue(task < MAX_GAP_MS, "a task posted to the FX thread held it for " + task + " ms" + clock);
        assertTrue(layout < MAX_GAP_MS, "a layout pass held the FX thread for " + layout + " ms" + clock);
        assertTrue(busy < MAX_GAP_MS, "the FX thread was busy for " + busy + " ms before it answered a pulse" + clock);
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
