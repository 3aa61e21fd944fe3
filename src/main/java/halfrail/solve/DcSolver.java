package halfrail.solve;

import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmp;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.VoltageSource;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * DC operating point by Newton's method on the {@link Mode#DC} equations of an {@link MnaSystem}.
 *
 * <p>The start is the solution of the circuit with every op-amp limiter switched off (a linear
 * solve); circuits whose op-amps stay linear then converge in one or two iterations. When
 * Newton fails, these are tried in turn, each from the linearised start: the limiter active-set
 * search ({@link OperatingPoint.Strategy#LIMITER_ACTIVE_SET}), gain stepping
 * ({@link OperatingPoint.Strategy#GAIN_STEPPING}), gmin stepping and source stepping. The
 * strategy that succeeded is reported. Each loop is bounded by a named limit and ends in
 * {@link AnalysisException} of kind NO_CONVERGENCE, or SINGULAR when the linearised circuit is
 * singular and no strategy succeeds (a loop of voltage sources, for example); its message names
 * each strategy tried and where it stopped (the unknown Newton could not settle, the gmin or
 * source level or gain fraction reached). Nodes without a DC path are reported before any solve
 * as FLOATING_NODE.
 *
 * <p>Op-amp limiter handling. Beyond its knee the limiter is flat, so its Newton linearisation
 * says the output does not depend on the inputs; a saturated output whose target has moved to
 * the other side of the window would then jump from rail to rail on every iteration. So in each
 * iteration, an op-amp whose open-loop target lies beyond one edge of its window while its state
 * does not yet lie beyond that same edge has its state row replaced by the unlimited row
 * {@code x = u} (the linearised circuit): the step then lands on the solution with that op-amp
 * linear, and the next iteration clamps it if that solution lies outside the window. If such a
 * step moves the state away from the side its target lies on (the signature of positive
 * feedback, where the linear solution is the unstable middle point), the op-amp keeps its
 * limited row for that iteration. At a solution no op-amp qualifies, so the converged iterate
 * satisfies the true equations. Steps are not damped.
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
    /**
     * Formerly the largest voltage change per Newton iteration, V. No longer applied: uniform
     * damping of the op-amp limiter's steps made saturated stages oscillate about their solution
     * instead of re-entering the linear region (see the class comment). Kept for compatibility.
     *
     * @deprecated not used by the solver any more
     */
    @Deprecated
    public static final double MAX_VOLTAGE_STEP = 2.0;
    /**
     * Largest Kirchhoff current-law residual accepted at a node of a converged solution, A, on top
     * of {@link #RESIDUAL_RELATIVE_TOLERANCE} times the magnitude of the currents meeting there.
     */
    public static final double KCL_TOLERANCE_AMPS = 1e-9;
    /**
     * Largest residual accepted in a voltage-source or op-amp equation of a converged solution, V.
     * Looser than the step tolerance because an op-amp row in its linear region carries the
     * rounding of A·(V+ − V−): with A = 1e8 that is about 1e-7 V.
     */
    public static final double EQUATION_RESIDUAL_VOLTS = 1e-6;
    /** Relative part of the residual test: a fraction of the sum of |current| terms at the node. */
    public static final double RESIDUAL_RELATIVE_TOLERANCE = 1e-6;
    /** Starting shunt conductance of gmin stepping, S. */
    public static final double GMIN_START = 1e-2;
    /** Smallest shunt conductance of gmin stepping before the final solve without it, S. */
    public static final double GMIN_END = 1e-13;
    /** Factor by which gmin falls per step. */
    public static final double GMIN_FACTOR = 10;
    /** Smallest source step of source stepping before giving up. */
    public static final double MIN_SOURCE_STEP = 1e-4;
    /** Largest number of source-stepping solves. */
    public static final int MAX_SOURCE_STEPS = 400;

    /**
     * Pseudo-time step at the start of pseudo-transient continuation, relative: each node and
     * op-amp state row's diagonal is multiplied by 1 + 1/δ, so a small δ takes small, steepest-
     * descent-like steps and a large one plain Newton steps.
     */
    public static final double PSEUDO_TRANSIENT_START = 1e-3;
    /** Relative pseudo-time step beyond which pseudo-transient continuation hands over to Newton. */
    public static final double PSEUDO_TRANSIENT_END = 1e10;
    /** Smallest relative pseudo-time step before pseudo-transient continuation gives up. */
    public static final double PSEUDO_TRANSIENT_MIN = 1e-9;
    /** Largest number of pseudo-time steps. */
    public static final int MAX_PSEUDO_TRANSIENT_STEPS = 2000;
    /** Largest factor by which the pseudo-time step grows in one step. */
    public static final double PSEUDO_TRANSIENT_GROWTH = 10;
    /**
     * Relative pseudo-time step from which pseudo-transient continuation tries plain Newton from
     * its current point (again at each further factor of {@link #PSEUDO_TRANSIENT_NEWTON_EVERY}).
     */
    public static final double PSEUDO_TRANSIENT_NEWTON_FROM = 1e2;
    /** Factor of pseudo-time step between two Newton attempts of pseudo-transient continuation. */
    public static final double PSEUDO_TRANSIENT_NEWTON_EVERY = 100;
    /**
     * Residual size (V, see residualSize) below which pseudo-transient continuation accepts any
     * step and hands over to Newton: rounding, not the march, sets the residual there.
     */
    public static final double PSEUDO_TRANSIENT_SETTLED_VOLTS = 1e-6;

    /** Largest total violation, V, at which the limiter active-set search accepts a set of modes. */
    public static final double ACTIVE_SET_TOLERANCE = 1e-9;
    /** Mode changes allowed per op-amp in the limiter active-set search (plus {@link #ACTIVE_SET_EXTRA_PASSES}). */
    public static final int ACTIVE_SET_PASSES_PER_OP_AMP = 4;
    /** Mode changes allowed in the limiter active-set search on top of the per-op-amp allowance. */
    public static final int ACTIVE_SET_EXTRA_PASSES = 8;

    /** Largest effective open-loop gain at the start of gain stepping, V/V. */
    public static final double GAIN_STEPPING_START = 1;
    /** Largest factor by which gain stepping raises every op-amp's gain in one step. */
    public static final double GAIN_STEP_FACTOR = 10;
    /** Smallest gain-stepping factor before giving up (steps are refined by square roots). */
    public static final double MIN_GAIN_STEP_FACTOR = 1.001;
    /** Largest number of gain-stepping solves. */
    public static final int MAX_GAIN_STEPS = 200;

    /**
     * Loop gain (dimensionless) above which an op-amp resting in its linear region marks the
     * operating point as unstable: its target moves by more than its output does, so with the
     * dominant-pole dynamics dx/dt = ωp·(u − x) any disturbance grows.
     */
    public static final double UNSTABLE_LOOP_GAIN = 1;
    /**
     * Smallest |z_s| (dimensionless, the diagonal of G⁻¹ at an op-amp state) for which the loop
     * gain 1 − 1/z_s is taken from the shared factorisation; below it the opened matrix is
     * factored directly (loop gains beyond about 1e7 in magnitude).
     */
    static final double LOOP_GAIN_DIRECT_BELOW = 1e-7;

    private static final int ROW_LIMITED = 0;
    private static final int ROW_UNLIMITED = 1;
    private static final int ROW_CLAMP_HIGH = 2;
    private static final int ROW_CLAMP_LOW = 3;
    /** What {@link #applyStep} returns when every unknown moved within its tolerance. */
    private static final int STEP_WITHIN_TOLERANCE = -1;
    /** What {@link #applyStep} returns when an entry of the step is not finite. */
    private static final int NON_FINITE_STEP = -2;

    private final MnaSystem system;
    private final int n;
    private final int nodeCount;
    private final int branchCount;
    private final int opAmpCount;
    private final double[] f;
    private final double[][] g;
    private final double[] dx;
    private final double[] rowMagnitude;
    /** Row used for each op-amp's state in the current iteration: one of the ROW_ constants. */
    private final int[] rowKind;
    private final double[] limiter = new double[4];
    private final LinearSolver lu;
    /** The solver when it is sparse; it then reads only {@link #pattern} of {@link #g}. */
    private final SparseLu sparse;
    /**
     * The circuit's pattern when the solver is sparse. Then {@link #g} holds nonzeros only inside
     * it (the sparse solver reads g without writing it, and every row replacement stays inside),
     * so evaluating clears only the pattern.
     */
    private final MnaSystem.Pattern pattern;
    private int iterations;
    /** Whether {@link #lu} holds the factors of the true Jacobian at the point preferStable examines. */
    private boolean jacobianAtX;
    /** Whether that Jacobian turned out singular (then each loop gain is found directly). */
    private boolean jacobianSingular;
    /** Factor on every op-amp's open-loop gain in the current solve: 1 except during gain stepping. */
    private double gainScale = 1;
    private boolean linearStartSingular;
    /** The array {@link #solveVectorFrom} answers in (made on first use, handed on by {@link #reusedFor}). */
    private double[] vector;
    /** 1/δ of pseudo-transient continuation while it runs (see {@link #step}); 0 otherwise. */
    private double pseudoInverseStep;
    /** How the last failed Newton solve ended (for the failure message). */
    private String newtonStall = "";
    /** What each strategy of the current solve reached before it gave up (for the failure message). */
    private final List<String> tried = new ArrayList<>();

    public DcSolver(MnaSystem system) {
        this(system, LinearSolvers.forSize(system.size()));
    }

    /** As {@link #DcSolver(MnaSystem)} with a given linear solver (tests compare the solvers). */
    DcSolver(MnaSystem system, LinearSolver solver) {
        this.system = system;
        this.n = system.size();
        this.nodeCount = system.nodeCount();
        this.opAmpCount = system.opAmpCount();
        Circuit c = system.circuit();
        this.branchCount = c.elements(VoltageSource.class).size() + opAmpCount;
        this.f = new double[n];
        this.g = new double[n][n];
        this.dx = new double[n];
        this.rowMagnitude = new double[n];
        this.rowKind = new int[opAmpCount];
        this.lu = solver;
        this.sparse = solver instanceof SparseLu sp ? sp : null;
        this.pattern = sparse != null ? system.pattern() : null;
    }

    /**
     * A solver for {@code variant}, a system of this solver's topology (made with
     * {@link MnaSystem#withValuesOf} from this solver's system or from one made that way), that
     * takes over this solver's work arrays and sparse factorisation — the pivot order and factor
     * patterns it keeps — so that solving many builds of one circuit allocates nothing per build.
     * This solver must not be used afterwards; the new one serves one thread.
     *
     * @throws IllegalArgumentException when the variant's topology is not this solver's
     */
    public DcSolver reusedFor(MnaSystem variant) {
        if (variant.size() != n || (pattern != null && variant.pattern() != pattern)
                || !system.hasTopologyOf(variant.circuit())) {
            throw new IllegalArgumentException("the variant's topology differs from this solver's system");
        }
        return new DcSolver(variant, this);
    }

    /** The variant's solver on {@code from}'s work (see {@link #reusedFor}). */
    private DcSolver(MnaSystem variant, DcSolver from) {
        this.system = variant;
        this.n = from.n;
        this.nodeCount = from.nodeCount;
        this.opAmpCount = from.opAmpCount;
        this.branchCount = from.branchCount;
        this.f = from.f;
        this.g = from.g;
        this.dx = from.dx;
        this.rowMagnitude = from.rowMagnitude;
        this.rowKind = from.rowKind;
        this.lu = from.lu;
        this.sparse = from.sparse;
        this.pattern = from.pattern;
        this.vector = from.vector;
    }

    /**
     * As {@link #solveFrom}, returning only the solution (the stable one, as there) in an array of
     * this solver's that the next solve overwrites: no {@link OperatingPoint}, no maps. For
     * studies that read a few numbers from many builds.
     *
     * @throws AnalysisException as {@link #solveFrom}
     */
    public double[] solveVectorFrom(double[] guess) {
        double[] x = vector != null ? vector : (vector = new double[n]);
        OperatingPoint.Strategy strategy = converge(guess, x);
        if (strategy == null) {
            throw failure();
        }
        finish(x);
        return x;
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
     *
     * @throws AnalysisException FLOATING_NODE naming the nodes without a DC path; BAD_REQUEST for a
     *                           guess of the wrong length; SINGULAR when the circuit's equations
     *                           are singular (for example a loop of voltage sources); NO_CONVERGENCE
     *                           when every strategy fails
     */
    public OperatingPoint solveFrom(double[] guess) {
        double[] x = new double[n];
        OperatingPoint.Strategy strategy = converge(guess, x);
        if (strategy == null) {
            throw failure();
        }
        return result(x, strategy);
    }

    /** The strategies of {@link #solveFrom} in turn, on x; the one that converged, or null. */
    private OperatingPoint.Strategy converge(double[] guess, double[] x) {
        checkFloating();
        if (guess != null && guess.length != n) {
            throw new AnalysisException(AnalysisException.Kind.BAD_REQUEST,
                    "a starting guess needs " + n + " unknowns, got " + guess.length);
        }
        iterations = 0;
        if (guess != null) {
            System.arraycopy(guess, 0, x, 0, n);
        } else {
            linearStartOr(x);
        }
        tried.clear();
        if (newton(x, 1, 0)) {
            return OperatingPoint.Strategy.NEWTON;
        }
        tried.add("Newton from " + (guess != null ? "the given start" : "the linearised circuit") + ": " + newtonStall);
        if (limiterActiveSet(x)) {
            return OperatingPoint.Strategy.LIMITER_ACTIVE_SET;
        }
        if (gainStepping(x)) {
            return OperatingPoint.Strategy.GAIN_STEPPING;
        }
        if (gminStepping(x)) {
            return OperatingPoint.Strategy.GMIN_STEPPING;
        }
        if (sourceStepping(x)) {
            return OperatingPoint.Strategy.SOURCE_STEPPING;
        }
        if (pseudoTransient(x)) {
            return OperatingPoint.Strategy.PSEUDO_TRANSIENT;
        }
        return null;
    }

    /**
     * Solve with one strategy only, from the linearised start (package-private: lets tests
     * exercise each convergence aid on its own).
     */
    OperatingPoint solveUsing(OperatingPoint.Strategy strategy) {
        checkFloating();
        iterations = 0;
        tried.clear();
        double[] x = new double[n];
        linearStartOr(x);
        boolean ok = switch (strategy) {
            case NEWTON -> newton(x, 1, 0);
            case LIMITER_ACTIVE_SET -> limiterActiveSet(x);
            case GAIN_STEPPING -> gainStepping(x);
            case GMIN_STEPPING -> gminStepping(x);
            case SOURCE_STEPPING -> sourceStepping(x);
            case PSEUDO_TRANSIENT -> pseudoTransient(x);
        };
        if (!ok) {
            throw failure();
        }
        return result(x, strategy);
    }

    private void checkFloating() {
        List<String> floating = system.floatingNodes();
        if (!floating.isEmpty()) {
            throw new AnalysisException(AnalysisException.Kind.FLOATING_NODE,
                    "no DC path to a defined voltage at node" + (floating.size() > 1 ? "s " : " ")
                            + String.join(", ", floating), floating);
        }
    }

    private AnalysisException failure() {
        String what = tried.isEmpty() ? "" : "; tried: " + String.join("; ", tried);
        if (linearStartSingular) {
            return new AnalysisException(AnalysisException.Kind.SINGULAR,
                    "the circuit equations are singular (for example a loop of voltage sources or two"
                            + " driven outputs tied together), and no strategy found an operating point" + what);
        }
        return new AnalysisException(AnalysisException.Kind.NO_CONVERGENCE,
                "the operating point did not converge" + what);
    }

    /** Three significant digits, for messages. */
    private static String g3(double v) {
        return String.format(java.util.Locale.ROOT, "%.3g", v);
    }

    /** Records a failed strategy's outcome and returns false. */
    private boolean gaveUp(String strategy, String reached) {
        tried.add(strategy + ": " + reached + (newtonStall.isEmpty() ? "" : " (Newton: " + newtonStall + ")"));
        return false;
    }

    /** The solution of the circuit with every limiter switched off, from x = 0. */
    private void linearStart(double[] x) {
        jacobianAtX = false;
        Arrays.fill(x, 0);
        system.evaluate(x, 0, Mode.DC, 1, 0, false, 1, sparse != null, f, g, null, null);
        factor();
        for (int i = 0; i < n; i++) {
            dx[i] = -f[i];
        }
        lu.solve(dx);
        for (int i = 0; i < n; i++) {
            x[i] = Double.isFinite(dx[i]) ? dx[i] : 0;
        }
    }

    /** {@link #linearStart}, or all zeros when the linearised circuit is singular. */
    private void linearStartOr(double[] x) {
        try {
            linearStart(x);
            linearStartSingular = false;
        } catch (AnalysisException e) {
            linearStartSingular = true;
            Arrays.fill(x, 0);
        }
    }

    /**
     * Limiter active-set search, for circuits where op-amps in a loop keep changing region together
     * (Newton with one region change per op-amp and iteration can then cycle). Each op-amp is given
     * an explicit mode: linear (x = u), clamped at its high edge or clamped at its low edge. From
     * all-linear, the circuit is solved with the modes held; then the one op-amp whose mode is most
     * inconsistent (a linear output beyond an edge, or a clamped output whose target has come back
     * inside) changes mode, and the circuit is solved again; a clamped op-amp made linear whose
     * linear solution lies beyond the edge it was clamped at is in positive feedback and takes the
     * other clamp instead. One change per pass avoids the cycles
     * of changing all at once. A consistent set of modes is then the start for a final Newton solve
     * on the true, smooth equations. Bounded by {@link #ACTIVE_SET_PASSES_PER_OP_AMP} per op-amp
     * plus {@link #ACTIVE_SET_EXTRA_PASSES}; updates x only on success.
     */
    private boolean limiterActiveSet(double[] x) {
        if (opAmpCount == 0) {
            return false;
        }
        double[] trial = new double[n];
        linearStartOr(trial);
        int[] mode = new int[opAmpCount];
        Arrays.fill(mode, ROW_UNLIMITED);
        int passes = ACTIVE_SET_PASSES_PER_OP_AMP * opAmpCount + ACTIVE_SET_EXTRA_PASSES;
        boolean consistent = false;
        int released = -1;
        int releasedFrom = ROW_UNLIMITED;
        int passesUsed = 0;
        for (int pass = 0; pass < passes && !consistent; pass++) {
            passesUsed = pass + 1;
            if (!heldModeNewton(trial, mode)) {
                return gaveUp("limiter active-set search", "a solve with the modes held failed in pass " + passesUsed);
            }
            if (released >= 0) {
                // A clamped op-amp just made linear whose linear solution lies beyond the edge it
                // was clamped at is in positive feedback: its consistent mode is the other clamp.
                system.opAmpLimiter(released, trial, 1, 1, limiter);
                double xs = trial[system.opAmpStateUnknown(released)];
                boolean back = releasedFrom == ROW_CLAMP_LOW ? xs < limiter[1] : xs > limiter[2];
                int op = released;
                released = -1;
                if (back) {
                    mode[op] = releasedFrom == ROW_CLAMP_LOW ? ROW_CLAMP_HIGH : ROW_CLAMP_LOW;
                    continue;
                }
            }
            int worst = -1;
            int worstMode = ROW_UNLIMITED;
            double worstAmount = ACTIVE_SET_TOLERANCE;
            for (int j = 0; j < opAmpCount; j++) {
                system.opAmpLimiter(j, trial, 1, 1, limiter);
                double u = limiter[0];
                double lo = limiter[1];
                double hi = limiter[2];
                if (limiter[3] <= 0) {
                    continue; // no window: the limited row is already linear in the supplies
                }
                double xs = trial[system.opAmpStateUnknown(j)];
                double amount = 0;
                int next = mode[j];
                switch (mode[j]) {
                    case ROW_UNLIMITED -> {
                        if (xs > hi) {
                            amount = xs - hi;
                            next = ROW_CLAMP_HIGH;
                        } else if (xs < lo) {
                            amount = lo - xs;
                            next = ROW_CLAMP_LOW;
                        }
                    }
                    case ROW_CLAMP_HIGH -> {
                        amount = hi - u;
                        next = ROW_UNLIMITED;
                    }
                    case ROW_CLAMP_LOW -> {
                        amount = u - lo;
                        next = ROW_UNLIMITED;
                    }
                    default -> { }
                }
                if (amount > worstAmount) {
                    worstAmount = amount;
                    worst = j;
                    worstMode = next;
                }
            }
            if (worst < 0) {
                consistent = true;
            } else {
                if (worstMode == ROW_UNLIMITED) {
                    released = worst;
                    releasedFrom = mode[worst];
                }
                mode[worst] = worstMode;
            }
        }
        if (!consistent) {
            newtonStall = "";
            return gaveUp("limiter active-set search", "no consistent set of linear/clamped modes in " + passesUsed
                    + " passes");
        }
        if (!newton(trial, 1, 0)) {
            return gaveUp("limiter active-set search", "the modes were consistent but Newton from them failed");
        }
        System.arraycopy(trial, 0, x, 0, n);
        return true;
    }

    /** Newton with every op-amp's state row held in {@code mode}; true when converged. */
    private boolean heldModeNewton(double[] x, int[] mode) {
        for (int it = 0; it < MAX_NEWTON_ITERATIONS; it++) {
            iterations++;
            System.arraycopy(mode, 0, rowKind, 0, opAmpCount);
            if (!step(x, 1, 0)) {
                newtonStall = "the circuit with the modes held was singular at iteration " + (it + 1);
                return false;
            }
            int worst = applyStep(x);
            if (worst == NON_FINITE_STEP) {
                newtonStall = "a non-finite step at iteration " + (it + 1);
                return false;
            }
            if (worst == STEP_WITHIN_TOLERANCE) {
                return true;
            }
        }
        newtonStall = MAX_NEWTON_ITERATIONS + " iterations with the modes held";
        return false;
    }

    /**
     * Gain stepping: a homotopy in the op-amps' open-loop gains. Every gain is scaled so that the
     * largest is {@link #GAIN_STEPPING_START}, where each op-amp barely amplifies and Newton
     * converges from zero; the scale then rises by up to {@link #GAIN_STEP_FACTOR} per step, each
     * solve starting from the last, with the factor refined by square roots after a failure, until
     * the real gains are reached. The solution follows a continuous path, which finds operating
     * points where an op-amp in a loop rests in its limiter's knee (no set of linear/clamped modes
     * is consistent there). Bounded by {@link #MAX_GAIN_STEPS} and {@link #MIN_GAIN_STEP_FACTOR};
     * updates x only on success.
     */
    private boolean gainStepping(double[] x) {
        if (opAmpCount == 0) {
            return false;
        }
        double maxGain = 0;
        for (OpAmp o : system.circuit().elements(OpAmp.class)) {
            maxGain = Math.max(maxGain, o.params().openLoopGain());
        }
        double level = Math.min(1, GAIN_STEPPING_START / maxGain);
        double[] trial = new double[n];
        double[] last = new double[n];
        try {
            gainScale = level;
            if (!newton(trial, 1, 0)) {
                return gaveUp("gain stepping", "no solution even at " + g3(level) + " of the op-amps' gains");
            }
            double factor = GAIN_STEP_FACTOR;
            int solves = 0;
            while (level < 1) {
                if (++solves > MAX_GAIN_STEPS) {
                    newtonStall = "";
                    return gaveUp("gain stepping", MAX_GAIN_STEPS + " solves reached " + g3(level)
                            + " of the op-amps' gains");
                }
                double next = Math.min(1, level * factor);
                System.arraycopy(trial, 0, last, 0, n);
                gainScale = next;
                if (newton(trial, 1, 0)) {
                    level = next;
                    factor = Math.min(factor * factor, GAIN_STEP_FACTOR);
                } else {
                    System.arraycopy(last, 0, trial, 0, n);
                    factor = Math.sqrt(factor);
                    if (factor < MIN_GAIN_STEP_FACTOR) {
                        return gaveUp("gain stepping", "stalled at " + g3(level)
                                + " of the op-amps' gains (step factor below " + MIN_GAIN_STEP_FACTOR + ")");
                    }
                }
            }
        } finally {
            gainScale = 1;
        }
        System.arraycopy(trial, 0, x, 0, n);
        return true;
    }

    private boolean gminStepping(double[] x) {
        double[] trial = new double[n];
        linearStartOr(trial);
        for (double gmin = GMIN_START; gmin >= GMIN_END; gmin /= GMIN_FACTOR) {
            if (!newton(trial, 1, gmin)) {
                return gaveUp("gmin stepping", "failed at a shunt of " + g3(gmin) + " S on every node");
            }
        }
        if (!newton(trial, 1, 0)) {
            return gaveUp("gmin stepping", "reached " + GMIN_END + " S but failed without the shunts");
        }
        System.arraycopy(trial, 0, x, 0, n);
        return true;
    }

    private boolean sourceStepping(double[] x) {
        double[] trial = new double[n];
        double[] last = new double[n];
        double scale = 0;
        double step = 0.1;
        if (!newton(trial, 0, 0)) {
            return gaveUp("source stepping", "no solution with every source at zero");
        }
        int solves = 0;
        while (scale < 1) {
            if (++solves > MAX_SOURCE_STEPS) {
                newtonStall = "";
                return gaveUp("source stepping", MAX_SOURCE_STEPS + " solves reached " + Math.round(100 * scale)
                        + " % of the sources");
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
                    return gaveUp("source stepping", "stalled at " + g3(100 * scale) + " % of the sources (step below "
                            + MIN_SOURCE_STEP + ")");
                }
            }
        }
        System.arraycopy(trial, 0, x, 0, n);
        return true;
    }

    /**
     * Pseudo-transient continuation (Kelley and Keyes, "Convergence analysis of pseudo-transient
     * continuation", SIAM J. Numer. Anal. 35 (1998), from memory): damped Newton steps
     * x ← x − (J + D/δ)⁻¹·f(x) on the true, limited equations, D the diagonal of J in the node and
     * op-amp state rows (the algebraic rows of sources and output pins get none), as if every node
     * had a capacitor to ground and every state its pole, marching in pseudo-time towards the
     * steady state. δ starts at {@link #PSEUDO_TRANSIENT_START} and follows the switched evolution
     * relaxation rule δ ← δ·‖f_old‖/‖f_new‖ (at least doubling while the residual does not grow, at
     * most ×{@link #PSEUDO_TRANSIENT_GROWTH} per step; ‖·‖ see residualSize, in volts); a step that
     * is singular, not finite or grows the residual tenfold is retried with δ/10. From δ ≥ {@link #PSEUDO_TRANSIENT_END}
     * plain Newton finishes. The last resort: the path follows the circuit's own settling rather
     * than a homotopy, which reaches operating points where op-amps in a loop keep the
     * undamped Newton steps jumping between rails. Bounded by {@link #MAX_PSEUDO_TRANSIENT_STEPS}
     * and {@link #PSEUDO_TRANSIENT_MIN}; updates x only on success.
     */
    private boolean pseudoTransient(double[] x) {
        double[] trial = new double[n];
        double[] last = new double[n];
        linearStartOr(trial);
        Arrays.fill(rowKind, ROW_LIMITED);
        double delta = PSEUDO_TRANSIENT_START;
        double before = residualSize(trial);
        double newtonAt = PSEUDO_TRANSIENT_NEWTON_FROM;
        double[] probe = new double[n];
        boolean settledTried = false;
        try {
            for (int k = 0; k < MAX_PSEUDO_TRANSIENT_STEPS && delta < PSEUDO_TRANSIENT_END; k++) {
                boolean settledNow = before <= PSEUDO_TRANSIENT_SETTLED_VOLTS && !settledTried;
                if (delta >= newtonAt || settledNow) {
                    settledTried |= settledNow;
                    newtonAt = Math.max(newtonAt, delta * PSEUDO_TRANSIENT_NEWTON_EVERY);
                    System.arraycopy(trial, 0, probe, 0, n);
                    pseudoInverseStep = 0;
                    if (newton(probe, 1, 0)) {
                        System.arraycopy(probe, 0, x, 0, n);
                        return true;
                    }
                    Arrays.fill(rowKind, ROW_LIMITED);
                }
                iterations++;
                System.arraycopy(trial, 0, last, 0, n);
                pseudoInverseStep = 1 / delta;
                boolean ok = step(trial, 1, 0);
                for (int i = 0; ok && i < n; i++) {
                    trial[i] += dx[i];
                    ok = Double.isFinite(trial[i]);
                }
                double after = ok ? residualSize(trial) : Double.NaN;
                if (!ok || !(after <= 10 * before + PSEUDO_TRANSIENT_SETTLED_VOLTS)) {
                    System.arraycopy(last, 0, trial, 0, n);
                    delta /= 10;
                    if (delta < PSEUDO_TRANSIENT_MIN) {
                        newtonStall = "";
                        return gaveUp("pseudo-transient continuation", "the pseudo-time step fell below "
                                + PSEUDO_TRANSIENT_MIN + " after " + (k + 1) + " steps");
                    }
                    continue;
                }
                // Switched evolution relaxation, at least doubling while the residual does not grow.
                double ratio = after > 0 ? before / after : PSEUDO_TRANSIENT_GROWTH;
                delta *= Math.min(PSEUDO_TRANSIENT_GROWTH, ratio >= 1 ? Math.max(2, ratio) : ratio);
                before = after;
            }
        } finally {
            pseudoInverseStep = 0;
        }
        if (delta < PSEUDO_TRANSIENT_END) {
            newtonStall = "";
            return gaveUp("pseudo-transient continuation", MAX_PSEUDO_TRANSIENT_STEPS + " steps reached a pseudo-time"
                    + " step of only " + g3(delta) + ": the march did not settle, as when the circuit oscillates or"
                    + " has no stable operating point");
        }
        if (!newton(trial, 1, 0)) {
            return gaveUp("pseudo-transient continuation", "the march reached plain Newton steps (relative step "
                    + PSEUDO_TRANSIENT_END + ") but Newton did not converge from there");
        }
        System.arraycopy(trial, 0, x, 0, n);
        return true;
    }

    /** Node rows that hold a branch current (a source or op-amp output), whose current absorbs their KCL residual. */
    private boolean[] nodeWithBranch;

    /**
     * The residual's size for pseudo-transient continuation, in volts: the largest |f_i| of the
     * source, output-pin and op-amp state equations, and |f_i / J_ii| of the node rows without a
     * branch current (a node row with one has its residual absorbed by that current in one step).
     */
    private double residualSize(double[] x) {
        system.evaluate(x, 0, Mode.DC, 1, 0, true, gainScale, sparse != null, f, g, null, null);
        jacobianAtX = false;
        if (nodeWithBranch == null) {
            nodeWithBranch = new boolean[nodeCount];
            for (int i = 0; i < nodeCount; i++) {
                for (int j = nodeCount; j < nodeCount + branchCount; j++) {
                    nodeWithBranch[i] |= g[i][j] != 0;
                }
            }
        }
        double worst = 0;
        for (int i = 0; i < n; i++) {
            double d = g[i][i];
            if (i >= nodeCount) {
                worst = Math.max(worst, Math.abs(f[i]));
            } else if (d != 0 && !nodeWithBranch[i]) {
                worst = Math.max(worst, Math.abs(f[i] / d));
            }
        }
        return worst;
    }

    /** Newton at one source scale and gmin; updates x in place; true when converged. */
    private boolean newton(double[] x, double scale, double gmin) {
        int worst = STEP_WITHIN_TOLERANCE;
        for (int it = 0; it < MAX_NEWTON_ITERATIONS; it++) {
            iterations++;
            boolean anyUnlimited = chooseRows(x, scale);
            if (!step(x, scale, gmin)) {
                newtonStall = "the linearised circuit was singular at iteration " + (it + 1);
                return false;
            }
            boolean residualOk = residualAcceptable();
            if (anyUnlimited && undoAgainstTarget(x, scale)) {
                if (!step(x, scale, gmin)) {
                    newtonStall = "the linearised circuit was singular at iteration " + (it + 1);
                    return false;
                }
            }
            // An iteration that used an unlimited state row solved other equations than the
            // circuit's: it may not end the loop, however small its step.
            boolean converged = residualOk && !anyUnlimitedRow();
            worst = applyStep(x);
            if (worst == NON_FINITE_STEP) {
                newtonStall = "a non-finite step at iteration " + (it + 1);
                return false;
            }
            if (converged && worst == STEP_WITHIN_TOLERANCE) {
                // The factors are those of the true Jacobian at the previous iterate, which the
                // converged step moved by less than the tolerance: the stability check reuses them.
                jacobianAtX = scale == 1 && gmin == 0 && gainScale == 1;
                return true;
            }
        }
        newtonStall = MAX_NEWTON_ITERATIONS + " iterations, "
                + (worst < 0 ? "the steps small but the equations not met"
                : system.unknownName(worst) + " still moving by " + g3(Math.abs(dx[worst]))
                + (isVoltage(worst) ? " V" : " A") + " a step");
        return false;
    }

    /**
     * The Newton update shared by {@link #newton} and {@link #heldModeNewton}: x += {@link #dx},
     * each unknown's move measured against {@link #RELATIVE_TOLERANCE} of its size plus
     * {@link #VOLTAGE_TOLERANCE} or {@link #CURRENT_TOLERANCE}. Returns
     * {@link #STEP_WITHIN_TOLERANCE}, the unknown that moved most beyond its tolerance, or
     * {@link #NON_FINITE_STEP} (x then updated only up to the bad entry).
     */
    private int applyStep(double[] x) {
        int worst = STEP_WITHIN_TOLERANCE;
        double worstMove = 0;
        for (int i = 0; i < n; i++) {
            if (!Double.isFinite(dx[i])) {
                return NON_FINITE_STEP;
            }
            double move = Math.abs(dx[i]);
            double next = x[i] + dx[i];
            double tol = RELATIVE_TOLERANCE * Math.max(Math.abs(x[i]), Math.abs(next))
                    + (isVoltage(i) ? VOLTAGE_TOLERANCE : CURRENT_TOLERANCE);
            if (move > tol && move > worstMove) {
                worstMove = move;
                worst = i;
            }
            x[i] = next;
        }
        return worst;
    }

    private boolean anyUnlimitedRow() {
        for (int j = 0; j < opAmpCount; j++) {
            if (rowKind[j] != ROW_LIMITED) {
                return true;
            }
        }
        return false;
    }

    /**
     * Evaluate at x, apply the state rows chosen in {@link #rowKind}, factor and solve for
     * the Newton step into {@link #dx}; records the node rows' magnitudes for the residual test.
     * False when the matrix is singular.
     */
    private boolean step(double[] x, double scale, double gmin) {
        jacobianAtX = false;
        system.evaluate(x, 0, Mode.DC, scale, gmin, true, gainScale, sparse != null, f, g, null, null);
        for (int j = 0; j < opAmpCount; j++) {
            switch (rowKind[j]) {
                case ROW_UNLIMITED -> system.unlimitedStateRow(j, x, scale, gainScale, f, g);
                case ROW_CLAMP_HIGH -> system.clampedStateRow(j, x, true, f, g);
                case ROW_CLAMP_LOW -> system.clampedStateRow(j, x, false, f, g);
                default -> { }
            }
        }
        if (pseudoInverseStep > 0) {
            // Pseudo-transient continuation: a pseudo-capacitance on every node and state row.
            for (int i = 0; i < n; i++) {
                if (i < nodeCount || i >= nodeCount + branchCount) {
                    g[i][i] *= 1 + pseudoInverseStep;
                }
            }
        }
        for (int i = 0; i < nodeCount; i++) {
            double m = 0;
            double[] row = g[i];
            if (pattern != null) {
                for (int p = pattern.rowStart[i]; p < pattern.rowStart[i + 1]; p++) {
                    int k = pattern.columns[p];
                    m += Math.abs(row[k] * x[k]);
                }
            } else {
                for (int k = 0; k < n; k++) {
                    m += Math.abs(row[k] * x[k]);
                }
            }
            rowMagnitude[i] = m;
        }
        try {
            factor();
        } catch (AnalysisException e) {
            return false;
        }
        for (int i = 0; i < n; i++) {
            dx[i] = -f[i];
        }
        lu.solve(dx);
        return true;
    }

    /**
     * Whether the residual at x (held in f by the last {@link #step}) is within tolerance in every
     * row: Kirchhoff's current law at every node, and every source and op-amp equation within
     * {@link #EQUATION_RESIDUAL_VOLTS}. The step size alone is not enough: near a swing limit a
     * high loop gain makes Newton's steps tiny while the op-amp equation is still volts off.
     */
    private boolean residualAcceptable() {
        for (int i = 0; i < nodeCount; i++) {
            if (!(Math.abs(f[i]) <= KCL_TOLERANCE_AMPS + RESIDUAL_RELATIVE_TOLERANCE * rowMagnitude[i])) {
                return false;
            }
        }
        for (int i = nodeCount; i < n; i++) {
            if (!(Math.abs(f[i]) <= EQUATION_RESIDUAL_VOLTS)) {
                return false;
            }
        }
        return true;
    }

    /** Marks the op-amps whose target lies beyond an edge their state has not reached; true if any. */
    private boolean chooseRows(double[] x, double scale) {
        boolean any = false;
        for (int j = 0; j < opAmpCount; j++) {
            system.opAmpLimiter(j, x, scale, gainScale, limiter);
            double u = limiter[0];
            double lo = limiter[1];
            double hi = limiter[2];
            double k = limiter[3];
            double xs = x[system.opAmpStateUnknown(j)];
            boolean release = k > 0
                    && ((u > hi - k && xs <= hi - k) || (u < lo + k && xs >= lo + k));
            rowKind[j] = release ? ROW_UNLIMITED : ROW_LIMITED;
            any |= release;
        }
        return any;
    }

    /**
     * After a step with unlimited rows: an op-amp whose state the step moved away from the side
     * its target lies on goes back to its limited row. True when any did (the step must be redone).
     */
    private boolean undoAgainstTarget(double[] x, double scale) {
        boolean any = false;
        for (int j = 0; j < opAmpCount; j++) {
            if (rowKind[j] != ROW_UNLIMITED) {
                continue;
            }
            system.opAmpLimiter(j, x, scale, gainScale, limiter);
            double u = limiter[0];
            double hi = limiter[2];
            double k = limiter[3];
            double move = dx[system.opAmpStateUnknown(j)];
            boolean targetHigh = u > hi - k;
            if (targetHigh ? move < 0 : move > 0) {
                rowKind[j] = ROW_LIMITED;
                any = true;
            }
        }
        return any;
    }

    /**
     * Moves a converged point off an unstable equilibrium. An op-amp in its linear region whose
     * loop gain exceeds {@link #UNSTABLE_LOOP_GAIN} (positive feedback, as in a Schmitt trigger
     * whose input lies inside its hysteresis band) sits on the unstable middle solution, which a
     * real circuit never rests on. The op-amp is then held at the nearer edge of its window (then
     * the other) and the circuit solved again; a converged result with that op-amp on its edge
     * replaces x. Which of two stable states a real circuit takes depends on its history, which a
     * DC analysis does not know. At most two extra solves per op-amp; x is kept when both fail.
     */
    private void preferStable(double[] x) {
        int[] mode = new int[opAmpCount];
        for (int j = 0; j < opAmpCount; j++) {
            system.opAmpLimiter(j, x, 1, 1, limiter);
            double u = limiter[0];
            double lo = limiter[1];
            double hi = limiter[2];
            double k = limiter[3];
            if (k <= 0 || u <= lo + k || u >= hi - k || !(loopGain(j, x) > UNSTABLE_LOOP_GAIN)) {
                continue;
            }
            int st = system.opAmpStateUnknown(j);
            boolean upperFirst = x[st] >= 0.5 * (lo + hi);
            jacobianAtX = false; // the solves below factor other matrices
            for (int attempt = 0; attempt < 2; attempt++) {
                boolean high = upperFirst == (attempt == 0);
                double[] trial = x.clone();
                Arrays.fill(mode, ROW_LIMITED);
                mode[j] = high ? ROW_CLAMP_HIGH : ROW_CLAMP_LOW;
                if (heldModeNewton(trial, mode) && newton(trial, 1, 0)) {
                    system.opAmpLimiter(j, trial, 1, 1, limiter);
                    boolean onEdge = high ? limiter[0] >= limiter[2] - limiter[3] : limiter[0] <= limiter[1] + limiter[3];
                    if (onEdge) {
                        System.arraycopy(trial, 0, x, 0, n);
                        break;
                    }
                }
            }
        }
    }

    /**
     * Loop gain of op-amp {@code j} at x: the change of its target u per volt of change of its
     * state, with the rest of the circuit linearised at x and the op-amp's own state row opened.
     * NaN when the opened circuit is singular.
     *
     * <p>Opening row s (replacing it by the unit row) is a rank-one change of the Jacobian G, so by
     * the Sherman–Morrison formula the opened system's response to a unit state change is
     * z / z_s with z = G⁻¹·e_s (Golub and Van Loan, Matrix Computations, §2.1.4): one
     * factorisation of G serves every op-amp of the circuit, and when the operating point has just
     * converged it is the factorisation of Newton's last iteration. When G is singular or z_s is within
     * {@link #LOOP_GAIN_DIRECT_BELOW} of zero (a loop gain near ±1/that, where the sign would be
     * uncertain), the opened matrix is factored directly.
     */
    private double loopGain(int j, double[] x) {
        int st = system.opAmpStateUnknown(j);
        if (!jacobianAtX && !jacobianSingular) {
            system.evaluate(x, 0, Mode.DC, 1, 0, true, 1, sparse != null, f, g, null, null);
            try {
                factor();
                jacobianAtX = true;
            } catch (AnalysisException e) {
                jacobianSingular = true;
            }
        }
        if (jacobianAtX) {
            Arrays.fill(dx, 0);
            dx[st] = 1;
            lu.solve(dx);
            double zs = dx[st];
            if (Math.abs(zs) >= LOOP_GAIN_DIRECT_BELOW && Double.isFinite(zs)) {
                return system.opAmpTargetChange(j, dx) / zs;
            }
        }
        jacobianAtX = false;
        system.evaluate(x, 0, Mode.DC, 1, 0, true, 1, sparse != null, f, g, null, null);
        Arrays.fill(g[st], 0, n, 0);
        g[st][st] = 1;
        try {
            factor();
        } catch (AnalysisException e) {
            return Double.NaN;
        }
        Arrays.fill(dx, 0);
        dx[st] = 1;
        lu.solve(dx);
        return system.opAmpTargetChange(j, dx);
    }

    /**
     * Factor {@link #g}: a sparse solver reads only the circuit's pattern (every entry the
     * equations and the row replacements can write lies in it), a dense one the whole array.
     */
    private void factor() {
        if (sparse != null) {
            sparse.factor(pattern, g);
        } else {
            lu.factor(g, n);
        }
    }

    /** Node voltages and op-amp states are voltages; branch currents are not. */
    private boolean isVoltage(int i) {
        return i < nodeCount || i >= nodeCount + branchCount;
    }

    /** The stability check on a converged x, then the finiteness check. */
    private void finish(double[] x) {
        jacobianSingular = false;
        preferStable(x);
        for (double v : x) {
            if (!Double.isFinite(v)) {
                throw new AnalysisException(AnalysisException.Kind.NO_CONVERGENCE,
                        "the operating point holds a non-finite value");
            }
        }
    }

    private OperatingPoint result(double[] x, OperatingPoint.Strategy strategy) {
        finish(x);
        Circuit c = system.circuit();
        system.evaluate(x, 0, Mode.DC, 1, 0, f, null, null, null);
        double residual = 0;
        for (int i = 0; i < system.nodeCount(); i++) {
            residual = Math.max(residual, Math.abs(f[i]));
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
        OperatingPoint op = new OperatingPoint(system, x, volts, amps, states, strategy, iterations, residual);
        SolveAudit.Listener audit = SolveAudit.listener;
        if (audit != null) {
            audit.operatingPoint(op);
        }
        return op;
    }
}
