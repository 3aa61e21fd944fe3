package halfrail.check;

import halfrail.design.Design;
import halfrail.design.OpAmpChoice;
import halfrail.parts.OpAmpSpread;
import halfrail.parts.PartsLibrary;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class WorstCaseTest {
    private static final double RA = 10e3;
    private static final double RB = 22e3;
    private static final double VS = 10;

    @Test
    void dividerExtremesMatchTheClosedFormAtTheToleranceCorners() {
        // Closed form of an unloaded divider: Vout = Vs·Rb/(Ra + Rb); it rises with Rb and falls
        // with Ra, so the corners are (Ra low, Rb high) and (Ra high, Rb low).
        double t = 0.05;
        double max = VS * RB * (1 + t) / (RA * (1 - t) + RB * (1 + t));
        double min = VS * RB * (1 - t) / (RA * (1 + t) + RB * (1 - t));
        Design d = StudyDesigns.divider(StudyDesigns.tenVolts(0), RA, RB);
        WorstCaseResult r = WorstCase.run(d, ToleranceOptions.resistorsOnly(t));
        StageWorstCase f = r.opAmp("follower").orElseThrow();
        // 1 mV covers the follower's finite gain (1e5) and the input capacitor's typical leakage.
        assertEquals(max, f.maxQuiescentVolts(), 1e-3);
        assertEquals(min, f.minQuiescentVolts(), 1e-3);
        assertEquals(VS * RB / (RA + RB), f.nominalQuiescentVolts(), 1e-3);
        // The two resistors drive it, in opposite directions (closed form: ∂V/∂Rb > 0 > ∂V/∂Ra).
        List<PartInfluence> drivers = f.drivers();
        assertTrue(drivers.size() >= 2);
        assertEquals(List.of("RA.ohms", "RB.ohms"),
                drivers.subList(0, 2).stream().map(PartInfluence::parameterId).sorted().toList());
        PartInfluence ra = drivers.stream().filter(x -> x.parameterId().equals("RA.ohms")).findFirst().orElseThrow();
        PartInfluence rb = drivers.stream().filter(x -> x.parameterId().equals("RB.ohms")).findFirst().orElseThrow();
        assertTrue(ra.sensitivity() < 0 && rb.sensitivity() > 0);
        // Secant over ±5 % of Ra: the closed form at Ra(1 ± t), Rb nominal.
        double raSwing = VS * RB / (RA * (1 + t) + RB) - VS * RB / (RA * (1 - t) + RB);
        assertEquals(raSwing, ra.swingVolts(), 1e-4);
    }

    @Test
    void theCornerBuildsCanBeOpenedAndAnalysedAsDesigns() {
        Design d = StudyDesigns.divider(StudyDesigns.tenVolts(0), RA, RB);
        StageWorstCase f = WorstCase.run(d, ToleranceOptions.resistorsOnly(0.05)).opAmp("follower").orElseThrow();
        Design low = f.lowCorner().design();
        assertEquals(RA * 1.05, low.reference().upperOhms(), 1e-6);
        assertEquals(RB * 0.95, low.reference().lowerOhms(), 1e-6);
        DesignReport report = DesignAnalysis.analyse(low, false);
        assertEquals(f.minQuiescentVolts(), report.stage("follower").orElseThrow().outputVolts(), 1e-6);
    }

    @Test
    void offsetAndBiasSpreadOfAnArchetypeWidenTheFollowersRestPoint() {
        // Follower of the divider: out = Vref + Vos − (Ib + Ios/2)·(Ra‖Rb) (the + pin's current,
        // as the op-amp model defines it, through the divider's Thevenin resistance). Over the
        // spread: 2·Vos,max in offset, the bias current from typical to the maximum of the same
        // sign, and Ios/2 over ±Ios,max/2 (figures from opamp-archetypes.json).
        String id = "single-supply-bipolar";
        Design base = StudyDesigns.divider(StudyDesigns.tenVolts(0), RA, RB);
        Design d = base.withStage(0, base.stages().get(0).withOpAmp(OpAmpChoice.archetype(id)));
        var arch = PartsLibrary.builtIn().opAmpArchetype(id).orElseThrow();
        double rth = RA * RB / (RA + RB);
        double ibTyp = arch.typical().biasAmps();
        double ibMax = Math.copySign(arch.spread().biasAmpsMax(), ibTyp);
        double expected = 2 * arch.spread().offsetVoltsMax() + Math.abs(ibMax - ibTyp) * rth
                + arch.spread().offsetCurrentAmpsMax() * rth;
        ToleranceOptions opts = ToleranceOptions.resistorsOnly(0).withOpAmpInputErrors(true);
        StageWorstCase f = WorstCase.run(d, opts).opAmp("follower").orElseThrow();
        assertEquals(expected, f.maxQuiescentVolts() - f.minQuiescentVolts(), 1e-4);
        assertEquals("U1.offsetVolts", f.drivers().get(0).parameterId());
    }

    @Test
    void aCustomOpAmpHasNoSpreadUnlessOneIsGiven() {
        Design d = StudyDesigns.divider(StudyDesigns.tenVolts(0), RA, RB);
        ToleranceOptions opts = ToleranceOptions.resistorsOnly(0).withOpAmpInputErrors(true);
        assertTrue(ToleranceModel.of(d, opts).parameters().stream().noneMatch(p -> p.element().equals("U1")));
        OpAmpSpread spread = new OpAmpSpread(5e-3, 0, 0, 0);
        ToleranceModel m = ToleranceModel.of(d, opts.withCustomOpAmpSpreads(Map.of("stages[0].opAmp", spread)));
        ToleranceParameter vos = m.parameters().get(m.indexOf("U1.offsetVolts").orElseThrow());
        assertEquals(-5e-3, vos.lowValue(), 0);
        assertEquals(5e-3, vos.highValue(), 0);
        StageWorstCase f = WorstCase.run(m).opAmp("follower").orElseThrow();
        // A follower passes its offset straight to the output (gain 1).
        assertEquals(10e-3, f.maxQuiescentVolts() - f.minQuiescentVolts(), 1e-5);
        assertEquals("tolerance.customOpAmpSpreads", assertThrows(StudyOptionsException.class,
                () -> ToleranceModel.of(d, opts.withCustomOpAmpSpreads(Map.of("stages[3].opAmp", spread)))).field());
    }

    @Test
    void theLadderGetsTheCornerSpread() {
        Design d = StudyDesigns.divider(StudyDesigns.tenVolts(0), RA, RB);
        WorstCaseResult r = WorstCase.run(d, ToleranceOptions.resistorsOnly(0.05));
        List<Ladder> ladders = r.withSpread(DesignAnalysis.analyse(d, false).ladders());
        Ladder l = ladders.get(0);
        assertEquals(r.opAmps().get(0).minQuiescentVolts(), l.spreadLowVolts().getAsDouble(), 0);
        assertEquals(r.opAmps().get(0).maxQuiescentVolts(), l.spreadHighVolts().getAsDouble(), 0);
    }

    @Test
    void aStageThatClipsAtACornerDoesNotPassAtWorst() {
        // 10 % resistors move the divider of an 11× stage by ±0.05·V/2 = ±0.125 V (5 V rail); with
        // 0.2 V peak in, 2.2 V peak out leaves 2.4 − 2.2 = 0.2 V nominal room (0.76 dB) — already
        // below 3 dB, and at a corner only 0.075 V (−29 dB is far below the margin).
        Design d = StudyDesigns.gainOfEleven(new halfrail.design.FixedRail(5, 0, 0, 0, 0), 0.2);
        StageWorstCase s = WorstCase.run(d, ToleranceOptions.resistorsOnly(0.10)).opAmp("amp").orElseThrow();
        assertFalse(s.passesAtWorst());
        assertTrue(s.minHeadroomDb() < s.nominalHeadroomDb());
    }

    @Test
    void toleranceOptionsRejectBadValuesNamingTheField() {
        assertEquals("tolerance.resistorTolerance", assertThrows(StudyOptionsException.class,
                () -> ToleranceOptions.defaults().withResistorTolerance(1.5)).field());
        assertEquals("tolerance.resistorTolerance", assertThrows(StudyOptionsException.class,
                () -> ToleranceOptions.defaults().withResistorTolerance(-0.01)).field());
        assertEquals("tolerance.resistorTolerance", assertThrows(StudyOptionsException.class,
                () -> ToleranceOptions.defaults().withResistorTolerance(1.0)).field());
        assertEquals("tolerance.resistorTempcoPpmPerKelvin", assertThrows(StudyOptionsException.class,
                () -> ToleranceOptions.defaults().withTempco(-5, 0, 50)).field());
        assertEquals("tolerance.maxTemperatureCelsius", assertThrows(StudyOptionsException.class,
                () -> ToleranceOptions.defaults().withTempco(100, 50, 0)).field());
    }

    @Test
    void temperatureDriftWidensTheSpreadByTheTempcoTimesTheLargestExcursion() {
        // Each resistor's coefficient within ±α, board from 25 °C to 125 °C: drift ±α·100 K on each
        // resistor, so the corners are as for a tolerance of α·100 K (closed form as above).
        double alpha = 200;
        double t = alpha * 1e-6 * 100;
        ToleranceOptions opts = ToleranceOptions.resistorsOnly(0).withTempco(alpha, 25, 125);
        Design d = StudyDesigns.divider(StudyDesigns.tenVolts(0), RA, RB);
        StageWorstCase f = WorstCase.run(d, opts).opAmp("follower").orElseThrow();
        double max = VS * RB * (1 + t) / (RA * (1 - t) + RB * (1 + t));
        double min = VS * RB * (1 - t) / (RA * (1 + t) + RB * (1 - t));
        assertEquals(max, f.maxQuiescentVolts(), 1e-3);
        assertEquals(min, f.minQuiescentVolts(), 1e-3);
    }
}
