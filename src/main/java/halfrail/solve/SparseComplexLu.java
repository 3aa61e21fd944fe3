package halfrail.solve;

import java.util.Arrays;

/**
 * Sparse complex LU decomposition for the small-signal matrices G + jωC of a circuit, real and
 * imaginary parts in parallel {@code double} arrays (no object per entry).
 *
 * <p>Method: as {@link SparseLu} — the left-looking algorithm of Gilbert and Peierls ("Sparse
 * partial pivoting in time proportional to arithmetic operations", SIAM J. Sci. Stat. Comput. 9,
 * 1988; Davis, <i>Direct Methods for Sparse Linear Systems</i>, SIAM 2006, §6.3) in complex
 * arithmetic, columns in the minimum-degree order of the circuit's pattern
 * ({@link MnaSystem.Pattern#fillOrder()}, made once per pattern and shared), rows by threshold
 * partial pivoting on the modulus ({@link SparseLu#PIVOT_THRESHOLD}). A frequency sweep changes
 * only the values: after the first factorisation every later one reuses the pivot order and the
 * patterns of L and U and only redoes the arithmetic (the refactorisation of KLU, Davis and
 * Palamadai Natarajan, ACM TOMS 37, 2010); it pivots afresh only when a kept pivot falls below the
 * threshold of its column. No array is allocated per factorisation once the factors have reached
 * their size.
 *
 * <p>Rows are equilibrated (each divided by its largest modulus); a pivot of modulus at or below
 * {@link #DEFAULT_TOO_SMALL} (relative to its row's largest original modulus), an empty row or a
 * non-finite entry marks the matrix singular.
 *
 * <p>One instance serves one thread.
 */
final class SparseComplexLu implements ComplexLinearSolver {
    /** Pivot modulus, relative to the largest modulus of the pivot's row, below which the matrix is singular. */
    static final double DEFAULT_TOO_SMALL = SparseLu.DEFAULT_TOO_SMALL;

    private final double tooSmall;
    /** Pattern of A by columns, column order, pivot rows, patterns of L and U, reach (shared with {@link SparseLu}). */
    private final SparseLuSymbolic sym = new SparseLuSymbolic();
    private int n = -1;
    private MnaSystem.Pattern lastPattern;
    private double[] rowScale;
    // A, equilibrated, by columns (values beside sym.ai).
    private double[] axRe;
    private double[] axIm;
    private int[] toColumn;
    // Values of L (beside sym.li) and U (beside sym.ui).
    private double[] lxRe;
    private double[] lxIm;
    private double[] uxRe;
    private double[] uxIm;
    // Work.
    private double[] xRe;
    private double[] xIm;
    private double[] yRe;
    private double[] yIm;
    private boolean factored;
    private boolean refactorReady;
    private int fullFactorisations;
    // For the dense entry point: the pattern of the last dense matrix and its gathered values.
    private MnaSystem.Pattern densePattern;
    private double[] gatheredRe = new double[0];
    private double[] gatheredIm = new double[0];

    SparseComplexLu() {
        this(DEFAULT_TOO_SMALL);
    }

    /** @param tooSmall pivot threshold relative to the pivot row's largest original modulus, in (0, 1) */
    SparseComplexLu(double tooSmall) {
        if (!(tooSmall > 0 && tooSmall < 1)) {
            throw new IllegalArgumentException("the pivot threshold must lie between 0 and 1, got " + tooSmall);
        }
        this.tooSmall = tooSmall;
    }

    /** Factorisations that searched for pivots (the rest reused the kept order), for tests. */
    int fullFactorisations() {
        return fullFactorisations;
    }

    /** Nonzeros of L and U of the last factorisation (L's unit diagonal included). */
    int factorNonzeros() {
        return factored ? sym.factorNonzeros() : 0;
    }

    /**
     * Factor a dense matrix: its nonzero pattern is taken (and kept while it does not change) and
     * the matrix factored as {@link #factor(MnaSystem.Pattern, double[], double[])} would.
     */
    @Override
    public void factor(double[][] re, double[][] im, int size) {
        factored = false;
        boolean same = densePattern != null && densePattern.size == size;
        int count = 0;
        for (int i = 0; i < size; i++) {
            double[] r = re[i];
            double[] m = im[i];
            for (int j = 0; j < size; j++) {
                if (r[j] != 0 || m[j] != 0 || r[j] != r[j] || m[j] != m[j]) {
                    if (same && (count >= densePattern.entries() || densePattern.columns[count] != j)) {
                        same = false;
                    }
                    count++;
                }
            }
            if (same && densePattern.rowStart[i + 1] != count) {
                same = false;
            }
        }
        if (!same) {
            int[] rowStart = new int[size + 1];
            int[] columns = new int[count];
            int k = 0;
            for (int i = 0; i < size; i++) {
                for (int j = 0; j < size; j++) {
                    if (re[i][j] != 0 || im[i][j] != 0 || re[i][j] != re[i][j] || im[i][j] != im[i][j]) {
                        columns[k++] = j;
                    }
                }
                rowStart[i + 1] = k;
            }
            densePattern = new MnaSystem.Pattern(size, rowStart, columns);
            gatheredRe = new double[count];
            gatheredIm = new double[count];
        }
        MnaSystem.Pattern p = densePattern;
        for (int i = 0; i < size; i++) {
            for (int k = p.rowStart[i]; k < p.rowStart[i + 1]; k++) {
                gatheredRe[k] = re[i][p.columns[k]];
                gatheredIm[k] = im[i][p.columns[k]];
            }
        }
        factor(p, gatheredRe, gatheredIm);
    }

    /**
     * Factor the matrix whose entries are {@code re} + j·{@code im} at the positions of {@code p}
     * (row by row, as {@link MnaSystem#pattern()} orders them).
     *
     * @throws AnalysisException SINGULAR for a pivot below the threshold, an empty row or a
     *                           non-finite entry
     */
    void factor(MnaSystem.Pattern p, double[] re, double[] im) {
        factored = false;
        if (p != lastPattern) {
            setUp(p);
        }
        for (int i = 0; i < n; i++) {
            int from = p.rowStart[i];
            int to = p.rowStart[i + 1];
            double max2 = 0;
            for (int k = from; k < to; k++) {
                double a = re[k];
                double b = im[k];
                if (!(Math.abs(a) <= Double.MAX_VALUE) || !(Math.abs(b) <= Double.MAX_VALUE)) {
                    throw new AnalysisException(AnalysisException.Kind.SINGULAR,
                            "the system matrix holds a non-finite entry in row " + i);
                }
                max2 = Math.max(max2, a * a + b * b);
            }
            if (max2 == 0) {
                throw new AnalysisException(AnalysisException.Kind.SINGULAR,
                        "the system matrix has an empty row " + i);
            }
            // The squared modulus over- or underflows only for entries beyond 1e±154.
            double max = max2 > 1e300 || max2 < 1e-300 ? rowMax(re, im, from, to) : Math.sqrt(max2);
            double inv = 1.0 / max;
            rowScale[i] = inv;
            for (int k = from; k < to; k++) {
                int slot = toColumn[k];
                axRe[slot] = re[k] * inv;
                axIm[slot] = im[k] * inv;
            }
        }
        if (!(refactorReady && refactor())) {
            decompose();
            prepareRefactor();
        }
        factored = true;
    }

    /** Largest modulus of entries [from, to), without overflow. */
    private static double rowMax(double[] re, double[] im, int from, int to) {
        double max = 0;
        for (int k = from; k < to; k++) {
            max = Math.max(max, Math.hypot(re[k], im[k]));
        }
        return max;
    }

    @Override
    public void solve(double[] bRe, double[] bIm) {
        if (!factored) {
            throw new IllegalStateException("solve before factor");
        }
        double[] vr = yRe;
        double[] vi = yIm;
        int[] pinv = sym.pinv;
        int[] lp = sym.lp;
        int[] li = sym.li;
        int[] up = sym.up;
        int[] ui = sym.ui;
        int[] order = sym.order;
        for (int i = 0; i < n; i++) {
            int k = pinv[i];
            vr[k] = bRe[i] * rowScale[i];
            vi[k] = bIm[i] * rowScale[i];
        }
        for (int j = 0; j < n; j++) {
            double ar = vr[j];
            double ai2 = vi[j];
            if (ar != 0 || ai2 != 0) {
                for (int p = lp[j] + 1, end = lp[j + 1]; p < end; p++) {
                    int i = li[p];
                    double lr = lxRe[p];
                    double lim = lxIm[p];
                    vr[i] -= lr * ar - lim * ai2;
                    vi[i] -= lr * ai2 + lim * ar;
                }
            }
        }
        for (int j = n - 1; j >= 0; j--) {
            int diag = up[j + 1] - 1;
            double dr = uxRe[diag];
            double di = uxIm[diag];
            double d2 = dr * dr + di * di;
            double sr = vr[j];
            double si = vi[j];
            double ar = (sr * dr + si * di) / d2;
            double ai2 = (si * dr - sr * di) / d2;
            vr[j] = ar;
            vi[j] = ai2;
            if (ar != 0 || ai2 != 0) {
                for (int p = up[j]; p < diag; p++) {
                    int i = ui[p];
                    double ur = uxRe[p];
                    double uim = uxIm[p];
                    vr[i] -= ur * ar - uim * ai2;
                    vi[i] -= ur * ai2 + uim * ar;
                }
            }
        }
        for (int k = 0; k < n; k++) {
            bRe[order[k]] = vr[k];
            bIm[order[k]] = vi[k];
        }
    }

    @Override
    public void solveTransposed(double[] bRe, double[] bIm) {
        if (!factored) {
            throw new IllegalStateException("solve before factor");
        }
        // P·(R·A)·Q = L·U, so Aᵀ = Q·Uᵀ·Lᵀ·P·R⁻¹: w = Qᵀ·b, solve Uᵀ·v = w and Lᵀ·s = v, then
        // y = R·Pᵀ·s. U and L are stored by columns, so both triangular solves are dot products.
        double[] vr = yRe;
        double[] vi = yIm;
        int[] pinv = sym.pinv;
        int[] lp = sym.lp;
        int[] li = sym.li;
        int[] up = sym.up;
        int[] ui = sym.ui;
        int[] order = sym.order;
        for (int k = 0; k < n; k++) {
            vr[k] = bRe[order[k]];
            vi[k] = bIm[order[k]];
        }
        for (int j = 0; j < n; j++) {
            int diag = up[j + 1] - 1;
            double sr = vr[j];
            double si = vi[j];
            for (int p = up[j]; p < diag; p++) {
                int i = ui[p];
                double ur = uxRe[p];
                double uim = uxIm[p];
                sr -= ur * vr[i] - uim * vi[i];
                si -= ur * vi[i] + uim * vr[i];
            }
            double dr = uxRe[diag];
            double di = uxIm[diag];
            double d2 = dr * dr + di * di;
            vr[j] = (sr * dr + si * di) / d2;
            vi[j] = (si * dr - sr * di) / d2;
        }
        for (int j = n - 1; j >= 0; j--) {
            double sr = vr[j];
            double si = vi[j];
            for (int p = lp[j] + 1, end = lp[j + 1]; p < end; p++) {
                int i = li[p];
                double lr = lxRe[p];
                double lim = lxIm[p];
                sr -= lr * vr[i] - lim * vi[i];
                si -= lr * vi[i] + lim * vr[i];
            }
            vr[j] = sr;
            vi[j] = si;
        }
        for (int i = 0; i < n; i++) {
            bRe[i] = vr[pinv[i]] * rowScale[i];
            bIm[i] = vi[pinv[i]] * rowScale[i];
        }
    }

    /** Column store of p's pattern and p's shared fill-reducing order; the factors' patterns are made on the next factorisation. */
    private void setUp(MnaSystem.Pattern p) {
        int size = p.size;
        int entries = p.entries();
        n = size;
        int cap = Math.max(4 * entries, 8 * size + 16);
        sym.allocate(size, entries, cap);
        toColumn = sym.columnStore(p);
        sym.order = p.fillOrder();
        rowScale = new double[size];
        axRe = new double[entries];
        axIm = new double[entries];
        lxRe = new double[cap];
        lxIm = new double[cap];
        uxRe = new double[cap];
        uxIm = new double[cap];
        xRe = new double[size];
        xIm = new double[size];
        yRe = new double[size];
        yIm = new double[size];
        lastPattern = p;
        refactorReady = false;
    }

    /** Sort each column of U by row (the diagonal stays last) so that {@link #refactor} can run in order. */
    private void prepareRefactor() {
        sym.sortColumnsOfU(uxRe, uxIm);
        refactorReady = true;
    }

    /**
     * Numeric factorisation on the kept pivot order and L and U patterns. False, with the work
     * arrays left clean, when a pivot falls below {@link SparseLu#PIVOT_THRESHOLD} of its column
     * or the singularity threshold; the caller then factors afresh with pivoting.
     */
    private boolean refactor() {
        double[] wr = xRe;
        double[] wi = xIm;
        double tooSmall2 = tooSmall * tooSmall;
        double threshold2 = SparseLu.PIVOT_THRESHOLD * SparseLu.PIVOT_THRESHOLD;
        int[] order = sym.order;
        int[] ap = sym.ap;
        int[] ai = sym.ai;
        int[] pinv = sym.pinv;
        int[] lp = sym.lp;
        int[] li = sym.li;
        int[] up = sym.up;
        int[] ui = sym.ui;
        for (int k = 0; k < n; k++) {
            int col = order[k];
            for (int p = ap[col]; p < ap[col + 1]; p++) {
                int r = pinv[ai[p]];
                wr[r] = axRe[p];
                wi[r] = axIm[p];
            }
            int diag = up[k + 1] - 1;
            for (int p = up[k]; p < diag; p++) {
                int j = ui[p];
                double ur = wr[j];
                double uim = wi[j];
                wr[j] = 0;
                wi[j] = 0;
                uxRe[p] = ur;
                uxIm[p] = uim;
                if (ur != 0 || uim != 0) {
                    for (int q = lp[j] + 1, end = lp[j + 1]; q < end; q++) {
                        int i = li[q];
                        double lr = lxRe[q];
                        double lim = lxIm[q];
                        wr[i] -= lr * ur - lim * uim;
                        wi[i] -= lr * uim + lim * ur;
                    }
                }
            }
            double pr = wr[k];
            double pi = wi[k];
            wr[k] = 0;
            wi[k] = 0;
            double max2 = 0;
            for (int q = lp[k] + 1, end = lp[k + 1]; q < end; q++) {
                int i = li[q];
                max2 = Math.max(max2, wr[i] * wr[i] + wi[i] * wi[i]);
            }
            double m2 = pr * pr + pi * pi;
            if (!(m2 > tooSmall2) || m2 < threshold2 * max2) {
                for (int q = lp[k] + 1, end = lp[k + 1]; q < end; q++) {
                    wr[li[q]] = 0;
                    wi[li[q]] = 0;
                }
                refactorReady = false;
                return false;
            }
            uxRe[diag] = pr;
            uxIm[diag] = pi;
            double invRe = pr / m2;
            double invIm = -pi / m2;
            for (int q = lp[k] + 1, end = lp[k + 1]; q < end; q++) {
                int i = li[q];
                double a = wr[i];
                double b = wi[i];
                lxRe[q] = a * invRe - b * invIm;
                lxIm[q] = a * invIm + b * invRe;
                wr[i] = 0;
                wi[i] = 0;
            }
        }
        return true;
    }

    /** Gilbert–Peierls left-looking factorisation of the column store in the symbolic part's order, with threshold pivoting. */
    private void decompose() {
        fullFactorisations++;
        sym.beginDecompose();
        int[] order = sym.order;
        int[] pinv = sym.pinv;
        int[] xi = sym.xi;
        int[] lp = sym.lp;
        int[] up = sym.up;
        int[] li = sym.li;
        int[] ui = sym.ui;
        double tooSmall2 = tooSmall * tooSmall;
        double threshold2 = SparseLu.PIVOT_THRESHOLD * SparseLu.PIVOT_THRESHOLD;
        int lnz = 0;
        int unz = 0;
        for (int k = 0; k < n; k++) {
            lp[k] = lnz;
            up[k] = unz;
            int cap = sym.roomInL(lnz);
            if (cap > 0) {
                li = sym.li;
                lxRe = Arrays.copyOf(lxRe, cap);
                lxIm = Arrays.copyOf(lxIm, cap);
            }
            cap = sym.roomInU(unz);
            if (cap > 0) {
                ui = sym.ui;
                uxRe = Arrays.copyOf(uxRe, cap);
                uxIm = Arrays.copyOf(uxIm, cap);
            }
            int col = order[k];
            int top = lowerSolve(col);
            int ipiv = -1;
            double best = -1;
            for (int p = top; p < n; p++) {
                int i = xi[p];
                if (pinv[i] < 0) {
                    double t = xRe[i] * xRe[i] + xIm[i] * xIm[i];
                    if (t > best) {
                        best = t;
                        ipiv = i;
                    }
                } else {
                    ui[unz] = pinv[i];
                    uxRe[unz] = xRe[i];
                    uxIm[unz++] = xIm[i];
                }
            }
            if (ipiv < 0 || !(best > tooSmall2)) {
                for (int p = top; p < n; p++) {
                    xRe[xi[p]] = 0;
                    xIm[xi[p]] = 0;
                }
                refactorReady = false;
                throw new AnalysisException(AnalysisException.Kind.SINGULAR,
                        "the system matrix is singular at unknown " + k);
            }
            if (pinv[col] < 0 && sym.reached(col)
                    && xRe[col] * xRe[col] + xIm[col] * xIm[col] >= threshold2 * best) {
                ipiv = col;
            }
            double pr = xRe[ipiv];
            double pi = xIm[ipiv];
            double m2 = pr * pr + pi * pi;
            double invRe = pr / m2;
            double invIm = -pi / m2;
            ui[unz] = k;
            uxRe[unz] = pr;
            uxIm[unz++] = pi;
            pinv[ipiv] = k;
            li[lnz] = ipiv;
            lxRe[lnz] = 1;
            lxIm[lnz++] = 0;
            for (int p = top; p < n; p++) {
                int i = xi[p];
                if (pinv[i] < 0) {
                    double a = xRe[i];
                    double b = xIm[i];
                    li[lnz] = i;
                    lxRe[lnz] = a * invRe - b * invIm;
                    lxIm[lnz++] = a * invIm + b * invRe;
                }
                xRe[i] = 0;
                xIm[i] = 0;
            }
        }
        sym.endDecompose(lnz, unz);
    }

    /**
     * x = L \ A(:, col) over the columns of L made so far; the nonzero pattern is left in
     * the symbolic part's {@code xi[top..n-1]}, in topological order. Returns top.
     */
    private int lowerSolve(int col) {
        int top = sym.reach(col);
        int[] xi = sym.xi;
        int[] ap = sym.ap;
        int[] ai = sym.ai;
        int[] pinv = sym.pinv;
        int[] lp = sym.lp;
        int[] li = sym.li;
        for (int p = top; p < n; p++) {
            xRe[xi[p]] = 0;
            xIm[xi[p]] = 0;
        }
        for (int p = ap[col]; p < ap[col + 1]; p++) {
            xRe[ai[p]] = axRe[p];
            xIm[ai[p]] = axIm[p];
        }
        for (int px = top; px < n; px++) {
            int j = xi[px];
            int jj = pinv[j];
            if (jj < 0) {
                continue;
            }
            double ar = xRe[j];
            double ai2 = xIm[j];
            if (ar != 0 || ai2 != 0) {
                for (int p = lp[jj] + 1, end = lp[jj + 1]; p < end; p++) {
                    int i = li[p];
                    double lr = lxRe[p];
                    double lim = lxIm[p];
                    xRe[i] -= lr * ar - lim * ai2;
                    xIm[i] -= lr * ai2 + lim * ar;
                }
            }
        }
        return top;
    }
}
