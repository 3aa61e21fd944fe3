package halfrail.solve;

/**
 * Dense LU decomposition with row equilibration and partial (row) pivoting, in place. Each row
 * is first scaled so that its largest magnitude is 1 (circuit matrices mix conductances of
 * 1e-12 S with op-amp gains of 1e8 in one matrix, so a threshold relative to the largest entry
 * of the whole matrix would call well-posed circuits singular). A pivot whose magnitude in the
 * equilibrated matrix is at or below {@link #DEFAULT_TOO_SMALL} marks the matrix singular, as
 * does a row that is all zeros or an entry that is not finite.
 */
public final class DenseLu implements LinearSolver {
    /** Pivot threshold, relative to the largest entry of the pivot's row, below which the matrix is singular. */
    public static final double DEFAULT_TOO_SMALL = 1e-14;

    private final double tooSmall;
    private double[][] lu;
    private int n;
    private int[] perm = new int[0];
    private double[] work = new double[0];
    private double[] rowScale = new double[0];

    public DenseLu() {
        this(DEFAULT_TOO_SMALL);
    }

    /** @param tooSmall pivot threshold relative to the pivot row's largest original entry */
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
            rowScale = new double[size];
        }
        for (int i = 0; i < size; i++) {
            perm[i] = i;
            double[] row = a[i];
            double max = 0;
            for (int j = 0; j < size; j++) {
                double v = Math.abs(row[j]);
                if (!(v <= Double.MAX_VALUE)) {
                    throw new AnalysisException(AnalysisException.Kind.SINGULAR,
                            "the system matrix holds a non-finite entry in row " + i);
                }
                max = Math.max(max, v);
            }
            if (max == 0) {
                throw new AnalysisException(AnalysisException.Kind.SINGULAR,
                        "the system matrix has an empty row " + i);
            }
            double inv = 1.0 / max;
            rowScale[i] = inv;
            for (int j = 0; j < size; j++) {
                row[j] *= inv;
            }
        }
        double threshold = tooSmall;
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
            if (!(max > threshold)) {
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
            y[i] = b[perm[i]] * rowScale[perm[i]];
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
