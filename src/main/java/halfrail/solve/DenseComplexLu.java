package halfrail.solve;

/**
 * Dense complex LU decomposition with partial (row) pivoting, in place, on separate real and
 * imaginary arrays. The pivot of column k is the entry of largest modulus on or below the
 * diagonal; when its modulus is at most {@link #DEFAULT_TOO_SMALL} (or the threshold given to
 * the constructor) times the largest modulus in column k of the original matrix, the matrix is
 * singular. The column-relative threshold keeps a column of small conductances (a node tied in
 * by megohms) from being measured against the large entries of an op-amp row.
 *
 * <p>Work arrays grow to the largest size seen and are reused; not thread-safe.
 */
public final class DenseComplexLu implements ComplexLinearSolver {
    /** Relative pivot threshold (against the column's largest original modulus) below which the matrix is singular. */
    public static final double DEFAULT_TOO_SMALL = 1e-14;

    private final double tooSmall;
    private double[][] re;
    private double[][] im;
    private int n;
    private int[] perm = new int[0];
    private double[] columnScale = new double[0];
    private double[] workRe = new double[0];
    private double[] workIm = new double[0];

    public DenseComplexLu() {
        this(DEFAULT_TOO_SMALL);
    }

    /** @param tooSmall relative pivot threshold, positive and below 1 */
    public DenseComplexLu(double tooSmall) {
        if (!(tooSmall > 0 && tooSmall < 1)) {
            throw new IllegalArgumentException("the pivot threshold must lie between 0 and 1, got " + tooSmall);
        }
        this.tooSmall = tooSmall;
    }

    @Override
    public void factor(double[][] aRe, double[][] aIm, int size) {
        this.re = aRe;
        this.im = aIm;
        this.n = size;
        if (perm.length < size) {
            perm = new int[size];
            columnScale = new double[size];
            workRe = new double[size];
            workIm = new double[size];
        }
        java.util.Arrays.fill(columnScale, 0, size, 0);
        for (int i = 0; i < size; i++) {
            perm[i] = i;
            double[] rowRe = aRe[i];
            double[] rowIm = aIm[i];
            for (int j = 0; j < size; j++) {
                double m2 = rowRe[j] * rowRe[j] + rowIm[j] * rowIm[j];
                if (!Double.isFinite(m2)) {
                    throw new AnalysisException(AnalysisException.Kind.SINGULAR,
                            "the system matrix holds a non-finite entry in row " + i + ", column " + j);
                }
                columnScale[j] = Math.max(columnScale[j], m2);
            }
        }
        double tooSmall2 = tooSmall * tooSmall;
        for (int k = 0; k < size; k++) {
            int p = k;
            double max = aRe[k][k] * aRe[k][k] + aIm[k][k] * aIm[k][k];
            for (int i = k + 1; i < size; i++) {
                double v = aRe[i][k] * aRe[i][k] + aIm[i][k] * aIm[i][k];
                if (v > max) {
                    max = v;
                    p = i;
                }
            }
            if (max == 0 || max <= tooSmall2 * columnScale[k]) {
                throw new AnalysisException(AnalysisException.Kind.SINGULAR,
                        "the system matrix is singular at unknown " + k);
            }
            if (p != k) {
                double[] t = aRe[p];
                aRe[p] = aRe[k];
                aRe[k] = t;
                t = aIm[p];
                aIm[p] = aIm[k];
                aIm[k] = t;
                int ti = perm[p];
                perm[p] = perm[k];
                perm[k] = ti;
            }
            double[] kRe = aRe[k];
            double[] kIm = aIm[k];
            // 1 / pivot
            double invRe = kRe[k] / max;
            double invIm = -kIm[k] / max;
            for (int i = k + 1; i < size; i++) {
                double[] iRe = aRe[i];
                double[] iIm = aIm[i];
                double xr = iRe[k];
                double xi = iIm[k];
                if (xr == 0 && xi == 0) {
                    continue;
                }
                double mr = xr * invRe - xi * invIm;
                double mi = xr * invIm + xi * invRe;
                iRe[k] = mr;
                iIm[k] = mi;
                for (int j = k + 1; j < size; j++) {
                    double ur = kRe[j];
                    double ui = kIm[j];
                    iRe[j] -= mr * ur - mi * ui;
                    iIm[j] -= mr * ui + mi * ur;
                }
            }
        }
    }

    @Override
    public void solve(double[] bRe, double[] bIm) {
        if (re == null) {
            throw new IllegalStateException("solve before factor");
        }
        double[] yr = workRe;
        double[] yi = workIm;
        for (int i = 0; i < n; i++) {
            yr[i] = bRe[perm[i]];
            yi[i] = bIm[perm[i]];
        }
        // Forward substitution with the unit lower triangle.
        for (int i = 0; i < n; i++) {
            double[] rowRe = re[i];
            double[] rowIm = im[i];
            double sr = yr[i];
            double si = yi[i];
            for (int j = 0; j < i; j++) {
                sr -= rowRe[j] * yr[j] - rowIm[j] * yi[j];
                si -= rowRe[j] * yi[j] + rowIm[j] * yr[j];
            }
            yr[i] = sr;
            yi[i] = si;
        }
        // Back substitution with the upper triangle.
        for (int i = n - 1; i >= 0; i--) {
            double[] rowRe = re[i];
            double[] rowIm = im[i];
            double sr = yr[i];
            double si = yi[i];
            for (int j = i + 1; j < n; j++) {
                sr -= rowRe[j] * yr[j] - rowIm[j] * yi[j];
                si -= rowRe[j] * yi[j] + rowIm[j] * yr[j];
            }
            double dr = rowRe[i];
            double di = rowIm[i];
            double d2 = dr * dr + di * di;
            yr[i] = (sr * dr + si * di) / d2;
            yi[i] = (si * dr - sr * di) / d2;
        }
        System.arraycopy(yr, 0, bRe, 0, n);
        System.arraycopy(yi, 0, bIm, 0, n);
    }
}
