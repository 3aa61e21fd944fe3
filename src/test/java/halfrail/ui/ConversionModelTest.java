package halfrail.ui;

import halfrail.check.Severity;
import halfrail.convert.ConversionRequest;
import halfrail.convert.ConversionResult;
import halfrail.convert.LimitPriority;
import halfrail.design.CellPack;
import halfrail.design.StageKind;
import halfrail.design.UsbPort;
import halfrail.parts.CellChemistry;
import halfrail.parts.PartsLibrary;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
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
    void aValueThatCannotBeReadIsMarkedOnItsFieldAsItIsTypedAndRefusedNamingIt() {
        ConversionModel.Entry r2 = conv.stages().get(0).r2();
        r2.textProperty().set("10 kV");
        assertFalse(r2.problemProperty().get().isEmpty(), "a voltage is not a resistance: refused at once");
        conv.convert();
        assertNull(conv.resultProperty().get());
        assertTrue(conv.messageProperty().get().startsWith("Not converted — stage 1, R2:"), conv.messageProperty().get());
        r2.textProperty().set("4k7");
        assertEquals("", r2.problemProperty().get(), "IEC 60062 code 4k7 = 4.7 kΩ is read");
        assertEquals(4.7e3, conv.request().original().stages().get(0).r2Ohms(), 1e-9);
    }

    @Test
    void aBandWhoseTopLiesBelowItsLowEndIsRefusedOnTheTopField() {
        conv.bandLow().textProperty().set("30k");
        assertTrue(conv.bandHigh().problemProperty().get().contains("above the band's low end"),
                conv.bandHigh().problemProperty().get());
        assertTrue(conv.firstProblem().orElseThrow().startsWith("band to:"));
        conv.bandLow().textProperty().set("20");
        assertEquals("", conv.bandHigh().problemProperty().get());
    }

    // ---- chain editing -------------------------------------------------------------------------

    @Test
    void stagesAreAddedAfterTheLastUnderAFreeNameMovedAndRemovedButNeverTheLastOne() {
        ConversionModel.StageEntry first = conv.stages().get(0);
        assertFalse(conv.removeStage(0), "a chain keeps at least one stage");
        assertTrue(conv.addStage());
        ConversionModel.StageEntry second = conv.stages().get(1);
        assertEquals("stage 2", second.name().textProperty().get());
        assertEquals(first.r2().textProperty().get(), second.r2().textProperty().get(), "a new stage copies the last one");
        second.kindProperty().set(StageKind.INVERTING);
        second.r2().textProperty().set("22k");

        assertTrue(conv.moveStage(1, -1));
        assertEquals(List.of(second, first), conv.stages());
        assertFalse(conv.moveStage(0, -1), "nothing comes before the first stage");
        ConversionRequest q = conv.request();
        assertEquals(StageKind.INVERTING, q.original().stages().get(0).kind());
        assertEquals("stage 2", q.original().stages().get(0).name());
        assertEquals(StageKind.NON_INVERTING, q.original().stages().get(1).kind());

        assertTrue(conv.removeStage(0));
        assertEquals(List.of(first), conv.stages());
    }

    @Test
    void aChainHoldsAtMostEightStagesAndTwoStagesMayNotShareAName() {
        while (conv.addStage()) {
            // fill the chain
        }
        assertEquals(halfrail.convert.DualRailChain.MAX_STAGES, conv.stages().size());
        conv.stages().get(3).name().textProperty().set("stage 1");
        assertTrue(conv.stages().get(3).name().problemProperty().get().contains("used by another stage"));
        assertTrue(conv.firstProblem().orElseThrow().startsWith("stage 4, name:"), conv.firstProblem().toString());
        conv.stages().get(3).name().textProperty().set("buffer");
        assertTrue(conv.firstProblem().isEmpty(), conv.firstProblem().toString());
    }

    @Test
    void aTwoStageChainConvertsWithTheProductOfTheStageGains() {
        conv.addStage();
        ConversionModel.StageEntry second = conv.stages().get(1);
        second.kindProperty().set(StageKind.INVERTING);
        second.r1().textProperty().set("10k");
        second.r2().textProperty().set("22k");
        conv.signal().textProperty().set("30m");
        conv.convert();
        ConversionResult r = conv.resultProperty().get();
        assertNotNull(r, conv.messageProperty().get());
        assertEquals(2, r.design().stages().size());
        assertEquals(StageKind.INVERTING, r.design().stages().get(1).kind());
        // cascade gain is the product of the stage gains: (1 + 100k/10k)·(22k/10k) = 11·2.2 = 24.2 (closed form);
        // the engine's finite open-loop gain takes about noise gain / A ≈ 11/1e5 off each stage
        assertEquals(24.2, r.comparison().before().gain(), 24.2 * 1e-3);
        assertEquals(24.2, r.comparison().after().gain(), 24.2 * 0.02);
        assertTrue(conv.changes().stream().anyMatch(c -> c.where().startsWith("stages[0].legCapacitor")),
                "the non-inverting stage gets its leg capacitor");
    }

    @Test
    void aCustomPartStartsFromTheChosenArchetypesFiguresAndAnImpossibleFigureIsRefused() {
        ConversionModel.StageEntry s = conv.stages().get(0);
        String before = s.opAmpProperty().get();
        s.opAmpProperty().set(ConversionModel.CUSTOM);
        double gbw = PartsLibrary.builtIn().requireOpAmpArchetype(before).typical().gainBandwidthHz();
        assertEquals(OpAmpFigures.text(1, gbw), s.custom().get(1).textProperty().get());
        s.custom().get(1).textProperty().set("3 MV");
        assertFalse(s.custom().get(1).problemProperty().get().isEmpty(), "a voltage is not a gain-bandwidth");
        s.custom().get(1).textProperty().set("3M");
        s.custom().get(OpAmpFigures.SUPPLY_MAX).textProperty().set("1");
        assertTrue(s.opAmpProblemProperty().get().startsWith("supply, highest:"), s.opAmpProblemProperty().get());
        s.custom().get(OpAmpFigures.SUPPLY_MAX).textProperty().set("no limit");
        assertEquals("", s.opAmpProblemProperty().get());
        halfrail.circuit.OpAmpParams p = conv.request().original().stages().get(0).opAmp().customParams().orElseThrow();
        assertEquals(3e6, p.gainBandwidthHz(), 1e-3);
        assertEquals(Double.POSITIVE_INFINITY, p.supplyMaxVolts());
    }

    // ---- the new supply ------------------------------------------------------------------------

    @Test
    void aUsbPortIsOfferedWithItsRippleAndARuntimeLimitIsRefusedForIt() {
        conv.supplyKindProperty().set(ConversionModel.SupplyKind.USB_PORT);
        UsbPort usb = assertInstanceOf(UsbPort.class, conv.request().supply());
        // USB 2.0 §7.2: 4.75–5.25 V at the port; 4.4 V low end after cable drop (UsbPort, via secondary sources)
        assertEquals(5.25, usb.highVolts());
        assertEquals(4.4, usb.lowVolts());
        assertTrue(conv.supplySummaryProperty().get().contains("5 V nominal"), conv.supplySummaryProperty().get());
        assertEquals(new UsbPort(0, 0).safetyNote(), conv.safetyNoteProperty().get());

        conv.usbRipple().textProperty().set("20m");
        conv.usbRippleHz().textProperty().set("100k");
        UsbPort rippled = assertInstanceOf(UsbPort.class, conv.request().supply());
        assertEquals(0.02, rippled.rippleVoltsPeak(), 1e-12);
        assertEquals(1e5, rippled.rippleHz(), 1e-6);
        conv.usbRippleHz().textProperty().set("");
        assertEquals("is required with a ripple", conv.usbRippleHz().problemProperty().get());

        conv.usbRipple().textProperty().set("");
        conv.minRuntime().textProperty().set("100");
        assertTrue(conv.minRuntime().problemProperty().get().contains("capacity"), conv.minRuntime().problemProperty().get());
        conv.supplyKindProperty().set(ConversionModel.SupplyKind.CELLS);
        assertEquals("", conv.minRuntime().problemProperty().get(), "cells have a capacity");
    }

    @Test
    void aStageConvertedToAUsbPortHasNoFailingFinding() {
        ConversionModel.StageEntry s = conv.stages().get(0);
        s.kindProperty().set(StageKind.INVERTING);
        s.r1().textProperty().set("10k");
        s.r2().textProperty().set("47k");
        s.opAmpProperty().set("jfet-input-audio");
        conv.positiveRail().textProperty().set("12");
        conv.negativeRail().textProperty().set("12");
        conv.supplyKindProperty().set(ConversionModel.SupplyKind.USB_PORT);
        conv.signal().textProperty().set("300m");
        conv.sourceOhms().textProperty().set("600");
        conv.loadOhms().textProperty().set("600");
        conv.convert();
        ConversionResult r = conv.resultProperty().get();
        assertNotNull(r, conv.messageProperty().get());
        assertInstanceOf(UsbPort.class, r.design().supply());
        assertFalse(r.hasFailingFinding(), r.report().findings().toString());
        assertTrue(conv.messageProperty().get().startsWith("Converted: no failing finding"), conv.messageProperty().get());
    }

    @Test
    void cellsTakeTheChemistrysOwnCautionAndALithiumCellSaysItNeedsProtection() {
        conv.chemistryProperty().set(CellChemistry.LI_ION);
        conv.cells().textProperty().set("2");
        CellPack p = assertInstanceOf(CellPack.class, conv.request().supply());
        assertEquals(2, p.cellsInSeries());
        assertEquals(p.data().safetyNote(), conv.safetyNoteProperty().get());
        assertTrue(conv.safetyNoteProperty().get().contains("protection circuit"));
        assertTrue(conv.safetyNoteProperty().get().contains("cell maker's limits"));
        conv.cells().textProperty().set("1.5");
        assertTrue(conv.cells().problemProperty().get().contains("whole number"), conv.cells().problemProperty().get());
        assertThrows(IllegalArgumentException.class, conv::request);
    }

    // ---- limits and their priority -------------------------------------------------------------

    @Test
    void aOneHertzBandWithATenMillisecondSettleUpReportsWhichLimitWonAndByHowMuchTheOtherIsMissed() {
        // the impossible request of the conversion brief: a 1 Hz corner needs τ ≥ 1/(2π·1 Hz) ≈ 159 ms
        // per network (first-order RC corner), far beyond a 10 ms settle-up
        conv.bandLow().textProperty().set("1");
        conv.maxSettle().textProperty().set("10m");
        conv.convert();
        assertNotNull(conv.resultProperty().get(), conv.messageProperty().get());
        ConversionModel.ConflictLine c = conv.conflicts().get(0);
        assertTrue(c.winner().startsWith("band low end 1 Hz"), c.winner());
        assertTrue(c.loser().startsWith("settle-up limit 10 ms"), c.loser());
        assertTrue(c.statement().startsWith("Won: band low end"), c.statement());
        assertTrue(c.statement().contains("Missed: settle-up limit"), c.statement());
        double missed = conv.resultProperty().get().conflicts().get(0).missedBy();
        assertTrue(missed > 1 / (2 * Math.PI) - 0.01, "missed by " + missed + " s");
        assertEquals(ConversionModel.amount(missed, "s"), c.missedBy());
        assertTrue(conv.messageProperty().get().contains("a limit missed"), conv.messageProperty().get());
        assertFalse(conv.tradeOff().isEmpty());
    }

    @Test
    void theChosenPriorityDecidesWhichLimitWins() {
        conv.maxSettle().textProperty().set("200m");
        conv.priorityProperty().set(LimitPriority.SETTLE);
        conv.convert();
        ConversionResult fast = conv.resultProperty().get();
        assertNotNull(fast, conv.messageProperty().get());
        assertEquals(LimitPriority.SETTLE, fast.request().limits().priority());
        ConversionModel.ConflictLine won = conv.conflicts().get(0);
        assertTrue(won.winner().startsWith("settle-up limit 200 ms"), won.winner());
        assertTrue(won.missedBy().endsWith("Hz"), "the band is missed, in hertz: " + won.missedBy());
        assertTrue(fast.comparison().after().settleSeconds().orElseThrow() <= 0.2);

        conv.priorityProperty().set(LimitPriority.BAND);
        conv.convert();
        ConversionResult wide = conv.resultProperty().get();
        assertTrue(conv.conflicts().get(0).winner().startsWith("band low end 20 Hz"), conv.conflicts().toString());
        assertTrue(wide.comparison().after().lowerCornerHz().orElseThrow() <= 20);
    }

    // ---- off the FX thread ---------------------------------------------------------------------

    @Test
    void theConversionIsHandedToTheExecutorAndItsResultArrivesOnlyWhenTheJobEnds() {
        HeldExecutor held = new HeldExecutor();
        WorkbenchModel wb = new WorkbenchModel(new SynchronousAnalysisExecutor(), held, SampleDesigns.instrumentBoost(),
                Optional.empty());
        ConversionModel c = wb.conversion();
        c.convert();
        assertTrue(c.runningProperty().get());
        assertNull(c.resultProperty().get(), "convert() only submits the work");
        assertEquals(1, held.jobs.size());
        held.jobs.get(0).finish();
        assertFalse(c.runningProperty().get());
        assertNotNull(c.resultProperty().get(), c.messageProperty().get());
    }
}
