package halfrail.check;

import halfrail.circuit.Circuit;
import halfrail.design.Design;
import halfrail.design.DesignCircuit;
import halfrail.design.DesignCircuits;
import halfrail.design.StageNodes;
import halfrail.parts.LeakageLevel;
import halfrail.solve.AcAnalysis;
import halfrail.solve.AnalysisException;
import halfrail.solve.DcSolver;
import halfrail.solve.FloatingNodes;
import halfrail.solve.MnaSystem;
import halfrail.solve.OpAmpState;
import halfrail.solve.OperatingPoint;

import java.util.List;

/**
 * What every study starts from: the design's circuit at one supply voltage with typical leakage,
 * its operating point, and the nominal signal peak at every op-amp output.
 *
 * <p>The signal peak comes from one small-signal analysis at this operating point (the peak of
 * the passband response from the source to the output over the design's band, times the source
 * peak, reduced behind a clipping stage exactly as {@link DesignAnalysis} reduces it: the
 * demanded peak of {@link SignalEnvelope}) and is then reused at every other supply voltage and
 * every tolerance build: the signal gain is set by resistor ratios and hardly moves with the supply, and solving an AC response
 * per build would cost more than the DC solve it accompanies. Headroom figures of the studies are
 * therefore "at the nominal signal gain".
 */
final class NominalStudy {
    final Design design;
    final DesignCircuit circuit;
    final OperatingPoint op;
    final double supplyVolts;
    final List<StageNodes> opAmps;
    /**
     * Nominal signal peak at each op-amp output, V, in {@link #opAmps} order: the demanded peak
     * ({@link SignalEnvelope#outputPeakVolts}), the same figure as the design check's swing.
     */
    final double[] signalPeakVolts;
    final double sourcePeakVolts;
    /** The signal's peaks along the chain at {@link #op}, clip-aware; used for every later swing. */
    final SignalEnvelope envelope;
    final double minHeadroomDb;

    private NominalStudy(Design design, DesignCircuit circuit, OperatingPoint op) {
        this.design = design;
        this.circuit = circuit;
        this.op = op;
        this.supplyVolts = circuit.supplyVolts();
        this.opAmps = circuit.opAmps();
        this.sourcePeakVolts = design.source().voltsPeak();
        this.minHeadroomDb = design.thresholds().minHeadroomDb();
        envelope = SignalEnvelope.of(circuit, op, new AcAnalysis(op), design.source());
        signalPeakVolts = new double[opAmps.size()];
        for (int k = 0; k < opAmps.size(); k++) {
            signalPeakVolts[k] = envelope.outputPeakVolts(k);
        }
    }

    /**
     * Build and solve the design at {@code supplyVolts}.
     *
     * @throws AnalysisException FLOATING_NODE, NO_CONVERGENCE or SINGULAR when the nominal circuit cannot be solved
     */
    static NominalStudy of(Design design, double supplyVolts) {
        return of(design, DesignCircuits.build(design, supplyVolts, LeakageLevel.TYPICAL));
    }

    /** Solve {@code dc}, the circuit of {@code design}. */
    static NominalStudy of(Design design, DesignCircuit dc) {
        List<String> floating = FloatingNodes.find(dc.circuit());
        if (!floating.isEmpty()) {
            throw new AnalysisException(AnalysisException.Kind.FLOATING_NODE,
                    "no DC path at " + String.join(", ", floating), floating);
        }
        OperatingPoint op = new DcSolver(MnaSystem.of(dc.circuit())).solve();
        return new NominalStudy(design, dc, op);
    }

    /**
     * Solve {@code c} (same topology as the circuit of {@code from}) with Newton started from
     * {@code from}'s solution — unless an op-amp that was linear there would find its open-loop
     * target beyond a rail at that starting point (a changed offset times an open-loop gain of
     * 1e5 easily does): Newton cannot leave a saturated limiter whose slope is zero, so it is then
     * started from the linearised circuit instead, as it is when the warm start fails to converge.
     * The equations reuse {@code from}'s unknowns ({@link MnaSystem#withValuesOf}).
     */
    static OperatingPoint solve(Circuit c, OperatingPoint from) {
        MnaSystem system = from.system().withValuesOf(c);
        DcSolver s = new DcSolver(system);
        double[] guess = from.solution();
        for (OpAmpState st : from.opAmps()) {
            if (!st.saturated() && system.saturated(guess, st.name())) {
                return s.solve();
            }
        }
        try {
            return s.solveFrom(guess);
        } catch (AnalysisException e) {
            if (e.kind() == AnalysisException.Kind.NO_CONVERGENCE || e.kind() == AnalysisException.Kind.SINGULAR) {
                return s.solve();
            }
            throw e;
        }
    }

    /**
     * The swing of op-amp {@code k} at operating point {@code p} solved at {@code volts}, at the
     * nominal signal, with the drive that reaches it through the stages before it at {@code p}'s
     * windows (a stage that clips only at this supply reduces what the later ones are asked for).
     */
    SwingReport swing(OperatingPoint p, int k, double volts) {
        OpAmpState st = p.opAmp(opAmps.get(k).opAmp()).orElseThrow();
        return envelope.swing(k, envelope.driveAt(p, k), volts, st.outputVolts(), st.swingLowVolts(),
                st.swingHighVolts(), st.saturated());
    }

    /**
     * Whether op-amp {@code k} passes: not saturated at rest and, for a signal stage, headroom at
     * the nominal signal of at least the design's {@code minHeadroomDb}.
     */
    boolean passes(SwingReport s, int k) {
        if (s.saturated()) {
            return false;
        }
        return !opAmps.get(k).signal() || s.headroomDbOrInfinite() >= minHeadroomDb;
    }
}
