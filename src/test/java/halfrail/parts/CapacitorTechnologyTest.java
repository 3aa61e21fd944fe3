package halfrail.parts;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.solve.DcSolver;
import halfrail.solve.OperatingPoint;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertAll;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class CapacitorTechnologyTest {
    private static final PartsLibrary PARTS = PartsLibrary.builtIn();

    private static CapacitorTechnology tech(String id) {
        return PARTS.requireCapacitorTechnology(id);
    }

    private static void assertClose(double expected, double actual) {
        assertEquals(expected, actual, Math.abs(expected) * 1e-12, () -> "expected " + expected + ", got " + actual);
    }

    @Test
    void theLibraryHoldsTheSixTechnologiesInResourceOrder() {
        List<String> ids = PARTS.capacitorTechnologies().stream().map(CapacitorTechnology::id).toList();
        assertEquals(List.of(CapacitorTechnology.ALUMINIUM_ELECTROLYTIC, CapacitorTechnology.TANTALUM,
                CapacitorTechnology.CERAMIC_CLASS_1, CapacitorTechnology.CERAMIC_CLASS_2,
                CapacitorTechnology.POLYESTER_FILM, CapacitorTechnology.POLYPROPYLENE_FILM), ids);
    }

    @Test
    @DisplayName("electrolytic 47 µF / 40 V leaks at most 18.8 µA at rated voltage (IEC 60384-4, from memory / secondary: worked example)")
    void electrolyticLimitIsOneHundredthOfCapacitanceTimesRatedVoltage() {
        CapacitorTechnology e = tech(CapacitorTechnology.ALUMINIUM_ELECTROLYTIC);
        assertClose(18.8e-6, e.leakageAmps(47e-6, 40, 40, LeakageLevel.LIMIT));
    }

    @Test
    @DisplayName("electrolytic 1 µF / 16 V is held to the 3 µA floor, not 0.16 µA (IEC 60384-4, from memory / secondary)")
    void electrolyticLimitNeverFallsBelowThreeMicroamps() {
        CapacitorTechnology e = tech(CapacitorTechnology.ALUMINIUM_ELECTROLYTIC);
        assertClose(3e-6, e.leakageAmps(1e-6, 16, 16, LeakageLevel.LIMIT));
    }

    @Test
    @DisplayName("tantalum floor is 0.5 µA and above it 0.01·C·U_R (IEC 60384-15, from memory, unverified)")
    void tantalumLimitHasAHalfMicroampFloor() {
        CapacitorTechnology t = tech(CapacitorTechnology.TANTALUM);
        assertClose(0.5e-6, t.leakageAmps(1e-6, 16, 16, LeakageLevel.LIMIT));      // 0.16 µA < floor
        assertClose(4.7e-6, t.leakageAmps(47e-6, 10, 10, LeakageLevel.LIMIT));     // 0.01·47·10 = 4.7 µA
    }

    @Test
    @DisplayName("MLCC 1 µF / 50 V needs 500 MΩ, 10 nF / 50 V is capped at 10 GΩ (IEC 60384-1 practice, secondary sources)")
    void multilayerCeramicInsulationIsFiveHundredSecondsOverCapacitanceCappedAtTenGigaohms() {
        for (String id : List.of(CapacitorTechnology.CERAMIC_CLASS_1, CapacitorTechnology.CERAMIC_CLASS_2)) {
            CapacitorTechnology c = tech(id);
            assertAll(id,
                    () -> assertClose(1 / 500e6, c.leakageSiemens(1e-6, 50, LeakageLevel.LIMIT)),
                    () -> assertClose(1 / 10e9, c.leakageSiemens(10e-9, 50, LeakageLevel.LIMIT)));
        }
    }

    @Test
    @DisplayName("MLCC at 6.3–16 V: 1 µF / 16 V needs only 100 MΩ (IEC 60384-1 practice, secondary sources)")
    void lowVoltageCeramicUsesTheHundredSecondBand() {
        CapacitorTechnology c = tech(CapacitorTechnology.CERAMIC_CLASS_2);
        assertClose(1 / 100e6, c.leakageSiemens(1e-6, 16, LeakageLevel.LIMIT));
        assertClose(1 / 100e6, c.leakageSiemens(1e-6, 6.3, LeakageLevel.LIMIT));
        assertClose(1 / 500e6, c.leakageSiemens(1e-6, 25, LeakageLevel.LIMIT));
    }

    @Test
    @DisplayName("film 1 µF: polyester 10 000 s → 10 GΩ, polypropylene 100 000 s → 100 GΩ (IEC 60384-1 §4.5; figures common practice)")
    void filmInsulationFollowsItsTimeConstantAboveAThirdOfAMicrofarad() {
        assertClose(1 / 10e9, tech(CapacitorTechnology.POLYESTER_FILM).leakageSiemens(1e-6, 100, LeakageLevel.LIMIT));
        assertClose(1 / 100e9, tech(CapacitorTechnology.POLYPROPYLENE_FILM).leakageSiemens(1e-6, 100, LeakageLevel.LIMIT));
    }

    @Test
    @DisplayName("film below 0.33 µF is held to the fixed minimum chosen in the resource (30 GΩ polyester, 300 GΩ polypropylene)")
    void smallFilmCapacitorsHaveAFixedMinimumInsulation() {
        assertClose(1 / 30e9, tech(CapacitorTechnology.POLYESTER_FILM).leakageSiemens(10e-9, 100, LeakageLevel.LIMIT));
        assertClose(1 / 300e9, tech(CapacitorTechnology.POLYPROPYLENE_FILM).leakageSiemens(100e-9, 100, LeakageLevel.LIMIT));
        // At 0.33 µF the time-constant rule (10 000 s / 0.33 µF = 30.3 GΩ) and the fixed minimum nearly meet.
        double atBoundary = 1 / tech(CapacitorTechnology.POLYESTER_FILM).leakageSiemens(0.33e-6, 100, LeakageLevel.LIMIT);
        assertEquals(30e9, atBoundary, 0.02 * 30e9);
    }

    @Test
    void limitConductanceIsTheLimitCurrentAtRatedVoltageDividedByThatVoltage() {
        CapacitorTechnology e = tech(CapacitorTechnology.ALUMINIUM_ELECTROLYTIC);
        double g = e.leakageSiemens(47e-6, 40, LeakageLevel.LIMIT);
        assertClose(18.8e-6 / 40, g); // IEC 60384-4 limit (from memory) linearised as I / U_R
        // Linear in the applied voltage: half the voltage, half the current.
        assertClose(9.4e-6, e.leakageAmps(47e-6, 40, 20, LeakageLevel.LIMIT));
        assertClose(9.4e-6, e.leakageAmps(47e-6, 40, -20, LeakageLevel.LIMIT));
    }

    @Test
    void typicalLeakageIsTheStatedFractionOfTheLimitAndNoneIsZero() {
        for (CapacitorTechnology t : PARTS.capacitorTechnologies()) {
            double limit = t.leakageSiemens(10e-6, 50, LeakageLevel.LIMIT);
            assertAll(t.id(),
                    () -> assertClose(t.typicalFractionOfLimit() * limit, t.leakageSiemens(10e-6, 50, LeakageLevel.TYPICAL)),
                    () -> assertTrue(t.leakageSiemens(10e-6, 50, LeakageLevel.TYPICAL) < limit,
                            "typical well below the limit (common practice)"),
                    () -> assertEquals(0, t.leakageSiemens(10e-6, 50, LeakageLevel.NONE)));
        }
        // Electrolytic typical is a tenth of the limit (from memory): 47 µF / 40 V → 1.88 µA.
        assertClose(1.88e-6, tech(CapacitorTechnology.ALUMINIUM_ELECTROLYTIC)
                .leakageAmps(47e-6, 40, 40, LeakageLevel.TYPICAL));
    }

    @Test
    @DisplayName("electrolytics leak far more than film of the same value (DESIGN.md common practice: prefer film in the feedback leg)")
    void electrolyticsLeakMoreThanFilmAndCeramic() {
        double e = tech(CapacitorTechnology.ALUMINIUM_ELECTROLYTIC).leakageSiemens(1e-6, 50, LeakageLevel.LIMIT);
        double pet = tech(CapacitorTechnology.POLYESTER_FILM).leakageSiemens(1e-6, 50, LeakageLevel.LIMIT);
        double mlcc = tech(CapacitorTechnology.CERAMIC_CLASS_2).leakageSiemens(1e-6, 50, LeakageLevel.LIMIT);
        assertTrue(e > 100 * pet && e > 10 * mlcc, "electrolytic " + e + " S, polyester " + pet + " S, MLCC " + mlcc + " S");
    }

    @Test
    @DisplayName("derating: electrolytic 80 %, tantalum 50 % of rated voltage (common practice)")
    void deratedVoltageIsTheDeratingFractionOfTheRating() {
        assertClose(20, tech(CapacitorTechnology.ALUMINIUM_ELECTROLYTIC).deratedVolts(25));
        assertClose(8, tech(CapacitorTechnology.TANTALUM).deratedVolts(16));
    }

    @Test
    void smallestRatingIsTheFirstStandardStepWhoseDeratedVoltageCoversTheWork() {
        CapacitorTechnology e = tech(CapacitorTechnology.ALUMINIUM_ELECTROLYTIC);
        assertEquals(16, e.smallestRatingFor(9).getAsDouble());      // 0.8·10 = 8 < 9 ≤ 0.8·16 = 12.8
        assertEquals(6.3, e.smallestRatingFor(5.04).getAsDouble());  // exactly 0.8·6.3
        assertTrue(e.smallestRatingFor(1000).isEmpty());
        assertEquals(10, tech(CapacitorTechnology.TANTALUM).smallestRatingFor(4.5).getAsDouble()); // 0.5·6.3 < 4.5 ≤ 0.5·10
    }

    @Test
    @DisplayName("polarity: electrolytic and tantalum are polarised, ceramics and films are not (common practice)")
    void onlyElectrolyticAndTantalumArePolarised() {
        for (CapacitorTechnology t : PARTS.capacitorTechnologies()) {
            boolean expected = t.id().equals(CapacitorTechnology.ALUMINIUM_ELECTROLYTIC)
                    || t.id().equals(CapacitorTechnology.TANTALUM);
            assertEquals(expected, t.polarised(), t.id());
        }
    }

    @Test
    @DisplayName("tolerance: electrolytic ±20 % (common practice), C0G ±5 %, polypropylene ±5 % (common practice)")
    void typicalTolerancesMatchCommonPractice() {
        assertEquals(0.2, tech(CapacitorTechnology.ALUMINIUM_ELECTROLYTIC).typicalTolerance());
        assertEquals(0.05, tech(CapacitorTechnology.CERAMIC_CLASS_1).typicalTolerance());
        assertEquals(0.05, tech(CapacitorTechnology.POLYPROPYLENE_FILM).typicalTolerance());
    }

    @Test
    void standardRatingsIncludeTheCommonElectrolyticSteps() {
        // Common practice: 6.3 10 16 25 35 50 63 100 V.
        assertTrue(tech(CapacitorTechnology.ALUMINIUM_ELECTROLYTIC).standardRatedVolts()
                .containsAll(List.of(6.3, 10.0, 16.0, 25.0, 35.0, 50.0, 63.0, 100.0)));
    }

    @Test
    void aCircuitCapacitorCarriesTheTechnologyPolarityToleranceRatingAndLeakage() {
        CapacitorTechnology e = tech(CapacitorTechnology.ALUMINIUM_ELECTROLYTIC);
        Capacitor c = e.toCapacitor("C3", "fb", "0", 47e-6, 40, LeakageLevel.LIMIT);
        assertAll(
                () -> assertEquals("C3", c.name()),
                () -> assertEquals("fb", c.plus()),
                () -> assertEquals("0", c.minus()),
                () -> assertEquals(47e-6, c.farads()),
                () -> assertEquals(CapacitorTechnology.ALUMINIUM_ELECTROLYTIC, c.technology()),
                () -> assertTrue(c.polarised()),
                () -> assertEquals(0.2, c.tolerance()),
                () -> assertEquals(40, c.ratedVolts()),
                () -> assertClose(18.8e-6 / 40, c.leakageSiemens()));
        Capacitor film = tech(CapacitorTechnology.POLYESTER_FILM).toCapacitor("C1", "a", "b", 1e-6, 63, LeakageLevel.NONE);
        assertFalse(film.polarised());
        assertEquals(0, film.leakageSiemens());
    }

    @Test
    void formulasRejectValuesWithNoPhysicalMeaning() {
        CapacitorTechnology e = tech(CapacitorTechnology.ALUMINIUM_ELECTROLYTIC);
        assertEquals(PartsException.Kind.BAD_VALUE,
                assertThrows(PartsException.class, () -> e.leakageSiemens(-1e-6, 16, LeakageLevel.LIMIT)).kind());
        assertEquals(PartsException.Kind.BAD_VALUE,
                assertThrows(PartsException.class, () -> e.leakageSiemens(1e-6, Double.POSITIVE_INFINITY, LeakageLevel.LIMIT)).kind());
        assertEquals(PartsException.Kind.BAD_VALUE,
                assertThrows(PartsException.class, () -> e.leakageAmps(1e-6, 16, Double.NaN, LeakageLevel.LIMIT)).kind());
        assertEquals(PartsException.Kind.BAD_VALUE,
                assertThrows(PartsException.class, () -> e.deratedVolts(0)).kind());
    }

    @Test
    void everyEntrySaysWhereItsFiguresComeFrom() {
        for (CapacitorTechnology t : PARTS.capacitorTechnologies()) {
            assertTrue(t.basis().keySet().containsAll(List.of("typicalTolerance", "voltageDerating", "leakage",
                    "typicalFractionOfLimit", "standardRatedVolts")), t.id());
        }
        assertTrue(tech(CapacitorTechnology.TANTALUM).basis().get("leakage").contains("unverified"));
        assertTrue(tech(CapacitorTechnology.ALUMINIUM_ELECTROLYTIC).basis().get("voltageDerating").contains("common practice"));
        assertTrue(tech(CapacitorTechnology.TANTALUM).basis().get("voltageDerating").contains("common practice"));
    }

    @Test
    @DisplayName("the DC solution draws the leakage current through a limit-leakage electrolytic (closed form: divider of 1 MΩ and U_R / I_limit)")
    void theSolverDrawsTheLeakageCurrentThroughALimitLeakageCapacitor() {
        CapacitorTechnology e = tech(CapacitorTechnology.ALUMINIUM_ELECTROLYTIC);
        Circuit circuit = Circuit.builder().nodes("in", "n")
                .voltageSource("V1", "in", "0", 10)
                .resistor("R1", "in", "n", 1e6)
                .add(e.toCapacitor("C1", "n", "0", 47e-6, 40, LeakageLevel.LIMIT))
                .build();
        OperatingPoint op = DcSolver.operatingPoint(circuit);
        // IEC 60384-4 limit 18.8 µA at 40 V (from memory) → 2.128 MΩ; divider with 1 MΩ: 10 V / (1 + 1e6·18.8e-6/40).
        double expected = 10 / (1 + 1e6 * 18.8e-6 / 40);
        assertEquals(expected, op.voltage("n"), 1e-6);
        double throughR1 = (10 - op.voltage("n")) / 1e6;
        assertEquals(throughR1, e.leakageAmps(47e-6, 40, op.voltage("n"), LeakageLevel.LIMIT), 1e-12);
    }
}
