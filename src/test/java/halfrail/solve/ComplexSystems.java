package halfrail.solve;

import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.complex.ComplexField;
import org.apache.commons.math3.linear.Array2DRowFieldMatrix;
import org.apache.commons.math3.linear.ArrayFieldVector;
import org.apache.commons.math3.linear.FieldLUDecomposition;
import org.apache.commons.math3.linear.FieldMatrix;

import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Random complex systems for the tests of the {@link ComplexLinearSolver}s, and the independent
 * reference they are checked against: Apache Commons Math's FieldLUDecomposition over its Complex
 * field, and the residual ‖A·x − b‖.
 */
final class ComplexSystems {
    private ComplexSystems() {}

    /** A = re + j·im, b = bRe + j·bIm, n × n. */
    record ComplexSystem(double[][] re, double[][] im, double[] bRe, double[] bIm) {
        int size() {
            return re.length;
        }
    }

    /**
     * A full random system, its diagonal raised to keep it comfortably non-singular; with
     * {@code wideScale} each row is scaled by a power of ten from 1e-6 to 1e6 (rows in different
     * units, as in a circuit's matrix).
     */
    static ComplexSystem randomDense(Random random, int n, boolean wideScale) {
        double[][] re = new double[n][n];
        double[][] im = new double[n][n];
        double[] bRe = new double[n];
        double[] bIm = new double[n];
        for (int i = 0; i < n; i++) {
            double rowScale = wideScale ? Math.pow(10, random.nextInt(13) - 6) : 1;
            for (int j = 0; j < n; j++) {
                re[i][j] = rowScale * random.nextGaussian();
                im[i][j] = rowScale * random.nextGaussian();
            }
            re[i][i] += rowScale * n;
            bRe[i] = rowScale * random.nextGaussian();
            bIm[i] = rowScale * random.nextGaussian();
        }
        return new ComplexSystem(re, im, bRe, bIm);
    }

    /**
     * A random sparse system shaped like a circuit matrix: a dominant diagonal, two or three
     * off-diagonal entries per row and a hub (row and column 0); rows scaled as in
     * {@link #randomDense}.
     */
    static ComplexSystem randomSparse(Random random, int n, boolean wideScale) {
        double[][] re = new double[n][n];
        double[][] im = new double[n][n];
        double[] bRe = new double[n];
        double[] bIm = new double[n];
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
        return new ComplexSystem(re, im, bRe, bIm);
    }

    /** The solution by Commons Math's complex LU. */
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

    static Complex[] commonsMathSolve(ComplexSystem s) {
        return commonsMathSolve(s.re(), s.im(), s.bRe(), s.bIm());
    }

    /** Factor copies of the system's matrix with {@code lu} and solve; returns {x real, x imaginary}. */
    static double[][] solve(ComplexLinearSolver lu, ComplexSystem s) {
        double[] xRe = s.bRe().clone();
        double[] xIm = s.bIm().clone();
        lu.factor(copy(s.re()), copy(s.im()), s.size());
        lu.solve(xRe, xIm);
        return new double[][] {xRe, xIm};
    }

    /** Every entry of x within {@code relative} times the largest modulus of {@code expected}. */
    static void assertAgrees(Complex[] expected, double[][] x, double relative, String what) {
        double norm = 0;
        for (Complex c : expected) {
            norm = Math.max(norm, c.abs());
        }
        for (int i = 0; i < expected.length; i++) {
            assertEquals(expected[i].getReal(), x[0][i], relative * norm, what + ", re x" + i);
            assertEquals(expected[i].getImaginary(), x[1][i], relative * norm, what + ", im x" + i);
        }
    }

    /** Each row's residual of A·x = b at most 1e-12 of the largest term in it. */
    static void assertResidualSmall(ComplexSystem s, double[] xRe, double[] xIm) {
        double[][] re = s.re();
        double[][] im = s.im();
        int n = re.length;
        for (int i = 0; i < n; i++) {
            double sr = 0;
            double si = 0;
            double scale = Math.hypot(s.bRe()[i], s.bIm()[i]);
            for (int j = 0; j < n; j++) {
                sr += re[i][j] * xRe[j] - im[i][j] * xIm[j];
                si += re[i][j] * xIm[j] + im[i][j] * xRe[j];
                scale = Math.max(scale, Math.hypot(re[i][j], im[i][j]) * Math.hypot(xRe[j], xIm[j]));
            }
            double r = Math.hypot(sr - s.bRe()[i], si - s.bIm()[i]);
            assertTrue(r <= 1e-12 * scale, "residual of row " + i + " is " + r + " against scale " + scale);
        }
    }

    static double[][] copy(double[][] a) {
        double[][] c = new double[a.length][];
        for (int i = 0; i < a.length; i++) {
            c[i] = a[i].clone();
        }
        return c;
    }
}
