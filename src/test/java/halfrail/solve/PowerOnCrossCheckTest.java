package halfrail.solve;

import halfrail.circuit.Circuit;
import halfrail.circuit.VoltageSource;
import org.apache.commons.math3.ode.FirstOrderDifferentialEquations;
import org.apache.commons.math3.ode.nonstiff.DormandPrince853Integrator;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * Cross-check against an independent integrator: the state equations of a three-section RC
 * ladder written by hand and integrated with Apache Commons Math's DormandPrince853Integrator
 * (an explicit 8th-order Runge–Kutta method, Hairer, Nørsett &amp; Wanner, Solving ODEs I).
 */
class PowerOnCrossCheckTest {
    // Time constants about 10 µs, 10 ms and 1 s.
    private static final double R1 = 100;
    private static final double C1 = 100e-9;
    private static final double R2 = 10e3;
    private static final double C2 = 1e-6;
    private static final double R3 = 100e3;
    private static final double C3 = 10e-6;
    private static final double VS = 5;
    private static final double RAMP = 1e-3;

    static Circuit ladder() {
        return Circuit.builder().nodes("vs", "a", "b", "c")
                .add(new VoltageSource("VS", "vs", "0", VS, 0, 0, RAMP))
                .resistor("R1", "vs", "a", R1)
                .capacitor("C1", "a", "0", C1)
                .resistor("R2", "a", "b", R2)
                .capacitor("C2", "b", "0", C2)
                .resistor("R3", "b", "c", R3)
                .capacitor("C3", "c", "0", C3)
                .build();
    }

    /** dv/dt of the ladder, by Kirchhoff's current law at a, b and c. */
    private static final class Ladder implements FirstOrderDifferentialEquations {
        @Override
        public int getDimension() {
            return 3;
        }

        @Override
        public void computeDerivatives(double t, double[] v, double[] dv) {
            double vs = t >= RAMP ? VS : VS * t / RAMP;
            double i1 = (vs - v[0]) / R1;
            double i2 = (v[0] - v[1]) / R2;
            double i3 = (v[1] - v[2]) / R3;
            dv[0] = (i1 - i2) / C1;
            dv[1] = (i2 - i3) / C2;
            dv[2] = i3 / C3;
        }
    }

    /** Reference node voltages at {@code times} (ascending, the ramp end among them). */
    private static double[][] reference(double[] times) {
        DormandPrince853Integrator dp = new DormandPrince853Integrator(1e-12, 1.0, 1e-12, 1e-12);
        double[] v = new double[3];
        double t = 0;
        double[][] out = new double[times.length][];
        for (int k = 0; k < times.length; k++) {
            // integrate piecewise so that no Runge–Kutta step spans the corner of the ramp
            if (t < RAMP && times[k] > RAMP) {
                dp.integrate(new Ladder(), t, v, RAMP, v);
                t = RAMP;
            }
            if (times[k] > t) {
                dp.integrate(new Ladder(), t, v, times[k], v);
                t = times[k];
            }
            out[k] = v.clone();
        }
        return out;
    }

    @Test
    @DisplayName("RC ladder (τ ≈ 10 µs, 10 ms, 1 s) under a ramped source matches DormandPrince853 within 0.1 % of the supply at default tolerances")
    void ladderMatchesDormandPrinceAtDefaultTolerances() {
        double[] times = {2e-5, 2e-4, 1e-3, 2e-3, 1e-2, 3e-2, 0.1, 0.3, 1, 2, 5};
        double[][] ref = reference(times);
        PowerOnResult r = PowerOnTransient.run(ladder(), PowerOnOptions.of(5).withStopWhenSettled(false));
        String[] nodes = {"a", "b", "c"};
        for (int k = 0; k < times.length; k++) {
            for (int j = 0; j < 3; j++) {
                assertEquals(ref[k][j], r.voltageAt(nodes[j], times[k]), 1e-3 * VS,
                        "V(" + nodes[j] + ") at " + times[k] + " s");
            }
        }
    }

    @Test
    @DisplayName("tightening the tolerances brings the ladder within 0.002 % of the supply of DormandPrince853")
    void tighterTolerancesConvergeOnDormandPrince() {
        double[] times = {2e-5, 1e-3, 1e-2, 0.1, 1, 5};
        double[][] ref = reference(times);
        PowerOnResult r = PowerOnTransient.run(ladder(),
                PowerOnOptions.of(5).withStopWhenSettled(false).withTolerances(1e-7, 1e-10));
        String[] nodes = {"a", "b", "c"};
        for (int k = 0; k < times.length; k++) {
            for (int j = 0; j < 3; j++) {
                assertEquals(ref[k][j], r.voltageAt(nodes[j], times[k]), 2e-5 * VS,
                        "V(" + nodes[j] + ") at " + times[k] + " s");
            }
        }
    }
}
