package halfrail.solve;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.RepeatedTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.RepetitionInfo;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

/** Dense LU checked against Apache Commons Math 3.6.1 {@code LUDecomposition} (reference implementation). */
class DenseLuTest {

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

    @RepeatedTest(40)
    @DisplayName("random dense systems: solution agrees with commons-math3 LUDecomposition")
    void randomSystemsAgreeWithCommonsMath(RepetitionInfo info) {
        Random rnd = new Random(1000 + info.getCurrentRepetition());
        int n = 1 + rnd.nextInt(25);
        double[][] a = new double[n][n];
        double[] b = new double[n];
        for (int i = 0; i < n; i++) {
            b[i] = rnd.nextGaussian() * 10;
            for (int j = 0; j < n; j++) {
                a[i][j] = rnd.nextDouble() < 0.3 ? 0 : rnd.nextGaussian() * Math.pow(10, rnd.nextInt(7) - 3);
            }
            a[i][i] += 1e-3 * (1 + rnd.nextDouble()); // keep clear of exact singularity
        }
        double[] expected = referenceSolve(a, b);
        DenseLu lu = new DenseLu();
        double[] x = b.clone();
        lu.factor(copy(a), n);
        lu.solve(x);
        double norm = 0;
        for (double v : expected) {
            norm = Math.max(norm, Math.abs(v));
        }
        for (int i = 0; i < n; i++) {
            assertEquals(expected[i], x[i], 1e-8 * Math.max(1, norm), "component " + i + " of n=" + n);
        }
        // residual ‖A·x − b‖ small, independent of the reference
        for (int i = 0; i < n; i++) {
            double r = -b[i];
            double scale = Math.abs(b[i]);
            for (int j = 0; j < n; j++) {
                r += a[i][j] * x[j];
                scale += Math.abs(a[i][j] * x[j]);
            }
            assertEquals(0, r, 1e-10 * Math.max(1, scale));
        }
    }

    @Test
    void oneFactorServesManyRightHandSides() {
        double[][] a = {{4, 1, 0}, {1, 3, 1}, {0, 1, 2}};
        DenseLu lu = new DenseLu();
        lu.factor(copy(a), 3);
        for (double[] b : new double[][] {{1, 0, 0}, {0, 1, 0}, {1, 2, 3}}) {
            double[] x = b.clone();
            lu.solve(x);
            double[] expected = referenceSolve(a, b);
            for (int i = 0; i < 3; i++) {
                assertEquals(expected[i], x[i], 1e-14);
            }
        }
    }

    @Test
    @DisplayName("badly scaled but regular matrix (1e-12 S beside a gain of 1e8) is solved, like commons-math3")
    void badlyScaledRegularMatrixIsNotCalledSingular() {
        double[][] a = {{1e-12, 0, -1}, {-1e8, 1, 0}, {0, 1, 1e-3}};
        double[] b = {1e-12, 0, 1};
        double[] expected = referenceSolve(a, b);
        DenseLu lu = new DenseLu();
        lu.factor(copy(a), 3);
        double[] x = b.clone();
        lu.solve(x);
        for (int i = 0; i < 3; i++) {
            assertEquals(expected[i], x[i], 1e-9 * Math.abs(expected[i]));
        }
    }

    @Test
    void singularMatricesAreReportedAsSingular() {
        double[][][] cases = {
                {{1, 2}, {2, 4}},
                {{0, 0}, {0, 0}},
                {{1, 0, 0}, {0, 0, 0}, {0, 0, 1}},
                {{1, 1, 0}, {1, 1, 0}, {0, 0, 5}},
                {{2, 3, 5}, {1, 1, 1}, {3, 4, 6}},   // row 3 = row 1 + row 2
        };
        for (double[][] a : cases) {
            AnalysisException e = assertThrows(AnalysisException.class, () -> new DenseLu().factor(copy(a), a.length));
            assertEquals(AnalysisException.Kind.SINGULAR, e.kind());
            // the reference agrees
            assertEquals(false, new LUDecomposition(new Array2DRowRealMatrix(a)).getSolver().isNonSingular());
        }
    }
}
