package halfrail.design;

import halfrail.parts.CapacitorTechnology;
import halfrail.parts.OpAmpArchetype;
import halfrail.parts.PartsLibrary;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestFactory;
import org.junit.jupiter.api.function.Executable;

import java.util.ArrayList;
import java.util.List;
import java.util.function.UnaryOperator;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Every way a design can be refused names the field. Paths given by a record's constructor are
 * relative to that record as the loader sees it ({@code farads} of a capacitor, {@code stage.legOhms}
 * of a stage); paths found while building the circuit are absolute ({@code stages[0].opAmp.archetype}).
 */
class DesignValidationTest {
    static CapacitorSpec film(double f) {
        return new CapacitorSpec(f, "polyester-film", 63);
    }

    static OpAmpChoice part() {
        return OpAmpChoice.archetype(OpAmpArchetype.SINGLE_SUPPLY_BIPOLAR);
    }

    static Stage stage() {
        return new Stage("boost", StageKind.NON_INVERTING, part(), 47e3, 4.7e3, film(10e-6), film(1e-6));
    }

    static Design design() {
        return new Design("d", "", new FixedRail(9, 0.05, 0, 0, 0), Reference.decoupled(100e3, 100e3, film(10e-6), 100e3),
                List.of(stage()), new SignalSource(0.1, AmplitudeUnit.VOLTS_PEAK, 1e3, 20, 20e3),
                new Load(10e3, 0, film(4.7e-6)), Thresholds.defaults(), 1e-3);
    }

    static Thresholds thresholds(int field, double value) {
        double[] v = {0.01, 2.0, 3.0, 1.0, 0.05, 0.1, 1e-3, 0.05, 1.0, 50, 100e3, 0, 0};
        v[field] = value;
        return new Thresholds(v[0], v[1], v[2], v[3], v[4], v[5], v[6], v[7], v[8], v[9], v[10], v[11], v[12]);
    }

    record Case(String path, Executable action) {
    }

    static List<Case> cases() {
        Design d = design();
        List<Case> c = new ArrayList<>();
        c.add(new Case("farads", () -> new CapacitorSpec(0, "polyester-film", 63)));
        c.add(new Case("farads", () -> new CapacitorSpec(Double.NaN, "polyester-film", 63)));
        c.add(new Case("technology", () -> new CapacitorSpec(1e-6, " ", 63)));
        c.add(new Case("ratedVolts", () -> new CapacitorSpec(1e-6, "polyester-film", -1)));
        c.add(new Case("opAmp", () -> new OpAmpChoice(null, null)));
        c.add(new Case("stage.name", () -> new Stage("", StageKind.FOLLOWER, part(), 0, 0, null, null)));
        c.add(new Case("stage.kind", () -> new Stage("x", null, part(), 0, 0, null, null)));
        c.add(new Case("stage.opAmp", () -> new Stage("x", StageKind.FOLLOWER, null, 0, 0, null, null)));
        c.add(new Case("stage.feedbackOhms", () -> new Stage("x", StageKind.INVERTING, part(), 0, 1e3, null, null)));
        c.add(new Case("stage.legOhms", () -> new Stage("x", StageKind.NON_INVERTING, part(), 1e3, -5, null, null)));
        c.add(new Case("reference.kind", () -> new Reference(null, 1, 1, null, 0, null, 0, null)));
        c.add(new Case("reference.upperOhms", () -> Reference.direct(0, 1e3)));
        c.add(new Case("reference.lowerOhms", () -> Reference.direct(1e3, Double.POSITIVE_INFINITY)));
        c.add(new Case("reference.decoupling", () -> Reference.decoupled(1e3, 1e3, null, 1e3)));
        c.add(new Case("reference.biasOhms", () -> Reference.decoupled(1e3, 1e3, film(1e-6), 0)));
        c.add(new Case("reference.buffer", () -> Reference.buffered(1e3, 1e3, film(1e-6), 1e3, null, 100, film(1e-6))));
        c.add(new Case("reference.isolationOhms", () -> Reference.buffered(1e3, 1e3, film(1e-6), 1e3, part(), 0, film(1e-6))));
        c.add(new Case("reference.bufferDecoupling", () -> Reference.buffered(1e3, 1e3, film(1e-6), 1e3, part(), 100, null)));
        c.add(new Case("source.amplitude", () -> new SignalSource(Double.NaN, AmplitudeUnit.DBU, 0, 20, 20e3)));
        c.add(new Case("source.amplitude", () -> new SignalSource(-1, AmplitudeUnit.VOLTS_PEAK, 0, 20, 20e3)));
        c.add(new Case("source.unit", () -> new SignalSource(1, null, 0, 20, 20e3)));
        c.add(new Case("source.sourceOhms", () -> new SignalSource(1, AmplitudeUnit.VOLTS_RMS, -1, 20, 20e3)));
        c.add(new Case("source.bandLowHz", () -> new SignalSource(1, AmplitudeUnit.VOLTS_RMS, 0, 0, 20e3)));
        c.add(new Case("source.bandHighHz", () -> new SignalSource(1, AmplitudeUnit.VOLTS_RMS, 0, 20, Double.NaN)));
        c.add(new Case("source.bandHighHz", () -> new SignalSource(1, AmplitudeUnit.VOLTS_RMS, 0, 20e3, 20)));
        c.add(new Case("load.ohms", () -> new Load(0, 0, null)));
        c.add(new Case("load.farads", () -> new Load(1e3, -1e-9, null)));
        c.add(new Case("supply.volts", () -> new FixedRail(-9, 0, 0, 0, 0)));
        c.add(new Case("supply.tolerance", () -> new FixedRail(9, 1.5, 0, 0, 0)));
        c.add(new Case("supply.rippleVoltsPeak", () -> new FixedRail(9, 0, -0.1, 0, 0)));
        c.add(new Case("supply.rippleHz", () -> new FixedRail(9, 0, 0.1, 0, 0)));
        c.add(new Case("supply.sourceOhms", () -> new FixedRail(9, 0, 0, 0, Double.NaN)));
        c.add(new Case("supply.chemistry", () -> new CellPack(null, 1)));
        c.add(new Case("supply.cellsInSeries", () -> new CellPack("alkaline-aa", 0)));
        c.add(new Case("supply.rippleVoltsPeak", () -> new UsbPort(-1, 0)));
        c.add(new Case("supply.rippleHz", () -> new UsbPort(0.01, 0)));
        String[] names = {"settleBandFraction", "maxSettleSeconds", "minHeadroomDb", "offCentreDb", "nearRailFraction",
                "maxLeakageDriftVolts", "maxRippleVolts", "maxBiasShiftVolts", "maxStepVolts", "maxStageGain",
                "maxFeedbackOhms", "minRuntimeHours", "capacitorDeratingOverride"};
        double[] bad = {0, -1, Double.NaN, -1, 2, 0, 0, 0, 0, 0, 0, -1, 1.5};
        for (int i = 0; i < names.length; i++) {
            int field = i;
            c.add(new Case("thresholds." + names[i], () -> thresholds(field, bad[field])));
        }
        c.add(new Case("supply", () -> d.withSupply(null)));
        c.add(new Case("reference", () -> d.withReference(null)));
        c.add(new Case("stages", () -> d.withStages(null)));
        c.add(new Case("stages", () -> d.withStages(List.of())));
        c.add(new Case("stages[1].name", () -> d.withStages(List.of(stage(), stage()))));
        c.add(new Case("source", () -> d.withSource(null)));
        c.add(new Case("load", () -> d.withLoad(null)));
        c.add(new Case("thresholds", () -> d.withThresholds(null)));
        c.add(new Case("powerOnRampSeconds", () -> new Design("d", "", d.supply(), d.reference(), d.stages(), d.source(),
                d.load(), d.thresholds(), -1)));
        c.add(new Case("supplyVolts", () -> DesignCircuits.build(d, 0, halfrail.parts.LeakageLevel.TYPICAL)));
        // Direct reference: a second stage on the divider node while the first puts signal on it.
        c.add(new Case("stages[1].inputCapacitor", () -> DesignCircuits.nominal(d.withReference(Reference.direct(1e5, 1e5))
                .withStages(List.of(stage(), new Stage("two", StageKind.FOLLOWER, part(), 0, 0, null, film(1e-6)))))));
        c.add(new Case("stages[1]", () -> DesignCircuits.nominal(d.withReference(Reference.direct(1e5, 1e5))
                .withStages(List.of(stage(), new Stage("two", StageKind.INVERTING, part(), 1e4, 1e4, null, null))))));
        return c;
    }

    @TestFactory
    List<DynamicTest> everyRefusalNamesItsField() {
        List<DynamicTest> tests = new ArrayList<>();
        for (Case c : cases()) {
            tests.add(DynamicTest.dynamicTest(c.path(), () -> {
                DesignException e = assertThrows(DesignException.class, c.action());
                assertEquals(c.path(), e.path());
                assertTrue(e.getMessage().startsWith(c.path() + ": "), e.getMessage());
            }));
        }
        return tests;
    }

    static void assertNamesKnownIds(DesignException e, List<String> known) {
        for (String id : known) {
            assertTrue(e.getMessage().contains(id), () -> e.getMessage() + " should list " + id);
        }
    }

    @Test
    void anUnknownArchetypeNamesTheStagesOpAmpAndTheKnownArchetypes() {
        Design d = design().withStage(0, stage().withOpAmp(OpAmpChoice.archetype("tube-amp")));
        DesignException e = assertThrows(DesignException.class, () -> DesignCircuits.nominal(d));
        assertEquals("stages[0].opAmp.archetype", e.path());
        assertNamesKnownIds(e, PartsLibrary.builtIn().opAmpArchetypes().stream().map(OpAmpArchetype::id).toList());
        assertTrue(e.getMessage().contains("tube-amp"));
    }

    @Test
    void anUnknownBufferArchetypeNamesTheReferenceBuffer() {
        Reference r = Reference.buffered(1e5, 1e5, film(10e-6), 1e5, OpAmpChoice.archetype("nope"), 1e3, film(10e-6));
        DesignException e = assertThrows(DesignException.class, () -> DesignCircuits.nominal(design().withReference(r)));
        assertEquals("reference.buffer.archetype", e.path());
    }

    @Test
    void anUnknownTechnologyNamesTheCapacitorAndTheKnownTechnologies() {
        List<String> known = PartsLibrary.builtIn().capacitorTechnologies().stream().map(CapacitorTechnology::id).toList();
        record Where(String path, UnaryOperator<Design> change) {
        }
        CapacitorSpec odd = new CapacitorSpec(1e-6, "paper-in-oil", 63);
        List<Where> places = List.of(
                new Where("stages[0].legCapacitor.technology", x -> x.withStage(0, stage().withLegCapacitor(odd))),
                new Where("stages[0].inputCapacitor.technology", x -> x.withStage(0, stage().withInputCapacitor(odd))),
                new Where("reference.decoupling.technology", x -> x.withReference(Reference.decoupled(1e5, 1e5, odd, 1e5))),
                new Where("load.outputCapacitor.technology", x -> x.withLoad(new Load(1e4, 0, odd))));
        for (Where w : places) {
            DesignException e = assertThrows(DesignException.class, () -> DesignCircuits.nominal(w.change().apply(design())));
            assertEquals(w.path(), e.path());
            assertNamesKnownIds(e, known);
        }
    }
}
