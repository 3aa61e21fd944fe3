package halfrail.solve;

import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.complex.ComplexField;
import org.apache.commons.math3.linear.Array2DRowFieldMatrix;
import org.apache.commons.math3.linear.ArrayFieldVector;
import org.apache.commons.math3.linear.FieldLUDecomposition;
import org.apache.commons.math3.linear.FieldMatrix;
import org.apache.commons.math3.linear.FieldVector;
import org.junit.jupiter.api.Test;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The complex LU against an independent implementation: Apache Commons Math's
 * FieldLUDecomposition over its Complex field, and against the residual ‖A·x − b‖.
 */
class DenseComplexLuTest {
    /** Random systems tried per test. */
    private static final int SYSTEMS = 60;
    /** Largest random system size. */
    private static final int MAX_SIZE = 14;
    /** Relative agreement demanded between the two solutions (well-conditioned random systems). */
    private static final double RELATIVE_TOLERANCE = 1e-9;

    @Test
    void solutionsAgreeWithCommonsMathComplexLuOnRandomSystems() {
        Random random = new Random(20260101L);
        DenseComplexLu lu = new DenseComplexLu();
        for (int s = 0; s < SYSTEMS; s++) {
            int n = 1 + random.nextInt(MAX_SIZE);
            double[][] re = new double[n][n];
            double[][] im = new double[n][n];
            double[] bRe = new double[n];
            double[] bIm = new double[n];
            fillRandom(random, re, im, bRe, bIm, s % 3 == 0);
            Complex[] expected = commonsMathSolve(re, im, bRe, bIm);
            double[][] aRe = copy(re);
            double[][] aIm = copy(im);
            double[] xRe = bRe.clone();
            double[] xIm = bIm.clone();
            lu.factor(aRe, aIm, n);
            lu.solve(xRe, xIm);
            double norm = 0;
            for (Complex c : expected) {
                norm = Math.max(norm, c.abs());
            }
            for (int i = 0; i < n; i++) {
                assertEquals(expected[i].getReal(), xRe[i], RELATIVE_TOLERANCE * norm, "system " + s + ", re x" + i);
                assertEquals(expected[i].getImaginary(), xIm[i], RELATIVE_TOLERANCE * norm, "system " + s + ", im x" + i);
            }
            assertResidualSmall(re, im, bRe, bIm, xRe, xIm);
        }
    }

    @Test
    void oneFactorisationServesSeveralRightHandSides() {
        Random random = new Random(7);
        int n = 6;
        double[][] re = new double[n][n];
        double[][] im = new double[n][n];
        double[] unused = new double[n];
        fillRandom(random, re, im, unused, unused.clone(), false);
        DenseComplexLu lu = new DenseComplexLu();
        lu.factor(copy(re), copy(im), n);
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
            assertResidualSmall(re, im, bRe, bIm, xRe, xIm);
        }
    }

    @Test
    void aRepeatedRowIsReportedSingular() {
        double[][] re = {{1, 2, 3}, {4, 5, 6}, {1, 2, 3}};
        double[][] im = {{0, 1, 0}, {1, 0, 1}, {0, 1, 0}};
        AnalysisException e = assertThrows(AnalysisException.class, () -> new DenseComplexLu().factor(re, im, 3));
        assertEquals(AnalysisException.Kind.SINGULAR, e.kind());
    }

    @Test
    void aRowThatIsAComplexMultipleOfAnotherIsReportedSingular() {
        // Row 2 = (1 + 2j) · row 1, row 1 = (1, 2 + j): (1 + 2j)·1 = 1 + 2j, (1 + 2j)(2 + j) = 5j.
        // Singular over the complex numbers, though neither the real nor the imaginary part alone is.
        double[][] re = {{1, 2}, {1, 0}};
        double[][] im = {{0, 1}, {2, 5}};
        AnalysisException e = assertThrows(AnalysisException.class, () -> new DenseComplexLu().factor(re, im, 2));
        assertEquals(AnalysisException.Kind.SINGULAR, e.kind());
    }

    @Test
    void aNonFiniteEntryIsReportedSingular() {
        double[][] re = {{1, Double.NaN}, {0, 1}};
        double[][] im = {{0, 0}, {0, 0}};
        AnalysisException e = assertThrows(AnalysisException.class, () -> new DenseComplexLu().factor(re, im, 2));
        assertEquals(AnalysisException.Kind.SINGULAR, e.kind());
    }

    @Test
    void aColumnOfSmallConductancesIsNotMistakenForSingular() {
        // Entries spanning 1e-8 to 1e7, as in an MNA matrix with megohm resistors beside an op-amp row.
        double[][] re = {{1e7, 0, 1}, {0, 2e-8, -1e-8}, {1, -1e-8, 1e-8 + 1e-3}};
        double[][] im = {{0, 0, 0}, {0, 1e-9, 0}, {0, 0, 0}};
        double[] bRe = {1, 1e-8, 0};
        double[] bIm = {0, 0, 0};
        double[] xRe = bRe.clone();
        double[] xIm = bIm.clone();
        DenseComplexLu lu = new DenseComplexLu();
        lu.factor(copy(re), copy(im), 3);
        lu.solve(xRe, xIm);
        assertResidualSmall(re, im, bRe, bIm, xRe, xIm);
    }

    @Test
    void aPivotIsMeasuredAgainstItsOwnRowNotAgainstALargerRowInItsColumn() {
        // Row 0 in the units of an op-amp state row (1e10), row 1 in siemens (1e-5): the second
        // pivot, 1e-5, is half its own row's largest entry but 1e-15 of column 1's largest. Exact
        // solution of x0 + x1 = 1, x0 + 2·x1 = 1 (each row divided by its scale): x = (1, 0).
        double[][] re = {{1e10, 1e10}, {1e-5, 2e-5}};
        double[][] im = {{0, 0}, {0, 0}};
        double[] xRe = {1e10, 1e-5};
        double[] xIm = {0, 0};
        DenseComplexLu lu = new DenseComplexLu();
        lu.factor(copy(re), copy(im), 2);
        lu.solve(xRe, xIm);
        assertEquals(1, xRe[0], 1e-15);
        assertEquals(0, xRe[1], 1e-15);
    }

    @Test
    void aChainOfSixGainElevenStagesIsNotCalledSingular() {
        // Regression: at 2.25 kHz the six-stage chain's last pivot came from a node row of
        // conductances near 1e-4 S and was 1e-14 of the op-amp row's 1.4e4 in the same column; the
        // column-relative threshold called the system singular. Against Commons Math's complex LU.
        OperatingPoint op = DcSolver.operatingPoint(OpAmpChains.chain(6));
        MnaSystem s = op.system();
        int n = s.size();
        double[][] g = new double[n][n];
        double[][] c = new double[n][n];
        s.evaluate(op.solution(), 0, Mode.DYNAMIC, 1, 0, new double[n], g, new double[n], c);
        double omega = 2 * Math.PI * 2253.9339047347926;
        double[][] re = new double[n][n];
        double[][] im = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                re[i][j] = g[i][j];
                im[i][j] = omega * c[i][j];
            }
        }
        double[] bRe = s.sourceDirection("VSIG");
        double[] bIm = new double[n];
        Complex[] expected = commonsMathSolve(re, im, bRe, bIm);
        double[] xRe = bRe.clone();
        double[] xIm = bIm.clone();
        DenseComplexLu lu = new DenseComplexLu();
        lu.factor(copy(re), copy(im), n);
        lu.solve(xRe, xIm);
        for (int i = 0; i < n; i++) {
            double scale = Math.max(1e-9, expected[i].abs());
            assertEquals(expected[i].getReal(), xRe[i], 1e-9 * scale, s.unknownName(i));
            assertEquals(expected[i].getImaginary(), xIm[i], 1e-9 * scale, s.unknownName(i));
        }
    }

    private static void fillRandom(Random random, double[][] re, double[][] im, double[] bRe, double[] bIm,
                                   boolean wideScale) {
        int n = re.length;
        for (int i = 0; i < n; i++) {
            double rowScale = wideScale ? Math.pow(10, random.nextInt(13) - 6) : 1;
            for (int j = 0; j < n; j++) {
                re[i][j] = rowScale * random.nextGaussian();
                im[i][j] = rowScale * random.nextGaussian();
            }
            // Keep the random systems comfortably non-singular.
            re[i][i] += rowScale * n;
            bRe[i] = rowScale * random.nextGaussian();
            bIm[i] = rowScale * random.nextGaussian();
        }
    }

    private static Complex[] commonsMathSolve(double[][] re, double[][] im, double[] bRe, double[] bIm) {
        int n = re.length;
        FieldMatrix<Complex> a = new Array2DRowFieldMatrix<>(ComplexField.getInstance(), n, n);
        Complex[] b = new Complex[n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                a.setEntry(i, j, new Complex(re[i][j], im[i][j]));
            }
            b[i] = new Complex(bRe[i], bIm[i]);
        }
        FieldVector<Complex> x = new FieldLUDecomposition<>(a).getSolver().solve(new ArrayFieldVector<>(b));
        return x.toArray();
    }

    private static void assertResidualSmall(double[][] re, double[][] im, double[] bRe, double[] bIm,
                                            double[] xRe, double[] xIm) {
        int n = re.length;
        for (int i = 0; i < n; i++) {
            double sr = 0;
            double si = 0;
            double scale = Math.hypot(bRe[i], bIm[i]);
            for (int j = 0; j < n; j++) {
                sr += re[i][j] * xRe[j] - im[i][j] * xIm[j];
                si += re[i][j] * xIm[j] + im[i][j] * xRe[j];
                scale = Math.max(scale, Math.hypot(re[i][j], im[i][j]) * Math.hypot(xRe[j], xIm[j]));
            }
            double r = Math.hypot(sr - bRe[i], si - bIm[i]);
            assertTrue(r <= 1e-12 * scale, "residual of row " + i + " is " + r + " against scale " + scale);
        }
    }

    private static double[][] copy(double[][] a) {
        double[][] c = new double[a.length][];
        for (int i = 0; i < a.length; i++) {
            c[i] = a[i].clone();
        }
        return c;
    }
}
