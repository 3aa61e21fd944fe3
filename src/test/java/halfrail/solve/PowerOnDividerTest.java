package halfrail.solve;

import halfrail.circuit.Circuit;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;

/** Power-on of a mid-rail divider with a decoupling capacitor. */
class PowerOnDividerTest {
    private static final double RA = 100e3;
    private static final double RB = 100e3;
    private static final double C = 10e-6;
    private static final double VS = 9;

    @Test
    @DisplayName("mid-rail divider charges with time constant (Ra‖Rb)·C towards Vs·Rb/(Ra+Rb) (design brief; Thevenin)")
    void midRailChargesWithTheParallelResistanceTimesC() {
        Circuit c = Circuit.builder().nodes("vs", "mid")
                .voltageSource("VS", "vs", "0", VS)
                .resistor("RA", "vs", "mid", RA)
                .resistor("RB", "mid", "0", RB)
                .capacitor("C1", "mid", "0", C)
                .build();
        double band = 0.01;
        PowerOnResult r = PowerOnTransient.run(c, PowerOnOptions.of(10).withSettleBand(band).withWatchedNodes("mid")
                .withTolerances(1e-6, 1e-9));
        double tau = RA * RB / (RA + RB) * C;
        double vFinal = VS * RB / (RA + RB);
        assertEquals(vFinal, r.finalPoint().voltage("mid"), 1e-9);
        for (double k : new double[] {0.5, 1, 2, 3}) {
            double v = r.voltageAt("mid", k * tau);
            // 0.01 % of the final value: BDF2's global error at a local tolerance of 1e-6
            assertEquals(vFinal * (1 - Math.exp(-k)), v, 1e-4 * vFinal, "at " + k + " τ");
            // the time constant read back from the curve
            double tauSeen = k * tau / -Math.log(1 - v / vFinal);
            assertEquals(tau, tauSeen, 1e-3 * tau, "τ read at " + k + " τ");
        }
        double settle = tau * Math.log(vFinal / band);
        assertEquals(settle, r.settleTimeSeconds().orElseThrow(), 2e-3 * settle);
    }
}
