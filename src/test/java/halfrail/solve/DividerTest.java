package halfrail.solve;

import halfrail.circuit.Circuit;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * Mid-rail reference dividers. Source for every formula: the voltage divider and Thévenin's
 * theorem (The Art of Electronics, 3rd ed., §1.2): Vs·Rb/(Ra+Rb) behind Ra‖Rb.
 */
class DividerTest {

    private static double parallel(double a, double b) {
        return a * b / (a + b);
    }

    private static Circuit.Builder divider(double vs, double ra, double rb) {
        return Circuit.builder().nodes("vcc", "mid")
                .voltageSource("VBAT", "vcc", "0", vs)
                .resistor("RA", "vcc", "mid", ra)
                .resistor("RB", "mid", "0", rb);
    }

    @ParameterizedTest(name = "Vs={0} V, Ra={1} Ω, Rb={2} Ω")
    @CsvSource({"9, 100e3, 100e3", "5, 10e3, 22e3", "3.7, 1e6, 470e3", "12, 4.7e3, 1e3"})
    @DisplayName("unloaded divider gives Vs·Rb/(Ra+Rb) and draws Vs/(Ra+Rb) from the source (AoE §1.2)")
    void unloadedDividerGivesRatioAndItsCurrentIsTheSourceCurrent(double vs, double ra, double rb) {
        Circuit c = divider(vs, ra, rb).build();
        OperatingPoint op = DcSolver.operatingPoint(c);
        assertEquals(vs * rb / (ra + rb), op.voltage("mid"), 1e-9 * vs);
        assertEquals(vs / (ra + rb), op.current("VBAT"), 1e-9 * vs / (ra + rb));
        KclCheck.assertHolds(c, op);
    }

    @ParameterizedTest(name = "Ra={0} Ω, Rb={1} Ω, RL={2} Ω")
    @CsvSource({"100e3, 100e3, 47e3", "10e3, 10e3, 1e6", "22e3, 47e3, 2.2e3"})
    @DisplayName("a load resistor on the mid point gives Vs·(Rb‖RL)/(Ra + Rb‖RL) (AoE §1.2)")
    void loadResistorPullsTheMidPointDown(double ra, double rb, double rl) {
        double vs = 9;
        Circuit c = divider(vs, ra, rb).resistor("RL", "mid", "0", rl).build();
        OperatingPoint op = DcSolver.operatingPoint(c);
        double lower = parallel(rb, rl);
        assertEquals(vs * lower / (ra + lower), op.voltage("mid"), 1e-9 * vs);
        assertEquals(vs / (ra + lower), op.current("VBAT"), 1e-9 * vs / ra);
        KclCheck.assertHolds(c, op);
    }

    @ParameterizedTest(name = "Ib={0} A through Ra={1} Ω ‖ Rb={2} Ω")
    @CsvSource({"100e-9, 100e3, 100e3", "1e-6, 1e6, 1e6", "-250e-9, 47e3, 22e3"})
    @DisplayName("a bias current drawn from the mid point shifts it by Ib·(Ra‖Rb) (Thévenin, AoE §1.2)")
    void biasCurrentShiftsTheMidPointByItTimesTheTheveninResistance(double ib, double ra, double rb) {
        double vs = 9;
        Circuit c = divider(vs, ra, rb).currentSource("IB", "mid", "0", ib).build();
        OperatingPoint op = DcSolver.operatingPoint(c);
        double thevenin = vs * rb / (ra + rb);
        assertEquals(thevenin - ib * parallel(ra, rb), op.voltage("mid"), 1e-9 * vs);
        KclCheck.assertHolds(c, op);
    }

    @Test
    @DisplayName("a source's series resistance drops Rs·I before the divider (AoE §1.2, Thévenin source)")
    void seriesResistanceOfTheSupplyLowersTheDividerInput() {
        double vs = 9;
        double rs = 2;
        Circuit c = Circuit.builder().nodes("vcc", "mid")
                .add(new halfrail.circuit.VoltageSource("VBAT", "vcc", "0", vs, 0, rs, 0))
                .resistor("RA", "vcc", "mid", 100)
                .resistor("RB", "mid", "0", 100)
                .build();
        OperatingPoint op = DcSolver.operatingPoint(c);
        double i = vs / (rs + 200);
        assertEquals(i, op.current("VBAT"), 1e-12);
        assertEquals(vs - rs * i, op.voltage("vcc"), 1e-9);
        assertEquals((vs - rs * i) / 2, op.voltage("mid"), 1e-9);
        KclCheck.assertHolds(c, op);
    }
}
