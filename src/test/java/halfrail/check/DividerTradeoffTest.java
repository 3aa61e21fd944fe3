package halfrail.check;

import halfrail.design.Design;
import halfrail.design.OpAmpChoice;
import halfrail.parts.OpAmpArchetype;
import halfrail.parts.PartsLibrary;
import halfrail.units.ESeries;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class DividerTradeoffTest {
    /** Nominal voltage of four alkaline AA cells (4 × 1.5 V, cell-chemistries.json), V. */
    private static final double VOLTS = 6.0;
    /** The reference decoupling capacitor of {@link StudyDesigns#gainOfEleven}, F. */
    private static final double CREF = 10e-6;

    private static Design clean() {
        return StudyDesigns.gainOfEleven(StudyDesigns.fourAa(), 0.1);
    }

    @Test
    void dividerCurrentFallsAsOneOverRAndRuntimeIsCapacityOverCurrent() {
        DividerTradeoffResult r = DividerTradeoff.run(clean(), DividerTradeoffOptions.defaults().withTransientPoints(0));
        // E12 from 1 kΩ to 1 MΩ: 12 values per decade over three decades, plus 1 MΩ (IEC 60063).
        assertEquals(37, r.choices().size());
        double capacity = r.capacityAmpHours().getAsDouble();
        assertEquals(2.0, capacity, 0);
        for (DividerChoice c : r.choices()) {
            // Ohm's law on an unloaded equal divider: I = V/(Ra + Rb).
            assertEquals(VOLTS / (2 * c.upperOhms()), c.dividerAmps(), 1e-3 * c.dividerAmps());
            // The op-amp draws nothing, so the divider is (almost) all the supply delivers.
            assertEquals(c.dividerAmps(), c.totalAmps(), 1e-3 * c.totalAmps());
            // Runtime = capacity / current (definition).
            assertEquals(capacity / c.totalAmps(), c.runtimeHours().getAsDouble(), 1e-9 * c.runtimeHours().getAsDouble());
            // τ = (Ra‖Rb)·C.
            assertEquals(c.upperOhms() / 2 * CREF, c.timeConstantSeconds().getAsDouble(), 1e-15);
        }
        List<DividerChoice> current = r.choices().stream().filter(DividerChoice::current).toList();
        assertEquals(1, current.size());
        assertEquals(100e3, current.get(0).upperOhms(), 1e-6);
    }

    @Test
    void aDesignDividerOutsideTheSeriesGetsARowOfItsOwn() {
        Design d = clean();
        Design odd = d.withReference(d.reference().withDivider(123e3, 123e3));
        DividerTradeoffResult r = DividerTradeoff.run(odd, DividerTradeoffOptions.defaults().withTransientPoints(0)
                .withSeries(ESeries.E6).withRange(10e3, 1e6));
        assertEquals(ESeries.E6.values(10e3, 1e6).size() + 1, r.choices().size());
        assertEquals(123e3, r.current().upperOhms(), 0);
        for (int i = 1; i < r.choices().size(); i++) {
            assertTrue(r.choices().get(i).theveninOhms() > r.choices().get(i - 1).theveninOhms());
        }
    }

    @Test
    void theReferenceSettlesAsAFirstOrderRcInThePowerOnTransient() {
        // First-order RC from an empty capacitor: v = V/2·(1 − e^(−t/τ)) is inside the band b after
        // τ·ln((V/2)/b); the 1 ms supply ramp delays an RC with τ much longer than it by half the ramp.
        // A 10 MΩ bias resistor keeps the stage's input capacitor from loading the reference.
        Design base = clean();
        Design d = base.withReference(halfrail.design.Reference.decoupled(100e3, 100e3, StudyDesigns.film(CREF), 10e6));
        DividerTradeoffResult r = DividerTradeoff.run(d, DividerTradeoffOptions.defaults().withRange(1e3, 1e4));
        DividerChoice first = r.choices().get(0);
        assertTrue(first.transientRun());
        double tau = first.timeConstantSeconds().getAsDouble();
        double expected = tau * Math.log((VOLTS / 2) / r.settleBandVolts()) + Design.DEFAULT_POWER_ON_RAMP_SECONDS / 2;
        assertEquals(expected, first.settleSeconds().getAsDouble(), 0.05 * expected);
        assertEquals(3, r.choices().stream().filter(DividerChoice::transientRun).count());
        assertTrue(r.choices().stream().filter(c -> !c.transientRun()).allMatch(c -> c.settleSeconds().isEmpty()));
    }

    @Test
    void biasCurrentShiftsTheRestPointThroughTheDividerAndBiasResistors() {
        // Non-inverting stage, blocking capacitor in the leg: the + pin's current Ib + Ios/2 flows
        // through RBIAS + Ra‖Rb, the − pin's current Ib − Ios/2 through R2 from the output, so the
        // output moves by −(Ib + Ios/2)·(RBIAS + Ra‖Rb) + (Ib − Ios/2)·R2 (op-amp model's pin currents).
        Design base = clean();
        Design d = base.withStage(0, base.stages().get(0).withOpAmp(OpAmpChoice.archetype(
                OpAmpArchetype.SINGLE_SUPPLY_BIPOLAR)));
        var p = PartsLibrary.builtIn().opAmpArchetype(OpAmpArchetype.SINGLE_SUPPLY_BIPOLAR).orElseThrow().typical();
        double ibPlus = p.biasAmps() + p.offsetCurrentAmps() / 2;
        double ibMinus = p.biasAmps() - p.offsetCurrentAmps() / 2;
        DividerTradeoffResult r = DividerTradeoff.run(d, DividerTradeoffOptions.defaults().withTransientPoints(0));
        for (DividerChoice c : List.of(r.choices().get(0), r.choices().get(r.choices().size() - 1))) {
            double expected = -ibPlus * (100e3 + c.theveninOhms()) + ibMinus * 100e3;
            assertEquals(expected, c.biasShiftVolts(), 1e-5);
        }
    }

    @Test
    void referenceNoiseOfTheDesignsOwnDividerAgreesWithTheDesignReport() {
        Design d = TestDesigns.healthyNineVolt();
        DividerTradeoffResult r = DividerTradeoff.run(d, DividerTradeoffOptions.defaults().withTransientPoints(0));
        double reported = DesignAnalysis.analyse(d, false).chain().orElseThrow().referenceNoiseVoltsRms();
        assertEquals(reported, r.current().referenceNoiseVoltsRms(), 1e-9 * reported);
        assertTrue(reported > 0);
    }

    @Test
    void badRangesAreRejectedNamingTheField() {
        assertEquals("tradeoff.maxOhms", assertThrows(StudyOptionsException.class,
                () -> DividerTradeoffOptions.defaults().withRange(10e3, 1e3)).field());
        assertEquals("tradeoff.minOhms", assertThrows(StudyOptionsException.class,
                () -> DividerTradeoffOptions.defaults().withRange(-1, 1e3)).field());
        assertEquals("tradeoff.transientPoints", assertThrows(StudyOptionsException.class,
                () -> DividerTradeoffOptions.defaults().withTransientPoints(-1)).field());
    }
}
