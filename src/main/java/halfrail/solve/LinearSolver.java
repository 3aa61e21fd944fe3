package halfrail.solve;

/**
 * Solves a square real linear system A·x = b. {@link #factor} decomposes A once; {@link #solve}
 * can then be called for many right-hand sides. Implementations reuse their work arrays, so one
 * instance serves one thread.
 */
public interface LinearSolver {
    /**
     * Decompose {@code a} (n × n, row-major). The array may be overwritten.
     *
     * @throws AnalysisException of kind SINGULAR when a pivot is below the solver's threshold
     */
    void factor(double[][] a, int n);

    /** Overwrite {@code b} with the solution of A·x = b for the last factored A. */
    void solve(double[] b);
}
