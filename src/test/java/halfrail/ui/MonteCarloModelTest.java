package halfrail.ui;

import halfrail.check.Ladder;
import halfrail.check.MonteCarloResult;
import halfrail.check.StageDistribution;
import halfrail.design.Design;
import org.junit.jupiter.api.Test;

import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The Monte Carlo view-model with executors that run in the test's thread: its states, the
 * ladders' spread, opening the worst build, cancelling. No window needed.
 */
class MonteCarloModelTest {
    private static final int BUILDS = 400;

    @Test
    void aFinishedStudyFillsTheLaddersSpreadAroundTheRestPoint() {
        WorkbenchModel model = new WorkbenchModel(new SynchronousAnalysisExecutor(), SampleDesigns.instrumentBoost(), Optional.empty());
        MonteCarloModel mc = model.monteCarlo();
        assertTrue(model.ladders().rungs().get(0).ladder().spreadLowVolts().isEmpty(), "no spread before a study");
        mc.buildsProperty().set(BUILDS);
        mc.run();
        assertEquals(MonteCarloModel.State.DONE, mc.stateProperty().get());
        MonteCarloResult r = mc.resultProperty().get();
        assertEquals(BUILDS, r.builds());
        assertEquals(BUILDS, mc.doneProperty().get());
        Ladder l = model.ladders().rungs().get(0).ladder();
        StageDistribution s = r.opAmp(l.opAmp()).orElseThrow();
        assertEquals(s.lowPercentileVolts(), l.spreadLowVolts().getAsDouble(), 1e-12);
        assertEquals(s.highPercentileVolts(), l.spreadHighVolts().getAsDouble(), 1e-12);
        // the nominal rest point lies within the spread of its own tolerance builds (common practice: the
        // nominal build is the centre of a symmetric tolerance study)
        assertTrue(l.spreadLowVolts().getAsDouble() < l.quiescentVolts() && l.quiescentVolts() < l.spreadHighVolts().getAsDouble());
        assertFalse(mc.staleProperty().get());
    }

    @Test
    void anEditMarksTheStudyOutOfDateAndTheLaddersDropItsSpread() {
        WorkbenchModel model = new WorkbenchModel(new SynchronousAnalysisExecutor(), SampleDesigns.instrumentBoost(), Optional.empty());
        MonteCarloModel mc = model.monteCarlo();
        mc.buildsProperty().set(BUILDS);
        mc.run();
        model.edit("R2", d -> d.withStage(0, d.stages().get(0).withFeedbackOhms(47e3)));
        assertTrue(mc.staleProperty().get());
        assertTrue(model.ladders().rungs().get(0).ladder().spreadLowVolts().isEmpty());
        model.undo();
        assertFalse(mc.staleProperty().get(), "back to the design studied");
        assertTrue(model.ladders().rungs().get(0).ladder().spreadLowVolts().isPresent());
    }

    @Test
    void theWorstBuildOpensAsANewUnsavedDesignWithItsPartValues() {
        WorkbenchModel model = new WorkbenchModel(new SynchronousAnalysisExecutor(), SampleDesigns.instrumentBoost(), Optional.empty());
        MonteCarloModel mc = model.monteCarlo();
        mc.buildsProperty().set(BUILDS);
        mc.run();
        Design worst = mc.resultProperty().get().worst().orElseThrow().build().design();
        assertTrue(mc.openWorstBuild());
        assertEquals(worst, model.design());
        assertTrue(model.dirtyProperty().get(), "unsaved");
        assertNull(model.fileProperty().get());
        assertNotNull(model.reportProperty().get(), "analysed at once");
        // a ±1 % build differs from the nominal 39 kΩ feedback resistor but stays within ±1 % plus drift
        double r2 = model.design().stages().get(0).feedbackOhms();
        assertTrue(Math.abs(r2 - 39e3) / 39e3 < 0.01 + 100e-6 * 25 + 1e-9);
        assertEquals(MonteCarloModel.State.IDLE, mc.stateProperty().get(), "the new design has no study yet");
    }

    @Test
    void cancellingAHeldStudyEndsItAsCancelledWithoutAResult() {
        HeldExecutor held = new HeldExecutor();
        WorkbenchModel model = new WorkbenchModel(new SynchronousAnalysisExecutor(), held, SampleDesigns.instrumentBoost(), Optional.empty());
        MonteCarloModel mc = model.monteCarlo();
        mc.buildsProperty().set(BUILDS);
        mc.run();
        assertEquals(MonteCarloModel.State.RUNNING, mc.stateProperty().get());
        mc.cancel();
        held.jobs.get(0).finish();
        assertEquals(MonteCarloModel.State.CANCELLED, mc.stateProperty().get());
        assertNull(mc.resultProperty().get());
        assertTrue(mc.doneProperty().get() < BUILDS);
        assertTrue(mc.messageProperty().get().startsWith("Stopped after 0 of 400"), mc.messageProperty().get());
    }

    @Test
    void aDesignThatCannotBeStudiedEndsInAFailedStateWithTheReason() {
        WorkbenchModel model = new WorkbenchModel(new SynchronousAnalysisExecutor(), SampleDesigns.instrumentBoost(), Optional.empty());
        MonteCarloModel mc = model.monteCarlo();
        mc.buildsProperty().set(0); // refused by MonteCarloOptions: at least one build
        mc.run();
        assertEquals(MonteCarloModel.State.FAILED, mc.stateProperty().get());
        assertTrue(mc.messageProperty().get().contains("monteCarlo.builds"), mc.messageProperty().get());
    }
}
