package halfrail.solve;

/**
 * A test-only observer of every result the solvers return. {@link #listener} is null in
 * production, where each solver pays one volatile read and a null check per result (per
 * frequency in the AC analysis). The test suite installs a listener that checks Kirchhoff's
 * current law and that every reported number is finite (see DEVELOPERS.md, "Tests").
 *
 * <p>A listener only reads what it is given: the arrays are the solver's own and must not be
 * written; the hook never changes a result and never throws into the solver (a listener's
 * exception is caught and recorded by the listener itself).
 */
final class SolveAudit {

    /** Receives every result; each method is called on the thread that solved. */
    interface Listener {
        /** A DC operating point, as {@link DcSolver} returns it. */
        void operatingPoint(OperatingPoint op);

        /** A power-on run, as {@link PowerOnTransient#run} returns it. */
        void powerOn(PowerOnResult result);

        /**
         * One AC solve: {@code (g + jωc)·x = b} at {@code omega} rad/s, x = xRe + j·xIm. The arrays
         * are the analysis's work arrays: read them before returning, never write them.
         */
        void acSolve(MnaSystem system, double[][] g, double[][] c, double omega, double[] b, double[] xRe,
                     double[] xIm);
    }

    /** Null in production; set by the test suite. */
    static volatile Listener listener;

    private SolveAudit() {}
}
