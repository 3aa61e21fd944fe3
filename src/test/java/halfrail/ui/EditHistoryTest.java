package halfrail.ui;

import halfrail.design.Design;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Undo and redo as a command stack (the usual editor behaviour: a new edit clears redo — common practice). */
class EditHistoryTest {
    private final Design a = SampleDesigns.instrumentBoost();
    private final Design b = a.withStage(0, a.stages().get(0).withFeedbackOhms(47e3));
    private final Design c = b.withStage(0, b.stages().get(0).withLegOhms(4.7e3));

    @Test
    void undoReturnsTheDesignBeforeEachEditInReverseOrder() {
        EditHistory h = new EditHistory();
        h.record(new EditHistory.DesignEdit("R2", a, b));
        h.record(new EditHistory.DesignEdit("R1", b, c));
        assertSame(b, h.undo().orElseThrow().before());
        assertSame(a, h.undo().orElseThrow().before());
        assertTrue(h.undo().isEmpty());
    }

    @Test
    void redoAppliesUndoneEditsAgain() {
        EditHistory h = new EditHistory();
        h.record(new EditHistory.DesignEdit("R2", a, b));
        h.undo();
        assertSame(b, h.redo().orElseThrow().after());
        assertTrue(h.redo().isEmpty());
    }

    @Test
    void aNewEditClearsWhatCouldBeRedone() {
        EditHistory h = new EditHistory();
        h.record(new EditHistory.DesignEdit("R2", a, b));
        h.undo();
        h.record(new EditHistory.DesignEdit("R1", a, c));
        assertTrue(h.nextRedo().isEmpty());
        assertEquals("R1", h.nextUndo().orElseThrow().description());
    }

    @Test
    void theOldestEditsAreForgottenBeyondTheDepthLimit() {
        EditHistory h = new EditHistory();
        for (int i = 0; i < EditHistory.DEPTH_LIMIT + 10; i++) {
            h.record(new EditHistory.DesignEdit("edit " + i, a, b));
        }
        assertEquals(EditHistory.DEPTH_LIMIT, h.undoDepth());
    }
}
