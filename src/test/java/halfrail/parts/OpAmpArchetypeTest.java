package halfrail.parts;

import halfrail.circuit.OpAmpParams;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;
import java.util.regex.Pattern;

import static org.junit.jupiter.api.Assertions.assertAll;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class OpAmpArchetypeTest {
    private static final PartsLibrary PARTS = PartsLibrary.builtIn();

    private static OpAmpParams typical(String id) {
        return PARTS.requireOpAmpArchetype(id).typical();
    }

    @Test
    void theLibraryHoldsTheFiveArchetypes() {
        assertEquals(List.of(OpAmpArchetype.CLASSIC_BIPOLAR_DUAL_SUPPLY, OpAmpArchetype.SINGLE_SUPPLY_BIPOLAR,
                        OpAmpArchetype.JFET_INPUT_AUDIO, OpAmpArchetype.CMOS_RRIO_LOW_VOLTAGE, OpAmpArchetype.MICROPOWER),
                PARTS.opAmpArchetypes().stream().map(OpAmpArchetype::id).toList());
    }

    @Test
    void everyArchetypeHasValidParametersWithFiniteSupplyRangesAndSpreadCoveringTypical() {
        for (OpAmpArchetype a : PARTS.opAmpArchetypes()) {
            OpAmpParams p = a.typical();
            // Re-running the circuit layer's own validation on the loaded values.
            OpAmpParams copy = new OpAmpParams(p.openLoopGain(), p.gainBandwidthHz(), p.slewRateVoltsPerSecond(),
                    p.offsetVolts(), p.biasAmps(), p.offsetCurrentAmps(), p.commonModeLowVolts(),
                    p.commonModeHighVolts(), p.swingLowVolts(), p.swingHighVolts(), p.outputOhms(),
                    p.quiescentAmps(), p.supplyMinVolts(), p.supplyMaxVolts());
            assertAll(a.id(),
                    () -> assertEquals(p, copy),
                    () -> assertTrue(Double.isFinite(p.supplyMaxVolts()) && p.supplyMinVolts() > 0),
                    () -> assertTrue(p.quiescentAmps() > 0),
                    () -> assertTrue(Math.abs(p.offsetVolts()) <= a.spread().offsetVoltsMax()),
                    () -> assertTrue(Math.abs(p.biasAmps()) <= a.spread().biasAmpsMax()),
                    () -> assertTrue(Math.abs(p.offsetCurrentAmps()) <= a.spread().offsetCurrentAmpsMax()),
                    () -> assertTrue(Math.abs(p.offsetCurrentAmps()) <= Math.abs(p.biasAmps()),
                            "offset current is a difference of bias currents, so no larger (common practice)"),
                    // The output must be able to move at the lowest supply: swing window not empty.
                    () -> assertTrue(p.swingLowVolts() + p.swingHighVolts() < p.supplyMinVolts()),
                    () -> assertTrue(p.commonModeLowVolts() + p.commonModeHighVolts() < p.supplyMinVolts()));
        }
    }

    @Test
    @DisplayName("classic bipolar part: output and inputs at least 1 V from each rail, 10 V or more supply (The Art of Electronics, 3rd ed., ch. 4, from memory)")
    void classicBipolarPartNeedsVoltsOfHeadroom() {
        OpAmpParams p = typical(OpAmpArchetype.CLASSIC_BIPOLAR_DUAL_SUPPLY);
        assertAll(
                () -> assertTrue(p.swingLowVolts() >= 1 && p.swingHighVolts() >= 1),
                () -> assertTrue(p.commonModeLowVolts() >= 1 && p.commonModeHighVolts() >= 1),
                () -> assertTrue(p.supplyMinVolts() >= 10));
    }

    @Test
    @DisplayName("single-supply bipolar part: inputs reach V−, output within 50 mV of it, 3–32 V supply (common practice, from memory)")
    void singleSupplyBipolarPartReachesGround() {
        OpAmpParams p = typical(OpAmpArchetype.SINGLE_SUPPLY_BIPOLAR);
        assertAll(
                () -> assertTrue(p.commonModeLowVolts() <= 0),
                () -> assertTrue(p.swingLowVolts() <= 0.05),
                () -> assertTrue(p.swingHighVolts() >= 1, "but not the positive rail"),
                () -> assertEquals(3, p.supplyMinVolts()),
                () -> assertEquals(32, p.supplyMaxVolts()));
    }

    @Test
    @DisplayName("JFET-input audio part: inputs stop at least 2 V above V−, bias current in picoamps (common practice, from memory)")
    void jfetInputsDoNotReachTheNegativeRail() {
        OpAmpParams p = typical(OpAmpArchetype.JFET_INPUT_AUDIO);
        assertAll(
                () -> assertTrue(p.commonModeLowVolts() >= 2),
                () -> assertTrue(Math.abs(p.biasAmps()) < 1e-9),
                () -> assertTrue(p.swingLowVolts() >= 1 && p.swingHighVolts() >= 1));
    }

    @Test
    @DisplayName("CMOS rail-to-rail part: output within 0.1 V of both rails, inputs to both rails, 1.8–5.5 V (common practice)")
    void cmosRailToRailPartSwingsWithinATenthOfAVolt() {
        OpAmpParams p = typical(OpAmpArchetype.CMOS_RRIO_LOW_VOLTAGE);
        assertAll(
                () -> assertTrue(p.swingLowVolts() < 0.1 && p.swingHighVolts() < 0.1),
                () -> assertTrue(p.commonModeLowVolts() <= 0 && p.commonModeHighVolts() <= 0),
                () -> assertEquals(1.8, p.supplyMinVolts()),
                () -> assertEquals(5.5, p.supplyMaxVolts()),
                () -> assertTrue(Math.abs(p.biasAmps()) < 1e-9));
    }

    @Test
    @DisplayName("micropower part: supply current below 10 µA, gain-bandwidth about 10 kHz, slow slew (common practice, from memory)")
    void micropowerPartDrawsMicroamps() {
        OpAmpParams p = typical(OpAmpArchetype.MICROPOWER);
        assertAll(
                () -> assertTrue(p.quiescentAmps() < 10e-6),
                () -> assertTrue(p.gainBandwidthHz() <= 20e3),
                () -> assertTrue(p.slewRateVoltsPerSecond() < 0.1e6, "slower than 0.1 V/µs"));
        for (OpAmpArchetype other : PARTS.opAmpArchetypes()) {
            if (!other.id().equals(OpAmpArchetype.MICROPOWER)) {
                assertTrue(other.typical().quiescentAmps() > 10 * p.quiescentAmps(), other.id());
            }
        }
    }

    @Test
    @DisplayName("output headroom grows with load current in either direction (rail-to-rail outputs: common practice)")
    void headroomGrowsWithLoadCurrent() {
        OpAmpArchetype a = PARTS.requireOpAmpArchetype(OpAmpArchetype.CMOS_RRIO_LOW_VOLTAGE);
        double k = a.spread().swingHeadroomVoltsPerAmp();
        assertEquals(a.typical().swingLowVolts(), a.swingLowVoltsAt(0));
        assertEquals(a.typical().swingHighVolts() + k * 2e-3, a.swingHighVoltsAt(2e-3), 1e-15);
        assertEquals(a.typical().swingLowVolts() + k * 2e-3, a.swingLowVoltsAt(-2e-3), 1e-15);
        OpAmpParams loaded = a.typicalAtLoad(1e-3);
        assertTrue(loaded.swingLowVolts() > a.typical().swingLowVolts());
        assertTrue(loaded.swingHighVolts() > a.typical().swingHighVolts());
        assertEquals(a.typical().withSwing(loaded.swingLowVolts(), loaded.swingHighVolts()), loaded);
    }

    @Test
    void textsNameNoPartNumbersAndEveryArchetypeSaysItIsRepresentative() {
        // Rules: archetypes are described by parameters only. A part number looks like letters followed by digits.
        Pattern partNumber = Pattern.compile("\\b[A-Z]{1,4}-?\\d{2,}[A-Z]*\\b");
        for (OpAmpArchetype a : PARTS.opAmpArchetypes()) {
            List<String> texts = new java.util.ArrayList<>(List.of(a.displayName(), a.description()));
            texts.addAll(a.basis().values());
            for (String text : texts) {
                assertFalse(partNumber.matcher(text).find(), a.id() + ": " + text);
            }
            assertTrue(a.description().endsWith(".") && a.description().indexOf(". ") < 0,
                    a.id() + ": one sentence");
            Map<String, String> basis = a.basis();
            assertTrue(basis.get("typical").contains("common practice") || basis.get("typical").contains("from memory"));
        }
    }

    @Test
    void anArchetypeWhoseTypicalOffsetExceedsItsMaximumIsRejected() {
        OpAmpParams p = OpAmpParams.defaults().withInputErrors(5e-3, 0, 0).withSupplyRange(3, 5);
        PartsException e = assertThrows(PartsException.class, () -> new OpAmpArchetype("x", "X", "An x.", p,
                new OpAmpSpread(1e-3, 0, 0, 0), Map.of("typical", "t", "spread", "s")));
        assertEquals(PartsException.Kind.BAD_VALUE, e.kind());
    }
}
