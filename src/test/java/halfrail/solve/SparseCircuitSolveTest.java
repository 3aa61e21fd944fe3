package halfrail.solve;

import halfrail.circuit.Circuit;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The operating point and the power-on transient of chains large enough for {@link SparseLu}
 * agree with the same solvers on {@link DenseLu} (the reference here: DenseLu is itself checked
 * against commons-math3 in {@link DenseLuTest}).
 */
class SparseCircuitSolveTest {

    @Test
    @DisplayName("operating points of 16- and 64-stage chains: sparse and dense LU give the same solution")
    void operatingPointsAgree() {
        for (int stages : new int[] {16, 64}) {
            MnaSystem sys = MnaSystem.of(OpAmpChains.chain(stages));
            assertTrue(sys.size() >= LinearSolvers.SPARSE_FROM_UNKNOWNS, "the chain is in the sparse range");
            double[] dense = new DcSolver(sys, new DenseLu()).solve().solution();
            double[] sparse = new DcSolver(sys, new SparseLu()).solve().solution();
            for (int i = 0; i < dense.length; i++) {
                double tol = i < sys.nodeCount() ? DcSolver.VOLTAGE_TOLERANCE * 10 : DcSolver.CURRENT_TOLERANCE * 10;
                assertEquals(dense[i], sparse[i], tol + 1e-8 * Math.abs(dense[i]), stages + " stages, " + sys.unknownName(i));
            }
        }
    }

    @Test
    @DisplayName("power-on of a 16-stage chain: sparse and dense LU accept the same steps and the same values")
    void powerOnAgrees() {
        Circuit c = OpAmpChains.chain(16);
        MnaSystem sys = MnaSystem.of(c);
        TransientStepper.Settings s = new TransientStepper.Settings(0.05, 1e-3,
                PowerOnOptions.DEFAULT_RELATIVE_TOLERANCE, PowerOnOptions.DEFAULT_VOLTAGE_TOLERANCE_VOLTS, new double[0]);
        TransientStepper.Trajectory dense = new TransientStepper(sys, Bdf2.INSTANCE, new DenseLu()).run(s, null);
        TransientStepper.Trajectory sparse = new TransientStepper(sys, Bdf2.INSTANCE, new SparseLu()).run(s, null);
        // rounding moves the step choices a little (a few percent of the steps); compare the end state
        int nd = dense.times().length;
        int ns = sparse.times().length;
        assertTrue(Math.abs(nd - ns) <= Math.max(2, nd / 20), "dense " + nd + " points, sparse " + ns);
        double[] xd = dense.solutions()[nd - 1];
        double[] xs = sparse.solutions()[ns - 1];
        for (int i = 0; i < sys.nodeCount(); i++) {
            // the local-error tolerance, a few times over (errors of both runs add up over the steps)
            double tol = 10 * (PowerOnOptions.DEFAULT_RELATIVE_TOLERANCE * Math.abs(xd[i])
                    + PowerOnOptions.DEFAULT_VOLTAGE_TOLERANCE_VOLTS) + 1e-4;
            assertEquals(xd[i], xs[i], tol, sys.unknownName(i) + " at the end");
        }
    }
}
