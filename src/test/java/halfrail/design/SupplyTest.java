package halfrail.design;

import halfrail.parts.CellChemistry;
import halfrail.parts.PartsLibrary;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class SupplyTest {
    /**
     * Per unit (one cell, or a block) fresh / nominal / end-point volts as published, times the
     * number of units in series. Sources: alkaline AA 1.6 / 1.5 / 0.9 V and the 9 V block as six
     * such cells, 9.6 / 9.0 / 5.4 V (IEC 60086-2 via secondary sources); NiMH 1.2 V nominal, end about
     * 1.0 V (common practice); Li-ion 4.2 V full, 3.6–3.7 V nominal, cut-off 2.5–3.0 V; LiFePO4 3.65 V
     * full, 3.2 V nominal, 2.0–2.5 V cut-off (common practice; the cell maker's limits govern). The
     * NiMH fresh value 1.4 V is the library's own choice (off charge; common practice).
     */
    @ParameterizedTest(name = "{1} × {0}: {2} V fresh, {3} V nominal, {4} V end-point per unit")
    @CsvSource({
            "alkaline-aa,       1, 1.6,  1.5, 0.9",
            "alkaline-aa,       2, 1.6,  1.5, 0.9",
            "alkaline-aa,       4, 1.6,  1.5, 0.9",
            "alkaline-9v-block, 1, 9.6,  9.0, 5.4",
            "alkaline-9v-block, 2, 9.6,  9.0, 5.4",
            "nimh-aa,           4, 1.4,  1.2, 1.0",
            "li-ion,            1, 4.2,  3.7, 3.0",
            "li-ion,            2, 4.2,  3.7, 3.0",
            "lifepo4,           1, 3.65, 3.2, 2.5",
            "lifepo4,           4, 3.65, 3.2, 2.5"})
    void aCellPackSpansItsUnitsVoltagesTimesTheCount(String chemistry, int count, double fresh, double nominal,
                                                     double end) {
        CellPack p = new CellPack(chemistry, count);
        assertEquals(count * fresh, p.highVolts(), 1e-9);
        assertEquals(count * nominal, p.nominalVolts(), 1e-9);
        assertEquals(count * end, p.lowVolts(), 1e-9);
        CellChemistry c = p.data();
        // Cells in series add their resistance; the capacity (A·h) stays that of one unit.
        assertEquals(count * c.cellsPerUnit() * c.internalOhms(), p.internalOhms(), 1e-12);
        assertEquals(c.capacityAmpHours(), p.capacityAmpHours().getAsDouble(), 1e-12);
        assertEquals(0, p.rippleVoltsPeak());
        assertTrue(p.safetyNote().contains("cell maker"), p.safetyNote());
    }

    @Test
    void everyChemistryInTheLibraryMakesACellPackFromItsOwnData() {
        for (CellChemistry c : PartsLibrary.builtIn().cellChemistries()) {
            for (int n = 1; n <= 3; n++) {
                CellPack p = new CellPack(c.id(), n);
                assertEquals(n * c.cellsPerUnit() * c.endPointVolts(), p.lowVolts(), 1e-9, c.id());
                assertEquals(n * c.cellsPerUnit() * c.freshVolts(), p.highVolts(), 1e-9, c.id());
                assertEquals(n * c.cellsPerUnit() * c.nominalVolts(), p.nominalVolts(), 1e-9, c.id());
                assertTrue(p.lowVolts() < p.nominalVolts() && p.nominalVolts() <= p.highVolts());
            }
        }
    }

    @Test
    void lithiumPacksCarryTheProtectionCaution() {
        assertTrue(new CellPack(CellChemistry.LI_ION, 1).safetyNote().contains("protection"));
        assertTrue(new CellPack(CellChemistry.LIFEPO4, 1).safetyNote().contains("protection"));
    }

    @Test
    void aFixedRailSpansItsTolerance() {
        FixedRail r = new FixedRail(12, 0.05, 0.02, 100, 0.5);
        assertEquals(12, r.nominalVolts());
        assertEquals(12.6, r.highVolts(), 1e-12);
        assertEquals(11.4, r.lowVolts(), 1e-12);
        assertEquals(0.02, r.rippleVoltsPeak());
        assertEquals(100, r.rippleHz());
        assertEquals(0.5, r.internalOhms());
        assertFalse(r.capacityAmpHours().isPresent());
        assertTrue(r.safetyNote().contains("licensed"), r.safetyNote());
        FixedRail exact = new FixedRail(5, 0, 0, 0, 0);
        assertEquals(5, exact.lowVolts());
        assertEquals(5, exact.highVolts());
    }

    @Test
    void aUsbPortRunsFromTheLowPowerMinimumToTheTopOfThePortRange() {
        // USB 2.0 specification §7.2 (secondary sources): 4.75–5.25 V at the port; a low-power device
        // should work to about 4.4 V.
        UsbPort u = new UsbPort(0, 0);
        assertEquals(5.0, u.nominalVolts());
        assertEquals(5.25, u.highVolts());
        assertEquals(4.4, u.lowVolts());
        assertTrue(u.internalOhms() > 0);
        assertFalse(u.capacityAmpHours().isPresent());
    }

    @Test
    void anUnknownChemistryNamesTheFieldAndTheKnownIds() {
        CellPack p = new CellPack("zinc-air-9000", 2);
        DesignException e = assertThrows(DesignException.class, p::nominalVolts);
        assertEquals("supply.chemistry", e.path());
        for (CellChemistry c : PartsLibrary.builtIn().cellChemistries()) {
            assertTrue(e.getMessage().contains(c.id()), e.getMessage());
        }
        assertTrue(e.getMessage().contains("zinc-air-9000"));
    }
}
