package halfrail.parts;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertAll;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class CellChemistryTest {
    private static final PartsLibrary PARTS = PartsLibrary.builtIn();

    private static CellChemistry cell(String id) {
        return PARTS.requireCellChemistry(id);
    }

    @Test
    void theLibraryHoldsTheFiveChemistries() {
        assertEquals(List.of(CellChemistry.ALKALINE_AA, CellChemistry.ALKALINE_9V_BLOCK, CellChemistry.NIMH_AA,
                        CellChemistry.LI_ION, CellChemistry.LIFEPO4),
                PARTS.cellChemistries().stream().map(CellChemistry::id).toList());
    }

    @Test
    void dischargeCurvesFallMonotonicallyFromFreshToEndPoint() {
        for (CellChemistry c : PARTS.cellChemistries()) {
            List<DischargePoint> curve = c.dischargeCurve();
            assertAll(c.id(),
                    () -> assertTrue(curve.size() >= 10, "about ten points"),
                    () -> assertEquals(c.freshVolts(), c.voltsAt(0)),
                    () -> assertEquals(c.endPointVolts(), c.voltsAt(1)),
                    () -> assertTrue(c.nominalVolts() < c.freshVolts() && c.nominalVolts() > c.endPointVolts()));
            double previous = Double.POSITIVE_INFINITY;
            for (int i = 0; i <= 1000; i++) {
                double v = c.voltsAt(i / 1000.0);
                assertTrue(v < previous, c.id() + " at " + i / 1000.0);
                previous = v;
            }
        }
    }

    @Test
    @DisplayName("alkaline AA: 1.5 V nominal, 1.6 V fresh, 0.9 V end-point (IEC 60086-2 via secondary sources); about 2 A·h (from memory)")
    void alkalineAaFigures() {
        CellChemistry c = cell(CellChemistry.ALKALINE_AA);
        assertAll(() -> assertEquals(1.5, c.nominalVolts()), () -> assertEquals(1.6, c.freshVolts()),
                () -> assertEquals(0.9, c.endPointVolts()), () -> assertEquals(2.0, c.capacityAmpHours(), 0.5));
    }

    @Test
    @DisplayName("9 V alkaline block: six cells, 9.6 V fresh to 5.4 V end, about 550 mA·h (IEC 60086-2 via secondary sources)")
    void nineVoltBlockFigures() {
        CellChemistry c = cell(CellChemistry.ALKALINE_9V_BLOCK);
        assertAll(() -> assertEquals(6, c.cellsPerUnit()),
                () -> assertEquals(9.6, c.unitFreshVolts(), 1e-12),
                () -> assertEquals(9.0, c.unitNominalVolts(), 1e-12),
                () -> assertEquals(5.4, c.unitEndPointVolts(), 1e-12),
                () -> assertTrue(c.unitEndPointVolts() >= 5.4 && c.unitEndPointVolts() <= 6.0),
                () -> assertEquals(0.55, c.capacityAmpHours(), 1e-12),
                () -> assertEquals(6 * c.voltsAt(0.5), c.unitVoltsAt(0.5), 1e-12));
    }

    @Test
    @DisplayName("NiMH 1.2/1.4/1.0 V, Li-ion 3.7/4.2/3.0 V, LiFePO4 3.2/3.65/2.5 V (common practice)")
    void rechargeableFigures() {
        CellChemistry n = cell(CellChemistry.NIMH_AA);
        CellChemistry li = cell(CellChemistry.LI_ION);
        CellChemistry lfp = cell(CellChemistry.LIFEPO4);
        assertAll(
                () -> assertEquals(1.2, n.nominalVolts()), () -> assertEquals(1.4, n.freshVolts()),
                () -> assertEquals(1.0, n.endPointVolts()),
                () -> assertTrue(li.nominalVolts() >= 3.6 && li.nominalVolts() <= 3.7),
                () -> assertEquals(4.2, li.freshVolts()), () -> assertEquals(3.0, li.endPointVolts()),
                () -> assertEquals(3.2, lfp.nominalVolts()), () -> assertEquals(3.65, lfp.freshVolts()),
                () -> assertEquals(2.5, lfp.endPointVolts()));
    }

    @Test
    @DisplayName("LiFePO4 is flat: the middle 60 % of its capacity spans under 0.1 V (common practice)")
    void lithiumIronPhosphateHasAFlatPlateau() {
        CellChemistry c = cell(CellChemistry.LIFEPO4);
        assertTrue(c.voltsAt(0.2) - c.voltsAt(0.8) < 0.1);
        CellChemistry alk = cell(CellChemistry.ALKALINE_AA);
        assertTrue(alk.voltsAt(0.2) - alk.voltsAt(0.8) > 0.2, "while alkaline slopes (common practice)");
    }

    @Test
    void interpolationIsLinearBetweenCurvePoints() {
        CellChemistry c = cell(CellChemistry.ALKALINE_AA);
        // Points (0.5, 1.24) and (0.6, 1.19): halfway is 1.215 V.
        assertEquals(1.215, c.voltsAt(0.55), 1e-12);
        assertEquals(0.55, c.fractionUsedAt(1.215), 1e-12);
        assertEquals(0, c.fractionUsedAt(1.7), "above fresh reads as unused");
        assertEquals(1, c.fractionUsedAt(0.5), "below the end-point reads as used up");
    }

    @Test
    void terminalVoltageUnderLoadLosesTheInternalDrop() {
        CellChemistry c = cell(CellChemistry.ALKALINE_9V_BLOCK);
        assertEquals(c.unitVoltsAt(0) - 0.01 * 6 * c.internalOhms(), c.unitVoltsUnderLoad(0, 0.01), 1e-12);
    }

    @Test
    void safetyNotesDeferToTheCellMakerAndLithiumNotesDemandProtection() {
        for (CellChemistry c : PARTS.cellChemistries()) {
            String note = c.safetyNote().toLowerCase();
            assertTrue(note.contains("planning values") && note.contains("cell maker's data governs"), c.id());
            assertTrue(note.contains("regulations"), c.id());
            if (c.id().startsWith("li")) {
                assertTrue(note.contains("protection circuit") && note.contains("cell maker's limits"), c.id());
            }
        }
    }

    @Test
    void fractionsOutsideZeroToOneAreRejected() {
        CellChemistry c = cell(CellChemistry.NIMH_AA);
        assertEquals(PartsException.Kind.BAD_VALUE, assertThrows(PartsException.class, () -> c.voltsAt(1.01)).kind());
        assertEquals(PartsException.Kind.BAD_VALUE, assertThrows(PartsException.class, () -> c.voltsAt(-0.01)).kind());
        assertEquals(PartsException.Kind.BAD_VALUE, assertThrows(PartsException.class, () -> c.fractionUsedAt(Double.NaN)).kind());
    }

    @Test
    void aCurveThatRisesOrMissesItsEndPointsIsRejected() {
        Map<String, String> basis = Map.of("voltages", "v", "capacityAmpHours", "c", "internalOhms", "r",
                "dischargeCurve", "d");
        List<DischargePoint> rising = List.of(new DischargePoint(0, 1.5), new DischargePoint(0.5, 1.55),
                new DischargePoint(1, 1.0));
        List<DischargePoint> shortEnd = List.of(new DischargePoint(0, 1.5), new DischargePoint(1, 1.1));
        assertThrows(PartsException.class, () -> new CellChemistry("x", "X", 1, 1.5, 1.2, 1.0, 1, 0.1, rising, "n", basis));
        assertThrows(PartsException.class, () -> new CellChemistry("x", "X", 1, 1.5, 1.2, 1.0, 1, 0.1, shortEnd, "n", basis));
        // The same data with a proper curve is accepted.
        new CellChemistry("x", "X", 1, 1.5, 1.2, 1.0, 1, 0.1,
                List.of(new DischargePoint(0, 1.5), new DischargePoint(1, 1.0)), "n", basis);
    }
}
