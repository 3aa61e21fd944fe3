package halfrail.solve;

import halfrail.circuit.Circuit;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Kirchhoff's current law at every accepted point: the residual of f(x, t) + dq/dt, with dq/dt
 * rebuilt here from the stored charges by the textbook backward-difference formulas (backward
 * Euler; variable-step BDF2, Hairer &amp; Wanner, Solving ODEs II, §III.5 — from memory).
 */
class PowerOnKclTest {
    /** Residual allowed relative to the largest term of its row (Newton's tolerance leaves far less). */
    private static final double RELATIVE = 1e-6;
    /** Residual allowed regardless of the terms: A in node rows, V/s in op-amp state rows. */
    private static final double ABSOLUTE = 1e-12;

    private static double worstResidual(PowerOnResult r) {
        MnaSystem sys = r.system();
        int n = sys.size();
        double[] f = new double[n];
        double[] q0 = new double[n];
        double[] q1 = new double[n];
        double[] q2 = new double[n];
        double worst = 0;
        for (int i = 1; i < r.pointCount(); i++) {
            double t = r.timeSeconds(i);
            double h = t - r.timeSeconds(i - 1);
            sys.evaluate(r.solution(i - 1), r.timeSeconds(i - 1), Mode.DYNAMIC, 1, 0, f, null, q1, null);
            if (r.stepOrder(i) == 2) {
                sys.evaluate(r.solution(i - 2), r.timeSeconds(i - 2), Mode.DYNAMIC, 1, 0, f, null, q2, null);
            }
            sys.evaluate(r.solution(i), t, Mode.DYNAMIC, 1, 0, f, null, q0, null);
            double a0;
            double a1;
            double a2;
            if (r.stepOrder(i) == 1) {
                a0 = 1;
                a1 = -1;
                a2 = 0;
            } else {
                double rho = h / (r.timeSeconds(i - 1) - r.timeSeconds(i - 2));
                a0 = (1 + 2 * rho) / (1 + rho);
                a1 = -(1 + rho);
                a2 = rho * rho / (1 + rho);
            }
            for (int row = 0; row < n; row++) {
                double dq = (a0 * q0[row] + a1 * q1[row] + a2 * q2[row]) / h;
                double scale = Math.max(Math.abs(f[row]),
                        (Math.abs(a0 * q0[row]) + Math.abs(a1 * q1[row]) + Math.abs(a2 * q2[row])) / h);
                double ratio = Math.abs(f[row] + dq) / (RELATIVE * scale + ABSOLUTE);
                worst = Math.max(worst, ratio);
            }
        }
        return worst;
    }

    @Test
    @DisplayName("KCL holds at every accepted point of the RC ladder (residual of f + dq/dt)")
    void kirchhoffHoldsOnTheLadder() {
        Circuit c = PowerOnCrossCheckTest.ladder();
        double worst = worstResidual(PowerOnTransient.run(c, PowerOnOptions.of(5).withStopWhenSettled(false)));
        assertTrue(worst <= 1, "worst residual / tolerance " + worst);
    }

    @Test
    @DisplayName("KCL holds at every accepted point of the op-amp stage, on and off the rail")
    void kirchhoffHoldsOnTheOpAmpStage() {
        Circuit c = PowerOnOpAmpStageTest.stage();
        double worst = worstResidual(PowerOnTransient.run(c, PowerOnOptions.of(10)));
        assertTrue(worst <= 1, "worst residual / tolerance " + worst);
    }
}
