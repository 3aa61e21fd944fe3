package halfrail.ui;

import halfrail.check.DividerChoice;
import halfrail.check.PowerOnReport;
import halfrail.check.ResponseCurve;
import org.junit.jupiter.api.Test;

import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The view-models of the power-on, response and battery trade-off plots on the sample design,
 * with a synchronous executor (no window needed), and the axis labels' engineering notation.
 */
class StudyPlotsTest {
    private final WorkbenchModel model = new WorkbenchModel(new SynchronousAnalysisExecutor(), SampleDesigns.instrumentBoost(), Optional.empty());

    @Test
    void thePowerOnPlotGetsTheAnalysisTraceAndItsSettleUpTime() {
        PowerOnReport p = model.plots().powerOnProperty().get();
        assertNotNull(p);
        assertTrue(p.trace().isPresent());
        assertTrue(p.settleSeconds().isPresent());
        String[] lines = model.plots().powerOnCsv().split("\n");
        assertEquals("time_seconds,boost_volts,load_volts", lines[0]);
        assertEquals(p.trace().get().timesSeconds().length + 1, lines.length);
        // the first sample is at switch-on with the capacitors empty: the load starts at 0 V (common practice)
        assertEquals(0, Double.parseDouble(lines[1].split(",")[2]), 1e-3);
    }

    @Test
    void theResponsePlotGetsOneCurvePerSignalStageAndTheLoad() {
        var chain = model.plots().chainProperty().get();
        assertEquals(2, chain.responses().size(), chain.responses().toString());
        assertTrue(chain.responses().stream().anyMatch(ResponseCurve::atLoad));
        long rows = chain.responses().stream().mapToLong(c -> c.frequenciesHz().length).sum();
        assertEquals(rows + 1, model.plots().responseCsv().split("\n").length);
    }

    @Test
    void aDesignThatCannotBeAnalysedEmptiesThePlots() {
        model.edit("an unknown op-amp", d -> d.withStage(0, d.stages().get(0).withOpAmp(halfrail.design.OpAmpChoice.archetype("no-such-part"))));
        assertNull(model.plots().powerOnProperty().get());
        assertNull(model.plots().chainProperty().get());
    }

    @Test
    void theTradeoffRunsOnlyWhileWantedAndMarksTheDesignsOwnDivider() {
        DividerTradeoffModel t = model.tradeoff();
        assertNull(t.resultProperty().get(), "nothing computed while the plot is not shown");
        t.wantedProperty().set(true);
        DividerChoice mine = t.resultProperty().get().current();
        assertEquals(100e3, mine.upperOhms(), 1e-6);
        assertEquals(100e3, mine.lowerOhms(), 1e-6);
        // Ohm's law: 9 V across 100k + 100k drives 45 µA through the divider
        assertEquals(45e-6, mine.dividerAmps(), 45e-6 * 0.02);
        String csv = t.csv();
        assertEquals(1, csv.lines().filter(l -> l.endsWith(",yes")).count());
        assertEquals(t.resultProperty().get().choices().size() + 1, csv.lines().count());
        assertTrue(t.messageProperty().get().startsWith("This design: 100 kΩ / 100 kΩ divider, 45"), t.messageProperty().get());
    }

    @Test
    void anEditIsStudiedAgainOnlyWhenThePlotIsWanted() {
        DividerTradeoffModel t = model.tradeoff();
        t.wantedProperty().set(true);
        var first = t.resultProperty().get();
        t.wantedProperty().set(false);
        model.edit("divider", d -> d.withReference(d.reference().withDivider(47e3, 47e3)));
        assertTrue(first == t.resultProperty().get(), "not recomputed while hidden");
        t.wantedProperty().set(true);
        assertEquals(47e3, t.resultProperty().get().current().upperOhms(), 1e-6);
    }

    @Test
    void theSupplySweepRunsOnlyWhileItsPlotIsWantedAndThenOnTheLatestDesign() {
        HeadroomSweepModel h = model.headroom();
        assertTrue(h.curves().isEmpty(), "nothing swept while the plot is not shown");
        assertEquals(3.0, h.limitDbProperty().get(), 1e-12, "the limit line is known without the sweep");
        model.edit("R2", d -> d.withStage(0, d.stages().get(0).withFeedbackOhms(68e3)));
        assertTrue(h.curves().isEmpty(), "an edit while hidden sweeps nothing either");
        h.wantedProperty().set(true);
        assertEquals(1, h.curves().size(), "one signal op-amp");
        // swept on the edited design: gain 1 + 68k/3.9k ≈ 18.4 (non-inverting gain rule), 1.84 V peak, too much for a run-down block
        assertEquals(halfrail.check.LowestPassingSupply.Verdict.FAILS_BELOW, h.curves().get(0).lowest().verdict(),
                h.curves().get(0).lowestInWords());
        var swept = h.curves().get(0);
        h.wantedProperty().set(false);
        h.wantedProperty().set(true);
        assertTrue(swept == h.curves().get(0), "the same design is not swept twice");
    }

    @Test
    void axisLabelsUseEngineeringPrefixes() {
        assertEquals("4.7 µA", DecadeAxis.engineering(4.7e-6, "A"));
        assertEquals("100 kΩ", DecadeAxis.engineering(100e3, "Ω"));
        assertEquals("1 Hz", DecadeAxis.engineering(1, "Hz"));
        assertEquals("10 ms", DecadeAxis.engineering(0.01, "s"));
        assertEquals("0 V", DecadeAxis.engineering(0, "V"));
    }
}
