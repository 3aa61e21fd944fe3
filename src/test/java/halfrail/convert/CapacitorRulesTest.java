package halfrail.convert;

import halfrail.design.CapacitorSpec;
import halfrail.design.CellPack;
import halfrail.design.Supply;
import halfrail.parts.CapacitorTechnology;
import halfrail.parts.PartsLibrary;
import halfrail.units.ESeries;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class CapacitorRulesTest {
    private static final Supply NINE_VOLT = new CellPack("alkaline-9v-block", 1);
    private static final double DRIFT = 0.1;

    @Test
    void smallValuesAreClassOneCeramicRoundedUpInE12() {
        CapacitorSpec c = CapacitorRules.choose(3.0e-9, CapacitorRules.Position.INPUT, 100e3, NINE_VOLT, DRIFT).spec();
        assertEquals(CapacitorTechnology.CERAMIC_CLASS_1, c.technology());
        assertEquals(3.3e-9, c.farads(), 1e-21, "E12 (IEC 60063): the next value above 3.0 is 3.3");
    }

    @Test
    void mediumValuesAreFilm() {
        CapacitorSpec c = CapacitorRules.choose(0.2e-6, CapacitorRules.Position.INPUT, 100e3, NINE_VOLT, DRIFT).spec();
        assertEquals(CapacitorTechnology.POLYESTER_FILM, c.technology());
        assertEquals(0.22e-6, c.farads(), 1e-18);
    }

    @Test
    @DisplayName("a large output capacitor into a low-resistance load is an electrolytic: 3 µA floor × 600 Ω is harmless (IEC 60384-4 limit)")
    void largeHarmlessSpotsGetAnElectrolyticInE6() {
        CapacitorSpec c = CapacitorRules.choose(30e-6, CapacitorRules.Position.OUTPUT, 600, NINE_VOLT, DRIFT).spec();
        assertEquals(CapacitorTechnology.ALUMINIUM_ELECTROLYTIC, c.technology());
        assertEquals(33e-6, c.farads(), 1e-15);
        assertTrue(ESeries.E6.contains(c.farads()));
    }

    @Test
    @DisplayName("an electrolytic's limit leakage (at least 3 µA, IEC 60384-4) through 100 kΩ would move the bias 0.3 V: not there")
    void largeLeakySpotsAvoidElectrolytics() {
        CapacitorSpec c = CapacitorRules.choose(30e-6, CapacitorRules.Position.REFERENCE, 100e3, NINE_VOLT, DRIFT).spec();
        assertTrue(!c.technology().equals(CapacitorTechnology.ALUMINIUM_ELECTROLYTIC), c.toString());
    }

    @Test
    void theFeedbackLegIsFilmWhateverItsSize() {
        CapacitorSpec c = CapacitorRules.choose(50e-6, CapacitorRules.Position.LEG, 10, NINE_VOLT, DRIFT).spec();
        assertEquals(CapacitorTechnology.POLYESTER_FILM, c.technology());
    }

    @Test
    void theRatingIsTheSmallestStandardOneCoveringTheHighestSupplyAfterDerating() {
        CapacitorTechnology t = PartsLibrary.builtIn().requireCapacitorTechnology(CapacitorTechnology.TANTALUM);
        double rated = CapacitorRules.rating(t, 9.6);
        assertTrue(t.deratedVolts(rated) >= 9.6);
        int i = t.standardRatedVolts().indexOf(rated);
        assertTrue(i == 0 || t.deratedVolts(t.standardRatedVolts().get(i - 1)) < 9.6);
    }
}
