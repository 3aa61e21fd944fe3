package halfrail.solve;

import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.complex.ComplexField;
import org.apache.commons.math3.linear.Array2DRowFieldMatrix;
import org.apache.commons.math3.linear.ArrayFieldVector;
import org.apache.commons.math3.linear.FieldLUDecomposition;
import org.apache.commons.math3.linear.FieldMatrix;
import org.junit.jupiter.api.Test;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The sparse complex LU against two independent solvers: Apache Commons Math's
 * FieldLUDecomposition over its Complex field and {@link DenseComplexLu}, on random sparse
 * systems shaped like circuit matrices (a diagonal, a few entries per row, a hub row and column);
 * and its refactorisation on a kept pivot order, as a frequency sweep uses it.
 */
class SparseComplexLuTest {
    private static final int SYSTEMS = 60;
    private static final int MAX_SIZE = 40;
    /** Relative agreement between the solutions (well-conditioned random systems). */
    private static final double RELATIVE_TOLERANCE = 1e-9;

    @Test
    void solutionsAgreeWithCommonsMathAndTheDenseSolverOnRandomSparseSystems() {
        Random random = new Random(20261202L);
        for (int s = 0; s < SYSTEMS; s++) {
            int n = 1 + random.nextInt(MAX_SIZE);
            double[][] re = new double[n][n];
            double[][] im = new double[n][n];
            double[] bRe = new double[n];
            double[] bIm = new double[n];
            fillSparse(random, re, im, bRe, bIm, s % 3 == 0);
            Complex[] expected = commonsMathSolve(re, im, bRe, bIm);
            double[] sparse = solve(new SparseComplexLu(), re, im, bRe, bIm);
            double[] dense = solve(new DenseComplexLu(), re, im, bRe, bIm);
            double norm = 0;
            for (Complex c : expected) {
                norm = Math.max(norm, c.abs());
            }
            for (int i = 0; i < n; i++) {
                assertEquals(expected[i].getReal(), sparse[i], RELATIVE_TOLERANCE * norm, "system " + s + ", re x" + i);
                assertEquals(expected[i].getImaginary(), sparse[n + i], RELATIVE_TOLERANCE * norm,
                        "system " + s + ", im x" + i);
                assertEquals(dense[i], sparse[i], RELATIVE_TOLERANCE * norm, "system " + s + ", against dense");
                assertEquals(dense[n + i], sparse[n + i], RELATIVE_TOLERANCE * norm, "system " + s + ", against dense");
            }
        }
    }

    @Test
    void aSweepOverOnePatternSearchesForPivotsOnceAndAgreesWithCommonsMathAtEveryFrequency() {
        // G + jωC with a fixed pattern, as AcAnalysis factors it at each frequency.
        Random random = new Random(99);
        int n = 30;
        double[][] g = new double[n][n];
        double[][] c = new double[n][n];
        double[] b = new double[n];
        fillSparse(random, g, c, b, new double[n], false);
        MnaSystem.Pattern p = patternOf(g, c);
        double[] gv = gather(p, g);
        double[] cv = gather(p, c);
        SparseComplexLu lu = new SparseComplexLu();
        double[] re = new double[p.entries()];
        double[] im = new double[p.entries()];
        for (int k = 0; k < 25; k++) {
            double omega = Math.pow(10, -2 + 0.1 * k); // up to 2.5: the diagonal (8) stays dominant
            for (int e = 0; e < p.entries(); e++) {
                re[e] = gv[e];
                im[e] = omega * cv[e];
            }
            lu.factor(p, re, im);
            double[] xr = b.clone();
            double[] xi = new double[n];
            lu.solve(xr, xi);
            double[][] aIm = new double[n][n];
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    aIm[i][j] = omega * c[i][j];
                }
            }
            Complex[] expected = commonsMathSolve(g, aIm, b, new double[n]);
            for (int i = 0; i < n; i++) {
                double scale = Math.max(1, expected[i].abs());
                assertEquals(expected[i].getReal(), xr[i], 1e-9 * scale, "ω " + omega + ", re x" + i);
                assertEquals(expected[i].getImaginary(), xi[i], 1e-9 * scale, "ω " + omega + ", im x" + i);
            }
        }
        // A strongly diagonal matrix never needs its kept pivots replaced.
        assertEquals(1, lu.fullFactorisations());
    }

    @Test
    void aKeptPivotThatFallsBelowTheThresholdIsReplaced() {
        // [[d, 1], [1, 1]]: with d = 1 the diagonal order is kept; with d = 1e-6 the kept pivot
        // (first diagonal) is far below 0.1 of its column and the rows must be swapped.
        MnaSystem.Pattern p = new MnaSystem.Pattern(2, new int[] {0, 2, 4}, new int[] {0, 1, 0, 1});
        SparseComplexLu lu = new SparseComplexLu();
        lu.factor(p, new double[] {2, 1, 1, 1}, new double[4]);
        lu.factor(p, new double[] {1e-6, 1, 1, 1}, new double[4]);
        assertEquals(2, lu.fullFactorisations());
        double[] xr = {1, 2};
        double[] xi = {0, 0};
        lu.solve(xr, xi);
        // d·x0 + x1 = 1 and x0 + x1 = 2 give (d − 1)·x0 = −1, so x0 = 1/(1 − d), x1 = 2 − x0 (exact).
        double d = 1e-6;
        double x0 = 1 / (1 - d);
        assertEquals(x0, xr[0], 1e-15);
        assertEquals(2 - x0, xr[1], 1e-15);
    }

    @Test
    void aRowThatIsAComplexMultipleOfAnotherIsReportedSingular() {
        // Row 2 = (1 + 2j) · row 1 with row 1 = (1, 2 + j): singular over the complex numbers.
        double[][] re = {{1, 2}, {1, 0}};
        double[][] im = {{0, 1}, {2, 5}};
        AnalysisException e = assertThrows(AnalysisException.class, () -> new SparseComplexLu().factor(re, im, 2));
        assertEquals(AnalysisException.Kind.SINGULAR, e.kind());
    }

    @Test
    void nonFiniteEntriesAndEmptyRowsAreReportedSingular() {
        for (double bad : new double[] {Double.NaN, Double.POSITIVE_INFINITY}) {
            double[][] re = {{1, 0}, {0, bad}};
            double[][] im = {{0, 0}, {0, 0}};
            AnalysisException e = assertThrows(AnalysisException.class, () -> new SparseComplexLu().factor(re, im, 2));
            assertEquals(AnalysisException.Kind.SINGULAR, e.kind());
        }
        double[][] re = {{1, 0}, {0, 0}};
        double[][] im = {{0, 0}, {0, 0}};
        AnalysisException e = assertThrows(AnalysisException.class, () -> new SparseComplexLu().factor(re, im, 2));
        assertEquals(AnalysisException.Kind.SINGULAR, e.kind());
    }

    @Test
    void afterASingularMatrixTheNextOneIsFactoredCorrectly() {
        SparseComplexLu lu = new SparseComplexLu();
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

    private static double[] solve(ComplexLinearSolver lu, double[][] re, double[][] im, double[] bRe, double[] bIm) {
        int n = re.length;
        double[] xr = bRe.clone();
        double[] xi = bIm.clone();
        lu.factor(copy(re), copy(im), n);
        lu.solve(xr, xi);
        double[] out = new double[2 * n];
        System.arraycopy(xr, 0, out, 0, n);
        System.arraycopy(xi, 0, out, n, n);
        return out;
    }

    /** A diagonal, two or three off-diagonal entries per row, and a hub (row and column 0). */
    static void fillSparse(Random random, double[][] re, double[][] im, double[] bRe, double[] bIm, boolean wideScale) {
        int n = re.length;
        for (int i = 0; i < n; i++) {
            double rowScale = wideScale ? Math.pow(10, random.nextInt(13) - 6) : 1;
            int extra = 2 + random.nextInt(2);
            for (int e = 0; e < extra; e++) {
                int j = random.nextInt(n);
                re[i][j] += rowScale * random.nextGaussian();
                im[i][j] += rowScale * random.nextGaussian();
            }
            re[i][0] += rowScale * random.nextGaussian();
            re[0][i] += random.nextGaussian();
            re[i][i] += rowScale * 8;
            im[i][i] += rowScale * random.nextGaussian();
            bRe[i] = rowScale * random.nextGaussian();
            bIm[i] = rowScale * random.nextGaussian();
        }
        re[0][0] += 4 * n;
    }

    private static MnaSystem.Pattern patternOf(double[][] a, double[][] b) {
        int n = a.length;
        int[] rowStart = new int[n + 1];
        int count = 0;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                if (a[i][j] != 0 || b[i][j] != 0) {
                    count++;
                }
            }
            rowStart[i + 1] = count;
        }
        int[] columns = new int[count];
        int k = 0;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                if (a[i][j] != 0 || b[i][j] != 0) {
                    columns[k++] = j;
                }
            }
        }
        return new MnaSystem.Pattern(n, rowStart, columns);
    }

    private static double[] gather(MnaSystem.Pattern p, double[][] a) {
        double[] v = new double[p.entries()];
        for (int i = 0; i < p.size; i++) {
            for (int k = p.rowStart[i]; k < p.rowStart[i + 1]; k++) {
                v[k] = a[i][p.columns[k]];
            }
        }
        return v;
    }

    static Complex[] commonsMathSolve(double[][] re, double[][] im, double[] bRe, double[] bIm) {
        int n = re.length;
        FieldMatrix<Complex> a = new Array2DRowFieldMatrix<>(ComplexField.getInstance(), n, n);
        Complex[] b = new Complex[n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                a.setEntry(i, j, new Complex(re[i][j], im[i][j]));
            }
            b[i] = new Complex(bRe[i], bIm[i]);
        }
        return new FieldLUDecomposition<>(a).getSolver().solve(new ArrayFieldVector<>(b)).toArray();
    }

    private static double[][] copy(double[][] a) {
        double[][] c = new double[a.length][];
        for (int i = 0; i < a.length; i++) {
            c[i] = a[i].clone();
        }
        return c;
    }
}
