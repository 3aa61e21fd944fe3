package halfrail.ui;

import halfrail.check.Severity;
import org.junit.jupiter.api.Test;

import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The conversion assistant's view-model with a synchronous executor (no window needed). */
class ConversionModelTest {
    private final WorkbenchModel model = new WorkbenchModel(new SynchronousAnalysisExecutor(), SampleDesigns.instrumentBoost(), Optional.empty());
    private final ConversionModel conv = model.conversion();

    @Test
    void aDualRailNonInvertingStageConvertsAndOpensAsANewUnsavedDesignWithoutFailingFindings() {
        conv.convert();
        assertNotNull(conv.resultProperty().get(), conv.messageProperty().get());
        assertFalse(conv.changes().isEmpty(), "a mid-rail reference and coupling parts are added");
        // gain 1 + 100k/10k = 11 (non-inverting gain rule) before and after
        ConversionModel.Row gain = conv.comparison().get(0);
        assertEquals(11, Double.parseDouble(gain.before()), 1e-6);
        assertEquals(11, Double.parseDouble(gain.after()), 0.2);
        assertTrue(conv.openResult());
        assertTrue(model.dirtyProperty().get());
        assertNull(model.fileProperty().get());
        assertEquals(0, model.reportProperty().get().findings().stream().filter(f -> f.severity() == Severity.FAIL).count(),
                model.reportProperty().get().findings().toString());
    }

    @Test
    void aValueThatCannotBeReadIsRefusedNamingItsField() {
        conv.r2Property().set("10 kV");
        conv.convert();
        assertNull(conv.resultProperty().get());
        assertTrue(conv.messageProperty().get().startsWith("Not converted — R2:"), conv.messageProperty().get());
    }

    @Test
    void aOneHertzBandWithATenMillisecondSettleUpReportsTheConflict() {
        // the impossible request of the conversion brief: a low corner wants a large R·C, a short settle-up a small one
        conv.bandLowProperty().set("1");
        conv.maxSettleProperty().set("10m");
        conv.convert();
        assertNotNull(conv.resultProperty().get(), conv.messageProperty().get());
        assertFalse(conv.conflicts().isEmpty());
        assertTrue(conv.conflicts().get(0).contains(" wins over "), conv.conflicts().get(0));
    }
}
