package halfrail.parts;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.DoubleRange;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** voltsAt and fractionUsedAt are inverse functions on every built-in curve (exact for piecewise-linear curves). */
class DischargeCurvePropertiesTest {

    @Provide
    Arbitrary<CellChemistry> chemistries() {
        return Arbitraries.of(PartsLibrary.builtIn().cellChemistries());
    }

    @Property(seed = "77859756106822")
    void fractionUsedAtUndoesVoltsAt(@ForAll("chemistries") CellChemistry c,
                                     @ForAll @DoubleRange(min = 0, max = 1) double fraction) {
        assertEquals(fraction, c.fractionUsedAt(c.voltsAt(fraction)), 1e-9, c.id());
    }

    @Property(seed = "133849364824864")
    void voltsAtUndoesFractionUsedAt(@ForAll("chemistries") CellChemistry c,
                                     @ForAll @DoubleRange(min = 0, max = 1) double t) {
        double volts = c.endPointVolts() + t * (c.freshVolts() - c.endPointVolts());
        assertEquals(volts, c.voltsAt(c.fractionUsedAt(volts)), 1e-9, c.id());
    }

    @Property(seed = "107839876608060")
    void moreChargeUsedMeansLowerVoltage(@ForAll("chemistries") CellChemistry c,
                                         @ForAll @DoubleRange(min = 0, max = 1) double a,
                                         @ForAll @DoubleRange(min = 0, max = 1) double b) {
        if (a < b) {
            assertTrue(c.voltsAt(a) > c.voltsAt(b), c.id());
        }
    }
}
