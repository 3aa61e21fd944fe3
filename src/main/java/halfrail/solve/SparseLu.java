package halfrail.solve;

import java.util.Arrays;

/**
 * Sparse LU decomposition for circuit matrices, where each row holds a handful of entries and a
 * few nodes (the supply, a shared reference) touch every stage.
 *
 * <p>Method: the left-looking algorithm of Gilbert and Peierls ("Sparse partial pivoting in time
 * proportional to arithmetic operations", SIAM J. Sci. Stat. Comput. 9, 1988), as in Davis,
 * <i>Direct Methods for Sparse Linear Systems</i> (SIAM 2006, §6.3): column k of L and U comes
 * from a sparse triangular solve whose nonzero pattern is found by a depth-first search, so the
 * work is proportional to the arithmetic. Columns are taken in a minimum-degree order of the
 * symmetric pattern of A + Aᵀ (Tinney and Walker's scheme 2, fill-reducing; a hub node such as
 * the supply rail is eliminated last), rows by threshold partial pivoting: the diagonal of the
 * ordering is kept while its magnitude is at least {@link #PIVOT_THRESHOLD} times the largest
 * candidate, otherwise the largest is taken. The order is made once and made again only when an
 * entry appears outside every pattern seen so far. Given a circuit's fixed pattern
 * ({@link #factor(MnaSystem.Pattern, double[])}), later factorisations reuse the pivot order and
 * the patterns of L and U and only redo the arithmetic, as long as every pivot stays within the
 * threshold (the refactorisation of KLU, Davis and Palamadai Natarajan, ACM TOMS 37, 2010).
 *
 * <p>Rows are equilibrated first, exactly as in {@link DenseLu}, and the singularity test is the
 * same: a pivot at or below the threshold (relative to its row's largest entry), an empty row or
 * a non-finite entry marks the matrix singular.
 *
 * <p>The input is the dense array of {@link LinearSolver}, read once per factorisation. An
 * instance reuses its work arrays; one instance serves one thread.
 */
public final class SparseLu implements LinearSolver {
    /** Pivot threshold, relative to the largest entry of the pivot's row, below which the matrix is singular. */
    public static final double DEFAULT_TOO_SMALL = DenseLu.DEFAULT_TOO_SMALL;
    /**
     * A diagonal pivot (in the fill-reducing order) is kept while its magnitude is at least this
     * fraction of the largest candidate in its column; 1 would be plain partial pivoting.
     */
    public static final double PIVOT_THRESHOLD = 0.1;

    private final double tooSmall;
    /** Pattern of A by columns, column order, pivot rows, patterns of L and U, reach. */
    private final SparseLuSymbolic sym = new SparseLuSymbolic();
    private int n = -1;
    private double[] rowScale;
    // A, equilibrated, by columns (values beside sym.ai).
    private double[] ax;
    // Union of the patterns seen, one bit per entry, row-major.
    private long[] pattern;
    private int words;
    // Values of L (beside sym.li) and U (beside sym.ui).
    private double[] lx;
    private double[] ux;
    // Work.
    private double[] x;
    private double[] y;
    private boolean factored;
    /** The pattern whose column store and order are set up, for {@link #factor(MnaSystem.Pattern, double[])}. */
    private MnaSystem.Pattern lastPattern;
    private int[] toColumn;
    private double[] gathered;
    /** Whether the factors' patterns and pivot order may serve a numeric {@link #refactor}. */
    private boolean refactorReady;
    /** Whether no entry has been recorded in {@link #pattern} since it was allocated. */
    private boolean bitsEmpty;

    public SparseLu() {
        this(DEFAULT_TOO_SMALL);
    }

    /** @param tooSmall pivot threshold relative to the pivot row's largest original entry */
    public SparseLu(double tooSmall) {
        this.tooSmall = tooSmall;
    }

    /** Nonzeros of L and U of the last factorisation (L's unit diagonal included), for tests and reports. */
    public int factorNonzeros() {
        return factored ? sym.factorNonzeros() : 0;
    }

    @Override
    public void factor(double[][] a, int size) {
        factored = false;
        if (size != n) {
            allocate(size);
        }
        lastPattern = null; // the column store is about to hold a dense matrix's entries
        refactorReady = false;
        boolean grew = scatter(a);
        bitsEmpty = false;
        if (grew || sym.order == null) {
            sym.order = minimumDegree();
        }
        decompose();
        factored = true;
    }

    /**
     * Factor the dense array {@code a} reading only the positions of a circuit's pattern: every
     * entry outside it must be zero (as in a matrix {@link MnaSystem#evaluate} filled, with rows
     * replaced only within the pattern). The cost follows the entries, not n².
     *
     * @throws AnalysisException SINGULAR as {@link #factor(double[][], int)}
     */
    void factor(MnaSystem.Pattern p, double[][] a) {
        if (gathered == null || gathered.length < p.entries()) {
            gathered = new double[p.entries()];
        }
        for (int i = 0; i < p.size; i++) {
            double[] row = a[i];
            for (int k = p.rowStart[i]; k < p.rowStart[i + 1]; k++) {
                gathered[k] = row[p.columns[k]];
            }
        }
        factor(p, gathered);
    }

    /**
     * Factor a matrix given as the values of a circuit's pattern (row by row, as
     * {@link MnaSystem#pattern()} orders them): no dense array is read, so the cost follows the
     * entries, not their square. The order is made once per pattern.
     *
     * @throws AnalysisException SINGULAR as {@link #factor(double[][], int)}
     */
    void factor(MnaSystem.Pattern p, double[] values) {
        factored = false;
        if (p.size != n) {
            allocate(p.size);
            lastPattern = null;
        }
        if (p != lastPattern) {
            toColumn = sym.columnStore(p);
            if (ax.length < sym.ai.length) {
                ax = new double[sym.ai.length];
            }
            for (int i = 0; i < n; i++) {
                int base = i * words;
                for (int k = p.rowStart[i]; k < p.rowStart[i + 1]; k++) {
                    int j = p.columns[k];
                    pattern[base + (j >>> 6)] |= 1L << (j & 63);
                }
            }
            // A fresh union pattern equals p's: take p's shared order (the same algorithm on
            // the same graph) instead of making it again.
            sym.order = bitsEmpty ? p.fillOrder() : minimumDegree();
            bitsEmpty = false;
            lastPattern = p;
            refactorReady = false;
        }
        for (int i = 0; i < n; i++) {
            double max = 0;
            for (int k = p.rowStart[i]; k < p.rowStart[i + 1]; k++) {
                double m = Math.abs(values[k]);
                if (!(m <= Double.MAX_VALUE)) {
                    throw new AnalysisException(AnalysisException.Kind.SINGULAR,
                            "the system matrix holds a non-finite entry in row " + i);
                }
                max = Math.max(max, m);
            }
            if (max == 0) {
                throw new AnalysisException(AnalysisException.Kind.SINGULAR,
                        "the system matrix has an empty row " + i);
            }
            double inv = 1.0 / max;
            rowScale[i] = inv;
            for (int k = p.rowStart[i]; k < p.rowStart[i + 1]; k++) {
                ax[toColumn[k]] = values[k] * inv;
            }
        }
        if (!(refactorReady && refactor())) {
            decompose();
            prepareRefactor();
        }
        factored = true;
    }

    /** Sort each column of U by row (the diagonal stays last) so that {@link #refactor} can run in order. */
    private void prepareRefactor() {
        sym.sortColumnsOfU(ux, null);
        refactorReady = true;
    }

    /**
     * Numeric factorisation on the pivot order and the L and U patterns of the last full
     * factorisation (same pattern of A, new values): no search. Fails, leaving the work array
     * clean, when a pivot falls below {@link #PIVOT_THRESHOLD} of its column or the singularity
     * threshold; the caller then factors afresh with pivoting.
     */
    private boolean refactor() {
        double[] w = x;
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
                w[pinv[ai[p]]] = ax[p];
            }
            int diag = up[k + 1] - 1;
            for (int p = up[k]; p < diag; p++) {
                int j = ui[p];
                double ujk = w[j];
                w[j] = 0;
                ux[p] = ujk;
                if (ujk != 0) {
                    for (int q = lp[j] + 1, end = lp[j + 1]; q < end; q++) {
                        w[li[q]] -= lx[q] * ujk;
                    }
                }
            }
            double pivot = w[k];
            w[k] = 0;
            double max = 0;
            for (int q = lp[k] + 1, end = lp[k + 1]; q < end; q++) {
                max = Math.max(max, Math.abs(w[li[q]]));
            }
            double m = Math.abs(pivot);
            if (!(m > tooSmall) || m < PIVOT_THRESHOLD * max) {
                for (int q = lp[k] + 1, end = lp[k + 1]; q < end; q++) {
                    w[li[q]] = 0;
                }
                refactorReady = false;
                return false;
            }
            ux[diag] = pivot;
            for (int q = lp[k] + 1, end = lp[k + 1]; q < end; q++) {
                int i = li[q];
                lx[q] = w[i] / pivot;
                w[i] = 0;
            }
        }
        return true;
    }

    @Override
    public void solve(double[] b) {
        double[] v = y;
        int[] pinv = sym.pinv;
        int[] lp = sym.lp;
        int[] li = sym.li;
        int[] up = sym.up;
        int[] ui = sym.ui;
        int[] order = sym.order;
        for (int i = 0; i < n; i++) {
            v[pinv[i]] = b[i] * rowScale[i];
        }
        for (int j = 0; j < n; j++) {
            double vj = v[j];
            if (vj != 0) {
                for (int p = lp[j] + 1, end = lp[j + 1]; p < end; p++) {
                    v[li[p]] -= lx[p] * vj;
                }
            }
        }
        for (int j = n - 1; j >= 0; j--) {
            int diag = up[j + 1] - 1;
            double vj = v[j] / ux[diag];
            v[j] = vj;
            if (vj != 0) {
                for (int p = up[j]; p < diag; p++) {
                    v[ui[p]] -= ux[p] * vj;
                }
            }
        }
        for (int k = 0; k < n; k++) {
            b[order[k]] = v[k];
        }
    }

    private void allocate(int size) {
        refactorReady = false;
        n = size;
        sym.allocate(size, 4 * size + 16, 8 * size + 16);
        rowScale = new double[size];
        ax = new double[sym.ai.length];
        words = (size + 63) >>> 6;
        pattern = new long[size * words];
        bitsEmpty = true;
        lx = new double[sym.li.length];
        ux = new double[sym.ui.length];
        x = new double[size];
        y = new double[size];
    }

    /** Equilibrate the rows of a into the column store; true when the union pattern grew. */
    private boolean scatter(double[][] a) {
        int[] ap = sym.ap;
        Arrays.fill(ap, 0);
        int nnz = 0;
        boolean grew = false;
        for (int i = 0; i < n; i++) {
            double[] row = a[i];
            double max = 0;
            int base = i * words;
            for (int j = 0; j < n; j++) {
                double v = row[j];
                if (v != 0) {
                    double m = Math.abs(v);
                    if (!(m <= Double.MAX_VALUE)) {
                        throw new AnalysisException(AnalysisException.Kind.SINGULAR,
                                "the system matrix holds a non-finite entry in row " + i);
                    }
                    max = Math.max(max, m);
                    ap[j + 1]++;
                    nnz++;
                    long bit = 1L << (j & 63);
                    if ((pattern[base + (j >>> 6)] & bit) == 0) {
                        pattern[base + (j >>> 6)] |= bit;
                        grew = true;
                    }
                } else if (v != v) {
                    throw new AnalysisException(AnalysisException.Kind.SINGULAR,
                            "the system matrix holds a non-finite entry in row " + i);
                }
            }
            if (max == 0) {
                throw new AnalysisException(AnalysisException.Kind.SINGULAR,
                        "the system matrix has an empty row " + i);
            }
            rowScale[i] = 1.0 / max;
        }
        for (int j = 0; j < n; j++) {
            ap[j + 1] += ap[j];
        }
        if (sym.ai.length < nnz) {
            sym.ai = new int[2 * nnz];
            ax = new double[2 * nnz];
        }
        int[] ai = sym.ai;
        int[] next = sym.xi; // as a cursor per column
        System.arraycopy(ap, 0, next, 0, n);
        for (int i = 0; i < n; i++) {
            double[] row = a[i];
            double s = rowScale[i];
            for (int j = 0; j < n; j++) {
                double v = row[j];
                if (v != 0) {
                    int p = next[j]++;
                    ai[p] = i;
                    ax[p] = v * s;
                }
            }
        }
        return grew;
    }

    /**
     * Minimum-degree order of the union pattern made symmetric (A + Aᵀ), on an explicit
     * elimination graph: repeatedly the vertex of least degree (lowest index on ties) is
     * eliminated and its neighbours joined into a clique.
     */
    private int[] minimumDegree() {
        return SparseLuSymbolic.minimumDegree(pattern, n, words);
    }

    /** Gilbert–Peierls left-looking factorisation of the column store in the symbolic part's order. */
    private void decompose() {
        sym.beginDecompose();
        int[] order = sym.order;
        int[] pinv = sym.pinv;
        int[] xi = sym.xi;
        int[] lp = sym.lp;
        int[] up = sym.up;
        int[] li = sym.li;
        int[] ui = sym.ui;
        int lnz = 0;
        int unz = 0;
        for (int k = 0; k < n; k++) {
            lp[k] = lnz;
            up[k] = unz;
            int cap = sym.roomInL(lnz);
            if (cap > 0) {
                li = sym.li;
                lx = Arrays.copyOf(lx, cap);
            }
            cap = sym.roomInU(unz);
            if (cap > 0) {
                ui = sym.ui;
                ux = Arrays.copyOf(ux, cap);
            }
            int col = order[k];
            int top = lowerSolve(col);
            int ipiv = -1;
            double best = -1;
            for (int p = top; p < n; p++) {
                int i = xi[p];
                if (pinv[i] < 0) {
                    double t = Math.abs(x[i]);
                    if (t > best) {
                        best = t;
                        ipiv = i;
                    }
                } else {
                    ui[unz] = pinv[i];
                    ux[unz++] = x[i];
                }
            }
            if (ipiv < 0 || !(best > tooSmall)) {
                throw new AnalysisException(AnalysisException.Kind.SINGULAR,
                        "the system matrix is singular at unknown " + k);
            }
            if (pinv[col] < 0 && sym.reached(col) && Math.abs(x[col]) >= PIVOT_THRESHOLD * best) {
                ipiv = col;
            }
            double pivot = x[ipiv];
            ui[unz] = k;
            ux[unz++] = pivot;
            pinv[ipiv] = k;
            li[lnz] = ipiv;
            lx[lnz++] = 1;
            for (int p = top; p < n; p++) {
                int i = xi[p];
                if (pinv[i] < 0) {
                    li[lnz] = i;
                    lx[lnz++] = x[i] / pivot;
                }
                x[i] = 0;
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
            x[xi[p]] = 0;
        }
        for (int p = ap[col]; p < ap[col + 1]; p++) {
            x[ai[p]] = ax[p];
        }
        for (int px = top; px < n; px++) {
            int j = xi[px];
            int jj = pinv[j];
            if (jj < 0) {
                continue;
            }
            double xj = x[j];
            if (xj != 0) {
                for (int p = lp[jj] + 1, end = lp[jj + 1]; p < end; p++) {
                    x[li[p]] -= lx[p] * xj;
                }
            }
        }
        return top;
    }
}
