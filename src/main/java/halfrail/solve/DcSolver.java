package halfrail.solve;

import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmp;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.VoltageSource;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * DC operating point by Newton's method on the {@link Mode#DC} equations of an {@link MnaSystem}.
 *
 * <p>The start is the solution of the circuit with every op-amp limiter switched off (a linear
 * solve); circuits whose op-amps stay linear then converge in one or two iterations. When
 * Newton fails, gmin stepping and then source stepping are tried. Each loop is bounded by a
 * named limit and ends in {@link AnalysisException} of kind NO_CONVERGENCE or SINGULAR.
 * Nodes without a DC path are reported before any solve as FLOATING_NODE.
 *
 * <p>An instance holds work arrays for one circuit size; it is not thread-safe.
 */
public final class DcSolver {
    /** Newton iterations allowed for one solve at one gmin or source level. */
    public static final int MAX_NEWTON_ITERATIONS = 150;
    /** Relative change in an unknown below which Newton counts it converged. */
    public static final double RELATIVE_TOLERANCE = 1e-9;
    /** Absolute change in a voltage unknown below which Newton counts it converged, V. */
    public static final double VOLTAGE_TOLERANCE = 1e-9;
    /** Absolute change in a current unknown below which Newton counts it converged, A. */
    public static final double CURRENT_TOLERANCE = 1e-13;
    /** Largest change of any voltage unknown in one Newton iteration after the first, V. */
    public static final double MAX_VOLTAGE_STEP = 2.0;
    /** Largest Kirchhoff current-law residual accepted at a node of a converged solution, A. */
    public static final double KCL_TOLERANCE_AMPS = 1e-9;
    /** Starting shunt conductance of gmin stepping, S. */
    public static final double GMIN_START = 1e-2;
    /** Factor by which gmin falls per step. */
    public static final double GMIN_FACTOR = 10;
    /** Smallest source step of source stepping before giving up. */
    public static final double MIN_SOURCE_STEP = 1e-4;
    /** Largest number of source-stepping solves. */
    public static final int MAX_SOURCE_STEPS = 400;

    private final MnaSystem system;
    private final int n;
    private final double[] f;
    private final double[][] g;
    private final double[] dx;
    private final LinearSolver lu = new DenseLu();
    private int iterations;

    public DcSolver(MnaSystem system) {
        this.system = system;
        this.n = system.size();
        this.f = new double[n];
        this.g = new double[n][n];
        this.dx = new double[n];
    }

    /** Solve {@code circuit}'s operating point. */
    public static OperatingPoint operatingPoint(Circuit circuit) {
        return new DcSolver(MnaSystem.of(circuit)).solve();
    }

    /** Solve the operating point of this solver's system. */
    public OperatingPoint solve() {
        return solveFrom(null);
    }

    /**
     * Solve, starting Newton from {@code guess} when given (for example the previous point of a
     * sweep); a null guess starts from the linearised circuit.
     */
    public OperatingPoint solveFrom(double[] guess) {
        List<String> floating = FloatingNodes.find(system.circuit());
        if (!floating.isEmpty()) {
            throw new AnalysisException(AnalysisException.Kind.FLOATING_NODE,
                    "no DC path to a defined voltage at node" + (floating.size() > 1 ? "s " : " ")
                            + String.join(", ", floating), floating);
        }
        iterations = 0;
        double[] x = new double[n];
        if (guess != null) {
            System.arraycopy(guess, 0, x, 0, n);
        } else {
            linearStart(x);
        }
        OperatingPoint.Strategy strategy = OperatingPoint.Strategy.NEWTON;
        if (!newton(x, 1, 0)) {
            strategy = OperatingPoint.Strategy.GMIN_STEPPING;
            if (!gminStepping(x)) {
                strategy = OperatingPoint.Strategy.SOURCE_STEPPING;
                if (!sourceStepping(x)) {
                    throw new AnalysisException(AnalysisException.Kind.NO_CONVERGENCE,
                            "the operating point did not converge: Newton (" + MAX_NEWTON_ITERATIONS
                                    + " iterations), gmin stepping from " + GMIN_START
                                    + " S and source stepping down to steps of " + MIN_SOURCE_STEP + " all failed");
                }
            }
        }
        return result(x, strategy);
    }

    private void linearStart(double[] x) {
        java.util.Arrays.fill(x, 0);
        system.evaluate(x, 0, Mode.DC, 1, 0, false, f, g, null, null);
        lu.factor(g, n);
        for (int i = 0; i < n; i++) {
            dx[i] = -f[i];
        }
        lu.solve(dx);
        for (int i = 0; i < n; i++) {
            x[i] = dx[i];
        }
    }

    private boolean gminStepping(double[] x) {
        double[] trial = x.clone();
        linearStartOr(trial);
        for (double gmin = GMIN_START; gmin > 1e-13; gmin /= GMIN_FACTOR) {
            if (!newton(trial, 1, gmin)) {
                return false;
            }
        }
        if (!newton(trial, 1, 0)) {
            return false;
        }
        System.arraycopy(trial, 0, x, 0, n);
        return true;
    }

    private void linearStartOr(double[] x) {
        try {
            linearStart(x);
        } catch (AnalysisException e) {
            java.util.Arrays.fill(x, 0);
        }
    }

    private boolean sourceStepping(double[] x) {
        double[] trial = new double[n];
        double[] last = new double[n];
        double scale = 0;
        double step = 0.1;
        if (!newton(trial, 0, 0)) {
            return false;
        }
        int solves = 0;
        while (scale < 1) {
            if (++solves > MAX_SOURCE_STEPS) {
                return false;
            }
            double next = Math.min(1, scale + step);
            System.arraycopy(trial, 0, last, 0, n);
            if (newton(trial, next, 0)) {
                scale = next;
                step = Math.min(step * 2, 0.25);
            } else {
                System.arraycopy(last, 0, trial, 0, n);
                step /= 4;
                if (step < MIN_SOURCE_STEP) {
                    return false;
                }
            }
        }
        System.arraycopy(trial, 0, x, 0, n);
        return true;
    }

    /** Newton at one source scale and gmin; updates x in place; true when converged. */
    private boolean newton(double[] x, double scale, double gmin) {
        int nodes = system.nodeCount();
        for (int it = 0; it < MAX_NEWTON_ITERATIONS; it++) {
            iterations++;
            system.evaluate(x, 0, Mode.DC, scale, gmin, f, g, null, null);
            try {
                lu.factor(g, n);
            } catch (AnalysisException e) {
                return false;
            }
            for (int i = 0; i < n; i++) {
                dx[i] = -f[i];
            }
            lu.solve(dx);
            double maxStep = 0;
            for (int i = 0; i < n; i++) {
                if (!Double.isFinite(dx[i])) {
                    return false;
                }
                if (isVoltage(i, nodes)) {
                    maxStep = Math.max(maxStep, Math.abs(dx[i]));
                }
            }
            double damp = it > 0 && maxStep > MAX_VOLTAGE_STEP ? MAX_VOLTAGE_STEP / maxStep : 1;
            boolean converged = damp == 1;
            for (int i = 0; i < n; i++) {
                double step = damp * dx[i];
                double next = x[i] + step;
                double tol = RELATIVE_TOLERANCE * Math.max(Math.abs(x[i]), Math.abs(next))
                        + (isVoltage(i, nodes) ? VOLTAGE_TOLERANCE : CURRENT_TOLERANCE);
                if (Math.abs(step) > tol) {
                    converged = false;
                }
                x[i] = next;
            }
            if (converged) {
                return true;
            }
        }
        return false;
    }

    /** Node voltages and op-amp states are voltages; branch currents are not. */
    private boolean isVoltage(int i, int nodes) {
        return i < nodes || i >= nodes + branchCount();
    }

    private int branchCount() {
        Circuit c = system.circuit();
        return c.elements(VoltageSource.class).size() + c.elements(OpAmp.class).size();
    }

    private OperatingPoint result(double[] x, OperatingPoint.Strategy strategy) {
        Circuit c = system.circuit();
        system.evaluate(x, 0, Mode.DC, 1, 0, f, null, null, null);
        double residual = 0;
        for (int i = 0; i < system.nodeCount(); i++) {
            residual = Math.max(residual, Math.abs(f[i]));
        }
        for (double v : x) {
            if (!Double.isFinite(v)) {
                throw new AnalysisException(AnalysisException.Kind.NO_CONVERGENCE,
                        "the operating point holds a non-finite value");
            }
        }
        Map<String, Double> volts = new LinkedHashMap<>();
        for (String node : c.nodes()) {
            volts.put(node, system.voltage(x, node));
        }
        Map<String, Double> amps = new LinkedHashMap<>();
        for (VoltageSource v : c.elements(VoltageSource.class)) {
            amps.put(v.name(), x[system.branchIndex(v.name())]);
        }
        List<OpAmpState> states = new ArrayList<>();
        for (OpAmp o : c.elements(OpAmp.class)) {
            OpAmpParams p = o.params();
            double vp = system.voltage(x, o.vPos());
            double vn = system.voltage(x, o.vNeg());
            double inP = system.voltage(x, o.inPlus());
            double inM = system.voltage(x, o.inMinus());
            double cmLow = vn + p.commonModeLowVolts();
            double cmHigh = vp - p.commonModeHighVolts();
            boolean cmOk = inP >= cmLow && inP <= cmHigh && inM >= cmLow && inM <= cmHigh;
            double io = x[system.branchIndex(o.name())];
            amps.put(o.name(), io);
            double ioSource = 0.5 * (io + Math.sqrt(io * io
                    + MnaSystem.SPLIT_SMOOTHING_AMPS * MnaSystem.SPLIT_SMOOTHING_AMPS));
            states.add(new OpAmpState(o.name(), system.voltage(x, o.out()), inP, inM,
                    vn + p.swingLowVolts(), vp - p.swingHighVolts(), cmLow, cmHigh,
                    system.saturated(x, o.name()), cmOk, io, p.quiescentAmps() + ioSource));
        }
        return new OperatingPoint(system, x, volts, amps, states, strategy, iterations, residual);
    }
}
