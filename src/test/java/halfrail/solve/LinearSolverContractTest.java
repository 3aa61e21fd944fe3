package halfrail.solve;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.function.Supplier;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

/** What every {@link LinearSolver} promises, checked on each implementation. */
class LinearSolverContractTest {
    record Named(String name, Supplier<LinearSolver> solver) {
        @Override
        public String toString() {
            return name;
        }
    }

    static Stream<Named> solvers() {
        return Stream.of(new Named("DenseLu", DenseLu::new), new Named("SparseLu", SparseLu::new));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("solvers")
    void nonFiniteEntriesAreReportedAsSingular(Named s) {
        for (double bad : new double[] {Double.NaN, Double.POSITIVE_INFINITY}) {
            double[][] a = {{1, 0}, {0, bad}};
            AnalysisException e = assertThrows(AnalysisException.class, () -> s.solver().get().factor(a, 2));
            assertEquals(AnalysisException.Kind.SINGULAR, e.kind());
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("solvers")
    void solverWorksOnTheLeadingBlockOfALargerArray(Named s) {
        double[][] a = {{2, 1, 99}, {1, 3, 99}, {99, 99, 99}};
        LinearSolver lu = s.solver().get();
        lu.factor(a, 2);
        double[] x = {3, 5, 77};
        lu.solve(x);
        // 2x + y = 3, x + 3y = 5 gives x = 0.8, y = 1.4 (exact); the third entry is not touched.
        assertEquals(0.8, x[0], 1e-14);
        assertEquals(1.4, x[1], 1e-14);
        assertEquals(77, x[2]);
    }
}
