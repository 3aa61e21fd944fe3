package halfrail.solve;

import java.util.Arrays;

/**
 * The one time-stepping loop of the package: it integrates {@code f(x, t) + d/dt q(x) = 0}
 * ({@link Mode#DYNAMIC} equations of an {@link MnaSystem}) with an {@link IntegrationMethod},
 * Newton's method at every step and step sizes chosen from the local truncation error.
 *
 * <p>Order schedule: after the start and after every break point the history is restarted. The
 * first step after a restart is backward Euler with a small step and no error estimate (there
 * is no history to estimate it from); the second is backward Euler checked with a second
 * divided difference; from the third on, the configured method (BDF2) checked with a third
 * divided difference. Break points are stepped onto exactly.
 *
 * <p>Error control covers node voltages and op-amp states (V): a step is accepted when every
 * estimated local error is at most {@code relTol·|x| + absTol}. A step is rejected and shrunk
 * when Newton fails or the error is too big. Every loop is bounded and ends in an
 * {@link AnalysisException}: STEP_LIMIT, STEP_TOO_SMALL or SINGULAR.
 *
 * <p>An instance holds work arrays for one system; it is not thread-safe.
 */
final class TransientStepper {
    /**
     * Newton iterations allowed in one time step before the step is rejected and shrunk. A step
     * that needs more is better retried shorter: near a limiter knee Newton can cycle between
     * two iterates for good (seen at every such failure in a twelve-stage cascade, each of which
     * used to cost 30 iterations and 15 factorisations). SPICE's transient limit (ITL4) is 10 as
     * well (from memory: the SPICE2 user's guide, .OPTIONS).
     */
    static final int MAX_NEWTON_ITERATIONS = 10;
    /** Newton iterations allowed for the consistent state at t = 0, which has no shorter step to fall back on. */
    static final int START_NEWTON_ITERATIONS = 30;
    /** Budget of step attempts (accepted plus rejected) in one run. */
    static final int MAX_STEPS = 100_000;
    /** Smallest step before the run ends in STEP_TOO_SMALL, s. */
    static final double MIN_STEP_SECONDS = 1e-15;
    /** First step of a run, s (smaller when the first break point or the stop time is near). */
    static final double INITIAL_STEP_SECONDS = 1e-9;
    /** The first step is at most this fraction of the time to the first break point or the stop. */
    static final double INITIAL_STEP_FRACTION = 1e-3;
    /** The first step after a break point is this fraction of the step that reached it. */
    static final double RESTART_STEP_FRACTION = 0.01;
    /** Largest growth of the step from one step to the next; below 1 + √2 for BDF2's stability. */
    static final double MAX_GROWTH = 2;
    /** Smallest factor by which a step that failed its error test is shrunk. */
    static final double MIN_SHRINK = 0.1;
    /** Safety factor on the step predicted from the error estimate. */
    static final double SAFETY = 0.8;
    /** Factor on the step after Newton failed. */
    static final double NEWTON_FAILURE_SHRINK = 0.125;
    /** Newton converges when every update is below this fraction of the error tolerance. */
    static final double NEWTON_TOLERANCE_FRACTION = 0.01;
    /** Absolute convergence tolerance of Newton for current unknowns, A. */
    static final double CURRENT_TOLERANCE_AMPS = 1e-12;
    /** Largest change of any voltage unknown in one Newton iteration after the first, V. */
    static final double MAX_VOLTAGE_STEP = 2.0;
    /**
     * Length of the pseudo step that finds a consistent state at t = 0 with every charge held
     * at its power-on value (empty capacitors, op-amp states at 0), s.
     */
    static final double CONSISTENT_START_SECONDS = 1e-12;
    /** Relative distance to a break point within which a step is stretched onto it. */
    static final double BREAK_POINT_RESOLUTION = 1e-9;
    /**
     * Jacobian reuse policy, part 1: the factors of the iteration matrix G + α0/h·C are kept
     * from one Newton iteration and one time step to the next until α0/h differs from the value
     * they were made with by more than this fraction (the stale C term then slows Newton down).
     */
    static final double REUSE_COEFFICIENT_CHANGE = 0.3;
    /**
     * Jacobian reuse policy, part 2: a contraction rate (ratio of successive update sizes) above
     * which reused factors are made afresh at the current iterate; a rate of 1 or more also drops
     * the update.
     */
    static final double REUSE_MAX_RATE = 0.01;
    /**
     * Jacobian reuse policy, part 4: with factors made at an earlier iterate, an update below the
     * tolerance ends Newton only when the error it leaves, about rate × update, is below this
     * fraction of the tolerance. Full Newton's last update leaves a quadratically small error,
     * and the residual left must be as small as that: the op-amp state rows have slopes of
     * 2π·GBW (about 1e7 /s), so a tolerance-sized error there is a large residual.
     */
    static final double REUSE_FINAL_REMAINDER = 1e-9;
    /** Jacobian reuse policy, part 3: iterations on reused factors after which they are made afresh. */
    static final int REUSE_MAX_ITERATIONS = 3;
    /**
     * Jacobian reuse policy, part 5: when a step that began on reused factors had to make them
     * afresh all the same, the next steps begin on fresh factors (the stale iterations before the
     * refresh are wasted work): one step after the first such failure, twice as many after each
     * further one in a row, at most this many; a step that converges on reused factors alone
     * ends the back-off. Near an op-amp's limiter knee, where the Jacobian changes from step to
     * step, nearly every step refactors anyway, and this saves one or two iterations per step.
     */
    static final int REUSE_BACKOFF_MAX_STEPS = 16;
    /** Newest points kept in the history: the highest-order method's past points plus its error estimate. */
    private static final int HISTORY = 4;

    /** Decides after each accepted point whether the run may stop before its stop time. */
    interface EarlyStop {
        /** @param t time in s, @param x the accepted solution (do not modify) */
        boolean reached(double t, double[] x);
    }

    /** Tolerances and limits of one run. */
    record Settings(double stopSeconds, double maxStepSeconds, double relativeTolerance,
                    double voltageToleranceVolts, double[] breakPoints) {
    }

    /** The accepted points of one run. */
    record Trajectory(double[] times, double[][] solutions, int[] orders, boolean[] restarts,
                      boolean stoppedEarly, int rejectedByError, int rejectedByNewton, int newtonIterations,
                      int factorizations) {
    }

    private final MnaSystem system;
    private final IntegrationMethod method;
    private final int n;
    private final boolean[] controlled;
    private final double[] f;
    private final double[][] g;
    private final double[] q;
    private final double[][] c;
    private final double[] r;
    private final double[] hist;
    private final double[] alpha = new double[HISTORY];
    private final double[] steps = new double[HISTORY];
    private final double[] differenceWeights = new double[HISTORY + 1];
    private final double[] tt = new double[HISTORY + 1];
    private final LinearSolver lu;
    /** The solver when it is sparse: then G and C are assembled as values of {@link #pattern}, not dense. */
    private final SparseLu sparse;
    private final MnaSystem.Pattern pattern;
    private final double[] gValues;
    private final double[] cValues;
    private final double[] rowScale;
    /** Kept pattern positions of the sparse assembly's writes (see {@link MnaSystem.SlotSequence}). */
    private final MnaSystem.SlotSequence slots;
    /** Whether {@link #lu} holds factors of an iteration matrix of this run. */
    private boolean factorsValid;
    /** α0/h of the factored iteration matrix, 1/s. */
    private double factoredCoefficient;
    /** Whether the next Newton iteration must factor the iteration matrix afresh. */
    private boolean refreshJacobian = true;
    /** Steps left that begin on fresh factors (reuse policy part 5), and the length of the last such run. */
    private int freshStarts;
    private int freshRun;
    private int factorizations;

    // History since the last restart, newest first.
    private final double[] histT = new double[HISTORY];
    private final double[][] histX;
    private final double[][] histQ;
    private int histCount;

    private int newtonIterations;
    private boolean lastFailureSingular;

    TransientStepper(MnaSystem system, IntegrationMethod method) {
        this(system, method, LinearSolvers.forSize(system.size()));
    }

    /** As {@link #TransientStepper(MnaSystem, IntegrationMethod)} with a given linear solver. */
    TransientStepper(MnaSystem system, IntegrationMethod method, LinearSolver solver) {
        this.system = system;
        this.method = method;
        this.n = system.size();
        this.f = new double[n];
        this.q = new double[n];
        this.sparse = solver instanceof SparseLu sp ? sp : null;
        this.pattern = sparse != null ? system.pattern() : null;
        this.gValues = sparse != null ? new double[pattern.entries()] : null;
        this.cValues = sparse != null ? new double[pattern.entries()] : null;
        this.slots = sparse != null ? new MnaSystem.SlotSequence(pattern) : null;
        this.g = sparse != null ? null : new double[n][n];
        this.c = sparse != null ? null : new double[n][n];
        this.r = new double[n];
        this.hist = new double[n];
        this.rowScale = new double[n];
        this.lu = solver;
        this.histX = new double[HISTORY][n];
        this.histQ = new double[HISTORY][n];
        this.controlled = new boolean[n];
        int branches = system.circuit().elements(halfrail.circuit.VoltageSource.class).size()
                + system.circuit().elements(halfrail.circuit.OpAmp.class).size();
        for (int i = 0; i < n; i++) {
            controlled[i] = i < system.nodeCount() || i >= system.nodeCount() + branches;
        }
    }

    /** Whether unknown {@code i} is a voltage under error control (node voltage or op-amp state). */
    boolean isVoltage(int i) {
        return controlled[i];
    }

    /** Integrate from power-on (every charge zero) to the stop time or an early stop. */
    Trajectory run(Settings s, EarlyStop earlyStop) {
        Points points = new Points();
        newtonIterations = 0;
        factorizations = 0;
        factorsValid = false;
        refreshJacobian = true;
        freshStarts = 0;
        freshRun = 0;
        int rejectedByError = 0;
        int rejectedByNewton = 0;

        double[] x = new double[n];
        consistentStart(x, s);
        double t = 0;
        histCount = 0;
        push(t, x);
        points.add(t, x, 0, true);

        double[] bps = s.breakPoints().clone();
        Arrays.sort(bps);
        int nextBp = 0;
        while (nextBp < bps.length && bps[nextBp] <= 0) {
            nextBp++;
        }
        double firstTarget = nextBp < bps.length ? Math.min(bps[nextBp], s.stopSeconds()) : s.stopSeconds();
        double h = Math.min(Math.min(INITIAL_STEP_SECONDS, INITIAL_STEP_FRACTION * firstTarget), s.maxStepSeconds());
        double[] pred = new double[n];
        int attempts = 0;
        boolean stoppedEarly = false;

        while (t < s.stopSeconds()) {
            if (++attempts > MAX_STEPS) {
                throw new AnalysisException(AnalysisException.Kind.STEP_LIMIT,
                        "the transient used its budget of " + MAX_STEPS + " steps and reached only t = " + t
                                + " s of " + s.stopSeconds() + " s");
            }
            double target = nextBp < bps.length ? Math.min(bps[nextBp], s.stopSeconds()) : s.stopSeconds();
            boolean onTarget = false;
            h = Math.min(h, s.maxStepSeconds());
            if (t + h >= target - BREAK_POINT_RESOLUTION * Math.max(target, h)) {
                h = target - t;
                onTarget = true;
            } else if (t + 2 * h > target) {
                h = 0.5 * (target - t);
            }
            if (h < MIN_STEP_SECONDS || t + h == t) {
                throw new AnalysisException(lastFailureSingular ? AnalysisException.Kind.SINGULAR
                        : AnalysisException.Kind.STEP_TOO_SMALL,
                        "the time step fell to " + h + " s (minimum " + MIN_STEP_SECONDS + " s) at t = " + t + " s"
                                + (lastFailureSingular ? "; the system matrix was singular" : ""));
            }
            IntegrationMethod m = histCount > method.pastPoints() ? method : BackwardEuler.INSTANCE;
            boolean checked = histCount > m.order();
            int k = m.pastPoints();
            steps[0] = h;
            for (int i = 1; i < k; i++) {
                steps[i] = histT[i - 1] - histT[i];
            }
            m.coefficients(steps, alpha);
            double tNew = onTarget ? target : t + h;
            predict(tNew, Math.min(histCount, m.order() + 1), pred);
            System.arraycopy(pred, 0, x, 0, n);
            if (!newton(x, tNew, h, k, s, MAX_NEWTON_ITERATIONS)) {
                rejectedByNewton++;
                h *= NEWTON_FAILURE_SHRINK;
                continue;
            }
            double factor;
            if (checked) {
                double err = errorRatio(x, tNew, m, s);
                double grow = err == 0 ? MAX_GROWTH : SAFETY * Math.pow(err, -1.0 / (m.order() + 1));
                if (err > 1) {
                    rejectedByError++;
                    h *= Math.max(MIN_SHRINK, Math.min(grow, 0.5));
                    continue;
                }
                factor = Math.min(MAX_GROWTH, grow);
            } else {
                factor = MAX_GROWTH;
            }
            // Accept.
            t = tNew;
            lastFailureSingular = false;
            boolean restart = onTarget && nextBp < bps.length && target == bps[nextBp];
            points.add(t, x, m.order(), restart);
            if (restart) {
                while (nextBp < bps.length && bps[nextBp] <= t) {
                    nextBp++;
                }
                histCount = 0;
                push(t, x);
                h = Math.max(h * RESTART_STEP_FRACTION, 2 * MIN_STEP_SECONDS);
            } else {
                push(t, x);
                h *= factor;
            }
            if (earlyStop != null && t < s.stopSeconds() && earlyStop.reached(t, x)) {
                stoppedEarly = true;
                break;
            }
        }
        int count = points.count;
        return new Trajectory(Arrays.copyOf(points.times, count), Arrays.copyOf(points.solutions, count),
                Arrays.copyOf(points.orders, count), Arrays.copyOf(points.restarts, count), stoppedEarly,
                rejectedByError, rejectedByNewton, newtonIterations, factorizations);
    }

    /** The accepted points of a run, in arrays that grow by doubling (no boxing per step). */
    private static final class Points {
        double[] times = new double[256];
        double[][] solutions = new double[256][];
        int[] orders = new int[256];
        boolean[] restarts = new boolean[256];
        int count;

        void add(double t, double[] x, int order, boolean restart) {
            if (count == times.length) {
                int size = 2 * count;
                times = Arrays.copyOf(times, size);
                solutions = Arrays.copyOf(solutions, size);
                orders = Arrays.copyOf(orders, size);
                restarts = Arrays.copyOf(restarts, size);
            }
            times[count] = t;
            solutions[count] = x.clone();
            orders[count] = order;
            restarts[count] = restart;
            count++;
        }
    }

    /**
     * The state at t = 0: charges at their power-on values (zero), the algebraic part solved
     * with the sources at their t = 0 values. A backward-Euler pseudo step of
     * {@link #CONSISTENT_START_SECONDS} from x = 0 with the time held at 0.
     */
    private void consistentStart(double[] x, Settings s) {
        Arrays.fill(x, 0);
        histCount = 0;
        push(0, x);
        BackwardEuler.INSTANCE.coefficients(steps, alpha);
        if (!newton(x, 0, CONSISTENT_START_SECONDS, 1, s, START_NEWTON_ITERATIONS)) {
            throw new AnalysisException(lastFailureSingular ? AnalysisException.Kind.SINGULAR
                    : AnalysisException.Kind.NO_CONVERGENCE,
                    "no consistent state at power-on: Newton did not converge in " + START_NEWTON_ITERATIONS
                            + " iterations with every capacitor empty");
        }
        histCount = 0;
    }

    private void push(double t, double[] x) {
        double[] oldX = histX[HISTORY - 1];
        double[] oldQ = histQ[HISTORY - 1];
        for (int i = HISTORY - 1; i > 0; i--) {
            histT[i] = histT[i - 1];
            histX[i] = histX[i - 1];
            histQ[i] = histQ[i - 1];
        }
        histT[0] = t;
        histX[0] = oldX;
        histQ[0] = oldQ;
        System.arraycopy(x, 0, oldX, 0, n);
        system.evaluate(x, t, Mode.DYNAMIC, 1, 0, f, null, oldQ, null);
        histCount = Math.min(histCount + 1, HISTORY);
    }

    /** Polynomial extrapolation through the newest {@code points} history points to {@code tNew}. */
    private void predict(double tNew, int points, double[] out) {
        Arrays.fill(out, 0);
        for (int j = 0; j < points; j++) {
            double w = 1;
            for (int l = 0; l < points; l++) {
                if (l != j) {
                    w *= (tNew - histT[l]) / (histT[j] - histT[l]);
                }
            }
            double[] xj = histX[j];
            for (int i = 0; i < n; i++) {
                out[i] += w * xj[i];
            }
        }
    }

    /**
     * Newton's method on f(x, t) + (α0·q(x) + Σ αj·q_{n+1−j}) / h = 0, starting from and
     * updating {@code x}. Returns false when it does not converge or the matrix is singular.
     *
     * <p>The iteration matrix G + α0/h·C is factored only when the reuse policy of the class
     * constants asks for it ({@link #REUSE_COEFFICIENT_CHANGE}, {@link #REUSE_MAX_RATE},
     * {@link #REUSE_MAX_ITERATIONS}); otherwise the factors of an earlier iterate or step serve
     * (modified Newton, Hairer and Wanner, Solving ODEs II, §IV.8). Convergence: every update
     * below {@link #NEWTON_TOLERANCE_FRACTION} of the error tolerance, as in full Newton; with
     * factors made at an earlier iterate, also a measured contraction rate (ratio of successive
     * update sizes) small enough that rate × update is below {@link #REUSE_FINAL_REMAINDER}.
     */
    private boolean newton(double[] x, double t, double h, int k, Settings s, int maxIterations) {
        Arrays.fill(hist, 0);
        for (int j = 1; j <= k; j++) {
            double a = alpha[j];
            double[] qj = histQ[j - 1];
            for (int i = 0; i < n; i++) {
                hist[i] += a * qj[i];
            }
        }
        double a0h = alpha[0] / h;
        if (!factorsValid || Math.abs(a0h / factoredCoefficient - 1) > REUSE_COEFFICIENT_CHANGE) {
            refreshJacobian = true;
        }
        if (freshStarts > 0) {
            freshStarts--;
            refreshJacobian = true;
        }
        // Whether this step tries the kept factors first, for part 5 of the policy.
        boolean beganStale = !refreshJacobian;
        int staleIterations = 0;
        int factorizationsAtStart = factorizations;
        double previous = Double.NaN;
        for (int it = 0; it < maxIterations; it++) {
            newtonIterations++;
            boolean refresh = refreshJacobian;
            if (!refresh || sparse == null) {
                system.evaluate(x, t, Mode.DYNAMIC, 1, 0, f, refresh ? g : null, q, refresh ? c : null);
            }
            if (refresh && sparse != null) {
                system.evaluateSparse(x, t, f, gValues, q, cValues, slots);
                int[] rowStart = pattern.rowStart;
                for (int i = 0; i < n; i++) {
                    double scale = 0;
                    for (int p = rowStart[i]; p < rowStart[i + 1]; p++) {
                        gValues[p] += a0h * cValues[p];
                        scale = Math.max(scale, Math.abs(gValues[p]));
                    }
                    double inv = scale > 0 && Double.isFinite(scale) ? 1 / scale : 1;
                    rowScale[i] = inv;
                    if (inv != 1) {
                        for (int p = rowStart[i]; p < rowStart[i + 1]; p++) {
                            gValues[p] *= inv;
                        }
                    }
                }
            } else if (refresh) {
                for (int i = 0; i < n; i++) {
                    double[] gi = g[i];
                    double[] ci = c[i];
                    double scale = 0;
                    for (int j = 0; j < n; j++) {
                        gi[j] += a0h * ci[j];
                        scale = Math.max(scale, Math.abs(gi[j]));
                    }
                    // Row equilibration: the op-amp state rows (1/h) and the node rows (conductances)
                    // differ by many decades at small steps; the pivot threshold is relative.
                    double inv = scale > 0 && Double.isFinite(scale) ? 1 / scale : 1;
                    rowScale[i] = inv;
                    if (inv != 1) {
                        for (int j = 0; j < n; j++) {
                            gi[j] *= inv;
                        }
                    }
                }
            }
            if (refresh) {
                factorizations++;
                try {
                    if (sparse != null) {
                        sparse.factor(pattern, gValues);
                    } else {
                        lu.factor(g, n);
                    }
                } catch (AnalysisException e) {
                    factorsValid = false;
                    lastFailureSingular = true;
                    return false;
                }
                factorsValid = true;
                factoredCoefficient = a0h;
                refreshJacobian = false;
                staleIterations = 0;
                previous = Double.NaN;
            } else {
                staleIterations++;
            }
            lastFailureSingular = false;
            for (int i = 0; i < n; i++) {
                r[i] = -(f[i] + (alpha[0] * q[i] + hist[i]) / h) * rowScale[i];
            }
            lu.solve(r);
            double maxStep = 0;
            boolean finite = true;
            for (int i = 0; i < n; i++) {
                if (!Double.isFinite(r[i])) {
                    finite = false;
                    break;
                }
                if (controlled[i]) {
                    maxStep = Math.max(maxStep, Math.abs(r[i]));
                }
            }
            if (!finite) {
                if (refresh) {
                    refreshJacobian = true;
                    return false;
                }
                refreshJacobian = true; // old factors gave nonsense here: factor at this iterate
                continue;
            }
            double damp = it > 0 && maxStep > MAX_VOLTAGE_STEP ? MAX_VOLTAGE_STEP / maxStep : 1;
            // Size of the update relative to the tolerance (the largest ratio over the unknowns).
            double ratio = 0;
            for (int i = 0; i < n; i++) {
                double step = damp * r[i];
                double next = x[i] + step;
                double abs = controlled[i] ? s.voltageToleranceVolts() : CURRENT_TOLERANCE_AMPS;
                double tol = NEWTON_TOLERANCE_FRACTION
                        * (s.relativeTolerance() * Math.max(Math.abs(x[i]), Math.abs(next)) + abs);
                ratio = Math.max(ratio, Math.abs(step) / tol);
            }
            double rate = previous > 0 && !refresh ? ratio / previous : Double.NaN;
            if (!refresh && rate >= 1) {
                // Old factors that no longer contract: drop this update, factor at this iterate.
                refreshJacobian = true;
                continue;
            }
            for (int i = 0; i < n; i++) {
                x[i] += damp * r[i];
            }
            previous = ratio;
            // Converged: the update is below the tolerance and, unless the factors were made at
            // this very iterate, the measured contraction shows they still describe the system.
            if (damp == 1 && ratio <= 1 && (refresh || rate * ratio <= REUSE_FINAL_REMAINDER)) {
                if (beganStale) {
                    if (factorizations == factorizationsAtStart) {
                        freshRun = 0;
                    } else {
                        freshRun = Math.min(REUSE_BACKOFF_MAX_STEPS, Math.max(1, 2 * freshRun));
                        freshStarts = freshRun;
                    }
                }
                return true;
            }
            if (!refresh && (rate > REUSE_MAX_RATE || staleIterations >= REUSE_MAX_ITERATIONS)) {
                refreshJacobian = true;
            }
        }
        refreshJacobian = true;
        return false;
    }

    /**
     * Largest ratio of estimated local error to tolerance over the controlled unknowns; the
     * error is the method's factor times the divided difference of order p+1 over the new point
     * and the newest p+1 history points.
     */
    private double errorRatio(double[] x, double tNew, IntegrationMethod m, Settings s) {
        int p = m.order() + 2;
        double e = m.errorFactor(steps);
        tt[0] = tNew;
        for (int j = 1; j < p; j++) {
            tt[j] = histT[j - 1];
        }
        // The divided difference of order p−1 is Σ x_j / Π_{l≠j} (t_j − t_l): weights once per
        // step, then p multiply-adds per unknown.
        for (int j = 0; j < p; j++) {
            double d = 1;
            for (int l = 0; l < p; l++) {
                if (l != j) {
                    d *= tt[j] - tt[l];
                }
            }
            differenceWeights[j] = 1 / d;
        }
        double worst = 0;
        for (int i = 0; i < n; i++) {
            if (!controlled[i]) {
                continue;
            }
            double sum = differenceWeights[0] * x[i];
            for (int j = 1; j < p; j++) {
                sum += differenceWeights[j] * histX[j - 1][i];
            }
            double lte = e * Math.abs(sum);
            double tol = s.relativeTolerance() * Math.max(Math.abs(x[i]), Math.abs(histX[0][i]))
                    + s.voltageToleranceVolts();
            worst = Math.max(worst, lte / tol);
        }
        return worst;
    }
}
