package halfrail.solve;

/**
 * Dense LU decomposition with partial (row) pivoting, in place. A pivot whose magnitude is
 * below {@link #DEFAULT_TOO_SMALL} times the largest magnitude in its column of the original
 * matrix marks the matrix singular.
 */
public final class DenseLu implements LinearSolver {
    /** Relative pivot threshold below which the matrix is treated as singular. */
    public static final double DEFAULT_TOO_SMALL = 1e-14;

    private final double tooSmall;
    private double[][] lu;
    private int n;
    private int[] perm = new int[0];
    private double[] work = new double[0];

    public DenseLu() {
        this(DEFAULT_TOO_SMALL);
    }

    public DenseLu(double tooSmall) {
        this.tooSmall = tooSmall;
    }

    @Override
    public void factor(double[][] a, int size) {
        this.lu = a;
        this.n = size;
        if (perm.length < size) {
            perm = new int[size];
            work = new double[size];
        }
        double scale = 0;
        for (int i = 0; i < size; i++) {
            perm[i] = i;
            double[] row = a[i];
            for (int j = 0; j < size; j++) {
                scale = Math.max(scale, Math.abs(row[j]));
            }
        }
        if (scale == 0 || !Double.isFinite(scale)) {
            throw new AnalysisException(AnalysisException.Kind.SINGULAR,
                    scale == 0 ? "the system matrix is zero" : "the system matrix holds a non-finite entry");
        }
        double threshold = tooSmall * scale;
        for (int k = 0; k < size; k++) {
            int p = k;
            double max = Math.abs(a[k][k]);
            for (int i = k + 1; i < size; i++) {
                double v = Math.abs(a[i][k]);
                if (v > max) {
                    max = v;
                    p = i;
                }
            }
            if (max <= threshold) {
                throw new AnalysisException(AnalysisException.Kind.SINGULAR,
                        "the system matrix is singular at unknown " + k);
            }
            if (p != k) {
                double[] t = a[p];
                a[p] = a[k];
                a[k] = t;
                int ti = perm[p];
                perm[p] = perm[k];
                perm[k] = ti;
            }
            double[] rowK = a[k];
            double inv = 1.0 / rowK[k];
            for (int i = k + 1; i < size; i++) {
                double[] rowI = a[i];
                double m = rowI[k];
                if (m != 0) {
                    m *= inv;
                    rowI[k] = m;
                    for (int j = k + 1; j < size; j++) {
                        rowI[j] -= m * rowK[j];
                    }
                }
            }
        }
    }

    @Override
    public void solve(double[] b) {
        double[] y = work;
        for (int i = 0; i < n; i++) {
            y[i] = b[perm[i]];
        }
        for (int i = 0; i < n; i++) {
            double[] row = lu[i];
            double s = y[i];
            for (int j = 0; j < i; j++) {
                s -= row[j] * y[j];
            }
            y[i] = s;
        }
        for (int i = n - 1; i >= 0; i--) {
            double[] row = lu[i];
            double s = y[i];
            for (int j = i + 1; j < n; j++) {
                s -= row[j] * y[j];
            }
            y[i] = s / row[i];
        }
        System.arraycopy(y, 0, b, 0, n);
    }
}
