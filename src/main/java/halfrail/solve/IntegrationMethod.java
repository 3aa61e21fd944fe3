package halfrail.solve;

/**
 * A linear multistep formula for the time derivative of the charges, for variable steps:
 * <pre>
 *   dq/dt(t_{n+1}) ≈ (α0·q_{n+1} + α1·q_n + … + αk·q_{n+1−k}) / h_n,   h_n = t_{n+1} − t_n
 * </pre>
 * and the factor of its local truncation error. A method supplies only these formulas; the one
 * stepping loop ({@link TransientStepper}) does Newton's method, error control and step-size
 * selection for every method.
 *
 * <p>Local-error convention: a formula of order p, applied to the exact solution, leaves a
 * local error in x of about {@code E · x^{(p+1)}/(p+1)!}; the loop estimates
 * {@code x^{(p+1)}/(p+1)!} by the divided difference of order p+1 over the new point and the
 * last p+1 accepted points, and multiplies it by {@link #errorFactor} = |E|. With the offsets
 * {@code s_i = t_{n+1−i} − t_{n+1}}, E = Σ αi·s_i^{p+1} / α0 (Taylor expansion about t_{n+1}).
 */
interface IntegrationMethod {
    /** Order p: the formula is exact for polynomials of degree ≤ p. */
    int order();

    /** Number k of past points (besides the new one) the formula uses. */
    int pastPoints();

    /**
     * Write α0…αk into {@code alpha}.
     *
     * @param steps {@code steps[0] = h_n}, {@code steps[1] = h_{n−1}}, … in s; at least
     *              {@link #pastPoints()} entries
     */
    void coefficients(double[] steps, double[] alpha);

    /** |E| of the class comment, in s^(p+1), for the steps as in {@link #coefficients}. */
    double errorFactor(double[] steps);

    /** A short name for reports, for example {@code "BDF2"}. */
    String name();
}
