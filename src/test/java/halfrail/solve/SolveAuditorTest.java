package halfrail.solve;

import halfrail.circuit.Circuit;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The global solver audit is installed for every test, and each of its checks can fail. */
class SolveAuditorTest {

    private static Circuit stage() {
        return StageCircuits.invertingCascade(2, new double[] {3}, 0.1, TestAmps.bipolarFiniteGain());
    }

    private static OperatingPoint tampered(OperatingPoint op, int index, double value) {
        double[] x = op.solution();
        x[index] = value;
        return new OperatingPoint(op.system(), x, op.nodeVolts(), op.branchAmps(), op.opAmps(), op.strategy(),
                op.iterations(), op.maxKclResidualAmps());
    }

    @Test
    @DisplayName("the audit is installed without any annotation and sees every DC, power-on and AC result")
    void theAuditSeesEverySolve() {
        assertTrue(SolveAuditor.installed(), "the extension was not registered automatically");
        long[] before = SolveAuditor.counts();
        Circuit c = stage();
        AcAnalysis ac = AcAnalysis.of(c);
        ac.sweep("VIN", "o2", 1, 1e3, 5);
        PowerOnTransient.run(PowerOnOpAmpStageTest.stage(), PowerOnOptions.of(1));
        long[] after = SolveAuditor.counts();
        assertTrue(after[0] - before[0] >= 2, "operating points audited: " + (after[0] - before[0]));
        assertEquals(1, after[1] - before[1], "power-on runs audited");
        assertTrue(after[2] - before[2] >= 5, "AC solves audited: " + (after[2] - before[2]));
        assertTrue(SolveAuditor.peek().isEmpty(), () -> SolveAuditor.peek().get());
    }

    @Test
    @DisplayName("a solved operating point passes; one with a node voltage moved by 1 mV or made NaN fails")
    void aTamperedOperatingPointFails() {
        OperatingPoint op = DcSolver.operatingPoint(stage());
        assertEquals(java.util.List.of(), SolveAuditor.problems(op));
        int mid = op.system().nodeIndex("m2");
        java.util.List<String> moved = SolveAuditor.problems(tampered(op, mid, op.solution()[mid] + 1e-3));
        assertFalse(moved.isEmpty());
        assertTrue(moved.get(0).contains("KCL fails at node"), moved.get(0));
        java.util.List<String> nan = SolveAuditor.problems(tampered(op, mid, Double.NaN));
        assertTrue(nan.get(0).contains("non-finite"), nan.get(0));
    }

    @Test
    @DisplayName("an AC solution with one node voltage off by 1 mV per volt fails the residual check")
    void aTamperedAcSolutionFails() {
        OperatingPoint op = DcSolver.operatingPoint(stage());
        MnaSystem sys = op.system();
        int n = sys.size();
        double[][] g = new double[n][n];
        double[][] c = new double[n][n];
        sys.evaluate(op.solution(), 0, Mode.DYNAMIC, 1, 0, new double[n], g, new double[n], c);
        double[] b = sys.sourceDirection("VIN");
        double omega = 2 * Math.PI * 100;
        // Solve (g + jωc)x = b with the production complex LU, then audit it as given and tampered.
        double[][] re = new double[n][];
        double[][] im = new double[n][n];
        for (int i = 0; i < n; i++) {
            re[i] = g[i].clone();
            for (int j = 0; j < n; j++) {
                im[i][j] = omega * c[i][j];
            }
        }
        DenseComplexLu lu = new DenseComplexLu();
        lu.factor(re, im, n);
        double[] xr = b.clone();
        double[] xi = new double[n];
        lu.solve(xr, xi);
        assertEquals(java.util.List.of(), SolveAuditor.problems(sys, g, c, omega, b, xr, xi));
        int m = sys.nodeIndex("m1");
        xr[m] += 1e-3; // 1 mV per volt of input: 0.1 µA through the 10 kΩ input resistor, far above the floor
        assertFalse(SolveAuditor.problems(sys, g, c, omega, b, xr, xi).isEmpty());
    }

    @Test
    @DisplayName("a power-on run passes; with one stored point moved it fails")
    void aTamperedPowerOnRunFails() {
        PowerOnResult r = PowerOnTransient.run(PowerOnOpAmpStageTest.stage(), PowerOnOptions.of(1));
        assertEquals(java.util.List.of(), SolveAuditor.problems(r));
        double[][] xs = new double[r.pointCount()][];
        for (int i = 0; i < xs.length; i++) {
            xs[i] = r.solution(i);
        }
        int k = r.system().nodeIndex("ref");
        xs[xs.length / 2][k] += 1e-3;
        int[] orders = new int[xs.length];
        for (int i = 0; i < xs.length; i++) {
            orders[i] = r.stepOrder(i);
        }
        boolean[] restarts = new boolean[xs.length];
        for (int i = 0; i < xs.length; i++) {
            restarts[i] = r.isBreakPoint(i);
        }
        PowerOnResult bad = new PowerOnResult(r.system(), r.finalPoint(), r.timesSeconds(), xs, orders, restarts,
                r.statistics(), r.ending(), r.settleBandVolts(), r.watchedNodes(), r.settled(), r.settleTimeSeconds(),
                r.railTimes(), r.loadSteps(), r.oscillation());
        java.util.List<String> p = SolveAuditor.problems(bad);
        assertFalse(p.isEmpty());
        assertTrue(p.get(0).contains("KCL fails"), p.get(0));
    }
}
