package halfrail.check;

import halfrail.units.Quantities;
import halfrail.circuit.OpAmpParams;
import halfrail.design.AmplitudeUnit;
import halfrail.design.CapacitorSpec;
import halfrail.design.CellPack;
import halfrail.design.Design;
import halfrail.design.FixedRail;
import halfrail.design.Load;
import halfrail.design.OpAmpChoice;
import halfrail.design.Reference;
import halfrail.design.SignalSource;
import halfrail.design.Stage;
import halfrail.design.StageKind;
import halfrail.design.Thresholds;
import halfrail.parts.OpAmpArchetype;
import halfrail.parts.PartsLibrary;
import halfrail.solve.AnalysisException;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Set;
import java.util.stream.Collectors;

import static halfrail.check.TestDesigns.electrolytic;
import static halfrail.check.TestDesigns.film;
import static halfrail.check.TestDesigns.stage;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Every finding code of the check classes, each triggered by a small design of its own and absent
 * from the healthy design. Asserted: code, severity, the parts (design paths) and that the message
 * carries the report's numbers — not the wording.
 */
class FindingCatalogueTest {
    /** Every code the check classes can raise. */
    static final List<String> ALL_CODES = List.of(NoDcPath.CODE, RestsOnRail.CODE, OffCentre.CODE, Headroom.CLIPS,
            Headroom.LOW, Headroom.END_POINT, CommonMode.CODE, BiasAmplified.CODE, LeakageDrift.CODE,
            CapacitorVoltage.REVERSED, CapacitorVoltage.OVER, Bandwidth.LOW_CORNER, Bandwidth.UPPER, Bandwidth.SLEW,
            Ripple.CODE, BiasShift.CODE, PowerOn.OSCILLATES, PowerOn.SLOW, PowerOn.PINNED, PowerOn.STEP, CommonPractice.FEEDBACK,
            CommonPractice.GAIN, SupplyAndRuntime.RANGE, SupplyAndRuntime.RUNTIME);

    static DesignReport healthy;

    @BeforeAll
    static void analyseHealthy() {
        healthy = DesignAnalysis.analyse(TestDesigns.healthyNineVolt());
    }

    static Design h() {
        return TestDesigns.healthyNineVolt();
    }

    static Design withStage0(Stage s) {
        return h().withStage(0, s);
    }

    static Stage s0() {
        return h().stages().get(0);
    }

    static Design withAmplitude(Design d, double voltsPeak) {
        return d.withSource(new SignalSource(voltsPeak, AmplitudeUnit.VOLTS_PEAK, 1e3, 20, 20e3));
    }

    /** The one finding with {@code code}; fails when there is none, or when the report holds a non-finite number. */
    static Finding only(DesignReport r, String code) {
        ReportAssertions.assertAllFinite(r);
        List<Finding> found = r.findings(code);
        assertEquals(1, found.size(), () -> code + " expected once, findings: " + r.findings());
        return found.get(0);
    }

    static void assertCarries(Finding f, String... numbers) {
        for (String n : numbers) {
            assertTrue(f.message().contains(n) || f.suggestion().contains(n),
                    () -> f.code() + " should carry " + n + ": " + f.message() + " / " + f.suggestion());
        }
    }

    @Test
    void theHealthyDesignIsCleanAtWarnLevelAndOnlyNotesItsBriefStartAtGround() {
        ReportAssertions.assertAllFinite(healthy);
        assertFalse(healthy.has(Severity.WARN), () -> "unexpected: " + healthy.findings());
        Set<String> codes = healthy.findings().stream().map(Finding::code).collect(Collectors.toSet());
        // The output starts at ground and sits at its low swing limit for a few ms while the reference
        // rises past it: a note, and short.
        assertTrue(Set.of(PowerOn.PINNED).containsAll(codes), codes::toString);
        healthy.powerOn().orElseThrow().pinnedSeconds().values().forEach(t -> assertTrue(t < 0.02, "pinned " + t));
    }

    @Test
    void aStageInputBehindACapacitorWithoutBiasHasNoDcPath() {
        DesignReport r = DesignAnalysis.analyse(withStage0(s0().withBiased(false)));
        Finding f = only(r, NoDcPath.CODE);
        assertEquals(Severity.FAIL, f.severity());
        assertTrue(f.parts().contains("stages[0].inputCapacitor"), f.parts()::toString);
        assertCarries(f, "s1.p");
        assertTrue(healthy.findings(NoDcPath.CODE).isEmpty());
    }

    @Test
    void withoutTheLegCapacitorTheBiasIsAmplifiedAndTheOutputRestsOnARail() {
        DesignReport r = DesignAnalysis.analyse(withStage0(s0().withLegCapacitor(null)), false);
        ReportAssertions.assertAllFinite(r);
        StageReport s = r.stages().get(0);
        Finding rail = only(r, RestsOnRail.CODE);
        assertEquals(Severity.FAIL, rail.severity());
        assertEquals(List.of("stages[0]"), rail.parts());
        assertCarries(rail, Quantities.volts(s.outputVolts()), Quantities.volts(s.nominal().swingHighVolts()));
        Finding amp = only(r, BiasAmplified.CODE);
        assertEquals(Severity.FAIL, amp.severity());
        assertEquals(List.of("stages[0].legCapacitor", "stages[0].legOhms"), amp.parts());
        // Bias gain of a non-inverting stage with R1 to ground: 1 + R2/R1 = 1 + 47k/4.7k = 11 (any op-amp text).
        assertEquals(11.0, s.biasGain(), 0.01);
        assertCarries(amp, "11.0", Quantities.volts(s.outputVolts()));
        // Suggested blocking capacitor: corner 5× below 20 Hz, 5/(2π·4.7 kΩ·20 Hz) = 8.5 µF → E6 10 µF (IEC 60063).
        assertTrue(amp.suggestion().contains(Quantities.farads(10e-6)), amp.suggestion());
        // Saturated: the headroom checks leave it to REST_ON_RAIL rather than report it twice.
        assertTrue(r.findings(Headroom.CLIPS).isEmpty(), r.findings()::toString);
        assertTrue(healthy.findings(RestsOnRail.CODE).isEmpty());
        assertTrue(healthy.findings(BiasAmplified.CODE).isEmpty());
    }

    @Test
    void anEqualDividerIsOffCentreForAPartWhoseWindowIsNotSymmetric() {
        Design d = h().withReference(Reference.decoupled(100e3, 100e3, electrolytic(10e-6, 16), 100e3));
        DesignReport r = DesignAnalysis.analyse(d, false);
        Finding f = only(r, OffCentre.CODE);
        assertEquals(Severity.WARN, f.severity());
        assertEquals(List.of("reference"), f.parts());
        SwingReport n = r.stages().get(0).nominal();
        // Hand figures: window 0.02 V to 9 − 1.5 = 7.5 V (archetype headrooms), rest at 9/2 = 4.5 V;
        // lost = 20·log10((window/2) / room above) = 20·log10(3.74 / 3.0) = 1.92 dB.
        double lost = 20 * Math.log10((n.swingHighVolts() - n.swingLowVolts()) / 2 / n.availableHighVolts());
        assertEquals(20 * Math.log10(3.74 / 3.0), lost, 0.03);
        assertCarries(f, Quantities.db(lost), Quantities.volts(n.quiescentVolts()));
        assertTrue(healthy.findings(OffCentre.CODE).isEmpty());
    }

    @Test
    void aSignalLargerThanTheRoomClipsAtTheNominalSupply() {
        DesignReport r = DesignAnalysis.analyse(withAmplitude(h(), 0.5), false);
        Finding f = only(r, Headroom.CLIPS);
        assertEquals(Severity.FAIL, f.severity());
        assertEquals(List.of("stages[0]"), f.parts());
        SwingReport n = r.stages().get(0).nominal();
        // 0.5 V × 11 = 5.5 V peak against 7.5 − 3.6 = 3.9 V of room above the rest point.
        assertEquals(5.5, n.signalPeakVolts(), 0.15);
        assertTrue(n.clips());
        assertCarries(f, Quantities.volts(n.signalPeakVolts()), Quantities.db(n.headroomDb().getAsDouble()));
        assertTrue(healthy.findings(Headroom.CLIPS).isEmpty());
    }

    @Test
    void headroomBelowTheMarginIsAWarning() {
        DesignReport r = DesignAnalysis.analyse(withAmplitude(h(), 0.25), false);
        Finding f = only(r, Headroom.LOW);
        assertEquals(Severity.WARN, f.severity());
        assertEquals(List.of("stages[0]"), f.parts());
        double db = r.stages().get(0).nominal().headroomDb().getAsDouble();
        assertTrue(db >= 0 && db < 3, "headroom " + db);
        assertCarries(f, Quantities.db(db));
        assertTrue(healthy.findings(Headroom.LOW).isEmpty());
    }

    @Test
    void aSignalThatFitsAtNominalButNotAtTheBatteryEndPointClipsThere() {
        DesignReport r = DesignAnalysis.analyse(withAmplitude(h(), 0.2), false);
        assertTrue(r.findings(Headroom.CLIPS).isEmpty(), r.findings()::toString);
        Finding f = only(r, Headroom.END_POINT);
        assertEquals(Severity.FAIL, f.severity());
        assertEquals(List.of("stages[0]", "supply"), f.parts());
        SwingReport end = r.stages().get(0).endPoint();
        // 9 V block end-point: six cells at 0.9 V = 5.4 V (IEC 60086-2 via secondary sources).
        assertEquals(5.4, end.supplyVolts(), 1e-9);
        assertCarries(f, Quantities.volts(5.4), Quantities.volts(end.largestSourcePeakVolts().getAsDouble()));
        assertTrue(healthy.findings(Headroom.END_POINT).isEmpty());
    }

    static Design jfet(Supply9 supply, double upper, double lower, Stage stage, double amplitude) {
        return new Design("jfet", "", supply.rail(), Reference.decoupled(upper, lower, electrolytic(10e-6, 16), 100e3),
                List.of(stage), new SignalSource(amplitude, AmplitudeUnit.VOLTS_PEAK, 1e3, 20, 20e3),
                new Load(10e3, 0, electrolytic(4.7e-6, 16)), Thresholds.defaults(), 1e-3);
    }

    record Supply9(double volts) {
        FixedRail rail() {
            return new FixedRail(volts, 0.02, 0, 0, 0);
        }
    }

    @Test
    void aJfetInputPartBiasedNearTheLowRailIsOutsideItsCommonModeRangeAtRest() {
        Stage st = new Stage("jfet", StageKind.NON_INVERTING, OpAmpChoice.archetype(OpAmpArchetype.JFET_INPUT_AUDIO),
                47e3, 4.7e3, film(10e-6), film(1e-6));
        // 7.5 V rail, 0.4 divider: inputs rest at 3.0 V, below the 3.5 V the inputs need above the
        // negative rail (archetype figure; the class's inputs stop volts short of it — from memory).
        DesignReport r = DesignAnalysis.analyse(jfet(new Supply9(7.5), 150e3, 100e3, st, 0.05), false);
        StageReport s = r.stages().get(0);
        assertFalse(s.commonModeOkAtRest());
        Finding f = only(r, CommonMode.CODE);
        assertEquals(Severity.FAIL, f.severity());
        assertEquals(List.of("stages[0].opAmp"), f.parts());
        assertEquals(LadderLevel.COMMON_MODE_LOW, f.level().orElseThrow());
        assertCarries(f, Quantities.volts(s.inPlusVolts()), Quantities.volts(s.commonModeLowVolts()));
        assertTrue(healthy.findings(CommonMode.CODE).isEmpty());
    }

    @Test
    void aJfetFollowerWhoseSignalPeaksDipBelowTheCommonModeRangeIsReportedAtThePeaks() {
        Stage st = new Stage("jfet", StageKind.FOLLOWER, OpAmpChoice.archetype(OpAmpArchetype.JFET_INPUT_AUDIO),
                0, 0, null, film(1e-6));
        DesignReport r = DesignAnalysis.analyse(jfet(new Supply9(9), 100e3, 100e3, st, 1.2), false);
        StageReport s = r.stages().get(0);
        assertTrue(s.commonModeOkAtRest());
        assertFalse(s.commonModeOkAtPeaks());
        Finding f = only(r, CommonMode.CODE);
        assertEquals(Severity.FAIL, f.severity());
        // 4.5 V − 1.2 V × 100k/101k ≈ 3.31 V, below 3.5 V.
        double dip = s.inPlusVolts() - s.inputSignalPeakVolts();
        assertEquals(4.5 - 1.2 * 100e3 / 101e3, dip, 0.02);
        assertCarries(f, Quantities.volts(dip), Quantities.volts(s.commonModeLowVolts()));
        assertTrue(r.findings(Headroom.CLIPS).isEmpty(), "the follower's output still fits: " + r.findings());
    }

    @Test
    void anElectrolyticInTheFeedbackLegBehindALargeR2DriftsTheOutput() {
        Design d = withStage0(s0().withFeedbackOhms(1e6).withLegOhms(100e3).withLegCapacitor(electrolytic(10e-6, 16)));
        DesignReport r = DesignAnalysis.analyse(d, false);
        Finding f = only(r, LeakageDrift.CODE);
        assertEquals(Severity.WARN, f.severity());
        assertEquals(List.of("stages[0].legCapacitor"), f.parts());
        StageReport s = r.stages().get(0);
        assertCarries(f, Quantities.volts(s.leakageDriftVolts()), Quantities.volts(s.leakageDriftByCapacitor().get("CLEG1")));
        assertTrue(s.leakageDriftVolts() > 0.1);
        assertFalse(r.findings(CommonPractice.FEEDBACK).isEmpty(), "R2 of 1 MΩ is also above 100 kΩ");
        assertTrue(healthy.findings(LeakageDrift.CODE).isEmpty());
    }

    @Test
    void aPolarisedCouplingCapacitorFacingAHigherPreviousOutputIsReverseBiased() {
        // Stage 1 has a little DC gain for its bias (R1 to ground): rests at 3.6 V × (1 + 10k/47k) = 4.37 V;
        // stage 2 is biased at 3.6 V, so its electrolytic input capacitor (+ on the stage side) sees −0.77 V.
        Stage one = stage("one", StageKind.NON_INVERTING, 10e3, 47e3, null, film(1e-6));
        Stage two = new Stage("two", StageKind.FOLLOWER, OpAmpChoice.archetype(OpAmpArchetype.SINGLE_SUPPLY_BIPOLAR),
                0, 0, null, electrolytic(10e-6, 16));
        DesignReport r = DesignAnalysis.analyse(h().withStages(List.of(one, two)), false);
        ReportAssertions.assertAllFinite(r);
        Finding f = only(r, CapacitorVoltage.REVERSED);
        assertEquals(Severity.FAIL, f.severity());
        assertEquals(List.of("stages[1].inputCapacitor"), f.parts());
        CapacitorReport c = r.capacitors().stream().filter(x -> x.element().equals("CIN2")).findFirst().orElseThrow();
        double ref = r.nodeVolts().get("ref");
        assertEquals(ref - ref * (1 + 10e3 / 47e3), c.dcVolts(), 0.03);
        assertCarries(f, Quantities.volts(-c.dcVolts()));
        assertTrue(r.findings(BiasAmplified.CODE).isEmpty(), "a bias gain of 1.2 is not yet amplified bias");
        assertTrue(healthy.findings(CapacitorVoltage.REVERSED).isEmpty());
    }

    @Test
    void aCapacitorAboveItsDeratedVoltageIsReportedWithTheNextStandardRating() {
        Design d = h().withLoad(new Load(10e3, 0, new CapacitorSpec(4.7e-6, "tantalum", 4)));
        DesignReport r = DesignAnalysis.analyse(d, false);
        Finding f = only(r, CapacitorVoltage.OVER);
        assertEquals(Severity.FAIL, f.severity());
        assertEquals(List.of("load.outputCapacitor"), f.parts());
        CapacitorReport c = r.capacitors().stream().filter(x -> x.element().equals("COUT")).findFirst().orElseThrow();
        // Tantalum derated to 50 % (library figure): 4 V allows 2 V. The worst case is the fresh
        // battery's 9.6 V × 0.4 = 3.84 V plus the signal across the capacitor itself (small in the
        // band), about 4 V: it needs 8 V or more, and the next standard tantalum rating is 10 V.
        assertEquals(2.0, c.deratedVolts(), 1e-12);
        assertEquals(3.84 + c.signalPeakVolts(), c.worstVolts(), 0.02);
        assertCarries(f, Quantities.volts(c.worstVolts()), Quantities.volts(c.deratedVolts()), Quantities.volts(10));
        assertTrue(healthy.findings(CapacitorVoltage.OVER).isEmpty());
    }

    @Test
    void aSmallInputCapacitorPutsTheChainsCornerAboveTheBand() {
        DesignReport r = DesignAnalysis.analyse(withStage0(s0().withInputCapacitor(film(10e-9))), false);
        Finding f = only(r, Bandwidth.LOW_CORNER);
        assertEquals(Severity.WARN, f.severity());
        assertEquals(List.of("stages[0].inputCapacitor"), f.parts());
        ChainReport ch = r.chain().orElseThrow();
        assertCarries(f, Quantities.hertz(ch.lowerCornerHz().getAsDouble()), Quantities.hertz(20));
        // 1/(2π·(1 kΩ + 100 kΩ)·10 nF) = 157.6 Hz (any circuits text).
        assertEquals(157.6, ch.lowerCornerHz().getAsDouble(), 3);
        // The remedy moves that capacitor's corner 5× below 20 Hz: 10 nF × 157.6 Hz × 5 / 20 Hz = 394 nF,
        // the next E6 value 470 nF (IEC 60063).
        assertTrue(f.suggestion().contains(Quantities.farads(470e-9)), f.suggestion());
        assertTrue(healthy.findings(Bandwidth.LOW_CORNER).isEmpty());
    }

    static OpAmpParams singleSupply() {
        return PartsLibrary.builtIn().opAmpArchetype(OpAmpArchetype.SINGLE_SUPPLY_BIPOLAR).orElseThrow().typical();
    }

    @Test
    void tooLittleGainBandwidthCutsTheBandsHighEnd() {
        DesignReport r = DesignAnalysis.analyse(withStage0(s0().withOpAmp(
                OpAmpChoice.custom(singleSupply().withGainBandwidth(100e3)))), false);
        Finding f = only(r, Bandwidth.UPPER);
        assertEquals(Severity.WARN, f.severity());
        assertEquals(List.of("stages[0].opAmp"), f.parts());
        double upper = r.chain().orElseThrow().upperCornerHz().getAsDouble();
        // Closed-loop bandwidth ≈ GBW / noise gain = 100 kHz / 11 = 9.1 kHz (any op-amp text).
        assertEquals(100e3 / 11, upper, 100e3 / 11 * 0.05);
        assertCarries(f, Quantities.hertz(upper), Quantities.hertz(20e3));
        assertTrue(healthy.findings(Bandwidth.UPPER).isEmpty());
    }

    @Test
    void aSlowSlewRateLimitsTheFullPowerBandwidth() {
        DesignReport r = DesignAnalysis.analyse(withStage0(s0().withOpAmp(
                OpAmpChoice.custom(singleSupply().withSlewRate(3e4)))), false);
        Finding f = only(r, Bandwidth.SLEW);
        assertEquals(Severity.WARN, f.severity());
        assertEquals(List.of("stages[0].opAmp"), f.parts());
        StageReport s = r.stages().get(0);
        // Full-power bandwidth SR/(2π·Vpeak) (Franco, Design with Operational Amplifiers — from memory).
        double fp = 3e4 / (2 * Math.PI * s.nominal().signalPeakVolts());
        assertEquals(fp, s.fullPowerHz().getAsDouble(), fp * 1e-9);
        assertCarries(f, Quantities.hertz(fp));
        assertTrue(r.findings(Bandwidth.UPPER).isEmpty(), "the small-signal bandwidth is not affected");
        assertTrue(healthy.findings(Bandwidth.SLEW).isEmpty());
    }

    @Test
    void aLargeBiasResistorLetsTheBiasCurrentMoveTheOperatingPoint() {
        Design d = h().withReference(Reference.decoupled(150e3, 100e3, electrolytic(10e-6, 16), 2.2e6));
        DesignReport r = DesignAnalysis.analyse(d, false);
        Finding f = only(r, BiasShift.CODE);
        assertEquals(Severity.WARN, f.severity());
        assertEquals(List.of("reference.biasOhms", "stages[0].opAmp"), f.parts());
        StageReport s = r.stages().get(0);
        // Ib·R: the PNP input draws 45 nA − 5/2 nA = 42.5 nA out of the + pin through 2.2 MΩ + 60 kΩ:
        // +96 mV (op-amp texts, e.g. Eggleston §6.4).
        assertEquals(42.5e-9 * (2.2e6 + 60e3), s.biasCurrentShiftVolts(), 2e-3);
        assertCarries(f, Quantities.volts(s.biasCurrentShiftVolts()));
        assertTrue(healthy.findings(BiasShift.CODE).isEmpty());
    }

    @Test
    void withADirectDividerTheBiasCurrentFlowsThroughTheDividerItself() {
        // 3.3 MΩ over 2.2 MΩ: 42.5 nA through Ra‖Rb = 1.32 MΩ moves the input by +56 mV (Ib·R).
        DesignReport r = DesignAnalysis.analyse(h().withReference(Reference.direct(3.3e6, 2.2e6)), false);
        Finding f = only(r, BiasShift.CODE);
        assertEquals(List.of("reference.upperOhms", "reference.lowerOhms", "stages[0].opAmp"), f.parts());
        assertEquals(42.5e-9 * 3.3e6 * 2.2e6 / 5.5e6, r.stages().get(0).biasCurrentShiftVolts(), 2e-3);
    }

    @Test
    void aLargeReferenceCapacitorSettlesSlowly() {
        DesignReport r = DesignAnalysis.analyse(h().withReference(
                Reference.decoupled(150e3, 100e3, electrolytic(22e-6, 16), 100e3)));
        Finding f = only(r, PowerOn.SLOW);
        assertEquals(Severity.WARN, f.severity());
        PowerOnReport p = r.powerOn().orElseThrow();
        assertTrue(p.settled());
        assertTrue(p.settleSeconds().getAsDouble() > 2, p::toString);
        assertCarries(f, Quantities.seconds(p.settleSeconds().getAsDouble()), Quantities.volts(p.bandVolts()), Quantities.seconds(2));
        assertTrue(healthy.findings(PowerOn.SLOW).isEmpty());
    }

    @Test
    void aCircuitStillMovingWhenTheRunEndsIsReportedAsNotSettled() {
        // τ = 60 kΩ × 1 mF = 60 s, far beyond the 5 × 2 s run.
        DesignReport r = DesignAnalysis.analyse(h().withReference(
                Reference.decoupled(150e3, 100e3, electrolytic(1e-3, 16), 100e3)));
        Finding f = only(r, PowerOn.SLOW);
        PowerOnReport p = r.powerOn().orElseThrow();
        assertFalse(p.settled());
        assertTrue(p.settleSeconds().isEmpty());
        assertEquals(10.0, p.simulatedSeconds(), 1e-6);
        assertCarries(f, Quantities.volts(p.bandVolts()), Quantities.seconds(p.simulatedSeconds()));
    }

    @Test
    void aLargeFeedbackLegCapacitorPinsTheOutputToARailAtStart() {
        // With 470 µF in the leg the stage has gain 11 for the rising bias for seconds: the output
        // runs into its upper limit and stays there while the leg capacitor charges through R2 + R1.
        DesignReport r = DesignAnalysis.analyse(withStage0(s0().withLegCapacitor(electrolytic(470e-6, 16))));
        Finding f = only(r, PowerOn.PINNED);
        assertEquals(Severity.NOTE, f.severity());
        assertEquals(List.of("stages[0]"), f.parts());
        double pinned = r.powerOn().orElseThrow().pinnedSeconds().get("boost");
        assertTrue(pinned > 0.1, "pinned " + pinned);
        assertCarries(f, Quantities.seconds(pinned));
    }

    /** The recorder preamp sample (gain 48, 100k/100k reference with 4.7 µF, 220k bias) repeated to {@code n} stages. */
    static Design preampRepeated(int n) {
        Design base = halfrail.io.DesignFiles.read(java.nio.file.Path.of("samples", "handheld-recorder-mic-preamp.json"));
        List<Stage> stages = new java.util.ArrayList<>();
        for (int i = 0; i < n; i++) {
            Stage s = base.stages().get(0);
            stages.add(new Stage(s.name() + "-" + (i + 1), s.kind(), s.opAmp(), s.feedbackOhms(), s.legOhms(),
                    s.legCapacitor(), s.inputCapacitor(), s.biased()));
        }
        return base.withStages(stages);
    }

    @Test
    void threeGainStagesOnOneSoftReferenceKeepOscillatingAfterSwitchOn() {
        // Each stage's input capacitor and bias resistor feed its driver's swing back into the shared
        // reference, which every stage amplifies: with three stages of gain 48 the loop closes at
        // under 1 Hz and the chain swings from rail to rail for ever ("motorboating", common practice).
        DesignReport r = DesignAnalysis.analyse(preampRepeated(3));
        Finding f = only(r, PowerOn.OSCILLATES);
        assertEquals(Severity.FAIL, f.severity());
        assertEquals(List.of("reference"), f.parts());
        PowerOnReport p = r.powerOn().orElseThrow();
        var o = p.oscillation().orElseThrow();
        assertTrue(o.periodSeconds() > 0.1 && o.periodSeconds() < 2, "period " + o.periodSeconds());
        // rail to rail on a 3 V pack: the swing window of the low-voltage part
        assertTrue(o.peakToPeakVolts() > 2.5, "swing " + o.peakToPeakVolts());
        assertCarries(f, Quantities.seconds(o.periodSeconds()), Quantities.volts(o.peakToPeakVolts()));
        assertFalse(p.settled());
        // the run stops on the oscillation, well before its stop time of 5 × the settle limit
        assertEquals(o.seenAtSeconds(), p.simulatedSeconds(), 1e-12);
        assertTrue(p.simulatedSeconds() < DesignAnalysis.POWER_ON_RUN_FACTOR * r.design().thresholds().maxSettleSeconds());
        // neither "not settled" nor "on a rail while the capacitors charge": the oscillation says it
        assertTrue(r.findings(PowerOn.SLOW).isEmpty(), r.findings()::toString);
        assertTrue(r.findings(PowerOn.PINNED).isEmpty(), r.findings()::toString);
        // two such stages settle; and ten times the decoupling (47 µF), as the suggestion says, stops it
        assertTrue(DesignAnalysis.analyse(preampRepeated(2)).powerOn().orElseThrow().oscillation().isEmpty());
        Design d = preampRepeated(3);
        Reference ref = d.reference();
        Design stiffer = d.withReference(Reference.decoupled(ref.upperOhms(), ref.lowerOhms(),
                ref.decoupling().withFarads(47e-6), ref.biasOhms()));
        DesignReport fixed = DesignAnalysis.analyse(stiffer);
        assertTrue(fixed.findings(PowerOn.OSCILLATES).isEmpty(), fixed.findings()::toString);
        assertTrue(healthy.findings(PowerOn.OSCILLATES).isEmpty());
    }

    @Test
    void aFastRisingOutputIntoALargeOutputCapacitorStepsTheLoad() {
        // Small reference capacitor: the output rises in tens of ms, the 47 µF × 10 kΩ output network
        // (0.47 s) passes nearly all of it to the load.
        Design d = h().withReference(Reference.decoupled(150e3, 100e3, electrolytic(1e-6, 16), 100e3))
                .withLoad(new Load(10e3, 0, electrolytic(47e-6, 16)));
        DesignReport r = DesignAnalysis.analyse(d);
        Finding f = only(r, PowerOn.STEP);
        assertEquals(Severity.WARN, f.severity());
        assertEquals(List.of("load.outputCapacitor"), f.parts());
        double step = r.powerOn().orElseThrow().loadStepVolts();
        assertTrue(step > 1, "step " + step);
        assertCarries(f, Quantities.volts(step));
        assertTrue(healthy.findings(PowerOn.STEP).isEmpty());
    }

    @Test
    void aDcCoupledLoadRisesWithTheOutputAndTheStepNamesTheLoad() {
        DesignReport r = DesignAnalysis.analyse(h().withLoad(new Load(10e3, 0, null)));
        Finding f = only(r, PowerOn.STEP);
        assertEquals(List.of("load"), f.parts());
        // The load starts at 0 V and ends at the rest point, 9 V × 0.4 = 3.6 V.
        double step = r.powerOn().orElseThrow().loadStepVolts();
        assertEquals(r.stages().get(0).outputVolts(), step, 0.01);
        assertEquals(3.6, step, 0.05);
        assertCarries(f, Quantities.volts(step));
    }

    @Test
    void aFeedbackResistorAbove100kIsAgainstCommonPractice() {
        DesignReport r = DesignAnalysis.analyse(withStage0(s0().withFeedbackOhms(220e3).withLegOhms(22e3)), false);
        Finding f = only(r, CommonPractice.FEEDBACK);
        assertEquals(Severity.WARN, f.severity());
        assertEquals(List.of("stages[0].feedbackOhms"), f.parts());
        // Scaled to the 100 kΩ ceiling (common practice) and rounded to E24 (IEC 60063): 100k and 10k.
        assertCarries(f, Quantities.ohms(220e3), Quantities.ohms(100e3), Quantities.ohms(10e3));
        assertTrue(healthy.findings(CommonPractice.FEEDBACK).isEmpty());
    }

    @Test
    void oneStageGainAbove50IsAgainstCommonPractice() {
        DesignReport r = DesignAnalysis.analyse(withAmplitude(withStage0(s0().withFeedbackOhms(100e3).withLegOhms(1e3)),
                0.01), false);
        Finding f = only(r, CommonPractice.GAIN);
        assertEquals(Severity.WARN, f.severity());
        assertEquals(List.of("stages[0]"), f.parts());
        double gain = r.stages().get(0).stageGain();
        // 1 + 100k/1k = 101 (any op-amp text); about 50 is the ceiling (common practice).
        assertEquals(101, gain, 1.5);
        assertCarries(f, String.format(java.util.Locale.ROOT, "%.3g", gain));
        assertTrue(healthy.findings(CommonPractice.GAIN).isEmpty());
    }

    @Test
    void aClassicDualSupplyPartOnTwoAaCellsIsOutsideItsSupplyRange() {
        Design d = h().withSupply(new CellPack("alkaline-aa", 2))
                .withStage(0, s0().withOpAmp(OpAmpChoice.archetype(OpAmpArchetype.CLASSIC_BIPOLAR_DUAL_SUPPLY)));
        DesignReport r = DesignAnalysis.analyse(d, false);
        ReportAssertions.assertAllFinite(r);
        Finding f = only(r, SupplyAndRuntime.RANGE);
        assertEquals(Severity.FAIL, f.severity());
        assertEquals(List.of("stages[0].opAmp", "supply"), f.parts());
        // Two alkaline AA cells: 1.8 V at the 0.9 V end-point to 3.2 V fresh (IEC 60086-2, secondary
        // sources), against the class's 10 V minimum (The Art of Electronics, 3rd ed., ch. 4 — memory).
        assertCarries(f, Quantities.volts(1.8), Quantities.volts(3.2));
        assertFalse(r.stages().get(0).supplyInRange());
        assertTrue(healthy.findings(SupplyAndRuntime.RANGE).isEmpty());
    }

    @Test
    void aRuntimeTargetBeyondTheBatterysCapacityIsShort() {
        Thresholds t = Thresholds.defaults();
        Thresholds target = new Thresholds(t.settleBandFraction(), t.maxSettleSeconds(), t.minHeadroomDb(),
                t.offCentreDb(), t.nearRailFraction(), t.maxLeakageDriftVolts(), t.maxRippleVolts(),
                t.maxBiasShiftVolts(), t.maxStepVolts(), t.maxStageGain(), t.maxFeedbackOhms(), 2000, 0);
        DesignReport r = DesignAnalysis.analyse(h().withThresholds(target), false);
        Finding f = only(r, SupplyAndRuntime.RUNTIME);
        assertEquals(Severity.WARN, f.severity());
        assertEquals(List.of("reference", "supply"), f.parts());
        BatteryReport b = r.battery().orElseThrow();
        // 0.55 A·h (9 V block, IEC 60086-2 via secondary sources) over about 0.5 mA quiescent + 36 µA divider.
        double hours = 0.55 / b.totalAmps();
        assertEquals(hours, b.runtimeHours().getAsDouble(), 1e-9);
        assertEquals(0.5e-3 + 9 / 250e3, b.totalAmps(), 0.02e-3);
        assertCarries(f, String.format(java.util.Locale.ROOT, "%.3g h", hours), Quantities.amps(b.totalAmps()));
        assertTrue(healthy.findings(SupplyAndRuntime.RUNTIME).isEmpty());
    }

    @Test
    void anEngineFailureBecomesAFindingAndNoNumbersAreShown() {
        // A load of 4.9e-324 Ω (the smallest double) is an infinite conductance: the equations hold a
        // non-finite entry, which no strategy gets past. (A 1e-300 Ω load, used here before, is a
        // dead short that the engine now solves: the output current is then set by Rout.)
        DesignReport r = DesignAnalysis.analyse(h().withLoad(new Load(Double.MIN_VALUE, 0, null)));
        assertEquals(java.util.Optional.of(AnalysisException.Kind.SINGULAR), r.failure());
        Finding f = only(r, DesignAnalysis.ANALYSIS_FAILED);
        assertEquals(Severity.FAIL, f.severity());
        assertTrue(r.stages().isEmpty());
        assertTrue(r.capacitors().isEmpty());
        assertTrue(r.nodeVolts().isEmpty());
        assertTrue(r.chain().isEmpty() && r.powerOn().isEmpty() && r.battery().isEmpty() && r.ladders().isEmpty());
        assertEquals(1, r.findings().size(), "the part is within its supply range: nothing else to say");
    }

    @Test
    void aFailedPowerOnTransientCostsOnlyThePowerOnFigures() {
        // A settle limit of 1e-30 s with a step supply asks the transient for steps below its minimum.
        Thresholds t = Thresholds.defaults();
        Thresholds absurd = new Thresholds(t.settleBandFraction(), 1e-30, t.minHeadroomDb(), t.offCentreDb(),
                t.nearRailFraction(), t.maxLeakageDriftVolts(), t.maxRippleVolts(), t.maxBiasShiftVolts(),
                t.maxStepVolts(), t.maxStageGain(), t.maxFeedbackOhms(), 0, 0);
        Design base = h();
        Design d = new Design("absurd", "", base.supply(), base.reference(), base.stages(), base.source(), base.load(),
                absurd, 0);
        DesignReport r = DesignAnalysis.analyse(d);
        assertTrue(r.failure().isEmpty(), r.failureMessage());
        assertTrue(r.powerOn().isEmpty());
        Finding f = only(r, DesignAnalysis.POWER_ON_FAILED);
        assertEquals(Severity.WARN, f.severity());
        assertTrue(f.message().contains("STEP_TOO_SMALL"), f.message());
        // Everything else is there, as for the healthy design.
        assertEquals(healthy.stages().get(0).outputVolts(), r.stages().get(0).outputVolts(), 1e-9);
        assertEquals(healthy.capacitors().size(), r.capacitors().size());
    }

    @Test
    void whenTheCircuitCannotBeSolvedTheSupplyRangeIsStillCheckedFromTheParameters() {
        // A JFET-input part (specified from 7 V) on one NiMH cell of 1.0–1.4 V, in a circuit made
        // unsolvable by a load of 4.9e-324 Ω (an infinite conductance): the range finding needs no
        // solution and is still given.
        Design d = h().withSupply(new CellPack("nimh-aa", 1)).withLoad(new Load(Double.MIN_VALUE, 0, null))
                .withStage(0, s0().withOpAmp(OpAmpChoice.archetype(OpAmpArchetype.JFET_INPUT_AUDIO)));
        DesignReport r = DesignAnalysis.analyse(d);
        assertTrue(r.failure().isPresent(), r.findings()::toString);
        assertEquals(Severity.FAIL, only(r, DesignAnalysis.ANALYSIS_FAILED).severity());
        Finding range = only(r, SupplyAndRuntime.RANGE);
        assertEquals(List.of("stages[0].opAmp", "supply"), range.parts());
        assertCarries(range, Quantities.volts(1.0), Quantities.volts(1.4));
        assertTrue(r.stages().isEmpty() && r.capacitors().isEmpty());
    }

    @Test
    void aSupplyBelowThePartsHeadroomsIsNotDescribedByAnInvertedWindow() {
        // JFET-input part on one NiMH cell (1.2 V nominal): output headrooms 2.0 V + 1.5 V and input
        // headrooms 3.5 V + 0.5 V (archetype figures) leave no window and no input range.
        Design d = h().withSupply(new CellPack("nimh-aa", 1))
                .withStage(0, s0().withOpAmp(OpAmpChoice.archetype(OpAmpArchetype.JFET_INPUT_AUDIO)));
        DesignReport r = DesignAnalysis.analyse(d, false);
        StageReport s = r.stages().get(0);
        assertTrue(s.nominal().swingHighVolts() < s.nominal().swingLowVolts());
        Finding rail = only(r, RestsOnRail.CODE);
        assertCarries(rail, Quantities.volts(1.2));
        assertFalse(rail.message().contains(Quantities.volts(s.nominal().swingHighVolts())), rail.message());
        Finding cm = only(r, CommonMode.CODE);
        assertCarries(cm, Quantities.volts(s.commonModeLowVolts()), Quantities.volts(s.commonModeHighVolts()));
        assertFalse(only(r, SupplyAndRuntime.RANGE).parts().isEmpty());
    }

    @Test
    void anInvalidDesignIsPassedOnAsTheTypedErrorNamingTheField() {
        Design d = h().withSupply(new CellPack("unobtainium", 1));
        halfrail.design.DesignException e = org.junit.jupiter.api.Assertions.assertThrows(
                halfrail.design.DesignException.class, () -> DesignAnalysis.analyse(d));
        assertEquals("supply.chemistry", e.path());
    }

    @Test
    void everyCodeOfTheCatalogueIsCoveredHere() {
        // A guard: a new code added to a check class must get a trigger test in this class.
        Set<String> declared = new java.util.TreeSet<>();
        for (DesignCheck c : Checks.ALL) {
            for (java.lang.reflect.Field fld : c.getClass().getDeclaredFields()) {
                if (fld.getType() == String.class && java.lang.reflect.Modifier.isStatic(fld.getModifiers())) {
                    try {
                        fld.setAccessible(true);
                        declared.add((String) fld.get(null));
                    } catch (IllegalAccessException e) {
                        throw new AssertionError(e);
                    }
                }
            }
        }
        declared.add(NoDcPath.CODE);
        assertEquals(new java.util.TreeSet<>(ALL_CODES), declared);
    }
}
