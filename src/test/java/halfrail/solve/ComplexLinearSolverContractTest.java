package halfrail.solve;

import halfrail.solve.ComplexSystems.ComplexSystem;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

import java.util.Random;
import java.util.function.Supplier;
import java.util.stream.Stream;

import static halfrail.solve.ComplexSystems.assertAgrees;
import static halfrail.solve.ComplexSystems.assertResidualSmall;
import static halfrail.solve.ComplexSystems.commonsMathSolve;
import static halfrail.solve.ComplexSystems.copy;
import static halfrail.solve.ComplexSystems.solve;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

/**
 * What every {@link ComplexLinearSolver} promises, checked on each implementation against an
 * independent one (Apache Commons Math's FieldLUDecomposition over its Complex field) and
 * against the residual ‖A·x − b‖; see {@link ComplexSystems}.
 */
class ComplexLinearSolverContractTest {
    /** Random systems tried per test. */
    private static final int SYSTEMS = 60;
    /** Relative agreement demanded with Commons Math (well-conditioned random systems). */
    private static final double RELATIVE_TOLERANCE = 1e-9;

    record Named(String name, Supplier<ComplexLinearSolver> solver) {
        @Override
        public String toString() {
            return name;
        }
    }

    static Stream<Named> solvers() {
        return Stream.of(new Named("DenseComplexLu", DenseComplexLu::new),
                new Named("SparseComplexLu", SparseComplexLu::new));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("solvers")
    void solutionsAgreeWithCommonsMathOnRandomDenseSystems(Named named) {
        Random random = new Random(20260101L);
        ComplexLinearSolver lu = named.solver().get(); // one instance over every size, as reused
        for (int s = 0; s < SYSTEMS; s++) {
            ComplexSystem system = ComplexSystems.randomDense(random, 1 + random.nextInt(14), s % 3 == 0);
            double[][] x = solve(lu, system);
            assertAgrees(commonsMathSolve(system), x, RELATIVE_TOLERANCE, "system " + s);
            assertResidualSmall(system, x[0], x[1]);
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("solvers")
    void solutionsAgreeWithCommonsMathOnRandomSparseSystems(Named named) {
        Random random = new Random(20261202L);
        for (int s = 0; s < SYSTEMS; s++) {
            ComplexSystem system = ComplexSystems.randomSparse(random, 1 + random.nextInt(40), s % 3 == 0);
            double[][] x = solve(named.solver().get(), system);
            assertAgrees(commonsMathSolve(system), x, RELATIVE_TOLERANCE, "system " + s);
            assertResidualSmall(system, x[0], x[1]);
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("solvers")
    void transposedSolvesAgreeWithCommonsMathOnTheTransposedMatrix(Named named) {
        Random random = new Random(20261203L);
        ComplexLinearSolver lu = named.solver().get();
        for (int s = 0; s < SYSTEMS; s++) {
            int n = 1 + random.nextInt(30);
            ComplexSystem a = s % 2 == 0 ? ComplexSystems.randomDense(random, n, s % 3 == 0)
                    : ComplexSystems.randomSparse(random, n, s % 3 == 0);
            ComplexSystem t = transposed(a);
            double[] yRe = a.bRe().clone();
            double[] yIm = a.bIm().clone();
            lu.factor(copy(a.re()), copy(a.im()), n);
            lu.solveTransposed(yRe, yIm);
            assertAgrees(commonsMathSolve(t), new double[][] {yRe, yIm}, RELATIVE_TOLERANCE, "system " + s);
            assertResidualSmall(t, yRe, yIm);
            // the same factors still solve A·x = b afterwards
            double[] xRe = a.bRe().clone();
            double[] xIm = a.bIm().clone();
            lu.solve(xRe, xIm);
            assertAgrees(commonsMathSolve(a), new double[][] {xRe, xIm}, RELATIVE_TOLERANCE, "system " + s + ", A·x");
        }
    }

    /** Aᵀ (the plain transpose) with the same right-hand side. */
    private static ComplexSystem transposed(ComplexSystem a) {
        int n = a.re().length;
        double[][] re = new double[n][n];
        double[][] im = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                re[j][i] = a.re()[i][j];
                im[j][i] = a.im()[i][j];
            }
        }
        return new ComplexSystem(re, im, a.bRe(), a.bIm());
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("solvers")
    void oneFactorisationServesSeveralRightHandSides(Named named) {
        Random random = new Random(7);
        int n = 6;
        ComplexSystem a = ComplexSystems.randomDense(random, n, false);
        ComplexLinearSolver lu = named.solver().get();
        lu.factor(copy(a.re()), copy(a.im()), n);
        for (int k = 0; k < 3; k++) {
            double[] bRe = new double[n];
            double[] bIm = new double[n];
            for (int i = 0; i < n; i++) {
                bRe[i] = random.nextGaussian();
                bIm[i] = random.nextGaussian();
            }
            double[] xRe = bRe.clone();
            double[] xIm = bIm.clone();
            lu.solve(xRe, xIm);
            assertResidualSmall(new ComplexSystem(a.re(), a.im(), bRe, bIm), xRe, xIm);
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("solvers")
    void aRepeatedRowIsReportedSingular(Named named) {
        double[][] re = {{1, 2, 3}, {4, 5, 6}, {1, 2, 3}};
        double[][] im = {{0, 1, 0}, {1, 0, 1}, {0, 1, 0}};
        assertSingular(named, re, im);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("solvers")
    void aRowThatIsAComplexMultipleOfAnotherIsReportedSingular(Named named) {
        // Row 2 = (1 + 2j) · row 1, row 1 = (1, 2 + j): (1 + 2j)·1 = 1 + 2j, (1 + 2j)(2 + j) = 5j.
        // Singular over the complex numbers, though neither the real nor the imaginary part alone is.
        double[][] re = {{1, 2}, {1, 0}};
        double[][] im = {{0, 1}, {2, 5}};
        assertSingular(named, re, im);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("solvers")
    void nonFiniteEntriesAndEmptyRowsAreReportedSingular(Named named) {
        for (double bad : new double[] {Double.NaN, Double.POSITIVE_INFINITY}) {
            assertSingular(named, new double[][] {{1, 0}, {0, bad}}, new double[2][2]);
            assertSingular(named, new double[][] {{1, bad}, {0, 1}}, new double[2][2]);
            assertSingular(named, new double[][] {{1, 0}, {0, 1}}, new double[][] {{0, 0}, {bad, 0}});
        }
        assertSingular(named, new double[][] {{1, 0}, {0, 0}}, new double[2][2]);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("solvers")
    void aColumnOfSmallConductancesIsNotMistakenForSingular(Named named) {
        // Entries spanning 1e-8 to 1e7, as in an MNA matrix with megohm resistors beside an op-amp row.
        ComplexSystem system = new ComplexSystem(
                new double[][] {{1e7, 0, 1}, {0, 2e-8, -1e-8}, {1, -1e-8, 1e-8 + 1e-3}},
                new double[][] {{0, 0, 0}, {0, 1e-9, 0}, {0, 0, 0}},
                new double[] {1, 1e-8, 0}, new double[] {0, 0, 0});
        double[][] x = solve(named.solver().get(), system);
        assertResidualSmall(system, x[0], x[1]);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("solvers")
    void aPivotIsMeasuredAgainstItsOwnRowNotAgainstALargerRowInItsColumn(Named named) {
        // Row 0 in the units of an op-amp state row (1e10), row 1 in siemens (1e-5): the second
        // pivot, 1e-5, is half its own row's largest entry but 1e-15 of column 1's largest. Exact
        // solution of x0 + x1 = 1, x0 + 2·x1 = 1 (each row divided by its scale): x = (1, 0).
        ComplexSystem system = new ComplexSystem(new double[][] {{1e10, 1e10}, {1e-5, 2e-5}},
                new double[2][2], new double[] {1e10, 1e-5}, new double[2]);
        double[][] x = solve(named.solver().get(), system);
        assertEquals(1, x[0][0], 1e-15);
        assertEquals(0, x[0][1], 1e-15);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("solvers")
    void aChainOfSixGainElevenStagesIsNotCalledSingular(Named named) {
        // Regression: at 2.25 kHz the six-stage chain's last pivot came from a node row of
        // conductances near 1e-4 S and was 1e-14 of the op-amp row's 1.4e4 in the same column; a
        // column-relative threshold called the system singular (DenseComplexLu once did).
        OperatingPoint op = DcSolver.operatingPoint(OpAmpChains.chain(6));
        MnaSystem s = op.system();
        int n = s.size();
        double[][] g = new double[n][n];
        double[][] c = new double[n][n];
        s.evaluate(op.solution(), 0, Mode.DYNAMIC, 1, 0, new double[n], g, new double[n], c);
        double omega = 2 * Math.PI * 2253.9339047347926;
        double[][] im = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                im[i][j] = omega * c[i][j];
            }
        }
        ComplexSystem system = new ComplexSystem(g, im, s.sourceDirection("VSIG"), new double[n]);
        Complex[] expected = commonsMathSolve(system);
        double[][] x = solve(named.solver().get(), system);
        for (int i = 0; i < n; i++) {
            double scale = Math.max(1e-9, expected[i].abs());
            assertEquals(expected[i].getReal(), x[0][i], 1e-9 * scale, s.unknownName(i));
            assertEquals(expected[i].getImaginary(), x[1][i], 1e-9 * scale, s.unknownName(i));
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("solvers")
    void afterASingularMatrixTheNextOneIsFactoredCorrectly(Named named) {
        ComplexLinearSolver lu = named.solver().get();
        assertThrows(AnalysisException.class, () -> lu.factor(new double[][] {{1, 1}, {1, 1}},
                new double[][] {{0, 0}, {0, 0}}, 2));
        lu.factor(new double[][] {{2, 1}, {1, 1}}, new double[][] {{0, 0}, {0, 1}}, 2);
        double[] xr = {1, 0};
        double[] xi = {0, 0};
        lu.solve(xr, xi);
        // [[2, 1], [1, 1 + j]]·x = (1, 0): det = 2 + 2j − 1 = 1 + 2j; x0 = (1 + j)/(1 + 2j), x1 = −1/(1 + 2j).
        Complex det = new Complex(1, 2);
        Complex x0 = new Complex(1, 1).divide(det);
        Complex x1 = new Complex(-1, 0).divide(det);
        assertEquals(x0.getReal(), xr[0], 1e-15);
        assertEquals(x0.getImaginary(), xi[0], 1e-15);
        assertEquals(x1.getReal(), xr[1], 1e-15);
        assertEquals(x1.getImaginary(), xi[1], 1e-15);
    }

    private static void assertSingular(Named named, double[][] re, double[][] im) {
        AnalysisException e = assertThrows(AnalysisException.class,
                () -> named.solver().get().factor(re, im, re.length));
        assertEquals(AnalysisException.Kind.SINGULAR, e.kind());
    }
}
