package halfrail.solve;

import java.util.Arrays;

/**
 * The symbolic half of the sparse LU factorisations {@link SparseLu} (real) and
 * {@link SparseComplexLu} (complex), which keep only their values and arithmetic: the pattern of A
 * by columns, the column order, the row permutation and the patterns of L and U, the depth-first
 * reach that gives the nonzero pattern of each column's triangular solve (Gilbert and Peierls,
 * SIAM J. Sci. Stat. Comput. 9, 1988; Davis, <i>Direct Methods for Sparse Linear Systems</i>, SIAM
 * 2006, §3.2 and §6.3), and the minimum-degree order of a pattern.
 *
 * <p>The arrays are open to the two numeric classes, which index their value arrays in step with
 * them ({@code ax} beside {@link #ai}, {@code lx} beside {@link #li}, {@code ux} beside
 * {@link #ui}); nothing here allocates once the arrays have their size. One instance belongs to
 * one solver.
 */
final class SparseLuSymbolic {
    /** Order of the matrix; -1 before the first {@link #allocate}. */
    int n = -1;
    /** A by columns: column j's entries are rows {@code ai[ap[j] .. ap[j+1]-1]}. */
    int[] ap;
    int[] ai;
    /** Column order: step k eliminates column {@code order[k]}; null until one is made. */
    int[] order;
    /** L by columns, unit diagonal first; U by columns, diagonal last. */
    int[] lp;
    int[] li;
    int[] up;
    int[] ui;
    /** Step at which each row became a pivot; -1 for rows not yet pivoted (during a factorisation). */
    int[] pinv;
    /** The reach of the last {@link #reach} in {@code xi[top .. n-1]}; between reaches, free as a cursor of size n. */
    int[] xi;
    private int[] stack;
    private int[] pstack;
    private int[] mark;
    private int stamp;

    /**
     * Arrays for order {@code size}: room for {@code columnCapacity} entries of A and
     * {@code factorCapacity} entries each of L and U (both grow as needed); the order is dropped.
     */
    void allocate(int size, int columnCapacity, int factorCapacity) {
        n = size;
        ap = new int[size + 1];
        ai = new int[columnCapacity];
        order = null;
        lp = new int[size + 1];
        up = new int[size + 1];
        li = new int[factorCapacity];
        ui = new int[factorCapacity];
        pinv = new int[size];
        xi = new int[size];
        stack = new int[size];
        pstack = new int[size];
        mark = new int[size];
        stamp = 0;
    }

    /**
     * Lay out A by columns for the entries of {@code p} (of order {@link #n}), growing {@link #ai}
     * if it is too short. Returns, for each entry of p (row by row), its slot in the column store.
     */
    int[] columnStore(MnaSystem.Pattern p) {
        int entries = p.entries();
        if (ai.length < entries) {
            ai = new int[entries];
        }
        Arrays.fill(ap, 0);
        for (int k = 0; k < entries; k++) {
            ap[p.columns[k] + 1]++;
        }
        for (int j = 0; j < n; j++) {
            ap[j + 1] += ap[j];
        }
        int[] toColumn = new int[entries];
        int[] next = xi; // as a cursor per column
        System.arraycopy(ap, 0, next, 0, n);
        for (int i = 0; i < n; i++) {
            for (int k = p.rowStart[i]; k < p.rowStart[i + 1]; k++) {
                int slot = next[p.columns[k]]++;
                ai[slot] = i;
                toColumn[k] = slot;
            }
        }
        return toColumn;
    }

    /** Nonzeros of L and U of the last factorisation, L's unit diagonal included. */
    int factorNonzeros() {
        return lp[n] + up[n];
    }

    /** Start a full factorisation: no row is a pivot yet. */
    void beginDecompose() {
        Arrays.fill(pinv, -1);
    }

    /**
     * Make room for one more column of L after its first {@code lnz} entries; returns the new
     * length of {@link #li} when it grew (the caller grows its values to match), else 0.
     */
    int roomInL(int lnz) {
        if (lnz + n <= li.length) {
            return 0;
        }
        int cap = 2 * li.length + n;
        li = Arrays.copyOf(li, cap);
        return cap;
    }

    /** As {@link #roomInL} for U and {@link #ui}. */
    int roomInU(int unz) {
        if (unz + n <= ui.length) {
            return 0;
        }
        int cap = 2 * ui.length + n;
        ui = Arrays.copyOf(ui, cap);
        return cap;
    }

    /** Close a full factorisation of lnz and unz entries: L's rows are renumbered to pivot steps. */
    void endDecompose(int lnz, int unz) {
        lp[n] = lnz;
        up[n] = unz;
        for (int p = 0; p < lnz; p++) {
            li[p] = pinv[li[p]];
        }
    }

    /**
     * The nonzero pattern of L \ A(:, col) over the columns of L made so far (rows in their
     * original numbering), left in {@code xi[top .. n-1]} in topological order and marked so that
     * {@link #reached} tells them. Returns top.
     */
    int reach(int col) {
        if (++stamp == Integer.MAX_VALUE) {
            Arrays.fill(mark, 0);
            stamp = 1;
        }
        int top = n;
        for (int p = ap[col]; p < ap[col + 1]; p++) {
            int i = ai[p];
            if (mark[i] != stamp) {
                top = depthFirst(i, top);
            }
        }
        return top;
    }

    /** Whether row i is in the pattern of the last {@link #reach}. */
    boolean reached(int i) {
        return mark[i] == stamp;
    }

    /** Non-recursive depth-first search from row j in the graph of L; pushes finished rows onto xi. */
    private int depthFirst(int start, int top) {
        int head = 0;
        stack[0] = start;
        while (head >= 0) {
            int j = stack[head];
            int jj = pinv[j];
            if (mark[j] != stamp) {
                mark[j] = stamp;
                pstack[head] = jj < 0 ? 0 : lp[jj];
            }
            boolean done = true;
            int end = jj < 0 ? 0 : lp[jj + 1];
            for (int p = pstack[head]; p < end; p++) {
                int i = li[p];
                if (mark[i] == stamp) {
                    continue;
                }
                pstack[head] = p;
                stack[++head] = i;
                done = false;
                break;
            }
            if (done) {
                head--;
                xi[--top] = j;
            }
        }
        return top;
    }

    /**
     * Sort each column of U by row (the diagonal stays last), moving the values {@code re} and,
     * when not null, {@code im} along, so that a refactorisation can run the columns in order.
     */
    void sortColumnsOfU(double[] re, double[] im) {
        for (int k = 0; k < n; k++) {
            int start = up[k];
            int end = up[k + 1] - 1; // the diagonal is last and the largest row index
            for (int p = start + 1; p < end; p++) {
                int row = ui[p];
                double vr = re[p];
                double vi = im != null ? im[p] : 0;
                int q = p - 1;
                while (q >= start && ui[q] > row) {
                    ui[q + 1] = ui[q];
                    re[q + 1] = re[q];
                    if (im != null) {
                        im[q + 1] = im[q];
                    }
                    q--;
                }
                ui[q + 1] = row;
                re[q + 1] = vr;
                if (im != null) {
                    im[q + 1] = vi;
                }
            }
        }
    }

    /**
     * Minimum-degree order of the pattern {@code bits} (n rows of {@code words} 64-bit words,
     * row-major) made symmetric (A + Aᵀ), on an explicit elimination graph: repeatedly the vertex
     * of least degree (lowest index on ties) is eliminated and its neighbours joined into a clique
     * (Tinney and Walker's scheme 2). Used by {@link SparseLu} and
     * {@link MnaSystem.Pattern#fillOrder()}.
     */
    static int[] minimumDegree(long[] bits, int n, int words) {
        long[] adj = new long[n * words];
        for (int i = 0; i < n; i++) {
            for (int w = 0; w < words; w++) {
                long row = bits[i * words + w];
                while (row != 0) {
                    int j = (w << 6) + Long.numberOfTrailingZeros(row);
                    row &= row - 1;
                    if (j != i) {
                        adj[i * words + (j >>> 6)] |= 1L << (j & 63);
                        adj[j * words + (i >>> 6)] |= 1L << (i & 63);
                    }
                }
            }
        }
        int[] degree = new int[n];
        for (int i = 0; i < n; i++) {
            degree[i] = popCount(adj, i, words);
        }
        boolean[] gone = new boolean[n];
        int[] result = new int[n];
        for (int k = 0; k < n; k++) {
            int v = -1;
            for (int i = 0; i < n; i++) {
                if (!gone[i] && (v < 0 || degree[i] < degree[v])) {
                    v = i;
                }
            }
            result[k] = v;
            gone[v] = true;
            int vb = v * words;
            long vbit = 1L << (v & 63);
            int vw = v >>> 6;
            for (int w = 0; w < words; w++) {
                long row = adj[vb + w];
                while (row != 0) {
                    int u = (w << 6) + Long.numberOfTrailingZeros(row);
                    row &= row - 1;
                    int ub = u * words;
                    for (int z = 0; z < words; z++) {
                        adj[ub + z] |= adj[vb + z];
                    }
                    adj[ub + (u >>> 6)] &= ~(1L << (u & 63));
                    adj[ub + vw] &= ~vbit;
                    degree[u] = popCount(adj, u, words);
                }
            }
        }
        return result;
    }

    private static int popCount(long[] adj, int i, int words) {
        int count = 0;
        for (int w = 0; w < words; w++) {
            count += Long.bitCount(adj[i * words + w]);
        }
        return count;
    }
}
