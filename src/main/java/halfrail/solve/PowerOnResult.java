package halfrail.solve;

import java.util.List;
import java.util.Optional;

/**
 * The outcome of a {@link PowerOnTransient} run: the accepted time points with the full solution
 * at each, step statistics, how the run ended, and the settle-up figures. Immutable; arrays are
 * copied out (the package's runner hands its fresh arrays over).
 *
 * <p>Values between accepted points come from {@link #voltageAt}: a quadratic through three
 * neighbouring points that never spans a break point (a corner of a source ramp).
 */
public final class PowerOnResult {

    /** How the run ended. */
    public enum Ending {
        /**
         * Stopped early: after the last source ramp every node voltage and op-amp state lay
         * within {@link PowerOnTransient#EARLY_STOP_FRACTION} of the settle band from its final
         * value, at {@link PowerOnTransient#EARLY_STOP_POINTS} accepted points in a row.
         */
        SETTLED,
        /** Reached the stop time; {@link #settled()} says whether the watched nodes were in band there. */
        STOP_TIME_REACHED,
        /**
         * Stopped early because a watched node kept oscillating across its final value
         * ({@link #oscillation()}): such a circuit does not settle however long it runs.
         */
        OSCILLATING
    }

    /**
     * A sustained oscillation seen in the run, as {@link OscillationWatch} recognises it: a
     * watched node swinging across its final value, beyond the settle band on both sides, with
     * swings that keep their size over {@link OscillationWatch#HALF_CYCLES} half-cycles.
     *
     * @param node             the watched node that showed it first
     * @param periodSeconds    mean period over the half-cycles that showed it, s
     * @param peakToPeakVolts  sum of the last two excursions (one each side of the final value), V
     * @param fromSeconds      the crossing that began the first of those half-cycles, s
     * @param seenAtSeconds    the crossing at which it was recognised, s
     */
    public record Oscillation(String node, double periodSeconds, double peakToPeakVolts, double fromSeconds,
                              double seenAtSeconds) {
        /** 1 / period, Hz. */
        public double frequencyHz() {
            return 1 / periodSeconds;
        }
    }

    /**
     * Step statistics.
     *
     * @param acceptedSteps     accepted time steps (points after t = 0)
     * @param rejectedByError   steps rejected because the local-error estimate was too big
     * @param rejectedByNewton  steps rejected because Newton's method did not converge
     * @param newtonIterations  Newton iterations over the whole run, rejected steps included
     * @param smallestStepSeconds smallest accepted step, s
     * @param largestStepSeconds  largest accepted step, s
     */
    public record StepStatistics(int acceptedSteps, int rejectedByError, int rejectedByNewton, int newtonIterations,
                                 double smallestStepSeconds, double largestStepSeconds) {
        /** Rejected steps of either cause. */
        public int rejectedSteps() {
            return rejectedByError + rejectedByNewton;
        }
    }

    /**
     * How one op-amp's output sat on a rail during power-on. The output counts as on a rail at an
     * accepted point when the part is saturated (its open-loop target lies beyond the swing
     * window) or its output lies within {@link PowerOnTransient#RAIL_MARGIN_VOLTS} of a limit of
     * the swing window, while that window is at least {@link PowerOnTransient#MIN_WINDOW_VOLTS}
     * wide (a part whose supply has not come up yet is not counted).
     *
     * @param opAmp             the op-amp's name
     * @param reachedRail       whether the output was on a rail at any accepted point
     * @param secondsOnRail     time on a rail, s: trapezoidal sum over the accepted points
     * @param lastOnRailSeconds the last accepted time at which the output was on a rail, s
     */
    public record RailTime(String opAmp, boolean reachedRail, double secondsOnRail, Optional<Double> lastOnRailSeconds) {
    }

    /**
     * The largest step a load node received.
     *
     * @param node               the load node
     * @param peakDeviationVolts largest |V − final| over the accepted points, V
     * @param atSeconds          time of that peak, s
     */
    public record LoadStep(String node, double peakDeviationVolts, double atSeconds) {
    }

    private final MnaSystem system;
    private final OperatingPoint finalPoint;
    private final double[] times;
    private final double[][] solutions;
    private final int[] orders;
    private final boolean[] restarts;
    private final StepStatistics statistics;
    private final Ending ending;
    private final double settleBandVolts;
    private final List<String> watchedNodes;
    private final boolean settled;
    private final Optional<Double> settleTimeSeconds;
    private final List<RailTime> railTimes;
    private final List<LoadStep> loadSteps;
    private final Optional<Oscillation> oscillation;

    PowerOnResult(MnaSystem system, OperatingPoint finalPoint, double[] times, double[][] solutions, int[] orders,
                  boolean[] restarts, StepStatistics statistics, Ending ending, double settleBandVolts,
                  List<String> watchedNodes, boolean settled, Optional<Double> settleTimeSeconds,
                  List<RailTime> railTimes, List<LoadStep> loadSteps, Optional<Oscillation> oscillation) {
        this.system = system;
        this.finalPoint = finalPoint;
        // The arrays are taken over, not copied: the one caller (PowerOnTransient) hands over the
        // stepper's fresh arrays, shared only with another result of the same run; nothing
        // writes to them afterwards, and every accessor copies out.
        this.times = times;
        this.solutions = solutions;
        this.orders = orders;
        this.restarts = restarts;
        this.statistics = statistics;
        this.ending = ending;
        this.settleBandVolts = settleBandVolts;
        this.watchedNodes = List.copyOf(watchedNodes);
        this.settled = settled;
        this.settleTimeSeconds = settleTimeSeconds;
        this.railTimes = List.copyOf(railTimes);
        this.loadSteps = List.copyOf(loadSteps);
        this.oscillation = oscillation;
    }

    /** The equations the run solved (for unknown indices and names). */
    public MnaSystem system() {
        return system;
    }

    /** The DC operating point the run settles towards: the final values. */
    public OperatingPoint finalPoint() {
        return finalPoint;
    }

    /** Number of accepted time points, t = 0 included. */
    public int pointCount() {
        return times.length;
    }

    /** The accepted times, s, from 0 ascending. */
    public double[] timesSeconds() {
        return times.clone();
    }

    /** The time of point {@code i}, s. */
    public double timeSeconds(int i) {
        return times[i];
    }

    /** The full solution (every unknown of {@link #system()}) at point {@code i}. */
    public double[] solution(int i) {
        return solutions[i].clone();
    }

    /**
     * The order of the formula that reached point {@code i}: 1 for backward Euler, 2 for BDF2,
     * 0 for the start point.
     */
    public int stepOrder(int i) {
        return orders[i];
    }

    /** Whether point {@code i} is the start or a break point (the end of a source ramp). */
    public boolean isBreakPoint(int i) {
        return restarts[i];
    }

    /** Voltage of {@code node} at every accepted point, V. @throws AnalysisException BAD_REQUEST for an unknown node */
    public double[] voltages(String node) {
        return column(system.nodeIndex(node));
    }

    /** Internal state (unloaded output voltage) of op-amp {@code name} at every accepted point, V. */
    public double[] opAmpStates(String name) {
        return column(system.stateIndex(name));
    }

    /**
     * Voltage of {@code node} at time {@code seconds} in [0, last accepted time], V, interpolated
     * between accepted points.
     */
    public double voltageAt(String node, double seconds) {
        return valueAt(system.nodeIndex(node), seconds);
    }

    /** Unknown {@code index} of the solution interpolated at {@code seconds}; 0 for index −1 (ground). */
    double valueAt(int index, double seconds) {
        if (index < 0) {
            return 0;
        }
        int last = times.length - 1;
        if (!(seconds >= 0 && seconds <= times[last])) {
            throw new AnalysisException(AnalysisException.Kind.BAD_REQUEST,
                    "time " + seconds + " s lies outside the run [0, " + times[last] + "] s");
        }
        if (last == 0) {
            return solutions[0][index];
        }
        int lo = 0;
        int hi = last;
        while (hi - lo > 1) {
            int mid = (lo + hi) >>> 1;
            if (times[mid] <= seconds) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        int i = lo;
        int first;
        if (i > 0 && !restarts[i]) {
            first = i - 1;
        } else if (i + 2 <= last && !restarts[i + 1]) {
            first = i;
        } else {
            double w = (seconds - times[i]) / (times[i + 1] - times[i]);
            return solutions[i][index] + w * (solutions[i + 1][index] - solutions[i][index]);
        }
        double sum = 0;
        for (int j = first; j < first + 3; j++) {
            double w = 1;
            for (int l = first; l < first + 3; l++) {
                if (l != j) {
                    w *= (seconds - times[l]) / (times[j] - times[l]);
                }
            }
            sum += w * solutions[j][index];
        }
        return sum;
    }

    private double[] column(int index) {
        double[] out = new double[times.length];
        if (index >= 0) {
            for (int i = 0; i < times.length; i++) {
                out[i] = solutions[i][index];
            }
        }
        return out;
    }

    public StepStatistics statistics() {
        return statistics;
    }

    public Ending ending() {
        return ending;
    }

    /** The settle band's half-width, V. */
    public double settleBandVolts() {
        return settleBandVolts;
    }

    /** The nodes whose settling was timed. */
    public List<String> watchedNodes() {
        return watchedNodes;
    }

    /** Whether every watched node lay within the band of its final value at the last accepted point. */
    public boolean settled() {
        return settled;
    }

    /**
     * The settle-up time, s: the last time any watched node was outside ±band of its final
     * value (0 when none ever was). Empty when the run ended with a watched node still outside
     * the band: the circuit did not settle within the stop time.
     */
    public Optional<Double> settleTimeSeconds() {
        return settleTimeSeconds;
    }

    /** Rail figures, one per op-amp in circuit order. */
    public List<RailTime> railTimes() {
        return railTimes;
    }

    public Optional<RailTime> railTime(String opAmp) {
        return railTimes.stream().filter(r -> r.opAmp().equals(opAmp)).findFirst();
    }

    /** The largest step into each load node, in the order of the options. */
    public List<LoadStep> loadSteps() {
        return loadSteps;
    }

    /**
     * The sustained oscillation seen, when a watched node kept swinging across its final value
     * (see {@link Oscillation}); whether the run stopped on it is {@link #ending()}.
     */
    public Optional<Oscillation> oscillation() {
        return oscillation;
    }

    public Optional<LoadStep> loadStep(String node) {
        return loadSteps.stream().filter(l -> l.node().equals(node)).findFirst();
    }

    @Override
    public String toString() {
        return "PowerOnResult[" + ending + ", " + times.length + " points to t = " + times[times.length - 1]
                + " s, settle " + settleTimeSeconds.map(s -> s + " s").orElse("not reached")
                + oscillation.map(o -> ", oscillating with period " + o.periodSeconds() + " s").orElse("") + "]";
    }
}
