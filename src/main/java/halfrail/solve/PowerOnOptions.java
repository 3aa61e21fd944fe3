package halfrail.solve;

import java.util.List;

/**
 * Options of a {@link PowerOnTransient} run.
 *
 * @param stopSeconds           latest circuit time to simulate, s; positive
 * @param settleBandVolts       half-width of the settle band around each watched node's final
 *                              (DC operating point) value, V; positive
 * @param watchedNodes          nodes whose settling is timed, besides every op-amp output and every
 *                              load node; when all three are empty, every node is watched
 * @param loadNodes             nodes fed by an output coupling capacitor, whose largest step
 *                              (peak |V − final|) is reported
 * @param maxStepSeconds        largest time step, s; positive
 * @param relativeTolerance     local-error tolerance per step relative to the voltage, a fraction
 *                              (1e-3 is 0.1 %); in (0, 0.1]
 * @param voltageToleranceVolts absolute local-error tolerance per step for node voltages and
 *                              op-amp states, V; positive
 * @param stopWhenSettled       whether to stop before {@code stopSeconds} once every node and
 *                              op-amp state lies within {@link PowerOnTransient#EARLY_STOP_FRACTION}
 *                              of the band from its final value, after the last source ramp, at
 *                              {@link PowerOnTransient#EARLY_STOP_POINTS} accepted points in a row
 * @param stopWhenOscillating   whether to stop before {@code stopSeconds} once a watched node is
 *                              seen to keep oscillating across its final value (see
 *                              {@link PowerOnResult.Oscillation}); the oscillation is reported either way
 */
public record PowerOnOptions(double stopSeconds, double settleBandVolts, List<String> watchedNodes,
                             List<String> loadNodes, double maxStepSeconds, double relativeTolerance,
                             double voltageToleranceVolts, boolean stopWhenSettled, boolean stopWhenOscillating) {

    /** Default settle band, V: ±10 mV around the final value (a choice of this tool). */
    public static final double DEFAULT_SETTLE_BAND_VOLTS = 0.01;
    /** Default relative local-error tolerance: 0.01 % (settle bands of millivolts on volts need it). */
    public static final double DEFAULT_RELATIVE_TOLERANCE = 1e-4;
    /** Default absolute local-error tolerance, V: 1 µV. */
    public static final double DEFAULT_VOLTAGE_TOLERANCE_VOLTS = 1e-6;
    /** Default largest step as a fraction of the stop time: 1/50. */
    public static final double DEFAULT_MAX_STEP_FRACTION = 0.02;

    public PowerOnOptions {
        require(Double.isFinite(stopSeconds) && stopSeconds > 0, "stopSeconds must be positive, got " + stopSeconds);
        require(Double.isFinite(settleBandVolts) && settleBandVolts > 0,
                "settleBandVolts must be positive, got " + settleBandVolts);
        require(Double.isFinite(maxStepSeconds) && maxStepSeconds > 0,
                "maxStepSeconds must be positive, got " + maxStepSeconds);
        require(relativeTolerance > 0 && relativeTolerance <= 0.1,
                "relativeTolerance must lie in (0, 0.1], got " + relativeTolerance);
        require(Double.isFinite(voltageToleranceVolts) && voltageToleranceVolts > 0,
                "voltageToleranceVolts must be positive, got " + voltageToleranceVolts);
        watchedNodes = List.copyOf(watchedNodes);
        loadNodes = List.copyOf(loadNodes);
    }

    /**
     * Defaults for a run up to {@code stopSeconds}: band {@value #DEFAULT_SETTLE_BAND_VOLTS} V,
     * op-amp outputs watched, no load nodes, largest step stop/50, tolerances 1e-4 and 1 µV,
     * early stop on (settled or oscillating).
     */
    public static PowerOnOptions of(double stopSeconds) {
        return new PowerOnOptions(stopSeconds, DEFAULT_SETTLE_BAND_VOLTS, List.of(), List.of(),
                DEFAULT_MAX_STEP_FRACTION * stopSeconds, DEFAULT_RELATIVE_TOLERANCE,
                DEFAULT_VOLTAGE_TOLERANCE_VOLTS, true, true);
    }

    /** Copy with another settle band, V. */
    public PowerOnOptions withSettleBand(double volts) {
        return new PowerOnOptions(stopSeconds, volts, watchedNodes, loadNodes, maxStepSeconds, relativeTolerance,
                voltageToleranceVolts, stopWhenSettled, stopWhenOscillating);
    }

    /** Copy with other watched nodes (in addition to op-amp outputs and load nodes). */
    public PowerOnOptions withWatchedNodes(String... nodes) {
        return new PowerOnOptions(stopSeconds, settleBandVolts, List.of(nodes), loadNodes, maxStepSeconds,
                relativeTolerance, voltageToleranceVolts, stopWhenSettled, stopWhenOscillating);
    }

    /** Copy with other load nodes. */
    public PowerOnOptions withLoadNodes(String... nodes) {
        return new PowerOnOptions(stopSeconds, settleBandVolts, watchedNodes, List.of(nodes), maxStepSeconds,
                relativeTolerance, voltageToleranceVolts, stopWhenSettled, stopWhenOscillating);
    }

    /** Copy with another largest step, s. */
    public PowerOnOptions withMaxStep(double seconds) {
        return new PowerOnOptions(stopSeconds, settleBandVolts, watchedNodes, loadNodes, seconds, relativeTolerance,
                voltageToleranceVolts, stopWhenSettled, stopWhenOscillating);
    }

    /** Copy with other local-error tolerances: relative (fraction) and absolute (V). */
    public PowerOnOptions withTolerances(double relative, double volts) {
        return new PowerOnOptions(stopSeconds, settleBandVolts, watchedNodes, loadNodes, maxStepSeconds, relative,
                volts, stopWhenSettled, stopWhenOscillating);
    }

    /** Copy that does or does not stop early once settled. */
    public PowerOnOptions withStopWhenSettled(boolean stop) {
        return new PowerOnOptions(stopSeconds, settleBandVolts, watchedNodes, loadNodes, maxStepSeconds,
                relativeTolerance, voltageToleranceVolts, stop, stopWhenOscillating);
    }

    /** Copy that does or does not stop early once a sustained oscillation is seen. */
    public PowerOnOptions withStopWhenOscillating(boolean stop) {
        return new PowerOnOptions(stopSeconds, settleBandVolts, watchedNodes, loadNodes, maxStepSeconds,
                relativeTolerance, voltageToleranceVolts, stopWhenSettled, stop);
    }

    private static void require(boolean ok, String message) {
        if (!ok) {
            throw new AnalysisException(AnalysisException.Kind.BAD_REQUEST, message);
        }
    }
}
