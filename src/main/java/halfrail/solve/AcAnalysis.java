package halfrail.solve;

import halfrail.circuit.Capacitor;
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

    /**
     * Systems of at least this many unknowns are factored with {@link SparseComplexLu} on the
     * circuit's pattern (its fill-reducing order made once per {@link MnaSystem} and shared,
     * the pivot order and factor patterns kept from one frequency to the next); smaller ones with
     * {@link DenseComplexLu}. Measured on 200-point sweeps (thread CPU, 2026-12-02): sparse takes
     * 0.35 against 0.41 ms at 12 unknowns (the preamp sample), 0.41 against 1.04 ms at 25
     * (three stages) and 2.3 against 31 ms at 133 (sixteen stages); below 12 it was not measured.
     */
    static final int SPARSE_FROM_UNKNOWNS = 12;
    /**
     * Most doubles the solutions kept for reuse may hold (4 MB). Passband searches over the same
     * range for different outputs ask for the same grid frequencies, and the solution at a
     * frequency holds every node: each frequency is factored and solved once per input.
     */
    static final int KEPT_SOLUTION_DOUBLES = 1 << 19;

    private final MnaSystem system;
    private final OperatingPoint operatingPoint;
    private final int n;
    private final double[] xRe;
    private final double[] xIm;
    // Dense path.
    private final double[][] g;
    private final double[][] c;
    private final double[][] workRe;
    private final double[][] workIm;
    private final ComplexLinearSolver lu;
    // Sparse path.
    private final MnaSystem.Pattern pattern;
    private final double[] gValues;
    private final double[] cValues;
    private final double[] reValues;
    private final double[] imValues;
    private final SparseComplexLu sparse;
    private final Map<String, double[]> directions = new HashMap<>();
    /** Solutions by input and frequency (bits of hz): real parts then imaginary parts. */
    private final Map<String, Map<Long, double[]>> kept = new HashMap<>();
    private int keptDoubles;
    /** No frequency is factored: the bits of a NaN that no frequency accepted here has. */
    private static final long NONE_FACTORED = 0x7ff8dead0000beefL;
    /** Bits of the frequency whose factors the solver holds, or {@link #NONE_FACTORED}. */
    private long factoredHzBits = NONE_FACTORED;
    private int solves;
    /** The last adjoint solve of {@link #transimpedance} (y = A⁻ᵀ·e_out): its output node and frequency. */
    private int adjointNode = -1;
    private long adjointHzBits = NONE_FACTORED;
    private final double[] adjointRe;
    private final double[] adjointIm;

    /** Linearise the circuit of {@code operatingPoint} at that point. */
    public AcAnalysis(OperatingPoint operatingPoint) {
        this(operatingPoint, null, operatingPoint.system().size() >= SPARSE_FROM_UNKNOWNS);
    }

    /** As {@link #AcAnalysis(OperatingPoint)}, with a given complex solver on dense matrices. */
    public AcAnalysis(OperatingPoint operatingPoint, ComplexLinearSolver solver) {
        this(operatingPoint, solver, false);
    }

    private AcAnalysis(OperatingPoint operatingPoint, ComplexLinearSolver solver, boolean useSparse) {
        this.operatingPoint = operatingPoint;
        this.system = operatingPoint.system();
        this.n = system.size();
        this.xRe = new double[n];
        this.xIm = new double[n];
        this.adjointRe = new double[n];
        this.adjointIm = new double[n];
        double[] f = new double[n];
        double[] q = new double[n];
        if (useSparse) {
            this.pattern = system.pattern();
            int entries = pattern.entries();
            this.gValues = new double[entries];
            this.cValues = new double[entries];
            this.reValues = new double[entries];
            this.imValues = new double[entries];
            this.sparse = new SparseComplexLu();
            system.evaluateSparse(operatingPoint.solution(), 0, f, gValues, q, cValues);
            this.g = null;
            this.c = null;
            this.workRe = null;
            this.workIm = null;
            this.lu = null;
        } else {
            this.pattern = null;
            this.gValues = null;
            this.cValues = null;
            this.reValues = null;
            this.imValues = null;
            this.sparse = null;
            this.g = new double[n][n];
            this.c = new double[n][n];
            this.workRe = new double[n][n];
            this.workIm = new double[n][n];
            this.lu = solver != null ? solver : new DenseComplexLu();
            system.evaluate(operatingPoint.solution(), 0, Mode.DYNAMIC, 1, 0, f, g, q, c);
        }
    }

    /** An analysis that factors sparse whatever the size (tests compare the solvers). */
    static AcAnalysis sparse(OperatingPoint operatingPoint) {
        return new AcAnalysis(operatingPoint, null, true);
    }

    /** Whether this analysis factors sparse. */
    boolean usesSparse() {
        return sparse != null;
    }

    /** Factorisations made so far (a frequency asked for again, or for another input right after, is not factored again). */
    int solves() {
        return solves;
    }

    /** Factorisations of the sparse solver that searched for pivots; 0 on the dense path. */
    int pivotSearches() {
        return sparse != null ? sparse.fullFactorisations() : 0;
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
        String input = inputName(inputSource);
        int p = system.nodeIndex(outputPlus);
        int m = system.nodeIndex(outputMinus);
        double[] x = solution(input, hz);
        return new AcTransfer(hz, value(x, p, 0) - value(x, m, 0), value(x, p, n) - value(x, m, n));
    }

    /**
     * The impedance at {@code hz} between the terminals of capacitor {@code capacitorName} with
     * the capacitor taken out of the linearised circuit (its capacitance and leakage removed, the
     * circuit kept at this operating point), every source held: V(plus) − V(minus) per ampere
     * driven into plus and out of minus. One factorisation on this analysis's pattern; nothing
     * is assembled or ordered afresh.
     *
     * @throws AnalysisException BAD_REQUEST for a bad frequency or a name that is not a
     *                           capacitor; SINGULAR when the circuit without it is singular at hz
     */
    public AcTransfer impedanceWithout(String capacitorName, double hz) {
        if (!Double.isFinite(hz) || hz < 0) {
            throw new AnalysisException(AnalysisException.Kind.BAD_REQUEST,
                    "the frequency must be finite and not negative, got " + hz + " Hz");
        }
        Element e = system.circuit().element(capacitorName).orElse(null);
        if (!(e instanceof Capacitor cap)) {
            throw new AnalysisException(AnalysisException.Kind.BAD_REQUEST, "no capacitor named " + capacitorName);
        }
        int a = system.nodeIndex(cap.plus());
        int b = system.nodeIndex(cap.minus());
        double omega = 2 * Math.PI * hz;
        // The stamp MnaSystem made for it: the leakage (when positive) as a conductance, and the capacitance.
        double leak = cap.leakageSiemens() > 0 ? cap.leakageSiemens() : 0;
        double susceptance = omega * cap.farads();
        factoredHzBits = NONE_FACTORED; // the factors below are not those of the circuit
        solves++;
        try {
            if (sparse != null) {
                fill(omega);
                remove(a, a, leak, susceptance);
                remove(b, b, leak, susceptance);
                remove(a, b, -leak, -susceptance);
                remove(b, a, -leak, -susceptance);
                sparse.factor(pattern, reValues, imValues);
            } else {
                fill(omega);
                remove(a, a, leak, susceptance);
                remove(b, b, leak, susceptance);
                remove(a, b, -leak, -susceptance);
                remove(b, a, -leak, -susceptance);
                lu.factor(workRe, workIm, n);
            }
        } catch (AnalysisException ex) {
            throw new AnalysisException(ex.kind(), "at " + hz + " Hz without " + capacitorName + ": "
                    + ex.getMessage(), ex.nodes());
        }
        java.util.Arrays.fill(xRe, 0);
        java.util.Arrays.fill(xIm, 0);
        if (a >= 0) {
            xRe[a] = 1;
        }
        if (b >= 0) {
            xRe[b] = -1;
        }
        if (sparse != null) {
            sparse.solve(xRe, xIm);
        } else {
            lu.solve(xRe, xIm);
        }
        return new AcTransfer(hz, value(xRe, a, 0) - value(xRe, b, 0), value(xIm, a, 0) - value(xIm, b, 0));
    }

    /**
     * The transimpedance at {@code hz} from a current injected into node {@code into} (and drawn
     * out of node {@code outOf}) to the voltage of {@code outputNode}, V/A — what a current source
     * between those nodes would give, without adding one to the circuit. All such transfers to
     * one output at one frequency come from a single solve with the transposed matrix (the
     * adjoint: V_out = eᵀ·A⁻¹·b = (A⁻ᵀ·e)ᵀ·b, so y = A⁻ᵀ·e serves every b), which is kept for
     * the next call with the same output and frequency.
     *
     * @throws AnalysisException BAD_REQUEST for an unknown node or a bad frequency; SINGULAR when
     *                           the linearised system is singular at {@code hz}
     */
    public AcTransfer transimpedance(String into, String outOf, String outputNode, double hz) {
        if (!Double.isFinite(hz) || hz < 0) {
            throw new AnalysisException(AnalysisException.Kind.BAD_REQUEST,
                    "the frequency must be finite and not negative, got " + hz + " Hz");
        }
        int a = system.nodeIndex(into);
        int b = system.nodeIndex(outOf);
        int out = system.nodeIndex(outputNode);
        if (out < 0) {
            return new AcTransfer(hz, 0, 0);
        }
        long bits = Double.doubleToLongBits(hz);
        if (out != adjointNode || bits != adjointHzBits) {
            factorAt(hz);
            java.util.Arrays.fill(adjointRe, 0);
            java.util.Arrays.fill(adjointIm, 0);
            adjointRe[out] = 1;
            if (sparse != null) {
                sparse.solveTransposed(adjointRe, adjointIm);
            } else {
                lu.solveTransposed(adjointRe, adjointIm);
            }
            adjointNode = out;
            adjointHzBits = bits;
            SolveAudit.Listener audit = SolveAudit.listener;
            if (audit != null) {
                double[] e = new double[n];
                e[out] = 1;
                auditMatrices();
                audit.acSolve(system, transpose(auditG), transpose(auditC), 2 * Math.PI * hz, e, adjointRe, adjointIm);
            }
        }
        return new AcTransfer(hz, value(adjointRe, a, 0) - value(adjointRe, b, 0),
                value(adjointIm, a, 0) - value(adjointIm, b, 0));
    }

    private static double[][] transpose(double[][] m) {
        double[][] t = new double[m.length][m.length];
        for (int i = 0; i < m.length; i++) {
            for (int j = 0; j < m.length; j++) {
                t[j][i] = m[i][j];
            }
        }
        return t;
    }

    /** Subtract a conductance and a susceptance at (row, col) of the assembled G + jωC (skipped for ground). */
    private void remove(int row, int col, double conductance, double susceptance) {
        if (row < 0 || col < 0) {
            return;
        }
        if (sparse != null) {
            int k = pattern.slot(row, col);
            reValues[k] -= conductance;
            imValues[k] -= susceptance;
        } else {
            workRe[row][col] -= conductance;
            workIm[row][col] -= susceptance;
        }
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
     * The peak of |H| from {@code inputSource} to V({@code outputPlus}) − V({@code outputMinus})
     * over [fStartHz, fStopHz]: {@link #passband(String, String, String, double, double)}'s
     * {@link AcPassband#peakMagnitude()}, found the same way, without the search for the corners.
     *
     * @throws AnalysisException as {@link #passband(String, String, double, double)}
     */
    public double peakMagnitude(String inputSource, String outputPlus, String outputMinus, double fStartHz,
                                double fStopHz) {
        checkRange(fStartHz, fStopHz);
        String input = inputName(inputSource);
        system.nodeIndex(outputPlus);
        system.nodeIndex(outputMinus);
        return new PassbandFinder(hz -> response(input, outputPlus, outputMinus, hz).magnitude())
                .findPeak(fStartHz, fStopHz).peakMagnitude();
    }

    /** As {@link #peakMagnitude(String, String, String, double, double)} for the voltage of {@code outputNode}. */
    public double peakMagnitude(String inputSource, String outputNode, double fStartHz, double fStopHz) {
        return peakMagnitude(inputSource, outputNode, Circuit.GROUND, fStartHz, fStopHz);
    }

    /**
     * The lower −3.0103 dB point in Hz, relative to the peak gain over [fStartHz, fStopHz]; empty
     * when the gain does not fall that far below the peak within the range.
     *
     * @throws AnalysisException as {@link #passband(String, String, double, double)}
     */
    public OptionalDouble lowerCornerHz(String inputSource, String outputNode, double fStartHz, double fStopHz) {
        return corners(inputSource, outputNode, fStartHz, fStopHz, true, false).lowerCornerHz();
    }

    /**
     * The upper −3.0103 dB point in Hz, relative to the peak gain over [fStartHz, fStopHz]; empty
     * when the gain does not fall that far above the peak within the range.
     *
     * @throws AnalysisException as {@link #passband(String, String, double, double)}
     */
    public OptionalDouble upperCornerHz(String inputSource, String outputNode, double fStartHz, double fStopHz) {
        return corners(inputSource, outputNode, fStartHz, fStopHz, false, true).upperCornerHz();
    }

    /** The passband search with only the corners asked for (the other's search skipped). */
    private AcPassband corners(String inputSource, String outputNode, double fStartHz, double fStopHz, boolean lower,
                               boolean upper) {
        checkRange(fStartHz, fStopHz);
        String input = inputName(inputSource);
        system.nodeIndex(outputNode);
        return new PassbandFinder(hz -> response(input, outputNode, Circuit.GROUND, hz).magnitude())
                .find(fStartHz, fStopHz, lower, upper);
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

    /**
     * The solution for a unit of {@code input} at {@code hz}, real parts at [0, n) and imaginary
     * parts at [n, 2n): kept for reuse while {@link #KEPT_SOLUTION_DOUBLES} allows.
     */
    private double[] solution(String input, double hz) {
        Map<Long, double[]> byHz = kept.computeIfAbsent(input, k -> new HashMap<>());
        Long key = Double.doubleToLongBits(hz);
        double[] x = byHz.get(key);
        if (x != null) {
            return x;
        }
        solveAt(hz, direction(input));
        x = new double[2 * n];
        System.arraycopy(xRe, 0, x, 0, n);
        System.arraycopy(xIm, 0, x, n, n);
        if (keptDoubles + 2 * n <= KEPT_SOLUTION_DOUBLES) {
            byHz.put(key, x);
            keptDoubles += 2 * n;
        }
        return x;
    }

    private void solveAt(double hz, double[] b) {
        double omega = 2 * Math.PI * hz;
        factorAt(hz);
        System.arraycopy(b, 0, xRe, 0, n);
        java.util.Arrays.fill(xIm, 0);
        if (sparse != null) {
            sparse.solve(xRe, xIm);
        } else {
            lu.solve(xRe, xIm);
        }
        SolveAudit.Listener audit = SolveAudit.listener;
        if (audit != null) {
            auditMatrices();
            audit.acSolve(system, auditG, auditC, omega, b, xRe, xIm);
        }
    }

    /** Factor G + jωC at {@code hz} unless the factors held are of that very frequency. */
    private void factorAt(double hz) {
        double omega = 2 * Math.PI * hz;
        if (Double.doubleToLongBits(hz) != factoredHzBits) {
            // Another input at the frequency last factored needs only another solve.
            factoredHzBits = NONE_FACTORED;
            solves++;
            try {
                fill(omega);
                if (sparse != null) {
                    sparse.factor(pattern, reValues, imValues);
                } else {
                    lu.factor(workRe, workIm, n);
                }
            } catch (AnalysisException e) {
                throw new AnalysisException(e.kind(), "at " + hz + " Hz: " + e.getMessage(), e.nodes());
            }
            factoredHzBits = Double.doubleToLongBits(hz);
        }
    }

    /**
     * G and C as dense matrices for the audit (tests only): the dense path's own, or the sparse
     * path's made on the first audited solve (G and C do not depend on the frequency).
     */
    private double[][] auditG;
    private double[][] auditC;

    private void auditMatrices() {
        if (auditG == null) {
            auditG = sparse != null ? auditDense(gValues) : g;
            auditC = sparse != null ? auditDense(cValues) : c;
        }
    }

    /** G or C of the sparse path as a dense matrix, for the test-only audit (never in production). */
    private double[][] auditDense(double[] values) {
        double[][] m = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int k = pattern.rowStart[i]; k < pattern.rowStart[i + 1]; k++) {
                m[i][pattern.columns[k]] = values[k];
            }
        }
        return m;
    }

    /** G + jωC into the work arrays of the path in use. */
    private void fill(double omega) {
        if (sparse != null) {
            int entries = pattern.entries();
            for (int k = 0; k < entries; k++) {
                reValues[k] = gValues[k];
                imValues[k] = omega * cValues[k];
            }
        } else {
            for (int i = 0; i < n; i++) {
                double[] gi = g[i];
                double[] ci = c[i];
                double[] re = workRe[i];
                double[] im = workIm[i];
                for (int j = 0; j < n; j++) {
                    re[j] = gi[j];
                    im[j] = omega * ci[j];
                }
            }
        }
    }

    private static double value(double[] x, int i, int offset) {
        return i < 0 ? 0 : x[offset + i];
    }
}
