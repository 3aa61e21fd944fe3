package halfrail.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** The shared field rules: the boundaries and that the layer's own exception, with the path, is thrown. */
class FieldRulesTest {
    static final class Refused extends RuntimeException {
        final String path;

        Refused(String path, String message) {
            super(path + ": " + message);
            this.path = path;
        }
    }

    private final FieldRules rules = new FieldRules(Refused::new);

    @Test
    void positiveRefusesZeroNegativeAndNonFinite() {
        assertEquals(1e-12, rules.positive("a", 1e-12, "F"));
        for (double bad : new double[] {0, -1, Double.NaN, Double.POSITIVE_INFINITY}) {
            Refused r = assertThrows(Refused.class, () -> rules.positive("stages[0].r1Ohms", bad, "Ω"));
            assertEquals("stages[0].r1Ohms", r.path);
            assertTrue(r.getMessage().contains("positive value in Ω"), r.getMessage());
        }
    }

    @Test
    void nonNegativeTakesZero() {
        assertEquals(0.0, rules.nonNegative("a", 0, "V"));
        assertThrows(Refused.class, () -> rules.nonNegative("a", -1e-30, "V"));
        assertThrows(Refused.class, () -> rules.nonNegative("a", Double.NaN, "V"));
    }

    @Test
    void finiteTakesAnySign() {
        assertEquals(-3.0, rules.finite("a", -3, "V"));
        assertThrows(Refused.class, () -> rules.finite("a", Double.NEGATIVE_INFINITY, "V"));
    }

    @Test
    void fractionIncludesBothEnds() {
        assertEquals(0.0, rules.fraction("a", 0));
        assertEquals(1.0, rules.fraction("a", 1));
        assertThrows(Refused.class, () -> rules.fraction("a", 1.0000001));
        assertThrows(Refused.class, () -> rules.fraction("a", -0.1));
    }

    @Test
    void toleranceStopsBelowOneHundredPercent() {
        assertEquals(0.999, rules.tolerance("t", 0.999));
        Refused r = assertThrows(Refused.class, () -> rules.tolerance("t", 1));
        assertTrue(r.getMessage().contains("100 %"), r.getMessage());
        assertThrows(Refused.class, () -> rules.tolerance("t", -0.01));
    }

    @Test
    void atLeastAndRequired() {
        assertEquals(1, rules.atLeast("n", 1, 1));
        assertThrows(Refused.class, () -> rules.atLeast("n", 0, 1));
        assertEquals("x", rules.required("r", "x"));
        Refused r = assertThrows(Refused.class, () -> rules.required("supply", null));
        assertEquals("supply: is required", r.getMessage());
    }

    @Test
    void aFailureIsRequired() {
        assertThrows(IllegalArgumentException.class, () -> new FieldRules(null));
    }
}
