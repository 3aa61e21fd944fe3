package halfrail.check;

import halfrail.design.CapacitorSpec;
import halfrail.design.Design;
import halfrail.design.DesignException;
import halfrail.design.FixedRail;
import halfrail.design.Reference;
import halfrail.design.Stage;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

import java.time.Duration;
import java.util.List;
import java.util.function.UnaryOperator;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Values far outside the usual range are analysed or refused with a reason — never an exception
 * escaping to the user, never a non-finite number shown as if valid. The time limit guards
 * against a hang; it is not a speed target.
 */
class PathologicalValuesTest {
    /** Longest an analysis of one of these designs may take before it counts as a hang, s. */
    private static final Duration HANG_LIMIT = Duration.ofSeconds(60);

    record Case(String name, UnaryOperator<Design> change) {
        @Override
        public String toString() {
            return name;
        }
    }

    static Stream<Case> cases() {
        return Stream.of(
                new Case("1 mΩ feedback leg resistor", d -> d.withStage(0, d.stages().get(0).withLegOhms(1e-3))),
                new Case("1 TΩ feedback resistor", d -> d.withStage(0, d.stages().get(0).withFeedbackOhms(1e12))),
                new Case("1 mΩ divider", d -> d.withReference(d.reference().withDivider(1e-3, 1e-3))),
                new Case("1 TΩ divider", d -> d.withReference(d.reference().withDivider(1e12, 1e12))),
                new Case("1 pF input coupling", d -> d.withStage(0,
                        d.stages().get(0).withInputCapacitor(new CapacitorSpec(1e-12, "ceramic-class-1", 50)))),
                new Case("10 F reference capacitor", d -> d.withReference(Reference.decoupled(
                        d.reference().upperOhms(), d.reference().lowerOhms(),
                        new CapacitorSpec(10, "aluminium-electrolytic", 16), d.reference().biasOhms()))),
                new Case("supply below the op-amp's minimum", d -> d.withSupply(new FixedRail(1.0, 0, 0, 0, 0))),
                new Case("1 pF feedback-leg capacitor", d -> d.withStage(0,
                        d.stages().get(0).withLegCapacitor(new CapacitorSpec(1e-12, "ceramic-class-1", 50)))));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("cases")
    @DisplayName("an extreme value is analysed with finite numbers or refused with a reason")
    void extremeValuesAreAnalysedOrRefused(Case c) {
        Design design;
        try {
            design = c.change().apply(TestDesigns.healthyNineVolt());
        } catch (DesignException e) {
            assertFalse(e.path().isEmpty(), "a refusal names the field");
            return;
        }
        DesignReport r = assertTimeoutPreemptively(HANG_LIMIT, () -> DesignAnalysis.analyse(design));
        ReportAssertions.assertAllFinite(r);
        if (r.failure().isPresent()) {
            assertTrue(r.stages().isEmpty(), "no numbers are shown for a circuit that could not be solved");
            assertTrue(r.has(Severity.FAIL), "the failure is a finding");
        } else {
            assertFalse(r.stages().isEmpty());
        }
        List<String> codes = r.findings().stream().map(Finding::code).toList();
        if (c.name().startsWith("supply below")) {
            assertTrue(codes.contains(SupplyAndRuntime.RANGE), codes.toString());
        }
    }

    private static DesignReport analysed(String name) {
        Case c = cases().filter(k -> k.name().equals(name)).findFirst().orElseThrow();
        return assertTimeoutPreemptively(HANG_LIMIT, () -> DesignAnalysis.analyse(c.change().apply(TestDesigns.healthyNineVolt())));
    }

    private static List<String> codes(DesignReport r) {
        return r.findings().stream().map(Finding::code).toList();
    }

    /** Every op-amp output rests between its own supply pins (0 V and the supply here). */
    private static void outputsBetweenTheRails(DesignReport r) {
        for (StageReport s : r.stages()) {
            double out = s.nominal().quiescentVolts();
            assertTrue(out >= -1e-6 && out <= s.nominal().supplyVolts() + 1e-6, s.label() + " rests at " + out + " V");
        }
        assertFalse(codes(r).contains(CapacitorVoltage.REVERSED), "no capacitor is reversed by an output below ground: "
                + codes(r));
    }

    @org.junit.jupiter.api.Test
    @DisplayName("1 mΩ leg resistor: the leg capacitor still sets DC gain 1, so the rest point stays on the reference; the AC gain clips")
    void aMilliohmLegKeepsTheRestPointAndClips() {
        DesignReport r = analysed("1 mΩ feedback leg resistor");
        // A capacitor in the leg makes the DC gain 1 (common practice: the blocking capacitor in the
        // feedback leg of a single-supply non-inverting stage): the output rests at its + input.
        StageReport s = r.stages().get(0);
        assertEquals(s.inPlusVolts(), s.nominal().quiescentVolts(), 0.05);
        assertTrue(codes(r).contains(Headroom.CLIPS), codes(r).toString());
    }

    @org.junit.jupiter.api.Test
    @DisplayName("1 TΩ feedback resistor: flagged as too high, and the bias current through it puts the stage on a rail")
    void aTeraohmFeedbackResistorIsFlaggedAndRestsOnARail() {
        DesignReport r = analysed("1 TΩ feedback resistor");
        List<String> codes = codes(r);
        assertTrue(codes.contains(CommonPractice.FEEDBACK), codes.toString());
        // 80 nA archetype bias current × 1 TΩ is far beyond any rail (Ohm's law).
        assertTrue(codes.contains(RestsOnRail.CODE), codes.toString());
        // Known limit of the model: the input bias current is an ideal source, with no input clamp,
        // so the inverting input is reported hundreds of volts high (COMMON_MODE says so) where a
        // real part's protection diodes would hold it near a rail.
        assertTrue(codes.contains(CommonMode.CODE), codes.toString());
    }

    @org.junit.jupiter.api.Test
    @DisplayName("1 mΩ divider: the battery collapses into it; the op-amp has no window and its output stays between its pins")
    void aMilliohmDividerCollapsesTheSupply() {
        DesignReport r = analysed("1 mΩ divider");
        assertTrue(codes(r).contains(RestsOnRail.CODE), codes(r).toString());
        outputsBetweenTheRails(r);
    }

    @org.junit.jupiter.api.Test
    @DisplayName("1 TΩ divider: the input bias currents, not the divider, set the rest point")
    void aTeraohmDividerIsRuledByBiasCurrents() {
        DesignReport r = analysed("1 TΩ divider");
        assertTrue(codes(r).contains(BiasShift.CODE), codes(r).toString());
    }

    @org.junit.jupiter.api.Test
    @DisplayName("1 pF input coupling: the high-pass corner lies far above the band's low end")
    void aPicofaradCouplingPutsTheCornerAboveTheBand() {
        DesignReport r = analysed("1 pF input coupling");
        assertTrue(codes(r).contains(Bandwidth.LOW_CORNER), codes(r).toString());
        // 1/(2π·100 kΩ·1 pF) = 1.6 MHz for the coupling capacitor into the 100 kΩ bias resistor
        // (first-order high-pass); the op-amp's own roll-off near GBW/11 ≈ 90 kHz caps the
        // passband, so the chain's lower corner lands far above 20 Hz, near the top of the range.
        assertTrue(r.chain().orElseThrow().lowerCornerHz().orElseThrow() > 10e3, r.chain().toString());
    }

    @org.junit.jupiter.api.Test
    @DisplayName("10 F reference capacitor: its leakage drags the reference down, and the report names it")
    void aTenFaradReferenceCapacitorLeaksTheReferenceAway() {
        DesignReport r = analysed("10 F reference capacitor");
        Finding drift = r.findings().stream().filter(f -> f.code().equals(LeakageDrift.CODE)).findFirst().orElseThrow();
        assertTrue(drift.message().contains("CREF"), drift.message());
        outputsBetweenTheRails(r);
    }

    @org.junit.jupiter.api.Test
    @DisplayName("supply below the op-amp's minimum: out of range, no window, the output between its pins")
    void aSupplyBelowTheMinimumIsOutOfRangeWithTheOutputBetweenThePins() {
        DesignReport r = analysed("supply below the op-amp's minimum");
        assertTrue(codes(r).contains(SupplyAndRuntime.RANGE), codes(r).toString());
        assertTrue(codes(r).contains(RestsOnRail.CODE), codes(r).toString());
        outputsBetweenTheRails(r);
    }

    @org.junit.jupiter.api.Test
    @DisplayName("1 pF leg capacitor: the leg is open across the band, so the stage is a follower (gain 1)")
    void aPicofaradLegCapacitorMakesAFollower() {
        DesignReport r = analysed("1 pF feedback-leg capacitor");
        // Non-inverting gain 1 + Zf/Zleg with |Zleg| = 1/(2π·20 kHz·1 pF) ≈ 8 MΩ against 47 kΩ: gain
        // about 1 over the band (non-inverting amplifier gain, any op-amp text); the healthy stage
        // has 1 + 47k/4k7 = 11.
        assertEquals(1.0, r.chain().orElseThrow().peakGain(), 0.1);
        assertEquals(11.0, DesignAnalysis.analyse(TestDesigns.healthyNineVolt(), false).chain().orElseThrow().peakGain(),
                0.6);
    }
}
