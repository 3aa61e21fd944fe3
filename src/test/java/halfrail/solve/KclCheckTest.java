package halfrail.solve;

import halfrail.circuit.Circuit;
import org.junit.jupiter.api.Test;
import org.opentest4j.AssertionFailedError;

import static org.junit.jupiter.api.Assertions.assertThrows;

/** The KCL helper must be able to fail: it rejects a solution that has been tampered with. */
class KclCheckTest {

    private static OperatingPoint tampered(OperatingPoint op, int index, double delta) {
        double[] x = op.solution();
        x[index] += delta;
        return new OperatingPoint(op.system(), x, op.nodeVolts(), op.branchAmps(), op.opAmps(), op.strategy(),
                op.iterations(), op.maxKclResidualAmps());
    }

    @Test
    void perturbedNodeVoltageBreaksKcl() {
        Circuit c = StageCircuits.invertingCascade(2, new double[] {3}, 0.1, TestAmps.bipolarFiniteGain());
        OperatingPoint op = DcSolver.operatingPoint(c);
        KclCheck.assertHolds(c, op);
        int mid = op.system().nodeIndex("m2");
        assertThrows(AssertionFailedError.class, () -> KclCheck.assertHolds(c, tampered(op, mid, 1e-3)));
    }

    @Test
    void perturbedSourceCurrentBreaksKcl() {
        Circuit c = StageCircuits.invertingCascade(1, new double[] {3}, 0.1, TestAmps.bipolarFiniteGain());
        OperatingPoint op = DcSolver.operatingPoint(c);
        int branch = op.system().branchIndex("VBAT");
        assertThrows(AssertionFailedError.class, () -> KclCheck.assertHolds(c, tampered(op, branch, 1e-6)));
        int out = op.system().branchIndex("U1");
        assertThrows(AssertionFailedError.class, () -> KclCheck.assertHolds(c, tampered(op, out, 1e-6)));
    }
}
