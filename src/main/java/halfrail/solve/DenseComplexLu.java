package halfrail.solve;

/**
 * Dense complex LU decomposition with row equilibration and partial (row) pivoting, in place, on
 * separate real and imaginary arrays. Each row is first divided by its largest modulus, as in
 * {@link DenseLu}: the rows of a circuit's matrix are in different units (siemens in a node's
 * current balance, 1/s times a gain of 1e5 in an op-amp's state row), so a pivot is measured
 * only against its own row. The pivot of column k is then the entry of largest modulus on or
 * below the diagonal; when its modulus is at most {@link #DEFAULT_TOO_SMALL} (or the threshold
 * given to the constructor), the matrix is singular.
 *
 * <p>An earlier version measured the pivot against the largest modulus of its column in the
 * original matrix. That mixes the units: in a six-stage chain of gain-11 stages the last pivot,
 * from a node row of conductances near 1e-4 S, was 6e-7 of its own row but 1e-14 of the op-amp
 * row sharing its column, and a well-posed system was called singular.
 *
 * <p>Work arrays grow to the largest size seen and are reused; not thread-safe.
 */
public final class DenseComplexLu implements ComplexLinearSolver {
    /** Pivot modulus, relative to the largest original modulus of the pivot's row, below which the matrix is singular. */
    public static final double DEFAULT_TOO_SMALL = 1e-14;

    private final double tooSmall;
    private double[][] re;
    private double[][] im;
    private int n;
    private int[] perm = new int[0];
    private double[] rowScale = new double[0];
    private double[] workRe = new double[0];
    private double[] workIm = new double[0];

    public DenseComplexLu() {
        this(DEFAULT_TOO_SMALL);
    }

    /** @param tooSmall pivot threshold relative to the pivot row's largest original modulus, positive and below 1 */
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
            rowScale = new double[size];
            workRe = new double[size];
            workIm = new double[size];
        }
        for (int i = 0; i < size; i++) {
            perm[i] = i;
            double[] rowRe = aRe[i];
            double[] rowIm = aIm[i];
            double max2 = 0;
            for (int j = 0; j < size; j++) {
                double a = rowRe[j];
                double b = rowIm[j];
                if (!(Math.abs(a) <= Double.MAX_VALUE) || !(Math.abs(b) <= Double.MAX_VALUE)) {
                    throw new AnalysisException(AnalysisException.Kind.SINGULAR,
                            "the system matrix holds a non-finite entry in row " + i + ", column " + j);
                }
                max2 = Math.max(max2, a * a + b * b);
            }
            double max = Math.sqrt(max2);
            if (max2 > 1e300 || (max2 < 1e-300 && max2 > 0)) {
                // Entries beyond 1e±150: the squared modulus over- or underflows.
                max = 0;
                for (int j = 0; j < size; j++) {
                    max = Math.max(max, Math.hypot(rowRe[j], rowIm[j]));
                }
            }
            if (max == 0) {
                throw new AnalysisException(AnalysisException.Kind.SINGULAR,
                        "the system matrix has an empty row " + i);
            }
            double inv = 1.0 / max;
            rowScale[i] = inv;
            for (int j = 0; j < size; j++) {
                rowRe[j] *= inv;
                rowIm[j] *= inv;
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
            if (!(max > tooSmall2)) {
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
            yr[i] = bRe[perm[i]] * rowScale[perm[i]];
            yi[i] = bIm[perm[i]] * rowScale[perm[i]];
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

    @Override
    public void solveTransposed(double[] bRe, double[] bIm) {
        if (re == null) {
            throw new IllegalStateException("solve before factor");
        }
        // P·R·A = L·U, so Aᵀ = Uᵀ·Lᵀ·P·R⁻¹: solve Uᵀ·v = b, then Lᵀ·s = v, then y = R·Pᵀ·s.
        double[] vr = workRe;
        double[] vi = workIm;
        System.arraycopy(bRe, 0, vr, 0, n);
        System.arraycopy(bIm, 0, vi, 0, n);
        // Forward substitution with Uᵀ (lower triangle, U's diagonal).
        for (int i = 0; i < n; i++) {
            double sr = vr[i];
            double si = vi[i];
            for (int j = 0; j < i; j++) {
                double ur = re[j][i];
                double ui = im[j][i];
                sr -= ur * vr[j] - ui * vi[j];
                si -= ur * vi[j] + ui * vr[j];
            }
            double dr = re[i][i];
            double di = im[i][i];
            double d2 = dr * dr + di * di;
            vr[i] = (sr * dr + si * di) / d2;
            vi[i] = (si * dr - sr * di) / d2;
        }
        // Back substitution with Lᵀ (unit upper triangle).
        for (int i = n - 1; i >= 0; i--) {
            double sr = vr[i];
            double si = vi[i];
            for (int j = i + 1; j < n; j++) {
                double lr = re[j][i];
                double li = im[j][i];
                sr -= lr * vr[j] - li * vi[j];
                si -= lr * vi[j] + li * vr[j];
            }
            vr[i] = sr;
            vi[i] = si;
        }
        for (int i = 0; i < n; i++) {
            int row = perm[i];
            bRe[row] = vr[i] * rowScale[row];
            bIm[row] = vi[i] * rowScale[row];
        }
    }
}
