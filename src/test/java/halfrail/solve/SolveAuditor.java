package halfrail.solve;

import halfrail.circuit.Capacitor;
import halfrail.circuit.Circuit;
import halfrail.circuit.CurrentSource;
import halfrail.circuit.Element;
import halfrail.circuit.OpAmp;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.Resistor;
import halfrail.circuit.VoltageSource;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Queue;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.atomic.AtomicLong;

/**
 * The test suite's check of every solver result (installed through {@link SolveAudit} by
 * {@link SolveAuditExtension} for JUnit Jupiter tests and {@link SolveAuditHook} for jqwik
 * properties, both registered automatically). For every DC operating point, power-on run and AC
 * solve it checks that every reported number is finite and that Kirchhoff's current law holds at
 * every node: the net current, summed element by element from the reported voltages and branch
 * currents (not from the solver's own equations), within {@link #RELATIVE} of the largest term
 * of that node's balance plus {@link #ABSOLUTE_AMPS}. Source: Kirchhoff's current law (any
 * circuits text, e.g. Horowitz &amp; Hill, The Art of Electronics, 3rd ed., ch. 1); the 1e-6
 * relative tolerance is the one of the existing KCL tests (PowerOnKclTest).
 *
 * <p>Terms of a node's balance: each resistor's and each capacitor leakage's Ohm's-law current;
 * each source current; each op-amp pin current of the element's documented model (bias currents
 * into the inputs, quiescent plus sourced current into V+, the output current, the balance out
 * of V−); in the power-on run each capacitor's charging current, rebuilt from the stored node
 * voltages by the step's backward-difference formula (backward Euler; variable-step BDF2, Hairer
 * &amp; Wanner, Solving ODEs II, §III.5, from memory), whose terms are the charges a_k·C·V_k/h.
 * In the AC solve a row's terms are G_ij·x_j, ω·C_ij·x_j and b_i of the linearised system.
 *
 * <p>Violations are recorded, never thrown into the solver (that would change what the code
 * under test sees); the extension and the hook fail the test that was running.
 */
public final class SolveAuditor implements SolveAudit.Listener {
    /** Residual allowed relative to the largest term of a node's balance. */
    public static final double RELATIVE = 1e-6;
    /** Residual allowed regardless of the terms in a DC or power-on balance, A. */
    public static final double ABSOLUTE_AMPS = 1e-12;
    /**
     * Residual allowed regardless of the terms in an AC balance, A per unit of input: the DC
     * solver's own floor ({@link DcSolver#KCL_TOLERANCE_AMPS}). The LU's rounding is bounded in norm,
     * not row by row, so a node whose only terms are tiny (the unloaded output of a saturated
     * stage, an input fed through one bias resistor) carries about 1e-12 A per volt of the
     * op-amp rows' rounding.
     */
    public static final double AC_ABSOLUTE_AMPS = DcSolver.KCL_TOLERANCE_AMPS;
    /**
     * Residual allowed in a DC voltage-source or op-amp equation, V: the DC solver's own
     * acceptance limit ({@link DcSolver#EQUATION_RESIDUAL_VOLTS}), which its last step only shrinks.
     */
    public static final double EQUATION_VOLTS = DcSolver.EQUATION_RESIDUAL_VOLTS;
    /** Most violations kept between two checks (the rest are counted). */
    private static final int KEEP = 20;

    private static final SolveAuditor INSTANCE = new SolveAuditor();

    private final Queue<AssertionError> violations = new ConcurrentLinkedQueue<>();
    private final AtomicLong dropped = new AtomicLong();
    private final AtomicLong operatingPoints = new AtomicLong();
    private final AtomicLong powerOnRuns = new AtomicLong();
    private final AtomicLong acSolves = new AtomicLong();

    private SolveAuditor() {}

    /** Installs the auditor (idempotent); called by the extension and the hook. */
    static SolveAuditor install() {
        SolveAudit.listener = INSTANCE;
        return INSTANCE;
    }

    /** Whether the auditor is installed. */
    public static boolean installed() {
        return SolveAudit.listener == INSTANCE;
    }

    /** Results audited so far: DC operating points, power-on runs, AC solves. */
    public static long[] counts() {
        return new long[] {INSTANCE.operatingPoints.get(), INSTANCE.powerOnRuns.get(), INSTANCE.acSolves.get()};
    }

    /** As {@link #drain()}, for tests in other packages that attribute violations themselves (surveys). */
    public static AssertionError takeViolations() {
        return drain();
    }

    /** Takes the violations recorded since the last call: null when there were none. */
    static AssertionError drain() {
        AssertionError first = null;
        for (AssertionError e; (e = INSTANCE.violations.poll()) != null; ) {
            if (first == null) {
                first = new AssertionError("solver result audit failed: " + e.getMessage(), e);
            } else {
                first.addSuppressed(e);
            }
        }
        long lost = INSTANCE.dropped.getAndSet(0);
        if (first != null && lost > 0) {
            first.addSuppressed(new AssertionError(lost + " further violations not kept"));
        }
        return first;
    }

    private void record(String problem) {
        if (violations.size() < KEEP) {
            violations.add(new AssertionError(problem + " [thread " + Thread.currentThread().getName() + "]"));
        } else {
            dropped.incrementAndGet();
        }
    }

    @Override
    public void operatingPoint(OperatingPoint op) {
        operatingPoints.incrementAndGet();
        try {
            problems(op).forEach(this::record);
        } catch (RuntimeException e) {
            record("the audit of an operating point threw " + e);
        }
    }

    @Override
    public void powerOn(PowerOnResult result) {
        powerOnRuns.incrementAndGet();
        try {
            problems(result).forEach(this::record);
        } catch (RuntimeException e) {
            record("the audit of a power-on run threw " + e);
        }
    }

    @Override
    public void acSolve(MnaSystem system, double[][] g, double[][] c, double omega, double[] b, double[] xRe,
                        double[] xIm) {
        acSolves.incrementAndGet();
        try {
            problems(system, g, c, omega, b, xRe, xIm).forEach(this::record);
        } catch (RuntimeException e) {
            record("the audit of an AC solve threw " + e);
        }
    }

    // ---- the checks (package-private: SolveAuditorTest shows that each can fail) ----

    /** What is wrong with a DC operating point; empty when nothing is. */
    static List<String> problems(OperatingPoint op) {
        List<String> out = new ArrayList<>();
        MnaSystem sys = op.system();
        double[] x = op.solution();
        finite(out, "operating point", x);
        op.nodeVolts().forEach((k, v) -> finite(out, "node voltage " + k, v));
        op.branchAmps().forEach((k, v) -> finite(out, "branch current " + k, v));
        finite(out, "largest KCL residual", op.maxKclResidualAmps());
        for (OpAmpState s : op.opAmps()) {
            finite(out, s.name() + " state", s.outputVolts(), s.inPlusVolts(), s.inMinusVolts(), s.swingLowVolts(),
                    s.swingHighVolts(), s.commonModeLowVolts(), s.commonModeHighVolts(), s.outputAmps(),
                    s.supplyAmps());
        }
        if (!out.isEmpty()) {
            return out;
        }
        Balance bal = balance(sys, x, null, null, 0);
        bal.report(out, sys, "DC operating point (" + op.strategy() + ")");
        double[] f = new double[sys.size()];
        sys.evaluate(x, 0, Mode.DC, 1, 0, f, null, null, null);
        for (int i = sys.nodeCount(); i < sys.size(); i++) {
            if (!(Math.abs(f[i]) <= EQUATION_VOLTS)) {
                out.add("DC operating point (" + op.strategy() + "): the equation of " + sys.unknownName(i)
                        + " is off by " + f[i] + " V (limit " + EQUATION_VOLTS + " V); " + describe(sys));
            }
        }
        return out;
    }

    /** What is wrong with a power-on run; empty when nothing is. */
    static List<String> problems(PowerOnResult r) {
        List<String> out = new ArrayList<>();
        MnaSystem sys = r.system();
        double[] times = r.timesSeconds();
        finite(out, "time points", times);
        for (int i = 0; i < r.pointCount(); i++) {
            finite(out, "solution at point " + i, r.solution(i));
        }
        r.settleTimeSeconds().ifPresent(t -> finite(out, "settle-up time", t));
        for (PowerOnResult.RailTime t : r.railTimes()) {
            finite(out, "time on rail of " + t.opAmp(), t.secondsOnRail());
            t.lastOnRailSeconds().ifPresent(v -> finite(out, "last time on rail of " + t.opAmp(), v));
        }
        for (PowerOnResult.LoadStep s : r.loadSteps()) {
            finite(out, "load step at " + s.node(), s.peakDeviationVolts(), s.atSeconds());
        }
        PowerOnResult.StepStatistics st = r.statistics();
        finite(out, "step statistics", st.smallestStepSeconds(), st.largestStepSeconds());
        if (!out.isEmpty()) {
            return out;
        }
        for (int i = 1; i < r.pointCount() && out.isEmpty(); i++) {
            double h = times[i] - times[i - 1];
            double[] a;
            double[][] xs;
            if (r.stepOrder(i) == 1) {
                a = new double[] {1, -1};
                xs = new double[][] {r.solution(i), r.solution(i - 1)};
            } else {
                double rho = h / (times[i - 1] - times[i - 2]);
                a = new double[] {(1 + 2 * rho) / (1 + rho), -(1 + rho), rho * rho / (1 + rho)};
                xs = new double[][] {r.solution(i), r.solution(i - 1), r.solution(i - 2)};
            }
            String what = "power-on point " + i + " at " + times[i] + " s";
            balance(sys, xs[0], xs, a, h).report(out, sys, what);
            for (VoltageSource v : sys.circuit().elements(VoltageSource.class)) {
                double amps = xs[0][sys.branchIndex(v.name())];
                double lhs = sys.voltage(xs[0], v.plus()) - sys.voltage(xs[0], v.minus());
                double rhs = v.valueAt(times[i]) - v.seriesOhms() * amps;
                double tol = 1e-9 * Math.max(1, Math.abs(v.valueAt(times[i])));
                if (!(Math.abs(lhs - rhs) <= tol) && out.isEmpty()) {
                    out.add(what + ": " + v.name() + " has V(+) − V(−) = " + lhs + " V but the source gives " + rhs
                            + " V; " + describe(sys));
                }
            }
        }
        return out;
    }

    /** What is wrong with one AC solve; empty when nothing is. */
    static List<String> problems(MnaSystem sys, double[][] g, double[][] c, double omega, double[] b, double[] xRe,
                                 double[] xIm) {
        List<String> out = new ArrayList<>();
        int n = sys.size();
        finite(out, "AC solution (real part)", xRe);
        finite(out, "AC solution (imaginary part)", xIm);
        if (!out.isEmpty()) {
            return out;
        }
        for (int i = 0; i < sys.nodeCount(); i++) {
            double re = -b[i];
            double im = 0;
            // squared moduli (no hypot in the inner loop: the audit runs on every AC solve of every test)
            double largest2 = b[i] * b[i];
            double[] gi = g[i];
            double[] ci = c[i];
            for (int j = 0; j < n; j++) {
                double gij = gi[j];
                double wc = omega * ci[j];
                if (gij == 0 && wc == 0) {
                    continue;
                }
                double x2 = xRe[j] * xRe[j] + xIm[j] * xIm[j];
                // (g + jωc)(xr + j·xi) = g·xr − ωc·xi + j(g·xi + ωc·xr)
                re += gij * xRe[j] - wc * xIm[j];
                im += gij * xIm[j] + wc * xRe[j];
                largest2 = Math.max(largest2, Math.max(gij * gij, wc * wc) * x2);
            }
            double net = Math.sqrt(re * re + im * im);
            double largest = Math.sqrt(largest2);
            double tol = AC_ABSOLUTE_AMPS + RELATIVE * largest;
            if (!(net <= tol)) {
                StringBuilder terms = new StringBuilder();
                for (int j = 0; j < n; j++) {
                    if (g[i][j] != 0 || c[i][j] != 0) {
                        terms.append(" [").append(sys.unknownName(j)).append(": g=").append(g[i][j]).append(" wc=")
                                .append(omega * c[i][j]).append(" x=").append(xRe[j]).append("+j").append(xIm[j]).append(']');
                    }
                }
                out.add("AC solve at " + omega / (2 * Math.PI) + " Hz: KCL fails at node " + sys.nodeName(i)
                        + ": net " + net + " (per unit input), tolerance " + tol + "; terms" + terms + "; " + describe(sys));
                return out;
            }
        }
        return out;
    }

    /** Net current and largest term at every node (index as the system's node unknowns). */
    private record Balance(double[] net, double[] largest) {
        void add(int node, double amps) {
            if (node >= 0) {
                net[node] += amps;
                largest[node] = Math.max(largest[node], Math.abs(amps));
            }
        }

        void report(List<String> out, MnaSystem sys, String what) {
            for (int i = 0; i < net.length; i++) {
                double tol = ABSOLUTE_AMPS + RELATIVE * largest[i];
                if (!(Math.abs(net[i]) <= tol)) {
                    out.add(what + ": KCL fails at node " + sys.nodeName(i) + ": net current " + net[i]
                            + " A, tolerance " + tol + " A (largest term " + largest[i] + " A); " + describe(sys));
                    return;
                }
            }
        }
    }

    /**
     * The balance at every node for solution x. With {@code history} (x at the point itself, then
     * the earlier points) and the difference coefficients a over step h, the capacitors' charging
     * currents are included.
     */
    private static Balance balance(MnaSystem sys, double[] x, double[][] history, double[] a, double h) {
        int nodes = sys.nodeCount();
        Balance s = new Balance(new double[nodes], new double[nodes]);
        boolean dynamic = history != null;
        for (Element e : sys.circuit().elements()) {
            if (e instanceof Resistor r) {
                double i = (sys.voltage(x, r.a()) - sys.voltage(x, r.b())) / r.ohms();
                s.add(sys.nodeIndex(r.a()), i);
                s.add(sys.nodeIndex(r.b()), -i);
            } else if (e instanceof Capacitor c) {
                int pa = sys.nodeIndex(c.plus());
                int pb = sys.nodeIndex(c.minus());
                double leak = (sys.voltage(x, c.plus()) - sys.voltage(x, c.minus())) * c.leakageSiemens();
                s.add(pa, leak);
                s.add(pb, -leak);
                if (dynamic) {
                    double charge = 0;
                    double largestTerm = 0;
                    for (int k = 0; k < a.length; k++) {
                        double q = c.farads() * (sys.voltage(history[k], c.plus()) - sys.voltage(history[k], c.minus()));
                        charge += a[k] * q / h;
                        largestTerm = Math.max(largestTerm, Math.abs(a[k] * q / h));
                    }
                    for (int node : new int[] {pa, pb}) {
                        if (node >= 0) {
                            s.net[node] += node == pa ? charge : -charge;
                            s.largest[node] = Math.max(s.largest[node], largestTerm);
                        }
                    }
                }
            } else if (e instanceof VoltageSource v) {
                double i = x[sys.branchIndex(v.name())];
                s.add(sys.nodeIndex(v.plus()), -i);
                s.add(sys.nodeIndex(v.minus()), i);
            } else if (e instanceof CurrentSource cs) {
                s.add(sys.nodeIndex(cs.from()), cs.amps());
                s.add(sys.nodeIndex(cs.to()), -cs.amps());
            } else if (e instanceof OpAmp o) {
                OpAmpParams p = o.params();
                double ibp = p.biasAmps() + p.offsetCurrentAmps() / 2;
                double ibm = p.biasAmps() - p.offsetCurrentAmps() / 2;
                double io = x[sys.branchIndex(o.name())];
                double sourced = 0.5 * (io + Math.sqrt(io * io
                        + MnaSystem.SPLIT_SMOOTHING_AMPS * MnaSystem.SPLIT_SMOOTHING_AMPS));
                double supply = p.quiescentAmps() + sourced;
                s.add(sys.nodeIndex(o.inPlus()), ibp);
                s.add(sys.nodeIndex(o.inMinus()), ibm);
                s.add(sys.nodeIndex(o.vPos()), supply);
                s.add(sys.nodeIndex(o.out()), -io);
                int vn = sys.nodeIndex(o.vNeg());
                s.add(vn, -(ibp + ibm));
                s.add(vn, -p.quiescentAmps());
                s.add(vn, -(sourced - io));
            }
        }
        return s;
    }

    private static void finite(List<String> out, String what, double... values) {
        for (double v : values) {
            if (!Double.isFinite(v)) {
                out.add(what + " holds a non-finite value (" + v + ")");
                return;
            }
        }
    }

    private static String describe(MnaSystem sys) {
        Circuit c = sys.circuit();
        String text = c.elements().toString();
        return "circuit of " + c.nodes().size() + " nodes: " + (text.length() > 600 ? text.substring(0, 600) + "…" : text);
    }

    /** For tests of the auditor: the last violation's text, if any, without draining. */
    static Optional<String> peek() {
        AssertionError e = INSTANCE.violations.peek();
        return e == null ? Optional.empty() : Optional.of(e.getMessage());
    }
}
