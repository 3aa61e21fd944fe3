package halfrail.solve;

/**
 * Chooses the real linear solver by system size: {@link DenseLu} for stage-sized systems, where
 * its tight loops beat any bookkeeping, {@link SparseLu} from {@link #SPARSE_FROM_UNKNOWNS}
 * unknowns on, where the dense solver's cubic cost takes over (a 64-stage chain has about 400
 * unknowns and some 5 entries per row).
 */
final class LinearSolvers {
    /**
     * Number of unknowns from which the sparse solver is used. Set from the benchmarks of the
     * generated stage chains (OperatingPointBench, LinearSolverBench): below it the dense
     * solver is as fast or faster.
     */
    static final int SPARSE_FROM_UNKNOWNS = 60;

    private LinearSolvers() {}

    /** A new solver suited to systems of {@code unknowns} unknowns. */
    static LinearSolver forSize(int unknowns) {
        return unknowns >= SPARSE_FROM_UNKNOWNS ? new SparseLu() : new DenseLu();
    }
}
