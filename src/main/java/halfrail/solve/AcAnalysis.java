package halfrail.solve;

import halfrail.circuit.Circuit;
import halfrail.circuit.CurrentSource;
import halfrail.circuit.Element;
import halfrail.circuit.VoltageSource;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;

/**
 * Small-signal AC analysis: the {@link Mode#DYNAMIC} equations of an {@link MnaSystem} linearised
 * at a DC {@link OperatingPoint}, solved as {@code (G + jωC)·X = b} at each frequency, where b is
 * {@link MnaSystem#sourceDirection} of the input source. Each op-amp contributes its dominant
 * pole at GBW/A; a saturated op-amp's limiter has almost no slope, so a stage sitting on a rail
 * has almost no gain, as it should.
 *
 * <p>Every response is a transfer per unit of input: the input source is driven with a unit
 * small-signal amplitude (1 V for a voltage source, 1 A for a current source), whatever its
 * {@link VoltageSource#acMagnitude()}; multiply by that magnitude for the output amplitude in V.
 * The AC magnitude only selects the default input: when the input name is {@code null}, the input
 * is the one voltage source with a nonzero AC magnitude.
 *
 * <p>The output is the voltage of one node, or the difference between two nodes.
 *
 * <p>Passband and corners: the reference gain is the largest |H| over the requested range, found
 * on a log grid and refined by Brent's method; a −3.0103 dB point is where |H| has fallen to
 * 1/√2 of it, bracketed on the grid and solved on log10 f by a bracketing Brent solver. The
 * search costs at most {@link #MAX_GRID_POINTS} + {@link #MAX_PEAK_EVALUATIONS} +
 * 2·{@link #MAX_CORNER_EVALUATIONS} solves and ends in {@link AnalysisException} of kind
 * NO_CONVERGENCE when a limit is reached. Features narrower than the grid spacing (1/
 * {@link #GRID_POINTS_PER_DECADE} decade) may be missed.
 *
 * <p>Before each factorisation every row of {@code G + jωC} (and of b) is divided by the power of
 * two nearest below its largest coefficient (row equilibration, as {@link DenseLu} does for DC;
 * Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed., ch. 9 — from memory). The modified nodal equations mix rows of microsiemens
 * (a node tied in by a bias resistor) with op-amp rows of A·ωp ≈ 1e7: unscaled, partial pivoting
 * bounds the rounding only against the largest rows, which left a node fed through one 180 kΩ
 * resistor 30 % off in a two-stage chain, and made the pivot test call a high-gain cascade
 * singular over a band of frequencies where its response is smooth (random designs 512, 783,
 * 803, 1070, 1480, 1547 of RandomDesignPropertiesTest.design). The scaling is exact and leaves
 * the solution unchanged in exact arithmetic.
 *
 * <p>An instance holds the linearised matrices and work arrays for one circuit; it is not
 * thread-safe.
 */
public final class AcAnalysis {
    /** Most points one sweep may ask for. */
    public static final int MAX_SWEEP_POINTS = 100_000;
    /** Points per decade of the log grid that locates the peak and brackets the corners. */
    public static final int GRID_POINTS_PER_DECADE = 20;
    /** Most points of that grid; wider ranges get a coarser grid. */
    public static final int MAX_GRID_POINTS = 401;
    /** Most evaluations of |H| spent refining the peak (Brent's method). */
    public static final int MAX_PEAK_EVALUATIONS = 200;
    /** Most evaluations of |H| spent solving for one −3 dB point (bracketing Brent solver). */
    public static final int MAX_CORNER_EVALUATIONS = 200;

    private final MnaSystem system;
    private final OperatingPoint operatingPoint;
    private final int n;
    private final double[][] g;
    private final double[][] c;
    private final double[][] workRe;
    private final double[][] workIm;
    private final double[] xRe;
    private final double[] xIm;
    /** Power-of-two factor on each row of the system at the last frequency solved. */
    private final double[] rowScale;
    private final ComplexLinearSolver lu;
    private final Map<String, double[]> directions = new HashMap<>();

    /** Linearise the circuit of {@code operatingPoint} at that point. */
    public AcAnalysis(OperatingPoint operatingPoint) {
        this(operatingPoint, new DenseComplexLu());
    }

    /** As {@link #AcAnalysis(OperatingPoint)}, with a given complex solver. */
    public AcAnalysis(OperatingPoint operatingPoint, ComplexLinearSolver solver) {
        this.operatingPoint = operatingPoint;
        this.system = operatingPoint.system();
        this.n = system.size();
        this.g = new double[n][n];
        this.c = new double[n][n];
        this.workRe = new double[n][n];
        this.workIm = new double[n][n];
        this.xRe = new double[n];
        this.xIm = new double[n];
        this.rowScale = new double[n];
        this.lu = solver;
        double[] f = new double[n];
        double[] q = new double[n];
        system.evaluate(operatingPoint.solution(), 0, Mode.DYNAMIC, 1, 0, f, g, q, c);
    }

    /** Solve the operating point of {@code circuit} with {@link DcSolver} and linearise there. */
    public static AcAnalysis of(Circuit circuit) {
        return new AcAnalysis(DcSolver.operatingPoint(circuit));
    }

    /** The operating point this analysis is linearised at. */
    public OperatingPoint operatingPoint() {
        return operatingPoint;
    }

    /**
     * The default input: the one voltage source with a nonzero AC magnitude.
     *
     * @throws AnalysisException BAD_REQUEST when there is none or more than one
     */
    public String defaultInput() {
        List<String> driven = new ArrayList<>();
        for (VoltageSource v : system.circuit().elements(VoltageSource.class)) {
            if (v.acMagnitude() > 0) {
                driven.add(v.name());
            }
        }
        if (driven.size() != 1) {
            throw new AnalysisException(AnalysisException.Kind.BAD_REQUEST, driven.isEmpty()
                    ? "no source has an AC magnitude; name the input source"
                    : "several sources have an AC magnitude (" + String.join(", ", driven)
                    + "); name the input source");
        }
        return driven.get(0);
    }

    /**
     * The transfer from {@code inputSource} to the voltage of {@code outputNode} at {@code hz}.
     *
     * @param inputSource a voltage or current source, or null for {@link #defaultInput()}
     * @param outputNode  the output node
     * @param hz          frequency in Hz, finite and not negative
     * @throws AnalysisException BAD_REQUEST for an unknown source or node or a bad frequency;
     *                           SINGULAR when the linearised system is singular at {@code hz}
     */
    public AcTransfer response(String inputSource, String outputNode, double hz) {
        return response(inputSource, outputNode, Circuit.GROUND, hz);
    }

    /**
     * The transfer from {@code inputSource} to V({@code outputPlus}) − V({@code outputMinus}) at
     * {@code hz}; otherwise as {@link #response(String, String, double)}.
     */
    public AcTransfer response(String inputSource, String outputPlus, String outputMinus, double hz) {
        if (!Double.isFinite(hz) || hz < 0) {
            throw new AnalysisException(AnalysisException.Kind.BAD_REQUEST,
                    "the frequency must be finite and not negative, got " + hz + " Hz");
        }
        double[] b = direction(inputSource);
        int p = system.nodeIndex(outputPlus);
        int m = system.nodeIndex(outputMinus);
        solveAt(hz, b);
        return new AcTransfer(hz, value(xRe, p) - value(xRe, m), value(xIm, p) - value(xIm, m));
    }

    /**
     * The transfer from {@code inputSource} to {@code outputNode} at {@code points} frequencies
     * spaced evenly in log f from {@code fStartHz} to {@code fStopHz}, both included.
     *
     * @throws AnalysisException BAD_REQUEST unless 0 &lt; fStartHz &lt; fStopHz (finite) and
     *                           2 ≤ points ≤ {@link #MAX_SWEEP_POINTS}, or for an unknown source or
     *                           node; SINGULAR as for {@link #response(String, String, double)}
     */
    public AcSweep sweep(String inputSource, String outputNode, double fStartHz, double fStopHz, int points) {
        return sweep(inputSource, outputNode, Circuit.GROUND, fStartHz, fStopHz, points);
    }

    /** As {@link #sweep(String, String, double, double, int)} for V(outputPlus) − V(outputMinus). */
    public AcSweep sweep(String inputSource, String outputPlus, String outputMinus, double fStartHz, double fStopHz,
                         int points) {
        checkRange(fStartHz, fStopHz);
        if (points < 2 || points > MAX_SWEEP_POINTS) {
            throw new AnalysisException(AnalysisException.Kind.BAD_REQUEST,
                    "a sweep needs between 2 and " + MAX_SWEEP_POINTS + " points, got " + points);
        }
        String input = inputName(inputSource);
        AcTransfer[] out = new AcTransfer[points];
        double ratio = Math.log(fStopHz / fStartHz);
        for (int k = 0; k < points; k++) {
            double hz = k == points - 1 ? fStopHz : fStartHz * Math.exp(ratio * k / (points - 1));
            out[k] = response(input, outputPlus, outputMinus, hz);
        }
        return AcSweep.of(input, outputPlus, outputMinus, out);
    }

    /**
     * The peak of |H| from {@code inputSource} to {@code outputNode} over [fStartHz, fStopHz] and
     * the −3.0103 dB points either side of it within that range.
     *
     * @throws AnalysisException BAD_REQUEST for a bad range, source or node; NO_CONVERGENCE when a
     *                           search reaches its evaluation limit; SINGULAR as for
     *                           {@link #response(String, String, double)}
     */
    public AcPassband passband(String inputSource, String outputNode, double fStartHz, double fStopHz) {
        return passband(inputSource, outputNode, Circuit.GROUND, fStartHz, fStopHz);
    }

    /** As {@link #passband(String, String, double, double)} for V(outputPlus) − V(outputMinus). */
    public AcPassband passband(String inputSource, String outputPlus, String outputMinus, double fStartHz,
                               double fStopHz) {
        checkRange(fStartHz, fStopHz);
        String input = inputName(inputSource);
        system.nodeIndex(outputPlus);
        system.nodeIndex(outputMinus);
        return new PassbandFinder(hz -> response(input, outputPlus, outputMinus, hz).magnitude())
                .find(fStartHz, fStopHz);
    }

    /**
     * The lower −3.0103 dB point in Hz, relative to the peak gain over [fStartHz, fStopHz]; empty
     * when the gain does not fall that far below the peak within the range.
     *
     * @throws AnalysisException as {@link #passband(String, String, double, double)}
     */
    public OptionalDouble lowerCornerHz(String inputSource, String outputNode, double fStartHz, double fStopHz) {
        return passband(inputSource, outputNode, fStartHz, fStopHz).lowerCornerHz();
    }

    /**
     * The upper −3.0103 dB point in Hz, relative to the peak gain over [fStartHz, fStopHz]; empty
     * when the gain does not fall that far above the peak within the range.
     *
     * @throws AnalysisException as {@link #passband(String, String, double, double)}
     */
    public OptionalDouble upperCornerHz(String inputSource, String outputNode, double fStartHz, double fStopHz) {
        return passband(inputSource, outputNode, fStartHz, fStopHz).upperCornerHz();
    }

    private static void checkRange(double fStartHz, double fStopHz) {
        if (!(fStartHz > 0) || !(fStopHz > fStartHz) || !Double.isFinite(fStopHz)) {
            throw new AnalysisException(AnalysisException.Kind.BAD_REQUEST,
                    "a frequency range needs 0 < start < stop, both finite; got " + fStartHz + " to " + fStopHz + " Hz");
        }
    }

    private String inputName(String inputSource) {
        String name = inputSource == null ? defaultInput() : inputSource;
        direction(name);
        return name;
    }

    private double[] direction(String inputSource) {
        String name = inputSource == null ? defaultInput() : inputSource;
        double[] b = directions.get(name);
        if (b == null) {
            Element e = system.circuit().element(name).orElseThrow(() ->
                    new AnalysisException(AnalysisException.Kind.BAD_REQUEST, "no source named " + name));
            if (!(e instanceof VoltageSource) && !(e instanceof CurrentSource)) {
                throw new AnalysisException(AnalysisException.Kind.BAD_REQUEST, name + " is not a source");
            }
            b = system.sourceDirection(name);
            directions.put(name, b);
        }
        return b;
    }

    private void solveAt(double hz, double[] b) {
        double omega = 2 * Math.PI * hz;
        for (int i = 0; i < n; i++) {
            double[] gi = g[i];
            double[] ci = c[i];
            double[] re = workRe[i];
            double[] im = workIm[i];
            double largest = 0;
            for (int j = 0; j < n; j++) {
                largest = Math.max(largest, Math.max(Math.abs(gi[j]), Math.abs(omega * ci[j])));
            }
            // Row equilibration: each equation divided by its largest coefficient (a power of two,
            // so exact), see the class comment.
            double s = largest > 0 && Double.isFinite(largest) ? 1 / Math.scalb(1.0, Math.getExponent(largest)) : 1;
            rowScale[i] = s;
            for (int j = 0; j < n; j++) {
                re[j] = gi[j] * s;
                im[j] = omega * ci[j] * s;
            }
        }
        try {
            lu.factor(workRe, workIm, n);
        } catch (AnalysisException e) {
            throw new AnalysisException(e.kind(), "at " + hz + " Hz: " + e.getMessage(), e.nodes());
        }
        for (int i = 0; i < n; i++) {
            xRe[i] = b[i] * rowScale[i];
        }
        java.util.Arrays.fill(xIm, 0);
        lu.solve(xRe, xIm);
        SolveAudit.Listener audit = SolveAudit.listener;
        if (audit != null) {
            audit.acSolve(system, g, c, omega, b, xRe, xIm);
        }
    }

    private static double value(double[] x, int i) {
        return i < 0 ? 0 : x[i];
    }
}
