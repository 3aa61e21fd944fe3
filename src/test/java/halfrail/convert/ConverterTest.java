package halfrail.convert;

import halfrail.check.DesignReport;
import halfrail.check.Severity;
import halfrail.check.StageReport;
import halfrail.design.CapacitorSpec;
import halfrail.design.Design;
import halfrail.design.Load;
import halfrail.design.Reference;
import halfrail.design.Stage;
import halfrail.parts.CapacitorTechnology;
import halfrail.parts.PartsLibrary;
import halfrail.units.ESeries;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ConverterTest {
    private static ConversionResult nonInverting;
    private static ConversionResult inverting;
    private static ConversionResult chain;

    @BeforeAll
    static void convert() {
        nonInverting = Converter.convert(ConversionRequests.nonInvertingToNineVolts());
        inverting = Converter.convert(ConversionRequests.invertingToUsb());
        chain = Converter.convert(ConversionRequests.twoStageChainToThreeAaCells());
    }

    @Test
    void aConvertedNonInvertingStageHasNoFailingFindingAtTheNominalSupply() {
        assertFalse(nonInverting.report().has(Severity.FAIL), () -> nonInverting.report().findings().toString());
        assertTrue(nonInverting.succeeded());
    }

    @Test
    void aConvertedInvertingStageHasNoFailingFindingAtTheNominalSupply() {
        assertFalse(inverting.report().has(Severity.FAIL), () -> inverting.report().findings().toString());
        assertTrue(inverting.succeeded());
    }

    @Test
    void aConvertedTwoStageChainHasNoFailingFindingAndMeetsItsLimits() {
        assertFalse(chain.report().has(Severity.FAIL), () -> chain.report().findings().toString());
        assertTrue(chain.succeeded(), chain.conflicts().toString());
        assertEquals(2, chain.design().stages().size());
        assertEquals(List.of("gain", "invert"), chain.design().stages().stream().map(Stage::name).toList());
        assertTrue(chain.comparison().after().settleSeconds().orElseThrow() <= 1);
        assertTrue(chain.report().battery().orElseThrow().totalAmps() <= 1e-3);
        // cascade gain is the product of the stage gains, (1 + 100k/10k)·(22k/10k) = 24.2 (closed form);
        // the chain's gain in the band loses the bias resistor's loading of the 10 kΩ source, so at most that
        double loading = chain.design().reference().biasOhms() / (chain.design().reference().biasOhms() + 10e3);
        assertEquals(24.2 * loading, chain.comparison().after().gain(), 24.2 * 0.02);
        assertTrue(chain.design().stages().get(1).legCapacitor() == null, "an inverting stage gets no leg capacitor");
        assertTrue(chain.design().stages().get(1).inputCapacitor() == null,
                "later stages are DC-coupled: each output rests at the reference the next input wants");
    }

    @Test
    @DisplayName("every chosen capacitor is in E12 (film, ceramic) or E6 (electrolytic, tantalum), every resistor in E24 (IEC 60063)")
    void chosenValuesAreESeriesMembers() {
        for (ConversionResult r : List.of(nonInverting, inverting, chain)) {
            for (CapacitorSpec c : capacitors(r.design())) {
                CapacitorTechnology t = PartsLibrary.builtIn().requireCapacitorTechnology(c.technology());
                ESeries series = t.polarised() ? ESeries.E6 : ESeries.E12;
                assertTrue(series.contains(c.farads()), c + " is not in " + series);
                assertTrue(t.deratedVolts(c.ratedVolts()) >= r.design().supply().highVolts(),
                        c + " is not rated for the supply's highest voltage after derating");
                assertTrue(t.standardRatedVolts().contains(c.ratedVolts()), c + " has no standard rating");
            }
            Reference ref = r.design().reference();
            assertTrue(ESeries.E24.contains(ref.upperOhms()) && ESeries.E24.contains(ref.lowerOhms())
                    && ESeries.E24.contains(ref.biasOhms()), ref.toString());
        }
    }

    @Test
    @DisplayName("the chain's real lower −3 dB point from the engine lies at or below the band's low end")
    void lowerCornerMeetsTheBand() {
        // the band's low end is a −3 dB point (common practice); the engine finds the chain's from its
        // complex response, which for n cascaded first-order networks lies above the largest single corner
        for (ConversionResult r : List.of(nonInverting, inverting, chain)) {
            DesignReport rep = r.report();
            double corner = rep.chain().orElseThrow().lowerCornerHz().orElseThrow();
            assertTrue(corner <= r.request().signal().bandLowHz(), "corner " + corner + " Hz");
            assertEquals(corner, r.comparison().after().lowerCornerHz().orElseThrow(), 1e-12);
            assertTrue(rep.findings("CORNER_ABOVE_BAND").isEmpty());
        }
    }

    @Test
    @DisplayName("the user's R1 and R2 are kept, so the gain is 1 + R2/R1 and −R2/R1 (closed form, any op-amp text)")
    void gainIsKept() {
        Stage ni = nonInverting.design().stages().get(0);
        assertEquals(10e3, ni.legOhms());
        assertEquals(100e3, ni.feedbackOhms());
        StageReport sn = nonInverting.report().stages().stream().filter(StageReport::signal).findFirst().orElseThrow();
        assertEquals(11, sn.stageGain(), 11 * 0.01);
        Stage inv = inverting.design().stages().get(0);
        assertEquals(10e3, inv.legOhms());
        assertEquals(47e3, inv.feedbackOhms());
        StageReport si = inverting.report().stages().stream().filter(StageReport::signal).findFirst().orElseThrow();
        assertEquals(4.7, si.stageGain(), 4.7 * 0.01);
        assertEquals(1, sn.biasGain(), 1e-3, "the leg capacitor keeps the bias gain at 1");
    }

    @Test
    @DisplayName("a part that stops 1.5 V below the positive rail but 20 mV above ground gets its reference below mid-rail, and more end-point headroom")
    void aLopsidedOutputWindowMovesTheReferenceBelowMidRail() {
        Reference ref = nonInverting.design().reference();
        assertTrue(ref.lowerOhms() < ref.upperOhms(), ref.toString());
        assertTrue(ESeries.E24.contains(ref.upperOhms()) && ESeries.E24.contains(ref.lowerOhms()));
        Design mid = nonInverting.design().withReference(ref.withDivider(ref.lowerOhms(), ref.lowerOhms()));
        double centred = nonInverting.comparison().after().point("end-point").headroomDb();
        double atMid = halfrail.check.DesignAnalysis.analyse(mid, false).stages().stream()
                .filter(StageReport::signal).findFirst().orElseThrow().endPoint().headroomDbOrInfinite();
        assertTrue(centred > atMid + 1, "end-point headroom " + centred + " dB against " + atMid + " dB at mid-rail");
        assertTrue(inverting.design().reference().upperOhms() == inverting.design().reference().lowerOhms(),
                "a rail-to-rail part keeps the reference at mid-rail");
    }

    @Test
    void anOpAmpThatCannotRunOnTheSupplyIsReplacedAndSaidSo() {
        Change c = nonInverting.changes().stream().filter(x -> x.kind() == ChangeKind.OP_AMP_REPLACED).findFirst()
                .orElseThrow();
        assertEquals("classic-bipolar-dual-supply", c.before());
        assertTrue(c.reason().contains("10 V"), c.reason());
        assertEquals("single-supply-bipolar", nonInverting.design().stages().get(0).opAmp().archetype());
    }

    @Test
    void everyAddedPartIsListedWithItsReason() {
        List<ChangeKind> kinds = nonInverting.changes().stream().map(Change::kind).toList();
        assertTrue(kinds.containsAll(List.of(ChangeKind.SUPPLY_REPLACED, ChangeKind.REFERENCE_ADDED,
                ChangeKind.BIAS_RESISTOR_ADDED, ChangeKind.INPUT_CAPACITOR_ADDED, ChangeKind.LEG_CAPACITOR_ADDED,
                ChangeKind.OUTPUT_CAPACITOR_ADDED)), kinds.toString());
        assertFalse(inverting.changes().stream().anyMatch(c -> c.kind() == ChangeKind.LEG_CAPACITOR_ADDED),
                "an inverting stage has no leg capacitor");
        for (Change c : nonInverting.changes()) {
            assertFalse(c.reason().isBlank(), c.toString());
        }
    }

    @Test
    void theComparisonShowsTheLostSwingFromTheEngine() {
        ChainFigures before = nonInverting.comparison().before();
        ChainFigures after = nonInverting.comparison().after();
        assertTrue(before.point("nominal").symmetricSwingVolts() > after.point("nominal").symmetricSwingVolts());
        assertTrue(after.point("end-point").symmetricSwingVolts() < after.point("fresh").symmetricSwingVolts());
        assertTrue(after.point("end-point").headroomDb() >= 0, "no clipping at the end-point");
        Reference ref = nonInverting.design().reference();
        double k = ref.lowerOhms() / (ref.upperOhms() + ref.lowerOhms());
        assertEquals(k * 9.0, after.point("nominal").restVolts(), 0.05, "rests at the reference (9 V block, 9.0 V nominal)");
        assertTrue(before.lowerCornerHz().isEmpty(), "the DC-coupled original passes DC");
        assertEquals(3, after.points().size());
    }

    @Test
    @DisplayName("a 1 Hz corner with a 10 ms settle-up limit reports the conflict with numbers instead of a silent compromise")
    void impossibleRequestReportsTheConflict() {
        ConversionResult r = Converter.convert(ConversionRequests.oneHertzInTenMilliseconds());
        Conflict c = r.conflicts().stream().filter(x -> x.kind() == ConflictKind.CORNER_VERSUS_SETTLE).findFirst()
                .orElseThrow(() -> new AssertionError("no conflict reported: " + r.conflicts()));
        assertEquals("s", c.unit());
        assertEquals(0.01, c.limit(), 1e-15);
        // a 1 Hz corner needs τ of at least 1/(2π·1 Hz) = 159 ms per network (RC corner, The Art of Electronics ch. 1)
        assertTrue(c.achieved() > 1 / (2 * Math.PI), "settle-up " + c.achieved() + " s");
        assertEquals(c.achieved() - c.limit(), c.missedBy(), 1e-12);
        assertTrue(c.explanation().contains("10 ms"), c.explanation());
        assertFalse(r.limitsMet());
        assertFalse(r.succeeded());
        double corner = r.report().chain().orElseThrow().lowerCornerHz().orElseThrow();
        assertTrue(corner <= 1, "the band wins by default: corner " + corner + " Hz");
    }

    @Test
    void theTradeOffCurveTradesCornerForSettleUpTime() {
        ConversionResult r = Converter.convert(ConversionRequests.oneHertzInTenMilliseconds());
        List<TradeOffPoint> curve = r.tradeOff();
        assertEquals(Converter.TRADE_OFF_POINTS, curve.size());
        for (int i = 1; i < curve.size(); i++) {
            TradeOffPoint a = curve.get(i - 1);
            TradeOffPoint b = curve.get(i);
            assertTrue(b.targetCornerHz() > a.targetCornerHz());
            assertTrue(b.lowerCornerHz().orElseThrow() > a.lowerCornerHz().orElseThrow(), "smaller capacitors, higher corner");
            assertTrue(b.settleSeconds().orElse(b.simulatedSeconds()) < a.settleSeconds().orElse(a.simulatedSeconds()),
                    "smaller capacitors settle sooner: " + a + " then " + b);
        }
    }

    @Test
    void withSettlePriorityTheCornerRisesAndTheMissIsStatedInHertz() {
        ConversionRequest q = ConversionRequests.nonInvertingToNineVolts();
        q = q.withLimits(ConversionLimits.none().withMaxSettleSeconds(0.2).withPriority(LimitPriority.SETTLE));
        ConversionResult r = Converter.convert(q);
        Conflict c = r.conflicts().stream().filter(x -> x.kind() == ConflictKind.CORNER_VERSUS_SETTLE).findFirst()
                .orElseThrow(() -> new AssertionError(r.conflicts().toString()));
        assertEquals("Hz", c.unit());
        double corner = r.report().chain().orElseThrow().lowerCornerHz().orElseThrow();
        assertTrue(corner > 20, "corner " + corner);
        assertEquals(corner, c.achieved(), corner * 1e-6);
        assertEquals(corner - 20, c.missedBy(), corner * 1e-6);
        assertTrue(r.comparison().after().settleSeconds().orElseThrow() <= 0.2,
                "settle-up " + r.comparison().after().settleSeconds());
        assertTrue(r.changes().stream().anyMatch(x -> x.kind() == ChangeKind.CAPACITORS_REDUCED_FOR_SETTLE));
    }

    @Test
    void aFeedbackResistorAboveTheCommonPracticeLimitIsScaledWithR1AndSaidSo() {
        DualRailChain chain = new DualRailChain(List.of(new DualRailStage("gain", halfrail.design.StageKind.NON_INVERTING,
                47e3, 470e3, halfrail.design.OpAmpChoice.archetype("cmos-rrio-low-voltage"))), 2.5, 2.5);
        ConversionRequest q = new ConversionRequest("x", chain, new halfrail.design.UsbPort(0, 0),
                new halfrail.design.SignalSource(0.05, halfrail.design.AmplitudeUnit.VOLTS_PEAK, 100, 20, 20e3),
                10e3, 0, ConversionLimits.none());
        ConversionResult r = Converter.convert(q);
        Stage s = r.design().stages().get(0);
        assertEquals(4.7e3, s.legOhms(), 1e-9);
        assertEquals(47e3, s.feedbackOhms(), 1e-9);
        assertEquals(11, s.nominalGain(), 1e-12);
        assertTrue(r.changes().stream().anyMatch(c -> c.kind() == ChangeKind.RESISTORS_SCALED), r.changes().toString());
        assertTrue(r.report().findings("FEEDBACK_RESISTANCE_HIGH").isEmpty());
    }

    @Test
    void aCurrentLimitRaisesTheDividerAndBuffersItWhenBiasCurrentWouldShiftTheBias() {
        // a custom rail-to-rail part with a large bias current, 20 µA quiescent (invented values)
        halfrail.circuit.OpAmpParams p = new halfrail.circuit.OpAmpParams(1e5, 1e6, 1e6, 0.5e-3, 400e-9, 20e-9,
                -0.1, -0.1, 0.02, 0.02, 100, 20e-6, 1.8, 5.5);
        DualRailChain chain = new DualRailChain(List.of(new DualRailStage("gain", halfrail.design.StageKind.NON_INVERTING,
                10e3, 47e3, halfrail.design.OpAmpChoice.custom(p))), 5, 5);
        ConversionRequest q = new ConversionRequest("x", chain, new halfrail.design.CellPack("li-ion", 1),
                new halfrail.design.SignalSource(0.02, halfrail.design.AmplitudeUnit.VOLTS_PEAK, 1e3, 10, 5e3),
                100e3, 0, ConversionLimits.none().withMaxSupplyAmps(30e-6));
        ConversionResult r = Converter.convert(q);
        assertEquals(halfrail.design.ReferenceKind.DIVIDER_BUFFERED, r.design().reference().kind(),
                r.changes().toString());
        assertTrue(r.changes().stream().anyMatch(c -> c.kind() == ChangeKind.REFERENCE_BUFFERED));
        assertTrue(r.report().findings("BIAS_CURRENT_SHIFT").isEmpty(), r.report().findings().toString());
        double total = r.report().battery().orElseThrow().totalAmps();
        assertTrue(total <= 30e-6, "supply current " + total + " A");
        assertTrue(r.succeeded(), r.conflicts() + " " + r.report().findings());
    }

    @Test
    void whenNoBufferFitsTheBiasShiftWinsAndTheCurrentLimitIsMissedByAStatedAmount() {
        // single-supply bipolar part on a 9 V block with a budget that leaves the divider only a few µA
        DualRailChain chain = new DualRailChain(List.of(new DualRailStage("gain", halfrail.design.StageKind.NON_INVERTING,
                10e3, 47e3, halfrail.design.OpAmpChoice.archetype("single-supply-bipolar"))), 9, 9);
        ConversionRequest q = new ConversionRequest("x", chain, new halfrail.design.CellPack("alkaline-9v-block", 1),
                new halfrail.design.SignalSource(0.05, halfrail.design.AmplitudeUnit.VOLTS_PEAK, 1e3, 20, 20e3),
                10e3, 0, ConversionLimits.none().withMaxSupplyAmps(0.503e-3));
        ConversionResult r = Converter.convert(q);
        Conflict c = r.conflicts().stream().filter(x -> x.kind() == ConflictKind.CURRENT_VERSUS_BIAS_SHIFT).findFirst()
                .orElseThrow(() -> new AssertionError(r.conflicts().toString()));
        assertEquals("A", c.unit());
        assertEquals(0.503e-3, c.limit(), 1e-12);
        assertTrue(c.missedBy() > 0);
        assertTrue(r.report().findings("BIAS_CURRENT_SHIFT").isEmpty(), r.report().findings().toString());
        assertFalse(r.succeeded());
    }

    @Test
    @DisplayName("a runtime limit becomes a current budget: 550 mA·h over 500 h is 1.1 mA (9 V block capacity, IEC 60086-2 via secondary sources)")
    void aRuntimeLimitIsMetOrItsMissIsStatedInAmps() {
        ConversionRequest ok = ConversionRequests.nonInvertingToNineVolts()
                .withLimits(ConversionLimits.none().withMinRuntimeHours(500));
        ConversionResult r = Converter.convert(ok);
        assertEquals(500, r.design().thresholds().minRuntimeHours());
        assertTrue(r.report().findings("RUNTIME_SHORT").isEmpty(), r.report().findings().toString());
        assertTrue(r.report().battery().orElseThrow().runtimeHours().orElseThrow() >= 500);
        assertTrue(r.limitsMet(), r.conflicts().toString());

        ConversionRequest tooLong = ConversionRequests.nonInvertingToNineVolts()
                .withLimits(ConversionLimits.none().withMinRuntimeHours(5000));
        ConversionResult miss = Converter.convert(tooLong);
        Conflict c = miss.conflicts().stream().filter(x -> x.kind() == ConflictKind.CURRENT_LIMIT_UNREACHABLE)
                .findFirst().orElseThrow(() -> new AssertionError(miss.conflicts().toString()));
        assertEquals("A", c.unit());
        assertEquals(0.55 / 5000, c.limit(), 1e-12);
        assertEquals(c.achieved() - c.limit(), c.missedBy(), 1e-12);
        assertFalse(miss.succeeded());
    }

    static List<CapacitorSpec> capacitors(Design d) {
        List<CapacitorSpec> list = new ArrayList<>();
        Reference ref = d.reference();
        list.add(ref.decoupling());
        if (ref.bufferDecoupling() != null) {
            list.add(ref.bufferDecoupling());
        }
        for (Stage s : d.stages()) {
            if (s.legCapacitor() != null) {
                list.add(s.legCapacitor());
            }
            if (s.inputCapacitor() != null) {
                list.add(s.inputCapacitor());
            }
        }
        Load l = d.load();
        if (l.outputCapacitor() != null) {
            list.add(l.outputCapacitor());
        }
        return list;
    }
}
