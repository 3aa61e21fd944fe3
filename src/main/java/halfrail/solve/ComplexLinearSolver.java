package halfrail.solve;

/**
 * Solves a square complex linear system A·x = b, with the real and imaginary parts of every
 * matrix and vector held in separate {@code double} arrays (no object per entry). {@link #factor}
 * decomposes A once; {@link #solve} can then be called for many right-hand sides.
 * Implementations reuse their work arrays, so one instance serves one thread.
 */
public interface ComplexLinearSolver {
    /**
     * Decompose A = {@code re} + j·{@code im} (both n × n, row-major). Both arrays may be
     * overwritten (rows may be swapped).
     *
     * @throws AnalysisException of kind SINGULAR when a pivot is below the solver's threshold
     *                           or an entry is not finite
     */
    void factor(double[][] re, double[][] im, int n);

    /**
     * Overwrite {@code bRe} + j·{@code bIm} with the solution x of A·x = b for the last
     * factored A.
     */
    void solve(double[] bRe, double[] bIm);

    /**
     * Overwrite {@code bRe} + j·{@code bIm} with the solution y of Aᵀ·y = b (the plain transpose,
     * not the conjugate) for the last factored A, from the same factors. One such solve with the
     * unit vector of an output node gives that node's response to a current injected anywhere:
     * the adjoint (reciprocity-free) form of the transfer, eᵀA⁻¹b = (A⁻ᵀe)ᵀb.
     */
    void solveTransposed(double[] bRe, double[] bIm);
}
