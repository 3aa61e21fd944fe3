package halfrail.ui;

import halfrail.check.DesignReport;
import halfrail.check.Finding;
import halfrail.check.Ladder;
import halfrail.check.LadderLevel;
import halfrail.check.Severity;
import halfrail.design.Design;
import org.junit.jupiter.api.Test;

import java.util.Optional;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The main view-model with a synchronous executor: every edit is analysed before the call
 * returns. JavaFX properties work without the toolkit, so these tests need no window.
 */
class WorkbenchModelTest {
    private final SynchronousAnalysisExecutor sync = new SynchronousAnalysisExecutor();
    private final WorkbenchModel model = new WorkbenchModel(sync, SampleDesigns.instrumentBoost(), Optional.empty());

    private EditorPanelModel.TextEntry entry(String path) {
        return (EditorPanelModel.TextEntry) model.editor().field(path).orElseThrow();
    }

    private Ladder ladder() {
        return model.ladders().rungs().get(0).ladder();
    }

    @Test
    void theSampleIsAnalysedOnOpeningAndRestsAtMidRail() {
        DesignReport r = model.reportProperty().get();
        assertTrue(r.failure().isEmpty());
        assertEquals(1, model.ladders().rungs().size());
        // equal 100k/100k divider on the nominal 9 V block: 9 · 100k/(100k+100k) = 4.5 V
        // (voltage-divider rule, any circuits textbook); the stage's bias gain is 1, so the output rests there too
        assertEquals(4.5, ladder().midRailVolts(), 0.05);
        assertEquals(4.5, ladder().quiescentVolts(), 0.05);
        assertEquals("4.50 V", model.readings().readings().get(0).rest());
    }

    @Test
    void raisingR2WidensTheEnvelopeByTheNonInvertingGainRatio() {
        double before = ladder().envelopeHighVolts() - ladder().quiescentVolts();
        EditorPanelModel.TextEntry r2 = entry("stages[0].feedbackOhms");
        r2.textProperty().set("82k");
        assertTrue(r2.commit());
        double after = ladder().envelopeHighVolts() - ladder().quiescentVolts();
        // non-inverting gain 1 + R2/R1 (standard op-amp result): (1 + 82/3.9) / (1 + 39/3.9) = 22.03/11
        assertEquals((1 + 82 / 3.9) / (1 + 39 / 3.9), after / before, 0.02);
        assertEquals(82e3, model.design().stages().get(0).feedbackOhms(), 1e-9);
    }

    @Test
    void aGainThatRunsIntoTheRailBringsAHeadroomFindingOnTheEnvelope() {
        assertFalse(model.findings().items().stream().anyMatch(f -> f.severity() == Severity.FAIL));
        EditorPanelModel.TextEntry r2 = entry("stages[0].feedbackOhms");
        // gain 1 + 150k/3.9k ≈ 39.5 puts 3.9 V peak on a 4.5 V rest point under a 7.5 V top: clips
        r2.textProperty().set("150k");
        r2.commit();
        assertTrue(model.findings().items().stream()
                .anyMatch(f -> f.severity() == Severity.FAIL && f.level().equals(Optional.of(LadderLevel.SIGNAL_ENVELOPE))),
                () -> model.findings().items().toString());
        assertTrue(ladder().clips());
    }

    @Test
    void aBadValueIsRefusedAtTheFieldAndNeverReachesTheDesign() {
        Design before = model.design();
        int runs = sync.jobsRun();
        EditorPanelModel.TextEntry r2 = entry("stages[0].feedbackOhms");
        r2.textProperty().set("39 kq");
        assertFalse(r2.problemProperty().get().isEmpty());
        assertFalse(r2.commit());
        r2.textProperty().set("-39k");
        // the design model itself refuses a negative resistor, and the field shows its reason
        assertTrue(r2.problemProperty().get().contains("stage.feedbackOhms"), r2.problemProperty().get());
        assertFalse(r2.commit());
        assertSame(before, model.design());
        assertEquals(runs, sync.jobsRun(), "no analysis for a refused value");
        r2.textProperty().set("47k");
        assertEquals("", r2.problemProperty().get());
    }

    @Test
    void aFractionalCellCountIsRefused() {
        EditorPanelModel.TextEntry cells = entry("supply.cellsInSeries");
        cells.textProperty().set("1.5");
        assertTrue(cells.problemProperty().get().contains("whole number"));
    }

    @Test
    void undoAndRedoWalkTheEditsBackAndForth() {
        Design original = model.design();
        double rest = ladder().envelopeHighVolts();
        EditorPanelModel.TextEntry r1 = entry("stages[0].legOhms");
        r1.textProperty().set("2k2");
        r1.commit();
        Design edited = model.design();
        assertNotEquals(rest, ladder().envelopeHighVolts());
        assertTrue(model.canUndoProperty().get());
        model.undo();
        assertSame(original, model.design());
        assertTrue(model.statusProperty().get().startsWith("Undone R1 leg = 2k2 · Analysed"), model.statusProperty().get());
        assertEquals(rest, ladder().envelopeHighVolts(), 1e-12);
        assertEquals("3.9 kΩ", r1.textProperty().get());
        assertTrue(model.canRedoProperty().get());
        model.redo();
        assertSame(edited, model.design());
        assertEquals("2.2 kΩ", r1.textProperty().get());
    }

    @Test
    void aStaleAnalysisIsCancelledAndItsResultDropped() {
        HeldExecutor held = new HeldExecutor();
        WorkbenchModel m = new WorkbenchModel(held, SampleDesigns.instrumentBoost(), Optional.empty());
        m.headroom().wantedProperty().set(true); // the headroom plot is shown: its sweep is job 1
        EditorPanelModel.TextEntry r2 = (EditorPanelModel.TextEntry) m.editor().field("stages[0].feedbackOhms").orElseThrow();
        r2.textProperty().set("47k");
        r2.commit();
        r2.textProperty().set("56k");
        r2.commit();
        // each design change starts an analysis and a headroom sweep: jobs 0, 2, 4 are the analyses
        assertEquals(6, held.jobs.size());
        assertTrue(held.jobs.get(0).cancelled());
        assertTrue(held.jobs.get(2).cancelled());
        assertTrue(held.jobs.get(3).cancelled(), "the older sweep too");
        assertFalse(held.jobs.get(4).cancelled());
        held.jobs.get(4).finish();
        DesignReport latest = m.reportProperty().get();
        assertEquals(56e3, latest.design().stages().get(0).feedbackOhms(), 1e-9);
        // even if an older job's work had finished, the generation check would drop it
        held.jobs.get(2).cancel();
        held.jobs.get(2).finish();
        assertSame(latest, m.reportProperty().get());
        assertFalse(m.analysingProperty().get());
    }

    @Test
    void aChainBehindAClippingStageNamesItInTheReadings() {
        halfrail.design.Design base = halfrail.io.DesignFiles.read(java.nio.file.Path.of("samples",
                "handheld-recorder-mic-preamp.json"));
        java.util.List<halfrail.design.Stage> stages = new java.util.ArrayList<>();
        for (int i = 1; i <= 3; i++) {
            halfrail.design.Stage st = base.stages().get(0);
            stages.add(new halfrail.design.Stage(st.name() + "-" + i, st.kind(), st.opAmp(), st.feedbackOhms(),
                    st.legOhms(), st.legCapacitor(), st.inputCapacitor(), true));
        }
        model.replace(base.withStages(stages), null);
        double drive = model.reportProperty().get().stages().get(2).driveFactor();
        assertTrue(model.readings().figures().stream().anyMatch(f -> f.name().equals("clips first")
                && f.value().equals("mic-2; mic-3 gets " + String.format(java.util.Locale.ROOT, "%.3g", 100 * drive)
                + " % of its linear drive")), model.readings().figures()::toString);
        model.replace(SampleDesigns.instrumentBoost(), null);
        assertTrue(model.readings().figures().stream().noneMatch(f -> f.name().equals("clips first")));
    }

    @Test
    void aDesignWithoutItsLegCapacitorShowsItsFailingFindings() {
        model.replace(SampleDesigns.missingLegCapacitor(), null);
        // with R1 DC-coupled to ground the stage amplifies its bias by 1 + R2/R1 = 11 (non-inverting gain rule),
        // 4.5 V × 11 is far above the rail: the output sits on its upper limit
        assertTrue(model.findings().items().stream().anyMatch(f -> f.code().equals("BIAS_AMPLIFIED")
                && f.severity() == Severity.FAIL));
        assertTrue(model.findings().items().stream().anyMatch(f -> f.code().equals("REST_ON_RAIL")));
        assertEquals(Optional.of(Severity.FAIL), model.ladders().rungs().get(0).worst());
        assertEquals("on a rail", model.readings().readings().get(0).headroom());
        assertFalse(model.canUndoProperty().get(), "a replaced design starts a fresh history");
    }

    @Test
    void selectingAFindingSpotlightsItsLadderLevelAndItsFields() {
        model.replace(SampleDesigns.missingLegCapacitor(), null);
        Finding bias = model.findings().items().stream().filter(f -> f.code().equals("BIAS_AMPLIFIED"))
                .findFirst().orElseThrow();
        model.findings().selectedProperty().set(bias);
        LadderPanelModel.Focus focus = model.ladders().focusProperty().get();
        assertEquals(bias.opAmp().orElseThrow(), focus.opAmp());
        assertEquals(bias.level().orElseThrow(), focus.level());
        assertTrue(model.editor().field("stages[0].legCapacitor.technology").orElseThrow().highlightedProperty().get());
        assertFalse(model.editor().field("load.ohms").orElseThrow().highlightedProperty().get());
        model.findings().selectedProperty().set(null);
        assertEquals(null, model.ladders().focusProperty().get());
    }

    @Test
    void pickingALadderLevelSelectsTheFindingAboutIt() {
        model.replace(SampleDesigns.missingLegCapacitor(), null);
        Finding rail = model.findings().items().stream().filter(f -> f.code().equals("REST_ON_RAIL"))
                .findFirst().orElseThrow();
        model.ladders().pick(rail.opAmp().orElseThrow(), rail.level().orElseThrow());
        assertEquals(rail, model.findings().selectedProperty().get());
    }

    @Test
    void stagesCanBeAddedReorderedAndRemovedEachAsOneUndoableEdit() {
        model.editor().addStage();
        assertEquals(2, model.design().stages().size());
        assertEquals(2, model.ladders().rungs().size());
        String second = model.design().stages().get(1).name();
        model.editor().moveStage(1, -1);
        assertEquals(second, model.design().stages().get(0).name());
        assertTrue(model.editor().removeStage(0).isEmpty());
        assertEquals(1, model.design().stages().size());
        assertTrue(model.editor().removeStage(0).isPresent(), "a design keeps at least one stage");
        model.undo();
        model.undo();
        model.undo();
        assertEquals(SampleDesigns.instrumentBoost(), model.design());
    }

    @Test
    void theSupplyTrialAnalysesAtTheChosenVoltageWithoutEditingTheDesign() {
        Design d = model.design();
        double endPoint = d.supply().lowVolts();
        model.trialVoltsProperty().set(endPoint);
        model.trialActiveProperty().set(true);
        assertEquals(endPoint, ladder().supplyVolts(), 1e-9);
        // the ladder keeps marking the design supply's own end-point
        assertEquals(endPoint, model.ladders().rungs().get(0).endPointSupplyVolts(), 1e-9);
        assertSame(d, model.design());
        assertFalse(model.canUndoProperty().get());
        model.trialActiveProperty().set(false);
        assertEquals(d.supply().nominalVolts(), ladder().supplyVolts(), 1e-9);
    }

    @Test
    void switchingTheSupplyKindRebuildsTheSupplyFields() {
        EditorPanelModel.Choice kind = (EditorPanelModel.Choice) model.editor().field("supply").orElseThrow();
        kind.choose(kind.options().stream().filter(o -> o.key().equals("fixed")).findFirst().orElseThrow());
        assertTrue(model.editor().field("supply.volts").isPresent());
        assertTrue(model.editor().field("supply.chemistry").isEmpty());
        model.undo();
        assertTrue(model.editor().field("supply.chemistry").isPresent());
    }

    @Test
    void aTighterHeadroomLimitRaisesAFindingWithoutChangingTheCircuit() {
        assertTrue(model.findings().items().stream().noneMatch(f -> f.code().equals("HEADROOM_LOW")));
        EditorPanelModel.TextEntry least = entry("thresholds.minHeadroomDb");
        assertEquals("3", least.textProperty().get());
        // the sample has about 8.9 dB of headroom (see the readings); asking for 12 dB must flag it
        least.textProperty().set("12");
        assertTrue(least.commit());
        assertEquals(12, model.design().thresholds().minHeadroomDb(), 1e-12);
        assertTrue(model.findings().items().stream().anyMatch(f -> f.code().equals("HEADROOM_LOW")),
                () -> model.findings().items().toString());
    }

    @Test
    void theReadingsExportAsCsvWithQuotedFields() {
        String csv = model.readings().csv();
        String[] lines = csv.split("\r\n", -1);
        assertEquals("op-amp,rest point,swing window,headroom,nearer limit,bias gain,leakage shift", lines[0]);
        assertTrue(lines[1].startsWith("boost,4.50 V,"), lines[1]);
        // RFC 4180 §2: a field containing a quote is quoted and the quote doubled
        assertEquals("\"say \"\"hi\"\", twice\"", ReadingsPanelModel.quote("say \"hi\", twice"));
        assertEquals("plain", ReadingsPanelModel.quote("plain"));
    }

    @Test
    void anAnalysisThatThrowsClearsTheLaddersAndListsTheReasonAtItsField() {
        // a held executor lets the test hand the model a failure, as a check-layer refusal would arrive
        HeldExecutor held = new HeldExecutor();
        WorkbenchModel m = new WorkbenchModel(held, SampleDesigns.instrumentBoost(), Optional.empty());
        m.headroom().wantedProperty().set(true); // the headroom plot is shown: its sweep is job 1
        held.jobs.get(0).finish();
        assertEquals(1, m.ladders().rungs().size());
        EditorPanelModel.TextEntry r1 = (EditorPanelModel.TextEntry) m.editor().field("stages[0].legOhms").orElseThrow();
        r1.textProperty().set("4k7");
        r1.commit();
        held.fail(2, new halfrail.design.DesignException("stages[0].legOhms", "refused for the test"));
        assertTrue(m.ladders().rungs().isEmpty());
        Finding f = m.findings().items().get(0);
        assertEquals(WorkbenchModel.NOT_ANALYSED, f.code());
        m.findings().selectedProperty().set(f);
        assertTrue(m.editor().field("stages[0].legOhms").orElseThrow().highlightedProperty().get());
    }

    @Test
    void theChainDrawingShowsEachStagesDcVoltagesAndLeadsToItsFindings() {
        ChainPanelModel.Block stage = model.chain().blocks().stream()
                .filter(b -> b.kind() == ChainPanelModel.Kind.STAGE).findFirst().orElseThrow();
        // unity bias gain: the output rests at the 4.5 V mid-rail of the equal divider (voltage-divider rule)
        assertTrue(stage.lines().contains("out at rest 4.50 V"), stage.lines().toString());
        assertTrue(stage.lines().get(0).contains("gain 11"), "1 + 39k/3.9k = 11 (non-inverting gain rule)");
        model.replace(SampleDesigns.missingLegCapacitor(), null);
        ChainPanelModel.Block broken = model.chain().blocks().stream()
                .filter(b -> b.path().equals("stages[0]")).findFirst().orElseThrow();
        assertEquals(Optional.of(Severity.FAIL), broken.worst());
        model.chain().pick("stages[0]");
        Finding picked = model.findings().selectedProperty().get();
        assertEquals(Severity.FAIL, picked.severity());
        assertTrue(model.chain().isSpotlit("stages[0]"));
    }

    @Test
    void headroomShrinksAsTheBatteryRunsDown() {
        model.headroom().wantedProperty().set(true); // the plot is shown
        HeadroomSweepModel.Curve c = model.headroom().curves().get(0);
        assertEquals("boost", c.opAmp());
        assertEquals(HeadroomSweepModel.SWEEP_POINTS, c.points().size());
        assertEquals(model.design().supply().lowVolts(), c.points().get(0).volts(), 1e-9);
        assertEquals(model.design().supply().highVolts(), c.points().get(c.points().size() - 1).volts(), 1e-9);
        // with the rest point at mid-rail, a lower rail narrows the swing window around the same signal
        // (common practice), so headroom grows with the supply
        for (int i = 1; i < c.points().size(); i++) {
            assertTrue(c.points().get(i).headroomDb() > c.points().get(i - 1).headroomDb(), c.points().toString());
        }
        assertEquals(3.0, model.headroom().limitDbProperty().get(), 1e-12);
    }

    @Test
    void theHeadroomPlotMarksTheLowestPassingSupplyWhereTheHeadroomMeetsTheLimit() {
        model.headroom().wantedProperty().set(true); // the plot is shown
        // a 68k feedback resistor (gain 1 + 68/3.9 ≈ 18.4: 1.84 V peak from 100 mV) fits a fresh block but not a run-down one
        model.edit("R2", d -> d.withStage(0, d.stages().get(0).withFeedbackOhms(68e3)));
        HeadroomSweepModel.Curve c = model.headroom().curves().get(0);
        assertEquals(halfrail.check.LowestPassingSupply.Verdict.FAILS_BELOW, c.lowest().verdict(), c.lowestInWords());
        double v = c.markVolts().getAsDouble();
        assertTrue(v > model.design().supply().lowVolts() && v < model.design().supply().highVolts());
        // the mark sits where the curve crosses the limit: the points either side lie below and above it
        double limit = model.headroom().limitDbProperty().get();
        HeadroomSweepModel.Point below = c.points().stream().filter(p -> p.volts() < v).reduce((a, b) -> b).orElseThrow();
        HeadroomSweepModel.Point above = c.points().stream().filter(p -> p.volts() > v).findFirst().orElseThrow();
        assertTrue(below.headroomDb() < limit && above.headroomDb() >= limit, below + " " + above);
        assertTrue(c.lowestInWords().startsWith("passes down to "), c.lowestInWords());
        assertTrue(c.lowestInWords().contains("% of the charge left"), "a battery: the charge left is told");
    }

    @Test
    void aCustomOpAmpStartsFromTheArchetypesFiguresAndItsSwingLimitMovesTheLadder() {
        EditorPanelModel.Choice opAmp = (EditorPanelModel.Choice) model.editor().field("stages[0].opAmp").orElseThrow();
        double top = ladder().swingHighVolts();
        EditorPanelModel.Option custom = opAmp.options().stream().filter(o -> o.key().isEmpty()).findFirst().orElseThrow();
        assertTrue(opAmp.choose(custom).isEmpty());
        assertTrue(model.design().stages().get(0).opAmp().customParams().isPresent());
        // same figures as the archetype: same output top
        assertEquals(top, ladder().swingHighVolts(), 1e-9);
        EditorPanelModel.TextEntry headroomTop = entry("stages[0].opAmp.custom.9");
        double was = model.design().stages().get(0).opAmp().customParams().orElseThrow().swingHighVolts();
        headroomTop.textProperty().set("0.5");
        assertTrue(headroomTop.commit(), headroomTop.problemProperty().get());
        // the output top is "headroom below V+": 0.5 V more room moves it up by (was − 0.5) V at the same rail
        assertEquals(top + (was - 0.5), ladder().swingHighVolts(), 0.02);
        headroomTop.textProperty().set("-1");
        assertFalse(headroomTop.problemProperty().get().isEmpty(), "the op-amp model refuses a negative swing headroom");
        model.undo();
        model.undo();
        assertEquals(SampleDesigns.instrumentBoost(), model.design());
    }

    /** A design store for the test: keeps designs in memory by path, as the design-file layer will on disk. */
    static final class MemoryFiles implements DesignFileActions {
        final java.util.Map<java.nio.file.Path, Design> stored = new java.util.HashMap<>();

        @Override
        public Design read(java.nio.file.Path file) throws java.io.IOException {
            Design d = stored.get(file);
            if (d == null) {
                throw new java.io.IOException("no such design: " + file);
            }
            return d;
        }

        @Override
        public void write(Design design, java.nio.file.Path file) {
            stored.put(file, design);
        }

        @Override
        public String extension() {
            return "json";
        }
    }

    @Test
    void anEditMarksTheDesignUnsavedAndUndoingItClearsTheMark() {
        assertFalse(model.dirtyProperty().get());
        EditorPanelModel.TextEntry r2 = entry("stages[0].feedbackOhms");
        r2.textProperty().set("47k");
        r2.commit();
        assertTrue(model.dirtyProperty().get());
        model.undo();
        assertFalse(model.dirtyProperty().get(), "back at the design as opened");
    }

    @Test
    void savingAndReopeningGivesTheSameDesignWithAFreshHistory() {
        MemoryFiles files = new MemoryFiles();
        WorkbenchModel m = new WorkbenchModel(sync, SampleDesigns.instrumentBoost(), Optional.of(files));
        assertTrue(m.filesAvailable());
        EditorPanelModel.TextEntry r2 = (EditorPanelModel.TextEntry) m.editor().field("stages[0].feedbackOhms").orElseThrow();
        r2.textProperty().set("47k");
        r2.commit();
        java.nio.file.Path path = java.nio.file.Path.of("boost.json");
        m.saveAs(path);
        assertFalse(m.dirtyProperty().get());
        assertEquals(path, m.fileProperty().get());
        assertEquals(path.toAbsolutePath().normalize(), m.recentFiles().files().get(0));
        Design saved = m.design();
        m.replace(SampleDesigns.missingLegCapacitor(), null);
        m.open(path);
        assertEquals(saved, m.design());
        assertEquals(path, m.fileProperty().get());
        assertFalse(m.canUndoProperty().get());
        assertEquals(47e3, m.reportProperty().get().design().stages().get(0).feedbackOhms(), 1e-9);
        m.open(java.nio.file.Path.of("missing.json"));
        assertTrue(m.statusProperty().get().startsWith("Could not open missing.json"), m.statusProperty().get());
        assertEquals(saved, m.design(), "a failed open keeps the design");
    }

    @Test
    void exportingAReviewWritesTheHtmlAndPdfOfTheAnalysedDesign(@org.junit.jupiter.api.io.TempDir java.nio.file.Path dir)
            throws java.io.IOException {
        model.exportReview(dir.resolve("review.html"), HalfrailApp.VERSION);
        java.nio.file.Path html = dir.resolve("review.html");
        java.nio.file.Path pdf = dir.resolve("review.pdf");
        assertTrue(java.nio.file.Files.isRegularFile(html) && java.nio.file.Files.isRegularFile(pdf));
        String text = java.nio.file.Files.readString(html);
        String stage = model.reportProperty().get().stages().stream()
                .filter(halfrail.check.StageReport::signal).findFirst().orElseThrow().label();
        assertTrue(text.contains(stage), "the review names the stage");
        assertTrue(java.nio.file.Files.readAllBytes(pdf).length > 1000 && new String(
                java.nio.file.Files.readAllBytes(pdf), 0, 5, java.nio.charset.StandardCharsets.US_ASCII).equals("%PDF-"));
    }
}
