package halfrail.solve;

import halfrail.circuit.Circuit;
import halfrail.circuit.OpAmp;
import halfrail.circuit.OpAmpParams;
import halfrail.circuit.VoltageSource;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;

/**
 * Power-on transient: the circuit from switch-on, every capacitor empty and every source at
 * the start of its ramp, until it settles to its DC operating point or the stop time comes.
 *
 * <p>The final values come from {@link DcSolver}. The run steps with BDF2 (backward Euler at
 * the start and after each ramp end, both break points stepped onto exactly) under local-error
 * control, see {@link TransientStepper}. From the accepted points it reports the settle-up
 * time of the watched nodes, how long each op-amp's output sat on a rail, the largest step
 * delivered into each load node, and a sustained oscillation of a watched node when one is seen
 * ({@link OscillationWatch}; the run may stop on it, since such a circuit never settles).
 */
public final class PowerOnTransient {
    /**
     * The run may stop early once every node voltage and op-amp state lies within this fraction
     * of the settle band from its final value (after the last source ramp).
     */
    public static final double EARLY_STOP_FRACTION = 0.1;
    /**
     * Consecutive accepted points at which the early-stop condition must hold, so that a node
     * merely passing through its final value does not end the run.
     */
    public static final int EARLY_STOP_POINTS = 3;
    /** An op-amp output within this distance of a swing-window limit counts as on the rail, V. */
    public static final double RAIL_MARGIN_VOLTS = 2 * MnaSystem.KNEE_VOLTS;
    /** A swing window narrower than this (supply not yet up) does not count as a rail, V. */
    public static final double MIN_WINDOW_VOLTS = 4 * MnaSystem.KNEE_VOLTS;
    /** Bisection halvings that locate the moment a watched node enters the band. */
    static final int CROSSING_BISECTIONS = 60;

    private PowerOnTransient() {}

    /**
     * Run the power-on transient of {@code circuit}.
     *
     * @throws AnalysisException BAD_REQUEST for an unknown watched or load node; FLOATING_NODE,
     *                           NO_CONVERGENCE or SINGULAR from the final operating point; STEP_LIMIT,
     *                           STEP_TOO_SMALL or SINGULAR from the stepping
     */
    public static PowerOnResult run(Circuit circuit, PowerOnOptions options) {
        MnaSystem system = MnaSystem.of(circuit);
        List<String> watched = watchedNodes(circuit, options);
        for (String node : options.loadNodes()) {
            system.nodeIndex(node);
        }
        OperatingPoint finalPoint = new DcSolver(system).solve();
        double[] fin = finalPoint.solution();

        Set<Double> ends = new TreeSet<>();
        for (VoltageSource v : circuit.elements(VoltageSource.class)) {
            if (v.rampSeconds() > 0 && v.rampSeconds() < options.stopSeconds()) {
                ends.add(v.rampSeconds());
            }
        }
        double[] breakPoints = ends.stream().mapToDouble(Double::doubleValue).toArray();
        double lastRamp = breakPoints.length == 0 ? 0 : breakPoints[breakPoints.length - 1];

        TransientStepper stepper = new TransientStepper(system, Bdf2.INSTANCE);
        double nearBand = EARLY_STOP_FRACTION * options.settleBandVolts();
        int[] watchedIndices = new int[watched.size()];
        for (int i = 0; i < watchedIndices.length; i++) {
            watchedIndices[i] = system.nodeIndex(watched.get(i));
        }
        OscillationWatch oscillation = new OscillationWatch(watchedIndices, watched.toArray(new String[0]), fin,
                options.settleBandVolts(), lastRamp);
        int[] inBand = {0};
        TransientStepper.EarlyStop early = (t, x) -> {
            if (oscillation.accept(t, x) && options.stopWhenOscillating()) {
                return true;
            }
            if (!options.stopWhenSettled()) {
                return false;
            }
            boolean near = t >= lastRamp;
            for (int i = 0; i < x.length && near; i++) {
                if (stepper.isVoltage(i) && Math.abs(x[i] - fin[i]) > nearBand) {
                    near = false;
                }
            }
            inBand[0] = near ? inBand[0] + 1 : 0;
            return inBand[0] >= EARLY_STOP_POINTS;
        };
        TransientStepper.Trajectory run = stepper.run(new TransientStepper.Settings(options.stopSeconds(),
                options.maxStepSeconds(), options.relativeTolerance(), options.voltageToleranceVolts(), breakPoints),
                early);

        double[] times = run.times();
        double smallest = Double.POSITIVE_INFINITY;
        double largest = 0;
        for (int i = 1; i < times.length; i++) {
            double h = times[i] - times[i - 1];
            smallest = Math.min(smallest, h);
            largest = Math.max(largest, h);
        }
        PowerOnResult.StepStatistics stats = new PowerOnResult.StepStatistics(times.length - 1,
                run.rejectedByError(), run.rejectedByNewton(), run.newtonIterations(),
                times.length > 1 ? smallest : 0, largest);
        Optional<PowerOnResult.Oscillation> oscillating = oscillation.found();
        PowerOnResult.Ending ending = !run.stoppedEarly() ? PowerOnResult.Ending.STOP_TIME_REACHED
                : oscillating.isPresent() && options.stopWhenOscillating() ? PowerOnResult.Ending.OSCILLATING
                : PowerOnResult.Ending.SETTLED;

        // A first result without the settle figures serves the interpolation.
        PowerOnResult raw = new PowerOnResult(system, finalPoint, times, run.solutions(), run.orders(),
                run.restarts(), stats, ending, options.settleBandVolts(), watched, false, Optional.empty(),
                List.of(), List.of(), Optional.empty());
        double[][] xs = run.solutions();
        int last = times.length - 1;
        double band = options.settleBandVolts();
        boolean settled = true;
        double settle = 0;
        for (String node : watched) {
            int idx = system.nodeIndex(node);
            double target = idx < 0 ? 0 : fin[idx];
            if (idx < 0) {
                continue;
            }
            if (Math.abs(xs[last][idx] - target) > band) {
                settled = false;
                continue;
            }
            int out = -1;
            for (int i = last; i >= 0; i--) {
                if (Math.abs(xs[i][idx] - target) > band) {
                    out = i;
                    break;
                }
            }
            if (out >= 0) {
                settle = Math.max(settle, entry(raw, idx, target, band, times[out], times[out + 1]));
            }
        }
        Optional<Double> settleTime = settled ? Optional.of(settle) : Optional.empty();

        List<PowerOnResult.RailTime> rails = new ArrayList<>();
        for (OpAmp o : circuit.elements(OpAmp.class)) {
            rails.add(railTime(system, o, times, xs));
        }
        List<PowerOnResult.LoadStep> loads = new ArrayList<>();
        for (String node : options.loadNodes()) {
            int idx = system.nodeIndex(node);
            double peak = 0;
            double at = 0;
            for (int i = 0; i < times.length; i++) {
                double d = idx < 0 ? 0 : Math.abs(xs[i][idx] - fin[idx]);
                if (d > peak) {
                    peak = d;
                    at = times[i];
                }
            }
            loads.add(new PowerOnResult.LoadStep(node, peak, at));
        }
        PowerOnResult result = new PowerOnResult(system, finalPoint, times, xs, run.orders(), run.restarts(), stats,
                ending, band, watched, settled, settleTime, rails, loads, oscillating);
        SolveAudit.Listener audit = SolveAudit.listener;
        if (audit != null) {
            audit.powerOn(result);
        }
        return result;
    }

    /** The watched nodes: every op-amp output, the named nodes and the load nodes; every node if none. */
    private static List<String> watchedNodes(Circuit circuit, PowerOnOptions options) {
        Set<String> nodes = new LinkedHashSet<>();
        for (OpAmp o : circuit.elements(OpAmp.class)) {
            if (!Circuit.GROUND.equals(o.out())) {
                nodes.add(o.out());
            }
        }
        for (String n : options.watchedNodes()) {
            requireNode(circuit, n);
            nodes.add(n);
        }
        for (String n : options.loadNodes()) {
            requireNode(circuit, n);
            nodes.add(n);
        }
        if (nodes.isEmpty()) {
            nodes.addAll(circuit.nodes());
        }
        return List.copyOf(nodes);
    }

    private static void requireNode(Circuit circuit, String node) {
        if (!circuit.hasNode(node)) {
            throw new AnalysisException(AnalysisException.Kind.BAD_REQUEST, "no node named " + node);
        }
    }

    /**
     * The moment in (t0, t1] at which the interpolated voltage enters the band for good: t0 lies
     * outside the band, t1 inside; bisection on the interpolant.
     */
    private static double entry(PowerOnResult raw, int idx, double target, double band, double t0, double t1) {
        double a = t0;
        double b = t1;
        for (int k = 0; k < CROSSING_BISECTIONS && b - a > 0; k++) {
            double m = 0.5 * (a + b);
            if (m <= a || m >= b) {
                break;
            }
            if (Math.abs(raw.valueAt(idx, m) - target) > band) {
                a = m;
            } else {
                b = m;
            }
        }
        return b;
    }

    private static PowerOnResult.RailTime railTime(MnaSystem system, OpAmp o, double[] times, double[][] xs) {
        OpAmpParams p = o.params();
        boolean[] on = new boolean[times.length];
        int lastOn = -1;
        // The node indices once, not a name look-up per point (−1 is ground).
        int vNeg = system.nodeIndex(o.vNeg());
        int vPos = system.nodeIndex(o.vPos());
        int outNode = system.nodeIndex(o.out());
        int number = system.opAmpNumber(o.name());
        for (int i = 0; i < times.length; i++) {
            double[] x = xs[i];
            double lo = (vNeg < 0 ? 0 : x[vNeg]) + p.swingLowVolts();
            double hi = (vPos < 0 ? 0 : x[vPos]) - p.swingHighVolts();
            if (hi - lo < MIN_WINDOW_VOLTS) {
                continue;
            }
            double out = outNode < 0 ? 0 : x[outNode];
            on[i] = out >= hi - RAIL_MARGIN_VOLTS || out <= lo + RAIL_MARGIN_VOLTS || system.saturated(x, number);
            if (on[i]) {
                lastOn = i;
            }
        }
        double seconds = 0;
        for (int i = 1; i < times.length; i++) {
            seconds += 0.5 * ((on[i - 1] ? 1 : 0) + (on[i] ? 1 : 0)) * (times[i] - times[i - 1]);
        }
        return new PowerOnResult.RailTime(o.name(), lastOn >= 0, seconds,
                lastOn >= 0 ? Optional.of(times[lastOn]) : Optional.empty());
    }
}
