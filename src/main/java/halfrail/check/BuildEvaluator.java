package halfrail.check;

import halfrail.circuit.Circuit;
import halfrail.solve.OperatingPoint;

/**
 * Solves tolerance builds of one {@link ToleranceModel}: the DC operating point of the build's
 * circuit, Newton started from the nominal solution, and every op-amp's rest point and headroom
 * at the nominal signal (the nominal signal gain, reused). Not thread-safe only in that the
 * caller's output arrays are written; the evaluator itself holds no mutable state.
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
    private final DcSolve dc;

    BuildEvaluator(ToleranceModel model, DcSolve dc) {
        this.model = model;
        this.nominal = NominalStudy.of(model.design(), model.nominalCircuit());
        this.dc = dc;
    }

    BuildEvaluator(ToleranceModel model) {
        this(model, NominalStudy::solve);
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
    boolean evaluate(double[] values, double[] quiescentVolts, double[] headroomDb, boolean[] saturated) {
        OperatingPoint p = dc.solve(model.circuit(values), nominal.op);
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
