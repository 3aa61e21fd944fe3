package halfrail.check;

import halfrail.units.Quantities;
import halfrail.circuit.OpAmpParams;
import halfrail.design.AmplitudeUnit;
import halfrail.design.CapacitorSpec;
import halfrail.design.Design;
import halfrail.design.DesignCircuit;
import halfrail.design.DesignCircuits;
import halfrail.design.FixedRail;
import halfrail.design.Load;
import halfrail.design.OpAmpChoice;
import halfrail.design.Reference;
import halfrail.design.SignalSource;
import halfrail.design.Stage;
import halfrail.design.StageKind;
import halfrail.design.Thresholds;
import halfrail.parts.LeakageLevel;
import halfrail.parts.OpAmpArchetype;
import halfrail.parts.PartsLibrary;
import halfrail.solve.DcSolver;
import halfrail.solve.OperatingPoint;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;

import java.util.List;

import static halfrail.check.TestDesigns.electrolytic;
import static halfrail.check.TestDesigns.film;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The stage templates' results against hand formulas worked out independently of the engine. */
class TemplateFormulaTest {
    static final String PART = OpAmpArchetype.SINGLE_SUPPLY_BIPOLAR;

    static OpAmpParams part() {
        return PartsLibrary.builtIn().opAmpArchetype(PART).orElseThrow().typical();
    }

    /** Current into the + pin, A: Ib + Ios/2 (the circuit model's convention, see OpAmpParams). */
    static double plusPinAmps() {
        return part().biasAmps() + part().offsetCurrentAmps() / 2;
    }

    static FixedRail rail(double volts) {
        return new FixedRail(volts, 0, 0, 0, 0);
    }

    static Design design(Reference ref, List<Stage> stages, Load load) {
        return new Design("formula", "", rail(9), ref, stages, new SignalSource(0.1, AmplitudeUnit.VOLTS_PEAK, 1e3, 20, 20e3),
                load, Thresholds.defaults(), 1e-3);
    }

    static Stage nonInverting(double r2, double r1, CapacitorSpec leg, CapacitorSpec in) {
        return new Stage("s", StageKind.NON_INVERTING, OpAmpChoice.archetype(PART), r2, r1, leg, in);
    }

    static OperatingPoint leakFree(Design d) {
        DesignCircuit c = DesignCircuits.build(d, 9, LeakageLevel.NONE);
        return DcSolver.operatingPoint(c.circuit());
    }

    /** The report of {@code d}, checked to hold finite numbers only. */
    static DesignReport analysed(Design d, boolean withPowerOn) {
        DesignReport r = DesignAnalysis.analyse(d, withPowerOn);
        ReportAssertions.assertAllFinite(r);
        return r;
    }

    static DesignReport analysed(Design d) {
        return analysed(d, true);
    }

    static double parallel(double a, double b) {
        return a * b / (a + b);
    }

    @Test
    void aDecoupledDividerWithBiasCurrentSitsAtTheTheveninVoltageLessIbTimesTheResistanceBehindThePin() {
        double ra = 150e3;
        double rb = 100e3;
        double rbias = 1e6;
        Design d = design(Reference.decoupled(ra, rb, film(10e-6), rbias), List.of(nonInverting(47e3, 4.7e3, film(10e-6),
                film(1e-6))), new Load(10e3, 0, film(4.7e-6)));
        OperatingPoint op = leakFree(d);
        // Thevenin: V·Rb/(Ra+Rb) behind Ra‖Rb; the + pin's current I flows through Ra‖Rb + Rbias
        // (superposition, any circuits text). The single-supply part's PNP input draws it out of the pin.
        double vth = 9 * rb / (ra + rb);
        double i = plusPinAmps();
        assertEquals(vth - i * parallel(ra, rb), op.voltage("ref"), 1e-6);
        assertEquals(vth - i * (parallel(ra, rb) + rbias), op.voltage("s1.p"), 1e-6);
        assertTrue(op.voltage("s1.p") > vth + 0.04, "42.5 nA out of the pin through 1.06 MΩ raises it by 45 mV");
    }

    @Test
    void aDirectDividerCarriesThePinCurrentThroughRaParallelRbOnly() {
        double ra = 150e3;
        double rb = 100e3;
        Design d = design(Reference.direct(ra, rb), List.of(nonInverting(47e3, 4.7e3, film(10e-6), film(1e-6))),
                new Load(10e3, 0, film(4.7e-6)));
        OperatingPoint op = leakFree(d);
        // The stage's + input is the divider node itself.
        DesignCircuit c = DesignCircuits.build(d, 9, LeakageLevel.NONE);
        assertEquals("ref", c.stages().get(0).inPlus());
        assertEquals(9 * rb / (ra + rb) - plusPinAmps() * parallel(ra, rb), op.voltage("ref"), 1e-6);
    }

    @Test
    void aBufferedReferenceAddsOnlyTheBuffersOffsetAndTheDropAcrossIsolationAndBiasResistors() {
        double ra = 150e3;
        double rb = 100e3;
        double riso = 1e3;
        double rbias = 100e3;
        Reference ref = Reference.buffered(ra, rb, film(10e-6), rbias, OpAmpChoice.archetype(PART), riso, film(10e-6));
        Design d = design(ref, List.of(nonInverting(47e3, 4.7e3, film(10e-6), film(1e-6))), new Load(10e3, 0, film(4.7e-6)));
        OperatingPoint op = leakFree(d);
        double vref = 9 * rb / (ra + rb) - plusPinAmps() * parallel(ra, rb);
        // Follower: out = A·(V+ − out + Vos) → out = (V+ + Vos)·A/(1 + A).
        double a = part().openLoopGain();
        double buffered = (vref + part().offsetVolts()) * a / (1 + a);
        assertEquals(vref, op.voltage("ref"), 1e-6);
        assertEquals(buffered, op.voltage("refb"), 1e-5);
        assertEquals(buffered - plusPinAmps() * (riso + rbias), op.voltage("s1.p"), 1e-5);
    }

    @Test
    void leakageOfTheFeedbackLegCapacitorShiftsTheOutputByTheLeakCurrentTimesR2() {
        double r2 = 1e6;
        double r1 = 100e3;
        CapacitorSpec leg = electrolytic(10e-6, 16);
        Design d = design(Reference.decoupled(150e3, 100e3, film(10e-6), 100e3), List.of(nonInverting(r2, r1, leg,
                film(1e-6))), new Load(10e3, 0, film(4.7e-6)));
        DesignReport r = analysed(d, false);
        StageReport s = r.stages().get(0);
        // IEC 60384-4 limit (from memory and secondary sources): I = max(0.01·C·U_R, 3 µA) =
        // max(0.01 × 10 µF × 16 V = 1.6 µA, 3 µA) = 3 µA at 16 V, taken as the conductance G = 3 µA / 16 V.
        double g = Math.max(0.01 * 10 * 16, 3) * 1e-6 / 16;
        // Closed form: with V− held at V+ by the loop, the leak current i = G·V_leg flows in through R2
        // and R1 in series: V_leg = V+ − i·R1, so i = G·V+/(1 + G·R1); the output rises by i·R2.
        double vPlus = s.inPlusVolts();
        double i = g * vPlus / (1 + g * r1);
        assertEquals(i * r2, s.leakageDriftByCapacitor().get("CLEG1"), i * r2 * 0.005);
        // About 0.66 V: I_leak·R2 at the leg's working voltage (common practice warns of exactly this).
        assertEquals(0.66, s.leakageDriftVolts(), 0.02);
    }

    static CapacitorReport capacitor(DesignReport r, String element) {
        return r.capacitors().stream().filter(c -> c.element().equals(element)).findFirst().orElseThrow();
    }

    static double corner(double ohms, double farads) {
        return 1 / (2 * Math.PI * ohms * farads);
    }

    @Test
    void eachCapacitorReportsTheCornerOfItsOwnNetwork() {
        double rs = 1e3;
        double rbias = 100e3;
        Design d = design(Reference.decoupled(150e3, 100e3, film(10e-6), rbias), List.of(nonInverting(47e3, 4.7e3,
                film(10e-6), film(1e-6))), new Load(10e3, 0, film(4.7e-6)));
        DesignReport r = analysed(d, false);
        // f = 1/(2πRC) (Horowitz & Hill, The Art of Electronics, 3rd ed., ch. 1), with R the resistance
        // the capacitor sees when the other capacitors are short in the band (short-circuit time constants).
        assertEquals(corner(rs + rbias, 1e-6), capacitor(r, "CIN1").cornerHz().getAsDouble(), corner(rs + rbias, 1e-6) * 0.01);
        assertEquals(corner(4.7e3, 10e-6), capacitor(r, "CLEG1").cornerHz().getAsDouble(), corner(4.7e3, 10e-6) * 0.01);
        // Output: closed-loop output resistance (ohms over the loop gain) plus the load.
        assertEquals(corner(10e3, 4.7e-6), capacitor(r, "COUT").cornerHz().getAsDouble(), corner(10e3, 4.7e-6) * 0.01);
    }

    @Test
    void theInputCapacitorOfADirectReferenceSeesTheDividerAndOfAnInvertingStageSeesR1() {
        Design direct = design(Reference.direct(150e3, 100e3), List.of(nonInverting(47e3, 4.7e3, film(10e-6),
                film(1e-6))), new Load(10e3, 0, film(4.7e-6)));
        DesignReport r = analysed(direct, false);
        double expected = corner(1e3 + parallel(150e3, 100e3), 1e-6);
        assertEquals(expected, capacitor(r, "CIN1").cornerHz().getAsDouble(), expected * 0.01);

        Stage inv = new Stage("inv", StageKind.INVERTING, OpAmpChoice.archetype(PART), 100e3, 10e3, null, film(1e-6));
        DesignReport ri = analysed(design(Reference.decoupled(150e3, 100e3, film(10e-6), 100e3),
                List.of(inv), new Load(10e3, 0, film(4.7e-6))), false);
        // The inverting input is a virtual ground: the input capacitor sees Rs + R1.
        double inverting = corner(1e3 + 10e3, 1e-6);
        assertEquals(inverting, capacitor(ri, "CIN1").cornerHz().getAsDouble(), inverting * 0.01);
    }

    @Test
    void twoEqualCornersGiveAChainCornerFromTheComplexResponseAboveEitherOfThem() {
        // A follower between an input network (1 kΩ + 100 kΩ, 100 nF) and an output network
        // (10 kΩ, 1.01 µF): two buffered first-order high-passes with the same corner f0.
        Stage follower = new Stage("buf", StageKind.FOLLOWER, OpAmpChoice.archetype(PART), 0, 0, null, film(100e-9));
        Design d = design(Reference.decoupled(150e3, 100e3, film(10e-6), 100e3), List.of(follower),
                new Load(10e3, 0, film(1.01e-6)));
        DesignReport r = analysed(d, false);
        double f0 = corner(101e3, 100e-9);
        assertEquals(f0, capacitor(r, "CIN1").cornerHz().getAsDouble(), f0 * 0.01);
        assertEquals(f0, capacitor(r, "COUT").cornerHz().getAsDouble(), f0 * 0.01);
        // Two identical buffered first-order poles: combined −3 dB point at f0/0.6436 (exact:
        // (x²/(1+x²))² = 1/2 gives x = 1/√(√2 − 1) = 1.5538).
        double chain = r.chain().orElseThrow().lowerCornerHz().getAsDouble();
        assertEquals(f0 / Math.sqrt(Math.sqrt(2) - 1), chain, f0 * 0.02);
        assertTrue(chain > Math.max(capacitor(r, "CIN1").cornerHz().getAsDouble(), capacitor(r, "COUT").cornerHz().getAsDouble()));
    }

    @Test
    void aReferenceThatDominatesSettlesInTauTimesTheLogOfStepOverBand() {
        // Decoupled 100k/100k divider with 10 µF: τ = (Ra‖Rb)·C = 50 kΩ × 10 µF = 0.5 s. A follower
        // with a small input network (10 kΩ, 10 nF: 0.1 ms) and a DC-coupled load follows it.
        Stage follower = new Stage("buf", StageKind.FOLLOWER, OpAmpChoice.archetype(PART), 0, 0, null, film(10e-9));
        Design d = new Design("settle", "", rail(9), Reference.decoupled(100e3, 100e3, film(10e-6), 10e3),
                List.of(follower), new SignalSource(0.1, AmplitudeUnit.VOLTS_PEAK, 1e3, 20, 20e3),
                new Load(10e3, 0, null), Thresholds.defaults(), 1e-6);
        DesignReport r = analysed(d);
        PowerOnReport p = r.powerOn().orElseThrow();
        double tau = 50e3 * 10e-6;
        double finalOut = r.stages().get(0).outputVolts();
        // e^(−t/τ)·ΔV = band → t = τ·ln(ΔV/band) (exact); ΔV the output's full rise from 0 V, band 1 % of 9 V.
        double expected = tau * Math.log(finalOut / p.bandVolts());
        assertEquals(0.09, p.bandVolts(), 1e-12);
        assertTrue(p.settled());
        assertEquals(expected, p.settleSeconds().getAsDouble(), expected * 0.03);
    }

    static Design rippleDesign(Reference ref) {
        FixedRail rippled = new FixedRail(9, 0, 0.05, 100, 0);
        return new Design("ripple", "", rippled, ref, List.of(nonInverting(47e3, 4.7e3, film(10e-6), film(1e-6))),
                new SignalSource(0.1, AmplitudeUnit.VOLTS_PEAK, 1e3, 20, 20e3), new Load(10e3, 0, film(4.7e-6)),
                Thresholds.defaults(), 1e-3);
    }

    @Test
    void aDirectDividerPassesSupplyRippleAmplifiedByTheStageAndADecoupledOneDoesNot() {
        double ra = 150e3;
        double rb = 100e3;
        DesignReport direct = analysed(rippleDesign(Reference.direct(ra, rb)), false);
        // Hand formula at 100 Hz (complex, any circuits text): Thevenin ripple r·Rb/(Ra+Rb) behind Ra‖Rb,
        // loaded by the input network Rs + 1/(jωCin) to the source's ground; then the stage's gain
        // 1 + R2/(R1 + 1/(jωCleg)); then the output network RL/(RL + 1/(jωCout)). The supply source has no AC
        // magnitude of its own: the engine's response is per unit of whichever source is named.
        double w = 2 * Math.PI * 100;
        Complex zin = new Complex(1e3, -1 / (w * 1e-6));
        Complex vref = zin.divide(zin.add(parallel(ra, rb))).multiply(rb / (ra + rb));
        Complex gain = new Complex(1).add(new Complex(47e3).divide(new Complex(4.7e3, -1 / (w * 10e-6))));
        Complex out = new Complex(10e3).divide(new Complex(10e3, -1 / (w * 4.7e-6)));
        double expected = vref.multiply(gain).multiply(out).abs();
        ChainReport ch = direct.chain().orElseThrow();
        assertEquals(expected, ch.rippleGain(), expected * 0.02);
        assertEquals(0.05 * ch.rippleGain(), ch.rippleAtLoadVolts(), 1e-15);
        Finding f = FindingCatalogueTest.only(direct, Ripple.CODE);
        assertEquals(Severity.WARN, f.severity());
        assertEquals(List.of("reference"), f.parts());
        FindingCatalogueTest.assertCarries(f, Quantities.volts(ch.rippleAtLoadVolts()), Quantities.volts(0.05), Quantities.hertz(100));
        assertTrue(f.suggestion().contains("decouple"), f.suggestion());

        DesignReport decoupled = analysed(rippleDesign(Reference.decoupled(ra, rb, film(10e-6), 100e3)),
                false);
        assertTrue(decoupled.findings(Ripple.CODE).isEmpty(), decoupled.findings()::toString);
        assertTrue(decoupled.chain().orElseThrow().rippleGain() < ch.rippleGain() / 100);
        // The healthy design (a battery) has no ripple to pass.
        assertTrue(analysed(TestDesigns.healthyNineVolt(), false).findings(Ripple.CODE).isEmpty());
    }
}
