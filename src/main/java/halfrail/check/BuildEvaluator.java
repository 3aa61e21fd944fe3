package halfrail.check;

import halfrail.circuit.Circuit;
import halfrail.circuit.Element;
import halfrail.circuit.OpAmp;
import halfrail.design.StageNodes;
import halfrail.solve.AnalysisException;
import halfrail.solve.DcSolver;
import halfrail.solve.MnaSystem;
import halfrail.solve.OpAmpState;
import halfrail.solve.OperatingPoint;

import java.util.List;

/**
 * Solves tolerance builds of one {@link ToleranceModel}: the DC operating point of the build's
 * circuit, Newton started from the nominal solution, and every op-amp's rest point and headroom
 * at the nominal signal (the nominal signal gain, reused). Not thread-safe only in that the
 * caller's output arrays are written; the evaluator itself holds no mutable state.
 *
 * <p>What does not change between builds is done once: a build's equations share the nominal
 * system's unknowns, sparsity pattern and fill-reducing order ({@link MnaSystem#withValuesOf}),
 * and its floating-node check (the graph is the same), and a {@link Work} carries one solver's
 * arrays and sparse factors from build to build ({@link DcSolver#reusedFor}); each build's answer
 * is read from the solution vector, without an {@link OperatingPoint} and its maps. A work serves
 * one chunk of builds on one thread, so the numbers do not depend on which thread ran the chunk.
 */
final class BuildEvaluator {
    /** How a build's circuit is solved; replaceable so that tests can make chosen builds fail. */
    @FunctionalInterface
    interface DcSolve {
        /** @throws halfrail.solve.AnalysisException when the circuit cannot be solved */
        OperatingPoint solve(Circuit circuit, OperatingPoint from);
    }

    final ToleranceModel model;
    final NominalStudy nominal;
    /** The replaced solve (tests), or null for the build-level solve on reused work. */
    private final DcSolve dc;
    private final double[] guess;
    private final boolean[] nominalSaturated;
    private final String[] opAmpNames;
    private final int[] opAmpElement;
    private final int[] outIndex;
    private final int[] vPosIndex;
    private final int[] vNegIndex;

    BuildEvaluator(ToleranceModel model, DcSolve dc) {
        this.model = model;
        this.nominal = NominalStudy.of(model.design(), model.nominalCircuit());
        this.dc = dc;
        OperatingPoint op = nominal.op;
        MnaSystem system = op.system();
        this.guess = op.solution();
        List<OpAmpState> states = op.opAmps();
        this.nominalSaturated = new boolean[states.size()];
        for (int j = 0; j < states.size(); j++) {
            nominalSaturated[j] = states.get(j).saturated();
        }
        this.opAmpNames = states.stream().map(OpAmpState::name).toArray(String[]::new);
        int m = nominal.opAmps.size();
        List<Element> elements = system.circuit().elements();
        this.opAmpElement = new int[m];
        this.outIndex = new int[m];
        this.vPosIndex = new int[m];
        this.vNegIndex = new int[m];
        for (int k = 0; k < m; k++) {
            StageNodes sn = nominal.opAmps.get(k);
            int e = 0;
            while (!elements.get(e).name().equals(sn.opAmp())) {
                e++;
            }
            OpAmp o = (OpAmp) elements.get(e);
            opAmpElement[k] = e;
            outIndex[k] = system.nodeIndex(o.out());
            vPosIndex[k] = system.nodeIndex(o.vPos());
            vNegIndex[k] = system.nodeIndex(o.vNeg());
        }
    }

    BuildEvaluator(ToleranceModel model) {
        this(model, null);
    }

    /** Work carried from build to build by one thread: the solver whose arrays and factors are reused. */
    static final class Work {
        private DcSolver solver;
    }

    /** Fresh work, for one chunk of builds. */
    Work work() {
        return new Work();
    }

    int opAmpCount() {
        return nominal.opAmps.size();
    }

    /**
     * Solve the build of {@code values}; write each op-amp's rest point (V), headroom (dB) and
     * saturation into the arrays; return whether every op-amp passes.
     *
     * @throws halfrail.solve.AnalysisException when the build cannot be solved
     */
    boolean evaluate(double[] values, Work work, double[] quiescentVolts, double[] headroomDb, boolean[] saturated) {
        if (dc != null) {
            return evaluate(values, quiescentVolts, headroomDb, saturated);
        }
        Circuit c = model.circuit(values);
        MnaSystem system = nominal.op.system().withValuesOf(c);
        DcSolver s = work.solver == null ? new DcSolver(system) : work.solver.reusedFor(system);
        work.solver = s;
        double[] x = solve(s, system);
        List<Element> elements = c.elements();
        boolean all = true;
        double drive = 1;
        for (int k = 0; k < quiescentVolts.length; k++) {
            OpAmp o = (OpAmp) elements.get(opAmpElement[k]);
            var p = o.params();
            double out = at(x, outIndex[k]);
            double low = at(x, vNegIndex[k]) + p.swingLowVolts();
            double high = at(x, vPosIndex[k]) - p.swingHighVolts();
            // the drive reaching stage k through this build's windows of the stages before it
            double reaching = nominal.opAmps.get(k).signal() ? drive : 1;
            SwingReport r = nominal.envelope.swing(k, reaching, nominal.supplyVolts, out, low, high,
                    system.saturated(x, o.name()));
            drive = nominal.envelope.passOn(k, drive, out, low, high);
            quiescentVolts[k] = r.quiescentVolts();
            headroomDb[k] = r.headroomDbOrInfinite();
            saturated[k] = r.saturated();
            all &= nominal.passes(r, k);
        }
        return all;
    }

    /**
     * The build's solution as {@link NominalStudy#solve} finds it: Newton from the nominal solution,
     * or from the linearised circuit when an op-amp linear at nominal would start beyond a rail or
     * the warm start fails.
     */
    private double[] solve(DcSolver s, MnaSystem system) {
        for (int j = 0; j < opAmpNames.length; j++) {
            if (!nominalSaturated[j] && system.saturated(guess, opAmpNames[j])) {
                return s.solveVectorFrom(null);
            }
        }
        try {
            return s.solveVectorFrom(guess);
        } catch (AnalysisException e) {
            if (e.kind() == AnalysisException.Kind.NO_CONVERGENCE || e.kind() == AnalysisException.Kind.SINGULAR) {
                return s.solveVectorFrom(null);
            }
            throw e;
        }
    }

    private static double at(double[] x, int i) {
        return i < 0 ? 0 : x[i];
    }

    /**
     * As {@link #evaluate(double[], Work, double[], double[], boolean[])}, one build on its own:
     * through the replaced solve when there is one, else {@link NominalStudy#solve}.
     */
    boolean evaluate(double[] values, double[] quiescentVolts, double[] headroomDb, boolean[] saturated) {
        DcSolve solve = dc != null ? dc : NominalStudy::solve;
        OperatingPoint p = solve.solve(model.circuit(values), nominal.op);
        boolean all = true;
        for (int k = 0; k < quiescentVolts.length; k++) {
            SwingReport s = nominal.swing(p, k, nominal.supplyVolts);
            quiescentVolts[k] = s.quiescentVolts();
            headroomDb[k] = s.headroomDbOrInfinite();
            saturated[k] = s.saturated();
            all &= nominal.passes(s, k);
        }
        return all;
    }

    /** Whether op-amp {@code k} passes with this rest-point outcome. */
    boolean passes(int k, double headroomDb, boolean saturated) {
        if (saturated) {
            return false;
        }
        return !nominal.opAmps.get(k).signal() || headroomDb >= nominal.minHeadroomDb;
    }

    /**
     * How far the worst op-amp of a build is from failing, dB: the smallest headroom less the
     * required margin over the signal stages; −∞ when any op-amp is saturated.
     */
    double worstMarginDb(double[] headroomDb, boolean[] saturated) {
        double worst = Double.POSITIVE_INFINITY;
        for (int k = 0; k < headroomDb.length; k++) {
            if (saturated[k]) {
                return Double.NEGATIVE_INFINITY;
            }
            if (nominal.opAmps.get(k).signal()) {
                worst = Math.min(worst, headroomDb[k] - nominal.minHeadroomDb);
            }
        }
        return worst;
    }
}
