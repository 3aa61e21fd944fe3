package halfrail.solve;

/**
 * Chooses the real linear solver by system size: {@link DenseLu} for the smallest systems, where
 * its tight loops beat any bookkeeping, {@link SparseLu} from {@link #SPARSE_FROM_UNKNOWNS}
 * unknowns on, where the dense solver's cubic cost (and the n² of clearing and reading a dense
 * matrix) takes over. A circuit row holds some 3 to 6 entries; a 64-stage chain has about 500
 * unknowns.
 */
final class LinearSolvers {
    /**
     * Number of unknowns from which the sparse solver is used. Set from measurements on the
     * generated stage chains (thread CPU time, 2026-12-02): at 13 unknowns (one stage) the DC
     * operating point costs the same either way and the power-on transient half as much sparse;
     * at 25 unknowns (three stages) sparse halves both.
     */
    static final int SPARSE_FROM_UNKNOWNS = 10;

    private LinearSolvers() {}

    /** A new solver suited to systems of {@code unknowns} unknowns. */
    static LinearSolver forSize(int unknowns) {
        return unknowns >= SPARSE_FROM_UNKNOWNS ? new SparseLu() : new DenseLu();
    }
}
