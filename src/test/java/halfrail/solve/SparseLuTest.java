package halfrail.solve;

import halfrail.circuit.Circuit;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.RepeatedTest;
import org.junit.jupiter.api.RepetitionInfo;
import org.junit.jupiter.api.Test;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Sparse LU checked against Apache Commons Math 3.6.1 {@code LUDecomposition} (reference
 * implementation) and against {@link DenseLu}, on random sparse matrices and on the circuit
 * matrices the solvers factor.
 */
class SparseLuTest {

    private static double[][] copy(double[][] a) {
        double[][] c = new double[a.length][];
        for (int i = 0; i < a.length; i++) {
            c[i] = a[i].clone();
        }
        return c;
    }

    private static double[] referenceSolve(double[][] a, double[] b) {
        RealMatrix m = new Array2DRowRealMatrix(a, true);
        return new LUDecomposition(m).getSolver().solve(new ArrayRealVector(b)).toArray();
    }

    private static double[] solve(LinearSolver lu, double[][] a, double[] b) {
        double[] x = b.clone();
        lu.factor(copy(a), a.length);
        lu.solve(x);
        return x;
    }

    private static void assertClose(double[] expected, double[] actual, double relative, String what) {
        double norm = 0;
        for (double v : expected) {
            norm = Math.max(norm, Math.abs(v));
        }
        for (int i = 0; i < expected.length; i++) {
            assertEquals(expected[i], actual[i], relative * Math.max(1e-300, norm), what + ", component " + i);
        }
    }

    private static void assertSmallResidual(double[][] a, double[] b, double[] x) {
        for (int i = 0; i < a.length; i++) {
            double r = -b[i];
            double scale = Math.abs(b[i]);
            for (int j = 0; j < a.length; j++) {
                r += a[i][j] * x[j];
                scale += Math.abs(a[i][j] * x[j]);
            }
            assertEquals(0, r, 1e-10 * Math.max(1e-300, scale), "residual of row " + i);
        }
    }

    @RepeatedTest(60)
    @DisplayName("random sparse systems: the solution agrees with commons-math3 LUDecomposition and with DenseLu")
    void randomSparseSystemsAgreeWithCommonsMathAndDenseLu(RepetitionInfo info) {
        Random rnd = new Random(7000 + info.getCurrentRepetition());
        int n = 1 + rnd.nextInt(120);
        double density = Math.min(1, 3.0 / n + rnd.nextDouble() * 0.1);
        double[][] a = new double[n][n];
        double[] b = new double[n];
        for (int i = 0; i < n; i++) {
            b[i] = rnd.nextGaussian() * 10;
            for (int j = 0; j < n; j++) {
                if (rnd.nextDouble() < density) {
                    a[i][j] = rnd.nextGaussian() * Math.pow(10, rnd.nextInt(7) - 3);
                }
            }
            // a zero diagonal now and then, as in the branch rows of modified nodal analysis
            a[i][i] = rnd.nextDouble() < 0.15 ? 0 : a[i][i] + 1e-2 * (1 + rnd.nextDouble());
        }
        // keep clear of structural singularity: a permutation entry in each row
        int[] perm = new int[n];
        for (int i = 0; i < n; i++) {
            perm[i] = i;
        }
        for (int i = n - 1; i > 0; i--) {
            int j = rnd.nextInt(i + 1);
            int t = perm[i];
            perm[i] = perm[j];
            perm[j] = t;
        }
        for (int i = 0; i < n; i++) {
            a[i][perm[i]] += 1 + rnd.nextDouble();
        }
        LUDecomposition ref = new LUDecomposition(new Array2DRowRealMatrix(a, true));
        if (!ref.getSolver().isNonSingular()) {
            return; // a rare random singular matrix: nothing to compare
        }
        double[] expected = referenceSolve(a, b);
        double[] sparse = solve(new SparseLu(), a, b);
        double[] dense = solve(new DenseLu(), a, b);
        assertClose(expected, sparse, 1e-7, "sparse vs commons-math, n=" + n);
        assertClose(dense, sparse, 1e-7, "sparse vs dense, n=" + n);
        assertSmallResidual(a, b, sparse);
    }

    /** G + C/h of a generated chain of non-inverting single-supply stages, at the DC solution. */
    private static double[][] chainMatrix(int stages, double h) {
        Circuit c = OpAmpChains.chain(stages);
        MnaSystem sys = MnaSystem.of(c);
        int n = sys.size();
        double[] x = DcSolver.operatingPoint(c).solution();
        double[] f = new double[n];
        double[] q = new double[n];
        double[][] g = new double[n][n];
        double[][] cap = new double[n][n];
        sys.evaluate(x, 0, Mode.DYNAMIC, 1, 0, f, g, q, cap);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                g[i][j] += cap[i][j] / h;
            }
        }
        return g;
    }

    @Test
    @DisplayName("circuit matrices of 1 to 64 stages: the same solution as commons-math3 and DenseLu, from 1 ns to 1 s steps")
    void circuitMatricesAgreeWithCommonsMathAndDenseLu() {
        Random rnd = new Random(42);
        for (int stages : new int[] {1, 4, 16, 64}) {
            for (double h : new double[] {1e-9, 1e-3, 1}) {
                double[][] a = chainMatrix(stages, h);
                double[] b = new double[a.length];
                for (int i = 0; i < b.length; i++) {
                    b[i] = rnd.nextGaussian();
                }
                double[] expected = referenceSolve(a, b);
                double[] sparse = solve(new SparseLu(), a, b);
                double[] dense = solve(new DenseLu(), a, b);
                assertClose(expected, sparse, 1e-8, stages + " stages, h=" + h);
                assertClose(dense, sparse, 1e-8, stages + " stages, h=" + h);
                assertSmallResidual(a, b, sparse);
            }
        }
    }

    @Test
    @DisplayName("the fill-reducing order keeps the factors of a 64-stage chain near linear in size (common practice: minimum degree)")
    void factorsOfALongChainStaySparse() {
        double[][] small = chainMatrix(16, 1e-3);
        double[][] large = chainMatrix(64, 1e-3);
        SparseLu lu = new SparseLu();
        lu.factor(copy(small), small.length);
        int nnzSmall = lu.factorNonzeros();
        lu = new SparseLu();
        lu.factor(copy(large), large.length);
        int nnzLarge = lu.factorNonzeros();
        // four times the stages: at most about five times the factor entries (dense would be sixteen times)
        assertTrue(nnzLarge <= 5 * nnzSmall, "16 stages: " + nnzSmall + " entries, 64 stages: " + nnzLarge);
        assertTrue(nnzLarge < large.length * large.length / 10, "64 stages: " + nnzLarge + " entries of " + large.length + "²");
    }

    @Test
    void oneFactorServesManyRightHandSidesAndRefactoringReusesTheOrder() {
        double[][] a = {{4, 1, 0, 0}, {1, 3, 1, 0}, {0, 1, 2, 1}, {0, 0, 1, 5}};
        SparseLu lu = new SparseLu();
        for (int round = 0; round < 3; round++) {
            double[][] m = copy(a);
            for (int i = 0; i < 4; i++) {
                m[i][i] += round; // same pattern, new values
            }
            lu.factor(copy(m), 4);
            for (double[] b : new double[][] {{1, 0, 0, 0}, {0, 1, 0, 0}, {1, 2, 3, 4}}) {
                double[] x = b.clone();
                lu.solve(x);
                assertClose(referenceSolve(m, b), x, 1e-14, "round " + round);
            }
        }
        // a new entry outside the pattern seen so far
        double[][] m = copy(a);
        m[0][3] = 2;
        m[3][0] = -1;
        lu.factor(copy(m), 4);
        double[] x = {1, 1, 1, 1};
        lu.solve(x);
        assertClose(referenceSolve(m, new double[] {1, 1, 1, 1}), x, 1e-14, "grown pattern");
    }

    @Test
    @DisplayName("a zero diagonal needs an off-diagonal pivot (a voltage source's branch row)")
    void zeroDiagonalTakesAnOffDiagonalPivot() {
        // 1 V source into 1 kΩ: rows V(a), I(V1); unknowns V(a), I(V1)
        double[][] a = {{1e-3, -1}, {1, 0}};
        double[] x = solve(new SparseLu(), a, new double[] {0, 1});
        assertEquals(1, x[0], 1e-15);
        assertEquals(1e-3, x[1], 1e-18);
    }

    @Test
    @DisplayName("badly scaled but regular matrix (1e-12 S beside a gain of 1e8) is solved, like commons-math3")
    void badlyScaledRegularMatrixIsNotCalledSingular() {
        double[][] a = {{1e-12, 0, -1}, {-1e8, 1, 0}, {0, 1, 1e-3}};
        double[] b = {1e-12, 0, 1};
        double[] expected = referenceSolve(a, b);
        double[] x = solve(new SparseLu(), a, b);
        for (int i = 0; i < 3; i++) {
            assertEquals(expected[i], x[i], 1e-9 * Math.abs(expected[i]));
        }
    }

    @Test
    void singularMatricesAreReportedAsSingularLikeDenseLu() {
        double[][][] cases = {
                {{1, 2}, {2, 4}},
                {{0, 0}, {0, 0}},
                {{1, 0, 0}, {0, 0, 0}, {0, 0, 1}},
                {{1, 1, 0}, {1, 1, 0}, {0, 0, 5}},
                {{2, 3, 5}, {1, 1, 1}, {3, 4, 6}},   // row 3 = row 1 + row 2
                {{1, 0, 0}, {0, 1, 0}, {1, 0, 0}},   // structurally singular: column 3 empty
        };
        for (double[][] a : cases) {
            AnalysisException e = assertThrows(AnalysisException.class, () -> new SparseLu().factor(copy(a), a.length));
            assertEquals(AnalysisException.Kind.SINGULAR, e.kind());
            assertThrows(AnalysisException.class, () -> new DenseLu().factor(copy(a), a.length));
            assertEquals(false, new LUDecomposition(new Array2DRowRealMatrix(a)).getSolver().isNonSingular());
        }
    }

    @Test
    @DisplayName("the solvers choose dense below the named size and sparse from it on")
    void solverChoiceFollowsTheNamedThreshold() {
        assertTrue(LinearSolvers.forSize(LinearSolvers.SPARSE_FROM_UNKNOWNS - 1) instanceof DenseLu);
        assertTrue(LinearSolvers.forSize(LinearSolvers.SPARSE_FROM_UNKNOWNS) instanceof SparseLu);
    }
}
