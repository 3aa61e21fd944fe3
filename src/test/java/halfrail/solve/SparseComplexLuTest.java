package halfrail.solve;

import halfrail.solve.ComplexSystems.ComplexSystem;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * What only the sparse complex LU does: factor the values of a fixed pattern and refactor on a
 * kept pivot order, as a frequency sweep uses it, checked against Apache Commons Math's
 * FieldLUDecomposition over its Complex field. What both complex solvers promise is in
 * {@link ComplexLinearSolverContractTest}.
 */
class SparseComplexLuTest {
    @Test
    void aSweepOverOnePatternSearchesForPivotsOnceAndAgreesWithCommonsMathAtEveryFrequency() {
        // G + jωC with a fixed pattern, as AcAnalysis factors it at each frequency.
        Random random = new Random(99);
        int n = 30;
        ComplexSystem system = ComplexSystems.randomSparse(random, n, false);
        double[][] g = system.re();
        double[][] c = system.im();
        double[] b = system.bRe();
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
            Complex[] expected = ComplexSystems.commonsMathSolve(g, aIm, b, new double[n]);
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
}
